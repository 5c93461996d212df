package org.microtally.limit;

import java.util.List;
import org.microtally.InvalidInputException;
import org.microtally.Tabular;
import org.microtally.special.FermiDiracValues;
import org.microtally.special.RelativisticFermiDirac;
import org.apache.commons.math3.util.FastMath;
import org.microtally.units.Codata2018;

/**
 * The ideal relativistic Fermi gas (spin 1/2) at temperature T: electrons with thermal
 * electron-positron pairs neutralising matter of given mass density and mu_e, or neutrons (no
 * antiparticles) of given mass density. With beta = kT/(m c^2), eta the kinetic chemical potential
 * over kT, eta_+ = -eta - 2/beta for positrons (pair equilibrium mu_+ = -mu_-), F_k and S_k the
 * integrals of {@link RelativisticFermiDirac}, K_n = 8 pi sqrt(2) (m c / h)^3 and
 * K_p = m c^2 K_n:
 * <ul>
 *   <li>n = K_n beta^(3/2) [F_{1/2} + beta F_{3/2}] for each species, n_- - n_+ = rho/(mu_e m_u);</li>
 *   <li>P = (2/3) K_p beta^(5/2) [F_{3/2} + (beta/2) F_{5/2}];</li>
 *   <li>U/V = K_p beta^(5/2) [F_{3/2} + beta F_{5/2}] (kinetic) + 2 m c^2 n_+ (the rest energy of the
 *       pairs; the rest energy of the net electrons is not included);</li>
 *   <li>S/V = k K_n beta^(3/2) [S_{1/2} + beta S_{3/2}] summed over species: the entropy integral
 *       itself, positive term by term, rather than (U + P V - mu N)/T, which loses all digits in the
 *       degenerate limit.</li>
 * </ul>
 * This is the ideal electron-positron part of the equation of state described by F. X. Timmes and
 * D. Arnett, ApJS 125, 277 (1999) (their eqs. for n, P, E with the generalised Fermi-Dirac
 * integrals), evaluated directly rather than from a table.
 *
 * <p><b>Method and accuracy.</b> eta solves the charge (or number) equation by Halley's method (Newton's where
 * Halley's correction is large) on asinh((n_- - n_+)/s) with s = 2 sqrt(n_- n_+) at the starting point (so that the
 * function is linear in eta where both species are non-degenerate, n_- - n_+ = s sinh(eta + 1/beta), and
 * ln(n_- - n_+) + const where the positrons are negligible), or on ln n without antiparticles, from a Sommerfeld
 * (degenerate) or Maxwell-Boltzmann (non-degenerate) start, with a bisection safeguard on a proven bracket; the
 * second eta-derivative it needs comes from the same quadrature pass as n and dn/deta. A Halley step below 1e-6
 * max(1, eta) is accepted as the last (its own error is of third order, below ~1e-18 max(1, eta)), and n, P, U, S
 * are taken from that last iterate's integrals by a second-order step in eta (with dF_k/deta, d^2F_k/deta^2 and
 * the entropy's; neglected term below ~2e-19 relative) rather than a fresh evaluation; iterates not predicted to
 * be the last sum only F_1/2 + beta F_3/2 and its derivatives ({@link RelativisticFermiDirac#numberIntegral});
 * every integral carries {@value RelativisticFermiDirac#RELATIVE_ACCURACY} relative, and so do n, P, U and S
 * (a sum of positive integrals, plus the second-order step above; measured against the T = 0 closed
 * forms in the degenerate limit by LimitStatedAccuracyTest, and against an independent mpmath equation of
 * state by RelativisticFermiGasTest). Where pairs outnumber the net electrons a thousandfold the net charge is a
 * small difference and eta loses digits ({@link #notes()} says so); P, U and S do not.
 *
 * <p><b>Model limits.</b> Ideal gas of one species and its antiparticles only: no ions, no photons
 * (radiation pressure), no Coulomb corrections, no neutrinos, no nuclear forces (neutrons),
 * equilibrium pair creation. Not for engineering or safety use.
 */
