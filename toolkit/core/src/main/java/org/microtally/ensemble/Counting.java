package org.microtally.ensemble;

import org.apache.commons.math3.special.Gamma;
import org.microtally.InvalidInputException;
import org.microtally.spectrum.Statistics;

/**
 * How the microstates of N particles are counted, a choice that matters only for
 * {@link Statistics#DISTINGUISHABLE} particles and that every ensemble takes explicitly.
 *
 * <ul>
 *   <li>{@link #LABELLED}: the particles carry labels (moments on lattice sites, oscillators of a
 *       solid): each assignment of labelled particles to states counts once, Z_N = Z_1^N,
 *       Omega = number of assignments. The default of {@link Canonical} and {@link Microcanonical}.
 *       In the grand canonical ensemble this gives Xi = sum_N (z Z_1)^N = 1/(1 - z Z_1).</li>
 *   <li>{@link #CORRECTED_BOLTZMANN}: identical classical particles (a dilute gas): every count is
 *       divided by N! (Gibbs's correction), Z_N = Z_1^N / N!, so S and ln Z drop by ln N! while U, C_V
 *       and the occupations are unchanged; in the grand canonical ensemble Xi = exp(z Z_1), the
 *       Maxwell-Boltzmann limit of the quantum gases and the default of {@link GrandCanonical}.
 *       (Standard: e.g. K. Huang, <i>Statistical Mechanics</i>, 2nd ed., sec. 6.6, from memory.)</li>
 *   <li>{@link #IDENTICAL}: quantum statistics (Bose, Fermi, Gentile) already count each occupation
 *       pattern once; the only counting those statistics admit.</li>
 * </ul>
 * ln N! is Commons Math's ln Gamma(N + 1) (a few ulp relative).
 */
public enum Counting {
    /** Labelled particles, Z_N = Z_1^N. */
    LABELLED,
    /** Identical classical particles, Z_N = Z_1^N / N!. */
    CORRECTED_BOLTZMANN,
    /** Quantum statistics: each occupation pattern once. */
    IDENTICAL;

    /** The counting an ensemble uses when none is given: LABELLED for distinguishable particles. */
    static Counting defaultFor(Statistics st) {
        return st.indistinguishable() ? IDENTICAL : LABELLED;
    }

    /**
     * Checks that {@code counting} applies to {@code st}.
     *
     * @throws InvalidInputException for LABELLED or CORRECTED_BOLTZMANN with quantum statistics, and
     *                               for IDENTICAL with distinguishable particles
     */
    static Counting require(Statistics st, Counting counting) {
        if (counting == null) {
            throw InvalidInputException.of("counting", "null", "LABELLED, CORRECTED_BOLTZMANN or IDENTICAL", "");
        }
        boolean quantum = st.indistinguishable();
        if (quantum != (counting == IDENTICAL)) {
            throw InvalidInputException.of("counting for " + st, counting,
                    quantum ? "IDENTICAL (quantum statistics count each occupation pattern once)"
                            : "LABELLED (Z_1^N) or CORRECTED_BOLTZMANN (Z_1^N / N!)",
                    quantum ? "Use Statistics.DISTINGUISHABLE for classical particles." : "");
        }
        return counting;
    }

    /** ln of the factor the counts are divided by: ln N! for CORRECTED_BOLTZMANN, else 0. */
    double lnDivisor(int n) {
        return this == CORRECTED_BOLTZMANN ? Gamma.logGamma(n + 1.0) : 0.0;
    }
}
