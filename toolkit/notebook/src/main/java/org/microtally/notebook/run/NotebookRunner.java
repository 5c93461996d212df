package org.microtally.notebook.run;

import com.google.gson.JsonArray;
import com.google.gson.JsonNull;
import com.google.gson.JsonObject;
import java.io.IOException;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.nio.file.StandardOpenOption;
import java.security.SecureRandom;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import java.util.concurrent.Executors;
import java.util.concurrent.ScheduledExecutorService;
import java.util.concurrent.ScheduledFuture;
import java.util.concurrent.TimeUnit;
import org.microtally.notebook.session.CellError;
import org.microtally.notebook.session.CellResult;
import org.microtally.notebook.session.Session;

/**
 * The headless runner: {@code microtally run NOTEBOOK... [--out DIR] [--keep-going] [--cell-timeout SECONDS]}.
 *
 * <p>Each notebook (nbformat 4) is read, its code cells are run in order in a fresh
 * {@link Session}, and the executed notebook ({@code DIR/NAME.ipynb}) and a standalone HTML page
 * ({@code DIR/NAME.html}) are written. The run stops at the first failing cell unless
 * {@code --keep-going}; cells tagged {@code raises-exception} are expected to fail. A notebook that
 * stops on a failure writes nothing, and outputs are always written to a temporary file in DIR and
 * then renamed, so DIR never holds a half-written file and the input is never touched. Progress goes
 * to standard error: one line updated in place on a terminal, one line per cell otherwise.
 *
 * <p>Exit status: 0 all cells ran as expected; 1 a cell failed (the message names notebook, cell and
 * the first line of the error); 2 bad arguments or an unreadable/malformed notebook.
 */
public final class NotebookRunner {
    /** The tag that marks a cell expected to fail (as in Jupyter's own tools). */
    public static final String RAISES_EXCEPTION = "raises-exception";
    static final String DEFAULT_OUT = "microtally-out";
    private static final SecureRandom RANDOM = new SecureRandom();

    private final Path outDir;
    private final boolean keepGoing;
    private final long cellTimeoutMillis;
    private final PrintStream log;
    private final ProgressLine progress;

    private NotebookRunner(Path outDir, boolean keepGoing, long cellTimeoutMillis, PrintStream log, boolean terminal) {
        this.outDir = outDir;
        this.keepGoing = keepGoing;
        this.cellTimeoutMillis = cellTimeoutMillis;
        this.log = log;
        this.progress = new ProgressLine(log, terminal);
    }

    /** Command-line entry: {@code System.exit(main(List.of(args)))}. */
    public static void main(String[] args) {
        System.exit(main(List.of(args)));
    }

    /**
     * Runs the {@code run} sub-command with its arguments (without the word "run") and returns the
     * exit status. Messages and progress go to the process's standard error.
     */
    public static int main(List<String> args) {
        return main(args, Session.consoleErr(), System.console() != null);
    }

    static int main(List<String> args, PrintStream log, boolean terminal) {
        List<Path> notebooks = new ArrayList<>();
        Path out = Path.of(DEFAULT_OUT);
        boolean keepGoing = false;
        long timeout = 0;
        for (int i = 0; i < args.size(); i++) {
            String a = args.get(i);
            switch (a) {
                case "--out" -> {
                    if (i + 1 >= args.size()) {
                        return usage(log, "--out needs a directory");
                    }
                    out = Path.of(args.get(++i));
                }
                case "--keep-going" -> keepGoing = true;
                case "--cell-timeout" -> {
                    if (i + 1 >= args.size()) {
                        return usage(log, "--cell-timeout needs a number of seconds");
                    }
                    try {
                        double s = Double.parseDouble(args.get(++i));
                        if (!(s > 0) || s > 1e6) {
                            return usage(log, "--cell-timeout = " + args.get(i) + " is not allowed: must be a number of seconds > 0");
                        }
                        timeout = (long) Math.ceil(s * 1000);
                    } catch (NumberFormatException e) {
                        return usage(log, "--cell-timeout = " + args.get(i) + " is not a number of seconds");
                    }
                }
                case "-h", "--help" -> {
                    log.println(USAGE);
                    return 0;
                }
                default -> {
                    if (a.startsWith("-")) {
                        return usage(log, "unknown option " + a);
                    }
                    notebooks.add(Path.of(a));
                }
            }
        }
        if (notebooks.isEmpty()) {
            return usage(log, "no notebook given");
        }
        return new NotebookRunner(out, keepGoing, timeout, log, terminal).runAll(notebooks);
    }

