package org.microtally.count;

import java.math.BigInteger;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.Collections;
import java.util.List;
import java.util.Objects;
import org.microtally.Inputs;
import org.microtally.InvalidInputException;
import org.microtally.MemoryEstimate;
import org.microtally.ProgressListener;
import org.microtally.Tabular;
import org.microtally.spectrum.Spectrum;
import org.microtally.spectrum.Statistics;
import org.microtally.exact.Combinatorics;

/**
 * Exact counts resolved by a second conserved quantity: Omega(n, e, L), the number of microstates of
 * n particles with total energy e and total label L = sum of the occupied states' labels (for
 * example L = 2M, twice the total angular-momentum projection, with {@link
 * org.microtally.spectrum.Spectra#spinInField} or a shell of j-orbitals labelled by 2m). Immutable.
 *
 * <p>Two modes: {@link #of} constrains the energy to 0..E exactly like {@link CountTable};
 * {@link #ignoringEnergy} counts by (n, L) alone, every level of the spectrum taking part whatever
 * its energy (which may then be any real number), as needed to size many-body bases. Labels of an
 * unlabelled spectrum are all 0.
 *
 * <p><b>Formula.</b> Omega(n, e, L) is the coefficient of x^n q^e z^L in the trivariate generating
 * function prod_l F_l(x q^(e_l) z^(m_l)), where level l has energy e_l, label m_l and degeneracy g_l,
 * and F_l is the level factor of {@link CountTable}: (1 - y)^(-g_l) for Bose, (1 + y)^(g_l) for Fermi,
 * (1 + y + ... + y^k)^(g_l) for maxOccupancy(k). For distinguishable particles the count is
 * [q^e z^L] Z1(q, z)^n with Z1 = sum_l g_l q^(e_l) z^(m_l).
 *
 * <p><b>Method.</b> The product of ordinary generating functions counts the ways to pick an
 * occupation of each level independently with the exponents adding up (the product rule for ordinary
 * generating functions: H. S. Wilf, generatingfunctionology, 2nd ed. (1994), ch. 1-2, and R. P. Stanley,
 * Enumerative Combinatorics vol. 1, 2nd ed. (2012), ch. 1; both from memory, chapters not re-checked).
 * Each level is applied once as its truncated series sum_j c_j y^j ({@code LevelSeries}, j &lt;= min(N,
 * E / e_l)), in place, rows n from high to low so each level is used once. Distinguishable particles
 * multiply row n - 1 by Z1. Cost O(N E W sum_l J_l) BigInteger multiply-adds for a label window of
 * width W = N (max label - min label) + 1; table memory (N+1)(E+1)W entries, refused above half the heap.
 *
 * <p><b>Accuracy.</b> Exact: BigInteger arithmetic throughout (no modular path, no double); the
 * tests compare it with brute-force enumeration and with closed forms.
 *
 * <p><b>Completeness under a spectrum cutoff.</b> For a spectrum truncated at C (integer energies, so
 * every omitted level lies at C + 1 or above), a microstate the table misses has one particle at
 * &gt;= floor(C) + 1 and the other n - 1 at least at their lowest possible energy E_low(n - 1) (levels
 * filled from the bottom, particles beyond the kept levels' capacity counted at floor(C) + 1). So row n
 * is exact for the untruncated spectrum through e = floor(C) + E_low(n - 1)
 * ({@link #completeThroughEnergy(int)}). {@link #count}, {@link #countAtLabel} and
 * {@link #countAllLabels} refuse entries beyond that with a message saying how far to raise the cutoff;
 * {@link #truncatedModelCount} gives the count for the truncated spectrum as it is, and the table rows
 * carry a "complete" column. Counting with energy ignored needs a spectrum that is not truncated.
 */
public final class LabelledCountTable implements Tabular {
    private final Spectrum spectrum;
    private final Statistics statistics;
    private final int maxN;
    private final int maxE;
    private final boolean energyIgnored;
    private final int labelLo;
    private final int width;
    private final BigInteger[] counts;
    private final int[] completeThrough;

