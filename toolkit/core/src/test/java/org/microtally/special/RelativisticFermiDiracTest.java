package org.microtally.special;

import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.math.BigDecimal;
import java.util.ArrayList;
import java.util.List;
import org.apache.commons.math3.special.Gamma;
import org.junit.jupiter.api.Test;
import org.microtally.InvalidInputException;
import org.microtally.MeasuredAccuracy;

/**
 * RelativisticFermiDirac against the committed 20-digit mpmath table and against closed forms.
 *
 * <p>Source: special/relativistic-fd-mpmath.csv, written by special/generate_relativistic_fd.py with
 * mpmath 1.3.0 (each value confirmed by mpmath's tanh-sinh and Gauss-Legendre quadratures to 16 digits).
 */
class RelativisticFermiDiracTest {

    record Row(String quantity, double k, double eta, double beta, BigDecimal value) { }

    static List<Row> table() throws IOException {
        return MeasuredAccuracy.rows(RelativisticFermiDiracTest.class, "/special/relativistic-fd-mpmath.csv").stream()
                .map(c -> new Row(c[0], Double.parseDouble(c[1]), Double.parseDouble(c[2]), Double.parseDouble(c[3]),
                        new BigDecimal(c[4]))).toList();
    }

    @Test
    void tableIsLargeAndCoversTheDomainCorners() throws IOException {
        List<Row> rows = table();
        assertTrue(rows.size() >= 3000, "rows: " + rows.size());
        assertTrue(rows.stream().anyMatch(r -> r.eta() >= 1e6 && r.beta() >= 2000));
        assertTrue(rows.stream().anyMatch(r -> r.eta() <= -300 && r.beta() == 0.0));
        for (String q : new String[] {"F", "dEta", "dBeta", "S"}) {
            assertTrue(rows.stream().filter(r -> r.quantity().equals(q)).count() >= 750, q);
        }
    }

    /** Every row, one assertion listing all failures (a loop rather than 3000 parameterized cases, for speed). */
    @Test
    void matchesMpmath() throws IOException {
        List<String> failures = new ArrayList<>();
        double worst = 0;
        for (Row row : table()) {
            FermiDiracValues v = RelativisticFermiDirac.evaluate(row.eta(), row.beta(), true);
            double got = switch (row.quantity()) {
                case "F" -> v.integral(row.k());
                case "dEta" -> v.etaDerivative(row.k());
                case "dBeta" -> v.betaDerivative(row.k());
                case "S" -> v.entropyIntegral(row.k());
                default -> throw new AssertionError(row.quantity());
            };
            double expected = row.value().doubleValue();
            double rel = Math.abs(got - expected) / expected;
            worst = Math.max(worst, rel);
            // Source: special/relativistic-fd-mpmath.csv (mpmath 1.3.0, 20 digits)
            if (!(rel <= RelativisticFermiDirac.RELATIVE_ACCURACY)) {
                failures.add(row + ": got " + got + ", rel " + rel);
            }
        }
        System.out.printf("RelativisticFermiDirac: worst relative error %.3g (stated %.3g)%n", worst,
                RelativisticFermiDirac.RELATIVE_ACCURACY);
        assertTrue(failures.isEmpty(), failures.size() + " rows outside " + RelativisticFermiDirac.RELATIVE_ACCURACY + ", e.g. " + failures.subList(0, Math.min(5, failures.size())));
        assertTrue(worst > 0, "a table that matches to the last bit everywhere is suspicious: is it our own output?");
    }

    @Test
    void betaZeroIsGammaTimesTheCompleteIntegral() {
        // Source: DLMF 25.12.14: int_0^inf x^k/(e^(x-eta)+1) dx = Gamma(k+1) F_k(eta); F_k from the existing
        // FermiDirac routine (a different method: series, tanh-sinh, Sommerfeld)
        // a dense grid across every switch of the piece layout (eta = -10, 0, 34, 50, ...) and a few far values
        List<Double> etas = new ArrayList<>();
        for (double eta = -25.0; eta <= 70.0; eta += 0.37) {
            etas.add(eta);
        }
        etas.addAll(List.of(-300.0, 250.0, 1e4, 3e6));
        for (double eta : etas) {
            for (double k : new double[] {-0.5, 0.5, 1.5, 2.5}) {
                double expected = Math.exp(Gamma.logGamma(k + 1)) * FermiDirac.integral(k, eta);
                double got = RelativisticFermiDirac.integral(k, eta, 0.0);
                assertTrue(Math.abs(got / expected - 1) <= 1e-12, "k=" + k + " eta=" + eta + ": " + got + " vs " + expected);
                // Source: DLMF 25.12.16 (dF_j/deta = F_{j-1}) with the Gamma normalisation: dF_k/deta = k F_{k-1}
                if (k > 0) {
                    double d = RelativisticFermiDirac.etaDerivative(k, eta, 0.0);
                    double dExpected = k * RelativisticFermiDirac.integral(k - 1, eta, 0.0);
                    assertTrue(Math.abs(d / dExpected - 1) <= 1e-12, "derivative k=" + k + " eta=" + eta);
                }
            }
        }
    }

