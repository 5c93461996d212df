package org.microtally.notebook.render;

import java.util.Objects;
import org.microtally.spectrum.Spectrum;
import org.knowm.xchart.XYChart;
import org.knowm.xchart.XYChartBuilder;
import org.knowm.xchart.XYSeries;
import org.knowm.xchart.style.markers.SeriesMarkers;

/**
 * Charts of spectra ({@code org.microtally.spectrum}), in the look of {@link Charts}.
 */
public final class SpectrumCharts {
    private SpectrumCharts() { }

    /**
     * The spectrum as a stick chart: one vertical line per level from 0 up to its degeneracy, at its
     * energy; the x axis is titled with the spectrum's energy unit.
     */
    public static XYChart levels(Spectrum spectrum) {
        Objects.requireNonNull(spectrum, "spectrum");
        int n = spectrum.size();
        double[] xs = new double[3 * n];
        double[] ys = new double[3 * n];
        for (int i = 0; i < n; i++) {
            double e = spectrum.energy(i);
            xs[3 * i] = e;
            xs[3 * i + 1] = e;
            xs[3 * i + 2] = e;
            ys[3 * i + 1] = spectrum.degeneracy(i);
        }
        XYChart chart = new XYChartBuilder().width(Charts.WIDTH).height(Charts.HEIGHT)
                .xAxisTitle("energy [" + spectrum.scale().name() + "]").yAxisTitle("degeneracy").build();
        XYSeries s = chart.addSeries("levels", xs, ys);
        s.setXYSeriesRenderStyle(XYSeries.XYSeriesRenderStyle.Line);
        s.setMarker(SeriesMarkers.NONE);
        chart.setTitle("Levels and their degeneracies, " + spectrum.size() + " levels");
        Charts.style(chart);
        chart.getStyler().setLegendVisible(false);
        chart.getStyler().setYAxisMin(0.0);
        return chart;
    }

}
