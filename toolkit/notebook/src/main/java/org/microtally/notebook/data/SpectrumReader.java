package org.microtally.notebook.data;

import java.io.IOException;
import java.io.Reader;
import java.io.StringReader;
import java.io.UncheckedIOException;
import java.math.BigDecimal;
import java.nio.ByteBuffer;
import java.nio.charset.CharacterCodingException;
import java.nio.charset.CodingErrorAction;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Objects;
import org.microtally.InvalidInputException;
import org.microtally.spectrum.Level;
import org.microtally.spectrum.Spectrum;
import org.microtally.units.EnergyScale;
import tech.tablesaw.api.ColumnType;
import tech.tablesaw.api.Table;
import tech.tablesaw.columns.Column;
import tech.tablesaw.io.csv.CsvReadOptions;

/**
 * Reads a single-particle {@link Spectrum} from a CSV file or a Tablesaw table.
 *
 * <p>Layout: a header row naming the columns {@code energy} and {@code degeneracy} (required) and
 * {@code label} (optional; its presence makes the spectrum labelled), in any order and letter case;
 * other columns are ignored. One level per row. Energies are finite decimal numbers in the unit of
 * the given scale; degeneracies integers &gt;= 1; labels integers. This is the layout
 * {@link org.microtally.notebook.render.Tables#of(Spectrum)} and {@link Csv} write.
 *
 * <p>As {@link Spectrum#of(List, EnergyScale, boolean, double, String)} documents, rows need not be
 * sorted (they are sorted by energy, then label) and rows with the same energy and label are merged
 * by adding their degeneracies.
 *
 * <p>A file holds no cutoff. Read without one ({@link #fromCsv(Path, EnergyScale)},
 * {@link #fromTable(Table, EnergyScale)}) the spectrum is used as complete but marked
 * {@link Spectrum#isCompletenessUndeclared() completeness undeclared}, so the ensembles warn when its
 * top level is populated; pass the cutoff, or {@code Double.POSITIVE_INFINITY} for a list that is
 * complete, to declare it.
 *
 * <p>Labels are integers written as integers: a label cell such as {@code 010}, {@code +3} or
 * {@code 2.0} is refused with the cell named (a text label like {@code 010} would otherwise become
 * the number 10 and merge with it). Energies and degeneracies are numbers in any decimal form.
 * A bad cell is reported with its data row (1-based), the file line (assuming no quoted line
 * breaks), the column and the text found ({@code NaN} shown as written). A missing file is reported
 * as not found, bytes that are not UTF-8 by their offset.
 */
public final class SpectrumReader {
    private static final String ENERGY = "energy";
    private static final String DEGENERACY = "degeneracy";
    private static final String LABEL = "label";

    private SpectrumReader() { }

    /** A spectrum from a UTF-8 CSV file with no declared cutoff (used as complete, completeness undeclared). */
    public static Spectrum fromCsv(Path file, EnergyScale scale) {
        return fromCsv(file, scale, Double.POSITIVE_INFINITY, "").withCompletenessUndeclared(undeclared(file.toString()));
    }

    private static String undeclared(String source) {
        return "read from " + source + " without a declared cutoff: levels above its last row may exist; declare the "
                + "cutoff, or Double.POSITIVE_INFINITY if the list is complete";
    }

    /**
     * A spectrum from a UTF-8 CSV file, recording that levels above {@code cutoffEnergy} were omitted
     * ({@code Double.POSITIVE_INFINITY}: the file lists every level).
     */
    public static Spectrum fromCsv(Path file, EnergyScale scale, double cutoffEnergy, String cutoffNote) {
        Objects.requireNonNull(file, "file");
        file = NotebookFolder.resolve(file);   // a relative name is the notebook's neighbour
        byte[] bytes;
        try {
            bytes = Files.readAllBytes(file);
        } catch (NoSuchFileException e) {
            throw InvalidInputException.of("spectrum CSV file", file.toAbsolutePath(), "an existing file",
                    "The file was not found; a relative name is taken in the notebook's folder (" + NotebookFolder.current() + ").");
        } catch (IOException e) {
            throw new UncheckedIOException("could not read spectrum CSV " + file + ": " + e.getMessage(), e);
        }
        return fromCsv(new StringReader(utf8(bytes, file.getFileName().toString())), file.getFileName().toString(),
                scale, cutoffEnergy, cutoffNote);
    }

    /** Decodes strictly, naming the offset of the first byte that is not UTF-8. */
    private static String utf8(byte[] bytes, String source) {
        ByteBuffer in = ByteBuffer.wrap(bytes);
        try {
            return StandardCharsets.UTF_8.newDecoder().onMalformedInput(CodingErrorAction.REPORT)
                    .onUnmappableCharacter(CodingErrorAction.REPORT).decode(in).toString();
        } catch (CharacterCodingException e) {
            throw InvalidInputException.of("spectrum CSV " + source, "a file that is not valid UTF-8 at byte "
                    + in.position() + " (0-based, value 0x" + String.format("%02x", bytes[in.position()] & 0xff)
                    + ")", "UTF-8 text", "Save the file as UTF-8.");
        }
    }

