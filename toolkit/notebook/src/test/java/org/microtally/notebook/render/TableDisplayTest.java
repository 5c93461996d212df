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
        // Source: OEIS A000142 (100! has 158 digits, leading digits 933262154439)
        assertEquals("933262154439\u2026(158 digits)", cell.getTextContent());
        assertEquals(f.toString(), cell.getAttribute("title"));
        assertTrue(cell.getAttribute("class").contains("mt-cut"));
        Element small = (Element) d.getElementsByTagName("td").item(3);
        assertEquals("120", small.getTextContent()); // Source: 5! = 120, OEIS A000142
        assertFalse(small.hasAttribute("title"));
        assertEquals("mt-num", small.getAttribute("class"));
    }

    @Test
    void longTablesShowHeadAndTailAndStateTheTotal() throws Exception {
        TableFormat f = new TableFormat(40, 12, 8, 4, 2);
        Tabular t = numbered(1000);
        Document d = parse(TableDisplay.html(t, "squares", List.of(), f));
        NodeList trs = d.getElementsByTagName("tr");
        assertEquals(1 + 4 + 1 + 2, trs.getLength()); // header, head rows, gap line, tail rows
        assertEquals("mt-gap", ((Element) trs.item(5)).getAttribute("class"));
        assertEquals("\u2026 994 rows omitted \u2026", trs.item(5).getTextContent());
        assertEquals("998", ((Element) trs.item(6)).getElementsByTagName("td").item(0).getTextContent());
        assertEquals("999", ((Element) trs.item(7)).getElementsByTagName("td").item(0).getTextContent());
        NodeList notes = d.getElementsByTagName("p");
        assertEquals("1,000 rows \u00d7 3 columns; showing the first 4 and the last 2", notes.item(0).getTextContent());

        String plain = TableDisplay.plain(t, "squares", List.of("a note"), f);
        List<String> lines = plain.lines().toList();
        assertEquals("squares", lines.get(0));
        assertEquals(1 + 2 + 4 + 1 + 2 + 1 + 1, lines.size(), plain);
        assertEquals("\u2026 994 rows omitted \u2026", lines.get(7));
        assertEquals("(1,000 rows \u00d7 3 columns; showing the first 4 and the last 2)", lines.get(10));
        assertEquals("a note", lines.get(11));
    }

    @Test
    void tableJustOverTheLimitIsShownWhole() throws Exception {
        TableFormat f = new TableFormat(40, 12, 8, 4, 2);
        // head + tail + 1 rows: eliding one row would save nothing, so all 7 are shown
        Document d = parse(TableDisplay.html(numbered(7), null, List.of(), f));
        assertEquals(8, d.getElementsByTagName("tr").getLength());
        assertEquals(0, d.getElementsByTagName("p").getLength());
        Document d8 = parse(TableDisplay.html(numbered(8), null, List.of(), f));
        assertEquals(1 + 4 + 1 + 2, d8.getElementsByTagName("tr").getLength());
        Document all = parse(TableDisplay.html(numbered(5000), null, List.of(), f.allRows()));
        assertEquals(5001, all.getElementsByTagName("tr").getLength());
    }

    @Test
    void plainTextAlignsNumbersRightAndTextLeft() {
        Tabular t = TestTables.of(List.of("E", "Omega", "note"),
                new Object[] {0, BigInteger.ONE, "ground"}, new Object[] {10, BigInteger.valueOf(184756), "x"});
        String plain = TableDisplay.plain(t, null, null, TableFormat.DEFAULT);
        // Source: C(20,10) = 184756, OEIS A000984
        assertEquals(String.join("\n",
                " E   Omega  note",
                "--  ------  ------",
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
        Tabular t = new Tabular() {
            @Override
            public List<String> columnNames() {
                return List.of("a", "b");
            }

            @Override
            public List<List<Object>> rows() {
                return rows;
            }
        };
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
