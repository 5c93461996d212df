package org.microtally.count;

import java.lang.management.ManagementFactory;
import java.lang.management.ThreadMXBean;
import java.math.BigInteger;
import java.util.Arrays;
import java.util.Random;
import java.util.function.DoubleSupplier;
import org.microtally.special.FermiDirac;
import org.microtally.special.Polylog;
import org.microtally.special.Zeta;
import org.microtally.spectrum.Spectra;
import org.microtally.spectrum.Spectrum;
import org.microtally.spectrum.Statistics;

/**
 * The same cases as the JMH benchmarks, timed by the CPU time of the measuring thread
 * ({@link ThreadMXBean#getCurrentThreadCpuTime}) instead of wall time, for a shared machine where
 * other processes take most of the wall clock: median of seven rounds after warm-up, on one thread
 * (the common fork-join pool gets parallelism 0, so the per-prime tasks run on the caller); the count
 * table stages are timed interleaved, round by round, and reported as median and range (see
 * {@code countTables}). Prints
 * each figure with its ratio to a baseline measured in the same run. Run:
 * {@code java -cp toolkit/bench/target/benchmarks.jar org.microtally.count.CpuTimeRatios}.
 */
public final class CpuTimeRatios {
    private CpuTimeRatios() { }

    private static final ThreadMXBean CPU = ManagementFactory.getThreadMXBean();
    private static double sink;

    /** Median CPU nanoseconds per call of f over seven rounds of {@code calls} calls, after two warm-up rounds. */
    static double cpuNanos(DoubleSupplier f, int calls) {
        double[] r = new double[9];
        for (int round = 0; round < r.length; round++) {
            long t0 = CPU.getCurrentThreadCpuTime();
            double s = 0;
            for (int i = 0; i < calls; i++) {
                s += f.getAsDouble();
            }
            r[round] = (CPU.getCurrentThreadCpuTime() - t0) / (double) calls;
            sink += s;
        }
        double[] counted = Arrays.copyOfRange(r, 2, r.length);
        Arrays.sort(counted);
        return counted[counted.length / 2];
    }

    public static void main(String[] args) {
        System.setProperty("java.util.concurrent.ForkJoinPool.common.parallelism", "0");
        if (args.length > 0 && args[0].equals("eos")) { // only the equation of state (runs against older jars too)
            equationOfState();
            return;
        }
        countTables();
        modularLoop();
        specialFunctions();
        equationOfState();
        System.out.println(sink == 42 ? "" : "done");
    }

    /**
     * The stages of one exact table (3D oscillator, bosons, one thread), timed in steady state on this
     * thread: every round times each stage once, in turn, so load changes hit all stages alike, and the
     * shares are taken round by round against the build plus full read of the same round. The first
     * rounds (at least {@link #WARM_UP_CPU_NANOS} of CPU time) only warm the JIT and the heap. The CRT
     * stage rebuilds every entry from the table's own residues with one {@code Moduli.Crt}, as the rows
     * of a read table are rebuilt.
     */
    private static void countTables() {
        System.out.println("load average before the count tables: " + loadAverage());
        for (int[] size : new int[][] {{40, 200}, {100, 600}}) {
            int n = size[0];
            int e = size[1];
            Spectrum s = Spectra.harmonicOscillator(3, e);
            int[] en = s.integerEnergies();
            int[] g = s.degeneracies();
            int entries = (n + 1) * (e + 1);
            int calls = n == 40 ? 5 : 1;
            long[] primes = Moduli.tablePrimes(CountTable.of(s, Statistics.BOSE, n, e).primesUsed());
            long[][] res = CountEngine.multiModularResidues(en, g, Statistics.BOSE, n, e, primes,
                    org.microtally.ProgressListener.NONE);
            Moduli.Crt crt = new Moduli.Crt(primes);
            DoubleSupplier[] stages = {
                () -> CountBound.log2Bound(en, g, Statistics.BOSE, n, e),
                () -> CountTable.of(s, Statistics.BOSE, n, e).primesUsed(),
                () -> {
                    CountTable t = CountTable.of(s, Statistics.BOSE, n, e);
                    double bits = 0;
                    for (int m = 0; m <= n; m++) {
                        for (int q = 0; q <= e; q++) {
                            bits += t.count(m, q).bitLength();
                        }
                    }
                    return bits;
                },
                () -> {
                    double bits = 0;
                    for (BigInteger v : crt.reconstructAll(res)) {
                        bits += v.bitLength();
                    }
                    return bits;
                },
            };
            double[][] r = interleaved(stages, calls, 15);
            double[] bound = r[0];
            double[] build = r[1];
            double[] buildRead = r[2];
            double[] crtTime = r[3];
            double[] crtShare = new double[crtTime.length];
            double[] boundShare = new double[crtTime.length];
            double[] bothShare = new double[crtTime.length];
            for (int i = 0; i < crtTime.length; i++) {
                crtShare[i] = 100 * crtTime[i] / buildRead[i];
                boundShare[i] = 100 * bound[i] / buildRead[i];
                bothShare[i] = crtShare[i] + boundShare[i];
            }
            System.out.printf("count table %dx%d Bose, one thread, %d primes, %d entries, median [min-max] of %d "
                    + "rounds: build %s ms, build + full read %s ms (%s ns per entry); CRT %s ns per entry; "
                    + "share of build + full read: CRT %s%%, bound %s%%, the two together %s%% (bound %s ms)%n",
                    n, e, primes.length, entries, crtTime.length, range(build, 1e-6), range(buildRead, 1e-6),
                    range(buildRead, 1.0 / entries), range(crtTime, 1.0 / entries), range(crtShare, 1),
                    range(boundShare, 1), range(bothShare, 1), range(bound, 1e-6));
        }
        System.out.println("load average after the count tables: " + loadAverage());
    }

