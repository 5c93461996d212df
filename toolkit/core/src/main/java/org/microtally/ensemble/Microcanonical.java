package org.microtally.ensemble;

import java.math.BigInteger;
import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.Objects;
import org.apache.commons.math3.fraction.BigFraction;
import org.microtally.Inputs;
import org.microtally.InvalidInputException;
import org.microtally.Missing;
import org.microtally.ProgressListener;
import org.microtally.Tabular;
import org.microtally.count.CountTable;
import org.microtally.exact.ExactLog;
import org.microtally.exact.ExactRatio;
import org.microtally.occupation.LevelOccupations;
import org.microtally.spectrum.Spectrum;
import org.microtally.spectrum.Statistics;

/**
 * The microcanonical ensemble (fixed N, E) of ideal particles on an integer spectrum, from the exact
 * count table Omega(N, E) of {@link CountTable}.
 *
 * <h2>Definitions (k = 1, energies in quanta of the spectrum's unit)</h2>
 * <ul>
 *   <li>Boltzmann entropy S_B(E) = ln Omega(N, E); Gibbs entropy S_G(E) = ln sum_{E' &lt;= E} Omega(N, E')
 *       (the number of states with energy at most E). The distinction, and why S_G never gives a
 *       negative temperature while S_B does for bounded spectra above half filling, is discussed by
 *       Dunkel &amp; Hilbert, Nature Physics 10, 67 (2014).</li>
 *   <li>Inverse temperatures by the central difference on the energy grid of step d (d = gcd of the
 *       level spacings, so every grid point can be reached): beta(E) = (S(E + d) - S(E - d)) / (2 d);
 *       kT = 1/beta where beta != 0. Defined where Omega is non-zero at E - d, E, E + d (Gibbs: where the
 *       cumulative count is non-zero at E - d).</li>
 *   <li>Heat capacity from the Boltzmann entropy, C(E) = -beta^2 / S''(E) with
 *       S''(E) = (S(E + d) - 2 S(E) + S(E - d)) / d^2 (dE/dT of T = 1/S'); undefined where S'' = 0.</li>
 *   <li>Mean occupation of one state s of level i at fixed (N, E), exact: P(n_s = j) =
 *       W_s(N - j, E - j e_i) / Omega(N, E) with W_s the counts of the spectrum without state s,
 *       obtained from Omega by exact integer division of the generating function by the state's factor
 *       (W(n, e) = Omega(n, e) - sum_{j=1..k} W(n - j, e - j e_i); bosons: W = Omega(n, e) -
 *       Omega(n - 1, e - e_i)), evaluated along the line (N - m, E - m e_i) only. Distinguishable
 *       particles: &lt;n_s&gt; = N Omega(N - 1, E - e_i) / Omega(N, E). The mean is an exact
 *       {@link BigFraction}, converted to double only at the end
 *       (correctly rounded, by {@link ExactRatio}).</li>
 * </ul>
 * Accuracy: counts exact; logarithms within 2 ulp ({@link CountTable#lnCount}); finite differences
 * carry the O(d^2 S''') discretisation error of a central difference, which is the meaning of a
 * temperature on a discrete grid, not a rounding error.
 */
public final class Microcanonical implements Tabular {
    /** Relative agreement of C from steps d and 2d below which {@link #isHeatCapacityResolved} says no. */
    public static final double HEAT_CAPACITY_STEP_AGREEMENT = 0.1;
    private final CountTable table;
    private final int n;
    private final int step;
    private final int maxE;
    private final BigInteger[] cumulative;
    private final List<String> warnings;
    private final Counting counting;
    private final double lnDivisor;

    private Microcanonical(CountTable table, int n, Counting counting) {
        this.counting = Counting.require(table.statistics(), counting);
        this.lnDivisor = counting.lnDivisor(n);
        this.table = table;
        this.n = n;
        this.maxE = table.maxEnergy();
        this.step = gridStep(table.spectrum());
        this.cumulative = new BigInteger[maxE + 1];
        BigInteger s = BigInteger.ZERO;
        for (int e = 0; e <= maxE; e++) {
            s = s.add(table.count(n, e));
            cumulative[e] = s;
        }
        int complete = table.completeThroughEnergy();
        this.warnings = complete < maxE
                ? List.of("the spectrum's cutoff makes counts above E = " + complete + " incomplete (" + table.spectrum()
                        .cutoffNote() + "); entries there, and temperatures within one grid step of them, are for the "
                        + "truncated spectrum")
                : List.of();
    }

