package org.microtally.ensemble;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.math.BigInteger;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import org.apache.commons.math3.fraction.BigFraction;
import org.junit.jupiter.api.Test;
import org.microtally.InvalidInputException;
import org.microtally.exact.Combinatorics;
import org.microtally.count.CountTable;
import org.microtally.count.MicrostateEnumerator;
import org.microtally.spectrum.Level;
import org.microtally.spectrum.Spectra;
import org.microtally.spectrum.Spectrum;
import org.microtally.spectrum.Statistics;

class MicrocanonicalLevelNumberTest {

    @Test
    void everyLevelOfRandomSpectraAgreesWithListedMicrostates() {
        Random rnd = new Random(91L);
        for (Statistics st : List.of(Statistics.BOSE, Statistics.FERMI, Statistics.maxOccupancy(2),
                Statistics.DISTINGUISHABLE)) {
            for (int trial = 0; trial < 5; trial++) {
                List<Level> levels = new ArrayList<>();
                int e = 0;
                for (int i = 0; i < 4; i++) {
                    levels.add(new Level(e, 1 + rnd.nextInt(3)));
                    e += 1 + rnd.nextInt(2);
                }
                Spectrum s = Spectrum.of(levels);
                int n = 2 + rnd.nextInt(3);
                int total = 2 + rnd.nextInt(6);
                MicrostateEnumerator en = MicrostateEnumerator.of(s, st);
                if (en.microstateCount(n, total).signum() == 0) {
                    continue;
                }
                int[] levelOf = en.stateLevels(total);
                for (int l = 0; l < s.size(); l++) {
                    long[] tally = new long[n + 1];
                    final int level = l;
                    // Source: independent brute force, every microstate listed (MicrostateEnumerator)
                    en.microstates(n, total).forEach(m -> {
                        int inLevel = 0;
                        if (st.indistinguishable()) {
                            for (int k = 0; k < m.length; k++) {
                                inLevel += levelOf[k] == level ? m[k] : 0;
                            }
                        } else {
                            for (int state : m) {
                                inLevel += levelOf[state] == level ? 1 : 0;
                            }
                        }
                        tally[inLevel]++;
                    });
                    MicrocanonicalLevelNumber d = MicrocanonicalLevelNumber.of(s, st, n, total, l);
                    for (int j = 0; j <= n; j++) {
                        assertEquals(BigInteger.valueOf(tally[j]), d.count(j), st + " " + levels + " n=" + n
                                + " E=" + total + " level " + l + " j=" + j);
                    }
                    // Source: exact count table of the whole spectrum (CountTable), Omega(N, E) = sum_j
                    assertEquals(CountTable.of(s, st, n, total).count(n, total), d.totalCount());
                }
            }
        }
    }

    @Test
    void groupsOfLevelsAgreeWithListedMicrostates() {
        Spectrum s = Spectrum.of(List.of(new Level(0, 2), new Level(1, 1), new Level(2, 3), new Level(4, 2)));
        for (Statistics st : List.of(Statistics.BOSE, Statistics.FERMI, Statistics.maxOccupancy(2),
                Statistics.DISTINGUISHABLE)) {
            int n = 4;
            int total = 6;
            MicrostateEnumerator en = MicrostateEnumerator.of(s, st);
            int[] levelOf = en.stateLevels(total);
            long[] tally = new long[n + 1];
            // Source: independent brute force, every microstate listed (MicrostateEnumerator); group = levels 0 and 2
            en.microstates(n, total).forEach(m -> {
                int in = 0;
                if (st.indistinguishable()) {
                    for (int k = 0; k < m.length; k++) {
                        in += levelOf[k] == 0 || levelOf[k] == 2 ? m[k] : 0;
                    }
                } else {
                    for (int state : m) {
                        in += levelOf[state] == 0 || levelOf[state] == 2 ? 1 : 0;
                    }
                }
                tally[in]++;
            });
            MicrocanonicalLevelNumber d = MicrocanonicalLevelNumber.ofLevels(s, st, n, total, 0, 2);
            for (int j = 0; j <= n; j++) {
                assertEquals(BigInteger.valueOf(tally[j]), d.count(j), st + " j=" + j);
            }
        }
        assertThrows(InvalidInputException.class, () -> MicrocanonicalLevelNumber.ofLevels(s, Statistics.BOSE, 2, 2, 1, 1));
        assertThrows(InvalidInputException.class, () -> MicrocanonicalLevelNumber.ofLevels(s, Statistics.BOSE, 2, 2));
    }

    /** p(n, k), partitions of n into exactly k parts, by the recurrence given in OEIS A008284. */
    private static BigInteger[][] partitionsIntoParts(int max) {
        BigInteger[][] p = new BigInteger[max + 1][max + 1];
        for (BigInteger[] row : p) {
            java.util.Arrays.fill(row, BigInteger.ZERO);
        }
        p[0][0] = BigInteger.ONE;
        for (int n = 1; n <= max; n++) {
            for (int k = 1; k <= n; k++) {
                p[n][k] = p[n - 1][k - 1].add(p[n - k][k]);
            }
        }
        return p;
    }

