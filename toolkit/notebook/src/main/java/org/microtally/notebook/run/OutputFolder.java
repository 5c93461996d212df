package org.microtally.notebook.run;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.AccessDeniedException;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.DirectoryStream;
import java.nio.file.FileAlreadyExistsException;
import java.nio.file.FileSystemException;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.NotDirectoryException;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.nio.file.StandardOpenOption;
import java.security.SecureRandom;
import java.util.ArrayList;
import java.util.List;

/**
 * The runner's output folder: checked before a notebook executes, and written so that it never
 * holds a half-written file.
 *
 * <p>Pair rule: the page ({@code NAME.html}) and then the executed notebook ({@code NAME.ipynb}) are
 * written to hidden temporary files ({@code .NAME.html.RANDOM.partial}) first; only when both are
 * written is the page renamed into place, and the executed notebook last. A run killed before the
 * renames changes nothing; one killed between them leaves a new page beside the previous notebook,
 * never a new notebook without its page; so a page newer than its notebook marks a run killed while
 * writing (a finished pair has the notebook at least as new as the page). Temporary files of the
 * same notebook left by a killed run are removed by the next run before it writes.
 */
final class OutputFolder {
    private static final SecureRandom RANDOM = new SecureRandom();
    private static final String PARTIAL = ".partial";

    private OutputFolder() { }

    /** Why the folder cannot take outputs, in the operating system's words, or null when it can. */
    static String problem(Path dir) {
        Path missing = missingFolderOnPath(dir);
        if (missing != null) {
            return dir + " goes through " + missing + ", which does not exist; create it or give a path without '..'";
        }
        if (Files.exists(dir) && !Files.isDirectory(dir)) {
            return dir + " is a regular file, not a folder; choose another --out";
        }
        try {
            Files.createDirectories(dir);
            Path probe = dir.resolve(".microtally-probe-" + Long.toHexString(RANDOM.nextLong()) + PARTIAL);
            Files.writeString(probe, "", StandardOpenOption.CREATE_NEW);
            Files.delete(probe);
            return null;
        } catch (IOException e) {
            return "cannot write to " + dir + ": " + reason(e);
        }
    }

    /** The first folder before a ".." element of {@code dir} that does not exist (the OS would refuse that path). */
    private static Path missingFolderOnPath(Path dir) {
        Path prefix = dir.isAbsolute() ? dir.getRoot() : Path.of("");
        for (Path part : dir) {
            if (part.toString().equals("..") && !prefix.toString().isEmpty() && !Files.isDirectory(prefix)) {
                return prefix;
            }
            prefix = prefix.resolve(part);
        }
        return null;
    }

    /** An I/O failure in words: the operating system's reason and the file it concerns. */
    static String reason(IOException e) {
        if (e instanceof AccessDeniedException a) {
            return "permission denied (" + a.getFile() + ")";
        }
        if (e instanceof NoSuchFileException n) {
            return "no such file or folder (" + n.getFile() + ")";
        }
        if (e instanceof NotDirectoryException n) {
            return "not a folder (" + n.getFile() + ")";
        }
        if (e instanceof FileAlreadyExistsException f) {
            return "a file is in the way (" + f.getFile() + ")";
        }
        if (e instanceof FileSystemException f) {
            String why = f.getReason() == null ? f.getClass().getSimpleName() : f.getReason();
            return why.toLowerCase(java.util.Locale.ROOT) + " (" + f.getFile() + ")";
        }
        return e.getMessage() == null ? e.getClass().getSimpleName() : e.getMessage();
    }

    /** Removes the temporary files a killed run left for {@code targets}; returns how many. */
    static int removeStalePartials(List<Path> targets) throws IOException {
        int n = 0;
        for (Path t : targets) {
            Path dir = t.toAbsolutePath().getParent();
            if (!Files.isDirectory(dir)) {
                continue;
            }
            String prefix = "." + t.getFileName() + ".";
            try (DirectoryStream<Path> s = Files.newDirectoryStream(dir, p -> {
                String name = p.getFileName().toString();
                return name.startsWith(prefix) && name.endsWith(PARTIAL);
            })) {
                for (Path p : s) {
                    Files.deleteIfExists(p);
                    n++;
                }
            }
        }
        return n;
    }

    /**
     * Writes every file to a temporary file in its folder first and renames them into place in the
     * order given only when all are written; on any failure the temporary files are removed and no
     * target is touched. Callers list the executed notebook last (the pair rule above).
     */
    static void writeAtomically(List<Path> targets, List<String> contents) throws IOException {
        List<Path> temps = new ArrayList<>();
        try {
            for (int i = 0; i < targets.size(); i++) {
                Path t = targets.get(i).toAbsolutePath();
                Files.createDirectories(t.getParent());
                // created like any new file (permissions from the umask), unlike createTempFile's owner-only mode
                Path tmp = t.getParent().resolve("." + t.getFileName() + "." + Long.toHexString(RANDOM.nextLong()) + PARTIAL);
                temps.add(tmp);
                Files.writeString(tmp, contents.get(i), StandardCharsets.UTF_8, StandardOpenOption.CREATE_NEW, StandardOpenOption.WRITE);
            }
            for (int i = 0; i < targets.size(); i++) {
                try {
                    Files.move(temps.get(i), targets.get(i), StandardCopyOption.ATOMIC_MOVE, StandardCopyOption.REPLACE_EXISTING);
                } catch (AtomicMoveNotSupportedException e) {
                    Files.move(temps.get(i), targets.get(i), StandardCopyOption.REPLACE_EXISTING);
                }
            }
        } finally {
            for (Path tmp : temps) {
                Files.deleteIfExists(tmp);
            }
        }
    }
}
