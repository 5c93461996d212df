package org.microtally.special;

import org.microtally.InvalidInputException;

/**
 * The polylogarithm Li_s(z) = sum_{k>=1} z^k / k^s (DLMF 25.12.10) for real order s and real
 * z &lt;= 1; for 0 &lt; z &lt;= 1 this is the Bose-Einstein function g_s(z) of an ideal Bose gas of
 * fugacity z, and for z &lt; 0 it gives the complete Fermi-Dirac integral,
 * F_j(eta) = -Li_{j+1}(-e^eta) (DLMF 25.12.16).
 *
 * <p><b>Methods</b> (chosen by z; all converge geometrically):
 * <ul>
 *   <li>|z| &lt;= 1/2, or s &gt;= 25: the defining power series.</li>
 *   <li>1/2 &lt; z &lt; 1: the series in mu = ln z about z = 1 (D. C. Wood, "The computation of
 *       polylogarithms", Univ. of Kent Computing Laboratory Tech. Report 15-92 (1992);
 *       DLMF 25.12.12): Li_s(e^mu) = Gamma(1-s) (-mu)^(s-1) + sum_k zeta(s-k) mu^k / k!, with zeta
 *       continued analytically. When s is within 0.05 of a positive integer n, the two terms that
 *       are singular at s = n (Gamma(1-s) and zeta(s-n+1)) are combined analytically with the
 *       Stieltjes-constant expansion of zeta about 1 (DLMF 25.2.4) and the Taylor series of
 *       ln Gamma, which gives Wood's formula for integer order at s = n exactly and no cancellation nearby.</li>
 *   <li>-e &lt;= z &lt; -1/2: the Taylor series about z = -1 in mu = ln(-z), Li_s(-e^mu) =
 *       -sum_k eta(s-k) mu^k / k! with the Dirichlet eta function (radius pi; here |mu| &lt;= 1).</li>
 *   <li>z &lt; -e (s &gt; 0 only): Li_s(z) = -F_{s-1}(ln(-z)), see {@link FermiDirac#integral}.</li>
 *   <li>z = 1: zeta(s) for s &gt; 1 ({@link Zeta#zeta}).</li>
 * </ul>
 *
 * <p><b>Accuracy.</b> At most {@value #MAX_RELATIVE_ERROR} relative error for -2 &lt;= s &lt;= 30 and
 * every allowed z: the largest measured over 524 table points against a 30-digit mpmath table
 * ({@code special/reference-mpmath.csv}).
 * For s &lt; -2 and z near -1/2 the power series cancels and the relative error grows roughly like
 * Gamma(1-s) 1e-16.
 */
public final class Polylog {
    /**
     * Largest relative error measured against the committed 30-digit mpmath tables (test resources
     * {@code special/}), rounded up; the test StatedAccuracyTest fails if any table row is worse.
     */
    public static final double MAX_RELATIVE_ERROR = 1.6e-15;

    private Polylog() { }

    private static final double HALF = 0.5;
    private static final double SERIES_TOLERANCE = 1e-17;
    private static final int MAX_TERMS = 5000;

    /**
     * Per-thread memo of the series coefficients zeta(s-k) and eta(s-k) for the last order s used,
     * filled on demand: root solves and sweeps call Li_s at one s and many z. Values are the same
     * with or without the memo.
     */
    private static final class Coefficients {
        final double s;
        final boolean dirichletEta;
        final double[] values;

        Coefficients(double s, boolean dirichletEta) {
            this.s = s;
            this.dirichletEta = dirichletEta;
            this.values = new double[Math.max(0, (int) Math.ceil(s + 1.0)) + 64];
            java.util.Arrays.fill(values, Double.NaN);
        }

        private double gammaOneMinusS = Double.NaN;

        /** Gamma(1 - s), computed once per order. */
        double gammaOneMinusS() {
            if (Double.isNaN(gammaOneMinusS)) {
                gammaOneMinusS = SpecialMath.gamma(1.0 - s);
            }
            return gammaOneMinusS;
        }

        double get(int k) {
            if (k >= values.length) {
                return compute(k);
            }
            double v = values[k];
            if (Double.isNaN(v)) {
                v = compute(k);
                values[k] = v;
            }
            return v;
        }

        private double compute(int k) {
            return dirichletEta ? Zeta.eta(s - k) : Zeta.zetaAnyReal(s - k);
        }
    }

    private static final ThreadLocal<Coefficients[]> MEMO = ThreadLocal.withInitial(() -> new Coefficients[2]);

    private static Coefficients coefficients(double s, boolean dirichletEta) {
        Coefficients[] memo = MEMO.get();
        int slot = dirichletEta ? 1 : 0;
        Coefficients c = memo[slot];
        if (c == null || Double.compare(c.s, s) != 0) {
            c = new Coefficients(s, dirichletEta);
            memo[slot] = c;
        }
        return c;
    }

