package org.microtally.notebook.session;

import java.io.ByteArrayInputStream;
import java.io.File;
import java.io.IOException;
import java.io.PrintStream;
import java.net.URISyntaxException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.CodeSource;
import java.util.ArrayList;
import java.util.Collections;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import java.util.concurrent.ConcurrentHashMap;
import java.util.concurrent.atomic.AtomicInteger;
import java.util.jar.Attributes;
import java.util.jar.JarFile;
import jdk.jshell.Diag;
import jdk.jshell.EvalException;
import jdk.jshell.ExpressionSnippet;
import jdk.jshell.JShell;
import jdk.jshell.JShellException;
import jdk.jshell.DeclarationSnippet;
import jdk.jshell.Snippet;
import jdk.jshell.SnippetEvent;
import jdk.jshell.SourceCodeAnalysis;
import jdk.jshell.SourceCodeAnalysis.CompletionInfo;
import jdk.jshell.UnresolvedReferenceException;
import jdk.jshell.VarSnippet;
import org.microtally.notebook.render.MimeBundle;
import org.microtally.notebook.render.Renderers;

/**
 * The evaluation engine: one JShell session in this JVM, with the toolkit on its class path, the
 * toolkit packages and the {@link Display} helpers imported, running one notebook cell at a time.
 *
 * <h2>How a cell runs</h2>
 * The cell is split into snippets with JShell's source analysis ({@code analyzeCompletion} loop)
 * and the snippets are evaluated in order. Each snippet runs on a fresh thread of this session's
 * thread group, so {@link #interrupt()} can stop it. {@code System.out}/{@code System.err} are
 * routed to the cell's {@link CellOutput} while it runs, delivered in chunks at least every
 * {@value CellContext#FLUSH_INTERVAL_MS} ms (not only at the end); {@code System.in} reads as empty.
 * A failing {@link CellOutput} loses that output but does not fail the cell. The first failing snippet ends the
 * cell: a compile error (line and column in the cell, diagnostic with caret line), an unresolved
 * reference (a declaration that cannot be used yet), a runtime exception (type, message, the stack
 * frames of cell code with lines mapped back to "cell N, line L", engine frames trimmed), or an
 * interruption ({@link CellResult.Outcome#INTERRUPTED}). The value of a final expression is kept as
 * the real object and rendered with {@link Renderers#render(Object)}.
 *
 * <h2>Faults a cell cannot make fatal</h2>
 * {@code System.exit}, {@code Runtime.exit} and {@code Runtime.halt} in cell code are rewritten at
 * bytecode level into an {@link ExitBlockedException}. An {@link OutOfMemoryError} is reported as
 * a runtime error, and the static fields (the JShell variables) assigned by the failed cell are set
 * to null so the memory can be reclaimed; the session stays usable.
 *
 * <h2>Threads</h2>
 * {@link #run} blocks the calling thread until the cell ends; only one cell runs at a time
 * (a second concurrent call throws {@link IllegalStateException}). {@link #interrupt()} is meant to
 * be called from another thread. {@link CellOutput} callbacks arrive on the cell's thread, on the
 * engine's output flusher thread, or on threads the cell started, but never concurrently for one
 * cell, and all of them before {@code run} returns (except output of threads the cell leaves running).
 *
 * <h2>Recommended JVM settings for a long session</h2>
 * {@code -Xmx1g -XX:+UseSerialGC} (optionally {@code -XX:TieredStopAtLevel=1}, a little less
 * memory for the JIT). JShell compiles every snippet with javac inside this JVM and keeps every
 * snippet's class, so a default JVM (G1, heap limit a quarter of RAM) lets the committed heap grow
 * far beyond what is live. Measured with {@code SessionFootprint} (test sources; 55 cells, each
 * allocating 1.6 MB of doubles and defining a method and a record; 2-core machine under load):
 * default flags 1007 MB resident after 55 cells (2.6 GB heap committed for 0.3 GB used);
 * {@code -Xmx1g -XX:+UseSerialGC} 358 MB; with {@code -XX:TieredStopAtLevel=1} as well 314 MB.
 * Session start took 2.4-6 s and a trivial cell ({@code 1 + 1}) 75-170 ms on that loaded machine;
 * an earlier run at lower load measured 0.8 s to start and 65-230 ms for small cells.
 */
