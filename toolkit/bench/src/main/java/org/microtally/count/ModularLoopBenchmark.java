package org.microtally.count;

import java.util.Random;
import java.util.concurrent.TimeUnit;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Fork;
import org.openjdk.jmh.annotations.Level;
import org.openjdk.jmh.annotations.Measurement;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OperationsPerInvocation;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.Warmup;

/**
 * The counting inner loop, t[d + e] = (t[d + e] + c t[s + e]) mod p over one row, in ns per element:
 * <ul>
 *   <li>{@code bareModularAdd}: t[d+e] = (t[d+e] + t[s+e]) mod p, 62-bit longs, the floor any
 *       modular loop pays (baseline);</li>
 *   <li>{@code shoupScalar}: the multiply-add as the library did it before, 62-bit primes with
 *       Shoup's precomputed quotient (kept here as the reference the new loop is measured against);</li>
 *   <li>{@code fmaRow}: the library's loop now, {@link FmaModulus#mulAddRow}, primes below 2^50 in
 *       doubles (meant for SIMD code; C2 on JDK 17 leaves it scalar, see FmaModulus).</li>
 * </ul>
 * Rows of {@value #ROW} entries, source and destination rows in one array as in the table.
 */
@State(Scope.Thread)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.NANOSECONDS)
@Fork(1)
@Warmup(iterations = 3, time = 1)
@Measurement(iterations = 5, time = 1)
public class ModularLoopBenchmark {
    /** Entries per row (a table of E = 600 has 601). */
    public static final int ROW = 601;

    private static final long P62 = (1L << 62) - 57; // prime below 2^62 (checked in setUp)

    private static final long P50 = (1L << 50) - 27; // prime below 2^50 (checked in setUp)

    private long[] table;
    private double[] dtable;
    private double dc;
    private long c;
    private long cShoup;

    @Setup(Level.Trial)
    public void setUp() {
        if (!Moduli.isPrime(P62)) {
            throw new IllegalStateException("not prime: " + P62);
        }
        Random rnd = new Random(1);
        table = new long[2 * ROW + 7];
        for (int i = 0; i < table.length; i++) {
            table[i] = Math.floorMod(rnd.nextLong(), P62);
        }
        c = Math.floorMod(rnd.nextLong(), P62);
        cShoup = Moduli.shoup(c, P62);
        if (!Moduli.isPrime(P50)) {
            throw new IllegalStateException("not prime: " + P50);
        }
        dtable = new double[table.length];
        for (int i = 0; i < table.length; i++) {
            dtable[i] = Math.floorMod(table[i], P50);
        }
        dc = Math.floorMod(c, P50);
    }

    @Benchmark
    @OperationsPerInvocation(ROW)
    public long[] bareModularAdd() {
        long[] t = table;
        long p = P62;
        int d = ROW + 7;
        for (int e = 0; e < ROW; e++) {
            long s = t[d + e] + t[e];
            t[d + e] = s >= p ? s - p : s;
        }
        return t;
    }

    @Benchmark
    @OperationsPerInvocation(ROW)
    public long[] shoupScalar() {
        long[] t = table;
        long p = P62;
        long cm = c;
        long csh = cShoup;
        int d = ROW + 7;
        for (int e = 0; e < ROW; e++) {
            t[d + e] = Moduli.add(t[d + e], Moduli.mulShoup(cm, csh, t[e], p), p);
        }
        return t;
    }

    @Benchmark
    @OperationsPerInvocation(ROW)
    public double[] fmaRow() {
        FmaModulus.mulAddRow(dtable, ROW + 7, dtable, 0, ROW, dc, P50, 1.0 / P50);
        return dtable;
    }
}