    LabelledCountTable(Spectrum spectrum, Statistics statistics, int maxN, int maxE, boolean energyIgnored,
                       int labelLo, int width, BigInteger[] counts) {
        this.completeThrough = new int[maxN + 1];
        for (int n = 0; n <= maxN; n++) {
            completeThrough[n] = completeThrough(spectrum, statistics, n, maxE);
        }
        this.spectrum = spectrum;
        this.statistics = statistics;
        this.maxN = maxN;
        this.maxE = maxE;
        this.energyIgnored = energyIgnored;
        this.labelLo = labelLo;
        this.width = width;
        this.counts = counts;
    }

    /** Row n's completeness limit (class notes): E when n = 0 or nothing is truncated, else min(E, floor(C) + E_low(n - 1)). */
    static int completeThrough(Spectrum spectrum, Statistics statistics, int n, int maxE) {
        long c = n == 0 || !spectrum.isTruncated() ? maxE
                : (long) Math.floor(spectrum.cutoffEnergy()) + lowestEnergyBound(spectrum, statistics, n - 1);
        return (int) Math.min(maxE, c);
    }

    /** Counts by (n, e, L) for n &lt;= N, e &lt;= E; energies must be integers &gt;= 0 (as for {@link CountTable}). */
    public static LabelledCountTable of(Spectrum spectrum, Statistics statistics, int maxParticles, int maxEnergy) {
        return of(spectrum, statistics, maxParticles, maxEnergy, ProgressListener.NONE);
    }

    /** As {@link #of(Spectrum, Statistics, int, int)}, reporting progress per level. */
    public static LabelledCountTable of(Spectrum spectrum, Statistics statistics, int maxParticles, int maxEnergy,
                                        ProgressListener progress) {
        return build(spectrum, statistics, Layout.of(spectrum, statistics, maxParticles, maxEnergy, false), progress);
    }

    /** Counts by (n, L) alone, for n &lt;= N, every level taking part; energies are not used. */
    public static LabelledCountTable ignoringEnergy(Spectrum spectrum, Statistics statistics, int maxParticles) {
        return build(spectrum, statistics, Layout.of(spectrum, statistics, maxParticles, 0, true), ProgressListener.NONE);
    }

    /**
     * As {@link #of(Spectrum, Statistics, int, int)}, by the multi-modular path of
     * {@link LabelledPrimePlan} (residues modulo primes &gt; 2^61, Chinese remaindering, one redundant
     * prime checking the reconstruction): the same table entry by entry.
     */
    public static LabelledCountTable multiModular(Spectrum spectrum, Statistics statistics, int maxParticles,
                                                  int maxEnergy) {
        LabelledPrimePlan plan = LabelledPrimePlan.forTable(spectrum, statistics, maxParticles, maxEnergy, 1);
        return plan.table(plan.residuesLocally());
    }

    /** As {@link #ignoringEnergy}, by the multi-modular path of {@link LabelledPrimePlan}. */
    public static LabelledCountTable multiModularIgnoringEnergy(Spectrum spectrum, Statistics statistics,
                                                                int maxParticles) {
        LabelledPrimePlan plan = LabelledPrimePlan.forTableIgnoringEnergy(spectrum, statistics, maxParticles, 1);
        return plan.table(plan.residuesLocally());
    }

    /**
     * The validated integer inputs of one labelled table and its layout: levels taking part, label
     * window [labelLo, labelLo + width), cells (n, e, L) at index (n (E + 1) + e) width + L - labelLo.
     * Serializable, so a worker can run the recursion modulo a prime without the spectrum.
     */
    static final class Layout implements java.io.Serializable {
        private static final long serialVersionUID = 1L;
        final int[] energy;
        final int[] labels;
        final int[] deg;
        final Statistics.Kind kind;
        final int maxOccupancy;
        final int maxN;
        final int maxE;
        final boolean energyIgnored;
        final int levels;
        final int labelLo;
        final int width;

        private Layout(int[] energy, int[] labels, int[] deg, Statistics stats, int maxN, int maxE,
                       boolean energyIgnored, int levels, int labelLo, int width) {
            this.energy = energy;
            this.labels = labels;
            this.deg = deg;
            this.kind = stats.kind();
            this.maxOccupancy = stats.maxOccupancy();
            this.maxN = maxN;
            this.maxE = maxE;
            this.energyIgnored = energyIgnored;
            this.levels = levels;
            this.labelLo = labelLo;
            this.width = width;
        }

