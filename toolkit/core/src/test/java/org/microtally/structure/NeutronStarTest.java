package org.microtally.structure;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
import org.microtally.InvalidInputException;

class NeutronStarTest {

    @Test
    void maximumMassOfTheIdealNeutronGas() {
        NeutronStar max = NeutronStar.maximumMass();
        // Source: J. R. Oppenheimer and G. M. Volkoff, Phys. Rev. 55, 374 (1939): maximum mass about 0.71 M_sun at a
        // radius of about 9 km (figures from memory, as quoted in issue 16). Computed here: 0.7102 M_sun, 9.16 km,
        // x_c = 0.834; the test allows the two printed digits of the mass and +-0.5 km
        assertEquals(0.71, max.solarMasses(), 0.005);
        assertEquals(9.2, max.radiusKm(), 0.5);
        // Source: stationarity (common practice, no source): the mass is a maximum along the sequence
        double rho = max.centralDensity();
        assertTrue(NeutronStar.ofCentralDensity(rho * 1.2).mass() < max.mass());
        assertTrue(NeutronStar.ofCentralDensity(rho / 1.2).mass() < max.mass());
    }

    @Test
    void lowDensityLimitIsTheNewtonianPolytrope() {
        // Source: Newtonian non-relativistic limit, n = 1.5 polytrope with K = (3 pi^2)^{2/3} hbar^2/(5 m_n^{8/3}),
        // xi_1 = 3.65375, omega = 2.71406 (Chandrasekhar 1939 Table 4, from memory); at x_c = 0.01 the GR and special
        // relativistic corrections are of relative order x_c^2 ~ 1e-4
        double hbar = 6.62607015e-34 / (2 * Math.PI);
        double mn = 1.67492749804e-27;
        double g = 6.67430e-11;
        double k = Math.pow(3 * Math.PI * Math.PI, 2.0 / 3) * hbar * hbar / (5 * Math.pow(mn, 8.0 / 3));
        double xc = 0.01;
        double lambda = hbar / (mn * 299792458.0);
        double rho = mn * xc * xc * xc / (3 * Math.PI * Math.PI * lambda * lambda * lambda);
        NeutronStar star = NeutronStar.solve(xc, rho, NeutronStar.TOLERANCE);
        double a = Math.sqrt(2.5 * k * Math.pow(rho, -1.0 / 3) / (4 * Math.PI * g));
        assertEquals(a * 3.65375 / 1e3, star.radiusKm(), 1e-3 * a * 3.65375 / 1e3);
        assertEquals(4 * Math.PI * a * a * a * rho * 2.71406, star.mass(), 1e-3 * star.mass());
    }

    @Test
    void stepRefinement() {
        // common practice, no source: default tolerance against 3e-15, stated accuracy 1e-9
        StepRefinement.assertRefined((xc, tol) -> NeutronStar.solve(xc, 1, tol), NeutronStar.TOLERANCE,
                NeutronStar.RELATIVE_ACCURACY, 0.1, 0.83, 3);
    }

    @Test
    void badInputIsRefusedWithTheValue() {
        // common practice, no source
        InvalidInputException e = assertThrows(InvalidInputException.class, () -> NeutronStar.ofCentralDensity(1e12));
        assertTrue(e.getMessage().contains("1.0E12"), e.getMessage());
        assertThrows(InvalidInputException.class, () -> NeutronStar.ofCentralDensity(-1));
        assertThrows(InvalidInputException.class, () -> NeutronStar.ofCentralDensity(1e23));
    }
}
