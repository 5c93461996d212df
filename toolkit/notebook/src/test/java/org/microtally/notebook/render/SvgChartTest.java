package org.microtally.notebook.render;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Test;
import org.knowm.xchart.XYChart;
import org.microtally.Tabular;

class SvgChartTest {

    /** The d attribute of the first path drawn with the given fill or stroke colour. */
    static String pathWithFill(String svg, String colour) {
        Matcher m = Pattern.compile("<path d=\"([^\"]*)\"[^>]*(fill|stroke)=\"" + Pattern.quote(colour) + "\"").matcher(svg);
        assertTrue(m.find(), "no path in " + colour);
        return m.group(1);
    }

    /** The absolute points of a path of M and l commands (as written by SvgChart.polyline). */
    static List<double[]> points(String d) {
        List<double[]> pts = new ArrayList<>();
        Matcher m = Pattern.compile("([Ml])(-?[0-9.]+)[ ]?(-?[0-9.]+)").matcher(d);
        double x = 0;
        double y = 0;
        while (m.find()) {
            double a = Double.parseDouble(m.group(2));
            double b = Double.parseDouble(m.group(3));
            x = m.group(1).equals("M") ? a : x + a;
            y = m.group(1).equals("M") ? b : y + b;
            pts.add(new double[] {x, y});
        }
        return pts;
    }

    static Tabular curve(int n) {
        Object[][] rows = new Object[n][];
        for (int i = 0; i < n; i++) {
            double x = 10.0 * i / (n - 1);
            rows[i] = new Object[] {x, Math.sin(x), 2 * x};
        }
        return TestTables.of(List.of("x", "sin x", "2x"), rows);
    }

    @Test
    void aStraightLineOfManyPointsIsTwoPoints() {
        String d = pathWithFill(Charts.svg(Charts.line(curve(2000), "x", "2x")), "#1f5f6b");
        // common practice, no source: collinear points add nothing to a drawn line
        assertEquals(2, points(d).size(), d);
    }

    @Test
    void simplifiedCurveStaysWithinAPixelOfEveryPoint() {
        XYChart chart = Charts.line(curve(2000), "x", "sin x");
        String svg = Charts.svg(chart);
        List<double[]> pts = points(pathWithFill(svg, "#1f5f6b"));
        assertTrue(pts.size() < 400, "kept " + pts.size() + " of 2000 points");
        // the axis frame path gives the plot box: M left top V bottom H right
        Matcher frame = Pattern.compile("<path d=\"M([0-9.]+) ([0-9.]+)V([0-9.]+)H([0-9.]+)\" stroke=\"#8a989c\"").matcher(svg);
        assertTrue(frame.find());
        double left = Double.parseDouble(frame.group(1));
        double top = Double.parseDouble(frame.group(2));
        double bottom = Double.parseDouble(frame.group(3));
        double right = Double.parseDouble(frame.group(4));
        // y axis runs -1..1 (nice ticks), x axis 0..10
        for (int i = 0; i < 2000; i += 37) {
            double x = 10.0 * i / 1999;
            double px = left + x / 10 * (right - left);
            double py = bottom - (Math.sin(x) + 1) / 2 * (bottom - top);
            double best = Double.MAX_VALUE;
            for (int j = 1; j < pts.size(); j++) {
                best = Math.min(best, segmentDistance(px, py, pts.get(j - 1), pts.get(j)));
            }
            // Source: closed form sin x; tolerance 0.25 px simplification + 0.05 px rounding, so < 0.5 px
            assertTrue(best < 0.5, "point " + i + " is " + best + " px from the drawn line");
        }
    }

    private static double segmentDistance(double x, double y, double[] a, double[] b) {
        double dx = b[0] - a[0];
        double dy = b[1] - a[1];
        double t = dx == 0 && dy == 0 ? 0 : Math.max(0, Math.min(1, ((x - a[0]) * dx + (y - a[1]) * dy) / (dx * dx + dy * dy)));
        return Math.hypot(x - a[0] - t * dx, y - a[1] - t * dy);
    }

    @Test
    void markersAreThinnedAboveFiftyPoints() {
        String svgFew = Charts.svg(Charts.line(curve(40), "x", "sin x"));
        String svgMany = Charts.svg(Charts.line(curve(2000), "x", "sin x"));
        assertEquals(40, markerCount(svgFew));
        long many = markerCount(svgMany);
        assertTrue(many >= 20 && many <= 30, "markers on 2000 points: " + many);
    }

    /** Circles (the first series' marker) are written as two arcs each. */
    private static long markerCount(String svg) {
        Matcher m = Pattern.compile("a2\\.8 2\\.8 0 1 0 5\\.6 0").matcher(svg);
        long n = 0;
        while (m.find()) {
            n++;
        }
        return n;
    }

    @Test
    void textIsRealTextAndEscaped() {
        Tabular t = TestTables.of(List.of("kT <hbar*omega>", "U & more"), new Object[] {1.0, 2.0}, new Object[] {2.0, 3.0});
        XYChart chart = Charts.line(t, "kT <hbar*omega>", "U & more");
        chart.setTitle("A \"title\"");
        String svg = Charts.svg(chart);
        assertTrue(svg.contains(">kT &lt;hbar*omega&gt;</text>"), svg);
        assertTrue(svg.contains(">A &quot;title&quot;</text>"), svg);
        assertFalse(svg.contains("<glyph"));
    }

    @Test
    void pointsThatCannotBeDrawnAreCountedNotHidden() {
        Tabular t = TestTables.of(List.of("x", "y"), new Object[] {1.0, 1e-3}, new Object[] {2.0, 0.0},
                new Object[] {3.0, 10.0}, new Object[] {4.0, Double.NaN});
        XYChart chart = Charts.line(t, "x", "y");
        chart.getStyler().setYAxisLogarithmic(true);
        String svg = Charts.svg(chart);
        assertTrue(svg.contains("2 points not drawn"), svg);
        // log axis ticks are decades
        assertTrue(svg.contains(">0.001</text>") && svg.contains(">10</text>"), svg);
    }

    @Test
    void compactForALongSeries() {
        // the former export (VectorGraphics2D, text as outlines) wrote 543 KB for 01 cell 10: three series of 401 points
        int bytes = Charts.svg(Charts.line(curve(2000), "x", "sin x", "2x")).length();
        assertTrue(bytes < 12_000, "SVG of 2 x 2000 points: " + bytes + " bytes");
    }
}
