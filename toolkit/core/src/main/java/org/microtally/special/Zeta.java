package org.microtally.special;

import java.math.BigDecimal;
import java.math.BigInteger;
import java.math.MathContext;
import org.apache.commons.math3.special.Gamma;
import org.microtally.InvalidInputException;
import org.microtally.exact.Combinatorics;

/**
 * The Riemann zeta function zeta(s) = sum_{k>=1} k^-s for real s &gt; 1 (DLMF 25.2.1).
 *
 * <p><b>Method.</b> zeta(s) = eta(s) / (1 - 2^(1-s)), with the Dirichlet eta function
 * eta(s) = sum_{k>=1} (-1)^(k-1) k^-s summed by P. Borwein's Chebyshev-weighted acceleration
 * ("An efficient algorithm for the Riemann zeta function", Constructive, Experimental and Nonlinear
 * Analysis, CMS Conf. Proc. 27 (2000) 29-34, Algorithm 2) with n = {@value #TERMS} terms, whose
 * truncation error is below 3 / (3 + sqrt 8)^n &lt; 1.5e-18 for real s &gt;= 1/2. The weights
 * (d_n - d_k)/d_n are computed once in 50-digit decimal arithmetic; the powers k^-s come from one
 * exponential per prime k (double-double exponent) and products for composite k. The factor 1 - 2^(1-s) is
 * evaluated as -expm1((1-s) ln 2), so the pole at s = 1 costs no relative accuracy.
 *
 * <p><b>Accuracy.</b> At most {@value #MAX_RELATIVE_ERROR} relative error, the largest measured over
 * 215 arguments 1.0001 &lt;= s &lt;= 100 against 30-digit mpmath tables ({@code special/} in the test
 * resources), near s = 1 where eta(s) is divided by the small 1 - 2^(1-s); truncation contributes
 * below 1.5e-18, the rest is rounding.
 *
 * <p>Inside this package the same code gives zeta on the whole real line (Riemann's functional
 * equation, DLMF 25.4.1, for s &lt; 1/2) and eta everywhere; the public entry point only accepts
 * s &gt; 1, where the defining series converges.
 */
public final class Zeta {
    /**
     * Largest relative error measured against the committed 30-digit mpmath tables (test resources
     * {@code special/}), rounded up; the test StatedAccuracyTest fails if any table row is worse.
     */
    public static final double MAX_RELATIVE_ERROR = 5e-16;

    private Zeta() { }

    /** Number of terms n of Borwein's algorithm. */
    static final int TERMS = 24;

    /** Per-thread scratch for the powers k^-x. */
    private static final ThreadLocal<double[]> POWERS = ThreadLocal.withInitial(() -> new double[TERMS + 1]);

    /** Borwein weights w_k = (d_n - d_k) / d_n, k = 0 .. n-1. */
    private static final double[] WEIGHTS = borweinWeights(TERMS);

    private static final double LN2 = Math.log(2.0);

    /** From this argument on, zeta is summed directly (16 terms bound the tail by 17^-16 &lt; 1e-19). */
    private static final double DIRECT_FROM = 16.0;

    /**
     * The Riemann zeta function for real s &gt; 1.
     *
     * @param s real argument, finite and &gt; 1
     * @return zeta(s), within {@value #MAX_RELATIVE_ERROR} relative (see the class documentation)
     * @throws InvalidInputException for s &lt;= 1 (s = 1 is the pole), NaN or infinite s
     */
    public static double zeta(double s) {
        if (Double.isNaN(s) || Double.isInfinite(s)) {
            throw InvalidInputException.of("zeta argument s", s, "a finite real number > 1", "");
        }
        if (s == 1.0) {
            throw InvalidInputException.of("zeta argument s", s, "a real number > 1",
                    "s = 1 is the pole of zeta (zeta(s) ~ 1/(s-1)); there is no finite value there.");
        }
        if (s < 1.0) {
            throw InvalidInputException.of("zeta argument s", s, "a real number > 1",
                    "For s < 1 the series sum k^-s diverges; this routine does not offer the analytic continuation.");
        }
        return zetaAnyReal(s);
    }