    /** Warnings (a cutoff that affects part of the energy range); empty when none. */
    public List<String> warnings() {
        return warnings;
    }

    /** The microcanonical ensemble of {@code n} particles from an existing count table (n &lt;= its N). */
    public static Microcanonical of(CountTable table, int n) {
        requireInTable(table, n);
        return new Microcanonical(table, n, Counting.defaultFor(table.statistics()));
    }

    private static void requireInTable(CountTable table, int n) {
        Objects.requireNonNull(table, "table");
        Inputs.particleNumber("particle number N (the count table's range)", n, table.maxParticles(),
                "Build the count table with a larger maxParticles.");
    }

    /**
     * As {@link #of(CountTable, int)} with an explicit {@link Counting}: for distinguishable particles
     * LABELLED (Omega = assignments of labelled particles, the default) or CORRECTED_BOLTZMANN
     * (Omega / N!: S_B, S_G and ln Z lower by ln N!, temperatures, C and occupations unchanged);
     * IDENTICAL for quantum statistics. The counts themselves ({@link #count}) stay the exact integers.
     */
    public static Microcanonical of(CountTable table, int n, Counting counting) {
        requireInTable(table, n);
        return new Microcanonical(table, n, counting);
    }

    /** As {@link #of(Spectrum, Statistics, int, int)} with an explicit {@link Counting}. */
    public static Microcanonical of(Spectrum spectrum, Statistics statistics, int n, int maxEnergy, Counting counting) {
        Counting.require(statistics, counting);
        return of(of(spectrum, statistics, n, maxEnergy).table, n, counting);
    }

    /** How microstates are counted ({@link Counting}); the entropies and ln Z depend on it. */
    public Counting counting() {
        return counting;
    }

    /** Builds the count table for n particles and total energies 0..maxEnergy, then the ensemble. */
    public static Microcanonical of(Spectrum spectrum, Statistics statistics, int n, int maxEnergy) {
        return of(spectrum, statistics, n, maxEnergy, ProgressListener.NONE);
    }

    /**
     * The microcanonical ensemble of an exact density of states g(E) with BigInteger multiplicities
     * (interacting lattices, user tables), through the same front door: delegates to
     * {@link ExactMicrocanonical} (Boltzmann and Gibbs entropies and temperatures from the exact counts).
     */
    public static ExactMicrocanonical of(ExactDensityOfStates g) {
        return ExactMicrocanonical.of(g);
    }

    /** As {@link #of(Spectrum, Statistics, int, int)}, reporting the count table's progress. */
    public static Microcanonical of(Spectrum spectrum, Statistics statistics, int n, int maxEnergy,
                                    ProgressListener progress) {
        Inputs.particleNumber(n);
        return new Microcanonical(CountTable.of(spectrum, statistics, n, maxEnergy, progress), n,
                Counting.defaultFor(statistics));
    }

    private static int gridStep(Spectrum s) {
        int[] e = s.integerEnergies();
        int g = 0;
        for (int x : e) {
            g = gcd(g, Math.abs(x - e[0]));
        }
        return g == 0 ? 1 : g;
    }

    private static int gcd(int a, int b) {
        while (b != 0) {
            int t = a % b;
            a = b;
            b = t;
        }
        return a;
    }

    /** The count table used. */
    public CountTable table() {
        return table;
    }

    /** N. */
    public int particleNumber() {
        return n;
    }

    /** Largest total energy E covered. */
    public int maxEnergy() {
        return maxE;
    }

    /** Energy grid step d (gcd of the level spacings). */
    public int gridStep() {
        return step;
    }

    /** Omega(N, E), exact. */
    public BigInteger count(int e) {
        return table.count(n, e);
    }

    /** Whether some microstate has energy exactly e. */
    public boolean isAccessible(int e) {
        return e >= 0 && e <= maxE && !table.isZero(n, e);
    }

    /** Number of microstates with energy at most e, exact. */
    public BigInteger cumulativeCount(int e) {
        requireEnergy(e);
        return cumulative[e];
    }

