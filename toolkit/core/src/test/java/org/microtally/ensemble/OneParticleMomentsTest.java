package org.microtally.ensemble;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.List;
import org.junit.jupiter.api.Test;
import org.microtally.spectrum.Level;
import org.microtally.spectrum.Spectrum;
import org.microtally.spectrum.Statistics;

/** The one-particle sums that labelled (distinguishable) particles multiply by N, in both canonical routes. */
class OneParticleMomentsTest {

    /**
     * A sharp excitation: ground level g = 1 at 0, level g = 2e9 at 1, kT = 10, so x = g e^(-1/10) ~ 1.8e9
     * and Var d ~ 5.5e-10 while &lt;d&gt; ~ 1: the one-pass form &lt;d^2&gt; - &lt;d&gt;^2 would keep only
     * about 6 of its digits here.
     */
    @Test
    void sharpTwoLevelExcitationKeepsItsVarianceDigits() {
        Spectrum s = Spectrum.of(List.of(new Level(0, 1), new Level(1, 2_000_000_000)));
        int n = 3;
        double kT = 10;
        double x = 2e9 * Math.exp(-1 / kT);
        // Source: closed form, two levels 0 and Delta = 1: p = x/(1+x), Var d = Delta^2 p (1-p) = x/(1+x)^2, times N
        double variance = n * x / ((1 + x) * (1 + x));
        // Source: closed form, U = N Delta p
        double energy = n * x / (1 + x);
        Canonical c = Canonical.of(s, Statistics.DISTINGUISHABLE, n, kT);
        assertEquals(variance, c.energyVariance(), 1e-12 * variance);
        assertEquals(energy, c.energy(), 1e-14 * energy);
        CanonicalSweep w = CanonicalSweep.of(s, Statistics.DISTINGUISHABLE, n, kT);
        assertEquals(variance, w.energyVariance(n), 1e-12 * variance);
        // Source: closed form, ln Z_N = N ln(1 + x)
        assertEquals(n * Math.log1p(x), c.lnZ(), 1e-14 * n * Math.log1p(x));
        assertEquals(n * Math.log1p(x), w.lnZ(n), 1e-14 * n * Math.log1p(x));
    }
}
