package org.microtally.count;

import static org.junit.jupiter.api.Assertions.assertTrue;

import java.math.BigInteger;
import java.util.Random;
import org.junit.jupiter.api.Test;
import org.microtally.ProgressListener;
import org.microtally.spectrum.Spectra;
import org.microtally.spectrum.Spectrum;
import org.microtally.spectrum.Statistics;
import org.microtally.exact.Combinatorics;
import org.microtally.exact.ExactLog;

class CountBoundTest {

    /** Exact level coefficients as doubles (no shared code with the bound beyond the series itself). */
    private static double[][] coefficients(int[] en, int[] g, Statistics st, int maxN, int maxE) {
        int levels = CountEngine.relevantLevels(en, maxE);
        double[][] c = new double[levels][];
        for (int l = 0; l < levels; l++) {
            BigInteger[] b = LevelSeries.coefficients(st, g[l], CountEngine.maxJ(en[l], maxN, maxE));
            c[l] = new double[b.length];
            for (int j = 0; j < b.length; j++) {
                c[l][j] = b[j].doubleValue();
            }
        }
        return c;
    }

    /** ln G(e^u, e^v) - N u - E v. */
    /**
     * The bound in bits (with the 2-bit margin) at the best point of a grid over u in [uMin, 0] and
     * v in [vMin, 0] with steps du, dv: a brute-force minimisation of the same saddle-point function.
     */
    private static double gridSearchBits(double[][] c, int[] en, int maxN, int maxE,
                                         double uMin, double du, double vMin, double dv) {
        double grid = Double.POSITIVE_INFINITY;
        for (double u = uMin; u <= 0; u += du) {
            for (double v = vMin; v <= 0; v += dv) {
                grid = Math.min(grid, saddle(c, en, maxN, maxE, u, v));
            }
        }
        return Math.max(grid / Math.log(2), 0) + 2;
    }

    private static double saddle(double[][] c, int[] en, int maxN, int maxE, double u, double v) {
        double f = -maxN * u - maxE * v;
        for (int l = 0; l < c.length; l++) {
            double y = Math.exp(u + en[l] * v);
            double s = 0;
            for (int j = c[l].length - 1; j >= 0; j--) {
                s = s * y + c[l][j];
            }
            f += Math.log(s);
        }
        return f;
    }

    @Test
    void newtonBoundIsValidAndAsTightAsAGridSearch() {
        Random rnd = new Random(49L);
        Statistics[] all = {Statistics.BOSE, Statistics.FERMI, Statistics.maxOccupancy(2)};
        for (int trial = 0; trial < 24; trial++) {
            Spectrum s = trial % 2 == 0 ? Spectra.harmonicOscillator(1 + rnd.nextInt(3), 40)
                    : CountTableTest.irregular(rnd);
            int[] en = s.integerEnergies();
            int[] g = s.degeneracies();
            Statistics st = all[trial % all.length];
            int maxN = 1 + rnd.nextInt(30);
            int maxE = 1 + rnd.nextInt(40);
            double bits = CountBound.log2Bound(en, g, st, maxN, maxE);
            BigInteger[] exact = CountEngine.bigInteger(en, g, st, maxN, maxE, ProgressListener.NONE);
            int largest = 0;
            for (BigInteger x : exact) {
                largest = Math.max(largest, x.bitLength());
            }
            // Source: Flajolet & Sedgewick, Analytic Combinatorics, Ch. VIII (saddle-point bounds dominate every coefficient)
            assertTrue(largest <= bits + 1, "trial " + trial + ": bound " + bits + " vs " + largest + " bits");
            double gridBits = gridSearchBits(coefficients(en, g, st, maxN, maxE), en, maxN, maxE, -12, 0.08, -6, 0.04);
            // Source: independent brute force (grid search of the same saddle-point function)
            assertTrue(bits <= gridBits + 0.01, "trial " + trial + ": Newton " + bits + " vs grid " + gridBits);
        }
    }

    /**
     * The benchmark size 40 x 200 (3D oscillator, 201 levels, up to 40 terms each: the ratio recurrence,
     * the cut-off tails and the climbed peaks all in use) and a 1D oscillator with long level series
     * (300 levels, up to 30 terms): the bound is at least every exact count and no looser than a grid search.
     */
    @Test
    void boundIsValidAndTightAtTheBenchmarkSize() {
        Object[][] cases = {
            {Spectra.harmonicOscillator(3, 200), Statistics.BOSE, 40, 200},
            {Spectra.harmonicOscillator(3, 200), Statistics.FERMI, 40, 200},
            {Spectra.harmonicOscillator(3, 200), Statistics.maxOccupancy(2), 40, 200},
            {Spectra.harmonicOscillator(1, 300), Statistics.BOSE, 30, 300},
        };
        for (Object[] c : cases) {
            Spectrum s = (Spectrum) c[0];
            Statistics st = (Statistics) c[1];
            int maxN = (Integer) c[2];
            int maxE = (Integer) c[3];
            int[] en = s.integerEnergies();
            int[] g = s.degeneracies();
            double bits = CountBound.log2Bound(en, g, st, maxN, maxE);
            BigInteger largest = BigInteger.ZERO;
            for (BigInteger x : CountEngine.bigInteger(en, g, st, maxN, maxE, ProgressListener.NONE)) {
                largest = largest.max(x);
            }
            String what = st + " " + maxN + " x " + maxE + ": bound " + bits + " bits, largest count " + largest.bitLength() + " bits";
            // Source: Flajolet & Sedgewick, Analytic Combinatorics, Ch. VIII (saddle-point bounds dominate every
            // coefficient); exact counts from the independent BigInteger recursion
            assertTrue(ExactLog.ln(largest) / Math.log(2) <= bits, what);
            double gridBits = gridSearchBits(coefficients(en, g, st, maxN, maxE), en, maxN, maxE, -8, 0.05, -1.5, 0.01);
            // Source: independent brute force (grid search of the same saddle-point function)
            assertTrue(bits <= gridBits + 0.01, what + " vs grid " + gridBits);
        }
    }
}
