package org.microtally.limit;

import org.apache.commons.math3.special.Gamma;
import org.microtally.InvalidInputException;
import org.microtally.units.Codata2018;

/**
 * A power-law single-particle density of states g(e) = C e^(alpha - 1) (e in joules, C in
 * J^-alpha), the semiclassical description that makes ideal-gas thermodynamics in a box or a trap
 * a matter of Bose and Fermi-Dirac functions of order alpha (V. Bagnato, D. E. Pritchard and
 * D. Kleppner, Phys. Rev. A 35, 4354 (1987)).
 *
 * <p>Whether C counts states per unit volume (a box: the particle amount is then a density in
 * m^-3) or in the whole system (a trap: the amount is a number of particles) is recorded in
 * {@link #perVolume()}.
 *
 * <p><b>Method.</b> Each builder evaluates a closed form: the box is the leading (Weyl) term of the
 * free-particle state count, phase-space volume / (2 pi hbar)^3; the traps are the semiclassical
 * phase-space volume below e for the given potential (Bagnato, Pritchard and Kleppner 1987, above),
 * with the zero-point energy dropped. {@link #statesBelow} is the integral C e^alpha / alpha.
 *
 * <p><b>Accuracy.</b> Two separate things. (1) Numerically, {@link #box3D}, {@link #harmonic},
 * {@link #harmonic2D} and {@link #statesBelow} are a few floating-point operations on the CODATA 2018
 * constants: relative error a few ulp. {@link #powerLawTrap} goes through ln K with
 * Commons Math {@code Gamma.logGamma} and one exp, so its relative error is about |ln K| 2^-53 plus
 * that of logGamma (on the 4:4:1 demo trap it agrees with {@link #harmonic} to 1e-13, tested).
 * (2) As physics, a power law is the continuum limit: it is the leading term for e (and kT) large
 * compared with the level spacing (hbar omega for a trap). Discreteness and zero-point energy give corrections of relative order
 * hbar omega / kT, seen for example as the finite-N shift of the condensation temperature in a
 * harmonic trap (W. Ketterle and N. J. van Druten, Phys. Rev. A 54, 656 (1996), from memory); for
 * small N use the exact spectrum and the ensemble classes instead.
 */
public final class DensityOfStates {
    private final double coefficient;
    private final double exponent;
    private final boolean perVolume;
    private final String description;

    private DensityOfStates(double coefficient, double exponent, boolean perVolume, String description) {
        this.coefficient = Checks.positive("density-of-states coefficient C", coefficient, "");
        this.exponent = Checks.positive("density-of-states exponent alpha", exponent,
                "g(e) = C e^(alpha-1) needs alpha > 0 to be integrable at e = 0.");
        this.perVolume = perVolume;
        this.description = description;
    }

    /**
     * Free particles of mass m in a three-dimensional box, per unit volume:
     * g(e) = g_s (2m)^(3/2) / (4 pi^2 hbar^3) e^(1/2), alpha = 3/2.
     *
     * @param massKg           particle mass in kg
     * @param spinDegeneracy   g_s (1 for spinless bosons, 2 for spin-1/2)
     */
    public static DensityOfStates box3D(double massKg, int spinDegeneracy) {
        Checks.positive("particle mass (kg)", massKg, "Masses in u: multiply by Codata2018.ATOMIC_MASS_UNIT.");
        Checks.degeneracy(spinDegeneracy);
        double hbar = Codata2018.HBAR;
        double c = spinDegeneracy * Math.pow(2.0 * massKg, 1.5) / (4.0 * Math.PI * Math.PI * hbar * hbar * hbar);
        return new DensityOfStates(c, 1.5, true, "3D box, m = " + massKg + " kg, g = " + spinDegeneracy);
    }

    /**
     * A three-dimensional harmonic trap: g(e) = g_s e^2 / (2 (hbar omega_g)^3), alpha = 3
     * (zero-point energy dropped, valid for kT &gt;&gt; hbar omega).
     */
    public static DensityOfStates harmonic(HarmonicTrap trap, int spinDegeneracy) {
        Checks.degeneracy(spinDegeneracy);
        double e = Codata2018.HBAR * trap.geometricMean();
        return new DensityOfStates(spinDegeneracy / (2.0 * e * e * e), 3.0, false,
                "3D harmonic trap, omega_g = " + trap.geometricMean() + " rad/s, g = " + spinDegeneracy);
    }

