package org.microtally.spark;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.util.HashSet;
import java.util.List;
import java.util.Set;
import org.junit.jupiter.api.Test;
import org.microtally.InvalidInputException;
import org.microtally.spectrum.Statistics;

class SweepGridTest {

    @Test
    void everyCombinationOfTheAxesIsExactlyOnePoint() {
        List<SpectrumSpec> spectra = List.of(SpectrumSpec.oscillator(new int[] {4, 4, 1}, 20),
                SpectrumSpec.box(3, 30), SpectrumSpec.equallySpaced(5, 0.5));
        int[] particles = {1, 7, 30};
        double[] kTs = {0.5, 1, 2, 4};
        List<Statistics> stats = List.of(Statistics.BOSE, Statistics.FERMI, Statistics.maxOccupancy(3));
        List<Ensemble> ensembles = List.of(Ensemble.CANONICAL, Ensemble.GRAND_CANONICAL);
        SweepGrid grid = SweepGrid.of(spectra, particles, kTs, stats, ensembles);
        // common practice, no source: a Cartesian product has the product of the axis lengths as its size, and
        // decoding the point ids in mixed radix visits each combination exactly once
        assertEquals(3L * 3 * 4 * 3 * 2, grid.size());
        Set<List<Object>> seen = new HashSet<>();
        for (long id = 0; id < grid.size(); id++) {
            SweepPoint p = grid.point(id);
            assertEquals(id, p.id());
            seen.add(List.of(p.spectrum(), p.particles(), p.kT(), p.statistics(), p.ensemble()));
        }
        assertEquals(grid.size(), seen.size());
        SweepPoint last = grid.point(grid.size() - 1);
        assertEquals(List.of(spectra.get(2), 30, 4.0, Statistics.maxOccupancy(3), Ensemble.GRAND_CANONICAL),
                List.of(last.spectrum(), last.particles(), last.kT(), last.statistics(), last.ensemble()));
        assertThrows(InvalidInputException.class, () -> grid.point(grid.size()));
    }

    @Test
    void spectrumSpecsBuildTheirBuildersSpectrumAndDescribeThemselves() {
        SpectrumSpec trap = SpectrumSpec.oscillator(new int[] {4, 4, 1}, 12);
        // common practice, no source: the spec is the builder's arguments, so it builds the same spectrum
        assertEquals(org.microtally.spectrum.Spectra.harmonicOscillator(new int[] {4, 4, 1}, 12), trap.build(1.0));
        assertEquals("oscillator 4:4:1 cutoff 12", trap.toString());
        assertThrows(InvalidInputException.class, () -> SpectrumSpec.oscillator(new int[] {0, 1}, 5));
        assertThrows(InvalidInputException.class, () -> SpectrumSpec.equallySpaced(3, Double.POSITIVE_INFINITY));
    }

    @Test
    void aCutoffFollowingKTKeepsItsMinimumAndGrowsWithTheTemperature() {
        SpectrumSpec trap = SpectrumSpec.oscillatorFollowingKT(new int[] {4, 4, 1}, 20, 15);
        // common practice, no source: cutoff = max(minimum, ceil(15 kT))
        assertEquals(20, trap.cutoffAt(1.0));
        assertEquals(61, trap.cutoffAt(4.01));
        assertEquals("oscillator 4:4:1 cutoff max(20, 15.0 kT)", trap.toString());
        // the sweep row's state count is that of the builder's spectrum at this point's cutoff
        SweepPoint p = new SweepPoint(0, trap, 10, 4.01, Statistics.BOSE, Ensemble.GRAND_CANONICAL);
        assertEquals(org.microtally.spectrum.Spectra.harmonicOscillator(new int[] {4, 4, 1}, 61).stateCount(),
                Sweep.evaluate(p).getLong(2));
        assertThrows(InvalidInputException.class, () -> SpectrumSpec.oscillatorFollowingKT(new int[] {1}, 5, 0));
    }
}
