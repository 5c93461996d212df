package org.microtally.ensemble;

import java.math.BigInteger;
import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import org.microtally.InvalidInputException;
import org.microtally.Tabular;
import org.microtally.spectrum.Level;
import org.microtally.spectrum.Spectrum;
import org.microtally.spectrum.Statistics;

/**
 * The grand canonical ensemble (T, mu, field h) of indistinguishable particles on a complete finite
 * labelled spectrum (a shell, a spinor condensate's m_F states), resolved by the total label L: Xi(L), and at fixed L the mean particle
 * number, its variance and the mean energy. Immutable.
 *
 * <h2>Definitions</h2>
 * Xi(L) = sum over microstates of any particle number N with total label L of
 * e^{-beta (E_0 - h L - mu N)}; Xi = sum_L Xi(L) is the field-coupled grand partition function (that
 * of {@link LabelledGrandCanonical}); at fixed L: &lt;N&gt;_L, Var N_L and U_0(L) = &lt;E_0&gt;_L (without the
 * field term).
 *
 * <h2>Method</h2>
 * The two-variable positive-term series of {@link LabelledCanonical} in particle number and label,
 * built with the unscaled factors y_s = e^{-beta (e_s - h m_s - mu)} (capped factors with y &gt; 1
 * divided by y^k first), taken to every particle number up to the spectrum's capacity k S (capped
 * statistics: nothing is truncated) or, for bosons, up to n_max = (K + 60)/theta where the Chernoff
 * bound P(N &gt; n_max) &lt;= e^{K - theta (n_max + 1)} with theta = beta (e'_min - mu)/2 and
 * K = sum_s ln[(1 - y_s)/(1 - y_s e^theta)] is below e^-60 (e'_min the lowest field-shifted level; the
 * bound is the exponential Markov inequality for independent geometric occupations, common practice,
 * no source): Xi(L) = sum_n c[n][L]. Memory 2 (n_max + 1) W doubles with W = n_max x (label range) + 1,
 * refused above half the heap; that is why only complete finite spectra are taken.
 *
 * <h2>Accuracy</h2>
 * Sums of non-negative terms: relative rounding error below (S + kS) 2^-53; flushed mantissas add at
 * most S (n_max + 1) W 2^-1073 / P(L) relative (P(L) = Xi(L)/Xi), the bosonic truncation at most
 * e^{K - theta(n_max+1)} / P(L); labels where either exceeds 1e-12, and labels no microstate reaches
 * (up to n_max), are refused by the accessors ({@link #hasLabel} tells which).
 */
public final class LabelResolvedGrandCanonical implements Tabular {
    /** Largest flushing bound, and (bosons) tail beyond n_max, accepted relative to P(L); labels beyond it are refused. */
    public static final double FLUSH_TOLERANCE = 1e-12;

    private final double kT;
    private final double mu;
    private final double field;
    private final int labelLo;
    private final double[] lnXiL;
    private final double[] meanN;
    private final double[] varN;
    private final double[] energy;
    private final boolean[] usable;
    private final double lnXi;

    private LabelResolvedGrandCanonical(double kT, double mu, double field, int labelLo, double[] lnXiL,
                                        double[] meanN, double[] varN, double[] energy, boolean[] usable, double lnXi) {
        this.kT = kT;
        this.mu = mu;
        this.field = field;
        this.labelLo = labelLo;
        this.lnXiL = lnXiL;
        this.meanN = meanN;
        this.varN = varN;
        this.energy = energy;
        this.usable = usable;
        this.lnXi = lnXi;
    }