    /** A spectrum from CSV text; {@code sourceName} names it in error messages. */
    public static Spectrum fromCsv(Reader csv, String sourceName, EnergyScale scale, double cutoffEnergy,
                                   String cutoffNote) {
        Objects.requireNonNull(csv, "csv");
        Table table;
        try {
            table = Table.read().csv(CsvReadOptions.builder(csv).tableName(sourceName).header(true)
                    .missingValueIndicator("").columnTypes(name -> ColumnType.STRING));
        } catch (RuntimeException e) {
            String why = String.valueOf(e.getMessage()).strip().lines().findFirst().orElse("").strip()
                    .replaceAll("\\.+$", "");
            throw new InvalidInputException("could not read spectrum CSV " + sourceName + ": " + why
                    + ". Give a comma-separated file with a header row naming energy, degeneracy and optionally label.");
        }
        return read(table, sourceName, true, scale, cutoffEnergy, cutoffNote);
    }

    /** A spectrum from the columns of a Tablesaw table with no declared cutoff (completeness undeclared). */
    public static Spectrum fromTable(Table table, EnergyScale scale) {
        return fromTable(table, scale, Double.POSITIVE_INFINITY, "")
                .withCompletenessUndeclared(undeclared("table '" + table.name() + "'"));
    }

    /** A spectrum from the columns of a Tablesaw table, with its cutoff. */
    public static Spectrum fromTable(Table table, EnergyScale scale, double cutoffEnergy, String cutoffNote) {
        Objects.requireNonNull(table, "table");
        return read(table, "table '" + table.name() + "'", false, scale, cutoffEnergy, cutoffNote);
    }

    private static Spectrum read(Table table, String source, boolean fromFile, EnergyScale scale,
                                 double cutoffEnergy, String cutoffNote) {
        Objects.requireNonNull(scale, "scale");
        Column<?> energy = find(table, ENERGY, source, true);
        Column<?> degeneracy = find(table, DEGENERACY, source, true);
        Column<?> label = find(table, LABEL, source, false);
        int n = table.rowCount();
        if (n == 0) {
            throw InvalidInputException.of("number of levels in " + source, 0, ">= 1 data row",
                    "Add one row per level below the header.");
        }
        List<Level> levels = new ArrayList<>(n);
        for (int r = 0; r < n; r++) {
            String where = (fromFile ? "data row " + (r + 1) + " (line " + (r + 2) + ")" : "row " + r) + " of " + source;
            double e = number(energy, r, where);
            if (!Double.isFinite(e)) {
                throw bad(energy, r, where, "a finite number");
            }
            int g = integer(degeneracy, r, where, "an integer >= 1");
            if (g < 1) {
                throw bad(degeneracy, r, where, "an integer >= 1");
            }
            int l = label == null ? 0 : labelValue(label, r, where);
            levels.add(new Level(e, g, l));
        }
        return Spectrum.of(levels, scale, label != null, cutoffEnergy, cutoffNote);
    }

    private static Column<?> find(Table table, String wanted, String source, boolean required) {
        for (Column<?> c : table.columns()) {
            if (c.name().strip().toLowerCase(Locale.ROOT).equals(wanted)) {
                return c;
            }
        }
        if (required) {
            throw InvalidInputException.of("columns of " + source, table.columnNames(),
                    "a header containing '" + wanted + "'",
                    "Name the columns energy, degeneracy and optionally label.");
        }
        return null;
    }

    private static double number(Column<?> col, int r, String where) {
        if (col.isMissing(r)) {
            throw bad(col, r, where, "a finite number");
        }
        Object v = col.get(r);
        if (v instanceof Number num) {
            return num.doubleValue();
        }
        try {
            return Double.parseDouble(String.valueOf(v).strip());
        } catch (NumberFormatException e) {
            throw bad(col, r, where, "a finite number");
        }
    }

    private static int integer(Column<?> col, int r, String where, String allowed) {
        if (col.isMissing(r)) {
            throw bad(col, r, where, allowed);
        }
        Object v = col.get(r);
        try {
            BigDecimal d = v instanceof Number num && !(v instanceof Double || v instanceof Float)
                    ? new BigDecimal(num.toString()) : new BigDecimal(String.valueOf(v).strip());
            return d.intValueExact();
        } catch (NumberFormatException | ArithmeticException e) {
            throw bad(col, r, where, allowed);
        }
    }

    /** Labels: integers written as integers (no leading zeros, sign only for negatives, no decimals). */
    private static int labelValue(Column<?> col, int r, String where) {
        String allowed = "an integer written as one (such as 10 or -2; not 010, +2 or 2.0: labels name states, "
                + "and text labels would merge with the number they look like)";
        if (!col.isMissing(r) && !(col.get(r) instanceof Number)
                && !String.valueOf(col.get(r)).strip().matches("-?(0|[1-9][0-9]*)")) {
            throw bad(col, r, where, allowed);
        }
        return integer(col, r, where, allowed);
    }

    private static InvalidInputException bad(Column<?> col, int r, String where, String allowed) {
        String text = col.isMissing(r) ? "(empty)" : "\"" + col.getString(r) + "\"";
        return InvalidInputException.of("column '" + col.name().strip() + "' in " + where, text, allowed,
                "Correct or remove that row.");
    }
}