public final class Session implements AutoCloseable {
    /** Packages imported in every session when they exist at run time, in this order. */
    static final List<String> TOOLKIT_PACKAGES = List.of(
            "org.microtally", "org.microtally.spectrum", "org.microtally.count", "org.microtally.ensemble",
            "org.microtally.occupation", "org.microtally.special", "org.microtally.limit",
            "org.microtally.lattice", "org.microtally.units", "org.microtally.notebook.render",
            "org.microtally.notebook.data");
    /** Standard library packages imported in every session. */
    static final List<String> JAVA_PACKAGES = List.of(
            "java.util", "java.util.function", "java.util.stream", "java.math", "java.io", "java.nio.file");

    private static final AtomicInteger SESSIONS = new AtomicInteger();
    private static final String REPL_PREFIX = "REPL.";

    private final JShell jshell;
    private final SourceCodeAnalysis analysis;
    private final EngineControl control;
    private final SnippetLoader loader;
    private final ThreadGroup group;
    private final List<String> imports;
    private final Map<String, SnippetPlace> places = new ConcurrentHashMap<>();
    private final Object runLock = new Object();
    private volatile boolean running;
    private int cellCount;
    private boolean closed;

    private Session() {
        OutputRouter.install();
        int n = SESSIONS.incrementAndGet();
        group = new ThreadGroup("microtally-session-" + n);
        Set<String> classPath = classPath();
        loader = new SnippetLoader(Session.class.getClassLoader(), classPath);
        control = new EngineControl(loader, group);
        jshell = JShell.builder()
                .executionEngine(EngineControl.provider(control), Map.of())
                .in(new ByteArrayInputStream(new byte[0]))
                .out(OutputRouter.CONSOLE_OUT)
                .err(OutputRouter.CONSOLE_ERR)
                .build();
        analysis = jshell.sourceCodeAnalysis();
        for (String entry : classPath) {
            jshell.addToClasspath(entry);
        }

        List<String> done = new ArrayList<>();
        Set<String> present = PackageProbe.existing(classPath, TOOLKIT_PACKAGES);
        List<String> wanted = new ArrayList<>();
        for (String p : JAVA_PACKAGES) {
            wanted.add("import " + p + ".*;");
        }
        for (String p : TOOLKIT_PACKAGES) {
            if (present.contains(p)) {
                wanted.add("import " + p + ".*;");
            }
        }
        wanted.add("import static " + Display.class.getName() + ".*;");
        for (String imp : wanted) {
            List<SnippetEvent> ev = jshell.eval(imp);
            if (!ev.isEmpty() && ev.get(0).status() == Snippet.Status.VALID) {
                done.add(imp);
            }
        }
        imports = Collections.unmodifiableList(done);
    }

    /** Starts a session with the toolkit imported. Takes about a second (JShell starts javac). */
    public static Session open() {
        return new Session();
    }

    /** The import statements this session ran at start (toolkit packages that exist, display helpers). */
    public List<String> imports() {
        return imports;
    }

    /** The class loader of cell code (its parent is the engine's own loader). */
    public ClassLoader cellClassLoader() {
        return loader.classLoader();
    }

    /** Number of cells run so far (the number used in stack traces: "cell N, line L"). */
    public synchronized int cellCount() {
        return cellCount;
    }

    /** True while a cell runs. */
    public boolean isRunning() {
        return running;
    }

    /** The process's standard output as it was before the engine routed it: for diagnostics that must never land in a cell. */
    public static PrintStream consoleOut() {
        return OutputRouter.CONSOLE_OUT;
    }

    /** The process's standard error as it was before the engine routed it. */
    public static PrintStream consoleErr() {
        return OutputRouter.CONSOLE_ERR;
    }

    /**
     * Runs one cell and blocks until it ends. Output, displays and progress go to {@code output}
     * as they happen.
     */
    public CellResult run(String code, CellOutput output) {
        synchronized (runLock) {
            if (closed) {
                throw new IllegalStateException("the session is closed; open a new one with Session.open()");
            }
            if (running) {
                throw new IllegalStateException("a cell is already running in this session; wait for it or interrupt it");
            }
            control.clearStop();
            running = true;
        }
        int cell;
        synchronized (this) {
            cell = ++cellCount;
        }
        CellContext context = new CellContext(group, output);
        loader.mark();
        OutputRouter.begin(context);
        try {
            return runCell(code, cell);
        } finally {
            OutputRouter.end(context);
            control.resetCapture();
            running = false;
        }
    }

    /**
     * Stops the running cell, from any thread; the cell then reports
     * {@link CellResult.Outcome#INTERRUPTED}. Does nothing when no cell runs.
     */
    public void interrupt() {
        if (running) {
            jshell.stop();
        }
    }

