package org.microtally.notebook.render;

import java.util.ArrayList;
import java.util.List;
import org.microtally.Tabular;
import org.microtally.count.CountTable;
import org.microtally.count.LabelledCountTable;
import org.microtally.count.MacrostateHistogram;
import org.microtally.count.SharedTotal;
import org.microtally.spectrum.Spectrum;
import org.microtally.spectrum.Statistics;

/**
 * The displays of the core result types: a table (a compact view where the result is large), a
 * chart under it where a picture helps, and a formula where a closed form is known. Registered by
 * {@link Renderers}; a display that fails falls back to plain text there.
 */
final class ResultDisplays {
    /** Most particle-number columns in the grid view of a label-resolved count table. */
    static final int GRID_COLUMNS = 9;
    /** Count grids show exact integers in full up to 20 digits, longer ones as 10 leading digits and their digit count. */
    static final TableFormat GRID_FORMAT = new TableFormat(20, 10, 6, 60, 20);
    /**
     * Width in CSS pixels a count grid may take: the output column of the standalone page at a 1280 px
     * window (the page's 62rem main column less its padding and the prompt column, at 16 px per rem)
     * and a little less than Jupyter Notebook's output area at that width.
     */
    static final int GRID_WIDTH_PX = 880;

    /**
     * Width in CSS pixels of a grid column whose widest cell has {@code chars} characters: the table
     * cells' monospace font (0.82em of 16 px, 0.6 em per character, 7.9 px) plus 0.6em padding each side.
     */
    static int columnPixels(int chars) {
        return (int) Math.ceil(chars * 7.9 + 16);
    }

    private ResultDisplays() { }

    static void registerAll(Renderers r) {
        r.put(CountTable.class, ResultDisplays::countTable);
        r.put(LabelledCountTable.class, ResultDisplays::labelledCountTable);
        r.put(MacrostateHistogram.class, ResultDisplays::histogram);
        r.put(SharedTotal.class, ResultDisplays::sharedTotal);
    }

    // ---- count tables

    /** The particle numbers shown as grid columns: every n when N + 1 <= 9, else 9 evenly spaced n from 0 to N (0, N/8, ..., N). */
    static int[] gridColumns(int maxN) {
        return evenlySpaced(maxN, Math.min(maxN + 1, GRID_COLUMNS));
    }

    /** {@code k} particle numbers evenly spaced from 0 to N, both included (k >= 2, or every n when k > N). */
    static int[] evenlySpaced(int maxN, int k) {
        if (k >= maxN + 1) {
            int[] all = new int[maxN + 1];
            for (int n = 0; n <= maxN; n++) {
                all[n] = n;
            }
            return all;
        }
        int[] some = new int[k];
        for (int i = 0; i < k; i++) {
            some[i] = (int) Math.round((double) i * maxN / (k - 1));
        }
        return some;
    }

    /**
     * The particle numbers of a count table's grid: every n = 0..N when all columns fit in
     * {@value #GRID_WIDTH_PX} px, else as many evenly spaced n from 0 to N (both kept) as fit, at least
     * two. A column's width is that of its widest entry as the grid shows it ({@link #GRID_FORMAT}).
     */
    static int[] gridColumns(CountTable t) {
        int maxN = t.maxParticles();
        int[] px = new int[maxN + 1];
        for (int n = 0; n <= maxN; n++) {
            java.math.BigInteger widest = java.math.BigInteger.ZERO;
            for (int e = 0; e <= t.maxEnergy(); e++) {
                widest = widest.max(t.count(n, e));
            }
            px[n] = columnPixels(Math.max(("n=" + n).length(), shownChars(widest)));
        }
        int room = GRID_WIDTH_PX - columnPixels(Math.max(1, String.valueOf(t.maxEnergy()).length()));
        for (int k = maxN + 1; k > 2; k--) {
            int[] ns = evenlySpaced(maxN, k);
            int used = 0;
            for (int n : ns) {
                used += px[n];
            }
            if (used <= room) {
                return ns;
            }
        }
        return evenlySpaced(maxN, 2);
    }

    /** Characters of a non-negative exact count as the grid shows it. */
    static int shownChars(java.math.BigInteger count) {
        int digits = count.toString().length();
        // a column with a count longer than maxDigits is scientific throughout (ColumnNumbers): d.ddddde+XX
        return digits <= GRID_FORMAT.maxDigits() ? digits
                : GRID_FORMAT.significantDigits() + 3 + Math.max(2, String.valueOf(digits - 1).length());
    }

