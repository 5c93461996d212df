package org.microtally.ensemble;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
import org.microtally.InvalidInputException;
import org.microtally.spectrum.Level;
import org.microtally.spectrum.Spectra;
import org.microtally.spectrum.Spectrum;
import org.microtally.spectrum.Statistics;

/** The stated effect of a cutoff on each quantity, and cutoffs chosen from a tolerance. */
class CutoffEffectTest {
    private static final int N = 1000;
    private static final double KT = 7.5;

    private static Canonical trap(int cut) {
        return Canonical.of(Spectra.harmonicOscillator(3, cut), Statistics.BOSE, N, KT);
    }

    private static TruncationCheck.Effect effect(Canonical c) {
        double[] perState = new double[c.spectrum().size()];
        for (int i = 0; i < perState.length; i++) {
            perState[i] = c.occupations().perState(i);
        }
        return TruncationCheck.effect(c.spectrum(), perState, N, KT, c.referenceChemicalPotential(), c.energy(),
                c.entropy(), c.condensate().mean());
    }

    @Test
    void theStatedEffectOfACutoffMatchesTheChangeWhenItIsRaised() {
        Canonical cut = trap(175);
        Canonical far = trap(400);
        TruncationCheck.Effect f = effect(cut);
        // Source: independent route, the same ensemble with the cutoff raised to 400 quanta (where the
        // omitted levels hold below 1e-20 particles)
        double dN0 = Math.abs(far.condensate().mean() - cut.condensate().mean()) / far.condensate().mean();
        double dU = Math.abs(far.energy() - cut.energy()) / far.energy();
        double dS = Math.abs(far.entropy() - cut.entropy()) / far.entropy();
        double dC = Math.abs(far.heatCapacity() - cut.heatCapacity());
        assertEquals(dN0, f.groundLevel(), Cutoffs.ESTIMATE_RELATIVE_ERROR * dN0);
        assertEquals(dU, f.energy(), Cutoffs.ESTIMATE_RELATIVE_ERROR * dU);
        assertEquals(dS, f.entropy(), Cutoffs.ESTIMATE_RELATIVE_ERROR * dS);
        assertEquals(dC, f.heatCapacity(), Cutoffs.ESTIMATE_RELATIVE_ERROR * dC);
        // the old top-level threshold (1e-8 N) stayed silent here although <N_0> moves by 2.6e-8
        assertTrue(cut.warnings().stream().anyMatch(w -> w.contains("<N_0> by 2.6e-08")), cut.warnings().toString());
        assertTrue(far.warnings().isEmpty(), far.warnings().toString());
    }

    @Test
    void aCutoffChosenFromTheToleranceMeetsItOnEveryQuantity() {
        Spectrum s = Cutoffs.forTolerance(cut -> Spectra.harmonicOscillator(3, cut), Statistics.BOSE, N, KT);
        Canonical c = Canonical.of(s, Statistics.BOSE, N, KT);
        Canonical far = trap(400);
        assertTrue(c.warnings().isEmpty(), c.warnings().toString());
        // Source: independent route, the ensemble at cutoff 400; the estimate is an extrapolation, so a
        // factor 10 over the 1e-12 target is allowed
        assertEquals(far.condensate().mean(), c.condensate().mean(), 1e-11 * far.condensate().mean());
        assertEquals(far.energy(), c.energy(), 1e-11 * far.energy());
        assertEquals(far.entropy(), c.entropy(), 1e-11 * far.entropy());
        // and it is the smallest such cutoff: one quantum less fails the target
        Canonical below = trap((int) s.topEnergy() - 1);
        assertTrue(effect(below).worst() > Cutoffs.DEFAULT_TOLERANCE * 0.5, "" + effect(below).worst());
        assertThrows(InvalidInputException.class,
                () -> Cutoffs.forTolerance(cut -> Spectra.harmonicOscillator(3, cut), Statistics.BOSE, N, KT, 0.0));
    }

    @Test
    void aSpectrumOfUndeclaredCompletenessWarnsWhenItsTopLevelIsPopulated() {
        Spectrum listed = Spectrum.of(java.util.List.of(new Level(0, 1), new Level(1, 3), new Level(2, 6),
                new Level(3, 10))).withCompletenessUndeclared("read from levels.csv without a cutoff");
        // Source: common practice, no source (a list that stops where the occupation is still 0.1 is not complete)
        assertTrue(Canonical.of(listed, Statistics.BOSE, 10, 2.0).warnings().stream()
                .anyMatch(w -> w.startsWith("spectrum of undeclared completeness")));
        assertTrue(Canonical.of(listed, Statistics.BOSE, 10, 0.02).warnings().isEmpty());
        assertThrows(InvalidInputException.class, () -> Canonical.of(listed, Statistics.FERMI, 3, -1.0));
    }
}
