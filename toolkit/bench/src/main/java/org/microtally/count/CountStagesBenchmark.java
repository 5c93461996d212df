package org.microtally.count;

import java.math.BigInteger;
import java.util.concurrent.TimeUnit;
import org.microtally.ProgressListener;
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
 * The stages of one exact count table (3D isotropic oscillator, bosons) on one core, so the fixed
 * overheads can be stated as fractions of the whole measured in the same run:
 * {@code wholeTable} (CountTable.of, every stage, residues on one thread; rows are rebuilt
 * on first read, so this no longer includes CRT), {@code wholeTableReadAll} (the same plus every row
 * read once: every entry rebuilt), {@code bound} (the
 * prime-count bound alone) and {@code crt} (Chinese remaindering of every entry from residues
 * prepared in the set-up). Lives in the count package to reach the package-private stages; benchmark
 * code only. Its fork sets {@code -Djava.util.concurrent.ForkJoinPool.common.parallelism=0}, so the
 * per-prime tasks run one after another on the calling thread: one core.
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
@Fork(value = 1, jvmArgsAppend = "-Djava.util.concurrent.ForkJoinPool.common.parallelism=0")
@Warmup(iterations = 2)
@Measurement(iterations = 5)
public class CountStagesBenchmark {
    /** N x E of the table. */
    @Param({"40x200", "100x600"})
    public String size;

    private int maxN;
    private int maxE;
    private int[] energy;
    private int[] deg;
    private Spectrum spectrum;
    private CountStages.Prepared crtInput;

    @Setup(Level.Trial)
    public void setUp() {
        String[] p = size.split("x");
        maxN = Integer.parseInt(p[0]);
        maxE = Integer.parseInt(p[1]);
        spectrum = Spectra.harmonicOscillator(3, maxE);
        energy = spectrum.integerEnergies();
        deg = spectrum.degeneracies();
        CountTable t = CountTable.of(spectrum, Statistics.BOSE, maxN, maxE);
        BigInteger[] exact = new BigInteger[(maxN + 1) * (maxE + 1)];
        for (int n = 0; n <= maxN; n++) {
            for (int e = 0; e <= maxE; e++) {
                exact[n * (maxE + 1) + e] = t.count(n, e);
            }
        }
        crtInput = CountStages.prepare(exact, t.primesUsed());
        if (!java.util.Arrays.equals(exact, CountStages.reconstruct(crtInput))) {
            throw new IllegalStateException("CRT stage does not reproduce the table");
        }
    }

    @Benchmark
    public CountTable wholeTable() {
        return CountTable.of(spectrum, Statistics.BOSE, maxN, maxE, ProgressListener.NONE);
    }

    /**
     * The table and then every entry read once: what a caller who uses the whole table pays, now that
     * rows are rebuilt from residues on first read ({@code wholeTable} alone no longer includes CRT).
     */
    @Benchmark
    public BigInteger wholeTableReadAll() {
        CountTable t = CountTable.of(spectrum, Statistics.BOSE, maxN, maxE, ProgressListener.NONE);
        BigInteger last = null;
        for (int n = 0; n <= maxN; n++) {
            last = t.total(n);
        }
        return last;
    }

    @Benchmark
    public double bound() {
        return CountBound.log2Bound(energy, deg, Statistics.BOSE, maxN, maxE);
    }

    @Benchmark
    public BigInteger[] crt() {
        return CountStages.reconstruct(crtInput);
    }
}
