package org.microtally.units;

/**
 * Physical units in which an {@link Energy} can be expressed. Conversions use CODATA 2018 exact
 * constants ({@link Codata2018}): 1 eV = e J, 1 K = k_B J (energy E/k_B), 1 cm^-1 = 100 h c J,
 * 1 Hz = h J.
 *
 * <p>Accuracy: those constants are exact in the SI since 2019, so the only error is rounding: each
 * factor is the double nearest to the exact value, or a product of two or three such doubles (meV,
 * cm^-1), within 2 ulp of the exact factor.
 */
public enum EnergyUnit {
    /** Joule. */
    JOULE("J", 1.0),
    /** Electronvolt. */
    ELECTRONVOLT("eV", Codata2018.ELEMENTARY_CHARGE),
    /** Millielectronvolt. */
    MILLIELECTRONVOLT("meV", Codata2018.ELEMENTARY_CHARGE * 1e-3),
    /** Kelvin, as the energy k_B T. */
    KELVIN("K", Codata2018.BOLTZMANN),
    /** Wavenumber, reciprocal centimetre, as the energy h c / lambda. */
    WAVENUMBER("cm^-1", 100.0 * Codata2018.PLANCK * Codata2018.SPEED_OF_LIGHT),
    /** Hertz, as the energy h nu. */
    HERTZ("Hz", Codata2018.PLANCK);

    private final String symbol;
    private final double joules;

    EnergyUnit(String symbol, double joules) {
        this.symbol = symbol;
        this.joules = joules;
    }

    /** The printed symbol, e.g. {@code "meV"}. */
    public String symbol() {
        return symbol;
    }

    /** How many joules one of this unit is. */
    public double joules() {
        return joules;
    }
}
