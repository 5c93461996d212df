package org.microtally;

/**
 * How a reported quantity scales with the unit of energy, so that a result can be converted from
 * the spectrum's declared quantum to a physical unit by one typed rule instead of by parsing unit
 * text: a value of dimension energy^p is multiplied by (size of the quantum in the new unit)^p.
 */
public enum Dimension {
    /** A pure number (particle numbers, ln Z, S/k, C/k, probabilities). */
    NONE(0),
    /** An energy (kT, U, F, mu). */
    ENERGY(1),
    /** An energy squared (Var E). */
    ENERGY_SQUARED(2),
    /** An inverse energy (beta). */
    INVERSE_ENERGY(-1);

    private final int power;

    Dimension(int power) {
        this.power = power;
    }

    /** The power p of energy. */
    public int power() {
        return power;
    }

    /** The unit text for an energy unit named {@code energyUnit}: "", "meV", "meV^2", "1/meV". */
    public String unit(String energyUnit) {
        return switch (this) {
            case NONE -> "";
            case ENERGY -> energyUnit;
            case ENERGY_SQUARED -> energyUnit + "^2";
            case INVERSE_ENERGY -> "1/" + energyUnit;
        };
    }
}
