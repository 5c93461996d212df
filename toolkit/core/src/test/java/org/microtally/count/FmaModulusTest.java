package org.microtally.count;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.math.BigInteger;
import java.util.Random;
import org.junit.jupiter.api.Test;
import org.microtally.ProgressListener;
import org.microtally.spectrum.Spectra;
import org.microtally.spectrum.Spectrum;
import org.microtally.spectrum.Statistics;

class FmaModulusTest {

    private static long reference(long t, long c, long x, long p) {
        return BigInteger.valueOf(c).multiply(BigInteger.valueOf(x)).add(BigInteger.valueOf(t))
                .mod(BigInteger.valueOf(p)).longValueExact();
    }

    @Test
    void multiplyAddEqualsBigIntegerOnRandomAndEdgeOperands() {
        Random rnd = new Random(50L);
        long[] primes = Moduli.fmaPrimes(3);
        // the smallest primes of the allowed range too, where the bound |l| < p/8 is tightest
        long low = Moduli.FMA_FLOOR + 1;
        while (!Moduli.isPrime(low)) {
            low += 2;
        }
        long[] all = {primes[0], primes[1], primes[2], low};
        for (long p : all) {
            assertTrue(p > Moduli.FMA_FLOOR && p < FmaModulus.LIMIT, "range of " + p);
            double dp = p;
            double pinv = 1.0 / dp;
            long[] edges = {0, 1, 2, p / 2, p / 2 + 1, p - 2, p - 1};
            for (long c : edges) {
                for (long x : edges) {
                    for (long t : edges) {
                        // Source: independent arithmetic (BigInteger (t + c x) mod p)
                        assertEquals(reference(t, c, x, p), (long) FmaModulus.mulAdd(t, c, x, dp, pinv),
                                "p=" + p + " c=" + c + " x=" + x + " t=" + t);
                    }
                }
            }
            for (int i = 0; i < 10_000; i++) {
                long c = Math.floorMod(rnd.nextLong(), p);
                long x = Math.floorMod(rnd.nextLong(), p);
                // t chosen so that t + c x is often an exact multiple of p, the case a floor can miss
                long t = rnd.nextBoolean() ? Math.floorMod(rnd.nextLong(), p)
                        : Math.floorMod(-reference(0, c, x, p) + rnd.nextInt(3) - 1, p);
                // Source: independent arithmetic (BigInteger (t + c x) mod p)
                assertEquals(reference(t, c, x, p), (long) FmaModulus.mulAdd(t, c, x, dp, pinv),
                        "p=" + p + " c=" + c + " x=" + x + " t=" + t);
            }
        }
    }

    @Test
    void rowLoopEqualsScalarFormulaAndLeavesTheRestAlone() {
        Random rnd = new Random(51L);
        long p = Moduli.fmaPrimes(1)[0];
        double[] a = new double[3000];
        for (int i = 0; i < a.length; i++) {
            a[i] = Math.floorMod(rnd.nextLong(), p);
        }
        double c = Math.floorMod(rnd.nextLong(), p);
        // source and destination in one array at different offsets, as rows of a table; scratch is clobbered
        double[] b = a.clone();
        double[] scratch = new double[a.length];
        FmaModulus.mulAddRow(b, 1700, b, 3, 1111, c, p, 1.0 / p, scratch);
        // destination before source, source in a separate array
        double[] d = a.clone();
        double[] src = a.clone();
        FmaModulus.mulAddRow(d, 5, src, 900, 2001, c, p, 1.0 / p, scratch);
        for (int i = 0; i < a.length; i++) {
            long want = (i >= 1700 && i < 2811) ? reference((long) a[i], (long) c, (long) a[i - 1697], p) : (long) a[i];
            // Source: independent arithmetic (BigInteger, element by element)
            assertEquals(want, (long) b[i], "index " + i);
            long want2 = (i >= 5 && i < 2006) ? reference((long) a[i], (long) c, (long) a[i + 895], p) : (long) a[i];
            // Source: independent arithmetic (BigInteger, element by element)
            assertEquals(want2, (long) d[i], "second row, index " + i);
        }
    }

    @Test
    void largeTableIsBitIdenticalToTheBigIntegerRecursion() {
        Spectrum s = Spectra.harmonicOscillator(3, 100);
        int[] en = s.integerEnergies();
        int[] g = s.degeneracies();
        BigInteger[] ref = CountEngine.bigInteger(en, g, Statistics.BOSE, 30, 100, ProgressListener.NONE);
        CountTable t = CountTable.of(s, Statistics.BOSE, 30, 100);
        // precondition of this test, not a result check: several primes are in use
        assertTrue(t.primesUsed() >= 2, "primes used: " + t.primesUsed());
        for (int n = 0; n <= 30; n++) {
            for (int e = 0; e <= 100; e++) {
                // Source: independent arithmetic (exact BigInteger recursion)
                assertEquals(ref[n * 101 + e], t.count(n, e), "n=" + n + " e=" + e);
            }
        }
    }
}
