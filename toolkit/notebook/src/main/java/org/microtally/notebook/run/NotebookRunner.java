package org.microtally.notebook.run;

import java.io.IOException;
import java.io.PrintStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.HashSet;
import java.util.List;
import java.util.Optional;
import java.util.Set;
import org.microtally.notebook.session.Engine;
import org.microtally.notebook.session.Session;
import picocli.CommandLine;

/**
 * The headless runner: {@code microtally run NOTEBOOK... [--out DIR] [--keep-going]
 * [--cell-timeout SECONDS] [--output-limit BYTES]} (options in {@link RunCommand}, settings and
 * defaults in {@link RunSettings}).
 *
 * <p>Each notebook goes through one straight pipeline, each stage in one place: <b>read</b>
 * ({@link Notebook#read}: UTF-8 nbformat 4, errors with line and column or JSON path) -&gt;
 * <b>check</b> the output folder ({@link OutputFolder#problem}: a probe file is created and removed,
 * so an unwritable folder is found before any cell runs, with the operating system's reason) -&gt;
 * <b>execute</b> cell by cell in a fresh engine, collecting the outputs
 * ({@link NotebookExecution}) -&gt; <b>write</b> the page and the executed notebook
 * ({@link OutputFolder#writeAtomically}, pair rule there). A notebook that stops on a failure
 * writes nothing, and the input is never touched. Threads a notebook started are stopped when it
 * ends (the engine's close). Progress goes to standard error: one line updated in place on a
 * terminal, one line per cell otherwise.
 *
 * <p>Exit status: 0 all cells ran as expected; 1 a cell failed (the message names notebook, cell and
 * the first line of the error); 2 bad arguments, an unreadable or malformed notebook, or an output
 * folder that cannot be written. With {@code --keep-going} every notebook is tried whatever happens
 * to the others.
 */
public final class NotebookRunner {
    /** The tag that marks a cell expected to fail (as in Jupyter's own tools). */
    public static final String RAISES_EXCEPTION = NotebookExecution.RAISES_EXCEPTION;

    private final RunSettings settings;
    private final PrintStream log;
    private final ProgressLine progress;
    private final java.util.function.Function<String, Engine.Factory> engines; // by the kernelspec name a notebook gives

    NotebookRunner(RunSettings settings, PrintStream log, boolean terminal) {
        this(settings, log, terminal, Session::forKernel);
    }

    NotebookRunner(RunSettings settings, PrintStream log, boolean terminal, java.util.function.Function<String, Engine.Factory> engines) {
        this.settings = settings;
        this.log = log;
        this.progress = new ProgressLine(log, terminal);
        this.engines = engines;
    }

    /**
     * Runs the {@code run} sub-command with its arguments (without the word "run") and returns the
     * exit status. Messages and progress go to the process's standard error.
     */
    public static int main(List<String> args) {
        return main(args, Session.consoleErr(), System.console() != null);
    }

    static int main(List<String> args, PrintStream log, boolean terminal) {
        CommandLine cli = Cli.configure(new CommandLine(new RunCommand(log, terminal)), log, log);
        cli.setCommandName("microtally run");
        return cli.execute(args.toArray(String[]::new));
    }

    int runAll(List<Path> notebooks) {
        Set<String> names = new HashSet<>();
        for (Path p : notebooks) {
            if (!names.add(baseName(p))) {
                log.println("microtally: two notebooks are named " + baseName(p) + "; their outputs would overwrite each other in "
                        + settings.outDir() + ". Run them with different --out directories.");
                return 2;
            }
        }
        Optional<NotebookExecution.Failure> first = Optional.empty();
        boolean badInput = false;
        long started = System.nanoTime();
        int ran = 0;
        try (ExitWatch exits = new ExitWatch(log)) {
            for (Path p : notebooks) {
                Outcome o = runOne(p, exits);
                ran++;
                if (o.failure().isPresent() && first.isEmpty()) {
                    first = o.failure();
                }
                badInput |= o.badInput();
                if ((o.failure().isPresent() || o.badInput()) && !settings.keepGoing()) {
                    break;
                }
            }
        }
        if (ran > 1) {
            progress.runDone(ran, (System.nanoTime() - started) / 1e9);
        }
        if (first.isPresent()) {
            log.println("microtally: FAILED " + first.get().describe());
            return 1;
        }
        return badInput ? 2 : 0;
    }

    /** What became of one notebook: a failing cell, or input/output that could not be used. */
    private record Outcome(Optional<NotebookExecution.Failure> failure, boolean badInput) {
        static final Outcome OK = new Outcome(Optional.empty(), false);
        static final Outcome BAD_INPUT = new Outcome(Optional.empty(), true);
    }

    private Outcome runOne(Path file, ExitWatch exits) {
        // read
        Notebook input;
        Duration timeout;
        try {
            input = Notebook.read(file);
            timeout = settings.cellTimeoutFor(input);
        } catch (NotebookFormatException e) {
            log.println("microtally: " + e.getMessage());
            return Outcome.BAD_INPUT;
        }
        // check the output folder before anything runs
        Path page = settings.outDir().resolve(baseName(file) + ".html");
        Path target = settings.outDir().resolve(baseName(file) + ".ipynb");
        String problem = OutputFolder.problem(settings.outDir());
        if (problem == null && sameFile(target, file)) {
            problem = "the output " + target + " would replace the input notebook; choose another --out directory";
        }
        if (problem != null) {
            log.println("microtally: " + file + " not run: " + problem);
            return Outcome.BAD_INPUT;
        }
        // execute cell by cell, collecting the outputs
        NotebookExecution.Executed done = new NotebookExecution(file, timeout, settings, progress, exits).run(input, engines.apply(input.kernelName()));
        if (done.failure().isPresent() && !settings.keepGoing()) {
            log.println("microtally: " + file + ": nothing written, the run stopped at a failing cell");
            return new Outcome(done.failure(), false);
        }
        // write: the page, then the executed notebook (the pair rule of OutputFolder)
        try {
            List<Path> pair = List.of(page, target);
            int stale = OutputFolder.removeStalePartials(pair);
            if (stale > 0) {
                log.println("microtally: removed " + stale + " temporary file(s) left in " + settings.outDir() + " by an interrupted run");
            }
            OutputFolder.writeAtomically(pair, List.of(HtmlPage.of(done.notebook(), baseName(file)), done.notebook().toJson()));
        } catch (IOException e) {
            log.println("microtally: cannot write the outputs of " + file + " to " + settings.outDir() + ": " + OutputFolder.reason(e));
            return new Outcome(done.failure(), true);
        }
        log.println("microtally: wrote " + target + " and " + page);
        return done.failure().isPresent() ? new Outcome(done.failure(), false) : Outcome.OK;
    }

    private static boolean sameFile(Path a, Path b) {
        try {
            return Files.exists(a) && Files.isSameFile(a, b);
        } catch (IOException e) {
            return false;
        }
    }

    static String baseName(Path p) {
        String n = p.getFileName().toString();
        return n.endsWith(".ipynb") ? n.substring(0, n.length() - ".ipynb".length()) : n;
    }
}
