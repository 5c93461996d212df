package org.microtally;

import java.util.List;

/**
 * A result whose table is its {@link QuantityTable}: {@link #columnNames()} and {@link #rows()} are
 * those of {@link #quantities()}, so an ensemble shows the same cells whether it is rendered as a
 * table or its quantities are read one by one.
 */
public interface QuantityResult extends Tabular {
    /** The result as a quantity table (name, value, unit, note). */
    QuantityTable quantities();

    /** The columns of {@link #quantities()}. */
    @Override
    default List<String> columnNames() {
        return quantities().columnNames();
    }

    /** The rows of {@link #quantities()}. */
    @Override
    default List<List<Object>> rows() {
        return quantities().rows();
    }
}
