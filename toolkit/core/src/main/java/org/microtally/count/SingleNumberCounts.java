package org.microtally.count;

import java.math.BigInteger;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.Collections;
import java.util.List;
import java.util.Objects;
import org.microtally.InvalidInputException;
import org.microtally.ProgressListener;
import org.microtally.Tabular;
import org.microtally.spectrum.Spectrum;
import org.microtally.spectrum.Statistics;
import org.microtally.exact.Combinatorics;
import org.microtally.exact.ExactLog;

/**
 * Exact counts Omega(N, e), e = 0..E, for one particle number N, without the table of exact
 * integers for every (n, e): labelled (distinguishable) particles in memory E + 1 integers, so 1000
 * spin-1 moments (E = 2000) or a block of 3000 oscillators fit in any heap; indistinguishable
 * particles in one (N + 1)(E + 1) table of longs at a time (8 bytes per entry instead of a
 * BigInteger each). Immutable.
 *
 * <p><b>Formula.</b> Omega(N, e) = [q^e] Z_1(q)^N with Z_1(q) = sum_l g_l q^(e_l) (each labelled
 * particle independently in one state), energies measured from the ground level (Z_1 = q^(e_0) A(q)
 * with a_0 = g_0 &gt; 0, so Omega(N, e) = [q^(e - N e_0)] A(q)^N).
 *
 * <p><b>Method.</b> The coefficients p_k of P = A^N satisfy A P' = N A' P, which gives the recurrence
 * p_0 = a_0^N, p_k = (1 / (k a_0)) sum_{i=1..min(k, D)} ((N + 1) i - k) a_i p_{k-i}, D the degree of A
 * (J. C. P. Miller's formula for powers of a power series; D. E. Knuth, <i>The Art of Computer
 * Programming</i> vol. 2, sect. 4.7; both from memory). In BigInteger the division is exact (the sum
 * is k a_0 p_k, an integer identity); a non-zero remainder would be a bug and throws. Cost
 * O(E min(E, D)) BigInteger multiply-adds of numbers up to log2 Omega bits.
 *
 * <p><b>Accuracy.</b> Exact. Cutoffs: as in {@link CountTable}, entries with e &lt;= the spectrum's
 * cutoff energy equal the untruncated count ({@link #completeThroughEnergy()}).
 *
 * <p><b>Indistinguishable particles.</b> The level-by-level recursion of {@link CountTable} (one
 * truncated level series per level, {@code LevelSeries}) needs every row n &lt;= N, so it is run
 * modulo one prime below 2^31 at a time on a table of longs, keeping row N only; the row is rebuilt
 * exactly by Chinese remaindering (incremental, Garner's scheme; D. E. Knuth, TAOCP vol. 2, 4.3.2,
 * from memory). Number of primes: every count is at most C(S_E + N - 1, N), the number of N-boson
 * occupations of the S_E states with energy &lt;= E (capped statistics count a subset), so primes of
 * more than 30 bits each, one more than that bound's bit length / 30, make the product exceed twice
 * every count: exact. Cost: primes x O(N E sum_l J_l) word operations, sequential (frugal in memory,
 * slower than CountTable's parallel path).
 */
public final class SingleNumberCounts implements Tabular {
    private final Spectrum spectrum;
    private final int n;
    private final int maxE;
    private final BigInteger[] counts;

    private SingleNumberCounts(Spectrum spectrum, int n, int maxE, BigInteger[] counts) {
        this.spectrum = spectrum;
        this.n = n;
        this.maxE = maxE;
        this.counts = counts;
    }