    static final String USAGE = String.join("\n",
            "usage: microtally run NOTEBOOK.ipynb... [--out DIR] [--keep-going] [--cell-timeout SECONDS]",
            "  Runs the code cells of each notebook in a fresh session and writes DIR/NAME.ipynb",
            "  (executed, nbformat 4) and DIR/NAME.html (standalone page). DIR defaults to ./" + DEFAULT_OUT + ".",
            "  --keep-going          run every cell even after a failure (outputs keep the errors)",
            "  --cell-timeout S      interrupt a cell that runs longer than S seconds (counts as a failure)",
            "  Cells tagged raises-exception may fail. Exit status: 0 ok, 1 a cell failed, 2 bad input.");

    private static int usage(PrintStream log, String problem) {
        log.println("microtally run: " + problem);
        log.println(USAGE);
        return 2;
    }

    /** Why a notebook run did not succeed. */
    record Failure(Path notebook, int cellNumber, int executionCount, String firstLine) {
        String describe() {
            return notebook + ", cell " + cellNumber + (executionCount > 0 ? " (In [" + executionCount + "])" : "")
                    + ": " + firstLine;
        }
    }

    private int runAll(List<Path> notebooks) {
        Set<String> names = new HashSet<>();
        for (Path p : notebooks) {
            if (!names.add(baseName(p))) {
                log.println("microtally run: two notebooks are named " + baseName(p)
                        + "; their outputs would overwrite each other in " + outDir + ". Run them with different --out directories.");
                return 2;
            }
        }
        Optional<Failure> first = Optional.empty();
        boolean badInput = false;
        for (Path p : notebooks) {
            Notebook nb;
            try {
                nb = Notebook.read(p);
            } catch (NotebookFormatException e) {
                log.println("microtally run: " + e.getMessage());
                badInput = true;
                if (keepGoing) {
                    continue;
                }
                return 2;
            } catch (IOException e) {
                log.println("microtally run: cannot read " + p + ": " + e.getMessage());
                badInput = true;
                if (keepGoing) {
                    continue;
                }
                return 2;
            }
            Optional<Failure> f;
            try {
                f = runOne(p, nb);
            } catch (IOException e) {
                log.println("microtally run: cannot write the outputs of " + p + " to " + outDir + ": " + e.getMessage());
                return 2;
            }
            if (f.isPresent() && first.isEmpty()) {
                first = f;
            }
            if (f.isPresent() && !keepGoing) {
                break;
            }
        }
        if (first.isPresent()) {
            log.println("microtally run: FAILED " + first.get().describe());
            return 1;
        }
        return badInput ? 2 : 0;
    }

