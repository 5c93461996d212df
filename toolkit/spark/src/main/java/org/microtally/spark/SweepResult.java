package org.microtally.spark;

import java.util.AbstractList;
import java.util.Arrays;
import java.util.List;
import java.util.Objects;
import org.apache.spark.sql.Dataset;
import org.apache.spark.sql.Row;
import org.apache.spark.sql.SaveMode;
import org.apache.spark.sql.SparkSession;
import org.microtally.InvalidInputException;
import org.microtally.Tabular;

/**
 * The rows of a finished {@link Sweep}, held on the driver in point order: read directly, or as a Spark
 * Dataset (columns {@link Sweep#SCHEMA}) over the held rows, written to Parquet or CSV, queried with
 * Spark SQL under the view name {@code sweep}, or shown as a {@link Tabular} (which the notebook module
 * shows as a table). Immutable: every operation reads the same held rows, nothing is recomputed.
 */
public final class SweepResult implements Tabular {
    /** The temporary view name under which {@link #sql(String)} sees the rows. */
    public static final String VIEW = "sweep";

    private final SparkSession spark;
    private final List<Row> held;
    private final Dataset<Row> rows;

    /** The rows {@code held} (point order), with a Dataset over them. */
    SweepResult(SparkSession spark, List<Row> held) {
        this.spark = spark;
        this.held = List.copyOf(held);
        this.rows = spark.createDataFrame(this.held, Sweep.SCHEMA);
    }

    /** The result as a Spark Dataset over the held rows, one row per grid point. */
    public Dataset<Row> dataset() {
        return rows;
    }

    /** Number of rows (= grid points). */
    public long size() {
        return held.size();
    }

    /**
     * Runs a Spark SQL query in which the rows are the view {@code sweep}, e.g.
     * {@code SELECT N, max(C) FROM sweep GROUP BY N}.
     */
    public Dataset<Row> sql(String query) {
        Objects.requireNonNull(query, "query");
        rows.createOrReplaceTempView(VIEW);
        return spark.sql(query);
    }

    /**
     * Writes Parquet files into {@code directory} through Spark's output committer: task files appear
     * under the directory only when the whole job commits (then with a {@code _SUCCESS} marker), so a
     * failed write leaves no partial result. Refuses to overwrite an existing directory.
     */
    public void writeParquet(String directory) {
        writeParquet(rows, directory);
    }

    /** As {@link #writeParquet(String)}, as CSV files with a header line; nulls are written as empty fields. */
    public void writeCsv(String directory) {
        writeCsv(rows, directory);
    }

    static void writeParquet(Dataset<Row> rows, String directory) {
        Objects.requireNonNull(directory, "directory");
        rows.write().mode(SaveMode.ErrorIfExists).parquet(directory);
    }

    static void writeCsv(Dataset<Row> rows, String directory) {
        Objects.requireNonNull(directory, "directory");
        rows.write().mode(SaveMode.ErrorIfExists).option("header", "true").csv(directory);
    }

    /** Column names of {@link Sweep#SCHEMA}. */
    @Override
    public List<String> columnNames() {
        return Arrays.asList(Sweep.SCHEMA.fieldNames());
    }

    /** Every row, ordered by point (missing values as null); read from the held rows, no Spark job. */
    @Override
    public List<List<Object>> rows() {
        return cells(held);
    }

    /**
     * The rows of any Dataset (e.g. a {@link #sql} result), in the Dataset's own order, as a Tabular. The
     * query runs once and brings at most {@link Sweep#driverRowLimit(long)} + 1 rows to the driver.
     *
     * @throws InvalidInputException when the result has more rows than the driver may hold (the message
     *                               gives the limit); aggregate it with {@link #sql} first or write it to files
     */
    public static Tabular tabular(Dataset<Row> dataset) {
        List<String> names = Arrays.asList(dataset.schema().fieldNames());
        List<List<Object>> data = collect(dataset, Runtime.getRuntime().maxMemory());
        return new Tabular() {
            @Override
            public List<String> columnNames() {
                return names;
            }

            @Override
            public List<List<Object>> rows() {
                return data;
            }
        };
    }

    static List<List<Object>> collect(Dataset<Row> dataset, long maxHeap) {
        long limit = Sweep.driverRowLimit(maxHeap);
        List<Row> got = dataset.limit((int) Math.min(Integer.MAX_VALUE - 1, limit) + 1).collectAsList();
        if (got.size() > limit) {
            throw InvalidInputException.of("rows of a query brought to the driver", "more than " + limit,
                    "at most " + limit + " (half the driver's maximum heap at " + Sweep.BYTES_PER_ROW + " bytes a row)",
                    "Aggregate the rows with Spark SQL first, write them to files (Dataset.write()), or "
                            + Sweep.MORE_HEAP + ".");
        }
        return cells(got);
    }

    /** Read-only list views of the rows' cells (no copy). */
    private static List<List<Object>> cells(List<Row> rows) {
        List<Row> fixed = List.copyOf(rows);
        return new AbstractList<List<Object>>() {
            @Override
            public List<Object> get(int i) {
                Row r = fixed.get(i);
                return new AbstractList<Object>() {
                    @Override
                    public Object get(int c) {
                        return r.get(c);
                    }

                    @Override
                    public int size() {
                        return r.size();
                    }
                };
            }

            @Override
            public int size() {
                return fixed.size();
            }
        };
    }
}
