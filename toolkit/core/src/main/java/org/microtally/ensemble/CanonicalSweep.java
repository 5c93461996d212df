package org.microtally.ensemble;

import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.Objects;
import org.microtally.Inputs;
import org.microtally.InvalidInputException;
import org.microtally.Tabular;
import org.microtally.occupation.ChemicalPotential;
import org.microtally.spectrum.Spectrum;
import org.microtally.spectrum.Statistics;

/**
 * A canonical sweep over the particle number at one temperature: ln Z_n, F_n, U_n, S_n, Var E_n and
 * C_n for every n = 0..N of ideal particles on one spectrum, with the chemical potential mu_n = F_n - F_{n-1}, the
 * addition energy Delta_n = mu_{n+1} - mu_n = F_{n+1} - 2 F_n + F_{n-1} (the "charging" spectrum of
 * a quantum dot, shell closings) and the odd-even staggering
 * Delta3_n = (-1)^n (F_{n+1} - 2 F_n + F_{n-1}) / 2 (the three-point parity indicator of nuclear
 * and cluster physics; W. Satula, J. Dobaczewski and W. Nazarewicz, PRL 81, 3599 (1998); from memory).
 * Immutable.
 *
 * <h2>Method</h2>
 * The generating product prod_states f(y_s t) of {@link Canonical} (positive-term elementary /
 * complete symmetric-polynomial recurrences, Boltzmann factors fugacity-scaled by a grand canonical
 * chemical potential mu*) holds Z_n e^{beta mu* n} for every n &lt;= N as its coefficients, so one
 * pass gives all n whose coefficient is representable to full accuracy. The pass uses mu* for the
 * largest n still missing; coefficients far from the peak of the grand canonical number distribution
 * at that mu* are flushed or lose relative accuracy to flushing, so n is accepted from a pass only when
 * the flushing bound S (n_max + 1) 2^-1073 / P_GC(n; mu*) (as on {@link Canonical}) is below 1e-12;
 * the remaining n get further passes at lower mu*. {@link #passes()} says how many were needed (one
 * when the whole range fits, e.g. bosons or high T; of order N / sqrt(Var_GC N) for cold fermions).
 * Each pass also carries the first energy moment with energies measured from the ground level
 * (non-negative terms only), so U_n = n e_0 + u_n / c_n, and the second moment v_n (also
 * non-negative), so Var E_n = v_n / c_n - (u_n / c_n)^2 with its cancellation bounded (absolute
 * error 2 (S + n) 2^-53 (v_n/c_n + (u_n/c_n)^2), refused above 1e-6 max(Var, kT^2)); for Fermi and
 * Gentile statistics the states are multiplied in one at a time and the moment entries below the series' first non-zero
 * coefficient are zeroed after each (stale entries there would otherwise feed back into the moments
 * as the support moves up). Distinguishable particles use the closed form
 * Z_n = Z_1^n.
 *
 * <h2>Accuracy</h2>
 * Every ln Z_n has an absolute error below (S + n) 2^-53 + 1e-12 (the relative bound of Z_n stated on
 * {@link Canonical}, S = number of states, plus the flushing bound enforced above); U_n the same
 * relative bound. mu_n, Delta_n and Delta3_n are differences of ln Z, so their absolute error is
 * about 2 kT, 4 kT and 2 kT times that bound, independent of n (no loss relative to the size of F).
 * Cost: one forward pass per {@link #passes()}, each at most S x (its largest n) multiply-adds,
 * three arrays wide (the energy moment rides along).
 *
 * <p>Model limits: ideal particles; the truncation warning is the grand canonical estimate at the
 * largest N (smaller n are less affected by a cutoff).
 */
public final class CanonicalSweep implements Tabular {
    /** Largest flushing bound S(N+1) 2^-1073 / P_GC(n) accepted for an n read from a pass (relative error of Z_n). */
    public static final double FLUSH_TOLERANCE = 1e-12;

