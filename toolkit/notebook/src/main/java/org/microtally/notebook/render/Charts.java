package org.microtally.notebook.render;

import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Font;
import java.awt.image.BufferedImage;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.util.ArrayList;
import java.util.Base64;
import java.util.List;
import java.util.Objects;
import javax.imageio.ImageIO;
import org.microtally.InvalidInputException;
import org.microtally.Tabular;
import org.knowm.xchart.CategoryChart;
import org.knowm.xchart.CategoryChartBuilder;
import org.knowm.xchart.XYChart;
import org.knowm.xchart.XYChartBuilder;
import org.knowm.xchart.XYSeries;
import org.knowm.xchart.internal.chartpart.Chart;
import org.knowm.xchart.style.AxesChartStyler;
import org.knowm.xchart.style.Styler;
import org.knowm.xchart.style.markers.Marker;
import org.knowm.xchart.style.markers.SeriesMarkers;

/**
 * Charts of tabular results (XChart), in one consistent look of our own, and their encodings for
 * notebooks: compact SVG written by our own {@link SvgChart} (the default display) and, on request,
 * PNG at twice the size painted by XChart off-screen (headless); both in memory.
 *
 * <p>Columns are chosen by name. Cells are converted to double for plotting only (a chart is a
 * picture): exact integers and fractions beyond the double range are refused with a message that
 * names the row and column and suggests plotting the logarithm; missing cells ({@code null} or
 * {@code "n/a"}) are left out of their series (bar charts draw them as 0).
 *
 * <p>The charts returned are ordinary mutable XChart objects: titles, ranges and sizes can be
 * adjusted before display. {@link #style(Chart)} applies our look to a chart built elsewhere.
 */
public final class Charts {
    /** Default chart size in pixels. */
    public static final int WIDTH = 640;
    /** Default chart size in pixels. */
    public static final int HEIGHT = 400;

    /** Our series colours, in order: harbour teal, amber, brick, slate blue, moss, plum, sand, slate grey. */
    public static final List<Color> PALETTE = List.of(
            new Color(0x1f5f6b), new Color(0xd08c2b), new Color(0xa8433a), new Color(0x4a5a9a),
            new Color(0x6b8e3d), new Color(0x7d4a86), new Color(0xb59a62), new Color(0x5c6b70));

    private static final Color INK = new Color(0x23343a);
    private static final Color GRID = new Color(0xe1e8ea);

    private static final java.util.Map<Chart<?, ?>, double[]> X_TICKS =
            java.util.Collections.synchronizedMap(new java.util.WeakHashMap<>());

    private Charts() { }

    /**
     * Puts the x-axis ticks of {@code chart} at the given positions (for example the shell closings
     * 2, 6, 12, 20, 30, 42) instead of round numbers; returns the chart. Used by the SVG writer.
     *
     * @throws InvalidInputException unless 1 to 20 finite, strictly increasing positions are given
     */
    public static <C extends Chart<?, ?>> C xTicks(C chart, double... positions) {
        Objects.requireNonNull(chart, "chart");
        if (positions == null || positions.length < 1 || positions.length > 20) {
            throw InvalidInputException.of("number of tick positions", positions == null ? 0 : positions.length,
                    "1 to 20", "Give the positions in increasing order.");
        }
        for (int i = 0; i < positions.length; i++) {
            if (!Double.isFinite(positions[i]) || (i > 0 && positions[i] <= positions[i - 1])) {
                throw InvalidInputException.of("tick position " + i, positions[i],
                        "finite and greater than the one before", "Give the positions in increasing order.");
            }
        }
        X_TICKS.put(chart, positions.clone());
        return chart;
    }