public final class RelativisticFermiGas implements Tabular {
    private static final double NEGLIGIBLE_EXPONENT = 40.0; // skip antiparticles below e^-40 of the particles
    /** Longest accepted last Halley step, and longest Taylor step from an iterate's integrals, times max(1, eta). */
    private static final double TAYLOR_STEP = 1e-6;

    private final String particle;
    private final double mass;
    private final boolean pairs;
    private final double kelvin;
    private final double netDensity;
    private final double eta;
    private final double beta;
    private final double particles;
    private final double antiparticles;
    private final double pressure;
    private final double energy;
    private final double entropy;
    private final double fermiX;

    private RelativisticFermiGas(String particle, double mass, boolean pairs, double kelvin, double netDensity) {
        this.particle = particle;
        this.mass = mass;
        this.pairs = pairs;
        this.kelvin = kelvin;
        this.netDensity = netDensity;
        double c = Codata2018.SPEED_OF_LIGHT;
        this.beta = Codata2018.BOLTZMANN * kelvin / (mass * c * c);
        this.fermiX = ColdFermiGas.relativityParameter(netDensity, mass);
        double h = Codata2018.PLANCK;
        double mch = mass * c / h;
        double kn = 8 * Math.PI * Math.sqrt(2) * mch * mch * mch;
        double kp = mass * c * c * kn;
        Solution solved = solveEta(kn);
        this.eta = solved.eta;
        Moments minus = Moments.at(solved.minus, eta, beta);
        double b15 = Math.pow(beta, 1.5);
        double b25 = b15 * beta;
        double nMinus = kn * b15 * (minus.f05 + beta * minus.f15);
        double p = 2.0 / 3.0 * kp * b25 * (minus.f15 + 0.5 * beta * minus.f25);
        double u = kp * b25 * (minus.f15 + beta * minus.f25);
        double s = kn * b15 * (minus.s05 + beta * minus.s15);
        double nPlus = 0.0;
        double etaPlus = -eta - 2.0 / beta;
        if (pairs && etaPlus >= RelativisticFermiDirac.MIN_ETA) {
            Moments plus = Moments.at(solved.plus, etaPlus, beta);
            nPlus = kn * b15 * (plus.f05 + beta * plus.f15);
            p += 2.0 / 3.0 * kp * b25 * (plus.f15 + 0.5 * beta * plus.f25);
            u += kp * b25 * (plus.f15 + beta * plus.f25) + 2 * mass * c * c * nPlus;
            s += kn * b15 * (plus.s05 + beta * plus.s15);
        }
        this.particles = nMinus;
        this.antiparticles = nPlus;
        this.pressure = p;
        this.energy = u;
        this.entropy = Codata2018.BOLTZMANN * s;
    }

    /**
     * Electrons and positrons neutralising matter of mass density rho (kg/m^3) with mu_e nucleon
     * masses m_u per electron, at temperature T (K).
     *
     * @throws InvalidInputException for rho &lt;= 0, mu_e &lt; 1, T &lt;= 0, or T outside the range of the
     *         finite-temperature route (see {@link #MAX_TEMPERATURE}; T so low that eta &gt; 1e11: use
     *         {@link ColdFermiGas})
     */
    public static RelativisticFermiGas electrons(double massDensity, double muE, double kelvin) {
        double n = ColdFermiGas.electronDensity(massDensity, muE);
        return new RelativisticFermiGas("electron", Codata2018.ELECTRON_MASS, true, checkTemperature(kelvin, n,
                Codata2018.ELECTRON_MASS), n);
    }

    /** Neutrons (mass m_n, no antiparticles) of mass density rho = m_n n (kg/m^3) at temperature T (K). */
    public static RelativisticFermiGas neutrons(double massDensity, double kelvin) {
        Checks.positive("mass density rho (kg/m^3)", massDensity, "Densities are positive; 1 g/cm^3 = 1000 kg/m^3.");
        double n = massDensity / Codata2018.NEUTRON_MASS;
        return new RelativisticFermiGas("neutron", Codata2018.NEUTRON_MASS, false,
                checkTemperature(kelvin, n, Codata2018.NEUTRON_MASS), n);
    }

