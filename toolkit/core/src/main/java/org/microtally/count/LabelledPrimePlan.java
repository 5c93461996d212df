package org.microtally.count;

import java.io.Serializable;
import java.math.BigInteger;
import java.util.Arrays;
import java.util.List;
import java.util.Objects;
import org.microtally.InvalidInputException;
import org.microtally.ProgressListener;
import org.microtally.exact.Combinatorics;
import org.microtally.spectrum.Spectrum;
import org.microtally.spectrum.Statistics;

/**
 * The multi-modular count of a {@link LabelledCountTable} or a {@link SpeciesMix} cut into
 * independent pieces, one per prime, for engines that run the pieces elsewhere (a thread pool, a
 * cluster) and recombine them on the caller. {@link Serializable}: a worker gets only the integer
 * level data; the spectra stay with the plan that was built, which alone can turn the recombined
 * counts into a table ({@link #table}) or a mix ({@link #mix}).
 *
 * <p><b>Method.</b> Modulo each prime p (all &gt; 2^61, {@link WordPrimes}) the recursion of
 * {@link LabelledCountTable} runs with the level-series coefficients reduced mod p and Shoup's
 * precomputed-quotient modular multiplication (V. Shoup, NTL; described in D. Harvey, "Faster
 * arithmetic for number-theoretic transforms", J. Symb. Comput. 60 (2014) 113-119, from memory);
 * a mix convolves the species' slices mod p exactly as {@link SpeciesMix} does over the integers.
 * {@link #recombine} is Garner's Chinese remaindering ({@link WordPrimes#recombine}; Knuth, TAOCP
 * Vol. 2, Sec. 4.3.2) over the required primes, then every entry is reduced modulo each redundant
 * prime and compared with that prime's own residue, so a corrupted residue is refused (a wrong
 * reconstruction agrees with an independent residue with probability about 2^-61 per entry).
 *
 * <p><b>Bound.</b> The number of required primes comes from a proven bound on every entry, with one
 * bit of margin: with energy, each labelled entry is at most the unlabelled Omega(n, e), bounded by
 * {@code CountBound.log2Bound} (the saddle-point bound of {@link CountTable}), and a species' slice
 * sums to at most (E + 1) times that; with energy ignored, every entry is at most the number of
 * n-particle states over the G single-particle states, C(G + N - 1, N) (Bose, capped), max_n C(G, n)
 * (Fermi) or G^N (distinguishable), computed exactly. A mix entry is at most the product of its
 * species' slice sums (the sum of a convolution's entries is the product of the factors' sums, and
 * the cut at e &lt;= E drops only non-negative terms).
 *
 * <p><b>Accuracy.</b> Exact: the reconstruction is the unique value below the product of the
 * required primes, which the bound proves exceeds every entry; identical entry by entry to the
 * BigInteger path of {@link LabelledCountTable#of} and {@link SpeciesMix#of} (tested by comparing
 * every entry).
 */
public final class LabelledPrimePlan implements Serializable {
    private static final long serialVersionUID = 1L;

    private final LabelledCountTable.Layout[] parts;
    private final int[] particles;          // per part; -1 for a table plan
    private final boolean isMix;
    private final int maxE;
    private final int labelLo;
    private final int width;
    private final double log2Bound;
    private final long[] primes;
    private final int required;
    private final transient Spectrum spectrum;
    private final transient Statistics statistics;
    private final transient List<Species> species;

    private LabelledPrimePlan(LabelledCountTable.Layout[] parts, int[] particles, boolean isMix, double bits,
                              int redundant, Spectrum spectrum, Statistics statistics, List<Species> species) {
        if (redundant < 0 || redundant > 8) {
            throw InvalidInputException.of("number of redundant primes", redundant, "in [0, 8]",
                    "One redundant prime already detects a corrupted residue with probability 1 - 2^-61.");
        }
        this.parts = parts;
        this.particles = particles;
        this.isMix = isMix;
        this.maxE = parts[0].maxE;
        int lo = 0;
        int w = 1;
        for (LabelledCountTable.Layout p : parts) {
            lo += p.labelLo;
            w += p.width - 1;
        }
        this.labelLo = isMix ? lo : parts[0].labelLo;
        this.width = isMix ? w : parts[0].width;
        this.log2Bound = bits;
        this.required = WordPrimes.primesFor(bits);
        this.primes = WordPrimes.primes(required + redundant);
        this.spectrum = spectrum;
        this.statistics = statistics;
        this.species = species;
    }

