package org.microtally.ensemble;

import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import org.microtally.Inputs;
import org.microtally.InvalidInputException;
import org.microtally.Dimension;
import org.microtally.QuantityTable;
import org.microtally.QuantityResult;
import org.microtally.occupation.ChemicalPotential;
import org.microtally.occupation.LevelOccupations;
import org.microtally.occupation.MeanOccupation;
import org.microtally.spectrum.Spectrum;
import org.microtally.spectrum.Statistics;
import org.microtally.units.Energy;

/**
 * The grand canonical ensemble of ideal particles on a spectrum at temperature kT and chemical
 * potential mu (given, or solved from a target mean particle number).
 *
 * <p>Definitions (k = 1; energies and kT in the spectrum's unit; x_i = (e_i - mu)/kT; n(x), var(x)
 * and ln xi(x) the one-state laws of {@link MeanOccupation}):
 * <ul>
 *   <li>ln Xi = sum_i g_i ln xi(x_i); &lt;N&gt; = sum g_i n_i; Var N = sum g_i var_i;</li>
 *   <li>U = sum g_i e_i n_i; Var E = sum g_i e_i^2 var_i; Cov(E,N) = sum g_i e_i var_i (states are
 *       independent in this ensemble);</li>
 *   <li>S/k = ln Xi + (U - mu &lt;N&gt;)/kT;</li>
 *   <li>C/k = (Var E - Cov(E,N)^2 / Var N) / (kT)^2: the heat capacity at fixed &lt;N&gt;, which
 *       is the one to compare with the canonical C_V (the fluctuation formula for dU/dT at fixed
 *       &lt;N&gt;, common practice, no source); the sums use e_i - mu, which leaves it unchanged and
 *       reduces cancellation.</li>
 *   <li>Condensate: the lowest level holds &lt;N_0&gt; = g_0 n_0 with grand canonical variance
 *       g_0 n_0 (n_0 + 1) for bosons, the value known to overestimate the canonical and
 *       microcanonical fluctuations below T_c (Politzer, PRA 54, 5048 (1996); Wilkens &amp; Weiss,
 *       J. Mod. Opt. 44, 1801 (1997)).</li>
 * </ul>
 * {@link Statistics#DISTINGUISHABLE} is taken as Maxwell-Boltzmann (classical particles with 1/N!
 * counting, {@link Counting#CORRECTED_BOLTZMANN}) unless {@link Counting#LABELLED} is asked for: then
 * Xi = sum_N (z Z_1)^N = 1/(1 - w), w = z Z_1 &lt; 1, so &lt;N&gt; = w/(1 - w), Var N = w/(1 - w)^2, the
 * N particles of each term independent with the one-particle law p_i = g_i e^{-e_i/kT}/Z_1:
 * U = &lt;N&gt; e_bar, Var E = &lt;N&gt; var_1 + Var N e_bar^2, Cov(E, N) = Var N e_bar, and
 * Var N_0 = &lt;N&gt; p_0 (1 - p_0) + p_0^2 Var N (closed forms of the geometric mixture, common
 * practice, no source); mu for a target &lt;N&gt; is kT (ln(N/(N+1)) - ln Z_1) in closed form.
 * Accuracy: each term to a few ulp; the sums are plain double sums of positive terms
 * (relative error ~ M ulp for M levels), except C, whose difference of fluctuations can lose digits
 * where it is small compared with Var E.
 */
public final class GrandCanonical implements QuantityResult {
    private final Spectrum spectrum;
    private final Statistics statistics;
    private final double kT;
    private final double mu;
    private final double lnXi;
    private final double meanN;
    private final double varN;
    private final double energy;
    private final double varE;
    private final double covEN;
    /** Var E - Cov(E,N)^2/Var N, formed as a weighted variance of e - mu (non-negative terms). */
    private final double fixedNVariance;
    private final double entropy;
    private final double[] perState;
    private final double groundMean;
    private final double groundVariance;
    private final List<String> warnings;
    private final Counting counting;

