package org.microtally.spectrum;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.math.BigInteger;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.microtally.InvalidInputException;

/** The one-state laws on {@link Statistics}, against closed forms and direct sums. */
class StatisticsLawsTest {

    @Test
    void closedFormsAtSimplePoints() {
        // Source: closed forms (Fermi-Dirac 1/(e^x + 1), Bose-Einstein 1/(e^x - 1)), common practice
        assertEquals(0.5, Statistics.FERMI.meanOccupation(0.0), 0.0);
        assertEquals(0.25, Statistics.FERMI.occupationVariance(0.0), 0.0);
        assertEquals(Math.log(2), Statistics.FERMI.lnStateSum(0.0), 1e-16);
        assertEquals(1.0, Statistics.BOSE.meanOccupation(Math.log(2)), 1e-15);
        assertEquals(2.0, Statistics.BOSE.occupationVariance(Math.log(2)), 1e-15);
        assertEquals(Math.log(2), Statistics.BOSE.lnStateSum(Math.log(2)), 1e-15);
        assertEquals(Math.exp(-1.5), Statistics.DISTINGUISHABLE.meanOccupation(1.5), 1e-16);
        assertEquals(Math.exp(-1.5), Statistics.DISTINGUISHABLE.lnStateSum(1.5), 1e-16);
    }

    @ParameterizedTest
    @CsvSource({"1, 0.7", "2, -1.3", "3, 0.0", "6, 2.5"})
    void gentileLawsMatchTheDirectSum(int k, double x) {
        // independent brute force: the weights e^{-m x}, m = 0..k, summed directly
        double s0 = 0;
        double s1 = 0;
        double s2 = 0;
        for (int m = 0; m <= k; m++) {
            double w = Math.exp(-m * x);
            s0 += w;
            s1 += m * w;
            s2 += (double) m * m * w;
        }
        Statistics st = Statistics.maxOccupancy(k);
        double mean = s1 / s0;
        assertEquals(mean, st.meanOccupation(x), 1e-14 * Math.max(1, mean));
        assertEquals(s2 / s0 - mean * mean, st.occupationVariance(x), 1e-13);
        assertEquals(Math.log(s0), st.lnStateSum(x), 1e-14 * Math.max(1, Math.abs(Math.log(s0))));
    }

    @Test
    void levelWaysMatchBinomialsAndTrinomials() {
        // Source: closed forms C(g, j) (Fermi), C(g + j - 1, j) (Bose), g^j (labelled), common practice
        assertEquals(BigInteger.valueOf(10), Statistics.FERMI.levelWays(5, 2));
        assertEquals(BigInteger.valueOf(15), Statistics.BOSE.levelWays(5, 2));
        assertEquals(BigInteger.valueOf(25), Statistics.DISTINGUISHABLE.levelWays(5, 2));
        assertEquals(BigInteger.ZERO, Statistics.FERMI.levelWays(3, 4));
        // Source: OEIS A002426, central trinomial coefficients (coefficient of t^n in (1 + t + t^2)^n):
        // 1, 1, 3, 7, 19, 51, 141, 393, 1107, 3139, 8953
        long[] a002426 = {1, 1, 3, 7, 19, 51, 141, 393, 1107, 3139, 8953};
        Statistics two = Statistics.maxOccupancy(2);
        for (int n = 0; n < a002426.length; n++) {
            assertEquals(BigInteger.valueOf(a002426[n]), two.levelWays(n, n), "n = " + n);
        }
        assertThrows(InvalidInputException.class, () -> Statistics.FERMI.levelWays(-1, 2));
    }

    @Test
    void onlyBoseCondensesAndOutOfRangeArgumentsAreRefused() {
        assertTrue(Statistics.BOSE.condenses());
        assertFalse(Statistics.FERMI.condenses() || Statistics.DISTINGUISHABLE.condenses()
                || Statistics.maxOccupancy(3).condenses());
        // Bose needs mu below the state (x > 0); the labelled law overflows below x = -709.78
        assertThrows(InvalidInputException.class, () -> Statistics.BOSE.meanOccupation(0.0));
        assertThrows(InvalidInputException.class, () -> Statistics.DISTINGUISHABLE.meanOccupation(-800));
        assertThrows(InvalidInputException.class, () -> Statistics.FERMI.meanOccupation(Double.NaN));
    }
}
