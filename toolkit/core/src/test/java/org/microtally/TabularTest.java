package org.microtally;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import org.junit.jupiter.api.Test;

class TabularTest {
    // common practice, no source: a factory result keeps what it was given and cannot be changed afterwards.
    @Test
    void ofCopiesNamesAndRowsAndKeepsNullCells() {
        List<String> names = new ArrayList<>(List.of("n", "Omega"));
        List<Object> row = new ArrayList<>(Arrays.asList(3, null));
        List<List<Object>> rows = new ArrayList<>();
        rows.add(row);
        Tabular t = Tabular.of(names, rows);
        names.add("extra");
        row.set(0, 99);
        rows.add(List.of(4, 5));
        assertEquals(List.of("n", "Omega"), t.columnNames());
        assertEquals(1, t.rows().size());
        assertEquals(3, t.rows().get(0).get(0));
        assertNull(t.rows().get(0).get(1));
        assertThrows(UnsupportedOperationException.class, () -> t.rows().get(0).set(0, 1));
        assertThrows(UnsupportedOperationException.class, () -> t.rows().add(List.of()));
    }

    @Test
    void ofRefusesNullArguments() {
        assertThrows(NullPointerException.class, () -> Tabular.of(null, List.of()));
        assertThrows(NullPointerException.class, () -> Tabular.of(List.of("a"), null));
    }
}
