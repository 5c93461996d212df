package org.microtally.notebook.render;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertSame;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.awt.Color;
import java.awt.image.BufferedImage;
import java.io.ByteArrayInputStream;
import java.math.BigInteger;
import java.util.ArrayList;
import java.util.Base64;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.stream.IntStream;
import java.util.stream.Stream;
import javax.imageio.ImageIO;
import org.apache.commons.math3.fraction.BigFraction;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import org.microtally.Tabular;
import org.microtally.spectrum.Spectra;
import org.microtally.spectrum.Spectrum;
import org.microtally.units.Energy;
import org.microtally.units.EnergyUnit;
import tech.tablesaw.api.DoubleColumn;
import tech.tablesaw.api.IntColumn;
import tech.tablesaw.api.Table;

class RenderersTest {

    static Stream<Arguments> values() {
        BufferedImage img = new BufferedImage(30, 20, BufferedImage.TYPE_INT_RGB);
        return Stream.of(null, "plain", 42, BigInteger.TEN.pow(200), new BigFraction(3, 7), 2.5,
                new Html("<b>x</b>"), new Markdown("# title"), Latex.of("\\Omega"),
                TestTables.of(List.of("a"), new Object[] {1}),
                Table.create("t", IntColumn.create("n", 1, 2)),
                Spectra.harmonicOscillator(2, 4), Energy.of(3, EnergyUnit.MILLIELECTRONVOLT),
                new int[] {1, 2, 3}, new double[][] {{1.5}, {2.5}}, new String[0],
                List.of(1, 2), Map.of("k", 1), new Object(), img,
                Charts.line(ChartsTest.twoLevel(), "kT", "U"), MimeBundle.text("as is"))
                .map(v -> Arguments.of((Object) v)); // one argument each, arrays included
    }

    @ParameterizedTest
    @MethodSource("values")
    void everyBundleHasPlainText(Object value) {
        MimeBundle b = Renderers.render(value);
        assertNotNull(b);
        assertTrue(b.has(MimeBundle.TEXT_PLAIN));
        assertFalse(b.plain().contains("rich display failed"), b.plain());
    }

    @Test
    void nullAndStringsArePlainText() {
        assertEquals(MimeBundle.text("null"), Renderers.render(null));
        MimeBundle b = Renderers.render("<b>not markup</b>");
        assertEquals(List.of(MimeBundle.TEXT_PLAIN), List.copyOf(b.data().keySet()));
        assertEquals("<b>not markup</b>", b.plain());
    }

    @Test
    void wrappersCarryTheirMimeType() {
        MimeBundle h = Renderers.render(new Html("<p>U &amp; C<br>of <i>N</i> = 42</p>"));
        assertEquals("<p>U &amp; C<br>of <i>N</i> = 42</p>", h.get(MimeBundle.TEXT_HTML));
        assertEquals("U & C\nof N = 42", h.plain());
        MimeBundle m = Renderers.render(new Markdown("**bold**"));
        assertEquals("**bold**", m.get(MimeBundle.TEXT_MARKDOWN));
        MimeBundle l = Renderers.render(Latex.of("\\Omega(N, q) = \\binom{q + N - 1}{q}"));
        assertEquals("$$\\Omega(N, q) = \\binom{q + N - 1}{q}$$", l.get(MimeBundle.TEXT_LATEX));
        MimeBundle given = MimeBundle.text("x");
        assertSame(given, Renderers.render(given));
    }

    @Test
    void spectrumShowsItsLevelsAndCutoffNote() {
        Spectrum s = Spectra.harmonicOscillator(2, 3);
        MimeBundle b = Renderers.render(s);
        // Source: closed form, 2D isotropic oscillator degeneracy g_n = n + 1; 1+2+3+4 = 10 states
        assertTrue(b.plain().startsWith("Spectrum: 4 levels, 10 states, energies in hbar*omega, cut off above 3"),
                b.plain());
        assertTrue(b.plain().contains("Cutoff: levels above 3 quanta omitted"), b.plain());
        List<String> lines = b.plain().lines().toList();
        assertEquals("energy  degeneracy", lines.get(1));
        assertEquals("     3           4", lines.get(6));
        assertTrue(b.get(MimeBundle.TEXT_HTML).contains("<div class=\"mt-caption\">Spectrum: 4 levels"));
    }