    private final Spectrum spectrum;
    private final Statistics statistics;
    private final double kT;
    private final double[] lnZ;
    private final double[] energy;
    private final double[] energyVariance;
    private final double[] varianceError;
    private final int passes;
    private final List<String> warnings;

    private CanonicalSweep(Spectrum spectrum, Statistics statistics, double kT, double[] lnZ, double[] energy,
                           double[] energyVariance, double[] varianceError, int passes, List<String> warnings) {
        this.spectrum = spectrum;
        this.statistics = statistics;
        this.kT = kT;
        this.lnZ = lnZ;
        this.energy = energy;
        this.energyVariance = energyVariance;
        this.varianceError = varianceError;
        this.passes = passes;
        this.warnings = Collections.unmodifiableList(warnings);
    }

    /**
     * The sweep n = 0..{@code maxN} at temperature {@code kT}.
     *
     * @throws InvalidInputException for kT &lt;= 0 or not finite, maxN &lt; 1 or above 10^6, or maxN
     *                               above the capacity of a capped spectrum
     */
    public static CanonicalSweep of(Spectrum spectrum, Statistics statistics, int maxN, double kT) {
        Objects.requireNonNull(spectrum, "spectrum");
        Objects.requireNonNull(statistics, "statistics");
        Inputs.temperature(kT);
        Inputs.particleNumber("largest particle number N of the sweep", maxN, 1_000_000, "");
        Inputs.withinCapacity("largest particle number N of the sweep", maxN, statistics.maxOccupancy(),
                spectrum.stateCount());
        double beta = 1 / kT;
        double[] lnZ = new double[maxN + 1];
        double[] u = new double[maxN + 1];
        double[] var = new double[maxN + 1];
        double[] varErr = new double[maxN + 1];
        List<String> warnings = new ArrayList<>();
        double e0 = spectrum.groundEnergy();
        if (!statistics.indistinguishable()) {
            OneParticleMoments one = OneParticleMoments.of(spectrum, beta);
            for (int n = 0; n <= maxN; n++) {
                lnZ[n] = n * one.lnZ1();
                u[n] = n * (e0 + one.meanExcitation());
                var[n] = n * one.excitationVariance();
                varErr[n] = 4 * spectrum.size() * 0x1p-53 * var[n];
            }
            warnings.addAll(GrandCanonical.ofMeanNumber(spectrum, statistics, kT, maxN).warnings());
            return new CanonicalSweep(spectrum, statistics, kT, lnZ, u, var, varErr, 0, warnings);
        }
        boolean[] done = new boolean[maxN + 1];
        done[0] = true;
        int passes = 0;
        int missing = maxN;
        double capacity = statistics.capped() ? (double) statistics.maxOccupancy() * spectrum.stateCount()
                : Double.POSITIVE_INFINITY;
        double lnStates = Math.log((double) spectrum.stateCount());
        while (missing > 0) {
            int target = missing;
            double mu = ChemicalPotential.forMeanNumber(spectrum, statistics, kT, Math.min(target, capacity - 0.5));
            GrandCanonical gc = GrandCanonical.ofChemicalPotential(spectrum, statistics, kT, mu);
            if (passes == 0) {
                warnings.addAll(gc.warnings());
            }
            ScaledSeries z = pass(spectrum, statistics, target, beta, mu);
            passes++;
            double lnBoundBase = lnStates + Math.log(target + 1.0) - 1073 * Math.log(2.0) - Math.log(FLUSH_TOLERANCE);
            for (int n = 1; n <= target; n++) {
                if (done[n]) {
                    continue;
                }
                double lc = z.logCoefficient(n);
                if (lc == Double.NEGATIVE_INFINITY || lnBoundBase - (lc - gc.lnXi()) > 0) {
                    continue;
                }
                lnZ[n] = lc - beta * mu * n;
                double m1 = z.u[n] / z.c[n];
                double m2 = z.v[n] / z.c[n];
                u[n] = n * e0 + m1;
                var[n] = m2 - m1 * m1;
                // the three moments carry relative errors <= (S + n) 2^-53 each (non-negative terms), so
                // the difference has an absolute error below 2 (S + n) 2^-53 (m2 + m1^2)
                varErr[n] = 2 * (spectrum.stateCount() + n) * 0x1p-53 * (m2 + m1 * m1);
                done[n] = true;
            }
            if (!done[target]) {
                throw new IllegalStateException("canonical sweep: the pass at mu* = " + mu + " did not resolve n = "
                        + target + " to the flushing tolerance; please report this input");
            }
            while (missing > 0 && done[missing]) {
                missing--;
            }
        }
        return new CanonicalSweep(spectrum, statistics, kT, lnZ, u, var, varErr, passes, warnings);
    }

