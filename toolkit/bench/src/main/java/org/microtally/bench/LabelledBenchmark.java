package org.microtally.bench;

import java.util.concurrent.TimeUnit;
import org.microtally.ensemble.Canonical;
import org.microtally.ensemble.LabelledCanonical;
import org.microtally.ensemble.MicrocanonicalLevelNumber;
import org.microtally.spectrum.Spectra;
import org.microtally.spectrum.Spectrum;
import org.microtally.spectrum.Statistics;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;

/**
 * The label-resolved canonical ensemble (12 electrons of the dot with spin, resolved by L_z, in a
 * rotation field) and the exact microcanonical condensate distribution (150 bosons, 1D trap) against
 * the plain Canonical run on the same spectrum, measured in the same run.
 * Ratios: {@code java -cp toolkit/bench/target/benchmarks.jar org.microtally.bench.LabelledRatio}.
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.SingleShotTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
public class LabelledBenchmark {
    Spectrum dotByLz;
    Spectrum trap;

    @Setup
    public void setUp() {
        dotByLz = Spectra.oscillator2dByAngularMomentum(20).withInternalMultiplicity(2);
        trap = Spectra.harmonicOscillator(1, 400);
    }

    @Benchmark
    public double dotCanonical() {
        Canonical c = Canonical.of(dotByLz, Statistics.FERMI, 12, 0.2);
        return c.lnZ() + c.occupations().perState(3);
    }

    @Benchmark
    public double dotLabelledInField() {
        LabelledCanonical c = LabelledCanonical.inField(dotByLz, Statistics.FERMI, 12, 0.2, 0.05);
        return c.lnZ() + c.meanLabel();
    }

    @Benchmark
    public double trapCanonical() {
        Canonical c = Canonical.of(trap, Statistics.BOSE, 150, 10.0);
        return c.lnZ() + c.condensate().variance();
    }

    @Benchmark
    public double trapMicrocanonicalCondensate() {
        return MicrocanonicalLevelNumber.groundLevel(trap, Statistics.BOSE, 150, 165).variance();
    }
}