    /**
     * The polylogarithm Li_s(z) for real s and real z &lt;= 1.
     *
     * @param s order, a finite real number
     * @param z argument, a finite real number &lt;= 1 (z = 1 needs s &gt; 1; z &lt; -e needs s &gt; 0)
     * @return Li_s(z)
     * @throws InvalidInputException for z &gt; 1 (the value is complex), z = 1 with s &lt;= 1 (the
     *         series diverges), z &lt; -e with s &lt;= 0, or non-finite input
     */
    public static double li(double s, double z) {
        if (!Double.isFinite(s)) {
            throw InvalidInputException.of("polylogarithm order s", s, "a finite real number", "");
        }
        if (!Double.isFinite(z)) {
            throw InvalidInputException.of("polylogarithm argument z", z, "a finite real number <= 1",
                    "For z -> -infinity use FermiDirac.integral(s - 1, ln(-z)).");
        }
        if (z > 1.0) {
            throw InvalidInputException.of("polylogarithm argument z", z, "<= 1",
                    "Li_s(z) is complex for real z > 1 (branch cut); this routine returns real values only.");
        }
        if (z == 1.0) {
            if (s <= 1.0) {
                throw InvalidInputException.of("polylogarithm order s at z = 1", s, "> 1",
                        "Li_s(1) = zeta(s) diverges for s <= 1 (an ideal Bose gas at fugacity 1 with this "
                                + "density-of-states exponent has no finite particle number).");
            }
            return Zeta.zeta(s);
        }
        if (z == 0.0) {
            return 0.0;
        }
        if (Math.abs(z) <= HALF || (s >= 25.0 && z > 0)) {
            return powerSeries(s, z);
        }
        if (z > 0) {
            return aboutOne(s, Math.log(z));
        }
        double mu = Math.log(-z);
        if (mu <= 1.0) {
            return aboutMinusOne(s, mu);
        }
        if (s <= 0.0) {
            throw InvalidInputException.of("polylogarithm order s for z = " + z, s, "> 0 when z < -e",
                    "Use the rational form of Li_s for integer s <= 0, or an argument z >= -e.");
        }
        return -FermiDirac.integral(s - 1.0, mu);
    }

    /**
     * Li_s(z_i) for every z_i of a grid at one order s (for charts): the same values as
     * {@link #li(double, double)} element by element, in a new array.
     *
     * @throws InvalidInputException as {@link #li(double, double)}, for the first bad z_i
     */
    public static double[] li(double s, double[] z) {
        double[] out = new double[z.length];
        for (int i = 0; i < z.length; i++) {
            out[i] = li(s, z[i]);
        }
        return out;
    }

    /**
     * Per-thread memo of the powers k^-s of the power series for the last order s used (like the
     * series coefficients above: each power is the same whether memoised or recomputed).
     */
    private static final class Powers {
        double s = Double.NaN;
        int filled;
        final double[] values = new double[SpecialMath.MAX_POWER_BASE + 1];

        double[] upTo(double order, int count) {
            if (Double.compare(order, s) != 0 || count > filled) {
                SpecialMath.inversePowers(order, values, count);
                s = order;
                filled = count;
            }
            return values;
        }
    }

    private static final ThreadLocal<Powers> POWERS = ThreadLocal.withInitial(Powers::new);

    /** sum_{k>=1} z^k k^-s, for |z| &lt;= 1/2 (or large s with 0 &lt; z &lt; 1). */
    static double powerSeries(double s, double z) {
        // Fast path (s >= 0): K terms with |z|^(K-1) <= 1e-18 leave a tail below 1e-18 |z| <= 2e-18 |sum|
        // (|sum| >= |z|/2 for |z| <= 1/2, s >= 0); the powers k^-s for k <= K come from one exp per prime.
        double az = Math.abs(z);
        if (s >= 0 && az <= HALF) {
            int terms = 1 + (int) Math.ceil(Math.log(1e-18) / Math.log(az));
            if (terms <= SpecialMath.MAX_POWER_BASE) {
                double[] pw = POWERS.get().upTo(s, terms);
                double sum = 0.0;
                for (int k = terms; k >= 1; k--) { // Horner: z (pw[1] + z (pw[2] + ...))
                    sum = (sum + pw[k]) * z;
                }
                return sum;
            }
        }
        double sum = 0.0;
        double zk = 1.0;
        for (int k = 1; k <= MAX_TERMS; k++) {
            zk *= z;
            double term = zk * Math.pow(k, -s);
            sum += term;
            if (k > -s && Math.abs(term) <= SERIES_TOLERANCE * Math.abs(sum)) {
                return sum;
            }
            if (zk == 0.0) {
                return sum;
            }
        }
        return sum;
    }

