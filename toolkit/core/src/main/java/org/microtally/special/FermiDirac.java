package org.microtally.special;

import org.apache.commons.math3.special.Gamma;
import org.microtally.InvalidInputException;

/**
 * The complete Fermi-Dirac integral in the normalisation of DLMF 25.12.14,
 * F_j(eta) = (1 / Gamma(j+1)) int_0^inf t^j / (e^(t - eta) + 1) dt = -Li_{j+1}(-e^eta),
 * for real j &gt; -1 and every real eta. F_0(eta) = ln(1 + e^eta); F_j(eta) ~ e^eta as eta -&gt; -inf
 * and ~ eta^(j+1) / Gamma(j+2) as eta -&gt; +inf.
 *
 * <p><b>Methods</b> (chosen by eta):
 * <ul>
 *   <li>eta &lt;= -ln 2: the alternating series sum_{k>=1} (-1)^(k-1) e^(k eta) / k^(j+1)
 *       (DLMF 25.12.10 with z = -e^eta).</li>
 *   <li>-ln 2 &lt; eta &lt;= 1: the Taylor series about eta = 0, F_j(eta) = sum_k eta_D(j+1-k) eta^k/k!
 *       with the Dirichlet eta function eta_D (see {@link Polylog}).</li>
 *   <li>1 &lt; eta &lt; 40 + 2 max(j, 0): the integral itself, split at t = eta and computed by
 *       tanh-sinh quadrature (Takahasi and Mori 1974) on [0, eta] and, after t = eta - ln v, on
 *       v in [0, 1]; the integrand is positive, so there is no cancellation. For j &lt;= 20 the quadrature is
 *       sampled once per order j and unit interval of eta at 17 Chebyshev nodes, and calls evaluate
 *       that degree-16 interpolant (error below 3e-18 relative, far under the quadrature's own; see
 *       FermiDiracTable): the first call in an interval costs about 17 quadratures, later ones
 *       a short polynomial, and the value never depends on what was computed before.</li>
 *   <li>larger eta: the Sommerfeld expansion
 *       F_j(eta) = cos(pi j) F_j(-eta) + 2 sum_{k>=0} eta_D(2k) eta^(j+1-2k) / Gamma(j+2-2k),
 *       eta_D(0) = 1/2 (the inversion formula, exact with a finite sum for integer j; for other j an
 *       asymptotic series whose remainder here is below 1e-17 relative; R. B. Dingle, Appl. Sci.
 *       Res. B 6 (1957) 225; J. S. Blakemore, Solid-State Electronics 25 (1982) 1067).</li>
 * </ul>
 *
 * <p><b>Accuracy.</b> At most {@value #MAX_RELATIVE_ERROR} relative error for -1 &lt; j &lt;= 20 and all
 * eta: the largest measured over 426 table points against a 30-digit mpmath table
 * ({@code special/reference-mpmath.csv}). Never
 * overflows for |eta| &lt;= 1e4 with j &lt;= 20; for eta &lt; -745 the true value is below the
 * smallest double and 0 is returned. A result beyond the double range throws.
 */
public final class FermiDirac {
    /**
     * Largest relative error measured against the committed 30-digit mpmath tables (test resources
     * {@code special/}), rounded up; the test StatedAccuracyTest fails if any table row is worse.
     */
    public static final double MAX_RELATIVE_ERROR = 2e-15;

    private FermiDirac() { }

    private static final double LN2 = Math.log(2.0);

    /** Dirichlet eta(2k), k = 0 .. 200, for the Sommerfeld series (eta(0) = 1/2 is not used there). */
    private static final double[] ETA_EVEN = new double[201];

    static {
        ETA_EVEN[0] = 0.5;
        for (int k = 1; k < ETA_EVEN.length; k++) {
            ETA_EVEN[k] = Zeta.eta(2.0 * k);
        }
    }

