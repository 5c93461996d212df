package org.microtally.ensemble;

import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.Objects;
import org.microtally.Roots;
import org.microtally.InvalidInputException;
import org.microtally.Tabular;
import org.microtally.exact.ExactLog;

/**
 * Canonical thermodynamics of a system given by an exact density of states g(E) (and, when the
 * density carries a label such as the magnetisation M, of that label).
 *
 * <h2>Definitions (k = 1, E and kT in units of the density's scale, beta = 1/kT)</h2>
 * Z = sum_E g(E) e^{-beta E}; F = -kT ln Z; U = &lt;E&gt;; S = ln Z + beta U;
 * C = beta^2 &lt;(E - U)^2&gt; (fluctuation formula, = dU/dT). With a label M:
 * &lt;|M|&gt;, &lt;M^2&gt;, &lt;M^4&gt;, chi = beta &lt;(M - &lt;M&gt;)^2&gt;,
 * chi' = beta &lt;(|M| - &lt;|M|&gt;)^2&gt; (the finite-lattice estimator used below T_c), and the
 * Binder cumulant U_4 = 1 - &lt;M^4&gt; / (3 &lt;M^2&gt;^2) (K. Binder, Z. Phys. B 43, 119 (1981)).
 * Susceptibilities are extensive: divide by the number of sites for values per site.
 *
 * <h2>Method and accuracy</h2>
 * ln Z by log-sum-exp: ln Z = w* + ln sum_E e^{w(E) - w*}, w(E) = ln g(E) - beta E, w* the largest
 * w, with ln g from the exact integer ({@link ExactLog}, within 2 ulp), so nothing overflows at any
 * lattice size; every term of the sum lies in (0, 1]. Moments are taken about the mean in a
 * second pass (central moments of non-negative weights; no E^2 - U^2 cancellation). Relative
 * accuracy of ln Z, U and C: about n 2^-53 for n energies, plus the 2-ulp error of ln g times
 * |beta E| / ln Z cancellation in S = ln Z + beta U when S is tiny (a warning-free but
 * absolute, not relative, statement there). The specific-heat peak is the root of
 * dC/dbeta = beta (2 k_2 - beta k_3) (k_2, k_3 central moments) found by a bracketing order-5
 * Brent solver after a 400-point scan in kT; its location is within {@value #PEAK_LOCATION_ERROR}
 * relative (the worst error measured against a committed mpmath table of the peaks of periodic Ising
 * rings of 4 to 32 spins, test resource {@code ensemble/ising-ring-peaks-mpmath.csv}, rounded up).
 * That table has at most 17 energies; with n energies the moments carry about n 2^-53 relative, so
 * large lattices can be correspondingly worse (not measured).
 */
public final class ExactCanonical {
    /**
     * Largest relative error of the heat-capacity peak temperature measured against the committed mpmath
     * table, rounded up; ExactCanonicalStatedAccuracyTest fails if any row is worse, or if this is more
     * than twice the maximum.
     */
    public static final double PEAK_LOCATION_ERROR = 5e-15;

    private final ExactDensityOfStates dos;
    private final ExactDensityOfStates byEnergy;
    private final double[] energy;
    private final double[] lnG;

    private ExactCanonical(ExactDensityOfStates dos) {
        this.dos = dos;
        this.byEnergy = dos.byEnergy();
        int n = byEnergy.size();
        energy = new double[n];
        lnG = new double[n];
        for (int i = 0; i < n; i++) {
            energy[i] = byEnergy.energy(i);
            lnG[i] = ExactLog.ln(byEnergy.multiplicity(i));
        }
    }

    /** The canonical ensemble of the given exact density of states. */
    public static ExactCanonical of(ExactDensityOfStates dos) {
        return new ExactCanonical(Objects.requireNonNull(dos, "dos"));
    }

    /** The density of states this ensemble was built from. */
    public ExactDensityOfStates densityOfStates() {
        return dos;
    }

