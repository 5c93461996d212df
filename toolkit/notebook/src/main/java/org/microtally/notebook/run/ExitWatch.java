package org.microtally.notebook.run;

import java.io.PrintStream;
import java.nio.file.Path;

/**
 * Says which cell ended the JVM. The engine rewrites exit calls in cell code (also through
 * reflection and method handles), but library code a cell calls may still call
 * {@code System.exit}; then this shutdown hook prints the notebook and cell that was running, so the
 * run never ends without a word. ({@code Runtime.halt} from library code skips shutdown hooks and
 * cannot be reported.)
 */
final class ExitWatch implements AutoCloseable {
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
            log.println("microtally run: the JVM is exiting while " + cell + " runs: code called by that cell ended the "
                    + "process (System.exit outside the cell's own code); this notebook and the ones after it were not written");
            log.flush();
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
