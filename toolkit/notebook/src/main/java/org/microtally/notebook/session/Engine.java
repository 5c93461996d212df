package org.microtally.notebook.session;

import java.util.Optional;

/**
 * The evaluation engine, as both front doors (the Jupyter kernel and the headless runner) use it:
 * run a cell, stop it, and answer the editor's questions about code. The implementation is
 * {@link Session} (JShell in this JVM); tests of a front door may use a small double.
 *
 * <p>Offsets are UTF-16 {@code char} indexes into {@code code}. {@link #run} blocks its caller;
 * {@link #interrupt} is called from another thread. Output reaches the {@link CellOutput} in the
 * order the cell wrote it, all of it before {@code run} returns (except output of threads the cell
 * leaves running).
 */
public interface Engine extends AutoCloseable {

    /** Runs one cell and blocks until it ends; output goes to {@code output} as it happens. */
    CellResult run(String code, CellOutput output);

    /** From another thread: stops the running cell, which then ends {@link CellResult.Outcome#INTERRUPTED}. */
    void interrupt();

    /** Completion candidates for the text at {@code cursor}, with the range they replace. */
    Completions complete(String code, int cursor);

    /** Signature and documentation of what is at {@code cursor}, as plain text, if known. */
    Optional<String> inspect(String code, int cursor);

    /** Whether {@code code} is a complete cell, needs more lines, or is invalid. */
    Completeness completeness(String code);

    /** Ends the engine: stops a running cell and the threads cells left running. Not used again. */
    @Override
    void close();

    /** Makes fresh engines: one at start, another after a reset. */
    @FunctionalInterface
    interface Factory {
        Engine open();
    }
}
