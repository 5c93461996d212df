package org.microtally.notebook.session;

import java.util.List;

/**
 * Completion suggestions for a cursor position in a cell.
 *
 * @param matches the texts that may replace {@code code.substring(start, end)}, best first
 * @param start   offset in the cell where the replaced text begins
 * @param end     offset in the cell where it ends (the cursor)
 */
public record Completions(List<String> matches, int start, int end) {
    public Completions {
        matches = List.copyOf(matches);
    }
}
