package org.microtally.spectrum;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.HashMap;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.microtally.InvalidInputException;

class SpectraTest {

    static Map<Integer, Integer> degeneracyMap(Spectrum s) {
        Map<Integer, Integer> m = new HashMap<>();
        for (Level l : s.levels()) {
            m.merge((int) l.energy(), l.degeneracy(), Integer::sum);
        }
        return m;
    }

    @Test
    void isotropic3dOscillatorShellDegeneracies() {
        Spectrum s = Spectra.harmonicOscillator(3, 30);
        assertEquals(31, s.size());
        for (int n = 0; n <= 30; n++) {
            // Source: closed form (n+1)(n+2)/2 (e.g. Sakurai, Modern Quantum Mechanics, 3D isotropic oscillator)
            assertEquals((n + 1) * (n + 2) / 2, s.degeneracy(n));
            assertEquals(n, s.energy(n));
        }
        Spectrum two = Spectra.harmonicOscillator(2, 10);
        for (int n = 0; n <= 10; n++) {
            assertEquals(n + 1, two.degeneracy(n)); // Source: closed form n + 1 for the 2D isotropic oscillator
        }
        assertEquals(30.0, s.cutoffEnergy());
        assertTrue(s.isTruncated());
        assertTrue(s.cutoffNote().contains("30"));
    }

    @Test
    void anisotropicOscillatorDegeneraciesMatchTupleEnumeration() {
        int[][] ratioSets = {{4, 4, 1}, {1, 2, 3}, {2, 1}, {3}, {1, 1, 5}};
        int cut = 40;
        for (int[] r : ratioSets) {
            Map<Integer, Integer> brute = new HashMap<>();
            // Source: independent brute force over all quantum-number tuples (n_1, ..., n_d)
            int d = r.length;
            int[] n = new int[d];
            while (true) {
                int e = 0;
                for (int i = 0; i < d; i++) {
                    e += r[i] * n[i];
                }
                if (e <= cut) {
                    brute.merge(e, 1, Integer::sum);
                }
                int i = 0;
                while (i < d && ++n[i] > cut) {
                    n[i] = 0;
                    i++;
                }
                if (i == d) {
                    break;
                }
            }
            assertEquals(brute, degeneracyMap(Spectra.harmonicOscillator(r, cut)), java.util.Arrays.toString(r));
        }
    }

    @Test
    void cubicBoxDegeneracies() {
        Spectrum box = Spectra.particleInBox(3, 30);
        Map<Integer, Integer> g = degeneracyMap(box);
        // Source: the textbook table of cubic-box levels n_x^2 + n_y^2 + n_z^2 (values from memory, e.g. as in
        // Griffiths, Introduction to Quantum Mechanics): 3 -> 1, 6 -> 3, 9 -> 3, 11 -> 3, 12 -> 1, 14 -> 6
        assertEquals(1, g.get(3));
        assertEquals(3, g.get(6));
        assertEquals(3, g.get(9));
        assertEquals(3, g.get(11));
        assertEquals(1, g.get(12));
        assertEquals(6, g.get(14));
        assertFalse(g.containsKey(4)); // no representation as a sum of three positive squares
        // Source: independent brute force over (n_x, n_y, n_z)
        Map<Integer, Integer> brute = new HashMap<>();
        for (int a = 1; a <= 6; a++) {
            for (int b = 1; b <= 6; b++) {
                for (int c = 1; c <= 6; c++) {
                    int s = a * a + b * b + c * c;
                    if (s <= 30) {
                        brute.merge(s, 1, Integer::sum);
                    }
                }
            }
        }
        assertEquals(brute, g);
        // Source: 1D box levels n^2, non-degenerate (closed form)
        Spectrum line = Spectra.particleInBox(1, 50);
        assertEquals(7, line.size());
        assertEquals(49.0, line.topEnergy());
        assertThrows(InvalidInputException.class, () -> Spectra.particleInBox(3, 2));
    }

    @Test
    void rigidRotor() {
        Spectrum r = Spectra.rigidRotor(10);
        for (int j = 0; j <= 10; j++) {
            // Source: closed form E_J = J(J+1) hbar^2/2I, g_J = 2J+1 (e.g. Atkins, Physical Chemistry, rotational spectra)
            assertEquals(j * (j + 1), r.energy(j));
            assertEquals(2 * j + 1, r.degeneracy(j));
        }
        // Source: sum_{J<=Jmax} (2J+1) = (Jmax+1)^2
        assertEquals(121, r.stateCount());
        assertThrows(InvalidInputException.class, () -> Spectra.rigidRotor(-1));
    }

    @Test
    void spinInFieldWithHalfIntegerJ() {
        Spectrum s = Spectra.spinInField(1.5);
        assertEquals(4, s.size());
        assertTrue(s.isLabelled());
        int[] expectedLabels = {3, 1, -1, -3}; // 2m for m = 3/2 .. -3/2
        for (int k = 0; k < 4; k++) {
            // Source: closed form, 2J+1 equally spaced Zeeman levels E = (J - m) g muB B
            assertEquals(k, s.energy(k));
            assertEquals(expectedLabels[k], s.label(k));
            assertEquals(1, s.degeneracy(k));
        }
        InvalidInputException ex = assertThrows(InvalidInputException.class, () -> Spectra.spinInField(0.3));
        assertTrue(ex.getMessage().contains("0.3"), ex.getMessage());
        assertThrows(InvalidInputException.class, () -> Spectra.spinInField(-1));
        assertThrows(InvalidInputException.class, () -> Spectra.spinInField(Double.NaN));
        assertEquals(2, Spectra.spinInField(0.5).size());
    }

    @Test
    void oscillatorByAngularMomentum() {
        Spectrum s = Spectra.oscillator2dByAngularMomentum(8);
        Map<Integer, Integer> g = degeneracyMap(s);
        for (int n = 0; n <= 8; n++) {
            assertEquals(n + 1, g.get(n)); // Source: closed form n + 1, with m = -n, -n+2, ..., n (Fock-Darwin states)
        }
        for (Level l : s.levels()) {
            assertEquals(0, ((int) l.energy() - l.label()) % 2);
            assertTrue(Math.abs(l.label()) <= l.energy());
        }
    }

    @Test
    void internalMultiplicityAndSimpleBuilders() {
        Spectrum s = Spectra.harmonicOscillator(3, 6).withInternalMultiplicity(2);
        for (int n = 0; n <= 6; n++) {
            assertEquals((n + 1) * (n + 2), s.degeneracy(n)); // Source: spin-1/2 doubles (n+1)(n+2)/2
        }
        assertEquals(2 * 84, s.stateCount());
        assertEquals(6.0, s.cutoffEnergy());
        assertThrows(InvalidInputException.class, () -> s.withInternalMultiplicity(0));
        Spectrum two = Spectra.twoLevel(1.5, 1, 3);
        assertEquals(2, two.size());
        assertEquals(3, two.degeneracy(1));
        assertThrows(InvalidInputException.class, () -> Spectra.twoLevel(0));
        Spectrum eq = Spectra.equallySpaced(5, 2);
        assertEquals(8.0, eq.topEnergy());
        assertThrows(InvalidInputException.class, () -> Spectra.equallySpaced(0, 1));
        assertThrows(InvalidInputException.class, () -> Spectra.harmonicOscillator(4, 3));
        assertThrows(InvalidInputException.class, () -> Spectra.harmonicOscillator(new int[] {1, 0}, 3));
        assertThrows(InvalidInputException.class, () -> Spectra.harmonicOscillator(1, -1));
    }
}
