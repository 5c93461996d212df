package org.microtally.notebook.run;

import java.io.PrintStream;
import java.nio.file.Path;

/**
 * Says which cell ended the JVM. The engine rewrites exit calls in cell code (also through
 * reflection and method handles), but library code a cell calls may still call
 * {@code System.exit}; then this shutdown hook prints the notebook and cell that was running and
 * ends the process with status {@value #EXIT_STATUS} (a failed cell), so the run never ends without
 * a word or with a status that looks like success. ({@code Runtime.halt} from library code skips shutdown hooks and
 * cannot be reported.)
 */
final class ExitWatch implements AutoCloseable {
    /** The process status after a cell ended the JVM: that of a failed cell. */
    static final int EXIT_STATUS = 1;
    private final PrintStream log;
    private final Thread hook;
    private volatile String running;

    ExitWatch(PrintStream log) {
        this.log = log;
        this.hook = new Thread(this::report, "microtally-run-exit-report");
        Runtime.getRuntime().addShutdownHook(hook);
    }

    void cellStarted(Path notebook, int cellNumber) {
        running = notebook + ", cell " + cellNumber;
    }

    void cellEnded() {
        running = null;
    }

    private void report() {
        String cell = running;
        if (cell != null) {
            log.println("microtally: FAILED " + cell + ": code called by that cell ended the JVM (System.exit outside "
                    + "the cell's own code); this notebook and the ones after it were not written");
            log.flush();
            Runtime.getRuntime().halt(EXIT_STATUS);   // the status of a failed cell, whatever status the library asked for
        }
    }

    @Override
    public void close() {
        try {
            Runtime.getRuntime().removeShutdownHook(hook);
        } catch (IllegalStateException e) {
            // the JVM is already shutting down: the hook runs
        }
    }
}
