package org.microtally.count;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.math.BigInteger;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import org.junit.jupiter.api.Test;
import org.microtally.InvalidInputException;
import org.microtally.spectrum.Level;
import org.microtally.spectrum.Spectra;
import org.microtally.spectrum.Spectrum;
import org.microtally.spectrum.Statistics;
import org.microtally.exact.Combinatorics;

class SingleNumberCountsTest {

    @Test
    void randomSpectraAgreeWithTheFullTable() {
        Random rnd = new Random(4242L);
        for (int trial = 0; trial < 20; trial++) {
            Spectrum s = randomLadder(rnd, 3, 2, 4, 3, 3);
            int n = 1 + rnd.nextInt(7);
            // Source: the full exact table (CountTable, an independent level-by-level recursion)
            assertRowMatchesFullTable(s, Statistics.DISTINGUISHABLE, n, 25);
        }
    }

    /**
     * Levels at integer energies from {@code [0, firstBelow)} upwards with gaps in {@code [1, maxGap]},
     * {@code minLevels + [0, moreLevels)} of them (the bound is redrawn each step, as the loop condition
     * always did), degeneracies in {@code [1, maxDegeneracy]}.
     */
    private static Spectrum randomLadder(Random rnd, int firstBelow, int minLevels, int moreLevels, int maxDegeneracy,
                                         int maxGap) {
        List<Level> levels = new ArrayList<>();
        int e = rnd.nextInt(firstBelow);
        for (int i = 0; i < minLevels + rnd.nextInt(moreLevels); i++) {
            levels.add(new Level(e, 1 + rnd.nextInt(maxDegeneracy)));
            e += 1 + rnd.nextInt(maxGap);
        }
        return Spectrum.of(levels);
    }

    /** The single-N row of {@code n} particles against row n of the full table, every e in [0, maxE]. */
    private static void assertRowMatchesFullTable(Spectrum s, Statistics st, int n, int maxE) {
        SingleNumberCounts single = SingleNumberCounts.of(s, st, n, maxE);
        CountTable full = CountTable.of(s, st, n, maxE);
        for (int k = 0; k <= maxE; k++) {
            assertEquals(full.count(n, k), single.count(k), st + " " + s.levels() + " n=" + n + " e=" + k);
        }
    }

    @Test
    void indistinguishableRowsAgreeWithTheFullTable() {
        Random rnd = new Random(777L);
        for (Statistics st : List.of(Statistics.BOSE, Statistics.FERMI, Statistics.maxOccupancy(3))) {
            for (int trial = 0; trial < 6; trial++) {
                Spectrum s = randomLadder(rnd, 2, 3, 5, 4, 2);
                int n = 1 + rnd.nextInt(9);
                // Source: the full exact table (CountTable: 61-bit primes in parallel or plain BigInteger)
                assertRowMatchesFullTable(s, st, n, 40);
            }
        }
        // large counts need several primes: 30 bosons on a 3D oscillator, against the full table
        Spectrum osc = Spectra.harmonicOscillator(3, 30);
        SingleNumberCounts big = SingleNumberCounts.of(osc, Statistics.BOSE, 30, 60);
        // Source: the full exact table (CountTable)
        assertEquals(CountTable.of(osc, Statistics.BOSE, 30, 60).count(30, 60), big.count(60));
        assertTrue(big.count(60).bitLength() > 60);
    }

    @Test
    void spinOneBosonsFollowTheClosedForm() {
        int n = 400;
        SingleNumberCounts t = SingleNumberCounts.of(Spectrum.ofEnergies(0, 1, 2), Statistics.BOSE, n, 2 * n);
        for (int e = 0; e <= 2 * n; e += 37) {
            // Source: closed form, (n0, n1, n2) with n0 + n1 + n2 = N and n1 + 2 n2 = e:
            // floor(e/2) - max(0, e - N) + 1 choices of n2 (common practice, no source)
            long expected = e / 2 - Math.max(0, e - n) + 1;
            assertEquals(BigInteger.valueOf(expected), t.count(e), "e=" + e);
        }
    }

