package org.microtally.notebook.run;

import com.google.gson.JsonNull;
import com.google.gson.JsonObject;
import java.nio.file.Path;
import java.time.Duration;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.concurrent.Executors;
import java.util.concurrent.ScheduledExecutorService;
import java.util.concurrent.ScheduledFuture;
import java.util.concurrent.TimeUnit;
import org.microtally.notebook.data.NotebookFolder;
import org.microtally.notebook.session.CellError;
import org.microtally.notebook.session.CellResult;
import org.microtally.notebook.session.Engine;

/**
 * The execute stage of the runner: runs a notebook's code cells in order in one engine, each under
 * the cell time limit, and collects every cell's outputs into the (copied) notebook. Stops at the
 * first unexpected failure unless told to keep going; cells tagged {@code raises-exception} may fail.
 *
 * @param file        the notebook's path, for messages
 * @param cellTimeout the time limit of each cell
 * @param settings    the run's settings (keep going, output limit)
 * @param progress    where progress lines go
 * @param exits       told which cell runs, to name it if the JVM is made to exit
 */
record NotebookExecution(Path file, Duration cellTimeout, RunSettings settings, ProgressLine progress, ExitWatch exits) {
    /** The tag that marks a cell expected to fail (as in Jupyter's own tools). */
    static final String RAISES_EXCEPTION = "raises-exception";

    /** Why a notebook run did not succeed. */
    record Failure(Path notebook, int cellNumber, int executionCount, String firstLine) {
        String describe() {
            return notebook + ", cell " + cellNumber + (executionCount > 0 ? " (In [" + executionCount + "])" : "")
                    + ": " + firstLine;
        }
    }

    /** The executed notebook and its first unexpected failure, if any. */
    record Executed(Notebook notebook, Optional<Failure> failure) { }

    Executed run(Notebook input, Engine.Factory engines) {
        Notebook nb = input.copy();
        nb.normalize();
        int codeCells = (int) nb.cells().stream().filter(c -> Notebook.type(c).equals("code")).count();
        Failure failure = null;
        Map<String, JsonObject> displays = new HashMap<>();
        List<ProgressLine.CellTime> times = new ArrayList<>();
        ScheduledExecutorService timer = Executors.newSingleThreadScheduledExecutor(r -> {
            Thread t = new Thread(r, "microtally-cell-timeout");
            t.setDaemon(true);
            return t;
        });
        long started = System.nanoTime();
        int count = 0;
        int i = 0;
        // relative file names in the cells are the notebook's neighbours, whatever the runner's working directory
        try (NotebookFolder.Scope folder = NotebookFolder.use(file.toAbsolutePath().getParent()); Engine engine = engines.open()) {
            for (JsonObject cell : nb.cells()) {
                i++;
                if (!Notebook.type(cell).equals("code")) {
                    continue;
                }
                cell.add("execution_count", JsonNull.INSTANCE);
                if (failure != null && !settings.keepGoing()) {
                    cell.add("outputs", new com.google.gson.JsonArray());
                    continue;
                }
                count++;
                cell.addProperty("execution_count", count);
                Optional<Failure> f = runCell(engine, timer, cell, i, count, codeCells, displays, times);
                if (failure == null && f.isPresent()) {
                    failure = f.get();
                }
            }
        } finally {
            timer.shutdownNow();
            exits.cellEnded();
        }
        progress.notebookDone(file, count, codeCells, (System.nanoTime() - started) / 1e9, failure == null, times);
        return new Executed(nb, Optional.ofNullable(failure));
    }

    private Optional<Failure> runCell(Engine engine, ScheduledExecutorService timer, JsonObject cell, int cellNumber,
                                      int count, int codeCells, Map<String, JsonObject> displays,
                                      List<ProgressLine.CellTime> times) {
        progress.cellStarted(file, count, codeCells, cellNumber);
        OutputCollector collector = new OutputCollector(displays, text -> progress.computation(file, cellNumber, text),
                settings.outputLimitBytes());
        boolean[] timedOut = {false};
        ScheduledFuture<?> alarm = timer.schedule(() -> {
            timedOut[0] = true;
            engine.interrupt();
        }, cellTimeout.toMillis(), TimeUnit.MILLISECONDS);
        exits.cellStarted(file, cellNumber);
        long t0 = System.nanoTime();
        CellResult r = engine.run(Notebook.text(cell.get("source")), collector);
        exits.cellEnded();
        alarm.cancel(false);
        double seconds = (System.nanoTime() - t0) / 1e9;
        times.add(new ProgressLine.CellTime(cellNumber, seconds));
        Optional<Failure> failure = Optional.empty();
        String status = "ok";
        if (r.ok()) {
            r.value().ifPresent(b -> collector.result(b, count));
        } else {
            CellError e = r.error().orElseThrow();
            if (r.outcome() == CellResult.Outcome.INTERRUPTED && timedOut[0]) {
                e = new CellError(e.type(), "the cell ran longer than the time limit of " + RunSettings.describe(cellTimeout)
                        + " and was interrupted (change it with --cell-timeout SECONDS or the notebook's metadata.microtally."
                        + RunSettings.TIMEOUT_KEY + ")", e.traceback(), e.line(), e.column());
            }
            collector.error(e);
            boolean expected = Notebook.hasTag(cell, RAISES_EXCEPTION);
            status = expected ? "failed as expected (" + e.type() + ")" : "FAILED (" + e.type() + ")";
            if (!expected) {
                String msg = e.message() == null ? "" : e.message().split("\n", 2)[0];
                failure = Optional.of(new Failure(file, cellNumber, count, e.type() + (msg.isEmpty() ? "" : ": " + msg)));
            }
        }
        collector.finishInto(cell);   // outputs, and the times in the cell metadata
        progress.cellDone(file, count, codeCells, cellNumber, status, seconds);
        return failure;
    }
}
