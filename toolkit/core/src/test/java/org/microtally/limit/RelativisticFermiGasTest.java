package org.microtally.limit;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.math.BigDecimal;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.microtally.InvalidInputException;
import org.microtally.MeasuredAccuracy;
import org.microtally.special.RelativisticFermiDirac;

class RelativisticFermiGasTest {
    private static final double K = 1.380649e-23;
    private static final double H = 6.62607015e-34;
    private static final double HBAR = H / (2 * Math.PI);
    private static final double C = 299792458.0;
    private static final double ME = 9.1093837015e-31;
    private static final double MU = 1.66053906660e-27;

    @Test
    void coldLimitIsTheChandrasekharPressure() {
        // Source: Chandrasekhar's T = 0 closed form (MNRAS 95, 207 (1935)) via ColdFermiGas; thermal corrections are
        // of relative order (kT/E_F)^2 ~ 4e-13 at 1e3 K and 1e9 kg/m^3
        RelativisticFermiGas hot = RelativisticFermiGas.electrons(1e9, 2.0, 1e3);
        ColdFermiGas cold = ColdFermiGas.electrons(1e9, 2.0);
        assertEquals(cold.pressure(), hot.pressure(), 1e-11 * cold.pressure());
        assertEquals(cold.kineticEnergyDensity(), hot.energyDensity(), 1e-11 * cold.kineticEnergyDensity());
        RelativisticFermiGas n = RelativisticFermiGas.neutrons(1e18, 1e5);
        ColdFermiGas nCold = ColdFermiGas.neutrons(1e18);
        assertEquals(nCold.pressure(), n.pressure(), 1e-11 * nCold.pressure());
        assertEquals(0.0, n.antiparticleDensity(), 0.0); // neutrons: no antiparticles in the model
    }

    @Test
    void degenerateEntropyFollowsSommerfeld() {
        // Source: Sommerfeld expansion S/V = (pi^2/3) k^2 T D(E_F), D(E) = (8 pi/h^3) p E_tot/c^2 the relativistic density of
        // states per volume (Ashcroft & Mermin, Solid State Physics (1976), eqs. 2.70-2.80, any D(E)); next term of relative
        // order (kT/E_F)^2 ~ 1e-6 here
        double rho = 1e9;
        double t = 1e6;
        RelativisticFermiGas g = RelativisticFermiGas.electrons(rho, 2.0, t);
        double x = g.fermiRelativityParameter();
        double p = x * ME * C;
        double eTot = ME * C * C * Math.sqrt(1 + x * x);
        double dos = 8 * Math.PI / (H * H * H) * p * eTot / (C * C);
        double expected = Math.PI * Math.PI / 3 * K * K * t * dos;
        assertEquals(expected, g.entropyDensity(), 2e-5 * expected);
        // Source: the same expansion for mu: eta ~ E_F/kT to relative (kT/E_F)^2
        double fermi = ME * C * C * x * x / (Math.sqrt(1 + x * x) + 1);
        assertEquals(fermi / (K * t), g.degeneracyParameter(), 1e-5 * fermi / (K * t));
        assertTrue(g.regime().startsWith("degenerate"), g.regime());
    }

    @Test
    void classicalLimitIsTheIdealGasAndSackurTetrode() {
        // Source: ideal-gas law P = n k T, which holds for a classical gas at any beta (F. Juttner, Ann. Phys. 339, 856
        // (1911)), with the first quantum correction for fermions, P = n k T [1 + n lambda^3 / (2^{5/2} g_s)]
        // (R. K. Pathria, Statistical Mechanics, sec. 8.1, from memory) = 2.2e-8 here; next terms ~ 1e-13
        double rho = 1e-6;
        double t = 1e4;
        RelativisticFermiGas g = RelativisticFermiGas.electrons(rho, 1.0, t);
        double n = g.particleDensity() + g.antiparticleDensity();
        double lambda = H / Math.sqrt(2 * Math.PI * ME * K * t);
        double degeneracy = n * lambda * lambda * lambda / (Math.pow(2, 2.5) * 2);
        assertTrue(degeneracy > 1e-8, "the correction must be visible: " + degeneracy);
        assertEquals(n * K * t * (1 + degeneracy), g.pressure(), 1e-11 * n * K * t);
        // Source: Sackur-Tetrode, S/(N k) = 5/2 + ln(g_s / (n lambda^3)), lambda = h / sqrt(2 pi m k T), g_s = 2, and
        // U = (3/2) N k T; relativistic corrections of relative order beta = 1.7e-6
        double sackur = n * K * (2.5 + Math.log(2 / (n * lambda * lambda * lambda)));
        assertEquals(sackur, g.entropyDensity(), 1e-5 * sackur);
        assertEquals(1.5 * n * K * t, g.energyDensity(), 1e-5 * 1.5 * n * K * t);
        assertTrue(g.regime().startsWith("non-degenerate") && g.regime().contains("non-relativistic"), g.regime());
        assertEquals(rho / MU, g.netDensity(), 1e-15 * rho / MU);
    }

