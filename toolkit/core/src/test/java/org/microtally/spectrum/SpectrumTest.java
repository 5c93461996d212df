package org.microtally.spectrum;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.junit.jupiter.api.Test;
import org.microtally.InvalidInputException;
import org.microtally.units.EnergyScale;

class SpectrumTest {

    @Test
    void badDegeneraciesAreRefusedNamingTheValue() {
        InvalidInputException neg = assertThrows(InvalidInputException.class,
                () -> Spectrum.of(new double[] {0, 1}, new int[] {1, -3}));
        assertTrue(neg.getMessage().contains("-3") && neg.getMessage().contains("level 1"), neg.getMessage());
        InvalidInputException zero = assertThrows(InvalidInputException.class,
                () -> Spectrum.of(new double[] {0, 1}, new int[] {0, 1}));
        assertTrue(zero.getMessage().contains("= 0") && zero.getMessage().contains("level 0"), zero.getMessage());
        InvalidInputException frac = assertThrows(InvalidInputException.class,
                () -> Spectrum.of(new double[] {0, 1}, new double[] {1, 2.5}));
        assertTrue(frac.getMessage().contains("2.5") && frac.getMessage().contains("level 1"), frac.getMessage());
        assertEquals(3, Spectrum.of(new double[] {0, 1}, new double[] {1, 3.0}).degeneracy(1));
        assertThrows(InvalidInputException.class, () -> Spectrum.of(new double[] {0, 1}, new double[] {1, Double.NaN}));
        assertThrows(InvalidInputException.class, () -> Spectrum.of(new double[] {0, 1}, new int[] {1}));
        assertThrows(InvalidInputException.class, () -> new Level(0, 0));
    }

    @Test
    void nanAndInfiniteEnergiesAreRefused() {
        InvalidInputException nan = assertThrows(InvalidInputException.class, () -> Spectrum.ofEnergies(0, Double.NaN));
        assertTrue(nan.getMessage().contains("NaN"), nan.getMessage());
        InvalidInputException inf = assertThrows(InvalidInputException.class,
                () -> Spectrum.ofEnergies(0, Double.POSITIVE_INFINITY));
        assertTrue(inf.getMessage().contains("Infinity"), inf.getMessage());
        assertThrows(InvalidInputException.class, () -> new Level(Double.NEGATIVE_INFINITY, 1));
        assertThrows(InvalidInputException.class, () -> Spectrum.of(List.of()));
    }

    @Test
    void nonIntegerEnergyNamesTheFirstLevel() {
        Spectrum s = Spectrum.ofEnergies(0, 1, 1.25, 2.5);
        assertFalse(s.isExact());
        NonIntegerEnergyException ex = assertThrows(NonIntegerEnergyException.class, s::integerEnergies);
        assertEquals(2, ex.levelIndex());
        assertEquals(1.25, ex.energy());
        assertTrue(ex.getMessage().contains("level 2") && ex.getMessage().contains("1.25"), ex.getMessage());
        assertTrue(Spectrum.ofEnergies(0, 3, 7).isExact());
    }

    @Test
    void unsortedInputIsSortedAndDuplicatesAreMerged() {
        // documented behaviour (Spectrum class notes): sorted by energy, equal energies merged, degeneracies added
        Spectrum s = Spectrum.of(new double[] {5, 0, 2, 5, 2}, new int[] {1, 2, 3, 4, 5});
        assertArrayEquals(new double[] {0, 2, 5}, s.energies());
        assertArrayEquals(new int[] {2, 8, 5}, s.degeneracies());
        assertEquals(15, s.stateCount());
        // labelled levels merge only when energy and label agree
        Spectrum l = Spectrum.of(List.of(new Level(1, 1, 1), new Level(1, 2, -1), new Level(1, 1, 1)),
                EnergyScale.abstractUnit("u"), true, Double.POSITIVE_INFINITY, "");
        assertEquals(2, l.size());
        assertEquals(-1, l.label(0));
        assertEquals(2, l.degeneracy(1));
        // unlabelled spectra drop labels and merge
        Spectrum u = Spectrum.of(List.of(new Level(1, 1, 1), new Level(1, 2, -1)));
        assertEquals(1, u.size());
        assertEquals(3, u.degeneracy(0));
    }

    @Test
    void truncationRecordsTheCutoff() {
        Spectrum s = Spectra.harmonicOscillator(1, 20).truncatedAt(7.5);
        assertEquals(8, s.size());
        assertEquals(7.5, s.cutoffEnergy());
        assertTrue(s.cutoffNote().contains("7.5"));
        assertFalse(Spectrum.ofEnergies(0, 1).isTruncated());
        assertThrows(InvalidInputException.class, () -> Spectrum.ofEnergies(1, 2).truncatedAt(0.5));
    }
}
