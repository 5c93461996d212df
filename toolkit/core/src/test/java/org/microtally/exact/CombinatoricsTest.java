package org.microtally.exact;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.math.BigInteger;
import java.util.Random;
import org.junit.jupiter.api.Test;
import org.microtally.InvalidInputException;

class CombinatoricsTest {

    @Test
    void factorialsMatchOeis() {
        // Source: OEIS A000142 (factorial numbers), terms 0! .. 20!
        long[] a000142 = {1L, 1L, 2L, 6L, 24L, 120L, 720L, 5040L, 40320L, 362880L, 3628800L, 39916800L,
            479001600L, 6227020800L, 87178291200L, 1307674368000L, 20922789888000L, 355687428096000L,
            6402373705728000L, 121645100408832000L, 2432902008176640000L};
        for (int n = 0; n < a000142.length; n++) {
            assertEquals(BigInteger.valueOf(a000142[n]), Combinatorics.factorial(n), "n = " + n);
        }
        // Source: 25! = 15511210043330985984000000 (from memory; confirmed with Python 3 math.factorial)
        assertEquals(new BigInteger("15511210043330985984000000"), Combinatorics.factorial(25));
    }

    @Test
    void binomialRowsMatchOeisPascalTriangle() {
        // Source: OEIS A007318 (Pascal's triangle read by rows), rows 0..6
        long[][] rows = {{1}, {1, 1}, {1, 2, 1}, {1, 3, 3, 1}, {1, 4, 6, 4, 1}, {1, 5, 10, 10, 5, 1},
            {1, 6, 15, 20, 15, 6, 1}};
        for (int n = 0; n < rows.length; n++) {
            for (int k = 0; k <= n; k++) {
                assertEquals(BigInteger.valueOf(rows[n][k]), Combinatorics.binomial(n, k), "C(" + n + ", " + k + ")");
            }
        }
        // Source: OEIS A000984 (central binomial coefficients C(2n, n)), n = 0..10
        long[] a000984 = {1, 2, 6, 20, 70, 252, 924, 3432, 12870, 48620, 184756};
        for (int n = 0; n < a000984.length; n++) {
            assertEquals(BigInteger.valueOf(a000984[n]), Combinatorics.binomial(2L * n, n), "C(2n, n), n = " + n);
        }
        // Source: C(100, 50) = 100891344545564193334812497256 (from memory; confirmed with Python 3 math.comb)
        assertEquals(new BigInteger("100891344545564193334812497256"), Combinatorics.binomial(100, 50));
    }

    @Test
    void binomialAgreesWithPascalRecurrenceAndFactorialClosedForm() {
        // Source: independent brute force, Pascal's rule C(n, k) = C(n-1, k-1) + C(n-1, k) built by addition
        // only, and the closed form n! / (k! (n-k)!) (DLMF 26.3.1, from memory)
        int max = 60;
        BigInteger[] row = {BigInteger.ONE};
        for (int n = 0; n <= max; n++) {
            for (int k = 0; k <= n; k++) {
                assertEquals(row[k], Combinatorics.binomial(n, k), "C(" + n + ", " + k + ")");
                BigInteger closed = Combinatorics.factorial(n)
                        .divide(Combinatorics.factorial(k).multiply(Combinatorics.factorial(n - k)));
                assertEquals(closed, Combinatorics.binomial(n, k), "closed form C(" + n + ", " + k + ")");
            }
            assertEquals(BigInteger.ZERO, Combinatorics.binomial(n, n + 1L), "k > n gives 0");
            BigInteger[] next = new BigInteger[n + 2];
            next[0] = BigInteger.ONE;
            next[n + 1] = BigInteger.ONE;
            for (int k = 1; k <= n; k++) {
                next[k] = row[k - 1].add(row[k]);
            }
            row = next;
        }
    }

    @Test
    void binomialWithLongArgumentsBeyondIntRange() {
        // Source: closed form C(n, 3) = n (n-1) (n-2) / 6 (common practice, no source), n = 4e9 + 3,
        // checked against random n by the same closed form in BigInteger
        long n = 4_000_000_003L;
        assertEquals(new BigInteger("10666666682666666674000000001"), Combinatorics.binomial(n, 3));
        Random rnd = new Random(20261201L);
        for (int t = 0; t < 50; t++) {
            long m = 3 + (rnd.nextLong() >>> 2);
            BigInteger bm = BigInteger.valueOf(m);
            BigInteger closed = bm.multiply(bm.subtract(BigInteger.ONE)).multiply(bm.subtract(BigInteger.TWO))
                    .divide(BigInteger.valueOf(6));
            assertEquals(closed, Combinatorics.binomial(m, 3), "n = " + m);
            // Source: C(n, 1) = n and C(n, 0) = 1 (common practice, no source)
            assertEquals(bm, Combinatorics.binomial(m, 1));
            assertEquals(BigInteger.ONE, Combinatorics.binomial(m, 0));
        }
    }

    @Test
    void negativeArgumentsAreRejected() {
        InvalidInputException f = assertThrows(InvalidInputException.class, () -> Combinatorics.factorial(-1));
        assertEquals(true, f.getMessage().contains("-1"), f.getMessage());
        assertThrows(InvalidInputException.class, () -> Combinatorics.binomial(-1, 0));
        assertThrows(InvalidInputException.class, () -> Combinatorics.binomial(5, -2));
    }
}
