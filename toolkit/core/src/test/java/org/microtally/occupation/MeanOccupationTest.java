package org.microtally.occupation;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.function.Executable;
import org.microtally.InvalidInputException;
import org.microtally.spectrum.Statistics;

/** Results that would overflow a double throw, naming x; results just inside the range are finite. */
class MeanOccupationTest {

    private static void assertThrowsNaming(double x, Executable call) {
        InvalidInputException e = assertThrows(InvalidInputException.class, call);
        assertTrue(e.getMessage().contains("(e - mu)/kT = " + x), e.getMessage());
        assertTrue(e.getMessage().contains("finite double"), e.getMessage());
    }

    @Test
    void maxwellBoltzmannMeanOverflowThrows() {
        assertThrowsNaming(-1000.0, () -> MeanOccupation.maxwellBoltzmann(-1000.0));
        assertThrowsNaming(-1000.0, () -> MeanOccupation.mean(Statistics.DISTINGUISHABLE, -1000.0));
        assertThrowsNaming(-1000.0, () -> MeanOccupation.variance(Statistics.DISTINGUISHABLE, -1000.0));
        // Source: closed form e^709 = exp(709), below Double.MAX_VALUE (IEEE 754 binary64, ln MAX = 709.78)
        assertEquals(Math.exp(709.0), MeanOccupation.maxwellBoltzmann(-709.0), 0.0);
    }

    @Test
    void boseEinsteinMeanOverflowThrows() {
        assertThrowsNaming(1e-320, () -> MeanOccupation.boseEinstein(1e-320));
        assertThrowsNaming(1e-320, () -> MeanOccupation.mean(Statistics.BOSE, 1e-320));
        // Source: closed form 1/(e^x - 1) = 1/x - 1/2 + O(x) for small x
        assertEquals(1e300, MeanOccupation.boseEinstein(1e-300), 1e285);
    }

    @Test
    void boseEinsteinVarianceOverflowThrows() {
        assertThrowsNaming(1e-200, () -> MeanOccupation.variance(Statistics.BOSE, 1e-200));
        // Source: closed form n(n+1) with n = 1/x - 1/2 + O(x): variance = 1/x^2 - 1/4 + O(x)
        assertEquals(1e300, MeanOccupation.variance(Statistics.BOSE, 1e-150), 1e286);
    }

    @Test
    void maxwellBoltzmannLogFactorOverflowThrows() {
        assertThrowsNaming(-1000.0, () -> MeanOccupation.logFactor(Statistics.DISTINGUISHABLE, -1000.0));
        // Source: closed form ln xi = e^-x for Maxwell-Boltzmann
        assertEquals(Math.exp(700.0), MeanOccupation.logFactor(Statistics.DISTINGUISHABLE, -700.0), 0.0);
    }

    @Test
    void gentileLogFactorOverflowThrows() {
        double x = -1e308;
        assertThrowsNaming(x, () -> MeanOccupation.logFactor(Statistics.maxOccupancy(3), x));
        // Source: closed form ln sum_{m=0..k} e^{-m x} = -k x + ln(1 + e^x + ...) -> -k x for x -> -infinity
        assertEquals(3e300, MeanOccupation.logFactor(Statistics.maxOccupancy(3), -1e300), 1e285);
    }

    @Test
    void fermiDiracStaysFiniteAtExtremes() {
        // Source: closed form 1/(e^x + 1) -> 1 as x -> -infinity, ln(1 + e^-x) -> -x
        assertEquals(1.0, MeanOccupation.fermiDirac(-1e308), 0.0);
        assertEquals(1e308, MeanOccupation.logFactor(Statistics.FERMI, -1e308), 1e293);
    }
}
