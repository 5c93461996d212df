package org.microtally.ensemble;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.junit.jupiter.api.Test;
import org.microtally.Tabular;
import org.microtally.count.BinnedCounts;
import org.microtally.count.LevelDensityFit;
import org.microtally.count.ShellDimensions;
import org.microtally.count.SingleNumberCounts;
import org.microtally.count.Species;
import org.microtally.spectrum.ShellOrbits;
import org.microtally.spectrum.Spectra;
import org.microtally.spectrum.Spectrum;
import org.microtally.spectrum.Statistics;
import org.microtally.units.EnergyScale;

/** Every new result type is a well-formed table for the notebook layer (shape and cell types). */
class NewResultTablesTest {

    private static void wellFormed(Tabular t) {
        List<String> cols = t.columnNames();
        assertFalse(cols.isEmpty(), t.getClass().getSimpleName());
        assertFalse(t.rows().isEmpty(), t.getClass().getSimpleName());
        for (List<Object> row : t.rows()) {
            // common practice, no source: the Tabular contract (one cell per column; Number, String or Boolean)
            assertEquals(cols.size(), row.size(), t.getClass().getSimpleName() + " " + row);
            for (Object cell : row) {
                assertTrue(cell instanceof Number || cell instanceof String || cell instanceof Boolean,
                        t.getClass().getSimpleName() + " cell " + cell);
                if (cell instanceof Double d) {
                    assertTrue(Double.isFinite(d), t.getClass().getSimpleName() + " cell " + cell);
                }
            }
        }
    }

    @Test
    void everyNewResultRendersAsATable() {
        Spectrum dot = Spectra.harmonicOscillator(2, 8);
        ShellOrbits sd = ShellOrbits.sdShell(EnergyScale.abstractUnit("MeV"), 0, 1, 3);
        List<Species> two = List.of(new Species("a", dot, Statistics.FERMI, 4), new Species("b", dot, Statistics.BOSE, 3));
        LabelledCanonical lc = LabelledCanonical.of(sd.spectrum(), Statistics.FERMI, 3, 1.0);
        BinnedCounts b = BinnedCounts.of(List.of(new Species("p", Spectra.equallySpaced(40, 1.0), Statistics.BOSE, 30),
                new Species("n", Spectra.equallySpaced(40, 1.0), Statistics.BOSE, 30)), 1.0, 30);
        for (Tabular t : List.of(CanonicalMixture.of(two, 0.7), GrandCanonicalMixture.ofMeanNumbers(two, 0.7),
                CanonicalSweep.of(dot, Statistics.FERMI, 10, 0.5),
                MicrocanonicalLevelNumber.groundLevel(dot, Statistics.BOSE, 5, 6), lc,
                AngularMomentumProjection.of(lc),
                LabelledGrandCanonical.inField(sd.spectrum(), Statistics.FERMI, 1.0, 0.5, 0.1),
                LabelResolvedGrandCanonical.of(sd.spectrum(), Statistics.FERMI, 1.0, 0.5, 0.1),
                GroundLevelComparison.of(Spectra.harmonicOscillator(1, 40), Statistics.BOSE, 10, 12),
                ShellDimensions.of(sd, 2, sd, 2),
                SingleNumberCounts.of(dot, Statistics.FERMI, 4, 12), b, LevelDensityFit.fit(b, 8, 30))) {
            wellFormed(t);
        }
    }
}
