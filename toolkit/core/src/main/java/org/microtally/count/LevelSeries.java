package org.microtally.count;

import java.math.BigInteger;
import org.microtally.spectrum.Statistics;

/**
 * Coefficients c_j of the single-level generating factor F(y) = sum_j c_j y^j, y = x q^e, for a
 * level of degeneracy g holding j indistinguishable particles:
 * <ul>
 *   <li>Bose: F = (1 - y)^-g, c_j = C(g + j - 1, j) (multisets of size j from g states);</li>
 *   <li>Fermi: F = (1 + y)^g, c_j = C(g, j);</li>
 *   <li>Gentile k: F = ((1 - y^(k+1)) / (1 - y))^g = (1 + y + ... + y^k)^g, by J. C. P. Miller's
 *       recurrence for a power of a power series (D. E. Knuth, TAOCP Vol. 2, 3rd ed., Sec. 4.7,
 *       powers of power series): a_0 = 1, a_m = (1/m) sum_{i=1..min(k,m)} ((g+1) i - m) a_{m-i}, exact division.</li>
 * </ul>
 * All coefficients are exact and non-negative.
 */
final class LevelSeries {
    private LevelSeries() { }

    /** c_0..c_J with J = min(maxJ, largest j with c_j != 0). */
    static BigInteger[] coefficients(Statistics stats, int g, int maxJ) {
        switch (stats.kind()) {
            case BOSE: {
                BigInteger[] c = new BigInteger[maxJ + 1];
                c[0] = BigInteger.ONE;
                for (int j = 1; j <= maxJ; j++) {
                    c[j] = c[j - 1].multiply(BigInteger.valueOf((long) g + j - 1)).divide(BigInteger.valueOf(j));
                }
                return c;
            }
            case FERMI: {
                int top = Math.min(maxJ, g);
                BigInteger[] c = new BigInteger[top + 1];
                c[0] = BigInteger.ONE;
                for (int j = 1; j <= top; j++) {
                    c[j] = c[j - 1].multiply(BigInteger.valueOf((long) g - j + 1)).divide(BigInteger.valueOf(j));
                }
                return c;
            }
            case GENTILE: {
                int k = stats.maxOccupancy();
                int top = (int) Math.min(maxJ, (long) g * k);
                BigInteger[] a = new BigInteger[top + 1];
                a[0] = BigInteger.ONE;
                BigInteger g1 = BigInteger.valueOf((long) g + 1);
                for (int m = 1; m <= top; m++) {
                    BigInteger s = BigInteger.ZERO;
                    for (int i = 1; i <= Math.min(k, m); i++) {
                        s = s.add(g1.multiply(BigInteger.valueOf(i)).subtract(BigInteger.valueOf(m)).multiply(a[m - i]));
                    }
                    a[m] = s.divide(BigInteger.valueOf(m));
                }
                return a;
            }
            default:
                throw new IllegalStateException("no level series for " + stats);
        }
    }
}
