package org.microtally.bench;

import java.math.BigInteger;
import java.util.ArrayList;
import java.util.List;
import org.microtally.spectrum.Spectrum;
import org.microtally.spectrum.Statistics;

/**
 * The baseline that the degeneracy-grouped counting replaces: one update pass per single-particle
 * state (g passes for a level of degeneracy g), in the same multi-modular arithmetic as the library
 * (same number of primes below 2^62, Chinese remaindering at the end), so a measured ratio isolates
 * the algorithmic change. A Bose state multiplies the generating function by 1/(1 - x q^e), i.e.
 * T[n][e] += T[n-1][e - e_s] sweeping n upwards; a Fermi state by (1 + x q^e), the same sum sweeping
 * n downwards. Only additions modulo p are needed. Benchmark code only, not part of the toolkit.
 */
public final class PerStateCounter {
    private PerStateCounter() { }

    /** Omega(n, e) for n &lt;= maxN, e &lt;= maxE, row-major, with {@code primes} moduli (&gt;= what the values need). */
    public static BigInteger[] count(Spectrum s, Statistics stats, int maxN, int maxE, int primes) {
        if (stats != Statistics.BOSE && stats != Statistics.FERMI) {
            throw new IllegalArgumentException("baseline covers BOSE and FERMI only, not " + stats);
        }
        int[] energy = s.integerEnergies();
        int[] deg = s.degeneracies();
        long[] p = primesBelow62(primes);
        int w = maxE + 1;
        long[][] res = new long[primes][];
        for (int k = 0; k < primes; k++) {
            long m = p[k];
            long[] t = new long[(maxN + 1) * w];
            t[0] = 1;
            for (int l = 0; l < energy.length && energy[l] <= maxE; l++) {
                int el = energy[l];
                for (int copy = 0; copy < deg[l]; copy++) {
                    if (stats == Statistics.BOSE) {
                        for (int n = 1; n <= maxN; n++) {
                            pass(t, n * w, (n - 1) * w, el, maxE, m);
                        }
                    } else {
                        for (int n = maxN; n >= 1; n--) {
                            pass(t, n * w, (n - 1) * w, el, maxE, m);
                        }
                    }
                }
            }
            res[k] = t;
        }
        return reconstruct(res, p);
    }

    private static void pass(long[] t, int dst, int src, int el, int maxE, long m) {
        for (int e = el; e <= maxE; e++) {
            long v = t[dst + e] + t[src + e - el];
            t[dst + e] = v >= m ? v - m : v;
        }
    }

    static long[] primesBelow62(int k) {
        List<Long> out = new ArrayList<>();
        long c = (1L << 62) - 1;
        while (out.size() < k) {
            if (BigInteger.valueOf(c).isProbablePrime(100)) {
                out.add(c);
            }
            c -= 2;
        }
        long[] a = new long[k];
        for (int i = 0; i < k; i++) {
            a[i] = out.get(i);
        }
        return a;
    }

    private static BigInteger[] reconstruct(long[][] res, long[] p) {
        BigInteger modulus = BigInteger.ONE;
        for (long q : p) {
            modulus = modulus.multiply(BigInteger.valueOf(q));
        }
        BigInteger[] basis = new BigInteger[p.length];
        for (int k = 0; k < p.length; k++) {
            BigInteger mk = modulus.divide(BigInteger.valueOf(p[k]));
            basis[k] = mk.multiply(mk.modInverse(BigInteger.valueOf(p[k])));
        }
        BigInteger[] out = new BigInteger[res[0].length];
        for (int i = 0; i < out.length; i++) {
            BigInteger v = BigInteger.ZERO;
            for (int k = 0; k < p.length; k++) {
                if (res[k][i] != 0) {
                    v = v.add(basis[k].multiply(BigInteger.valueOf(res[k][i])));
                }
            }
            out[i] = v.mod(modulus);
        }
        return out;
    }
}
