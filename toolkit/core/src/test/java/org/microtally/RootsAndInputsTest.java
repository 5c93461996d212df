package org.microtally;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.function.Executable;
import org.microtally.ensemble.Canonical;
import org.microtally.ensemble.GrandCanonical;
import org.microtally.ensemble.Microcanonical;
import org.microtally.spectrum.Spectra;
import org.microtally.spectrum.Statistics;

/** The one root finder keeps its stated tolerance; the one validation helper gives one message per kind of value. */
class RootsAndInputsTest {

    @Test
    void rootsMeetTheStatedTolerance() {
        // Source: OEIS A003957, the Dottie number, root of cos x = x: 0.739085133215160641655312087673...
        double dottie = Roots.solve("cos x = x", x -> Math.cos(x) - x, 0, 1, 0);
        assertEquals(0.7390851332151607, dottie, Roots.RELATIVE_ACCURACY * dottie + Math.ulp(dottie));
        // Source: closed form, 2^(1/3)
        double cbrt = Roots.solve("x^3 = 2", x -> x * x * x - 2, 1, 2, 1e-6);
        assertEquals(Math.cbrt(2), cbrt, 1e-6 + Roots.RELATIVE_ACCURACY * cbrt);
    }

    @Test
    void aBracketWithoutSignChangeNamesTheRoot() {
        IllegalStateException e = assertThrows(IllegalStateException.class,
                () -> Roots.solve("the test root", x -> x * x + 1, -1, 1, 1e-12));
        assertTrue(e.getMessage().contains("the test root") && e.getMessage().contains("[-1.0, 1.0]"), e.getMessage());
    }

    @Test
    void oneMessagePerKindOfValue() {
        var dot = Spectra.harmonicOscillator(2, 6);
        String canonical = refusal(() -> Canonical.of(dot, Statistics.FERMI, 3, -0.0));
        String grand = refusal(() -> GrandCanonical.ofMeanNumber(dot, Statistics.FERMI, 0.0, 3));
        assertTrue(grand.startsWith("temperature kT = 0.0 is not allowed: must be a finite number > 0."), grand);
        assertTrue(canonical.startsWith("temperature kT = "), canonical);
        String micro = refusal(() -> Microcanonical.of(dot, Statistics.FERMI, 0, 10));
        String can = refusal(() -> Canonical.of(dot, Statistics.FERMI, 0, 1.0));
        assertTrue(micro.startsWith("particle number N = 0 is not allowed: must be an integer"), micro);
        assertTrue(can.startsWith("particle number N = 0 is not allowed: must be an integer"), can);
        String full = refusal(() -> Canonical.of(dot, Statistics.FERMI, 29, 1.0));
        // 2D oscillator with shells 0..6: 1 + 2 + ... + 7 = 28 states
        assertTrue(full.contains("capacity 28") && full.contains("Raise the spectrum's cutoff"), full);
    }

    /** The message of the {@link InvalidInputException} that {@code call} throws (failing when it throws none). */
    private static String refusal(Executable call) {
        return assertThrows(InvalidInputException.class, call).getMessage();
    }
}
