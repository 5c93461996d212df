package org.microtally.limit;

import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import org.apache.commons.math3.special.Gamma;
import org.microtally.Roots;
import org.microtally.InvalidInputException;
import org.microtally.special.Polylog;
import org.microtally.special.Zeta;
import org.microtally.units.Codata2018;
import org.microtally.units.Energy;
import org.microtally.units.EnergyUnit;

/**
 * The ideal Bose gas in the thermodynamic limit, for a power-law density of states
 * g(e) = C e^(alpha-1) with alpha &gt; 1 (a 3D box: alpha = 3/2; a 3D harmonic trap: alpha = 3).
 * Reference formulas to set next to the exact finite-N results of the ensemble package.
 *
 * <p><b>Formulas</b> (Bagnato, Pritchard and Kleppner, Phys. Rev. A 35, 4354 (1987); K. Huang,
 * Statistical Mechanics, 2nd ed., ch. 12; g_s = Li_s, {@link Polylog#li}):
 * <ul>
 *   <li>excited particles N_ex = C Gamma(alpha) (kT)^alpha g_alpha(z); critical temperature
 *       k T_c = [N / (C Gamma(alpha) zeta(alpha))]^(1/alpha): in a box n lambda_T^3 = zeta(3/2),
 *       in a harmonic trap k T_c = hbar omega_g (N / zeta(3))^(1/3);</li>
 *   <li>condensate fraction 1 - (T/T_c)^alpha below T_c, 0 above;</li>
 *   <li>fugacity z from g_alpha(z) = zeta(alpha) (T_c/T)^alpha above T_c (bracketed Brent solve in
 *       ln z on the proven bracket y/(1+y) &lt;= z &lt;= y, y the right side), z = 1 below;</li>
 *   <li>U/N = alpha kT g_{alpha+1}(z)/g_alpha(z) above T_c, alpha kT (T/T_c)^alpha zeta(alpha+1)/zeta(alpha)
 *       below; C/(N k) = alpha(alpha+1) g_{alpha+1}/g_alpha - alpha^2 g_alpha/g_{alpha-1} above,
 *       alpha(alpha+1) (zeta(alpha+1)/zeta(alpha)) (T/T_c)^alpha below;</li>
 *   <li>pressure (box only) P = (U/V)/alpha, i.e. 2U/(3V) in 3D.</li>
 * </ul>
 * <p>Temperatures go in as kelvin ({@code double kelvin}) and come out as an {@link Energy} (k T),
 * like every energy here: {@link #criticalThermalEnergy()}{@code .in(EnergyUnit.KELVIN)} is T_c in K.
 *
 * <p><b>Accuracy.</b> Fugacity, U/N and C/(N k) within {@value #MAX_RELATIVE_ERROR} relative, the
 * largest error measured against a committed 30-digit mpmath table (test resource
 * {@code limit/ideal-gas-mpmath.csv}, alpha = 3/2 and 3, T/T_c from 0.3 to 100), rounded up; it
 * comes from the Bose functions ({@link Polylog#MAX_RELATIVE_ERROR}) and the fugacity solve. The
 * formulas themselves are the thermodynamic limit (semiclassical density of states, zero-point
 * energy dropped), so finite-N corrections such as {@link #criticalTemperatureShift()} are separate.
 */
public final class BoseGas {
    /**
     * Largest relative error of fugacity, U/N and C/(N k) measured against the committed mpmath table
     * (test resource {@code limit/ideal-gas-mpmath.csv}), rounded up; LimitStatedAccuracyTest fails if any
     * row is worse, or if this figure is more than twice the measured maximum.
     */
    public static final double MAX_RELATIVE_ERROR = 3e-14;

    private final DensityOfStates dos;
    private final double amount;
    private final HarmonicTrap trap; // null unless built from a trap
    private final double criticalEnergy; // k T_c in J

    private BoseGas(DensityOfStates dos, double amount, HarmonicTrap trap) {
        this.dos = dos;
        this.amount = amount;
        this.trap = trap;
        double alpha = dos.exponent();
        if (alpha <= 1.0) {
            throw InvalidInputException.of("density-of-states exponent alpha for a Bose gas", alpha, "> 1",
                    "For alpha <= 1 (e.g. a 2D box) zeta(alpha) diverges and there is no condensation at T > 0.");
        }
        double gammaAlpha = Math.exp(Gamma.logGamma(alpha));
        this.criticalEnergy = Math.pow(amount / (dos.coefficient() * gammaAlpha * Zeta.zeta(alpha)), 1.0 / alpha);
    }