    /** Li_s(e^mu) for ln(1/2) &lt;= mu &lt; 0: Wood's series about z = 1. */
    static double aboutOne(double s, double mu) {
        double n = Math.rint(s);
        double eps = s - n;
        int singularK = -1;
        double sum = 0.0;
        Coefficients c = coefficients(s, false);
        if (n >= 1.0 && Math.abs(eps) < 0.05) {
            singularK = (int) n - 1;
            sum += singularPair(singularK, eps, mu);
        } else {
            sum += c.gammaOneMinusS() * Math.pow(-mu, s - 1.0);
        }
        return exponentialSeries(c, s, mu, singularK, sum);
    }

    /**
     * Gamma(1-s) (-mu)^(s-1) + zeta(s-m) mu^m / m! for s = m + 1 + eps, |eps| &lt; 0.05, combined:
     * mu^m/m! [ (1 - f)/eps + sum_k (-1)^k gamma_k eps^k / k! ], f = (pi eps / sin pi eps)
     * (m! / Gamma(m+1+eps)) (-mu)^eps, with ln f expanded in eps: ln Gamma(m+1+eps) - ln Gamma(m+1) =
     * psi(m+1) eps + sum_{k>=2} (-1)^k zeta(k, m+1) eps^k / k (Taylor series with DLMF 5.15.1), and
     * ln(pi x / sin pi x) = sum_{k>=1} zeta(2k) x^(2k) / k (logarithm of the product DLMF 4.22.1).
     */
    private static double singularPair(int m, double eps, double mu) {
        double logMinusMu = Math.log(-mu);
        // psi(m+1) = H_m - gamma; Hurwitz zeta(k, m+1) = zeta(k) - H_m^(k)
        double harmonic = 0.0;
        for (int i = 1; i <= m; i++) {
            harmonic += 1.0 / i;
        }
        double digamma = harmonic - SpecialMath.EULER_GAMMA;
        // [lnGamma(m+1+eps) - lnGamma(m+1)] / eps = psi(m+1) + sum_{k>=2} (-1)^k zeta(k, m+1) eps^(k-1) / k
        double lgDiff = digamma;
        double epsPow = 1.0;
        for (int k = 2; k <= 60; k++) {
            epsPow *= eps;
            double hurwitz = Zeta.zetaAnyReal(k);
            for (int i = 1; i <= m; i++) {
                hurwitz -= Math.pow(i, -k);
            }
            double term = ((k % 2 == 0) ? 1.0 : -1.0) * hurwitz * epsPow / k;
            lgDiff += term;
            if (Math.abs(term) < 1e-18 * Math.max(1.0, Math.abs(lgDiff))) {
                break;
            }
        }
        // ln(pi eps / sin(pi eps)) / eps = sum_{k>=1} zeta(2k) eps^(2k-1) / k
        double lnSinc = 0.0;
        double eps2 = eps * eps;
        epsPow = eps;
        for (int k = 1; k <= 30; k++) {
            double term = Zeta.zetaAnyReal(2.0 * k) * epsPow / k;
            lnSinc += term;
            if (Math.abs(term) < 1e-18) {
                break;
            }
            epsPow *= eps2;
        }
        double h = logMinusMu - lgDiff + lnSinc; // ln f = eps * h
        double oneMinusFOverEps = (eps == 0.0) ? -h : -Math.expm1(eps * h) / eps;
        double stieltjes = 0.0;
        double c = 1.0; // eps^k / k!
        for (int k = 0; k < SpecialMath.STIELTJES.length; k++) {
            if (k > 0) {
                c *= eps / k;
            }
            stieltjes += ((k % 2 == 0) ? 1.0 : -1.0) * SpecialMath.STIELTJES[k] * c;
        }
        double muPowOverFact = 1.0;
        for (int i = 1; i <= m; i++) {
            muPowOverFact *= mu / i;
        }
        return muPowOverFact * (oneMinusFOverEps + stieltjes);
    }

    /**
     * start + sum_k c_k mu^k / k! over k = 0, 1, ..., skipping k = {@code skipK} (-1 for none); stops once
     * mu^k/k! underflows to 0 or, past k = s + 1, two successive terms fall below SERIES_TOLERANCE
     * relative to the sum.
     */
    private static double exponentialSeries(Coefficients c, double s, double mu, int skipK, double start) {
        double sum = start;
        double power = 1.0; // mu^k / k!
        int small = 0;
        for (int k = 0; k <= MAX_TERMS; k++) {
            if (k > 0) {
                power *= mu / k;
            }
            if (power == 0.0) {
                break;
            }
            if (k == skipK) {
                continue;
            }
            double term = c.get(k) * power;
            sum += term;
            if (k > s + 1 && Math.abs(term) <= SERIES_TOLERANCE * Math.abs(sum)) {
                if (++small >= 2) {
                    break;
                }
            } else {
                small = 0;
            }
        }
        return sum;
    }

    /** Li_s(-e^mu) = -sum_k eta(s-k) mu^k / k!, for |mu| &lt;= 1 (Taylor series about z = -1). */
    static double aboutMinusOne(double s, double mu) {
        return -exponentialSeries(coefficients(s, true), s, mu, -1, 0.0);
    }
}
