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
import org.microtally.spectrum.Spectra;
import org.microtally.spectrum.Spectrum;
import org.microtally.spectrum.Statistics;

/**
 * Measured script (run by spark-scaling.sh, not part of any test run): the distributed count table
 * against the local multi-modular path in the same JVM, local[1] against local[2], the 2,000-point trap
 * sweep of notebook 08 on local[1] and local[2], and the per-task and driver (CRT) costs that a
 * projection to a cluster needs. Every time is the median of REPEATS runs after one warm-up run.
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
        for (int r = 0; r < repeats; r++) {
            crt.add(seconds(() -> plan.recombine(res)));
        }
        System.out.printf(Locale.ROOT, "primes: %d required + %d redundant; one prime's residues %.3f s (median of %d); "
                + "driver CRT + check of %d entries %.3f s%n", plan.requiredPrimes(), plan.redundantPrimes(),
                median(perPrime), perPrime.size(), plan.entries(), median(crt));

        List<Double> local = new ArrayList<>();
        double[] dist = new double[3];
        double[] sweep = new double[3];
        for (int threads : new int[] {2, 1}) {
            SparkSession spark = Clusters.local(threads);
            DistributedCountTable.of(spark, s, st, n, e);         // warm-up
            Sweep.run(spark, trapGrid()).dataset().unpersist();     // warm-up
            List<Double> d = new ArrayList<>();
            List<Double> w = new ArrayList<>();
            for (int r = 0; r < repeats; r++) {
                if (threads == 2) {
                    local.add(seconds(() -> CountTable.of(s, st, n, e)));
                }
                d.add(seconds(() -> DistributedCountTable.of(spark, s, st, n, e)));
                w.add(seconds(() -> Sweep.run(spark, trapGrid()).dataset().unpersist()));
            }
            dist[threads] = median(d);
            sweep[threads] = median(w);
            spark.stop();
        }
        double loc = median(local);
        System.out.printf(Locale.ROOT, "local CountTable (multi-modular, fork-join on all cores): %.3f s%n", loc);
        System.out.printf(Locale.ROOT, "distributed CountTable local[2]: %.3f s = %.2f x local; local[1]: %.3f s; "
                + "speed-up local[1]/local[2] %.2f%n", dist[2], dist[2] / loc, dist[1], dist[1] / dist[2]);
        System.out.printf(Locale.ROOT, "2,000-point trap sweep local[2]: %.3f s (%.2f ms per point per core); local[1]: "
                + "%.3f s; speed-up %.2f%n", sweep[2], 2 * sweep[2] / 2000 * 1e3, sweep[1], sweep[1] / sweep[2]);
        System.out.println("load average during the run: " + Arrays.toString(loadAverage()));
    }

    static String[] loadAverage() {
        try {
            return java.nio.file.Files.readString(java.nio.file.Path.of("/proc/loadavg")).trim().split(" ", 4);
        } catch (java.io.IOException ex) {
            return new String[] {"unknown"};
        }
    }
}
