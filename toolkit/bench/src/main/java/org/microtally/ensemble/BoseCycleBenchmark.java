package org.microtally.ensemble;

import java.util.concurrent.TimeUnit;
import org.microtally.spectrum.Spectra;
import org.microtally.spectrum.Spectrum;
import org.microtally.spectrum.Statistics;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Param;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;

/**
 * Canonical bosons of notebook 01 (2,000 atoms, trap 4:4:1, cutoff 15 kT) at T = f T_c0: the cycle-sum
 * recursion ({@link BoseCycleMoments}) against the state-by-state paths it replaces, both measured in the
 * same run (the old paths are the baselines): {@code seriesProduct} vs {@code cycleSeries} for Z_n (all levels
 * and all but the lowest), {@code seriesMomentPass} vs {@code cycleMoments} for C_V and Var E with their
 * checks. Run: {@code java -jar toolkit/bench/target/benchmarks.jar BoseCycleBenchmark -f 1 -wi 2 -i 3 -w 1 -r 1}.
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
public class BoseCycleBenchmark {
    static final int N = 2000;

    @Param({"0.5", "0.9", "1.2"})
    public double fraction;

    Spectrum trap;
    double kT;
    double muStar;
    double energy;
    double lnZ;

    @Setup
    public void setUp() {
        double kTc0 = Math.cbrt(16 * N / 1.2020569031595942);
        kT = fraction * kTc0;
        trap = Spectra.harmonicOscillator(new int[] {4, 4, 1}, Math.max(60, (int) Math.ceil(15 * kT)));
        Canonical c = Canonical.of(trap, Statistics.BOSE, N, kT);
        muStar = c.referenceChemicalPotential();
        energy = c.energy();
        lnZ = c.lnZ();
    }

    /** Baseline: the generating product state by state, as CanonicalSeries.bose builds it without the cycle sums. */
    @Benchmark
    public double seriesProduct() {
        ScaledSeries z = new ScaledSeries(N, false);
        ScaledSeries others = null;
        double beta = 1.0 / kT;
        for (int i = trap.size() - 1; i >= 0; i--) {
            if (i == 0) {
                others = z.copy();
            }
            z.multiplyStates(trap.degeneracy(i), -beta * (trap.energy(i) - muStar), Integer.MAX_VALUE, 0);
        }
        return z.logCoefficient(N) + others.logCoefficient(N);
    }

    @Benchmark
    public double cycleSeries() {
        ScaledSeries[] z = BoseCycleMoments.partitionSeries(trap, N, kT, muStar);
        return z[0].logCoefficient(N) + z[1].logCoefficient(N);
    }

    /** Baseline: the particle-hole moment pass over every state with its dU/dT check pass. */
    @Benchmark
    public double seriesMomentPass() {
        return EnergyFluctuations.bySeries(trap, Statistics.BOSE, N, kT, muStar, energy).variance;
    }

    @Benchmark
    public double cycleMoments() {
        return EnergyFluctuations.boseByCycles(trap, N, kT, muStar, energy, lnZ).variance;
    }
}
