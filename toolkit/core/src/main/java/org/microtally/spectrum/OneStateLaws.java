package org.microtally.spectrum;

import java.math.BigInteger;
import org.microtally.Inputs;
import org.microtally.InvalidInputException;
import org.microtally.exact.Combinatorics;

/**
 * Grand canonical occupation of one single-particle state as a function of
 * {@code x = (e - mu) / kT}: mean, variance and the state's contribution to ln Xi.
 *
 * <table>
 *   <caption>Formulas (common practice, e.g. any statistical mechanics text)</caption>
 *   <tr><th>law</th><th>mean n</th><th>variance</th><th>ln xi</th></tr>
 *   <tr><td>Bose-Einstein (x &gt; 0)</td><td>1/(e^x - 1)</td><td>n(n+1)</td><td>-ln(1 - e^-x)</td></tr>
 *   <tr><td>Fermi-Dirac</td><td>1/(e^x + 1)</td><td>n(1-n)</td><td>ln(1 + e^-x)</td></tr>
 *   <tr><td>Maxwell-Boltzmann</td><td>e^-x</td><td>n</td><td>e^-x</td></tr>
 *   <tr><td>Gentile, at most k</td><td>sum m y^m / sum y^m, y = e^-x</td><td>&lt;m^2&gt; - n^2</td>
 *       <td>ln sum_{m=0..k} y^m</td></tr>
 * </table>
 *
 * <p>Method: each formula is evaluated in the branch that never forms e^{|x|} (expm1/log1p for the
 * Bose and Fermi laws; for Gentile the geometric sums run over powers of e^{-|x|} &lt;= 1, the
 * particle-hole image m -&gt; k - m is used for x &lt; 0). Accuracy: a few ulp relative for mean and
 * ln xi, and for the variance, wherever the result is a finite double. That is not the whole real
 * line: the Maxwell-Boltzmann mean, variance and ln xi (e^-x) overflow for x below about -709.78;
 * the Bose-Einstein mean (about 1/x) overflows for x below about 5.6e-309 and its variance (about
 * 1/x^2) for x below about 7.5e-155; the Gentile ln xi (about -k x) overflows for x below about
 * -1.8e308/k. Fermi-Dirac results are finite for every finite x. Where a result would not be
 * finite, the method throws {@link InvalidInputException} naming x, never returning Infinity.
 *
 * <p>{@link Statistics#DISTINGUISHABLE} is mapped to Maxwell-Boltzmann: the grand canonical
 * ensemble of classical particles with Boltzmann's 1/N! counting.
 *
 * <p>Package-private: the public doors are {@link Statistics#meanOccupation}, {@link Statistics#occupationVariance},
 * {@link Statistics#lnStateSum}, {@link Statistics#levelWays} and the named laws of
 * {@code org.microtally.occupation.MeanOccupation}.
 */
final class OneStateLaws {
    private OneStateLaws() { }

    /** Bose-Einstein mean 1/(e^x - 1); x must be &gt; 0 (mu below the state). */
    static double boseEinstein(double x) {
        requireBoseArgument(x);
        return requireFiniteResult("Bose-Einstein mean occupation", x, 1.0 / Math.expm1(x));
    }

    /** Fermi-Dirac mean 1/(e^x + 1), any finite x. */
    static double fermiDirac(double x) {
        requireFinite(x);
        if (x > 0) {
            double t = Math.exp(-x);
            return t / (1.0 + t);
        }
        return 1.0 / (1.0 + Math.exp(x));
    }

    /** Maxwell-Boltzmann mean e^-x. */
    static double maxwellBoltzmann(double x) {
        requireFinite(x);
        return requireFiniteResult("Maxwell-Boltzmann mean occupation", x, Math.exp(-x));
    }

    /** Gentile mean occupation with at most {@code k} particles per state. */
    static double gentile(int k, double x) {
        return gentileMoments(k, x)[0];
    }

    static double mean(Statistics statistics, double x) {
        return switch (statistics.kind()) {
            case BOSE -> boseEinstein(x);
            case FERMI -> fermiDirac(x);
            case DISTINGUISHABLE -> maxwellBoltzmann(x);
            case GENTILE -> gentile(statistics.maxOccupancy(), x);
        };
    }

    static double variance(Statistics statistics, double x) {
        return switch (statistics.kind()) {
            case BOSE -> {
                double n = boseEinstein(x);
                yield requireFiniteResult("Bose-Einstein occupation variance", x, n * (n + 1));
            }
            case FERMI -> {
                double n = fermiDirac(x);
                yield n * fermiDirac(-x);
            }
            case DISTINGUISHABLE -> maxwellBoltzmann(x);
            case GENTILE -> gentileMoments(statistics.maxOccupancy(), x)[1];
        };
    }