    @Test
    void energyHasTextAndLatex() {
        MimeBundle b = Renderers.render(Energy.of(3, EnergyUnit.MILLIELECTRONVOLT));
        assertEquals("3 meV", b.plain());
        assertEquals("$3\\ \\mathrm{meV}$", b.get(MimeBundle.TEXT_LATEX));
        MimeBundle w = Renderers.render(Energy.of(1.5e-3, EnergyUnit.WAVENUMBER));
        assertEquals("$0.0015\\ \\mathrm{cm}^{-1}$", w.get(MimeBundle.TEXT_LATEX));
        MimeBundle k = Renderers.render(Energy.of(2.5e-9, EnergyUnit.KELVIN));
        assertEquals("$2.5 \\times 10^{-9}\\ \\mathrm{K}$", k.get(MimeBundle.TEXT_LATEX));
    }

    @Test
    void bigIntegerValueIsShownInFull() {
        BigInteger f = CellTextTest.factorial(100);
        assertEquals(f.toString(), Renderers.render(f).plain());
        MimeBundle q = Renderers.render(new BigFraction(-3, 7));
        assertEquals("-3/7", q.plain());
        assertEquals("$-\\frac{3}{7}$", q.get(MimeBundle.TEXT_LATEX));
    }

    @Test
    void tablesawTableIsShownAsATable() {
        Table t = Table.create("levels", DoubleColumn.create("energy", 0.0, 1.0), IntColumn.create("g", 1, 3));
        MimeBundle b = Renderers.render(t);
        assertEquals(String.join("\n", "levels", "energy  g", "\u2500\u2500\u2500\u2500\u2500\u2500  \u2500", "     0  1", "     1  3"), b.plain());
        assertTrue(b.get(MimeBundle.TEXT_HTML).contains("<div class=\"mt-caption\">levels</div>"));
    }

    @Test
    void arraysAndCollectionsArePlainAndCapped() {
        assertEquals("int[3] {1, 2, 3}", Renderers.render(new int[] {1, 2, 3}).plain());
        assertEquals("double[][2] {double[1] {1.5}, double[1] {2.5}}",
                Renderers.render(new double[][] {{1.5}, {2.5}}).plain());
        int[] many = IntStream.range(0, 1000).toArray();
        String p = Renderers.render(many).plain();
        assertTrue(p.startsWith("int[1000] {0, 1, 2,"), p);
        assertTrue(p.endsWith(", 99, \u2026 900 more}"), p);
        List<Integer> list = new ArrayList<>();
        for (int i = 0; i < 150; i++) {
            list.add(i);
        }
        String lp = Renderers.render(list).plain();
        assertTrue(lp.startsWith("List of 150: [0, 1,"), lp);
        assertTrue(lp.endsWith("99, \u2026 50 more]"), lp);
        Map<String, Integer> m = new LinkedHashMap<>();
        m.put("N", 42);
        m.put("q", 100);
        assertEquals("Map of 2: {N=42, q=100}", Renderers.render(m).plain());
    }

    @Test
    void imageIsPng() throws Exception {
        BufferedImage img = new BufferedImage(30, 20, BufferedImage.TYPE_INT_RGB);
        img.setRGB(3, 4, Color.ORANGE.getRGB());
        MimeBundle b = Renderers.render(img);
        assertEquals("image 30\u00d720 px", b.plain());
        BufferedImage back = ImageIO.read(new ByteArrayInputStream(Base64.getDecoder().decode(b.get(MimeBundle.IMAGE_PNG))));
        assertEquals(30, back.getWidth());
        assertEquals(Color.ORANGE.getRGB(), back.getRGB(3, 4));
    }

