package org.microtally.spectrum;

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
        if (k < 1) {
            throw InvalidInputException.of("maximum occupancy k", k, "an integer >= 1", "");
        }
        return new Statistics(Kind.GENTILE, k);
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
