package org.microtally.notebook.session;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.concurrent.ConcurrentHashMap;
import jdk.jshell.DeclarationSnippet;
import jdk.jshell.Diag;
import jdk.jshell.EvalException;
import jdk.jshell.JShell;
import jdk.jshell.JShellException;
import jdk.jshell.Snippet;
import jdk.jshell.UnresolvedReferenceException;

/**
 * Turns what went wrong in a cell into a {@link CellResult}: compile errors (cell line and column,
 * caret line), unresolved references, runtime errors with the stack frames of cell code written as
 * "cell N, line L" (engine frames trimmed, repeated frames folded into one line), interruptions.
 */
final class CellErrors {
    private static final String REPL_PREFIX = "REPL.";
    /** A run of frames repeated at least this often is folded into one line. */
    static final int FOLD_AT = 3;
    private static final int LONGEST_CYCLE = 8;

    private final JShell jshell;
    private final SnippetLoader loader;
    private final Map<String, SnippetPlace> places = new ConcurrentHashMap<>();

    /** Where a snippet came from: cell number and the cell line its source starts on. */
    record SnippetPlace(int cell, int firstLine) { }

    CellErrors(JShell jshell, SnippetLoader loader) {
        this.jshell = jshell;
        this.loader = loader;
    }

    void remember(Snippet s, int cell, int firstLine) {
        places.put(s.id(), new SnippetPlace(cell, firstLine));
    }

    static CellResult failure(CellResult.Outcome outcome, CellError error) {
        return new CellResult(outcome, Optional.empty(), Optional.empty(), Optional.of(error));
    }

    static CellResult interrupted() {
        return failure(CellResult.Outcome.INTERRUPTED, new CellError("Interrupted",
                "the cell was interrupted before it finished",
                List.of("Interrupted: the cell was stopped on request before it finished.",
                        "Definitions completed before the interruption are kept; the session is still running."),
                0, 0));
    }

    /** An exception of the engine itself (not of cell code) while evaluating. */
    static CellResult engineError(RuntimeException e) {
        return failure(CellResult.Outcome.RUNTIME_ERROR, new CellError(e.getClass().getName(), String.valueOf(e.getMessage()),
                List.of("engine error while evaluating the cell: " + e), 0, 0));
    }

    CellResult compileError(String code, CellSplitter.Piece piece, Snippet s) {
        List<Diag> diags = jshell.diagnostics(s).filter(Diag::isError).toList();
        if (diags.isEmpty()) {
            int line = CellSplitter.lineOf(code, piece.start());
            String msg = "this " + s.kind().name().toLowerCase(Locale.ROOT).replace('_', ' ')
                    + " is not accepted in a notebook cell";
            return failure(CellResult.Outcome.COMPILE_ERROR, new CellError("CompileError", msg,
                    List.of("cell line " + line + ": error: " + msg, CellSplitter.lineText(code, line)), line, 1));
        }
        List<String> tb = new ArrayList<>();
        int firstLine = 0;
        int firstCol = 0;
        String firstMsg = null;
        for (Diag d : diags) {
            long p = d.getPosition() >= 0 ? d.getPosition() : d.getStartPosition();
            int rel = (int) Math.max(0, Math.min(p, piece.source().length()));
            int abs = Math.min(piece.start() + rel, code.length());
            int line = CellSplitter.lineOf(code, abs);
            int col = CellSplitter.columnOf(code, abs);
            String msg = cleanDiagnostic(d.getMessage(Locale.ROOT));
            if (firstMsg == null) {
                firstMsg = msg;
                firstLine = line;
                firstCol = col;
            }
            String[] msgLines = msg.split("\n");
            tb.add("cell line " + line + ", column " + col + ": error: " + msgLines[0]);
            for (int i = 1; i < msgLines.length; i++) {
                tb.add(msgLines[i]);
            }
            String text = CellSplitter.lineText(code, line);
            tb.add(text);
            tb.add(" ".repeat(Math.max(0, Math.min(col - 1, text.length()))) + "^");
        }
        return failure(CellResult.Outcome.COMPILE_ERROR, new CellError("CompileError", firstMsg, tb, firstLine, firstCol));
    }

    /** The diagnostic without the lines that name JShell's generated wrapper classes. */
    private static String cleanDiagnostic(String msg) {
        StringBuilder sb = new StringBuilder();
        for (String l : msg.split("\n")) {
            if (l.contains("$JShell$") || l.matches("\\s*location: class\\s*")) {
                continue;
            }
            if (sb.length() > 0) {
                sb.append('\n');
            }
            sb.append(l);
        }
        return sb.toString();
    }

