package org.microtally.special;

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
     * a Lanczos approximation with about 1e-15 relative accuracy for |x| <= 20 and a few 1e-14
     * beyond).
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
