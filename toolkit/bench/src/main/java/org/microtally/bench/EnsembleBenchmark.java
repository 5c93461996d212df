package org.microtally.bench;

import static org.microtally.bench.OscillatorWorkload.N;

import java.util.concurrent.TimeUnit;
import org.microtally.ensemble.Canonical;
import org.microtally.occupation.ChemicalPotential;
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
 * Canonical ensemble and chemical-potential solver at the sizes of issue 3: a 3D isotropic
 * oscillator cut at 83 quanta (102,340 single-particle states, 84 levels), N = 10,000 fermions and
 * bosons at one temperature; mu for 1e6 distinct levels at 100 temperatures. The baseline is a bare
 * loop of M x N multiply-adds (M = number of states) of the same shape as one generating-product
 * step, measured in the same run, so the ratio canonical / baseline is machine independent.
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.SingleShotTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
public class EnsembleBenchmark {
    double[] stateFactors;
    Spectrum million;
    Spectrum millionStates;
    double[] temperatures;

    @Setup
    public void setUp(OscillatorWorkload w) {
        Spectrum oscillator = w.oscillator;
        stateFactors = new double[(int) oscillator.stateCount()];
        int k = 0;
        for (int i = 0; i < oscillator.size(); i++) {
            for (int d = 0; d < oscillator.degeneracy(i); d++) {
                stateFactors[k++] = 1.0 / oscillator.stateCount();
            }
        }
        million = Spectra.equallySpaced(1_000_000, 1e-3);
        millionStates = Spectra.harmonicOscillator(3, 180);
        temperatures = new double[100];
        for (int t = 0; t < temperatures.length; t++) {
            temperatures[t] = 0.5 + 0.05 * t;
        }
    }

    /** Baseline: M x N multiply-adds, c[n] += y c[n-1] over every state. */
    @Benchmark
    public double baselineMultiplyAdd() {
        double[] c = new double[N + 1];
        c[0] = 1;
        for (double y : stateFactors) {
            for (int n = N; n >= 1; n--) {
                c[n] += y * c[n - 1];
            }
        }
        return c[N];
    }

    @Benchmark
    public double canonicalFermionsZAndOccupations(OscillatorWorkload w) {
        Canonical c = Canonical.of(w.oscillator, Statistics.FERMI, N, 5.0);
        return c.lnZ() + c.occupations().perState(40);
    }

    @Benchmark
    public double canonicalBosonsZAndOccupations(OscillatorWorkload w) {
        Canonical c = Canonical.of(w.oscillator, Statistics.BOSE, N, 10.0);
        return c.lnZ() + c.occupations().perState(1) + c.condensate().mean();
    }

    /** 1,004,731 single-particle states in 181 degenerate levels (3D oscillator cut at 180), 100 temperatures. */
    @Benchmark
    public double chemicalPotentialMillionStatesHundredTemperatures() {
        ChemicalPotential.Solver fermi = ChemicalPotential.solver(millionStates, Statistics.FERMI);
        ChemicalPotential.Solver bose = ChemicalPotential.solver(millionStates, Statistics.BOSE);
        double s = 0;
        for (double t : temperatures) {
            s += fermi.forMeanNumber(10 * t, 100_000);
            s += bose.forMeanNumber(10 * t, 100_000);
        }
        return s;
    }

    /** 1e6 distinct non-degenerate levels, 100 temperatures. */
    @Benchmark
    public double chemicalPotentialMillionLevelsHundredTemperatures() {
        ChemicalPotential.Solver fermi = ChemicalPotential.solver(million, Statistics.FERMI);
        double s = 0;
        for (double t : temperatures) {
            s += fermi.forMeanNumber(t, 100_000);
        }
        return s;
    }
}
