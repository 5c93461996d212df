package org.microtally.spark;

import java.io.Serializable;
import java.util.List;
import java.util.Objects;
import java.util.stream.IntStream;
import org.apache.spark.TaskContext;
import org.apache.spark.api.java.JavaSparkContext;
import org.apache.spark.sql.SparkSession;
import org.microtally.ProgressListener;
import scala.Tuple2;

/**
 * Runs the independent prime tasks of a multi-modular count on Spark: task i computes every entry
 * modulo prime i on an executor, the driver receives the residue arrays in prime order (Spark retries
 * a failed task; the results are pure functions of i, so a retry returns the same array). Common
 * practice, no source. Package-private: the exact tables here call it and recombine on the driver.
 */
final class PrimeTasks {
    private PrimeTasks() { }

    /** The residues of one prime, computed on an executor from serializable plan data only. */
    @FunctionalInterface
    interface Residues extends Serializable {
        long[] of(int prime);
    }

    /**
     * residues[i] = task.of(i) for i &lt; primes, one Spark task each, progress reported as stage
     * {@code stage}; {@code fault} is the tests' hook (production passes {@link TaskFault#NONE}).
     */
    static long[][] run(SparkSession spark, int primes, Residues task, String stage, ProgressListener progress,
                        TaskFault fault) {
        Objects.requireNonNull(spark, "spark");
        JavaSparkContext jsc = JavaSparkContext.fromSparkContext(spark.sparkContext());
        List<Integer> tasks = IntStream.range(0, primes).boxed().toList();
        List<Tuple2<Integer, long[]>> parts = SparkProgress.run(spark.sparkContext(), progress, primes, stage,
                () -> jsc.parallelize(tasks, primes).map(i -> {
                    long[] r = task.of(i);
                    TaskContext tc = TaskContext.get();
                    return new Tuple2<>(i, fault.apply(i, tc == null ? 0 : tc.attemptNumber(), r));
                }).collect());
        long[][] residues = new long[primes][];
        for (Tuple2<Integer, long[]> p : parts) {
            residues[p._1()] = p._2();
        }
        return residues;
    }
}