    private CellResult runCell(String code, int cell) {
        List<Piece> pieces = split(code);
        Object value = EngineControl.NO_VALUE;
        for (int k = 0; k < pieces.size(); k++) {
            if (control.stopRequested()) {
                return interrupted();
            }
            Piece piece = pieces.get(k);
            control.resetCapture();
            List<SnippetEvent> events;
            try {
                events = jshell.eval(piece.source);
            } catch (OutOfMemoryError e) {
                return runtimeError(e, null, code, cell);
            } catch (RuntimeException e) {
                return new CellResult(CellResult.Outcome.RUNTIME_ERROR, Optional.empty(), Optional.empty(),
                        Optional.of(new CellError(e.getClass().getName(), String.valueOf(e.getMessage()),
                                List.of("engine error while evaluating the cell: " + e), 0, 0)));
            }
            SnippetEvent main = null;
            for (SnippetEvent e : events) {
                if (e.causeSnippet() == null) {
                    main = e;
                    break;
                }
            }
            if (main == null) {
                continue;
            }
            Snippet s = main.snippet();
            places.put(s.id(), new SnippetPlace(cell, lineOf(code, piece.start)));
            if (control.stopRequested()) {
                return interrupted();
            }
            switch (main.status()) {
                case REJECTED:
                    return compileError(code, piece, s);
                case RECOVERABLE_DEFINED:
                case RECOVERABLE_NOT_DEFINED:
                    return unresolved(code, piece, s);
                default:
                    break;
            }
            if (main.exception() != null) {
                return runtimeError(control.lastThrown(), main.exception(), code, cell);
            }
            if (k == pieces.size() - 1) {
                value = valueOf(main);
            }
        }
        if (control.stopRequested()) {
            return interrupted();
        }
        if (value == EngineControl.NO_VALUE || value instanceof java.io.PrintStream) {
            // A cell ending in System.out.printf(...) or .append(...) evaluates to the stream itself;
            // its text has already been streamed, so the stream object is not shown as a value.
            return new CellResult(CellResult.Outcome.OK, Optional.empty(), Optional.empty(), Optional.empty());
        }
        Object v = value;
        try {
            MimeBundle bundle = control.callAsUser(() -> Renderers.render(v));
            return new CellResult(CellResult.Outcome.OK, Optional.of(bundle), Optional.ofNullable(v), Optional.empty());
        } catch (EngineControl.UserFailure f) {
            if (control.stopRequested()) {
                return interrupted();
            }
            return runtimeError(f.getCause(), null, code, cell);
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            return interrupted();
        }
    }

    private Object valueOf(SnippetEvent main) {
        Snippet s = main.snippet();
        boolean expression = s.kind() == Snippet.Kind.EXPRESSION
                || (s instanceof VarSnippet && s.subKind() == Snippet.SubKind.TEMP_VAR_EXPRESSION_SUBKIND);
        if (!expression) {
            return EngineControl.NO_VALUE;
        }
        Object v = control.lastValue();
        if (v == EngineControl.NO_VALUE && s instanceof ExpressionSnippet es) {
            // A bare variable name may be answered by JShell without running code: read the variable.
            Optional<VarSnippet> var = jshell.variables().filter(x -> x.name().equals(es.name())).reduce((a, b) -> b);
            if (var.isPresent()) {
                jshell.varValue(var.get());
                v = control.lastValue();
            }
        }
        return v;
    }

    // ---------------------------------------------------------------- splitting

    /** A snippet of a cell: the source given to JShell and its offset in the cell. */
    private record Piece(String source, int start, int end) { }

    private List<Piece> split(String code) {
        List<Piece> pieces = new ArrayList<>();
        int pos = 0;
        while (pos < code.length()) {
            String rest = code.substring(pos);
            if (rest.isBlank()) {
                break;
            }
            CompletionInfo ci = analysis.analyzeCompletion(rest);
            SourceCodeAnalysis.Completeness c = ci.completeness();
            if (c == SourceCodeAnalysis.Completeness.EMPTY) {
                break;
            }
            String source;
            int consumed;
            if (c.isComplete() && ci.source() != null) {
                source = ci.source();
                consumed = rest.length() - ci.remaining().length();
                if (consumed <= 0) {
                    consumed = rest.length();
                }
            } else {
                source = rest;
                consumed = rest.length();
            }
            source = source.stripLeading();   // so that line 1 of the snippet is the line it starts on
            pieces.add(new Piece(source, pos + offsetIn(rest, source), pos + consumed));
            pos += consumed;
        }
        return pieces;
    }