    /** One forward pass truncated at t^target with the first energy moment from the ground level. */
    private static ScaledSeries pass(Spectrum s, Statistics st, int target, double beta, double mu) {
        int m = s.size();
        int cap = st.capped() ? st.maxOccupancy() : Integer.MAX_VALUE;
        double e0 = s.groundEnergy();
        ScaledSeries z = new ScaledSeries(target, true);
        int cleared = 0;
        for (int step = 0; step < m; step++) {
            int i = st.capped() ? step : m - 1 - step;
            double lnY = -beta * (s.energy(i) - mu);
            if (!st.capped()) {
                z.multiplyStates(s.degeneracy(i), lnY, cap, s.energy(i) - e0);
                continue;
            }
            // capped steps move the series' lower support bound up; the moment entries below it must
            // be zero before the next state is multiplied in, so states go one at a time here
            for (int g = 0; g < s.degeneracy(i); g++) {
                z.multiplyStates(1, lnY, cap, s.energy(i) - e0);
                cleared = clearMomentsBelowSupport(z, cleared);
            }
        }
        return z;
    }

    /**
     * Zeroes the moment companions from {@code from} up to the first non-zero coefficient (below it they
     * are no longer valid); returns the new bound.
     */
    private static int clearMomentsBelowSupport(ScaledSeries z, int from) {
        for (int m = from; m < z.low; m++) {
            z.u[m] = 0;
            z.v[m] = 0;
        }
        return Math.max(from, z.low);
    }

    private void checkN(int n, int lo, int hi) {
        if (n < lo || n > hi) {
            throw InvalidInputException.of("particle number n", n, "in [" + lo + ", " + hi + "]",
                    hi < lnZ.length - 1 ? "This quantity needs n + 1 in the sweep too." : "Sweep to a larger N.");
        }
    }

    /** The spectrum. */
    public Spectrum spectrum() {
        return spectrum;
    }

    /** The statistics. */
    public Statistics statistics() {
        return statistics;
    }

    /** Temperature kT. */
    public double kT() {
        return kT;
    }

    /** Largest particle number N of the sweep. */
    public int maxParticles() {
        return lnZ.length - 1;
    }

    /** Number of forward passes used (0 for distinguishable particles, closed form). */
    public int passes() {
        return passes;
    }

    /** ln Z_n, n = 0..N (ln Z_0 = 0). */
    public double lnZ(int n) {
        checkN(n, 0, lnZ.length - 1);
        return lnZ[n];
    }

    /** F_n = -kT ln Z_n. */
    public double freeEnergy(int n) {
        return -kT * lnZ(n);
    }

    /** U_n, the canonical mean energy of n particles (U_0 = 0). */
    public double energy(int n) {
        checkN(n, 0, lnZ.length - 1);
        return energy[n];
    }

