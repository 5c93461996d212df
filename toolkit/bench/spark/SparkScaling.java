import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
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
 * Measured script (run by spark-scaling.sh, not part of any test run): the distributed count table
 * against the local multi-modular path in the same JVM, local[1] against local[2], a 2,000-point trap
 * sweep on local[1] and local[2] (notebook 08's axes, but a fixed cutoff of 80 quanta and N up to 160:
 * notebook 08's cutoff follows kT, up to 121 quanta; warm, on one thread, both grids cost about 0.6 s),
 * and the per-task and driver (CRT) costs that a
 * projection to a cluster needs; the same for a labelled table (LabelledPrimePlan) and a lattice
 * g(E, M) (LatticeTasks), and the on-paper 64-executor projections for a 16 x 16 free-boundary Ising
 * g(E, M) and a 10^6-point sweep from the measured per-task times. Every time is the median of
 * REPEATS runs after one warm-up run; the local[1] and local[2] sessions alternate, one run of each workload
 * per session, and plain Java threads (no Spark) on 1 and 2 threads give the ceiling of the same run.
 * Arguments: N E REPEATS [LATTICE_SIDE (default 8)].
 */
public class SparkScaling {
    static double median(List<Double> xs) {
        double[] a = xs.stream().mapToDouble(Double::doubleValue).sorted().toArray();
        return a.length % 2 == 1 ? a[a.length / 2] : 0.5 * (a[a.length / 2 - 1] + a[a.length / 2]);
    }

    static double seconds(Runnable r) {
        long t0 = System.nanoTime();
        r.run();
        return (System.nanoTime() - t0) / 1e9;
    }

    static SweepGrid trapGrid() {
        List<SpectrumSpec> traps = new ArrayList<>();
        for (int r = 3; r <= 6; r++) {
            traps.add(SpectrumSpec.oscillator(new int[] {r, r, 1}, 80));
        }
        double[] kTs = IntStream.range(0, 50).mapToDouble(i -> 0.25 + 0.1 * i).toArray();
        return SweepGrid.of(traps, new int[] {10, 20, 40, 80, 160}, kTs, List.of(Statistics.BOSE),
                List.of(Ensemble.CANONICAL, Ensemble.GRAND_CANONICAL));
    }

    public static void main(String[] args) {
        int n = Integer.parseInt(args[0]);
        int e = Integer.parseInt(args[1]);
        int repeats = Integer.parseInt(args[2]);
        int side = args.length > 3 ? Integer.parseInt(args[3]) : 8;
        Spectrum s = Spectra.harmonicOscillator(3, e);
        Statistics st = Statistics.BOSE;
        System.out.printf(Locale.ROOT, "3D oscillator, Bose, N = %d, E = %d, %d repeats (median), %d cores%n",
                n, e, repeats, Runtime.getRuntime().availableProcessors());

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
        System.out.printf(Locale.ROOT, "primes: %d required + %d redundant; one prime's residues %.3f s (median of %d); "
                + "driver eager CRT + check of %d entries (PrimePlan.recombine) %.3f s; redundant-prime check alone "
                + "(PrimePlan.table, rows rebuilt when read) %.4f s; check + reading every row %.3f s%n",
                plan.requiredPrimes(), plan.redundantPrimes(), median(perPrime), perPrime.size(), plan.entries(),
                median(crt), median(check), median(checkRead));
        // the ceiling on these 2 cores: the same prime tasks in 1 and in 2 plain Java threads (no Spark)
        double[] primeCeiling = ceiling(repeats, plan.primeCount(), i -> plan.residues(i, ProgressListener.NONE));
        System.out.printf(Locale.ROOT, "CEILING prime tasks in plain threads: 1 thread %.3f s, 2 threads %.3f s, "
                + "speed-up %.2f; cores obtained (worker CPU time / wall time) %.2f and %.2f%n", primeCeiling[0],
                primeCeiling[1], primeCeiling[0] / primeCeiling[1], primeCeiling[2], primeCeiling[3]);
        // and the same for the 2,000-point sweep, cut into the 16 ranges Sweep.run gives local[2]
        SweepGrid g = trapGrid();
        int chunks = 16;
        double[] sweepCeiling = ceiling(repeats, chunks,
                c -> drain(Sweep.rows(g, g.size() * c / chunks, g.size() * (c + 1) / chunks)));
        System.out.printf(Locale.ROOT, "CEILING 2,000-point sweep in plain threads (16 ranges from one queue): 1 thread "
                + "%.3f s, 2 threads %.3f s, speed-up %.2f; cores obtained %.2f and %.2f%n", sweepCeiling[0],
                sweepCeiling[1], sweepCeiling[0] / sweepCeiling[1], sweepCeiling[2], sweepCeiling[3]);

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
        System.out.printf(Locale.ROOT, "labelled table (2D dot by m, Fermi, N = 24, E = 30): %d primes; one prime %.3f s; "
                + "driver CRT + check %.3f s; local BigInteger path %.3f s%n", lplan.primeCount(), median(lPrime),
                median(lCrt), median(lBig));

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
        System.out.printf(Locale.ROOT, "lattice %dx%d free Ising g(E, M): %d primes; one prime %.3f s (%.3g updates, %.3g "
                + "updates/s); driver CRT + checks of %d entries %.4f s%n", side, side, lt.primeCount(), median(latPrime),
                small.updates(), rate, latRes[0].length, median(latCrt));

        List<Double> local = new ArrayList<>();
        double[] dist = new double[3];
        double[] emptyJob = new double[3];
        double[] sweep = new double[3];
        double[] labelled = new double[3];
        double[] lattice = new double[3];
        double[] enumerated = new double[3];
        // local[2] and local[1] sessions alternate (2, 1, 1, 2, 2, 1, ...), one measurement of each workload per
        // session after a warm-up of each, so a load that drifts during the run biases neither side
        Lattice enumLattice = Lattice.square(5, 5, Boundary.FREE);
        List<Integer> primeIndices = IntStream.range(0, plan.primeCount()).boxed().toList();
        List<List<Double>> d = List.of(new ArrayList<>(), new ArrayList<>(), new ArrayList<>());
        List<List<Double>> empty = List.of(new ArrayList<>(), new ArrayList<>(), new ArrayList<>());
        List<List<Double>> w = List.of(new ArrayList<>(), new ArrayList<>(), new ArrayList<>());
        List<List<Double>> lab = List.of(new ArrayList<>(), new ArrayList<>(), new ArrayList<>());
        List<List<Double>> lat = List.of(new ArrayList<>(), new ArrayList<>(), new ArrayList<>());
        List<List<Double>> en = List.of(new ArrayList<>(), new ArrayList<>(), new ArrayList<>());
        List<List<Double>> sweepCpu = List.of(new ArrayList<>(), new ArrayList<>(), new ArrayList<>());
        List<List<Double>> sweepBusy = List.of(new ArrayList<>(), new ArrayList<>(), new ArrayList<>());
        for (int r = 0; r < repeats; r++) {
            for (int threads : r % 2 == 0 ? new int[] {2, 1} : new int[] {1, 2}) {
                SparkSession spark = Clusters.local(threads);
                TaskTimes taskTimes = new TaskTimes();
                spark.sparkContext().addSparkListener(taskTimes);
                DistributedCountTable.of(spark, s, st, n, e);         // warm-up
                Sweep.run(spark, trapGrid()).dataset().unpersist();     // warm-up
                DistributedLabelledCounts.table(spark, dot, Statistics.FERMI, 24, 30, ProgressListener.NONE);
                DistributedLattice.densityOfStates(spark, sq, ising, true, ProgressListener.NONE);
                DistributedLattice.enumerate(spark, enumLattice, ising, true, ProgressListener.NONE);
                org.apache.spark.api.java.JavaSparkContext jsc =
                        org.apache.spark.api.java.JavaSparkContext.fromSparkContext(spark.sparkContext());
                if (threads == 2) {
                    local.add(seconds(() -> CountTable.of(s, st, n, e)));
                }
                d.get(threads).add(seconds(() -> DistributedCountTable.of(spark, s, st, n, e)));
                empty.get(threads).add(seconds(() -> jsc.parallelize(primeIndices, primeIndices.size()).collect()));
                taskTimes.reset();
                w.get(threads).add(seconds(() -> Sweep.run(spark, trapGrid()).dataset().unpersist()));
                sweepCpu.get(threads).add(taskTimes.cpuSeconds() / w.get(threads).get(w.get(threads).size() - 1));
                sweepBusy.get(threads).add(taskTimes.runSeconds() / w.get(threads).get(w.get(threads).size() - 1));
                lab.get(threads).add(seconds(() -> DistributedLabelledCounts.table(spark, dot, Statistics.FERMI, 24, 30,
                        ProgressListener.NONE)));
                lat.get(threads).add(seconds(() -> DistributedLattice.densityOfStates(spark, sq, ising, true,
                        ProgressListener.NONE)));
                en.get(threads).add(seconds(() -> DistributedLattice.enumerate(spark, enumLattice, ising, true,
                        ProgressListener.NONE)));
                spark.stop();
            }
        }
        for (int threads = 1; threads <= 2; threads++) {
            dist[threads] = median(d.get(threads));
            emptyJob[threads] = median(empty.get(threads));
            sweep[threads] = median(w.get(threads));
            labelled[threads] = median(lab.get(threads));
            lattice[threads] = median(lat.get(threads));
            enumerated[threads] = median(en.get(threads));
        }
        double loc = median(local);
        System.out.printf(Locale.ROOT, "local CountTable (multi-modular, fork-join on all cores): %.3f s%n", loc);
        System.out.printf(Locale.ROOT, "distributed CountTable local[2]: %.3f s = %.2f x local; local[1]: %.3f s; "
                + "speed-up local[1]/local[2] %.2f%n", dist[2], dist[2] / loc, dist[1], dist[1] / dist[2]);
        System.out.printf(Locale.ROOT, "Spark job of %d no-op tasks (the fixed cost of one distributed table) "
                + "local[2]: %.3f s, local[1]: %.3f s%n", plan.primeCount(), emptyJob[2], emptyJob[1]);
        System.out.printf(Locale.ROOT, "2,000-point trap sweep local[2]: %.3f s (%.2f ms per point per core); local[1]: "
                + "%.3f s; speed-up %.2f%n", sweep[2], 2 * sweep[2] / 2000 * 1e3, sweep[1], sweep[1] / sweep[2]);
        System.out.printf(Locale.ROOT, "sweep tasks per wall second (Spark task metrics, listener bus lag aside): local[2] "
                + "run time %.2f, CPU %.2f; local[1] run time %.2f, CPU %.2f (run time near the thread count means the "
                + "slots ran concurrently; CPU is the cores the machine gave them)%n", median(sweepBusy.get(2)),
                median(sweepCpu.get(2)), median(sweepBusy.get(1)), median(sweepCpu.get(1)));
        System.out.printf(Locale.ROOT, "distributed labelled table local[2]: %.3f s, local[1]: %.3f s, speed-up %.2f%n",
                labelled[2], labelled[1], labelled[1] / labelled[2]);
        System.out.printf(Locale.ROOT, "distributed lattice %dx%d g(E, M) local[2]: %.3f s, local[1]: %.3f s, speed-up %.2f%n",
                side, side, lattice[2], lattice[1], lattice[1] / lattice[2]);
        System.out.printf(Locale.ROOT, "prefix enumeration 5x5 free Ising g(E, M) (2^25 configurations) local[2]: %.3f s, "
                + "local[1]: %.3f s, speed-up %.2f%n", enumerated[2], enumerated[1], enumerated[1] / enumerated[2]);

        // on paper: 64 executors, each one core, from the measured rates above
        Lattice big = Lattice.square(16, 16, Boundary.FREE);
        TransferMatrix.Cost bigCost = TransferMatrix.estimate(big, ising, true);
        int bigTasks = bigCost.primes() + LatticeTasks.REDUNDANT_PRIMES;
        double bigTask = bigCost.updates() / rate;
        int bigEntries = (big.bonds() + 1) * (big.sites() + 1);
        double crtPerEntryPrime2 = median(latCrt) / (latRes[0].length * Math.pow(lt.primeCount(), 2));
        double bigCrt = crtPerEntryPrime2 * bigEntries * Math.pow(bigTasks, 2);
        System.out.printf(Locale.ROOT, "PROJECTION 16x16 free Ising g(E, M): %d prime tasks (so at most %d of 64 executors "
                + "busy), one task %.3g updates = %.3g s = %.3g h at the measured rate, peak state vectors %.3g GB per "
                + "executor; driver CRT of %d entries about %.3g s; wall time on 64 executors about %.3g h%n",
                bigTasks, Math.min(64, bigTasks), bigCost.updates(), bigTask, bigTask / 3600, bigCost.peakBytes() / 1e9,
                bigEntries, bigCrt, (Math.ceil(bigTasks / 64.0) * bigTask + bigCrt) / 3600);
        // on paper, the split that would make it practical (not implemented): evaluate the magnetic fugacity z at
        // sites + 1 distinct points modulo each prime, so each task sweeps polynomials in the energy only, and
        // interpolate in z (Vandermonde, sites + 1 points) on the driver. A z-task is a g(E) sweep without
        // the spin-flip symmetry the g(E) estimate uses (which stores half the states): twice its memory and updates.
        TransferMatrix.Cost eOnly = TransferMatrix.estimate(big, ising, false);
        int zPoints = big.sites() + 1;
        long zTasks = (long) bigTasks * zPoints;
        double zTask = 2 * eOnly.updates() / rate;
        double interpolation = (double) bigTasks * (big.bonds() + 1) * zPoints * zPoints * 3e-9;
        System.out.printf(Locale.ROOT, "PROJECTION 16x16 g(E, M) split by magnetic fugacity (not implemented): %d tasks "
                + "(%d primes x %d z points), one task about %.3g updates = %.3g s, state vectors about %.3g GB per "
                + "task; interpolation about %.3g s (3 ns per multiply-add, assumed); on 64 executors about %.3g h%n",
                zTasks, bigTasks, zPoints, 2 * eOnly.updates(), zTask, 2 * eOnly.peakBytes() / 1e9, interpolation,
                (Math.ceil(zTasks / 64.0) * zTask + interpolation) / 3600);
        double perPoint = sweep[1] / 2000;
        System.out.printf(Locale.ROOT, "PROJECTION 10^6-point sweep: %.3g s per point on one core (local[1]), so %.3g s of "
                + "work; on 64 executors about %.3g s (%.3g min) plus the output write%n", perPoint, perPoint * 1e6,
                perPoint * 1e6 / 64, perPoint * 1e6 / 64 / 60);
        System.out.println("load average during the run: " + Arrays.toString(loadAverage()));
    }

    /**
     * job(0 .. tasks-1) in 1 and then in 2 plain threads, one warm-up each, median of {@code repeats}:
     * {wall 1 thread, wall 2 threads, cores obtained with 1, cores obtained with 2} (cores obtained =
     * worker CPU time / wall time, which says how much of the machine the run got).
     */
    static double[] ceiling(int repeats, int tasks, java.util.function.IntFunction<?> job) {
        double[] out = new double[4];
        for (int t = 1; t <= 2; t++) {
            int threads = t;
            inThreads(threads, tasks, job);
            List<Double> wall = new ArrayList<>();
            List<Double> cores = new ArrayList<>();
            for (int r = 0; r < repeats; r++) {
                wall.add(seconds(() -> inThreads(threads, tasks, job)));
                cores.add(lastCpuSeconds / wall.get(r));
            }
            out[t - 1] = median(wall);
            out[t + 1] = median(cores);
        }
        return out;
    }

    /** Sums Spark's task metrics (run time and CPU time of every finished task) since the last reset. */
    static final class TaskTimes extends org.apache.spark.scheduler.SparkListener {
        private final java.util.concurrent.atomic.AtomicLong cpuNanos = new java.util.concurrent.atomic.AtomicLong();
        private final java.util.concurrent.atomic.AtomicLong runMillis = new java.util.concurrent.atomic.AtomicLong();

        @Override
        public void onTaskEnd(org.apache.spark.scheduler.SparkListenerTaskEnd end) {
            if (end.taskMetrics() != null) {
                cpuNanos.addAndGet(end.taskMetrics().executorCpuTime());
                runMillis.addAndGet(end.taskMetrics().executorRunTime());
            }
        }

        void reset() {
            cpuNanos.set(0);
            runMillis.set(0);
        }

        /** After the job: waits briefly for the listener bus to deliver the last task ends. */
        double cpuSeconds() {
            settle();
            return cpuNanos.get() / 1e9;
        }

        double runSeconds() {
            settle();
            return runMillis.get() / 1e3;
        }

        private static void settle() {
            try {
                Thread.sleep(200);
            } catch (InterruptedException ex) {
                Thread.currentThread().interrupt();
            }
        }
    }

    /** CPU seconds used by the worker threads of the last {@link #inThreads} call. */
    static double lastCpuSeconds;

    /** Runs job(0 .. tasks-1) on {@code threads} plain threads taking the next index from one counter. */
    static void inThreads(int threads, int tasks, java.util.function.IntFunction<?> job) {
        java.util.concurrent.atomic.AtomicInteger next = new java.util.concurrent.atomic.AtomicInteger();
        java.util.concurrent.atomic.AtomicLong cpuNanos = new java.util.concurrent.atomic.AtomicLong();
        Thread[] ts = new Thread[threads];
        for (int t = 0; t < threads; t++) {
            ts[t] = new Thread(() -> {
                for (int i = next.getAndIncrement(); i < tasks; i = next.getAndIncrement()) {
                    job.apply(i);
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
