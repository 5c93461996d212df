package org.microtally.kernel;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.logging.FileHandler;
import java.util.logging.Handler;
import java.util.logging.Level;
import java.util.logging.LogManager;
import java.util.logging.Logger;
import java.util.logging.SimpleFormatter;

/**
 * Kernel diagnostics go to a log file, never to the notebook and never to stderr (Jupyter shows a
 * kernel's stderr in its own console, and java.util.logging's default console handler would send
 * every library message there). The file is {@code microtally-kernel.0.log} in the directory of the
 * connection file (Jupyter's runtime directory), rotated at 1 MiB into {@code microtally-kernel.1.log}.
 */
final class KernelLog {
    static final Logger LOG = Logger.getLogger("org.microtally.kernel");
    private static volatile Path file;

    private KernelLog() { }

    /** Removes the console handler and logs to a file beside {@code connectionFile} (or nowhere if that fails). */
    static void configure(Path connectionFile) {
        LogManager.getLogManager().reset();
        Logger root = Logger.getLogger("");
        root.setLevel(Level.INFO);
        Logger.getLogger("Jupyter").setLevel(Level.WARNING);
        Path dir = connectionFile.toAbsolutePath().getParent();
        if (dir == null) {
            return;
        }
        try {
            Files.createDirectories(dir);
            Path target = dir.resolve("microtally-kernel.0.log");
            Handler h = new FileHandler(dir.resolve("microtally-kernel.%g.log").toString(), 1 << 20, 2, true);
            h.setFormatter(new SimpleFormatter());
            root.addHandler(h);
            file = target;
        } catch (IOException | SecurityException e) {
            // no log rather than a log in the notebook
            file = null;
        }
    }

    /** The log file in use, or null. */
    static Path file() {
        return file;
    }
}