    /**
     * Adds a reference curve without markers: {@code f} evaluated at every x in {@code xs} (give a
     * dense grid, so that jumps and kinks of a limit law are drawn where they are); returns the chart.
     * Values that are not finite are left out of the drawing and counted in a note on the chart.
     */
    public static XYChart curve(XYChart chart, String name, double[] xs, java.util.function.DoubleUnaryOperator f) {
        Objects.requireNonNull(chart, "chart");
        Objects.requireNonNull(f, "f");
        if (xs == null || xs.length < 2) {
            throw InvalidInputException.of("number of x values", xs == null ? 0 : xs.length, ">= 2",
                    "Give a dense grid of x values.");
        }
        double[] ys = new double[xs.length];
        for (int i = 0; i < xs.length; i++) {
            ys[i] = f.applyAsDouble(xs[i]);
        }
        XYSeries s = chart.addSeries(name, xs.clone(), ys);
        s.setXYSeriesRenderStyle(XYSeries.XYSeriesRenderStyle.Line);
        s.setMarker(SeriesMarkers.NONE);
        chart.getStyler().setLegendVisible(chart.getSeriesCollection().size() > 1);
        return chart;
    }

    /** {@code n} evenly spaced values from {@code from} to {@code to}, both included (n >= 2). */
    public static double[] grid(double from, double to, int n) {
        if (n < 2 || !(from < to)) {
            throw InvalidInputException.of("grid", from + ".." + to + " in " + n + " points",
                    "from < to and n >= 2", "");
        }
        double[] g = new double[n];
        for (int i = 0; i < n; i++) {
            g[i] = i == n - 1 ? to : from + (to - from) * i / (n - 1);
        }
        return g;
    }

    /** The positions set by {@link #xTicks}, or null. */
    static double[] xTicksOf(Chart<?, ?> chart) {
        double[] t = X_TICKS.get(chart);
        return t == null ? null : t.clone();
    }

    /** Lines with small markers, one series per y column, against the x column. */
    public static XYChart line(Tabular table, String xColumn, String... yColumns) {
        return xy(table, XYSeries.XYSeriesRenderStyle.Line, xColumn, yColumns);
    }

    /** Markers only, one series per y column, against the x column. */
    public static XYChart scatter(Tabular table, String xColumn, String... yColumns) {
        return xy(table, XYSeries.XYSeriesRenderStyle.Scatter, xColumn, yColumns);
    }

    /**
     * One line per distinct value of {@code groupColumn} (in order of first appearance), each
     * plotting {@code yColumn} against {@code xColumn} over that group's rows: for example
     * U against kT with one series per ensemble. Rows with a missing x or y are left out.
     */
    public static XYChart grouped(Tabular table, String groupColumn, String xColumn, String yColumn) {
        Objects.requireNonNull(table, "table");
        int gc = ChartCells.columnIndex(table, groupColumn);
        int xc = ChartCells.columnIndex(table, xColumn);
        int yc = ChartCells.columnIndex(table, yColumn);
        java.util.Map<String, List<double[]>> groups = new java.util.LinkedHashMap<>();
        List<List<Object>> rows = table.rows();
        for (int r = 0; r < rows.size(); r++) {
            List<Object> row = rows.get(r);
            Object x = row.get(xc);
            Object y = row.get(yc);
            if (CellText.isMissing(x) || CellText.isMissing(y)) {
                continue;
            }
            String g = CellText.shown(row.get(gc), TableFormat.DEFAULT);
            groups.computeIfAbsent(g, k -> new ArrayList<>())
                    .add(new double[] {ChartCells.toDouble(x, r, xColumn), ChartCells.toDouble(y, r, yColumn)});
        }
        if (groups.isEmpty()) {
            throw InvalidInputException.of("number of points", 0, ">= 1 (rows with both '" + xColumn + "' and '"
                    + yColumn + "' present)", "");
        }
        XYChart chart = new XYChartBuilder().width(WIDTH).height(HEIGHT)
                .xAxisTitle(xColumn).yAxisTitle(yColumn).build();
        for (var e : groups.entrySet()) {
            double[] xs = new double[e.getValue().size()];
            double[] ys = new double[xs.length];
            for (int i = 0; i < xs.length; i++) {
                xs[i] = e.getValue().get(i)[0];
                ys[i] = e.getValue().get(i)[1];
            }
            chart.addSeries(e.getKey().isEmpty() ? "(none)" : e.getKey(), xs, ys)
                    .setXYSeriesRenderStyle(XYSeries.XYSeriesRenderStyle.Line);
        }
        style(chart);
        chart.getStyler().setLegendVisible(groups.size() > 1);
        return chart;
    }

