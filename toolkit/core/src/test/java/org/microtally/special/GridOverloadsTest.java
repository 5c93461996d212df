package org.microtally.special;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
import org.microtally.InvalidInputException;

class GridOverloadsTest {

    @Test
    void gridsGiveTheScalarValuesAndRefuseBadPoints() {
        double[] z = new double[401];
        double[] eta = new double[401];
        double[] s = new double[401];
        for (int i = 0; i < z.length; i++) {
            z[i] = -5 + 6.0 * i / 400;      // -5 .. 1
            eta[i] = -20 + 80.0 * i / 400;  // -20 .. 60, every regime
            s[i] = 1.01 + 30.0 * i / 400;
        }
        double[] li = Polylog.li(2.5, z);
        double[] fd = FermiDirac.integral(0.5, eta);
        double[] ze = Zeta.zeta(s);
        for (int i = 0; i < z.length; i++) {
            // common practice, no source: a grid overload is the scalar function element by element
            assertEquals(Polylog.li(2.5, z[i]), li[i], 0.0);
            assertEquals(FermiDirac.integral(0.5, eta[i]), fd[i], 0.0);
            assertEquals(Zeta.zeta(s[i]), ze[i], 0.0);
        }
        // Source: DLMF 25.12.16 with 25.12.10, F_{3/2}(eta) = -Li_{5/2}(-e^eta): the two grids agree to rounding
        double[] fromLi = Polylog.li(2.5, new double[] {-Math.exp(3.0), -Math.exp(-1.0)});
        assertArrayEquals(new double[] {-fromLi[0], -fromLi[1]},
                FermiDirac.integral(1.5, new double[] {3.0, -1.0}), 1e-14 * Math.abs(fromLi[0]));
        InvalidInputException ex = assertThrows(InvalidInputException.class, () -> Polylog.li(2.5, new double[] {0.5, 1.5}));
        assertTrue(ex.getMessage().contains("1.5"), ex.getMessage());
        assertThrows(InvalidInputException.class, () -> Zeta.zeta(new double[] {2.0, 0.5}));
        assertThrows(InvalidInputException.class, () -> FermiDirac.integral(0.5, new double[] {1.0, Double.NaN}));
    }
}
