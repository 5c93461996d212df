package org.microtally.exact;

import java.math.BigInteger;
import org.microtally.InvalidInputException;

/**
 * Exact binomial coefficients and factorials as BigInteger, the one shared copy for the toolkit.
 *
 * <p><b>Formulas.</b> n! = 1 * 2 * ... * n (0! = 1), and C(n, k) = n! / (k! (n - k)!) for 0 &lt;= k &lt;= n,
 * C(n, k) = 0 for k &gt; n.
 *
 * <p><b>Method.</b> {@link #factorial} multiplies 2..n in order. {@link #binomial} uses the
 * multiplicative formula C(n, k) = prod_{i=1}^{k} (n - k + i) / i, dividing after each
 * multiplication: after step i the running value is C(n - k + i, i), an integer, so every division
 * is exact (definition: NIST DLMF 26.3.1; the product form as a falling factorial over k! is in
 * R. L. Graham, D. E. Knuth, O. Patashnik, Concrete Mathematics, 2nd ed. (1994), section 5.1; both
 * from memory). It takes k steps of growing BigInteger size, so it is meant for moderate k, not
 * for C(n, n/2) with n in the millions.
 *
 * <p><b>Accuracy.</b> Exact: only BigInteger arithmetic, no double anywhere.
 */
public final class Combinatorics {
    private Combinatorics() { }

    /**
     * n! exactly, for n &gt;= 0.
     *
     * @throws InvalidInputException if n &lt; 0
     */
    public static BigInteger factorial(int n) {
        if (n < 0) {
            throw InvalidInputException.of("n in n!", n, "an integer >= 0",
                    "The factorial is defined here for non-negative integers only; use Gamma.logGamma for ln Gamma(x).");
        }
        BigInteger f = BigInteger.ONE;
        for (int i = 2; i <= n; i++) {
            f = f.multiply(BigInteger.valueOf(i));
        }
        return f;
    }

    /**
     * The binomial coefficient C(n, k) exactly, for n &gt;= 0 and k &gt;= 0; 0 when k &gt; n.
     * The arguments are long so that callers can pass sums such as g + N - 1 of two ints without overflow.
     *
     * @throws InvalidInputException if n &lt; 0 or k &lt; 0
     */
    public static BigInteger binomial(long n, long k) {
        if (n < 0) {
            throw InvalidInputException.of("n in C(n, k)", n, "an integer >= 0",
                    "Upper arguments below zero are not supported; pass the number of objects to choose from.");
        }
        if (k < 0) {
            throw InvalidInputException.of("k in C(n, k)", k, "an integer >= 0",
                    "Pass the number of objects chosen.");
        }
        if (k > n) {
            return BigInteger.ZERO;
        }
        BigInteger r = BigInteger.ONE;
        for (long i = 1; i <= k; i++) {
            r = r.multiply(BigInteger.valueOf(n - k + i)).divide(BigInteger.valueOf(i));
        }
        return r;
    }
}