    CellResult unresolved(String code, CellSplitter.Piece piece, Snippet s) {
        List<String> deps = s instanceof DeclarationSnippet d ? jshell.unresolvedDependencies(d).toList() : List.of();
        String what = s instanceof DeclarationSnippet d ? d.name() : s.source().strip();
        String msg = what + " refers to something not defined: " + String.join(", ", deps)
                + "; define it (or fix the name) before using " + what;
        int line = CellSplitter.lineOf(code, piece.start());
        return failure(CellResult.Outcome.COMPILE_ERROR, new CellError("UnresolvedReference", msg,
                List.of("cell line " + line + ": error: " + msg, CellSplitter.lineText(code, line)), line,
                CellSplitter.columnOf(code, piece.start())));
    }

    /**
     * A runtime error of a snippet the engine re-ran itself ({@link RepeatedSnippet}): the same
     * report {@link #runtimeError} gives for JShell's, with the real throwable's frames (and those
     * of its causes) translated by {@code frames} as JShell translates them.
     */
    CellResult rerunError(Throwable real, int cell, SnippetFrames frames) {
        if (real == null) {
            return runtimeError(null, null, cell);
        }
        List<String> tb = new ArrayList<>();
        int[] where = {0};
        String type = real.getClass().getName();
        String message = safeMessage(real);
        tb.add(type + (message.isEmpty() ? "" : ": " + message));
        appendFrames(tb, frames.translate(real.getStackTrace()), cell, where);
        Throwable cause = real.getCause();
        for (int depth = 0; cause != null && depth < 8; depth++, cause = cause.getCause()) {
            String cmsg = safeMessage(cause);
            tb.add("Caused by: " + cause.getClass().getName() + (cmsg.isEmpty() ? "" : ": " + cmsg));
            appendFrames(tb, frames.translate(cause.getStackTrace()), cell, new int[] {0});
        }
        return finish(real, type, message, tb, where[0]);
    }

    /**
     * A runtime error of cell {@code cell}. JShell's report carries stack frames already translated
     * to snippet lines ("#id", line); the real throwable is used where the report has nothing.
     */
    CellResult runtimeError(Throwable real, JShellException reported, int cell) {
        if (reported instanceof UnresolvedReferenceException ure) {
            String name = ure.getSnippet().name();
            List<String> deps = jshell.unresolvedDependencies(ure.getSnippet()).toList();
            String msg = name + " cannot run yet: it refers to something not defined: " + String.join(", ", deps)
                    + "; define it first";
            return failure(CellResult.Outcome.RUNTIME_ERROR,
                    new CellError("UnresolvedReference", msg, List.of("UnresolvedReference: " + msg), 0, 0));
        }
        List<String> tb = new ArrayList<>();
        int[] where = {0};
        String type;
        String message;
        if (reported instanceof EvalException ee) {
            type = ee.getExceptionClassName();
            message = ee.getMessage() == null ? "" : ee.getMessage();
            tb.add(type + (message.isEmpty() ? "" : ": " + message));
            appendFrames(tb, ee.getStackTrace(), cell, where);
            Throwable cause = ee.getCause();
            for (int depth = 0; cause != null && depth < 8; depth++, cause = cause.getCause()) {
                String cname = cause instanceof EvalException ce ? ce.getExceptionClassName() : cause.getClass().getName();
                String cmsg = safeMessage(cause);
                tb.add("Caused by: " + cname + (cmsg.isEmpty() ? "" : ": " + cmsg));
                appendFrames(tb, cause.getStackTrace(), cell, new int[] {0});
            }
        } else {
            Throwable t = real != null ? real : reported;
            type = t == null ? "Error" : t.getClass().getName();
            message = t == null ? "" : safeMessage(t);
            tb.add(type + (message.isEmpty() ? "" : ": " + message));
            if (t != null) {
                appendFrames(tb, t.getStackTrace(), cell, where);
            }
        }
        return finish(real, type, message, tb, where[0]);
    }

