package org.microtally.notebook.render;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.math.BigInteger;
import java.util.List;
import java.util.Random;
import org.apache.commons.math3.fraction.BigFraction;
import org.junit.jupiter.api.Test;
import org.microtally.InvalidInputException;
import org.microtally.Tabular;
import org.microtally.spectrum.Spectra;
import org.microtally.spectrum.Spectrum;
import tech.tablesaw.api.ColumnType;
import tech.tablesaw.api.Table;

class TablesTest {

    @Test
    void columnTypesFollowTheCells() {
        Tabular t = TestTables.of(List.of("i", "l", "d", "mixed", "b", "s", "big", "frac", "hugeLongWithDouble"),
                new Object[] {1, 1L, 0.5, 1, true, "a", BigInteger.TEN.pow(50), new BigFraction(1, 3), 1L << 60},
                new Object[] {2, 1L << 40, 1.5, 2.5, false, "b", BigInteger.ONE, new BigFraction(2), 0.5});
        Table table = Tables.of(t, "types");
        assertEquals("types", table.name());
        assertEquals(ColumnType.INTEGER, table.column("i").type());
        assertEquals(ColumnType.LONG, table.column("l").type());
        assertEquals(ColumnType.DOUBLE, table.column("d").type());
        assertEquals(ColumnType.DOUBLE, table.column("mixed").type());
        assertEquals(ColumnType.BOOLEAN, table.column("b").type());
        assertEquals(ColumnType.STRING, table.column("s").type());
        assertEquals(ColumnType.STRING, table.column("big").type());
        assertEquals(ColumnType.STRING, table.column("frac").type());
        // 2^60 is not exactly a double neighbour-free value above 2^53: kept as text, not rounded
        assertEquals(ColumnType.STRING, table.column("hugeLongWithDouble").type());
        assertEquals(Long.toString(1L << 60), table.stringColumn("hugeLongWithDouble").get(0));
    }

    @Test
    void roundTripKeepsEveryValueExactly() {
        Random rnd = new Random(42);
        int n = 200;
        Object[][] rows = new Object[n][];
        for (int i = 0; i < n; i++) {
            BigInteger big = new BigInteger(300 + rnd.nextInt(300), rnd);
            BigFraction frac = new BigFraction(new BigInteger(100, rnd).add(BigInteger.ONE),
                    new BigInteger(100, rnd).add(BigInteger.ONE));
            rows[i] = new Object[] {i, rnd.nextLong(), rnd.nextGaussian() * Math.pow(10, rnd.nextInt(40) - 20), big, frac,
                rnd.nextBoolean(), "row " + i};
        }
        Tabular t = TestTables.of(List.of("i", "l", "d", "big", "frac", "b", "s"), rows);
        Table table = Tables.of(t);
        Tabular back = Tables.asTabular(table);
        assertEquals(t.columnNames(), back.columnNames());
        assertEquals(n, back.rows().size());
        for (int r = 0; r < n; r++) {
            List<Object> a = t.rows().get(r);
            List<Object> b = back.rows().get(r);
            assertEquals(a.get(0), b.get(0));
            assertEquals(a.get(1), b.get(1));
            assertEquals(Double.doubleToLongBits((Double) a.get(2)), Double.doubleToLongBits((Double) b.get(2)));
            assertEquals(a.get(3), new BigInteger((String) b.get(3)));
            assertEquals(a.get(4), Tables.exactFraction((String) b.get(4)));
            assertEquals(a.get(5), b.get(5));
            assertEquals(a.get(6), b.get(6));
        }
    }

    @Test
    void nullCellsBecomeMissingAndComeBackAsNull() {
        Tabular t = TestTables.of(List.of("x", "y"), new Object[] {1, null}, new Object[] {null, 2.0});
        Table table = Tables.of(t);
        assertEquals(1, table.column("x").countMissing());
        assertEquals(1, table.column("y").countMissing());
        Tabular back = Tables.asTabular(table);
        assertNull(back.rows().get(0).get(1));
        assertNull(back.rows().get(1).get(0));
        assertEquals(1, back.rows().get(0).get(0));
    }

    @Test
    void notAvailableMarkersAreMissingValues() {
        Tabular t = TestTables.of(List.of("beta"), new Object[] {"n/a"}, new Object[] {0.5}, new Object[] {-0.25});
        Table table = Tables.of(t);
        assertEquals(ColumnType.DOUBLE, table.column("beta").type());
        assertEquals(1, table.column("beta").countMissing());
        assertEquals(-0.25, table.doubleColumn("beta").get(2));
        String plain = TableDisplay.plain(t, null, List.of(), TableFormat.DEFAULT);
        // one format per column: two decimals for every value, points aligned
        assertEquals(List.of(" beta", "\u2500\u2500\u2500\u2500\u2500", "  n/a", " 0.50", "-0.25"), plain.lines().toList());
        var series = Charts.scatter(TestTables.of(List.of("E", "beta"), new Object[] {1, "n/a"}, new Object[] {2, 0.5}),
                "E", "beta").getSeries("beta");
        assertEquals(1, series.getXData().length);
    }

    @Test
    void spectrumTableHasLevelsInOrder() {
        // Source: closed form, 3D isotropic oscillator degeneracy g_n = (n+1)(n+2)/2
        Spectrum s = Spectra.harmonicOscillator(3, 6);
        Table table = Tables.of(s);
        assertEquals(List.of("energy", "degeneracy"), table.columnNames());
        assertEquals(7, table.rowCount());
        for (int n = 0; n <= 6; n++) {
            assertEquals(n, table.doubleColumn("energy").get(n));
            assertEquals((n + 1) * (n + 2) / 2, table.intColumn("degeneracy").get(n));
        }
        Table labelled = Tables.of(Spectra.spinInField(1.5));
        assertEquals(List.of("energy", "degeneracy", "label"), labelled.columnNames());
        assertEquals(3, labelled.intColumn("label").get(0)); // 2m for m = J = 3/2
    }

    @Test
    void badFractionTextIsRejectedWithItsValue() {
        InvalidInputException e = assertThrows(InvalidInputException.class, () -> Tables.exactFraction("1/x"));
        assertTrue(e.getMessage().contains("\"1/x\""), e.getMessage());
        assertThrows(InvalidInputException.class, () -> Tables.exactFraction("1/0"));
        assertEquals(new BigFraction(-3, 4), Tables.exactFraction(" -6/8 "));
    }
}