    @Test
    void zeroTemperatureLimitIsTheFermiSphere() {
        // Source: closed form (counting states in the Fermi sphere, S. Chandrasekhar, An Introduction to the Study of
        // Stellar Structure (1939), ch. X): with p/(mc) = sqrt(2 beta x + beta^2 x^2), p^2 dp is proportional to
        // x^{1/2} (1 + beta x) sqrt(1 + beta x/2) dx, so for a step Fermi factor at x = eta
        // F_{1/2} + beta F_{3/2} -> (2 beta eta + beta^2 eta^2)^{3/2} / (3 sqrt(2) beta^{3/2}); the thermal correction is of
        // relative order (pi^2/6) / eta^2 = 2e-12 at eta = 1e6 (Sommerfeld)
        double eta = 1e6;
        for (double beta : new double[] {1e-9, 1e-6, 1e-4, 2e-3}) {
            double be = beta * eta;
            double step = Math.pow(2 * be + be * be, 1.5) / (3 * Math.sqrt(2) * Math.pow(beta, 1.5));
            double got = RelativisticFermiDirac.integral(0.5, eta, beta) + beta * RelativisticFermiDirac.integral(1.5, eta, beta);
            assertTrue(Math.abs(got / step - 1) <= 1e-11, "beta " + beta + ": " + got + " vs " + step);
        }
    }

    @Test
    void quadratureAndSommerfeldSeriesAgreeWhereTheyMeet() {
        // common practice, no source: two independent routes (Gauss quadrature below eta = 50, the Sommerfeld series from
        // 50 on) must agree across the switch, 2e-12 apart: F is carried to eta = 50 with its eta-derivative; the other
        // values move by at most (k + 2) 2e-12 / eta < 2e-13 relative across the gap, inside the 1e-12 allowed
        double d = 1e-12;
        double below = RelativisticFermiDirac.SOMMERFELD_FROM - d;
        double above = RelativisticFermiDirac.SOMMERFELD_FROM + d;
        for (double beta : new double[] {0.0, 1e-3, 0.3, 10.0, 3000.0}) {
            FermiDiracValues q = RelativisticFermiDirac.evaluate(below, beta, true);
            FermiDiracValues s = RelativisticFermiDirac.evaluate(above, beta, true);
            for (double k : new double[] {-0.5, 0.5, 1.5, 2.5}) {
                double fq = q.integral(k) + d * q.etaDerivative(k);
                double fs = s.integral(k) - d * s.etaDerivative(k);
                assertTrue(Math.abs(fq / fs - 1) <= 1e-12, "F_" + k + " beta " + beta + ": " + fq + " vs " + fs);
                assertTrue(Math.abs(q.etaDerivative(k) / s.etaDerivative(k) - 1) <= 1e-12, "dF/deta " + k + " beta " + beta);
                assertTrue(Math.abs(q.betaDerivative(k) / s.betaDerivative(k) - 1) <= 1e-12, "dF/dbeta " + k + " beta " + beta);
                assertTrue(Math.abs(q.entropyIntegral(k) / s.entropyIntegral(k) - 1) <= 1e-12, "S " + k + " beta " + beta);
            }
        }
    }