    private GrandCanonical(Spectrum spectrum, Statistics statistics, double kT, double mu) {
        this.counting = statistics.indistinguishable() ? Counting.IDENTICAL : Counting.CORRECTED_BOLTZMANN;
        this.spectrum = spectrum;
        this.statistics = statistics;
        this.kT = kT;
        this.mu = mu;
        double beta = 1.0 / kT;
        int m = spectrum.size();
        perState = new double[m];
        double lx = 0;
        double nn = 0;
        double vn = 0;
        double u = 0;
        double ve = 0;
        double cov = 0;
        double sk = 0;
        double[] weight = new double[m];
        for (int i = 0; i < m; i++) {
            double g = spectrum.degeneracy(i);
            double d = spectrum.energy(i) - mu;
            double x = beta * d;
            double n = MeanOccupation.mean(statistics, x);
            double v = MeanOccupation.variance(statistics, x);
            perState[i] = n;
            lx += g * MeanOccupation.logFactor(statistics, x);
            nn += g * n;
            vn += g * v;
            u += g * spectrum.energy(i) * n;
            ve += g * d * d * v;
            cov += g * d * v;
            weight[i] = g * v;
            sk += g * stateEntropy(statistics, x);
        }
        double dBar = vn > 0 ? cov / vn : 0;
        double fixed = 0;
        for (int i = 0; i < m; i++) {
            double dd = spectrum.energy(i) - mu - dBar;
            fixed += weight[i] * dd * dd;
        }
        fixedNVariance = vn > 0 ? fixed : ve;
        entropy = sk;
        lnXi = lx;
        meanN = nn;
        varN = vn;
        energy = u;
        varE = ve;
        covEN = cov;
        groundMean = spectrum.degeneracy(0) * perState[0];
        groundVariance = spectrum.degeneracy(0) * MeanOccupation.variance(statistics, beta * (spectrum.energy(0) - mu));
        warnings = TruncationCheck.warnings(spectrum, perState, meanN, kT, mu, energy, entropy, groundMean);
    }

    /** Labelled (Z_1^N) particles at fugacity w = z Z_1 &lt; 1: the geometric mixture of the class notes. */
    private GrandCanonical(Spectrum spectrum, double kT, double mu, double w) {
        this.counting = Counting.LABELLED;
        this.spectrum = spectrum;
        this.statistics = Statistics.DISTINGUISHABLE;
        this.kT = kT;
        this.mu = mu;
        double beta = 1.0 / kT;
        double e0 = spectrum.groundEnergy();
        int m = spectrum.size();
        double z1 = 0;
        double m1 = 0;
        double m2 = 0;
        double[] boltzmann = new double[m];
        for (int i = 0; i < m; i++) {
            double d = spectrum.energy(i) - e0;
            boltzmann[i] = Math.exp(-beta * d);
            double g = spectrum.degeneracy(i) * boltzmann[i];
            z1 += g;
            m1 += g * d;
            m2 += g * d * d;
        }
        double mean1 = m1 / z1;
        double var1 = Math.max(0.0, m2 / z1 - mean1 * mean1);
        double n = w / (1 - w);
        double vn = n / (1 - w);
        perState = new double[m];
        for (int i = 0; i < m; i++) {
            perState[i] = n * boltzmann[i] / z1;
        }
        double eBar = e0 + mean1;
        // energies relative to mu, as in the general constructor (Var E is reassembled in energyVariance)
        double dBar = eBar - mu;
        lnXi = -Math.log1p(-w);
        meanN = n;
        varN = vn;
        energy = n * eBar;
        varE = n * var1 + vn * dBar * dBar;
        covEN = vn * dBar;
        fixedNVariance = n * var1;
        entropy = lnXi + (energy - mu * meanN) / kT;
        double p0 = spectrum.degeneracy(0) / z1;
        groundMean = n * p0;
        groundVariance = n * p0 * (1 - p0) + p0 * p0 * vn;
        warnings = TruncationCheck.warnings(spectrum, perState, meanN, kT, mu, energy, entropy, groundMean);
    }

    /**
     * Entropy of one state, ln xi + x n, in the form without cancellation: capped laws by the
     * particle-hole symmetry s(x) = s(|x|) (so both terms are non-negative), Bose with x &gt; 0 (both
     * terms positive); Maxwell-Boltzmann e^{-x}(1 + x).
     */
    private static double stateEntropy(Statistics st, double x) {
        double y = st.capped() ? Math.abs(x) : x;
        double n = MeanOccupation.mean(st, y);
        return n == 0 ? MeanOccupation.logFactor(st, y) : MeanOccupation.logFactor(st, y) + y * n;
    }

    private static double lnZ1(Spectrum s, double kT) {
        double e0 = s.groundEnergy();
        double z1 = 0;
        for (int i = 0; i < s.size(); i++) {
            z1 += s.degeneracy(i) * Math.exp(-(s.energy(i) - e0) / kT);
        }
        return Math.log(z1) - e0 / kT;
    }

