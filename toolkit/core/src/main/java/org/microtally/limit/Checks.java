package org.microtally.limit;

import org.microtally.InvalidInputException;

/** Input checks shared by the reference-formula classes (package-private). */
final class Checks {
    private Checks() { }

    /** Returns {@code value} if it is finite and &gt; 0, else throws naming it. */
    static double positive(String what, double value, String remedy) {
        if (!(value > 0) || !Double.isFinite(value)) {
            throw InvalidInputException.of(what, value, "a finite number > 0", remedy);
        }
        return value;
    }

    /** A temperature in kelvin: finite and &gt; 0. */
    static double temperature(double kelvin) {
        return positive("temperature T (K)", kelvin,
                "T = 0 is a limit, not a state: use the ground-state quantities (e.g. fermiEnergy()) instead.");
    }

    /** A spin (or other internal) degeneracy: an integer &gt;= 1. */
    static int degeneracy(int g) {
        if (g < 1) {
            throw InvalidInputException.of("spin degeneracy g", g, "an integer >= 1", "Use 2 for spin-1/2 particles.");
        }
        return g;
    }
}
