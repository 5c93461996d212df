package org.microtally.ensemble;

import java.math.BigInteger;
import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.Objects;
import org.microtally.Inputs;
import org.microtally.InvalidInputException;
import org.microtally.Tabular;
import org.microtally.occupation.ChemicalPotential;
import org.microtally.spectrum.Level;
import org.microtally.spectrum.Spectrum;
import org.microtally.spectrum.Statistics;

/**
 * The canonical ensemble of N ideal particles on a labelled spectrum, resolved by the total label
 * L = sum of the occupied states' labels (2M for spin or shell-model m-states, 2 L_z or L_z for a
 * dot), and optionally coupled to the conjugate field h: H = H_0 - h L (a magnetic field on 2M in
 * units of its Zeeman quantum, a rotation frequency on L_z). Immutable.
 *
 * <h2>Definitions (k = 1, beta = 1/kT, energies in the spectrum's unit)</h2>
 * Z(L) = sum over N-particle microstates with total label L of e^{-beta (E_0 - h L)}: the canonical
 * partition function at fixed label (the constrained ensemble; the field enters it only as the factor
 * e^{beta h L}). Z = sum_L Z(L) is the field-coupled canonical ensemble; P(L) = Z(L)/Z; &lt;L&gt; and
 * Var L are its label moments, and beta Var L = d&lt;L&gt;/dh is the susceptibility. At fixed L:
 * U_0(L) = &lt;E_0&gt; (the energy without the field term), S(L)/k = ln Z(L) + beta (U_0(L) - h L),
 * which does not depend on h.
 *
 * <h2>Method</h2>
 * The generating function prod_states f(y_s t z^(m_s)) in particle number t and label z, with
 * f = 1 + w + ... + w^k (at most k per state, Fermi k = 1) or 1/(1 - w) (Bose), built state by state
 * with positive terms only (the symmetric-polynomial recurrences of {@link Canonical} with the label
 * exponent carried along), Boltzmann factors y_s = e^{-beta(e_s - h m_s - mu*)} scaled by the grand
 * canonical mu* of the field-shifted spectrum, the first energy moment (energies from the ground
 * level, non-negative) carried alongside. Labelled (distinguishable) particles: [z^L] Z_1(z)^N.
 * The coefficient of t^N z^L is Z(L) e^{beta mu* N}. Cost S x N x W x k multiply-adds, memory 2 (N+1) W
 * doubles, W = N (max label - min label) + 1 the label window (refused above half the heap).
 *
 * <h2>Accuracy</h2>
 * As for {@link Canonical}: each Z(L) is a sum of non-negative terms, relative error below
 * (S + N) 2^-53 from rounding, plus flushing of underflowed mantissas, bounded for each L by
 * S (N+1) W 2^-1073 / P_GC(N, L) with P_GC(N, L) the grand canonical probability at mu* and h
 * (labelled particles: P(L) itself, the rows summing to Z_1^k). Zero weights are told from flushed ones
 * by an exact reachability pass over the label totals (the same recursion on bits). A label
 * whose bound exceeds 1e-12 is <em>unresolved</em>: {@link #lnZAtLabel} refuses it (raise or lower h
 * to move the label distribution's peak towards it) instead of returning a wrong number.
 *
 * <p>Model limits: ideal particles. A truncated spectrum in a field can hide low-lying states: levels
 * above the cutoff may carry large labels that the field lowers by h times their label; a warning
 * says so when h != 0 and the spectrum is truncated.
 */
public final class LabelledCanonical implements Tabular {

    private final Spectrum spectrum;
    private final Statistics statistics;
    private final int n;
    private final double kT;
    private final double field;
    private final double scaleMu;
    private final int labelLo;
    private final double[] lnZL;
    private final double[] energyL;
    private final boolean[] resolved;
    private final boolean[] reached;
    private final double lnZ;
    private final List<String> warnings;

