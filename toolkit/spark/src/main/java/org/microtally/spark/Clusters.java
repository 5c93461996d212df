package org.microtally.spark;

import java.util.Objects;
import org.apache.spark.sql.SparkSession;
import org.microtally.InvalidInputException;

/**
 * Spark sessions with the toolkit's defaults: no web UI, one shuffle partition per worker thread
 * ({@code spark.sql.shuffle.partitions} = the session's default parallelism instead of Spark's 200:
 * results here are small, and every partition is a task), the driver bound to the loopback address in
 * local mode, task results up to {@value #DIRECT_RESULT_LIMIT} sent straight to the driver (Spark's default is
 * 1m: a larger result, such as the 2.4 MB of residues a count-table task returns at N = 100, E = 600, is
 * first stored in the executor's block manager and then fetched, which cost about 17 ms of a 0.25 s table
 * here), and Spark's own log level at WARN.
 *
 * <p>{@link #local(int)} is the embedded default (no cluster needed); {@link #connect(String, String)}
 * takes any master URL ({@code local[*]}, {@code spark://host:7077}, {@code yarn}, ...). When the code
 * runs under {@code spark-submit} the master comes from the submit line and {@link #submitted(String)}
 * takes the session Spark already configured.
 */
public final class Clusters {
    private Clusters() { }

    /**
     * {@code spark.task.maxDirectResultSize}: task results up to this size go to the driver in the task's
     * status message (Spark caps it at {@code spark.rpc.message.maxSize}, 128m by default).
     */
    static final String DIRECT_RESULT_LIMIT = "64m";

    /** A local session with {@code threads} worker threads ({@code local[threads]}). */
    public static SparkSession local(int threads) {
        if (threads < 1 || threads > 1024) {
            throw InvalidInputException.of("local worker threads", threads, "in [1, 1024]",
                    "Use Clusters.connect(\"local[*]\", name) for one thread per core.");
        }
        return connect("local[" + threads + "]", "microtally");
    }

    /**
     * A local session in which every task may be attempted {@code maxAttempts} times before the job
     * fails ({@code local[threads,maxAttempts]}); plain {@code local[n]} never retries.
     */
    public static SparkSession localWithRetries(int threads, int maxAttempts) {
        if (threads < 1 || maxAttempts < 1) {
            throw InvalidInputException.of("local threads and attempts", threads + ", " + maxAttempts,
                    "both >= 1", "");
        }
        return connect("local[" + threads + "," + maxAttempts + "]", "microtally");
    }

    /**
     * A session on {@code master} (any Spark master URL) named {@code appName}, or the running one if it has
     * this master.
     *
     * @throws InvalidInputException when this JVM already runs a session on another master (Spark allows
     *         one context per JVM and would silently hand back the running one)
     */
    public static SparkSession connect(String master, String appName) {
        Objects.requireNonNull(master, "master");
        Objects.requireNonNull(appName, "appName");
        scala.Option<SparkSession> running = SparkSession.getDefaultSession();
        if (running.isDefined() && !running.get().sparkContext().isStopped()
                && !running.get().sparkContext().master().equals(master)) {
            throw InvalidInputException.of("Spark master", master,
                    "the master of the session already running in this JVM, " + running.get().sparkContext().master(),
                    "Stop that session first (spark.stop()); Spark runs one context per JVM.");
        }
        SparkSession.Builder b = SparkSession.builder().master(master).appName(appName)
                .config("spark.ui.enabled", "false")
                .config("spark.ui.showConsoleProgress", "false")
                .config("spark.sql.adaptive.enabled", "false")
                .config("spark.task.maxDirectResultSize", DIRECT_RESULT_LIMIT);
        if (master.startsWith("local")) {
            b = b.config("spark.driver.host", "127.0.0.1").config("spark.driver.bindAddress", "127.0.0.1");
        }
        SparkSession s = b.getOrCreate();
        s.sparkContext().setLogLevel("WARN");
        return onePartitionPerThread(s);
    }

    /**
     * Sets {@code spark.sql.shuffle.partitions} to the session's default parallelism (its worker threads;
     * on a cluster the executor cores registered when the session started, at least 2) unless the
     * submit line or the session's configuration chose a value.
     */
    static SparkSession onePartitionPerThread(SparkSession s) {
        if (!s.sparkContext().getConf().contains("spark.sql.shuffle.partitions")) {
            s.conf().set("spark.sql.shuffle.partitions", Integer.toString(Math.max(1, s.sparkContext().defaultParallelism())));
        }
        return s;
    }

    /** The session configured by {@code spark-submit} (master and resources from the submit line). */
    public static SparkSession submitted(String appName) {
        return onePartitionPerThread(SparkSession.builder().appName(Objects.requireNonNull(appName, "appName")).getOrCreate());
    }
}
