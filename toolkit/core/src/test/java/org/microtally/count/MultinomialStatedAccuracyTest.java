package org.microtally.count;

import java.util.Random;
import org.junit.jupiter.api.Test;
import org.microtally.MeasuredAccuracy;

/** {@link Multinomial#MAX_ERROR} is a bound; this measures the worst error on exact and closed-form references. */
class MultinomialStatedAccuracyTest {

    private static double error(double actual, double reference) {
        return Math.abs(actual - reference) / Math.max(1, Math.abs(reference));
    }

    @Test
    void logarithmsMeetTheStatedBound() {
        Random rnd = new Random(20261203L);
        double worst = 0;
        int points = 0;
        for (int trial = 0; trial < 300; trial++) {
            MultinomialCase c = MultinomialCase.random(rnd, trial < 150 ? 25 : 800);
            // Source: the exact references of MultinomialCase (exact BigInteger coefficient, ln by ExactLog, 2 ulp)
            worst = Math.max(worst, error(Multinomial.lnCount(c.asDoubles()), c.exactLnCount()));
            worst = Math.max(worst, error(Multinomial.lnProbability(c.asDoubles()), c.exactLnProbability()));
            points += 2;
        }
        for (double n : new double[] {6e12, 3 * Math.scalb(1.0, 60), 3 * Math.scalb(1.0, 89)}) {
            // Source: Stirling (DLMF 5.11.1): ln[C(N, N/2) / 2^N] = 0.5 ln(2/(pi N)) - 1/(4N) + O(N^-3)
            worst = Math.max(worst, error(Multinomial.lnProbability(n / 2, n / 2), 0.5 * Math.log(2 / (Math.PI * n)) - 0.25 / n));
            // Source: same, M = 3 equal boxes: ln P = ln(3 sqrt 3 / (2 pi N)) + O(1/N)
            worst = Math.max(worst, error(Multinomial.lnProbability(n / 3, n / 3, n / 3),
                    Math.log(3 * Math.sqrt(3) / (2 * Math.PI * n))));
            points += 2;
        }
        MeasuredAccuracy.assertBound("Multinomial lnCount, lnProbability (relative to max(1, |ln|))", worst,
                Multinomial.MAX_ERROR, points);
    }
}
