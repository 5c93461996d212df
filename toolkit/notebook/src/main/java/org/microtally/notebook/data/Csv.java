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
import java.math.BigDecimal;
import java.math.BigInteger;
import java.util.List;
import org.apache.commons.math3.fraction.BigFraction;
import org.apache.commons.math3.fraction.Fraction;
import org.microtally.InvalidInputException;
import org.microtally.Tabular;
import tech.tablesaw.api.Table;

/**
 * CSV export (RFC 4180: comma separated, header row, fields with commas, quotes or line breaks
 * quoted and their quotes doubled; UTF-8, lines ended by LF).
 *
 * <p>A {@link Tabular} is written directly, independent of the display layer: exact integers and
 * fractions with all their digits ({@code p/q} for fractions), doubles as {@link Double#toString}
 * (which reads back to the same double), missing cells ({@code null} or the core's marker
 * {@code "n/a"}) as empty fields; nothing is rounded. A Tablesaw {@link Table} is written by Tablesaw. Files are written to a temporary file beside the
 * target and moved into place, so a failed export never leaves a half-written file. A relative
 * file name is taken in the notebook's folder ({@link NotebookFolder}).
 */
public final class Csv {
    private Csv() { }

    /** The CSV text of a result. */
    public static String text(Tabular table) {
        StringWriter w = new StringWriter();
        write(table, w);
        return w.toString();
    }

    /** The CSV text of a Tablesaw table. */
    public static String text(Table table) {
        StringWriter w = new StringWriter();
        write(table, w);
        return w.toString();
    }

    /** Writes a result as CSV to {@code file} (replacing it; relative: in the notebook's folder); returns the absolute file. */
    public static Path write(Tabular table, Path file) {
        Objects.requireNonNull(table, "table");
        return replace(file, w -> write(table, w));
    }

    /** Writes a Tablesaw table as CSV to {@code file} (replacing it); returns the file. */
    public static Path write(Table table, Path file) {
        Objects.requireNonNull(table, "table");
        return replace(file, w -> write(table, w));
    }

    private interface Body {
        void writeTo(Writer w) throws IOException;
    }

    private static Path replace(Path file, Body body) {
        Path target = NotebookFolder.resolve(file).toAbsolutePath();
        Path dir = target.getParent();
        Path tmp = null;
        try {
            if (dir != null) {
                Files.createDirectories(dir);
            }
            tmp = Files.createTempFile(dir, "." + target.getFileName(), ".tmp");
            try (Writer w = Files.newBufferedWriter(tmp, StandardCharsets.UTF_8)) {
                body.writeTo(w);
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

    /** Writes a result as CSV to {@code out} (not closed). */
    public static void write(Tabular table, Writer out) {
        Objects.requireNonNull(table, "table");
        Objects.requireNonNull(out, "out");
        List<String> names = table.columnNames();
        StringBuilder sb = new StringBuilder();
        line(sb, names);
        List<List<Object>> rows = table.rows();
        for (int r = 0; r < rows.size(); r++) {
            List<Object> row = rows.get(r);
            if (row.size() != names.size()) {
                throw InvalidInputException.of("number of cells in row " + r, row.size(),
                        "equal to the number of columns (" + names.size() + ")", "Fix the Tabular implementation.");
            }
            line(sb, row);
        }
        try {
            out.write(sb.toString());
            out.flush();
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    private static void line(StringBuilder sb, List<?> cells) {
        for (int c = 0; c < cells.size(); c++) {
            if (c > 0) {
                sb.append(',');
            }
            String f = field(cells.get(c));
            if (f.indexOf(',') >= 0 || f.indexOf('"') >= 0 || f.indexOf('\n') >= 0 || f.indexOf('\r') >= 0) {
                sb.append('"').append(f.replace("\"", "\"\"")).append('"');
            } else {
                sb.append(f);
            }
        }
        sb.append('\n');
    }

    /** The exact text of one cell: all digits of exact numbers, p/q for fractions, empty when missing. */
    static String field(Object v) {
        if (v == null || v instanceof org.microtally.Missing || "n/a".equals(v)) {
            return "";
        }
        if (v instanceof BigFraction f) {
            return f.getDenominator().equals(BigInteger.ONE) ? f.getNumerator().toString()
                    : f.getNumerator() + "/" + f.getDenominator();
        }
        if (v instanceof Fraction f) {
            return f.getDenominator() == 1 ? Integer.toString(f.getNumerator()) : f.getNumerator() + "/" + f.getDenominator();
        }
        if (v instanceof BigDecimal d) {
            return d.toString();
        }
        return String.valueOf(v);
    }
}
