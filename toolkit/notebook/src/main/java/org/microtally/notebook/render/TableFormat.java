package org.microtally.notebook.render;

import org.microtally.InvalidInputException;

/**
 * How tables are shown: how wide an exact integer may be before it is abbreviated, how many
 * significant digits a floating-point cell shows, and how many rows are shown before the middle of a
 * long table is elided. Display settings only: the value behind every cell is never changed, and an
 * abbreviated cell says so (a trailing {@code …(n digits)}) and carries its full value in the HTML
 * {@code title} attribute.
 *
 * @param maxDigits         exact integers with up to this many digits are shown in full, &gt;= 1
 * @param leadingDigits     an abbreviated integer shows this many leading digits, 1..maxDigits
 * @param significantDigits floating-point cells are shown to this many significant digits, 1..17
 *                          (17 shows every double exactly enough to read it back)
 * @param headRows          rows shown from the top of a long table, &gt;= 1
 * @param tailRows          rows shown from the bottom of a long table, &gt;= 0
 */
public record TableFormat(int maxDigits, int leadingDigits, int significantDigits, int headRows, int tailRows) {

    /** 40 digits in full, 12 leading digits otherwise, 8 significant digits, 20 head and 5 tail rows. */
    public static final TableFormat DEFAULT = new TableFormat(40, 12, 8, 20, 5);

    /** Validates the settings; see the record description for the allowed ranges. */
    public TableFormat {
        if (maxDigits < 1) {
            throw InvalidInputException.of("maxDigits", maxDigits, "an integer >= 1", "");
        }
        if (leadingDigits < 1 || leadingDigits > maxDigits) {
            throw InvalidInputException.of("leadingDigits", leadingDigits, "an integer in [1, maxDigits = "
                    + maxDigits + "]", "");
        }
        if (significantDigits < 1 || significantDigits > 17) {
            throw InvalidInputException.of("significantDigits", significantDigits, "an integer in [1, 17]", "");
        }
        if (headRows < 1) {
            throw InvalidInputException.of("headRows", headRows, "an integer >= 1", "");
        }
        if (tailRows < 0) {
            throw InvalidInputException.of("tailRows", tailRows, "an integer >= 0", "");
        }
    }

    /** Whether a table of {@code rowCount} rows is shown with its middle elided. */
    public boolean elides(int rowCount) {
        return rowCount > headRows + tailRows + 1;
    }

    /** The same format showing every row: for exports and small tables. */
    public TableFormat allRows() {
        return new TableFormat(maxDigits, leadingDigits, significantDigits, Integer.MAX_VALUE / 2,
                Integer.MAX_VALUE / 2);
    }
}
