package org.microtally.spark;

import java.math.BigInteger;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.Iterator;
import java.util.List;
import java.util.Objects;
import org.apache.spark.api.java.JavaSparkContext;
import org.apache.spark.sql.SparkSession;
import org.microtally.InvalidInputException;
import org.microtally.ProgressListener;
import org.microtally.count.CountTable;
import org.microtally.spectrum.Spectrum;
import org.microtally.spectrum.Statistics;

/**
 * Brute-force enumeration of every microstate with at most N particles and total energy at most E,
 * split by prefix into Spark tasks, tallied into the exact histogram Omega(n, e): the independent
 * cross-check of a {@link DistributedCountTable} or a {@link CountTable}. Immutable result.
 *
 * <p><b>Method.</b> The single-particle states (each level's g states, levels with energy &lt;= E, in
 * ascending energy) are walked depth-first: at each state the walk tries every occupation 0..k
 * (k = 1 Fermi, k Gentile, unlimited Bose) that keeps n &lt;= N and e &lt;= E, and every complete
 * occupation vector adds one to its (n, e) cell; once the next state's energy exceeds the energy left,
 * every later state must be empty and the vector is complete (the states are in ascending order).
 * The driver enumerates the occupations of the first P states (P grown until there are at least eight
 * prefixes per core), each task walks the rest for its share of prefixes, and the driver adds the
 * per-task histograms exactly (overflow refused). Common practice, no source; it shares no code with the
 * generating-function recursion, which is what makes it a cross-check.
 *
 * <p><b>Cost.</b> Proportional to the number of microstates, sum over n &lt;= N, e &lt;= E of
 * Omega(n, e); a run above the cap (default 10^8) is refused before any task starts, with the exact
 * number (from a local {@link CountTable}) in the message. Labelled (DISTINGUISHABLE) particles are
 * refused: their microstates are assignments, not occupation vectors.
 */
public final class PrefixEnumeration implements CountGrid {
    /** Default cap on the number of microstates enumerated. */
    public static final long DEFAULT_CAP = 100_000_000L;

    private final int maxN;
    private final int maxE;
    private final long[] counts;
    private final int prefixStates;
    private final int prefixes;

    private PrefixEnumeration(int maxN, int maxE, long[] counts, int prefixStates, int prefixes) {
        this.maxN = maxN;
        this.maxE = maxE;
        this.counts = counts;
        this.prefixStates = prefixStates;
        this.prefixes = prefixes;
    }

    /** Enumerates with the default cap and no progress reports. */
    public static PrefixEnumeration of(SparkSession spark, Spectrum spectrum, Statistics statistics,
                                       int maxParticles, int maxEnergy) {
        return of(spark, spectrum, statistics, maxParticles, maxEnergy, DEFAULT_CAP, ProgressListener.NONE);
    }

    /**
     * Enumerates every microstate with n &lt;= maxParticles and e &lt;= maxEnergy, reporting finished
     * tasks (stage {@code "prefix tasks"}).
     *
     * @throws InvalidInputException for DISTINGUISHABLE statistics, the inputs {@link CountTable#of}
     *         refuses, or more than {@code cap} microstates (the message gives the exact number)
     */
    public static PrefixEnumeration of(SparkSession spark, Spectrum spectrum, Statistics statistics,
                                       int maxParticles, int maxEnergy, long cap, ProgressListener progress) {
        Objects.requireNonNull(spark, "spark");
        Objects.requireNonNull(progress, "progress");
        if (!Objects.requireNonNull(statistics, "statistics").indistinguishable()) {
            throw InvalidInputException.of("statistics for prefix enumeration", statistics,
                    "BOSE, FERMI or maxOccupancy(k)", "Labelled particles: compare with the closed form or CountTable.");
        }
        CountTable sizes = CountTable.of(spectrum, statistics, maxParticles, maxEnergy);
        BigInteger total = BigInteger.ZERO;
        for (int n = 0; n <= maxParticles; n++) {
            total = total.add(sizes.total(n));
        }
        if (total.compareTo(BigInteger.valueOf(cap)) > 0) {
            throw InvalidInputException.of("number of microstates to enumerate", total, "at most the cap " + cap,
                    "Lower N or E, or raise the cap (cost grows with the number of microstates).");
        }
        int[] eps = stateEnergies(spectrum.integerEnergies(), spectrum.degeneracies(), maxEnergy);
        int k = statistics.capped() ? statistics.maxOccupancy() : Integer.MAX_VALUE;
        JavaSparkContext jsc = JavaSparkContext.fromSparkContext(spark.sparkContext());
        int wanted = 8 * Math.max(1, jsc.defaultParallelism());
        int p = 0;
        List<int[]> starts = List.of(new int[] {0, 0});
        while (p < eps.length && starts.size() < wanted) {
            p++;
            starts = prefixes(eps, p, k, maxParticles, maxEnergy);
        }
        int prefixStates = p;
        int tasks = Math.min(starts.size(), wanted);
        List<int[]> work = starts;
        List<long[]> parts = SparkProgress.run(spark.sparkContext(), progress, tasks, "prefix tasks",
                () -> jsc.parallelize(work, tasks).mapPartitions((Iterator<int[]> it) -> {
                    long[] h = new long[(maxParticles + 1) * (maxEnergy + 1)];
                    while (it.hasNext()) {
                        int[] s = it.next();
                        walk(eps, prefixStates, k, maxParticles, maxEnergy, s[0], s[1], h);
                    }
                    return List.of(h).iterator();
                }).collect());
        long[] merged = new long[(maxParticles + 1) * (maxEnergy + 1)];
        for (long[] h : parts) {
            for (int i = 0; i < merged.length; i++) {
                merged[i] = Math.addExact(merged[i], h[i]);
            }
        }
        return new PrefixEnumeration(maxParticles, maxEnergy, merged, prefixStates, starts.size());
    }