    /**
     * zeta(s_i) for every s_i of a grid (for charts): the same values as {@link #zeta(double)}
     * element by element, in a new array.
     *
     * @throws InvalidInputException as {@link #zeta(double)}, for the first bad s_i
     */
    public static double[] zeta(double[] s) {
        double[] out = new double[s.length];
        for (int i = 0; i < s.length; i++) {
            out[i] = zeta(s[i]);
        }
        return out;
    }

    /** zeta(x) for every real x != 1 (package-private: analytic continuation used by Polylog). */
    static double zetaAnyReal(double x) {
        if (x >= DIRECT_FROM) {
            // direct sum: n^-x < 1e-17 for n > 10^(17/x) <= 12; the tail is below 1e-17 relative
            double[] pw = POWERS.get();
            SpecialMath.inversePowers(x, pw, 16);
            double sum = 0.0;
            for (int n = 16; n >= 1; n--) {
                sum += pw[n];
            }
            return sum;
        }
        if (x >= 0.5) {
            // 1 - 2^(1-x) = -expm1((1-x) ln 2), accurate near the pole x = 1.
            return eta(x) / -Math.expm1((1.0 - x) * LN2);
        }
        if (x == 0.0) {
            return -0.5; // DLMF 25.6.1
        }
        // Functional equation, DLMF 25.4.1: zeta(x) = 2^x pi^(x-1) sin(pi x / 2) Gamma(1-x) zeta(1-x).
        double sin = SpecialMath.sinPi(0.5 * x);
        if (sin == 0.0) {
            return 0.0; // trivial zeros at the negative even integers
        }
        double oneMinusX = 1.0 - x;
        double zetaReflected = zetaAnyReal(oneMinusX);
        if (oneMinusX <= 170.0) {
            return Math.pow(2.0, x) * Math.pow(Math.PI, x - 1.0) * sin * SpecialMath.gamma(oneMinusX) * zetaReflected;
        }
        double logMagnitude = x * LN2 + (x - 1.0) * Math.log(Math.PI) + Gamma.logGamma(oneMinusX);
        return Math.signum(sin) * Math.exp(logMagnitude) * zetaReflected;
    }

    /**
     * Dirichlet eta(x) = (1 - 2^(1-x)) zeta(x) for every real x (an entire function; eta(1) = ln 2).
     * Borwein's algorithm for x &gt;= 1/2, the functional equation of zeta below.
     */
    static double eta(double x) {
        if (x >= DIRECT_FROM) {
            return -Math.expm1((1.0 - x) * LN2) * zetaAnyReal(x);
        }
        if (x >= 0.5) {
            double[] pw = POWERS.get();
            SpecialMath.inversePowers(x, pw, TERMS);
            double sum = 0.0;
            // Sum from the smallest terms up, alternating signs.
            for (int k = TERMS - 1; k >= 0; k--) {
                double term = WEIGHTS[k] * pw[k + 1];
                sum += (k % 2 == 0) ? term : -term;
            }
            return sum;
        }
        return -Math.expm1((1.0 - x) * LN2) * zetaAnyReal(x);
    }

    /** w_k = (d_n - d_k)/d_n with d_k = n sum_{i=0}^{k} (n+i-1)! 4^i / ((n-i)! (2i)!) (Borwein 2000). */
    private static double[] borweinWeights(int n) {
        MathContext mc = new MathContext(50);
        BigDecimal[] t = new BigDecimal[n + 1];
        for (int i = 0; i <= n; i++) {
            BigInteger num = BigInteger.valueOf(n).multiply(Combinatorics.factorial(n + i - 1)).multiply(BigInteger.valueOf(4).pow(i));
            BigInteger den = Combinatorics.factorial(n - i).multiply(Combinatorics.factorial(2 * i));
            t[i] = new BigDecimal(num).divide(new BigDecimal(den), mc);
        }
        BigDecimal dn = BigDecimal.ZERO;
        for (BigDecimal ti : t) {
            dn = dn.add(ti, mc);
        }
        double[] w = new double[n];
        BigDecimal tail = BigDecimal.ZERO; // d_n - d_k = sum_{i>k} t_i
        for (int k = n - 1; k >= 0; k--) {
            tail = tail.add(t[k + 1], mc);
            w[k] = tail.divide(dn, mc).doubleValue();
        }
        return w;
    }

}
