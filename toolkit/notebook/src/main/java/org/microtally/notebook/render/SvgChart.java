package org.microtally.notebook.render;

import java.awt.Color;
import java.util.ArrayList;
import java.util.Collection;
import java.util.List;
import java.util.Locale;
import org.knowm.xchart.CategoryChart;
import org.knowm.xchart.CategorySeries;
import org.knowm.xchart.XYChart;
import org.knowm.xchart.XYSeries;
import org.knowm.xchart.internal.chartpart.AxesChart;
import org.knowm.xchart.internal.chartpart.Chart;
import org.knowm.xchart.style.AxesChartStyler;
import org.knowm.xchart.style.markers.None;

/**
 * Our own compact SVG writer for the XChart charts built by {@link Charts}: the chart object is the
 * description (title, axis titles, log flags, axis limits, series data); the drawing is ours.
 *
 * <p>What comes out is one bare {@code <svg>} element (no XML declaration, no DOCTYPE, no scripts,
 * no external references), so that it can be placed inline in HTML, where Jupyter's own HTML
 * exporter keeps it. Each series is one {@code <path>} for its line and one for its markers;
 * coordinates are rounded to a tenth of a pixel and points that would not move the line by more
 * than a quarter pixel are dropped (Ramer-Douglas-Peucker line simplification: D. H. Douglas and
 * T. K. Peucker, The Canadian Cartographer 10 (1973) 112); markers are drawn at every point up to
 * {@value #MARKER_LIMIT} points and at an even selection of about {@value #MARKER_SHOWN} beyond;
 * all text is real {@code <text>} (escaped), not glyph outlines. Ticks come from {@link Ticks}.
 *
 * <p>Points that cannot be drawn (not finite, or not positive on a log axis) break the line and are
 * counted in a note under the plot, never silently dropped.
 */
final class SvgChart {
    static final int MARKER_LIMIT = 50;
    static final int MARKER_SHOWN = 25;
    private static final String INK = "#23343a";
    private static final String GRID = "#e1e8ea";
    private static final String FONT = "font-family=\"DejaVu Sans,Helvetica,Arial,sans-serif\"";

    private record Series(String name, double[] xs, double[] ys, String colour, boolean line, boolean markers, int shape) { }

    private SvgChart() { }

