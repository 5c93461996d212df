package org.microtally.ensemble;

/**
 * Closed-form reference for the tests: the Gaussian (q-)binomial coefficient
 * [m choose n]_q = prod_{k=1..n} (1 - q^(m-n+k)) / (1 - q^k), the generating function of partitions
 * fitting in an n x (m-n) box (G. E. Andrews, <i>The Theory of Partitions</i> (1976), Theorem 3.1;
 * from memory). With q = e^(-beta) it gives the canonical partition functions of n particles on the
 * non-degenerate ladder e_k = k, k = 0..M-1:
 * fermions Z_n = q^(n(n-1)/2) [M choose n]_q, bosons Z_n = [n+M-1 choose n]_q.
 * Evaluated as a sum of logarithms of positive factors (log1p), independent of the generating-product code.
 */
final class QBinomial {
    private QBinomial() {
    }

    /** ln [m choose n]_q for q = e^(-beta), beta > 0. */
    static double ln(int m, int n, double beta) {
        double s = 0;
        for (int k = 1; k <= n; k++) {
            s += Math.log(-Math.expm1(-beta * (m - n + k))) - Math.log(-Math.expm1(-beta * k));
        }
        return s;
    }

    /** ln Z_n of n fermions on the ladder 0..M-1 at inverse temperature beta. */
    static double fermiLadder(int levels, int n, double beta) {
        return -beta * n * (n - 1) / 2.0 + ln(levels, n, beta);
    }

    /** ln Z_n of n bosons on the ladder 0..M-1 at inverse temperature beta. */
    static double boseLadder(int levels, int n, double beta) {
        return ln(n + levels - 1, n, beta);
    }

    /** U = -d ln Z / d beta by a central difference with step h (h ~ 1e-5 gives ~1e-9 relative). */
    static double energy(java.util.function.DoubleUnaryOperator lnZ, double beta) {
        double h = 1e-5 * beta;
        return -(lnZ.applyAsDouble(beta + h) - lnZ.applyAsDouble(beta - h)) / (2 * h);
    }
}