    /**
     * Var E_n = &lt;E^2&gt;_n - U_n^2, from the non-negative moments of E - n e_0 carried in the pass
     * (a value below 0 by rounding is returned as 0); its absolute error bound is
     * {@link #energyVarianceError(int)}, which includes the cancellation of the difference.
     *
     * @throws InvalidInputException when that bound exceeds 1e-6 max(Var E_n, (kT)^2), i.e. C_n would
     *                               carry an error above 1e-6 max(C_n, 1); then use {@link Canonical}
     *                               at this n, which measures energies from U/N
     */
    public double energyVariance(int n) {
        checkN(n, 0, lnZ.length - 1);
        double v = Math.max(0.0, energyVariance[n]);
        if (varianceError[n] > 1e-6 * Math.max(v, kT * kT)) {
            throw InvalidInputException.of("absolute error bound of Var E at n = " + n, varianceError[n],
                    "<= 1e-6 max(Var E, kT^2) = " + 1e-6 * Math.max(v, kT * kT),
                    "The spread of the energy is tiny next to its mean excitation here; use Canonical.of(..., " + n
                            + ", kT).energyVariance().");
        }
        return v;
    }

    /** The absolute error bound of {@link #energyVariance(int)} (rounding times the cancellation). */
    public double energyVarianceError(int n) {
        checkN(n, 0, lnZ.length - 1);
        return varianceError[n];
    }

    /** C_n/k = Var E_n / (kT)^2, refused like {@link #energyVariance(int)}. */
    public double heatCapacity(int n) {
        return energyVariance(n) / (kT * kT);
    }

    /** S_n/k = ln Z_n + U_n/kT. */
    public double entropy(int n) {
        return lnZ(n) + energy(n) / kT;
    }

    /** mu_n = F_n - F_{n-1} = -kT (ln Z_n - ln Z_{n-1}), n = 1..N. */
    public double chemicalPotential(int n) {
        checkN(n, 1, lnZ.length - 1);
        return -kT * (lnZ[n] - lnZ[n - 1]);
    }

    /** Addition energy Delta_n = mu_{n+1} - mu_n = F_{n+1} - 2F_n + F_{n-1}, n = 1..N-1. */
    public double additionEnergy(int n) {
        checkN(n, 1, lnZ.length - 2);
        return -kT * (lnZ[n + 1] - 2 * lnZ[n] + lnZ[n - 1]);
    }

    /** Odd-even staggering Delta3_n = (-1)^n (F_{n+1} - 2F_n + F_{n-1}) / 2, n = 1..N-1. */
    public double oddEvenStaggering(int n) {
        return (n % 2 == 0 ? 0.5 : -0.5) * additionEnergy(n);
    }

    /** ln Z_0..ln Z_N (a copy). */
    public double[] lnZValues() {
        return lnZ.clone();
    }

    /** Warnings (cutoff that matters at the largest N); empty when none. */
    public List<String> warnings() {
        return warnings;
    }

    /** Columns n, ln Z, F, U, S/k, C/k, mu, addition energy, odd-even staggering. */
    @Override
    public List<String> columnNames() {
        return List.of("n", "ln Z", "F", "U", "S/k", "C/k", "mu", "addition energy", "odd-even staggering");
    }

    /**
     * One row per n = 0..N; cells without a value (mu at n = 0, differences at the ends, C where
     * {@link #heatCapacity(int)} refuses) are empty strings.
     */
    @Override
    public List<List<Object>> rows() {
        int top = lnZ.length - 1;
        List<List<Object>> r = new ArrayList<>(top + 1);
        for (int n = 0; n <= top; n++) {
            Object mu = n >= 1 ? chemicalPotential(n) : "";
            Object add = n >= 1 && n < top ? additionEnergy(n) : "";
            Object stag = n >= 1 && n < top ? oddEvenStaggering(n) : "";
            double v = Math.max(0.0, energyVariance[n]);
            Object c = varianceError[n] <= 1e-6 * Math.max(v, kT * kT) ? v / (kT * kT) : "";
            r.add(List.of(n, lnZ[n], freeEnergy(n), energy[n], entropy(n), c, mu, add, stag));
        }
        return r;
    }

    @Override
    public String toString() {
        return "CanonicalSweep[" + statistics + ", n = 0.." + (lnZ.length - 1) + ", kT=" + kT + ", " + passes
                + " pass(es)" + (warnings.isEmpty() ? "" : ", " + warnings.size() + " warning(s)") + "]";
    }
}
