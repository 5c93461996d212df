package org.microtally.bench;

import java.util.concurrent.TimeUnit;
import org.microtally.ProgressListener;
import org.microtally.ensemble.ExactDensityOfStates;
import org.microtally.lattice.Boundary;
import org.microtally.lattice.Lattice;
import org.microtally.lattice.Model;
import org.microtally.lattice.TransferMatrix;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Fork;
import org.openjdk.jmh.annotations.Level;
import org.openjdk.jmh.annotations.Measurement;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.Warmup;

/**
 * The transfer matrix's element-update rate against a bare modular-add loop in the same run.
 *
 * <p>{@code transferMatrix12}: free 12 x 12 Ising g(E) ({@link TransferMatrix.Cost#updates()} x primes
 * element updates, each a modular add of one table entry into another). {@code bareModularAdd}: the
 * same number of additions a + b mod p over two arrays of the transfer matrix's largest vector size (its
 * peak memory holds three),
 * with nothing else (no index arithmetic, no allocation): the ceiling for this kind of update.
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
@Fork(value = 1, jvmArgs = {"-Xmx2g"})
@Warmup(iterations = 2)
@Measurement(iterations = 5)
public class LatticeRateBenchmark {
    static final Lattice LATTICE = Lattice.square(12, 12, Boundary.FREE);
    static final Model ISING = Model.ising(Model.Coupling.FERROMAGNETIC);
    private static final long P = (1L << 62) - 57;

    /** Element updates of one transfer-matrix run (all primes). */
    public static double updates() {
        TransferMatrix.Cost c = TransferMatrix.estimate(LATTICE, ISING, false);
        return c.updates() * c.primes();
    }

    private long[] a;
    private long[] b;
    private long passes;

    @Setup(Level.Trial)
    public void setUp() {
        TransferMatrix.Cost c = TransferMatrix.estimate(LATTICE, ISING, false);
        int size = (int) (c.peakBytes() / 24);     // the Ising g(E) sweep holds three vectors of this size
        a = new long[size];
        b = new long[size];
        for (int i = 0; i < size; i++) {
            a[i] = (i * 0x9E3779B97F4A7C15L >>> 2) % P;
            b[i] = (i * 0xC2B2AE3D27D4EB4FL >>> 2) % P;
        }
        passes = Math.round(updates() / size);
    }

    @Benchmark
    public ExactDensityOfStates transferMatrix12() {
        return TransferMatrix.densityOfStates(LATTICE, ISING, ProgressListener.NONE);
    }

    @Benchmark
    public long bareModularAdd() {
        for (long pass = 0; pass < passes; pass++) {
            for (int i = 0; i < a.length; i++) {
                long x = a[i] + b[i] - P;
                a[i] = x + ((x >> 63) & P);
            }
        }
        return a[a.length / 2];
    }
}
