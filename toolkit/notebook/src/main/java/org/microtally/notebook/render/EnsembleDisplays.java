package org.microtally.notebook.render;

import java.util.ArrayList;
import java.util.List;
import org.microtally.QuantityTable;
import org.microtally.ensemble.Canonical;
import org.microtally.ensemble.EnsembleComparison;
import org.microtally.ensemble.GrandCanonical;
import org.microtally.ensemble.GroundState;
import org.microtally.ensemble.Microcanonical;
import org.microtally.occupation.CondensateDistribution;
import org.microtally.occupation.LevelOccupations;
import org.microtally.spectrum.Statistics;

/**
 * Displays of the ensemble and occupation results. A display never starts a computation the
 * result has not done: a canonical result is shown as its table of quantities; its occupations are
 * charted when asked for ({@link Charts#occupations}).
 */
final class EnsembleDisplays {
    private EnsembleDisplays() { }

    static void registerAll(Renderers r) {
        r.put(Canonical.class, EnsembleDisplays::canonical);
        r.put(GrandCanonical.class, EnsembleDisplays::grandCanonical);
        r.put(Microcanonical.class, EnsembleDisplays::microcanonical);
        r.put(EnsembleComparison.class, EnsembleDisplays::comparison);
        r.put(EnsembleComparison.ConvergenceSweep.class, EnsembleDisplays::convergence);
        r.put(LevelOccupations.class, o -> Charts.combine(
                TableDisplay.bundle(o, String.format("Mean occupations of %d levels, %s particles in all", o.size(),
                        CellText.floating(o.total(), 8)), List.of()),
                OccupationCharts.occupations(java.util.Map.of("<n> per state", o))));
        r.put(CondensateDistribution.class, EnsembleDisplays::condensate);
        r.put(GroundState.class, EnsembleDisplays::groundState);
        r.put(QuantityTable.class, t -> TableDisplay.bundle(t, "Quantities (energies in " + t.energyUnit() + ")",
                List.of()));
    }

    static MimeBundle canonical(Canonical c) {
        String caption = String.format("Canonical ensemble: N = %d, %s, kT = %s %s", c.particleNumber(),
                c.statistics(), CellText.floating(c.kT(), 8), c.spectrum().scale().name());
        return TableDisplay.bundle(c.quantities(), caption, List.of());
    }

    static MimeBundle grandCanonical(GrandCanonical g) {
        String caption = String.format("Grand canonical ensemble: %s, kT = %s, mu = %s %s", g.statistics(),
                CellText.floating(g.kT(), 8), CellText.floating(g.chemicalPotential(), 10), g.spectrum().scale().name());
        MimeBundle table = TableDisplay.bundle(g.quantities(), caption, List.of("Occupation of one state: "
                + occupationLawText(g.statistics())));
        return ResultDisplays.withLatex(table, occupationLaw(g.statistics()));
    }

    /** The grand canonical mean occupation of one state, in LaTeX. */
    static String occupationLaw(Statistics s) {
        return switch (s.kind()) {
            case FERMI -> "$$\\langle n \\rangle = \\frac{1}{e^{(\\varepsilon - \\mu)/kT} + 1}$$";
            case BOSE -> "$$\\langle n \\rangle = \\frac{1}{e^{(\\varepsilon - \\mu)/kT} - 1}$$";
            case DISTINGUISHABLE -> "$$\\langle n \\rangle = e^{-(\\varepsilon - \\mu)/kT}$$";
            case GENTILE -> "$$\\langle n \\rangle = \\frac{1}{e^{x} - 1} - \\frac{" + (s.maxOccupancy() + 1)
                    + "}{e^{" + (s.maxOccupancy() + 1) + "x} - 1}, \\quad x = \\frac{\\varepsilon - \\mu}{kT}$$";
        };
    }

    /** The same law in plain text. */
    static String occupationLawText(Statistics s) {
        return switch (s.kind()) {
            case FERMI -> "<n> = 1/(exp((e - mu)/kT) + 1)";
            case BOSE -> "<n> = 1/(exp((e - mu)/kT) - 1)";
            case DISTINGUISHABLE -> "<n> = exp(-(e - mu)/kT)";
            case GENTILE -> "<n> = 1/(exp(x) - 1) - " + (s.maxOccupancy() + 1) + "/(exp(" + (s.maxOccupancy() + 1)
                    + " x) - 1), x = (e - mu)/kT";
        };
    }

