package org.microtally.count;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.math.BigInteger;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import org.apache.commons.math3.fraction.BigFraction;
import org.apache.commons.math3.special.Gamma;
import org.junit.jupiter.api.Test;
import org.microtally.InvalidInputException;
import org.microtally.ProgressListener;
import org.microtally.spectrum.Level;
import org.microtally.spectrum.NonIntegerEnergyException;
import org.microtally.spectrum.Spectra;
import org.microtally.spectrum.Spectrum;
import org.microtally.spectrum.Statistics;
import org.microtally.exact.ExactLog;

class CountTableTest {

    static BigInteger binomial(long n, long k) {
        if (k < 0 || k > n) {
            return BigInteger.ZERO;
        }
        BigInteger r = BigInteger.ONE;
        for (long i = 1; i <= k; i++) {
            r = r.multiply(BigInteger.valueOf(n - k + i)).divide(BigInteger.valueOf(i));
        }
        return r;
    }

    @Test
    void einsteinSolidOfThreeOscillatorsMatchesTextbookTable() {
        CountTable t = CountTable.of(Spectra.harmonicOscillator(1, 10), Statistics.DISTINGUISHABLE, 3, 6);
        // Source: D. V. Schroeder, An Introduction to Thermal Physics (2000), Fig./Table 2.2: three
        // oscillators, q = 0..6 units -> Omega = 1, 3, 6, 10, 15, 21, 28
        long[] expected = {1, 3, 6, 10, 15, 21, 28};
        for (int q = 0; q <= 6; q++) {
            assertEquals(BigInteger.valueOf(expected[q]), t.count(3, q), "q = " + q);
        }
    }

    @Test
    void einsteinSolidMatchesClosedFormForManySizes() {
        int maxN = 30;
        int maxQ = 80;
        CountTable t = CountTable.of(Spectra.harmonicOscillator(1, maxQ), Statistics.DISTINGUISHABLE, maxN, maxQ);
        for (int n = 1; n <= maxN; n++) {
            for (int q = 0; q <= maxQ; q++) {
                // Source: closed form Omega(N, q) = C(q + N - 1, q) (Schroeder, Sec. 2.2)
                assertEquals(binomial(q + n - 1, q), t.count(n, q), "N = " + n + ", q = " + q);
            }
        }
    }

    @Test
    void bosonsOnEquallySpacedLevelsArePartitions() {
        CountTable t = CountTable.of(Spectra.harmonicOscillator(1, 100), Statistics.BOSE, 100, 100);
        // Source: OEIS A000041 (partition numbers), p(0..20) and p(100) = 190569292
        long[] p = {1, 1, 2, 3, 5, 7, 11, 15, 22, 30, 42, 56, 77, 101, 135, 176, 231, 297, 385, 490, 627};
        for (int e = 0; e <= 20; e++) {
            assertEquals(BigInteger.valueOf(p[e]), t.count(100, e), "p(" + e + ")");
        }
        assertEquals(BigInteger.valueOf(190569292L), t.count(100, 100)); // Source: OEIS A000041, a(100)
        // Source: OEIS A008284 row 10: partitions of 10 into exactly k parts, k = 1..10
        long[] exactlyK = {1, 5, 8, 9, 7, 5, 3, 2, 1, 1};
        for (int k = 1; k <= 10; k++) {
            assertEquals(BigInteger.valueOf(exactlyK[k - 1]), t.count(k, 10).subtract(t.count(k - 1, 10)), "k = " + k);
        }
    }

    @Test
    void fermionsOnPositiveEquallySpacedLevelsAreDistinctPartitions() {
        double[] e = new double[100];
        for (int i = 0; i < e.length; i++) {
            e[i] = i + 1;
        }
        CountTable t = CountTable.of(Spectrum.ofEnergies(e), Statistics.FERMI, 20, 100);
        // Source: OEIS A000009 (partitions into distinct parts), a(0..20) and a(100) = 444793
        long[] q = {1, 1, 1, 2, 2, 3, 4, 5, 6, 8, 10, 12, 15, 18, 22, 27, 32, 38, 46, 54, 64};
        for (int s = 0; s <= 20; s++) {
            BigInteger sum = BigInteger.ZERO;
            for (int n = 0; n <= 20; n++) {
                sum = sum.add(t.count(n, s));
            }
            assertEquals(BigInteger.valueOf(q[s]), sum, "q(" + s + ")");
        }
        BigInteger sum = BigInteger.ZERO;
        for (int n = 0; n <= 20; n++) { // 1 + 2 + ... + 14 = 105 > 100: at most 13 distinct parts
            sum = sum.add(t.count(n, 100));
        }
        assertEquals(BigInteger.valueOf(444793L), sum); // Source: OEIS A000009, a(100)
    }

