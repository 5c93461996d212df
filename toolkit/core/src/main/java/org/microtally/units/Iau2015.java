package org.microtally.units;

/**
 * Nominal solar values of IAU 2015 Resolution B3, SI units, with the solar mass derived from them.
 *
 * <p>Source: IAU 2015 Resolution B3 on recommended nominal conversion constants for selected solar
 * and planetary properties (A. Prsa et al., AJ 152, 41 (2016)). The nominal values are exact by
 * definition; they are conversion constants, not measurements of the Sun.
 */
public final class Iau2015 {
    private Iau2015() { }

    /** Nominal solar mass parameter (GM)_sun^N = 1.3271244e20 m^3 s^-2 (exact by definition). */
    public static final double SOLAR_MASS_PARAMETER = 1.3271244e20;
    /** Nominal solar radius R_sun^N = 6.957e8 m (exact by definition). */
    public static final double SOLAR_RADIUS = 6.957e8;
    /**
     * Solar mass M_sun = (GM)_sun^N / G = 1.98841e30 kg with CODATA 2018 G
     * ({@link Codata2018#GRAVITATION}); carries G's relative uncertainty 2.2e-5.
     */
    public static final double SOLAR_MASS = SOLAR_MASS_PARAMETER / Codata2018.GRAVITATION;
}
