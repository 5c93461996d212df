package org.microtally.count;

import java.math.BigInteger;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.Collections;
import java.util.List;
import java.util.Objects;
import java.util.concurrent.atomic.AtomicReferenceArray;
import org.apache.commons.math3.fraction.BigFraction;
import org.microtally.InvalidInputException;
import org.microtally.MemoryEstimate;
import org.microtally.ProgressListener;
import org.microtally.Tabular;
import org.microtally.spectrum.Spectrum;
import org.microtally.spectrum.Statistics;
import org.microtally.exact.ExactLog;

/**
 * Exact microstate counts Omega(n, e): the number of microstates of n non-interacting particles on a
 * spectrum with total energy exactly e, for every 0 &lt;= n &lt;= N and 0 &lt;= e &lt;= E at once. Immutable.
 *
 * <p><b>Definition.</b> Level energies are {@link Spectrum#integerEnergies()} (integer multiples of
 * the spectrum's quantum) and e is the sum of the particles' level energies. For indistinguishable
 * particles a microstate is an occupation vector over single-particle states (at most k per state
 * for {@code maxOccupancy(k)}, at most one for FERMI); for DISTINGUISHABLE particles it is an
 * assignment of a state to each labelled particle, so Omega(n, e) = [q^e] Z1(q)^n with
 * Z1 = sum_l g_l q^(e_l).
 *
 * <p><b>Energies must be &gt;= 0.</b> A negative level energy is refused: the totals are measured from
 * 0, and shifting every level by a constant c shifts e by n c, which differs between rows. Shift the
 * spectrum yourself so its ground level is at 0 and add n c back when reading.
 *
 * <p><b>Method.</b> Generating functions grouped by degeneracy: each level of energy e_l and
 * degeneracy g multiplies the bivariate generating function by (1 - x q^e_l)^-g (Bose),
 * (1 + x q^e_l)^g (Fermi) or (1 + x q^e_l + ... + (x q^e_l)^k)^g (Gentile), applied as one truncated
 * binomial series with j &lt;= min(N, E / e_l) terms, not as g single-state passes; cost
 * O(N E sum_l min(N, E/e_l)) word operations per prime. Counting is done modulo the largest primes below
 * 2^50, held in doubles with an exact FMA reduction (below 2^62 in longs on a processor
 * without a fused multiply-add; one parallel task per prime on the common fork-join pool), and reconstructed by Chinese
 * remaindering, one row at a time when the row is first read (so reading a few entries of a large
 * table costs only their rows; every read returns the same exact value); the number of primes comes from a proven
 * saddle-point upper bound on every entry (see {@link #primesUsed()}), so the result is exact. Small
 * tables (under 2e5 word operations) run the same recursion directly in BigInteger; the two paths
 * are tested against each other. Only the window of each row that can be non-zero (above the
 * ground energy of its particles) is swept. (See
 * {@code CountEngine}, {@code CountBound}, {@code Moduli} for the sources.)
 *
 * <p><b>Completeness under a spectrum cutoff.</b> The counts are exact for the levels the spectrum
 * holds. If the spectrum was truncated at {@link Spectrum#cutoffEnergy()} = C, any omitted level has
 * energy &gt; C, so every entry with e &lt;= C equals the count for the untruncated spectrum;
 * {@link #completeThroughEnergy()} returns min(E, floor(C)). (Row n is in fact complete up to C plus
 * the lowest energy of n - 1 particles; the single number is the safe one.)
 *
 * <p><b>Zero counts.</b> {@link #lnCount} and {@link #entropy} throw for an empty macrostate
 * (Omega = 0) rather than return -infinity; test with {@link #isZero} first.
 */
public final class CountTable implements Tabular {
    /** Tables whose estimated memory exceeds this fraction of the JVM's maximum heap are refused. */
    private static final double MEMORY_FRACTION = 0.5;
    /** Above this many word operations the multi-modular path is used; below, plain BigInteger. */
    private static final long BIG_INTEGER_WORK_LIMIT = 200_000;

