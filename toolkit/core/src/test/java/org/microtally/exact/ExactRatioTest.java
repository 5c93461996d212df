package org.microtally.exact;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.math.BigDecimal;
import java.math.BigInteger;
import java.math.MathContext;
import java.util.Random;
import org.apache.commons.math3.fraction.BigFraction;
import org.junit.jupiter.api.Test;
import org.microtally.InvalidInputException;

/** ExactRatio against an independent BigDecimal evaluation of the same quotient. */
class ExactRatioTest {
    private static final MathContext MC40 = new MathContext(40);

    private static double reference(BigInteger num, BigInteger den) {
        return new BigDecimal(num).divide(new BigDecimal(den), MC40).doubleValue();
    }

    private static BigInteger two(int k) {
        return BigInteger.ONE.shiftLeft(k);
    }

    @Test
    void partsBeyondDoubleRange() {
        // Source: independent BigDecimal evaluation at MathContext(40); closed form 2^28 / 2^1028 = 2^-1000
        assertEquals(reference(two(28), two(1028)), ExactRatio.toDouble(two(28), two(1028)), 0.0);
        assertEquals(Math.scalb(1.0, -1000), ExactRatio.toDouble(two(28), two(1028)), 0.0);
        BigInteger den = two(1025).add(BigInteger.ONE);
        // Source: independent BigDecimal evaluation at MathContext(40)
        assertEquals(reference(two(1022), den), ExactRatio.toDouble(two(1022), den), 0.0);
        assertEquals(reference(two(1022), den), ExactRatio.toDouble(new BigFraction(two(1022), den)), 0.0);
        // Source: independent BigDecimal evaluation at MathContext(40), a 3000-bit over 2990-bit ratio
        BigInteger big = BigInteger.valueOf(3).pow(1893);
        BigInteger other = BigInteger.valueOf(7).pow(1065);
        assertEquals(reference(big, other), ExactRatio.toDouble(big, other), 0.0);
    }

    @Test
    void zeroSignAndSubnormal() {
        // Source: closed form 0 / q = 0
        assertEquals(0.0, ExactRatio.toDouble(BigInteger.ZERO, two(2000)), 0.0);
        // Source: independent BigDecimal evaluation at MathContext(40), signs as in exact arithmetic
        assertEquals(reference(BigInteger.valueOf(-5), BigInteger.valueOf(3)),
                ExactRatio.toDouble(BigInteger.valueOf(-5), BigInteger.valueOf(3)), 0.0);
        assertEquals(reference(BigInteger.valueOf(5), BigInteger.valueOf(-3)),
                ExactRatio.toDouble(BigInteger.valueOf(5), BigInteger.valueOf(-3)), 0.0);
        assertEquals(5.0 / 3.0, ExactRatio.toDouble(BigInteger.valueOf(-5), BigInteger.valueOf(-3)), 0.0);
        // Source: IEEE 754 binary64: Double.MIN_VALUE = 2^-1074; 2^-1075 is a tie that rounds to even (0)
        assertEquals(Double.MIN_VALUE, ExactRatio.toDouble(BigInteger.ONE, two(1074)), 0.0);
        assertEquals(0.0, ExactRatio.toDouble(BigInteger.ONE, two(1075)), 0.0);
        assertEquals(Double.MIN_VALUE, ExactRatio.toDouble(BigInteger.valueOf(3), two(1076)), 0.0);
        assertEquals(0.0, ExactRatio.toDouble(BigInteger.ONE, two(1200)), 0.0);
        // Source: independent BigDecimal evaluation at MathContext(40), subnormal quotients
        for (int j = 367; j <= 386; j++) {
            BigInteger num = BigInteger.valueOf(1_000_003L);
            BigInteger den = BigInteger.valueOf(7).pow(j);
            assertEquals(reference(num, den), ExactRatio.toDouble(num, den), 0.0, "j = " + j);
        }
        // Source: closed form: 1000003 / 2^1075 = 500001.5 x 2^-1074 exactly, a tie, rounds to even 500002;
        // over 2^1075 + 17 it lies just below the tie and rounds down to 500001 (IEEE 754 round to nearest)
        BigInteger m = BigInteger.valueOf(1_000_003L);
        assertEquals(500002 * Double.MIN_VALUE, ExactRatio.toDouble(m, two(1075)), 0.0);
        assertEquals(500001 * Double.MIN_VALUE, ExactRatio.toDouble(m, two(1075).add(BigInteger.valueOf(17))), 0.0);
        // Source: IEEE 754 binary64, Double.MAX_VALUE = (2^53 - 1) 2^971
        BigInteger max = two(53).subtract(BigInteger.ONE).shiftLeft(971);
        assertEquals(Double.MAX_VALUE, ExactRatio.toDouble(max.multiply(BigInteger.valueOf(3)), BigInteger.valueOf(3)), 0.0);
    }

    @Test
    void randomRatiosMatchBigDecimal() {
        Random random = new Random(20261201L);
        for (int trial = 0; trial < 2000; trial++) {
            BigInteger num = new BigInteger(1 + random.nextInt(2200), random);
            BigInteger den = new BigInteger(1 + random.nextInt(2200), random).add(BigInteger.ONE);
            if (random.nextBoolean()) {
                num = num.negate();
            }
            if (num.bitLength() - den.bitLength() > 1000) {
                continue;
            }
            // Source: independent BigDecimal evaluation at MathContext(40)
            assertEquals(reference(num, den), ExactRatio.toDouble(num, den), 0.0, num + " / " + den);
        }
    }

    @Test
    void badInputsThrow() {
        InvalidInputException zero = assertThrows(InvalidInputException.class,
                () -> ExactRatio.toDouble(BigInteger.ONE, BigInteger.ZERO));
        assertTrue(zero.getMessage().contains("= 0"), zero.getMessage());
        InvalidInputException huge = assertThrows(InvalidInputException.class,
                () -> ExactRatio.toDouble(two(1024), BigInteger.ONE));
        assertTrue(huge.getMessage().contains("about 2^1024"), huge.getMessage());
    }
}