    private LabelledCanonical(Spectrum spectrum, Statistics statistics, int n, double kT, double field, double scaleMu,
                              int labelLo,
                              double[] lnZL, double[] energyL, boolean[] resolved, boolean[] reached,
                              List<String> warnings) {
        this.spectrum = spectrum;
        this.statistics = statistics;
        this.n = n;
        this.kT = kT;
        this.field = field;
        this.scaleMu = scaleMu;
        this.labelLo = labelLo;
        this.lnZL = lnZL;
        this.energyL = energyL;
        this.resolved = resolved;
        this.reached = reached;
        double max = Double.NEGATIVE_INFINITY;
        for (double x : lnZL) {
            max = Math.max(max, x);
        }
        double s = 0;
        for (double x : lnZL) {
            s += x == Double.NEGATIVE_INFINITY ? 0 : Math.exp(x - max);
        }
        this.lnZ = max + Math.log(s);
        this.warnings = Collections.unmodifiableList(warnings);
    }

    /** The ensemble without a field (h = 0); see the class notes. */
    public static LabelledCanonical of(Spectrum spectrum, Statistics statistics, int n, double kT) {
        return inField(spectrum, statistics, n, kT, 0.0);
    }

    /**
     * The ensemble in the conjugate field {@code h} (H = H_0 - h L).
     *
     * @throws InvalidInputException for an unlabelled spectrum, kT &lt;= 0, h not finite, N outside
     *                               [1, capacity], or a table above half the heap
     */
    public static LabelledCanonical inField(Spectrum spectrum, Statistics statistics, int n, double kT, double h) {
        Objects.requireNonNull(spectrum, "spectrum");
        Objects.requireNonNull(statistics, "statistics");
        if (!spectrum.isLabelled()) {
            throw InvalidInputException.of("spectrum labels", "none (unlabelled spectrum)", "a labelled spectrum",
                    "Without labels every total label is 0: use Canonical.");
        }
        Inputs.temperature(kT);
        if (!Double.isFinite(h)) {
            throw InvalidInputException.of("field h", h, "a finite number", "");
        }
        long capacity = statistics.capped() ? (long) statistics.maxOccupancy() * spectrum.stateCount() : Long.MAX_VALUE;
        Inputs.withinCapacity("particle number N", n, statistics.maxOccupancy(), spectrum.stateCount());
        Inputs.particleNumber("particle number N", n, 100_000, "");
        int minLabel = Integer.MAX_VALUE;
        int maxLabel = Integer.MIN_VALUE;
        for (Level l : spectrum.levels()) {
            minLabel = Math.min(minLabel, l.label());
            maxLabel = Math.max(maxLabel, l.label());
        }
        double cells = LabelSeries.cells(n, minLabel, maxLabel);
        double limit = Runtime.getRuntime().maxMemory() * 0.5;
        if (cells * 16 > limit || cells > Integer.MAX_VALUE - 16) {
            throw InvalidInputException.of("label-resolved table (N + 1) x (label window)",
                    String.format("%.3g doubles, about %.3g MiB", 2 * cells, cells * 16 / (1 << 20)),
                    String.format("at most %.3g MiB (half the maximum heap)", limit / (1 << 20)),
                    "Lower N, or narrow the label range of the spectrum.");
        }
        Spectrum shifted = shifted(spectrum, h);
        double beta = 1 / kT;
        double e0 = spectrum.groundEnergy();
        double mu;
        if (statistics.indistinguishable()) {
            mu = ChemicalPotential.forMeanNumber(shifted, statistics, kT,
                    Math.min(n, statistics.capped() ? capacity - 0.5 : n));
        } else {
            mu = Double.POSITIVE_INFINITY;
            for (int i = 0; i < shifted.size(); i++) {
                mu = Math.min(mu, shifted.energy(i));
            }
        }
        LabelSeries z = series(spectrum, statistics, n, beta, h, mu, -1);
        GrandCanonical gc = statistics.indistinguishable()
                ? GrandCanonical.ofChemicalPotential(shifted, statistics, kT, mu) : null;
        // the untruncated total the flushed mantissas are measured against: Xi at (mu*, h) for
        // indistinguishable particles; for labelled ones the row sum Z_1^N (every row k <= N sums to Z_1^k)
        double lnTotal;
        if (gc != null) {
            lnTotal = gc.lnXi();
        } else {
            double rowSum = 0;
            for (double x : z.c[n]) {
                rowSum += x;
            }
            lnTotal = Math.log(rowSum) + z.logScale;
        }
        double lnBase = z.lnFlushThreshold(spectrum.stateCount());
        double[] lnZL = new double[z.width];
        double[] energyL = new double[z.width];
        boolean[] resolved = new boolean[z.width];
        boolean[] reached = new boolean[z.width];
        int unresolved = 0;
        BigInteger reachable = reachableLabels(spectrum, statistics, n, z.lo);
        for (int i = 0; i < z.width; i++) {
            double c = z.c[n][i];
            reached[i] = reachable.testBit(i);
            if (c > 0 && !reached[i]) {
                throw new IllegalStateException("labelled series has weight at an unreachable label total; please report");
            }
            if (c <= 0) {
                lnZL[i] = Double.NEGATIVE_INFINITY;
                if (reached[i]) {
                    unresolved++; // reached by some microstate, but its weight was flushed
                }
                continue;
            }
            double lnEntry = Math.log(c) + z.logScale;
            lnZL[i] = lnEntry - beta * mu * n;
            energyL[i] = n * e0 + z.u[n][i] / c;
            resolved[i] = lnBase - (lnEntry - lnTotal) <= 0;
            if (!resolved[i]) {
                unresolved++;
            }
        }
        List<String> warnings = new ArrayList<>();
        if (gc != null) {
            warnings.addAll(gc.warnings());
        }
        if (h != 0 && spectrum.isTruncated()) {
            warnings.add("spectrum truncated at " + spectrum.cutoffEnergy() + " " + spectrum.scale().name()
                    + " and coupled to a field h = " + h + ": omitted levels may carry labels the field lowers by h x label; "
                    + "check that results do not move when the cutoff is raised");
        }
        if (unresolved > 0) {
            warnings.add(unresolved + " label total(s) far in the tails are below the flushing tolerance and are "
                    + "refused by lnZAtLabel; a field h moves the label distribution's peak towards them");
        }
        return new LabelledCanonical(spectrum, statistics, n, kT, h, mu, z.lo, lnZL, energyL, resolved, reached,
                warnings);
    }

