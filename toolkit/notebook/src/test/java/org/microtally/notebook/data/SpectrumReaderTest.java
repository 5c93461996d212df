package org.microtally.notebook.data;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.StringReader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.microtally.InvalidInputException;
import org.microtally.notebook.render.Tables;
import org.microtally.spectrum.Level;
import org.microtally.spectrum.Spectra;
import org.microtally.spectrum.Spectrum;
import org.microtally.units.Energy;
import org.microtally.units.EnergyScale;
import org.microtally.units.EnergyUnit;
import tech.tablesaw.api.DoubleColumn;
import tech.tablesaw.api.IntColumn;
import tech.tablesaw.api.StringColumn;
import tech.tablesaw.api.Table;

class SpectrumReaderTest {
    static final EnergyScale MEV = EnergyScale.of("meV", Energy.of(1, EnergyUnit.MILLIELECTRONVOLT));

    static Spectrum read(String csv) {
        return SpectrumReader.fromCsv(new StringReader(csv), "dot.csv", MEV, Double.POSITIVE_INFINITY, "");
    }

    @Test
    void readsLevelsSortsAndMergesDuplicates() {
        Spectrum s = read("degeneracy,Energy\n2,6.0\n2,3\n1,0\n4,6\n");
        assertEquals(List.of(new Level(0, 1), new Level(3, 2), new Level(6, 6)), s.levels());
        assertFalse(s.isLabelled());
        assertFalse(s.isTruncated());
        assertEquals(MEV, s.scale());
    }

    @Test
    void labelColumnMakesALabelledSpectrum() {
        Spectrum s = read("energy,degeneracy,label,comment\n1,1,1,up\n1,1,-1,down\n0,1,0,\n");
        assertTrue(s.isLabelled());
        assertEquals(List.of(new Level(0, 1, 0), new Level(1, 1, -1), new Level(1, 1, 1)), s.levels());
    }

    @Test
    void fileRoundTripOfAnOscillatorKeepsEveryLevel(@TempDir Path dir) {
        // Source: closed form, 3D isotropic oscillator degeneracy g_n = (n+1)(n+2)/2
        Spectrum trap = Spectra.harmonicOscillator(3, 12);
        Path file = Csv.write(Tables.of(trap), dir.resolve("trap.csv"));
        Spectrum back = SpectrumReader.fromCsv(file, trap.scale(), trap.cutoffEnergy(), trap.cutoffNote());
        assertEquals(trap, back);
        for (int n = 0; n <= 12; n++) {
            assertEquals((n + 1) * (n + 2) / 2, back.degeneracy(n));
        }
        Spectrum complete = SpectrumReader.fromCsv(file, trap.scale());
        assertFalse(complete.isTruncated());
        assertEquals(trap.levels(), complete.levels());
    }

    @Test
    void labelledRoundTrip(@TempDir Path dir) {
        Spectrum dot = Spectra.oscillator2dByAngularMomentum(4);
        Path file = Csv.write(Tables.of(dot), dir.resolve("dot.csv"));
        Spectrum back = SpectrumReader.fromCsv(file, dot.scale(), dot.cutoffEnergy(), dot.cutoffNote());
        assertEquals(dot, back);
        // Source: closed form, 2D oscillator shell n holds n + 1 states with m = -n, -n+2, ..., n
        assertEquals(15, back.stateCount());
    }

    @ParameterizedTest(name = "{0}")
    @CsvSource(delimiter = '|', textBlock = """
            energy,degeneracy\\n0,1\\nabc,2\\n | column 'energy' in data row 2 (line 3) of dot.csv = "abc" | a finite number
            energy,degeneracy\\n0,1\\n1,0\\n   | column 'degeneracy' in data row 2 (line 3) of dot.csv = "0" | an integer >= 1
            energy,degeneracy\\n0,2.5\\n       | column 'degeneracy' in data row 1 (line 2) of dot.csv = "2.5" | an integer >= 1
            energy,degeneracy\\n0,1\\n,1\\n    | column 'energy' in data row 2 (line 3) of dot.csv = (empty) | a finite number
            energy,degeneracy\\nInfinity,1\\n  | column 'energy' in data row 1 (line 2) of dot.csv = "Infinity" | a finite number
            energy,degeneracy,label\\n0,1,x\\n | column 'label' in data row 1 (line 2) of dot.csv = "x" | an integer written as one
            energy,degeneracy,label\\n0,1,010\\n | column 'label' in data row 1 (line 2) of dot.csv = "010" | an integer written as one
            energy,degeneracy,label\\n0,1,+2\\n | column 'label' in data row 1 (line 2) of dot.csv = "+2" | an integer written as one
            energy,degeneracy\\nNaN,1\\n       | column 'energy' in data row 1 (line 2) of dot.csv = "NaN" | a finite number
            """)
    void badCellsAreReportedWithRowAndColumn(String csv, String where, String allowed) {
        InvalidInputException e = assertThrows(InvalidInputException.class, () -> read(csv.replace("\\n", "\n")));
        assertTrue(e.getMessage().startsWith(where + " is not allowed: must be " + allowed + ".")
                || e.getMessage().startsWith(where + " is not allowed: must be " + allowed + " ("), e.getMessage());
    }

