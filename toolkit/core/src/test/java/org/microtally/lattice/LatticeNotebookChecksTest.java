package org.microtally.lattice;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.math.BigInteger;
import org.junit.jupiter.api.Test;
import org.microtally.ProgressListener;
import org.microtally.ensemble.ExactCanonical;
import org.microtally.ensemble.ExactDensityOfStates;

/** The checks of notebooks/07-spin-cluster-lattice.ipynb that no other unit test makes. */
class LatticeNotebookChecksTest {
    private static final double J_OVER_K = 12.0;   // scenario value, kelvin
    private static final Model ISING = Model.ising(Model.Coupling.FERROMAGNETIC);

    @Test
    void clusterCountsAndTheOneFlipLevel() {
        Lattice cluster = Lattice.square(4, 4, Boundary.PERIODIC);
        ExactDensityOfStates gm = TransferMatrix.withMagnetisation(cluster, ISING, ProgressListener.NONE);
        // Source: closed form, one flipped spin of 16 breaks 4 bonds: 16 states at E = -24 J with M = +-14
        assertEquals(BigInteger.valueOf(16), gm.count(-24, 14));
        assertEquals(BigInteger.valueOf(16), gm.count(-24, -14));
        // Source: closed form, on the 4 x 4 torus no state has exactly 2 broken bonds: g(-28 J) = 0
        assertEquals(BigInteger.ZERO, gm.byEnergy().count(-28));
        // Source: independent brute force over all 2^16 states
        assertEquals(BruteForce.withMagnetisation(cluster, ISING).rows(), gm.rows());
    }

    @Test
    void peakHeightGrowthFromSixteenToThirtyTwo() {
        double c16 = peakPerSite(16);
        double c32 = peakPerSite(32);
        double kc = Math.log(1 + Math.sqrt(2)) / 2;
        // Source: A. E. Ferdinand and M. E. Fisher, Phys. Rev. 185, 832 (1969): C_max/N ~ (8/pi) K_c^2 ln L
        assertEquals(8 / Math.PI * kc * kc * Math.log(2), c32 - c16, 0.02);
    }

    private static double peakPerSite(int l) {
        return ExactCanonical.of(Kaufman.densityOfStates(l, l, ProgressListener.NONE)).heatCapacityPeak(1.5, 4).heatCapacity() / (l * l);
    }

    @Test
    void peakInKelvinLiesAboveTheOnsagerTemperature() {
        double tcKelvin = J_OVER_K * 2 / Math.log(1 + Math.sqrt(2));
        // Source: Onsager 1944, T_c = 2J / (k ln(1 + sqrt 2)) = 27.2302 K for J/k = 12 K
        assertEquals(27.2302, tcKelvin, 1e-4);
        double t8 = ExactCanonical.of(Kaufman.densityOfStates(8, 8, ProgressListener.NONE)).heatCapacityPeak(1.5, 4).kT() * J_OVER_K;
        // Source: Ferdinand and Fisher 1969, L (T_max - T_c)/T_c below its asymptote 0.3603 (from memory), above 0.3
        double shift = 8 * (t8 / tcKelvin - 1);
        assertTrue(shift > 0.3 && shift < 0.3603, "shift " + shift);
    }

    @Test
    void leadingFisherZeroImaginaryPartHalvesFromFourToEight() {
        double im4 = FisherZeros.of(Kaufman.densityOfStates(4, 4, ProgressListener.NONE), 2, 25).leading().im().doubleValue();
        double im8 = FisherZeros.of(Kaufman.densityOfStates(8, 8, ProgressListener.NONE), 2, 25).leading().im().doubleValue();
        // Source: Onsager 1944, nu = 1, so Im x_1 ~ 1/L (Itzykson, Pearson, Zuber, Nucl. Phys. B 220 (1983) 415)
        assertEquals(2.0, im4 / im8, 0.15);
        // Source: Onsager 1944, nu = 1: the two-size estimate from L = 6, 8 within 0.1
        FisherZeros.Zero z6 = FisherZeros.of(Kaufman.densityOfStates(6, 6, ProgressListener.NONE), 2, 20).leading();
        FisherZeros.Zero z8 = FisherZeros.of(Kaufman.densityOfStates(8, 8, ProgressListener.NONE), 2, 20).leading();
        assertEquals(1.0, FisherZeros.scalingExponent(6, z6, 8, z8), 0.1);
    }
}
