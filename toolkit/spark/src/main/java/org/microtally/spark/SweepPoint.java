package org.microtally.spark;

import org.microtally.spectrum.Statistics;

/**
 * One point of a {@link SweepGrid}.
 *
 * @param id         its index in the grid
 * @param spectrum   the spectrum builder arguments
 * @param particles  N (exact for canonical, mean for grand canonical)
 * @param kT         temperature in the spectrum's energy unit
 * @param statistics particle statistics
 * @param ensemble   which ensemble
 */
public record SweepPoint(long id, SpectrumSpec spectrum, int particles, double kT, Statistics statistics,
                         Ensemble ensemble) {
}