    @Test
    void thousandSpinOneMomentsGiveTheTrinomialCoefficients() {
        int n = 1000;
        SingleNumberCounts t = SingleNumberCounts.of(Spectrum.ofEnergies(0, 1, 2), Statistics.DISTINGUISHABLE, n, 2 * n);
        // Source: OEIS A027907, central trinomial coefficient a(n) = sum_k C(n, 2k) C(2k, k) (OEIS A002426 formula)
        BigInteger central = BigInteger.ZERO;
        for (int k = 0; 2 * k <= n; k++) {
            central = central.add(Combinatorics.binomial(n, 2L * k).multiply(Combinatorics.binomial(2L * k, k)));
        }
        assertEquals(central, t.count(n));
        // Source: OEIS A002426, first terms 1, 1, 3, 7, 19, 51, 141
        long[] a2426 = {1, 1, 3, 7, 19, 51, 141};
        for (int m = 1; m < a2426.length; m++) {
            assertEquals(BigInteger.valueOf(a2426[m]),
                    SingleNumberCounts.of(Spectrum.ofEnergies(0, 1, 2), Statistics.DISTINGUISHABLE, m, 2 * m).count(m));
        }
        // Source: closed form sum_e Omega = 3^N
        BigInteger sum = BigInteger.ZERO;
        for (BigInteger c : t.row()) {
            sum = sum.add(c);
        }
        assertEquals(BigInteger.valueOf(3).pow(n), sum);
    }

    @Test
    void bigEinsteinSolidsMatchTheClosedFormAndShareEnergy() {
        int q = 800;
        SingleNumberCounts a = SingleNumberCounts.of(Spectra.harmonicOscillator(1, q), Statistics.DISTINGUISHABLE, 3000, q);
        List<BigInteger> closed = ClosedFormBlocks.einsteinSolid(3000, q);
        for (int k = 0; k <= q; k += 37) {
            // Source: Einstein solid Omega = C(q + N - 1, q) (Schroeder, Thermal Physics, eq. 2.9)
            assertEquals(Combinatorics.binomial(k + 2999L, k), a.count(k), "q=" + k);
            assertEquals(Combinatorics.binomial(k + 2999L, k), closed.get(k));
        }
        SharedTotal split = SharedTotal.of(closed, ClosedFormBlocks.einsteinSolid(1000, q), q);
        // Source: Vandermonde's identity, sum_qa C(qa+N_A-1, qa) C(q-qa+N_B-1, q-qa) = C(q+N_A+N_B-1, q)
        assertEquals(Combinatorics.binomial(q + 3999L, q), split.totalCount());
        // Source: the most probable split is at q N_A / (N_A + N_B) = 600 to within one quantum (equal temperatures)
        assertEquals(600, split.mostProbableSplit(), 1);
    }

    @Test
    void twoStateBlocksAreBinomial() {
        List<BigInteger> b = ClosedFormBlocks.twoState(10, 12);
        for (int k = 0; k <= 10; k++) {
            // Source: OEIS A007318 (Pascal's triangle), row 10
            assertEquals(Combinatorics.binomial(10, k), b.get(k));
        }
        assertEquals(BigInteger.ZERO, b.get(11));
        assertEquals(BigInteger.ZERO, b.get(12));
    }

    @Test
    void refusesWhatItDoesNotCover() {
        assertThrows(InvalidInputException.class,
                () -> SingleNumberCounts.of(Spectrum.ofEnergies(0, 0.5), Statistics.DISTINGUISHABLE, 3, 3));
        assertThrows(InvalidInputException.class, () -> ClosedFormBlocks.einsteinSolid(0, 3));
        SingleNumberCounts s = SingleNumberCounts.of(Spectrum.ofEnergies(2, 3), Statistics.DISTINGUISHABLE, 3, 8);
        // Source: closed form, 3 labelled particles on levels 2 and 3: Omega(6) = 1, Omega(7) = 3, below 6 none
        assertEquals(BigInteger.ZERO, s.count(5));
        assertEquals(BigInteger.ONE, s.count(6));
        assertEquals(BigInteger.valueOf(3), s.count(7));
        assertThrows(InvalidInputException.class, () -> s.lnCount(5));
    }
}
