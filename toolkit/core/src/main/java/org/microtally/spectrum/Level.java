package org.microtally.spectrum;

import org.microtally.InvalidInputException;

/**
 * One single-particle level: an energy, the number of independent states at that energy, and an
 * optional integer label for a second conserved quantity (for example twice a projection, 2m).
 *
 * @param energy     energy in the unit of the owning {@link Spectrum}; finite
 * @param degeneracy number of single-particle states with this energy and label; &gt;= 1
 * @param label      value of the second conserved quantity carried by each of these states
 *                   (0 when the spectrum is unlabelled)
 */
public record Level(double energy, int degeneracy, int label) {

    /** Validates the level; see the record description for the allowed ranges. */
    public Level {
        if (!Double.isFinite(energy)) {
            throw InvalidInputException.of("level energy", energy, "a finite number",
                    "Remove the level or give its energy as a finite value.");
        }
        if (degeneracy < 1) {
            throw InvalidInputException.of("degeneracy of the level at energy " + energy, degeneracy,
                    "an integer >= 1", "Drop levels that have no states.");
        }
    }

    /** An unlabelled level. */
    public Level(double energy, int degeneracy) {
        this(energy, degeneracy, 0);
    }
}
