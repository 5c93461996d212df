package org.microtally.count;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.math.BigInteger;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.microtally.InvalidInputException;
import org.microtally.spectrum.Spectra;
import org.microtally.spectrum.Spectrum;
import org.microtally.spectrum.Statistics;

/**
 * Label-resolved counts and species mixes on truncated spectra: exact through the stated energy,
 * refused beyond it (the counts there miss microstates with a particle above the cutoff).
 */
class TruncatedCountCompletenessTest {
    private static final Spectrum CUT14 = Spectra.oscillator2dByAngularMomentum(14).withInternalMultiplicity(2);
    private static final Spectrum CUT30 = Spectra.oscillator2dByAngularMomentum(30).withInternalMultiplicity(2);

    @Test
    void sixElectronsByAngularMomentumAreExactThroughTheStatedEnergyAndRefusedBeyond() {
        LabelledCountTable t = LabelledCountTable.of(CUT14, Statistics.FERMI, 6, 30);
        LabelledCountTable ref = LabelledCountTable.of(CUT30, Statistics.FERMI, 6, 30);
        // Source: closed form, lowest energy of 5 spin-1/2 fermions in the 2D oscillator (shells of 2 and
        // 4 states) is 0 + 0 + 1 + 1 + 1 = 3, so row 6 is complete through 14 + 3 = 17
        assertEquals(17, t.completeThroughEnergy(6));
        assertEquals(14, t.completeThroughEnergy());
        for (int n = 0; n <= 6; n++) {
            for (int e = 0; e <= t.completeThroughEnergy(n); e++) {
                for (int l = t.minLabelTotal(); l <= t.maxLabelTotal(); l++) {
                    // Source: independent route, the same count on a spectrum cut at 30 (complete through e = 30)
                    assertEquals(ref.count(n, e, l), t.count(n, e, l), "n=" + n + " e=" + e + " L=" + l);
                }
            }
        }
        // the bound is sharp here: at e = 18 the truncated model already lacks microstates
        // Source: the same cutoff-30 table (a state with one electron at 15 quanta and five at 0,0,1,1,1)
        assertNotEquals(ref.countAllLabels(6, 18), sumOverLabels(t, 6, 18));
        InvalidInputException e = assertThrows(InvalidInputException.class, () -> t.count(6, 18, 0));
        assertTrue(e.getMessage().contains("at most 17") && e.getMessage().contains("cutoff of at least 15"),
                e.getMessage());
        assertThrows(InvalidInputException.class, () -> t.countAtLabel(6, 0));
        assertThrows(InvalidInputException.class, () -> t.countAllLabels(6, 30));
    }

    private static BigInteger sumOverLabels(LabelledCountTable t, int n, int e) {
        BigInteger s = BigInteger.ZERO;
        for (int l = t.minLabelTotal(); l <= t.maxLabelTotal(); l++) {
            s = s.add(t.truncatedModelCount(n, e, l));
        }
        return s;
    }

    @Test
    void aMixOfTwoSpeciesIsExactThroughTheStatedEnergyAndRefusedBeyond() {
        Spectrum a = Spectra.oscillator2dByAngularMomentum(14);
        Spectrum b = Spectra.oscillator2dByAngularMomentum(30);
        SpeciesMix cut = SpeciesMix.of(List.of(new Species("up", a, Statistics.FERMI, 3),
                new Species("down", a, Statistics.FERMI, 3)), 22);
        SpeciesMix ref = SpeciesMix.of(List.of(new Species("up", b, Statistics.FERMI, 3),
                new Species("down", b, Statistics.FERMI, 3)), 22);
        // Source: closed form, 2 fermions lowest at 0 + 1, 3 at 0 + 1 + 1: each species is complete
        // through 14 + 1 = 15, the mix through 15 + 2 = 17
        assertEquals(17, cut.completeThroughEnergy());
        for (int e = 0; e <= 17; e++) {
            for (int l = cut.minLabelTotal(); l <= cut.maxLabelTotal(); l++) {
                // Source: independent route, the same mix on spectra cut at 30
                assertEquals(ref.count(e, l), cut.count(e, l), "e=" + e + " L=" + l);
            }
        }
        assertThrows(InvalidInputException.class, () -> cut.count(18, 0));
        assertThrows(InvalidInputException.class, cut::total);
        assertThrows(InvalidInputException.class, () -> LabelledCountTable.ignoringEnergy(a, Statistics.FERMI, 2));
    }
}
