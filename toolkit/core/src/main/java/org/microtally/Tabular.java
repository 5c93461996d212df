package org.microtally;

import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.Objects;

/**
 * A result that can be shown as a table: named columns and rows of cells. Every core result
 * implements it, so the notebook module can render any of them without knowing its type.
 *
 * <p>Cells are {@link Number} (including {@link java.math.BigInteger} and
 * {@link org.apache.commons.math3.fraction.BigFraction}), {@link String} or {@link Boolean}; exact
 * values are given as exact objects, never pre-rounded to double.
 */
public interface Tabular {
    /** Column names, in display order. */
    List<String> columnNames();

    /** The rows; each has {@code columnNames().size()} cells. */
    List<List<Object>> rows();

    /**
     * A table of the given column names and rows, copied (later changes to the arguments do not show) and
     * unmodifiable. Cells may be null (shown as missing by the renderers). Row widths are not checked here:
     * the renderers refuse a row whose cell count differs from the number of columns, naming the row.
     */
    static Tabular of(List<String> names, List<? extends List<?>> rows) {
        List<String> columns = List.copyOf(Objects.requireNonNull(names, "names"));
        List<List<Object>> copy = new ArrayList<>();
        for (List<?> row : Objects.requireNonNull(rows, "rows")) {
            copy.add(Collections.unmodifiableList(new ArrayList<Object>(Objects.requireNonNull(row, "row"))));
        }
        List<List<Object>> cells = Collections.unmodifiableList(copy);
        return new Tabular() {
            @Override
            public List<String> columnNames() {
                return columns;
            }

            @Override
            public List<List<Object>> rows() {
                return cells;
            }
        };
    }
}
