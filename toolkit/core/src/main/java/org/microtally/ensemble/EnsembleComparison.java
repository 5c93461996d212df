package org.microtally.ensemble;

import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.Objects;
import java.util.function.IntToDoubleFunction;
import org.microtally.InvalidInputException;
import org.microtally.Missing;
import org.microtally.Tabular;
import org.microtally.count.CountTable;
import org.microtally.spectrum.Spectrum;
import org.microtally.spectrum.Statistics;

/**
 * The same finite system (spectrum, statistics, N) in every applicable ensemble, side by side: one
 * row per (ensemble, temperature) with U, C, S, the lowest level's mean number &lt;N_0&gt; and its
 * variance, and the relative differences from the canonical row at the same temperature.
 *
 * <p>Ensembles: canonical ({@link Canonical}, exact) and grand canonical ({@link GrandCanonical} with
 * mu fixed by &lt;N&gt; = N). Where the spectrum is exact-integer and a count table is available,
 * {@link Microcanonical} rows are added by {@link #overTemperatures(CountTable, int, double...)} at the energy grid point
 * nearest to the canonical U. Relative difference of a quantity q: (q - q_canonical) / |q_canonical|
 * (0 for the canonical rows; when q_canonical = 0 it is 0 if q = 0 and sign(q) otherwise).
 *
 * <p>Counting: every row of one comparison counts microstates the same way ({@link Counting});
 * distinguishable particles default to CORRECTED_BOLTZMANN (1/N!) in all three ensembles, so a
 * difference in S is an ensemble difference, not a counting convention.
 *
 * <p>The canonical Var N_0 is exact; the grand canonical one is g_0 n_0 (n_0 + 1) for bosons, which
 * below condensation is of order N_0^2 instead of order N, the overestimate discussed by Politzer
 * (PRA 54, 5048 (1996)) and Wilkens &amp; Weiss (J. Mod. Opt. 44, 1801 (1997)). The canonical
 * Var N_0 is exact for every statistics ({@link Canonical#groundLevelDistribution()}).
 *
 * <p>Method and accuracy: nothing is computed here beyond the relative differences (one subtraction
 * and one division, a few ulp); every entry carries the accuracy stated by the class that produced
 * it ({@link Canonical}, {@link GrandCanonical}, {@link Microcanonical}). "Exact" above means without
 * a large-N or grand canonical approximation, within those rounding bounds. Microcanonical rows sit
 * at the grid energy nearest to the canonical U, so they differ from the canonical row by that
 * energy offset as well as by the ensemble.
 */
public final class EnsembleComparison implements Tabular {
    private static final Missing NO_OWN_TEMPERATURE = Missing.because(
            "the microcanonical grid temperature 1/beta_B is undefined here (beta_B = 0 or no neighbouring states)");
    private static final Missing NO_GROUND_VARIANCE = Missing.because(
            "Var N_0 is not computed for the microcanonical row");
    /**
     * One row: an ensemble at one nominal temperature kT. {@code ownKT} is the temperature the
     * ensemble itself assigns (equal to kT for canonical and grand canonical; for the microcanonical
     * row the Boltzmann grid temperature 1/beta_B at the energy nearest to the canonical U, null where
     * beta_B = 0 or undefined).
     */
    public record Row(String ensemble, double kT, Double ownKT, double energy, double heatCapacity, double entropy,
                      double groundMean, Double groundVariance, double relEnergy, double relHeatCapacity,
                      double relEntropy) { }

    private final List<Row> rows;
    private final List<String> notes;

    private EnsembleComparison(List<Row> rows) {
        this(rows, List.of());
    }

    private EnsembleComparison(List<Row> rows, List<String> notes) {
        this.rows = Collections.unmodifiableList(rows);
        this.notes = List.copyOf(notes);
    }

    /**
     * Canonical and grand canonical rows at each temperature kT (in the spectrum's unit), with one
     * counting in every row: distinguishable particles are compared under
     * {@link Counting#CORRECTED_BOLTZMANN} (the grand canonical ensemble's usual Maxwell-Boltzmann
     * counting, so S and ln Z are like with like); choose LABELLED with
     * {@link #overTemperatures(Spectrum, Statistics, int, Counting, double...)}.
     */
    public static EnsembleComparison overTemperatures(Spectrum spectrum, Statistics statistics, int n, double... kTs) {
        Objects.requireNonNull(statistics, "statistics");
        return overTemperatures(spectrum, statistics, n, comparisonCounting(statistics), kTs);
    }

    private static Counting comparisonCounting(Statistics st) {
        return st.indistinguishable() ? Counting.IDENTICAL : Counting.CORRECTED_BOLTZMANN;
    }

