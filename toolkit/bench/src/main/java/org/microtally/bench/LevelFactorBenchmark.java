package org.microtally.bench;

import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.TimeUnit;
import org.microtally.ensemble.Canonical;
import org.microtally.spectrum.Level;
import org.microtally.spectrum.Spectrum;
import org.microtally.spectrum.Statistics;
import org.microtally.units.EnergyScale;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;

/**
 * Canonical fermions on two hugely degenerate levels (issue 14): N = 1000 on levels 0 and 1 of
 * 2^31 - 1 states each, where each level is one closed-form factor. Baseline in the same run: the
 * same kind of system with 10^5 states per level split into labelled levels of 1000 states, which
 * takes the single-state steps (the old cost per state), so the ratio shows what a level costs.
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.SingleShotTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
public class LevelFactorBenchmark {
    static final int N = 1000;

    Spectrum huge;
    Spectrum splitSmall;

    @Setup
    public void setUp() {
        huge = Spectrum.of(new double[] {0, 1}, new int[] {Integer.MAX_VALUE, Integer.MAX_VALUE});
        List<Level> parts = new ArrayList<>();
        for (int e = 0; e <= 1; e++) {
            for (int p = 0; p < 100; p++) {
                parts.add(new Level(e, 1000, p));
            }
        }
        splitSmall = Spectrum.of(parts, EnergyScale.abstractUnit("unit"), true, Double.POSITIVE_INFINITY, "");
    }

    /** Baseline: 2 x 10^5 states in levels of 1000, single-state steps. */
    @Benchmark
    public double baselineSingleStateSteps() {
        return Canonical.of(splitSmall, Statistics.FERMI, N, 1.0).lnZ();
    }

    /** 2 x (2^31 - 1) states, each level one closed-form factor; Z, occupations and C_V. */
    @Benchmark
    public double twoLevelsOfMaximalDegeneracy() {
        Canonical c = Canonical.of(huge, Statistics.FERMI, N, 1.0);
        return c.lnZ() + c.occupations().perState(0) + c.heatCapacity();
    }
}
