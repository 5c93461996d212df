package org.microtally;

import java.util.List;

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
}