    /** Thermodynamic state at inverse temperature beta (finite, non-zero; negative beta is allowed for bounded spectra). */
    public State atBeta(double beta) {
        checkBeta(beta);
        double[] p = new double[energy.length];
        double lnZ = weights(beta, energy, lnG, p);
        double u = 0;
        for (int i = 0; i < p.length; i++) {
            u += p[i] * energy[i];
        }
        double var = 0;
        for (int i = 0; i < p.length; i++) {
            double d = energy[i] - u;
            var += p[i] * d * d;
        }
        return new State(beta, lnZ, u, beta * beta * var, lnZ + beta * u, -lnZ / beta, byEnergy.scale().name());
    }

    /** Thermodynamic state at temperature kT &gt; 0 (in units of the scale). */
    public State atTemperature(double kT) {
        checkTemperature(kT, "kT");
        return atBeta(1 / kT);
    }

    /** Magnetisation statistics at inverse temperature beta; needs a labelled density of states. */
    public Magnetisation magnetisation(double beta) {
        checkBeta(beta);
        if (!dos.labelled()) {
            throw InvalidInputException.of("magnetisation of an unlabelled density of states", "requested",
                    "a density of states resolved by a second label (e.g. g(E, M))", "Count g(E, M) first.");
        }
        int n = dos.size();
        double[] e = new double[n];
        double[] lg = new double[n];
        double[] m = new double[n];
        for (int i = 0; i < n; i++) {
            e[i] = dos.energy(i);
            lg[i] = ExactLog.ln(dos.multiplicity(i));
            m[i] = dos.label(i);
        }
        double[] p = new double[n];
        weights(beta, e, lg, p);
        double mean = 0;
        double abs = 0;
        for (int i = 0; i < n; i++) {
            mean += p[i] * m[i];
            abs += p[i] * Math.abs(m[i]);
        }
        double m2 = 0;
        double m4 = 0;
        double var = 0;
        double varAbs = 0;
        for (int i = 0; i < n; i++) {
            double sq = m[i] * m[i];
            m2 += p[i] * sq;
            m4 += p[i] * sq * sq;
            double d = m[i] - mean;
            var += p[i] * d * d;
            double da = Math.abs(m[i]) - abs;
            varAbs += p[i] * da * da;
        }
        if (m2 == 0) {
            throw InvalidInputException.of("<" + dos.labelName() + "^2>", 0, "> 0 for the Binder cumulant",
                    "Every state has label 0; the cumulant is undefined.");
        }
        return new Magnetisation(beta, abs, m2, m4, beta * var, beta * varAbs, 1 - m4 / (3 * m2 * m2), dos.labelName());
    }

    /**
     * The largest maximum of C(T) for kT in [kTLow, kTHigh]: located on a 400-point geometric grid,
     * then refined as the root of dC/dbeta (see the class notes for accuracy).
     *
     * @throws InvalidInputException when the largest grid value lies at an end of the interval
     *         (the peak is outside it)
     */
    public Peak heatCapacityPeak(double kTLow, double kTHigh) {
        checkTemperature(kTLow, "kTLow");
        checkTemperature(kTHigh, "kTHigh");
        if (!(kTHigh > kTLow)) {
            throw InvalidInputException.of("kTHigh", kTHigh, "> kTLow = " + kTLow, "");
        }
        int points = 400;
        double ratio = Math.pow(kTHigh / kTLow, 1.0 / (points - 1));
        int best = 0;
        double bestC = -1;
        double[] kT = new double[points];
        for (int i = 0; i < points; i++) {
            kT[i] = i == points - 1 ? kTHigh : kTLow * Math.pow(ratio, i);
            double c = atTemperature(kT[i]).heatCapacity();
            if (c > bestC) {
                bestC = c;
                best = i;
            }
        }
        if (best == 0 || best == points - 1) {
            throw InvalidInputException.of("interval [kTLow, kTHigh]", "[" + kTLow + ", " + kTHigh + "]",
                    "an interval with the heat-capacity maximum inside it (the largest C is at kT = " + kT[best] + ")",
                    "Widen the interval.");
        }
        double betaHi = 1 / kT[best - 1];
        double betaLo = 1 / kT[best + 1];
        double beta = Roots.solve("heat-capacity peak (dC/dbeta = 0) near kT = " + kT[best], this::slope, betaLo, betaHi,
                1e-14 * betaHi);
        State s = atBeta(beta);
        return new Peak(1 / beta, beta, s.heatCapacity(), byEnergy.scale().name());
    }

