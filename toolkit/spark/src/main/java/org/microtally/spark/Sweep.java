package org.microtally.spark;

import java.util.ArrayList;
import java.util.Iterator;
import java.util.List;
import java.util.Locale;
import java.util.Objects;
import java.util.stream.IntStream;
import org.apache.spark.api.java.JavaRDD;
import org.apache.spark.api.java.JavaSparkContext;
import org.apache.spark.sql.Dataset;
import org.apache.spark.sql.Row;
import org.apache.spark.sql.RowFactory;
import org.apache.spark.sql.SparkSession;
import org.apache.spark.sql.types.DataTypes;
import org.apache.spark.sql.types.StructField;
import org.apache.spark.sql.types.StructType;
import org.microtally.InvalidInputException;
import org.microtally.ProgressListener;
import org.microtally.ensemble.Canonical;
import org.microtally.ensemble.GrandCanonical;
import org.microtally.occupation.CondensateDistribution;
import org.microtally.spectrum.Spectrum;

/**
 * A parameter sweep on Spark: every point of a {@link SweepGrid} is one ensemble run, evaluated in a
 * Spark task, and the results form a Spark {@code Dataset<Row>} with the columns of {@link #SCHEMA}.
 *
 * <p><b>Columns</b> (k = 1, energies and kT in the spectrum's unit): {@code point} (grid index),
 * {@code spectrum} (builder and cutoff), {@code states} (single-particle states kept), {@code N},
 * {@code kT}, {@code statistics}, {@code ensemble}; then {@code lnZ} (canonical ln Z_N; grand canonical
 * ln Xi), {@code U} (mean energy), {@code S} (entropy / k), {@code C} (heat capacity / k; grand canonical:
 * at fixed mean N), {@code mu} (grand canonical chemical potential; null for canonical rows, where the
 * ensemble fixes N instead), {@code n0_mean} and {@code n0_var} (mean and variance of the number of
 * particles in the lowest level), {@code warnings} (the run's warnings joined by " | ", empty when
 * none). The definitions, methods and accuracy are those of {@link Canonical} and
 * {@link GrandCanonical}; nothing is recomputed here.
 *
 * <p>A point whose input its ensemble refuses (for example N above the capacity of a capped spectrum)
 * becomes a row with null quantities and the refusal in {@code warnings}; any other failure fails the
 * task, which Spark retries, and then the sweep.
 *
 * <p><b>Model limits.</b> Ideal (non-interacting) particles on a truncated spectrum: the truncation
 * warnings say where the cutoff matters; interactions, which shift real condensate numbers by
 * percents, are not modelled.
 */
public final class Sweep {
    private Sweep() { }

    /** The result columns; see the class description. */
    public static final StructType SCHEMA = new StructType(new StructField[] {
        DataTypes.createStructField("point", DataTypes.LongType, false),
        DataTypes.createStructField("spectrum", DataTypes.StringType, false),
        DataTypes.createStructField("states", DataTypes.LongType, false),
        DataTypes.createStructField("N", DataTypes.IntegerType, false),
        DataTypes.createStructField("kT", DataTypes.DoubleType, false),
        DataTypes.createStructField("statistics", DataTypes.StringType, false),
        DataTypes.createStructField("ensemble", DataTypes.StringType, false),
        DataTypes.createStructField("lnZ", DataTypes.DoubleType, true),
        DataTypes.createStructField("U", DataTypes.DoubleType, true),
        DataTypes.createStructField("S", DataTypes.DoubleType, true),
        DataTypes.createStructField("C", DataTypes.DoubleType, true),
        DataTypes.createStructField("mu", DataTypes.DoubleType, true),
        DataTypes.createStructField("n0_mean", DataTypes.DoubleType, true),
        DataTypes.createStructField("n0_var", DataTypes.DoubleType, true),
        DataTypes.createStructField("warnings", DataTypes.StringType, false),
    });

    /**
     * Estimated bytes one held result row takes on the driver: the row as Java objects (boxed cells and
     * strings) plus its copy inside the Dataset view over the held rows. spark-scaling.sh measured 1,940
     * bytes a row (heap in use after and before, 2,000 rows) on notebook 08's grid, whose rows carry the
     * cutoff warnings; this leaves about 30% for longer warnings.
     */
    static final long BYTES_PER_ROW = 2560;
    /** How a user gives the driver more heap, for the refusals that hold rows on it. */
    static final String MORE_HEAP = "give the driver more heap (-Xmx; MICROTALLY_HEAP=4g for toolkit/bin/microtally, "
            + "install-kernel --heap 4g for the kernel)";
    /** Fraction of the driver's maximum heap that held results may take. */
    static final double DRIVER_MEMORY_FRACTION = 0.5;
    /** Most points one task computes (a retried task recomputes them all): large grids get more tasks. */
    static final long MAX_POINTS_PER_TASK = 100_000;

    /** Runs the sweep without progress reports; see {@link #run(SparkSession, SweepGrid, ProgressListener)}. */
    public static SweepResult run(SparkSession spark, SweepGrid grid) {
        return run(spark, grid, ProgressListener.NONE);
    }

