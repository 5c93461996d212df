package org.microtally.count;

import java.math.BigInteger;
import org.microtally.spectrum.Statistics;
import org.microtally.exact.Combinatorics;
import org.microtally.exact.ExactLog;

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
 * minimise it by a projected Newton iteration with backtracking (J. Nocedal, S. J. Wright, Numerical
 * Optimization, 2nd ed., Springer 2006, Ch. 3 and 16.7), in about 25 evaluations (23 at N = 40, E = 200); every
 * evaluated point is itself a valid bound and the smallest is kept, so the search quality affects
 * only tightness, never validity. For
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
                lnc[l] = lnCoefficients(stats, deg[l], CountEngine.maxJ(energy[l], maxN, maxE));
            }
            best = newton(new Saddle(lnc, energy, levels, maxN, maxE));
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

    /**
     * ln c_j of {@link LevelSeries#coefficients}: for Bose and Fermi by the ratio recurrence
     * c_j = c_{j-1} (g + j - 1)/j, resp. (g - j + 1)/j, in double logs; each step adds a few ulp of
     * the running sum, so ln c_j errs by under 1e-6 for j &lt;= 10^5, and ln G (a sum over levels of
     * log-sum-exps, each off by at most its largest input error) by far less than the 2-bit margin
     * added to the bound. Gentile: from the exact series.
     */
    private static double[] lnCoefficients(Statistics stats, int g, int maxJ) {
        int top;
        switch (stats.kind()) {
            case BOSE:
                top = maxJ;
                break;
            case FERMI:
                top = Math.min(maxJ, g);
                break;
            default:
                BigInteger[] c = LevelSeries.coefficients(stats, g, maxJ);
                double[] out = new double[c.length];
                for (int j = 0; j < c.length; j++) {
                    out[j] = ExactLog.ln(c[j]);
                }
                return out;
        }
        boolean bose = stats.kind() == Statistics.Kind.BOSE;
        double[] out = new double[top + 1];
        for (int j = 1; j <= top; j++) {
            out[j] = out[j - 1] + Math.log(bose ? (double) g + j - 1 : (double) g - j + 1) - Math.log(j);
        }
        return out;
    }

    /** Number of primes of {@link Moduli#fmaPrimes} (each &gt; 2^49) whose product exceeds every entry. */
    static int fmaPrimesFor(double log2Bound) {
        return Math.max(1, (int) Math.ceil(log2Bound / Moduli.FMA_BITS_PER_PRIME));
    }

    /** Number of primes of {@link Moduli#primes} (each &gt; 2^61) whose product exceeds every entry. */
    static int primesFor(double log2Bound) {
        return Math.max(1, (int) Math.ceil(log2Bound / Moduli.BITS_PER_PRIME));
    }

    /**
     * f(u, v) = sum_l ln F_l(e^(u + e_l v)) - N u - E v on the quadrant u, v &lt;= 0 (where the
     * minimum of the bound lies: outside it the bound only grows), with its gradient
     * (sum_l &lt;j&gt;_l - N, sum_l e_l &lt;j&gt;_l - E) and Hessian (the covariance of (j, e_l j) under the
     * tilted weights c_j e^(j t) / F_l), both from the same exponentials as the value.
     */
    private static final class Saddle {
        final double[][] lnc;
        final int[] energy;
        final int levels;
        final int maxN;
        final int maxE;
        double value;
        double gu;
        double gv;
        double huu;
        double huv;
        double hvv;

        Saddle(double[][] lnc, int[] energy, int levels, int maxN, int maxE) {
            this.lnc = lnc;
            this.energy = energy;
            this.levels = levels;
            this.maxN = maxN;
            this.maxE = maxE;
        }

        /** Evaluates value, gradient and Hessian at (u, v). */
        void at(double u, double v) {
            double f = -maxN * u - maxE * v;
            double su = -maxN;
            double sv = -maxE;
            double suu = 0;
            double suv = 0;
            double svv = 0;
            for (int l = 0; l < levels; l++) {
                double[] c = lnc[l];
                double t = u + energy[l] * v;
                double m = Double.NEGATIVE_INFINITY;
                for (int j = 0; j < c.length; j++) {
                    m = Math.max(m, c[j] + j * t);
                }
                double z = 0;
                double z1 = 0;
                double z2 = 0;
                for (int j = 0; j < c.length; j++) {
                    double w = Math.exp(c[j] + j * t - m);
                    z += w;
                    z1 += j * w;
                    z2 += (double) j * j * w;
                }
                double mean = z1 / z;
                double var = Math.max(0, z2 / z - mean * mean);
                double el = energy[l];
                f += m + Math.log(z);
                su += mean;
                sv += el * mean;
                suu += var;
                suv += el * var;
                svv += el * el * var;
            }
            value = f;
            gu = su;
            gv = sv;
            huu = suu;
            huv = suv;
            hvv = svv;
        }
    }

    /**
     * Projected Newton iteration with backtracking on the convex saddle function, from (0, 0), keeping
     * the smallest value seen (each one is a valid bound, so the search affects tightness only).
     * Variables at 0 whose gradient points out of the quadrant are held there.
     */
    private static double newton(Saddle f) {
        double u = 0;
        double v = 0;
        f.at(u, v);
        double best = f.value;
        for (int it = 0; it < 60; it++) {
            boolean holdU = u >= 0 && f.gu < 0;
            boolean holdV = v >= 0 && f.gv < 0;
            double du;
            double dv;
            if (holdU && holdV) {
                break; // (0, 0) is the constrained minimum
            } else if (holdU) {
                du = 0;
                dv = f.hvv > 0 ? -f.gv / f.hvv : -Math.signum(f.gv);
            } else if (holdV) {
                dv = 0;
                du = f.huu > 0 ? -f.gu / f.huu : -Math.signum(f.gu);
            } else {
                double det = f.huu * f.hvv - f.huv * f.huv;
                if (det > 1e-12 * (f.huu * f.hvv) && det > 0) {
                    du = -(f.hvv * f.gu - f.huv * f.gv) / det;
                    dv = -(f.huu * f.gv - f.huv * f.gu) / det;
                } else {
                    du = f.huu > 0 ? -f.gu / (f.huu + f.hvv) : -Math.signum(f.gu);
                    dv = f.hvv > 0 ? -f.gv / (f.huu + f.hvv) : -Math.signum(f.gv);
                }
            }
            double longest = Math.max(Math.abs(du), Math.abs(dv));
            if (longest > 8) { // no step longer than 8 in ln x or ln q
                du *= 8 / longest;
                dv *= 8 / longest;
            }
            double slope = f.gu * du + f.gv * dv;
            double start = f.value;
            double step = 1;
            double nu = u;
            double nv = v;
            boolean moved = false;
            for (int half = 0; half < 40; half++) {
                nu = Math.max(-RANGE, Math.min(0, u + step * du));
                nv = Math.max(-RANGE, Math.min(0, v + step * dv));
                f.at(nu, nv);
                if (!Double.isNaN(f.value)) {
                    best = Math.min(best, f.value);
                }
                if (f.value <= start + 1e-4 * step * Math.min(slope, 0)) {
                    moved = true;
                    break;
                }
                step *= 0.5;
            }
            if (!moved) {
                break;
            }
            double gain = start - f.value;
            u = nu;
            v = nv;
            if (gain <= 1e-12 * Math.max(1, Math.abs(start))) {
                break;
            }
        }
        return best;
    }

    private interface Objective1 {
        double at(double v);
    }

    private static final double GOLD = (Math.sqrt(5) - 1) / 2;

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