    /** Largest accepted temperature, K (beyond it muons, pions and the rest of particle physics matter). */
    public static final double MAX_TEMPERATURE = 1e12;

    private static double checkTemperature(double kelvin, double n, double mass) {
        if (!(kelvin >= 0) || Double.isNaN(kelvin)) {
            throw InvalidInputException.of("temperature T (K)", kelvin, "a finite number > 0", "Temperatures are absolute.");
        }
        if (kelvin == 0.0) {
            throw InvalidInputException.of("temperature T (K)", kelvin, "> 0 for the finite-temperature gas",
                    "Use ColdFermiGas for T = 0 (closed forms in x = p_F/(m c)).");
        }
        if (kelvin > MAX_TEMPERATURE) {
            throw InvalidInputException.of("temperature T (K)", kelvin, "<= " + MAX_TEMPERATURE,
                    "Above that the ideal electron-positron (or neutron) gas is not a model of matter: other particles appear.");
        }
        double x = ColdFermiGas.relativityParameter(n, mass);
        double c = Codata2018.SPEED_OF_LIGHT;
        double fermiOverKT = mass * c * c * x * x / (Math.sqrt(1 + x * x) + 1) / (Codata2018.BOLTZMANN * kelvin);
        if (fermiOverKT > 1e11) {
            throw InvalidInputException.of("temperature T (K)", kelvin, "above E_F/(1e11 k) = " + kelvin * fermiOverKT / 1e11
                    + " K at this density", "The gas is then at T = 0 to better than 1e-20: use ColdFermiGas.");
        }
        return kelvin;
    }

    /**
     * The integrals that P, U, S and n need at the solved eta: from the last iterate's values (evaluated with
     * entropy) by a second-order Taylor step d = eta - eta_last, |d| &lt;= {@value #TAYLOR_STEP} max(1, eta_last) (the
     * neglected d^3 F'''/6 is below ~2e-19 relative: |f'''| &lt;= f for the Fermi factor, so |F'''| &lt;= F, and
     * F'''/F ~ k^3/eta^3 for eta &gt;&gt; 1), or from a fresh evaluation when there are none or the step is longer.
     */
    private static final class Moments {
        final double f05;
        final double f15;
        final double f25;
        final double s05;
        final double s15;

        private Moments(FermiDiracValues v, double d) {
            double h = 0.5 * d * d;
            f05 = v.integral(0.5) + d * v.etaDerivative(0.5) + h * v.etaSecondDerivative(0.5);
            f15 = v.integral(1.5) + d * v.etaDerivative(1.5) + h * v.etaSecondDerivative(1.5);
            f25 = v.integral(2.5) + d * v.etaDerivative(2.5) + h * v.etaSecondDerivative(2.5);
            s05 = v.entropyIntegral(0.5) + d * v.entropyEtaDerivative(0.5) + h * v.entropyEtaSecondDerivative(0.5);
            s15 = v.entropyIntegral(1.5) + d * v.entropyEtaDerivative(1.5) + h * v.entropyEtaSecondDerivative(1.5);
        }

        static Moments at(FermiDiracValues last, double eta, double beta) {
            if (last == null || !(Math.abs(eta - last.eta()) <= TAYLOR_STEP * Math.max(1.0, last.eta()))) {
                return new Moments(RelativisticFermiDirac.evaluate(eta, beta, true), 0.0);
            }
            return new Moments(last, eta - last.eta());
        }
    }

    /** The solved eta and the last iterate's values with entropy (null when that iterate had none). */
    private static final class Solution {
        final double eta;
        final FermiDiracValues minus;
        final FermiDiracValues plus;

        Solution(double eta, FermiDiracValues minus, FermiDiracValues plus) {
            this.eta = eta;
            this.minus = minus;
            this.plus = plus;
        }
    }