    @Test
    void entropyEtaDerivativeMatchesClosedFormsAndTheDerivativeOfTheTestedEntropy() {
        // Source: closed form, classical limit: f = e^(eta - x) (1 + O(e^eta)), so at beta = 0
        // dS_k/deta = int x^k (x - eta) f (1 - f) dx = e^eta [Gamma(k + 2) - eta Gamma(k + 1)] (1 + O(e^eta))
        double eta = -40.0;
        for (double k : new double[] {-0.5, 0.5, 1.5, 2.5}) {
            double expected = Math.exp(eta) * (Gamma.gamma(k + 2) - eta * Gamma.gamma(k + 1));
            double got = RelativisticFermiDirac.evaluate(eta, 0.0, true).entropyEtaDerivative(k);
            assertTrue(Math.abs(got / expected - 1) < 1e-12, "classical k = " + k + ": " + got + " vs " + expected);
        }
        // Source: closed form, degenerate limit at beta = 0 (Sommerfeld, A. Sommerfeld, Z. Phys. 47, 1 (1928)):
        // S_k = (pi^2/3) eta^k + (7 pi^4/90) k (k-1) eta^(k-2) + O(eta^(k-4)), differentiated term by term
        for (double e : new double[] {40.0, 1e3}) {
            for (double k : new double[] {-0.5, 0.5, 1.5, 2.5}) {
                double expected = Math.PI * Math.PI / 3 * k * Math.pow(e, k - 1)
                        + 7 * Math.pow(Math.PI, 4) / 90 * k * (k - 1) * (k - 2) * Math.pow(e, k - 3);
                double got = RelativisticFermiDirac.evaluate(e, 0.0, true).entropyEtaDerivative(k);
                // the next term relative to the first: 12 eta_D(6) / (pi^2/3) (k-1)(k-2)(k-3)(k-4) / eta^4 <= 212 / eta^4
                double neglected = 300.0 * Math.pow(e, -4);
                assertTrue(Math.abs(got / expected - 1) < Math.max(1e-12, neglected),
                        "degenerate eta = " + e + ", k = " + k + ": " + got + " vs " + expected);
            }
        }
        // Source: central difference of S_k, itself checked against the mpmath table above (h = 1e-3: truncation
        // ~h^2 S^(3)/6 and rounding ~1e-12 S/h, both far below the 1e-5 asked here)
        for (double b : new double[] {0.0, 0.3, 20.0}) {
            for (double e : new double[] {-5.0, -0.7, 0.0, 2.5, 9.0, 30.0, 49.9995, 80.0}) {
                double h = 1e-3;
                FermiDiracValues up = RelativisticFermiDirac.evaluate(e + h, b, true);
                FermiDiracValues down = RelativisticFermiDirac.evaluate(e - h, b, true);
                FermiDiracValues at = RelativisticFermiDirac.evaluate(e, b, true);
                for (double k : new double[] {-0.5, 0.5, 1.5, 2.5}) {
                    double diff = (up.entropyIntegral(k) - down.entropyIntegral(k)) / (2 * h);
                    double got = at.entropyEtaDerivative(k);
                    double size = Math.max(Math.abs(diff), at.entropyIntegral(k));
                    assertTrue(Math.abs(got - diff) < 1e-5 * size,
                            "eta = " + e + ", beta = " + b + ", k = " + k + ": " + got + " vs " + diff);
                }
            }
        }
    }

