package org.microtally.notebook.render;

import java.util.ArrayList;
import java.util.List;
import org.microtally.Tabular;
import org.microtally.limit.ReferenceTable;
import org.microtally.structure.MassRadiusCurve;

/**
 * The displays of thermodynamic-limit references and of the stellar baselines built on them: a
 * reference sweep's table with its charts against reduced temperature, and a white-dwarf
 * mass-radius curve with its units and model limits. Registered by {@link Renderers}.
 */
final class LimitDisplays {
    private LimitDisplays() { }

    static void registerAll(Renderers r) {
        r.put(ReferenceTable.class, LimitDisplays::referenceTable);
        r.put(MassRadiusCurve.class, LimitDisplays::massRadiusCurve);
        r.put(org.microtally.structure.CompactStar.class, LimitDisplays::compactStar);
    }

    /**
     * One white dwarf or neutron-star model: its one-row table, captioned with what it is and its
     * mass, radius and central density in their units, and the model's limits as a note.
     */
    static MimeBundle compactStar(org.microtally.structure.CompactStar s) {
        boolean dwarf = s instanceof org.microtally.structure.WhiteDwarf;
        String kind = dwarf ? "White dwarf, mu_e = " + CellText.floating(((org.microtally.structure.WhiteDwarf) s).muE(), 4)
                : "Neutron star (toy model)";
        // kg/m^3 to g/cm^3: 1 g/cm^3 = 1000 kg/m^3
        String caption = String.format("%s: M = %s M_sun, R = %s km, rho_c = %s g/cm^3", kind,
                CellText.floating(s.solarMasses(), 5), CellText.floating(s.radiusKm(), 5), powerOfTen(s.centralDensity() / 1e3));
        String limits = dwarf ? WHITE_DWARF_LIMITS
                : "Model limits: ideal cold neutron gas in general relativity (TOV); no nuclear forces, no protons or"
                + " electrons: real neutron stars are heavier (about 2 M_sun observed). A toy, not a prediction.";
        return TableDisplay.bundle(s, caption, List.of(limits));
    }

    private static final String WHITE_DWARF_LIMITS = "Model limits: ideal cold electrons, Newtonian, non-rotating;"
            + " no Coulomb corrections, neutronisation or general-relativistic instability. Real white dwarfs"
            + " are smaller and their maximum mass lies below M_Ch: a baseline, not a prediction for a real star.";


    /**
     * A reference sweep: its table and one chart per dimensionless quantity (at most two), against the
     * reduced temperature, on a log axis where the temperatures span more than two decades. Where a
     * quantity "q" comes with a variant "q Sommerfeld", the first chart is the relative difference of
     * the variants ({@link #variantAgreement}, log-log) and the second the first such quantity alone.
     */
    static MimeBundle referenceTable(ReferenceTable t) {
        MimeBundle table = TableDisplay.bundle(t, "Thermodynamic-limit reference values", List.of());
        List<String> ys = new ArrayList<>();
        String x = referenceAxes(t, ys);
        if (x == null || ys.isEmpty() || t.rows().size() < 2) {
            return table;
        }
        int xc = t.columnNames().indexOf(x);
        double lo = Double.POSITIVE_INFINITY;
        double hi = 0;
        for (List<Object> r : t.rows()) {
            if (r.get(xc) instanceof Number n && n.doubleValue() > 0) {
                lo = Math.min(lo, n.doubleValue());
                hi = Math.max(hi, n.doubleValue());
            }
        }
        boolean logX = lo > 0 && hi / lo > 100;
        // one chart per quantity: a column "q Sommerfeld" (any "q <variant>") is drawn with "q"
        java.util.Map<String, List<String>> groups = new java.util.LinkedHashMap<>();
        for (String y : ys) {
            String base = y;
            for (String other : ys) {
                if (y.startsWith(other + " ")) {
                    base = other;
                }
            }
            groups.computeIfAbsent(base, k -> new ArrayList<>()).add(y);
        }
        List<org.knowm.xchart.XYChart> charts = new ArrayList<>();
        var agreement = variantAgreement(t, x, groups);
        if (agreement != null) {
            agreement.getStyler().setXAxisLogarithmic(lo > 0);
            charts.add(agreement);
        }
        for (var g : groups.entrySet()) {
            if (charts.size() == 2) {
                break;
            }
            if (agreement != null && g.getValue().size() > 1 && charts.size() == 1) {
                // the agreement chart shows how the variants differ; here the quantity itself, once
                var c = Charts.line(t, x, g.getKey());
                c.setTitle(g.getKey() + " against " + x);
                c.setYAxisTitle(g.getKey());
                c.getStyler().setXAxisLogarithmic(logX);
                charts.add(c);
                continue;
            }
            var c = Charts.line(t, x, g.getValue().toArray(new String[0]));
            c.setTitle(g.getKey() + " against " + x);
            c.setYAxisTitle(g.getKey());
            c.getStyler().setXAxisLogarithmic(logX);
            charts.add(c);
        }
        return Charts.combine(table, charts.toArray(new org.knowm.xchart.XYChart[0]));
    }