    /**
     * The label-resolved ensemble at (kT, mu, h).
     *
     * @throws InvalidInputException for an unlabelled or truncated spectrum, uncapped statistics,
     *                               kT &lt;= 0, mu or h not finite, or a table above half the heap
     */
    public static LabelResolvedGrandCanonical of(Spectrum spectrum, Statistics statistics, double kT, double mu,
                                                 double h) {
        Objects.requireNonNull(spectrum, "spectrum");
        Objects.requireNonNull(statistics, "statistics");
        if (!statistics.indistinguishable()) {
            throw InvalidInputException.of("statistics", statistics, "BOSE, FERMI or maxOccupancy(k)",
                    "Labelled particles have no grand canonical ensemble here; use LabelledCanonical at each N.");
        }
        if (spectrum.isTruncated()) {
            throw InvalidInputException.of("spectrum cutoff", spectrum.cutoffEnergy(), "none (a complete, finite spectrum)",
                    "Every particle number up to the capacity is summed, so omitted levels would be missed.");
        }
        LabelledGrandCanonical field = LabelledGrandCanonical.inField(spectrum, statistics, kT, mu, h);
        double beta = 1 / kT;
        double lnTail = Double.NEGATIVE_INFINITY;
        long capacity;
        if (statistics.capped()) {
            capacity = (long) statistics.maxOccupancy() * spectrum.stateCount();
        } else {
            // bosons: truncate the particle number where a Chernoff bound puts the rest below e^-60
            double gap = Double.POSITIVE_INFINITY;
            for (Level l : spectrum.levels()) {
                gap = Math.min(gap, beta * (l.energy() - h * l.label() - mu));
            }
            double theta = gap / 2;
            double k = 0;
            for (Level l : spectrum.levels()) {
                double lnY = -beta * (l.energy() - h * l.label() - mu);
                k += l.degeneracy() * (Math.log(-Math.expm1(lnY)) - Math.log(-Math.expm1(lnY + theta)));
            }
            capacity = (long) Math.ceil((k + 60) / theta);
            if (capacity > 100_000) {
                throw InvalidInputException.of("particle numbers to sum for bosons", capacity, "at most 100000",
                        "mu is too close to the lowest (field-shifted) level; lower mu or raise kT.");
            }
            lnTail = k - theta * (capacity + 1);
        }
        int minLabel = Integer.MAX_VALUE;
        int maxLabel = Integer.MIN_VALUE;
        for (Level l : spectrum.levels()) {
            minLabel = Math.min(minLabel, l.label());
            maxLabel = Math.max(maxLabel, l.label());
        }
        double cells = capacity > 100_000 ? Double.POSITIVE_INFINITY : LabelSeries.cells((int) capacity, minLabel, maxLabel);
        double limit = Runtime.getRuntime().maxMemory() * 0.5;
        if (cells * 16 > limit) {
            throw InvalidInputException.of("label-resolved table (capacity + 1) x (label window)",
                    String.format("%.3g doubles", 2 * cells), String.format("at most %.3g MiB (half the heap)",
                            limit / (1 << 20)), "Use a smaller spectrum, or LabelledCanonical at fixed N.");
        }
        int nMax = (int) capacity;
        double e0 = spectrum.groundEnergy();
        LabelSeries z = LabelledCanonical.series(spectrum, statistics, nMax, beta, h, mu, -1);
        BigInteger[] reach = LabelledCanonical.reachableRows(spectrum, statistics, nMax, z.lo);
        double lnBase = z.lnFlushThreshold(spectrum.stateCount());
        double[] lnXiL = new double[z.width];
        double[] meanN = new double[z.width];
        double[] varN = new double[z.width];
        double[] energy = new double[z.width];
        boolean[] usable = new boolean[z.width];
        for (int i = 0; i < z.width; i++) {
            double s0 = 0;
            double s1 = 0;
            double su = 0;
            boolean reached = false;
            for (int n = 0; n <= nMax; n++) {
                double c = z.c[n][i];
                s0 += c;
                s1 += n * c;
                su += z.u[n][i] + n * e0 * c;
                reached |= reach[n].testBit(i);
            }
            lnXiL[i] = s0 > 0 ? Math.log(s0) + z.logScale : Double.NEGATIVE_INFINITY;
            double lnP = lnXiL[i] - field.ensemble().lnXi();
            // flushing, and (bosons) the particle numbers beyond nMax, each below 1e-12 relative
            usable[i] = reached && s0 > 0 && lnBase - lnP <= 0 && lnTail - lnP <= Math.log(FLUSH_TOLERANCE);
            if (s0 > 0) {
                meanN[i] = s1 / s0;
                double v = 0;
                for (int n = 0; n <= nMax; n++) {
                    double d = n - meanN[i];
                    v += d * d * z.c[n][i];
                }
                varN[i] = v / s0;
                energy[i] = su / s0;
            }
        }
        return new LabelResolvedGrandCanonical(kT, mu, h, z.lo, lnXiL, meanN, varN, energy, usable,
                field.ensemble().lnXi());
    }

    /** Whether L is reached by some microstate and resolved to the flushing tolerance. */
    public boolean hasLabel(int labelTotal) {
        long i = (long) labelTotal - labelLo;
        return i >= 0 && i < usable.length && usable[(int) i];
    }

    private int require(int labelTotal) {
        if (!hasLabel(labelTotal)) {
            throw InvalidInputException.of("total label L", labelTotal,
                    "a label total reached by some microstate and resolved at this mu and h",
                    "Test hasLabel(L) first; a field h moves the label distribution towards far labels.");
        }
        return labelTotal - labelLo;
    }

    /** ln Xi(L). */
    public double lnXiAtLabel(int labelTotal) {
        return lnXiL[require(labelTotal)];
    }

    /** &lt;N&gt; at fixed L. */
    public double meanNumberAtLabel(int labelTotal) {
        return meanN[require(labelTotal)];
    }

    /** Var N at fixed L. */
    public double numberVarianceAtLabel(int labelTotal) {
        return varN[require(labelTotal)];
    }

    /** U_0(L) = &lt;E_0&gt; at fixed L (without the field term). */
    public double energyAtLabel(int labelTotal) {
        return energy[require(labelTotal)];
    }

    /** P(L) = Xi(L) / Xi. */
    public double labelProbability(int labelTotal) {
        return Math.exp(lnXiAtLabel(labelTotal) - lnXi);
    }

    /** ln Xi summed over all labels (equal to {@link LabelledGrandCanonical}'s ln Xi). */
    public double lnXi() {
        return lnXi;
    }

    /** kT. */
    public double kT() {
        return kT;
    }

    /** mu. */
    public double chemicalPotential() {
        return mu;
    }

    /** h. */
    public double field() {
        return field;
    }

    /** Columns L, P(L), ln Xi(L), &lt;N&gt;_L, Var N_L, U_0(L). */
    @Override
    public List<String> columnNames() {
        return List.of("L", "P(L)", "ln Xi(L)", "<N>_L", "Var N_L", "U_0(L)");
    }

    /** One row per usable label total. */
    @Override
    public List<List<Object>> rows() {
        List<List<Object>> r = new ArrayList<>();
        for (int i = 0; i < usable.length; i++) {
            if (usable[i]) {
                int l = labelLo + i;
                r.add(List.of(l, labelProbability(l), lnXiL[i], meanN[i], varN[i], energy[i]));
            }
        }
        return r;
    }

    @Override
    public String toString() {
        return "LabelResolvedGrandCanonical[kT=" + kT + ", mu=" + mu + ", h=" + field + ", lnXi=" + lnXi + "]";
    }
}