    /** The chart as one bare {@code <svg>} element. */
    static String of(Chart<?, ?> chart) {
        if (!(chart instanceof AxesChart<?, ?> axes)) {
            throw new IllegalArgumentException("only XY and category charts can be written as SVG, not "
                    + chart.getClass().getSimpleName());
        }
        AxesChartStyler st = (AxesChartStyler) chart.getStyler();
        List<String> categories = new ArrayList<>();
        List<Series> series = series(chart, st, categories);
        boolean bars = chart instanceof CategoryChart;
        int w = chart.getWidth();
        int h = chart.getHeight();

        double[] xr = range(series, true, st.isXAxisLogarithmic());
        double[] yr = range(series, false, st.isYAxisLogarithmic());
        if (bars) {
            xr = new double[] {-0.5, categories.size() - 0.5};
            if (!st.isYAxisLogarithmic()) {
                yr = new double[] {Math.min(0, yr[0]), Math.max(0, yr[1])};
            }
        }
        xr = limits(xr, st.getXAxisMin(), st.getXAxisMax());
        yr = limits(yr, st.getYAxisMin(), st.getYAxisMax());
        Ticks yt = st.isYAxisLogarithmic() ? Ticks.logarithmic(yr[0], yr[1]) : Ticks.linear(yr[0], yr[1], 8);
        double[] chosen = Charts.xTicksOf(chart);
        Ticks xt = bars ? null : chosen != null ? Ticks.at(chosen, xr[0], xr[1], st.isXAxisLogarithmic())
                : st.isXAxisLogarithmic() ? Ticks.logarithmic(xr[0], xr[1])
                : Ticks.linear(xr[0], xr[1], 10, integral(series));

        String title = chart.getTitle() == null ? "" : chart.getTitle();
        boolean legend = st.isLegendVisible() && series.size() > 1;
        int legendRows = legend ? legendRows(series, w - 80) : 0;
        int yLabelWidth = 0;
        for (String l : yt.labels()) {
            yLabelWidth = Math.max(yLabelWidth, textWidth(l, 11));
        }
        double left = 30 + yLabelWidth + 8;
        double top = title.isEmpty() ? 16 : 40;
        double right = w - 18;
        double bottom = h - 46 - 18 * legendRows;
        StringBuilder notes = new StringBuilder();

        StringBuilder sb = new StringBuilder(4096);
        sb.append("<svg xmlns=\"http://www.w3.org/2000/svg\" width=\"").append(w).append("\" height=\"").append(h)
                .append("\" viewBox=\"0 0 ").append(w).append(' ').append(h).append("\" role=\"img\" ").append(FONT)
                .append(" font-size=\"11\" fill=\"").append(INK).append("\">");
        sb.append("<title>").append(Markup.escape(Charts.describe(chart))).append("</title>");
        sb.append("<rect width=\"").append(w).append("\" height=\"").append(h).append("\" fill=\"#fff\"/>");
        if (!title.isEmpty()) {
            text(sb, w / 2.0, 24, "middle", 14, true, title, 0);
        }
        // grid and ticks
        StringBuilder grid = new StringBuilder();
        for (int i = 0; i < yt.values().length; i++) {
            double y = bottom - yt.fraction(yt.values()[i]) * (bottom - top);
            grid.append('M').append(n(left)).append(' ').append(n(y)).append('H').append(n(right));
            text(sb, left - 6, y + 4, "end", 11, false, yt.labels()[i], 0);
        }
        if (xt != null) {
            for (int i = 0; i < xt.values().length; i++) {
                double x = left + xt.fraction(xt.values()[i]) * (right - left);
                grid.append('M').append(n(x)).append(' ').append(n(top)).append('V').append(n(bottom));
                text(sb, x, bottom + 16, "middle", 11, false, xt.labels()[i], 0);
            }
        } else {
            int every = Math.max(1, (int) Math.ceil(categories.size() / 16.0));
            for (int i = 0; i < categories.size(); i += every) {
                double x = left + (i + 0.5) / categories.size() * (right - left);
                text(sb, x, bottom + 16, "middle", 11, false, categories.get(i), 0);
            }
        }
        sb.append("<path d=\"").append(grid).append("\" stroke=\"").append(GRID).append("\" fill=\"none\"/>");
        sb.append("<path d=\"M").append(n(left)).append(' ').append(n(top)).append('V').append(n(bottom)).append('H')
                .append(n(right)).append("\" stroke=\"#8a989c\" fill=\"none\"/>");
        String xTitle = axes.getXAxisTitle() == null ? "" : axes.getXAxisTitle();
        String yTitle = axes.getYAxisTitle() == null ? "" : axes.getYAxisTitle();
        text(sb, (left + right) / 2, bottom + 34, "middle", 12, false, xTitle + (xt == null ? "" : xt.exponentNote()), 0);
        text(sb, 14, (top + bottom) / 2, "middle", 12, false, yTitle + yt.exponentNote(), -90);

        // series
        int dropped = 0;
        for (int s = 0; s < series.size(); s++) {
            Series se = series.get(s);
            int k = se.xs().length;
            double[] px = new double[k];
            double[] py = new double[k];
            boolean[] ok = new boolean[k];
            for (int i = 0; i < k; i++) {
                double x = bars ? i : se.xs()[i];
                double y = se.ys()[i];
                ok[i] = Double.isFinite(x) && Double.isFinite(y) && (!st.isYAxisLogarithmic() || y > 0)
                        && (bars || !st.isXAxisLogarithmic() || x > 0);
                if (!ok[i]) {
                    dropped++;
                    continue;
                }
                px[i] = bars ? left + (i + 0.5) / k * (right - left) : left + xt.fraction(x) * (right - left);
                py[i] = bottom - yt.fraction(y) * (bottom - top);
            }
            if (bars) {
                bars(sb, se, s, series.size(), px, py, ok, (right - left) / k, bottom);
                continue;
            }
            if (se.line()) {
                sb.append("<path d=\"").append(SvgPath.polyline(px, py, ok)).append("\" fill=\"none\" stroke=\"")
                        .append(se.colour()).append("\" stroke-width=\"1.8\" stroke-linejoin=\"round\"/>");
            }
            if (se.markers()) {
                int every = !se.line() || k <= MARKER_LIMIT ? 1 : (int) Math.ceil(k / (double) MARKER_SHOWN);
                StringBuilder m = new StringBuilder();
                for (int i = 0; i < k; i += every) {
                    if (ok[i]) {
                        marker(m, se.shape(), px[i], py[i]);
                    }
                }
                sb.append("<path d=\"").append(m).append("\" fill=\"").append(se.colour()).append("\"/>");
            }
        }
        if (dropped > 0) {
            notes.append(dropped).append(dropped == 1 ? " point" : " points").append(" not drawn (")
                    .append(st.isYAxisLogarithmic() || st.isXAxisLogarithmic() ? "not positive on a log axis, or " : "")
                    .append("not finite)");
            text(sb, right, top - 4, "end", 10, false, notes.toString(), 0);
        }
        if (legend) {
            legend(sb, series, left, bottom + 46, w - 80);
        }
        return sb.append("</svg>").toString();
    }