    /** CPU time spent warming up {@link #interleaved} before any round is counted. */
    private static final long WARM_UP_CPU_NANOS = 2_000_000_000L;

    /**
     * CPU nanoseconds per call of each stage in each of {@code rounds} counted rounds ({@code [stage][round]});
     * a round runs {@code calls} calls of every stage in turn. Warm-up rounds run first until
     * {@link #WARM_UP_CPU_NANOS} have passed and at least five rounds were made.
     */
    static double[][] interleaved(DoubleSupplier[] stages, int calls, int rounds) {
        long warmStart = CPU.getCurrentThreadCpuTime();
        for (int round = 0; round < 5 || CPU.getCurrentThreadCpuTime() - warmStart < WARM_UP_CPU_NANOS; round++) {
            for (DoubleSupplier f : stages) {
                for (int i = 0; i < calls; i++) {
                    sink += f.getAsDouble();
                }
            }
        }
        double[][] out = new double[stages.length][rounds];
        for (int round = 0; round < rounds; round++) {
            for (int st = 0; st < stages.length; st++) {
                long t0 = CPU.getCurrentThreadCpuTime();
                double acc = 0;
                for (int i = 0; i < calls; i++) {
                    acc += stages[st].getAsDouble();
                }
                out[st][round] = (CPU.getCurrentThreadCpuTime() - t0) / (double) calls;
                sink += acc;
            }
        }
        return out;
    }

    /** "median [min-max]" of the values times {@code scale}, to three significant digits. */
    private static String range(double[] values, double scale) {
        double[] v = values.clone();
        Arrays.sort(v);
        return String.format("%.3g [%.3g-%.3g]", v[v.length / 2] * scale, v[0] * scale, v[v.length - 1] * scale);
    }

    private static void modularLoop() {
        int row = 601;
        long p62 = Moduli.primes(1)[0];
        long p50 = Moduli.fmaPrimes(1)[0];
        Random rnd = new Random(1);
        long[] t = new long[2 * row + 7];
        double[] d = new double[t.length];
        for (int i = 0; i < t.length; i++) {
            t[i] = Math.floorMod(rnd.nextLong(), p62);
            d[i] = Math.floorMod(rnd.nextLong(), p50);
        }
        long c = Math.floorMod(rnd.nextLong(), p62);
        long cs = Moduli.shoup(c, p62);
        double dc = Math.floorMod(rnd.nextLong(), p50);
        double[] scratch = new double[d.length];
        int calls = 20_000;
        double bare = cpuNanos(() -> {
            for (int i = 0; i < row; i++) {
                long s = t[row + 7 + i] + t[i];
                t[row + 7 + i] = s >= p62 ? s - p62 : s;
            }
            return t[row];
        }, calls) / row;
        double shoup = cpuNanos(() -> {
            for (int i = 0; i < row; i++) {
                t[row + 7 + i] = Moduli.add(t[row + 7 + i], Moduli.mulShoup(c, cs, t[i], p62), p62);
            }
            return t[row];
        }, calls) / row;
        double fma = cpuNanos(() -> {
            FmaModulus.mulAddRow(d, row + 7, d, 0, row, dc, p50, 1.0 / p50, scratch);
            return d[row];
        }, calls) / row;
        System.out.printf("modular multiply-add, rows of %d: bare 62-bit add %.3f ns, Shoup 62-bit %.3f ns, "
                + "FMA 50-bit %.3f ns per entry; FMA is %.2fx Shoup's throughput, %.2fx the bare add's%n",
                row, bare, shoup, fma, shoup / fma, bare / fma);
    }

