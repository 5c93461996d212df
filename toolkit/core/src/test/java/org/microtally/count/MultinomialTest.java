package org.microtally.count;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.math.BigInteger;
import java.util.Random;
import org.apache.commons.math3.fraction.BigFraction;
import org.apache.commons.math3.special.Gamma;
import org.junit.jupiter.api.Test;
import org.microtally.InvalidInputException;

class MultinomialTest {

    @Test
    void smallCountsAndProbabilities() {
        // Source: closed form 4! / (2! 1! 1!) = 12 (common practice, no source)
        assertEquals(BigInteger.valueOf(12), Multinomial.count(2, 1, 1));
        // Source: 12 of the 3^4 = 81 assignments
        assertEquals(new BigFraction(12, 81), Multinomial.probability(2, 1, 1));
        // Source: central binomial coefficient C(10, 5) = 252 (OEIS A000984)
        assertEquals(BigInteger.valueOf(252), Multinomial.count(5, 5));
    }

    @Test
    void multinomialIdentities() {
        // Source: multinomial theorem, sum over occupancies of N!/prod n_i! = M^N (DLMF Sec. 26.4); and the
        // Pascal-type recurrence C(n_1..n_M) = sum_i C(.., n_i - 1, ..) (common practice, no source)
        int m = 3;
        int n = 9;
        BigInteger sum = BigInteger.ZERO;
        for (int a = 0; a <= n; a++) {
            for (int b = 0; a + b <= n; b++) {
                int c = n - a - b;
                BigInteger v = Multinomial.count(a, b, c);
                sum = sum.add(v);
                BigInteger rec = BigInteger.ZERO;
                if (a > 0) {
                    rec = rec.add(Multinomial.count(a - 1, b, c));
                }
                if (b > 0) {
                    rec = rec.add(Multinomial.count(a, b - 1, c));
                }
                if (c > 0) {
                    rec = rec.add(Multinomial.count(a, b, c - 1));
                }
                // Source: Pascal-type recurrence for multinomial coefficients (common practice, no source)
                assertEquals(v, rec);
            }
        }
        // Source: multinomial theorem (DLMF Sec. 26.4)
        assertEquals(BigInteger.valueOf(m).pow(n), sum);
    }

    @Test
    void mostProbableOccupancyIsAsEvenAsPossibleAndIsMaximal() {
        // Source: closed form: 10 = 4 x 2 + 2, so 2 boxes hold 3 and 2 hold 2, larger first (common practice, no source)
        assertArrayEquals(new int[] {3, 3, 2, 2}, Multinomial.mostProbableOccupancy(4, 10));
        // Source: independent brute force over all occupancies of 4 boxes by 10 objects
        BigInteger best = BigInteger.ZERO;
        for (int a = 0; a <= 10; a++) {
            for (int b = 0; a + b <= 10; b++) {
                for (int c = 0; a + b + c <= 10; c++) {
                    best = best.max(Multinomial.count(a, b, c, 10 - a - b - c));
                }
            }
        }
        assertEquals(best, Multinomial.count(Multinomial.mostProbableOccupancy(4, 10)));
    }

    @Test
    void logarithmsMatchExactValuesToTwelveDigits() {
        Random rnd = new Random(31L);
        for (int trial = 0; trial < 200; trial++) {
            MultinomialCase c = MultinomialCase.random(rnd, trial < 100 ? 25 : 800);
            int[] occ = c.occupations();
            double[] d = c.asDoubles();
            int n = c.particles();
            // Source: the exact references of MultinomialCase (exact BigInteger coefficient, ln from the exact integer)
            double exactLnC = c.exactLnCount();
            assertEquals(exactLnC, Multinomial.lnCount(d), 1e-12 * Math.max(1, Math.abs(exactLnC)));
            double exactLnP = c.exactLnProbability();
            assertEquals(exactLnP, Multinomial.lnProbability(d), 1e-12 * Math.max(1, Math.abs(exactLnP)),
                    java.util.Arrays.toString(occ));
            if (n < 2000) {
                // Source: Commons Math Gamma.logGamma, an independent implementation, called directly here
                double direct = Gamma.logGamma(n + 1.0);
                for (int o : occ) {
                    direct -= Gamma.logGamma(o + 1.0);
                }
                assertEquals(direct, Multinomial.lnCountByLogGamma(d), 1e-12 * Math.max(1, Math.abs(direct)));
            }
        }
    }

