package org.microtally.ensemble;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
import org.microtally.InvalidInputException;
import org.microtally.spectrum.Spectra;
import org.microtally.spectrum.Spectrum;
import org.microtally.spectrum.Statistics;

/** Grand canonical S and C at low T without cancellation; an unreachable <N> is refused, not returned. */
class GrandCanonicalLowTemperatureTest {
    private final Spectrum osc = Spectra.harmonicOscillator(3, 40);

    @Test
    void closedShellFermionEntropyKeepsItsRelativeAccuracy() {
        GrandCanonical g = GrandCanonical.ofMeanNumber(osc, Statistics.FERMI, 0.01, 10);
        double mu = g.chemicalPotential();
        double expected = 0;
        for (int i = 0; i < osc.size(); i++) {
            double ax = Math.abs((osc.energy(i) - mu) / 0.01);
            expected += osc.degeneracy(i) * Math.exp(-ax) * (1 + ax);
        }
        // Source: closed form, one-state Fermi entropy s(x) = e^{-|x|} (1 + |x|) (1 + O(e^{-|x|})), |x| > 49 here
        assertEquals(expected, g.entropy(), 1e-12 * expected);
        assertTrue(g.heatCapacity() > 0 && Double.isFinite(g.heatCapacity()));
    }

    @Test
    void tinyTemperaturesGiveFiniteResultsOrARefusal() {
        GrandCanonical b = GrandCanonical.ofMeanNumber(osc, Statistics.BOSE, 1e-300, 10);
        // Source: closed form, T -> 0 limit of the one-state Bose law: all 10 in the ground state, C -> 0
        assertEquals(0.0, b.heatCapacity(), 0.0);
        assertEquals(10, b.meanNumber(), 1e-12);
        InvalidInputException e = assertThrows(InvalidInputException.class,
                () -> GrandCanonical.ofMeanNumber(osc, Statistics.FERMI, 1e-300, 10));
        assertTrue(e.getMessage().contains("gives 7.0"), e.getMessage());
    }
}
