package org.microtally.ensemble;

import java.math.BigInteger;
import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.Objects;
import org.apache.commons.math3.fraction.BigFraction;
import org.microtally.Inputs;
import org.microtally.InvalidInputException;
import org.microtally.Tabular;
import org.microtally.exact.Combinatorics;
import org.microtally.count.CountTable;
import org.microtally.exact.ExactRatio;
import org.microtally.occupation.CondensateDistribution;
import org.microtally.spectrum.Level;
import org.microtally.spectrum.Spectrum;
import org.microtally.spectrum.Statistics;

/**
 * The exact microcanonical distribution of the number of particles in one level (all its g states
 * together) at fixed particle number N and total energy E: P(N_l = j), its mean and its variance, as
 * exact rationals. For the lowest level of bosons this is the microcanonical condensate distribution
 * whose fluctuations differ from the canonical and grand canonical ones (H. D. Politzer, PRA 54, 5048
 * (1996); M. Wilkens and C. Weiss, J. Mod. Opt. 44, 1801 (1997); S. Grossmann and M. Holthaus,
 * Z. Naturforsch. 50a, 921 (1995)). Immutable.
 *
 * <h2>Formula</h2>
 * Omega_l(j) = w_j Omega'(N - j, E - j e_l), P(N_l = j) = Omega_l(j) / Omega(N, E), where Omega' counts
 * the microstates of the spectrum without level l and w_j is the number of ways to put j particles
 * into the level's g states: C(g + j - 1, j) (Bose), C(g, j) (Fermi), the capped count (Gentile, at
 * most k per state); for distinguishable particles w_j = C(N, j) g^j (which j particles, and a state
 * for each) with Omega' the labelled count of the other N - j particles. Omega(N, E) = sum_j
 * Omega_l(j) (every microstate has exactly one value of N_l).
 *
 * <h2>Method and accuracy</h2>
 * One exact {@link CountTable} of the spectrum without level l (its method and sources are stated
 * there); then BigInteger products and exact {@link BigFraction} moments. Exact; the double values
 * ({@link #mean()}, {@link #variance()}, {@link #distribution()}) are the exact rationals correctly
 * rounded ({@link ExactRatio}). Cost: that of one count table to (N, E).
 *
 * <p>Truncated spectra: if E exceeds the energy through which the table of the truncated spectrum is
 * complete ({@link CountTable#completeThroughEnergy()}), the counts would describe the truncated
 * spectrum, not the physical one; this is refused.
 */
public final class MicrocanonicalLevelNumber implements Tabular {
    private final Spectrum spectrum;
    private final Statistics statistics;
    private final int n;
    private final int e;
    private final int[] levels;
    private final BigInteger[] counts;
    private final BigInteger total;

    private MicrocanonicalLevelNumber(Spectrum spectrum, Statistics statistics, int n, int e, int[] levels,
                                      BigInteger[] counts, BigInteger total) {
        this.spectrum = spectrum;
        this.statistics = statistics;
        this.n = n;
        this.e = e;
        this.levels = levels;
        this.counts = counts;
        this.total = total;
    }

    /** The distribution of the number of particles in the lowest level (level 0). */
    public static MicrocanonicalLevelNumber groundLevel(Spectrum spectrum, Statistics statistics, int n, int e) {
        return of(spectrum, statistics, n, e, 0);
    }