    /**
     * Spinless bosons of mass m in a 3D box at number density n.
     *
     * @param massKg       particle mass in kg (masses in u: times {@link Codata2018#ATOMIC_MASS_UNIT})
     * @param densityPerM3 number density n in m^-3
     */
    public static BoseGas inBox(double massKg, double densityPerM3) {
        Checks.positive("number density n (m^-3)", densityPerM3, "");
        return new BoseGas(DensityOfStates.box3D(massKg, 1), densityPerM3, null);
    }

    /** N spinless bosons in a 3D harmonic trap (any mass: the density of states does not depend on it). */
    public static BoseGas inHarmonicTrap(HarmonicTrap trap, double n) {
        Checks.positive("number of n N", n, "");
        return new BoseGas(DensityOfStates.harmonic(trap, 1), n, trap);
    }

    /**
     * Bosons with any power-law density of states; {@code amount} is a density in m^-3 if
     * {@code dos.perVolume()}, else a number of particles.
     */
    public static BoseGas of(DensityOfStates dos, double amount) {
        Checks.positive("particle amount (N, or n in m^-3 for a box)", amount, "");
        return new BoseGas(dos, amount, null);
    }

    /** The density of states used. */
    public DensityOfStates densityOfStates() {
        return dos;
    }

    /** The particle number N (trap) or density n in m^-3 (box). */
    public double amount() {
        return amount;
    }

    /** The trap, if this gas was built with {@link #inHarmonicTrap}. */
    public Optional<HarmonicTrap> trap() {
        return Optional.ofNullable(trap);
    }

    /**
     * k T_c = [N / (C Gamma(alpha) zeta(alpha))]^(1/alpha), the thermal energy at the condensation
     * temperature, shown in kelvin ({@code .in(EnergyUnit.KELVIN)} is T_c in K).
     */
    public Energy criticalThermalEnergy() {
        return Energy.of(criticalKelvin(), EnergyUnit.KELVIN);
    }

    private double criticalKelvin() {
        return criticalEnergy / Codata2018.BOLTZMANN;
    }

    /**
     * The leading finite-N shift of T_c in a 3D harmonic trap,
     * delta T_c / T_c = -zeta(2) / (2 zeta(3)^(2/3)) (omega_m / omega_g) N^(-1/3)
     * (~ -0.7275 (omega_m/omega_g) N^(-1/3); S. Grossmann and M. Holthaus, Z. Naturforsch. 50a, 921
     * (1995); W. Ketterle and N. J. van Druten, Phys. Rev. A 54, 656 (1996)). It comes from the
     * zero-point energy (3/2) hbar omega_m that the semiclassical density of states drops.
     *
     * @throws InvalidInputException if this gas is not in a harmonic trap
     */
    public double criticalTemperatureShift() {
        if (trap == null) {
            throw new InvalidInputException("criticalTemperatureShift() is defined for a gas built with "
                    + "BoseGas.inHarmonicTrap(trap, N); this gas has " + dos + ".");
        }
        double coefficient = Zeta.zeta(2.0) / (2.0 * Math.pow(Zeta.zeta(3.0), 2.0 / 3.0));
        return -coefficient * (trap.arithmeticMean() / trap.geometricMean()) * Math.pow(amount, -1.0 / 3.0);
    }

    /** The fugacity z = e^(mu/kT): 1 at and below T_c, solved from g_alpha(z) above. */
    public double fugacity(double kelvin) {
        return Math.exp(logFugacity(Checks.temperature(kelvin)));
    }

    /** The chemical potential mu = kT ln z (0 at and below T_c, negative above). */
    public Energy chemicalPotential(double kelvin) {
        double kt = Codata2018.BOLTZMANN * Checks.temperature(kelvin);
        return Energy.of(kt * logFugacity(kelvin), EnergyUnit.JOULE);
    }

    /** N_0/N = 1 - (T/T_c)^alpha below T_c, 0 above. */
    public double condensateFraction(double kelvin) {
        double t = Checks.temperature(kelvin) / criticalKelvin();
        return t >= 1.0 ? 0.0 : -Math.expm1(dos.exponent() * Math.log(t));
    }

