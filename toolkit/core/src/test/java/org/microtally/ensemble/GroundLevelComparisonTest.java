package org.microtally.ensemble;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
import org.microtally.InvalidInputException;
import org.microtally.spectrum.Spectra;
import org.microtally.spectrum.Spectrum;
import org.microtally.spectrum.Statistics;

class GroundLevelComparisonTest {

    @Test
    void oneDimensionalTrapFollowsThePublishedFluctuationLaws() {
        Spectrum trap = Spectra.harmonicOscillator(1, 400);
        int n = 150;
        int e = 165;
        GroundLevelComparison c = GroundLevelComparison.of(trap, Statistics.BOSE, n, e);
        // Source: common practice, no source (the matched temperature reproduces U = E)
        assertEquals(e, c.canonical().energy(), 1e-9 * e);
        double q = Math.exp(-1 / c.kT());
        double var = 0;
        double cov = 0;
        double varE = 0;
        for (int k = 1; k < 5000; k++) {
            double v = Math.pow(q, k) / Math.pow(1 - Math.pow(q, k), 2);
            var += v;
            cov += k * v;
            varE += (double) k * k * v;
        }
        // Source: Wilkens & Weiss, J. Mod. Opt. 44, 1801 (1997): canonical 1D-trap condensate variance
        // sum_k q^k / (1 - q^k)^2 below T_c (large N), from memory
        assertEquals(var, c.canonical().groundLevelDistribution().variance(), 0.002 * var);
        // Source: Navez et al., PRL 79, 1789 (1997): microcanonical = canonical minus the part correlated
        // with the energy, Var - Cov(N_0, E)^2 / Var E (Gaussian conditioning, large N), from memory
        double mc = var - cov * cov / varE;
        assertEquals(mc, c.microcanonical().variance(), 0.02 * mc);
        // Source: Politzer, PRA 54, 5048 (1996): mc < canonical << grand canonical below T_c
        assertTrue(c.microcanonical().variance() < c.canonical().groundLevelDistribution().variance());
        assertTrue(10 * c.canonical().groundLevelDistribution().variance() < c.grandCanonical().groundLevelVariance());
        assertEquals(3, c.rows().size());
    }

    @Test
    void unreachableMatchesAreRefused() {
        Spectrum trap = Spectra.harmonicOscillator(1, 40);
        assertThrows(InvalidInputException.class, () -> GroundLevelComparison.of(trap, Statistics.BOSE, 10, 0));
        // ten fermions on 0..9 quanta cannot go below 45
        assertThrows(InvalidInputException.class, () -> GroundLevelComparison.of(trap, Statistics.FERMI, 10, 45));
    }
}
