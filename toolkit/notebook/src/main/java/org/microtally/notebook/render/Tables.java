package org.microtally.notebook.render;

import java.math.BigDecimal;
import java.math.BigInteger;
import java.util.AbstractList;
import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import java.util.function.Function;
import org.apache.commons.math3.fraction.BigFraction;
import org.apache.commons.math3.fraction.Fraction;
import org.microtally.InvalidInputException;
import org.microtally.Tabular;
import org.microtally.count.CountTable;
import org.microtally.spectrum.Level;
import org.microtally.spectrum.Spectrum;
import tech.tablesaw.api.BooleanColumn;
import tech.tablesaw.api.DoubleColumn;
import tech.tablesaw.api.IntColumn;
import tech.tablesaw.api.LongColumn;
import tech.tablesaw.api.StringColumn;
import tech.tablesaw.api.Table;
import tech.tablesaw.columns.Column;
import tech.tablesaw.columns.strings.StringColumnType;

/**
 * Conversions between our results and Tablesaw {@link Table}s.
 *
 * <p>Column types of {@link #of(Tabular)}, chosen from the non-missing cells of each column:
 * <ul>
 *   <li>only {@code Integer}/{@code Short}/{@code Byte}: {@link IntColumn};</li>
 *   <li>only integral primitives with some {@code Long}: {@link LongColumn};</li>
 *   <li>only {@code Double}/{@code Float}, possibly mixed with {@code int}s, or with {@code long}s of
 *       magnitude at most 2^53 (all exactly representable): {@link DoubleColumn};</li>
 *   <li>only {@code Boolean}: {@link BooleanColumn};</li>
 *   <li>anything else, in particular every column holding a {@link BigInteger}, {@link BigFraction},
 *       {@link Fraction} or {@link BigDecimal}: a {@link StringColumn} holding the <em>exact</em>
 *       text of each value (all digits; {@code p/q} for fractions), so nothing is rounded. Read a
 *       value back with {@code new BigInteger(s)} or {@link #exactFraction(String)}.</li>
 * </ul>
 * {@code null} cells and the marker {@code "n/a"} ({@link CellText#isMissing}) become missing values. Tablesaw has no arbitrary-precision column type; keeping
 * exact values as their digits is our documented choice.
 */
public final class Tables {
    private static final long DOUBLE_EXACT_LIMIT = 1L << 53;

    static {
        DisplayEnvironment.prepare();
    }

    private Tables() { }

    /** {@code table} as a Tablesaw table named "result". */
    public static Table of(Tabular table) {
        return of(table, "result");
    }

    /** {@code table} as a Tablesaw table named {@code name}; column types as described above. */
    public static Table of(Tabular table, String name) {
        Objects.requireNonNull(table, "table");
        List<String> names = table.columnNames();
        List<List<Object>> rows = table.rows();
        int n = names.size();
        for (int r = 0; r < rows.size(); r++) {
            if (rows.get(r).size() != n) {
                throw InvalidInputException.of("number of cells in row " + r, rows.get(r).size(),
                        "equal to the number of columns (" + n + ")", "Fix the Tabular implementation.");
            }
        }
        List<Column<?>> columns = new ArrayList<>(n);
        for (int c = 0; c < n; c++) {
            columns.add(column(names.get(c), rows, c));
        }
        return Table.create(name, columns);
    }

    /**
     * A spectrum as a table with columns {@code energy}, {@code degeneracy} and, for labelled
     * spectra, {@code label}: the layout {@link org.microtally.notebook.data.SpectrumReader} reads.
     */
    public static Table of(Spectrum spectrum) {
        return of(levels(spectrum), "spectrum (" + spectrum.scale().name() + ")");
    }

    /**
     * A count table as a grid: column {@code E} (0..E_max) and one exact column {@code n=k} per
     * particle number k = 0..N (digits as text, see the class description), the layout to export
     * with {@link org.microtally.notebook.data.Csv}.
     */
    public static Table grid(CountTable counts) {
        Objects.requireNonNull(counts, "counts");
        int[] all = new int[counts.maxParticles() + 1];
        for (int n = 0; n < all.length; n++) {
            all[n] = n;
        }
        return of(ResultDisplays.grid(counts, all), "Omega(n, E)");
    }

    /** The levels of {@code spectrum} as rows: energy, degeneracy and, when labelled, label. */
    public static Tabular levels(Spectrum spectrum) {
        Objects.requireNonNull(spectrum, "spectrum");
        boolean labelled = spectrum.isLabelled();
        List<String> names = labelled ? List.of("energy", "degeneracy", "label") : List.of("energy", "degeneracy");
        List<List<Object>> rows = new AbstractList<>() {
            @Override
            public List<Object> get(int i) {
                Level l = spectrum.level(i);
                return labelled ? List.of(l.energy(), l.degeneracy(), l.label()) : List.of(l.energy(), l.degeneracy());
            }

            @Override
            public int size() {
                return spectrum.size();
            }
        };
        return tabular(names, rows);
    }