    /**
     * A three-dimensional power-law trap V(x) = sum_i c_i |x_i|^(p_i) (c_i in J m^-p_i), semiclassically
     * (Bagnato, Pritchard and Kleppner 1987): alpha = 3/2 + sum_i 1/p_i and the number of states below e
     * is K e^alpha with
     * K = (4 pi/3) (2m)^(3/2) / (2 pi hbar)^3 * prod_i [2 Gamma(1 + 1/p_i) c_i^(-1/p_i)] * Gamma(5/2) / Gamma(alpha + 1),
     * from the phase-space volume and Dirichlet's integral; so C = alpha K. With p_i = 2 and
     * c_i = m omega_i^2 / 2 this is {@link #harmonic}; a quadrupole trap has p_i = 1 (alpha = 9/2).
     *
     * @param massKg         particle mass in kg
     * @param strengths      c_x, c_y, c_z in J m^-p_i, each &gt; 0
     * @param powers         p_x, p_y, p_z, each &gt; 0
     * @param spinDegeneracy g_s
     */
    public static DensityOfStates powerLawTrap(double massKg, double[] strengths, double[] powers, int spinDegeneracy) {
        Checks.positive("particle mass (kg)", massKg, "");
        Checks.degeneracy(spinDegeneracy);
        if (strengths.length != 3 || powers.length != 3) {
            throw InvalidInputException.of("number of trap axes", strengths.length + " strengths and " + powers.length
                    + " powers", "3 of each", "");
        }
        double alpha = 1.5;
        double logK = Math.log(4.0 * Math.PI / 3.0) + 1.5 * Math.log(2.0 * massKg) - 3.0 * Math.log(2.0 * Math.PI * Codata2018.HBAR)
                + Gamma.logGamma(2.5);
        for (int i = 0; i < 3; i++) {
            Checks.positive("trap strength c_" + "xyz".charAt(i) + " (J m^-p)", strengths[i], "");
            Checks.positive("trap power p_" + "xyz".charAt(i), powers[i], "");
            double inv = 1.0 / powers[i];
            alpha += inv;
            logK += Math.log(2.0) + Gamma.logGamma(1.0 + inv) - inv * Math.log(strengths[i]);
        }
        logK -= Gamma.logGamma(alpha + 1.0);
        double c = spinDegeneracy * alpha * Math.exp(logK);
        return new DensityOfStates(c, alpha, false, "3D power-law trap, alpha = " + alpha + ", g = " + spinDegeneracy);
    }

    /** A two-dimensional isotropic oscillator: g(e) = g_s e / (hbar omega)^2, alpha = 2. */
    public static DensityOfStates harmonic2D(double omega, int spinDegeneracy) {
        Checks.positive("oscillator angular frequency omega (rad/s)", omega, "");
        Checks.degeneracy(spinDegeneracy);
        double e = Codata2018.HBAR * omega;
        return new DensityOfStates(spinDegeneracy / (e * e), 2.0, false,
                "2D isotropic oscillator, omega = " + omega + " rad/s, g = " + spinDegeneracy);
    }

    /**
     * Any power law g(e) = C e^(alpha-1).
     *
     * @param coefficient C in J^-alpha (per m^3 if {@code perVolume})
     * @param exponent    alpha &gt; 0
     * @param perVolume   whether C counts states per unit volume
     */
    public static DensityOfStates powerLaw(double coefficient, double exponent, boolean perVolume) {
        return new DensityOfStates(coefficient, exponent, perVolume,
                "power law, C = " + coefficient + ", alpha = " + exponent);
    }

    /** C in g(e) = C e^(alpha-1), J^-alpha (per m^3 if {@link #perVolume()}). */
    public double coefficient() {
        return coefficient;
    }

    /** alpha in g(e) = C e^(alpha-1). */
    public double exponent() {
        return exponent;
    }

    /** True if the coefficient counts states per unit volume (a box). */
    public boolean perVolume() {
        return perVolume;
    }

    /** The number of states below energy e (J): C e^alpha / alpha (per m^3 if per volume). */
    public double statesBelow(double energyJoules) {
        if (!(energyJoules >= 0) || !Double.isFinite(energyJoules)) {
            throw InvalidInputException.of("energy (J)", energyJoules, "a finite number >= 0", "");
        }
        return coefficient * Math.pow(energyJoules, exponent) / exponent;
    }

    @Override
    public String toString() {
        return description;
    }

    /**
     * The pressure P = (U/V)/alpha of an ideal gas with this density of states, from its energy density
     * U/V in J/m^3 (for a 3D box, alpha = 3/2: P = 2U/(3V)); exact identity for a power-law density of
     * states per volume (Bagnato, Pritchard & Kleppner, PRA 35, 4354 (1987)), one rounding.
     *
     * @throws InvalidInputException if the density of states is not per volume (a trap has no pressure)
     */
    double pressureFromEnergyDensity(double energyDensity) {
        if (!perVolume) {
            throw new InvalidInputException("pressure is defined for a gas in a box (density of states per volume); "
                    + "this gas has " + this + ".");
        }
        return energyDensity / exponent;
    }
}
