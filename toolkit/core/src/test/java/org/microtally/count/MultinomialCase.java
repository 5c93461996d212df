package org.microtally.count;

import java.math.BigInteger;
import java.util.Random;
import org.microtally.exact.ExactLog;

/**
 * A random occupation of m = 1..6 boxes and its exact references: the BigInteger multinomial
 * coefficient C = N!/prod n_i! (by {@link Multinomial#count}, exact integer arithmetic), ln C from the
 * exact integer (ExactLog, 2 ulp), and ln P = ln(C / m^N) formed as ln(C 2^k / m^N) - k ln 2 with the
 * ratio taken exactly, k making it about 100 bits.
 */
record MultinomialCase(int[] occupations, double[] asDoubles, int particles, double exactLnCount,
                       double exactLnProbability) {

    /** Draws m, then each occupation uniformly in [0, maxOccupation). */
    static MultinomialCase random(Random rnd, int maxOccupation) {
        int m = 1 + rnd.nextInt(6);
        int[] occ = new int[m];
        double[] d = new double[m];
        int n = 0;
        for (int i = 0; i < m; i++) {
            occ[i] = rnd.nextInt(maxOccupation);
            d[i] = occ[i];
            n += occ[i];
        }
        BigInteger c = Multinomial.count(occ);
        BigInteger den = BigInteger.valueOf(m).pow(n);
        int k = Math.max(0, den.bitLength() - c.bitLength() + 100);
        return new MultinomialCase(occ, d, n, ExactLog.ln(c), ExactLog.ln(c.shiftLeft(k).divide(den)) - k * Math.log(2));
    }
}