    /**
     * A bar chart: one bar group per row, labelled by the category column (shown as text), one
     * series per value column. For histograms: the bin column as category, the counts as values.
     */
    public static CategoryChart bars(Tabular table, String categoryColumn, String... valueColumns) {
        Objects.requireNonNull(table, "table");
        requireSeries(valueColumns);
        int cat = ChartCells.columnIndex(table, categoryColumn);
        CategoryChart chart = new CategoryChartBuilder().width(WIDTH).height(HEIGHT)
                .xAxisTitle(categoryColumn).yAxisTitle(axisTitle(valueColumns)).build();
        for (String name : valueColumns) {
            int c = ChartCells.columnIndex(table, name);
            List<String> xs = new ArrayList<>();
            List<Double> ys = new ArrayList<>();
            List<List<Object>> rows = table.rows();
            for (int r = 0; r < rows.size(); r++) {
                Object x = rows.get(r).get(cat);
                Object y = rows.get(r).get(c);
                xs.add(x == null ? "" : CellText.shown(x, TableFormat.DEFAULT));
                ys.add(CellText.isMissing(y) ? 0.0 : ChartCells.toDouble(y, r, name));
            }
            if (xs.isEmpty()) {
                throw InvalidInputException.of("number of rows", 0, ">= 1 to draw a bar chart", "");
            }
            chart.addSeries(name, xs, ys);
        }
        style(chart);
        chart.getStyler().setOverlapped(false);
        chart.getStyler().setLegendVisible(valueColumns.length > 1);
        chart.getStyler().setXAxisLabelRotation(xsRotation(table.rows().size()));
        return chart;
    }

    /** Applies our look (palette, fonts, grid, legend placement) to any XChart chart; returns it. */
    public static <C extends Chart<?, ?>> C style(C chart) {
        Styler s = chart.getStyler();
        s.setSeriesColors(PALETTE.toArray(new Color[0]));
        s.setChartBackgroundColor(Color.WHITE);
        s.setPlotBackgroundColor(new Color(0xfbfcfc));
        s.setPlotBorderVisible(false);
        s.setChartFontColor(INK);
        s.setBaseFont(new Font(Font.SANS_SERIF, Font.PLAIN, 12));
        s.setChartTitleFont(new Font(Font.SANS_SERIF, Font.BOLD, 14));
        s.setChartTitleBoxVisible(false);
        s.setLegendFont(new Font(Font.SANS_SERIF, Font.PLAIN, 11));
        s.setLegendBorderColor(GRID);
        s.setLegendPosition(Styler.LegendPosition.OutsideS);
        s.setLegendLayout(Styler.LegendLayout.Horizontal);
        s.setMarkerSize(5);
        s.setSeriesMarkers(new Marker[] {SeriesMarkers.CIRCLE, SeriesMarkers.SQUARE, SeriesMarkers.DIAMOND,
            SeriesMarkers.TRIANGLE_UP, SeriesMarkers.TRIANGLE_DOWN, SeriesMarkers.CROSS});
        if (s instanceof AxesChartStyler a) {
            a.setPlotGridLinesColor(GRID);
            a.setPlotGridLinesStroke(new BasicStroke(1f));
            a.setAxisTickLabelsFont(new Font(Font.SANS_SERIF, Font.PLAIN, 11));
            a.setAxisTitleFont(new Font(Font.SANS_SERIF, Font.PLAIN, 12));
            a.setAxisTickMarksColor(new Color(0x8a989c));
            a.setAxisTickLabelsColor(INK);
            if (a instanceof org.knowm.xchart.style.XYStyler) {
                // our number format (0.05, 1.5e-12) instead of the default pattern (.05)
                a.setXAxisTickLabelsFormattingFunction(v -> CellText.floating(v, 6));
                a.setYAxisTickLabelsFormattingFunction(v -> CellText.floating(v, 6));
            }
        }
        return chart;
    }

