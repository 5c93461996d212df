package org.microtally.occupation;

import java.util.ArrayList;
import java.util.List;
import org.microtally.InvalidInputException;
import org.microtally.Tabular;

/**
 * The probability distribution of the number N_0 of particles in the lowest single-particle level
 * (all its states together), P(N_0 = j) for j = 0..N, with its mean and variance.
 *
 * <p>Mean and variance are accumulated from the probabilities with positive terms only
 * (sum j p_j, sum (j - mean)^2 p_j), so they carry the relative accuracy of the p_j.
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
}
