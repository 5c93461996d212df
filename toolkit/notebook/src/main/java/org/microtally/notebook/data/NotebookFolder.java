package org.microtally.notebook.data;

import java.nio.file.Path;
import java.util.Objects;

/**
 * The folder relative file names in a notebook are read from and written to: the notebook's own
 * folder, so that {@code SpectrumReader.fromCsv(Path.of("levels.csv"), ...)} finds the file that
 * sits beside the notebook however the notebook is run.
 *
 * <ul>
 *   <li>Under Jupyter the kernel process is started in the notebook's folder (Jupyter's own rule for
 *       kernels it starts), so nothing is set: relative names resolve against the working
 *       directory, which is that folder.</li>
 *   <li>The headless runner runs many notebooks in one process whose working directory is wherever
 *       it was started: it sets the folder of the notebook it runs ({@link #use}) for the time of
 *       that run.</li>
 * </ul>
 * Every reader and writer in this package resolves its path here. Code of your own that opens
 * files by a relative name should do the same: {@code Files.readString(NotebookFolder.resolve(Path.of("notes.txt")))}.
 */
public final class NotebookFolder {
    private static volatile Path folder;   // null: the working directory

    private NotebookFolder() { }

    /** The folder relative names resolve against: the running notebook's, else the working directory. */
    public static Path current() {
        Path f = folder;
        return f != null ? f : Path.of("").toAbsolutePath();
    }

    /** {@code file} itself when absolute, else resolved against {@link #current()}. */
    public static Path resolve(Path file) {
        Objects.requireNonNull(file, "file");
        Path f = folder;
        return file.isAbsolute() || f == null ? file : f.resolve(file);
    }

    /** Relative names resolve against {@code notebookFolder} until the returned scope is closed (for runners). */
    public static Scope use(Path notebookFolder) {
        Path before = folder;
        folder = Objects.requireNonNull(notebookFolder, "notebookFolder").toAbsolutePath().normalize();
        return () -> folder = before;
    }

    /** Restores the folder that was in effect before {@link #use}. */
    @FunctionalInterface
    public interface Scope extends AutoCloseable {
        @Override
        void close();
    }
}
