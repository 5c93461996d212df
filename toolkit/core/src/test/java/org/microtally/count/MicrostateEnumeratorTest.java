package org.microtally.count;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.math.BigInteger;
import java.util.List;
import java.util.stream.Collectors;
import org.junit.jupiter.api.Test;
import org.microtally.InvalidInputException;
import org.microtally.spectrum.Spectra;
import org.microtally.spectrum.Spectrum;
import org.microtally.spectrum.Statistics;

class MicrostateEnumeratorTest {

    @Test
    void threeOscillatorsWithTwoQuantaAreTheSixTextbookStates() {
        MicrostateEnumerator en = MicrostateEnumerator.of(Spectra.harmonicOscillator(1, 5), Statistics.DISTINGUISHABLE);
        List<int[]> states = en.microstates(3, 2).collect(Collectors.toList());
        // Source: Schroeder, An Introduction to Thermal Physics, Table 2.2 lists the 6 microstates of 3 oscillators, q = 2
        assertEquals(6, states.size());
        for (int[] a : states) {
            assertEquals(3, a.length);
            assertEquals(2, a[0] + a[1] + a[2]); // state index = quanta on a 1D oscillator
        }
    }

    @Test
    void fermionOccupationsAreSubsets() {
        Spectrum s = Spectrum.of(new double[] {0, 1}, new int[] {2, 2});
        List<int[]> states = MicrostateEnumerator.of(s, Statistics.FERMI).microstates(2, 1).collect(Collectors.toList());
        // Source: closed form (common practice, no source): one particle in each of the 2 lower states x 2 upper = 4
        assertEquals(4, states.size());
        for (int[] v : states) {
            assertEquals(4, v.length);
            assertEquals(1, v[0] + v[1]);
            assertEquals(1, v[2] + v[3]);
        }
        assertArrayEquals(new int[] {0, 0, 1, 1}, MicrostateEnumerator.of(s, Statistics.FERMI).stateLevels(1));
    }

    @Test
    void enumerationIsLazy() {
        MicrostateEnumerator en = MicrostateEnumerator.of(Spectra.harmonicOscillator(3, 40), Statistics.BOSE)
                .withCap(Long.MAX_VALUE);
        // billions of microstates exist; taking three must return at once
        // common practice, no source: limit(3) of a stream with at least 3 elements has 3 elements
        assertEquals(3, en.microstates(30, 40).limit(3).count());
        // Source: independent brute force: the generating function prod_s 1/(1 - z x^{e_s}) multiplied in one
        // single-particle state s at a time, over all C(43, 3) = 12341 states of the 3D oscillator up to 40 quanta
        long[][] c = new long[31][41];
        c[0][0] = 1;
        for (int level = 0; level <= 40; level++) {
            for (int state = 0; state < (level + 1) * (level + 2) / 2; state++) {
                for (int n = 1; n <= 30; n++) {
                    for (int e = level; e <= 40; e++) {
                        c[n][e] = Math.addExact(c[n][e], c[n - 1][e - level]);
                    }
                }
            }
        }
        assertEquals(BigInteger.valueOf(c[30][40]), en.microstateCount(30, 40));
        assertTrue(c[30][40] > 1L << 33, "billions: " + c[30][40]);
    }

    @Test
    void capIsEnforcedWithTheExactNumberInTheMessage() {
        MicrostateEnumerator en = MicrostateEnumerator.of(Spectra.harmonicOscillator(1, 60), Statistics.DISTINGUISHABLE);
        // Source: Einstein solid closed form C(q + N - 1, q) = C(59, 50) = 12565671261 microstates for N = 10, q = 50
        InvalidInputException ex = assertThrows(InvalidInputException.class, () -> en.microstates(10, 50));
        assertTrue(ex.getMessage().contains("12565671261"), ex.getMessage());
        assertTrue(ex.getMessage().contains("withCap"), ex.getMessage());
        assertEquals(10_000_000L, en.cap());
        InvalidInputException small = assertThrows(InvalidInputException.class,
                () -> en.withCap(5).microstates(3, 3)); // C(5, 3) = 10 > 5
        assertTrue(small.getMessage().contains("10"), small.getMessage());
        assertThrows(InvalidInputException.class, () -> en.withCap(0));
        assertThrows(InvalidInputException.class, () -> en.microstates(-1, 2));
    }
}
