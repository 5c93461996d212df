package org.microtally.bench;

import org.microtally.spectrum.Spectra;
import org.microtally.spectrum.Spectrum;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;

/**
 * The workload {@link EnsembleBenchmark} and {@link MixtureBenchmark} share (issue 3's size):
 * {@link #N} = 10,000 particles on the isotropic 3D oscillator cut at {@link #CUT} = 83 quanta
 * (102,340 single-particle states in 84 levels). A JMH state: benchmark methods receive it as a
 * parameter, built once per run.
 */
@State(Scope.Benchmark)
public class OscillatorWorkload {
    /** Particle number of every species in the two benchmarks. */
    public static final int N = 10_000;
    /** Oscillator cutoff in quanta. */
    public static final int CUT = 83;

    /** The 3D isotropic oscillator cut at {@link #CUT}. */
    public Spectrum oscillator;

    @Setup
    public void setUp() {
        oscillator = Spectra.harmonicOscillator(3, CUT);
    }
}