    /**
     * The chart drawn as PNG at twice its width and height (for high-resolution screens and print;
     * shown at its own size by {@link #asPng}), headless and off-screen, by XChart's own Java2D
     * painter in our style. Charts are shown as SVG by default ({@link #bundle}); PNG is on request.
     */
    public static byte[] png(Chart<?, ?> chart) {
        BufferedImage image = new BufferedImage(2 * chart.getWidth(), 2 * chart.getHeight(), BufferedImage.TYPE_INT_RGB);
        java.awt.Graphics2D g = image.createGraphics();
        try {
            g.scale(2, 2);
            chart.paint(g, chart.getWidth(), chart.getHeight());
        } finally {
            g.dispose();
        }
        return encodePng(image);
    }

    /**
     * The chart as one bare SVG element (no XML declaration or DOCTYPE), drawn by our own writer:
     * one path per series, coordinates on a tenth-pixel grid, thinned markers, real text. See
     * {@link SvgChart} for the method. The same element can be placed inline in HTML.
     */
    public static String svg(Chart<?, ?> chart) {
        return SvgChart.of(chart);
    }

    /**
     * The display of a chart: {@code text/html} holding the SVG inline (in
     * {@code <figure class="mt-figure">}) and a one-line {@code text/plain}. One picture format per
     * output: inline SVG in HTML is what Jupyter's notebook, its lab interface and its HTML exporter
     * all show as is (an {@code image/svg+xml} output is passed through an HTML cleaner by the
     * exporter, which drops every drawing element). For a bitmap use {@link #asPng}.
     */
    public static MimeBundle bundle(Chart<?, ?> chart) {
        return MimeBundle.builder(describe(chart)).put(MimeBundle.TEXT_HTML, figure(chart)).build();
    }

    /**
     * The chart as a PNG display, on request: {@code text/html} with an {@code <img>} of the 2x bitmap
     * shown at the chart's own size, and {@code image/png} for tools that want the bitmap itself.
     */
    public static MimeBundle asPng(Chart<?, ?> chart) {
        String b64 = Base64.getEncoder().encodeToString(png(chart));
        return MimeBundle.builder(describe(chart))
                .put(MimeBundle.TEXT_HTML, "<figure class=\"mt-figure\"><img alt=\"" + Markup.escape(describe(chart))
                        + "\" width=\"" + chart.getWidth() + "\" height=\"" + chart.getHeight()
                        + "\" src=\"data:image/png;base64," + b64 + "\"/></figure>")
                .put(MimeBundle.IMAGE_PNG, b64)
                .build();
    }

    private static String figure(Chart<?, ?> chart) {
        return "<figure class=\"mt-figure\" style=\"margin:0.4em 0\">" + svg(chart) + "</figure>";
    }

    /**
     * A table bundle with charts under it: the HTML shows the table and then each chart as inline
     * SVG ({@link #bundle}); the plain text is the table text followed by each chart's one-line
     * description. Other representations of {@code table} are kept.
     */
    public static MimeBundle combine(MimeBundle table, Chart<?, ?>... charts) {
        StringBuilder plain = new StringBuilder(table.plain());
        String html = table.has(MimeBundle.TEXT_HTML) ? table.get(MimeBundle.TEXT_HTML)
                : "<pre>" + Markup.escape(table.plain()) + "</pre>";
        StringBuilder figures = new StringBuilder(html);
        for (Chart<?, ?> chart : charts) {
            plain.append('\n').append(describe(chart));
            figures.append(figure(chart));
        }
        MimeBundle.Builder b = MimeBundle.builder(plain.toString());
        for (var e : table.data().entrySet()) {
            if (!e.getKey().equals(MimeBundle.TEXT_PLAIN)) {
                b.put(e.getKey(), e.getValue());
            }
        }
        return b.put(MimeBundle.TEXT_HTML, figures.toString()).build();
    }

