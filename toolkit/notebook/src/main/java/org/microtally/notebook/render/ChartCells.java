package org.microtally.notebook.render;

import java.math.BigInteger;
import org.apache.commons.math3.fraction.BigFraction;
import org.microtally.InvalidInputException;
import org.microtally.Tabular;

/** Table cells as chart coordinates: column lookup and conversion to double, refusing what cannot be plotted. */
final class ChartCells {
    private ChartCells() { }

    static int columnIndex(Tabular table, String name) {
        int i = table.columnNames().indexOf(name);
        if (i < 0) {
            throw InvalidInputException.of("column", "'" + name + "'", "one of " + table.columnNames(), "");
        }
        return i;
    }

    /** A cell as a double for plotting; exact values beyond the double range are refused. */
    static double toDouble(Object v, int row, String column) {
        double d;
        if (v instanceof BigFraction f) {
            d = CellText.decimalValue(f.getNumerator(), f.getDenominator());
        } else if (v instanceof Number n) {
            d = n.doubleValue();
        } else if (v instanceof Boolean b) {
            d = b ? 1 : 0;
        } else if (v instanceof CharSequence cs) {
            String s = cs.toString().strip();
            try {
                BigFraction f = s.indexOf('/') > 0 ? Tables.exactFraction(s) : null;
                d = f != null ? CellText.decimalValue(f.getNumerator(), f.getDenominator())
                        : s.matches("-?[0-9]+") ? new BigInteger(s).doubleValue() : Double.parseDouble(s);
            } catch (NumberFormatException e) {
                throw InvalidInputException.of("cell in row " + row + ", column '" + column + "'",
                        "\"" + s + "\"", "a number to plot", "Choose a numeric column.");
            }
        } else {
            throw InvalidInputException.of("cell in row " + row + ", column '" + column + "'", v,
                    "a number to plot", "Choose a numeric column.");
        }
        if (Double.isInfinite(d) && !(v instanceof Double || v instanceof Float)) {
            throw InvalidInputException.of("cell in row " + row + ", column '" + column + "'",
                    CellText.shown(v, TableFormat.DEFAULT), "at most 1.8e308 in magnitude to plot",
                    "Plot its logarithm instead (for example ln Omega).");
        }
        return d;
    }
}
