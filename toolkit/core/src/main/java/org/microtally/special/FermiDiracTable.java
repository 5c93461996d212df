package org.microtally.special;

import java.util.concurrent.ConcurrentHashMap;
import java.util.concurrent.atomic.AtomicReferenceArray;

/**
 * Piecewise Chebyshev interpolants of F_j(eta) on unit intervals [1 + i, 2 + i) of the quadrature
 * range of {@link FermiDirac}, built lazily per order j and per interval from the quadrature itself,
 * so a loop over eta at one order pays one short polynomial per call (package-private).
 *
 * <p><b>Method.</b> F_j(eta) = -Li_{j+1}(-e^eta) is analytic in the strip |Im eta| &lt; pi (its only
 * singularities are at eta = i pi (2m + 1)), so on an interval of half-width 1/2 the Chebyshev
 * interpolant of degree n through the second-kind nodes (end points included, so integer eta
 * returns a quadrature value itself) converges like rho^-n with the Bernstein
 * ellipse parameter rho = 2 pi + sqrt(4 pi^2 + 1) &gt; 12.6 (L. N. Trefethen, Approximation Theory and
 * Approximation Practice, SIAM 2013, Thm. 8.2); n = {@value #DEGREE} gives 12.6^-16 &lt; 3e-18
 * relative to the function's size near the interval (which varies by at most a factor e across it),
 * far below the quadrature's own error. Values by the barycentric formula for Chebyshev points of
 * the second kind (same book, Ch. 5; J.-P. Berrut, L. N. Trefethen, SIAM Review 46 (2004) 501-517),
 * stable with node errors amplified by at most the Lebesgue constant (below 3 here). The interpolant of an interval depends only on (j, i),
 * so every call returns the same bits whatever was computed before.
 */
final class FermiDiracTable {
    /**
     * Highest order tabulated, the top of the range whose accuracy is stated and measured; above it
     * the interpolated node errors measured larger than the direct quadrature's (1.9e-15 at j = 29),
     * so larger orders stay on the quadrature.
     */
    static final double MAX_ORDER = 20.0;

    /** Polynomial degree per unit interval. */
    static final int DEGREE = 16;
    private static final int NODES = DEGREE + 1;
    /** Left end of the first interval (where the quadrature regime starts). */
    static final double FROM = 1.0;
    private static final int MAX_ORDERS = 64;
    private static final ConcurrentHashMap<Double, FermiDiracTable> ORDERS = new ConcurrentHashMap<>();

    private final double j;
    private final AtomicReferenceArray<double[]> pieces;

    private FermiDiracTable(double j, int count) {
        this.j = j;
        this.pieces = new AtomicReferenceArray<>(count);
    }

    /** The table of order j covering [FROM, threshold). */
    static FermiDiracTable of(double j, double threshold) {
        FermiDiracTable t = ORDERS.get(j);
        if (t == null) {
            if (ORDERS.size() >= MAX_ORDERS) {
                ORDERS.clear(); // bound the memory; tables are rebuilt on demand, with the same values
            }
            t = ORDERS.computeIfAbsent(j, o -> new FermiDiracTable(o, (int) Math.ceil(threshold - FROM)));
        }
        return t;
    }

    /** Chebyshev points of the second kind on [-1, 1] (end points included) and their barycentric weights. */
    private static final double[] NODE = new double[NODES];
    private static final double[] WEIGHT = new double[NODES];

    static {
        for (int k = 0; k < NODES; k++) {
            NODE[k] = k == 0 ? 1.0 : k == DEGREE ? -1.0 : Math.cos(Math.PI * k / DEGREE);
            WEIGHT[k] = ((k % 2 == 0) ? 1.0 : -1.0) * ((k == 0 || k == DEGREE) ? 0.5 : 1.0);
        }
    }

    /** Drops every table (they are rebuilt on demand with the same values); for tests. */
    static void forgetAll() {
        ORDERS.clear();
    }

    /** F_j(eta) for FROM &lt;= eta &lt; threshold. */
    double value(double eta) {
        int i = (int) (eta - FROM);
        double[] f = pieces.get(i);
        if (f == null) {
            f = build(i);
            pieces.compareAndSet(i, null, f);
        }
        double x = 2.0 * (eta - (FROM + i)) - 1.0; // in [-1, 1), exact
        double num = 0.0;
        double den = 0.0;
        for (int k = 0; k < NODES; k++) {
            double d = x - NODE[k];
            if (d == 0.0) {
                return f[k];
            }
            double w = WEIGHT[k] / d;
            num += w * f[k];
            den += w;
        }
        return num / den;
    }

    /** F_j at the nodes of interval i. */
    private double[] build(int i) {
        double[] f = new double[NODES];
        for (int k = 0; k < NODES; k++) {
            f[k] = FermiDirac.quadrature(j, FROM + i + 0.5 * (NODE[k] + 1.0));
        }
        return f;
    }
}