    @Test
    void totalsOverAllEnergiesAreTheCombinatorialClosedForms() {
        Random rnd = new Random(20261201L);
        for (int trial = 0; trial < 30; trial++) {
            int m = 1 + rnd.nextInt(6);
            List<Level> levels = new ArrayList<>();
            int states = 0;
            int top = 0;
            for (int l = 0; l < m; l++) {
                int g = 1 + rnd.nextInt(3);
                int en = l == 0 ? 0 : top + 1 + rnd.nextInt(3);
                top = en;
                states += g;
                levels.add(new Level(en, g));
            }
            Spectrum s = Spectrum.of(levels);
            int n = rnd.nextInt(6);
            int maxE = n * top;
            // Source: closed forms (common practice, no source): multisets C(M+N-1, N), subsets C(M, N), words M^N
            assertEquals(binomial(states + n - 1, n), CountTable.of(s, Statistics.BOSE, n, maxE).total(n));
            assertEquals(binomial(states, n), CountTable.of(s, Statistics.FERMI, n, maxE).total(n));
            assertEquals(BigInteger.valueOf(states).pow(n), CountTable.of(s, Statistics.DISTINGUISHABLE, n, maxE).total(n));
        }
    }

    @Test
    void closedShellsOfSpinHalfFermionsIn3dOscillator() {
        // Source: closed form: shell N holds (N+1)(N+2) spin-1/2 fermions; cumulative 2, 8, 20, 40, 70, 112
        // (harmonic-oscillator magic numbers of nuclear-structure textbooks; reference from memory)
        assertEquals(List.of(2, 8, 20, 40, 70, 112), closedShells(3, 6, 112, 430));
    }

    @Test
    void closedShellsOfSpinHalfFermionsIn2dOscillator() {
        // Source: closed form: 2D shell N holds 2(N+1) spin-1/2 fermions; cumulative 2, 6, 12, 20, 30, 42
        // (Fock-Darwin shell filling of circular quantum dots, e.g. Kouwenhoven et al., Rep. Prog. Phys. 64, 701 (2001))
        assertEquals(List.of(2, 6, 12, 20, 30, 42), closedShells(2, 7, 42, 140));
    }

    /** The particle numbers n <= maxN whose lowest energy is reached by exactly one microstate (a closed shell). */
    private static List<Integer> closedShells(int dimension, int cutoff, int maxN, int maxE) {
        Spectrum s = Spectra.harmonicOscillator(dimension, cutoff).withInternalMultiplicity(2);
        CountTable t = CountTable.of(s, Statistics.FERMI, maxN, maxE);
        List<Integer> closed = new ArrayList<>();
        for (int n = 1; n <= maxN; n++) {
            int e = 0;
            while (t.isZero(n, e)) {
                e++;
            }
            if (t.count(n, e).equals(BigInteger.ONE)) {
                closed.add(n);
            }
        }
        return closed;
    }

    @Test
    void gentileInterpolatesBetweenFermiAndBose() {
        Spectrum s = Spectra.harmonicOscillator(3, 12);
        int n = 9;
        int e = 30;
        CountTable fermi = CountTable.of(s, Statistics.FERMI, n, e);
        CountTable k1 = CountTable.of(s, Statistics.maxOccupancy(1), n, e);
        CountTable bose = CountTable.of(s, Statistics.BOSE, n, e);
        CountTable kN = CountTable.of(s, Statistics.maxOccupancy(n), n, e);
        CountTable kBig = CountTable.of(s, Statistics.maxOccupancy(n + 5), n, e);
        CountTable k2 = CountTable.of(s, Statistics.maxOccupancy(2), n, e);
        for (int m = 0; m <= n; m++) {
            for (int q = 0; q <= e; q++) {
                // Source: Gentile, Nuovo Cimento 17, 493 (1940): k = 1 is Fermi-Dirac, k >= N is Bose-Einstein
                assertEquals(fermi.count(m, q), k1.count(m, q));
                assertEquals(bose.count(m, q), kN.count(m, q));
                assertEquals(bose.count(m, q), kBig.count(m, q));
                assertTrue(k2.count(m, q).compareTo(fermi.count(m, q)) >= 0); // common practice, no source
                assertTrue(k2.count(m, q).compareTo(bose.count(m, q)) <= 0);
            }
        }
    }