    /** The end common to both runtime-error reports: memory released after an OutOfMemoryError, the outcome. */
    private CellResult finish(Throwable real, String type, String message, List<String> tb, int line) {
        boolean oom = isOutOfMemory(real);
        if (oom) {
            List<String> reset = loader.releaseSinceMark();
            tb.add("The session is still alive. "
                    + (reset.isEmpty() ? "Nothing assigned by this cell had to be released."
                    : "To free memory, variables assigned by this cell were set to null: " + String.join(", ", reset) + "."));
        }
        if (real instanceof ExitBlockedException) {
            tb.add("(The session is still alive.)");
        }
        return failure(oom ? CellResult.Outcome.OUT_OF_MEMORY : CellResult.Outcome.RUNTIME_ERROR,
                new CellError(type, message, tb, line, line > 0 ? 1 : 0));
    }

    private static boolean isOutOfMemory(Throwable t) {
        for (int i = 0; t != null && i < 10; i++, t = t.getCause()) {
            if (t instanceof OutOfMemoryError) {
                return true;
            }
        }
        return false;
    }

    private static String safeMessage(Throwable t) {
        try {
            String m = t.getMessage();
            return m == null ? "" : m;
        } catch (RuntimeException e) {
            return "(message not available: " + e.getClass().getName() + ")";
        }
    }

    /**
     * Appends the frames down to the outermost frame of cell code, with cell frames written as
     * "cell N, line L". {@code where[0]} receives the line of the innermost frame in cell {@code cell}.
     */
    private void appendFrames(List<String> tb, StackTraceElement[] frames, int cell, int[] where) {
        int last = -1;
        for (int i = 0; i < frames.length; i++) {
            if (isSnippetFrame(frames[i])) {
                last = i;
            }
        }
        if (last < 0) {
            for (int i = 0; i < frames.length; i++) {
                if (isEngineFrame(frames[i])) {
                    break;
                }
                last = i;
            }
        }
        List<String> lines = new ArrayList<>();
        for (int i = 0; i <= last; i++) {
            StackTraceElement f = frames[i];
            if (isSnippetFrame(f)) {
                String id = f.getFileName() != null && f.getFileName().startsWith("#") ? f.getFileName().substring(1) : null;
                SnippetPlace place = id == null ? null : places.get(id);
                String method = f.getMethodName().isEmpty() || f.getMethodName().equals("do_it$") ? "" : f.getMethodName() + " ";
                if (place != null && f.getLineNumber() > 0) {
                    int line = place.firstLine() + f.getLineNumber() - 1;
                    String at = "cell " + place.cell() + ", line " + line;
                    lines.add("    at " + (method.isEmpty() ? at : method + "(" + at + ")"));
                    if (where[0] == 0 && place.cell() == cell) {
                        where[0] = line;
                    }
                } else {
                    lines.add("    at " + (method.isEmpty() ? "cell code" : method + "(cell code)"));
                }
            } else {
                lines.add("    at " + f);
            }
        }
        tb.addAll(fold(lines));
    }

    /**
     * Folds a block of 1 to 8 frame lines repeated {@value #FOLD_AT} or more times in a row (deep
     * recursion, a StackOverflowError) into one copy of the block and one line saying how often it
     * repeated.
     */
    static List<String> fold(List<String> lines) {
        List<String> out = new ArrayList<>();
        int i = 0;
        while (i < lines.size()) {
            int bestPeriod = 0;
            int bestRepeats = 1;
            for (int p = 1; p <= LONGEST_CYCLE && i + 2 * p <= lines.size(); p++) {
                int r = 1;
                while (i + (r + 1) * p <= lines.size() && lines.subList(i, i + p).equals(lines.subList(i + r * p, i + (r + 1) * p))) {
                    r++;
                }
                if (r >= FOLD_AT && r * p > bestRepeats * Math.max(bestPeriod, 1)) {
                    bestPeriod = p;
                    bestRepeats = r;
                }
            }
            if (bestPeriod == 0) {
                out.add(lines.get(i));
                i++;
                continue;
            }
            out.addAll(lines.subList(i, i + bestPeriod));
            out.add("    ... the " + (bestPeriod == 1 ? "frame" : bestPeriod + " frames") + " above repeated "
                    + (bestRepeats - 1) + " more times");
            i += bestPeriod * bestRepeats;
        }
        return out;
    }

    private static boolean isSnippetFrame(StackTraceElement f) {
        return f.getClassName().startsWith(REPL_PREFIX) || f.getClassName().isEmpty()
                || (f.getFileName() != null && f.getFileName().startsWith("#"));
    }

    private static boolean isEngineFrame(StackTraceElement f) {
        String c = f.getClassName();
        return c.startsWith("jdk.internal.reflect.") || c.startsWith("java.lang.reflect.")
                || c.startsWith("jdk.jshell.") || c.startsWith("org.microtally.notebook.session.EngineControl");
    }
}