    /**
     * Newton on asinh((n_- - n_+)/s) - asinh(n_net/s), s the pair scale (ln(n_- - n_+) - ln(n_net) without pairs),
     * safeguarded by bisection on a bracket.
     */
    private Solution solveEta(double kn) {
        double b15 = Math.pow(beta, 1.5);
        double xF = fermiX;
        double fermiOverKT = xF * xF / (Math.sqrt(1 + xF * xF) + 1) / beta;
        // lower end: net charge zero (eta = -1/beta) for pairs, the smallest eta for a single species
        double lo = pairs ? Math.max(-1.0 / beta, RelativisticFermiDirac.MIN_ETA) : RelativisticFermiDirac.MIN_ETA;
        double hi = Double.NaN;
        double e;
        if (fermiOverKT > 2) {
            // Sommerfeld: mu = E_F - (pi^2/6) (kT)^2 d ln g/dE at E_F, g ~ p E (relativistic density of states)
            double y = Math.sqrt(1 + xF * xF);
            e = fermiOverKT - Math.PI * Math.PI / 6 * beta * (y / (xF * xF) + 1 / y);
        } else {
            // non-relativistic inversion of F_1/2 bridging the Maxwell-Boltzmann and degenerate limits (N. G. Nilsson,
            // Phys. Status Solidi A 19, K75 (1973), from memory; only a start: Newton makes it exact), with u = n / (K_n beta^3/2
            // Gamma(3/2) (1 + 15 beta/8)), the last factor the first relativistic correction of int x^1/2 (1 + 5 beta x/4) e^-x dx
            double u = netDensity / (kn * b15 * (Math.sqrt(Math.PI) / 2) * (1 + 15 * beta / 8));
            double nu = Math.pow(0.75 * Math.sqrt(Math.PI) * u, 2.0 / 3.0);
            double bridge = 0.24 + 1.08 * nu;
            e = u < 0.999 || u > 1.001 ? Math.log(u) / (1 - u * u) + nu - nu / (bridge * bridge) : -0.5 + nu - nu / (bridge * bridge); // ln u/(1 - u^2) -> -1/2 at u = 1
        }
        e = Math.max(e, lo + 1e-3 * Math.max(1, Math.abs(lo)));
        double target = netDensity / (kn * b15); // F_1/2 + beta F_3/2 of the net particles
        double scale = 0.0; // 2 sqrt(n_- n_+) (reduced) at the first point with pairs: the pair scale of the asinh map
        double lastStep = Double.POSITIVE_INFINITY;
        double stepBefore = Double.POSITIVE_INFINITY;
        for (int iteration = 0; iteration < 200; iteration++) {
            // the entropy integrals where this iterate is likely the last: always in the Sommerfeld range (there they cost a
            // few series terms), else when cubic convergence, d_next ~ C d^3 with C = d / d_before^3 (1 before two steps),
            // predicts a step within the acceptance. A wrong guess costs one evaluation (or the entropy part of one), never
            // accuracy
            double predicted = lastStep * lastStep * lastStep
                    * (Double.isInfinite(stepBefore) ? 1.0 : lastStep / (stepBefore * stepBefore * stepBefore));
            boolean likelyLast = e >= RelativisticFermiDirac.SOMMERFELD_FROM
                    || predicted <= 0.1 * TAYLOR_STEP * Math.max(1.0, e);
            // other iterates need only N = F_1/2 + beta F_3/2 and its first two eta-derivatives (the lighter sum)
            FermiDiracValues m = likelyLast ? RelativisticFermiDirac.evaluate(e, beta, true) : null;
            FermiDiracValues pv = null;
            double[] nm = m == null ? RelativisticFermiDirac.numberIntegral(e, beta) : number(m);
            double n = nm[0];
            double dn = nm[1];
            double d2n = nm[2];
            double ep = -e - 2.0 / beta;
            if (pairs && ep >= Math.min(e, 0.0) - NEGLIGIBLE_EXPONENT && ep >= RelativisticFermiDirac.MIN_ETA) {
                pv = likelyLast ? RelativisticFermiDirac.evaluate(ep, beta, true) : null;
                double[] np = pv == null ? RelativisticFermiDirac.numberIntegral(ep, beta) : number(pv);
                if (scale == 0.0) {
                    scale = 2.0 * Math.sqrt(n * np[0]);
                }
                n -= np[0];
                dn += np[1]; // d eta_+ / d eta = -1
                d2n -= np[2];
            }
            // g = asinh(N / scale) - asinh(N_target / scale): linear in eta for non-degenerate pairs (N = scale sinh(eta +
            // 1/beta)), ln N + const for degenerate particles, defined for N <= 0; plain ln N - ln N_target without pairs
            double g;
            double slope;
            double curvature;
            if (scale > 0.0) {
                double z = n / scale;
                double inverseRoot = 1.0 / Math.sqrt(1.0 + z * z);
                g = FastMath.asinh(z) - FastMath.asinh(target / scale);
                slope = dn / scale * inverseRoot;
                curvature = (d2n / scale - z * slope * slope) * inverseRoot;
            } else {
                g = n > 0 ? Math.log(n / target) : Double.NEGATIVE_INFINITY;
                slope = dn / n;
                curvature = d2n / n - slope * slope;
            }
            if (g == 0.0) {
                return solution(e, m, pv, likelyLast);
            }
            if (g < 0) {
                lo = e;
            } else {
                hi = e;
            }
            // Halley's step (E. Halley, Phil. Trans. 18, 136 (1694); cubic convergence, error ~ C d^3 with C built from
            // the second and third derivatives of g over its first, of size 1/max(1, eta)^2); Newton's where the Halley
            // correction is large (far from the root)
            double newton = -g / slope;
            double denominator = 1.0 + 0.5 * newton * curvature / slope;
            boolean halley = denominator >= 0.5 && denominator <= 2.0;
            double next = Double.isInfinite(g) ? Double.NaN : e + (halley ? newton / denominator : newton);
            // a Halley step below 1e-6 max(1, eta) leaves an error below ~1e-18 max(1, eta); a Newton step would leave
            // ~d^2 g''/g', so it is accepted only below 1e-8 max(1, eta) (error ~1e-16 relative). Checked before the
            // bracket test: at the root a step of rounding size may land on the bracket end itself
            double accept = (halley ? TAYLOR_STEP : 1e-8) * Math.max(1.0, e);
            if (Math.abs(next - e) <= accept) {
                return solution(next, m, pv, likelyLast);
            }
            double upper = Double.isNaN(hi) ? Double.POSITIVE_INFINITY : hi;
            if (!(next > lo && next < upper)) {
                next = Double.isNaN(hi) ? Math.max(2 * Math.abs(e), e + 10) : 0.5 * (lo + hi);
            }
            stepBefore = lastStep;
            lastStep = Math.abs(next - e);
            e = next;
        }
        throw new IllegalStateException("no convergence of the chemical potential for n = " + netDensity + " m^-3 at T = "
                + kelvin + " K (bracket " + lo + ", " + hi + ")");
    }

