package org.microtally.structure;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.junit.jupiter.api.Test;
import org.microtally.InvalidInputException;
import org.microtally.units.Iau2015;

class WhiteDwarfTest {
    private static final double SOLAR_MASS = 1.3271244e20 / 6.67430e-11; // IAU 2015 B3 GM_sun / CODATA 2018 G

    @Test
    void chandrasekharMassFromTheClosedForm() {
        // Source: M_Ch = (sqrt(3 pi)/2) omega_3 (hbar c/G)^{3/2} / (mu_e m_u)^2 (S. Chandrasekhar, MNRAS 95, 207 (1935)),
        // omega_3 = 2.01824 (Chandrasekhar 1939 Table 4, from memory), CODATA 2018 hbar, c, G, m_u written out here
        double hbar = 6.62607015e-34 / (2 * Math.PI);
        double c = 299792458.0;
        double g = 6.67430e-11;
        double mu = 2 * 1.66053906660e-27;
        double expected = Math.sqrt(3 * Math.PI) / 2 * 2.01824 * Math.pow(hbar * c / g, 1.5) / (mu * mu);
        assertEquals(expected, WhiteDwarf.chandrasekharMass(2.0), 3e-6 * expected); // omega_3 given to 6 digits
        // Source: issue 16 / common textbook figure: about 5.83 / mu_e^2 solar masses with CODATA 2018 and m_u
        assertEquals(5.83, WhiteDwarf.chandrasekharMass(1.0) / SOLAR_MASS, 0.005);
        assertEquals(5.83 / (2.15 * 2.15), WhiteDwarf.chandrasekharMass(2.15) / SOLAR_MASS, 0.005 / (2.15 * 2.15));
    }

    @Test
    void massRisesTowardTheChandrasekharMassFromBelow() {
        double mch = WhiteDwarf.chandrasekharMass(2.0);
        MassRadiusCurve curve = WhiteDwarf.massRadiusCurve(2.0, 1e9, 1e14, 12);
        double previousMass = 0;
        double previousRadius = Double.POSITIVE_INFINITY;
        for (WhiteDwarf w : curve.models()) {
            // Source: Chandrasekhar 1935: M increases monotonically with rho_c toward M_Ch, and R decreases
            assertTrue(w.mass() > previousMass && w.mass() < mch, "rho_c " + w.centralDensity());
            assertTrue(w.radius() < previousRadius);
            previousMass = w.mass();
            previousRadius = w.radius();
        }
        // Source: closed-form limit M -> M_Ch as x_c -> inf; the deficit falls off as 1/x_c^2 (the outer layers
        // are non-relativistic), so 100 times the x_c gives 1e4 times smaller deficit
        double d100 = 1 - WhiteDwarf.ofCentralRelativityParameter(100, 2.0, WhiteDwarf.TOLERANCE).mass() / mch;
        double d1e4 = 1 - WhiteDwarf.ofCentralRelativityParameter(1e4, 2.0, WhiteDwarf.TOLERANCE).mass() / mch;
        assertTrue(d100 > 0 && d100 < 1e-3, "deficit at x_c = 100: " + d100);
        assertTrue(d1e4 > 0 && d1e4 < 1e-7, "deficit at x_c = 1e4: " + d1e4);
        assertEquals(1e-4, d1e4 / d100, 2e-6);
    }

