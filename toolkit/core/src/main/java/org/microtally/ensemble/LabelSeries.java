package org.microtally.ensemble;

/**
 * A generating function in two variables, t (particle number, truncated at t^N) and z (total label,
 * every reachable power kept), stored as mantissas c[n][L - lo] with one common factor e^{logScale},
 * plus the first energy moment u[n][L - lo] (weights times E - e_0 n, with every energy measured from
 * the ground level, so all terms are non-negative). Package-private engine of
 * {@link LabelledCanonical}.
 *
 * <p>One single-particle state with scaled Boltzmann factor y and label m is multiplied in as the
 * factor 1 + y t z^m + ... + (y t z^m)^k (at most k per state) or 1/(1 - y t z^m) (bosons, y &lt; 1):
 * the positive recurrences of the elementary and complete symmetric polynomials of {@link Canonical},
 * extended by the label exponent (the product rule for ordinary generating functions). For y &gt; 1
 * the capped factor is divided by y^k first (weights y^(j-k), ln y^k added to the scale), so every
 * weight is at most 1. Mantissas are rescaled by exact powers of two when a growth bound passes
 * 2^400; entries that underflow are flushed to zero (bounded by the caller).
 */
final class LabelSeries {
    private static final double GROWTH_LIMIT = 0x1p400;

    final int n;
    final int lo;
    final int width;
    final double[][] c;
    final double[][] u;
    double logScale;
    private double growth = 1;

    /** The series 1, for particle numbers up to n and labels of single states in [minLabel, maxLabel]. */
    LabelSeries(int n, int minLabel, int maxLabel) {
        this.n = n;
        this.lo = n * Math.min(0, minLabel);
        int hi = n * Math.max(0, maxLabel);
        this.width = hi - lo + 1;
        this.c = new double[n + 1][width];
        this.u = new double[n + 1][width];
        c[0][-lo] = 1;
    }

    /**
     * ln of the flushing bound's numerator over the tolerance, ln(S (n + 1) W 2^-1073 / 1e-12): an entry
     * whose probability P satisfies ln P &gt;= this value has a flushing error below 1e-12 relative
     * (each flushed mantissa is below 2^-1073 of the series maximum, itself below the untruncated total).
     */
    double lnFlushThreshold(long states) {
        return Math.log((double) states * (n + 1.0) * width) - 1073 * Math.log(2.0) - Math.log(1e-12);
    }

    /** Entries as the number of cells, for memory checks. */
    static double cells(int n, int minLabel, int maxLabel) {
        return (n + 1.0) * ((double) n * (Math.max(0, maxLabel) - Math.min(0, minLabel)) + 1);
    }

    /** Multiplies in one state: ln y, label m, at most {@code cap} per state, energy eps above the ground level. */
    void multiplyState(double lnY, int m, int cap, double eps) {
        if (cap == Integer.MAX_VALUE) {
            boseState(Math.exp(lnY), m, eps);
            growth *= Math.min(n + 1.0, -1.0 / Math.expm1(lnY));
        } else {
            cappedState(lnY, m, cap, eps);
            growth *= cap + 1.0;
        }
        if (growth > GROWTH_LIMIT) {
            renormalize();
        }
    }

    private void boseState(double y, int m, double eps) {
        int from = Math.max(0, m);
        int to = Math.min(width, width + m);
        for (int k = 1; k <= n; k++) {
            double[] ck = c[k];
            double[] uk = u[k];
            double[] cp = c[k - 1];
            double[] up = u[k - 1];
            for (int i = from; i < to; i++) {
                double cv = cp[i - m];
                uk[i] += y * (up[i - m] + eps * cv);
                ck[i] += y * cv;
            }
        }
    }

    private void cappedState(double lnY, int m, int cap, double eps) {
        double[] w = ScaledSeries.cappedWeights(lnY, cap);
        if (lnY > 0) {
            logScale += cap * lnY;
        }
        for (int k = n; k >= 0; k--) {
            double[] ck = c[k];
            double[] uk = u[k];
            int jTop = Math.min(cap, k);
            for (int i = 0; i < width; i++) {
                double sc = w[0] * ck[i];
                double su = w[0] * uk[i];
                for (int j = 1; j <= jTop; j++) {
                    int src = i - j * m;
                    if (src < 0 || src >= width) {
                        continue;
                    }
                    double cv = c[k - j][src];
                    sc += w[j] * cv;
                    su += w[j] * (u[k - j][src] + j * eps * cv);
                }
                ck[i] = sc;
                uk[i] = su;
            }
        }
    }

    /**
     * Labelled (distinguishable) particles: row k = row k-1 times Z_1(z) = sum_l y_l z^(m_l), k = 1..n,
     * with y_l the scaled Boltzmann factor of level l times its degeneracy (all &lt;= g_l).
     */
    void labelledParticles(double[] y, int[] m, double[] eps) {
        double sum = 0;
        for (double x : y) {
            sum += x;
        }
        for (int k = 1; k <= n; k++) {
            double[] ck = c[k];
            double[] uk = u[k];
            double[] cp = c[k - 1];
            double[] up = u[k - 1];
            for (int l = 0; l < y.length; l++) {
                int from = Math.max(0, m[l]);
                int to = Math.min(width, width + m[l]);
                for (int i = from; i < to; i++) {
                    double cv = cp[i - m[l]];
                    uk[i] += y[l] * (up[i - m[l]] + eps[l] * cv);
                    ck[i] += y[l] * cv;
                }
            }
            growth *= Math.max(1.0, sum);
            if (growth > GROWTH_LIMIT) {
                renormalize();
            }
        }
    }

    /** Rescales every mantissa by one power of two so the largest c lies in [1, 2). */
    void renormalize() {
        growth = 1;
        double max = 0;
        for (double[] row : c) {
            for (double x : row) {
                max = Math.max(max, x);
            }
        }
        if (max == 0) {
            return;
        }
        if (!Double.isFinite(max)) {
            throw new IllegalStateException("labelled series overflowed; please report this input");
        }
        int e = Math.getExponent(max);
        for (int k = 0; k <= n; k++) {
            for (int i = 0; i < width; i++) {
                c[k][i] = Math.scalb(c[k][i], -e);
                u[k][i] = Math.scalb(u[k][i], -e);
            }
        }
        logScale += e * Math.log(2.0);
    }
}
