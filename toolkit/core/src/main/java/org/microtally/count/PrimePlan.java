package org.microtally.count;

import java.io.Serializable;
import java.math.BigInteger;
import java.util.Arrays;
import java.util.Objects;
import org.microtally.InvalidInputException;
import org.microtally.ProgressListener;
import org.microtally.spectrum.Spectrum;
import org.microtally.spectrum.Statistics;

/**
 * The multi-modular count of a {@link CountTable} cut into independent pieces, one per prime, for
 * engines that run those pieces elsewhere (another thread pool, a cluster) and recombine them.
 * Immutable and {@link Serializable} (it holds only the integer level data, never the spectrum), so a
 * plan can be shipped to a worker that computes {@link #residues(int, ProgressListener)} for one prime.
 *
 * <p><b>Method.</b> Exactly the {@link CountTable} multi-modular path: the number k of primes (the
 * same set as the local table: above 2^49 and below 2^50 where the JVM has a hardware fused
 * multiply-add, so every task runs the vectorised FMA row loop, else above 2^61) comes from the
 * proven saddle-point bound on every entry ({@code CountBound}); residues
 * modulo one prime come from the same level-by-level recursion; {@link #table} (lazy, rows rebuilt
 * when read) and {@link #recombine(long[][])} (eager) are Garner's mixed-radix Chinese remaindering
 * (Knuth, TAOCP Vol. 2, Sec. 4.3.2). On top of that the plan carries {@code r} redundant primes: the
 * value reconstructed from the k required residues must agree with each redundant prime's own residue,
 * checked in long arithmetic as "every Garner digit over all k + r primes from the k-th on is zero"
 * (the digits are unique, so this is the same condition). A wrong residue
 * (a corrupted or mis-assigned task result) changes the reconstruction to some other value below the
 * product of the k primes, which agrees with an independent residue modulo a prime p &gt; 2^49 with
 * probability about 1/p per entry; so with {@code r >= 1} a corrupted table is refused, not returned.
 *
 * <p><b>Accuracy.</b> Exact (the reconstruction is the unique value below the product of the required
 * primes, which the bound proves exceeds every entry), identical entry by entry to
 * {@link CountTable#of}.
 *
 * <p>This facade only calls the package's existing machinery: {@code CountTable.Input.validate},
 * {@code CountTable.requireMemory}, {@code CountBound.log2Bound}, {@code Moduli.tablePrimeCount},
 * {@code Moduli.tablePrimes}, {@code CountEngine.residuesModulo} (one prime's table),
 * {@code Moduli.Crt} and {@code CountTable.fromResidues}.
 */
public final class PrimePlan implements Serializable {
    private static final long serialVersionUID = 1L;

    private final int[] energy;
    private final int[] deg;
    private final Statistics.Kind kind;
    private final int maxOccupancy;
    private final int maxN;
    private final int maxE;
    private final double log2Bound;
    private final int required;
    private final long[] primes;

    private PrimePlan(int[] energy, int[] deg, Statistics stats, int maxN, int maxE, double log2Bound,
                      int required, long[] primes) {
        this.energy = energy;
        this.deg = deg;
        this.kind = stats.kind();
        this.maxOccupancy = stats.maxOccupancy();
        this.maxN = maxN;
        this.maxE = maxE;
        this.log2Bound = log2Bound;
        this.required = required;
        this.primes = primes;
    }

    /**
     * The plan for Omega(n, e), n &lt;= maxParticles, e &lt;= maxEnergy, with {@code redundantPrimes}
     * extra primes for the consistency check.
     *
     * @throws InvalidInputException as {@link CountTable#of} (negative N or E, non-integer or
     *         negative energies, a table beyond half the heap), or redundantPrimes outside [0, 8]
     */
    public static PrimePlan of(Spectrum spectrum, Statistics statistics, int maxParticles, int maxEnergy,
                               int redundantPrimes) {
        CountTable.Input in = CountTable.Input.validate(spectrum, statistics, maxParticles, maxEnergy,
                ProgressListener.NONE);
        if (redundantPrimes < 0 || redundantPrimes > 8) {
            throw InvalidInputException.of("number of redundant primes", redundantPrimes, "in [0, 8]",
                    "One redundant prime already detects a corrupted residue with probability about 1 - 2^-49.");
        }
        CountTable.requireMemory(maxParticles, maxEnergy, 0, 1);
        double bits = CountBound.log2Bound(in.energy, in.deg, statistics, maxParticles, maxEnergy);
        int k = Moduli.tablePrimeCount(bits);
        CountTable.requireMemory(maxParticles, maxEnergy, bits, k + redundantPrimes);
        return new PrimePlan(in.energy, in.deg, statistics, maxParticles, maxEnergy, bits, k,
                Moduli.tablePrimes(k + redundantPrimes));
    }

    /** Number of primes whose product is proven to exceed every entry. */
    public int requiredPrimes() {
        return required;
    }

    /** Number of extra primes used only to verify the reconstruction. */
    public int redundantPrimes() {
        return primes.length - required;
    }

    /** requiredPrimes() + redundantPrimes(): the number of independent tasks. */
    public int primeCount() {
        return primes.length;
    }

    /** The i-th prime (required ones first, then the redundant ones). */
    public long prime(int i) {
        checkPrimeIndex(i);
        return primes[i];
    }

    /** The proven upper bound, in bits, on log2 of every entry. */
    public double log2Bound() {
        return log2Bound;
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
        return new Statistics(kind, maxOccupancy);
    }

