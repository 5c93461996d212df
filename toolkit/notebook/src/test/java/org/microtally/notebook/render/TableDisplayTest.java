package org.microtally.notebook.render;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.StringReader;
import java.math.BigInteger;
import java.util.ArrayList;
import java.util.List;
import javax.xml.parsers.DocumentBuilderFactory;
import org.apache.commons.math3.fraction.BigFraction;
import org.junit.jupiter.api.Test;
import org.microtally.InvalidInputException;
import org.microtally.Tabular;
import org.w3c.dom.Document;
import org.w3c.dom.Element;
import org.w3c.dom.NodeList;
import org.xml.sax.InputSource;

class TableDisplayTest {

    /** Our HTML is also well-formed XML; parse it so tests look at structure, not substrings. */
    static Document parse(String html) throws Exception {
        DocumentBuilderFactory f = DocumentBuilderFactory.newInstance();
        f.setFeature("http://apache.org/xml/features/disallow-doctype-decl", true);
        return f.newDocumentBuilder().parse(new InputSource(new StringReader("<root>" + html + "</root>")));
    }

    /** The text of the caption element. */
    static String caption(Document d) {
        NodeList divs = d.getElementsByTagName("div");
        for (int i = 0; i < divs.getLength(); i++) {
            Element e = (Element) divs.item(i);
            if (e.getAttribute("class").equals("mt-caption")) {
                return e.getTextContent();
            }
        }
        return null;
    }

    static Tabular numbered(int n) {
        Object[][] rows = new Object[n][];
        for (int i = 0; i < n; i++) {
            rows[i] = new Object[] {i, (double) i * i, "r" + i};
        }
        return TestTables.of(List.of("n", "n^2", "name"), rows);
    }

    @Test
    void scriptInCellsHeaderCaptionAndNotesIsEscaped() throws Exception {
        String evil = "<script>alert('x')</script>";
        Tabular t = TestTables.of(List.of(evil, "b & c"), new Object[] {evil, "\"quoted\" & <b>"});
        String html = TableDisplay.html(t, evil, List.of(evil), TableFormat.DEFAULT);
        assertFalse(html.contains("<script>"), html);
        assertTrue(html.contains("&lt;script&gt;alert(&#39;x&#39;)&lt;/script&gt;"), html);
        Document d = parse(html);
        assertEquals(0, d.getElementsByTagName("script").getLength());
        assertEquals(0, d.getElementsByTagName("b").getLength());
        NodeList tds = d.getElementsByTagName("td");
        assertEquals(evil, tds.item(0).getTextContent());
        assertEquals("\"quoted\" & <b>", tds.item(1).getTextContent());
        assertEquals(evil, caption(d));
        assertEquals(evil, d.getElementsByTagName("th").item(0).getTextContent());
    }

    @Test
    void abbreviatedBigIntegerCarriesItsFullValueInTheTitle() throws Exception {
        BigInteger f = CellTextTest.factorial(100);
        Tabular t = TestTables.of(List.of("N", "N!"), new Object[] {100, f}, new Object[] {5, BigInteger.valueOf(120)});
        Document d = parse(TableDisplay.html(t, null, List.of(), TableFormat.DEFAULT));
        Element cell = (Element) d.getElementsByTagName("td").item(1);
        // Source: OEIS A000142 (100! = 9.33262154439...e157, 158 digits); the column holds a number longer
        // than maxDigits, so all of it is scientific (one format per column), 5! = 120 as 1.20000e+002
        assertEquals("9.33262e+157", cell.getTextContent());
        assertEquals(f.toString(), cell.getAttribute("title"));
        assertTrue(cell.getAttribute("class").contains("mt-cut"));
        Element small = (Element) d.getElementsByTagName("td").item(3);
        assertEquals("1.20000e+002", small.getTextContent());
        assertEquals("120", small.getAttribute("title"));
        assertEquals("mt-num", small.getAttribute("class"));   // not rounded, so not marked as shortened
        Element n = (Element) d.getElementsByTagName("td").item(2);
        assertEquals("5", n.getTextContent());
        assertFalse(n.hasAttribute("title"));
        assertEquals("mt-num", n.getAttribute("class"));
    }

    @Test
    void aColumnOfWholeNumbersThatAllFitIsShownDigitForDigit() {
        // Source: C(40, 20) = 137846528820, OEIS A000984; 12 digits fit maxDigits = 40
        Tabular t = TestTables.of(List.of("n", "C(2n, n)"), new Object[] {1, BigInteger.TWO},
                new Object[] {20, new BigInteger("137846528820")});
        List<String> lines = TableDisplay.plain(t, null, List.of(), TableFormat.DEFAULT).lines().toList();
        assertEquals(" 1             2", lines.get(2));
        assertEquals("20  137846528820", lines.get(3));
    }

