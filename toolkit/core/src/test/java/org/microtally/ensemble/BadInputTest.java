package org.microtally.ensemble;

import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.function.Executable;
import org.microtally.InvalidInputException;
import org.microtally.occupation.ChemicalPotential;
import org.microtally.spectrum.Spectra;
import org.microtally.spectrum.Spectrum;
import org.microtally.spectrum.Statistics;

/** Each item of the bad-input list: the error names the offending value. */
class BadInputTest {
    private final Spectrum dot = Spectra.harmonicOscillator(2, 5);

    private static void assertNames(InvalidInputException e, String value) {
        assertTrue(e.getMessage().contains(value), e.getMessage());
    }

    /** {@code call} is refused with an {@link InvalidInputException} whose message names {@code value}. */
    private static void assertRefused(Executable call, String value) {
        assertNames(assertThrows(InvalidInputException.class, call), value);
    }

    @Test
    void nonPositiveOrNaNTemperature() {
        for (double t : new double[] {0.0, -1.5, Double.NaN, Double.POSITIVE_INFINITY}) {
            assertRefused(() -> Canonical.of(dot, Statistics.FERMI, 3, t), "kT = " + t);
            assertRefused(() -> GrandCanonical.ofMeanNumber(dot, Statistics.BOSE, t, 3), "kT = " + t);
            assertRefused(() -> GrandCanonical.ofChemicalPotential(dot, Statistics.FERMI, t, 0.5), "kT = " + t);
        }
    }

    @Test
    void targetAboveFermiCapacity() {
        // 21 states in the 2D oscillator up to 5 quanta
        InvalidInputException e = assertThrows(InvalidInputException.class,
                () -> GrandCanonical.ofMeanNumber(dot, Statistics.FERMI, 1.0, 21));
        assertNames(e, "= 21.0");
        assertTrue(e.getMessage().contains("capacity 21"), e.getMessage());
        assertRefused(() -> Canonical.of(dot, Statistics.FERMI, 22, 1.0), "N = 22");
        assertRefused(() -> GrandCanonical.ofMeanNumber(dot, Statistics.maxOccupancy(2), 1.0, 50), "= 50.0");
        assertRefused(() -> ChemicalPotential.fermiLevel(dot, Statistics.FERMI, 21), "= 21");
    }

    @Test
    void boseChemicalPotentialOutsideBracket() {
        assertRefused(() -> GrandCanonical.ofChemicalPotential(dot, Statistics.BOSE, 1.0, 0.0), "mu for bosons = 0.0");
        assertRefused(() -> GrandCanonical.ofChemicalPotential(dot, Statistics.BOSE, 1.0, 2.5), "= 2.5");
    }

    @Test
    void zeroParticles() {
        assertRefused(() -> Canonical.of(dot, Statistics.BOSE, 0, 1.0), "N = 0");
        assertRefused(() -> GrandCanonical.ofMeanNumber(dot, Statistics.FERMI, 1.0, 0), "= 0.0");
    }

    @Test
    void cutoffThatMattersIsReportedWithTheTopLevelOccupation() {
        Spectrum low = Spectra.harmonicOscillator(3, 4);
        GrandCanonical hot = GrandCanonical.ofMeanNumber(low, Statistics.FERMI, 5.0, 10);
        double top = hot.occupations().levelTotal(low.size() - 1);
        assertTrue(hot.warnings().size() == 1 && hot.warnings().get(0).contains(String.format("%.3g", top)),
                hot.warnings().toString());
        assertTrue(GrandCanonical.ofMeanNumber(low, Statistics.FERMI, 0.05, 10).warnings().isEmpty());
    }

    @Test
    void condensateOnlyForBosons() {
        Canonical f = Canonical.of(dot, Statistics.FERMI, 3, 1.0);
        assertNames(assertThrows(InvalidInputException.class, f::condensate), "FERMI");
    }
}
