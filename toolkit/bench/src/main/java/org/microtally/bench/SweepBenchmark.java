package org.microtally.bench;

import java.util.concurrent.TimeUnit;
import org.microtally.ensemble.Canonical;
import org.microtally.ensemble.CanonicalSweep;
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
 * The canonical sweep over N against its in-run baseline, one Canonical run per n (ln Z and U only
 * are compared; the separate runs also compute occupations, which is what a user without the sweep
 * would have to run): the quantum dot with spin (2D oscillator cut at 40) for n = 1..42 at
 * kT = 0.1, and 1000 bosons in the 4:4:1 trap cut at 120 at kT = 20.
 * Ratios: {@code java -cp toolkit/bench/target/benchmarks.jar org.microtally.bench.SweepRatio}.
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.SingleShotTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
public class SweepBenchmark {
    Spectrum dot;
    Spectrum trap;

    @Setup
    public void setUp() {
        dot = Spectra.harmonicOscillator(2, 40).withInternalMultiplicity(2);
        trap = Spectra.harmonicOscillator(new int[] {4, 4, 1}, 120);
    }

    @Benchmark
    public double dotSeparateRuns() {
        double s = 0;
        for (int n = 1; n <= 42; n++) {
            Canonical c = Canonical.of(dot, Statistics.FERMI, n, 0.1);
            s += c.lnZ() + c.energy();
        }
        return s;
    }

    @Benchmark
    public double dotSweep() {
        CanonicalSweep w = CanonicalSweep.of(dot, Statistics.FERMI, 42, 0.1);
        double s = 0;
        for (int n = 1; n <= 42; n++) {
            s += w.lnZ(n) + w.energy(n);
        }
        return s;
    }

    @Benchmark
    public double trapSeparateRunsEveryTenth() {
        double s = 0;
        for (int n = 10; n <= 1000; n += 10) {
            Canonical c = Canonical.of(trap, Statistics.BOSE, n, 20.0);
            s += c.lnZ() + c.energy();
        }
        return s;
    }

    @Benchmark
    public double trapSweepEveryN() {
        CanonicalSweep w = CanonicalSweep.of(trap, Statistics.BOSE, 1000, 20.0);
        double s = 0;
        for (int n = 1; n <= 1000; n++) {
            s += w.lnZ(n) + w.energy(n);
        }
        return s;
    }
}
