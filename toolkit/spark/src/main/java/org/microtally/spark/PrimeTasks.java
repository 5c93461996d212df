package org.microtally.spark;

import java.io.Serializable;
import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import java.util.concurrent.CompletableFuture;
import java.util.concurrent.CompletionException;
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
 * Spark's per-task cost once per thread rather than once per prime; with at least as many threads as
 * primes it is one task per prime. A caller may keep its last primes (a count table's redundant check
 * prime) on the driver, computed there while the tasks run. Spark retries a
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
     * residues[i] = task.of(i) for i &lt; primes, all as Spark tasks; as {@link #run(SparkSession, int, int,
     * Residues, String, ProgressListener, TaskFault)} with no prime on the driver.
     */
    static long[][] run(SparkSession spark, int primes, Residues task, String stage, ProgressListener progress,
                        TaskFault fault) {
        return run(spark, primes, 0, task, stage, progress, fault);
    }

    /**
     * residues[i] = task.of(i) for i &lt; primes: the first {@code primes - onDriver} dealt to
     * {@link #taskCount} Spark tasks, their completions reported as stage {@code stage}, and the last
     * {@code onDriver} computed on a thread of the driver while those tasks run. {@code fault} is the
     * tests' hook, applied to each prime's result with its task's attempt number (0 for a driver prime;
     * production passes {@link TaskFault#NONE}).
     *
     * <p>The driver primes are for the redundant check primes of an exact table whose one-prime working
     * memory is its result (a count table: (N + 1)(E + 1) entries, which the driver holds for every prime
     * anyway): the check is then computed by another process than the residues it checks, and it does
     * not add a round of tasks (with k required primes on T threads, k + 1 primes as tasks would take
     * ceil((k + 1) / T) rounds; on 2 threads and 8 required primes, 5 rounds against 4). In local mode the
     * driver thread shares the cores with the worker threads. A driver prime that throws fails the call
     * (it is not retried; the computation is a pure function of i).
     */
    static long[][] run(SparkSession spark, int primes, int onDriver, Residues task, String stage,
                        ProgressListener progress, TaskFault fault) {
        Objects.requireNonNull(spark, "spark");
        if (onDriver < 0 || onDriver >= primes) {
            throw new IllegalArgumentException("driver primes " + onDriver + " of " + primes + ": need 0 <= onDriver < primes");
        }
        JavaSparkContext jsc = JavaSparkContext.fromSparkContext(spark.sparkContext());
        int onTasks = primes - onDriver;
        int tasks = taskCount(onTasks, jsc.defaultParallelism());
        List<Integer> ids = IntStream.range(0, tasks).boxed().toList();
        long[][] residues = new long[primes][];
        // the driver primes run on a thread of their own while this thread waits in collect(), so Spark's own
        // failures (SparkException after the retries) reach the caller unchanged
        CompletableFuture<Void> driver = onDriver == 0 ? CompletableFuture.completedFuture(null)
                : CompletableFuture.runAsync(() -> {
                    for (int i = onTasks; i < primes; i++) {
                        residues[i] = fault.apply(i, 0, task.of(i));
                    }
                }, r -> {
                    Thread th = new Thread(r, "microtally-driver-primes");
                    th.setDaemon(true);
                    th.start();
                });
        List<List<Tuple2<Integer, long[]>>> parts = SparkProgress.run(spark.sparkContext(), progress, tasks, stage,
                () -> jsc.parallelize(ids, tasks).map(t -> {
                    TaskContext tc = TaskContext.get();
                    int attempt = tc == null ? 0 : tc.attemptNumber();
                    List<Tuple2<Integer, long[]>> out = new ArrayList<>();
                    for (int i = t; i < onTasks; i += tasks) {
                        out.add(new Tuple2<>(i, fault.apply(i, attempt, task.of(i))));
                    }
                    return out;
                }).collect());
        try {
            driver.join();
        } catch (CompletionException e) {
            if (e.getCause() instanceof Error err) {
                throw err;
            }
            throw e.getCause() instanceof RuntimeException re ? re : e;
        }
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
