package org.microtally.notebook.render;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.awt.GraphicsEnvironment;
import java.awt.image.BufferedImage;
import java.io.ByteArrayInputStream;
import java.io.StringReader;
import java.math.BigInteger;
import java.util.ArrayList;
import java.util.Base64;
import java.util.List;
import javax.imageio.ImageIO;
import javax.xml.parsers.DocumentBuilderFactory;
import org.junit.jupiter.api.Test;
import org.microtally.InvalidInputException;
import org.microtally.Tabular;
import org.microtally.spectrum.Spectra;
import org.microtally.spectrum.Spectrum;
import org.knowm.xchart.CategoryChart;
import org.knowm.xchart.XYChart;
import org.knowm.xchart.XYSeries;
import org.w3c.dom.Document;
import org.xml.sax.InputSource;

class ChartsTest {

    /** U and C of a two-level system (gap 1) vs kT, by its closed form. */
    static Tabular twoLevel() {
        List<Object[]> rows = new ArrayList<>();
        for (int i = 1; i <= 40; i++) {
            double t = 0.05 * i;
            double x = 1 / t;
            // Source: closed form for a two-level system with gap 1 (Schottky anomaly):
            // U = 1/(e^{1/kT} + 1), C = (1/kT)^2 e^{1/kT} / (e^{1/kT} + 1)^2
            double u = 1 / (Math.exp(x) + 1);
            double c = x * x * Math.exp(x) / Math.pow(Math.exp(x) + 1, 2);
            rows.add(new Object[] {t, u, c});
        }
        return TestTables.of(List.of("kT", "U", "C"), rows.toArray(new Object[0][]));
    }

    static BufferedImage decode(byte[] png) throws Exception {
        return ImageIO.read(new ByteArrayInputStream(png));
    }

    @Test
    void renderingIsHeadless() {
        Renderers.standard();
        Charts.png(Charts.line(twoLevel(), "kT", "U"));
        assertTrue(GraphicsEnvironment.isHeadless());
        assertEquals("true", System.getProperty("java.awt.headless"));
    }

    @Test
    void pngDecodesToTheRequestedSize() throws Exception {
        XYChart chart = Charts.line(twoLevel(), "kT", "U", "C");
        BufferedImage img = decode(Charts.png(chart));
        // PNG on request is drawn at twice the chart size, for high-resolution screens
        assertEquals(2 * Charts.WIDTH, img.getWidth());
        assertEquals(2 * Charts.HEIGHT, img.getHeight());
        XYChart small = Charts.scatter(twoLevel(), "kT", "C");
        small = resized(small, 320, 200);
        BufferedImage img2 = decode(Charts.png(small));
        assertEquals(640, img2.getWidth());
        assertEquals(400, img2.getHeight());
    }

    private static XYChart resized(XYChart chart, int w, int h) {
        XYChart c = new org.knowm.xchart.XYChartBuilder().width(w).height(h).build();
        for (XYSeries s : chart.getSeriesCollection()) {
            c.addSeries(s.getName(), s.getXData(), s.getYData());
        }
        return Charts.style(c);
    }

    @Test
    void firstSeriesIsDrawnInOurFirstColour() throws Exception {
        BufferedImage img = decode(Charts.png(Charts.line(twoLevel(), "kT", "U")));
        int teal = Charts.PALETTE.get(0).getRGB() & 0xffffff;
        int count = 0;
        for (int y = 0; y < img.getHeight(); y++) {
            for (int x = 0; x < img.getWidth(); x++) {
                if ((img.getRGB(x, y) & 0xffffff) == teal) {
                    count++;
                }
            }
        }
        assertTrue(count > 100, "pixels in the first palette colour: " + count);
    }

    @Test
    void svgIsWellFormedXmlWithTheChartSize() throws Exception {
        String svg = Charts.svg(Charts.line(twoLevel(), "kT", "U", "C"));
        DocumentBuilderFactory f = DocumentBuilderFactory.newInstance();
        f.setNamespaceAware(true);
        f.setFeature("http://apache.org/xml/features/nonvalidating/load-external-dtd", false);
        Document d = f.newDocumentBuilder().parse(new InputSource(new StringReader(svg)));
        assertEquals("svg", d.getDocumentElement().getLocalName());
        assertEquals("http://www.w3.org/2000/svg", d.getDocumentElement().getNamespaceURI());
        assertEquals("640", d.getDocumentElement().getAttribute("width"));
        assertEquals("0 0 640 400", d.getDocumentElement().getAttribute("viewBox"));
        // bare element: no XML declaration or DOCTYPE, which Jupyter's exporter cannot take inline
        assertTrue(svg.startsWith("<svg "), svg.substring(0, 40));
        assertFalse(svg.contains("<?xml") || svg.contains("<!DOCTYPE"));
    }

