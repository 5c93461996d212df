package org.microtally.notebook.render;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import org.microtally.Tabular;

/** Small Tabular implementations for tests. */
final class TestTables {
    private TestTables() { }

    /** A table from column names and rows given as arrays. */
    static Tabular of(List<String> names, Object[]... rows) {
        List<List<Object>> list = new ArrayList<>();
        for (Object[] r : rows) {
            list.add(Arrays.asList(r));
        }
        return Tables.tabular(names, list);
    }
}