    /**
     * The ensemble at a given chemical potential with an explicit {@link Counting} (LABELLED or
     * CORRECTED_BOLTZMANN for distinguishable particles, IDENTICAL for quantum statistics).
     *
     * @throws InvalidInputException as {@link #ofChemicalPotential(Spectrum, Statistics, double, double)};
     *                               for LABELLED also when z Z_1 &gt;= 1 (the geometric sum diverges)
     */
    public static GrandCanonical ofChemicalPotential(Spectrum spectrum, Statistics statistics, double kT, double mu,
                                                     Counting counting) {
        Counting.require(statistics, counting);
        if (counting != Counting.LABELLED) {
            return ofChemicalPotential(spectrum, statistics, kT, mu);
        }
        Inputs.temperature(kT);
        if (!Double.isFinite(mu)) {
            throw InvalidInputException.of("chemical potential mu", mu, "a finite number", "");
        }
        double lnZ1 = lnZ1(spectrum, kT);
        double lnW = mu / kT + lnZ1;
        if (!(lnW < 0)) {
            throw InvalidInputException.of("chemical potential mu for labelled particles", mu,
                    "below -kT ln Z_1 = " + (-kT * lnZ1) + " (z Z_1 < 1, else sum_N (z Z_1)^N diverges)",
                    "Fix <N> instead (ofMeanNumber).");
        }
        return new GrandCanonical(spectrum, kT, mu, Math.exp(lnW));
    }

    /**
     * The ensemble with mean particle number {@code n} and an explicit {@link Counting}; for
     * LABELLED, mu = kT (ln(N/(N+1)) - ln Z_1) in closed form.
     */
    public static GrandCanonical ofMeanNumber(Spectrum spectrum, Statistics statistics, double kT, double n,
                                              Counting counting) {
        Counting.require(statistics, counting);
        if (counting != Counting.LABELLED) {
            return ofMeanNumber(spectrum, statistics, kT, n);
        }
        Inputs.temperature(kT);
        if (!(n > 0) || !Double.isFinite(n)) {
            throw InvalidInputException.of("target mean particle number", n, "a finite number > 0", "");
        }
        double lnZ1 = lnZ1(spectrum, kT);
        double w = n / (n + 1);
        return new GrandCanonical(spectrum, kT, kT * (Math.log(w) - lnZ1), w);
    }

    /**
     * The ensemble at a temperature given as an energy (e.g. {@code Energy.ofTemperature(4.2)}) whose
     * chemical potential gives mean particle number {@code n}; kT is converted to the spectrum's unit
     * through its scale, refused with a message saying how to declare one when it has no physical size.
     */
    public static GrandCanonical ofMeanNumber(Spectrum spectrum, Statistics statistics, Energy kT, double n) {
        Objects.requireNonNull(spectrum, "spectrum");
        return ofMeanNumber(spectrum, statistics, Inputs.temperature(kT, spectrum.scale()), n);
    }

    /** As {@link #ofChemicalPotential(Spectrum, Statistics, double, double)}, kT and mu given as energies. */
    public static GrandCanonical ofChemicalPotential(Spectrum spectrum, Statistics statistics, Energy kT, Energy mu) {
        Objects.requireNonNull(spectrum, "spectrum");
        Objects.requireNonNull(mu, "mu");
        return ofChemicalPotential(spectrum, statistics, Inputs.temperature(kT, spectrum.scale()),
                mu.in(spectrum.scale()));
    }

    /** How microstates are counted ({@link Counting}); distinguishable particles default to CORRECTED_BOLTZMANN. */
    public Counting counting() {
        return counting;
    }

    /**
     * The ensemble at a given chemical potential.
     *
     * @throws InvalidInputException for kT &lt;= 0 or not finite, mu not finite, or (bosons) mu at
     *                               or above the lowest level
     */
    public static GrandCanonical ofChemicalPotential(Spectrum spectrum, Statistics statistics, double kT, double mu) {
        Inputs.temperature(kT);
        if (!Double.isFinite(mu)) {
            throw InvalidInputException.of("chemical potential mu", mu, "a finite number", "");
        }
        if (statistics.condenses() && !(mu < spectrum.groundEnergy())) {
            throw InvalidInputException.of("chemical potential mu for bosons", mu,
                    "below the lowest level e_0 = " + spectrum.groundEnergy() + " " + spectrum.scale().name(),
                    "Bose occupations diverge at mu = e_0; fix <N> instead (ofMeanNumber) to approach condensation.");
        }
        return new GrandCanonical(spectrum, statistics, kT, mu);
    }