    /** S_B(E) = ln Omega(N, E) (minus ln N! under CORRECTED_BOLTZMANN). @throws InvalidInputException where Omega = 0 */
    public double boltzmannEntropy(int e) {
        requireEnergy(e);
        return table.lnCount(n, e) - lnDivisor;
    }

    /**
     * S_B(E), or -infinity where Omega(N, E) = 0 (for sums of Boltzmann weights over the grid).
     * Package-private: the public API never returns an infinity; use {@link #boltzmannEntropy}.
     */
    double boltzmannEntropyOrMinusInfinity(int e) {
        requireEnergy(e);
        return table.isZero(n, e) ? Double.NEGATIVE_INFINITY : table.lnCount(n, e) - lnDivisor;
    }

    /** S_G(E) = ln (number of states with energy &lt;= E). @throws InvalidInputException where that is 0 */
    public double gibbsEntropy(int e) {
        BigInteger c = cumulativeCount(e);
        if (c.signum() == 0) {
            throw InvalidInputException.of("number of states with energy <= " + e, 0, "> 0",
                    "The lowest accessible energy is " + lowestEnergy() + ".");
        }
        return ExactLog.ln(c) - lnDivisor;
    }

    /** The lowest energy with Omega(N, E) &gt; 0. */
    public int lowestEnergy() {
        for (int e = 0; e <= maxE; e++) {
            if (!table.isZero(n, e)) {
                return e;
            }
        }
        throw InvalidInputException.of("largest energy of the table", maxE, "at least the N-particle ground energy",
                "Build the table with a larger maxEnergy.");
    }

    /** Whether beta_B is defined at e (Omega &gt; 0 at e - d, e, e + d). */
    public boolean hasBoltzmannTemperature(int e) {
        return isAccessible(e - step) && isAccessible(e) && isAccessible(e + step);
    }

    /**
     * Boltzmann inverse temperature beta_B(E) = (S_B(E + d) - S_B(E - d)) / (2d), formed as
     * ln(Omega(E + d)/Omega(E - d)) / (2d) from the exact counts ({@link #lnRatio}: no cancellation,
     * a few ulp relative even where beta_B is near 0).
     */
    public double boltzmannBeta(int e) {
        requireBoltzmann(e);
        return lnRatio(table.count(n, e + step), table.count(n, e - step)) / (2.0 * step);
    }

    /**
     * Gibbs inverse temperature beta_G(E) = (S_G(E + d) - S_G(E - d)) / (2d); always &gt;= 0. Formed as
     * ln(1 + (states in (E - d, E + d]) / (states &lt;= E - d)) / (2d) from exact integers, so values far
     * below 1 (high energies of bounded spectra, e.g. 1e-36) keep full relative accuracy.
     */
    public double gibbsBeta(int e) {
        if (e - step < 0 || e + step > maxE || cumulativeCount(e - step).signum() == 0) {
            throw InvalidInputException.of("energy for the Gibbs temperature", e,
                    "with at least one state at or below E - d and E + d <= " + maxE, "");
        }
        return lnRatio(cumulativeCount(e + step), cumulativeCount(e - step)) / (2.0 * step);
    }

    /**
     * ln(a/b) for positive integers without cancellation: log1p((a - b)/b) with the ratio rounded once
     * from exact integers ({@link ExactRatio}) when a and b are within a factor 2^60, else
     * ln a - ln b ({@link ExactLog}, each within 2 ulp, and then |ln a - ln b| &gt; 41, so the difference
     * keeps its relative accuracy). A few ulp relative in both branches.
     */
    static double lnRatio(BigInteger a, BigInteger b) {
        if (Math.abs(a.bitLength() - b.bitLength()) > 60) {
            return ExactLog.ln(a) - ExactLog.ln(b);
        }
        return Math.log1p(ExactRatio.toDouble(a.subtract(b), b));
    }

    /** Whether the Boltzmann temperature at e is negative (S_B decreasing: more energy, fewer states). */
    public boolean isNegativeBoltzmannTemperature(int e) {
        return boltzmannBeta(e) < 0;
    }

    /** Whether the Boltzmann heat capacity is defined at e (S_B'' != 0 there). */
    public boolean hasHeatCapacity(int e) {
        return hasBoltzmannTemperature(e) && secondDifference(e) != 0;
    }

