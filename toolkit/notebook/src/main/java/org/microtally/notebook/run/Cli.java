package org.microtally.notebook.run;

import java.io.PrintStream;
import java.io.PrintWriter;
import picocli.CommandLine;

/**
 * The one way the toolkit parses command lines (picocli 4.7): every command of the
 * {@code microtally} launcher is configured here, so options behave alike ({@code --opt VALUE} and
 * {@code --opt=VALUE}), usage errors exit with status 2 and a generated usage text, and help goes
 * to the given stream.
 */
public final class Cli {
    private Cli() { }

    /** Configures {@code cli} (and its subcommands): help and version to {@code out}, errors to {@code err}. */
    public static CommandLine configure(CommandLine cli, PrintStream out, PrintStream err) {
        cli.setOut(new PrintWriter(out, true));
        cli.setErr(new PrintWriter(err, true));
        cli.setCaseInsensitiveEnumValuesAllowed(true);
        return cli;
    }
}
