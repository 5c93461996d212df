import java.util.ArrayList;
import java.util.Arrays;
import java.util.Collections;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.stream.IntStream;
import org.apache.spark.sql.SparkSession;
import org.microtally.ProgressListener;
import org.microtally.count.CountTable;
import org.microtally.count.PrimePlan;
import org.microtally.spark.Clusters;
import org.microtally.spark.DistributedCountTable;
import org.microtally.spark.Ensemble;
import org.microtally.spark.SpectrumSpec;
import org.microtally.spark.Sweep;
import org.microtally.spark.SweepGrid;
import org.microtally.spark.SweepResult;
import org.microtally.spark.DistributedLabelledCounts;
import org.microtally.spark.DistributedLattice;
import org.microtally.count.LabelledCountTable;
import org.microtally.count.LabelledPrimePlan;
import org.microtally.lattice.Boundary;
import org.microtally.lattice.Lattice;
import org.microtally.lattice.LatticeTasks;
import org.microtally.lattice.Model;
import org.microtally.lattice.TransferMatrix;
import org.microtally.spectrum.Spectra;
import org.microtally.spectrum.Spectrum;
import org.microtally.spectrum.Statistics;

/**
 * Measured script (run by spark-scaling.sh, not part of any test run); prints a plain two-column table,
 * the load average first and last. In one JVM: the distributed count table against the local
 * multi-modular path (nine alternating pairs after five warm-up pairs in one local[2] session, each
 * checked bit-identical),
 * local[1] against local[2] for the count table, two 2,000-point trap sweeps, a labelled table, a
 * lattice g(E, M) and a prefix enumeration; the count table's and the sweeps' speed-ups beside the
 * ceiling of the same work in 1 and 2 plain Java threads, measured in the same alternating sessions
 * (cores obtained = worker CPU time / wall time says how much of the machine a run got); the per-task and driver (CRT) costs that a projection
 * to a cluster needs, and the on-paper 64-executor projections for a 16 x 16 free-boundary Ising
 * g(E, M) and a 10^6-point sweep.
 *
 * <p>The two sweeps: the light one has notebook 08's axes (traps r:r:1, r = 3..6, N 10..160, kT 0.25..5.15,
 * both ensembles) with a fixed cutoff of 80 quanta, a few tenths of a second of work on one thread, so
 * Spark's fixed cost per job shows; the work-dominated one has the same traps with N 100..1600, kT
 * 0.6..30 and the cutoff following kT (max(30, 3 kT) quanta: at high kT a coarse cutoff, said in each
 * row's warnings, which does not matter for timing), about 3-4 s of work on one thread. Likewise two count
 * tables: N = 100, E = 600 (the overhead target's size, a few tenths of a second) and a work-dominated
 * one (N = WORK_N, E = WORK_E, seconds of prime work). Every time is the
 * median of REPEATS runs after one warm-up run; the local[1] and local[2] sessions alternate, one run of
 * each workload per session. Arguments: N E REPEATS [LATTICE_SIDE (default 8)].
 */
public class SparkScaling {
    /** Overhead pairs (distributed, local) measured, alternating which goes first, after WARM_PAIRS unmeasured. */
    static final int PAIRS = 9;
    static final int WARM_PAIRS = 5;
    /** The work-dominated count table of the scaling rows (3D oscillator, Bose). */
    static final int WORK_N = 200;
    static final int WORK_E = 1100;
    static double median(List<Double> xs) {
        double[] a = xs.stream().mapToDouble(Double::doubleValue).sorted().toArray();
        return a.length % 2 == 1 ? a[a.length / 2] : 0.5 * (a[a.length / 2 - 1] + a[a.length / 2]);
    }

    static double seconds(Runnable r) {
        long t0 = System.nanoTime();
        r.run();
        return (System.nanoTime() - t0) / 1e9;
    }