    /**
     * The distribution of the number of particles in level {@code level} at fixed (N, E).
     *
     * @param spectrum   integer energies &gt;= 0 (as for {@link CountTable})
     * @param n          N &gt;= 1
     * @param e          total energy E &gt;= 0 in quanta
     * @param level      index of the level in the spectrum
     * @throws InvalidInputException for bad N, E or level index, non-integer or negative energies, E
     *                               beyond the completeness of a truncated spectrum, or no microstate
     *                               at (N, E)
     */
    public static MicrocanonicalLevelNumber of(Spectrum spectrum, Statistics statistics, int n, int e, int level) {
        Objects.requireNonNull(spectrum, "spectrum");
        Objects.requireNonNull(statistics, "statistics");
        Inputs.particleNumber(n);
        if (e < 0) {
            throw InvalidInputException.of("total energy E", e, "an integer >= 0 (quanta)", "");
        }
        if (level < 0 || level >= spectrum.size()) {
            throw InvalidInputException.of("level index", level, "in [0, " + (spectrum.size() - 1) + "]", "");
        }
        int[] energies = spectrum.integerEnergies();
        int el = energies[level];
        if (spectrum.cutoffEnergy() < e) {
            throw InvalidInputException.of("total energy E", e,
                    "at most the cutoff " + spectrum.cutoffEnergy() + " of the truncated spectrum, up to which its "
                            + "counts are complete", "Raise the spectrum's cutoff to at least " + e + ".");
        }
        int g = spectrum.degeneracy(level);
        long capacity = statistics.capped() ? (long) statistics.maxOccupancy() * g : Long.MAX_VALUE;
        int jMax = (int) Math.min(n, capacity);
        if (el > 0) {
            jMax = Math.min(jMax, e / el);
        }
        BigInteger[] counts = new BigInteger[n + 1];
        java.util.Arrays.fill(counts, BigInteger.ZERO);
        Spectrum rest = without(spectrum, level);
        CountTable others = rest == null ? null : CountTable.of(rest, statistics, n, e);
        BigInteger total = BigInteger.ZERO;
        for (int j = 0; j <= jMax; j++) {
            int nr = n - j;
            int er = e - j * el;
            BigInteger o = others == null ? (nr == 0 && er == 0 ? BigInteger.ONE : BigInteger.ZERO)
                    : others.count(nr, er);
            if (o.signum() == 0) {
                continue;
            }
            counts[j] = ways(statistics, g, j, n).multiply(o);
            total = total.add(counts[j]);
        }
        if (total.signum() == 0) {
            throw InvalidInputException.of("(N, E)", "(" + n + ", " + e + ")", "a macrostate with at least one microstate",
                    "Check CountTable.isZero(N, E) first; E must be reachable with N particles.");
        }
        return new MicrocanonicalLevelNumber(spectrum, statistics, n, e, new int[] {level}, counts, total);
    }

    /**
     * The distribution of the number of particles in a group of levels (all their states together),
     * for example every level below the Fermi energy: Omega_G(j) = sum_e' Omega_G(j, e') Omega_R(N - j, E - e')
     * (times C(N, j) for labelled particles, which j of them are in the group), with Omega_G and
     * Omega_R the exact count tables of the group's and of the remaining levels. Exact; the sum over j
     * is checked to equal Omega(N, E) from a third, independent route (the single-level formula).
     * Cost: three count tables to (N, E).
     *
     * @throws InvalidInputException as for {@link #of}, or for an empty, repeated or out-of-range
     *                               level index
     */
    public static MicrocanonicalLevelNumber ofLevels(Spectrum spectrum, Statistics statistics, int n, int e,
                                                     int... levelIndices) {
        Objects.requireNonNull(levelIndices, "levelIndices");
        if (levelIndices.length == 0) {
            throw InvalidInputException.of("number of levels in the group", 0, ">= 1", "");
        }
        boolean[] inGroup = new boolean[spectrum.size()];
        for (int l : levelIndices) {
            if (l < 0 || l >= spectrum.size() || inGroup[l]) {
                throw InvalidInputException.of("level index in the group", l,
                        "distinct indices in [0, " + (spectrum.size() - 1) + "]", "");
            }
            inGroup[l] = true;
        }
        // validates N, E, integer energies and the cutoff, and gives Omega(N, E) for the consistency check
        BigInteger whole = of(spectrum, statistics, n, e, levelIndices[0]).totalCount();
        List<Level> group = new ArrayList<>();
        List<Level> others = new ArrayList<>();
        for (int i = 0; i < spectrum.size(); i++) {
            (inGroup[i] ? group : others).add(spectrum.level(i));
        }
        CountTable tg = CountTable.of(subset(spectrum, group), statistics, n, e);
        CountTable tr = others.isEmpty() ? null : CountTable.of(subset(spectrum, others), statistics, n, e);
        BigInteger[] counts = new BigInteger[n + 1];
        BigInteger total = BigInteger.ZERO;
        for (int j = 0; j <= n; j++) {
            BigInteger c = BigInteger.ZERO;
            for (int eg = 0; eg <= e; eg++) {
                BigInteger a = tg.count(j, eg);
                if (a.signum() == 0) {
                    continue;
                }
                BigInteger b = tr == null ? (n - j == 0 && e - eg == 0 ? BigInteger.ONE : BigInteger.ZERO)
                        : tr.count(n - j, e - eg);
                c = c.add(a.multiply(b));
            }
            counts[j] = statistics.indistinguishable() ? c : c.multiply(Combinatorics.binomial(n, j));
            total = total.add(counts[j]);
        }
        if (!total.equals(whole)) {
            throw new IllegalStateException("group counts sum to " + total + ", not Omega(N, E) = " + whole
                    + "; please report this input");
        }
        return new MicrocanonicalLevelNumber(spectrum, statistics, n, e, levelIndices.clone(), counts, total);
    }