    @Test
    void ultraRelativisticPairPlasma() {
        // Source: ultra-relativistic fermions at mu = 0, two spin states (E. W. Kolb and M. S. Turner, The Early Universe
        // (1990), eqs. 3.52-3.54, from memory): n = (3 zeta(3) / (2 pi^2)) (kT/hbar c)^3 and
        // P = (7/8) (pi^2/45) (kT)^4/(hbar c)^3 per species; mass corrections of relative order 1/beta^2 ~ 4e-5 at 1e12 K
        double t = 1e12;
        RelativisticFermiGas g = RelativisticFermiGas.electrons(1e-3, 2.0, t);
        double kt = K * t;
        double zeta3 = 1.2020569031595942; // OEIS A002117
        double n = 3 * zeta3 / (2 * Math.PI * Math.PI) * Math.pow(kt / (HBAR * C), 3);
        double p = 7.0 / 8 * Math.PI * Math.PI / 45 * Math.pow(kt, 4) / Math.pow(HBAR * C, 3);
        assertEquals(n, g.particleDensity(), 2e-4 * n);
        assertEquals(n, g.antiparticleDensity(), 2e-4 * n);
        assertEquals(2 * p, g.pressure(), 2e-4 * 2 * p);
        assertTrue(g.notes().size() == 2, "pair-dominated note expected: " + g.notes());
    }

    @Test
    void entropyAgreesWithTheEulerRelationWherePairsMatter() {
        // Source: thermodynamic (Euler) relation T S = U_kin + P V - sum_i mu_i^kin N_i per species (closed form), here where
        // it loses no digits (eta of order 1)
        double t = 3e9;
        RelativisticFermiGas g = RelativisticFermiGas.electrons(1e6, 2.0, t);
        double kt = K * t;
        double eta = g.degeneracyParameter();
        double etaPlus = -eta - 2 / g.beta();
        double uKin = g.energyDensity() - 2 * ME * C * C * g.antiparticleDensity();
        double euler = (uKin + g.pressure() - kt * (eta * g.particleDensity() + etaPlus * g.antiparticleDensity())) / t;
        assertEquals(euler, g.entropyDensity(), 1e-10 * euler);
        // Source: charge neutrality, n_- - n_+ = rho / (mu_e m_u) (the defining equation), to the solver's accuracy
        assertEquals(1e6 / (2 * MU), g.particleDensity() - g.antiparticleDensity(), 1e-9 * 1e6 / (2 * MU));
    }

    @Test
    void chargeNeutralityHoldsToTheStatedAccuracyAcrossDegeneracyAndPairs() {
        // Source: charge neutrality n_- - n_+ = rho / (mu_e m_u), the defining equation of eta, on a grid from the
        // classical gas through partial degeneracy to pair plasmas (common practice, no source for the grid)
        for (double logRho = -3; logRho <= 12; logRho += 1.5) {
            for (double logT = 4; logT <= 11; logT += 0.5) {
                double rho = Math.pow(10, logRho);
                RelativisticFermiGas g;
                try {
                    g = RelativisticFermiGas.electrons(rho, 2.0, Math.pow(10, logT));
                } catch (InvalidInputException tooCold) {
                    continue; // outside the finite-temperature route (eta > 1e11): refused, as documented
                }
                double net = rho / (2 * MU);
                // where pairs outnumber the net electrons, the difference n_- - n_+ carries the integrals' 1e-12 relative
                // error times n_+/n_net (stated in notes())
                double tolerance = 2e-12 * Math.max(1.0, g.antiparticleDensity() / net);
                assertEquals(net, g.particleDensity() - g.antiparticleDensity(), tolerance * net,
                        "rho = 1e" + logRho + " kg/m^3, T = 1e" + logT + " K");
            }
        }
    }