    /**
     * The series of all states (indistinguishable: one state of level {@code skipLevel} left out when
     * it is >= 0), Boltzmann factors e^{-beta(e - h m - mu)}, energies from the ground level.
     * Labelled particles: the rows Z_1^k, k = 0..n (skipLevel unused).
     */
    static LabelSeries series(Spectrum spectrum, Statistics statistics, int n, double beta, double h, double mu,
                              int skipLevel) {
        int minLabel = Integer.MAX_VALUE;
        int maxLabel = Integer.MIN_VALUE;
        for (Level l : spectrum.levels()) {
            minLabel = Math.min(minLabel, l.label());
            maxLabel = Math.max(maxLabel, l.label());
        }
        double e0 = spectrum.groundEnergy();
        LabelSeries z = new LabelSeries(n, minLabel, maxLabel);
        if (statistics.indistinguishable()) {
            int cap = statistics.maxOccupancy();
            for (int i = 0; i < spectrum.size(); i++) {
                Level l = spectrum.level(i);
                double lnY = -beta * (l.energy() - h * l.label() - mu);
                int states = i == skipLevel ? l.degeneracy() - 1 : l.degeneracy();
                for (int g = 0; g < states; g++) {
                    z.multiplyState(lnY, l.label(), cap, l.energy() - e0);
                }
            }
        } else {
            int m = spectrum.size();
            double[] y = new double[m];
            int[] labels = new int[m];
            double[] eps = new double[m];
            for (int i = 0; i < m; i++) {
                Level l = spectrum.level(i);
                y[i] = l.degeneracy() * Math.exp(-beta * (l.energy() - h * l.label() - mu));
                labels[i] = l.label();
                eps[i] = l.energy() - e0;
            }
            z.labelledParticles(y, labels, eps);
        }
        return z;
    }