    /** Where {@code source} (possibly with a semicolon added by the analysis) starts in {@code text}. */
    private static int offsetIn(String text, String source) {
        String core = source.endsWith(";") ? source.substring(0, source.length() - 1) : source;
        core = core.strip();
        if (!core.isEmpty()) {
            int i = text.indexOf(core);
            if (i >= 0) {
                int j = source.indexOf(core);
                return Math.max(0, i - Math.max(0, j));
            }
        }
        int i = 0;
        while (i < text.length() && Character.isWhitespace(text.charAt(i))) {
            i++;
        }
        return i;
    }

    /** 1-based line of offset {@code pos} in {@code code}. */
    static int lineOf(String code, int pos) {
        int line = 1;
        for (int i = 0; i < Math.min(pos, code.length()); i++) {
            if (code.charAt(i) == '\n') {
                line++;
            }
        }
        return line;
    }

    private static int columnOf(String code, int pos) {
        int p = Math.min(pos, code.length());
        int lineStart = code.lastIndexOf('\n', p - 1) + 1;
        return p - lineStart + 1;
    }

    private static String lineText(String code, int line) {
        String[] lines = code.split("\n", -1);
        return line >= 1 && line <= lines.length ? lines[line - 1] : "";
    }

    // ---------------------------------------------------------------- errors

    private static CellResult failure(CellResult.Outcome outcome, CellError error) {
        return new CellResult(outcome, Optional.empty(), Optional.empty(), Optional.of(error));
    }

    private CellResult interrupted() {
        return failure(CellResult.Outcome.INTERRUPTED, new CellError("Interrupted",
                "the cell was interrupted before it finished",
                List.of("Interrupted: the cell was stopped on request before it finished.",
                        "Definitions completed before the interruption are kept; the session is still running."),
                0, 0));
    }