    private static List<Series> series(Chart<?, ?> chart, AxesChartStyler st, List<String> categories) {
        Color[] palette = st.getSeriesColors();
        List<Series> out = new ArrayList<>();
        int i = 0;
        for (Object o : chart.getSeriesCollection()) {
            String colour = hex(palette != null && palette.length > 0 ? palette[i % palette.length] : Color.DARK_GRAY);
            if (o instanceof XYSeries xy) {
                XYSeries.XYSeriesRenderStyle rs = xy.getXYSeriesRenderStyle()
                        .orElse(XYSeries.XYSeriesRenderStyle.Line);
                boolean scatter = rs == XYSeries.XYSeriesRenderStyle.Scatter;
                boolean marks = scatter || !(xy.getMarker() instanceof None);
                out.add(new Series(xy.getName(), xy.getXData(), xy.getYData(), colour, !scatter, marks, i));
            } else if (o instanceof CategorySeries cs) {
                Collection<?> xs = cs.getXData();
                if (categories.isEmpty()) {
                    for (Object x : xs) {
                        categories.add(x == null ? "" : String.valueOf(x));
                    }
                }
                out.add(new Series(cs.getName(), new double[xs.size()], cs.getYData(), colour, false, false, i));
            }
            i++;
        }
        if (out.isEmpty()) {
            throw new IllegalArgumentException("the chart has no series to draw");
        }
        return out;
    }

    private static double[] range(List<Series> series, boolean x, boolean log) {
        double lo = Double.POSITIVE_INFINITY;
        double hi = Double.NEGATIVE_INFINITY;
        for (Series s : series) {
            for (double v : x ? s.xs() : s.ys()) {
                if (Double.isFinite(v) && (!log || v > 0)) {
                    lo = Math.min(lo, v);
                    hi = Math.max(hi, v);
                }
            }
        }
        if (lo > hi) {
            return log ? new double[] {1, 10} : new double[] {0, 1};
        }
        return new double[] {lo, hi};
    }

    /** Whether every finite x of every series is a whole number. */
    private static boolean integral(List<Series> series) {
        for (Series s : series) {
            for (double x : s.xs()) {
                if (Double.isFinite(x) && x != Math.rint(x)) {
                    return false;
                }
            }
        }
        return true;
    }

    private static double[] limits(double[] r, Double min, Double max) {
        return new double[] {min != null ? min : r[0], max != null ? Math.max(max, min != null ? min : r[0]) : r[1]};
    }