    static double logFactor(Statistics statistics, double x) {
        requireFinite(x);
        return switch (statistics.kind()) {
            case BOSE -> {
                requireBoseArgument(x);
                yield -Math.log(-Math.expm1(-x));
            }
            case FERMI -> x > 0 ? Math.log1p(Math.exp(-x)) : -x + Math.log1p(Math.exp(x));
            case DISTINGUISHABLE -> requireFiniteResult("Maxwell-Boltzmann ln xi", x, Math.exp(-x));
            case GENTILE -> requireFiniteResult("Gentile ln xi", x, gentileLogFactor(statistics.maxOccupancy(), x));
        };
    }

    /** Mean and variance of the Gentile occupation, {mean, variance}. */
    static double[] gentileMoments(int k, double x) {
        requireFinite(x);
        Inputs.atLeast("maximum occupancy k", k, 1);
        double[] s = gentileSums(k, x);
        double mean = s[1] / s[0];
        double var = s[2] / s[0] - mean * mean;
        if (var < 0) {
            var = 0;
        }
        return new double[] {x < 0 ? k - mean : mean, var};
    }

    private static double gentileLogFactor(int k, double x) {
        return Math.log(gentileSums(k, x)[0]) + (x < 0 ? -k * x : 0.0);
    }

    /**
     * {s0, s1, s2} = sum_{m=0..k} m^p y^m for p = 0, 1, 2 with y = e^{-|x|} &lt;= 1 (the occupation law
     * folded onto x &gt;= 0, m counting particles, or holes when x &lt; 0); terms below 1e-300 of s0
     * are dropped, an error far below rounding.
     */
    private static double[] gentileSums(int k, double x) {
        double y = Math.exp(-Math.abs(x));
        double p = 1;
        double s0 = 1;
        double s1 = 0;
        double s2 = 0;
        for (int m = 1; m <= k; m++) {
            p *= y;
            if (p < 1e-300 * s0 || p == 0) {
                break;
            }
            s0 += p;
            s1 += m * p;
            s2 += (double) m * m * p;
        }
        return new double[] {s0, s1, s2};
    }

    private static void requireFinite(double x) {
        if (!Double.isFinite(x)) {
            throw InvalidInputException.of("(e - mu)/kT", x, "a finite number",
                    "Check that kT > 0 and mu are finite.");
        }
    }

    /**
     * Returns {@code result} if it is finite; otherwise throws naming x, the range of x for which
     * {@code quantity} is a finite double, and what to do.
     */
    private static double requireFiniteResult(String quantity, double x, double result) {
        if (Double.isFinite(result)) {
            return result;
        }
        throw InvalidInputException.of("(e - mu)/kT", x,
                "such that the " + quantity + " is a finite double (it overflows here)",
                "Choose mu and kT so that x lies in the range given in the Statistics Javadoc"
                        + " (e.g. mu further below the level).");
    }

    private static void requireBoseArgument(double x) {
        requireFinite(x);
        if (!(x > 0)) {
            throw InvalidInputException.of("(e - mu)/kT for a Bose-Einstein state", x, "> 0 (mu below every level)",
                    "Choose mu below the lowest level, or fix <N> and let the solver find mu.");
        }
    }

    /**
     * Number of ways to put {@code r} indistinguishable particles into g states, at most k each:
     * C(g, r) for k = 1, C(g + r - 1, r) for k &gt;= r, otherwise the inclusion-exclusion sum over the
     * states forced above k, sum_i (-1)^i C(g, i) C(r - i(k+1) + g - 1, g - 1) (the standard count of
     * bounded compositions, e.g. Stanley, <i>Enumerative Combinatorics</i> vol. 1, ch. 1, from memory).
     * Exact; cost O(r^2 / k) big-integer operations, independent of g.
     */
    static BigInteger boundedWays(long g, int k, int r) {
        if (g == 0) {
            return r == 0 ? BigInteger.ONE : BigInteger.ZERO;
        }
        if (k == 1) {
            return Combinatorics.binomial(g, r);
        }
        if (k >= r) {
            return Combinatorics.binomial(g + r - 1, r);
        }
        BigInteger sum = BigInteger.ZERO;
        BigInteger choose = BigInteger.ONE;
        for (int i = 0; i <= g && (long) i * (k + 1) <= r; i++) {
            if (i > 0) {
                choose = choose.multiply(BigInteger.valueOf(g - i + 1)).divide(BigInteger.valueOf(i));
            }
            long rest = r - (long) i * (k + 1);
            BigInteger term = choose.multiply(Combinatorics.binomial(rest + g - 1, rest));
            sum = (i & 1) == 0 ? sum.add(term) : sum.subtract(term);
        }
        return sum;
    }
}