    private final Spectrum spectrum;
    private final Statistics statistics;
    private final int maxN;
    private final int maxE;
    /**
     * Row n of the table once built: Omega(n, 0..E). Rows of the multi-modular path are rebuilt from
     * {@link #residues} by Chinese remaindering when first read (under {@link #crt}'s lock), so a
     * caller who reads a few rows does not pay for all of them; the values are the same either way.
     */
    private final AtomicReferenceArray<BigInteger[]> rows;
    private final AtomicReferenceArray<BigInteger> totals;
    /** Residues [prime][n (E + 1) + e] of rows not yet built; null for the BigInteger path. */
    private final long[][] residues;
    private final Moduli.Crt crt;
    private final int primesUsed;

    private CountTable(Spectrum spectrum, Statistics statistics, int maxN, int maxE, BigInteger[] counts,
                       long[][] residues, long[] primes) {
        this.spectrum = spectrum;
        this.statistics = statistics;
        this.maxN = maxN;
        this.maxE = maxE;
        this.rows = new AtomicReferenceArray<>(maxN + 1);
        this.totals = new AtomicReferenceArray<>(maxN + 1);
        this.residues = residues;
        this.crt = residues == null ? null : new Moduli.Crt(primes);
        this.primesUsed = residues == null ? 0 : primes.length;
        if (counts != null) {
            for (int n = 0; n <= maxN; n++) {
                rows.set(n, Arrays.copyOfRange(counts, n * (maxE + 1), (n + 1) * (maxE + 1)));
            }
        }
    }

    /** Row n, rebuilt from the residues on first access (thread-safe; built once). */
    private BigInteger[] rowArray(int n) {
        BigInteger[] r = rows.get(n);
        if (r != null) {
            return r;
        }
        synchronized (crt) {
            r = rows.get(n);
            if (r == null) {
                r = crt.reconstructRange(residues, n * (maxE + 1), maxE + 1);
                rows.set(n, r);
            }
            return r;
        }
    }

    /** Builds the table; see the class description. Equivalent to passing {@link ProgressListener#NONE}. */
    public static CountTable of(Spectrum spectrum, Statistics statistics, int maxParticles, int maxEnergy) {
        return of(spectrum, statistics, maxParticles, maxEnergy, ProgressListener.NONE);
    }

    /**
     * Builds the table, reporting progress per level (and prime), at most about 200 calls per stage,
     * one at a time but possibly from a worker thread.
     *
     * @param spectrum     levels with integer energies &gt;= 0
     * @param statistics   particle statistics
     * @param maxParticles N &gt;= 0
     * @param maxEnergy    E &gt;= 0, in quanta of the spectrum's unit
     * @throws InvalidInputException for negative N or E, negative or non-integer energies
     *         ({@link org.microtally.spectrum.NonIntegerEnergyException}), or a table whose estimated
     *         memory exceeds half the maximum heap (the message gives the estimate)
     */
    public static CountTable of(Spectrum spectrum, Statistics statistics, int maxParticles, int maxEnergy,
                                ProgressListener progress) {
        Input in = Input.validate(spectrum, statistics, maxParticles, maxEnergy, progress);
        requireMemory(maxParticles, maxEnergy, 0, 1);
        double bits = CountBound.log2Bound(in.energy, in.deg, statistics, maxParticles, maxEnergy);
        int primes = Moduli.tablePrimeCount(bits);
        requireMemory(maxParticles, maxEnergy, bits, primes);
        if (work(in.energy, statistics, maxParticles, maxEnergy) <= BIG_INTEGER_WORK_LIMIT) {
            BigInteger[] counts = CountEngine.bigInteger(in.energy, in.deg, statistics, maxParticles, maxEnergy,
                    progress);
            return new CountTable(spectrum, statistics, maxParticles, maxEnergy, counts, null, null);
        }
        long[] p = Moduli.tablePrimes(primes);
        long[][] res = CountEngine.multiModularResidues(in.energy, in.deg, statistics, maxParticles, maxEnergy,
                p, progress);
        return new CountTable(spectrum, statistics, maxParticles, maxEnergy, null, res, p);
    }

