package org.microtally.ensemble;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.stream.Stream;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
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
}
