package org.microtally.ensemble;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.util.List;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import org.microtally.MeasuredAccuracy;
import org.microtally.spectrum.Spectra;
import org.microtally.spectrum.Spectrum;
import org.microtally.spectrum.Statistics;

/**
 * Heat capacity and energy variance of many fermions, where the moment pass once returned NaN,
 * Infinity or 0 (stale moment entries below the support of the series were read un-rescaled).
 */
class CanonicalFluctuationTest {

    static Stream<Arguments> manyFermions() {
        return Stream.of(
                Arguments.of(Spectra.harmonicOscillator(2, 200), 10_000, 0.5),
                Arguments.of(Spectra.harmonicOscillator(2, 200), 10_000, 1.0),
                Arguments.of(Spectra.harmonicOscillator(2, 200).withInternalMultiplicity(2), 10_000, 0.5));
    }

    @ParameterizedTest
    @MethodSource("manyFermions")
    void heatCapacityOfManyFermionsMatchesTheTemperatureDerivativeOfU(Spectrum s, int n, double kT) {
        Canonical c = Canonical.of(s, Statistics.FERMI, n, kT);
        double h = 1e-2 * kT;
        // Source: independent route, five-point central difference (Abramowitz & Stegun 25.3.6) of
        // U(T) = sum_i g_i e_i <n_i> from the occupation pass (no energy moments involved); its
        // truncation error is O(h^4) ~ 1e-8 relative, its rounding error ~ 1e-7 relative here
        double dUdT = (-energy(s, n, kT + 2 * h) + 8 * energy(s, n, kT + h) - 8 * energy(s, n, kT - h)
                + energy(s, n, kT - 2 * h)) / (12 * h);
        assertTrue(Double.isFinite(c.heatCapacity()) && c.heatCapacity() > 0, "C = " + c.heatCapacity());
        assertEquals(dUdT, c.heatCapacity(), 1e-6 * dUdT);
        // Source: definition C_V = Var E / (kT)^2 (common practice, no source)
        assertEquals(c.energyVariance() / (kT * kT), c.heatCapacity(), 1e-14 * c.heatCapacity());
    }

    private static double energy(Spectrum s, int n, double kT) {
        return Canonical.of(s, Statistics.FERMI, n, kT).energy();
    }

    static Stream<Arguments> mpmathTable() throws IOException {
        // the first row holds the column names
        return MeasuredAccuracy.rows(CanonicalFluctuationTest.class, "/ensemble/canonical_moments_mpmath.csv").stream()
                .skip(1).map(f -> Arguments.of((Object[]) f));
    }

    @ParameterizedTest
    @MethodSource("mpmathTable")
    void energyAndVarianceAgreeWithMultiprecisionRecursion(String stat, String spin, String cutoff, String n,
                                                           String kT, String u, String varE) {
        Spectrum s = Spectra.harmonicOscillator(2, Integer.parseInt(cutoff))
                .withInternalMultiplicity(Integer.parseInt(spin));
        Canonical c = Canonical.of(s, stat.equals("FERMI") ? Statistics.FERMI : Statistics.BOSE,
                Integer.parseInt(n), Double.parseDouble(kT));
        // Source: 60-digit mpmath 1.3.0 symmetric-polynomial recursion with energy moments,
        // src/test/resources/ensemble/canonical_moments_mpmath.py (generator beside the table)
        assertEquals(Double.parseDouble(u), c.energy(), 1e-13 * Double.parseDouble(u));
        assertEquals(Double.parseDouble(varE), c.energyVariance(), 1e-12 * Double.parseDouble(varE));
        // the moment checks pass (a cutoff warning may be present: the reference uses the same cutoff)
        assertTrue(c.warnings().stream().noneMatch(w -> w.contains("consistency") || w.contains("rounding")),
                c.warnings().toString());
    }

    @Test
    void warningsDoNotDependOnWhichQuantityWasAskedFirst() {
        Spectrum s = Spectra.harmonicOscillator(2, 30);
        Canonical first = Canonical.of(s, Statistics.FERMI, 60, 0.5);
        List<String> before = first.warnings();
        first.heatCapacity();
        Canonical second = Canonical.of(s, Statistics.FERMI, 60, 0.5);
        second.heatCapacity();
        // Source: common practice, no source (the warnings are a property of the result, not of the call order)
        assertEquals(before, first.warnings());
        assertEquals(second.warnings(), first.warnings());
    }
}
