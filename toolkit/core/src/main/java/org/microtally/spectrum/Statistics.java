package org.microtally.spectrum;

import java.math.BigInteger;
import org.microtally.Inputs;
import org.microtally.InvalidInputException;

/**
 * How many particles may share one single-particle state, and whether particles are labelled.
 *
 * <ul>
 *   <li>{@link #DISTINGUISHABLE}: labelled particles, any number per state; a microstate is an
 *       assignment of a state to each particle.</li>
 *   <li>{@link #BOSE}: indistinguishable, any number per state.</li>
 *   <li>{@link #FERMI}: indistinguishable, at most one per state.</li>
 *   <li>{@link #maxOccupancy(int)}: Gentile's intermediate statistics, at most k per state
 *       (G. Gentile, Nuovo Cimento 17, 493 (1940)); k = 1 is Fermi, k &gt;= N is Bose.</li>
 * </ul>
 *
 *
 * <h2>One-state laws</h2>
 * For one single-particle state at x = (e - mu)/kT (grand canonical; formulas common practice, e.g.
 * any statistical mechanics text; Gentile's from Gentile 1940):
 * <table>
 *   <caption>mean, variance and ln of the one-state grand sum</caption>
 *   <tr><th>statistics</th><th>{@link #meanOccupation}</th><th>{@link #occupationVariance}</th>
 *       <th>{@link #lnStateSum}</th></tr>
 *   <tr><td>BOSE (x &gt; 0)</td><td>1/(e^x - 1)</td><td>n(n+1)</td><td>-ln(1 - e^-x)</td></tr>
 *   <tr><td>FERMI</td><td>1/(e^x + 1)</td><td>n(1-n)</td><td>ln(1 + e^-x)</td></tr>
 *   <tr><td>DISTINGUISHABLE (Maxwell-Boltzmann, 1/N! counting)</td><td>e^-x</td><td>n</td><td>e^-x</td></tr>
 *   <tr><td>GENTILE, at most k</td><td>sum m y^m / sum y^m, y = e^-x</td><td>&lt;m^2&gt; - n^2</td>
 *       <td>ln sum_{m=0..k} y^m</td></tr>
 * </table>
 * Accuracy: a few ulp relative wherever the result is a finite double; evaluated without forming
 * e^{|x|} (expm1/log1p; Gentile sums over powers of e^{-|x|}, particle-hole image for x &lt; 0). Not
 * finite, and then refused with an exception naming x: the Maxwell-Boltzmann laws for x below about
 * -709.78; the Bose mean for x below about 5.6e-309 and its variance below about 7.5e-155; the
 * Gentile ln sum for x below about -1.8e308/k. Fermi results are finite for every finite x.
 * {@link #levelWays} counts the ways to put j particles into the g states of one level (exact).
 *
 * @param kind         which family
 * @param maxOccupancy largest number of particles per single-particle state
 *                     ({@link Integer#MAX_VALUE} for Bose and distinguishable)
 */
public record Statistics(Kind kind, int maxOccupancy) {

    /** The statistics families. */
    public enum Kind { DISTINGUISHABLE, BOSE, FERMI, GENTILE }

    /** Labelled particles, unlimited occupancy. */
    public static final Statistics DISTINGUISHABLE = new Statistics(Kind.DISTINGUISHABLE, Integer.MAX_VALUE);
    /** Bose-Einstein: indistinguishable, unlimited occupancy. */
    public static final Statistics BOSE = new Statistics(Kind.BOSE, Integer.MAX_VALUE);
    /** Fermi-Dirac: indistinguishable, at most one per state. */
    public static final Statistics FERMI = new Statistics(Kind.FERMI, 1);

    /** Validates the combination. */
    public Statistics {
        if (kind == null) {
            throw new InvalidInputException("statistics kind must not be null");
        }
        if (maxOccupancy < 1) {
            throw InvalidInputException.of("maximum occupancy", maxOccupancy, "an integer >= 1",
                    "Use Statistics.FERMI for one particle per state.");
        }
        if (kind == Kind.FERMI && maxOccupancy != 1) {
            throw InvalidInputException.of("maximum occupancy for FERMI", maxOccupancy, "1",
                    "Use Statistics.maxOccupancy(k) for Gentile statistics.");
        }
        if ((kind == Kind.BOSE || kind == Kind.DISTINGUISHABLE) && maxOccupancy != Integer.MAX_VALUE) {
            throw InvalidInputException.of("maximum occupancy for " + kind, maxOccupancy, "unlimited",
                    "Use Statistics.maxOccupancy(k) for a finite cap.");
        }
    }

    /** Gentile statistics with at most {@code k} indistinguishable particles per state, k &gt;= 1. */
    public static Statistics maxOccupancy(int k) {
        Inputs.atLeast("maximum occupancy k", k, 1);
        return new Statistics(Kind.GENTILE, k);
    }

    /** Mean occupation of one state at x = (e - mu)/kT (see the class table); Bose needs x &gt; 0. */
    public double meanOccupation(double x) {
        return OneStateLaws.mean(this, x);
    }

    /** Variance of the occupation of one state at x = (e - mu)/kT (see the class table). */
    public double occupationVariance(double x) {
        return OneStateLaws.variance(this, x);
    }

    /** ln of the one-state grand sum, sum over allowed m of e^{-m x} (Maxwell-Boltzmann: e^-x; see the class table). */
    public double lnStateSum(double x) {
        return OneStateLaws.logFactor(this, x);
    }

    /**
     * Exact number of ways to put {@code j} particles into the {@code g} states of one level: Bose
     * C(g + j - 1, j), Fermi C(g, j), Gentile the bounded compositions (inclusion-exclusion, exact),
     * distinguishable g^j (each labelled particle picks a state; choosing which j particles is the caller's).
     */
    public BigInteger levelWays(long g, int j) {
        if (g < 0 || j < 0) {
            throw InvalidInputException.of("level states g and particles j", "(" + g + ", " + j + ")", "both >= 0", "");
        }
        return switch (kind) {
            case DISTINGUISHABLE -> BigInteger.valueOf(g).pow(j);
            case BOSE -> OneStateLaws.boundedWays(g, Math.max(j, 1), j);
            case FERMI, GENTILE -> OneStateLaws.boundedWays(g, maxOccupancy, j);
        };
    }

    /**
     * True for Bose statistics only: the mean occupation diverges as mu approaches a level from below,
     * so mu must stay below the lowest level and the lowest level can hold a condensate.
     */
    public boolean condenses() {
        return kind == Kind.BOSE;
    }

    /** True for every kind except {@link Kind#DISTINGUISHABLE}. */
    public boolean indistinguishable() {
        return kind != Kind.DISTINGUISHABLE;
    }

    /** True when the occupancy of a state is capped below any particle number. */
    public boolean capped() {
        return maxOccupancy != Integer.MAX_VALUE;
    }

    @Override
    public String toString() {
        return kind == Kind.GENTILE ? "GENTILE(k=" + maxOccupancy + ")" : kind.name();
    }
}
