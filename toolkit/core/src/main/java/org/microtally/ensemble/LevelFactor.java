package org.microtally.ensemble;

/**
 * The generating factor of one whole level of g states, truncated at t^limit, in closed form:
 * f(y t)^g with f(w) = 1 + w (Fermi: C(g, j) y^j), 1/(1 - w) (Bose: C(g + j - 1, j) y^j) or
 * 1 + w + ... + w^k (Gentile: binary powering of the truncated polynomial), so a level costs
 * O(limit) (Fermi, Bose) or O(log g limit^2) (Gentile) instead of g single-state steps.
 * Package-private helper of {@link ScaledSeries}.
 *
 * <p>Coefficients are mantissas b_j times e^{logScale}, the largest in [1, 2), all non-negative.
 * Fermi and Bose: b_j from b_{j-1} times y (g -/+ j + 1)/j, with y split as 2^a y_m so no power
 * overflows, and a binary exponent carried per entry: relative error at most about 3 j 2^-53 plus
 * j times the error of y itself (the conditioning of e^{ln y}, as in the single-state steps).
 * Gentile: each product of two non-negative truncated polynomials rounds every coefficient with
 * relative error below (limit + 1) 2^-53, and 2 log2 g products are made.
 * (Closed forms: the binomial theorem and the negative binomial series, common practice, no
 * source; binary powering: Knuth, TAOCP vol. 2, 4.6.3, from memory.)
 */
final class LevelFactor {
    private static final double LN2 = Math.log(2.0);

    final double[] b;
    final double logScale;

    private LevelFactor(double[] b, double logScale) {
        this.b = b;
        this.logScale = logScale;
    }

    /**
     * Whether the closed form is clearly cheaper than {@code count} single-state steps on a series of
     * degree n: its convolution costs about width^2 against count x width for the steps, whose inner
     * loops are faster (Bose steps run four at a time), hence the margins 8 (Bose) and 3 (Fermi).
     */
    static boolean pays(int count, int cap, int n) {
        long width = Math.min((long) count * Math.min(cap, n), n) + 1L;
        if (cap == Integer.MAX_VALUE) {
            return count > 8 * width;
        }
        if (cap == 1) {
            return count > 3 * width;
        }
        double log2 = 64 - Long.numberOfLeadingZeros(count);
        return (double) count * (Math.min(cap, n) + 1.0) > 2 * log2 * width + width;
    }

    static LevelFactor of(int count, double lnY, int cap, int limit) {
        if (cap == 1 || cap == Integer.MAX_VALUE) {
            return binomial(count, lnY, cap == 1, limit);
        }
        return power(count, lnY, cap, limit);
    }

    private static LevelFactor binomial(int count, double lnY, boolean fermi, int limit) {
        int size = (int) Math.min(fermi ? (long) count : limit, limit) + 1;
        double a = Math.floor(lnY / LN2);
        double ym = Math.exp(lnY - a * LN2);
        double[] mant = new double[size];
        double[] exp2 = new double[size];
        mant[0] = 1;
        double maxExp = 0;
        for (int j = 1; j < size; j++) {
            double r = ym * (fermi ? (double) count - j + 1 : (double) count + j - 1) / j;
            double mj = mant[j - 1] * r;
            int k = Math.getExponent(mj);
            mant[j] = Math.scalb(mj, -k);
            exp2[j] = exp2[j - 1] + a + k;
            maxExp = Math.max(maxExp, exp2[j]);
        }
        double[] b = new double[size];
        for (int j = 0; j < size; j++) {
            b[j] = Math.scalb(mant[j], (int) Math.max(exp2[j] - maxExp, -1100));
        }
        return new LevelFactor(b, maxExp * LN2);
    }

    private static LevelFactor power(int count, double lnY, int k, int limit) {
        int width = (int) Math.min((long) count * k, limit) + 1;
        double[] base = new double[Math.min(k, limit) + 1];
        double baseScale = 0;
        if (lnY <= 0) {
            for (int j = 0; j < base.length; j++) {
                base[j] = Math.exp(j * lnY);
            }
        } else {
            for (int j = 0; j < base.length; j++) {
                base[j] = Math.exp((j - k) * lnY);
            }
            baseScale = k * lnY;
        }
        double[] result = {1};
        double resultScale = 0;
        int e = count;
        while (true) {
            if ((e & 1) != 0) {
                LevelFactor p = product(result, resultScale, base, baseScale, width);
                result = p.b;
                resultScale = p.logScale;
            }
            e >>>= 1;
            if (e == 0) {
                break;
            }
            LevelFactor sq = product(base, baseScale, base, baseScale, width);
            base = sq.b;
            baseScale = sq.logScale;
        }
        return new LevelFactor(result, resultScale);
    }

    /** The product of two scaled non-negative polynomials truncated at width - 1, renormalised. */
    private static LevelFactor product(double[] x, double xs, double[] y, double ys, int width) {
        int size = Math.min(width, x.length + y.length - 1);
        double[] z = new double[size];
        double max = 0;
        for (int m = 0; m < size; m++) {
            double acc = 0;
            for (int i = Math.max(0, m - y.length + 1); i <= Math.min(m, x.length - 1); i++) {
                acc += x[i] * y[m - i];
            }
            z[m] = acc;
            max = Math.max(max, acc);
        }
        int shift = Math.getExponent(max);
        for (int m = 0; m < size; m++) {
            z[m] = Math.scalb(z[m], -shift);
        }
        return new LevelFactor(z, xs + ys + shift * LN2);
    }
}