    /**
     * The complete Fermi-Dirac integral F_j(eta), normalised with 1/Gamma(j+1) (DLMF 25.12.14).
     *
     * @param j   order, a finite real number &gt; -1
     * @param eta reduced chemical potential mu / kT, any finite real number
     * @return F_j(eta) &gt; 0
     * @throws InvalidInputException for j &lt;= -1, NaN or infinite input, or a result too large
     *         for a double
     */
    public static double integral(double j, double eta) {
        if (!Double.isFinite(j) || j <= -1.0) {
            throw InvalidInputException.of("Fermi-Dirac order j", j, "a finite real number > -1",
                    "F_{-1}(eta) = 1/(1 + e^-eta) is elementary; lower orders are derivatives of it.");
        }
        if (!Double.isFinite(eta)) {
            throw InvalidInputException.of("Fermi-Dirac argument eta", eta, "a finite real number",
                    "Use the limits directly: F_j -> 0 as eta -> -inf, F_j ~ eta^(j+1)/Gamma(j+2) as eta -> +inf.");
        }
        double value;
        if (eta <= -LN2) {
            value = -Polylog.powerSeries(j + 1.0, -Math.exp(eta));
        } else if (eta <= 1.0) {
            value = -Polylog.aboutMinusOne(j + 1.0, eta);
        } else if (eta < asymptoticThreshold(j)) {
            value = j <= FermiDiracTable.MAX_ORDER ? FermiDiracTable.of(j, asymptoticThreshold(j)).value(eta)
                    : quadrature(j, eta);
        } else {
            value = sommerfeld(j, eta);
        }
        if (!Double.isFinite(value)) {
            throw InvalidInputException.of("Fermi-Dirac argument eta (with j = " + j + ")", eta,
                    "small enough that F_j(eta) ~ eta^(j+1)/Gamma(j+2) fits in a double (< 1.8e308)",
                    "Work with ln F_j or rescale the problem.");
        }
        return value + 0.0; // no negative zero after underflow
    }

    /**
     * F_j(eta_i) for every eta_i of a grid at one order j (for charts): the same values as
     * {@link #integral(double, double)} element by element, in a new array.
     *
     * @throws InvalidInputException as {@link #integral(double, double)}, for the first bad eta_i
     */
    public static double[] integral(double j, double[] eta) {
        double[] out = new double[eta.length];
        for (int i = 0; i < eta.length; i++) {
            out[i] = integral(j, eta[i]);
        }
        return out;
    }

    static double asymptoticThreshold(double j) {
        return 40.0 + 2.0 * Math.max(j, 0.0);
    }

    /** Gamma(j+1) F_j(eta) = int_0^eta t^j/(e^(t-eta)+1) dt + int_0^1 (eta - ln v)^j/(1+v) dv. */
    static double quadrature(double j, double eta) {
        double below = TanhSinh.integrate((t, etaMinusT) -> Math.pow(t, j) / (1.0 + Math.exp(-etaMinusT)), eta);
        double above = TanhSinh.integrate((v, oneMinusV) -> {
            double lnV = (v < 0.5) ? Math.log(v) : Math.log1p(-oneMinusV);
            double vv = (v < 0.5) ? v : 1.0 - oneMinusV;
            return Math.pow(eta - lnV, j) / (1.0 + vv);
        }, 1.0);
        double total = below + above;
        if (j + 1.0 <= 170.0) {
            return total / SpecialMath.gamma(j + 1.0);
        }
        return Math.exp(Math.log(total) - Gamma.logGamma(j + 1.0));
    }

    /** Sommerfeld / inversion formula for large eta. */
    private static double sommerfeld(double j, double eta) {
        double leading;
        if (j + 2.0 <= 170.0) {
            leading = Math.pow(eta, j + 1.0) / SpecialMath.gamma(j + 2.0);
        } else {
            leading = Math.exp((j + 1.0) * Math.log(eta) - Gamma.logGamma(j + 2.0));
        }
        double series = 1.0;
        double ratio = 1.0; // Gamma(j+2)/Gamma(j+2-2k) / eta^(2k)
        double invEta2 = 1.0 / (eta * eta);
        double previous = Double.POSITIVE_INFINITY;
        for (int k = 1; k <= 200; k++) {
            ratio *= (j + 1.0 - (2 * k - 2)) * (j + 1.0 - (2 * k - 1)) * invEta2;
            double term = 2.0 * ETA_EVEN[k] * ratio;
            if (Math.abs(term) > previous) {
                break; // asymptotic series: stop at its smallest term (not reached in the range used)
            }
            series += term;
            if (Math.abs(term) <= 1e-17 * Math.abs(series)) {
                break;
            }
            previous = Math.abs(term);
        }
        double mirror = SpecialMath.cosPi(j);
        double mirrorTerm = (mirror == 0.0) ? 0.0 : mirror * integral(j, -eta);
        return leading * series + mirrorTerm;
    }
}