    /**
     * A white-dwarf mass-radius curve: its table, captioned with mu_e, the central-density range and
     * the mass and radius ranges in their units, and the model's limits as a note (the numbers are a
     * baseline, not a prediction for a real star).
     */
    static MimeBundle massRadiusCurve(MassRadiusCurve c) {
        var models = c.models();
        if (models.isEmpty()) {
            return TableDisplay.bundle(c, "White-dwarf mass-radius curve: no models", List.of());
        }
        var first = models.get(0);
        var last = models.get(models.size() - 1);
        double mMin = Double.POSITIVE_INFINITY;
        double mMax = 0;
        double rMin = Double.POSITIVE_INFINITY;
        double rMax = 0;
        for (var m : models) {
            mMin = Math.min(mMin, m.solarMasses());
            mMax = Math.max(mMax, m.solarMasses());
            rMin = Math.min(rMin, m.radiusKm());
            rMax = Math.max(rMax, m.radiusKm());
        }
        // kg/m^3 to g/cm^3: 1 g/cm^3 = 1000 kg/m^3 (SI definition of the units)
        String caption = String.format("White-dwarf mass-radius curve, mu_e = %s: %d models, rho_c = %s to %s g/cm^3,"
                        + " M = %s to %s M_sun, R = %s to %s km", CellText.floating(first.muE(), 4), models.size(),
                powerOfTen(first.centralDensity() / 1e3), powerOfTen(last.centralDensity() / 1e3),
                CellText.floating(mMin, 4), CellText.floating(mMax, 4), CellText.floating(rMin, 4),
                CellText.floating(rMax, 4));
        return TableDisplay.bundle(c, caption, List.of(WHITE_DWARF_LIMITS));
    }

    /** A positive value as mantissa and decimal exponent, {@code 1e6}, {@code 3.16e10} (densities that span decades). */
    private static String powerOfTen(double v) {
        int e = (int) Math.floor(Math.log10(v));
        String m = CellText.floating(v / Math.pow(10, e), 3);
        if (m.equals("10")) {
            m = "1";
            e++;
        }
        return m + "e" + e;
    }

    /**
     * How far the variant columns ("q Sommerfeld") are from their quantity ("q"): |variant / q - 1|
     * for every quantity that has a variant, on log-log axes, so that lines that would lie on top of
     * each other on a linear scale become a readable comparison (the error of a low-temperature series
     * grows as a power of T). Null when no quantity has a variant.
     */
    static org.knowm.xchart.XYChart variantAgreement(ReferenceTable t, String x,
                                                     java.util.Map<String, List<String>> groups) {
        List<String> names = new ArrayList<>(List.of(x));
        List<int[]> pairs = new ArrayList<>();
        String variant = null;
        for (var g : groups.entrySet()) {
            for (String v : g.getValue()) {
                if (!v.equals(g.getKey())) {
                    names.add(g.getKey());
                    pairs.add(new int[] {t.columnNames().indexOf(g.getKey()), t.columnNames().indexOf(v)});
                    variant = v.substring(g.getKey().length() + 1);
                    break;
                }
            }
        }
        if (pairs.isEmpty()) {
            return null;
        }
        int xc = t.columnNames().indexOf(x);
        List<List<Object>> rows = new ArrayList<>();
        for (List<Object> r : t.rows()) {
            List<Object> row = new ArrayList<>();
            row.add(r.get(xc));
            for (int[] p : pairs) {
                Object base = r.get(p[0]);
                Object other = r.get(p[1]);
                row.add(base instanceof Number b && other instanceof Number o && b.doubleValue() != 0
                        ? Math.abs(o.doubleValue() / b.doubleValue() - 1) : null);
            }
            rows.add(row);
        }
        String yTitle = "|" + variant + " / exact - 1|";
        var c = Charts.line(Tables.tabular(names, rows), x, names.subList(1, names.size()).toArray(new String[0]));
        c.setTitle(variant + " relative to the exact value, against " + x);
        c.setYAxisTitle(yTitle);
        c.getStyler().setYAxisLogarithmic(true);
        return c;
    }

    /**
     * The chart axes of a reference sweep: x is the first reduced-temperature column (named
     * {@code T/...}), y every other column not ending in a unit in parentheses such as
     * {@code " (K)"} (the dimensionless ones, which share a scale). Returns x, or null when there is no reduced temperature; fills {@code ys}.
     */
    static String referenceAxes(Tabular t, List<String> ys) {
        String x = null;
        for (String c : t.columnNames()) {
            if (c.startsWith("T/")) {
                x = c;
                break;
            }
        }
        if (x == null) {
            return null;
        }
        for (String c : t.columnNames()) {
            if (!c.equals(x) && !c.matches(".* \\([^()]*\\)")) {
                ys.add(c);
            }
        }
        return x;
    }
}