    /**
     * The multi-modular table from residues computed elsewhere ({@link PrimePlan#table}): rows are rebuilt
     * lazily by Chinese remaindering exactly as for {@link #of}. {@code residues[i]} belongs to
     * {@code primes[i]}; the caller has checked them.
     */
    static CountTable fromResidues(Spectrum spectrum, Statistics statistics, int maxN, int maxE, long[][] residues,
                                   long[] primes) {
        return new CountTable(spectrum, statistics, maxN, maxE, null, residues, primes);
    }

    /** Validated arrays of a spectrum for exact counting. */
    static final class Input {
        final int[] energy;
        final int[] deg;

        private Input(int[] energy, int[] deg) {
            this.energy = energy;
            this.deg = deg;
        }

        static Input validate(Spectrum spectrum, Statistics statistics, int maxParticles, int maxEnergy,
                              ProgressListener progress) {
            Objects.requireNonNull(spectrum, "spectrum");
            Objects.requireNonNull(statistics, "statistics");
            Objects.requireNonNull(progress, "progress");
            if (maxParticles < 0) {
                throw InvalidInputException.of("maximum particle number N", maxParticles, "an integer >= 0", "");
            }
            if (maxEnergy < 0) {
                throw InvalidInputException.of("maximum total energy E", maxEnergy, "an integer >= 0",
                        "Energies are counted in quanta from 0.");
            }
            int[] energy = spectrum.integerEnergies();
            for (int i = 0; i < energy.length; i++) {
                if (energy[i] < 0) {
                    throw InvalidInputException.of("energy of level " + i, energy[i], ">= 0 for exact counting",
                            "Shift every level by " + (-energy[0]) + " so the ground level is at 0; a total "
                                    + "energy e of n particles then corresponds to e - " + (-energy[0]) + " n.");
                }
            }
            return new Input(energy, spectrum.degeneracies());
        }
    }

    /** Word operations per prime of the counting recursion, an upper estimate (used to pick the arithmetic). */
    static double work(int[] energy, Statistics stats, int maxN, int maxE) {
        double cells = (maxN + 1.0) * (maxE + 1.0);
        int levels = CountEngine.relevantLevels(energy, maxE);
        if (!stats.indistinguishable()) {
            return cells * levels;
        }
        double w = 0;
        for (int l = 0; l < levels; l++) {
            w += cells * CountEngine.maxJ(energy[l], maxN, maxE);
        }
        return w;
    }

    /** Refuses, before allocating, a table whose estimated footprint exceeds the memory limit. */
    static void requireMemory(int maxN, int maxE, double bitsPerEntry, int primes) {
        double cells = (maxN + 1.0) * (maxE + 1.0);
        // per entry: a BigInteger (~40 bytes + magnitude) plus the reference, plus one long per prime
        double bytes = cells * (56 + bitsPerEntry / 8 + 8.0 * primes);
        double limit = Runtime.getRuntime().maxMemory() * MEMORY_FRACTION;
        if (cells > Integer.MAX_VALUE - 16 || bytes > limit) {
            throw InvalidInputException.of("count table size (N + 1) x (E + 1) = " + (maxN + 1L) + " x " + (maxE + 1L),
                    String.format("%.3g entries, about %s", cells, MemoryEstimate.human(bytes)),
                    String.format("at most 2^31 - 17 entries and %s (half the maximum heap)",
                            MemoryEstimate.human(limit)),
                    "Lower N or E, or give Java more heap (-Xmx; MICROTALLY_HEAP=4g for toolkit/bin/microtally, install-kernel --heap 4g for the kernel).");
        }
    }

    /** Omega(n, e). */
    public BigInteger count(int n, int e) {
        checkIndex(n, e);
        return rowArray(n)[e];
    }

    /** Whether Omega(n, e) = 0 (no microstate has this n and e). */
    public boolean isZero(int n, int e) {
        return count(n, e).signum() == 0;
    }