    static MimeBundle microcanonical(Microcanonical m) {
        String caption = String.format("Microcanonical ensemble: N = %d, E <= %d (%s)", m.particleNumber(),
                m.maxEnergy(), m.table().statistics());
        MimeBundle table = TableDisplay.bundle(m, caption, m.warnings());
        var chart = Charts.line(m, "E", "S_B", "S_G");
        chart.setTitle("Microcanonical entropy, N = " + m.particleNumber());
        chart.setYAxisTitle("S / k");
        return Charts.combine(table, chart);
    }

    static MimeBundle comparison(EnsembleComparison c) {
        MimeBundle table = TableDisplay.bundle(c, "Ensemble comparison", c.notes());
        var u = Charts.grouped(c, "ensemble", "kT", "U");
        u.setTitle("Mean energy in each ensemble");
        var heat = Charts.grouped(c, "ensemble", "kT", "C/k");
        heat.setTitle("Heat capacity in each ensemble");
        return Charts.combine(table, u, heat);
    }

    /**
     * A convergence sweep: its table (captioned with the temperature range), the size of the relative
     * differences of U and C on log-log axes, and Var N_0 in both ensembles against N (log-log).
     */
    static MimeBundle convergence(EnsembleComparison.ConvergenceSweep s) {
        var points = s.points();
        var first = points.get(0);
        var last = points.get(points.size() - 1);
        String kT0 = CellText.floating(first.kT(), 4);
        String kT1 = CellText.floating(last.kT(), 4);
        String temperatures = "kT = " + (kT0.equals(kT1) ? kT0 : kT0 + ".." + kT1);
        String caption = String.format("Canonical vs grand canonical as N grows: N = %d..%d, %s",
                first.n(), last.n(), temperatures);
        MimeBundle table = TableDisplay.bundle(s, caption, List.of());
        List<List<Object>> rows = new ArrayList<>();
        for (var p : points) {
            rows.add(java.util.Arrays.asList(p.n(), Math.abs(p.grandCanonical().relEnergy()),
                    Math.abs(p.grandCanonical().relHeatCapacity()), p.canonical().groundVariance(),
                    p.grandCanonical().groundVariance()));
        }
        var abs = Tables.tabular(List.of("N", "|rel. diff U|", "|rel. diff C|", "Var N_0 canonical",
                "Var N_0 grand canonical"), rows);
        // two sweeps in one cell differ in their temperatures: the titles say which one a chart shows
        var diff = logLog(abs, "Grand canonical minus canonical, relative, " + temperatures, "|relative difference|",
                "|rel. diff U|", "|rel. diff C|");
        var var0 = logLog(abs, "Fluctuation of the ground-level number, " + temperatures, "Var N_0",
                "Var N_0 canonical", "Var N_0 grand canonical");
        return Charts.combine(table, diff, var0);
    }

    /** A titled chart of columns against N on log-log axes. */
    private static org.knowm.xchart.XYChart logLog(org.microtally.Tabular t, String title, String yTitle, String... ys) {
        var c = Charts.line(t, "N", ys);
        c.setTitle(title);
        c.setXAxisTitle("N (particles)");
        c.setYAxisTitle(yTitle);
        c.getStyler().setXAxisLogarithmic(true);
        c.getStyler().setYAxisLogarithmic(true);
        return c;
    }

    static MimeBundle groundState(GroundState g) {
        String caption = String.format("Ground state (T -> 0): E = %s, %s microstates (exact), S/k = %s",
                CellText.floating(g.energy(), 12), CellText.shown(g.degeneracy(), TableFormat.DEFAULT),
                CellText.floating(g.entropy(), 12));
        return TableDisplay.bundle(g.occupations(), caption,
                List.of("Limiting mean occupations per level; degeneracy in full: " + g.degeneracy()));
    }

    static MimeBundle condensate(CondensateDistribution d) {
        String caption = String.format("Ground-level number distribution: <N_0> = %s, Var N_0 = %s",
                CellText.floating(d.mean(), 8), CellText.floating(d.variance(), 8));
        var chart = Charts.line(d, "N0", "probability");
        chart.setTitle("Distribution of the ground-level number N_0");
        return Charts.combine(TableDisplay.bundle(d, caption, List.of()), chart);
    }
}
