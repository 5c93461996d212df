package org.microtally.bench;

import java.util.concurrent.TimeUnit;
import org.microtally.ProgressListener;
import org.microtally.ensemble.ExactDensityOfStates;
import org.microtally.lattice.Boundary;
import org.microtally.lattice.Kaufman;
import org.microtally.lattice.Lattice;
import org.microtally.lattice.Model;
import org.microtally.lattice.TransferMatrix;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Fork;
import org.openjdk.jmh.annotations.Measurement;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.Warmup;

/**
 * Exact lattice densities of states, one full computation per measurement (single-shot):
 * <ul>
 *   <li>{@code kaufman32}, {@code kaufman64}: periodic L x L square Ising g(E) by Kaufman's formula
 *       (targets 2 s and 60 s).</li>
 *   <li>{@code freeIsing16}: free 16 x 16 square Ising g(E) by transfer matrix (target 3 min);
 *       {@code freeIsingMagnetisation10}: free 10 x 10 g(E, M) (1 min); {@code freePotts3By8}: free
 *       8 x 8 three-state Potts g(E) (1 min).</li>
 * </ul>
 * Each run is seconds to minutes long, so there is no warm-up iteration (JIT warm-up is a
 * small part of it). The update rate against a bare modular-add loop is in {@link LatticeRateBenchmark}; {@link LatticeRatio}
 * runs both and prints the numbers.
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.SingleShotTime)
@OutputTimeUnit(TimeUnit.SECONDS)
@Fork(value = 1, jvmArgs = {"-Xmx3g"})
@Warmup(iterations = 0)
@Measurement(iterations = 2)
public class LatticeBenchmark {
    private static final Model ISING = Model.ising(Model.Coupling.FERROMAGNETIC);

    @Benchmark
    public ExactDensityOfStates kaufman32() {
        return Kaufman.densityOfStates(32, 32, ProgressListener.NONE);
    }

    @Benchmark
    public ExactDensityOfStates kaufman64() {
        return Kaufman.densityOfStates(64, 64, ProgressListener.NONE);
    }

    @Benchmark
    public ExactDensityOfStates freeIsing16() {
        return TransferMatrix.densityOfStates(Lattice.square(16, 16, Boundary.FREE), ISING, ProgressListener.NONE);
    }

    @Benchmark
    public ExactDensityOfStates freeIsingMagnetisation10() {
        return TransferMatrix.withMagnetisation(Lattice.square(10, 10, Boundary.FREE), ISING, ProgressListener.NONE);
    }

    @Benchmark
    public ExactDensityOfStates freePotts3By8() {
        return TransferMatrix.densityOfStates(Lattice.square(8, 8, Boundary.FREE), Model.potts(3, Model.Coupling.FERROMAGNETIC),
                ProgressListener.NONE);
    }
}