    @Test
    void multiModularPathEqualsBigIntegerPath() {
        Random rnd = new Random(7L);
        Statistics[] all = {Statistics.BOSE, Statistics.FERMI, Statistics.DISTINGUISHABLE, Statistics.maxOccupancy(2),
            Statistics.maxOccupancy(3)};
        for (int trial = 0; trial < 60; trial++) {
            Spectrum s = trial % 2 == 0 ? Spectra.harmonicOscillator(1 + rnd.nextInt(3), 5 + rnd.nextInt(20))
                    : irregular(rnd);
            int[] en = s.integerEnergies();
            int[] g = s.degeneracies();
            Statistics st = all[trial % all.length];
            int maxN = 1 + rnd.nextInt(25);
            int maxE = rnd.nextInt(40);
            BigInteger[] ref = CountEngine.bigInteger(en, g, st, maxN, maxE, ProgressListener.NONE);
            int primes = CountBound.primesFor(CountBound.log2Bound(en, g, st, maxN, maxE));
            BigInteger[] mm = CountEngine.multiModular(en, g, st, maxN, maxE, Moduli.primes(primes), ProgressListener.NONE);
            // Source: independent arithmetic (exact BigInteger recursion) vs residues + Garner CRT
            assertEquals(java.util.Arrays.asList(ref), java.util.Arrays.asList(mm), "trial " + trial + " " + st);
            long[] small = Moduli.fmaPrimes(CountBound.fmaPrimesFor(CountBound.log2Bound(en, g, st, maxN, maxE)));
            BigInteger[] viaFma = CountEngine.multiModular(en, g, st, maxN, maxE, small, ProgressListener.NONE);
            // Source: independent arithmetic (exact BigInteger recursion) vs residues modulo 50-bit primes + Garner CRT
            assertEquals(java.util.Arrays.asList(ref), java.util.Arrays.asList(viaFma), "50-bit primes, trial " + trial);
            long p = small[small.length - 1];
            long[] one = CountEngine.residuesModulo(en, g, st, maxN, maxE, p);
            for (int i = 0; i < ref.length; i++) {
                // Source: independent arithmetic (exact BigInteger recursion, reduced mod p)
                assertEquals(ref[i].mod(BigInteger.valueOf(p)).longValueExact(), one[i], "per-prime residue " + i);
            }
            // Source: the proven saddle-point bound must dominate every exact entry (Flajolet-Sedgewick, Ch. VIII)
            double bound = CountBound.log2Bound(en, g, st, maxN, maxE);
            for (BigInteger v : ref) {
                assertTrue(v.bitLength() <= bound + 1, "bound " + bound + " vs " + v.bitLength());
            }
        }
    }

    /** Random levels: energies 1..30 (sometimes a level at 0), degeneracies 1..12. */
    static Spectrum irregular(Random rnd) {
        List<Level> levels = new ArrayList<>();
        int count = 1 + rnd.nextInt(12);
        for (int i = 0; i < count; i++) {
            levels.add(new Level(rnd.nextInt(4) == 0 ? 0 : 1 + rnd.nextInt(30), 1 + rnd.nextInt(12)));
        }
        return Spectrum.of(levels);
    }

    @Test
    void multiModularNeedsSeveralPrimesForLargeCounts() {
        Spectrum s = Spectra.harmonicOscillator(3, 100);
        int[] en = s.integerEnergies();
        int[] g = s.degeneracies();
        int primes = CountBound.primesFor(CountBound.log2Bound(en, g, Statistics.BOSE, 30, 100));
        assertTrue(primes >= 2, "primes = " + primes);
        BigInteger[] ref = CountEngine.bigInteger(en, g, Statistics.BOSE, 30, 100, ProgressListener.NONE);
        BigInteger[] mm = CountEngine.multiModular(en, g, Statistics.BOSE, 30, 100, Moduli.primes(primes),
                ProgressListener.NONE);
        // Source: independent arithmetic (exact BigInteger recursion)
        assertEquals(java.util.Arrays.asList(ref), java.util.Arrays.asList(mm));
        // precondition of this test, not a result check: the count must exceed one 61-bit prime
        assertTrue(ref[ref.length - 1].bitLength() > 61, "needs more than one prime");
        CountTable t = CountTable.of(s, Statistics.BOSE, 30, 100);
        // Source: independent arithmetic (exact BigInteger recursion, as above)
        assertEquals(ref[ref.length - 1], t.count(30, 100));
    }