    /** {N, dN/deta, d^2N/deta^2} with N = F_1/2 + beta F_3/2, from full values. */
    private double[] number(FermiDiracValues v) {
        return new double[] {v.integral(0.5) + beta * v.integral(1.5), v.etaDerivative(0.5) + beta * v.etaDerivative(1.5),
            v.etaSecondDerivative(0.5) + beta * v.etaSecondDerivative(1.5)};
    }

    /**
     * A solution at eta; the iterate's values are kept only when they carry the entropy integrals ({@link Moments#at}
     * evaluates afresh where the Taylor step from them would be too long, e.g. for the non-degenerate positrons, whose
     * step is the electrons' one while their |eta_+| may be large, and for positrons skipped in the loop).
     */
    private static Solution solution(double eta, FermiDiracValues minus, FermiDiracValues plus, boolean withEntropy) {
        return withEntropy ? new Solution(eta, minus, plus) : new Solution(eta, null, null);
    }

    /** The degeneracy parameter eta = (mu - m c^2)/kT (kinetic chemical potential over kT) of the particles. */
    public double degeneracyParameter() {
        return eta;
    }

    /** beta = kT / (m c^2). */
    public double beta() {
        return beta;
    }

    /** Temperature in K. */
    public double temperature() {
        return kelvin;
    }

