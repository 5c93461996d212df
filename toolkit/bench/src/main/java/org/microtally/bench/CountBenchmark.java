package org.microtally.bench;

import java.math.BigInteger;
import java.util.concurrent.TimeUnit;
import org.microtally.count.CountTable;
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
 * Exact count tables for a 3D isotropic oscillator.
 *
 * <ul>
 *   <li>{@code fullTable}: N = 100, E = 600 (the size the project targets, <= 5 s each).</li>
 *   <li>{@code groupedSmall} vs {@code perStateSmall}: N = 100, E = 100, the library's grouped
 *       generating-function update against one pass per single-particle state
 *       ({@link PerStateCounter}), same arithmetic. {@link CountRatio} runs the pair and prints the ratio.</li>
 *   <li>{@code smallTable}: N = 40, E = 200, the size where fixed overheads show (see also
 *       {@code org.microtally.count.CountStagesBenchmark}, one core).</li>
 * </ul>
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
@Fork(1)
@Warmup(iterations = 1)
@Measurement(iterations = 3)
public class CountBenchmark {
    /** Size of the small comparison. */
    public static final int SMALL_N = 100;
    /** Energy of the small comparison. */
    public static final int SMALL_E = 100;

    @Param({"BOSE", "FERMI"})
    public String statistics;

    private Statistics stats;
    private Spectrum full;
    private Spectrum small;
    private Spectrum small40;
    private int smallPrimes;

    @Setup(Level.Trial)
    public void setUp() {
        stats = "BOSE".equals(statistics) ? Statistics.BOSE : Statistics.FERMI;
        full = Spectra.harmonicOscillator(3, 600);
        small = Spectra.harmonicOscillator(3, SMALL_E);
        small40 = Spectra.harmonicOscillator(3, 200);
        CountTable grouped = CountTable.of(small, stats, SMALL_N, SMALL_E);
        smallPrimes = Math.max(1, grouped.primesUsed());
        BigInteger[] base = PerStateCounter.count(small, stats, SMALL_N, SMALL_E, smallPrimes);
        for (int n = 0; n <= SMALL_N; n++) {
            for (int e = 0; e <= SMALL_E; e++) {
                if (!base[n * (SMALL_E + 1) + e].equals(grouped.count(n, e))) {
                    throw new IllegalStateException("baseline and library disagree at n=" + n + ", e=" + e);
                }
            }
        }
    }

    @Benchmark
    public CountTable fullTable() {
        return CountTable.of(full, stats, 100, 600);
    }

    @Benchmark
    public CountTable smallTable() {
        return CountTable.of(small40, stats, 40, 200);
    }

    @Benchmark
    public CountTable groupedSmall() {
        return CountTable.of(small, stats, SMALL_N, SMALL_E);
    }

    @Benchmark
    public BigInteger[] perStateSmall() {
        return PerStateCounter.count(small, stats, SMALL_N, SMALL_E, smallPrimes);
    }
}