        Statistics statistics() {
            return new Statistics(kind, maxOccupancy);
        }

        int cells() {
            return (maxN + 1) * (maxE + 1) * width;
        }

        static Layout of(Spectrum spectrum, Statistics stats, int maxN, int maxE, boolean ignore) {
            int[] energy;
            if (ignore) {
                Objects.requireNonNull(spectrum, "spectrum");
                Objects.requireNonNull(stats, "statistics");
                Inputs.atLeast("maximum particle number N", maxN, 0);
                if (spectrum.isTruncated() && maxN > 0) {
                    throw InvalidInputException.of("spectrum cutoff for counting with energy ignored",
                            spectrum.cutoffEnergy(),
                            "+infinity (a complete, finite spectrum): with energy ignored every level takes part, "
                                    + "so the levels a cutoff omits would change every count with n >= 1",
                            "Give the finite model space itself (Spectrum.of with cutoff +infinity), or count with "
                                    + "energy (LabelledCountTable.of) below completeThroughEnergy(n).");
                }
                energy = new int[spectrum.size()];
            } else {
                energy = CountTable.Input.validate(spectrum, stats, maxN, maxE, ProgressListener.NONE).energy;
            }
            int levels = CountEngine.relevantLevels(energy, maxE);
            int[] labels = new int[spectrum.size()];
            long lo = 0;
            long hi = 0;
            for (int l = 0; l < labels.length; l++) {
                labels[l] = spectrum.label(l);
                if (l < levels) {
                    lo = Math.min(lo, labels[l]);
                    hi = Math.max(hi, labels[l]);
                }
            }
            long labelLo = lo * maxN;
            long labelHi = hi * maxN;
            double cells = (maxN + 1.0) * (maxE + 1.0) * (labelHi - labelLo + 1.0);
            double limit = Runtime.getRuntime().maxMemory() * 0.5;
            if (cells * 64 > limit || cells > Integer.MAX_VALUE - 16) {
                throw InvalidInputException.of("labelled table size (N+1) x (E+1) x (label range)",
                        String.format("%d x %d x %d = %.3g entries, about %s", maxN + 1L, maxE + 1L,
                                labelHi - labelLo + 1, cells, MemoryEstimate.human(cells * 64)),
                        String.format("at most 2^31 - 17 entries and %s (half the maximum heap)",
                                MemoryEstimate.human(limit)),
                        "Lower N or E, or count without the label (CountTable).");
            }
            return new Layout(energy, labels, spectrum.degeneracies(), stats, maxN, maxE, ignore, levels,
                    (int) labelLo, (int) (labelHi - labelLo + 1));
        }

        /**
         * Walks the recursion of the class notes: for each level (or, distinguishable, each n) every
         * shifted addition t[dst + (e, L)] += c t[src + (e - de, L - dl)], in the order that uses each
         * level once; dst and src are the offsets of rows n and n - j.
         */
        void walk(Ticker ticker, ShiftSink sink) {
            Statistics stats = statistics();
            int we = (maxE + 1) * width;
            if (stats.indistinguishable()) {
                for (int l = 0; l < levels; l++) {
                    int el = energy[l];
                    BigInteger[] c = LevelSeries.coefficients(stats, deg[l], CountEngine.maxJ(el, maxN, maxE));
                    for (int n = maxN; n >= 1; n--) {
                        int jTop = Math.min(n, c.length - 1);
                        for (int j = 1; j <= jTop && j * el <= maxE; j++) {
                            sink.add(n * we, (n - j) * we, c[j], j * el, j * labels[l]);
                        }
                    }
                    ticker.step();
                }
            } else {
                for (int n = 1; n <= maxN; n++) {
                    for (int l = 0; l < levels; l++) {
                        sink.add(n * we, (n - 1) * we, BigInteger.valueOf(deg[l]), energy[l], labels[l]);
                    }
                    ticker.step();
                }
            }
        }