    /** A PNG display bundle for an image, with a text/plain line giving its size. */
    public static MimeBundle bundle(BufferedImage image) {
        return MimeBundle.builder("image " + image.getWidth() + "\u00d7" + image.getHeight() + " px")
                .put(MimeBundle.IMAGE_PNG, Base64.getEncoder().encodeToString(encodePng(image)))
                .build();
    }

    private static byte[] encodePng(BufferedImage image) {
        ByteArrayOutputStream out = new ByteArrayOutputStream();
        try {
            if (!ImageIO.write(image, "png", out)) {
                throw new IllegalStateException("no PNG writer for image type " + image.getType());
            }
        } catch (IOException e) {
            throw new UncheckedIOException("could not encode the image as PNG", e);
        }
        return out.toByteArray();
    }

    /** E.g. {@code chart "U vs kT" (640×400 px): series U, C}. */
    static String describe(Chart<?, ?> chart) {
        String title = chart.getTitle() == null || chart.getTitle().isBlank() ? "" : " \"" + chart.getTitle() + "\"";
        return "chart" + title + " (" + chart.getWidth() + "\u00d7" + chart.getHeight() + " px): series "
                + chart.getSeriesCollection().stream()
                .map(org.knowm.xchart.internal.series.Series::getName).collect(java.util.stream.Collectors.joining(", "));
    }

    private static XYChart xy(Tabular table, XYSeries.XYSeriesRenderStyle renderStyle, String xColumn,
                              String... yColumns) {
        Objects.requireNonNull(table, "table");
        requireSeries(yColumns);
        int xc = ChartCells.columnIndex(table, xColumn);
        XYChart chart = new XYChartBuilder().width(WIDTH).height(HEIGHT)
                .xAxisTitle(xColumn).yAxisTitle(axisTitle(yColumns)).build();
        List<List<Object>> rows = table.rows();
        for (String name : yColumns) {
            int yc = ChartCells.columnIndex(table, name);
            double[] xs = new double[rows.size()];
            double[] ys = new double[rows.size()];
            int k = 0;
            for (int r = 0; r < rows.size(); r++) {
                Object x = rows.get(r).get(xc);
                Object y = rows.get(r).get(yc);
                if (CellText.isMissing(x) || CellText.isMissing(y)) {
                    continue;
                }
                xs[k] = ChartCells.toDouble(x, r, xColumn);
                ys[k] = ChartCells.toDouble(y, r, name);
                k++;
            }
            if (k == 0) {
                throw InvalidInputException.of("number of points in column '" + name + "'", 0,
                        ">= 1 (rows with both '" + xColumn + "' and '" + name + "' present)", "");
            }
            XYSeries series = chart.addSeries(name, java.util.Arrays.copyOf(xs, k), java.util.Arrays.copyOf(ys, k));
            series.setXYSeriesRenderStyle(renderStyle);
        }
        style(chart);
        chart.getStyler().setLegendVisible(yColumns.length > 1);
        return chart;
    }

    private static void requireSeries(String[] columns) {
        if (columns == null || columns.length == 0) {
            throw InvalidInputException.of("number of value columns", 0, ">= 1", "Name the columns to plot.");
        }
    }

    private static String axisTitle(String[] columns) {
        return columns.length == 1 ? columns[0] : "";
    }

    private static int xsRotation(int categories) {
        return categories > 16 ? 90 : 0;
    }
}
