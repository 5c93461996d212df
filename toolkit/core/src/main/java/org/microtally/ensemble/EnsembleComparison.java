package org.microtally.ensemble;

import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.Objects;
import java.util.function.IntToDoubleFunction;
import org.microtally.InvalidInputException;
import org.microtally.Tabular;
import org.microtally.spectrum.Spectrum;
import org.microtally.spectrum.Statistics;

/**
 * The same finite system (spectrum, statistics, N) in every applicable ensemble, side by side: one
 * row per (ensemble, temperature) with U, C, S, the lowest level's mean number &lt;N_0&gt; and its
 * variance, and the relative differences from the canonical row at the same temperature.
 *
 * <p>Ensembles: canonical ({@link Canonical}, exact) and grand canonical ({@link GrandCanonical} with
 * mu fixed by &lt;N&gt; = N). Where the spectrum is exact-integer and a count table is available,
 * {@link Microcanonical} rows are added by {@link #withMicrocanonical} at the energy grid point
 * nearest to the canonical U. Relative difference of a quantity q: (q - q_canonical) / |q_canonical|
 * (0 for the canonical rows; when q_canonical = 0 it is 0 if q = 0 and sign(q) otherwise).
 *
 * <p>The canonical Var N_0 is exact; the grand canonical one is g_0 n_0 (n_0 + 1) for bosons, which
 * below condensation is of order N_0^2 instead of order N, the overestimate discussed by Politzer
 * (PRA 54, 5048 (1996)) and Wilkens &amp; Weiss (J. Mod. Opt. 44, 1801 (1997)). For Fermi and
 * Gentile statistics the canonical Var N_0 is not computed and is reported as the string "n/a".
 */
public final class EnsembleComparison implements Tabular {
    /** One row: an ensemble at one temperature. */
    public record Row(String ensemble, double kT, double energy, double heatCapacity, double entropy,
                      double groundMean, Double groundVariance, double relEnergy, double relHeatCapacity,
                      double relEntropy) { }

    private final List<Row> rows;

    private EnsembleComparison(List<Row> rows) {
        this.rows = Collections.unmodifiableList(rows);
    }

    /** Canonical and grand canonical rows at each temperature kT (in the spectrum's unit). */
    public static EnsembleComparison overTemperatures(Spectrum spectrum, Statistics statistics, int n, double... kTs) {
        Objects.requireNonNull(spectrum, "spectrum");
        if (kTs == null || kTs.length == 0) {
            throw InvalidInputException.of("number of temperatures", 0, ">= 1", "");
        }
        List<Row> out = new ArrayList<>();
        for (double kT : kTs) {
            Canonical c = Canonical.of(spectrum, statistics, n, kT);
            GrandCanonical g = GrandCanonical.atMeanNumber(spectrum, statistics, kT, n);
            Row can = canonicalRow(c);
            out.add(can);
            out.add(relative(can, "grand canonical", kT, g.energy(), g.heatCapacity(), g.entropy(),
                    g.groundLevelMean(), g.groundLevelVariance()));
        }
        return new EnsembleComparison(out);
    }

    static Row canonicalRow(Canonical c) {
        double n0 = c.occupations().levelTotal(0);
        Double v0 = c.hasCondensate() ? c.condensate().variance() : null;
        return new Row("canonical", c.kT(), c.energy(), c.heatCapacity(), c.entropy(), n0, v0, 0, 0, 0);
    }

    static Row relative(Row can, String name, double kT, double u, double cv, double s, double n0, Double v0) {
        return new Row(name, kT, u, cv, s, n0, v0, rel(u, can.energy()), rel(cv, can.heatCapacity()),
                rel(s, can.entropy()));
    }

    private static double rel(double q, double ref) {
        if (ref == 0) {
            return q == 0 ? 0 : Math.signum(q);
        }
        return (q - ref) / Math.abs(ref);
    }

    /**
     * The convergence sweep: for each N, the canonical and grand canonical rows at temperature
     * {@code kTForN.applyAsDouble(N)} (e.g. a fixed fraction of a T_c that scales with N), so that the
     * relative differences can be seen to shrink with N.
     */
    public static ConvergenceSweep convergence(Spectrum spectrum, Statistics statistics, int[] ns,
                                               IntToDoubleFunction kTForN) {
        if (ns == null || ns.length == 0) {
            throw InvalidInputException.of("number of particle numbers", 0, ">= 1", "");
        }
        List<ConvergenceSweep.Point> pts = new ArrayList<>();
        for (int n : ns) {
            double kT = kTForN.applyAsDouble(n);
            EnsembleComparison one = overTemperatures(spectrum, statistics, n, kT);
            pts.add(new ConvergenceSweep.Point(n, kT, one.rows.get(0), one.rows.get(1)));
        }
        return new ConvergenceSweep(pts);
    }

    EnsembleComparison with(List<Row> extra) {
        List<Row> all = new ArrayList<>(rows);
        all.addAll(extra);
        return new EnsembleComparison(all);
    }

    /** The rows, canonical first at each temperature. */
    public List<Row> comparisonRows() {
        return rows;
    }

    @Override
    public List<String> columnNames() {
        return List.of("ensemble", "kT", "U", "C/k", "S/k", "<N_0>", "Var N_0", "rel. diff U", "rel. diff C",
                "rel. diff S");
    }

    @Override
    public List<List<Object>> rows() {
        List<List<Object>> out = new ArrayList<>(rows.size());
        for (Row r : rows) {
            out.add(List.of(r.ensemble(), r.kT(), r.energy(), r.heatCapacity(), r.entropy(), r.groundMean(),
                    r.groundVariance() == null ? "n/a" : r.groundVariance(), r.relEnergy(), r.relHeatCapacity(),
                    r.relEntropy()));
        }
        return out;
    }

    /** Canonical vs grand canonical at a sequence of particle numbers. */
    public static final class ConvergenceSweep implements Tabular {
        /** One particle number: its temperature and the two rows. */
        public record Point(int n, double kT, Row canonical, Row grandCanonical) { }

        private final List<Point> points;

        ConvergenceSweep(List<Point> points) {
            this.points = Collections.unmodifiableList(points);
        }

        /** The points in the order given. */
        public List<Point> points() {
            return points;
        }

        @Override
        public List<String> columnNames() {
            return List.of("N", "kT", "U/N canonical", "U/N grand canonical", "rel. diff U", "rel. diff C",
                    "rel. diff S", "Var N_0 canonical", "Var N_0 grand canonical");
        }

        @Override
        public List<List<Object>> rows() {
            List<List<Object>> out = new ArrayList<>();
            for (Point p : points) {
                Row c = p.canonical();
                Row g = p.grandCanonical();
                out.add(List.of(p.n(), p.kT(), c.energy() / p.n(), g.energy() / p.n(), g.relEnergy(),
                        g.relHeatCapacity(), g.relEntropy(), c.groundVariance() == null ? "n/a" : c.groundVariance(),
                        g.groundVariance()));
            }
            return out;
        }
    }
}