    /** The light 2,000-point sweep (see the class notes). */
    static SweepGrid trapGrid() {
        List<SpectrumSpec> traps = new ArrayList<>();
        for (int r = 3; r <= 6; r++) {
            traps.add(SpectrumSpec.oscillator(new int[] {r, r, 1}, 80));
        }
        double[] kTs = IntStream.range(0, 50).mapToDouble(i -> 0.25 + 0.1 * i).toArray();
        return SweepGrid.of(traps, new int[] {10, 20, 40, 80, 160}, kTs, List.of(Statistics.BOSE),
                List.of(Ensemble.CANONICAL, Ensemble.GRAND_CANONICAL));
    }

    /** The work-dominated 2,000-point sweep (see the class notes). */
    static SweepGrid workGrid() {
        List<SpectrumSpec> traps = new ArrayList<>();
        for (int r = 3; r <= 6; r++) {
            traps.add(SpectrumSpec.oscillatorFollowingKT(new int[] {r, r, 1}, WORK_MIN_CUTOFF, WORK_CUTOFF_PER_KT));
        }
        double[] kTs = IntStream.range(0, 50).mapToDouble(i -> 0.6 + (30 - 0.6) * i / 49).toArray();
        return SweepGrid.of(traps, new int[] {100, 200, 400, 800, 1600}, kTs, List.of(Statistics.BOSE),
                List.of(Ensemble.CANONICAL, Ensemble.GRAND_CANONICAL));
    }

    /** The work-dominated sweep's cutoff, max(30, 3 kT) quanta. */
    static final int WORK_MIN_CUTOFF = 30;
    static final double WORK_CUTOFF_PER_KT = 3;

    /** Notebook 08's grid: cutoff max(30, 15 kT), N 5..80, kT 0.2..8.04 (for the bytes held per row). */
    static SweepGrid notebookGrid() {
        List<SpectrumSpec> traps = new ArrayList<>();
        for (int r = 3; r <= 6; r++) {
            traps.add(SpectrumSpec.oscillatorFollowingKT(new int[] {r, r, 1}, 30, 15));
        }
        double[] kTs = IntStream.range(0, 50).mapToDouble(i -> 0.2 + 0.16 * i).toArray();
        return SweepGrid.of(traps, new int[] {5, 10, 20, 40, 80}, kTs, List.of(Statistics.BOSE),
                List.of(Ensemble.CANONICAL, Ensemble.GRAND_CANONICAL));
    }

    /** One line of the output table. */
    static void row(String what, String value) {
        System.out.printf(Locale.ROOT, "%-60s | %s%n", what, value);
    }

    static void row(String what, String format, Object... args) {
        row(what, String.format(Locale.ROOT, format, args));
    }

    static double usedHeap() {
        Runtime rt = Runtime.getRuntime();
        for (int i = 0; i < 4; i++) {
            System.gc();
        }
        return rt.totalMemory() - rt.freeMemory();
    }

