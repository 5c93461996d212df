package org.microtally.notebook.render;

import java.util.Objects;
import org.microtally.InvalidInputException;
import org.microtally.occupation.LevelOccupations;
import org.knowm.xchart.XYChart;
import org.knowm.xchart.XYChartBuilder;
import org.knowm.xchart.XYSeries;

/**
 * Charts of occupation numbers ({@code org.microtally.occupation}), in the look of {@link Charts}.
 */
public final class OccupationCharts {
    private OccupationCharts() { }

    /**
     * Mean occupation of one state of each level against the level energy, one series per entry
     * (for example the same spectrum under several statistics, or canonical next to grand
     * canonical), in the map's iteration order.
     */
    public static XYChart occupations(java.util.Map<String, LevelOccupations> byName) {
        Objects.requireNonNull(byName, "byName");
        if (byName.isEmpty()) {
            throw InvalidInputException.of("number of occupation profiles", 0, ">= 1", "");
        }
        XYChart chart = new XYChartBuilder().width(Charts.WIDTH).height(Charts.HEIGHT)
                .xAxisTitle("level energy").yAxisTitle("<n> per state").build();
        for (var e : byName.entrySet()) {
            LevelOccupations o = e.getValue();
            double[] xs = new double[o.size()];
            for (int i = 0; i < xs.length; i++) {
                xs[i] = o.energy(i);
            }
            chart.addSeries(e.getKey(), xs, o.perStateArray()).setXYSeriesRenderStyle(XYSeries.XYSeriesRenderStyle.Line);
        }
        chart.setTitle("Mean occupation of one state of each level");
        Charts.style(chart);
        chart.getStyler().setLegendVisible(byName.size() > 1);
        return chart;
    }

}
