package org.microtally.spark;

import java.util.ArrayList;
import java.util.Iterator;
import java.util.List;
import java.util.Objects;
import org.apache.spark.api.java.JavaRDD;
import org.apache.spark.api.java.JavaSparkContext;
import org.apache.spark.sql.Dataset;
import org.apache.spark.sql.Row;
import org.apache.spark.sql.RowFactory;
import org.apache.spark.sql.SparkSession;
import org.apache.spark.sql.types.DataTypes;
import org.apache.spark.sql.types.StructField;
import org.apache.spark.sql.types.StructType;
import org.apache.spark.storage.StorageLevel;
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

    /** Estimated bytes one result row takes when held on the driver as Java objects (boxed cells, strings). */
    static final long BYTES_PER_ROW = 640;
    /** Fraction of the driver's maximum heap that held results may take. */
    static final double DRIVER_MEMORY_FRACTION = 0.5;

    /** Runs the sweep without progress reports; see {@link #run(SparkSession, SweepGrid, ProgressListener)}. */
    public static SweepResult run(SparkSession spark, SweepGrid grid) {
        return run(spark, grid, ProgressListener.NONE);
    }

    /**
     * Evaluates every grid point on {@code spark} and keeps the result (cached on the executors, spilling
     * to disk), reporting the finished tasks (stage {@code "sweep tasks"}).
     *
     * @throws InvalidInputException in local mode (where the executors share the driver's heap) when the
     *         estimated result, {@link #BYTES_PER_ROW} bytes per point, exceeds half the driver's maximum
     *         heap; the message gives the estimate
     */
    public static SweepResult run(SparkSession spark, SweepGrid grid, ProgressListener progress) {
        Objects.requireNonNull(spark, "spark");
        Objects.requireNonNull(grid, "grid");
        if (spark.sparkContext().isLocal()) {
            requireDriverMemory(grid.size(), Runtime.getRuntime().maxMemory(), "run this sweep in local mode");
        }
        JavaSparkContext jsc = JavaSparkContext.fromSparkContext(spark.sparkContext());
        long size = grid.size();
        int parallelism = Math.max(1, jsc.defaultParallelism());
        // about 250 points per task on large grids, at least 8 tasks per core for progress and balance,
        // but no task under 8 points (each task has a fixed cost)
        int tasks = (int) Math.max(1, Math.min((size + 7) / 8,
                Math.min(100_000, Math.max(8L * parallelism, (size + 249) / 250))));
        List<long[]> ranges = new ArrayList<>(tasks);
        for (int i = 0; i < tasks; i++) {
            ranges.add(new long[] {size * i / tasks, size * (i + 1) / tasks});
        }
        // the rows are computed and kept as an RDD (the parallel part), and the Dataset is a view over it:
        // building a columnar cache of the Dataset instead adds a serial step of the order of a small sweep
        JavaRDD<Row> rows = jsc.parallelize(ranges, tasks).flatMap(r -> rows(grid, r[0], r[1]))
                .persist(StorageLevel.MEMORY_AND_DISK());
        long count = SparkProgress.run(spark.sparkContext(), progress, tasks, "sweep tasks", rows::count);
        if (count != size) {
            throw new IllegalStateException("sweep produced " + count + " rows for " + size + " points");
        }
        return new SweepResult(spark, spark.createDataFrame(rows, SCHEMA), size);
    }

    /**
     * The rows of points {@code from} (inclusive) to {@code to} (exclusive) of {@code grid}, computed lazily on
     * the calling thread exactly as one Spark task of {@link #run} computes them (one spectrum build serves
     * consecutive points with the same spectrum and kT). For a single point's check or a local baseline.
     *
     * @throws InvalidInputException for a range outside [0, grid.size()]
     */
    public static Iterator<Row> rows(SweepGrid grid, long from, long to) {
        Objects.requireNonNull(grid, "grid");
        if (from < 0 || to < from || to > grid.size()) {
            throw InvalidInputException.of("range of sweep points", "[" + from + ", " + to + ")",
                    "within [0, " + grid.size() + "]", "");
        }
        return new Iterator<Row>() {
            private long next = from;
            private SweepPoint last;
            private Spectrum lastSpectrum;

            @Override
            public boolean hasNext() {
                return next < to;
            }

            @Override
            public Row next() {
                if (next >= to) {
                    throw new java.util.NoSuchElementException("sweep points end at " + to);
                }
                SweepPoint p = grid.point(next++);
                // the ensemble varies fastest: consecutive points often share spectrum and kT, so one build serves
                if (last == null || last.spectrum() != p.spectrum() || last.kT() != p.kT()) {
                    lastSpectrum = p.spectrum().build(p.kT());
                    last = p;
                }
                return evaluate(p, lastSpectrum);
            }
        };
    }

    /**
     * Refuses to hold {@code rows} result rows in a heap of {@code maxHeap} bytes when the estimate
     * exceeds {@link #DRIVER_MEMORY_FRACTION} of it.
     */
    static void requireDriverMemory(long rows, long maxHeap, String action) {
        double bytes = (double) rows * BYTES_PER_ROW;
        double limit = maxHeap * DRIVER_MEMORY_FRACTION;
        if (bytes > limit) {
            throw InvalidInputException.of("estimated sweep result held on the driver to " + action,
                    String.format("%d rows x %d bytes = %.3g MiB", rows, BYTES_PER_ROW, bytes / (1 << 20)),
                    String.format("at most %.3g MiB (half the driver's maximum heap)", limit / (1 << 20)),
                    "Write the result to Parquet or CSV, aggregate it with Spark SQL first, split the grid, "
                            + "run on a cluster, or give the driver more heap (-Xmx; MICROTALLY_HEAP=4g for toolkit/bin/microtally, install-kernel --heap 4g for the kernel).");
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
