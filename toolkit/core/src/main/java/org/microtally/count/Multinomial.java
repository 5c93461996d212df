package org.microtally.count;

import java.math.BigDecimal;
import java.math.BigInteger;
import java.math.MathContext;
import org.apache.commons.math3.fraction.BigFraction;
import org.apache.commons.math3.special.Gamma;
import org.microtally.Inputs;
import org.microtally.InvalidInputException;
import org.microtally.exact.Combinatorics;

/**
 * Occupancy of M boxes by N labelled objects, each object in any box with equal probability.
 *
 * <p>An occupancy vector (n_1, ..., n_M), sum n_i = N, is realised by N! / (n_1! ... n_M!) of the
 * M^N assignments (the multinomial coefficient), so its probability is that over M^N.
 *
 * <p><b>Most probable occupancy.</b> As even as possible: N mod M boxes hold ceil(N/M) and the rest
 * floor(N/M). Proof: if n_i &gt;= n_j + 2, moving one object from box i to box j multiplies the count by
 * n_i / (n_j + 1) &gt; 1, so a maximiser has all n_i within 1 of each other, and every vector with
 * r = N mod M entries ceil(N/M) and M - r entries floor(N/M) has the same count. {@link #mostProbableOccupancy}
 * returns the one with the larger entries first.
 *
 * <p><b>Logarithms for huge N</b> (up to 1e27 and beyond, as doubles). The direct difference
 * lnGamma(N+1) - sum lnGamma(n_i+1) loses every digit at N = 1e27 (terms ~6e28, result ~ -30), so we
 * rearrange exactly. With ln x! = x ln x - x + r(x), r(0) = 0, and sum n_i = N,
 * <pre>
 *   ln C = sum_i n_i ln(N / n_i) + r(N) - sum_i r(n_i)                   (all first terms &gt;= 0)
 *   ln P = ln C - N ln M = -(N/M) sum_i f(d_i) + r(N) - sum_i r(n_i),    d_i = M n_i / N - 1,
 *          f(d) = (1 + d) ln(1 + d) - d &gt;= 0                            (uses sum d_i = 0)
 * </pre>
 * f is summed by its Taylor series sum_{k&gt;=2} (-d)^k / (k (k-1)) for |d| &lt;= 1/4. r(x) is the
 * Stirling series 0.5 ln(2 pi x) + 1/(12x) - 1/(360x^3) + 1/(1260x^5) - 1/(1680x^7) + 1/(1188x^9)
 * (DLMF 5.11.1; truncation error &lt; 1e-17 for x &gt;= 20), and ln(x! e^x / x^x) from the exact factorial
 * for integers x &lt; 20. N and the differences N - n_i, M n_i - N are formed exactly (BigDecimal).
 * <b>Accuracy.</b> Error below {@value #MAX_ERROR} times max(1, |result|) for every input, a bound
 * (the measured worst, against exact BigInteger logarithms and the Stirling closed forms up to
 * N = 3e27, is printed by MultinomialStatedAccuracyTest and is far smaller). {@link #lnCountByLogGamma} is the direct
 * Commons Math {@code Gamma.logGamma} difference, fine for N below ~1e6.
 */
public final class Multinomial {
    private Multinomial() { }

    /** Bound on the error of {@link #lnCount} and {@link #lnProbability}, relative to max(1, |result|). */
    public static final double MAX_ERROR = 1e-12;

    private static final double HALF_LN_2PI = 0.5 * Math.log(2 * Math.PI);

    /** N! / (n_1! ... n_M!), exact. */
    public static BigInteger count(int... occupancy) {
        int n = checkOccupancy(occupancy);
        BigInteger num = Combinatorics.factorial(n);
        BigInteger den = BigInteger.ONE;
        for (int k : occupancy) {
            den = den.multiply(Combinatorics.factorial(k));
        }
        return num.divide(den);
    }

    /** The exact probability count(occupancy) / M^N, M = occupancy.length. */
    public static BigFraction probability(int... occupancy) {
        int n = checkOccupancy(occupancy);
        return new BigFraction(count(occupancy), BigInteger.valueOf(occupancy.length).pow(n));
    }

    /** The most probable occupancy of {@code boxes} boxes by {@code objects} objects (see class notes). */
    public static int[] mostProbableOccupancy(int boxes, int objects) {
        Inputs.atLeast("number of boxes M", boxes, 1);
        Inputs.atLeast("number of objects N", objects, 0);
        int[] out = new int[boxes];
        int q = objects / boxes;
        int r = objects % boxes;
        for (int i = 0; i < boxes; i++) {
            out[i] = q + (i < r ? 1 : 0);
        }
        return out;
    }