    /** The T = 0 relativity parameter of the net density, x_F = p_F/(m c). */
    public double fermiRelativityParameter() {
        return fermiX;
    }

    /** Net number density n_- - n_+ (m^-3), the input density. */
    public double netDensity() {
        return netDensity;
    }

    /** Number density of the particles (electrons or neutrons), m^-3. */
    public double particleDensity() {
        return particles;
    }

    /**
     * Number density of the antiparticles (positrons), m^-3; 0 for neutrons and where e^eta_+ is
     * below 1e-304 (then the true density is below 1e-304 of the thermal scale, not a failed sum).
     */
    public double antiparticleDensity() {
        return antiparticles;
    }

    /** Pressure in Pa. */
    public double pressure() {
        return pressure;
    }

    /** Internal energy density in J/m^3: kinetic energy of all particles plus the rest energy of the pairs. */
    public double energyDensity() {
        return energy;
    }

    /** Entropy density in J/(K m^3). */
    public double entropyDensity() {
        return entropy;
    }

    /**
     * The regime in words, with the numbers that decide it: degenerate (eta &gt; 10, where the
     * second-order Sommerfeld expansion errs by about (pi/eta)^4), non-degenerate (eta &lt; -3, where
     * Maxwell-Boltzmann errs by about e^eta) or neither; non-relativistic when max(x_F^2, beta) &lt; 0.01
     * (corrections of about that relative size), ultra-relativistic when min(x_F, 1/beta) would
     * let the energy exceed 10 m c^2, else relativistic.
     */
    public String regime() {
        StringBuilder sb = new StringBuilder();
        if (eta > 10) {
            sb.append(String.format("degenerate: Sommerfeld expansion to (kT/E_F)^2 good to ~%.1e", Math.pow(Math.PI / eta, 4)));
        } else if (eta < -3) {
            sb.append(String.format("non-degenerate: Maxwell-Boltzmann good to ~%.1e", Math.exp(eta)));
        } else {
            sb.append("partially degenerate: neither limit holds");
        }
        double rel = Math.max(fermiX * fermiX, beta);
        if (rel < 0.01) {
            sb.append(String.format("; non-relativistic (corrections ~%.1e)", rel));
        } else if (Math.max(fermiX, beta) > 10) {
            sb.append("; ultra-relativistic");
        } else {
            sb.append("; relativistic: neither the non-relativistic nor the ultra-relativistic limit holds");
        }
        if (pairs && antiparticles > 1e-6 * particles) {
            sb.append(String.format("; pairs: n_+/n_- = %.3g", antiparticles / particles));
        }
        return sb.toString();
    }

    /** Cautions that apply to these numbers. */
    public List<String> notes() {
        String model = "ideal " + particle + " gas" + (pairs ? " with equilibrium pairs" : "")
                + ": no ions, photons, Coulomb corrections or neutrinos; not for engineering or safety use";
        if (pairs && antiparticles > 1e3 * netDensity) {
            return List.of(model, String.format("pairs outnumber the net particles %.2g-fold: eta carries about %.0e relative error",
                    antiparticles / netDensity, 1e-12 * antiparticles / netDensity));
        }
        return List.of(model);
    }

    @Override
    public List<String> columnNames() {
        return List.of("quantity", "value", "unit", "note");
    }

    @Override
    public List<List<Object>> rows() {
        String note = String.join("; ", notes());
        return List.of(
                List.of("T", kelvin, "K", ""),
                List.of("net " + particle + " density", netDensity, "m^-3", ""),
                List.of("degeneracy parameter eta", eta, "", regime()),
                List.of("beta = kT/(m c^2)", beta, "", ""),
                List.of("x_F = p_F/(m c)", fermiX, "", "of the net density at T = 0"),
                List.of(particle + " density", particles, "m^-3", ""),
                List.of("antiparticle density", antiparticles, "m^-3", pairs ? "" : "none for this species"),
                List.of("pressure P", pressure, "Pa", note),
                List.of("energy density U/V", energy, "J/m^3", "kinetic + pair rest energy"),
                List.of("entropy density S/V", entropy, "J/(K m^3)", ""));
    }
}