    /** Types for registry dispatch. */
    interface Marked { }

    static class Base { }

    static class Derived extends Base implements Marked { }

    static final class Leaf extends Derived { }

    record Pair(int a, int b) implements Marked { }

    @Test
    void registryDispatchesToTheNearestType() {
        Renderers.register(Base.class, v -> MimeBundle.text("base"));
        Renderers.register(Marked.class, v -> MimeBundle.text("marked"));
        assertEquals("base", Renderers.render(new Leaf()).plain()); // superclass before interface
        assertEquals("marked", Renderers.render(new Pair(1, 2)).plain());
        Renderers.register(Leaf.class, v -> MimeBundle.text("leaf"));
        assertEquals("leaf", Renderers.render(new Leaf()).plain());
        assertEquals("base", Renderers.render(new Derived()).plain());
    }

    static final class Broken implements Tabular {
        @Override
        public List<String> columnNames() {
            return List.of("x");
        }

        @Override
        public List<List<Object>> rows() {
            throw new IllegalStateException("rows not available");
        }

        @Override
        public String toString() {
            return "Broken[x]";
        }
    }

    record Sweep(List<List<Object>> rows) implements Tabular {
        @Override
        public List<String> columnNames() {
            return List.of("kT");
        }

        @Override
        public String toString() {
            return "Sweep[" + rows.size() + " temperatures]";
        }
    }

    record Raw(List<List<Object>> rows) implements Tabular {
        @Override
        public List<String> columnNames() {
            return List.of("x");
        }
    }

    record Holder(Object inner) implements Tabular {
        @Override
        public List<String> columnNames() {
            return List.of("x");
        }

        @Override
        public List<List<Object>> rows() {
            return List.of(List.of(1));
        }
    }

    @Test
    void captionNeverShowsAnObjectHash() {
        String first = Renderers.render(new Holder(new Object())).plain().lines().findFirst().get();
        assertEquals("Holder", first);
    }

    @Test
    void tabularCaptionIsItsShortToStringOrClassName() {
        List<List<Object>> rows = List.of(List.of(0.5), List.of(1.0));
        assertEquals("Sweep[2 temperatures]", Renderers.render(new Sweep(rows)).plain().lines().findFirst().get());
        List<List<Object>> many = new ArrayList<>();
        for (int i = 0; i < 100; i++) {
            many.add(List.of(i));
        }
        // a record's generated toString lists every row: too long, so the class name is used
        assertEquals("Raw", Renderers.render(new Raw(many)).plain().lines().findFirst().get());
        assertEquals("a", Renderers.render(TestTables.of(List.of("a"), new Object[] {1})).plain().lines().findFirst().get());
    }

    static final class FancyTable implements Tabular {
        @Override
        public List<String> columnNames() {
            return List.of("x");
        }

        @Override
        public List<List<Object>> rows() {
            return List.of(List.of(1), List.of(2));
        }
    }

    @Test
    void failingTypeRendererFallsBackToTheGenericTable() {
        Renderers.register(FancyTable.class, t -> {
            throw new IllegalStateException("no chart today");
        });
        MimeBundle b = Renderers.render(new FancyTable());
        assertTrue(b.get(MimeBundle.TEXT_HTML).contains("<table class=\"mt-table\">"));
        assertTrue(b.plain().startsWith("FancyTable\nx\n\u2500\n1\n2\n"), b.plain());
        assertTrue(b.plain().endsWith("(rich display failed: java.lang.IllegalStateException: no chart today; "
                + "shown as a plain table)"), b.plain());
    }

    @Test
    void failingRendererFallsBackToTextAndSaysWhy() {
        MimeBundle b = Renderers.render(new Broken());
        assertEquals("Broken[x]\n(rich display failed: java.lang.IllegalStateException: rows not available)", b.plain());
        assertEquals(1, b.data().size());
    }
}
