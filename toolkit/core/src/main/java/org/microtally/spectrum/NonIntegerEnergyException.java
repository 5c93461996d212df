package org.microtally.spectrum;

import org.microtally.InvalidInputException;

/** Thrown when exact counting is asked of a spectrum whose energies are not all integer multiples of its quantum. */
public class NonIntegerEnergyException extends InvalidInputException {
    private static final long serialVersionUID = 1L;

    private final int levelIndex;
    private final double energy;

    /** @param levelIndex index of the first offending level; @param energy its energy */
    public NonIntegerEnergyException(int levelIndex, double energy, String unit) {
        super("energy of level " + levelIndex + " = " + energy + " " + unit
                + " is not allowed for exact counting: must be an integer multiple of the quantum (" + unit
                + ") between -2^31 and 2^31. Rescale the spectrum to an integer grid, or use the canonical ensemble, "
                + "which accepts real energies.");
        this.levelIndex = levelIndex;
        this.energy = energy;
    }

    /** Index of the first non-integer level. */
    public int levelIndex() {
        return levelIndex;
    }

    /** Its energy. */
    public double energy() {
        return energy;
    }
}
