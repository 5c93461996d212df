package org.microtally.units;

import java.util.Objects;
import org.microtally.InvalidInputException;

/**
 * An energy with its unit. The number inside can only be read by naming a unit
 * ({@link #in(EnergyUnit)} or {@link #in(EnergyScale)}), so a value in meV can never be added to one
 * in kelvin without a conversion: arithmetic is between {@code Energy} objects only.
 *
 * <p>Stored as joules in a double; conversions multiply by CODATA 2018 factors
 * ({@link EnergyUnit}), so they are accurate to a few ulp. Immutable.
 */
public final class Energy implements Comparable<Energy> {
    private final double joules;
    private final EnergyUnit displayUnit;

    private Energy(double joules, EnergyUnit displayUnit) {
        if (!Double.isFinite(joules)) {
            throw InvalidInputException.of("energy", joules + " J", "a finite number", "");
        }
        this.joules = joules;
        this.displayUnit = displayUnit;
    }

    /** An energy of {@code value} in {@code unit}; {@link #toString()} uses that unit. */
    public static Energy of(double value, EnergyUnit unit) {
        Objects.requireNonNull(unit, "unit");
        if (!Double.isFinite(value)) {
            throw InvalidInputException.of("energy in " + unit.symbol(), value, "a finite number", "");
        }
        return new Energy(value * unit.joules(), unit);
    }

    /** The thermal energy k_B T for a temperature in kelvin. */
    public static Energy ofTemperature(double kelvin) {
        return of(kelvin, EnergyUnit.KELVIN);
    }

    /** This energy as a number of {@code unit}. */
    public double in(EnergyUnit unit) {
        return joules / unit.joules();
    }

    /** This energy as a multiple of a declared quantum; throws if the scale has no physical value. */
    public double in(EnergyScale scale) {
        return scale.multiples(this);
    }

    /** Sum of two energies. */
    public Energy plus(Energy other) {
        return new Energy(joules + other.joules, displayUnit);
    }

    /** Difference of two energies. */
    public Energy minus(Energy other) {
        return new Energy(joules - other.joules, displayUnit);
    }

    /** This energy times a dimensionless factor. */
    public Energy times(double factor) {
        return new Energy(joules * factor, displayUnit);
    }

    /** The dimensionless ratio this / other. */
    public double ratio(Energy other) {
        if (other.joules == 0.0) {
            throw InvalidInputException.of("divisor energy", other, "non-zero", "");
        }
        return joules / other.joules;
    }

    /** The unit this energy was created in (used for display only). */
    public EnergyUnit displayUnit() {
        return displayUnit;
    }

    @Override
    public int compareTo(Energy o) {
        return Double.compare(joules, o.joules);
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof Energy e && Double.compare(e.joules, joules) == 0;
    }

    @Override
    public int hashCode() {
        return Double.hashCode(joules);
    }

    /** E.g. {@code "3 meV"}, in the unit it was created in. */
    @Override
    public String toString() {
        double v = in(displayUnit);
        String num = (v == Math.rint(v) && Math.abs(v) < 1e15) ? Long.toString((long) v) : Double.toString(v);
        return num + " " + displayUnit.symbol();
    }
}
