package org.microtally.notebook.data;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.StringReader;
import java.math.BigInteger;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import org.apache.commons.math3.fraction.BigFraction;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.microtally.Tabular;
import org.microtally.notebook.render.Tables;
import tech.tablesaw.api.ColumnType;
import tech.tablesaw.api.Table;
import tech.tablesaw.io.csv.CsvReadOptions;

class CsvTest {

    static Tabular of(List<String> names, List<List<Object>> rows) {
        return Tables.tabular(names, rows);
    }

    static Table readAsText(String csv) {
        return Table.read().csv(CsvReadOptions.builder(new StringReader(csv)).header(true)
                .columnTypes(n -> ColumnType.STRING));
    }

    @Test
    void exportAndReadBackKeepsExactAndFloatingValues() {
        Random rnd = new Random(7);
        List<List<Object>> rows = new ArrayList<>();
        for (int i = 0; i < 100; i++) {
            BigInteger omega = new BigInteger(200 + rnd.nextInt(400), rnd);
            BigFraction p = new BigFraction(BigInteger.valueOf(rnd.nextInt(1000) + 1), omega.add(BigInteger.ONE));
            double lnZ = rnd.nextGaussian() * Math.pow(10, rnd.nextInt(30) - 15);
            rows.add(List.of(i, omega, p, lnZ, "Halyard, \"block A\""));
        }
        Tabular t = of(List.of("E", "Omega", "P", "ln Z", "note"), rows);
        String csv = Csv.text(t);
        assertTrue(csv.startsWith("E,Omega,P,ln Z,note\n") || csv.startsWith("E,Omega,P,ln Z,note\r\n"), csv);
        Table back = readAsText(csv);
        assertEquals(100, back.rowCount());
        for (int r = 0; r < 100; r++) {
            List<Object> row = rows.get(r);
            assertEquals(row.get(0).toString(), back.stringColumn("E").get(r));
            assertEquals(row.get(1), new BigInteger(back.stringColumn("Omega").get(r)));
            assertEquals(row.get(2), Tables.exactFraction(back.stringColumn("P").get(r)));
            double lnZ = Double.parseDouble(back.stringColumn("ln Z").get(r));
            assertEquals(Double.doubleToLongBits((Double) row.get(3)), Double.doubleToLongBits(lnZ));
            assertEquals("Halyard, \"block A\"", back.stringColumn("note").get(r));
        }
    }

    @Test
    void fileIsReplacedAndNoTemporaryFileIsLeft(@TempDir Path dir) throws Exception {
        Path file = dir.resolve("out/levels.csv");
        Tabular first = of(List.of("a"), List.of(List.of(1), List.of(2)));
        Tabular second = of(List.of("b"), List.of(List.of(3)));
        Csv.write(first, file);
        assertEquals(List.of("a", "1", "2"), Files.readAllLines(file, StandardCharsets.UTF_8));
        Csv.write(second, file);
        assertEquals(List.of("b", "3"), Files.readAllLines(file, StandardCharsets.UTF_8));
        try (var s = Files.list(file.getParent())) {
            assertEquals(List.of(file.getFileName().toString()), s.map(p -> p.getFileName().toString()).toList());
        }
    }

    @Test
    void tablesawReadsOurFileByPath(@TempDir Path dir) {
        // Tablesaw's own file reading detects the charset with icu4j: this fails if icu4j is excluded.
        Path file = Csv.write(of(List.of("E", "Omega"), List.of(List.of(0, 1), List.of(1, 3))), dir.resolve("c.csv"));
        Table t = Table.read().csv(file.toString());
        assertEquals(2, t.rowCount());
        assertEquals(List.of("E", "Omega"), t.columnNames());
    }

    @Test
    void missingValuesAreEmptyFields() {
        List<List<Object>> rows = new ArrayList<>();
        rows.add(java.util.Arrays.asList(1, null));
        rows.add(java.util.Arrays.asList(null, 2.5));
        String csv = Csv.text(of(List.of("x", "y"), rows));
        assertEquals(List.of("x,y", "1,", ",2.5"), csv.lines().toList());
    }
}
