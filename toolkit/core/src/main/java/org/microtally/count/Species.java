package org.microtally.count;

import java.util.Objects;
import org.microtally.InvalidInputException;
import org.microtally.spectrum.Spectrum;
import org.microtally.spectrum.Statistics;

/**
 * One kind of particle in a {@link SpeciesMix}: its name (for display), its own single-particle
 * spectrum and statistics, and its fixed particle number.
 */
public record Species(String name, Spectrum spectrum, Statistics statistics, int particles) {
    /** Validates the record. */
    public Species {
        Objects.requireNonNull(name, "name");
        Objects.requireNonNull(spectrum, "spectrum");
        Objects.requireNonNull(statistics, "statistics");
        if (particles < 0) {
            throw InvalidInputException.of("particle number of species " + name, particles, "an integer >= 0", "");
        }
    }
}
