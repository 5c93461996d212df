package org.microtally.notebook.session;

import java.util.LinkedHashMap;
import java.util.Map;

/**
 * Where the engine's time for one cell went, measured with {@link System#nanoTime()} around each
 * phase (wall-clock time, so on a loaded machine it includes time spent waiting for a core).
 *
 * @param splitNanos   splitting the cell into snippets (JShell's completeness analysis, a parse)
 * @param compileNanos JShell's own work on the snippets: parsing, the type analysis of expressions,
 *                     javac's attribution and class generation, and its bookkeeping of snippet state
 *                     (everything inside {@code JShell.eval} that is not class definition or running)
 * @param defineNanos  defining the compiled classes: the exit-call rewrite, {@code defineClass}, linking
 * @param runNanos     running the cell's code (the snippets' {@code do_it$} methods, on the cell thread)
 * @param displayNanos turning the final value into a MIME bundle
 * @param totalNanos   the whole {@code Session.run} call, including what the phases above do not cover
 * @param snippets     how many snippets the cell had
 * @param reran        how many of them re-ran the class JShell had compiled for the same source, without
 *                     compiling (see {@code RepeatedSnippet}); their compile time is then only the lookup
 */
public record CellPhases(long splitNanos, long compileNanos, long defineNanos, long runNanos, long displayNanos,
                         long totalNanos, int snippets, int reran) {
    /** For results that were not measured (made outside the engine). */
    public static final CellPhases NONE = new CellPhases(0, 0, 0, 0, 0, 0, 0, 0);

    /** The phases in milliseconds, keyed by name, in the order they happen (for reports and metadata). */
    public Map<String, Double> millis() {
        Map<String, Double> m = new LinkedHashMap<>();
        m.put("split", splitNanos / 1e6);
        m.put("compile", compileNanos / 1e6);
        m.put("define", defineNanos / 1e6);
        m.put("run", runNanos / 1e6);
        m.put("display", displayNanos / 1e6);
        m.put("engine_total", totalNanos / 1e6);
        return m;
    }

    /** Accumulates one cell's phases; used by one cell at a time (the engine runs one cell at a time). */
    static final class Clock {
        private long split;
        private long eval;
        private long define;
        private long run;
        private long display;
        private long start;
        private int snippets;
        private int reran;

        synchronized void begin() {
            split = eval = define = run = display = 0;
            snippets = 0;
            reran = 0;
            start = System.nanoTime();
        }

        synchronized void split(long nanos, int count) {
            split += nanos;
            snippets = count;
        }

        /** Time of a whole {@code JShell.eval} call (it contains define and run). */
        synchronized void eval(long nanos) {
            eval += nanos;
        }

        synchronized void reran() {
            reran++;
        }

        synchronized void define(long nanos) {
            define += nanos;
        }

        synchronized void run(long nanos) {
            run += nanos;
        }

        synchronized void display(long nanos) {
            display += nanos;
        }

        synchronized CellPhases end() {
            long compile = Math.max(0, eval - define - run);
            return new CellPhases(split, compile, define, run, display, System.nanoTime() - start, snippets, reran);
        }
    }
}
