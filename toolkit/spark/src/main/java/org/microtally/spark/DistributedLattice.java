package org.microtally.spark;

import java.util.Iterator;
import java.util.List;
import java.util.Objects;
import java.util.stream.LongStream;
import org.apache.spark.api.java.JavaSparkContext;
import org.apache.spark.sql.SparkSession;
import org.microtally.ProgressListener;
import org.microtally.ensemble.ExactDensityOfStates;
import org.microtally.lattice.Lattice;
import org.microtally.lattice.LatticeTasks;
import org.microtally.lattice.Model;

/**
 * Exact lattice densities of states on Spark, two independent ways (method and sources on
 * {@link LatticeTasks}):
 * <ul>
 *   <li>{@link #densityOfStates}: the transfer matrix, the primes dealt to the Spark tasks, Chinese
 *       remaindering and the redundant-prime and sum g = q^N checks on the driver; entry by entry equal to
 *       {@link org.microtally.lattice.TransferMatrix#count} (tested).</li>
 *   <li>{@link #enumerate}: every configuration, split by the values of the first P sites (q^P
 *       prefixes, P the smallest giving eight prefixes per core), each task a Gray-code walk over the
 *       other sites, the driver adding the histograms exactly (overflow refused): the cross-check.</li>
 * </ul>
 * Cost: prime tasks each hold the transfer matrix's state vectors (see
 * {@link org.microtally.lattice.TransferMatrix#estimate}); enumeration visits q^N configurations
 * (refused beyond {@link LatticeTasks#MAX_ENUMERATED}).
 */
public final class DistributedLattice {
    private DistributedLattice() { }

    /**
     * g(E) (Ising, Potts), g(E, M) (Ising with {@code withMagnetisation}) or g(n) (hard-core gas) by
     * the transfer matrix, tasks reported as stage {@code "primes"}.
     */
    public static ExactDensityOfStates densityOfStates(SparkSession spark, Lattice lattice, Model model,
                                                       boolean withMagnetisation, ProgressListener progress) {
        return byPrimes(spark, LatticeTasks.of(lattice, model, withMagnetisation), progress, TaskFault.NONE);
    }

    static ExactDensityOfStates byPrimes(SparkSession spark, LatticeTasks tasks, ProgressListener progress,
                                         TaskFault fault) {
        return tasks.fromResidues(PrimeTasks.run(spark, tasks.primeCount(), tasks::residues, "primes", progress, fault));
    }

    /** The same density of states by enumerating every configuration, tasks reported as stage {@code "prefix tasks"}. */
    public static ExactDensityOfStates enumerate(SparkSession spark, Lattice lattice, Model model,
                                                 boolean withMagnetisation, ProgressListener progress) {
        Objects.requireNonNull(spark, "spark");
        Objects.requireNonNull(progress, "progress");
        LatticeTasks tasks = LatticeTasks.of(lattice, model, withMagnetisation);
        JavaSparkContext jsc = JavaSparkContext.fromSparkContext(spark.sparkContext());
        int wanted = 8 * Math.max(1, jsc.defaultParallelism());
        int p = 0;
        while (p < tasks.sites() && tasks.prefixCount(p) < wanted) {
            p++;
        }
        int prefixSites = p;
        long prefixes = tasks.prefixCount(prefixSites);
        int slices = (int) Math.min(prefixes, wanted);
        List<Long> all = LongStream.range(0, prefixes).boxed().toList();
        List<long[]> parts = SparkProgress.run(spark.sparkContext(), progress, slices, "prefix tasks",
                () -> jsc.parallelize(all, slices).mapPartitions((Iterator<Long> it) -> {
                    long[] h = new long[tasks.histogramLength()];
                    while (it.hasNext()) {
                        addInto(h, tasks.walkPrefix(prefixSites, it.next()));
                    }
                    return List.of(h).iterator();
                }).collect());
        long[] merged = new long[tasks.histogramLength()];
        for (long[] h : parts) {
            addInto(merged, h);
        }
        return tasks.fromHistograms(merged);
    }

    private static void addInto(long[] sum, long[] h) {
        for (int i = 0; i < sum.length; i++) {
            sum[i] = Math.addExact(sum[i], h[i]);
        }
    }
}
