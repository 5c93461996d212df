package org.microtally.ensemble;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.math.BigInteger;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.microtally.Missing;
import org.microtally.Tabular;
import org.microtally.spectrum.Spectra;
import org.microtally.spectrum.Spectrum;
import org.microtally.spectrum.Statistics;

/** Every result renders as rectangular rows of allowed cell types; progress reports stay in range. */
class ResultShapeTest {

    @Test
    void everyResultIsRectangularWithAllowedCells() {
        Spectrum dot = Spectra.harmonicOscillator(2, 12);
        Canonical bose = Canonical.of(dot, Statistics.BOSE, 10, 1.0);
        List<Tabular> all = List.of(bose, bose.occupations(), bose.condensate(),
                Canonical.of(dot, Statistics.FERMI, 10, 1.0),
                GrandCanonical.ofMeanNumber(dot, Statistics.FERMI, 1.0, 10),
                EnsembleComparison.overTemperatures(dot, Statistics.BOSE, 10, 0.5, 1.0),
                EnsembleComparison.convergence(dot, Statistics.FERMI, new int[] {5, 10}, n -> 1.0),
                Microcanonical.of(dot, Statistics.FERMI, 6, 20), Canonical.groundState(dot, Statistics.FERMI, 7));
        for (Tabular t : all) {
            int cols = t.columnNames().size();
            assertTrue(cols >= 2);
            for (List<Object> row : t.rows()) {
                assertEquals(cols, row.size(), t.getClass().getSimpleName());
                for (Object cell : row) {
                    assertTrue(cell instanceof Number || cell instanceof String || cell instanceof Boolean
                            || cell instanceof BigInteger || cell instanceof Missing, t.getClass().getSimpleName() + ": " + cell);
                    assertFalse("n/a".equals(cell), t.getClass().getSimpleName() + ": missing must be a Missing value");
                    if (cell instanceof Double d) {
                        assertTrue(Double.isFinite(d), t.getClass().getSimpleName() + " has a non-finite cell");
                    }
                }
            }
        }
    }

    @Test
    void progressReportsStayInRange() {
        List<long[]> calls = new ArrayList<>();
        Canonical.of(Spectra.harmonicOscillator(3, 30), Statistics.FERMI, 200, 2.0,
                (done, total, stage) -> calls.add(new long[] {done, total}));
        assertTrue(calls.size() >= 2 && calls.size() <= 300, "calls: " + calls.size());
        for (long[] c : calls) {
            assertTrue(c[0] >= 0 && c[0] <= c[1] && c[1] >= 1);
        }
    }
}
