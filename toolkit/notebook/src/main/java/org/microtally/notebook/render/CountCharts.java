package org.microtally.notebook.render;

import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import org.microtally.InvalidInputException;
import org.microtally.count.CountTable;
import org.microtally.count.MacrostateHistogram;
import org.microtally.count.SharedTotal;
import org.knowm.xchart.XYChart;
import org.knowm.xchart.XYChartBuilder;
import org.knowm.xchart.XYSeries;
import org.knowm.xchart.internal.chartpart.Chart;

/**
 * Charts of exact counts ({@code org.microtally.count}): ln Omega curves, macrostate histograms, shared-total splits; in the look of {@link Charts}.
 */
public final class CountCharts {
    private CountCharts() { }

    /**
     * ln Omega(n, E) against E for the given particle numbers (default: up to four evenly spaced n
     * ending at N), one series per n; empty macrostates (Omega = 0) are left out. ln Omega is
     * computed by the table from the exact integer ({@link CountTable#lnCount}).
     */
    public static XYChart counts(CountTable table, int... particleNumbers) {
        Objects.requireNonNull(table, "table");
        int[] ns = particleNumbers.length > 0 ? particleNumbers : defaultParticleNumbers(table.maxParticles());
        XYChart chart = new XYChartBuilder().width(Charts.WIDTH).height(Charts.HEIGHT)
                .xAxisTitle("E [" + table.spectrum().scale().name() + "]").yAxisTitle("ln Omega").build();
        chart.setTitle("ln Omega(n, E), " + table.statistics());
        for (int n : ns) {
            if (n < 0 || n > table.maxParticles()) {
                throw InvalidInputException.of("particle number to plot", n, "in [0, " + table.maxParticles() + "]", "");
            }
            List<Double> xs = new ArrayList<>();
            List<Double> ys = new ArrayList<>();
            for (int e = 0; e <= table.maxEnergy(); e++) {
                if (!table.isZero(n, e)) {
                    xs.add((double) e);
                    ys.add(table.lnCount(n, e));
                }
            }
            if (!xs.isEmpty()) {
                XYSeries series = chart.addSeries("n = " + n, xs, ys);
                series.setXYSeriesRenderStyle(XYSeries.XYSeriesRenderStyle.Line);
            }
        }
        if (chart.getSeriesCollection().isEmpty()) {
            throw InvalidInputException.of("particle numbers to plot", java.util.Arrays.toString(ns),
                    "at least one with a non-empty macrostate for E <= " + table.maxEnergy(), "");
        }
        Charts.style(chart);
        chart.getStyler().setLegendVisible(chart.getSeriesCollection().size() > 1);
        return chart;
    }

    static int[] defaultParticleNumbers(int maxN) {
        if (maxN <= 0) {
            return new int[] {0};
        }
        int k = Math.min(4, maxN);
        java.util.TreeSet<Integer> set = new java.util.TreeSet<>();
        for (int i = 1; i <= k; i++) {
            set.add((int) Math.round((double) i * maxN / k));
        }
        return set.stream().mapToInt(Integer::intValue).toArray();
    }

    /** The exact probability of every total of a macrostate histogram (as bars for up to 60 totals, else a line). */
    public static Chart<?, ?> histogram(MacrostateHistogram histogram) {
        Objects.requireNonNull(histogram, "histogram");
        int span = histogram.maxTotal() - histogram.minTotal() + 1;
        Chart<?, ?> chart = span <= 60 ? Charts.bars(histogram, "total", "probability")
                : Charts.line(histogram, "total", "probability");
        chart.setTitle("Exact probability of each total");
        return chart;
    }

    /** The exact probability of every split q_A of a shared total, against q_A. */
    public static XYChart split(SharedTotal shared) {
        XYChart chart = Charts.line(Objects.requireNonNull(shared, "shared"), "q_A", "probability");
        chart.setTitle("Probability of each split of q = " + shared.total() + " quanta");
        chart.setXAxisTitle("q_A (quanta in the first part)");
        return chart;
    }

}
