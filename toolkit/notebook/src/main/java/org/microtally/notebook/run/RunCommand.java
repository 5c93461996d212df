package org.microtally.notebook.run;

import java.io.PrintStream;
import java.nio.file.Path;
import java.time.Duration;
import java.util.List;
import java.util.Optional;
import java.util.concurrent.Callable;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

/**
 * The {@code run} command's options, parsed by the one command-line parser (picocli) that the
 * {@code microtally} launcher uses for every command; the help text is generated from these.
 */
@Command(name = "run", mixinStandardHelpOptions = true, sortOptions = false,
        description = {"Run the code cells of each notebook in a fresh session (no Python needed) and write "
                + "DIR/NAME.ipynb (executed, nbformat 4) and DIR/NAME.html (a standalone page).",
            "Cells tagged raises-exception may fail. Exit status: 0 ok, 1 a cell failed, 2 bad input or an unwritable output."})
public final class RunCommand implements Callable<Integer> {
    @Parameters(paramLabel = "NOTEBOOK", arity = "1..*", description = "nbformat 4 notebooks (.ipynb)")
    List<Path> notebooks;

    @Option(names = "--out", paramLabel = "DIR", description = "output folder (default: ./" + RunSettings.DEFAULT_OUT + ")")
    Path out = Path.of(RunSettings.DEFAULT_OUT);

    @Option(names = "--keep-going", description = "run every cell and notebook even after a failure (outputs keep the errors)")
    boolean keepGoing;

    @Option(names = "--cell-timeout", paramLabel = "SECONDS",
            description = "interrupt a cell that runs longer (a failure); default 600, or the notebook's "
                    + "metadata.microtally." + RunSettings.TIMEOUT_KEY)
    Double cellTimeoutSeconds;

    @Option(names = "--output-limit", paramLabel = "BYTES",
            description = "bytes kept of each output; the rest is replaced by a note (default: 1048576)")
    long outputLimit = RunSettings.DEFAULT_OUTPUT_LIMIT;

    @Spec
    CommandLine.Model.CommandSpec spec;

    private final PrintStream log;
    private final boolean terminal;

    /** @param log where progress and messages go; {@code terminal} whether it is a terminal (progress in place) */
    public RunCommand(PrintStream log, boolean terminal) {
        this.log = log;
        this.terminal = terminal;
    }

    @Override
    public Integer call() {
        if (cellTimeoutSeconds != null && (!(cellTimeoutSeconds > 0) || cellTimeoutSeconds > 1e6)) {
            throw new CommandLine.ParameterException(spec.commandLine(), "--cell-timeout = " + cellTimeoutSeconds
                    + " is not allowed: give a number of seconds > 0 (at most 1e6)");
        }
        if (outputLimit < 1) {
            throw new CommandLine.ParameterException(spec.commandLine(), "--output-limit = " + outputLimit
                    + " is not allowed: give a number of bytes >= 1");
        }
        Optional<Duration> timeout = Optional.ofNullable(cellTimeoutSeconds).map(s -> Duration.ofMillis((long) Math.ceil(s * 1000)));
        return new NotebookRunner(new RunSettings(out, keepGoing, timeout, outputLimit), log, terminal).runAll(notebooks);
    }
}