    /** 2 k_2 - beta k_3, proportional to dC/dbeta. */
    private double slope(double beta) {
        double[] p = new double[energy.length];
        weights(beta, energy, lnG, p);
        double u = 0;
        for (int i = 0; i < p.length; i++) {
            u += p[i] * energy[i];
        }
        double k2 = 0;
        double k3 = 0;
        for (int i = 0; i < p.length; i++) {
            double d = energy[i] - u;
            k2 += p[i] * d * d;
            k3 += p[i] * d * d * d;
        }
        return 2 * k2 - beta * k3;
    }

    /** Fills p with normalised Boltzmann weights and returns ln Z. */
    private static double weights(double beta, double[] e, double[] lg, double[] p) {
        double max = Double.NEGATIVE_INFINITY;
        for (int i = 0; i < e.length; i++) {
            p[i] = lg[i] - beta * e[i];
            max = Math.max(max, p[i]);
        }
        double sum = 0;
        for (int i = 0; i < e.length; i++) {
            p[i] = Math.exp(p[i] - max);
            sum += p[i];
        }
        for (int i = 0; i < e.length; i++) {
            p[i] /= sum;
        }
        return max + Math.log(sum);
    }

    private static void checkBeta(double beta) {
        if (!Double.isFinite(beta) || beta == 0) {
            throw InvalidInputException.of("beta", beta, "finite and non-zero",
                    "beta = 0 (infinite temperature) has F = -kT ln Z infinite; use a small beta.");
        }
    }

    private static void checkTemperature(double kT, String what) {
        if (!Double.isFinite(kT) || kT <= 0) {
            throw InvalidInputException.of(what, kT, "finite and > 0", "");
        }
    }

    /** A table of {@link State} rows, one per temperature kT (in the scale's unit). */
    public Sweep sweep(double... kT) {
        List<List<Object>> rows = new ArrayList<>();
        for (double t : kT) {
            rows.add(atTemperature(t).rows().get(0));
        }
        List<String> names = atTemperature(kT.length == 0 ? 1 : kT[0]).columnNames();
        return new Sweep(names, Collections.unmodifiableList(rows));
    }

    /** A table of canonical states, one row per temperature. */
    public record Sweep(List<String> columnNames, List<List<Object>> rows) implements Tabular { }

    /**
     * One canonical state: ln Z, U, C, S, F at inverse temperature beta (energies in {@code unit}).
     */
    public record State(double beta, double lnZ, double energy, double heatCapacity, double entropy, double freeEnergy,
                        String unit) implements Tabular {
        /** kT = 1 / beta. */
        public double temperature() {
            return 1 / beta;
        }

        @Override
        public List<String> columnNames() {
            return List.of("kT [" + unit + "]", "ln Z", "U [" + unit + "]", "C [k]", "S [k]", "F [" + unit + "]");
        }

        @Override
        public List<List<Object>> rows() {
            return List.of(List.of(1 / beta, lnZ, energy, heatCapacity, entropy, freeEnergy));
        }
    }

    /** Magnetisation statistics at inverse temperature beta (extensive: M is the total label). */
    public record Magnetisation(double beta, double meanAbs, double meanSquare, double meanFourth, double susceptibility,
                                double absSusceptibility, double binder, String label) implements Tabular {
        @Override
        public List<String> columnNames() {
            return List.of("beta", "<|" + label + "|>", "<" + label + "^2>", "<" + label + "^4>", "chi", "chi'", "U_4");
        }

        @Override
        public List<List<Object>> rows() {
            return List.of(List.of(beta, meanAbs, meanSquare, meanFourth, susceptibility, absSusceptibility, binder));
        }
    }

    /** The heat-capacity maximum: temperature kT (units of {@code unit}), beta, and height C (units of k). */
    public record Peak(double kT, double beta, double heatCapacity, String unit) implements Tabular {
        @Override
        public List<String> columnNames() {
            return List.of("kT at C max [" + unit + "]", "beta", "C max [k]");
        }

        @Override
        public List<List<Object>> rows() {
            return List.of(List.of(kT, beta, heatCapacity));
        }
    }
}