    @Test
    void hugeNMatchesCentralBinomialAsymptotics() {
        double n = Math.scalb(1.0, 90); // about 1.24e27
        double d = Math.scalb(1.0, 43);
        // Source: de Moivre-Laplace / Stirling (DLMF 5.11.1): ln[C(N, N/2 + d) / 2^N] = 0.5 ln(2/(pi N)) - 2 d^2/N
        // with corrections of order d^4/N^3 and 1/N, here below 1e-26
        double expected = 0.5 * Math.log(2 / (Math.PI * n)) - 2 * d * d / n;
        double got = Multinomial.lnProbability(n / 2 + d, n / 2 - d);
        assertEquals(expected, got, 1e-12 * Math.abs(expected));
        double even = 0.5 * Math.log(2 / (Math.PI * n));
        assertEquals(even, Multinomial.lnProbability(n / 2, n / 2), 1e-12 * Math.abs(even));
        // Source: Stirling closed form for M = 3 equal boxes: ln P = ln(3 sqrt 3 / (2 pi N)) (leading terms, DLMF 5.11.1)
        double n3 = 3e27;
        double expected3 = Math.log(3 * Math.sqrt(3) / (2 * Math.PI * n3));
        assertEquals(expected3, Multinomial.lnProbability(1e27, 1e27, 1e27), 1e-12 * Math.abs(expected3));
        // Source: Stirling (DLMF 5.11.1): ln C(N, N/2) = N ln 2 - 0.5 ln(pi N / 2) + O(1/N); relative accuracy
        // on a number ~8.6e26
        double lnC = Multinomial.lnCount(n / 2, n / 2);
        assertEquals(n * Math.log(2) + 0.5 * Math.log(2 / (Math.PI * n)), lnC, 1e-12 * lnC);
    }

    @Test
    void badOccupanciesAreRefused() {
        assertTrue(assertThrows(InvalidInputException.class, () -> Multinomial.count(2, -1)).getMessage().contains("-1"));
        assertTrue(assertThrows(InvalidInputException.class, () -> Multinomial.lnCount(2.5, 1))
                .getMessage().contains("2.5"));
        // common practice, no source: NaN is not an occupancy, and 0 boxes cannot hold 3 objects
        assertTrue(assertThrows(InvalidInputException.class, () -> Multinomial.lnProbability(Double.NaN))
                .getMessage().contains("NaN"));
        assertTrue(assertThrows(InvalidInputException.class, () -> Multinomial.mostProbableOccupancy(0, 3))
                .getMessage().contains("M = 0"));
    }

    @Test
    void totalBeyondDoubleRangeIsRefusedNamingN() {
        // 1e308 + 1e308 = 2e308 exceeds Double.MAX_VALUE = 1.797...e308 (IEEE 754 binary64)
        for (InvalidInputException e : new InvalidInputException[] {
                assertThrows(InvalidInputException.class, () -> Multinomial.lnProbability(1e308, 1e308)),
                assertThrows(InvalidInputException.class, () -> Multinomial.lnCount(1e308, 1e308)),
                assertThrows(InvalidInputException.class, () -> Multinomial.lnCountByLogGamma(1e308, 1e308))}) {
            assertTrue(e.getMessage().contains("N = sum of the occupancies = 2.00000E+308"), e.getMessage());
        }
        // lnGamma(N + 1) ~ N ln N overflows long before N does: the direct formula refuses, naming N
        InvalidInputException e = assertThrows(InvalidInputException.class,
                () -> Multinomial.lnCountByLogGamma(1e307, 1e307));
        assertTrue(e.getMessage().contains("N = 2.0E307"), e.getMessage());
        // Source: Stirling (DLMF 5.11.1): ln C(N, N/2) = N ln 2 + 0.5 ln(2/(pi N)) + O(1/N), here at N = 2e307
        double n = 2e307;
        assertEquals(n * Math.log(2) + 0.5 * Math.log(2 / (Math.PI * n)), Multinomial.lnCount(1e307, 1e307),
                1e-12 * n);
    }
}