    /** C(E)/k = -beta_B^2 / S_B''(E). */
    public double heatCapacity(int e) {
        requireBoltzmann(e);
        double s2 = secondDifference(e);
        if (s2 == 0) {
            throw InvalidInputException.of("second difference of S_B at E = " + e, 0.0, "non-zero for a heat capacity",
                    "S_B is locally linear here (C is unbounded); use a neighbouring energy.");
        }
        double b = boltzmannBeta(e);
        return -b * b / s2;
    }

    /** S_B'' on step h: ln(Omega(E + h) Omega(E - h) / Omega(E)^2) / h^2 from exact integers (no cancellation). */
    private double secondDifference(int e, int h) {
        BigInteger mid = table.count(n, e);
        return lnRatio(table.count(n, e + h).multiply(table.count(n, e - h)), mid.multiply(mid)) / ((double) h * h);
    }

    private double secondDifference(int e) {
        return secondDifference(e, step);
    }

    /**
     * Whether the grid resolves the heat capacity at e: C from the central differences of step d and of
     * step 2d agree within a fraction {@value #HEAT_CAPACITY_STEP_AGREEMENT} (same sign). Where they do not (low energies, a few quanta per
     * particle) C(E) on the grid is a discretisation artefact (it can even come out negative for an
     * ideal gas at positive temperature), not a property of the system; false also where step 2d
     * leaves the table or meets Omega = 0.
     */
    public boolean isHeatCapacityResolved(int e) {
        if (!hasHeatCapacity(e) || !isAccessible(e - 2 * step) || !isAccessible(e + 2 * step)) {
            return false;
        }
        double fine = heatCapacity(e);
        double s2 = secondDifference(e, 2 * step);
        if (s2 == 0) {
            return false;
        }
        double b = lnRatio(table.count(n, e + 2 * step), table.count(n, e - 2 * step)) / (4.0 * step);
        double coarse = -b * b / s2;
        return Math.signum(fine) == Math.signum(coarse)
                && Math.abs(fine - coarse) <= HEAT_CAPACITY_STEP_AGREEMENT * Math.abs(fine);
    }

    /**
     * Exact mean occupation of one state of each level at (N, E), as exact fractions.
     *
     * @throws InvalidInputException where Omega(N, E) = 0
     */
    public List<BigFraction> exactOccupations(int e) {
        requireEnergy(e);
        BigInteger total = table.count(n, e);
        if (total.signum() == 0) {
            throw InvalidInputException.of("Omega(" + n + ", " + e + ")", 0, "> 0 for occupations",
                    "No microstate has this energy; the lowest is " + lowestEnergy() + ".");
        }
        Spectrum s = table.spectrum();
        Statistics st = table.statistics();
        int[] en = s.integerEnergies();
        List<BigFraction> out = new ArrayList<>(en.length);
        for (int i = 0; i < en.length; i++) {
            BigInteger num;
            if (st.kind() == Statistics.Kind.DISTINGUISHABLE) {
                num = BigInteger.valueOf(n).multiply(at(n - 1, e - en[i]));
            } else if (st.kind() == Statistics.Kind.BOSE) {
                // P(n_s >= j) = Omega(N - j, E - j e_i) / Omega(N, E)
                num = BigInteger.ZERO;
                for (int j = 1; j <= n; j++) {
                    num = num.add(at(n - j, e - j * en[i]));
                }
            } else {
                int k = st.maxOccupancy();
                int len = n + 1;
                BigInteger[] w = new BigInteger[len + k];
                for (int m = len + k - 1; m >= 0; m--) {
                    if (m >= len) {
                        w[m] = BigInteger.ZERO;
                        continue;
                    }
                    BigInteger v = at(n - m, e - (long) m * en[i]);
                    for (int j = 1; j <= k; j++) {
                        v = v.subtract(w[m + j]);
                    }
                    w[m] = v;
                }
                num = BigInteger.ZERO;
                for (int j = 1; j <= Math.min(k, n); j++) {
                    num = num.add(w[j].multiply(BigInteger.valueOf(j)));
                }
            }
            out.add(new BigFraction(num, total));
        }
        return Collections.unmodifiableList(out);
    }

    /** Mean occupations at (N, E) as doubles (from the exact fractions). */
    public LevelOccupations occupations(int e) {
        List<BigFraction> f = exactOccupations(e);
        double[] d = new double[f.size()];
        for (int i = 0; i < d.length; i++) {
            d[i] = ExactRatio.toDouble(f.get(i));
        }
        Spectrum s = table.spectrum();
        return new LevelOccupations(s.energies(), s.degeneracies(), d);
    }

