package org.microtally.count;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.math.BigInteger;
import java.util.Random;
import org.junit.jupiter.api.Test;

class ModuliTest {

    /** The textbook CRT sum r_i M_i (M_i^-1 mod p_i) mod M (Knuth, TAOCP Vol. 2, Sec. 4.3.2, eq. (24)). */
    private static BigInteger textbook(long[] p, long[] r) {
        BigInteger m = BigInteger.ONE;
        for (long q : p) {
            m = m.multiply(BigInteger.valueOf(q));
        }
        BigInteger v = BigInteger.ZERO;
        for (int i = 0; i < p.length; i++) {
            BigInteger pi = BigInteger.valueOf(p[i]);
            BigInteger mi = m.divide(pi);
            v = v.add(BigInteger.valueOf(r[i]).multiply(mi).multiply(mi.modInverse(pi)));
        }
        return v.mod(m);
    }

    @Test
    void garnerReconstructionEqualsTheTextbookSum() {
        Random rnd = new Random(62L);
        for (long[] all : new long[][] {Moduli.primes(12), Moduli.fmaPrimes(15)}) {
            for (int k = 1; k <= all.length; k++) {
                long[] p = java.util.Arrays.copyOf(all, k);
                Moduli.Crt crt = new Moduli.Crt(p);
                long[][] res = new long[k][60];
                for (int col = 0; col < 60; col++) {
                    for (int i = 0; i < k; i++) {
                        // edge columns: zero, all p_i - 1 (the largest value), small values, random
                        res[i][col] = col == 0 ? 0 : col == 1 ? p[i] - 1 : col == 2 ? 1 : Math.floorMod(rnd.nextLong(), p[i]);
                    }
                }
                for (int col = 0; col < 60; col++) {
                    long[] r = new long[k];
                    for (int i = 0; i < k; i++) {
                        r[i] = res[i][col];
                    }
                    BigInteger v = crt.reconstruct(res, col);
                    // Source: Knuth, TAOCP Vol. 2, Sec. 4.3.2 (the CRT in its summation form, independent of Garner's)
                    assertEquals(textbook(p, r), v, "k=" + k + " column " + col);
                }
            }
        }
        // the short cuts for small values (all residues equal; two Garner digits that fit in a long) and their edges
        for (long[] all : new long[][] {Moduli.primes(4), Moduli.fmaPrimes(4)}) {
            for (int k = 1; k <= all.length; k++) {
                long[] p = java.util.Arrays.copyOf(all, k);
                BigInteger product = BigInteger.ONE;
                for (long q : p) {
                    product = product.multiply(BigInteger.valueOf(q));
                }
                Moduli.Crt crt = new Moduli.Crt(p);
                BigInteger[] values = {BigInteger.ZERO, BigInteger.valueOf(12345), BigInteger.valueOf(p[0] - 1),
                    BigInteger.valueOf(p[0]), BigInteger.valueOf(Long.MAX_VALUE), BigInteger.ONE.shiftLeft(63),
                    BigInteger.ONE.shiftLeft(63).add(BigInteger.valueOf(p[0] - 1)), BigInteger.ONE.shiftLeft(100).add(BigInteger.ONE),
                    product.subtract(BigInteger.ONE)};
                for (BigInteger v : values) {
                    if (v.compareTo(product) >= 0) {
                        continue;
                    }
                    long[][] res = new long[k][1];
                    for (int i = 0; i < k; i++) {
                        res[i][0] = v.mod(BigInteger.valueOf(p[i])).longValueExact();
                    }
                    // Source: definition (v is the unique value in [0, prod p_i) with these residues); common practice
                    assertEquals(v, crt.reconstruct(res, 0), "k=" + k + " v=" + v);
                }
            }
        }
        // precondition, not a result: both prime sets lie in their stated ranges
        assertTrue(Moduli.fmaPrimes(15)[14] > Moduli.FMA_FLOOR && Moduli.primes(12)[11] > (1L << 61));
    }
}