    @Test
    void secondEtaDerivativesMatchClosedFormsAndDifferencesOfTheTestedDerivatives() {
        // Source: DLMF 25.12.16 (dF_j/deta = F_{j-1}) twice, with the Gamma normalisation: at beta = 0
        // d^2F_k/deta^2 = k (k - 1) F_{k-2}, F_{k-2} from the mpmath-tested integrals of lower order
        for (double eta : new double[] {-30.0, -3.0, 0.0, 1.7, 12.0, 40.0, 49.99, 50.01, 300.0}) {
            FermiDiracValues v = RelativisticFermiDirac.evaluate(eta, 0.0, true);
            for (double k : new double[] {1.5, 2.5}) {
                double expected = k * (k - 1) * v.integral(k - 2);
                double got = v.etaSecondDerivative(k);
                assertTrue(Math.abs(got / expected - 1) <= 1e-12, "k=" + k + " eta=" + eta + ": " + got + " vs " + expected);
            }
        }
        // Source: central differences of dF_k/deta and dS_k/deta, themselves checked against the mpmath table and
        // closed forms above (h = 1e-3: truncation ~h^2 f^(3)/6 and rounding ~1e-12 f/h, both far below the 1e-5 asked)
        for (double b : new double[] {0.0, 0.3, 20.0, 2000.0}) {
            for (double e : new double[] {-40.0, -5.0, -0.7, 0.0, 2.5, 9.0, 30.0, 49.9995, 80.0, 1e4}) {
                double h = 1e-3 * Math.max(1.0, e / 100);
                FermiDiracValues up = RelativisticFermiDirac.evaluate(e + h, b, true);
                FermiDiracValues down = RelativisticFermiDirac.evaluate(e - h, b, true);
                FermiDiracValues at = RelativisticFermiDirac.evaluate(e, b, true);
                for (double k : new double[] {-0.5, 0.5, 1.5, 2.5}) {
                    double diff = (up.etaDerivative(k) - down.etaDerivative(k)) / (2 * h);
                    double size = Math.max(Math.abs(diff), at.etaDerivative(k));
                    assertTrue(Math.abs(at.etaSecondDerivative(k) - diff) < 1e-5 * size,
                            "F'' eta = " + e + ", beta = " + b + ", k = " + k + ": " + at.etaSecondDerivative(k) + " vs " + diff);
                    double sDiff = (up.entropyEtaDerivative(k) - down.entropyEtaDerivative(k)) / (2 * h);
                    double sSize = Math.max(Math.abs(sDiff), Math.max(at.entropyIntegral(k), Math.abs(at.entropyEtaDerivative(k))));
                    assertTrue(Math.abs(at.entropyEtaSecondDerivative(k) - sDiff) < 1e-5 * sSize,
                            "S'' eta = " + e + ", beta = " + b + ", k = " + k + ": " + at.entropyEtaSecondDerivative(k) + " vs " + sDiff);
                }
            }
        }
        // common practice, no source: they come with the entropy only
        assertThrows(IllegalStateException.class, () -> RelativisticFermiDirac.evaluate(1, 1, false).etaSecondDerivative(0.5));
    }

    @Test
    void numberIntegralIsTheTestedCombinationOfTheFullEvaluation() {
        // Source: the mpmath-tested evaluate (same rule, fewer sums): N = F_1/2 + beta F_3/2, dN/deta and d^2N/deta^2
        for (double b : new double[] {0.0, 1e-4, 0.3, 20.0, 2000.0}) {
            for (double e : new double[] {-300.0, -40.0, -5.0, -0.7, 0.0, 2.5, 9.0, 30.0, 49.9995, 80.0, 1e4}) {
                FermiDiracValues v = RelativisticFermiDirac.evaluate(e, b, false);
                double[] got = RelativisticFermiDirac.numberIntegral(e, b);
                double n = v.integral(0.5) + b * v.integral(1.5);
                double dn = v.etaDerivative(0.5) + b * v.etaDerivative(1.5);
                FermiDiracValues w = RelativisticFermiDirac.evaluate(e, b, true);
                double d2n = w.etaSecondDerivative(0.5) + b * w.etaSecondDerivative(1.5);
                // N'' changes sign at the Fermi level: compared on the scale of N'
                assertTrue(Math.abs(got[2] - d2n) < 1e-13 * dn, "N'' at eta = " + e + ", beta = " + b + ": " + got[2] + " vs " + d2n);
                assertTrue(Math.abs(got[0] / n - 1) < 1e-14, "N at eta = " + e + ", beta = " + b + ": " + got[0] + " vs " + n);
                assertTrue(Math.abs(got[1] / dn - 1) < 1e-14, "dN at eta = " + e + ", beta = " + b + ": " + got[1] + " vs " + dn);
            }
        }
        // common practice, no source: the same domain check as evaluate
        assertThrows(InvalidInputException.class, () -> RelativisticFermiDirac.numberIntegral(-701.0, 0.0));
    }

    @Test
    void refusesOutsideTheDomain() {
        // common practice, no source
        assertThrows(InvalidInputException.class, () -> RelativisticFermiDirac.integral(0.5, -800, 1));
        assertThrows(InvalidInputException.class, () -> RelativisticFermiDirac.integral(0.5, Double.NaN, 1));
        assertThrows(InvalidInputException.class, () -> RelativisticFermiDirac.integral(0.5, 1, -1e-3));
        assertThrows(InvalidInputException.class, () -> RelativisticFermiDirac.integral(1.0, 1, 1));
        assertThrows(IllegalStateException.class, () -> RelativisticFermiDirac.evaluate(1, 1, false).entropyIntegral(0.5));
    }
}