    /** The mean energy per particle U/N (semiclassical; zero-point energy not included). */
    public Energy energyPerParticle(double kelvin) {
        double kt = Codata2018.BOLTZMANN * Checks.temperature(kelvin);
        double alpha = dos.exponent();
        double x = logFugacity(kelvin);
        double t = kelvin / criticalKelvin();
        double perKt;
        if (t <= 1.0) {
            perKt = alpha * Math.pow(t, alpha) * Zeta.zeta(alpha + 1.0) / Zeta.zeta(alpha);
        } else {
            double z = Math.exp(x);
            perKt = alpha * Polylog.li(alpha + 1.0, z) / Polylog.li(alpha, z);
        }
        return Energy.of(kt * perKt, EnergyUnit.JOULE);
    }

    /** The heat capacity per particle at fixed N (and volume), C/(N k), dimensionless. */
    public double heatCapacityPerParticle(double kelvin) {
        double alpha = dos.exponent();
        double t = Checks.temperature(kelvin) / criticalKelvin();
        if (t <= 1.0) {
            return alpha * (alpha + 1.0) * Zeta.zeta(alpha + 1.0) / Zeta.zeta(alpha) * Math.pow(t, alpha);
        }
        double z = Math.exp(logFugacity(kelvin));
        double gA = Polylog.li(alpha, z);
        double gAp1 = Polylog.li(alpha + 1.0, z);
        // at z = 1 (T within rounding of T_c) g_{alpha-1}(1) is infinite for alpha <= 2: the term vanishes
        double second = (z == 1.0 && alpha <= 2.0) ? 0.0 : alpha * alpha * gA / Polylog.li(alpha - 1.0, z);
        return alpha * (alpha + 1.0) * gAp1 / gA - second;
    }

    /**
     * The pressure in Pa, P = (U/V)/alpha (for a 3D box 2U/(3V)); below T_c only the excited
     * particles contribute, P = kT zeta(5/2)/lambda^3.
     *
     * @throws InvalidInputException if the density of states is not per volume (a trap has no pressure)
     */
    public double pressure(double kelvin) {
        return dos.pressureFromEnergyDensity(amount * energyPerParticle(kelvin).in(EnergyUnit.JOULE));
    }

    /**
     * A temperature sweep: T (K), T/T_c, fugacity, condensate fraction, U/(N k) (K), C/(N k).
     *
     * @param kelvins temperatures, each finite and &gt; 0
     */
    public ReferenceTable sweep(double... kelvins) {
        List<List<Object>> rows = new ArrayList<>();
        for (double t : kelvins) {
            rows.add(List.of(t, t / criticalKelvin(), fugacity(t), condensateFraction(t),
                    energyPerParticle(t).in(EnergyUnit.KELVIN), heatCapacityPerParticle(t)));
        }
        return new ReferenceTable(List.of("T (K)", "T/Tc", "fugacity", "condensate fraction", "U/(N k) (K)", "C/(N k)"),
                rows);
    }

    /** ln z: 0 at and below T_c, else the root of g_alpha(e^x) = zeta(alpha) (T_c/T)^alpha. */
    private double logFugacity(double kelvin) {
        double alpha = dos.exponent();
        double t = kelvin / criticalKelvin();
        if (t <= 1.0) {
            return 0.0;
        }
        double y = Zeta.zeta(alpha) * Math.pow(t, -alpha);
        // Li_alpha(z) >= z and Li_alpha(z) <= z/(1-z) for alpha >= 0 bracket the root: y/(1+y) <= z <= y.
        double lo = Math.log(y / (1.0 + y));
        double hi = Math.min(Math.log(y), 0.0);
        if (hi == 0.0 && lo == 0.0) {
            return 0.0;
        }
        double lnY = Math.log(y);
        return Roots.solve("ln fugacity of the Bose gas", x -> {
            if (x >= 0.0) {
                return Math.log(Zeta.zeta(alpha)) - lnY;
            }
            return Math.log(Polylog.li(alpha, Math.exp(x))) - lnY;
        }, lo, hi, Double.MIN_NORMAL, 1e-16);
    }

    @Override
    public String toString() {
        return "ideal Bose gas (" + dos + "), amount " + amount + ", T_c = " + criticalKelvin() + " K";
    }
}