    /**
     * Evaluates every grid point on {@code spark} in one Spark job and holds the rows on the driver, in
     * point order, reporting the finished tasks (stage {@code "sweep tasks"}). Queries on the result run
     * over the held rows; nothing is recomputed.
     *
     * @throws InvalidInputException before any task runs when the grid has more points than
     *         {@link #driverRowLimit(long)} allows for the driver's maximum heap; the message gives the grid
     *         size, the estimate and the ways out ({@link #writeParquet}, more heap, a split grid)
     */
    public static SweepResult run(SparkSession spark, SweepGrid grid, ProgressListener progress) {
        Objects.requireNonNull(spark, "spark");
        Objects.requireNonNull(grid, "grid");
        long size = grid.size();
        requireDriverMemory(size, Runtime.getRuntime().maxMemory());
        JavaRDD<Integer> ids = taskIds(spark, grid);
        int tasks = ids.getNumPartitions();
        // one job: each task returns its points' rows, the driver puts every row at its point's index
        List<Row[]> parts = SparkProgress.run(spark.sparkContext(), progress, tasks, "sweep tasks",
                () -> ids.map(t -> {
                    List<Row> out = new ArrayList<>();
                    taskRows(grid, t, tasks).forEachRemaining(out::add);
                    return out.toArray(new Row[0]);
                }).collect());
        Row[] rows = new Row[(int) size];
        for (Row[] part : parts) {
            for (Row r : part) {
                rows[(int) r.getLong(0)] = r;
            }
        }
        for (int i = 0; i < rows.length; i++) {
            if (rows[i] == null) {
                throw new IllegalStateException("sweep returned no row for point " + i + " of " + size);
            }
        }
        return new SweepResult(spark, List.of(rows));
    }

    /**
     * Evaluates every grid point on {@code spark} and writes the rows as Parquet files into
     * {@code directory} in one Spark job, without holding them on the driver (for grids beyond the
     * driver's memory). Spark's output committer makes the files appear only when the whole job commits
     * (then with a {@code _SUCCESS} marker); refuses to overwrite an existing directory.
     */
    public static void writeParquet(SparkSession spark, SweepGrid grid, String directory, ProgressListener progress) {
        write(spark, grid, directory, progress, SweepResult::writeParquet);
    }

    /** As {@link #writeParquet(SparkSession, SweepGrid, String, ProgressListener)}, as CSV files with a header line. */
    public static void writeCsv(SparkSession spark, SweepGrid grid, String directory, ProgressListener progress) {
        write(spark, grid, directory, progress, SweepResult::writeCsv);
    }

    /** The grid's rows, evaluated by the tasks, written by {@code writer} into {@code directory} in one job. */
    private static void write(SparkSession spark, SweepGrid grid, String directory, ProgressListener progress,
                              java.util.function.BiConsumer<Dataset<Row>, String> writer) {
        Objects.requireNonNull(directory, "directory");
        Dataset<Row> rows = distributed(spark, grid);
        int tasks = rows.rdd().getNumPartitions();
        SparkProgress.run(spark.sparkContext(), progress, tasks, "sweep tasks", () -> {
            writer.accept(rows, directory);
            return null;
        });
    }

    /** The rows as a Dataset computed by the tasks when an action runs (not held anywhere). */
    static Dataset<Row> distributed(SparkSession spark, SweepGrid grid) {
        Objects.requireNonNull(spark, "spark");
        Objects.requireNonNull(grid, "grid");
        JavaRDD<Integer> ids = taskIds(spark, grid);
        int tasks = ids.getNumPartitions();
        return spark.createDataFrame(ids.flatMap(t -> taskRows(grid, t, tasks)), SCHEMA);
    }

    /** The task indices 0 .. {@link #taskCount} - 1 of the grid on this session, one per partition. */
    private static JavaRDD<Integer> taskIds(SparkSession spark, SweepGrid grid) {
        JavaSparkContext jsc = JavaSparkContext.fromSparkContext(spark.sparkContext());
        int tasks = taskCount(grid.size(), jsc.defaultParallelism());
        return jsc.parallelize(IntStream.range(0, tasks).boxed().toList(), tasks);
    }

    /**
     * Tasks for a grid of {@code size} points: one per worker thread ({@code parallelism}, Spark's default
     * parallelism), more (a multiple of it) only when a task would exceed {@link #MAX_POINTS_PER_TASK}
     * points, never more tasks than points.
     */
    static int taskCount(long size, int parallelism) {
        long p = Math.max(1, parallelism);
        long rounds = Math.max(1, (size + p * MAX_POINTS_PER_TASK - 1) / (p * MAX_POINTS_PER_TASK));
        return (int) Math.max(1, Math.min(size, Math.min(Integer.MAX_VALUE, p * rounds)));
    }

