package org.microtally.structure;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
import org.microtally.InvalidInputException;

class LaneEmdenTest {

    @Test
    void matchesTheClassicalTableForNThreeHalvesAndThree() {
        LaneEmden a = LaneEmden.solve(1.5);
        LaneEmden b = LaneEmden.solve(3.0);
        // Source: S. Chandrasekhar, An Introduction to the Study of Stellar Structure (1939), Table 4 (values from
        // memory, as quoted in issue 16): n = 1.5: xi_1 = 3.65375, omega = 2.71406; n = 3: 6.89685, 2.01824
        assertEquals(3.65375, a.firstZero(), 5e-6);
        assertEquals(2.71406, a.massConstant(), 5e-6);
        assertEquals(6.89685, b.firstZero(), 5e-6);
        assertEquals(2.01824, b.massConstant(), 5e-6);
        // Source: from memory, nine-digit values (G. P. Horedt, Polytropes (2004), Table 3.1): n = 1.5: 3.65375374,
        // 2.71405512; n = 3: 6.89684862, 2.01823595
        assertEquals(3.65375374, a.firstZero(), 1e-8);
        assertEquals(2.71405512, a.massConstant(), 1e-8);
        assertEquals(6.89684862, b.firstZero(), 1e-8);
        assertEquals(2.01823595, b.massConstant(), 1e-8);
    }

    @Test
    void closedFormsForNZeroOneAndFive() {
        // Source: closed form theta = 1 - xi^2/6 (n = 0): xi_1 = sqrt 6, omega = 2 sqrt 6 (Chandrasekhar 1939, ch. IV)
        LaneEmden zero = LaneEmden.solve(0.0);
        assertEquals(Math.sqrt(6), zero.firstZero(), LaneEmden.RELATIVE_ACCURACY * Math.sqrt(6));
        assertEquals(2 * Math.sqrt(6), zero.massConstant(), LaneEmden.RELATIVE_ACCURACY * 2 * Math.sqrt(6));
        // Source: closed form theta = sin(xi)/xi (n = 1): xi_1 = pi, omega = pi
        LaneEmden one = LaneEmden.solve(1.0);
        assertEquals(Math.PI, one.firstZero(), LaneEmden.RELATIVE_ACCURACY * Math.PI);
        assertEquals(Math.PI, one.massConstant(), LaneEmden.RELATIVE_ACCURACY * Math.PI);
        assertEquals(Math.sin(2.0) / 2.0, LaneEmden.theta(1.0, 2.0), 1e-11);
        // Source: closed form theta = (1 + xi^2/3)^(-1/2) (n = 5, Schuster 1883)
        for (double xi : new double[] {5e-4, 0.5, 3.0, 20.0}) {
            assertEquals(1 / Math.sqrt(1 + xi * xi / 3), LaneEmden.theta(5.0, xi), 1e-11, "xi = " + xi);
        }
    }

    @Test
    void stepRefinementConfirmsTheStatedAccuracy() {
        // common practice, no source: the default (tolerance 1e-13) must agree with a run at tolerance 3e-15 to the
        // stated 1e-10 relative, and a run at 1e-11 must be visibly worse but within 1e-8 (the error follows the tolerance)
        for (double n : new double[] {0.5, 1.5, 2.5, 3.0, 4.0, 4.5}) {
            LaneEmden reference = LaneEmden.solve(n, 3e-15);
            LaneEmden standard = LaneEmden.solve(n);
            LaneEmden coarse = LaneEmden.solve(n, 1e-11);
            assertEquals(reference.firstZero(), standard.firstZero(), LaneEmden.RELATIVE_ACCURACY * reference.firstZero(), "xi_1, n = " + n);
            assertEquals(reference.massConstant(), standard.massConstant(), LaneEmden.RELATIVE_ACCURACY * reference.massConstant(), "omega, n = " + n);
            assertEquals(reference.firstZero(), coarse.firstZero(), 1e-8 * reference.firstZero(), "coarse xi_1, n = " + n);
            assertEquals(reference.massConstant(), coarse.massConstant(), 1e-8 * reference.massConstant(), "coarse omega, n = " + n);
        }
        // Source: Chandrasekhar 1939 Table 4 (from memory): rho_c/rho_mean = 54.18 for n = 3
        assertEquals(54.18, LaneEmden.solve(3.0).centralToMeanDensity(), 0.01);
    }

    @Test
    void refusesIndicesWithoutASurface() {
        InvalidInputException e = assertThrows(InvalidInputException.class, () -> LaneEmden.solve(5.0));
        assertTrue(e.getMessage().contains("5.0"), e.getMessage());
        assertThrows(InvalidInputException.class, () -> LaneEmden.solve(-0.5));
        assertThrows(InvalidInputException.class, () -> LaneEmden.solve(Double.NaN));
        assertThrows(InvalidInputException.class, () -> LaneEmden.theta(1.0, 4.0)); // beyond xi_1 = pi
    }
}
