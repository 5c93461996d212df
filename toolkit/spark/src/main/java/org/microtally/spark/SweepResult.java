package org.microtally.spark;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.Collections;
import java.util.List;
import java.util.Objects;
import org.apache.spark.sql.Dataset;
import org.apache.spark.sql.Row;
import org.apache.spark.sql.SaveMode;
import org.apache.spark.sql.SparkSession;
import org.microtally.InvalidInputException;
import org.microtally.Tabular;

/**
 * The rows of a finished {@link Sweep}: a cached Spark Dataset (columns {@link Sweep#SCHEMA}), written
 * to Parquet or CSV, queried with Spark SQL under the view name {@code sweep}, or brought to the driver
 * as a {@link Tabular} (which the notebook module shows as a table). Immutable: every operation reads
 * the same cached rows.
 */
public final class SweepResult implements Tabular {
    /** The temporary view name under which {@link #sql(String)} sees the rows. */
    public static final String VIEW = "sweep";

    private final SparkSession spark;
    private final Dataset<Row> rows;
    private final long size;

    SweepResult(SparkSession spark, Dataset<Row> rows, long size) {
        this.spark = spark;
        this.rows = rows;
        this.size = size;
    }

    /** The result as a Spark Dataset, one row per grid point. */
    public Dataset<Row> dataset() {
        return rows;
    }

    /** Number of rows (= grid points). */
    public long size() {
        return size;
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
        Objects.requireNonNull(directory, "directory");
        rows.write().mode(SaveMode.ErrorIfExists).parquet(directory);
    }

    /** As {@link #writeParquet(String)}, as CSV files with a header line; nulls are written as empty fields. */
    public void writeCsv(String directory) {
        Objects.requireNonNull(directory, "directory");
        rows.write().mode(SaveMode.ErrorIfExists).option("header", "true").csv(directory);
    }

    /** Column names of {@link Sweep#SCHEMA}. */
    @Override
    public List<String> columnNames() {
        return Arrays.asList(Sweep.SCHEMA.fieldNames());
    }

    /**
     * Every row, ordered by point, brought to the driver (missing values as null).
     *
     * @throws InvalidInputException when the estimated size exceeds half the driver's maximum heap (the
     *                               message gives the estimate); aggregate with {@link #sql} first
     */
    @Override
    public List<List<Object>> rows() {
        return collect(rows.orderBy("point"), Runtime.getRuntime().maxMemory());
    }

    /**
     * The rows of any Dataset (e.g. a {@link #sql} result), in the Dataset's own order, as a Tabular, with the
     * same memory check as {@link #rows()}.
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
        Sweep.requireDriverMemory(dataset.count(), maxHeap, "collect it");
        List<List<Object>> out = new ArrayList<>();
        for (Row r : dataset.collectAsList()) {
            Object[] cells = new Object[r.size()];
            for (int i = 0; i < cells.length; i++) {
                cells[i] = r.get(i);
            }
            out.add(Collections.unmodifiableList(Arrays.asList(cells)));
        }
        return Collections.unmodifiableList(out);
    }
}
