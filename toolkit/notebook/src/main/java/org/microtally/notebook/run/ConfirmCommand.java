package org.microtally.notebook.run;

import java.io.PrintStream;
import java.nio.file.Path;
import java.time.Duration;
import java.util.List;
import java.util.Optional;
import java.util.concurrent.Callable;
import org.microtally.notebook.session.Engine;
import org.microtally.notebook.session.Session;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

/**
 * {@code microtally confirm EXECUTED.ipynb [OTHER.ipynb] [--rel-tol R] [--abs-tol A]}: confirms
 * that a notebook's numbers come out again. With one notebook its code is run again in a fresh
 * session (nothing is written) and the new outputs are compared with the saved ones; with two,
 * their saved outputs are compared. The comparison is {@link NumberCheck}'s: cell by cell, words
 * equal and every number within the tolerance. Every difference is printed with its cell.
 */
@Command(name = "confirm", mixinStandardHelpOptions = true, sortOptions = false,
        description = {"Check that an executed notebook's numbers come out again: with one notebook, run its code "
                + "again in a fresh session and compare with the saved outputs; with two, compare their outputs.",
            "Exit status: 0 every number agrees, 1 a difference (each printed with its cell), 2 bad input or a cell "
                + "that failed on the rerun."})
public final class ConfirmCommand implements Callable<Integer> {
    @Parameters(paramLabel = "NOTEBOOK", arity = "1..2", description = "an executed notebook, or two to compare")
    List<Path> notebooks;

    @Option(names = "--rel-tol", paramLabel = "R",
            description = "numbers agree when |a - b| <= R * max(|a|, |b|) (default: 1e-9; 0 asks for the same digits)")
    double relative = NumberCheck.DEFAULT_RELATIVE;

    @Option(names = "--abs-tol", paramLabel = "A", description = "or when |a - b| <= A, for numbers near zero (default: 0)")
    double absolute;

    @Option(names = "--cell-timeout", paramLabel = "SECONDS",
            description = "time limit of each cell on the rerun (default as for the run command)")
    Double cellTimeoutSeconds;

    @Spec
    CommandLine.Model.CommandSpec spec;

    private final PrintStream log;
    private final java.util.function.Function<String, Engine.Factory> engines; // by the kernelspec name a notebook gives

    /** Reports on the process's standard error. */
    public ConfirmCommand() {
        this(Session.consoleErr(), Session::forKernel);
    }

    ConfirmCommand(PrintStream log, java.util.function.Function<String, Engine.Factory> engines) {
        this.log = log;
        this.engines = engines;
    }

    @Override
    public Integer call() {
        CommandLine me = spec.commandLine();
        if (!(relative >= 0) || Double.isInfinite(relative)) {
            throw new CommandLine.ParameterException(me, "--rel-tol = " + relative + " is not allowed: give a number >= 0, e.g. 1e-9");
        }
        if (!(absolute >= 0) || Double.isInfinite(absolute)) {
            throw new CommandLine.ParameterException(me, "--abs-tol = " + absolute + " is not allowed: give a number >= 0, e.g. 1e-300");
        }
        if (cellTimeoutSeconds != null && (!(cellTimeoutSeconds > 0) || cellTimeoutSeconds > 1e6)) {
            throw new CommandLine.ParameterException(me, "--cell-timeout = " + cellTimeoutSeconds
                    + " is not allowed: give a number of seconds > 0 (at most 1e6)");
        }
        Notebook reference;
        Notebook other;
        try {
            reference = Notebook.read(notebooks.get(0));
            if (notebooks.size() == 2) {
                other = Notebook.read(notebooks.get(1));
            } else {
                Optional<Notebook> rerun = rerun(notebooks.get(0), reference);
                if (rerun.isEmpty()) {
                    return 2;
                }
                other = rerun.get();
            }
        } catch (NotebookFormatException e) {
            log.println("microtally confirm: " + e.getMessage());
            return 2;
        }
        NumberCheck.Report r = new NumberCheck(relative, absolute).compare(reference, other);
        String what = notebooks.size() == 2 ? notebooks.get(0) + " and " + notebooks.get(1)
                : notebooks.get(0) + " and its rerun";
        String tolerance = "relative tolerance " + relative + (absolute > 0 ? ", absolute " + absolute : "");
        if (r.agrees()) {
            log.println("microtally confirm: " + what + " agree: " + r.numbersCompared() + " numbers in " + r.cellsCompared()
                    + " code cells (" + tolerance + ")");
            return 0;
        }
        r.differences().forEach(d -> log.println("  " + d.describe()));
        log.println("microtally confirm: " + what + " DIFFER (" + r.differences().size() + " differences listed above; "
                + r.numbersCompared() + " numbers compared, " + tolerance + ")");
        return 1;
    }

    /** Runs the notebook's code again (every cell, even after a failure); empty when a cell failed unexpectedly. */
    private Optional<Notebook> rerun(Path file, Notebook saved) throws NotebookFormatException {
        RunSettings settings = new RunSettings(Path.of(RunSettings.DEFAULT_OUT), true,
                Optional.ofNullable(cellTimeoutSeconds).map(s -> Duration.ofMillis((long) Math.ceil(s * 1000))),
                RunSettings.DEFAULT_OUTPUT_LIMIT);
        Duration timeout = settings.cellTimeoutFor(saved);
        NotebookExecution.Executed done;
        try (ExitWatch exits = new ExitWatch(log)) {
            done = new NotebookExecution(file, timeout, settings, new ProgressLine(log, false), exits).run(saved, engines.apply(saved.kernelName()));
        }
        if (done.failure().isPresent()) {
            log.println("microtally confirm: the rerun failed at " + done.failure().get().describe()
                    + "; the numbers were not compared");
            return Optional.empty();
        }
        return Optional.of(done.notebook());
    }
}