    /**
     * The ensemble whose chemical potential gives mean particle number {@code n}
     * ({@link ChemicalPotential#forMeanNumber}).
     */
    public static GrandCanonical ofMeanNumber(Spectrum spectrum, Statistics statistics, double kT, double n) {
        Inputs.temperature(kT);
        double mu = ChemicalPotential.forMeanNumber(spectrum, statistics, kT, n);
        GrandCanonical g = new GrandCanonical(spectrum, statistics, kT, mu);
        if (!(Math.abs(g.meanN - n) <= 1e-9 * Math.max(1.0, n))) {
            throw InvalidInputException.of("temperature kT for a grand canonical <N> = " + n, kT,
                    "large enough that some mu gives that mean (here the best mu, " + mu + ", gives " + g.meanN
                            + ": at this kT the occupations are steps)",
                    "Use Canonical.of (exact T -> 0 limit) or ChemicalPotential.fermiLevel for the T -> 0 limit.");
        }
        return g;
    }

    /** The spectrum. */
    public Spectrum spectrum() {
        return spectrum;
    }

    /** The statistics. */
    public Statistics statistics() {
        return statistics;
    }

    /** Temperature kT in the spectrum's unit. */
    public double kT() {
        return kT;
    }

    /** The chemical potential mu. */
    public double chemicalPotential() {
        return mu;
    }

    /** ln Xi. */
    public double lnXi() {
        return lnXi;
    }

    /** Grand potential Omega = -kT ln Xi. */
    public double grandPotential() {
        return -kT * lnXi;
    }

    /** Mean particle number &lt;N&gt;. */
    public double meanNumber() {
        return meanN;
    }

    /** Var N. */
    public double numberVariance() {
        return varN;
    }

    /** Mean energy U. */
    public double energy() {
        return energy;
    }

    /** Variance of the energy, Var E. */
    public double energyVariance() {
        return varE + 2 * mu * covEN + mu * mu * varN;
    }

    /**
     * Entropy S/k = ln Xi + (U - mu &lt;N&gt;)/kT, summed as sum_i g_i s(x_i) with the one-state entropy
     * in a form free of cancellation (capped statistics by particle-hole symmetry), so it keeps its
     * relative accuracy at low T; labelled particles from the definition.
     */
    public double entropy() {
        return entropy;
    }

    /**
     * Heat capacity at fixed &lt;N&gt;, C/k = (Var E - Cov(E,N)^2/Var N)/(kT)^2, formed as the weighted
     * variance sum_i g_i var_i (e_i - mu - d_bar)^2 with d_bar = Cov(E,N)/Var N (non-negative terms,
     * no difference of large numbers); labelled particles: &lt;N&gt; var_1 / kT^2.
     */
    public double heatCapacity() {
        return fixedNVariance / kT / kT;
    }

    /** Mean occupations of every level. */
    public LevelOccupations occupations() {
        return new LevelOccupations(spectrum.energies(), spectrum.degeneracies(), perState);
    }

    /** Mean number in the lowest level, g_0 n_0. */
    public double groundLevelMean() {
        return groundMean;
    }

    /** Grand canonical variance of the lowest level's number, g_0 var(n_0) (bosons: g_0 n_0 (n_0 + 1)). */
    public double groundLevelVariance() {
        return groundVariance;
    }

    /** Warnings (e.g. a cutoff that matters); empty when none. */
    public List<String> warnings() {
        return warnings;
    }

    /**
     * The reported quantities in the spectrum's energy unit: statistics, counting (labelled particles),
     * kT, mu, ln Xi, &lt;N&gt;, Var N, U, S/k, C/k at fixed &lt;N&gt;, &lt;N_0&gt;, Var N_0, one row per
     * warning. Physical units: {@code quantities().inUnits(EnergyUnit.MILLIELECTRONVOLT)}.
     */
    @Override
    public QuantityTable quantities() {
        QuantityTable.Builder t = QuantityTable.builder(spectrum.scale()).value("statistics", statistics.toString());
        if (!statistics.indistinguishable()) {
            t.value("counting", counting.toString());
        }
        return t.value("kT", kT, Dimension.ENERGY).value("mu", mu, Dimension.ENERGY).value("ln Xi", lnXi)
                .value("<N>", meanN).value("Var N", varN).value("U", energy, Dimension.ENERGY)
                .value("S/k", entropy()).value("C/k (fixed <N>)", heatCapacity())
                .value("<N_0>", groundMean).value("Var N_0", groundVariance).warnings(warnings).build();
    }

    /** A one-line summary (statistics, kT, mu, ln Xi, &lt;N&gt;, U, number of warnings). */
    @Override
    public String toString() {
        return "GrandCanonical[" + statistics + ", kT=" + kT + ", mu=" + mu + ", lnXi=" + lnXi + ", <N>=" + meanN
                + ", U=" + energy + (warnings.isEmpty() ? "" : ", " + warnings.size() + " warning(s)") + "]";
    }
}
