package org.microtally.lattice;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.math.BigDecimal;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.microtally.InvalidInputException;
import org.microtally.MeasuredAccuracy;
import org.microtally.ProgressListener;
import org.microtally.ensemble.ExactDensityOfStates;

class FisherZerosTest {
    @Test
    void zerosOfTheFourByFourTorusMatchMpmath() throws Exception {
        List<BigDecimal[]> reference = MeasuredAccuracy.rows(FisherZerosTest.class, "fisher_zeros_4x4.csv").stream()
                .map(p -> new BigDecimal[] {new BigDecimal(p[0]), new BigDecimal(p[1])}).toList();
        FisherZeros zeros = FisherZeros.of(Kaufman.densityOfStates(4, 4, ProgressListener.NONE), 2, 30);
        assertEquals(32, zeros.zeros().size());
        // Source: mpmath 1.2.1 polyroots at 60 digits (fisher_zeros_4x4.py beside the table); every reference
        // zero has one of ours within 1e-28
        for (BigDecimal[] ref : reference) {
            double best = Double.POSITIVE_INFINITY;
            for (FisherZeros.Zero z : zeros.zeros()) {
                double d = Math.hypot(z.re().subtract(ref[0]).doubleValue(), z.im().subtract(ref[1]).doubleValue());
                best = Math.min(best, d);
            }
            assertTrue(best < 1e-28, "reference zero " + ref[0] + " + " + ref[1] + "i: nearest at " + best);
        }
        for (FisherZeros.Zero z : zeros.zeros()) {
            assertTrue(z.errorRadius() < 1e-30 * z.abs());
        }
    }

    @Test
    void leadingZeroPinchesTheCriticalPoint() {
        // Source: Onsager 1944, x_c = e^{-2 K_c} = sqrt 2 - 1 and nu = 1, so Im x_1 ~ 1/L
        // (finite-size scaling of Fisher zeros, C. Itzykson, R. B. Pearson, J. B. Zuber, Nucl. Phys. B 220 (1983) 415)
        double xc = Math.sqrt(2) - 1;
        FisherZeros.Zero z4 = FisherZeros.of(Kaufman.densityOfStates(4, 4, ProgressListener.NONE), 2, 20).leading();
        FisherZeros.Zero z6 = FisherZeros.of(Kaufman.densityOfStates(6, 6, ProgressListener.NONE), 2, 20).leading();
        assertTrue(z6.re().doubleValue() > xc && z6.re().doubleValue() < z4.re().doubleValue());
        assertEquals(6.0 / 4.0, z4.im().doubleValue() / z6.im().doubleValue(), 0.1);
        assertEquals(1.0, FisherZeros.scalingExponent(4, z4, 6, z6), 0.1);
        assertThrows(InvalidInputException.class, () -> FisherZeros.scalingExponent(6, z6, 4, z4));
        // The same zeros from the transfer-matrix count (independent route to the coefficients).
        ExactDensityOfStates tm = TransferMatrix.densityOfStates(Lattice.square(6, 6, Boundary.PERIODIC),
                Model.ising(Model.Coupling.FERROMAGNETIC), ProgressListener.NONE);
        assertEquals(z6, FisherZeros.of(tm, 2, 20).leading());
    }

    @Test
    void pottsZerosApproachTheSelfDualPoint() {
        // Source: closed form, the q-state Potts self-dual point e^{K_c} = 1 + sqrt q (F. Y. Wu, Rev. Mod. Phys. 54,
        // 235 (1982)): z_c = e^{-K_c} = 1/(1 + sqrt 3) for q = 3; the leading zero in z = e^{-beta J} closes in on it,
        // Im z_1 ~ L^{-1/nu} with nu = 5/6 (Wu 1982, Table of exponents)
        double zc = 1 / (1 + Math.sqrt(3));
        double previous = Double.POSITIVE_INFINITY;
        double[] im = new double[3];
        int[] sizes = {3, 4, 5};
        for (int i = 0; i < 3; i++) {
            ExactDensityOfStates g = TransferMatrix.densityOfStates(Lattice.square(sizes[i], sizes[i], Boundary.PERIODIC),
                    Model.potts(3, Model.Coupling.FERROMAGNETIC), ProgressListener.NONE);
            FisherZeros.Zero z = FisherZeros.of(g, 1, 20).leading();
            double distance = Math.hypot(z.re().doubleValue() - zc, z.im().doubleValue());
            assertTrue(z.re().doubleValue() > zc && distance < previous, "L = " + sizes[i] + ": " + z);
            previous = distance;
            im[i] = z.im().doubleValue();
        }
        assertEquals(Math.pow(5.0 / 3.0, 6.0 / 5.0), im[0] / im[2], 0.15 * im[0] / im[2]);
    }

    @Test
    void badInput() {
        ExactDensityOfStates g = Kaufman.densityOfStates(4, 4, ProgressListener.NONE);
        // common practice, no source
        assertThrows(InvalidInputException.class, () -> FisherZeros.of(g, 3, 20));
        assertThrows(InvalidInputException.class, () -> FisherZeros.of(g, 2, 5));
        assertThrows(InvalidInputException.class, () -> FisherZeros.of(g, 0, 20));
    }
}
