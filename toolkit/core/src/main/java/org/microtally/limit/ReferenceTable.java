package org.microtally.limit;

import java.util.ArrayList;
import java.util.List;
import org.microtally.InvalidInputException;
import org.microtally.Tabular;

/**
 * A table of thermodynamic-limit reference values, e.g. a temperature sweep of a {@link FermiGas}
 * with the exact numbers next to the Sommerfeld expansion. Immutable.
 *
 * <p>A container only: it computes nothing and adds no error. Its cells carry the accuracy of the
 * class that filled them, stated there: {@link FermiGas#sweep} (the columns without a suffix as
 * stated on {@link FermiGas}: U within {@value FermiGas#MAX_RELATIVE_ERROR}, C within
 * {@value FermiGas#MAX_HEAT_CAPACITY_ERROR} relative, mu within {@value FermiGas#MAX_CHEMICAL_POTENTIAL_ERROR}
 * of max(|mu|, kT); the Sommerfeld columns are truncated expansions, mu and U to second order with the
 * next term of order (T/T_F)^4, C to first order with the next term of order (T/T_F)^3) and
 * {@link BoseGas#sweep} (within {@value BoseGas#MAX_RELATIVE_ERROR} relative). Those accuracies are within
 * the thermodynamic-limit model (a power-law density of states, {@link DensityOfStates}); they are
 * not statements about a finite N.
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