    /**
     * The rows that task {@code task} of {@code tasks} computes, lazily on the calling thread: the grid is
     * cut into blocks of consecutive points that share spectrum, N and kT (the statistics and ensemble
     * vary fastest, so one spectrum build serves a block), and the task takes blocks task, task + tasks,
     * task + 2 tasks, ... in order, so every task gets a like mix of cheap and costly points. For a local
     * baseline or a single point's check ({@code taskRows(grid, 0, 1)} is every row in point order).
     *
     * @throws InvalidInputException for tasks &lt; 1 or task outside [0, tasks)
     */
    public static Iterator<Row> taskRows(SweepGrid grid, int task, int tasks) {
        Objects.requireNonNull(grid, "grid");
        if (tasks < 1 || task < 0 || task >= tasks) {
            throw InvalidInputException.of("sweep task", task + " of " + tasks, "tasks >= 1, task in [0, tasks)", "");
        }
        long block = grid.pointsPerSpectrumBuild();
        long size = grid.size();
        return new Iterator<Row>() {
            private long blockStart = task * block;
            private long next = blockStart;
            private Spectrum blockSpectrum;

            @Override
            public boolean hasNext() {
                return next < size;
            }

            @Override
            public Row next() {
                if (next >= size) {
                    throw new java.util.NoSuchElementException("task " + task + " of " + tasks + " has no more points");
                }
                SweepPoint p = grid.point(next);
                if (next == blockStart) {
                    blockSpectrum = p.spectrum().build(p.kT());
                }
                Row r = evaluate(p, blockSpectrum);
                next++;
                if (next == blockStart + block) {
                    blockStart += (long) tasks * block;
                    next = blockStart;
                }
                return r;
            }
        };
    }

    /**
     * Most result rows the driver holds in a heap of {@code maxHeap} bytes: {@link #DRIVER_MEMORY_FRACTION}
     * of it at {@link #BYTES_PER_ROW} bytes a row.
     */
    static long driverRowLimit(long maxHeap) {
        return (long) (maxHeap * DRIVER_MEMORY_FRACTION / BYTES_PER_ROW);
    }

    /** Refuses {@code rows} result rows on the driver beyond {@link #driverRowLimit(long)} of {@code maxHeap}. */
    static void requireDriverMemory(long rows, long maxHeap) {
        long limit = driverRowLimit(maxHeap);
        if (rows > limit) {
            throw InvalidInputException.of("sweep rows held on the driver",
                    String.format(Locale.ROOT, "%d grid points, about %d rows x %d bytes = %.3g MiB", rows, rows,
                            BYTES_PER_ROW, rows * (double) BYTES_PER_ROW / (1 << 20)),
                    String.format(Locale.ROOT, "at most %d rows (%.3g MiB, half the driver's maximum heap of %.3g MiB)",
                            limit, limit * (double) BYTES_PER_ROW / (1 << 20), maxHeap / (double) (1 << 20)),
                    "Write the rows to files instead (Sweep.writeParquet or Sweep.writeCsv, which hold nothing on the "
                            + "driver; or the sweep job of the job jar), " + MORE_HEAP + ", or split the grid.");
        }
    }

    /** One grid point's row, computed where the task runs. */
    static Row evaluate(SweepPoint p) {
        return evaluate(p, p.spectrum().build(p.kT()));
    }

    /** One grid point's row on {@code s}, the point's spectrum already built at its kT. */
    static Row evaluate(SweepPoint p, Spectrum s) {
        // lnZ (ln Xi), U, S, C, mu, <n0>, Var n0: null where the ensemble has no such value or refused the point
        Double[] v = new Double[7];
        String warnings;
        try {
            warnings = String.join(" | ", p.ensemble() == Ensemble.CANONICAL ? canonical(p, s, v) : grandCanonical(p, s, v));
        } catch (InvalidInputException refused) {
            java.util.Arrays.fill(v, null);
            warnings = "refused: " + refused.getMessage();
        }
        return RowFactory.create(p.id(), p.spectrum().toString(), s.stateCount(), p.particles(), p.kT(),
                p.statistics().toString(), p.ensemble().name(), v[0], v[1], v[2], v[3], v[4], v[5], v[6], warnings);
    }

    private static List<String> canonical(SweepPoint p, Spectrum s, Double[] v) {
        Canonical can = Canonical.of(s, p.statistics(), p.particles(), p.kT());
        CondensateDistribution d = can.groundLevelDistribution();
        Double[] values = {can.lnZ(), can.energy(), can.entropy(), can.heatCapacity(), null, d.mean(), d.variance()};
        System.arraycopy(values, 0, v, 0, v.length);
        return can.warnings();
    }

    private static List<String> grandCanonical(SweepPoint p, Spectrum s, Double[] v) {
        GrandCanonical g = GrandCanonical.ofMeanNumber(s, p.statistics(), p.kT(), p.particles());
        Double[] values = {g.lnXi(), g.energy(), g.entropy(), g.heatCapacity(), g.chemicalPotential(),
            g.groundLevelMean(), g.groundLevelVariance()};
        System.arraycopy(values, 0, v, 0, v.length);
        return g.warnings();
    }
}