    /**
     * Omega(N, e) for e = 0..E of N labelled particles on {@code spectrum}.
     *
     * @throws InvalidInputException for N &lt; 0, E &lt; 0, negative or non-integer energies, or (for
     *                               indistinguishable particles) a table of longs above half the heap
     */
    public static SingleNumberCounts of(Spectrum spectrum, Statistics statistics, int particles, int maxEnergy) {
        Objects.requireNonNull(statistics, "statistics");
        CountTable.Input in = CountTable.Input.validate(spectrum, statistics, particles, maxEnergy, ProgressListener.NONE);
        if (statistics.indistinguishable()) {
            return new SingleNumberCounts(spectrum, particles, maxEnergy,
                    leanModular(in, statistics, particles, maxEnergy));
        }
        int e0 = in.energy[0];
        BigInteger[] out = new BigInteger[maxEnergy + 1];
        Arrays.fill(out, BigInteger.ZERO);
        long shift = (long) particles * e0;
        if (shift > maxEnergy) {
            return new SingleNumberCounts(spectrum, particles, maxEnergy, out);
        }
        int span = (int) (maxEnergy - shift);
        // A(q) = sum_l g_l q^(e_l - e0), truncated at degree span
        BigInteger[] a = new BigInteger[span + 1];
        Arrays.fill(a, BigInteger.ZERO);
        int degree = 0;
        for (int l = 0; l < in.energy.length; l++) {
            int d = in.energy[l] - e0;
            if (d <= span) {
                a[d] = a[d].add(BigInteger.valueOf(in.deg[l]));
                degree = Math.max(degree, d);
            }
        }
        BigInteger[] p = new BigInteger[span + 1];
        p[0] = a[0].pow(particles);
        BigInteger nPlus1 = BigInteger.valueOf(particles + 1L);
        for (int k = 1; k <= span; k++) {
            BigInteger s = BigInteger.ZERO;
            BigInteger bk = BigInteger.valueOf(k);
            for (int i = 1; i <= Math.min(k, degree); i++) {
                if (a[i].signum() == 0 || p[k - i].signum() == 0) {
                    continue;
                }
                BigInteger coef = nPlus1.multiply(BigInteger.valueOf(i)).subtract(bk);
                s = s.add(coef.multiply(a[i]).multiply(p[k - i]));
            }
            BigInteger[] qr = s.divideAndRemainder(bk.multiply(a[0]));
            if (qr[1].signum() != 0) {
                throw new IllegalStateException("power recurrence left a remainder at k = " + k + "; please report");
            }
            p[k] = qr[0];
        }
        for (int k = 0; k <= span; k++) {
            out[(int) (k + shift)] = p[k];
        }
        return new SingleNumberCounts(spectrum, particles, maxEnergy, out);
    }

    /** Primes below 2^31 (descending from 2^31 - 1), so every product of two residues fits in a long. */
    private static long[] smallPrimes(int k) {
        long[] out = new long[k];
        long c = Integer.MAX_VALUE;
        for (int i = 0; i < k; c -= 2) {
            if (BigInteger.valueOf(c).isProbablePrime(64)) {
                out[i++] = c;
            }
        }
        return out;
    }

