package org.microtally.bench;

import static org.microtally.bench.OscillatorWorkload.N;

import java.util.List;
import java.util.concurrent.TimeUnit;
import org.microtally.count.Species;
import org.microtally.ensemble.Canonical;
import org.microtally.ensemble.CanonicalMixture;
import org.microtally.spectrum.Statistics;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.State;

/**
 * Two species x 10^4 particles on the 3D oscillator cut at 83 quanta (102,340 states) against one
 * species of the same size, measured in the same run (target: mixture &lt;= 2x the single species).
 * Three mixtures: spin-up and spin-down fermions with equal N (one shared computation), two distinct
 * fermion numbers (two computations) and a Bose-Fermi mixture; each reports lnZ and one occupation.
 * Ratios: {@code java -cp toolkit/bench/target/benchmarks.jar org.microtally.bench.MixtureRatio}.
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.SingleShotTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
public class MixtureBenchmark {
    static final double KT = 5.0;

    @Benchmark
    public double singleFermions(OscillatorWorkload w) {
        Canonical c = Canonical.of(w.oscillator, Statistics.FERMI, N, KT);
        return c.lnZ() + c.occupations().perState(40);
    }

    @Benchmark
    public double singleBosons(OscillatorWorkload w) {
        Canonical c = Canonical.of(w.oscillator, Statistics.BOSE, N, KT);
        return c.lnZ() + c.occupations().perState(1);
    }

    @Benchmark
    public double mixtureSpinUpDownEqualN(OscillatorWorkload w) {
        return mix(new Species("up", w.oscillator, Statistics.FERMI, N),
                new Species("down", w.oscillator, Statistics.FERMI, N));
    }

    @Benchmark
    public double mixtureTwoFermionNumbers(OscillatorWorkload w) {
        return mix(new Species("protons", w.oscillator, Statistics.FERMI, N),
                new Species("neutrons", w.oscillator, Statistics.FERMI, N - 500));
    }

    @Benchmark
    public double mixtureBoseFermi(OscillatorWorkload w) {
        return mix(new Species("bosons", w.oscillator, Statistics.BOSE, N),
                new Species("fermions", w.oscillator, Statistics.FERMI, N));
    }

    private static double mix(Species a, Species b) {
        CanonicalMixture m = CanonicalMixture.of(List.of(a, b), KT);
        return m.lnZ() + m.occupations(0).perState(40) + m.occupations(1).perState(40);
    }
}
