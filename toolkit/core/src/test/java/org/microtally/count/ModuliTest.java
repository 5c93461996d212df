package org.microtally.count;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.math.BigInteger;
import java.util.Arrays;
import java.util.Random;
import org.junit.jupiter.api.Test;
import org.microtally.ProgressListener;
import org.microtally.spectrum.Spectra;
import org.microtally.spectrum.Spectrum;
import org.microtally.spectrum.Statistics;

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
                // both digit paths: doubles for 50-bit moduli from MIN_PRIMES_IN_DOUBLES on (with a hardware FMA), Shoup else
                assertEquals(FmaModulus.HARDWARE && p[0] < FmaModulus.LIMIT && k >= Moduli.Crt.MIN_PRIMES_IN_DOUBLES, crt.digitsInDoubles(), "k=" + k);
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
        // the short cuts for small values (all residues equal; two Garner digits that fit in a long; two and
        // three digits in limbs) and their edges, at limb boundaries and random inside the three-digit range
        for (long[] all : new long[][] {Moduli.primes(5), Moduli.fmaPrimes(5)}) {
            BigInteger two = BigInteger.valueOf(all[0]).multiply(BigInteger.valueOf(all[1]));
            BigInteger three = two.multiply(BigInteger.valueOf(all[2]));
            java.util.List<BigInteger> values = new java.util.ArrayList<>(java.util.List.of(BigInteger.ZERO,
                    BigInteger.valueOf(12345), BigInteger.valueOf(all[0] - 1), BigInteger.valueOf(all[0]),
                    BigInteger.valueOf(Long.MAX_VALUE), BigInteger.ONE.shiftLeft(63),
                    BigInteger.ONE.shiftLeft(63).add(BigInteger.valueOf(all[0] - 1)), BigInteger.ONE.shiftLeft(64),
                    BigInteger.ONE.shiftLeft(100).add(BigInteger.ONE), two.subtract(BigInteger.ONE), two,
                    BigInteger.ONE.shiftLeft(127), BigInteger.ONE.shiftLeft(128).subtract(BigInteger.ONE),
                    BigInteger.ONE.shiftLeft(128), three.subtract(BigInteger.ONE), three));
            Random inRange = new Random(3L);
            for (int i = 0; i < 64; i++) {
                values.add(two.add(new BigInteger(three.bitLength() + 8, inRange).mod(three.subtract(two))));
            }
            for (int k = 1; k <= all.length; k++) {
                long[] p = java.util.Arrays.copyOf(all, k);
                BigInteger product = BigInteger.ONE;
                for (long q : p) {
                    product = product.multiply(BigInteger.valueOf(q));
                }
                Moduli.Crt crt = new Moduli.Crt(p);
                java.util.List<BigInteger> cases = new java.util.ArrayList<>(values);
                cases.add(product.subtract(BigInteger.ONE));
                for (BigInteger v : cases) {
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

    /** Residues [prime][entry] of the given values. */
    private static long[][] residuesOf(long[] p, BigInteger[] values) {
        long[][] res = new long[p.length][values.length];
        for (int i = 0; i < p.length; i++) {
            BigInteger bp = BigInteger.valueOf(p[i]);
            for (int j = 0; j < values.length; j++) {
                res[i][j] = values[j].mod(bp).longValueExact();
            }
        }
        return res;
    }

    /** Column j of res, the residues of entry j. */
    private static long[] column(long[][] res, int j) {
        long[] r = new long[res.length];
        for (int i = 0; i < r.length; i++) {
            r[i] = res[i][j];
        }
        return r;
    }

    /**
     * The top mixed-radix digit by its definition: -1 for 0, else the largest i with v &gt;= p_0 ... p_(i-1)
     * (v = a_0 + a_1 p_0 + ... + a_(k-1) p_0 ... p_(k-2) with 0 &lt;= a_i &lt; p_i; Knuth, TAOCP Vol. 2, Sec. 4.3.2).
     */
    private static int topDigitByDefinition(long[] p, BigInteger v) {
        if (v.signum() == 0) {
            return -1;
        }
        int top = 0;
        BigInteger radix = BigInteger.valueOf(p[0]);
        while (top + 1 < p.length && v.compareTo(radix) >= 0) {
            top++;
            radix = radix.multiply(BigInteger.valueOf(p[top]));
        }
        return top;
    }

    /**
     * Blocks of 256 entries, the last one partial, unaligned ranges, and every kind of entry mixed in one
     * array: zero, below the smallest prime (all residues equal), between the smallest and the largest
     * prime, two digits that fit a long and that do not, every digit (up to the product minus one), and
     * random residues of unknown value.
     */
    @Test
    void blockReconstructionEqualsTheTextbookSumOnEveryKindOfEntry() {
        Random rnd = new Random(4_3_2L);
        for (long[] all : new long[][] {Moduli.primes(9), Moduli.fmaPrimes(9)}) {
            for (int k = 1; k <= all.length; k++) {
                long[] p = Arrays.copyOf(all, k);
                BigInteger product = BigInteger.ONE;
                for (long q : p) {
                    product = product.multiply(BigInteger.valueOf(q));
                }
                int size = 3 * Moduli.Crt.BLOCK + 77;
                long[][] res = new long[k][size];
                for (int j = 0; j < size; j++) {
                    BigInteger v;
                    switch (rnd.nextInt(8)) {
                        case 0:
                            v = BigInteger.ZERO;
                            break;
                        case 1:
                            v = BigInteger.valueOf(Math.floorMod(rnd.nextLong(), p[k - 1]));
                            break;
                        case 2:
                            v = BigInteger.valueOf(p[k - 1] + Math.floorMod(rnd.nextLong(), Math.max(1, p[0] - p[k - 1])));
                            break;
                        case 3:
                            v = BigInteger.valueOf(rnd.nextLong() & Long.MAX_VALUE);
                            break;
                        case 4:
                            v = new BigInteger(64 + rnd.nextInt(60), rnd);
                            break;
                        case 5:
                            v = product.subtract(BigInteger.ONE).subtract(BigInteger.valueOf(rnd.nextInt(3)));
                            break;
                        case 6:
                            v = new BigInteger(product.bitLength() + 8, rnd).mod(product);
                            break;
                        default:
                            v = null;
                    }
                    v = v == null ? null : v.mod(product);
                    for (int i = 0; i < k; i++) {
                        res[i][j] = v == null ? Math.floorMod(rnd.nextLong(), p[i]) : v.mod(BigInteger.valueOf(p[i])).longValueExact();
                    }
                }
                Moduli.Crt crt = new Moduli.Crt(p);
                // both digit paths: doubles for 50-bit moduli from MIN_PRIMES_IN_DOUBLES on (with a hardware FMA), Shoup else
                assertEquals(FmaModulus.HARDWARE && p[0] < FmaModulus.LIMIT && k >= Moduli.Crt.MIN_PRIMES_IN_DOUBLES, crt.digitsInDoubles(), "k=" + k);
                BigInteger[] got = crt.reconstructAll(res);
                int from = 37;
                BigInteger[] part = crt.reconstructRange(res, from, size - from - 5);
                int[] top = new int[size];
                crt.topDigits(res, 0, size, top);
                int[] single = new int[1];
                for (int j = 0; j < size; j++) {
                    // Source: Knuth, TAOCP Vol. 2, Sec. 4.3.2 (the CRT in its summation form, independent of Garner's)
                    BigInteger expected = textbook(p, column(res, j));
                    assertEquals(expected, got[j], "k=" + k + " entry " + j);
                    if (j >= from && j < size - 5) {
                        assertEquals(expected, part[j - from], "k=" + k + " entry " + j + " of a range from " + from);
                    }
                    // Source: definition of the mixed-radix representation (Knuth, TAOCP Vol. 2, Sec. 4.3.2)
                    assertEquals(topDigitByDefinition(p, expected), top[j], "k=" + k + " top digit of entry " + j);
                    crt.topDigits(res, j, 1, single);
                    assertEquals(top[j], single[0], "k=" + k + " single-entry top digit of entry " + j);
                }
            }
        }
    }

    /**
     * The residues of a real table (3D oscillator, bosons, N = 40, E = 200, as the multi-modular path
     * computes them) rebuilt block-wise equal the textbook CRT entry by entry; the table holds zeros,
     * entries below the smallest prime and entries that need every prime, and the test checks that it does.
     */
    @Test
    void blockReconstructionOfRealTableResiduesEqualsTheTextbookSum() {
        int maxN = 40;
        int maxE = 200;
        Spectrum s = Spectra.harmonicOscillator(3, maxE);
        int[] en = s.integerEnergies();
        int[] g = s.degeneracies();
        for (long[] p : new long[][] {
            Moduli.fmaPrimes(CountBound.fmaPrimesFor(CountBound.log2Bound(en, g, Statistics.BOSE, maxN, maxE))),
            Moduli.primes(CountBound.primesFor(CountBound.log2Bound(en, g, Statistics.BOSE, maxN, maxE)))}) {
            long[][] res = CountEngine.multiModularResidues(en, g, Statistics.BOSE, maxN, maxE, p, ProgressListener.NONE);
            BigInteger[] got = new Moduli.Crt(p).reconstructAll(res);
            int zeros = 0;
            int belowSmallest = 0;
            int everyPrime = 0;
            BigInteger withoutLast = BigInteger.ONE;
            for (int i = 0; i < p.length - 1; i++) {
                withoutLast = withoutLast.multiply(BigInteger.valueOf(p[i]));
            }
            for (int j = 0; j < got.length; j++) {
                // Source: Knuth, TAOCP Vol. 2, Sec. 4.3.2 (the CRT in its summation form, independent of Garner's)
                BigInteger expected = textbook(p, column(res, j));
                assertEquals(expected, got[j], p.length + " primes, Omega(" + j / (maxE + 1) + ", " + j % (maxE + 1) + ")");
                zeros += expected.signum() == 0 ? 1 : 0;
                belowSmallest += expected.signum() > 0 && expected.compareTo(BigInteger.valueOf(p[p.length - 1])) < 0 ? 1 : 0;
                everyPrime += expected.compareTo(withoutLast) >= 0 ? 1 : 0;
            }
            // precondition, not a result: the table exercises every path of the reconstruction
            assertTrue(p.length >= 2 && zeros > 0 && belowSmallest > 0 && everyPrime > 0,
                    p.length + " primes: " + zeros + " zeros, " + belowSmallest + " below the smallest prime, "
                            + everyPrime + " needing every prime");
        }
    }

    @Test
    void crtRefusesModuliItCannotReduceByOneSubtraction() {
        // common practice, no source: Garner's digits need distinct moduli, and this implementation reduces a digit
        // modulo a later prime by one conditional subtraction, so the largest must be below twice the smallest
        assertThrows(IllegalArgumentException.class, () -> new Moduli.Crt(new long[0]));
        assertThrows(IllegalArgumentException.class, () -> new Moduli.Crt(new long[] {Moduli.primes(1)[0], Moduli.fmaPrimes(1)[0]}));
        assertThrows(IllegalArgumentException.class, () -> new Moduli.Crt(new long[] {Moduli.fmaPrimes(1)[0], Moduli.fmaPrimes(1)[0]}));
        assertThrows(IllegalArgumentException.class, () -> new Moduli.Crt(new long[] {1L << 62}));
    }
}