    /** The plan for {@link LabelledCountTable#of}(spectrum, statistics, maxParticles, maxEnergy). */
    public static LabelledPrimePlan forTable(Spectrum spectrum, Statistics statistics, int maxParticles,
                                             int maxEnergy, int redundantPrimes) {
        LabelledCountTable.Layout l = LabelledCountTable.Layout.of(spectrum, statistics, maxParticles, maxEnergy, false);
        return new LabelledPrimePlan(new LabelledCountTable.Layout[] {l}, new int[] {-1}, false, entryBits(l),
                redundantPrimes, spectrum, statistics, null);
    }

    /** The plan for {@link LabelledCountTable#ignoringEnergy}(spectrum, statistics, maxParticles). */
    public static LabelledPrimePlan forTableIgnoringEnergy(Spectrum spectrum, Statistics statistics, int maxParticles,
                                                           int redundantPrimes) {
        LabelledCountTable.Layout l = LabelledCountTable.Layout.of(spectrum, statistics, maxParticles, 0, true);
        return new LabelledPrimePlan(new LabelledCountTable.Layout[] {l}, new int[] {-1}, false, entryBits(l),
                redundantPrimes, spectrum, statistics, null);
    }

    /** The plan for {@link SpeciesMix#of}(species, maxEnergy). */
    public static LabelledPrimePlan forMix(List<Species> species, int maxEnergy, int redundantPrimes) {
        if (maxEnergy < 0) {
            throw InvalidInputException.of("maximum total energy E", maxEnergy, "an integer >= 0", "");
        }
        return mixPlan(SpeciesMix.checked(species), maxEnergy, false, redundantPrimes);
    }

    /** The plan for {@link SpeciesMix#ignoringEnergy}(species). */
    public static LabelledPrimePlan forMixIgnoringEnergy(List<Species> species, int redundantPrimes) {
        return mixPlan(SpeciesMix.checked(species), 0, true, redundantPrimes);
    }

    private static LabelledPrimePlan mixPlan(List<Species> species, int maxE, boolean ignore, int redundant) {
        LabelledCountTable.Layout[] parts = new LabelledCountTable.Layout[species.size()];
        int[] n = new int[parts.length];
        double bits = 1;
        for (int i = 0; i < parts.length; i++) {
            Species s = species.get(i);
            parts[i] = LabelledCountTable.Layout.of(s.spectrum(), s.statistics(), s.particles(), maxE, ignore);
            n[i] = s.particles();
            // a slice sums to at most (E + 1) x (bound on one unlabelled entry); with energy ignored E = 0
            bits += entryBits(parts[i]) + Math.log(maxE + 1.0) / Math.log(2) * (1 + 1e-12);
        }
        return new LabelledPrimePlan(parts, n, true, bits, redundant, null, null, species);
    }

    /** A proven upper bound, in bits, on every entry of the layout's table (class notes). */
    private static double entryBits(LabelledCountTable.Layout l) {
        Statistics stats = l.statistics();
        if (!l.energyIgnored) {
            return CountBound.log2Bound(l.energy, l.deg, stats, l.maxN, l.maxE) + 1;
        }
        long g = 0;
        for (int i = 0; i < l.levels; i++) {
            g += l.deg[i];
        }
        int n = l.maxN;
        BigInteger states;
        if (n == 0 || g == 0) {
            states = BigInteger.ONE;
        } else if (stats.kind() == Statistics.Kind.DISTINGUISHABLE) {
            states = BigInteger.valueOf(g).pow(n);
        } else if (stats.kind() == Statistics.Kind.FERMI) {
            states = Combinatorics.binomial(g, Math.min(n, g / 2));
        } else {
            states = Combinatorics.binomial(g + n - 1, n);
        }
        return states.bitLength() + 1;
    }

