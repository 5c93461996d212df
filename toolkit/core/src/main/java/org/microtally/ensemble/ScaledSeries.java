package org.microtally.ensemble;

/**
 * A power series in t truncated at t^N, stored as mantissas c[0..N] times a common factor
 * e^{logScale}, with optional first and second energy-moment companions (u, v). Package-private
 * engine of {@link Canonical}.
 *
 * <p>The series is the generating function prod_states f(y_s t) of the canonical partition
 * functions, with fugacity-scaled Boltzmann factors y_s = e^{-beta (e_s - mu*)}: its coefficient
 * c_n is Z_n e^{beta mu* n}. One single-particle state is multiplied in by one of the steps below;
 * every step adds products of non-negative numbers only (for c; the moment companions carry signed
 * energies). Mantissas are rescaled by exact powers of two whenever a bound on their growth passes
 * 2^400, so nothing overflows; coefficients that fall below 2^-1074 of the largest one are flushed
 * to zero (the error this causes is bounded in {@link Canonical}'s documentation). The indices
 * {@code low..degree} bound the non-zero mantissas and every loop runs over that support only.
 *
 * <p>Moments: with e_s measured from a reference energy per particle r (eps_s = e_s - r), u_n and
 * v_n are the sums over n-particle configurations of weight times (E - r n) and (E - r n)^2.
 */
final class ScaledSeries {
    private static final double GROWTH_LIMIT = 0x1p400;
    private static final double BIG_LOG_FACTOR = 200.0;

    final int n;
    final double[] c;
    final double[] u;
    final double[] v;
    /** Index of the first non-zero mantissa (entries below are zero). */
    int low;
    /** Index of the last non-zero mantissa (entries above are zero). */
    int degree;
    double logScale;
    /**
     * Excitation-moment mode only: the configuration-independent constant removed from the energy so
     * that every per-state contribution is non-negative (see {@link #excitationMoments(int)}).
     */
    double momentShift;
    private final boolean excitation;
    private double growth = 1;

    /** The series 1 (no states yet). */
    ScaledSeries(int n, boolean moments) {
        this(n, moments, false);
    }

    /**
     * The series 1 with energy moments in which every term is non-negative: a state of energy
     * eps &gt;= 0 (relative to the reference) adds eps per particle, a capped state with eps &lt; 0 adds
     * |eps| per vacancy, (J - n_s)|eps| with J = min(cap, N) (the particle-hole picture), and the
     * constant J eps this drops is summed in {@link #momentShift}. Then u_m/c_m + momentShift is the
     * mean of E - r m and v_m/c_m - (u_m/c_m)^2 its variance, with no signed terms anywhere, so the
     * variance loses only the factor 1 + mean(X)^2/Var(X) (X the shifted energy) to the final
     * subtraction. Bose states must have eps &gt;= 0 (reference at or below the lowest level).
     */
    static ScaledSeries excitationMoments(int n) {
        return new ScaledSeries(n, true, true);
    }

    private ScaledSeries(int n, boolean moments, boolean excitation) {
        this.excitation = excitation;
        this.n = n;
        this.c = new double[n + 1];
        this.c[0] = 1;
        this.u = moments ? new double[n + 1] : null;
        this.v = moments ? new double[n + 1] : null;
        this.degree = 0;
        this.logScale = 0;
    }

    private ScaledSeries(ScaledSeries o) {
        this.n = o.n;
        this.c = o.c.clone();
        this.u = o.u == null ? null : o.u.clone();
        this.v = o.v == null ? null : o.v.clone();
        this.low = o.low;
        this.degree = o.degree;
        this.logScale = o.logScale;
        this.momentShift = o.momentShift;
        this.excitation = o.excitation;
        this.growth = o.growth;
    }

    ScaledSeries copy() {
        return new ScaledSeries(this);
    }

    /** ln of the true coefficient m, or -infinity if it was flushed to zero. */
    double logCoefficient(int m) {
        return m < low || m > degree || c[m] <= 0 ? Double.NEGATIVE_INFINITY : Math.log(c[m]) + logScale;
    }