    @Test
    void wholeNumbersNextToTooLongOnesBecomeOneScientificColumn() {
        // Source: OEIS A000984, C(2n, n): C(10,5) = 252, C(200,100) = 9.05485146561...e58 (59 digits);
        // maxDigits 20 (the count grid's format) makes the second too long, so the column is scientific
        Tabular t = TestTables.of(List.of("n", "C(2n, n)"), new Object[] {5, BigInteger.valueOf(252)},
                new Object[] {100, CellTextTest.factorial(200).divide(CellTextTest.factorial(100).pow(2))},
                new Object[] {0, BigInteger.ONE});
        List<String> lines = TableDisplay.plain(t, null, List.of(), ResultDisplays.GRID_FORMAT).lines().toList();
        assertEquals(List.of("  5  2.52000e+02", "100  9.05485e+58", "  0  1.00000e+00"), lines.subList(2, 5));
        for (String l : lines) {
            assertFalse(l.contains("\u2026"), l);
        }
    }

    @Test
    void fractionsTooLongToShowMakeTheirWholeColumnOneApproximateFormat() {
        // Source: closed form, 1/3 = 0.333..., 1/(3 * 10^50) = 3.333...e-51, 2/7 = 0.285714...
        BigFraction tiny = new BigFraction(BigInteger.ONE, BigInteger.valueOf(3).multiply(BigInteger.TEN.pow(50)));
        Tabular t = TestTables.of(List.of("case", "p", "small"), new Object[] {"a", new BigFraction(1, 3), new BigFraction(1, 3)},
                new Object[] {"b", tiny, new BigFraction(2, 7)});
        List<String> lines = TableDisplay.plain(t, null, List.of(), TableFormat.DEFAULT).lines().toList();
        assertEquals("a     \u22483.33333e-01    1/3", lines.get(2));
        assertEquals("b     \u22483.33333e-51    2/7", lines.get(3));
    }

    @Test
    void floatingColumnWithExponentZeroKeepsTheSignedTwoDigitExponent() {
        // Source: ISO/IEC 9899:2018 7.21.6.1 (%e: a sign and at least two exponent digits); the column
        // spans 1e-3 to 1e3 (more than significantDigits - 3 decades), so it is scientific
        Tabular t = TestTables.of(List.of("rho_c", "R"), new Object[] {1e6, 1666.74}, new Object[] {1e11, 2.5},
                new Object[] {1e8, 0.00125});
        List<String> lines = TableDisplay.plain(t, null, List.of(), TableFormat.DEFAULT).lines().toList();
        assertEquals(List.of("1e+06  1.66674e+03", "1e+11  2.50000e+00", "1e+08  1.25000e-03"), lines.subList(2, 5));
    }

    @Test
    void longTableWithoutAPeakShowsItsStartAndEndAndSaysHowToSeeAll() throws Exception {
        TableFormat f = new TableFormat(40, 12, 8, 10, 4);   // shortened above 10 rows; window 4, edges 1
        Tabular t = numbered(1000);                          // n^2 grows: its largest value is the last row
        Document d = parse(TableDisplay.html(t, "squares", List.of(), f));
        NodeList trs = d.getElementsByTagName("tr");
        assertEquals(1 + 4 + 1 + 1, trs.getLength()); // header, first 4 rows, gap, last row
        assertEquals("mt-gap", ((Element) trs.item(5)).getAttribute("class"));
        assertEquals("\u22ee 995 rows not shown", trs.item(5).getTextContent());
        assertEquals("999", ((Element) trs.item(6)).getElementsByTagName("td").item(0).getTextContent());
        NodeList notes = d.getElementsByTagName("p");
        assertEquals("5 of 1,000 rows shown: the first 4 and the last 1. Every row: show(Tables.allRows(table)).",
                notes.item(0).getTextContent());
        String plain = TableDisplay.plain(t, "squares", List.of("a note"), f);
        List<String> lines = plain.lines().toList();
        assertEquals("squares", lines.get(0));
        assertEquals("  \u22ee 995 rows not shown", lines.get(7));
        assertEquals("a note", lines.get(lines.size() - 1));
    }