    private static Spectrum subset(Spectrum s, List<Level> levels) {
        return Spectrum.of(levels, s.scale(), s.isLabelled(), s.cutoffEnergy(), s.cutoffNote());
    }

    /** Ways to put j particles into the level's g states (distinguishable: choose the j of n, then a state each). */
    private static BigInteger ways(Statistics st, int g, int j, int n) {
        BigInteger w = st.levelWays(g, j);
        return st.indistinguishable() ? w : Combinatorics.binomial(n, j).multiply(w);
    }

    /** The spectrum without level {@code skip}, same scale and cutoff; null when it was the only level. */
    private static Spectrum without(Spectrum s, int skip) {
        if (s.size() == 1) {
            return null;
        }
        List<Level> kept = new ArrayList<>(s.levels());
        kept.remove(skip);
        return Spectrum.of(kept, s.scale(), s.isLabelled(), s.cutoffEnergy(), s.cutoffNote());
    }

    /** The number of microstates at (N, E) with exactly j particles in the level. */
    public BigInteger count(int j) {
        return j < 0 || j > n ? BigInteger.ZERO : counts[j];
    }

    /** Omega(N, E), the sum of {@link #count(int)} over j. */
    public BigInteger totalCount() {
        return total;
    }

    /** Exact P(N_l = j). */
    public BigFraction probability(int j) {
        return new BigFraction(count(j), total);
    }

    /** Exact mean &lt;N_l&gt;. */
    public BigFraction exactMean() {
        BigInteger s = BigInteger.ZERO;
        for (int j = 1; j <= n; j++) {
            s = s.add(counts[j].multiply(BigInteger.valueOf(j)));
        }
        return new BigFraction(s, total);
    }

    /** Exact variance Var N_l = &lt;N_l^2&gt; - &lt;N_l&gt;^2. */
    public BigFraction exactVariance() {
        BigInteger s1 = BigInteger.ZERO;
        BigInteger s2 = BigInteger.ZERO;
        for (int j = 1; j <= n; j++) {
            BigInteger bj = BigInteger.valueOf(j);
            s1 = s1.add(counts[j].multiply(bj));
            s2 = s2.add(counts[j].multiply(bj).multiply(bj));
        }
        // (s2 total - s1^2) / total^2, exact
        return new BigFraction(s2.multiply(total).subtract(s1.multiply(s1)), total.multiply(total));
    }

    /** &lt;N_l&gt;, correctly rounded from the exact value. */
    public double mean() {
        return ExactRatio.toDouble(exactMean());
    }

    /** Var N_l, correctly rounded from the exact value. */
    public double variance() {
        return ExactRatio.toDouble(exactVariance());
    }

    /** The probabilities as doubles (each correctly rounded), with their moments, for charts and comparison. */
    public CondensateDistribution distribution() {
        double[] p = new double[n + 1];
        for (int j = 0; j <= n; j++) {
            p[j] = ExactRatio.toDouble(probability(j));
        }
        return new CondensateDistribution(p);
    }

    /** N. */
    public int particleNumber() {
        return n;
    }

    /** E in quanta. */
    public int totalEnergy() {
        return e;
    }

    /** Indices of the level (or of the group of levels) counted. */
    public int[] levels() {
        return levels.clone();
    }

    /** The spectrum. */
    public Spectrum spectrum() {
        return spectrum;
    }

    /** The statistics. */
    public Statistics statistics() {
        return statistics;
    }

    /** Columns j, microstates, probability (exact). */
    @Override
    public List<String> columnNames() {
        return List.of("j", "microstates", "probability");
    }

    /** One row per j with a non-zero count. */
    @Override
    public List<List<Object>> rows() {
        List<List<Object>> r = new ArrayList<>();
        for (int j = 0; j <= n; j++) {
            if (counts[j].signum() != 0) {
                r.add(List.of(j, counts[j], probability(j)));
            }
        }
        return Collections.unmodifiableList(r);
    }

    @Override
    public String toString() {
        return "MicrocanonicalLevelNumber[" + statistics + ", N=" + n + ", E=" + e + ", levels "
                + java.util.Arrays.toString(levels) + ", <N_l>="
                + mean() + ", Var=" + variance() + "]";
    }
}