    @Test
    void badInputIsRefusedWithTheValue() {
        // common practice, no source
        InvalidInputException rho = assertThrows(InvalidInputException.class, () -> RelativisticFermiGas.electrons(-1e6, 2, 1e7));
        assertTrue(rho.getMessage().contains("-1000000.0"), rho.getMessage());
        InvalidInputException mu = assertThrows(InvalidInputException.class, () -> RelativisticFermiGas.electrons(1e6, 0.99, 1e7));
        assertTrue(mu.getMessage().contains("0.99"), mu.getMessage());
        InvalidInputException t = assertThrows(InvalidInputException.class, () -> RelativisticFermiGas.electrons(1e6, 2, -5));
        assertTrue(t.getMessage().contains("-5.0"), t.getMessage());
        InvalidInputException zero = assertThrows(InvalidInputException.class, () -> RelativisticFermiGas.electrons(1e6, 2, 0));
        assertTrue(zero.getMessage().contains("ColdFermiGas"), zero.getMessage());
        assertThrows(InvalidInputException.class, () -> RelativisticFermiGas.electrons(1e12, 2, 1e-3));
        assertThrows(InvalidInputException.class, () -> RelativisticFermiGas.electrons(1e6, 2, 1e13));
        assertThrows(InvalidInputException.class, () -> RelativisticFermiGas.neutrons(1e18, Double.NaN));
    }

    @Test
    void matchesAnIndependentMpmathEquationOfState() throws IOException {
        // Source: limit/relativistic-gas-mpmath.csv, written by limit/generate_relativistic_gas.py with mpmath 1.3.0 from
        // the definitions alone (eta by mpmath's bracketing root finder, every integral by tanh-sinh and Gauss-Legendre
        // quadrature agreeing to 16 digits): 21 states from the classical gas to pair plasmas and neutron matter
        List<String> failures = new ArrayList<>();
        double worst = 0;
        int rows = 0;
        for (String[] c : MeasuredAccuracy.rows(getClass(), "/limit/relativistic-gas-mpmath.csv")) {
            double rho = Double.parseDouble(c[1]);
            double kelvin = Double.parseDouble(c[3]);
            RelativisticFermiGas g = c[0].equals("electron")
                    ? RelativisticFermiGas.electrons(rho, Double.parseDouble(c[2]), kelvin)
                    : RelativisticFermiGas.neutrons(rho, kelvin);
            double[] expected = new double[6];
            for (int i = 0; i < 6; i++) {
                expected[i] = new BigDecimal(c[4 + i]).doubleValue();
            }
            double[] got = {g.degeneracyParameter(), g.particleDensity(), g.antiparticleDensity(), g.pressure(),
                g.energyDensity(), g.entropyDensity()};
            // eta and the densities lose digits where pairs outnumber the net particles (notes() says so); P, U, S do not
            double pairFactor = Math.max(1.0, g.antiparticleDensity() / g.netDensity());
            for (int i = 0; i < 6; i++) {
                double scale = i == 0 ? Math.max(1.0, Math.abs(expected[0])) : Math.abs(expected[i]);
                double allowed = (i <= 2 ? pairFactor : 1.0) * RelativisticFermiDirac.RELATIVE_ACCURACY;
                double error = expected[i] == 0.0 ? Math.abs(got[i]) : Math.abs(got[i] - expected[i]) / scale;
                worst = Math.max(worst, error / allowed);
                if (!(error <= allowed)) {
                    failures.add(String.join(",", c[0], c[1], c[2], c[3]) + " column " + i + ": got " + got[i]
                            + ", expected " + expected[i] + " (" + error + ")");
                }
            }
            rows++;
        }
        assertEquals(21, rows);
        assertTrue(failures.isEmpty(), failures.toString());
        assertTrue(worst > 0, "a reference that matches to the last bit everywhere is suspicious: is it our own output?");
    }
}
