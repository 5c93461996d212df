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
        return separateRuns(dot, Statistics.FERMI, 1, 42, 1, 0.1);
    }

    @Benchmark
    public double dotSweep() {
        return sweep(dot, Statistics.FERMI, 42, 0.1);
    }

    @Benchmark
    public double trapSeparateRunsEveryTenth() {
        return separateRuns(trap, Statistics.BOSE, 10, 1000, 10, 20.0);
    }

    @Benchmark
    public double trapSweepEveryN() {
        return sweep(trap, Statistics.BOSE, 1000, 20.0);
    }

    /** One {@link Canonical} per n = from, from + step, .. to; the sum of ln Z + E keeps every run live. */
    private static double separateRuns(Spectrum s, Statistics stats, int from, int to, int step, double kT) {
        double sum = 0;
        for (int n = from; n <= to; n += step) {
            Canonical c = Canonical.of(s, stats, n, kT);
            sum += c.lnZ() + c.energy();
        }
        return sum;
    }

    /** One {@link CanonicalSweep} to nMax, read at every n = 1 .. nMax. */
    private static double sweep(Spectrum s, Statistics stats, int nMax, double kT) {
        CanonicalSweep w = CanonicalSweep.of(s, stats, nMax, kT);
        double sum = 0;
        for (int n = 1; n <= nMax; n++) {
            sum += w.lnZ(n) + w.energy(n);
        }
        return sum;
    }
}
