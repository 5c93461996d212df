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
 *   <li>{@code fmaOffsetScalar}: the previous library loop, 50-bit primes in doubles with source and
 *       destination at different offsets of one array; C2 leaves it scalar (kept here as the
 *       reference, the loop "today" in issue 13);</li>
 *   <li>{@code fmaRow}: the library's loop now, {@link FmaModulus#mulAddRow}: the source copied to a
 *       scratch row at the destination's column, then one-index loop that C2 vectorises (the copy is
 *       included in the time).</li>
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
    private double[] scratch;
    /** Row offsets as run-time values, as in the table (constants would let C2 prove more than it can there). */
    private int dstAt = ROW + 7;
    private int srcAt = 0;
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
        scratch = new double[table.length];
    }

    @Benchmark
    @OperationsPerInvocation(ROW)
    public long[] bareModularAdd() {
        long[] t = table;
        long p = P62;
        int d = dstAt;
        int from = srcAt;
        for (int e = 0; e < ROW; e++) {
            long s = t[d + e] + t[from + e];
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
        int d = dstAt;
        int s = srcAt;
        for (int e = 0; e < ROW; e++) {
            t[d + e] = Moduli.add(t[d + e], Moduli.mulShoup(cm, csh, t[s + e], p), p);
        }
        return t;
    }

    @Benchmark
    @OperationsPerInvocation(ROW)
    public double[] fmaOffsetScalar() {
        // the previous library loop: both rows of one array, at run-time offsets
        double[] t = dtable;
        for (int e = 0, d = dstAt, s = srcAt; e < ROW; e++) {
            t[d + e] = FmaModulus.mulAdd(t[d + e], dc, t[s + e], P50, 1.0 / P50);
        }
        return t;
    }

    @Benchmark
    @OperationsPerInvocation(ROW)
    public double[] fmaRow() {
        FmaModulus.mulAddRow(dtable, dstAt, dtable, srcAt, ROW, dc, P50, 1.0 / P50, scratch);
        return dtable;
    }
}
