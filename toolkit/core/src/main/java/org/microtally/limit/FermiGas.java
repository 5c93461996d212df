package org.microtally.limit;

import java.util.ArrayList;
import java.util.List;
import org.apache.commons.math3.special.Gamma;
import org.microtally.Roots;
import org.microtally.InvalidInputException;
import org.microtally.special.FermiDirac;
import org.microtally.special.Zeta;
import org.microtally.units.Codata2018;
import org.microtally.units.Energy;
import org.microtally.units.EnergyUnit;

/**
 * The ideal Fermi gas in the thermodynamic limit, for a power-law density of states
 * g(e) = C e^(alpha-1) (3D box: alpha = 3/2; 3D harmonic trap: alpha = 3; 2D oscillator: alpha = 2).
 *
 * <p><b>Formulas.</b> Fermi energy from C E_F^alpha / alpha = N: in a box
 * E_F = hbar^2/(2m) (6 pi^2 n / g_s)^(2/3) (free electrons, g_s = 2: (3 pi^2 n)^(2/3); N. W. Ashcroft and
 * N. D. Mermin, Solid State Physics (1976), ch. 2 and Table 2.1), in a 3D harmonic trap
 * E_F = hbar omega_g (6N/g_s)^(1/3), in a 2D oscillator E_F = hbar omega (2N/g_s)^(1/2); T_F = E_F/k.
 * At temperature T with eta = mu/kT and F_j the complete Fermi-Dirac integral
 * ({@link FermiDirac#integral}):
 * <ul>
 *   <li>N = C Gamma(alpha) (kT)^alpha F_{alpha-1}(eta), so eta solves
 *       F_{alpha-1}(eta) = (T_F/T)^alpha / Gamma(alpha+1) (bracketed Brent solve in eta; the lower end
 *       ln of the right side is a proven bracket since F_j(eta) &lt;= e^eta);</li>
 *   <li>U/N = alpha kT F_alpha(eta) / F_{alpha-1}(eta);</li>
 *   <li>C/(N k) = alpha(alpha+1) F_alpha/F_{alpha-1} - alpha^2 F_{alpha-1}/F_{alpha-2}; for eta &gt;= 60 the two
 *       terms nearly cancel (by a factor ~eta^2), so the difference is summed from the Sommerfeld series of
 *       the three functions instead, term by term without cancellation;</li>
 *   <li>pressure (box only) P = (U/V)/alpha.</li>
 * </ul>
 * Sommerfeld expansion to second order (A. Sommerfeld, Z. Phys. 47, 1 (1928); Ashcroft and Mermin
 * ch. 2), with t = kT/E_F: mu = E_F [1 - (pi^2/6)(alpha-1) t^2], U/N = alpha/(alpha+1) E_F
 * [1 + (pi^2/6)(alpha+1) t^2], C/(N k) = (pi^2/3) alpha t (pi^2/2 T/T_F in a 3D box).
 *
 * <p>Temperatures go in as kelvin ({@code double kelvin}) and come out as an {@link Energy}:
 * {@link #fermiEnergy()}{@code .in(EnergyUnit.KELVIN)} is T_F in K.
 *
 * <p><b>Accuracy</b> of the exact route: U/N within {@value #MAX_RELATIVE_ERROR} relative, C/(N k)
 * within {@value #MAX_HEAT_CAPACITY_ERROR} relative, mu within {@value #MAX_CHEMICAL_POTENTIAL_ERROR}
 * of max(|mu|, kT); the largest errors measured against a committed 30-digit mpmath table (test
 * resource {@code limit/ideal-gas-mpmath.csv}, alpha = 3/2, 2 and 3, T/T_F from 0.001 to 100),
 * rounded up. They come from the Fermi-Dirac integrals ({@link FermiDirac#MAX_RELATIVE_ERROR}) and
 * the eta solve; C/(N k) is a difference of two terms that cancel by a factor ~eta^2 when the gas is
 * degenerate, so it is worst just below the switch to the series at eta = 60 (T/T_F ~ 0.02 in a
 * box). The Sommerfeld methods are truncated expansions: their error is the next order in
 * (kT/E_F)^2, not a rounding figure.
 */