    @Test
    void lowDensityLimitIsTheNThreeHalvesPolytrope() {
        // Source: non-relativistic limit P = K rho^{5/3}, K = (3 pi^2)^{2/3} hbar^2 / (5 m_e (mu_e m_u)^{5/3})
        // (Chandrasekhar 1939, ch. XI), with the n = 1.5 Lane-Emden constants xi_1 = 3.65375, omega = 2.71406
        // (Chandrasekhar 1939 Table 4, from memory): R = a xi_1, M = 4 pi a^3 rho_c omega, a^2 = 2.5 K rho_c^{-1/3}/(4 pi G);
        // corrections are of relative order x_c^2 = 1e-6, the table's rounding 2e-6
        double hbar = 6.62607015e-34 / (2 * Math.PI);
        double me = 9.1093837015e-31;
        double mu = 2 * 1.66053906660e-27;
        double g = 6.67430e-11;
        double k = Math.pow(3 * Math.PI * Math.PI, 2.0 / 3) * hbar * hbar / (5 * me * Math.pow(mu, 5.0 / 3));
        for (double xc : new double[] {1e-3, 2e-3}) {
            WhiteDwarf w = WhiteDwarf.ofCentralRelativityParameter(xc, 2.0, WhiteDwarf.TOLERANCE);
            double rho = w.centralDensity();
            double a = Math.sqrt(2.5 * k * Math.pow(rho, -1.0 / 3) / (4 * Math.PI * g));
            assertEquals(a * 3.65375, w.radius(), 1e-5 * a * 3.65375, "R at x_c = " + xc);
            assertEquals(4 * Math.PI * a * a * a * rho * 2.71406, w.mass(), 1e-5 * w.mass(), "M at x_c = " + xc);
        }
        // Source: n = 1.5 polytrope scaling R ~ M^{-1/3} (M R^3 constant), closed form
        WhiteDwarf w1 = WhiteDwarf.ofCentralRelativityParameter(1e-3, 2.0, WhiteDwarf.TOLERANCE);
        WhiteDwarf w2 = WhiteDwarf.ofCentralRelativityParameter(4e-3, 2.0, WhiteDwarf.TOLERANCE);
        double c1 = w1.mass() * Math.pow(w1.radius(), 3);
        double c2 = w2.mass() * Math.pow(w2.radius(), 3);
        assertEquals(c1, c2, 2e-5 * c1);
    }

    @Test
    void stepRefinement() {
        // common practice, no source: tolerance 1e-12 (default) against 3e-15; stated accuracy 1e-9
        StepRefinement.assertRefined((xc, tol) -> WhiteDwarf.ofCentralRelativityParameter(xc, 2.0, tol),
                WhiteDwarf.TOLERANCE, WhiteDwarf.RELATIVE_ACCURACY, 1e-3, 0.3, 3, 30);
    }

    @Test
    void tableRowsAndSolarUnits() {
        WhiteDwarf w = WhiteDwarf.ofCentralDensity(1e10, 2.0);
        // Source: IAU 2015 Resolution B3 nominal GM_sun over CODATA 2018 G
        assertEquals(w.mass() / SOLAR_MASS, w.solarMasses(), 1e-12 * w.solarMasses());
        assertEquals(Iau2015.SOLAR_MASS, SOLAR_MASS, 1e-9 * SOLAR_MASS);
        List<List<Object>> rows = WhiteDwarf.massRadiusCurve(2.0, 1e9, 1e12, 3).rows();
        assertEquals(3, rows.size());
        assertEquals(1e6, (double) rows.get(0).get(1), 1e-3); // g/cm^3
    }

    @Test
    void badInputIsRefusedWithTheValue() {
        // common practice, no source
        InvalidInputException low = assertThrows(InvalidInputException.class, () -> WhiteDwarf.ofCentralDensity(1e4, 2.0));
        assertTrue(low.getMessage().contains("10000.0"), low.getMessage());
        InvalidInputException high = assertThrows(InvalidInputException.class, () -> WhiteDwarf.ofCentralDensity(1e16, 2.0));
        assertTrue(high.getMessage().contains("1.0E16") && high.getMessage().contains("neutronisation"), high.getMessage());
        assertThrows(InvalidInputException.class, () -> WhiteDwarf.ofCentralDensity(-1e9, 2.0));
        InvalidInputException mu = assertThrows(InvalidInputException.class, () -> WhiteDwarf.ofCentralDensity(1e9, 0.9));
        assertTrue(mu.getMessage().contains("0.9"), mu.getMessage());
        assertThrows(InvalidInputException.class, () -> WhiteDwarf.chandrasekharMass(Double.NaN));
        assertThrows(InvalidInputException.class, () -> WhiteDwarf.massRadiusCurve(2.0, 1e9, 1e8, 10));
    }
}