    /**
     * The label totals reached by some N-particle microstate, as bits (bit i is L = lo + i): the same
     * recursion as the series on booleans (exact, no weights), so a zero weight can be told from a
     * flushed one.
     */
    static BigInteger reachableLabels(Spectrum s, Statistics st, int n, int lo) {
        return reachableRows(s, st, n, lo)[n];
    }

    /** As {@link #reachableLabels}, for every particle number 0..n at once (row k: k particles). */
    static BigInteger[] reachableRows(Spectrum s, Statistics st, int n, int lo) {
        BigInteger[] row = new BigInteger[n + 1];
        java.util.Arrays.fill(row, BigInteger.ZERO);
        row[0] = BigInteger.ONE.shiftLeft(-lo);
        if (!st.indistinguishable()) {
            for (int k = 1; k <= n; k++) {
                BigInteger acc = BigInteger.ZERO;
                for (Level l : s.levels()) {
                    acc = acc.or(shift(row[k - 1], l.label()));
                }
                row[k] = acc;
            }
            return row;
        }
        int cap = st.maxOccupancy();
        for (Level l : s.levels()) {
            for (int g = 0; g < l.degeneracy(); g++) {
                if (cap == Integer.MAX_VALUE) {
                    for (int k = 1; k <= n; k++) {
                        row[k] = row[k].or(shift(row[k - 1], l.label()));
                    }
                } else {
                    for (int k = n; k >= 1; k--) {
                        for (int j = 1; j <= Math.min(cap, k); j++) {
                            row[k] = row[k].or(shift(row[k - j], j * l.label()));
                        }
                    }
                }
            }
        }
        return row;
    }

    private static BigInteger shift(BigInteger bits, int by) {
        return by >= 0 ? bits.shiftLeft(by) : bits.shiftRight(-by);
    }

    /** The spectrum with every energy e replaced by e - h * label (same scale, labels and cutoff). */
    static Spectrum shifted(Spectrum s, double h) {
        if (h == 0) {
            return s;
        }
        List<Level> levels = new ArrayList<>(s.size());
        for (Level l : s.levels()) {
            levels.add(new Level(l.energy() - h * l.label(), l.degeneracy(), l.label()));
        }
        return Spectrum.of(levels, s.scale(), true, s.cutoffEnergy(), s.cutoffNote());
    }

    private int index(int labelTotal) {
        long i = (long) labelTotal - labelLo;
        return i < 0 || i >= lnZL.length ? -1 : (int) i;
    }

    /** The chemical potential that scales the Boltzmann factors of the series (package use). */
    double scaleChemicalPotential() {
        return scaleMu;
    }

    /** Whether some microstate has total label L (Z(L) &gt; 0 and resolved). */
    public boolean hasLabel(int labelTotal) {
        int i = index(labelTotal);
        return i >= 0 && reached[i] && resolved[i];
    }

    private int require(int labelTotal) {
        int i = index(labelTotal);
        if (i < 0 || !reached[i]) {
            throw InvalidInputException.of("total label L", labelTotal, "a label total reached by some microstate",
                    "Test hasLabel(L) first; labels reached lie in [" + minLabelTotal() + ", " + maxLabelTotal() + "].");
        }
        if (!resolved[i]) {
            throw InvalidInputException.of("total label L", labelTotal,
                    "within the resolved part of the label distribution at h = " + field,
                    "Its Z(L) is below the flushing tolerance; compute with inField(...) at a field that moves the "
                            + "distribution's peak towards L.");
        }
        return i;
    }

    /** ln Z(L), field factor e^{beta h L} included (see the class notes). */
    public double lnZAtLabel(int labelTotal) {
        return lnZL[require(labelTotal)];
    }

    /** F(L) = -kT ln Z(L). */
    public double freeEnergyAtLabel(int labelTotal) {
        return -kT * lnZAtLabel(labelTotal);
    }