    @Test
    void longTableIsShortenedAroundThePeakOfItsMainColumn() throws Exception {
        // Omega_A(q) Omega_B(100 - q) for Einstein solids of 300 and 200 oscillators peaks at q = 60
        Object[][] rows = new Object[101][];
        for (int q = 0; q <= 100; q++) {
            rows[q] = new Object[] {q, ResultDisplaysTest.binomial(q + 299, q).multiply(ResultDisplaysTest.binomial(100 - q + 199, 100 - q))};
        }
        Tabular t = TestTables.of(List.of("q_A", "Omega"), rows);
        Document d = parse(TableDisplay.html(t, null, List.of(), TableFormat.DEFAULT));
        NodeList trs = d.getElementsByTagName("tr");
        List<String> firstCells = new java.util.ArrayList<>();
        for (int i = 1; i < trs.getLength(); i++) {
            firstCells.add(((Element) trs.item(i)).getElementsByTagName("td").item(0).getTextContent());
        }
        // Source: closed form, the most probable split q_A = q N_A / N rounded: 100 * 300 / 500 = 60
        assertTrue(firstCells.contains("60"), firstCells.toString());
        assertTrue(firstCells.contains("0") && firstCells.contains("100"), firstCells.toString());
        assertEquals(30, firstCells.stream().filter(c -> c.matches("[0-9]+")).count(), firstCells.toString());
        assertTrue(d.getElementsByTagName("p").item(0).getTextContent().contains("around the largest 'Omega' (row 61)"));
    }

    @Test
    void tableAtTheLimitIsShownWholeAndAllRowsShowsEverything() throws Exception {
        TableFormat f = new TableFormat(40, 12, 8, 10, 4);
        Document d = parse(TableDisplay.html(numbered(10), null, List.of(), f));
        assertEquals(11, d.getElementsByTagName("tr").getLength());
        assertEquals(0, d.getElementsByTagName("p").getLength());
        Document all = parse(TableDisplay.html(numbered(5000), null, List.of(), f.allRows()));
        assertEquals(5001, all.getElementsByTagName("tr").getLength());
        Document shown = parse(Renderers.render(Tables.allRows(numbered(200))).get(MimeBundle.TEXT_HTML));
        assertEquals(201, shown.getElementsByTagName("tr").getLength());
    }

    @Test
    void floatingColumnsShareOneFormat() {
        Tabular t = TestTables.of(List.of("T/T_c0", "atoms omitted"), new Object[] {0.1, 6.8172413e-7},
                new Object[] {0.15, 0.00019161266}, new Object[] {1.2, 0.11190341});
        List<String> lines = TableDisplay.plain(t, null, List.of(), TableFormat.DEFAULT).lines().toList();
        // common practice, no source: one exponent style and one mantissa width per column, points aligned
        assertEquals(List.of("T/T_c0  atoms omitted", "\u2500\u2500\u2500\u2500\u2500\u2500  \u2500\u2500\u2500\u2500\u2500\u2500\u2500\u2500\u2500\u2500\u2500\u2500\u2500",
                "  0.10    6.81724e-07", "  0.15    1.91613e-04", "  1.20    1.11903e-01"), lines);
    }

    @Test
    void plainTextAlignsNumbersRightAndTextLeft() {
        Tabular t = TestTables.of(List.of("E", "Omega", "note"),
                new Object[] {0, BigInteger.ONE, "ground"}, new Object[] {10, BigInteger.valueOf(184756), "x"});
        String plain = TableDisplay.plain(t, null, null, TableFormat.DEFAULT);
        // Source: C(20,10) = 184756, OEIS A000984
        assertEquals(String.join("\n",
                " E   Omega  note",
                "\u2500\u2500  \u2500\u2500\u2500\u2500\u2500\u2500  \u2500\u2500\u2500\u2500\u2500\u2500",
                " 0       1  ground",
                "10  184756  x"), plain);
    }

    @Test
    void emptyTableSaysSo() throws Exception {
        Tabular t = TestTables.of(List.of("a", "b"));
        assertTrue(TableDisplay.plain(t, null, List.of(), TableFormat.DEFAULT).endsWith("(no rows)"));
        Document d = parse(TableDisplay.html(t, null, List.of(), TableFormat.DEFAULT));
        assertEquals("(no rows)", d.getElementsByTagName("p").item(0).getTextContent());
    }

    @Test
    void rowWithWrongCellCountIsReported() {
        List<List<Object>> rows = new ArrayList<>();
        rows.add(List.of(1, 2));
        rows.add(List.of(3));
        Tabular t = Tabular.of(List.of("a", "b"), rows);
        InvalidInputException e = assertThrows(InvalidInputException.class,
                () -> TableDisplay.plain(t, null, List.of(), TableFormat.DEFAULT));
        assertTrue(e.getMessage().contains("row 1"), e.getMessage());
    }

    @Test
    void bundleHasPlainAndHtml() {
        MimeBundle b = TableDisplay.bundle(numbered(3), "c", List.of());
        assertTrue(b.has(MimeBundle.TEXT_PLAIN));
        assertTrue(b.get(MimeBundle.TEXT_HTML).contains("<table class=\"mt-table\">"));
        assertEquals(List.of(MimeBundle.TEXT_PLAIN, MimeBundle.TEXT_HTML), List.copyOf(b.data().keySet()));
    }
}
