package org.microtally.notebook.run;

import java.io.PrintStream;
import java.nio.file.Path;
import java.util.Locale;

/**
 * The runner's per-cell progress on standard error, in words: {@code NAME.ipynb  cell 4 (2 of 9)
 * ok  2.85 s}. On a terminal one line rewritten with a carriage return, otherwise one line per
 * finished cell (readable in CI logs); each notebook ends with a line giving its total time.
 */
final class ProgressLine {
    private final PrintStream err;
    private final boolean terminal;

    ProgressLine(PrintStream err, boolean terminal) {
        this.err = err;
        this.terminal = terminal;
    }

    void cellStarted(Path nb, int n, int total, int cellNumber) {
        if (terminal) {
            err.print("\r" + where(nb, cellNumber, n, total) + "  running\u001B[K");
            err.flush();
        }
    }

    /** A progress report of a computation inside a cell: shown in place on a terminal only. */
    void computation(Path nb, int cellNumber, String text) {
        if (terminal && !text.isEmpty()) {
            err.print("\r" + nb.getFileName() + "  cell " + cellNumber + "  " + text + "\u001B[K");
            err.flush();
        }
    }

    void cellDone(Path nb, int n, int total, int cellNumber, String status, double seconds) {
        String line = where(nb, cellNumber, n, total) + "  " + status + String.format(Locale.ROOT, "  %.2f s", seconds);
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

    /** {@code NAME.ipynb  cell C (n of total)}: the notebook cell number and the count of code cells. */
    static String where(Path nb, int cellNumber, int n, int total) {
        return nb.getFileName() + "  cell " + cellNumber + " (" + n + " of " + total + ")";
    }
}
