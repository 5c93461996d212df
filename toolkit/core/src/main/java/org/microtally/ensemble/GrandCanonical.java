package org.microtally.ensemble;

import java.util.ArrayList;
import java.util.List;
import org.microtally.InvalidInputException;
import org.microtally.Tabular;
import org.microtally.occupation.ChemicalPotential;
import org.microtally.occupation.LevelOccupations;
import org.microtally.occupation.MeanOccupation;
import org.microtally.spectrum.Spectrum;
import org.microtally.spectrum.Statistics;

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
 * counting). Accuracy: each term to a few ulp; the sums are plain double sums of positive terms
 * (relative error ~ M ulp for M levels), except C, whose difference of fluctuations can lose digits
 * where it is small compared with Var E.
 */
public final class GrandCanonical implements Tabular {
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
    private final double[] perState;
    private final double groundMean;
    private final double groundVariance;
    private final List<String> warnings;

    private GrandCanonical(Spectrum spectrum, Statistics statistics, double kT, double mu) {
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
        }
        lnXi = lx;
        meanN = nn;
        varN = vn;
        energy = u;
        varE = ve;
        covEN = cov;
        groundMean = spectrum.degeneracy(0) * perState[0];
        groundVariance = spectrum.degeneracy(0) * MeanOccupation.variance(statistics, beta * (spectrum.energy(0) - mu));
        warnings = TruncationCheck.warnings(spectrum, spectrum.degeneracy(m - 1) * perState[m - 1], meanN);
    }

    /**
     * The ensemble at a given chemical potential.
     *
     * @throws InvalidInputException for kT &lt;= 0 or not finite, mu not finite, or (bosons) mu at
     *                               or above the lowest level
     */
    public static GrandCanonical atChemicalPotential(Spectrum spectrum, Statistics statistics, double kT, double mu) {
        requireTemperature(kT);
        if (!Double.isFinite(mu)) {
            throw InvalidInputException.of("chemical potential mu", mu, "a finite number", "");
        }
        if (statistics.kind() == Statistics.Kind.BOSE && !(mu < spectrum.groundEnergy())) {
            throw InvalidInputException.of("chemical potential mu for bosons", mu,
                    "below the lowest level e_0 = " + spectrum.groundEnergy() + " " + spectrum.scale().name(),
                    "Bose occupations diverge at mu = e_0; fix <N> instead (atMeanNumber) to approach condensation.");
        }
        return new GrandCanonical(spectrum, statistics, kT, mu);
    }

    /**
     * The ensemble whose chemical potential gives mean particle number {@code targetN}
     * ({@link ChemicalPotential#forMeanNumber}).
     */
    public static GrandCanonical atMeanNumber(Spectrum spectrum, Statistics statistics, double kT, double targetN) {
        requireTemperature(kT);
        double mu = ChemicalPotential.forMeanNumber(spectrum, statistics, kT, targetN);
        return new GrandCanonical(spectrum, statistics, kT, mu);
    }

    static void requireTemperature(double kT) {
        if (!(kT > 0) || !Double.isFinite(kT)) {
            throw InvalidInputException.of("temperature kT", kT, "a finite number > 0",
                    "T -> 0 limits are separate calls: Canonical.groundState, ChemicalPotential.fermiLevel.");
        }
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

    /** Entropy S/k = ln Xi + (U - mu &lt;N&gt;)/kT. */
    public double entropy() {
        return lnXi + (energy - mu * meanN) / kT;
    }

    /** Heat capacity at fixed &lt;N&gt;, C/k = (Var E - Cov(E,N)^2/Var N)/(kT)^2. */
    public double heatCapacity() {
        double c = varN > 0 ? (varE - covEN * covEN / varN) / (kT * kT) : varE / (kT * kT);
        return Math.max(c, 0.0);
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

    @Override
    public List<String> columnNames() {
        return List.of("quantity", "value");
    }

    @Override
    public List<List<Object>> rows() {
        List<List<Object>> r = new ArrayList<>();
        r.add(List.of("statistics", statistics.toString()));
        r.add(List.of("kT", kT));
        r.add(List.of("mu", mu));
        r.add(List.of("ln Xi", lnXi));
        r.add(List.of("<N>", meanN));
        r.add(List.of("Var N", varN));
        r.add(List.of("U", energy));
        r.add(List.of("S/k", entropy()));
        r.add(List.of("C/k (fixed <N>)", heatCapacity()));
        r.add(List.of("<N_0>", groundMean));
        r.add(List.of("Var N_0", groundVariance));
        for (String w : warnings) {
            r.add(List.of("warning", w));
        }
        return r;
    }

    /** A one-line summary (statistics, kT, mu, ln Xi, &lt;N&gt;, U, number of warnings). */
    @Override
    public String toString() {
        return "GrandCanonical[" + statistics + ", kT=" + kT + ", mu=" + mu + ", lnXi=" + lnXi + ", <N>=" + meanN
                + ", U=" + energy + (warnings.isEmpty() ? "" : ", " + warnings.size() + " warning(s)") + "]";
    }
}
