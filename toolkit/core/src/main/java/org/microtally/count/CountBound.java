package org.microtally.count;

import java.math.BigInteger;
import org.microtally.spectrum.Statistics;

/**
 * A proven upper bound on every entry of a count table, which fixes how many primes the
 * multi-modular path needs.
 *
 * <p>Saddle-point bound: if G(x, q) = sum a_{n,e} x^n q^e has non-negative coefficients then, for
 * every x0, q0 &gt; 0, a_{n,e} &lt;= G(x0, q0) / (x0^n q0^e) (P. Flajolet, R. Sedgewick, Analytic
 * Combinatorics, CUP 2009, Ch. VIII, "saddle-point bounds"). We apply it to the
 * product of the level polynomials truncated at J (which has the same coefficients for n &lt;= N,
 * e &lt;= E, and is a polynomial, so any x0, q0 is allowed), and bound every n &lt;= N, e &lt;= E at once
 * by ln G - N min(ln x0, 0) - E min(ln q0, 0). That function of (ln x0, ln q0) is convex, and we
 * minimise it by nested golden-section search; every evaluated point is itself a valid bound and the
 * smallest is kept, so the search quality affects only tightness, never validity. For
 * distinguishable particles the bound is Z1(q0)^n / q0^e &lt;= max(1, Z1(q0)^N) / min(1, q0)^E.
 *
 * <p>Floating-point evaluation of the log of the bound carries a relative error far below 1e-9; we
 * add 1e-9 relative plus 2 bits, so the returned number of bits is a proven upper bound on log2 of
 * every entry.
 */
final class CountBound {
    private CountBound() { }

    private static final double LN2 = Math.log(2.0);
    private static final double RANGE = 60.0;

    /** An upper bound, in bits, on log2 of every Omega(n, e), n &lt;= maxN, e &lt;= maxE. */
    static double log2Bound(int[] energy, int[] deg, Statistics stats, int maxN, int maxE) {
        int levels = CountEngine.relevantLevels(energy, maxE);
        if (levels == 0 || maxN == 0) {
            return 2; // only Omega(0, 0) = 1 can be non-zero
        }
        double best;
        if (stats.indistinguishable()) {
            double[][] lnc = new double[levels][];
            for (int l = 0; l < levels; l++) {
                BigInteger[] c = LevelSeries.coefficients(stats, deg[l], CountEngine.maxJ(energy[l], maxN, maxE));
                lnc[l] = new double[c.length];
                for (int j = 0; j < c.length; j++) {
                    lnc[l][j] = ExactLog.ln(c[j]);
                }
            }
            Objective2 f = (u, v) -> {
                double s = 0;
                for (int l = 0; l < levels; l++) {
                    s += logSumExp(lnc[l], u + energy[l] * v);
                }
                return s - maxN * Math.min(u, 0) - maxE * Math.min(v, 0);
            };
            best = minimise2(f);
        } else {
            Objective1 f = v -> {
                double m = Double.NEGATIVE_INFINITY;
                for (int l = 0; l < levels; l++) {
                    m = Math.max(m, Math.log(deg[l]) + energy[l] * v);
                }
                double s = 0;
                for (int l = 0; l < levels; l++) {
                    s += Math.exp(Math.log(deg[l]) + energy[l] * v - m);
                }
                double lnZ1 = levels == 0 ? Double.NEGATIVE_INFINITY : m + Math.log(s);
                return Math.max(0, maxN * lnZ1) - maxE * Math.min(v, 0);
            };
            best = minimise1(f, new double[] {Double.POSITIVE_INFINITY});
        }
        if (!(best < Double.POSITIVE_INFINITY)) {
            throw new IllegalStateException("no finite count bound found for N = " + maxN + ", E = " + maxE);
        }
        double bits = best / LN2;
        return Math.max(bits, 0) * (1 + 1e-9) + 2;
    }

    /** Number of primes (each &gt; 2^61) whose product exceeds every entry. */
    static int primesFor(double log2Bound) {
        return Math.max(1, (int) Math.ceil(log2Bound / Moduli.BITS_PER_PRIME));
    }

    /** ln sum_j exp(lnc[j] + j t). */
    private static double logSumExp(double[] lnc, double t) {
        double m = Double.NEGATIVE_INFINITY;
        for (int j = 0; j < lnc.length; j++) {
            m = Math.max(m, lnc[j] + j * t);
        }
        double s = 0;
        for (int j = 0; j < lnc.length; j++) {
            s += Math.exp(lnc[j] + j * t - m);
        }
        return m + Math.log(s);
    }

    private interface Objective1 {
        double at(double v);
    }

    private interface Objective2 {
        double at(double u, double v);
    }

    private static final double GOLD = (Math.sqrt(5) - 1) / 2;

    private static double minimise2(Objective2 f) {
        double[] best = {Double.POSITIVE_INFINITY};
        minimise1(u -> minimise1(v -> f.at(u, v), best), best);
        return best[0];
    }

    /** Golden-section search on [-RANGE, RANGE]; returns the smallest value seen (also folded into best[0]). */
    private static double minimise1(Objective1 f, double[] best) {
        double a = -RANGE;
        double b = RANGE;
        double c = b - GOLD * (b - a);
        double d = a + GOLD * (b - a);
        double fc = f.at(c);
        double fd = f.at(d);
        double seen = Math.min(Math.min(fc, fd), f.at(0.0));
        for (int it = 0; it < 32; it++) {
            if (fc < fd) {
                b = d;
                d = c;
                fd = fc;
                c = b - GOLD * (b - a);
                fc = f.at(c);
                seen = Math.min(seen, fc);
            } else {
                a = c;
                c = d;
                fc = fd;
                d = a + GOLD * (b - a);
                fd = f.at(d);
                seen = Math.min(seen, fd);
            }
        }
        if (!Double.isNaN(seen)) {
            best[0] = Math.min(best[0], seen);
        }
        return seen;
    }
}
