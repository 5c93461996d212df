package org.microtally.exact;

import java.math.BigInteger;
import org.apache.commons.math3.fraction.BigFraction;
import org.microtally.InvalidInputException;

/**
 * The double nearest to an exact ratio p / q of integers of any size.
 *
 * <p>Why: {@code BigFraction.doubleValue()} in Commons Math 3.6.1 converts numerator and
 * denominator to double separately, so a part of 2^1024 or more becomes infinite; only the case of
 * both parts that large (a NaN quotient) is rescued by a shift, otherwise the quotient comes out 0 or
 * infinite (2^28 / 2^1028 gives 0.0 instead of 2^-1000).
 *
 * <p>Method: with e = bitLength(|p|) - bitLength(|q|), form the integer quotient
 * Q = floor(|p| 2^s / |q|), s = 55 - e, so Q has 55 or 56 bits, and remember whether the division
 * left a remainder. The result has t = min(53, E + 1075) significant bits, E = bitLength(Q) - 1 - s
 * being its binary exponent (t &lt; 53 for subnormal results). Q is cut to its top t bits and rounded
 * to nearest, ties to even, using the first dropped bit and a sticky bit (any lower dropped bit or a
 * non-zero remainder): the default rounding of IEEE 754 binary64 (roundTiesToEven). The rounded
 * integer times 2^(dropped - s) is then formed with {@link Math#scalb}, which is exact there because
 * the integer already fits the result's precision. Accuracy: correctly rounded (error at most half
 * an ulp), for normal and subnormal results alike; exact zero gives 0.0. Cost: one BigInteger
 * division of numbers of the size of p and q.
 */
public final class ExactRatio {
    private ExactRatio() { }

    /**
     * The double nearest to num / den.
     *
     * @throws InvalidInputException when den = 0, or when |num / den| is at least 2^1024 (no finite
     *                               double is near it)
     */
    public static double toDouble(BigInteger num, BigInteger den) {
        if (den.signum() == 0) {
            throw InvalidInputException.of("denominator of an exact ratio", den, "non-zero", "");
        }
        if (num.signum() == 0) {
            return 0.0;
        }
        boolean negative = num.signum() != den.signum();
        BigInteger p = num.abs();
        BigInteger q = den.abs();
        int s = 55 - (p.bitLength() - q.bitLength());
        if (s >= 0) {
            p = p.shiftLeft(s);
        } else {
            q = q.shiftLeft(-s);
        }
        BigInteger[] qr = p.divideAndRemainder(q);
        BigInteger quotient = qr[0];
        int length = quotient.bitLength();
        int exponent = length - 1 - s;
        int precision = Math.min(53, exponent + 1075);
        int dropped = length - precision;
        BigInteger kept = quotient.shiftRight(dropped);
        boolean roundBit = quotient.testBit(dropped - 1);
        boolean sticky = qr[1].signum() != 0 || quotient.getLowestSetBit() < dropped - 1;
        if (roundBit && (sticky || kept.testBit(0))) {
            kept = kept.add(BigInteger.ONE);
        }
        double magnitude = Math.scalb((double) kept.longValueExact(), dropped - s);
        if (Double.isInfinite(magnitude)) {
            throw InvalidInputException.of("ratio of a " + num.bitLength() + "-bit by a " + den.bitLength()
                    + "-bit integer", "about 2^" + exponent, "below 2^1024 in magnitude to fit a double",
                    "Use ln of the parts (ExactLog.ln) instead.");
        }
        return negative ? -magnitude : magnitude;
    }

    /** The double nearest to the exact fraction f, by {@link #toDouble(BigInteger, BigInteger)}. */
    public static double toDouble(BigFraction f) {
        return toDouble(f.getNumerator(), f.getDenominator());
    }
}