    /**
     * Multiplies in {@code count} states with ln y = {@code lnY} under occupancy cap {@code cap}
     * ({@code Integer.MAX_VALUE} for bosons), energies eps relative to the moment reference.
     */
    void multiplyStates(int count, double lnY, int cap, double eps) {
        if (excitation && eps < 0 && cap == Integer.MAX_VALUE && u != null) {
            throw new IllegalStateException("excitation moments need Bose states at or above the reference");
        }
        if (count > 1 && LevelFactor.pays(count, cap, n)) {
            multiplyLevel(count, lnY, cap, eps);
            return;
        }
        int s = 0;
        if (cap == Integer.MAX_VALUE && lnY < 0) {
            double g1 = Math.min(n + 1.0, -1.0 / Math.expm1(lnY));
            double g4 = g1 * g1 * g1 * g1;
            for (; s + 4 <= count; s += 4) {
                if (growth * g4 > GROWTH_LIMIT) {
                    renormalize();
                }
                boseFourSteps(lnY, eps);
                growth *= g4;
            }
        }
        for (; s < count; s++) {
            if (cap == Integer.MAX_VALUE) {
                boseStep(lnY, eps);
            } else if (cap == 1) {
                fermiStep(lnY, eps);
            } else {
                gentileStep(lnY, cap, eps);
            }
            if (growth > GROWTH_LIMIT) {
                renormalize();
            }
        }
        renormalize();
    }

    /**
     * Multiplies by 1/(1 - y t)^4 as four successive single-state steps evaluated in one sweep over m
     * (stage s at index m needs stage s-1 at m and stage s at m-1, so the four recurrences pipeline
     * instead of waiting on one another); the arithmetic is exactly that of four {@link #boseStep}s.
     */
    private void boseFourSteps(double lnY, double eps) {
        double y = Math.exp(lnY);
        int oldTop = degree;
        int last = degree;
        if (u == null) {
            double a1 = c[low];
            double a2 = a1;
            double a3 = a1;
            double a4 = a1;
            for (int m = low + 1; m <= n; m++) {
                a1 = c[m] + y * a1;
                a2 = a1 + y * a2;
                a3 = a2 + y * a3;
                a4 = a3 + y * a4;
                c[m] = a4;
                if (m > oldTop) {
                    if (a1 == 0 && a2 == 0 && a3 == 0 && a4 == 0) {
                        break;
                    }
                    last = m;
                }
            }
        } else {
            double e2 = eps * eps;
            double c1 = c[low];
            double c2 = c1;
            double c3 = c1;
            double c4 = c1;
            double u1 = u[low];
            double u2 = u1;
            double u3 = u1;
            double u4 = u1;
            double v1 = v[low];
            double v2 = v1;
            double v3 = v1;
            double v4 = v1;
            for (int m = low + 1; m <= n; m++) {
                v1 = v[m] + y * (v1 + 2 * eps * u1 + e2 * c1);
                u1 = u[m] + y * (u1 + eps * c1);
                c1 = c[m] + y * c1;
                v2 = v1 + y * (v2 + 2 * eps * u2 + e2 * c2);
                u2 = u1 + y * (u2 + eps * c2);
                c2 = c1 + y * c2;
                v3 = v2 + y * (v3 + 2 * eps * u3 + e2 * c3);
                u3 = u2 + y * (u3 + eps * c3);
                c3 = c2 + y * c3;
                v4 = v3 + y * (v4 + 2 * eps * u4 + e2 * c4);
                u4 = u3 + y * (u4 + eps * c4);
                c4 = c3 + y * c4;
                c[m] = c4;
                u[m] = u4;
                v[m] = v4;
                if (m > oldTop) {
                    if (c1 == 0 && c2 == 0 && c3 == 0 && c4 == 0) {
                        break;
                    }
                    last = m;
                }
            }
        }
        degree = last;
    }

    /** Multiplies by 1/(1 - y t) = sum_j y^j t^j (y &lt; 1 required). */
    private void boseStep(double lnY, double eps) {
        double y = Math.exp(lnY);
        int oldTop = degree;
        int last = degree;
        if (u == null) {
            for (int m = low + 1; m <= n; m++) {
                double x = c[m] + y * c[m - 1];
                c[m] = x;
                if (m > oldTop) {
                    if (x == 0) {
                        break;
                    }
                    last = m;
                }
            }
        } else {
            double e2 = eps * eps;
            for (int m = low + 1; m <= n; m++) {
                double cp = c[m - 1];
                double up = u[m - 1];
                v[m] += y * (v[m - 1] + 2 * eps * up + e2 * cp);
                u[m] += y * (up + eps * cp);
                double x = c[m] + y * cp;
                c[m] = x;
                if (m > oldTop) {
                    if (x == 0) {
                        break;
                    }
                    last = m;
                }
            }
        }
        degree = last;
        double ratio = -Math.expm1(lnY);
        growth *= Math.min(n + 1.0, 1.0 / ratio);
    }