        /** Steps the walk reports: levels (indistinguishable) or particles. */
        Ticker ticker(ProgressListener progress) {
            boolean ind = kind != Statistics.Kind.DISTINGUISHABLE;
            return new Ticker(progress, ind ? levels : maxN, ind ? "levels" : "particles");
        }
    }

    /** One shifted addition of the recursion (see {@link Layout#walk}). */
    interface ShiftSink {
        void add(int dst, int src, BigInteger c, int de, int dl);
    }

    private static LabelledCountTable build(Spectrum spectrum, Statistics stats, Layout layout,
                                            ProgressListener progress) {
        int w = layout.width;
        BigInteger[] t = new BigInteger[layout.cells()];
        Arrays.fill(t, BigInteger.ZERO);
        t[-layout.labelLo] = BigInteger.ONE;
        layout.walk(layout.ticker(progress), (dst, src, c, de, dl) -> addShifted(t, dst, src, c, de, dl, layout.maxE, w));
        return new LabelledCountTable(spectrum, stats, layout.maxN, layout.maxE, layout.energyIgnored, layout.labelLo,
                w, t);
    }

    /** t[dst][e][L] += c * t[src][e - de][L - dl] over every valid (e, L). */
    private static void addShifted(BigInteger[] t, int dst, int src, BigInteger c, int de, int dl, int maxE, int w) {
        int lFrom = Math.max(0, dl);
        int lTo = Math.min(w - 1, w - 1 + dl);
        for (int e = de; e <= maxE; e++) {
            int d = dst + e * w;
            int s = src + (e - de) * w - dl;
            for (int li = lFrom; li <= lTo; li++) {
                BigInteger v = t[s + li];
                if (v.signum() != 0) {
                    t[d + li] = t[d + li].add(c.multiply(v));
                }
            }
        }
    }

    /**
     * Omega(n, e, L) (0 for a label total outside the table's window), exact for the untruncated
     * spectrum.
     *
     * @throws InvalidInputException for e beyond {@link #completeThroughEnergy(int)} (use
     *                               {@link #truncatedModelCount} for the truncated spectrum's count)
     */
    public BigInteger count(int n, int e, int labelTotal) {
        BigInteger v = truncatedModelCount(n, e, labelTotal);
        if (e > completeThrough[n]) {
            throw incomplete(n, e);
        }
        return v;
    }

    private InvalidInputException incomplete(int n, int e) {
        long need = (long) e - completeThrough[n] + (long) Math.floor(spectrum.cutoffEnergy());
        return InvalidInputException.of("total energy e for n = " + n, e, "at most " + completeThrough[n]
                        + ": the spectrum is truncated at " + spectrum.cutoffEnergy() + " and above that energy the "
                        + "omitted levels add microstates this table lacks (" + spectrum.cutoffNote() + ")",
                "Rebuild the spectrum with a cutoff of at least " + need + ", or call truncatedModelCount(n, e, L) "
                        + "for the count in the truncated spectrum as given.");
    }

    /**
     * Omega(n, e, L) in the spectrum exactly as given, levels above its cutoff absent: the number the
     * generating function gives, with no completeness check (the finite model's own count).
     */
    public BigInteger truncatedModelCount(int n, int e, int labelTotal) {
        checkN(n);
        if (e < 0 || e > maxE) {
            throw InvalidInputException.of("total energy e", e, "in [0, " + maxE + "]",
                    energyIgnored ? "This table ignores energy: use countAtLabel(n, L)." : "Build a larger table.");
        }
        long li = (long) labelTotal - labelLo;
        if (li < 0 || li >= width) {
            return BigInteger.ZERO;
        }
        return counts[(n * (maxE + 1) + e) * width + (int) li];
    }

    /** sum over e &lt;= E of Omega(n, e, L); for a table that ignores energy, the count by (n, L). */
    public BigInteger countAtLabel(int n, int labelTotal) {
        BigInteger s = BigInteger.ZERO;
        for (int e = 0; e <= maxE; e++) {
            s = s.add(count(n, e, labelTotal));
        }
        return s;
    }

    /** sum over L of Omega(n, e, L): the unlabelled count. */
    public BigInteger countAllLabels(int n, int e) {
        BigInteger s = BigInteger.ZERO;
        for (int li = 0; li < width; li++) {
            s = s.add(count(n, e, labelLo + li));
        }
        return s;
    }

