package org.microtally.notebook.session;

import java.io.ByteArrayInputStream;
import java.io.PrintStream;
import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import java.util.concurrent.atomic.AtomicInteger;
import jdk.jshell.ExpressionSnippet;
import jdk.jshell.JShell;
import jdk.jshell.Snippet;
import jdk.jshell.SnippetEvent;
import jdk.jshell.VarSnippet;
import org.microtally.notebook.render.MimeBundle;
import org.microtally.notebook.render.Renderers;

/**
 * The evaluation engine: one JShell session in this JVM, with the toolkit on its class path, the
 * toolkit packages and the {@link Display} helpers imported, running one notebook cell at a time.
 *
 * <h2>How a cell runs</h2>
 * The cell is split into snippets with JShell's source analysis ({@code analyzeCompletion} loop)
 * and the snippets are evaluated in order (an expression that cannot be void as the initializer of
 * {@code $value}, see {@link ValueExpression}, instead of a new {@code $N}; the same expression
 * evaluated again with nothing evaluated in between re-runs the class already compiled for it, see
 * {@link RepeatedSnippet}). Each snippet runs on a fresh thread of this session's
 * thread group, so {@link #interrupt()} can stop it. {@code System.out}/{@code System.err} are
 * routed to the cell's {@link CellOutput} while it runs, through one ordered queue with the cell's
 * displays (so every output keeps the order the cell wrote it), delivered in chunks at least every
 * {@value CellContext#FLUSH_INTERVAL_MS} ms (not only at the end); {@code System.in} reads as empty.
 * A failing {@link CellOutput} loses that output but does not fail the cell. The first failing snippet ends the
 * cell: a compile error (line and column in the cell, diagnostic with caret line), an unresolved
 * reference (a declaration that cannot be used yet), a runtime exception (type, message, the stack
 * frames of cell code with lines mapped back to "cell N, line L", engine frames trimmed), or an
 * interruption ({@link CellResult.Outcome#INTERRUPTED}). The value of a final expression is kept as
 * the real object and rendered with this engine's own registry ({@link Renderers#withBuiltIns()}, see {@link Display#renderers()}).
 *
 * <h2>Faults a cell cannot make fatal</h2>
 * {@code System.exit}, {@code Runtime.exit} and {@code Runtime.halt} in cell code are rewritten at
 * bytecode level into an {@link ExitBlockedException}. An {@link OutOfMemoryError} is reported as
 * {@link CellResult.Outcome#OUT_OF_MEMORY}, and the static fields (the JShell variables) assigned by
 * the failed cell are set to null so the memory can be reclaimed; the session stays usable. A
 * StackOverflowError's repeated frames are folded into one line.
 *
 * <h2>What a cell sees</h2>
 * On-demand imports of {@link #JAVA_PACKAGES} and of those {@link #TOOLKIT_PACKAGES} that exist on
 * the class path (checked with {@code PackageProbe}, so a package another module adds later is
 * imported once it is there); single-type imports of the display layer's user classes
 * {@link #DISPLAY_TYPES} (not the whole render package: its helpers are not user API); and the
 * static helpers of {@link Display}.
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
public final class Session implements Engine {
    /**
     * Packages imported on demand in every session when they exist at run time, in this order: the
     * core toolkit (org.microtally.lattice once that package is built) and file reading.
     */
    static final List<String> TOOLKIT_PACKAGES = List.of(
            "org.microtally", "org.microtally.spectrum", "org.microtally.count", "org.microtally.exact", "org.microtally.ensemble",
            "org.microtally.occupation", "org.microtally.special", "org.microtally.limit", "org.microtally.structure",
            "org.microtally.lattice", "org.microtally.units", "org.microtally.notebook.data");
    /** The display layer's user classes, imported one by one when they exist (its helpers are not user API). */
    static final List<String> DISPLAY_TYPES = List.of(
            "org.microtally.notebook.render.MimeBundle", "org.microtally.notebook.render.Renderers",
            "org.microtally.notebook.render.Tables", "org.microtally.notebook.render.Charts",
            "org.microtally.notebook.render.Html", "org.microtally.notebook.render.Latex",
            "org.microtally.notebook.render.Markdown");
    /** Standard library packages imported in every session. */
    static final List<String> JAVA_PACKAGES = List.of(
            "java.util", "java.util.function", "java.util.stream", "java.math", "java.io", "java.nio.file");

    private static final AtomicInteger SESSIONS = new AtomicInteger();

    private final JShell jshell;
    private final EngineControl control;
    private final SnippetLoader loader;
    private final ThreadGroup group;
    private final List<String> imports;
    private final CellSplitter splitter;
    private final CodeAssist assist;
    private final CellErrors errors;
    private final SnippetEvaluator evaluator;
    private final Renderers renderers = Renderers.withBuiltIns();   // this engine's display registry
    private final Object runLock = new Object();
    private final CellPhases.Clock clock = new CellPhases.Clock();
    private volatile boolean running;
    private int cellCount;
    private boolean closed;

    private Session(boolean withSpark) {
        OutputRouter.install();
        int n = SESSIONS.incrementAndGet();
        group = new ThreadGroup("microtally-session-" + n);
        Display.attach(group, renderers);
        Set<String> classPath = EngineClassPath.classPath(withSpark);
        loader = new SnippetLoader(Session.class.getClassLoader(), classPath, clock);
        control = new EngineControl(loader, group, clock);
        jshell = EngineClassPath.compilingAgainst(classPath, () -> JShell.builder()
                .executionEngine(EngineControl.provider(control), Map.of())
                .in(new ByteArrayInputStream(new byte[0]))
                .out(OutputRouter.CONSOLE_OUT)
                .err(OutputRouter.CONSOLE_ERR)
                .build());
        splitter = new CellSplitter(jshell.sourceCodeAnalysis());
        assist = new CodeAssist(jshell.sourceCodeAnalysis(), splitter);
        errors = new CellErrors(jshell, loader);
        evaluator = new SnippetEvaluator(jshell, control);
        imports = runImports(classPath);
    }

    private List<String> runImports(Set<String> classPath) {
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
        for (String t : DISPLAY_TYPES) {
            wanted.add("import " + t + ";");
        }
        wanted.add("import static " + Display.class.getName() + ".*;");
        List<String> done = new ArrayList<>();
        for (String imp : wanted) {
            List<SnippetEvent> ev = evaluator.eval(imp);
            if (!ev.isEmpty() && ev.get(0).status() == Snippet.Status.VALID) {
                done.add(imp);
            }
        }
        return Collections.unmodifiableList(done);
    }

    /** Starts a session with the toolkit imported. Takes about a second (JShell starts javac). */
    public static Session open() {
        return new Session(true);
    }

    /**
     * The engines for a notebook whose metadata names the kernelspec {@code kernelName}: {@link #open} for the
     * Spark kernel ({@link KernelIdentity#SPARK_KERNEL_NAME}); for any other, sessions that compile without
     * the entries the launcher lists in {@link KernelIdentity#SPARK_CLASSPATH_PROPERTY}, as under the plain
     * kernel, even when the runner's JVM has Spark for another notebook. Their cells also compile faster (the
     * eight single-machine notebooks of a nine-notebook run: 21.1 s with Spark's 175 jars, 12.7 s without).
     */
    public static Engine.Factory forKernel(String kernelName) {
        return KernelIdentity.SPARK_KERNEL_NAME.equals(kernelName) ? Session::open : () -> new Session(false);
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
     * as they happen, in the order the cell wrote them.
     */
    @Override
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
        clock.begin();
        loader.mark();
        OutputRouter.begin(context);
        try {
            CellResult result = runCell(code, cell);
            return result.withPhases(clock.end());
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
    @Override
    public void interrupt() {
        if (running) {
            jshell.stop();
        }
    }

    private CellResult runCell(String code, int cell) {
        long t0 = System.nanoTime();
        List<CellSplitter.Piece> pieces = splitter.split(code);
        clock.split(System.nanoTime() - t0, pieces.size());
        Object value = EngineControl.NO_VALUE;
        for (int k = 0; k < pieces.size(); k++) {
            if (control.stopRequested()) {
                return CellErrors.interrupted();
            }
            CellSplitter.Piece piece = pieces.get(k);
            control.resetCapture();
            SnippetEvaluator.Evaluated main;
            long e0 = System.nanoTime();
            try {
                main = evaluator.evaluate(piece.source());
            } catch (OutOfMemoryError e) {
                return errors.runtimeError(e, null, cell);
            } catch (RuntimeException e) {
                return CellErrors.engineError(e);
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
                return CellErrors.interrupted();
            } finally {
                clock.eval(System.nanoTime() - e0);
            }
            if (main == null) {
                continue;
            }
            if (main.rerun()) {
                clock.reran();
            }
            Snippet s = main.snippet();
            errors.remember(s, cell, CellSplitter.lineOf(code, piece.start()));
            if (control.stopRequested()) {
                return CellErrors.interrupted();
            }
            switch (main.status()) {
                case REJECTED:
                    return errors.compileError(code, piece, s);
                case RECOVERABLE_DEFINED:
                case RECOVERABLE_NOT_DEFINED:
                    return errors.unresolved(code, piece, s);
                default:
                    break;
            }
            if (main.rerunFailed()) {
                return control.stopRequested() ? CellErrors.interrupted()
                        : errors.rerunError(control.lastThrown(), cell, new SnippetFrames(jshell));
            }
            if (main.exception() != null) {
                return control.stopRequested() ? CellErrors.interrupted()
                        : errors.runtimeError(control.lastThrown(), main.exception(), cell);
            }
            if (k == pieces.size() - 1) {
                value = valueOf(main);
            }
        }
        if (control.stopRequested()) {
            return CellErrors.interrupted();
        }
        if (value == EngineControl.NO_VALUE || value instanceof java.io.PrintStream) {
            // A cell ending in System.out.printf(...) or .append(...) evaluates to the stream itself;
            // its text has already been streamed, so the stream object is not shown as a value.
            return new CellResult(CellResult.Outcome.OK, Optional.empty(), Optional.empty(), Optional.empty());
        }
        Object v = value;
        long d0 = System.nanoTime();
        try {
            MimeBundle bundle = control.callAsUser(() -> renderers.display(v));
            clock.display(System.nanoTime() - d0);
            return new CellResult(CellResult.Outcome.OK, Optional.of(bundle), Optional.ofNullable(v), Optional.empty());
        } catch (EngineControl.UserFailure f) {
            return control.stopRequested() ? CellErrors.interrupted() : errors.runtimeError(f.getCause(), null, cell);
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            return CellErrors.interrupted();
        }
    }

    private Object valueOf(SnippetEvaluator.Evaluated main) {
        Snippet s = main.snippet();
        if (evaluator.onValueRoute(s)) {
            return control.lastValue();
        }
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

    /** JShell completion suggestions at {@code cursor} (an offset in {@code code}). */
    @Override
    public Completions complete(String code, int cursor) {
        return assist.complete(code, cursor);
    }

    /**
     * Signatures (and the first Javadoc sentence where JShell finds the sources: for JDK classes when the
     * JDK's {@code lib/src.zip} is installed) of what is at
     * or just before {@code cursor}: a method call's name or its open argument list, a type, a variable.
     */
    @Override
    public Optional<String> inspect(String code, int cursor) {
        return assist.inspect(code, cursor);
    }

    /** Whether {@code code} is a complete cell, needs more lines, or is invalid. */
    @Override
    public Completeness completeness(String code) {
        return assist.completeness(code);
    }

    /**
     * Closes the JShell session. A running cell is stopped first, then every thread cells started
     * and left running (interrupted, and after {@value EngineControl#GRACE_MS} ms stopped), so a busy
     * thread of one notebook does not spin on through the next.
     */
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
        control.stopAll();
        jshell.close();
        Display.detach(group);
    }
}
