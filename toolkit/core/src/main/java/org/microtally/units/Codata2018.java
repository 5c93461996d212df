package org.microtally.units;

/**
 * Physical constants, CODATA 2018 recommended values, SI units.
 *
 * <p>Source: E. Tiesinga, P. J. Mohr, D. B. Newell, B. N. Taylor, "CODATA recommended values of the
 * fundamental physical constants: 2018", Rev. Mod. Phys. 93, 025010 (2021). The first six are exact
 * by the 2019 definition of the SI; the masses carry their CODATA standard uncertainty (given in the
 * field documentation).
 */
public final class Codata2018 {
    private Codata2018() { }

    /** Boltzmann constant k_B in J/K (exact). */
    public static final double BOLTZMANN = 1.380649e-23;
    /** Planck constant h in J s (exact). */
    public static final double PLANCK = 6.62607015e-34;
    /** Reduced Planck constant hbar = h / 2 pi in J s (exact by definition; rounded to double). */
    public static final double HBAR = PLANCK / (2.0 * Math.PI);
    /** Elementary charge e in C (exact). */
    public static final double ELEMENTARY_CHARGE = 1.602176634e-19;
    /** Avogadro constant N_A in 1/mol (exact). */
    public static final double AVOGADRO = 6.02214076e23;
    /** Speed of light in vacuum c in m/s (exact). */
    public static final double SPEED_OF_LIGHT = 299792458.0;
    /** Atomic mass constant m_u = 1 u in kg; standard uncertainty 0.00000000050e-27 kg. */
    public static final double ATOMIC_MASS_UNIT = 1.66053906660e-27;
    /** Electron mass m_e in kg; standard uncertainty 0.0000000028e-31 kg. */
    public static final double ELECTRON_MASS = 9.1093837015e-31;
    /** Newtonian constant of gravitation G in m^3 kg^-1 s^-2; standard uncertainty 0.00015e-11. */
    public static final double GRAVITATION = 6.67430e-11;
    /** Neutron mass m_n in kg; standard uncertainty 0.00000000095e-27 kg. */
    public static final double NEUTRON_MASS = 1.67492749804e-27;
}
