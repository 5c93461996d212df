package org.microtally.limit;

import org.microtally.Inputs;
import org.microtally.InvalidInputException;

/** Input checks of the reference-formula classes (package-private), delegating to {@link Inputs}. */
final class Checks {
    private Checks() { }

    /** Returns {@code value} if it is finite and &gt; 0, else throws naming it. */
    static double positive(String what, double value, String remedy) {
        return Inputs.positive(what, value, remedy);
    }

    /** A temperature in kelvin: finite and &gt; 0. */
    static double temperature(double kelvin) {
        return Inputs.kelvin(kelvin);
    }

    /** A spin (or other internal) degeneracy: an integer &gt;= 1. */
    static int degeneracy(int g) {
        if (g < 1) {
            throw InvalidInputException.of("spin degeneracy g", g, "an integer >= 1", "Use 2 for spin-1/2 particles.");
        }
        return g;
    }
}
