package org.microtally.notebook.run;

import java.io.PrintStream;
import java.nio.file.Path;
import java.util.Locale;

/**
 * The runner's per-cell progress on standard error: on a terminal one line rewritten with a
 * carriage return, otherwise one line per finished cell (readable in CI logs).
 */
final class ProgressLine {
    private static final int WIDTH = 24;
    private final PrintStream err;
    private final boolean terminal;

    ProgressLine(PrintStream err, boolean terminal) {
        this.err = err;
        this.terminal = terminal;
    }

    void cellStarted(Path nb, int n, int total, int cellNumber) {
        if (terminal) {
            err.print("\r" + bar(n - 1, total) + " " + nb.getFileName() + "  cell " + cellNumber + " running...\u001B[K");
            err.flush();
        }
    }

    /** A progress report of a computation inside a cell: shown in place on a terminal only. */
    void computation(Path nb, int cellNumber, String text) {
        if (terminal) {
            err.print("\r" + nb.getFileName() + "  cell " + cellNumber + "  " + text + "\u001B[K");
            err.flush();
        }
    }

    void cellDone(Path nb, int n, int total, int cellNumber, String status, double seconds) {
        String line = bar(n, total) + " " + nb.getFileName() + "  cell " + cellNumber + " " + status
                + String.format(Locale.ROOT, " %.2f s", seconds);
        if (terminal) {
            err.print("\r" + line + "\u001B[K");
        } else {
            err.println(line);
        }
        err.flush();
    }

    void notebookDone(Path nb, int ran, int total, double seconds, boolean ok) {
        if (terminal) {
            err.println();
        }
        err.println(String.format(Locale.ROOT, "%s: %d of %d code cells run in %.1f s%s", nb, ran, total, seconds,
                ok ? "" : ", with failures"));
    }

    static String bar(int done, int total) {
        int t = Math.max(total, 1);
        int filled = WIDTH * Math.min(done, t) / t;
        return "[" + "#".repeat(filled) + "-".repeat(WIDTH - filled) + "] " + done + "/" + total;
    }
}
