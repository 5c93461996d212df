package org.microtally.special;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Random;
import org.junit.jupiter.api.RepeatedTest;
import org.junit.jupiter.api.RepetitionInfo;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import org.microtally.InvalidInputException;

/** Published values, closed forms and functional identities of zeta, Li_s and F_j. */
class SpecialIdentitiesTest {

    private static void assertRelative(double expected, double actual, double tolerance, String what) {
        double rel = Math.abs(actual - expected) / Math.abs(expected);
        assertTrue(rel <= tolerance, what + ": expected " + expected + ", got " + actual + " (relative " + rel + ")");
    }

    @Test
    void zetaAtPublishedPoints() {
        // Source: DLMF 25.6.1, zeta(2) = pi^2/6
        assertRelative(Math.PI * Math.PI / 6.0, Zeta.zeta(2.0), 1e-15, "zeta(2)");
        // Source: DLMF 25.6.1, zeta(4) = pi^4/90
        assertRelative(Math.pow(Math.PI, 4) / 90.0, Zeta.zeta(4.0), 1e-15, "zeta(4)");
        // Source: OEIS A078434, zeta(3/2) = 2.612375348685488343348567567924...
        assertRelative(2.612375348685488343, Zeta.zeta(1.5), 1e-15, "zeta(3/2)");
        // Source: OEIS A002117, zeta(3) = 1.202056903159594285399738161511... (Apery's constant)
        assertRelative(1.202056903159594285, Zeta.zeta(3.0), 1e-15, "zeta(3)");
        // Source: OEIS A078437, zeta(5/2) = 1.341487257250917179756769702...
        assertRelative(1.341487257250917180, Zeta.zeta(2.5), 1e-15, "zeta(5/2)");
        // Source: DLMF 25.6.1, zeta(6) = pi^6/945
        assertRelative(Math.pow(Math.PI, 6) / 945.0, Zeta.zeta(6.0), 1e-15, "zeta(6)");
    }

    @Test
    void zetaNearThePoleFollowsTheLaurentSeries() {
        // Source: DLMF 25.2.4 with Euler's constant (DLMF 5.2.3): zeta(1+e) = 1/e + gamma - gamma_1 e + O(e^2)
        double e = 1.0 / 1024; // exact in binary
        double expected = 1.0 / e + 0.5772156649015329 + 0.0728158454836767 * e - 0.5 * 0.0096903631928723 * e * e;
        assertRelative(expected, Zeta.zeta(1.0 + e), 1e-14, "zeta(1 + 2^-10)");
    }

    @ParameterizedTest
    @ValueSource(doubles = {0.5, 1.0, 1.5, 2.0, 2.5, 3.0, 4.5, 7.0})
    void fermiDiracAtZeroIsEtaOfJPlusOne(double j) {
        // Source: DLMF 25.12.16 with z = -1 and DLMF 25.2.3: F_j(0) = -Li_{j+1}(-1) = (1 - 2^-j) zeta(j+1)
        assertRelative((1.0 - Math.pow(2.0, -j)) * Zeta.zeta(j + 1.0), FermiDirac.integral(j, 0.0), 1e-14, "F_" + j + "(0)");
    }

    @ParameterizedTest
    @ValueSource(doubles = {-745.0, -30.0, -3.0, -0.5, 0.0, 0.8, 1.5, 7.0, 33.0, 39.99, 40.01, 300.0, 1e4})
    void fermiDiracOrderZeroIsLogOnePlusExp(double eta) {
        // Source: closed form F_0(eta) = ln(1 + e^eta) (DLMF 25.12.14 with j = 0, common practice)
        double expected = eta > 0 ? eta + Math.log1p(Math.exp(-eta)) : Math.log1p(Math.exp(eta));
        assertRelative(expected, FermiDirac.integral(0.0, eta), 1e-14, "F_0(" + eta + ")");
    }

    @ParameterizedTest
    @ValueSource(doubles = {1.5, 3.0, 5.0, 12.0, 25.0, 39.0, 41.0, 90.0})
    void fermiDiracOrderOneInversionFormula(double eta) {
        // Source: F_1(eta) + F_1(-eta) = eta^2/2 + pi^2/6, the inversion formula of Li_2
        // (DLMF 25.12.4 with z = -e^eta); checks the quadrature range 1 < eta < 42 independently
        double sum = FermiDirac.integral(1.0, eta) + FermiDirac.integral(1.0, -eta);
        assertRelative(eta * eta / 2.0 + Math.PI * Math.PI / 6.0, sum, 1e-14, "F_1(eta) + F_1(-eta) at " + eta);
    }

    @ParameterizedTest
    @ValueSource(doubles = {-5.0, -0.3, 0.5, 2.0, 10.0, 35.0, 60.0})
    void fermiDiracDerivativeIsOrderBelow(double eta) {
        // Source: derivative rule d/d eta F_j(eta) = F_{j-1}(eta), from z d/dz Li_s(z) = Li_{s-1}(z) (from memory), checked by
        // a 4th-order central difference; tolerance set by the difference formula, not by the routine
        double j = 1.5;
        double h = 1e-3;
        double d = (-FermiDirac.integral(j, eta + 2 * h) + 8 * FermiDirac.integral(j, eta + h)
                - 8 * FermiDirac.integral(j, eta - h) + FermiDirac.integral(j, eta - 2 * h)) / (12 * h);
        assertRelative(FermiDirac.integral(j - 1.0, eta), d, 1e-9, "dF_3/2/deta at " + eta);
    }