    /** The three states of DegenerateMatterBenchmark: P + U + S with the solve, per call, with the load average around them. */
    private static void equationOfState() {
        System.out.println("load average before the EOS cases: " + loadAverage());
        double[] wiggle = {1e-12};
        double base = cpuNanos(() -> {
            wiggle[0] = -wiggle[0];
            return Math.exp(1.5 + wiggle[0]) + Math.pow(2.5 + wiggle[0], 1.5);
        }, 200_000);
        double[][] states = {{6, 7}, {3, 7}, {6, 9.5}};
        // warm-up over all three regimes first (30,000 calls each), so that the compiled code is the one every state
        // uses and, on a loaded machine, the JIT has finished before the first state's rounds are timed
        for (double[] state : states) {
            for (int i = 0; i < 30_000; i++) {
                wiggle[0] = -wiggle[0];
                sink += org.microtally.limit.RelativisticFermiGas.electrons(Math.pow(10, state[0]) * 1e3 * (1 + wiggle[0]), 2.0,
                        Math.pow(10, state[1])).pressure();
            }
        }
        for (double[] state : states) {
            double rho = Math.pow(10, state[0]) * 1e3;
            double kelvin = Math.pow(10, state[1]);
            double ns = cpuNanos(() -> {
                wiggle[0] = -wiggle[0];
                org.microtally.limit.RelativisticFermiGas gas =
                        org.microtally.limit.RelativisticFermiGas.electrons(rho * (1 + wiggle[0]), 2.0, kelvin);
                return gas.pressure() + gas.energyDensity() + gas.entropyDensity();
            }, 4000);
            System.out.printf("EOS 1e%.0f g/cm^3, 1e%.1f K: %.2f us CPU per call (%.0fx the exp + pow baseline %.1f ns)%n",
                    state[0], state[1], ns / 1e3, ns / base, base);
        }
        System.out.println("load average after: " + loadAverage());
    }

    /** The first three fields of /proc/loadavg, or "unavailable" where there is no such file. */
    private static String loadAverage() {
        try {
            String[] f = java.nio.file.Files.readString(java.nio.file.Path.of("/proc/loadavg")).trim().split("\\s+");
            return f[0] + " " + f[1] + " " + f[2];
        } catch (java.io.IOException | RuntimeException e) {
            return "unavailable";
        }
    }

    private static void specialFunctions() {
        int calls = 200_000;
        double[] wiggle = {1e-12};
        DoubleSupplier next = () -> {
            wiggle[0] = -wiggle[0];
            return wiggle[0];
        };
        double base = cpuNanos(() -> Math.exp(0.5 + next.getAsDouble()) + Math.pow(2.5 + next.getAsDouble(), 1.5), calls);
        double zeta = cpuNanos(() -> Zeta.zeta(1.5 + next.getAsDouble()), calls);
        double liNear = cpuNanos(() -> Polylog.li(1.5, 0.99 + next.getAsDouble()), calls);
        double liSeries = cpuNanos(() -> Polylog.li(2.5, 0.3 + next.getAsDouble()), calls);
        System.out.printf("baseline exp + pow %.1f ns; zeta(1.5) %.1f ns (%.1fx); Li_1.5(0.99) %.1f ns (%.1fx); "
                + "Li_2.5(0.3) %.1f ns (%.1fx)%n", base, zeta, zeta / base, liNear, liNear / base, liSeries, liSeries / base);
        for (double eta : new double[] {-5, 0.5, 10, 100}) {
            double fd = cpuNanos(() -> FermiDirac.integral(0.5, eta + next.getAsDouble()), calls);
            System.out.printf("F_1/2(%s) %.1f ns (%.1fx the baseline)%n", eta, fd, fd / base);
        }
    }
}