    /** The particle numbers of 0..N not in {@code shown} (sorted), as ranges: {@code 1-3, 5-7, 9}. */
    static String omitted(int[] shown, int maxN) {
        boolean[] in = new boolean[maxN + 1];
        for (int n : shown) {
            in[n] = true;
        }
        StringBuilder sb = new StringBuilder();
        int n = 0;
        while (n <= maxN) {
            if (in[n]) {
                n++;
                continue;
            }
            int from = n;
            while (n + 1 <= maxN && !in[n + 1]) {
                n++;
            }
            sb.append(sb.length() == 0 ? "" : ", ").append(from == n ? String.valueOf(from) : from + "-" + n);
            n++;
        }
        return sb.toString();
    }

    /** Rows E = 0..E_max, one exact column per shown particle number. */
    static Tabular grid(CountTable t, int[] ns) {
        List<String> names = new ArrayList<>(ns.length + 1);
        names.add("E");
        for (int n : ns) {
            names.add("n=" + n);
        }
        List<List<Object>> rows = new java.util.AbstractList<>() {
            @Override
            public List<Object> get(int e) {
                List<Object> row = new ArrayList<>(ns.length + 1);
                row.add(e);
                for (int n : ns) {
                    row.add(t.count(n, e));
                }
                return row;
            }

            @Override
            public int size() {
                return t.maxEnergy() + 1;
            }
        };
        return Tables.tabular(names, rows);
    }

    static MimeBundle countTable(CountTable t) {
        int[] ns = gridColumns(t);
        List<String> notes = new ArrayList<>();
        notes.add("Omega(n, E): exact number of microstates of n " + t.statistics()
                + " particles with total energy E quanta.");
        if (t.completeThroughEnergy() < t.maxEnergy()) {
            notes.add("The spectrum is truncated: column n sums E <= completeThroughEnergy(n) only (the entries beyond "
                    + "it would miss microstates with a particle above the cutoff).");
        }
        if (ns.length < t.maxParticles() + 1) {
            notes.add("Not shown, to fit a 1280 px page: columns n = " + omitted(ns, t.maxParticles())
                    + "; every entry: count(n, E), or Tables.of(table) for all rows.");
        }
        if (t.completeThroughEnergy() < t.maxEnergy()) {
            notes.add("Entries with E > " + t.completeThroughEnergy() + " may miss levels above the spectrum cutoff.");
        }
        boolean einstein = isEinsteinSolid(t);
        if (einstein) {
            notes.add("Closed form: Omega(n, E) = C(E + n - 1, E), n distinguishable oscillators sharing E quanta.");
        }
        String caption = String.format("Exact counts Omega(n, E): %s, n <= %d, E <= %d, %s", t.statistics(),
                t.maxParticles(), t.maxEnergy(), levels(t.spectrum()));
        MimeBundle both = Charts.combine(TableDisplay.bundle(grid(t, ns), caption, notes, GRID_FORMAT), CountCharts.counts(t));
        return einstein ? withLatex(both, "$$\\Omega(n, E) = \\binom{E + n - 1}{E}$$") : both;
    }

    /**
     * Whether the table counts distinguishable particles on the non-degenerate, equally spaced
     * spectrum 0, 1, 2, ... (a 1D oscillator, the Einstein solid), complete through the table's E:
     * then Omega(n, E) = C(E + n - 1, E) (the number of ways to put E quanta into n oscillators).
     */
    static boolean isEinsteinSolid(CountTable t) {
        if (t.statistics().kind() != Statistics.Kind.DISTINGUISHABLE || t.completeThroughEnergy() < t.maxEnergy()) {
            return false;
        }
        Spectrum s = t.spectrum();
        if (s.isLabelled()) {
            return false;
        }
        for (int i = 0; i < s.size(); i++) {
            if (s.energy(i) != i || s.degeneracy(i) != 1) {
                return false;
            }
        }
        return s.topEnergy() >= t.maxEnergy() || s.isTruncated();
    }