    /** One energy per single-particle state with energy &lt;= maxE, ascending. */
    static int[] stateEnergies(int[] energy, int[] deg, int maxE) {
        List<Integer> out = new ArrayList<>();
        for (int l = 0; l < energy.length; l++) {
            if (energy[l] >= 0 && energy[l] <= maxE) {
                for (int g = 0; g < deg[l]; g++) {
                    out.add(energy[l]);
                }
            }
        }
        int[] a = out.stream().mapToInt(Integer::intValue).toArray();
        Arrays.sort(a);
        return a;
    }

    /** Every occupation of states 0..p-1 within the limits, as its (n, e). */
    static List<int[]> prefixes(int[] eps, int p, int k, int maxN, int maxE) {
        List<int[]> out = new ArrayList<>();
        prefixWalk(eps, 0, p, k, maxN, maxE, 0, 0, out);
        return out;
    }

    private static void prefixWalk(int[] eps, int s, int p, int k, int maxN, int maxE, int n, int e, List<int[]> out) {
        if (s == p) {
            out.add(new int[] {n, e});
            return;
        }
        for (int j = 0; j <= maxOccupation(eps[s], k, maxN - n, maxE - e); j++) {
            prefixWalk(eps, s + 1, p, k, maxN, maxE, n + j, e + j * eps[s], out);
        }
    }

    /** Adds one to h[n'][e'] for every completion of a prefix that reached (n, e) at state s. */
    static void walk(int[] eps, int s, int k, int maxN, int maxE, int n, int e, long[] h) {
        // no state left, no particle left, or (ascending energies) no later state fits: one completion
        if (s == eps.length || n == maxN || eps[s] > maxE - e) {
            h[n * (maxE + 1) + e]++;
            return;
        }
        for (int j = 0; j <= maxOccupation(eps[s], k, maxN - n, maxE - e); j++) {
            walk(eps, s + 1, k, maxN, maxE, n + j, e + j * eps[s], h);
        }
    }

    private static int maxOccupation(int eps, int k, int particlesLeft, int energyLeft) {
        int m = Math.min(k, particlesLeft);
        return eps == 0 ? m : Math.min(m, energyLeft / eps);
    }

    @Override
    public int maxParticles() {
        return maxN;
    }

    @Override
    public int maxEnergy() {
        return maxE;
    }

    /** The number of enumerated microstates with n particles and energy e. */
    @Override
    public BigInteger count(int n, int e) {
        return BigInteger.valueOf(counts[CountGrid.cellIndex(n, e, maxN, maxE)]);
    }

    /** P: the number of leading states whose occupations form the prefixes. */
    public int prefixStates() {
        return prefixStates;
    }

    /** Number of prefixes the walk was split into. */
    public int prefixCount() {
        return prefixes;
    }

    @Override
    public String toString() {
        return "PrefixEnumeration[N = " + maxN + ", E = " + maxE + ", " + prefixes + " prefixes over " + prefixStates
                + " states]";
    }
}
