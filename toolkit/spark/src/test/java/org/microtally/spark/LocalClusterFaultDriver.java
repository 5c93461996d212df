package org.microtally.spark;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Iterator;
import java.util.List;
import java.util.concurrent.atomic.AtomicInteger;
import java.util.stream.IntStream;
import java.util.stream.Stream;
import org.apache.spark.TaskContext;
import org.apache.spark.api.java.function.MapPartitionsFunction;
import org.apache.spark.scheduler.SparkListener;
import org.apache.spark.scheduler.SparkListenerExecutorRemoved;
import org.apache.spark.sql.Dataset;
import org.apache.spark.sql.Encoders;
import org.apache.spark.sql.Row;
import org.apache.spark.sql.SparkSession;
import org.microtally.spectrum.Statistics;

/**
 * The driver program of {@link LocalClusterFaultIT}, run in its own JVM (the workers of
 * {@code local-cluster} mode find Spark's jars through the SPARK_HOME the test builds): a sweep on two
 * executor processes, written as Parquet while one executor kills itself in the middle of its write
 * task ({@code Runtime.halt}, as abrupt as a {@code kill -9}: no shutdown hooks, its cached blocks lost).
 * Spark must rerun that task elsewhere; the committed output must hold every point exactly once with
 * the values the driver computes itself, and no temporary files. Prints the verdict; exits non-zero
 * (an exception) on any failure.
 */
public final class LocalClusterFaultDriver {
    /** The write task (of two: one per executor core) that kills its executor on its first attempt. */
    static final int DOOMED_PARTITION = 1;

    private LocalClusterFaultDriver() { }

    /** Kills the executor JVM after a few rows of partition {@link #DOOMED_PARTITION}, first attempt only. */
    static final class HaltOnce implements MapPartitionsFunction<Row, Row> {
        private static final long serialVersionUID = 1L;

        @Override
        public Iterator<Row> call(Iterator<Row> in) {
            TaskContext tc = TaskContext.get();
            if (tc.partitionId() != DOOMED_PARTITION || tc.attemptNumber() != 0) {
                return in;
            }
            return new Iterator<Row>() {
                private int handed;

                @Override
                public boolean hasNext() {
                    return in.hasNext();
                }

                @Override
                public Row next() {
                    if (++handed == 6) {
                        Runtime.getRuntime().halt(137);
                    }
                    return in.next();
                }
            };
        }
    }

    public static void main(String[] args) throws Exception {
        Path out = Path.of(args[0]);
        SparkSession spark = Clusters.connect("local-cluster[2,1,1024]", "microtally local-cluster fault");
        AtomicInteger removed = new AtomicInteger();
        spark.sparkContext().addSparkListener(new SparkListener() {
            @Override
            public void onExecutorRemoved(SparkListenerExecutorRemoved e) {
                removed.incrementAndGet();
                System.out.println("executor removed: " + e.executorId() + " (" + e.reason() + ")");
            }
        });
        long deadline = System.nanoTime() + 180_000_000_000L;
        while (spark.sparkContext().statusTracker().getExecutorInfos().length < 3) { // the driver + 2 executors
            if (System.nanoTime() > deadline) {
                throw new IllegalStateException("the two local-cluster executors did not register within 180 s");
            }
            Thread.sleep(200);
        }
        List<SpectrumSpec> traps = List.of(SpectrumSpec.oscillator(new int[] {4, 4, 1}, 30),
                SpectrumSpec.oscillator(new int[] {3, 3, 1}, 30));
        double[] kTs = IntStream.range(0, 25).mapToDouble(i -> 0.3 + 0.2 * i).toArray();
        SweepGrid grid = SweepGrid.of(traps, new int[] {5, 10}, kTs, List.of(Statistics.BOSE),
                List.of(Ensemble.CANONICAL, Ensemble.GRAND_CANONICAL));
        SweepResult sweep = Sweep.run(spark, grid);
        Dataset<Row> dying = sweep.dataset().mapPartitions(new HaltOnce(), Encoders.row(Sweep.SCHEMA));
        SweepResult.writeParquet(dying, out.toString());

        // the checks
        if (removed.get() < 1) {
            throw new IllegalStateException("no executor was lost: the fault did not happen");
        }
        if (!Files.isRegularFile(out.resolve("_SUCCESS"))) {
            throw new IllegalStateException("no _SUCCESS marker in " + out);
        }
        try (Stream<Path> files = Files.list(out)) {
            List<String> stray = files.map(p -> p.getFileName().toString())
                    .filter(n -> !n.equals("_SUCCESS") && !n.startsWith("._SUCCESS") && !(n.startsWith("part-")
                            || n.startsWith(".part-"))).toList();
            if (!stray.isEmpty()) {
                throw new IllegalStateException("files other than part files and _SUCCESS left in the output: " + stray);
            }
        }
        List<Row> back = spark.read().parquet(out.toString()).orderBy("point").collectAsList();
        if (back.size() != grid.size()) {
            throw new IllegalStateException(back.size() + " rows read back for " + grid.size() + " points");
        }
        List<Row> expected = new ArrayList<>();
        Sweep.taskRows(grid, 0, 1).forEachRemaining(expected::add);
        for (int i = 0; i < expected.size(); i++) {
            Row got = back.get(i);
            Row want = expected.get(i);
            for (int c = 0; c < Sweep.SCHEMA.size(); c++) {
                Object g = got.get(c);
                Object w = want.get(c);
                boolean same = g == null ? w == null : w instanceof Double d
                        ? Math.abs((Double) g - d) <= 1e-12 * Math.max(1, Math.abs(d)) : g.equals(w);
                if (!same) {
                    throw new IllegalStateException("row " + i + " column " + Sweep.SCHEMA.fieldNames()[c] + ": read back "
                            + g + ", computed on the driver " + w);
                }
            }
        }
        System.out.println("local-cluster fault check passed: " + removed.get() + " executor(s) lost during the write, "
                + back.size() + " rows committed, each point once and equal to the driver's own evaluation");
        spark.stop();
        System.exit(0);
    }
}
