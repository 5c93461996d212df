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

/**
 * Exact counts Omega(N, e), e = 0..E, for one particle number N of labelled (distinguishable)
 * particles, without the whole (n, e) table: memory E + 1 integers instead of (N + 1)(E + 1), so 1000
 * spin-1 moments (E = 2000) or a block of 3000 oscillators fit in any heap. Immutable.
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
 * <p>Indistinguishable particles are not covered here: their level-by-level recursion needs every
 * row n &lt;= N ({@link CountTable}).
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
     * @throws InvalidInputException for statistics other than DISTINGUISHABLE (use {@link CountTable}),
     *                               N &lt; 0, E &lt; 0, negative or non-integer energies
     */
    public static SingleNumberCounts of(Spectrum spectrum, Statistics statistics, int particles, int maxEnergy) {
        Objects.requireNonNull(statistics, "statistics");
        if (statistics.indistinguishable()) {
            throw InvalidInputException.of("statistics for a single-N table", statistics, "DISTINGUISHABLE",
                    "Indistinguishable particles need every row n <= N: use CountTable.");
        }
        CountTable.Input in = CountTable.Input.validate(spectrum, statistics, particles, maxEnergy, ProgressListener.NONE);
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
        return "SingleNumberCounts[DISTINGUISHABLE, N = " + n + ", E = " + maxE + ", " + spectrum + "]";
    }
}