    @Test
    void markupInNamesCannotGetIntoTheSvg() throws Exception {
        String evil = "y <script>alert(1)</script>";
        Tabular t = TestTables.of(List.of("x <&>", evil), new Object[] {1, 2.0}, new Object[] {2, 3.0});
        XYChart chart = Charts.line(t, "x <&>", evil);
        chart.setTitle("T \"q\" <i>");
        String svg = Charts.svg(chart);
        assertFalse(svg.contains("<script"), "script element in SVG");
        DocumentBuilderFactory f = DocumentBuilderFactory.newInstance();
        f.setFeature("http://apache.org/xml/features/nonvalidating/load-external-dtd", false);
        Document d = f.newDocumentBuilder().parse(new InputSource(new StringReader(svg)));
        assertEquals(0, d.getElementsByTagName("script").getLength());
    }

    @Test
    void seriesHoldTheTableValues() {
        Tabular t = twoLevel();
        XYChart chart = Charts.line(t, "kT", "U", "C");
        XYSeries c = chart.getSeries("C");
        assertEquals(40, c.getXData().length);
        for (int r = 0; r < 40; r++) {
            assertEquals((Double) t.rows().get(r).get(0), c.getXData()[r]);
            assertEquals((Double) t.rows().get(r).get(2), c.getYData()[r]);
        }
        assertEquals("kT", chart.getXAxisTitle());
    }

    @Test
    void missingCellsAreLeftOut() {
        Tabular t = TestTables.of(List.of("x", "y"), new Object[] {1, 2.0}, new Object[] {2, null},
                new Object[] {3, 4.0});
        XYSeries s = Charts.scatter(t, "x", "y").getSeries("y");
        assertArrayEquals(new double[] {1, 3}, s.getXData());
        assertArrayEquals(new double[] {2, 4}, s.getYData());
    }

    @Test
    void barsOfAHistogram() throws Exception {
        // Multiplicity of k up spins among 20 spin-1/2 moments (a two-state paramagnet): C(20, k).
        Object[][] rows = new Object[21][];
        for (int k = 0; k <= 20; k++) {
            rows[k] = new Object[] {k, ResultDisplaysTest.binomial(20, k)};
        }
        CategoryChart chart = Charts.bars(TestTables.of(List.of("up spins", "Omega"), rows), "up spins", "Omega");
        double[] ys = chart.getSeries("Omega").getYData();
        // Source: OEIS A007318 (Pascal's triangle), row 20: 1, 20, 190, 1140, ..., 184756 at k = 10
        assertEquals(1.0, ys[0]);
        assertEquals(20.0, ys[1]);
        assertEquals(190.0, ys[2]);
        assertEquals(1140.0, ys[3]);
        assertEquals(184756.0, ys[10]);
        assertEquals(ys[7], ys[13]);
        // one bar per category: 21 closed rectangles in the series path
        assertEquals(21, SvgChartTest.pathWithFill(Charts.svg(chart), "#1f5f6b").chars().filter(c -> c == 'z').count());
    }

    @Test
    void spectrumSticksRiseToTheDegeneracies() throws Exception {
        Spectrum s = Spectra.harmonicOscillator(3, 5);
        XYChart chart = SpectrumCharts.levels(s);
        XYSeries levels = chart.getSeries("levels");
        assertEquals("energy [hbar*omega]", chart.getXAxisTitle());
        for (int n = 0; n <= 5; n++) {
            assertEquals(n, levels.getXData()[3 * n + 1]);
            // Source: closed form, 3D isotropic oscillator degeneracy g_n = (n+1)(n+2)/2
            assertEquals((n + 1) * (n + 2) / 2.0, levels.getYData()[3 * n + 1]);
            assertEquals(0.0, levels.getYData()[3 * n]);
        }
        assertEquals(2 * Charts.HEIGHT, decode(Charts.png(chart)).getHeight());
    }

    @Test
    void tooLargeExactValueIsRefusedNamingRowAndColumn() {
        Tabular t = TestTables.of(List.of("E", "Omega"), new Object[] {0, BigInteger.ONE},
                new Object[] {1, BigInteger.TEN.pow(400)});
        InvalidInputException e = assertThrows(InvalidInputException.class, () -> Charts.line(t, "E", "Omega"));
        assertTrue(e.getMessage().contains("row 1"), e.getMessage());
        assertTrue(e.getMessage().contains("'Omega'"), e.getMessage());
        assertTrue(e.getMessage().contains("(401 digits)"), e.getMessage());
        assertTrue(e.getMessage().contains("logarithm"), e.getMessage());
    }