    public static void main(String[] args) {
        int n = Integer.parseInt(args[0]);
        int e = Integer.parseInt(args[1]);
        int repeats = Integer.parseInt(args[2]);
        int side = args.length > 3 ? Integer.parseInt(args[3]) : 8;
        row("load average at the start (1, 5, 15 min)", String.join(" ", Arrays.copyOf(loadAverage(), 3)));
        Spectrum s = Spectra.harmonicOscillator(3, e);
        Statistics st = Statistics.BOSE;
        row("workload", "3D oscillator, Bose, N = %d, E = %d; %d repeats (median); %d cores", n, e, repeats,
                Runtime.getRuntime().availableProcessors());

        // per-prime task time and the driver's CRT + check, measured without Spark
        PrimePlan plan = PrimePlan.of(s, st, n, e, 1);
        long[][] res = new long[plan.primeCount()][];
        List<Double> perPrime = new ArrayList<>();
        for (int i = 0; i < plan.primeCount(); i++) {
            int k = i;
            perPrime.add(seconds(() -> res[k] = plan.residues(k, ProgressListener.NONE)));
        }
        List<Double> crt = new ArrayList<>();
        List<Double> check = new ArrayList<>();
        List<Double> checkRead = new ArrayList<>();
        for (int r = 0; r < repeats; r++) {
            crt.add(seconds(() -> plan.recombine(res)));
            check.add(seconds(() -> plan.table(s, res)));
            checkRead.add(seconds(() -> readAll(plan.table(s, res))));
        }
        row("primes (required + redundant)", "%d + %d", plan.requiredPrimes(), plan.redundantPrimes());
        row("one prime's residues, no Spark", "%.3f s (median of %d)", median(perPrime), perPrime.size());
        row("driver eager CRT + check (PrimePlan.recombine)", "%.3f s for %d entries", median(crt), plan.entries());
        row("driver redundant-prime check alone (PrimePlan.table)", "%.4f s", median(check));
        row("driver check + reading every row", "%.3f s", median(checkRead));

        SweepGrid light = trapGrid();
        SweepGrid work = workGrid();

        // labelled table: the spin-resolved dot orbitals (2D oscillator by angular momentum), fermions
        Spectrum dot = Spectra.oscillator2dByAngularMomentum(30);
        LabelledPrimePlan lplan = LabelledPrimePlan.forTable(dot, Statistics.FERMI, 24, 30, 1);
        long[][] lres = new long[lplan.primeCount()][];
        List<Double> lPrime = new ArrayList<>();
        for (int i = 0; i < lplan.primeCount(); i++) {
            int k = i;
            lPrime.add(seconds(() -> lres[k] = lplan.residues(k)));
        }
        List<Double> lCrt = new ArrayList<>();
        List<Double> lBig = new ArrayList<>();
        for (int r = 0; r < repeats; r++) {
            lCrt.add(seconds(() -> lplan.table(lres)));
            lBig.add(seconds(() -> LabelledCountTable.of(dot, Statistics.FERMI, 24, 30)));
        }
        row("labelled table (2D dot by m, Fermi, N = 24, E = 30)", "%d primes; one prime %.3f s; driver CRT + check "
                + "%.3f s; local BigInteger path %.3f s", lplan.primeCount(), median(lPrime), median(lCrt), median(lBig));

        // lattice: one prime's transfer-matrix sweep of an L x L free Ising g(E, M), to get the update rate
        Model ising = Model.ising(Model.Coupling.FERROMAGNETIC);
        Lattice sq = Lattice.square(side, side, Boundary.FREE);
        LatticeTasks lt = LatticeTasks.of(sq, ising, true);
        long[][] latRes = new long[lt.primeCount()][];
        List<Double> latPrime = new ArrayList<>();
        for (int i = 0; i < lt.primeCount(); i++) {
            int k = i;
            latPrime.add(seconds(() -> latRes[k] = lt.residues(k)));
        }
        List<Double> latCrt = new ArrayList<>();
        for (int r = 0; r < repeats; r++) {
            latCrt.add(seconds(() -> lt.fromResidues(latRes)));
        }
        TransferMatrix.Cost small = TransferMatrix.estimate(sq, ising, true);
        double rate = small.updates() / median(latPrime);
        row(String.format(Locale.ROOT, "lattice %dx%d free Ising g(E, M)", side, side), "%d primes; one prime %.3f s "
                + "(%.3g updates, %.3g updates/s); driver CRT + checks of %d entries %.4f s", lt.primeCount(),
                median(latPrime), small.updates(), rate, latRes[0].length, median(latCrt));

        // local[2] and local[1] sessions alternate (2, 1, 1, 2, 2, 1, ...), one measurement of each workload per
        // session after a warm-up of each, so a load that drifts during the run biases neither side
        Lattice enumLattice = Lattice.square(5, 5, Boundary.FREE);
        // a count table where the prime work dominates Spark's fixed costs, as the work-dominated sweep does
        Spectrum s2 = Spectra.harmonicOscillator(3, WORK_E);
        PrimePlan plan2 = PrimePlan.of(s2, st, WORK_N, WORK_E, 1);
        List<Integer> primeIndices = IntStream.range(0, plan.requiredPrimes()).boxed().toList();
        String[] names = {"count table", "empty job", "light sweep", "work sweep", "labelled", "lattice", "enumeration",
            "work table"};
        List<List<List<Double>>> times = runs(names.length);       // [workload][threads] -> runs
        List<List<List<Double>>> plainTimes = runs(4);              // prime tasks, light sweep, work sweep, work table
        List<List<List<Double>>> plainCores = runs(4);
        for (int r = 0; r < repeats; r++) {
            for (int threads : r % 2 == 0 ? new int[] {2, 1} : new int[] {1, 2}) {
                SparkSession spark = Clusters.local(threads);
                org.apache.spark.api.java.JavaSparkContext jsc =
                        org.apache.spark.api.java.JavaSparkContext.fromSparkContext(spark.sparkContext());
                Runnable[] workloads = {
                    () -> DistributedCountTable.of(spark, s, st, n, e),
                    // an empty job of as many tasks as the distributed table uses (its required primes dealt to the
                    // threads; the redundant prime is computed on the driver)
                    () -> jsc.parallelize(primeIndices, Math.min(primeIndices.size(), threads)).collect(),
                    () -> Sweep.run(spark, light),
                    () -> Sweep.run(spark, work),
                    () -> DistributedLabelledCounts.table(spark, dot, Statistics.FERMI, 24, 30, ProgressListener.NONE),
                    () -> DistributedLattice.densityOfStates(spark, sq, ising, true, ProgressListener.NONE),
                    () -> DistributedLattice.enumerate(spark, enumLattice, ising, true, ProgressListener.NONE),
                    () -> DistributedCountTable.of(spark, s2, st, WORK_N, WORK_E),
                };
                // the ceilings: the same work in plain Java threads (no Spark), as many as the session has, split
                // as the Spark tasks split it, measured in the same session so a drifting load meets both alike
                Runnable[] plain = {
                    () -> inThreads(threads, plan.requiredPrimes(), plan.primeCount(),
                            i -> plan.residues(i, ProgressListener.NONE)),
                    () -> inThreads(threads, 2, t -> drain(Sweep.taskRows(light, t, 2))),
                    () -> inThreads(threads, 2, t -> drain(Sweep.taskRows(work, t, 2))),
                    () -> inThreads(threads, plan2.requiredPrimes(), plan2.primeCount(),
                            i -> plan2.residues(i, ProgressListener.NONE)),
                };
                for (Runnable warm : workloads) {
                    warm.run();
                }
                for (Runnable warm : plain) {
                    warm.run();
                }
                for (int w = 0; w < workloads.length; w++) {
                    times.get(w).get(threads).add(seconds(workloads[w]));
                }
                for (int w = 0; w < plain.length; w++) {
                    double wall = seconds(plain[w]);
                    plainTimes.get(w).get(threads).add(wall);
                    plainCores.get(w).get(threads).add(lastCpuSeconds / wall);
                }
                spark.stop();
            }
        }
        double[][] med = new double[names.length][3];
        for (int w = 0; w < names.length; w++) {
            for (int t = 1; t <= 2; t++) {
                med[w][t] = median(times.get(w).get(t));
            }
        }
        double[][] ceilings = new double[4][];
        for (int w = 0; w < 4; w++) {
            ceilings[w] = new double[] {median(plainTimes.get(w).get(1)), median(plainTimes.get(w).get(2)),
                median(plainCores.get(w).get(1)), median(plainCores.get(w).get(2))};
        }
        ceilingRows("prime tasks", ceilings[0]);
        ceilingRows("light 2,000-point sweep (2 interleaved task shares)", ceilings[1]);
        ceilingRows("work-dominated 2,000-point sweep (2 task shares)", ceilings[2]);
        ceilingRows(String.format(Locale.ROOT, "prime tasks of the work-dominated table (N = %d, E = %d)", WORK_N, WORK_E),
                ceilings[3]);
        speedUpRow("distributed CountTable", med[0], ceilings[0]);
        speedUpRow(String.format(Locale.ROOT, "work-dominated distributed CountTable (N = %d, E = %d, %d + %d primes)",
                WORK_N, WORK_E, plan2.requiredPrimes(), plan2.redundantPrimes()), med[7], ceilings[3]);
        row("empty Spark job of min(" + plan.primeCount() + " primes, threads) tasks", "local[2] %.3f s, local[1] %.3f s",
                med[1][2], med[1][1]);
        speedUpRow("light 2,000-point sweep (Sweep.run)", med[2], ceilings[1]);
        speedUpRow("work-dominated 2,000-point sweep (Sweep.run)", med[3], ceilings[2]);
        row("sweep cost per point per core, local[2]", "light %.3f ms, work-dominated %.3f ms",
                2 * med[2][2] / 2000 * 1e3, 2 * med[3][2] / 2000 * 1e3);
        speedUpRow("distributed labelled table", med[4], null);
        speedUpRow(String.format(Locale.ROOT, "distributed lattice %dx%d g(E, M)", side, side), med[5], null);
        speedUpRow("prefix enumeration 5x5 free Ising (2^25 configurations)", med[6], null);

        // the count-table overhead: distributed local[2] vs the local multi-modular path on the same 2 cores, in
        // alternating pairs in one session, each pair checked bit-identical
        SparkSession spark = Clusters.local(2);
        for (int warm = 0; warm < WARM_PAIRS; warm++) {
            DistributedCountTable.of(spark, s, st, n, e);
            CountTable.of(s, st, n, e);
        }
        List<Double> ratios = new ArrayList<>();
        List<Double> distTimes = new ArrayList<>();
        List<Double> localTimes = new ArrayList<>();
        int identical = 0;
        for (int pair = 0; pair < PAIRS; pair++) {
            DistributedCountTable[] d = new DistributedCountTable[1];
            CountTable[] loc = new CountTable[1];
            double td;
            double tl;
            if (pair % 2 == 0) {
                td = seconds(() -> d[0] = DistributedCountTable.of(spark, s, st, n, e));
                tl = seconds(() -> loc[0] = CountTable.of(s, st, n, e));
            } else {
                tl = seconds(() -> loc[0] = CountTable.of(s, st, n, e));
                td = seconds(() -> d[0] = DistributedCountTable.of(spark, s, st, n, e));
            }
            Optional<String> diff = d[0].firstDifference(loc[0]);
            if (diff.isPresent()) {
                throw new IllegalStateException("distributed table differs from the local one: " + diff.get());
            }
            identical++;
            distTimes.add(td);
            localTimes.add(tl);
            ratios.add(td / tl);
        }
        spark.stop();
        row("count table local (multi-modular, fork-join, 2 cores)", "median %.3f s (min %.3f, max %.3f)",
                median(localTimes), Collections.min(localTimes), Collections.max(localTimes));
        row("count table distributed local[2]", "median %.3f s (min %.3f, max %.3f)",
                median(distTimes), Collections.min(distTimes), Collections.max(distTimes));
        row("OVERHEAD distributed / local, " + PAIRS + " alternating pairs after " + WARM_PAIRS + " warm-up pairs",
                "median %.2fx (min %.2fx, max %.2fx); %d of %d bit-identical",
                median(ratios), Collections.min(ratios), Collections.max(ratios), identical, PAIRS);
        row("  of which: the redundant prime (on the driver, sharing the 2 cores)", "about %.3f s (half of one prime: "
                + "%d primes on 2 cores against the local path's %d)", median(perPrime) / 2, plan.primeCount(),
                plan.requiredPrimes());
        row("  of which: an empty job of as many tasks (2)", "%.3f s (in the alternating sessions, less warmed up)", med[1][2]);
        row("  of which: the driver's check", "%.4f s", median(check));

        // bytes a held sweep row takes on the driver (Sweep.BYTES_PER_ROW is the estimate), on notebook 08's grid
        SparkSession heapSession = Clusters.local(2);
        SweepGrid nb = notebookGrid();
        Sweep.run(heapSession, nb);
        double before = usedHeap();
        SweepResult held = Sweep.run(heapSession, nb);
        double after = usedHeap();
        row("held sweep result on the driver (notebook 08's grid)", "%.0f bytes per row (%d rows; compare the "
                + "refusal's estimate, Sweep.BYTES_PER_ROW)", (after - before) / held.size(), held.size());
        if (held.size() != nb.size()) {
            throw new IllegalStateException("held rows " + held.size());
        }
        heapSession.stop();

        // on paper: 64 executors, each one core, from the measured rates above
        Lattice big = Lattice.square(16, 16, Boundary.FREE);
        TransferMatrix.Cost bigCost = TransferMatrix.estimate(big, ising, true);
        int bigTasks = bigCost.primes() + LatticeTasks.REDUNDANT_PRIMES;
        double bigTask = bigCost.updates() / rate;
        int bigEntries = (big.bonds() + 1) * (big.sites() + 1);
        double crtPerEntryPrime2 = median(latCrt) / (latRes[0].length * Math.pow(lt.primeCount(), 2));
        double bigCrt = crtPerEntryPrime2 * bigEntries * Math.pow(bigTasks, 2);
        row("PROJECTION 16x16 free Ising g(E, M) on 64 executors", "%d prime tasks (at most %d executors busy), one "
                + "task %.3g updates = %.3g h at the measured rate, peak state vectors %.3g GB per executor; driver CRT "
                + "of %d entries about %.3g s; wall time about %.3g h", bigTasks, Math.min(64, bigTasks), bigCost.updates(),
                bigTask / 3600, bigCost.peakBytes() / 1e9, bigEntries, bigCrt, (Math.ceil(bigTasks / 64.0) * bigTask + bigCrt) / 3600);
        // on paper, the split that would make it practical (not implemented): evaluate the magnetic fugacity z at
        // sites + 1 distinct points modulo each prime, so each task sweeps polynomials in the energy only, and
        // interpolate in z (Vandermonde, sites + 1 points) on the driver. A z-task is a g(E) sweep without
        // the spin-flip symmetry the g(E) estimate uses (which stores half the states): twice its memory and updates.
        TransferMatrix.Cost eOnly = TransferMatrix.estimate(big, ising, false);
        int zPoints = big.sites() + 1;
        long zTasks = (long) bigTasks * zPoints;
        double zTask = 2 * eOnly.updates() / rate;
        double interpolation = (double) bigTasks * (big.bonds() + 1) * zPoints * zPoints * 3e-9;
        row("PROJECTION same, split by magnetic fugacity (not implemented)", "%d tasks (%d primes x %d z points), one "
                + "task about %.3g updates = %.3g s, state vectors about %.3g GB per task; interpolation about %.3g s "
                + "(3 ns per multiply-add, assumed); on 64 executors about %.3g h", zTasks, bigTasks, zPoints,
                2 * eOnly.updates(), zTask, 2 * eOnly.peakBytes() / 1e9, interpolation,
                (Math.ceil(zTasks / 64.0) * zTask + interpolation) / 3600);
        for (int w = 2; w <= 3; w++) {
            double perPoint = med[w][1] / 2000;
            row("PROJECTION 10^6-point " + names[w] + " on 64 executors", "%.3g s per point on one core (local[1]), so "
                    + "%.3g s of work; about %.3g s (%.3g min) plus the output write (Sweep.writeParquet)", perPoint,
                    perPoint * 1e6, perPoint * 1e6 / 64, perPoint * 1e6 / 64 / 60);
        }
        row("load average at the end (1, 5, 15 min)", String.join(" ", Arrays.copyOf(loadAverage(), 3)));
    }