    /** Number of primes whose product is proven to exceed every entry. */
    public int requiredPrimes() {
        return required;
    }

    /** The proven bound, in bits, on every entry. */
    public double log2Bound() {
        return log2Bound;
    }

    /** The number of independent tasks: the required primes, then the redundant ones (given to the factory). */
    public int primeCount() {
        return primes.length;
    }

    /** The i-th prime (required ones first). */
    public long prime(int i) {
        checkPrimeIndex(i);
        return primes[i];
    }

    /** Length of every residue array: (N + 1)(E + 1)(label width) for a table, (E + 1)(label width) for a mix. */
    public int entries() {
        return isMix ? (maxE + 1) * width : parts[0].cells();
    }

    /** Whether this plan counts a {@link SpeciesMix} (else a {@link LabelledCountTable}). */
    public boolean isMix() {
        return isMix;
    }

    /** Every entry modulo {@link #prime(int) prime(i)}, each in [0, p); independent of every other i. */
    public long[] residues(int i) {
        checkPrimeIndex(i);
        long p = primes[i];
        if (!isMix) {
            return tableResidues(parts[0], p);
        }
        long[] cur = new long[entries()];
        cur[0] = 1;                                // the empty mix: Omega(0, 0) = 1 at label 0
        int curWidth = 1;
        for (int s = 0; s < parts.length; s++) {
            LabelledCountTable.Layout l = parts[s];
            long[] t = tableResidues(l, p);
            int from = particles[s] * (maxE + 1) * l.width;
            long[] next = new long[cur.length];
            for (int e1 = 0; e1 <= maxE; e1++) {
                for (int l1 = 0; l1 < curWidth; l1++) {
                    long a = cur[e1 * width + l1];
                    if (a == 0) {
                        continue;
                    }
                    long as = Moduli.shoup(a, p);
                    for (int e2 = 0; e1 + e2 <= maxE; e2++) {
                        int dst = (e1 + e2) * width + l1;
                        int src = from + e2 * l.width;
                        for (int l2 = 0; l2 < l.width; l2++) {
                            long b = t[src + l2];
                            if (b != 0) {
                                next[dst + l2] = Moduli.add(next[dst + l2], Moduli.mulShoup(a, as, b, p), p);
                            }
                        }
                    }
                }
            }
            cur = next;
            curWidth += l.width - 1;
        }
        return cur;
    }

    /** The labelled table of one layout modulo p, cells as in {@link LabelledCountTable.Layout}. */
    private static long[] tableResidues(LabelledCountTable.Layout l, long p) {
        long[] t = new long[l.cells()];
        t[-l.labelLo] = 1;
        int w = l.width;
        BigInteger bigP = BigInteger.valueOf(p);
        l.walk(l.ticker(ProgressListener.NONE), (dst, src, c, de, dl) -> {
            long cm = c.mod(bigP).longValue();
            if (cm == 0) {
                return;
            }
            long cs = Moduli.shoup(cm, p);
            int lFrom = Math.max(0, dl);
            int lTo = Math.min(w - 1, w - 1 + dl);
            for (int e = de; e <= l.maxE; e++) {
                int d = dst + e * w;
                int s = src + (e - de) * w - dl;
                for (int li = lFrom; li <= lTo; li++) {
                    long v = t[s + li];
                    if (v != 0) {
                        t[d + li] = Moduli.add(t[d + li], Moduli.mulShoup(cm, cs, v, p), p);
                    }
                }
            }
        });
        return t;
    }

    /** Every prime's residues, computed one after another on this thread. */
    public long[][] residuesLocally() {
        long[][] out = new long[primes.length][];
        for (int i = 0; i < out.length; i++) {
            out[i] = residues(i);
        }
        return out;
    }

