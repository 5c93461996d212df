package org.microtally.count;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.math.BigInteger;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.microtally.InvalidInputException;
import org.microtally.spectrum.ShellOrbits;
import org.microtally.spectrum.Spectrum;
import org.microtally.units.EnergyScale;
import org.microtally.exact.Combinatorics;

class ShellDimensionsTest {
    private static final EnergyScale MEV = EnergyScale.abstractUnit("MeV");
    private static final ShellOrbits SD = ShellOrbits.sdShell(MEV, -3.9, -3.2, 1.6);

    private static ShellOrbits single(int l, int twoJ) {
        return ShellOrbits.builder(MEV).orbit(0, l, twoJ, 0.0).build();
    }

    /** Independent brute force: every subset of k m-states (bit masks), tallied by total 2M. */
    private static Map<Integer, Long> bruteForce(Spectrum s, int k) {
        int states = s.size();
        Map<Integer, Long> byTwoM = new HashMap<>();
        for (int mask = 0; mask < (1 << states); mask++) {
            if (Integer.bitCount(mask) != k) {
                continue;
            }
            int twoM = 0;
            for (int i = 0; i < states; i++) {
                if ((mask >> i & 1) == 1) {
                    twoM += s.label(i);
                }
            }
            byTwoM.merge(twoM, 1L, Long::sum);
        }
        return byTwoM;
    }

    @Test
    void twoIdenticalNucleonsInOneOrbitCoupleToEvenJOnly() {
        for (int twoJ : new int[] {3, 5, 7, 9}) {
            ShellDimensions d = ShellDimensions.identical(single((twoJ + 1) / 2, twoJ), 2);
            for (int tj = 0; tj <= 2 * twoJ; tj += 2) {
                // Source: two identical fermions in one j shell: J = 0, 2, ..., 2j - 1, once each
                // (de-Shalit & Talmi, Nuclear Shell Theory; from memory)
                int expected = tj / 2 % 2 == 0 && tj / 2 <= twoJ - 1 ? 1 : 0;
                assertEquals(BigInteger.valueOf(expected), d.jProjected(tj), "2j=" + twoJ + " 2J=" + tj);
            }
        }
    }

    @Test
    void threeAndFourNucleonsInOneOrbitGiveTheTabulatedMultiplets() {
        ShellDimensions d52 = ShellDimensions.identical(single(2, 5), 3);
        // Source: (5/2)^3 has J = 3/2, 5/2, 9/2 (de-Shalit & Talmi; from memory)
        for (int tj = 1; tj <= 15; tj += 2) {
            int expected = tj == 3 || tj == 5 || tj == 9 ? 1 : 0;
            assertEquals(BigInteger.valueOf(expected), d52.jProjected(tj), "2J=" + tj);
        }
        ShellDimensions d72 = ShellDimensions.identical(single(3, 7), 4);
        // Source: (7/2)^4 has J = 0, 2, 2, 4, 4, 5, 6, 8 (seniority 0, 2, 4; de-Shalit & Talmi; from memory)
        int[] expected = {1, 0, 2, 0, 2, 1, 1, 0, 1};
        for (int j = 0; j <= 8; j++) {
            assertEquals(BigInteger.valueOf(expected[j]), d72.jProjected(2 * j), "J=" + j);
        }
        // Source: closed form sum_J (2J+1) D(J) = C(8, 4) = 70 Slater determinants
        assertEquals(Combinatorics.binomial(8, 4), d72.totalDimension());
    }

    @Test
    void sdShellMSchemeDimensionsOfNeonMagnesiumSilicon() {
        // Source: sd-shell M = 0 dimensions 640 (20Ne), 28503 (24Mg), 93710 (28Si), from memory; confirmed
        // here by the brute-force enumeration below for 20Ne
        assertEquals(BigInteger.valueOf(640), ShellDimensions.of(SD, 2, SD, 2).mScheme(0));
        assertEquals(BigInteger.valueOf(28503), ShellDimensions.of(SD, 4, SD, 4).mScheme(0));
        assertEquals(BigInteger.valueOf(93710), ShellDimensions.of(SD, 6, SD, 6).mScheme(0));
        Map<Integer, Long> p = bruteForce(SD.spectrum(), 2);
        ShellDimensions ne = ShellDimensions.of(SD, 2, SD, 2);
        for (int twoM = -16; twoM <= 16; twoM += 2) {
            long sum = 0;
            for (Map.Entry<Integer, Long> e : p.entrySet()) {
                sum += e.getValue() * p.getOrDefault(twoM - e.getKey(), 0L);
            }
            // Source: independent brute force over all pairs of proton and neutron m-states
            assertEquals(BigInteger.valueOf(sum), ne.mScheme(twoM), "2M=" + twoM);
        }
        // Source: common practice, no source (basis dimensions do not depend on the single-particle
        // energies; with all three orbits degenerate their m-states merge into degenerate levels)
        ShellOrbits flat = ShellOrbits.sdShell(MEV, 0, 0, 0);
        assertEquals(BigInteger.valueOf(640), ShellDimensions.of(flat, 2, flat, 2).mScheme(0));
        assertEquals(ne.jProjected(4), ShellDimensions.of(flat, 2, flat, 2).jProjected(4));
        // Source: closed form, total Slater determinants C(12, 2)^2 = 4356
        assertEquals(BigInteger.valueOf(66L * 66), ne.totalDimension());
        BigInteger weighted = BigInteger.ZERO;
        for (List<Object> row : ne.rows()) {
            int tj = (Integer) row.get(0);
            weighted = weighted.add(((BigInteger) row.get(3)).multiply(BigInteger.valueOf(tj + 1)));
        }
        // Source: common practice, no source (each J multiplet holds 2J + 1 M-states)
        assertEquals(ne.totalDimension(), weighted);
    }

    @Test
    void oddNucleusHasHalfIntegerJ() {
        ShellDimensions f19 = ShellDimensions.of(SD, 1, SD, 2);
        Map<Integer, Long> n = bruteForce(SD.spectrum(), 2);
        Map<Integer, Long> p = bruteForce(SD.spectrum(), 1);
        long m12 = 0;
        for (Map.Entry<Integer, Long> e : p.entrySet()) {
            m12 += e.getValue() * n.getOrDefault(1 - e.getKey(), 0L);
        }
        // Source: independent brute force over one proton and two neutron m-states
        assertEquals(BigInteger.valueOf(m12), f19.mScheme(1));
        assertEquals(BigInteger.ZERO, f19.mScheme(0));
        assertThrows(InvalidInputException.class, () -> f19.jProjected(2));
    }

    @Test
    void badOrbitsAndNumbersAreRefused() {
        assertThrows(InvalidInputException.class, () -> ShellOrbits.builder(MEV).orbit(0, 2, 7, 0.0));
        assertThrows(InvalidInputException.class, () -> ShellOrbits.builder(MEV).orbit(0, 0, 1, 0).orbit(0, 0, 1, 1));
        assertThrows(InvalidInputException.class, () -> ShellOrbits.builder(MEV).build());
        assertThrows(InvalidInputException.class, () -> ShellDimensions.of(SD, 13, SD, 0));
        assertThrows(InvalidInputException.class, () -> ShellDimensions.of(SD, 0, SD, 0));
        assertEquals("0d5/2", SD.orbits().get(0).name());
        assertEquals(12, SD.stateCount());
    }
}