    /** Multiplies by (1 + y t); for y &gt; e^200 divides by y first and adds ln y to the scale. */
    private void fermiStep(double lnY, double eps) {
        int top = Math.min(n, degree + 1);
        int lo1 = Math.max(1, low);
        boolean big = lnY > BIG_LOG_FACTOR;
        double y = big ? 0 : Math.exp(lnY);
        if (u == null) {
            if (!big) {
                for (int m = top; m >= lo1; m--) {
                    c[m] += y * c[m - 1];
                }
            } else {
                double r = Math.exp(-lnY);
                for (int m = top; m >= lo1; m--) {
                    c[m] = c[m] * r + c[m - 1];
                }
                if (low == 0) {
                    c[0] *= r;
                }
            }
        } else {
            fermiMomentStep(big ? 1.0 : y, big ? Math.exp(-lnY) : 1.0, eps, top, lo1);
        }
        if (big) {
            logScale += lnY;
            growth *= 2;
        } else {
            growth *= 1.0 + Math.max(1.0, y);
        }
        degree = top;
        trim();
    }

    /**
     * One Fermi state with moments: weight {@code wp} with the state filled, {@code wa} with it empty;
     * energy eps per particle, or in excitation mode |eps| for the vacancy of a state below the
     * reference (then the constant eps goes to the shift).
     */
    private void fermiMomentStep(double wp, double wa, double eps, int top, int lo1) {
        double p = eps;
        double a = 0;
        if (excitation && eps < 0) {
            p = 0;
            a = -eps;
            momentShift += eps;
        }
        double p2 = p * p;
        double a2 = a * a;
        for (int m = top; m >= lo1; m--) {
            double cm = c[m];
            double um = u[m];
            double cp = c[m - 1];
            double up = u[m - 1];
            v[m] = wa * (v[m] + 2 * a * um + a2 * cm) + wp * (v[m - 1] + 2 * p * up + p2 * cp);
            u[m] = wa * (um + a * cm) + wp * (up + p * cp);
            c[m] = wa * cm + wp * cp;
        }
        if (low == 0) {
            v[0] = wa * (v[0] + 2 * a * u[0] + a2 * c[0]);
            u[0] = wa * (u[0] + a * c[0]);
            c[0] *= wa;
        }
    }

    /**
     * Multiplies in {@code count} states at once by their closed-form level factor ({@link LevelFactor}):
     * c'_m = sum_j b_j c_{m-j}, with the moments of j particles in the level, energy E_j = j eps (or, in
     * excitation mode below the reference, (J - j)|eps| with J = min(count cap, N)). Non-negative terms.
     */
    private void multiplyLevel(int count, double lnY, int cap, double eps) {
        LevelFactor f = LevelFactor.of(count, lnY, cap, n - low);
        double[] b = f.b;
        int width = b.length;
        double[] ej = null;
        if (u != null) {
            ej = new double[width];
            boolean holes = excitation && eps < 0;
            long full = Math.min((long) count * Math.min(cap, n), n);
            for (int j = 0; j < width; j++) {
                ej[j] = holes ? (full - j) * -eps : j * eps;
            }
            if (holes) {
                momentShift += full * eps;
            }
        }
        int top = (int) Math.min(n, (long) degree + width - 1);
        for (int m = top; m >= low; m--) {
            int jmax = Math.min(width - 1, m - low);
            int jmin = Math.max(0, m - degree);
            double sc = 0;
            double su = 0;
            double sv = 0;
            for (int j = jmin; j <= jmax; j++) {
                double w = b[j];
                if (w == 0) {
                    continue;
                }
                double cj = c[m - j];
                sc += w * cj;
                if (ej != null) {
                    double e = ej[j];
                    double uj = u[m - j];
                    su += w * (uj + e * cj);
                    sv += w * (v[m - j] + 2 * e * uj + e * e * cj);
                }
            }
            c[m] = sc;
            if (u != null) {
                u[m] = su;
                v[m] = sv;
            }
        }
        degree = top;
        logScale += f.logScale;
        trim();
        renormalize();
    }