    static void ceilingRows(String what, double[] c) {
        row("CEILING " + what + ", plain threads", "1 thread %.3f s, 2 threads %.3f s, speed-up %.2f; cores obtained "
                + "(worker CPU / wall) %.2f and %.2f", c[0], c[1], c[0] / c[1], c[2], c[3]);
    }

    /** local[1] vs local[2] times and speed-up, with the plain-thread ceiling of the same run when there is one. */
    static void speedUpRow(String what, double[] t, double[] ceiling) {
        String c = ceiling == null ? "" : String.format(Locale.ROOT, " of a possible %.2fx (plain threads)", ceiling[0] / ceiling[1]);
        row(what, "local[1] %.3f s, local[2] %.3f s, speed-up %.2fx%s", t[1], t[2], t[1] / t[2], c);
    }

    /** Empty run lists indexed [workload][threads], threads 1 and 2 (index 0 unused). */
    static List<List<List<Double>>> runs(int workloads) {
        List<List<List<Double>>> out = new ArrayList<>();
        for (int w = 0; w < workloads; w++) {
            out.add(List.of(new ArrayList<>(), new ArrayList<>(), new ArrayList<>()));
        }
        return out;
    }

    /** CPU seconds used by the worker threads of the last {@link #inThreads} call. */
    static double lastCpuSeconds;

