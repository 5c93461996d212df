package org.microtally.special;

/**
 * Tanh-sinh (double exponential) quadrature on a finite interval, package-private.
 *
 * <p>Method: H. Takahasi and M. Mori, "Double exponential formulas for numerical integration",
 * Publ. RIMS Kyoto Univ. 9 (1974) 721-741: x = tanh((pi/2) sinh t), trapezoidal rule in t with step
 * {@value #STEP_INVERSE}^-1, nodes kept while their distance to the end point is at least 1e-300
 * of the interval; the sum stops early once three successive node pairs add less than 1e-18 of it. Algebraic or logarithmic end-point singularities cost nothing extra. The
 * integrand receives the distances of the node from both ends, computed without cancellation, so
 * that a factor like t^j (j &gt; -1) near t = 0 or 1/(1 + e^(t - b)) near t = b is evaluated to full
 * relative accuracy.
 */
final class TanhSinh {
    private TanhSinh() { }

    /** The integrand, as a function of the distances (&gt;= 0) from the left and right ends. */
    interface Integrand {
        double value(double fromLeft, double fromRight);
    }

    static final int STEP_INVERSE = 20;
    private static final double[] DISTANCE; // distance from the nearer end on [-1, 1], t >= 0
    private static final double[] WEIGHT;   // weight on [-1, 1] (times the step)

    static {
        double h = 1.0 / STEP_INVERSE;
        int kMax = (int) Math.ceil(6.1 * STEP_INVERSE);
        double[] d = new double[kMax + 1];
        double[] w = new double[kMax + 1];
        int count = 0;
        for (int k = 0; k <= kMax; k++) {
            double t = k * h;
            double u = 0.5 * Math.PI * Math.sinh(t);
            double q = Math.exp(-2.0 * u);
            double dist = 2.0 * q / (1.0 + q); // 1 - tanh(u)
            if (dist < 1e-300) {
                break;
            }
            d[count] = dist;
            w[count] = h * 0.5 * Math.PI * Math.cosh(t) * 4.0 * q / ((1.0 + q) * (1.0 + q));
            count++;
        }
        DISTANCE = java.util.Arrays.copyOf(d, count);
        WEIGHT = java.util.Arrays.copyOf(w, count);
    }

    /** Integral of f over [0, length] (length &gt; 0). */
    static double integrate(Integrand f, double length) {
        double half = 0.5 * length;
        // centre node (t = 0): distance 1 on [-1, 1] from both ends
        double sum = WEIGHT[0] * f.value(half, half);
        int negligible = 0;
        for (int k = 1; k < DISTANCE.length; k++) {
            double near = half * DISTANCE[k];
            double far = length - near;
            double contribution = WEIGHT[k] * (f.value(near, far) + f.value(far, near));
            sum += contribution;
            // weights fall doubly exponentially; stop once three successive pairs are negligible
            if (Math.abs(contribution) <= 1e-18 * Math.abs(sum)) {
                if (++negligible >= 3) {
                    break;
                }
            } else {
                negligible = 0;
            }
        }
        return half * sum;
    }

    /** Number of integrand evaluations per call (for documentation and benchmarks). */
    static int evaluations() {
        return 2 * DISTANCE.length - 1;
    }
}