    @Test
    void bosonsInAOneDimensionalTrapFollowThePartitionCounts() {
        int e = 20;
        int n = 25;
        BigInteger[][] p = partitionsIntoParts(e);
        // Source: OEIS A008284, T(10, 3) = 8 (checks the recurrence used below)
        assertEquals(BigInteger.valueOf(8), partitionsIntoParts(10)[10][3]);
        MicrocanonicalLevelNumber d = MicrocanonicalLevelNumber.groundLevel(Spectra.harmonicOscillator(1, 30),
                Statistics.BOSE, n, e);
        // Source: OEIS A000041, p(20) = 627: with N >= E every partition of E is one microstate
        assertEquals(BigInteger.valueOf(627), d.totalCount());
        for (int k = 0; k <= e; k++) {
            // Source: OEIS A008284: N - N_0 excited particles form a partition of E into exactly that many parts
            assertEquals(p[e][k], d.count(n - k), "k=" + k);
        }
    }

    @Test
    void labelledOscillatorsFollowStarsAndBars() {
        int n = 12;
        int e = 15;
        MicrocanonicalLevelNumber d = MicrocanonicalLevelNumber.groundLevel(Spectra.harmonicOscillator(1, 20),
                Statistics.DISTINGUISHABLE, n, e);
        // Source: Einstein solid Omega = C(q + N - 1, q) (Schroeder, Thermal Physics, eq. 2.9)
        assertEquals(Combinatorics.binomial(e + n - 1, e), d.totalCount());
        for (int j = 0; j < n; j++) {
            // Source: closed form C(N, j) C(E - 1, N - j - 1): choose the j oscillators in the ground
            // state, compose E into N - j positive parts (stars and bars; common practice, no source)
            assertEquals(Combinatorics.binomial(n, j).multiply(Combinatorics.binomial(e - 1, n - j - 1)), d.count(j));
        }
        assertEquals(BigInteger.ZERO, d.count(n));
        // Source: common practice, no source (Var = <j^2> - <j>^2 from the same exact counts)
        BigFraction m2 = BigFraction.ZERO;
        for (int j = 0; j <= n; j++) {
            m2 = m2.add(d.probability(j).multiply(j * j));
        }
        assertEquals(m2.subtract(d.exactMean().multiply(d.exactMean())), d.exactVariance());
    }

    @Test
    void microcanonicalCondensateFluctuatesLessThanCanonicalAndGrandCanonical() {
        int n = 150;
        int e = 150;
        Spectrum trap = Spectra.harmonicOscillator(1, 400);
        MicrocanonicalLevelNumber mc = MicrocanonicalLevelNumber.groundLevel(trap, Statistics.BOSE, n, e);
        double lo = 1;
        double hi = 100;
        for (int it = 0; it < 40; it++) {
            double mid = 0.5 * (lo + hi);
            if (Canonical.of(trap, Statistics.BOSE, n, mid).energy() < e) {
                lo = mid;
            } else {
                hi = mid;
            }
        }
        Canonical c = Canonical.of(trap, Statistics.BOSE, n, lo);
        GrandCanonical g = GrandCanonical.ofMeanNumber(trap, Statistics.BOSE, lo, n);
        // Source: Politzer, PRA 54, 5048 (1996); Wilkens & Weiss, J. Mod. Opt. 44, 1801 (1997):
        // at equal mean energy, Var N_0 (microcanonical) < Var N_0 (canonical) < grand canonical n0(n0+1)
        assertTrue(mc.variance() < c.condensate().variance(), mc.variance() + " vs " + c.condensate().variance());
        assertTrue(c.condensate().variance() < g.groundLevelVariance());
        // Source: the same papers: the mean condensate numbers of the two closed ensembles nearly agree
        assertEquals(c.condensate().mean(), mc.mean(), 0.05 * c.condensate().mean());
        assertEquals(mc.mean(), mc.distribution().mean(), 1e-9 * mc.mean());
    }

    @Test
    void refusesWhatItCannotAnswerExactly() {
        Spectrum cut = Spectra.harmonicOscillator(1, 10);
        InvalidInputException ex = assertThrows(InvalidInputException.class,
                () -> MicrocanonicalLevelNumber.groundLevel(cut, Statistics.BOSE, 5, 11));
        assertTrue(ex.getMessage().contains("cutoff"), ex.getMessage());
        assertThrows(InvalidInputException.class, () -> MicrocanonicalLevelNumber.of(cut, Statistics.BOSE, 5, 4, 11));
        assertThrows(InvalidInputException.class, () -> MicrocanonicalLevelNumber.groundLevel(cut, Statistics.BOSE, 0, 4));
        // three fermions on a non-degenerate ladder have at least 0 + 1 + 2 = 3 quanta
        assertThrows(InvalidInputException.class, () -> MicrocanonicalLevelNumber.groundLevel(cut, Statistics.FERMI, 3, 2));
        assertThrows(InvalidInputException.class, () -> MicrocanonicalLevelNumber.groundLevel(
                Spectrum.ofEnergies(0, 0.5), Statistics.BOSE, 2, 1));
    }
}
