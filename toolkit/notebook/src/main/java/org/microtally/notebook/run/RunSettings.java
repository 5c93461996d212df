package org.microtally.notebook.run;

import com.google.gson.JsonElement;
import com.google.gson.JsonObject;
import java.nio.file.Path;
import java.time.Duration;
import java.util.Locale;
import java.util.Optional;
import org.microtally.InvalidInputException;

/**
 * How the headless runner runs: where it writes, whether it goes on after a failure, how long a
 * cell may run and how much of each output is kept.
 *
 * <p>Cell time limit: {@link #DEFAULT_CELL_TIMEOUT} (10 minutes) unless the notebook's metadata says
 * otherwise ({@code "microtally": {"cell_timeout_seconds": S}}); {@code --cell-timeout S} on the
 * command line wins over both, so whoever runs the notebook (a CI job) has the last word.
 * Output limit: each output keeps at most {@link #DEFAULT_OUTPUT_LIMIT} bytes (1 MiB) of UTF-8
 * text; the rest is counted and replaced by a visible note ({@code --output-limit BYTES} raises it).
 *
 * @param outDir            the folder the executed notebook and the page are written to
 * @param keepGoing         run every cell and every notebook even after a failure
 * @param cellTimeout       the command line's cell time limit, if one was given
 * @param outputLimitBytes  bytes kept per output (stream text or display)
 */
public record RunSettings(Path outDir, boolean keepGoing, Optional<Duration> cellTimeout, long outputLimitBytes) {
    public static final Duration DEFAULT_CELL_TIMEOUT = Duration.ofMinutes(10);
    public static final long DEFAULT_OUTPUT_LIMIT = 1L << 20;
    static final String DEFAULT_OUT = "microtally-out";
    /** The notebook metadata key (under "microtally") that sets the cell time limit in seconds. */
    static final String TIMEOUT_KEY = "cell_timeout_seconds";

    public RunSettings {
        if (outputLimitBytes < 1) {
            throw InvalidInputException.of("--output-limit", outputLimitBytes, "a number of bytes >= 1",
                    "The default keeps " + DEFAULT_OUTPUT_LIMIT + " bytes per output.");
        }
    }

    /** The defaults: ./microtally-out, stop at the first failure, 10 minutes per cell, 1 MiB per output. */
    static RunSettings defaults() {
        return new RunSettings(Path.of(DEFAULT_OUT), false, Optional.empty(), DEFAULT_OUTPUT_LIMIT);
    }

    /** The cell time limit for {@code notebook}: the command line's, else the notebook's, else the default. */
    Duration cellTimeoutFor(Notebook notebook) throws NotebookFormatException {
        if (cellTimeout.isPresent()) {
            return cellTimeout.get();
        }
        JsonElement md = notebook.root().get("metadata");
        if (md != null && md.isJsonObject() && md.getAsJsonObject().get("microtally") instanceof JsonObject own
                && own.has(TIMEOUT_KEY)) {
            JsonElement v = own.get(TIMEOUT_KEY);
            if (!v.isJsonPrimitive() || !v.getAsJsonPrimitive().isNumber() || !(v.getAsDouble() > 0) || v.getAsDouble() > 1e6) {
                throw new NotebookFormatException(notebook.name() + ": $.metadata.microtally." + TIMEOUT_KEY + " = " + v
                        + " is not allowed: give a number of seconds between 0 and 1e6");
            }
            return Duration.ofMillis((long) Math.ceil(v.getAsDouble() * 1000));
        }
        return DEFAULT_CELL_TIMEOUT;
    }

    static String describe(Duration d) {
        double s = d.toMillis() / 1000.0;
        return s >= 60 && s % 60 == 0 ? String.format(Locale.ROOT, "%d min", (long) s / 60) : String.format(Locale.ROOT, "%s s", s);
    }
}
