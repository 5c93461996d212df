package org.microtally.structure;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
import org.microtally.limit.RelativisticFermiGas;
import org.microtally.units.Iau2015;

/** The checks cell of notebooks/09-white-dwarf-baseline.ipynb, repeated as a unit test with the same sources. */
class WhiteDwarfBaselineNotebookChecksTest {
    private static final double GCC = 1e3;
    private static final double HBAR = 6.62607015e-34 / (2 * Math.PI);
    private static final double C = 299792458.0;
    private static final double G = 6.67430e-11;
    private static final double ME = 9.1093837015e-31;
    private static final double MU2 = 2 * 1.66053906660e-27;

    private static void relative(double expected, double got, double tolerance, String what) {
        assertEquals(expected, got, tolerance * Math.abs(expected), what);
    }

    @Test
    void laneEmdenConstants() {
        // Source: S. Chandrasekhar, An Introduction to the Study of Stellar Structure (1939), Table 4 (from memory)
        relative(3.65375, LaneEmden.solve(1.5).firstZero(), 2e-6, "xi_1(1.5)");
        relative(2.71406, LaneEmden.solve(1.5).massConstant(), 2e-6, "omega(1.5)");
        relative(6.89685, LaneEmden.solve(3).firstZero(), 2e-6, "xi_1(3)");
        relative(2.01824, LaneEmden.solve(3).massConstant(), 3e-6, "omega(3)");
        // Source: closed forms n = 0 (sqrt 6) and n = 1 (pi)
        relative(Math.sqrt(6), LaneEmden.solve(0).firstZero(), 1e-10, "xi_1(0)");
        relative(Math.PI, LaneEmden.solve(1).firstZero(), 1e-10, "xi_1(1)");
    }

    @Test
    void chandrasekharLimitApproachedFromBelow() {
        // Source: M_Ch = (sqrt(3 pi)/2) omega_3 (hbar c/G)^{3/2}/(mu_e m_u)^2, omega_3 = 2.01824 (Chandrasekhar 1939),
        // CODATA 2018 constants and IAU 2015 B3 GM_sun written out
        double closed = Math.sqrt(3 * Math.PI) / 2 * 2.01824 * Math.pow(HBAR * C / G, 1.5) / (MU2 * MU2) / (1.3271244e20 / G);
        relative(closed, WhiteDwarf.chandrasekharMass(2.0) / Iau2015.SOLAR_MASS, 5e-6, "M_Ch(2)");
        // Source: issue 16 / common figure, about 5.83 / mu_e^2 M_sun
        relative(5.83, WhiteDwarf.chandrasekharMass(2.15) / Iau2015.SOLAR_MASS * 2.15 * 2.15, 1e-3, "M_Ch mu_e^2");
        // Source: Chandrasekhar 1935: monotonic approach from below
        MassRadiusCurve carbon = WhiteDwarf.massRadiusCurve(2.0, 1e6 * GCC, 1e11 * GCC, 51);
        double mch = WhiteDwarf.chandrasekharMass(2.0);
        double last = 0;
        for (WhiteDwarf w : carbon.models()) {
            assertTrue(w.mass() < mch && w.mass() > last);
            last = w.mass();
        }
        assertTrue(carbon.models().get(50).mass() / mch > 0.99);
    }

    @Test
    void lowDensityPolytropeAndNeutronStarMaximum() {
        // Source: n = 1.5 polytrope, K = (3 pi^2)^{2/3} hbar^2/(5 m_e (mu_e m_u)^{5/3}), R = a xi_1 (Chandrasekhar 1939, ch. XI)
        double k = Math.pow(3 * Math.PI * Math.PI, 2.0 / 3) * HBAR * HBAR / (5 * ME * Math.pow(MU2, 5.0 / 3));
        WhiteDwarf sparse = WhiteDwarf.ofCentralDensity(1e3 * GCC, 2.0);
        double a = Math.sqrt(2.5 * k * Math.pow(sparse.centralDensity(), -1.0 / 3) / (4 * Math.PI * G));
        relative(a * 3.65375, sparse.radius(), 1e-2, "R at 1e3 g/cm^3");
        // Source: J. R. Oppenheimer and G. M. Volkoff, Phys. Rev. 55, 374 (1939), about 0.71 M_sun at about 9 km (from memory)
        NeutronStar heaviest = NeutronStar.maximumMass();
        relative(0.71, heaviest.solarMasses(), 7e-3, "maximum mass");
        relative(9.2, heaviest.radiusKm(), 0.06, "its radius");
    }

    @Test
    void equationOfStateLimits() {
        // Source: Chandrasekhar's T = 0 pressure A [x (2x^2 - 3) sqrt(1 + x^2) + 3 asinh x], written out
        double rho = 1e6 * GCC;
        double x = Math.cbrt(3 * Math.PI * Math.PI * rho / MU2) * HBAR / (ME * C);
        double p = Math.pow(ME, 4) * Math.pow(C, 5) / (24 * Math.PI * Math.PI * Math.pow(HBAR, 3))
                * (x * (2 * x * x - 3) * Math.sqrt(1 + x * x) + 3 * Math.log(x + Math.sqrt(1 + x * x)));
        relative(p, RelativisticFermiGas.electrons(rho, 2.0, 1e3).pressure(), 1e-10, "cold pressure");
        // Source: ideal-gas law P = n k T for a classical gas (Juttner 1911); degeneracy corrections ~1e-3 here
        RelativisticFermiGas thin = RelativisticFermiGas.electrons(1e-3 * GCC, 2.0, 1e9);
        relative((thin.particleDensity() + thin.antiparticleDensity()) * 1.380649e-23 * 1e9, thin.pressure(), 5e-3, "P = nkT");
    }
}
