package org.microtally.exact;

import java.math.BigInteger;
import org.microtally.InvalidInputException;

/**
 * Natural logarithms of exact non-negative integers of any size.
 *
 * <p>Method: for x with at most 1000 bits, ln x = Math.log(x.doubleValue()), where
 * {@code doubleValue} is correctly rounded (relative error at most 2^-53). For larger x, write
 * x = m * 2^s with m = x &gt;&gt; s holding the top 64 bits, so ln x = ln(m) + s ln 2 + ln(1 + f) with
 * 0 &lt;= f &lt; 2^-63 (neglected). No double ever overflows, so numbers far beyond 10^308 work.
 * Accuracy: within 2 ulp of the exact value of ln x.
 */
public final class ExactLog {
    private ExactLog() { }

    private static final double LN2 = Math.log(2.0);

    /**
     * ln x for x &gt;= 1.
     *
     * @throws InvalidInputException for x &lt;= 0 (ln 0 would be -infinity; the caller should test for zero)
     */
    public static double ln(BigInteger x) {
        if (x.signum() <= 0) {
            throw InvalidInputException.of("argument of ln", x, "an integer >= 1",
                    "Test for zero first: ln 0 is -infinity and is never returned silently.");
        }
        int bits = x.bitLength();
        if (bits <= 1000) {
            return Math.log(x.doubleValue());
        }
        int shift = bits - 64;
        return Math.log(x.shiftRight(shift).doubleValue()) + shift * LN2;
    }

    /** log2 x for x &gt;= 1, same method and accuracy as {@link #ln}. */
    public static double log2(BigInteger x) {
        return ln(x) / LN2;
    }
}