    private static void bars(StringBuilder sb, Series se, int s, int count, double[] px, double[] py, boolean[] ok,
                             double band, double bottom) {
        double bw = band * 0.8 / count;
        StringBuilder d = new StringBuilder();
        for (int i = 0; i < px.length; i++) {
            if (ok[i]) {
                double x0 = px[i] - band * 0.4 + s * bw;
                d.append('M').append(n(x0)).append(' ').append(n(bottom)).append('V').append(n(py[i]))
                        .append('h').append(n(bw)).append('V').append(n(bottom)).append('z');
            }
        }
        sb.append("<path d=\"").append(d).append("\" fill=\"").append(se.colour()).append("\"/>");
    }

    private static void marker(StringBuilder m, int shape, double x, double y) {
        String at = "M" + n(x) + " " + n(y);
        switch (shape % 4) {
            case 0 -> m.append(at).append("m-2.8 0a2.8 2.8 0 1 0 5.6 0a2.8 2.8 0 1 0-5.6 0z");
            case 1 -> m.append(at).append("m-2.5-2.5h5v5h-5z");
            case 2 -> m.append(at).append("m0-3.4l3.4 3.4-3.4 3.4-3.4-3.4z");
            default -> m.append(at).append("m0-3.3l3 5.2h-6z");
        }
    }

    private static int legendRows(List<Series> series, double width) {
        int rows = 1;
        double x = 0;
        for (Series s : series) {
            double item = 34 + textWidth(s.name(), 11);
            if (x > 0 && x + item > width) {
                rows++;
                x = 0;
            }
            x += item;
        }
        return rows;
    }

    private static void legend(StringBuilder sb, List<Series> series, double left, double y0, double width) {
        double x = 0;
        double y = y0;
        for (Series s : series) {
            double item = 34 + textWidth(s.name(), 11);
            if (x > 0 && x + item > width) {
                x = 0;
                y += 18;
            }
            double lx = left + x;
            StringBuilder m = new StringBuilder();
            if (s.markers()) {
                marker(m, s.shape(), lx + 10, y - 4);
            }
            if (s.line() || !s.markers()) {
                sb.append("<path d=\"M").append(n(lx)).append(' ').append(n(y - 4)).append("h20\" stroke=\"")
                        .append(s.colour()).append("\" stroke-width=\"").append(s.line() ? "1.8" : "8").append("\"/>");
            }
            if (m.length() > 0) {
                sb.append("<path d=\"").append(m).append("\" fill=\"").append(s.colour()).append("\"/>");
            }
            text(sb, lx + 26, y, "start", 11, false, s.name(), 0);
            x += item;
        }
    }

    private static void text(StringBuilder sb, double x, double y, String anchor, int size, boolean bold, String text,
                             int rotate) {
        if (text == null || text.isEmpty()) {
            return;
        }
        sb.append("<text x=\"").append(n(x)).append("\" y=\"").append(n(y)).append('"');
        if (!anchor.equals("start")) {
            sb.append(" text-anchor=\"").append(anchor).append('"');
        }
        if (size != 11) {
            sb.append(" font-size=\"").append(size).append('"');
        }
        if (bold) {
            sb.append(" font-weight=\"bold\"");
        }
        if (rotate != 0) {
            sb.append(" transform=\"rotate(").append(rotate).append(' ').append(n(x)).append(' ').append(n(y)).append(")\"");
        }
        sb.append('>').append(Markup.escape(text)).append("</text>");
    }

    /** Estimated advance width of sans-serif text: 0.6 em per character (common practice for layout, no source). */
    static int textWidth(String s, int size) {
        return (int) Math.ceil(s.length() * size * 0.6);
    }

    private static String n(double v) {
        return SvgPath.tenths(Math.round(v * 10));
    }



    private static String hex(Color c) {
        return String.format(Locale.ROOT, "#%02x%02x%02x", c.getRed(), c.getGreen(), c.getBlue());
    }
}