    @Test
    void missingColumnAndEmptyFilesAreReported() {
        InvalidInputException e = assertThrows(InvalidInputException.class, () -> read("E,g\n0,1\n"));
        assertTrue(e.getMessage().contains("[E, g]") && e.getMessage().contains("'energy'"), e.getMessage());
        InvalidInputException none = assertThrows(InvalidInputException.class, () -> read("energy,degeneracy\n"));
        assertTrue(none.getMessage().contains("number of levels in dot.csv = 0"), none.getMessage());
        InvalidInputException empty = assertThrows(InvalidInputException.class, () -> read(""));
        assertTrue(empty.getMessage().contains("dot.csv"), empty.getMessage());
    }

    @Test
    void readsFromATablesawTableWithNumericOrTextColumns() {
        Table t = Table.create("levels", DoubleColumn.create("energy", 0.0, 1.5, 1.5),
                IntColumn.create("degeneracy", 1, 2, 1));
        Spectrum s = SpectrumReader.fromTable(t, MEV);
        assertEquals(List.of(new Level(0, 1), new Level(1.5, 3)), s.levels());
        Table text = Table.create("as text", StringColumn.create("energy", "0", "1.5"),
                StringColumn.create("degeneracy", "1", "two"));
        InvalidInputException e = assertThrows(InvalidInputException.class, () -> SpectrumReader.fromTable(text, MEV));
        assertTrue(e.getMessage().startsWith("column 'degeneracy' in row 1 of table 'as text' = \"two\""), e.getMessage());
    }

    @Test
    void readsAFileByPath(@TempDir Path dir) throws Exception {
        Path file = dir.resolve("levels.csv");
        Files.writeString(file, "energy,degeneracy,label\n0,1,0\n2,1,2\n2,1,-2\n", StandardCharsets.UTF_8);
        Spectrum s = SpectrumReader.fromCsv(file, MEV);
        assertEquals(3, s.size());
        assertEquals(-2, s.label(1));
    }

    @Test
    void aFileReadWithoutACutoffIsMarkedSoTheEnsemblesCheckItsTop(@TempDir Path dir) throws Exception {
        Path file = dir.resolve("levels.csv");
        Files.writeString(file, "energy,degeneracy\n0,1\n1,3\n2,6\n", StandardCharsets.UTF_8);
        Spectrum s = SpectrumReader.fromCsv(file, MEV);
        // Source: common practice, no source (no cutoff declared: used as complete, marked undeclared)
        assertFalse(s.isTruncated());
        assertTrue(s.isCompletenessUndeclared());
        assertTrue(org.microtally.ensemble.Canonical.of(s, org.microtally.spectrum.Statistics.BOSE, 10, 2.0).warnings()
                .stream().anyMatch(w -> w.startsWith("spectrum of undeclared completeness")));
        assertFalse(SpectrumReader.fromCsv(file, MEV, Double.POSITIVE_INFINITY, "complete list").isCompletenessUndeclared());
    }

    @Test
    void aMissingFileIsReportedAsNotFoundAndBadBytesByOffset(@TempDir Path dir) throws Exception {
        InvalidInputException missing = assertThrows(InvalidInputException.class,
                () -> SpectrumReader.fromCsv(dir.resolve("nowhere.csv"), MEV));
        assertTrue(missing.getMessage().contains("not found") && missing.getMessage().contains("nowhere.csv"),
                missing.getMessage());
        Path latin = dir.resolve("latin.csv");
        Files.write(latin, new byte[] {'e', 'n', 'e', 'r', 'g', 'y', ',', 'd', 'e', 'g', 'e', 'n', 'e', 'r', 'a', 'c',
                'y', '\n', '0', ',', '1', (byte) 0xe9, '\n'});
        InvalidInputException bad = assertThrows(InvalidInputException.class, () -> SpectrumReader.fromCsv(latin, MEV));
        assertTrue(bad.getMessage().contains("not valid UTF-8 at byte 21"), bad.getMessage());
    }
}
