package org.microtally.notebook.session;

import java.util.ArrayList;
import java.util.Collections;
import java.util.List;

/**
 * Completion suggestions for a cursor position in a cell.
 *
 * @param matches    the texts that may replace {@code code.substring(start, end)}, best first
 * @param start      offset in the cell where the replaced text begins
 * @param end        offset in the cell where it ends (the cursor)
 * @param kinds      for each match, what it is when known ("variable": in scope and of a type the
 *                   argument position takes; "constant": a public constant of that type), else ""
 * @param signatures when the cursor is inside a call's arguments, the signatures of the overloads
 *                   being called (else empty)
 */
public record Completions(List<String> matches, int start, int end, List<String> kinds, List<String> signatures) {
    public Completions {
        matches = List.copyOf(matches);
        List<String> k = new ArrayList<>(kinds);
        if (k.size() > matches.size()) {
            throw new IllegalArgumentException("kinds (" + k.size() + ") outnumber matches (" + matches.size() + ")");
        }
        k.addAll(Collections.nCopies(matches.size() - k.size(), ""));
        kinds = List.copyOf(k);
        signatures = List.copyOf(signatures);
    }

    /** Suggestions without kinds or signatures. */
    public Completions(List<String> matches, int start, int end) {
        this(matches, start, end, List.of(), List.of());
    }
}