    /** sum over e &lt;= E of Omega(n, e): every microstate of n particles with energy at most E. */
    public BigInteger total(int n) {
        if (n < 0 || n > maxN) {
            throw InvalidInputException.of("particle number n", n, "in [0, " + maxN + "]", "Build a larger table.");
        }
        BigInteger t = totals.get(n);
        if (t == null) {
            t = BigInteger.ZERO;
            for (BigInteger c : rowArray(n)) {
                t = t.add(c);
            }
            totals.set(n, t); // racing threads store equal values
        }
        return t;
    }

    /**
     * ln Omega(n, e), computed from the exact integer ({@link ExactLog}: within 2 ulp, no overflow
     * for any size).
     *
     * @throws InvalidInputException when Omega(n, e) = 0
     */
    public double lnCount(int n, int e) {
        BigInteger c = count(n, e);
        if (c.signum() == 0) {
            throw InvalidInputException.of("Omega(" + n + ", " + e + ")", 0, "> 0 for a logarithm",
                    "No microstate has n = " + n + " and energy " + e + "; test isZero(n, e) first.");
        }
        return ExactLog.ln(c);
    }

    /** Microcanonical entropy S/k = ln Omega(n, e), in units of k_B; throws when Omega = 0. */
    public double entropy(int n, int e) {
        return lnCount(n, e);
    }

    /**
     * Omega(n, e) / total(n): the exact probability of total energy e when all microstates of n
     * particles with energy &lt;= E are equally likely.
     *
     * @throws InvalidInputException when total(n) = 0
     */
    public BigFraction probability(int n, int e) {
        BigInteger c = count(n, e);
        BigInteger t = total(n);
        if (t.signum() == 0) {
            throw InvalidInputException.of("total(" + n + ")", 0, "> 0", "No microstate of " + n
                    + " particles has energy <= " + maxE + "; raise E.");
        }
        return new BigFraction(c, t);
    }

    /** The row Omega(n, 0..E) as an unmodifiable list. */
    public List<BigInteger> row(int n) {
        if (n < 0 || n > maxN) {
            throw InvalidInputException.of("particle number n", n, "in [0, " + maxN + "]", "");
        }
        return Collections.unmodifiableList(Arrays.asList(rowArray(n).clone()));
    }

    /** The largest total energy up to which every entry equals the untruncated spectrum's count. */
    public int completeThroughEnergy() {
        double c = spectrum.cutoffEnergy();
        return c >= maxE ? maxE : (int) Math.max(-1, Math.floor(c));
    }

    /**
     * Number of primes used by the multi-modular path (0 when plain BigInteger was used): primes
     * between 2^49 and 2^50 where the processor has a fused multiply-add, else between 2^61 and 2^62.
     */
    public int primesUsed() {
        return primesUsed;
    }

    /** N. */
    public int maxParticles() {
        return maxN;
    }

    /** E. */
    public int maxEnergy() {
        return maxE;
    }

    /** The statistics counted. */
    public Statistics statistics() {
        return statistics;
    }

    /** The spectrum counted. */
    public Spectrum spectrum() {
        return spectrum;
    }

    /** Columns n, E, Omega. */
    @Override
    public List<String> columnNames() {
        return List.of("n", "E", "Omega");
    }

    /** One row per (n, e), n-major, Omega as an exact BigInteger. */
    @Override
    public List<List<Object>> rows() {
        List<List<Object>> out = new ArrayList<>((maxN + 1) * (maxE + 1));
        for (int n = 0; n <= maxN; n++) {
            BigInteger[] r = rowArray(n);
            for (int e = 0; e <= maxE; e++) {
                out.add(List.of(n, e, r[e]));
            }
        }
        return Collections.unmodifiableList(out);
    }

    private void checkIndex(int n, int e) {
        if (n < 0 || n > maxN) {
            throw InvalidInputException.of("particle number n", n, "in [0, " + maxN + "]", "Build a larger table.");
        }
        if (e < 0 || e > maxE) {
            throw InvalidInputException.of("total energy e", e, "in [0, " + maxE + "]", "Build a larger table.");
        }
    }

    @Override
    public String toString() {
        return "CountTable[" + statistics + ", N = " + maxN + ", E = " + maxE + ", " + spectrum + "]";
    }
}
