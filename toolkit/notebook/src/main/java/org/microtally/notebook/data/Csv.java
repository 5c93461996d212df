package org.microtally.notebook.data;

import java.io.IOException;
import java.io.StringWriter;
import java.io.UncheckedIOException;
import java.io.Writer;
import java.nio.charset.StandardCharsets;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.util.Objects;
import org.microtally.Tabular;
import org.microtally.notebook.render.DisplayEnvironment;
import org.microtally.notebook.render.Tables;
import tech.tablesaw.api.Table;

/**
 * CSV export (RFC 4180 style, comma separated, header row, UTF-8), written by Tablesaw.
 *
 * <p>A {@link Tabular} is first converted by {@link Tables#of(Tabular)}, so exact integers and
 * fractions are written with all their digits ({@code p/q} for fractions) and doubles in Java's
 * shortest round-trip form; nothing is rounded. Files are written to a temporary file beside the
 * target and moved into place, so a failed export never leaves a half-written file.
 */
public final class Csv {
    static {
        DisplayEnvironment.prepare();
    }

    private Csv() { }

    /** The CSV text of a result. */
    public static String text(Tabular table) {
        return text(Tables.of(table));
    }

    /** The CSV text of a Tablesaw table. */
    public static String text(Table table) {
        StringWriter w = new StringWriter();
        write(table, w);
        return w.toString();
    }

    /** Writes a result as CSV to {@code file} (replacing it); returns the file. */
    public static Path write(Tabular table, Path file) {
        return write(Tables.of(table), file);
    }

    /** Writes a Tablesaw table as CSV to {@code file} (replacing it); returns the file. */
    public static Path write(Table table, Path file) {
        Objects.requireNonNull(table, "table");
        Path target = file.toAbsolutePath();
        Path dir = target.getParent();
        Path tmp = null;
        try {
            if (dir != null) {
                Files.createDirectories(dir);
            }
            tmp = Files.createTempFile(dir, "." + target.getFileName(), ".tmp");
            try (Writer w = Files.newBufferedWriter(tmp, StandardCharsets.UTF_8)) {
                write(table, w);
            }
            try {
                Files.move(tmp, target, StandardCopyOption.ATOMIC_MOVE, StandardCopyOption.REPLACE_EXISTING);
            } catch (AtomicMoveNotSupportedException e) {
                Files.move(tmp, target, StandardCopyOption.REPLACE_EXISTING);
            }
            tmp = null;
            return target;
        } catch (IOException e) {
            throw new UncheckedIOException("could not write CSV to " + target + ": " + e.getMessage(), e);
        } finally {
            if (tmp != null) {
                try {
                    Files.deleteIfExists(tmp);
                } catch (IOException ignored) {
                    // the original error is the one to report
                }
            }
        }
    }

    /** Writes a Tablesaw table as CSV to {@code out} (not closed). */
    public static void write(Table table, Writer out) {
        Objects.requireNonNull(out, "out");
        table.write().csv(out);
        try {
            out.flush();
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }
}
