package org.microtally.limit;

import java.util.ArrayList;
import java.util.List;
import org.microtally.InvalidInputException;
import org.microtally.Tabular;

/**
 * A table of thermodynamic-limit reference values, e.g. a temperature sweep of a {@link FermiGas}
 * with the exact numbers next to the Sommerfeld expansion. Immutable.
 *
 * @param columnNames column names, with units in parentheses
 * @param rows        rows of {@link Double} cells, one per column
 */
public record ReferenceTable(List<String> columnNames, List<List<Object>> rows) implements Tabular {

    /** Copies both lists and checks that every row has one cell per column. */
    public ReferenceTable {
        columnNames = List.copyOf(columnNames);
        List<List<Object>> copy = new ArrayList<>(rows.size());
        for (List<Object> row : rows) {
            if (row.size() != columnNames.size()) {
                throw InvalidInputException.of("row length", row.size(), "equal to the number of columns "
                        + columnNames.size(), "");
            }
            copy.add(List.copyOf(row));
        }
        rows = List.copyOf(copy);
    }
}