    /** Moves low/degree inwards past mantissas that are zero (flushed or never reached). */
    private void trim() {
        while (degree > low && c[degree] == 0) {
            clearMoments(degree);
            degree--;
        }
        while (low < degree && c[low] == 0) {
            clearMoments(low);
            low++;
        }
    }

    /** Flushes the moments with their coefficient, so no stale (never rescaled) entry is read later. */
    private void clearMoments(int m) {
        if (u != null) {
            u[m] = 0;
            v[m] = 0;
        }
    }

    /**
     * The powers y^j, j = 0..k, of one state's scaled Boltzmann factor y = e^{lnY} with occupation at
     * most k, scaled so that the largest is 1: w_j = y^j when lnY &lt;= 0, else w_j = y^(j - k), the
     * factor y^k = e^{k lnY} left for the caller to add to its logScale. Built by repeated
     * multiplication from the entry 1, so no entry overflows; w_j carries about |j - j_max| roundings.
     */
    static double[] cappedWeights(double lnY, int k) {
        double[] w = new double[k + 1];
        if (lnY <= 0) {
            double y = Math.exp(lnY);
            w[0] = 1;
            for (int j = 1; j <= k; j++) {
                w[j] = w[j - 1] * y;
            }
        } else {
            double r = Math.exp(-lnY);
            w[k] = 1;
            for (int j = k - 1; j >= 0; j--) {
                w[j] = w[j + 1] * r;
            }
        }
        return w;
    }

    /** Multiplies by 1 + y t + ... + (y t)^k; weights taken as y^(j-k) when y &gt; 1. */
    private void gentileStep(double lnY, int k, double eps) {
        int top = (int) Math.min(n, (long) degree + k);
        double[] w = cappedWeights(lnY, k);
        if (lnY > 0) {
            logScale += k * lnY;
        }
        double[] je = new double[k + 1];
        if (u != null) {
            boolean holes = excitation && eps < 0;
            int full = Math.min(k, n);
            for (int j = 0; j <= k; j++) {
                je[j] = holes ? (full - j) * -eps : j * eps;
            }
            if (holes) {
                momentShift += full * eps;
            }
        }
        for (int m = top; m >= low; m--) {
            int jmax = Math.min(k, m - low);
            double sc = 0;
            double su = 0;
            double sv = 0;
            for (int j = 0; j <= jmax; j++) {
                double cj = c[m - j];
                if (cj == 0 && (u == null || u[m - j] == 0)) {
                    continue;
                }
                double wj = w[j];
                sc += wj * cj;
                if (u != null) {
                    double ej = je[j];
                    sv += wj * (v[m - j] + 2 * ej * u[m - j] + ej * ej * cj);
                    su += wj * (u[m - j] + ej * cj);
                }
            }
            c[m] = sc;
            if (u != null) {
                u[m] = su;
                v[m] = sv;
            }
        }
        degree = top;
        trim();
        growth *= k + 1.0;
    }

    /** Rescales all mantissas by an exact power of two so the largest c lies in [1, 2). */
    void renormalize() {
        double max = 0;
        for (int m = low; m <= degree; m++) {
            if (c[m] > max) {
                max = c[m];
            }
        }
        growth = 1;
        if (max == 0 || !Double.isFinite(max)) {
            if (max != 0) {
                throw new IllegalStateException("scaled series overflowed; please report this input");
            }
            return;
        }
        int e = Math.getExponent(max);
        if (e == 0) {
            return;
        }
        for (int m = low; m <= degree; m++) {
            c[m] = Math.scalb(c[m], -e);
        }
        if (u != null) {
            for (int m = low; m <= degree; m++) {
                u[m] = Math.scalb(u[m], -e);
                v[m] = Math.scalb(v[m], -e);
            }
        }
        logScale += e * Math.log(2.0);
    }

    /**
     * ln of the coefficient at {@code m} of the product of this series and {@code other}:
     * ln sum_a this[a] other[m - a] (non-negative terms).
     */
    double logProductCoefficient(ScaledSeries other, int m) {
        if (m < 0) {
            return Double.NEGATIVE_INFINITY;
        }
        int aLo = Math.max(low, m - other.degree);
        int aHi = Math.min(m - other.low, degree);
        double s = 0;
        double[] o = other.c;
        for (int a = aLo; a <= aHi; a++) {
            s += c[a] * o[m - a];
        }
        return s > 0 ? Math.log(s) + logScale + other.logScale : Double.NEGATIVE_INFINITY;
    }
}