    /** ln [N! / (n_1! ... n_M!)] for occupancies given as non-negative integer-valued doubles. */
    public static double lnCount(double... occupancy) {
        BigDecimal n = checkOccupancy(occupancy);
        double nd = n.doubleValue();
        double s = 0;
        double r = remainder(nd);
        for (double k : occupancy) {
            if (k > 0) {
                double ratioMinusOne = n.subtract(new BigDecimal(k)).divide(new BigDecimal(k), MathContext.DECIMAL64)
                        .doubleValue();
                s += k * Math.log1p(ratioMinusOne);
                r -= remainder(k);
            }
        }
        return s + r;
    }

    /** ln of the probability of the occupancy vector, M = occupancy.length boxes (see class notes). */
    public static double lnProbability(double... occupancy) {
        BigDecimal n = checkOccupancy(occupancy);
        int m = occupancy.length;
        double nd = n.doubleValue();
        if (nd == 0) {
            return 0.0;
        }
        BigDecimal bm = BigDecimal.valueOf(m);
        double s = 0;
        double r = remainder(nd);
        for (double k : occupancy) {
            double d = bm.multiply(new BigDecimal(k)).subtract(n).divide(n, MathContext.DECIMAL64).doubleValue();
            s += f(d);
            r -= remainder(k);
        }
        return -(nd / m) * s + r;
    }

    /** The direct formula lnGamma(N+1) - sum lnGamma(n_i+1) (Commons Math); accurate only for moderate N. */
    public static double lnCountByLogGamma(double... occupancy) {
        double n = checkOccupancy(occupancy).doubleValue();
        double s = Gamma.logGamma(n + 1);
        for (double k : occupancy) {
            s -= Gamma.logGamma(k + 1);
        }
        if (!Double.isFinite(s)) {
            throw InvalidInputException.of("total number of objects N", n,
                    "small enough that lnGamma(N + 1) is a finite double (about N < 1e305)",
                    "Use lnCount, which rearranges the logarithms and works for any finite N.");
        }
        return s;
    }

    /** f(d) = (1 + d) ln(1 + d) - d for d &gt;= -1. */
    static double f(double d) {
        if (d == -1) {
            return 1.0;
        }
        if (Math.abs(d) <= 0.25) {
            double s = 0;
            double p = d * d;
            for (int k = 2; k < 60; k++) {
                double t = p / ((double) k * (k - 1));
                s += (k % 2 == 0) ? t : -t;
                if (Math.abs(t) < 1e-18 * Math.abs(s)) {
                    break;
                }
                p *= d;
            }
            return s;
        }
        return (1 + d) * Math.log1p(d) - d;
    }

    /** r(x) = ln x! - x ln x + x (r(0) = 0). */
    static double remainder(double x) {
        if (x == 0) {
            return 0.0;
        }
        if (x < 20) {
            long fact = 1;
            for (int i = 2; i <= (int) x; i++) {
                fact *= i;
            }
            return Math.log(fact * Math.exp(x) / Math.pow(x, x));
        }
        double inv = 1 / x;
        double inv2 = inv * inv;
        double series = inv * (1.0 / 12 - inv2 * (1.0 / 360 - inv2 * (1.0 / 1260 - inv2 * (1.0 / 1680 - inv2 / 1188))));
        return HALF_LN_2PI + 0.5 * Math.log(x) + series;
    }

    private static int checkOccupancy(int[] occupancy) {
        if (occupancy == null || occupancy.length == 0) {
            throw InvalidInputException.of("number of boxes M", 0, "an integer >= 1", "");
        }
        long n = 0;
        for (int i = 0; i < occupancy.length; i++) {
            Inputs.atLeast("occupancy of box " + i, occupancy[i], 0);
            n += occupancy[i];
        }
        if (n > 100_000) {
            throw InvalidInputException.of("number of objects N", n, "at most 100000 for exact counts",
                    "Use lnCount / lnProbability, which work for any N.");
        }
        return (int) n;
    }

    private static BigDecimal checkOccupancy(double[] occupancy) {
        if (occupancy == null || occupancy.length == 0) {
            throw InvalidInputException.of("number of boxes M", 0, "an integer >= 1", "");
        }
        BigDecimal n = BigDecimal.ZERO;
        for (int i = 0; i < occupancy.length; i++) {
            double k = occupancy[i];
            if (!Double.isFinite(k) || k < 0 || k != Math.rint(k)) {
                throw InvalidInputException.of("occupancy of box " + i, k, "a finite integer >= 0", "");
            }
            n = n.add(new BigDecimal(k));
        }
        if (!Double.isFinite(n.doubleValue())) {
            throw InvalidInputException.of("total number of objects N = sum of the occupancies",
                    n.round(new MathContext(6)), "at most " + Double.MAX_VALUE + " (a finite double)",
                    "Rescale the occupancies; ln N! for such N is itself beyond double range.");
        }
        return n;
    }

}
