package org.microtally.bench;

import java.util.concurrent.TimeUnit;
import org.microtally.ProgressListener;
import org.microtally.count.CountTable;
import org.microtally.ensemble.Canonical;
import org.microtally.ensemble.ExactDensityOfStates;
import org.microtally.lattice.Boundary;
import org.microtally.lattice.Lattice;
import org.microtally.lattice.Model;
import org.microtally.lattice.TransferMatrix;
import org.microtally.occupation.ChemicalPotential;
import org.microtally.spectrum.Spectra;
import org.microtally.spectrum.Spectrum;
import org.microtally.spectrum.Statistics;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Fork;
import org.openjdk.jmh.annotations.Level;
import org.openjdk.jmh.annotations.Measurement;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Param;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.Warmup;

/**
 * Time against work at four sizes each, for {@link ScalingChart}: the exact Bose count table of a
 * 3D oscillator (work N x E x levels), the canonical boson solver on equally spaced single states at a
 * temperature where every state's series keeps all N + 1 terms (work N x states; the previous version
 * used a 3D oscillator at kT = 10, where most series are cut short and N x states was not the work
 * done), the chemical potential solve for distinct levels (work levels x temperatures) and the
 * transfer matrix for the free L x L square Ising g(E) at L = 6, 8, 10, 12 (work: its element updates
 * over all primes, {@link TransferMatrix.Cost#updates()} x primes, which grow like 2^L x sites x table
 * size: time is plotted against this work, not against the width).
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
@Fork(1)
@Warmup(iterations = 1)
@Measurement(iterations = 3)
public class ScalingBenchmark {
    /** Size index 0 .. 3. */
    @Param({"0", "1", "2", "3"})
    public int scale;

    static final int[] COUNT_N = {20, 40, 60, 80};
    static final int[] COUNT_E = {100, 200, 300, 400};
    static final int[] CANONICAL_N = {1000, 2000, 5000, 10000};
    static final int[] CANONICAL_LEVELS = {1000, 2000, 5000, 10000};
    static final double CANONICAL_SPACING = 1e-3;
    static final int[] MU_LEVELS = {10_000, 30_000, 100_000, 300_000};
    static final int TEMPERATURES = 100;
    static final int[] LATTICE_WIDTH = {6, 8, 10, 12};
    static final Model ISING = Model.ising(Model.Coupling.FERROMAGNETIC);

    private Spectrum countSpectrum;
    private Spectrum canonicalSpectrum;
    private ChemicalPotential.Solver muSolver;
    private Lattice lattice;

    @Setup(Level.Trial)
    public void setUp() {
        countSpectrum = Spectra.harmonicOscillator(3, COUNT_E[scale]);
        canonicalSpectrum = Spectra.equallySpaced(CANONICAL_LEVELS[scale], CANONICAL_SPACING);
        muSolver = ChemicalPotential.solver(Spectra.equallySpaced(MU_LEVELS[scale], 1e-3), Statistics.FERMI);
        lattice = square(scale);
    }

    /** The free L x L square lattice of a size index. */
    static Lattice square(int scale) {
        return Lattice.square(LATTICE_WIDTH[scale], LATTICE_WIDTH[scale], Boundary.FREE);
    }

    /** kT a thousand times the top level energy: full-length series for every state. */
    private double canonicalKT() {
        return 1e3 * CANONICAL_LEVELS[scale] * CANONICAL_SPACING;
    }

    /** Work of each benchmark at a size index, in the units the chart states. */
    static double work(String benchmark, int scale) {
        switch (benchmark) {
            case "countTable":
                // N x E x levels (the E + 1 oscillator levels up to E)
                return (double) COUNT_N[scale] * COUNT_E[scale] * (COUNT_E[scale] + 1);
            case "canonicalBosons":
                // N x states: at kT = canonicalKT every Boltzmann factor is above e^-0.001, so no state's series is
                // flushed below N terms and the solver really does N multiply-adds per state (at a low temperature the
                // support of each series shrinks, and N x states overstates the work)
                return (double) CANONICAL_N[scale] * CANONICAL_LEVELS[scale];
            case "muSolve":
                return (double) MU_LEVELS[scale] * TEMPERATURES;
            case "transferMatrix":
                // element updates (modular adds of one table entry) over all primes, from the sweep's own cost estimate
                TransferMatrix.Cost c = TransferMatrix.estimate(square(scale), ISING, false);
                return c.updates() * c.primes();
            default:
                throw new IllegalArgumentException(benchmark);
        }
    }

    @Benchmark
    public CountTable countTable() {
        return CountTable.of(countSpectrum, Statistics.BOSE, COUNT_N[scale], COUNT_E[scale]);
    }

    @Benchmark
    public double canonicalBosons() {
        return Canonical.of(canonicalSpectrum, Statistics.BOSE, CANONICAL_N[scale], canonicalKT()).lnZ();
    }

    @Benchmark
    public double muSolve() {
        double s = 0;
        for (int t = 0; t < TEMPERATURES; t++) {
            s += muSolver.forMeanNumber(0.5 + 0.05 * t, MU_LEVELS[scale] / 10.0);
        }
        return s;
    }

    @Benchmark
    public ExactDensityOfStates transferMatrix() {
        return TransferMatrix.densityOfStates(lattice, ISING, ProgressListener.NONE);
    }
}