    @Test
    void fermiDiracLargeArgumentsStayFinite() {
        // Source: leading Sommerfeld term F_j(eta) ~ eta^(j+1)/Gamma(j+2) (DLMF 25.12.14 asymptotics, common practice)
        // with the first correction 2 eta_D(2) (j+1) j eta^(j-1)/Gamma(j+2), eta_D(2) = pi^2/12
        double eta = 1e4;
        double lead = Math.pow(eta, 1.5) / (0.75 * Math.sqrt(Math.PI));
        double corr = lead * (Math.PI * Math.PI / 6.0) * 1.5 * 0.5 / (eta * eta);
        assertRelative(lead + corr, FermiDirac.integral(0.5, eta), 1e-14, "F_1/2(1e4)");
        // e^-1e4 is below the smallest double: the routine returns 0, not NaN
        assertEquals(0.0, FermiDirac.integral(0.5, -1e4));
    }

    @RepeatedTest(40)
    void duplicationFormula(RepetitionInfo info) {
        Random rnd = new Random(1729L + info.getCurrentRepetition());
        double s = -1.0 + 7.0 * rnd.nextDouble();
        double z = -0.999 + 1.998 * rnd.nextDouble();
        double left = Polylog.li(s, z) + Polylog.li(s, -z);
        double right = Math.pow(2.0, 1.0 - s) * Polylog.li(s, z * z);
        // Source: square relation Li_s(z) + Li_s(-z) = 2^(1-s) Li_s(z^2) (follows from the series DLMF 25.12.10; from memory)
        double scale = Math.abs(Polylog.li(s, z)) + Math.abs(Polylog.li(s, -z));
        assertTrue(Math.abs(left - right) <= 1e-13 * scale, "s = " + s + ", z = " + z + ": " + left + " vs " + right);
    }

    @ParameterizedTest
    @ValueSource(doubles = {-50.0, -2.0, -0.7, -1e-3, 0.2, 0.6, 0.9, 0.999, 1.0 - 1e-9})
    void orderOneAndZeroClosedForms(double z) {
        // Source: Li_1(z) = -ln(1 - z) (DLMF 25.12.10 with s = 1, the logarithm series)
        assertRelative(-Math.log1p(-z), Polylog.li(1.0, z), 1e-14, "Li_1(" + z + ")");
        if (z >= -Math.E) {
            // Source: Li_0(z) = z/(1 - z), Li_-1(z) = z/(1 - z)^2 (geometric series and z d/dz of it, common practice)
            assertRelative(z / (1.0 - z), Polylog.li(0.0, z), 1e-13, "Li_0(" + z + ")");
            assertRelative(z / ((1.0 - z) * (1.0 - z)), Polylog.li(-1.0, z), 1e-13, "Li_-1(" + z + ")");
        }
    }

    @Test
    void dilogarithmSpecialValues() {
        double ln2 = Math.log(2.0);
        // Source: Euler's value Li_2(1/2) = pi^2/12 - (ln 2)^2/2 (from memory)
        assertRelative(Math.PI * Math.PI / 12.0 - ln2 * ln2 / 2.0, Polylog.li(2.0, 0.5), 1e-15, "Li_2(1/2)");
        // Source: Li_2(-1) = -eta(2) = -pi^2/12 (DLMF 25.2.3 with 25.6.1)
        assertRelative(-Math.PI * Math.PI / 12.0, Polylog.li(2.0, -1.0), 1e-15, "Li_2(-1)");
        // Source: Li_s(1) = zeta(s) (DLMF 25.12.10)
        assertRelative(2.612375348685488343, Polylog.li(1.5, 1.0), 1e-15, "g_3/2(1)");
    }

    @Test
    void badInputsAreRejectedWithTheValueNamed() {
        InvalidInputException pole = assertThrows(InvalidInputException.class, () -> Zeta.zeta(1.0));
        assertTrue(pole.getMessage().contains("= 1.0") && pole.getMessage().contains("pole"), pole.getMessage());
        assertTrue(assertThrows(InvalidInputException.class, () -> Zeta.zeta(0.5)).getMessage().contains("0.5"));
        assertThrows(InvalidInputException.class, () -> Zeta.zeta(Double.NaN));
        InvalidInputException cut = assertThrows(InvalidInputException.class, () -> Polylog.li(2.0, 1.5));
        assertTrue(cut.getMessage().contains("1.5") && cut.getMessage().contains("complex"), cut.getMessage());
        InvalidInputException diverges = assertThrows(InvalidInputException.class, () -> Polylog.li(1.0, 1.0));
        assertTrue(diverges.getMessage().contains("diverges"), diverges.getMessage());
        assertThrows(InvalidInputException.class, () -> Polylog.li(0.5, 1.0));
        assertThrows(InvalidInputException.class, () -> Polylog.li(-1.0, -10.0));
        assertThrows(InvalidInputException.class, () -> Polylog.li(Double.NaN, 0.5));
        InvalidInputException order = assertThrows(InvalidInputException.class, () -> FermiDirac.integral(-1.0, 0.0));
        assertTrue(order.getMessage().contains("-1.0") && order.getMessage().contains("> -1"), order.getMessage());
        assertThrows(InvalidInputException.class, () -> FermiDirac.integral(0.5, Double.NaN));
        assertThrows(InvalidInputException.class, () -> FermiDirac.integral(0.5, Double.POSITIVE_INFINITY));
        assertThrows(InvalidInputException.class, () -> FermiDirac.integral(80.0, 1e300));
    }
}