    /** (N + 1) (E + 1): the length of every residue array and of the recombined table (row-major). */
    public int entries() {
        return (maxN + 1) * (maxE + 1);
    }

    /**
     * The whole table modulo {@link #prime(int) prime(i)}, row-major (index n (E + 1) + e), each value
     * in [0, p). Costs one prime's share of the {@link CountTable} work; independent of every other i.
     */
    public long[] residues(int i, ProgressListener progress) {
        checkPrimeIndex(i);
        Objects.requireNonNull(progress, "progress");
        return CountEngine.residuesModulo(energy, deg, statistics(), maxN, maxE, primes[i], progress);
    }

    /**
     * The exact table, row-major, from every prime's residues ({@code residues[i]} for prime i), after
     * checking each reconstructed entry against every redundant prime.
     *
     * @throws InvalidInputException if the residue arrays have the wrong count or length, or hold a
     *         value outside [0, p)
     * @throws IllegalStateException if a redundant prime disagrees with the reconstruction (a corrupted
     *         residue); the message names the entry and the prime
     */
    public BigInteger[] recombine(long[][] residues) {
        checkConsistent(residues);
        return new Moduli.Crt(Arrays.copyOf(primes, required)).reconstructAll(Arrays.copyOf(residues, required));
    }

    /**
     * The exact table as a {@link CountTable} of {@code spectrum} (the spectrum this plan was made from)
     * from every prime's residues, after the same checks as {@link #recombine}; its rows are rebuilt by
     * Chinese remaindering when first read, as for {@link CountTable#of}, so the table equals the local
     * one entry by entry and costs the driver only the check until it is read. The arrays are copied.
     *
     * @throws InvalidInputException as {@link #recombine}, or for a spectrum with other levels than the plan's
     * @throws IllegalStateException as {@link #recombine}
     */
    public CountTable table(Spectrum spectrum, long[][] residues) {
        CountTable.Input in = CountTable.Input.validate(spectrum, statistics(), maxN, maxE, ProgressListener.NONE);
        if (!Arrays.equals(in.energy, energy) || !Arrays.equals(in.deg, deg)) {
            throw InvalidInputException.of("spectrum of the residues' table", spectrum,
                    "the spectrum this plan was made from (the same integer energies and degeneracies)",
                    "Pass the spectrum given to PrimePlan.of.");
        }
        checkConsistent(residues);
        long[][] kept = new long[required][];
        for (int i = 0; i < required; i++) {
            kept[i] = residues[i].clone();
        }
        return CountTable.fromResidues(spectrum, statistics(), maxN, maxE, kept, Arrays.copyOf(primes, required));
    }

    /**
     * Checks the shape and range of every residue array, then every entry against the redundant primes:
     * the Garner digits over all primes (redundant ones last) are unique, so the k required residues
     * and the redundant ones agree exactly when every digit from the k-th on is zero (long arithmetic
     * only; the BigInteger is formed only to word the message of a failure).
     */
    private void checkConsistent(long[][] residues) {
        Objects.requireNonNull(residues, "residues");
        if (residues.length != primes.length) {
            throw InvalidInputException.of("number of residue arrays", residues.length, "exactly " + primes.length,
                    "Pass one array per prime of the plan, in prime order.");
        }
        int size = entries();
        for (int i = 0; i < residues.length; i++) {
            long[] r = Objects.requireNonNull(residues[i], "residues[" + i + "]");
            if (r.length != size) {
                throw InvalidInputException.of("length of residues[" + i + "]", r.length, "exactly " + size,
                        "Each array holds the whole table modulo one prime.");
            }
            for (int j = 0; j < size; j++) {
                if (r[j] < 0 || r[j] >= primes[i]) {
                    throw InvalidInputException.of("residues[" + i + "][" + j + "]", r[j],
                            "in [0, " + primes[i] + ")", "The array is not a table of residues modulo this prime.");
                }
            }
        }
        if (required == primes.length) {
            return;
        }
        Moduli.Crt all = new Moduli.Crt(primes);
        int[] top = new int[Moduli.Crt.BLOCK];
        for (int from = 0; from < size; from += top.length) {
            int count = Math.min(top.length, size - from);
            all.topDigits(residues, from, count, top);
            for (int j = 0; j < count; j++) {
                if (top[j] >= required) {
                    throw inconsistency(residues, from + j);
                }
            }
        }
    }

    private IllegalStateException inconsistency(long[][] residues, int j) {
        BigInteger v = new Moduli.Crt(Arrays.copyOf(primes, required)).reconstruct(residues, j);
        for (int r = required; r < primes.length; r++) {
            long got = v.mod(BigInteger.valueOf(primes[r])).longValue();
            if (got != residues[r][j]) {
                return new IllegalStateException(String.format(
                        "CRT consistency check failed at Omega(%d, %d): the value reconstructed from %d primes is "
                                + "%d modulo the redundant prime %d, but that prime's own residue is %d. A task "
                                + "returned a wrong residue; the table is refused. Recompute it.",
                        j / (maxE + 1), j % (maxE + 1), required, got, primes[r], residues[r][j]));
            }
        }
        throw new AssertionError("Garner digits above the required primes but every redundant residue agrees");
    }

    private void checkPrimeIndex(int i) {
        if (i < 0 || i >= primes.length) {
            throw InvalidInputException.of("prime index", i, "in [0, " + primes.length + ")", "");
        }
    }

    @Override
    public String toString() {
        return "PrimePlan[" + statistics() + ", N = " + maxN + ", E = " + maxE + ", " + required + " required + "
                + redundantPrimes() + " redundant primes]";
    }
}