    private CellResult compileError(String code, Piece piece, Snippet s) {
        List<Diag> diags = jshell.diagnostics(s).filter(Diag::isError).toList();
        if (diags.isEmpty()) {
            int line = lineOf(code, piece.start);
            String msg = "this " + s.kind().name().toLowerCase(Locale.ROOT).replace('_', ' ')
                    + " is not accepted in a notebook cell";
            return failure(CellResult.Outcome.COMPILE_ERROR, new CellError("CompileError", msg,
                    List.of("cell line " + line + ": error: " + msg, lineText(code, line)), line, 1));
        }
        List<String> tb = new ArrayList<>();
        int firstLine = 0;
        int firstCol = 0;
        String firstMsg = null;
        for (Diag d : diags) {
            long p = d.getPosition() >= 0 ? d.getPosition() : d.getStartPosition();
            int rel = (int) Math.max(0, Math.min(p, piece.source.length()));
            int abs = Math.min(piece.start + rel, code.length());
            int line = lineOf(code, abs);
            int col = columnOf(code, abs);
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
            String text = lineText(code, line);
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

    private CellResult unresolved(String code, Piece piece, Snippet s) {
        List<String> deps = s instanceof DeclarationSnippet d ? jshell.unresolvedDependencies(d).toList() : List.of();
        String what = s instanceof DeclarationSnippet d ? d.name() : s.source().strip();
        String msg = what + " refers to something not defined: " + String.join(", ", deps)
                + "; define it (or fix the name) before using " + what;
        int line = lineOf(code, piece.start);
        return failure(CellResult.Outcome.COMPILE_ERROR, new CellError("UnresolvedReference", msg,
                List.of("cell line " + line + ": error: " + msg, lineText(code, line)), line, columnOf(code, piece.start)));
    }

    private CellResult runtimeError(Throwable real, JShellException reported, String code, int cell) {
        if (control.stopRequested()) {
            return interrupted();
        }
        if (reported instanceof UnresolvedReferenceException ure) {
            String name = ure.getSnippet().name();
            List<String> deps = jshell.unresolvedDependencies(ure.getSnippet()).toList();
            String msg = name + " cannot run yet: it refers to something not defined: " + String.join(", ", deps)
                    + "; define it first";
            return failure(CellResult.Outcome.RUNTIME_ERROR,
                    new CellError("UnresolvedReference", msg, List.of("UnresolvedReference: " + msg), 0, 0));
        }
        // JShell's report carries stack frames already translated to snippet lines ("#id", line);
        // the real throwable is used where the report has nothing (errors outside snippet code).
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
        if (isOutOfMemory(real)) {
            List<String> reset = loader.releaseSinceMark();
            tb.add("The session is still alive. "
                    + (reset.isEmpty() ? "Nothing assigned by this cell had to be released."
                    : "To free memory, variables assigned by this cell were set to null: " + String.join(", ", reset) + "."));
        }
        if (real instanceof ExitBlockedException) {
            tb.add("(The session is still alive.)");
        }
        int line = where[0];
        return failure(CellResult.Outcome.RUNTIME_ERROR, new CellError(type, message, tb, line, line > 0 ? 1 : 0));
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
        for (int i = 0; i <= last; i++) {
            StackTraceElement f = frames[i];
            if (isSnippetFrame(f)) {
                String id = f.getFileName() != null && f.getFileName().startsWith("#") ? f.getFileName().substring(1) : null;
                SnippetPlace place = id == null ? null : places.get(id);
                String method = f.getMethodName().isEmpty() || f.getMethodName().equals("do_it$") ? "" : f.getMethodName() + " ";
                if (place != null && f.getLineNumber() > 0) {
                    int line = place.firstLine + f.getLineNumber() - 1;
                    String at = "cell " + place.cell + ", line " + line;
                    tb.add("    at " + (method.isEmpty() ? at : method + "(" + at + ")"));
                    if (where[0] == 0 && place.cell == cell) {
                        where[0] = line;
                    }
                } else {
                    tb.add("    at " + (method.isEmpty() ? "cell code" : method + "(cell code)"));
                }
            } else {
                tb.add("    at " + f);
            }
        }
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

    /** Where a snippet came from: cell number and the cell line its source starts on. */
    private record SnippetPlace(int cell, int firstLine) { }

    // ---------------------------------------------------------------- completion, inspection

    /** JShell completion suggestions at {@code cursor} (an offset in {@code code}). */
    public Completions complete(String code, int cursor) {
        int c = Math.max(0, Math.min(cursor, code.length()));
        int[] seg = segmentAt(code, c);
        String text = code.substring(seg[0], seg[1]);
        int[] anchor = new int[1];
        List<SourceCodeAnalysis.Suggestion> suggestions = analysis.completionSuggestions(text, c - seg[0], anchor);
        LinkedHashSet<String> typed = new LinkedHashSet<>();
        LinkedHashSet<String> other = new LinkedHashSet<>();
        for (SourceCodeAnalysis.Suggestion s : suggestions) {
            (s.matchesType() ? typed : other).add(s.continuation());
        }
        typed.addAll(other);
        return new Completions(new ArrayList<>(typed), seg[0] + anchor[0], c);
    }

    /**
     * Signatures (and the first Javadoc sentence where JShell finds the sources: for JDK classes when the
     * JDK's {@code lib/src.zip} is installed) of what is at
     * or just before {@code cursor}: a method call's name or its open argument list, a type, a variable.
     */
    public Optional<String> inspect(String code, int cursor) {
        int c = Math.max(0, Math.min(cursor, code.length()));
        int[] seg = segmentAt(code, c);
        String text = code.substring(seg[0], seg[1]);
        int rel = c - seg[0];
        List<SourceCodeAnalysis.Documentation> docs = analysis.documentation(text, rel, true);
        if (docs.isEmpty()) {
            // On a name rather than inside its parentheses: ask as if the call were opened.
            int end = rel;
            while (end < text.length() && Character.isJavaIdentifierPart(text.charAt(end))) {
                end++;
            }
            String opened = text.substring(0, end) + "(";
            docs = analysis.documentation(opened, opened.length(), true);
        }
        if (docs.isEmpty()) {
            return Optional.empty();
        }
        StringBuilder sb = new StringBuilder();
        for (SourceCodeAnalysis.Documentation d : docs) {
            if (sb.length() > 0) {
                sb.append('\n');
            }
            sb.append(d.signature());
            String first = firstSentence(d.javadoc());
            if (!first.isEmpty()) {
                sb.append("\n    ").append(first);
            }
        }
        return Optional.of(sb.toString());
    }

    static String firstSentence(String javadoc) {
        if (javadoc == null) {
            return "";
        }
        String text = javadoc.replaceAll("(?s)<[^>]*>", "").replaceAll("\\{@\\w+\\s+([^}]*)}", "$1");
        int tag = text.indexOf("\n@");
        if (tag >= 0) {
            text = text.substring(0, tag);
        }
        text = text.replaceAll("\\s+", " ").strip();
        int dot = text.indexOf(". ");
        return dot >= 0 ? text.substring(0, dot + 1) : text;
    }

    /** Whether {@code code} is a complete cell, needs more lines, or is invalid. */
    public Completeness completeness(String code) {
        String rest = code;
        while (true) {
            if (rest.isBlank()) {
                return new Completeness(Completeness.Status.COMPLETE, "");
            }
            CompletionInfo ci = analysis.analyzeCompletion(rest);
            switch (ci.completeness()) {
                case EMPTY:
                    return new Completeness(Completeness.Status.COMPLETE, "");
                case COMPLETE:
                case COMPLETE_WITH_SEMI:
                    if (ci.remaining().length() >= rest.length()) {
                        return new Completeness(Completeness.Status.COMPLETE, "");
                    }
                    rest = ci.remaining();
                    break;
                case DEFINITELY_INCOMPLETE:
                case CONSIDERED_INCOMPLETE:
                    return new Completeness(Completeness.Status.INCOMPLETE, "    ".repeat(Math.max(0, openBraces(code))));
                default:
                    return new Completeness(Completeness.Status.INVALID, "");
            }
        }
    }

    private static int openBraces(String code) {
        int depth = 0;
        boolean str = false;
        boolean chr = false;
        for (int i = 0; i < code.length(); i++) {
            char ch = code.charAt(i);
            if ((str || chr) && ch == '\\') {
                i++;
            } else if (ch == '"' && !chr) {
                str = !str;
            } else if (ch == '\'' && !str) {
                chr = !chr;
            } else if (!str && !chr) {
                if (ch == '{' || ch == '(') {
                    depth++;
                } else if (ch == '}' || ch == ')') {
                    depth--;
                }
            }
        }
        return depth;
    }

    /** {start, end} of the snippet of {@code code} that contains offset {@code cursor}. */
    private int[] segmentAt(String code, int cursor) {
        int start = 0;
        for (Piece p : split(code)) {
            if (cursor <= p.end) {
                return new int[] {start, p.end};
            }
            start = p.end;
        }
        return new int[] {Math.min(start, code.length()), code.length()};
    }

    /** Closes the JShell session. A running cell is stopped first. */
    @Override
    public void close() {
        synchronized (runLock) {
            if (closed) {
                return;
            }
            closed = true;
        }
        if (running) {
            interrupt();
        }
        jshell.close();
    }

    // ---------------------------------------------------------------- class path

    /**
     * The engine's class path for compiling cells: {@code java.class.path}, the {@code Class-Path}
     * entries of manifest-only jars on it (as build tools use), and the code sources of the engine
     * and core classes.
     */
    static Set<String> classPath() {
        LinkedHashSet<String> out = new LinkedHashSet<>();
        for (String e : System.getProperty("java.class.path", "").split(File.pathSeparator)) {
            addEntry(out, e);
        }
        for (Class<?> c : new Class<?>[] {Session.class, org.microtally.ProgressListener.class, MimeBundle.class}) {
            CodeSource cs = c.getProtectionDomain().getCodeSource();
            if (cs != null && cs.getLocation() != null) {
                try {
                    addEntry(out, Path.of(cs.getLocation().toURI()).toString());
                } catch (URISyntaxException | IllegalArgumentException ignored) {
                    // not a file location; the class is still visible to cells through the loader
                }
            }
        }
        return out;
    }

    private static void addEntry(Set<String> out, String entry) {
        if (entry.isEmpty()) {
            return;
        }
        Path p = Path.of(entry).toAbsolutePath().normalize();
        if (!Files.exists(p) || !out.add(p.toString())) {
            return;
        }
        if (Files.isRegularFile(p) && p.toString().endsWith(".jar")) {
            try (JarFile jar = new JarFile(p.toFile())) {
                if (jar.getManifest() == null) {
                    return;
                }
                String cp = jar.getManifest().getMainAttributes().getValue(Attributes.Name.CLASS_PATH);
                if (cp == null) {
                    return;
                }
                for (String ref : cp.trim().split("\\s+")) {
                    try {
                        Path resolved = Path.of(p.getParent().toUri().resolve(ref));
                        addEntry(out, resolved.toString());
                    } catch (IllegalArgumentException ignored) {
                        // unusable manifest entry
                    }
                }
            } catch (IOException ignored) {
                // unreadable jar: javac will report what it cannot find
            }
        }
    }
}