public final class FermiGas {
    /**
     * Largest relative error of U/N measured against the committed mpmath table, rounded up;
     * LimitStatedAccuracyTest fails if any row is worse, or if this is more than twice the maximum.
     */
    public static final double MAX_RELATIVE_ERROR = 1.5e-15;
    /** Largest relative error of C/(N k) measured against the same table, rounded up (checked the same way). */
    public static final double MAX_HEAT_CAPACITY_ERROR = 1e-12;
    /**
     * Largest error of mu relative to max(|mu|, kT) measured against the same table, rounded up
     * (checked the same way).
     */
    public static final double MAX_CHEMICAL_POTENTIAL_ERROR = 1e-15;

    private static final double SERIES_FROM_ETA = 60.0;

    private final DensityOfStates dos;
    private final double amount;
    private final double fermiEnergy; // J

    private FermiGas(DensityOfStates dos, double amount) {
        this.dos = dos;
        this.amount = amount;
        double alpha = dos.exponent();
        this.fermiEnergy = Math.pow(alpha * amount / dos.coefficient(), 1.0 / alpha);
    }

    /**
     * Fermions of mass m and spin degeneracy g_s in a 3D box at number density n.
     *
     * @param massKg          particle mass in kg
     * @param densityPerM3    number density n in m^-3 (all spin states together)
     * @param spinDegeneracy  g_s, 2 for spin-1/2
     */
    public static FermiGas inBox(double massKg, double densityPerM3, int spinDegeneracy) {
        Checks.positive("number density n (m^-3)", densityPerM3, "");
        return new FermiGas(DensityOfStates.box3D(massKg, spinDegeneracy), densityPerM3);
    }

    /** The free-electron gas of a metal: electron mass, g_s = 2, conduction-electron density n in m^-3. */
    public static FermiGas freeElectrons(double densityPerM3) {
        return inBox(Codata2018.ELECTRON_MASS, densityPerM3, 2);
    }

    /** N fermions of one species (g_s = 1, e.g. spin-polarised atoms) in a 3D harmonic trap. */
    public static FermiGas inHarmonicTrap(HarmonicTrap trap, double particlesPerSpecies) {
        Checks.positive("number of fermions per species N", particlesPerSpecies, "");
        return new FermiGas(DensityOfStates.harmonic(trap, 1), particlesPerSpecies);
    }

    /** N fermions in a 2D isotropic oscillator of angular frequency omega (rad/s), spin degeneracy g_s. */
    public static FermiGas inOscillator2D(double omega, double particles, int spinDegeneracy) {
        Checks.positive("number of fermions N", particles, "");
        return new FermiGas(DensityOfStates.harmonic2D(omega, spinDegeneracy), particles);
    }

    /** Fermions with any power-law density of states ({@code amount}: n in m^-3 if per volume, else N). */
    public static FermiGas of(DensityOfStates dos, double amount) {
        Checks.positive("particle amount (N, or n in m^-3 for a box)", amount, "");
        return new FermiGas(dos, amount);
    }

    /** The density of states used. */
    public DensityOfStates densityOfStates() {
        return dos;
    }

    /** The Fermi energy E_F (chemical potential at T = 0). */
    public Energy fermiEnergy() {
        return Energy.of(fermiEnergy, EnergyUnit.JOULE);
    }

    private double fermiKelvin() {
        return fermiEnergy / Codata2018.BOLTZMANN;
    }

    /** The ground-state energy per particle, alpha/(alpha+1) E_F (3/5 E_F in a 3D box). */
    public Energy groundStateEnergyPerParticle() {
        double alpha = dos.exponent();
        return Energy.of(alpha / (alpha + 1.0) * fermiEnergy, EnergyUnit.JOULE);
    }

    /** The chemical potential at temperature T, solved exactly from F_{alpha-1}(mu/kT). */
    public Energy chemicalPotential(double kelvin) {
        double kt = Codata2018.BOLTZMANN * Checks.temperature(kelvin);
        return Energy.of(kt * reducedChemicalPotential(kelvin), EnergyUnit.JOULE);
    }

    /** Sommerfeld to second order: mu = E_F [1 - (pi^2/6)(alpha-1)(kT/E_F)^2]. */
    public Energy sommerfeldChemicalPotential(double kelvin) {
        double t = Checks.temperature(kelvin) / fermiKelvin();
        return Energy.of(fermiEnergy * (1.0 - Math.PI * Math.PI / 6.0 * (dos.exponent() - 1.0) * t * t), EnergyUnit.JOULE);
    }