    @Test
    void rowsRebuiltOnFirstReadMatchTheBigIntegerPathUnderConcurrentReads() throws Exception {
        Spectrum s = Spectra.harmonicOscillator(3, 100);
        int maxN = 30;
        int maxE = 100;
        int w = maxE + 1;
        BigInteger[] ref = CountEngine.bigInteger(s.integerEnergies(), s.degeneracies(), Statistics.BOSE, maxN, maxE,
                ProgressListener.NONE);
        CountTable t = CountTable.of(s, Statistics.BOSE, maxN, maxE);
        assertTrue(t.primesUsed() >= 2, "precondition: the multi-modular path, primes = " + t.primesUsed());
        int threads = 4;
        java.util.concurrent.ExecutorService pool = java.util.concurrent.Executors.newFixedThreadPool(threads);
        try {
            java.util.concurrent.CountDownLatch start = new java.util.concurrent.CountDownLatch(1);
            List<java.util.concurrent.Future<BigInteger[]>> seen = new ArrayList<>();
            for (int k = 0; k < threads; k++) {
                int offset = k;
                seen.add(pool.submit(() -> {
                    start.await();
                    BigInteger[] out = new BigInteger[ref.length];
                    for (int i = 0; i < ref.length; i++) {
                        int j = (i * 7 + offset * 131) % ref.length; // each thread its own order
                        out[j] = t.count(j / w, j % w);
                    }
                    return out;
                }));
            }
            start.countDown();
            for (java.util.concurrent.Future<BigInteger[]> f : seen) {
                // Source: independent arithmetic (exact BigInteger recursion) vs rows rebuilt by Garner CRT
                assertEquals(java.util.Arrays.asList(ref), java.util.Arrays.asList(f.get()));
            }
        } finally {
            pool.shutdownNow();
        }
        for (int n = 0; n <= maxN; n++) {
            BigInteger sum = BigInteger.ZERO;
            for (int e = 0; e <= maxE; e++) {
                sum = sum.add(ref[n * w + e]);
            }
            // Source: independent arithmetic (sum of the exact BigInteger row)
            assertEquals(sum, t.total(n), "total " + n);
            assertEquals(java.util.Arrays.asList(ref).subList(n * w, (n + 1) * w), t.row(n), "row " + n);
        }
    }

    @Test
    void lnCountWorksFarBeyondDoubleRange() {
        // 2000 distinguishable two-state particles with the upper level at 0 as well: Omega = 2^2000 * ...
        Spectrum two = Spectrum.of(new double[] {0}, new int[] {2});
        CountTable t = CountTable.of(two, Statistics.DISTINGUISHABLE, 5000, 0);
        // Source: closed form ln 2^5000 = 5000 ln 2
        assertEquals(5000 * Math.log(2), t.lnCount(5000, 0), 1e-12 * 5000);
        // Source: Commons Math Gamma.logGamma (Lanczos; independent of the BigInteger path): ln 3000! = lnGamma(3001)
        BigInteger f = BigInteger.ONE;
        for (int i = 2; i <= 3000; i++) {
            f = f.multiply(BigInteger.valueOf(i));
        }
        assertEquals(Gamma.logGamma(3001), ExactLog.ln(f), 1e-13 * Gamma.logGamma(3001));
    }

    @Test
    void probabilitiesAreExactFractionsSummingToOne() {
        CountTable t = CountTable.of(Spectra.harmonicOscillator(1, 8), Statistics.DISTINGUISHABLE, 3, 6);
        BigFraction sum = BigFraction.ZERO;
        for (int e = 0; e <= 6; e++) {
            sum = sum.add(t.probability(3, e));
        }
        // Source: normalisation, closed form
        assertEquals(BigFraction.ONE, sum);
        // Source: Schroeder Table 2.2 (Omega = 1, 3, ..., 28 sum to C(9, 3) = 84): P(q = 6) = 28/84
        assertEquals(new BigFraction(28, 84), t.probability(3, 6));
    }

    @Test
    void zeroCountHasNoLogarithm() {
        CountTable t = CountTable.of(Spectra.harmonicOscillator(3, 5), Statistics.FERMI, 4, 3);
        assertTrue(t.isZero(4, 2)); // 4 fermions need at least 3 quanta (1 + 3 states)
        InvalidInputException ex = assertThrows(InvalidInputException.class, () -> t.lnCount(4, 2));
        assertTrue(ex.getMessage().contains("Omega(4, 2)"), ex.getMessage());
        assertFalse(t.isZero(4, 3));
    }

