package org.microtally.notebook.render;

import org.microtally.InvalidInputException;

/**
 * How tables are shown: how wide an exact integer may be before it is abbreviated, how many
 * significant digits a floating-point column shows, and when and how a long table is shortened.
 * Display settings only: the value behind every cell is never changed, and an abbreviated cell says
 * so (a trailing {@code …(n digits)}) and carries its full value in the HTML {@code title} attribute.
 *
 * <p>A table of more than {@link #maxRows()} rows is shown shortened: its first and last
 * {@link #edgeRows()} rows and {@link #windowRows()} rows around the largest value of its main column
 * (the first numeric column whose largest value lies inside the table, such as a probability peak or
 * a heat-capacity maximum), or, when no column peaks inside, its first {@link #windowRows()} rows.
 * A note under the table says what was left out and how to see every row
 * ({@code show(Tables.allRows(table))}).
 *
 * @param maxDigits         exact integers with up to this many digits are shown in full, &gt;= 1
 * @param leadingDigits     an abbreviated integer shows this many leading digits, 1..maxDigits
 * @param significantDigits floating-point columns are shown to this many significant digits, 3..17
 * @param maxRows           tables with more rows are shortened, &gt;= 1
 * @param windowRows        rows shown around the peak of a shortened table, 1..maxRows
 */
public record TableFormat(int maxDigits, int leadingDigits, int significantDigits, int maxRows, int windowRows) {

    /** 40 digits in full, 12 leading digits otherwise, 6 significant digits, shortened above 60 rows to 30. */
    public static final TableFormat DEFAULT = new TableFormat(40, 12, 6, 60, 20);

    /** Validates the settings; see the record description for the allowed ranges. */
    public TableFormat {
        if (maxDigits < 1) {
            throw InvalidInputException.of("maxDigits", maxDigits, "an integer >= 1", "");
        }
        if (leadingDigits < 1 || leadingDigits > maxDigits) {
            throw InvalidInputException.of("leadingDigits", leadingDigits, "an integer in [1, maxDigits = "
                    + maxDigits + "]", "");
        }
        if (significantDigits < 3 || significantDigits > 17) {
            throw InvalidInputException.of("significantDigits", significantDigits, "an integer in [3, 17]", "");
        }
        if (maxRows < 1) {
            throw InvalidInputException.of("maxRows", maxRows, "an integer >= 1", "");
        }
        if (windowRows < 1 || windowRows > maxRows) {
            throw InvalidInputException.of("windowRows", windowRows, "an integer in [1, maxRows = " + maxRows + "]", "");
        }
    }

    /** Rows shown at each end of a shortened table: a quarter of the window, at least 1. */
    public int edgeRows() {
        return Math.max(1, windowRows / 4);
    }

    /** Whether a table of {@code rowCount} rows is shown shortened. */
    public boolean elides(int rowCount) {
        return rowCount > maxRows;
    }

    /** The same format showing every row: for exports and for {@code Tables.allRows}. */
    public TableFormat allRows() {
        return new TableFormat(maxDigits, leadingDigits, significantDigits, Integer.MAX_VALUE, windowRows);
    }
}
