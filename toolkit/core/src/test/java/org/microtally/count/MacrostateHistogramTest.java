package org.microtally.count;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.math.BigInteger;
import java.util.List;
import java.util.Map;
import org.apache.commons.math3.fraction.BigFraction;
import org.junit.jupiter.api.Test;
import org.microtally.InvalidInputException;

class MacrostateHistogramTest {

    @Test
    void twoSixSidedDiceTotals() {
        MacrostateHistogram h = MacrostateHistogram.ofIdenticalUnits(2, 1, 2, 3, 4, 5, 6);
        // common practice, no source: totals 2..12 have multiplicities 1,2,3,4,5,6,5,4,3,2,1 out of 36
        long[] expected = {1, 2, 3, 4, 5, 6, 5, 4, 3, 2, 1};
        assertEquals(2, h.minTotal());
        assertEquals(12, h.maxTotal());
        for (int t = 2; t <= 12; t++) {
            assertEquals(BigInteger.valueOf(expected[t - 2]), h.multiplicity(t));
        }
        assertEquals(BigInteger.valueOf(36), h.totalMultiplicity());
        assertEquals(new BigFraction(1, 6), h.probability(7));
        assertEquals(List.of(7), h.mostProbableTotals());
        assertEquals(BigInteger.ZERO, h.multiplicity(13));
    }

    @Test
    void spinHalfParamagnetMagnetisationIsBinomial() {
        // N two-state spins with moments +1 / -1: multiplicity of total 2k - N is C(N, k)
        int n = 100;
        MacrostateHistogram h = MacrostateHistogram.ofIdenticalUnits(n, -1, 1);
        for (int k = 0; k <= n; k++) {
            // Source: closed form C(N, N_up) (Schroeder, An Introduction to Thermal Physics, Sec. 2.1)
            assertEquals(CountTableTest.binomial(n, k), h.multiplicity(2 * k - n));
            assertEquals(BigInteger.ZERO, h.multiplicity(2 * k - n + 1));
        }
        assertEquals(BigInteger.TWO.pow(n), h.totalMultiplicity()); // Source: closed form 2^N
    }

    @Test
    void weightedAndMixedUnitsMatchDirectSummation() {
        // one unit with outcomes {0 (x2), 3 (x1)} and one with {-1 (x1), 1 (x4)}: enumerate by hand
        MacrostateHistogram h = MacrostateHistogram.ofUnits(List.of(
                Map.of(0, BigInteger.TWO, 3, BigInteger.ONE), Map.of(-1, BigInteger.ONE, 1, BigInteger.valueOf(4))));
        // Source: direct enumeration of the 2 x 2 outcome pairs (common practice, no source)
        assertEquals(BigInteger.TWO, h.multiplicity(-1));
        assertEquals(BigInteger.valueOf(8), h.multiplicity(1));
        assertEquals(BigInteger.ONE, h.multiplicity(2));
        assertEquals(BigInteger.valueOf(4), h.multiplicity(4));
        assertEquals(BigInteger.valueOf(15), h.totalMultiplicity());
        assertEquals(6, h.rows().size()); // totals -1..4, zeros included
        MacrostateHistogram w = MacrostateHistogram.ofIdenticalUnits(3, new int[] {0, 1}, new long[] {1, 2});
        // Source: binomial theorem (1 + 2x)^3 = 1 + 6x + 12x^2 + 8x^3
        assertEquals(List.of(BigInteger.ONE, BigInteger.valueOf(6), BigInteger.valueOf(12), BigInteger.valueOf(8)),
                List.of(w.multiplicity(0), w.multiplicity(1), w.multiplicity(2), w.multiplicity(3)));
    }

    @Test
    void badUnitsAreRefused() {
        assertTrue(assertThrows(InvalidInputException.class,
                () -> MacrostateHistogram.ofIdenticalUnits(2, new int[] {1, 2}, new long[] {1, 0}))
                .getMessage().contains("0"));
        assertThrows(InvalidInputException.class, () -> MacrostateHistogram.ofIdenticalUnits(-1, 1, 2));
        assertThrows(InvalidInputException.class, () -> MacrostateHistogram.ofIdenticalUnits(2));
        assertTrue(assertThrows(InvalidInputException.class,
                () -> MacrostateHistogram.ofIdenticalUnits(1000, 0, 100_000)).getMessage().contains("span"));
    }
}
