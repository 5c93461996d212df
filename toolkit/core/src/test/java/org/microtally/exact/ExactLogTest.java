package org.microtally.exact;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.math.BigDecimal;
import java.math.BigInteger;
import java.math.MathContext;
import java.util.Random;
import org.junit.jupiter.api.Test;
import org.microtally.InvalidInputException;

class ExactLogTest {
    private static final MathContext MC = new MathContext(60);

    /** ln z = 2 artanh((z - 1)/(z + 1)), series sum z^(2k+1)/(2k+1), to 60 digits. */
    static BigDecimal lnSeries(BigDecimal z) {
        BigDecimal u = z.subtract(BigDecimal.ONE).divide(z.add(BigDecimal.ONE), MC);
        BigDecimal u2 = u.multiply(u, MC);
        BigDecimal term = u;
        BigDecimal sum = BigDecimal.ZERO;
        for (int k = 0; k < 400; k++) {
            BigDecimal add = term.divide(BigDecimal.valueOf(2L * k + 1), MC);
            sum = sum.add(add, MC);
            if (add.abs().compareTo(new BigDecimal("1e-58")) < 0) {
                break;
            }
            term = term.multiply(u2, MC);
        }
        return sum.multiply(BigDecimal.valueOf(2), MC);
    }

    /** Independent 60-digit reference: ln x = s ln 2 + ln(x / 2^s), x / 2^s in [1, 2). */
    static BigDecimal reference(BigInteger x) {
        int s = x.bitLength() - 1;
        BigDecimal m = new BigDecimal(x).divide(new BigDecimal(BigInteger.ONE.shiftLeft(s)), MC);
        BigDecimal ln2 = lnSeries(BigDecimal.valueOf(2));
        return ln2.multiply(BigDecimal.valueOf(s), MC).add(lnSeries(m), MC);
    }

    @Test
    void withinTwoUlpOfA60DigitReferenceForAllSizes() {
        Random rnd = new Random(11L);
        for (int trial = 0; trial < 300; trial++) {
            int bits = 1 + rnd.nextInt(trial < 150 ? 1100 : 20000);
            BigInteger x = new BigInteger(bits, rnd).setBit(bits - 1);
            double ref = reference(x).doubleValue();
            double got = ExactLog.ln(x);
            // Source: independent high-precision reference via the artanh series (common practice, no source)
            assertTrue(Math.abs(got - ref) <= 2 * Math.ulp(ref), bits + " bits: " + got + " vs " + ref);
        }
        assertEquals(0.0, ExactLog.ln(BigInteger.ONE));
        // Source: closed form log2(2^k) = k
        assertEquals(4321.0, ExactLog.log2(BigInteger.ONE.shiftLeft(4321)), 1e-9);
    }

    @Test
    void zeroAndNegativeAreRefused() {
        InvalidInputException ex = assertThrows(InvalidInputException.class, () -> ExactLog.ln(BigInteger.ZERO));
        assertTrue(ex.getMessage().contains("= 0"), ex.getMessage());
        assertThrows(InvalidInputException.class, () -> ExactLog.ln(BigInteger.valueOf(-5)));
    }
}