    /**
     * The largest total energy through which row n equals the untruncated spectrum's count
     * (see the class notes): E when the spectrum is not truncated or n = 0, else
     * min(E, floor(C) + E_low(n - 1)).
     */
    public int completeThroughEnergy(int n) {
        checkN(n);
        return completeThrough[n];
    }

    /**
     * The largest total energy through which every row n &gt;= 1 is complete, min(E, floor(C)) for a
     * truncated spectrum (the same safe number as {@link CountTable#completeThroughEnergy()}).
     */
    public int completeThroughEnergy() {
        int c = maxE;
        for (int n = 1; n <= maxN; n++) {
            c = Math.min(c, completeThrough[n]);
        }
        return c;
    }

    /**
     * A lower bound on the lowest total energy of n particles of the untruncated spectrum: levels
     * filled from the bottom (k per state for capped statistics), particles beyond the kept levels'
     * capacity at floor(C) + 1, or "unbounded" (Long.MAX_VALUE / 4) when the spectrum is complete and
     * cannot hold them (then no such microstate exists). Energies are the spectrum's integers.
     */
    static long lowestEnergyBound(Spectrum s, Statistics st, int n) {
        int[] e = s.integerEnergies();
        if (!st.capped()) {
            return (long) n * e[0];
        }
        long left = n;
        long total = 0;
        for (int i = 0; i < e.length && left > 0; i++) {
            long put = Math.min(left, (long) s.degeneracy(i) * st.maxOccupancy());
            total += put * e[i];
            left -= put;
        }
        if (left > 0) {
            return s.isTruncated() ? total + left * ((long) Math.floor(s.cutoffEnergy()) + 1) : Long.MAX_VALUE / 4;
        }
        return total;
    }

    /** Smallest label total in the table's window (N times the smallest label, or 0). */
    public int minLabelTotal() {
        return labelLo;
    }

    /** Largest label total in the table's window. */
    public int maxLabelTotal() {
        return labelLo + width - 1;
    }

    /** N. */
    public int maxParticles() {
        return maxN;
    }

    /** E (0 for a table that ignores energy). */
    public int maxEnergy() {
        return maxE;
    }

    /** Whether energies were ignored ({@link #ignoringEnergy}). */
    public boolean energyIgnored() {
        return energyIgnored;
    }

    /** The statistics counted. */
    public Statistics statistics() {
        return statistics;
    }

    /** The spectrum counted. */
    public Spectrum spectrum() {
        return spectrum;
    }

    /** The slice at n particles as [e][L - minLabelTotal] (copies). */
    BigInteger[][] slice(int n) {
        checkN(n);
        BigInteger[][] out = new BigInteger[maxE + 1][];
        for (int e = 0; e <= maxE; e++) {
            int from = (n * (maxE + 1) + e) * width;
            out[e] = Arrays.copyOfRange(counts, from, from + width);
        }
        return out;
    }

    private void checkN(int n) {
        if (n < 0 || n > maxN) {
            throw InvalidInputException.of("particle number n", n, "in [0, " + maxN + "]", "Build a larger table.");
        }
    }

    /**
     * Columns n, E, label total, Omega, complete (E and complete omitted when energy is ignored);
     * complete is false where the spectrum's cutoff makes the entry the truncated model's count only.
     */
    @Override
    public List<String> columnNames() {
        return energyIgnored ? List.of("n", "label total", "Omega")
                : List.of("n", "E", "label total", "Omega", "complete");
    }

    /** One row per non-zero entry. */
    @Override
    public List<List<Object>> rows() {
        List<List<Object>> out = new ArrayList<>();
        for (int n = 0; n <= maxN; n++) {
            for (int e = 0; e <= maxE; e++) {
                for (int li = 0; li < width; li++) {
                    BigInteger v = counts[(n * (maxE + 1) + e) * width + li];
                    if (v.signum() != 0) {
                        out.add(energyIgnored ? List.of(n, labelLo + li, v)
                                : List.of(n, e, labelLo + li, v, e <= completeThrough[n]));
                    }
                }
            }
        }
        return Collections.unmodifiableList(out);
    }
}
