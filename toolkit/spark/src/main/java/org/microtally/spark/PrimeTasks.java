package org.microtally.spark;

import java.io.Serializable;
import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import java.util.stream.IntStream;
import org.apache.spark.TaskContext;
import org.apache.spark.api.java.JavaSparkContext;
import org.apache.spark.sql.SparkSession;
import org.microtally.ProgressListener;
import scala.Tuple2;

/**
 * Runs the independent prime computations of a multi-modular count on Spark: prime i's residues are
 * every entry modulo prime i, computed on an executor; the driver receives the residue arrays in prime
 * order. The primes are dealt to one task per worker thread (task t computes primes t, t + T, t + 2T,
 * ... for T = min(primes, Spark's default parallelism)), so a table with more primes than threads pays
 * Spark's per-task cost once per thread rather than once per prime (the redundant prime rides in a task
 * with other primes); with at least as many threads as primes it is one task per prime. Spark retries a
 * failed task; the results are pure functions of i, so a retry returns the same arrays. Common
 * practice, no source. Package-private: the exact tables here call it and recombine on the driver.
 */
final class PrimeTasks {
    private PrimeTasks() { }

    /** The residues of one prime, computed on an executor from serializable plan data only. */
    @FunctionalInterface
    interface Residues extends Serializable {
        long[] of(int prime);
    }

    /** Number of tasks for {@code primes} primes on a session of default parallelism {@code parallelism}. */
    static int taskCount(int primes, int parallelism) {
        return Math.max(1, Math.min(primes, parallelism));
    }

    /**
     * residues[i] = task.of(i) for i &lt; primes, dealt to {@link #taskCount} Spark tasks, their completions
     * reported as stage {@code stage}; {@code fault} is the tests' hook, applied to each prime's result with
     * its task's attempt number (production passes {@link TaskFault#NONE}).
     */
    static long[][] run(SparkSession spark, int primes, Residues task, String stage, ProgressListener progress,
                        TaskFault fault) {
        Objects.requireNonNull(spark, "spark");
        JavaSparkContext jsc = JavaSparkContext.fromSparkContext(spark.sparkContext());
        int tasks = taskCount(primes, jsc.defaultParallelism());
        List<Integer> ids = IntStream.range(0, tasks).boxed().toList();
        List<List<Tuple2<Integer, long[]>>> parts = SparkProgress.run(spark.sparkContext(), progress, tasks, stage,
                () -> jsc.parallelize(ids, tasks).map(t -> {
                    TaskContext tc = TaskContext.get();
                    int attempt = tc == null ? 0 : tc.attemptNumber();
                    List<Tuple2<Integer, long[]>> out = new ArrayList<>();
                    for (int i = t; i < primes; i += tasks) {
                        out.add(new Tuple2<>(i, fault.apply(i, attempt, task.of(i))));
                    }
                    return out;
                }).collect());
        long[][] residues = new long[primes][];
        for (List<Tuple2<Integer, long[]>> part : parts) {
            for (Tuple2<Integer, long[]> p : part) {
                residues[p._1()] = p._2();
            }
        }
        for (int i = 0; i < primes; i++) {
            if (residues[i] == null) {
                throw new IllegalStateException("no residues returned for prime " + i + " of " + primes);
            }
        }
        return residues;
    }
}
