package org.microtally.notebook.session;

import java.util.List;

/**
 * Why a cell failed.
 *
 * @param type      for runtime errors the exception class name; {@code "CompileError"} or
 *                  {@code "Interrupted"} otherwise
 * @param message   the diagnostic or exception message
 * @param traceback human-readable lines: the diagnostic with a caret under the column, or the
 *                  exception and the stack frames of the user's code (engine frames trimmed)
 * @param line      1-based line in the cell where the error is located, or 0 when unknown
 * @param column    1-based column in that line, or 0 when unknown
 */
public record CellError(String type, String message, List<String> traceback, int line, int column) {
    public CellError {
        traceback = List.copyOf(traceback);
    }
}