    /** The mean energy per particle U/N = alpha kT F_alpha(eta)/F_{alpha-1}(eta). */
    public Energy energyPerParticle(double kelvin) {
        double kt = Codata2018.BOLTZMANN * Checks.temperature(kelvin);
        double alpha = dos.exponent();
        double eta = reducedChemicalPotential(kelvin);
        return Energy.of(alpha * kt * FermiDirac.integral(alpha, eta) / FermiDirac.integral(alpha - 1.0, eta),
                EnergyUnit.JOULE);
    }

    /** Sommerfeld to second order: U/N = alpha/(alpha+1) E_F [1 + (pi^2/6)(alpha+1)(kT/E_F)^2]. */
    public Energy sommerfeldEnergyPerParticle(double kelvin) {
        double t = Checks.temperature(kelvin) / fermiKelvin();
        double alpha = dos.exponent();
        return Energy.of(alpha / (alpha + 1.0) * fermiEnergy * (1.0 + Math.PI * Math.PI / 6.0 * (alpha + 1.0) * t * t),
                EnergyUnit.JOULE);
    }

    /**
     * The heat capacity per particle at fixed N (and volume), C/(N k).
     *
     * @throws InvalidInputException for alpha &lt; 1, where F_{alpha-2} has order &lt; -1
     */
    public double heatCapacityPerParticle(double kelvin) {
        double alpha = dos.exponent();
        if (alpha < 1.0) {
            throw InvalidInputException.of("density-of-states exponent alpha for the Fermi heat capacity", alpha, ">= 1",
                    "The formula needs F_{alpha-2} with alpha - 2 >= -1.");
        }
        double eta = reducedChemicalPotential(Checks.temperature(kelvin));
        if (eta >= SERIES_FROM_ETA) {
            return degenerateHeatCapacity(alpha, eta);
        }
        double f0 = FermiDirac.integral(alpha, eta);
        double f1 = FermiDirac.integral(alpha - 1.0, eta);
        double f2 = alpha == 1.0 ? 1.0 / (1.0 + Math.exp(-eta)) : FermiDirac.integral(alpha - 2.0, eta); // F_-1 = logistic
        return alpha * (alpha + 1.0) * f0 / f1 - alpha * alpha * f1 / f2;
    }

    /** Sommerfeld to first order: C/(N k) = (pi^2/3) alpha T/T_F. */
    public double sommerfeldHeatCapacityPerParticle(double kelvin) {
        return Math.PI * Math.PI / 3.0 * dos.exponent() * Checks.temperature(kelvin) / fermiKelvin();
    }

    /**
     * The pressure in Pa, P = (U/V)/alpha (2U/(3V) in a 3D box).
     *
     * @throws InvalidInputException if the density of states is not per volume
     */
    public double pressure(double kelvin) {
        return dos.pressureFromEnergyDensity(amount * energyPerParticle(kelvin).in(EnergyUnit.JOULE));
    }

    /**
     * A temperature sweep with the exact values next to the Sommerfeld expansion: T (K), T/T_F,
     * mu/E_F exact and Sommerfeld, U/(N E_F) exact and Sommerfeld, C/(N k) exact and Sommerfeld.
     */
    public ReferenceTable sweep(double... kelvins) {
        List<List<Object>> rows = new ArrayList<>();
        Energy ef = fermiEnergy();
        for (double t : kelvins) {
            rows.add(List.of(t, t / fermiKelvin(),
                    chemicalPotential(t).ratio(ef), sommerfeldChemicalPotential(t).ratio(ef),
                    energyPerParticle(t).ratio(ef), sommerfeldEnergyPerParticle(t).ratio(ef),
                    heatCapacityPerParticle(t), sommerfeldHeatCapacityPerParticle(t)));
        }
        return new ReferenceTable(List.of("T (K)", "T/TF", "mu/EF", "mu/EF Sommerfeld", "U/(N EF)",
                "U/(N EF) Sommerfeld", "C/(N k)", "C/(N k) Sommerfeld"), rows);
    }