    /**
     * A live, read-only {@link Tabular} view of a Tablesaw table: cells are the columns' boxed
     * values ({@code Integer}, {@code Long}, {@code Double}, {@code Boolean}, {@code String}, dates...),
     * missing values are {@code null}. Rows are read on access, so showing the head of a large table
     * touches only the rows shown.
     */
    public static Tabular asTabular(Table table) {
        Objects.requireNonNull(table, "table");
        List<String> names = List.copyOf(table.columnNames());
        List<Column<?>> cols = table.columns();
        List<List<Object>> rows = new AbstractList<>() {
            @Override
            public List<Object> get(int r) {
                List<Object> cells = new ArrayList<>(cols.size());
                for (Column<?> col : cols) {
                    cells.add(col.isMissing(r) ? null : col.get(r));
                }
                return cells;
            }

            @Override
            public int size() {
                return table.rowCount();
            }
        };
        return tabular(names, rows);
    }

    /** Parses the exact text of a fraction ({@code "p/q"} or an integer) as written by {@link #of(Tabular)}. */
    public static BigFraction exactFraction(String text) {
        String s = Objects.requireNonNull(text, "text").strip();
        int slash = s.indexOf('/');
        try {
            if (slash < 0) {
                return new BigFraction(new BigInteger(s));
            }
            return new BigFraction(new BigInteger(s.substring(0, slash).strip()),
                    new BigInteger(s.substring(slash + 1).strip()));
        } catch (IllegalArgumentException | ArithmeticException e) {
            throw InvalidInputException.of("exact fraction", "\"" + text + "\"",
                    "an integer or p/q with integers p and q != 0", "");
        }
    }

    /**
     * {@code table} marked to be shown with every row (a long table is otherwise shortened around its
     * peak, see {@link TableFormat}): {@code show(Tables.allRows(result))}.
     */
    public static Tabular allRows(Tabular table) {
        return new AllRows(Objects.requireNonNull(table, "table"));
    }

    /** A table shown in full; its rows and columns are those of the wrapped table. */
    record AllRows(Tabular table) implements Tabular {
        @Override
        public List<String> columnNames() {
            return table.columnNames();
        }

        @Override
        public List<List<Object>> rows() {
            return table.rows();
        }
    }

    /**
     * A {@link Tabular} of the given column names and rows, copied ({@link Tabular#of}): the quickest
     * way to show or export numbers computed in a notebook cell.
     */
    public static Tabular tabular(List<String> names, List<List<Object>> rows) {
        return Tabular.of(names, rows);
    }

    private enum Kind { INT, LONG, DOUBLE, BOOLEAN, STRING }

    private static Column<?> column(String name, List<List<Object>> rows, int c) {
        Kind kind = null;
        boolean bigLong = false;
        for (List<Object> row : rows) {
            Object v = row.get(c);
            if (CellText.isMissing(v)) {
                continue;
            }
            Kind k;
            if (v instanceof Integer || v instanceof Short || v instanceof Byte) {
                k = Kind.INT;
            } else if (v instanceof Long l) {
                k = Kind.LONG;
                bigLong |= Math.abs(l) > DOUBLE_EXACT_LIMIT || l == Long.MIN_VALUE;
            } else if (v instanceof Double || v instanceof Float) {
                k = Kind.DOUBLE;
            } else if (v instanceof Boolean) {
                k = Kind.BOOLEAN;
            } else {
                k = Kind.STRING;
            }
            kind = kind == null ? k : join(kind, k);
        }
        if (kind == Kind.DOUBLE && bigLong) {
            kind = Kind.STRING;
        }
        if (kind == null) {
            kind = Kind.STRING;
        }
        switch (kind) {
            case INT:
                return filled(IntColumn.create(name), rows, c, v -> ((Number) v).intValue());
            case LONG:
                return filled(LongColumn.create(name), rows, c, v -> ((Number) v).longValue());
            case DOUBLE:
                return filled(DoubleColumn.create(name), rows, c, v -> ((Number) v).doubleValue());
            case BOOLEAN:
                return filled(BooleanColumn.create(name), rows, c, v -> (Boolean) v);
            default: {
                String[] text = new String[rows.size()];
                for (int r = 0; r < text.length; r++) {
                    Object v = rows.get(r).get(c);
                    text[r] = CellText.isMissing(v) ? StringColumnType.missingValueIndicator() : CellText.exact(v);
                }
                return StringColumn.create(name, text);
            }
        }
    }

    /** Appends column {@code c} of every row to {@code col}: missing cells as missing, others through {@code value}. */
    private static <T> Column<T> filled(Column<T> col, List<List<Object>> rows, int c, Function<Object, T> value) {
        for (List<Object> row : rows) {
            Object v = row.get(c);
            if (CellText.isMissing(v)) {
                col.appendMissing();
            } else {
                col.append(value.apply(v));
            }
        }
        return col;
    }

    private static Kind join(Kind a, Kind b) {
        if (a == b) {
            return a;
        }
        if (a == Kind.STRING || b == Kind.STRING || a == Kind.BOOLEAN || b == Kind.BOOLEAN) {
            return Kind.STRING;
        }
        if (a == Kind.DOUBLE || b == Kind.DOUBLE) {
            return Kind.DOUBLE;
        }
        return Kind.LONG;
    }
}