    private BigInteger at(int nn, long e) {
        if (nn < 0 || e < 0 || e > maxE) {
            return BigInteger.ZERO;
        }
        return table.count(nn, (int) e);
    }

    private void requireEnergy(int e) {
        if (e < 0 || e > maxE) {
            throw InvalidInputException.of("total energy E", e, "in [0, " + maxE + "] (the table's range)",
                    "Build the count table with a larger maxEnergy.");
        }
    }

    private void requireBoltzmann(int e) {
        if (!hasBoltzmannTemperature(e)) {
            throw InvalidInputException.of("energy for the Boltzmann temperature", e,
                    "a grid point with Omega > 0 at E - " + step + ", E and E + " + step + " within [0, " + maxE + "]",
                    "Check hasBoltzmannTemperature(E) first.");
        }
    }

    /**
     * The canonical partition function from the counts, Z_N = sum_E Omega(N, E) e^{-E/kT} over the
     * table's energies (log-sum-exp of exact logs); the omitted tail E &gt; E_max makes this a lower
     * bound, and {@code warnings} of the canonical comparison should be consulted for the cutoff.
     */
    public double canonicalLnZ(double kT) {
        Inputs.temperature(kT);
        double max = Double.NEGATIVE_INFINITY;
        double[] t = new double[maxE + 1];
        for (int e = 0; e <= maxE; e++) {
            t[e] = table.isZero(n, e) ? Double.NEGATIVE_INFINITY : table.lnCount(n, e) - e / kT;
            max = Math.max(max, t[e]);
        }
        double s = 0;
        for (double x : t) {
            if (x != Double.NEGATIVE_INFINITY) {
                s += Math.exp(x - max);
            }
        }
        return max + Math.log(s) - lnDivisor;
    }

    private static final Missing NO_STATES = Missing.because("no microstate at this energy: S_B = ln Omega undefined");
    private static final Missing NO_BOLTZMANN_BETA = Missing.because(
            "beta_B needs microstates at E - d, E and E + d (d the grid step)");
    private static final Missing NO_GIBBS_BETA = Missing.because("beta_G needs grid energies on both sides within the table");
    private static final Missing NO_HEAT_CAPACITY = Missing.because(
            "C needs beta_B here and a non-zero second difference of S_B (where S_B is locally linear C is unbounded)");

    @Override
    public List<String> columnNames() {
        return List.of("E", "Omega", "S_B", "S_G", "beta_B", "beta_G", "C/k", "negative T_B");
    }

    /**
     * One row per grid energy from the lowest accessible one to E_max; undefined cells are {@link Missing} (shown "n/a"), and a
     * heat capacity the grid does not resolve ({@link #isHeatCapacityResolved}) is shown as text marked
     * "(grid artefact?)".
     */
    @Override
    public List<List<Object>> rows() {
        List<List<Object>> out = new ArrayList<>();
        int lo = lowestEnergy();
        for (int e = lo; e <= maxE; e += step) {
            List<Object> r = new ArrayList<>();
            r.add(e);
            r.add(count(e));
            r.add(isAccessible(e) ? (Object) boltzmannEntropy(e) : NO_STATES);
            r.add(gibbsEntropy(e));
            boolean hb = hasBoltzmannTemperature(e);
            r.add(hb ? (Object) boltzmannBeta(e) : NO_BOLTZMANN_BETA);
            boolean hg = e - step >= lo && e + step <= maxE;
            r.add(hg ? (Object) gibbsBeta(e) : NO_GIBBS_BETA);
            r.add(!hasHeatCapacity(e) ? NO_HEAT_CAPACITY : isHeatCapacityResolved(e) ? (Object) heatCapacity(e)
                    : String.format("%.4g (grid artefact?)", heatCapacity(e)));
            r.add(hb ? (Object) (boltzmannBeta(e) < 0) : NO_BOLTZMANN_BETA);
            out.add(Collections.unmodifiableList(r));
        }
        return out;
    }

    @Override
    public String toString() {
        return "Microcanonical[" + table.statistics() + ", N=" + n + ", E=0.." + maxE + ", grid step " + step
                + (warnings.isEmpty() ? "" : ", " + warnings.size() + " warning(s)") + "]";
    }
}