    private Optional<Failure> runOne(Path file, Notebook input) throws IOException {
        Path target = outDir.resolve(baseName(file) + ".ipynb");
        Path page = outDir.resolve(baseName(file) + ".html");
        if (Files.exists(target) && Files.isSameFile(target, file)) {
            throw new IOException("the output " + target + " would replace the input notebook; choose another --out directory");
        }
        Notebook nb = input.copy();
        nb.normalize();
        List<JsonObject> cells = nb.cells();
        int codeCells = (int) cells.stream().filter(c -> Notebook.type(c).equals("code")).count();
        Failure failure = null;
        Map<String, JsonObject> displays = new HashMap<>();
        ScheduledExecutorService timer = cellTimeoutMillis > 0 ? Executors.newSingleThreadScheduledExecutor(r -> {
            Thread t = new Thread(r, "microtally-cell-timeout");
            t.setDaemon(true);
            return t;
        }) : null;
        long started = System.nanoTime();
        int count = 0;
        try (Session session = Session.open()) {
            for (int i = 0; i < cells.size(); i++) {
                JsonObject cell = cells.get(i);
                if (!Notebook.type(cell).equals("code")) {
                    continue;
                }
                JsonArray outputs = new JsonArray();
                cell.add("outputs", outputs);
                cell.add("execution_count", JsonNull.INSTANCE);
                if (failure != null && !keepGoing) {
                    continue;
                }
                count++;
                cell.addProperty("execution_count", count);
                progress.cellStarted(file, count, codeCells, i + 1);
                int cellNumber = i + 1;
                OutputCollector collector = new OutputCollector(outputs, displays,
                        text -> progress.computation(file, cellNumber, text));
                ScheduledFuture<?> alarm = timer == null ? null
                        : timer.schedule(session::interrupt, cellTimeoutMillis, TimeUnit.MILLISECONDS);
                long t0 = System.nanoTime();
                CellResult r = session.run(Notebook.text(cell.get("source")), collector);
                if (alarm != null) {
                    alarm.cancel(false);
                }
                double seconds = (System.nanoTime() - t0) / 1e9;
                String status;
                if (r.ok()) {
                    r.value().ifPresent(b -> collector.result(b, cell.get("execution_count").getAsInt()));
                    status = "ok";
                } else {
                    CellError e = r.error().orElseThrow();
                    if (r.outcome() == CellResult.Outcome.INTERRUPTED && alarm != null) {
                        e = new CellError(e.type(), "the cell ran longer than the time limit of " + cellTimeoutMillis / 1000.0
                                + " s and was interrupted", e.traceback(), e.line(), e.column());
                    }
                    collector.error(e);
                    boolean expected = Notebook.hasTag(cell, RAISES_EXCEPTION);
                    status = expected ? "failed as expected (" + e.type() + ")" : "FAILED (" + e.type() + ")";
                    if (!expected && failure == null) {
                        String msg = e.message() == null ? "" : e.message().split("\n", 2)[0];
                        failure = new Failure(file, i + 1, count, e.type() + (msg.isEmpty() ? "" : ": " + msg));
                    }
                }
                progress.cellDone(file, count, codeCells, i + 1, status, seconds);
            }
        } finally {
            if (timer != null) {
                timer.shutdownNow();
            }
        }
        progress.notebookDone(file, count, codeCells, (System.nanoTime() - started) / 1e9, failure == null);
        if (failure != null && !keepGoing) {
            log.println("microtally run: " + file + ": nothing written, the run stopped at a failing cell");
            return Optional.of(failure);
        }
        writeAtomically(List.of(target, page), List.of(nb.toJson(), HtmlPage.of(nb, baseName(file))));
        log.println("microtally run: wrote " + target + " and " + page);
        return Optional.ofNullable(failure);
    }

    static String baseName(Path p) {
        String n = p.getFileName().toString();
        return n.endsWith(".ipynb") ? n.substring(0, n.length() - ".ipynb".length()) : n;
    }

    /**
     * Writes every file to a temporary file in its directory first and renames them into place only
     * when all are written; on any failure the temporary files are removed and no target is touched.
     */
    static void writeAtomically(List<Path> targets, List<String> contents) throws IOException {
        List<Path> temps = new ArrayList<>();
        try {
            for (int i = 0; i < targets.size(); i++) {
                Path t = targets.get(i).toAbsolutePath();
                Files.createDirectories(t.getParent());
                // created like any new file (permissions from the umask), unlike createTempFile's owner-only mode
                Path tmp = t.getParent().resolve("." + t.getFileName() + "." + Long.toHexString(RANDOM.nextLong()) + ".partial");
                temps.add(tmp);
                Files.writeString(tmp, contents.get(i), StandardCharsets.UTF_8, StandardOpenOption.CREATE_NEW, StandardOpenOption.WRITE);
            }
            for (int i = 0; i < targets.size(); i++) {
                try {
                    Files.move(temps.get(i), targets.get(i), StandardCopyOption.ATOMIC_MOVE, StandardCopyOption.REPLACE_EXISTING);
                } catch (AtomicMoveNotSupportedException e) {
                    Files.move(temps.get(i), targets.get(i), StandardCopyOption.REPLACE_EXISTING);
                }
            }
        } finally {
            for (Path tmp : temps) {
                Files.deleteIfExists(tmp);
            }
        }
    }
}
