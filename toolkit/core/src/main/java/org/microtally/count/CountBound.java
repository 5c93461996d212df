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
 * Optimization, 2nd ed., Springer 2006, Ch. 3 and 16.7), in 9-11 evaluations for the 3D oscillator at
 * N = 20-200, E = 100-1100 (8 at N = 1000, E = 50; 14 at N = 5, E = 2000; 14-28 before the step cap and
 * the known points of {@code newton}; each costs about two products per term, see {@code Saddle}); every
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
            double[][] rho = new double[levels][];
            for (int l = 0; l < levels; l++) {
                int maxJ = CountEngine.maxJ(energy[l], maxN, maxE);
                if (stats.kind() == Statistics.Kind.BOSE || stats.kind() == Statistics.Kind.FERMI) {
                    rho[l] = ratios(stats, deg[l], maxJ);
                    lnc[l] = logsFromRatios(rho[l]);
                } else {
                    lnc[l] = exactLnCoefficients(stats, deg[l], maxJ);
                    rho[l] = ratiosFromLogs(lnc[l]);
                }
            }
            best = newton(new Saddle(lnc, rho, energy, levels, maxN, maxE));
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
     * rho_j = c_j / c_(j-1) of {@link LevelSeries#coefficients} for 1 &lt;= j &lt;= top (rho_0 unused), top = maxJ
     * for Bose and min(maxJ, g) for Fermi (the series ends there): (g + j - 1)/j, resp. (g - j + 1)/j,
     * within half an ulp.
     */
    private static double[] ratios(Statistics stats, int g, int maxJ) {
        boolean bose = stats.kind() == Statistics.Kind.BOSE;
        int top = bose ? maxJ : Math.min(maxJ, g);
        double[] r = new double[top + 1];
        for (int j = 1; j <= top; j++) {
            r[j] = (bose ? (double) g + j - 1 : (double) g - j + 1) / j;
        }
        return r;
    }

    /**
     * ln c_j = ln c_(j-1) + ln rho_j from ln c_0 = 0, the ratio recurrence in double logs: each step
     * adds a few ulp of the running sum, so ln c_j errs by under 1e-6 for j &lt;= 10^5, and ln G (a sum
     * over levels of log-sum-exps, each off by at most its largest input error) by far less than the
     * 2-bit margin added to the bound.
     */
    private static double[] logsFromRatios(double[] rho) {
        double[] out = new double[rho.length];
        for (int j = 1; j < rho.length; j++) {
            out[j] = out[j - 1] + Math.log(rho[j]);
        }
        return out;
    }

    /** ln c_j of {@link LevelSeries#coefficients} from the exact series (statistics other than Bose and Fermi). */
    private static double[] exactLnCoefficients(Statistics stats, int g, int maxJ) {
        BigInteger[] c = LevelSeries.coefficients(stats, g, maxJ);
        double[] out = new double[c.length];
        for (int j = 0; j < c.length; j++) {
            out[j] = ExactLog.ln(c[j]);
        }
        return out;
    }

    /** rho_j = e^(ln c_j - ln c_(j-1)) for 1 &lt;= j &lt; lnc.length (rho_0 unused). */
    private static double[] ratiosFromLogs(double[] lnc) {
        double[] r = new double[lnc.length];
        for (int j = 1; j < r.length; j++) {
            r[j] = Math.exp(lnc[j] - lnc[j - 1]);
        }
        return r;
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
     * tilted weights c_j e^(j t) / F_l), both from the same weights as the value.
     *
     * <p>Each level's sum F_l(e^t) = e^m sum_j w_j, with m = ln c_j* + j* t at the largest term j*, is
     * evaluated from w_j* = 1 outwards by the ratios w_(j+1) = w_j rho_(j+1) e^t, rho_j = c_j / c_(j-1)
     * (computed once per bound), instead of one exponential per term. j* is found by climbing the
     * ratios from the level's peak at the last evaluation, and by a pass over every j where the ratios
     * show the weights could rise again past the climbed peak. e^t of a level whose energy is one
     * above the previous level's is that level's e^t times e^v, with a fresh exponential every
     * {@link #RESEED} levels or near underflow. Error: e^t carries at most RESEED + 1 ulp and each step
     * from j* adds that plus 3 ulp to a weight, so ln F_l errs by under 70 J ulp (below 1e-9 for
     * J &lt;= 10^5; summed over the levels, 70 ulp per term, under 1e-6 for 10^8 terms), and the level
     * sums (each in [1, J + 2)) are multiplied together, their product's logarithm taken once it passes
     * 2^500 (one ulp per level): far below the 2-bit margin. A side of a level's sum is cut off once
     * its weight w drops below {@link #NEGLIGIBLE} (the sum is at least 1) and no ratio further out
     * lets the weights grow again (rho_i e^t &lt;= 1 upwards, &gt;= 1 downwards): every weight left is then
     * at most w, and (terms left) x w is added to the sum, so the value stays an upper bound. A weight
     * near underflow on a side that may still grow is recomputed by its own exponential.
     */
    private static final class Saddle {
        /** Weights below this (relative to the largest, 1) end a side of a level's sum; see the class text. */
        private static final double NEGLIGIBLE = 0x1p-60;
        /** Below this a weight is recomputed directly rather than carried by the ratios into underflow. */
        private static final double NEAR_UNDERFLOW = 0x1p-900;
        /** Levels of consecutive energies share e^v products for e^t, this many at most before a new exponential. */
        private static final int RESEED = 64;

        final double[][] lnc;
        final double[][] rho;       // rho[l][j] = c_j / c_(j-1), j >= 1
        final double[][] inverse;   // 1 / rho[l][j]
        final double[][] maxAbove;  // maxAbove[l][j] = max of rho[l][j..J] (0 past J)
        final double[][] minBelow;  // minBelow[l][j] = min of rho[l][1..j]
        final int[] peakAt;         // each level's peak j* at the last evaluation
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

        Saddle(double[][] lnc, double[][] rho, int[] energy, int levels, int maxN, int maxE) {
            this.lnc = lnc;
            this.rho = rho;
            this.energy = energy;
            this.levels = levels;
            this.maxN = maxN;
            this.maxE = maxE;
            peakAt = new int[levels];
            inverse = new double[levels][];
            maxAbove = new double[levels][];
            minBelow = new double[levels][];
            for (int l = 0; l < levels; l++) {
                double[] c = lnc[l];
                int top = c.length - 1;
                double[] r = rho[l];
                double[] inv = new double[top + 1];
                double[] above = new double[top + 2];
                double[] below = new double[top + 1];
                below[0] = Double.POSITIVE_INFINITY;
                for (int j = 1; j <= top; j++) {
                    inv[j] = 1 / r[j];
                    below[j] = Math.min(below[j - 1], r[j]);
                }
                for (int j = top; j >= 1; j--) {
                    above[j] = Math.max(r[j], above[j + 1]);
                }
                inverse[l] = inv;
                maxAbove[l] = above;
                minBelow[l] = below;
            }
        }

        /** The j maximising ln c_j + j t (the first of equal ones). */
        private static int globalPeak(double[] c, double t) {
            int peak = 0;
            double m = c[0];
            for (int j = 1; j < c.length; j++) {
                double y = c[j] + j * t;
                if (y > m) {
                    m = y;
                    peak = j;
                }
            }
            return peak;
        }

        /** Evaluates value, gradient and Hessian at (u, v). */
        void at(double u, double v) {
            double f = -maxN * u - maxE * v;
            double su = -maxN;
            double sv = -maxE;
            double suu = 0;
            double suv = 0;
            double svv = 0;
            double sums = 1; // product of the level sums not yet taken into f by their logarithm
            double stepUp = Math.exp(v);
            double stepDown = 1 / stepUp;
            double x = 0;
            double xInv = 0;
            for (int l = 0; l < levels; l++) {
                double[] c = lnc[l];
                int top = c.length - 1;
                double t = u + energy[l] * v;
                if (l % RESEED != 0 && energy[l] == energy[l - 1] + 1 && x > NEAR_UNDERFLOW) {
                    x *= stepUp; // e^t of the next energy by one product, e^t itself every RESEED levels
                    xInv *= stepDown;
                } else {
                    x = Math.exp(t);
                    xInv = 1 / x;
                }
                double[] r = rho[l];
                int peak = peakAt[l]; // climb from the last evaluation's peak to a local maximum of c_j x^j
                while (peak < top && r[peak + 1] * x > 1) {
                    peak++;
                }
                while (peak > 0 && r[peak] * x < 1) {
                    peak--;
                }
                if (!(maxAbove[l][peak + 1] * x <= 1 && minBelow[l][peak] * x >= 1)) {
                    peak = globalPeak(c, t); // the weights may rise again past a local maximum
                }
                peakAt[l] = peak;
                double m = c[peak] + peak * t;
                double z = 1;
                double z1 = peak;
                double z2 = (double) peak * peak;
                double left = 0; // upper bound on the weights cut off
                double w = 1;
                for (int j = peak + 1; j <= top; j++) {
                    w *= r[j] * x;
                    if (w < NEGLIGIBLE) {
                        if (maxAbove[l][j + 1] * x <= 1) {
                            left += (top - j + 1) * Math.max(w, Double.MIN_NORMAL);
                            break;
                        }
                        if (w < NEAR_UNDERFLOW) {
                            w = Math.exp(c[j] + j * t - m);
                        }
                    }
                    z += w;
                    z1 += j * w;
                    z2 += (double) j * j * w;
                }
                double[] inv = inverse[l];
                w = 1;
                for (int j = peak - 1; j >= 0; j--) {
                    w *= inv[j + 1] * xInv;
                    if (w < NEGLIGIBLE) {
                        if (minBelow[l][j] * x >= 1) {
                            left += (j + 1) * Math.max(w, Double.MIN_NORMAL);
                            break;
                        }
                        if (w < NEAR_UNDERFLOW) {
                            w = Math.exp(c[j] + j * t - m);
                        }
                    }
                    z += w;
                    z1 += j * w;
                    z2 += (double) j * j * w;
                }
                double mean = z1 / z;
                double var = Math.max(0, z2 / z - mean * mean);
                double el = energy[l];
                f += m;
                sums *= z + left; // each factor in [1, J + 2): one logarithm for many levels
                if (sums > 0x1p500) {
                    f += Math.log(sums);
                    sums = 1;
                }
                su += mean;
                sv += el * mean;
                suu += var;
                suv += el * var;
                svv += el * el * var;
            }
            value = f + Math.log(sums);
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
     * Variables at 0 whose gradient points out of the quadrant are held there. A trial point the
     * projection puts where the function was already evaluated (typically back at (0, 0) while the
     * first steps halve towards the quadrant's edge: 9 of 23 evaluations at N = 40, E = 200 with the
     * step capped at 8 from the start) is judged
     * by the value it had, and evaluated again only if it would be accepted (its gradient is needed then).
     * Steps are capped at length 1 at first and the cap doubles with every accepted step, up to
     * {@link #MAX_STEP}: a first step capped at 8 lands far out where the function is nearly linear, and the
     * next ones only halve back. A step that no longer moves the point ends the search.
     */
    private static double newton(Saddle f) {
        double u = 0;
        double v = 0;
        f.at(u, v);
        double best = f.value;
        Seen seen = new Seen();
        seen.add(u, v, f.value);
        double cap = 1; // the longest step: 1 at first, doubled after every accepted step up to MAX_STEP
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
            if (longest > cap) { // no step longer than the cap in ln x or ln q
                du *= cap / longest;
                dv *= cap / longest;
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
                if (nu == u && nv == v) {
                    break; // the step no longer moves the point: converged (not moved, the loop ends)
                }
                double accept = start + 1e-4 * step * Math.min(slope, 0);
                int known = seen.indexOf(nu, nv);
                if (known >= 0 && !(seen.value[known] <= accept)) {
                    step *= 0.5; // already evaluated here (and in best): it fails again
                    continue;
                }
                f.at(nu, nv);
                seen.add(nu, nv, f.value);
                if (!Double.isNaN(f.value)) {
                    best = Math.min(best, f.value);
                }
                if (f.value <= accept) {
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
            cap = Math.min(MAX_STEP, 2 * cap);
            if (gain <= 1e-12 * Math.max(1, Math.abs(start))) {
                break;
            }
        }
        return best;
    }

    /** The longest Newton step in ln x or ln q. */
    private static final double MAX_STEP = 8;

    /** The points {@link #newton} evaluated, with their values (NaN kept as NaN). */
    private static final class Seen {
        double[] u = new double[32];
        double[] v = new double[32];
        double[] value = new double[32];
        int size;

        void add(double pu, double pv, double pvalue) {
            if (size == u.length) {
                u = java.util.Arrays.copyOf(u, 2 * size);
                v = java.util.Arrays.copyOf(v, 2 * size);
                value = java.util.Arrays.copyOf(value, 2 * size);
            }
            u[size] = pu;
            v[size] = pv;
            value[size++] = pvalue;
        }

        /** The index of the point (pu, pv), exactly equal, or -1. */
        int indexOf(double pu, double pv) {
            for (int i = 0; i < size; i++) {
                if (u[i] == pu && v[i] == pv) {
                    return i;
                }
            }
            return -1;
        }
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