    /** U_0(L) = &lt;E_0&gt; at fixed label, without the field term -h L. */
    public double energyAtLabel(int labelTotal) {
        return energyL[require(labelTotal)];
    }

    /** S(L)/k = ln Z(L) + beta (U_0(L) - h L), independent of h. */
    public double entropyAtLabel(int labelTotal) {
        return lnZAtLabel(labelTotal) + (energyAtLabel(labelTotal) - field * labelTotal) / kT;
    }

    /** P(L) = Z(L) / Z in the field-coupled ensemble (0 for unreached labels; refused for unresolved ones). */
    public double labelProbability(int labelTotal) {
        int i = index(labelTotal);
        if (i < 0 || !reached[i]) {
            return 0.0;
        }
        return Math.exp(lnZL[require(labelTotal)] - lnZ);
    }

    /** ln Z = ln sum_L Z(L), the field-coupled canonical partition function. */
    public double lnZ() {
        return lnZ;
    }

    /** &lt;L&gt; in the field-coupled ensemble. */
    public double meanLabel() {
        double s = 0;
        for (int i = 0; i < lnZL.length; i++) {
            s += lnZL[i] == Double.NEGATIVE_INFINITY ? 0 : (labelLo + i) * Math.exp(lnZL[i] - lnZ);
        }
        return s;
    }

    /** Var L in the field-coupled ensemble (non-negative terms about the mean). */
    public double labelVariance() {
        double m = meanLabel();
        double s = 0;
        for (int i = 0; i < lnZL.length; i++) {
            double d = labelLo + i - m;
            s += lnZL[i] == Double.NEGATIVE_INFINITY ? 0 : d * d * Math.exp(lnZL[i] - lnZ);
        }
        return s;
    }

    /** Susceptibility d&lt;L&gt;/dh = beta Var L. */
    public double susceptibility() {
        return labelVariance() / kT;
    }

    /** &lt;E_0&gt; over all labels (the energy without the field term). */
    public double energy() {
        double s = 0;
        for (int i = 0; i < lnZL.length; i++) {
            s += lnZL[i] == Double.NEGATIVE_INFINITY ? 0 : energyL[i] * Math.exp(lnZL[i] - lnZ);
        }
        return s;
    }

    /** Smallest label total in the table's window. */
    public int minLabelTotal() {
        return labelLo;
    }

    /** Largest label total in the table's window. */
    public int maxLabelTotal() {
        return labelLo + lnZL.length - 1;
    }

    /** The field h. */
    public double field() {
        return field;
    }

    /** Temperature kT. */
    public double kT() {
        return kT;
    }

    /** N. */
    public int particleNumber() {
        return n;
    }

    /** The spectrum (without the field shift). */
    public Spectrum spectrum() {
        return spectrum;
    }

    /** The statistics. */
    public Statistics statistics() {
        return statistics;
    }

    /** Warnings (cutoff, field on a truncated spectrum, unresolved labels); empty when none. */
    public List<String> warnings() {
        return warnings;
    }

    /** Columns L, P(L), ln Z(L), U_0(L), S(L)/k. */
    @Override
    public List<String> columnNames() {
        return List.of("L", "P(L)", "ln Z(L)", "U_0(L)", "S(L)/k");
    }

    /** One row per resolved label total reached by some microstate. */
    @Override
    public List<List<Object>> rows() {
        List<List<Object>> r = new ArrayList<>();
        for (int i = 0; i < lnZL.length; i++) {
            int l = labelLo + i;
            if (hasLabel(l)) {
                r.add(List.of(l, labelProbability(l), lnZAtLabel(l), energyAtLabel(l), entropyAtLabel(l)));
            }
        }
        return r;
    }

    @Override
    public String toString() {
        return "LabelledCanonical[" + statistics + ", N=" + n + ", kT=" + kT + ", h=" + field + ", lnZ=" + lnZ
                + ", <L>=" + meanLabel() + (warnings.isEmpty() ? "" : ", " + warnings.size() + " warning(s)") + "]";
    }
}
