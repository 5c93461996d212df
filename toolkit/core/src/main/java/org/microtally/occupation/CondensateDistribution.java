package org.microtally.occupation;

import java.util.ArrayList;
import java.util.List;
import org.microtally.InvalidInputException;
import org.microtally.Tabular;

/**
 * The probability distribution of the number N_0 of particles in the lowest single-particle level
 * (all its states together), P(N_0 = j) for j = 0..N, with its mean and variance.
 *
 * <p><b>Formula and where the p_j come from.</b> This class holds a distribution computed elsewhere,
 * normally by {@link org.microtally.ensemble.Canonical}: for bosons P(N_0 = j) = L_0[j] Z'_{N-j} / Z_N,
 * with L_0[j] = C(g_0 + j - 1, j) e^{-beta j e_0} the series of the lowest level's own states and Z'
 * the canonical partition functions of all other levels (for a non-degenerate lowest level this is
 * the same as P(N_0 &gt;= j) = e^{-beta j e_0} Z_{N-j} / Z_N); Fermi and Gentile particles use that
 * level's own capped series in place of L_0; distinguishable particles give a binomial distribution
 * with p = g_0 e^{-beta e_0} / Z_1. Method: the partition-function ratio form of the canonical
 * ground-state number distribution (H. D. Politzer, Phys. Rev. A 54, 5048 (1996); M. Wilkens and
 * C. Weiss, J. Mod. Opt. 44, 1801 (1997); both from memory), evaluated in
 * {@link org.microtally.ensemble.Canonical} with positive terms only.
 *
 * <p><b>Mean and variance.</b> mean = sum_j j p_j / sum_j p_j and variance = sum_j (j - mean)^2 p_j
 * / sum_j p_j, the probabilities renormalised by their sum (the constructor accepts sums within 1e-9
 * of 1). Both are accumulated with non-negative terms only.
 *
 * <p><b>Accuracy.</b> The probabilities are stored as given, so they carry the accuracy of their
 * producer (for {@code Canonical}, the bound stated in its class notes). The mean and variance add a
 * relative rounding error of at most about (N + 1) 2^-53 to the relative accuracy of the p_j, since
 * every term is non-negative; the error of the mean enters the variance only at second order (the
 * sum of (j - m)^2 p_j is stationary at m = mean).
 */
public final class CondensateDistribution implements Tabular {
    private final double[] probabilities;
    private final double mean;
    private final double variance;

    /** @param probabilities P(N_0 = j) for j = 0..N; finite, &gt;= 0, summing to 1 within 1e-9 */
    public CondensateDistribution(double[] probabilities) {
        double sum = 0;
        double m = 0;
        for (int j = 0; j < probabilities.length; j++) {
            double p = probabilities[j];
            if (!(p >= 0) || !Double.isFinite(p)) {
                throw InvalidInputException.of("P(N_0 = " + j + ")", p, "a finite number >= 0", "");
            }
            sum += p;
            m += j * p;
        }
        if (Math.abs(sum - 1) > 1e-9) {
            throw InvalidInputException.of("sum of the condensate probabilities", sum, "1 within 1e-9", "");
        }
        m /= sum;
        double v = 0;
        for (int j = 0; j < probabilities.length; j++) {
            double d = j - m;
            v += d * d * probabilities[j];
        }
        this.probabilities = probabilities.clone();
        this.mean = m;
        this.variance = v / sum;
    }

    /** P(N_0 = j); 0 for j outside 0..N. */
    public double probability(int j) {
        return j < 0 || j >= probabilities.length ? 0.0 : probabilities[j];
    }

    /** The probabilities P(N_0 = j), j = 0..N (a copy). */
    public double[] probabilities() {
        return probabilities.clone();
    }

    /** Largest particle number N covered. */
    public int maxNumber() {
        return probabilities.length - 1;
    }

    /** Mean of N_0. */
    public double mean() {
        return mean;
    }

    /** Variance of N_0. */
    public double variance() {
        return variance;
    }

    @Override
    public List<String> columnNames() {
        return List.of("N0", "probability");
    }

    @Override
    public List<List<Object>> rows() {
        List<List<Object>> rows = new ArrayList<>(probabilities.length);
        for (int j = 0; j < probabilities.length; j++) {
            rows.add(List.of(j, probabilities[j]));
        }
        return rows;
    }

    /** E.g. {@code "CondensateDistribution[N_0 = 0..40, <N_0> = 31.2, Var N_0 = 4.1]"}. */
    @Override
    public String toString() {
        return "CondensateDistribution[N_0 = 0.." + maxNumber() + ", <N_0> = " + mean() + ", Var N_0 = " + variance() + "]";
    }
}
