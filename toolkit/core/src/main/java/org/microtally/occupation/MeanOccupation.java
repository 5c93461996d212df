package org.microtally.occupation;

import org.microtally.spectrum.Statistics;

/**
 * Grand canonical occupation of one single-particle state as a function of
 * {@code x = (e - mu) / kT}: the named laws (Bose-Einstein, Fermi-Dirac, Maxwell-Boltzmann, Gentile).
 * The formulas, method, accuracy and the ranges of x where a result is finite are stated once, on
 * {@link Statistics} (its one-state laws, which these methods call); where a result would not be a
 * finite double an {@link org.microtally.InvalidInputException} names x, never returning Infinity.
 */
public final class MeanOccupation {
    private static final Statistics MAXWELL_BOLTZMANN = Statistics.DISTINGUISHABLE;

    private MeanOccupation() { }

    /** Bose-Einstein mean 1/(e^x - 1); x must be &gt; 0 (mu below the state). */
    public static double boseEinstein(double x) {
        return Statistics.BOSE.meanOccupation(x);
    }

    /** Fermi-Dirac mean 1/(e^x + 1), any finite x. */
    public static double fermiDirac(double x) {
        return Statistics.FERMI.meanOccupation(x);
    }

    /** Maxwell-Boltzmann mean e^-x. */
    public static double maxwellBoltzmann(double x) {
        return MAXWELL_BOLTZMANN.meanOccupation(x);
    }

    /** Gentile mean occupation with at most {@code k} particles per state. */
    public static double gentile(int k, double x) {
        return Statistics.maxOccupancy(k).meanOccupation(x);
    }

    /** The mean occupation of one state under {@code statistics}: {@link Statistics#meanOccupation}. */
    public static double mean(Statistics statistics, double x) {
        return statistics.meanOccupation(x);
    }

    /** The variance of the occupation of one state: {@link Statistics#occupationVariance}. */
    public static double variance(Statistics statistics, double x) {
        return statistics.occupationVariance(x);
    }

    /** The state's contribution to ln Xi: {@link Statistics#lnStateSum}. */
    public static double logFactor(Statistics statistics, double x) {
        return statistics.lnStateSum(x);
    }
}