    /**
     * A label-resolved table: counted by (n, label total) alone (energy ignored) it is shown as a
     * grid, rows L from the smallest to the largest label total, one exact column per shown particle
     * number (summed over E when energy was counted); every (n, E, L) entry stays available through
     * the rows and {@link Tables#of(Tabular)}.
     */
    /** Omega(n, L) summed over the energies through which row n is complete (all of them when nothing is cut). */
    private static java.math.BigInteger completeAtLabel(LabelledCountTable t, int n, int label) {
        if (t.energyIgnored() || t.completeThroughEnergy(n) >= t.maxEnergy()) {
            return t.countAtLabel(n, label);
        }
        java.math.BigInteger s = java.math.BigInteger.ZERO;
        for (int e = 0; e <= t.completeThroughEnergy(n); e++) {
            s = s.add(t.count(n, e, label));
        }
        return s;
    }

    static MimeBundle labelledCountTable(LabelledCountTable t) {
        int[] ns = gridColumns(t.maxParticles());
        List<String> names = new ArrayList<>(ns.length + 1);
        names.add("label total");
        for (int n : ns) {
            names.add("n=" + n);
        }
        int lo = t.minLabelTotal();
        List<List<Object>> rows = new java.util.AbstractList<>() {
            @Override
            public List<Object> get(int i) {
                List<Object> row = new ArrayList<>(ns.length + 1);
                row.add(lo + i);
                for (int n : ns) {
                    row.add(completeAtLabel(t, n, lo + i));
                }
                return row;
            }

            @Override
            public int size() {
                return t.maxLabelTotal() - lo + 1;
            }
        };
        List<String> notes = new ArrayList<>();
        notes.add(t.energyIgnored()
                ? "Omega(n, L): exact number of microstates of n " + t.statistics() + " particles with label total L "
                        + "(every level taking part, energy not constrained)."
                : "Omega(n, L) = sum over E <= " + t.maxEnergy() + " of Omega(n, E, L), exact, " + t.statistics()
                        + "; the rows of this table hold every (n, E, L).");
        if (t.completeThroughEnergy() < t.maxEnergy()) {
            notes.add("The spectrum is truncated: column n sums E <= completeThroughEnergy(n) only (the entries beyond "
                    + "it would miss microstates with a particle above the cutoff).");
        }
        if (ns.length < t.maxParticles() + 1) {
            notes.add("Not shown: columns n = " + omitted(ns, t.maxParticles()) + " (every n is in the table's rows).");
        }
        String caption = String.format("Label-resolved counts: %s, n <= %d%s, %s", t.statistics(), t.maxParticles(),
                t.energyIgnored() ? "" : ", E <= " + t.maxEnergy(), levels(t.spectrum()));
        return TableDisplay.bundle(Tables.tabular(names, rows), caption, notes, GRID_FORMAT);
    }

    // ---- histograms and shared totals

    static MimeBundle histogram(MacrostateHistogram h) {
        String caption = String.format("Macrostate histogram: totals %d..%d, %s microstates in all, most probable %s",
                h.minTotal(), h.maxTotal(), CellText.shown(h.totalMultiplicity(), TableFormat.DEFAULT),
                h.mostProbableTotals());
        return Charts.combine(TableDisplay.bundle(h, caption, List.of()), CountCharts.histogram(h));
    }

    static MimeBundle sharedTotal(SharedTotal s) {
        String caption = String.format("Shared total q = %d: most probable q_A = %d, mean %s, width %s",
                s.total(), s.mostProbableSplit(), CellText.floating(s.mean(), 8), CellText.floating(s.width(), 8));
        return Charts.combine(TableDisplay.bundle(s, caption, List.of()), CountCharts.split(s));
    }

    // ---- helpers

    /** A spectrum in a caption: {@code 41 levels (861 states) in hbar*omega}. */
    static String levels(Spectrum s) {
        return String.format("%,d levels (%,d states) in %s", s.size(), s.stateCount(), s.scale().name());
    }

    /** {@code bundle} with a text/latex representation added. */
    static MimeBundle withLatex(MimeBundle bundle, String latex) {
        MimeBundle.Builder b = MimeBundle.builder(bundle.plain());
        bundle.data().forEach((k, v) -> {
            if (!k.equals(MimeBundle.TEXT_PLAIN)) {
                b.put(k, v);
            }
        });
        return b.put(MimeBundle.TEXT_LATEX, latex).build();
    }
}