    /** Runs job(0 .. tasks-1) on {@code threads} plain threads taking the next index from one counter. */
    static void inThreads(int threads, int tasks, java.util.function.IntFunction<?> job) {
        inThreads(threads, tasks, tasks, job);
    }

    /**
     * job(i) for i &lt; tasks on {@code threads} threads taking the next index, and job(i) for tasks &lt;= i &lt;
     * all on one more thread of its own (the distributed count table's driver-side redundant prime).
     */
    static void inThreads(int threads, int tasks, int all, java.util.function.IntFunction<?> job) {
        java.util.concurrent.atomic.AtomicInteger next = new java.util.concurrent.atomic.AtomicInteger();
        java.util.concurrent.atomic.AtomicLong cpuNanos = new java.util.concurrent.atomic.AtomicLong();
        Thread[] ts = new Thread[threads + (all > tasks ? 1 : 0)];
        for (int t = 0; t < ts.length; t++) {
            boolean driver = t == threads;
            ts[t] = new Thread(() -> {
                if (driver) {
                    for (int i = tasks; i < all; i++) {
                        job.apply(i);
                    }
                } else {
                    for (int i = next.getAndIncrement(); i < tasks; i = next.getAndIncrement()) {
                        job.apply(i);
                    }
                }
                cpuNanos.addAndGet(java.lang.management.ManagementFactory.getThreadMXBean().getCurrentThreadCpuTime());
            });
            ts[t].start();
        }
        for (Thread t : ts) {
            try {
                t.join();
            } catch (InterruptedException ex) {
                throw new IllegalStateException(ex);
            }
        }
        lastCpuSeconds = cpuNanos.get() / 1e9;
    }

    static long drain(java.util.Iterator<?> it) {
        long k = 0;
        while (it.hasNext()) {
            it.next();
            k++;
        }
        return k;
    }

    static int readAll(CountTable t) {
        int rows = 0;
        for (int m = 0; m <= t.maxParticles(); m++) {
            rows += t.row(m).isEmpty() ? 0 : 1;
        }
        return rows;
    }

    static String[] loadAverage() {
        try {
            return java.nio.file.Files.readString(java.nio.file.Path.of("/proc/loadavg")).trim().split(" ", 4);
        } catch (java.io.IOException ex) {
            return new String[] {"unknown"};
        }
    }
}