    @Test
    void exactFractionsOfHugeIntegersArePlottedAtTheirValue() {
        BigInteger big = BigInteger.TEN.pow(400);
        Tabular t = TestTables.of(List.of("q_A", "probability"),
                new Object[] {0, new org.apache.commons.math3.fraction.BigFraction(big, big.multiply(BigInteger.TEN).add(BigInteger.ONE))},
                new Object[] {1, new org.apache.commons.math3.fraction.BigFraction(BigInteger.ONE, big)});
        XYSeries s = Charts.line(t, "q_A", "probability").getSeries("probability");
        // Source: closed form, 10^400/(10^401 + 1) = 0.1 to double precision; 10^-400 underflows to 0
        assertEquals(0.1, s.getYData()[0]);
        assertEquals(0.0, s.getYData()[1]);
    }

    @Test
    void unknownColumnIsNamed() {
        InvalidInputException e = assertThrows(InvalidInputException.class,
                () -> Charts.line(twoLevel(), "kT", "S"));
        assertTrue(e.getMessage().contains("'S'") && e.getMessage().contains("[kT, U, C]"), e.getMessage());
    }

    @Test
    void combinedBundleShowsTableThenChart() throws Exception {
        Tabular t = twoLevel();
        MimeBundle table = TableDisplay.bundle(t, "two-level", List.of());
        MimeBundle both = Charts.combine(table, Charts.line(t, "kT", "C"));
        assertTrue(both.plain().startsWith(table.plain() + "\n"), both.plain());
        assertTrue(both.plain().endsWith("chart (640\u00d7400 px): series C"), both.plain());
        Document d = TableDisplayTest.parse(both.get(MimeBundle.TEXT_HTML));
        assertEquals(1, d.getElementsByTagName("table").getLength());
        assertEquals(1, d.getElementsByTagName("svg").getLength());
        assertEquals(0, d.getElementsByTagName("img").getLength());
        String html = both.get(MimeBundle.TEXT_HTML);
        assertTrue(html.indexOf("<table") < html.indexOf("<svg"), "table first, then the chart");
    }

    @Test
    void groupedChartHasOneSeriesPerGroup() throws Exception {
        Tabular t = TestTables.of(List.of("ensemble", "kT", "U"),
                new Object[] {"canonical", 0.5, 1.0}, new Object[] {"grand canonical", 0.5, 1.2},
                new Object[] {"canonical", 1.0, 2.0}, new Object[] {"grand canonical", 1.0, 2.1},
                new Object[] {"canonical", 2.0, null});
        XYChart chart = Charts.grouped(t, "ensemble", "kT", "U");
        assertEquals(List.of("canonical", "grand canonical"),
                chart.getSeriesCollection().stream().map(XYSeries::getName).toList());
        assertArrayEquals(new double[] {0.5, 1.0}, chart.getSeries("canonical").getXData());
        assertArrayEquals(new double[] {1.2, 2.1}, chart.getSeries("grand canonical").getYData());
        MimeBundle both = Charts.combine(TableDisplay.bundle(t, null, List.of()), chart, Charts.scatter(t, "kT", "U"));
        Document d = TableDisplayTest.parse(both.get(MimeBundle.TEXT_HTML));
        assertEquals(2, d.getElementsByTagName("svg").getLength());
        assertEquals(2, both.plain().lines().filter(l -> l.startsWith("chart (")).count());
    }

    @Test
    void bundleCarriesOneInlineSvgAndText() throws Exception {
        MimeBundle b = Charts.bundle(Charts.line(twoLevel(), "kT", "U", "C"));
        assertEquals("chart (640\u00d7400 px): series U, C", b.plain());
        assertEquals(java.util.Set.of(MimeBundle.TEXT_PLAIN, MimeBundle.TEXT_HTML), b.data().keySet());
        Document d = TableDisplayTest.parse(b.get(MimeBundle.TEXT_HTML));
        assertEquals(1, d.getElementsByTagName("svg").getLength());
    }

    @Test
    void pngOnRequestIsTwiceTheSizeShownAtTheChartSize() throws Exception {
        MimeBundle b = Charts.asPng(Charts.line(twoLevel(), "kT", "U"));
        BufferedImage img = decode(Base64.getDecoder().decode(b.get(MimeBundle.IMAGE_PNG)));
        assertEquals(800, img.getHeight());
        Document d = TableDisplayTest.parse(b.get(MimeBundle.TEXT_HTML));
        org.w3c.dom.Element el = (org.w3c.dom.Element) d.getElementsByTagName("img").item(0);
        assertEquals("400", el.getAttribute("height"));
    }
}