    /**
     * As {@link #overTemperatures(Spectrum, Statistics, int, double...)} with the {@link Counting}
     * used in every row (LABELLED or CORRECTED_BOLTZMANN for distinguishable particles, IDENTICAL for
     * quantum statistics).
     */
    public static EnsembleComparison overTemperatures(Spectrum spectrum, Statistics statistics, int n,
                                                      Counting counting, double... kTs) {
        Objects.requireNonNull(spectrum, "spectrum");
        Counting.require(statistics, counting);
        if (kTs == null || kTs.length == 0) {
            throw InvalidInputException.of("number of temperatures", 0, ">= 1", "");
        }
        List<Row> out = new ArrayList<>();
        for (double kT : kTs) {
            Canonical c = Canonical.of(spectrum, statistics, n, kT, counting);
            GrandCanonical g = GrandCanonical.ofMeanNumber(spectrum, statistics, kT, n, counting);
            Row can = canonicalRow(c);
            out.add(can);
            out.add(relative(can, "grand canonical", kT, g.energy(), g.heatCapacity(), g.entropy(),
                    g.groundLevelMean(), g.groundLevelVariance()));
        }
        return new EnsembleComparison(out);
    }

    static Row canonicalRow(Canonical c) {
        double n0 = c.occupations().levelTotal(0);
        Double v0 = c.groundLevelDistribution().variance();
        return new Row("canonical", c.kT(), c.kT(), c.energy(), c.heatCapacity(), c.entropy(), n0, v0, 0, 0, 0);
    }

    static Row relative(Row can, String name, double kT, double u, double cv, double s, double n0, Double v0) {
        return relative(can, name, kT, kT, u, cv, s, n0, v0);
    }

    static Row relative(Row can, String name, double kT, Double ownKT, double u, double cv, double s, double n0,
                        Double v0) {
        return new Row(name, kT, ownKT, u, cv, s, n0, v0, rel(u, can.energy()), rel(cv, can.heatCapacity()),
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

    /**
     * All three ensembles for an exact-integer spectrum: canonical and grand canonical at each kT, and
     * a microcanonical row at the grid energy E* nearest to the canonical U (from the count table,
     * which must cover N and energies up to E* + one grid step). Microcanonical columns: U = E*,
     * C = C_B(E*), S = S_B(E*), &lt;N_0&gt; = exact g_0 &lt;n_0&gt;(N, E*); its Var N_0 is not
     * computed ({@link Missing}). Cells that the grid cannot define are {@link Missing} (ownKT null, C = 0 is never
     * substituted: a row whose E* has no heat capacity is left out, with the reason in
     * {@link #notes()}).
     */
    public static EnsembleComparison overTemperatures(CountTable table, int n, double... kTs) {
        Counting counting = comparisonCounting(table.statistics());
        Microcanonical mc = Microcanonical.of(table, n, counting);
        EnsembleComparison base = overTemperatures(table.spectrum(), table.statistics(), n, counting, kTs);
        List<Row> all = new ArrayList<>();
        List<String> notes = new ArrayList<>(mc.warnings());
        int lo = mc.lowestEnergy();
        int d = mc.gridStep();
        for (int t = 0; t < kTs.length; t++) {
            Row can = base.rows.get(2 * t);
            all.add(can);
            all.add(base.rows.get(2 * t + 1));
            long k = Math.round((can.energy() - lo) / d);
            long eStar = lo + k * d;
            if (eStar > Integer.MAX_VALUE || !mc.hasHeatCapacity((int) eStar)) {
                notes.add("kT = " + kTs[t] + ": no microcanonical row, E* = " + eStar
                        + " has no grid heat capacity within the table (max E " + mc.maxEnergy() + ")");
                continue;
            }
            int e = (int) eStar;
            if (!mc.isHeatCapacityResolved(e)) {
                notes.add(String.format("kT = %s: the microcanonical C = %.4g at E* = %d is not resolved by the energy "
                        + "grid (central differences of step %d and %d disagree by more than 10%%): a discretisation "
                        + "artefact of a few quanta per particle, not an ensemble difference", kTs[t],
                        mc.heatCapacity(e), e, d, 2 * d));
            }
            double beta = mc.boltzmannBeta(e);
            double n0 = mc.occupations(e).levelTotal(0);
            all.add(relative(can, "microcanonical", kTs[t], beta == 0 ? null : 1 / beta, e, mc.heatCapacity(e),
                    mc.boltzmannEntropy(e), n0, null));
        }
        return new EnsembleComparison(all, notes);
    }

    /** Notes on rows left out or cut-off effects; empty when none. */
    public List<String> notes() {
        return notes;
    }

    /** The rows, canonical first at each temperature. */
    public List<Row> comparisonRows() {
        return rows;
    }

    @Override
    public List<String> columnNames() {
        return List.of("ensemble", "kT", "own kT", "U", "C/k", "S/k", "<N_0>", "Var N_0", "rel. diff U", "rel. diff C",
                "rel. diff S");
    }

    @Override
    public List<List<Object>> rows() {
        List<List<Object>> out = new ArrayList<>(rows.size());
        for (Row r : rows) {
            out.add(List.of(r.ensemble(), r.kT(), r.ownKT() == null ? NO_OWN_TEMPERATURE : r.ownKT(), r.energy(),
                    r.heatCapacity(), r.entropy(), r.groundMean(),
                    r.groundVariance() == null ? NO_GROUND_VARIANCE : r.groundVariance(), r.relEnergy(), r.relHeatCapacity(),
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
                        g.relHeatCapacity(), g.relEntropy(), c.groundVariance() == null ? NO_GROUND_VARIANCE : c.groundVariance(),
                        g.groundVariance()));
            }
            return out;
        }
    }
}