    /**
     * Chinese remaindering of {@code residues} (array i modulo prime i, as {@link #residues(int)} gives
     * it) into exact entries, each verified modulo the redundant primes.
     *
     * @throws InvalidInputException unless there is one array per prime, each of {@link #entries()}
     *         values in [0, p)
     * @throws IllegalStateException when an entry disagrees with a redundant prime (some residue was
     *         corrupted); the message names the entry and the prime
     */
    public BigInteger[] recombine(long[][] residues) {
        if (Objects.requireNonNull(residues, "residues").length != primes.length) {
            throw InvalidInputException.of("residue arrays given", residues.length, primes.length + ", one per prime",
                    "Collect every task's result, in prime order.");
        }
        int size = entries();
        for (int i = 0; i < residues.length; i++) {
            long[] r = Objects.requireNonNull(residues[i], "residues[" + i + "]");
            long p = primes[i];
            if (r.length != size || Arrays.stream(r).anyMatch(v -> v < 0 || v >= p)) {
                throw InvalidInputException.of("residues[" + i + "]", r.length + " values",
                        "exactly " + size + " values, each in [0, " + p + ")",
                        "Each array holds every entry modulo its own prime, arrays in prime order.");
            }
        }
        BigInteger[] out = WordPrimes.recombine(Arrays.copyOf(primes, required), Arrays.copyOf(residues, required));
        for (int r = required; r < primes.length; r++) {
            BigInteger p = BigInteger.valueOf(primes[r]);
            for (int j = 0; j < size; j++) {
                long got = out[j].mod(p).longValue();
                if (got != residues[r][j]) {
                    throw new IllegalStateException("CRT consistency check failed at entry " + j + " of the "
                            + (isMix ? "species mix" : "labelled table") + ": the value reconstructed from " + required
                            + " primes is " + got + " modulo the redundant prime " + primes[r] + ", whose own residue is "
                            + residues[r][j] + ". A task returned a wrong residue; the counts are refused. Recompute.");
                }
            }
        }
        return out;
    }

    /**
     * The table this plan counts, from every prime's residues (recombined and checked as in
     * {@link #recombine}); only on the plan built by {@link #forTable} or {@link #forTableIgnoringEnergy}
     * itself, not on a deserialized copy.
     */
    public LabelledCountTable table(long[][] residues) {
        if (isMix || spectrum == null) {
            throw new IllegalStateException("table(...) needs the table plan as built on this machine "
                    + (isMix ? "(this plan counts a species mix: call mix(...))" : "(this is a deserialized copy)"));
        }
        LabelledCountTable.Layout l = parts[0];
        return new LabelledCountTable(spectrum, statistics, l.maxN, l.maxE, l.energyIgnored, l.labelLo, l.width,
                recombine(residues));
    }

    /**
     * The mix this plan counts, from every prime's residues (recombined and checked as in
     * {@link #recombine}); only on the plan built by {@link #forMix} or {@link #forMixIgnoringEnergy}
     * itself, not on a deserialized copy.
     */
    public SpeciesMix mix(long[][] residues) {
        if (!isMix || species == null) {
            throw new IllegalStateException("mix(...) needs the mix plan as built on this machine "
                    + (!isMix ? "(this plan counts a labelled table: call table(...))" : "(this is a deserialized copy)"));
        }
        BigInteger[] flat = recombine(residues);
        BigInteger[][] counts = new BigInteger[maxE + 1][];
        for (int e = 0; e <= maxE; e++) {
            counts[e] = Arrays.copyOfRange(flat, e * width, (e + 1) * width);
        }
        return SpeciesMix.fromCounts(species, maxE, parts[0].energyIgnored, labelLo, counts);
    }

    private void checkPrimeIndex(int i) {
        if (i < 0 || i >= primes.length) {
            throw InvalidInputException.of("prime index", i, "in [0, " + primes.length + ")", "");
        }
    }

    @Override
    public String toString() {
        return "LabelledPrimePlan[" + (isMix ? parts.length + " species" : "table") + ", " + required + " required + "
                + (primes.length - required) + " redundant primes]";
    }
}