    /**
     * Indistinguishable particles: the level-by-level table modulo one prime at a time (long entries,
     * one table alive at once), keeping only row N of each, then Chinese remaindering of that row.
     */
    private static BigInteger[] leanModular(CountTable.Input in, Statistics st, int n, int maxE) {
        int levels = CountEngine.relevantLevels(in.energy, maxE);
        long states = 0;
        for (int l = 0; l < levels; l++) {
            states += in.deg[l];
        }
        double cells = (double) (n + 1) * (maxE + 1);
        double limit = Runtime.getRuntime().maxMemory() * 0.5;
        if (cells * 8 > limit || cells > Integer.MAX_VALUE - 16) {
            throw InvalidInputException.of("modular table (N + 1) x (E + 1)", String.format("%.3g longs", cells),
                    String.format("at most %.3g MiB (half the heap)", limit / (1 << 20)), "Lower N or E.");
        }
        // every count is at most the number of N-boson occupations of the relevant states
        int bits = Combinatorics.binomial(states + n - 1, n).bitLength() + 1;
        long[] primes = smallPrimes(bits / 30 + 1);
        BigInteger[][] series = new BigInteger[levels][];
        for (int l = 0; l < levels; l++) {
            series[l] = LevelSeries.coefficients(st, in.deg[l], CountEngine.maxJ(in.energy[l], n, maxE));
        }
        int w = maxE + 1;
        long[][] rows = new long[primes.length][];
        long[] t = new long[(n + 1) * w];
        for (int pi = 0; pi < primes.length; pi++) {
            long p = primes[pi];
            java.util.Arrays.fill(t, 0);
            t[0] = 1;
            int prevTop = -1; // largest level energy applied so far (-1: none); row m is zero above m * prevTop
            for (int l = 0; l < levels; l++) {
                BigInteger[] cb = series[l];
                long[] c = new long[cb.length];
                for (int j = 0; j < c.length; j++) {
                    c[j] = cb[j].mod(BigInteger.valueOf(p)).longValue();
                }
                int el = in.energy[l];
                for (int k = n; k >= 1; k--) {
                    int jTop = Math.min(k, c.length - 1);
                    if (prevTop < 0) {
                        // only the empty state so far: k particles all in this level
                        if (k <= jTop && (long) k * el <= maxE) {
                            t[k * w + k * el] = c[k];
                        }
                        continue;
                    }
                    int eTop = (int) Math.min(maxE, (long) k * el);
                    for (int e = eTop; e >= 0; e--) {
                        // source row k - j is non-zero only for e - j el <= (k - j) prevTop
                        int jMin = 1;
                        if (el > prevTop) {
                            long need = (long) e - (long) k * prevTop;
                            if (need > 0) {
                                jMin = (int) Math.max(1, (need + (el - prevTop) - 1) / (el - prevTop));
                            }
                        } else if ((long) e > (long) k * prevTop) {
                            continue;
                        }
                        long acc = t[k * w + e];
                        for (int j = jMin; j <= jTop; j++) {
                            int src = e - j * el;
                            if (src < 0) {
                                break;
                            }
                            acc = (acc + c[j] * t[(k - j) * w + src]) % p;
                        }
                        t[k * w + e] = acc;
                    }
                }
                prevTop = el;
            }
            rows[pi] = java.util.Arrays.copyOfRange(t, n * w, (n + 1) * w);
        }
        BigInteger[] out = new BigInteger[w];
        for (int e = 0; e < w; e++) {
            // Garner-style incremental reconstruction: x = x + m ((r - x) m^-1 mod p)
            BigInteger x = BigInteger.ZERO;
            BigInteger m = BigInteger.ONE;
            for (int pi = 0; pi < primes.length; pi++) {
                BigInteger bp = BigInteger.valueOf(primes[pi]);
                BigInteger r = BigInteger.valueOf(rows[pi][e]);
                BigInteger step = r.subtract(x.mod(bp)).multiply(m.modInverse(bp)).mod(bp);
                x = x.add(m.multiply(step));
                m = m.multiply(bp);
            }
            out[e] = x;
        }
        return out;
    }

    /** Omega(N, e). */
    public BigInteger count(int e) {
        if (e < 0 || e > maxE) {
            throw InvalidInputException.of("total energy e", e, "in [0, " + maxE + "]", "Build with a larger E.");
        }
        return counts[e];
    }

    /** ln Omega(N, e) from the exact integer (within 2 ulp); refuses Omega = 0. */
    public double lnCount(int e) {
        BigInteger c = count(e);
        if (c.signum() == 0) {
            throw InvalidInputException.of("Omega(" + n + ", " + e + ")", 0, "> 0 for a logarithm", "");
        }
        return ExactLog.ln(c);
    }

    /** The row Omega(N, 0..E), unmodifiable (usable by {@link SharedTotal#of(List, List, int)}). */
    public List<BigInteger> row() {
        return Collections.unmodifiableList(Arrays.asList(counts.clone()));
    }

    /** The largest total energy up to which every entry equals the untruncated spectrum's count. */
    public int completeThroughEnergy() {
        double c = spectrum.cutoffEnergy();
        return c >= maxE ? maxE : (int) Math.max(-1, Math.floor(c));
    }

    /** N. */
    public int particleNumber() {
        return n;
    }

    /** E. */
    public int maxEnergy() {
        return maxE;
    }

    /** Columns E, Omega. */
    @Override
    public List<String> columnNames() {
        return List.of("E", "Omega");
    }

    /** One row per e = 0..E. */
    @Override
    public List<List<Object>> rows() {
        List<List<Object>> r = new ArrayList<>(maxE + 1);
        for (int e = 0; e <= maxE; e++) {
            r.add(List.of(e, counts[e]));
        }
        return r;
    }

    @Override
    public String toString() {
        return "SingleNumberCounts[N = " + n + ", E = " + maxE + ", " + spectrum + "]";
    }
}
