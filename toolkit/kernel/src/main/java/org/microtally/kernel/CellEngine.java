package org.microtally.kernel;

import java.util.List;
import java.util.Optional;
import org.microtally.notebook.session.CellOutput;
import org.microtally.notebook.session.CellResult;

/**
 * What the kernel needs from an evaluation engine. The production implementation adapts the
 * notebook module's JShell {@code Session}; tests use small doubles. Offsets are UTF-16 char
 * indexes into {@code code} (the kernel converts Jupyter's code-point cursors).
 */
interface CellEngine extends AutoCloseable {

    /** Runs one cell, blocking until it ends. */
    CellResult run(String code, CellOutput output);

    /** From another thread: stops the running cell, if any. */
    void interrupt();

    /** Completion candidates for the text at {@code cursor}. */
    Completion complete(String code, int cursor);

    /** Signature and documentation of the name at {@code cursor}, as plain text, if known. */
    Optional<String> inspect(String code, int cursor);

    /** Whether {@code code} is a complete cell. */
    Completeness completeness(String code);

    /** Releases the engine; it is not used again. */
    @Override
    void close();

    /**
     * Completion candidates replacing {@code code[start, end)}.
     *
     * @param matches the candidate texts
     * @param start   UTF-16 index where the replaced text starts
     * @param end     UTF-16 index where it ends
     */
    record Completion(List<String> matches, int start, int end) {
        public Completion {
            matches = List.copyOf(matches);
        }
    }

    /**
     * How complete a cell's source is; INCOMPLETE asks the front end for another line.
     *
     * @param kind   the answer
     * @param indent for INCOMPLETE, the indentation suggested for the next line
     */
    record Completeness(Kind kind, String indent) {
        /** The four answers of the protocol's is_complete_reply. */
        enum Kind { COMPLETE, INCOMPLETE, INVALID, UNKNOWN }

        static final Completeness UNKNOWN = new Completeness(Kind.UNKNOWN, "");
    }

    /** Makes fresh engines: one at start, another after a reset. */
    interface Factory {
        CellEngine open();
    }
}