    /** eta = mu/kT, the root of F_{alpha-1}(eta) = (T_F/T)^alpha / Gamma(alpha+1). */
    private double reducedChemicalPotential(double kelvin) {
        double alpha = dos.exponent();
        double j = alpha - 1.0;
        double lnY = alpha * Math.log(fermiKelvin() / kelvin) - Gamma.logGamma(alpha + 1.0);
        double lo = lnY; // F_j(eta) <= e^eta, so F_j(lnY) <= Y
        double hi = Math.max(lnY, 0.0) + 1.0;
        double leadingRoot = Math.exp((lnY + Gamma.logGamma(alpha + 1.0)) / alpha); // eta^(j+1)/Gamma(j+2) = Y
        hi = Math.max(hi, leadingRoot + 1.0);
        for (int i = 0; i < 200 && Math.log(FermiDirac.integral(j, hi)) < lnY; i++) {
            hi = 2.0 * hi + 1.0;
        }
        if (lo >= hi) {
            lo = hi - 1.0;
        }
        while (Math.log(FermiDirac.integral(j, lo)) > lnY) {
            lo -= Math.max(1.0, Math.abs(lo));
        }
        return Roots.solve("degeneracy parameter eta = mu/kT", e -> Math.log(FermiDirac.integral(j, e)) - lnY, lo, hi,
                1e-15, 1e-16);
    }

    /**
     * C/(N k) for large eta without cancellation: with F_j(eta) = eta^(j+1)/Gamma(j+2) S_j(eta),
     * S_j = sum_k c_k(j) eta^-2k, c_k(j) = 2 eta_D(2k) (j+1) j ... (j+2-2k), c_0 = 1 (the Sommerfeld
     * series of {@link FermiDirac}), C/(N k) = alpha eta (S_alpha S_{alpha-2} - S_{alpha-1}^2)/(S_{alpha-1} S_{alpha-2}),
     * and the numerator is summed coefficient by coefficient (its constant term cancels exactly).
     */
    private static double degenerateHeatCapacity(double alpha, double eta) {
        int terms = 25;
        double[] a = sommerfeldCoefficients(alpha, terms);
        double[] b = sommerfeldCoefficients(alpha - 1.0, terms);
        double[] c = sommerfeldCoefficients(alpha - 2.0, terms);
        double x = 1.0 / (eta * eta);
        double numerator = 0.0;
        double sB = 0.0;
        double sC = 0.0;
        double xk = 1.0;
        double previous = Double.POSITIVE_INFINITY;
        for (int k = 0; k < terms; k++) {
            double nk = 0.0;
            for (int i = 0; i <= k; i++) {
                nk += a[i] * c[k - i] - b[i] * b[k - i];
            }
            double term = nk * xk;
            if (k > 1 && Math.abs(term) > previous) {
                break; // asymptotic: stop at the smallest term (far below double precision for eta >= 60)
            }
            numerator += term;
            sB += b[k] * xk;
            sC += c[k] * xk;
            if (k > 1) {
                previous = Math.abs(term);
            }
            xk *= x;
        }
        return alpha * eta * numerator / (sB * sC);
    }

    /** Dirichlet eta(2k) = (1 - 2^(1-2k)) zeta(2k), k = 1 .. 24 (index 0 unused). */
    private static final double[] ETA_EVEN = new double[25];

    static {
        for (int k = 1; k < ETA_EVEN.length; k++) {
            ETA_EVEN[k] = -Math.expm1((1.0 - 2.0 * k) * Math.log(2.0)) * Zeta.zeta(2.0 * k);
        }
    }

    private static double[] sommerfeldCoefficients(double j, int terms) {
        double[] c = new double[terms];
        c[0] = 1.0;
        double product = 1.0;
        for (int k = 1; k < terms; k++) {
            product *= (j + 1.0 - (2 * k - 2)) * (j + 1.0 - (2 * k - 1));
            c[k] = 2.0 * ETA_EVEN[k] * product;
        }
        return c;
    }

    @Override
    public String toString() {
        return "ideal Fermi gas (" + dos + "), amount " + amount + ", E_F = " + fermiEnergy().in(EnergyUnit.ELECTRONVOLT)
                + " eV, T_F = " + fermiKelvin() + " K";
    }
}