    @Test
    void badInputIsRefusedWithTheValueNamed() {
        Spectrum s = Spectra.harmonicOscillator(1, 5);
        assertTrue(assertThrows(InvalidInputException.class, () -> CountTable.of(s, Statistics.BOSE, -1, 3))
                .getMessage().contains("-1"));
        assertTrue(assertThrows(InvalidInputException.class, () -> CountTable.of(s, Statistics.BOSE, 3, -7))
                .getMessage().contains("-7"));
        Spectrum real = Spectrum.ofEnergies(0, 1, 2.5, 4);
        NonIntegerEnergyException ne = assertThrows(NonIntegerEnergyException.class,
                () -> CountTable.of(real, Statistics.BOSE, 2, 4));
        assertEquals(2, ne.levelIndex());
        assertTrue(ne.getMessage().contains("2.5"), ne.getMessage());
        Spectrum negative = Spectrum.ofEnergies(-2, 0, 3);
        assertTrue(assertThrows(InvalidInputException.class, () -> CountTable.of(negative, Statistics.FERMI, 2, 4))
                .getMessage().contains("-2"));
        InvalidInputException big = assertThrows(InvalidInputException.class,
                () -> CountTable.of(s, Statistics.BOSE, 1_000_000, 1_000_000));
        assertTrue(big.getMessage().contains("MiB") && big.getMessage().contains("Lower N or E"), big.getMessage());
        CountTable t = CountTable.of(s, Statistics.BOSE, 2, 3);
        assertTrue(assertThrows(InvalidInputException.class, () -> t.count(3, 0)).getMessage().contains("3"));
    }

    @Test
    void cutoffCompletenessIsReported() {
        CountTable t = CountTable.of(Spectra.harmonicOscillator(1, 5), Statistics.BOSE, 3, 9);
        assertEquals(5, t.completeThroughEnergy());
        CountTable full = CountTable.of(Spectra.harmonicOscillator(1, 20), Statistics.BOSE, 3, 9);
        assertEquals(9, full.completeThroughEnergy());
        for (int e = 0; e <= 5; e++) {
            // common practice, no source: levels above the cutoff cannot take part in a total below it
            assertEquals(full.count(3, e), t.count(3, e));
        }
        // Source: OEIS A001399 (partitions into at most 3 parts): a(9) = 12; the truncated spectrum misses some
        assertEquals(BigInteger.valueOf(12), full.count(3, 9));
        assertTrue(t.count(3, 9).compareTo(BigInteger.valueOf(12)) < 0);
    }

    @Test
    void progressIsReportedInOrderAndThrottled() {
        List<long[]> calls = new ArrayList<>();
        CountTable t = CountTable.of(Spectra.harmonicOscillator(3, 80), Statistics.BOSE, 30, 80,
                (done, total, stage) -> calls.add(new long[] {done, total}));
        assertTrue(t.primesUsed() >= 1, "multi-modular path expected");
        assertTrue(calls.size() >= 2 && calls.size() <= 210, "calls: " + calls.size());
        for (int i = 1; i < calls.size(); i++) {
            assertTrue(calls.get(i)[0] > calls.get(i - 1)[0]);
        }
        long[] last = calls.get(calls.size() - 1);
        assertEquals(last[1], last[0]);
        // Source: independent BigInteger recursion (reference path) for the same table
        BigInteger[] ref = CountEngine.bigInteger(Spectra.harmonicOscillator(3, 80).integerEnergies(),
                Spectra.harmonicOscillator(3, 80).degeneracies(), Statistics.BOSE, 30, 80, ProgressListener.NONE);
        assertEquals(ref[ref.length - 1], t.count(30, 80));
    }

    @Test
    void levelsAboveTheTableLeaveOnlyTheEmptyState() {
        Spectrum high = Spectrum.ofEnergies(5, 7);
        for (Statistics st : new Statistics[] {Statistics.BOSE, Statistics.FERMI, Statistics.DISTINGUISHABLE}) {
            for (int n = 0; n <= 2; n++) {
                CountTable t = CountTable.of(high, st, n, 3);
                for (int m = 0; m <= n; m++) {
                    for (int e = 0; e <= 3; e++) {
                        // common practice, no source: no particle fits below the lowest level at 5
                        assertEquals(m == 0 && e == 0 ? BigInteger.ONE : BigInteger.ZERO, t.count(m, e));
                    }
                }
            }
        }
    }

    @Test
    void rowsListEveryEntry() {
        CountTable t = CountTable.of(Spectra.harmonicOscillator(1, 4), Statistics.BOSE, 2, 3);
        assertEquals(List.of("n", "E", "Omega"), t.columnNames());
        assertEquals(12, t.rows().size());
        // common practice, no source: 2 bosons with 3 quanta on 0,1,2,3,4 are {3,0} and {2,1}
        assertEquals(List.of(2, 3, BigInteger.valueOf(2)), t.rows().get(11));
    }
}
