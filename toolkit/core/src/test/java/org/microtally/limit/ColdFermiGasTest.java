package org.microtally.limit;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
import org.microtally.InvalidInputException;

class ColdFermiGasTest {
    private static final double HBAR = 6.62607015e-34 / (2 * Math.PI);
    private static final double C = 299792458.0;
    private static final double ME = 9.1093837015e-31;

    /** Composite Simpson rule with n (even) intervals: the independent brute force. */
    private static double simpson(java.util.function.DoubleUnaryOperator f, double a, double b, int n) {
        double h = (b - a) / n;
        double sum = f.applyAsDouble(a) + f.applyAsDouble(b);
        for (int i = 1; i < n; i++) {
            sum += (i % 2 == 1 ? 4 : 2) * f.applyAsDouble(a + i * h);
        }
        return sum * h / 3;
    }

    @Test
    void reducedFunctionsMatchTheirDefiningIntegrals() {
        for (double x : new double[] {0.01, 0.3, 0.49, 0.51, 0.7, 3.0, 30.0}) {
            // Source: independent brute force, Simpson's rule on the defining integrals P/A = 8 int_0^x s^4/sqrt(1+s^2) ds
            // and u/A = 24 int_0^x s^2 (sqrt(1+s^2) - 1) ds (Chandrasekhar 1939, ch. X)
            double p = 8 * simpson(s -> Math.pow(s, 4) / Math.sqrt(1 + s * s), 0, x, 20000);
            double u = 24 * simpson(s -> s * s * s * s / (Math.sqrt(1 + s * s) + 1), 0, x, 20000);
            assertEquals(p, ColdFermiGas.reducedPressure(x), 1e-12 * p, "P at x = " + x);
            assertEquals(u, ColdFermiGas.reducedKineticEnergy(x), 1e-12 * u, "u at x = " + x);
        }
    }

    @Test
    void nonRelativisticAndUltraRelativisticLimits() {
        // Source: closed forms of the degenerate gas: P = (2/5) n E_F with E_F = hbar^2 (3 pi^2 n)^{2/3}/(2m)
        // (Ashcroft & Mermin, Solid State Physics (1976), ch. 2); correction of relative order (5/14) x^2
        ColdFermiGas nr = ColdFermiGas.ofRelativityParameter(1e-4, ME);
        double n = nr.numberDensity();
        double pNr = 0.4 * n * HBAR * HBAR * Math.pow(3 * Math.PI * Math.PI * n, 2.0 / 3) / (2 * ME);
        assertEquals(pNr, nr.pressure(), 1e-8 * pNr);
        // Source: ultra-relativistic limit P = (hbar c/4) (3 pi^2)^{1/3} n^{4/3} (Chandrasekhar 1939, ch. X), correction ~ 1/x^2
        ColdFermiGas ur = ColdFermiGas.ofRelativityParameter(1e4, ME);
        double n2 = ur.numberDensity();
        double pUr = HBAR * C / 4 * Math.cbrt(3 * Math.PI * Math.PI) * Math.pow(n2, 4.0 / 3);
        assertEquals(pUr, ur.pressure(), 2e-8 * pUr);
        // Source: T = 0 Gibbs-Duhem u + P = n E_F (closed form)
        for (double x : new double[] {0.01, 0.6, 5}) {
            ColdFermiGas g = ColdFermiGas.ofRelativityParameter(x, ME);
            assertEquals(g.numberDensity() * g.fermiKineticEnergy(), g.kineticEnergyDensity() + g.pressure(),
                    1e-13 * g.numberDensity() * g.fermiKineticEnergy());
        }
    }

    @Test
    void electronsAtAGivenMassDensity() {
        // Source: common textbook value (from memory): x = 1.0088e-2 (rho / mu_e in g/cm^3)^{1/3}; x = 1 at
        // rho/mu_e = 9.74e5 g/cm^3
        ColdFermiGas g = ColdFermiGas.electrons(2 * 9.74e5 * 1e3, 2.0);
        assertEquals(1.0, g.relativityParameter(), 2e-4);
        assertEquals(1.0088e-2 * Math.cbrt(1e6), ColdFermiGas.electrons(2e9, 2.0).relativityParameter(), 5e-5); // 5 printed digits
    }

    @Test
    void badInputIsRefused() {
        // common practice, no source
        InvalidInputException e = assertThrows(InvalidInputException.class, () -> ColdFermiGas.electrons(-5, 2));
        assertTrue(e.getMessage().contains("-5.0"));
        InvalidInputException mu = assertThrows(InvalidInputException.class, () -> ColdFermiGas.electrons(1e9, 0.5));
        assertTrue(mu.getMessage().contains("0.5"));
        assertThrows(InvalidInputException.class, () -> ColdFermiGas.neutrons(0));
        assertThrows(InvalidInputException.class, () -> ColdFermiGas.ofRelativityParameter(Double.NaN, ME));
    }
}
