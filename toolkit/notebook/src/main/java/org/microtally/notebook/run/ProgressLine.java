package org.microtally.notebook.run;

import java.io.PrintStream;
import java.nio.file.Path;
import java.util.Comparator;
import java.util.List;
import java.util.Locale;
import java.util.stream.Collectors;

/**
 * The runner's per-cell progress on standard error, in words: {@code NAME.ipynb  cell 4 (2 of 9)
 * ok  2.85 s}. On a terminal one line rewritten with a carriage return, otherwise one line per
 * finished cell (readable in CI logs); each notebook ends with a line giving its total time and its
 * slowest cells, and a run of several notebooks with a line giving their number and wall time.
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

    /** One code cell's wall time. */
    record CellTime(int cellNumber, double seconds) { }

    /** The notebook's total line, with its slowest cells (at most {@value #SLOWEST}, those of 0.1 s or more). */
    void notebookDone(Path nb, int ran, int total, double seconds, boolean ok, List<CellTime> times) {
        if (terminal) {
            err.println();
        }
        err.println(String.format(Locale.ROOT, "%s: %d of %d code cells run in %.1f s%s%s", nb, ran, total, seconds,
                ok ? "" : ", with failures", slowest(times)));
    }

    static final int SLOWEST = 3;

    /** {@code ; slowest: cell 6 9.81 s, cell 2 1.75 s}, or empty when no cell took 0.1 s. */
    static String slowest(List<CellTime> times) {
        String list = times.stream().filter(t -> t.seconds() >= 0.1)
                .sorted(Comparator.comparingDouble(CellTime::seconds).reversed()).limit(SLOWEST)
                .map(t -> String.format(Locale.ROOT, "cell %d %.2f s", t.cellNumber(), t.seconds()))
                .collect(Collectors.joining(", "));
        return list.isEmpty() ? "" : "; slowest: " + list;
    }

    /** The run's closing line when more than one notebook ran: how many, and the wall time of the whole run. */
    void runDone(int notebooks, double seconds) {
        err.println(String.format(Locale.ROOT, "microtally: %d notebooks run in %.1f s", notebooks, seconds));
    }

    /** {@code NAME.ipynb  cell C (n of total)}: the notebook cell number and the count of code cells. */
    static String where(Path nb, int cellNumber, int n, int total) {
        return nb.getFileName() + "  cell " + cellNumber + " (" + n + " of " + total + ")";
    }
}
