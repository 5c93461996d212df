package org.microtally.special;

import java.math.BigDecimal;
import java.math.MathContext;
import org.apache.commons.math3.special.Gamma;

/**
 * Small numeric helpers shared by the special functions of this package (package-private).
 *
 * <p>{@link #sinPi(double)} reduces its argument exactly (subtracting an even integer is exact in
 * binary floating point), so it returns exactly 0 at integers, which the reflection formula of the
 * zeta function needs at the trivial zeros.
 */
final class SpecialMath {
    private SpecialMath() { }

    /** Euler's constant gamma = gamma_0 (DLMF 5.2.3). */
    static final double EULER_GAMMA = 0.5772156649015328606;

    /**
     * Stieltjes constants gamma_0 .. gamma_9 of the Laurent series of zeta about s = 1,
     * zeta(s) = 1/(s-1) + sum_n (-1)^n gamma_n (s-1)^n / n! (DLMF 25.2.4). Values computed with
     * mpmath 1.3.0 {@code stieltjes(n)} at 25 digits, rounded to double.
     */
    static final double[] STIELTJES = {
        0.5772156649015328606065121,
        -0.07281584548367672486058638,
        -0.009690363192872318484530386,
        0.002053834420303345866160047,
        0.00232537006546730005746817,
        0.0007933238173010627017533349,
        -0.0002387693454301996098724218,
        -0.0005272895670577510460740975,
        -0.0003521233538030395096020522,
        -0.00003439477441808804817791462,
    };

    /** Largest k for which {@link #inversePowers} can fill k^-x. */
    static final int MAX_POWER_BASE = 64;

    /** SMALLEST_FACTOR[k] = least prime factor of k, 2 &lt;= k &lt;= MAX_POWER_BASE. */
    private static final int[] SMALLEST_FACTOR = new int[MAX_POWER_BASE + 1];

    /** ln p = LN_HI[p] + LN_LO[p] to about 32 digits for the primes p &lt;= MAX_POWER_BASE. */
    private static final double[] LN_HI = new double[MAX_POWER_BASE + 1];
    private static final double[] LN_LO = new double[MAX_POWER_BASE + 1];

    static {
        MathContext mc = new MathContext(40);
        BigDecimal ln2 = atanhTimesTwo(BigDecimal.ONE.divide(BigDecimal.valueOf(3), mc), mc);
        for (int k = 2; k <= MAX_POWER_BASE; k++) {
            if (SMALLEST_FACTOR[k] != 0) {
                continue;
            }
            for (int m = k; m <= MAX_POWER_BASE; m += k) {
                if (SMALLEST_FACTOR[m] == 0) {
                    SMALLEST_FACTOR[m] = k;
                }
            }
            // ln k = e ln 2 + 2 atanh((a - 1)/(a + 1)), a = k / 2^e in [1, 2)
            int e = 31 - Integer.numberOfLeadingZeros(k);
            BigDecimal a = BigDecimal.valueOf(k).divide(BigDecimal.valueOf(1L << e), mc);
            BigDecimal y = a.subtract(BigDecimal.ONE).divide(a.add(BigDecimal.ONE), mc);
            BigDecimal ln = ln2.multiply(BigDecimal.valueOf(e), mc).add(atanhTimesTwo(y, mc), mc);
            LN_HI[k] = ln.doubleValue();
            LN_LO[k] = ln.subtract(new BigDecimal(LN_HI[k]), mc).doubleValue();
        }
    }

    /** 2 atanh(y) = 2 sum_k y^(2k+1)/(2k+1) for 0 &lt;= y &lt;= 1/3, to the precision of mc. */
    private static BigDecimal atanhTimesTwo(BigDecimal y, MathContext mc) {
        BigDecimal y2 = y.multiply(y, mc);
        BigDecimal power = y;
        BigDecimal sum = BigDecimal.ZERO;
        BigDecimal tiny = BigDecimal.ONE.movePointLeft(mc.getPrecision() + 2);
        for (int k = 0; power.compareTo(tiny) > 0; k++) {
            sum = sum.add(power.divide(BigDecimal.valueOf(2L * k + 1), mc), mc);
            power = power.multiply(y2, mc);
        }
        return sum.add(sum, mc);
    }

    /**
     * out[k] = k^-x for k = 1 .. count (out[0] is set to 0), count &lt;= {@link #MAX_POWER_BASE}.
     * Method: for each prime p, p^-x = exp(-x ln p) with x ln p carried in double-double
     * (the product's rounding error recovered by fma, ln p to 32 digits), so each prime power is within
     * about 1 ulp of exp's own error; composite k = p m as p^-x m^-x (k &lt;= 64 takes at most five such
     * products, so each entry is within about 6 ulp). One exp per prime instead of one pow per k.
     */
    static void inversePowers(double x, double[] out, int count) {
        out[0] = 0.0;
        out[1] = 1.0;
        for (int k = 2; k <= count; k++) {
            int p = SMALLEST_FACTOR[k];
            if (p == k) {
                double hi = x * LN_HI[k];
                double lo = Math.fma(x, LN_HI[k], -hi) + x * LN_LO[k];
                double e = Math.exp(-hi);
                out[k] = Math.fma(-e, lo, e);
            } else {
                out[k] = out[p] * out[k / p];
            }
        }
    }

    /** sin(pi x) with exact argument reduction; exactly 0 at every integer. */
    static double sinPi(double x) {
        if (!Double.isFinite(x)) {
            return Double.NaN;
        }
        double r = x - 2.0 * Math.rint(0.5 * x); // r in [-1, 1], exact
        double sign = 1.0;
        if (r < 0) {
            r = -r;
            sign = -1.0;
        }
        // now r in [0, 1]; sin(pi r) = sin(pi (1 - r))
        if (r > 0.5) {
            r = 1.0 - r; // exact for r in (0.5, 1]
        }
        if (r == 0.0) {
            return 0.0;
        }
        if (r <= 0.25) {
            return sign * Math.sin(Math.PI * r);
        }
        return sign * Math.cos(Math.PI * (0.5 - r));
    }

    /** cos(pi x) with exact argument reduction; exactly 0 at half-integers. */
    static double cosPi(double x) {
        return sinPi(x + 0.5);
    }

    /**
     * Gamma(x) for real x that is not a non-positive integer (Commons Math {@link Gamma#gamma},
     * a Lanczos approximation; about 1e-15 relative for |x| <= 20 and a few 1e-14 beyond, from memory
     * of its documentation: not a figure of ours, and the special functions' stated figures are
     * measured end to end with it).
     */
    static double gamma(double x) {
        return Gamma.gamma(x);
    }

    /** The reciprocal 1/Gamma(x), exactly 0 at the non-positive integers (the poles of Gamma). */
    static double reciprocalGamma(double x) {
        if (x <= 0 && x == Math.rint(x)) {
            return 0.0;
        }
        if (x > 170) {
            return Math.exp(-Gamma.logGamma(x));
        }
        return 1.0 / gamma(x);
    }
}
