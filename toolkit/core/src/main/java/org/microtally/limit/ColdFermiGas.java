package org.microtally.limit;

import java.util.List;
import org.microtally.InvalidInputException;
import org.microtally.Tabular;
import org.microtally.units.Codata2018;

/**
 * The ideal relativistic Fermi gas at T = 0 (spin 1/2, two states per momentum), in closed form in
 * the relativity parameter x = p_F / (m c): number density n = x^3 / (3 pi^2 lambda^3) with
 * lambda = hbar / (m c), and with A = m^4 c^5 / (24 pi^2 hbar^3)
 * <ul>
 *   <li>pressure P = A [x (2x^2 - 3) sqrt(1 + x^2) + 3 asinh x] (S. Chandrasekhar, MNRAS 95, 207
 *       (1935); An Introduction to the Study of Stellar Structure (1939), ch. X, eq. 20);</li>
 *   <li>kinetic energy density u = A [8 x^3 (sqrt(1 + x^2) - 1)] - P (so that u + P = n E_F, the T = 0
 *       Gibbs-Duhem relation), and the energy density with rest mass eps = u + n m c^2;</li>
 *   <li>Fermi kinetic energy E_F = m c^2 (sqrt(1 + x^2) - 1).</li>
 * </ul>
 * Limits: P -&gt; (8/5) A x^5 (non-relativistic, n = 3/2 polytrope) for x &lt;&lt; 1 and 2 A x^4
 * (ultra-relativistic, n = 3) for x &gt;&gt; 1.
 *
 * <p><b>Accuracy.</b> For x &lt; 0.5 the closed forms cancel (P ~ x^5 from terms ~ x), so P and u are
 * summed from their binomial series, int_0^x s^4 / sqrt(1 + s^2) ds and
 * int_0^x s^2 (sqrt(1 + s^2) - 1) ds term by term; a few ulp everywhere.
 *
 * <p><b>Model limits.</b> Ideal gas: no Coulomb (lattice) corrections, no inverse beta decay
 * (neutronisation), no interactions between neutrons; T = 0. Not for engineering or safety use.
 */
public final class ColdFermiGas implements Tabular {
    private final String particle;
    private final double mass;
    private final double x;

    private ColdFermiGas(String particle, double mass, double x) {
        this.particle = particle;
        this.mass = mass;
        this.x = x;
    }

    /** Electrons at T = 0 neutralising matter of mass density rho (kg/m^3) with mu_e nucleons (m_u) per electron. */
    public static ColdFermiGas electrons(double massDensity, double muE) {
        double n = electronDensity(massDensity, muE);
        return new ColdFermiGas("electron", Codata2018.ELECTRON_MASS, relativityParameter(n, Codata2018.ELECTRON_MASS));
    }

    /** Neutrons (mass m_n) at T = 0 of mass density rho = m_n n (kg/m^3). */
    public static ColdFermiGas neutrons(double massDensity) {
        Checks.positive("mass density rho (kg/m^3)", massDensity, "Densities are positive; 1 g/cm^3 = 1000 kg/m^3.");
        double n = massDensity / Codata2018.NEUTRON_MASS;
        return new ColdFermiGas("neutron", Codata2018.NEUTRON_MASS, relativityParameter(n, Codata2018.NEUTRON_MASS));
    }

    /** The gas of particles of mass m (kg) at relativity parameter x = p_F/(m c) &gt; 0. */
    public static ColdFermiGas ofRelativityParameter(double x, double massKg) {
        Checks.positive("relativity parameter x = p_F/(m c)", x, "");
        Checks.positive("particle mass m (kg)", massKg, "");
        return new ColdFermiGas("fermion", massKg, x);
    }

    /** n_e = rho / (mu_e m_u), validating rho &gt; 0 and mu_e &gt;= 1. */
    static double electronDensity(double massDensity, double muE) {
        Checks.positive("mass density rho (kg/m^3)", massDensity, "Densities are positive; 1 g/cm^3 = 1000 kg/m^3.");
        if (!(muE >= 1.0) || !Double.isFinite(muE)) {
            throw InvalidInputException.of("mean molecular weight per electron mu_e", muE, "a finite number >= 1",
                    "mu_e = 2 for helium, carbon or oxygen, about 2.15 for iron, 1 for hydrogen.");
        }
        return massDensity / (muE * Codata2018.ATOMIC_MASS_UNIT);
    }

    static double relativityParameter(double n, double mass) {
        double lambda = Codata2018.HBAR / (mass * Codata2018.SPEED_OF_LIGHT);
        return Math.cbrt(3 * Math.PI * Math.PI * n) * lambda;
    }

    /** A = m^4 c^5 / (24 pi^2 hbar^3) in J/m^3. */
    static double pressureScale(double mass) {
        double c = Codata2018.SPEED_OF_LIGHT;
        double h = Codata2018.HBAR;
        return mass * mass * mass * mass * c * c * c * c * c / (24 * Math.PI * Math.PI * h * h * h);
    }

    /** P / A = x (2x^2 - 3) sqrt(1 + x^2) + 3 asinh x = 8 int_0^x s^4/sqrt(1+s^2) ds, without cancellation. */
    public static double reducedPressure(double x) {
        if (x < 0.5) {
            // 8 sum_j C(-1/2, j) x^(5+2j) / (5+2j)
            double x2 = x * x;
            return 8.0 * binomialSeries(-0.5, 5, 0, x2) * x2 * x2 * x;
        }
        return x * (2 * x * x - 3) * Math.sqrt(1 + x * x) + 3 * org.apache.commons.math3.util.FastMath.asinh(x);
    }

    /** u / A = 8 x^3 (sqrt(1 + x^2) - 1) - P/A = 24 int_0^x s^2 (sqrt(1+s^2) - 1) ds, without cancellation. */
    public static double reducedKineticEnergy(double x) {
        if (x < 0.5) {
            // 24 sum_{j>=1} C(1/2, j) x^(3+2j) / (3+2j)
            double x2 = x * x;
            return 24.0 * binomialSeries(0.5, 3, 1, x2) * x2 * x;
        }
        double x3 = x * x * x;
        return 8 * x3 * x * x / (Math.sqrt(1 + x * x) + 1) - reducedPressure(x);
    }

    /**
     * S = sum_{j &gt;= first} C(a, j) y^j / (b + 2j), first = 0 or 1, y = x^2: x^b S is
     * int_0^x s^(b-1) ((1 + s^2)^a - first) ds, the binomial series integrated term by term. For
     * |a| = 1/2 and x &lt; 0.5 (y &lt; 1/4) each term is below a quarter of the one before; summed until
     * a term is below 1e-18 of the sum (at most 60 terms), so S is good to rounding.
     */
    private static double binomialSeries(double a, int b, int first, double y) {
        double term = first == 0 ? 1.0 : a * y; // C(a, first) y^first
        double sum = 0.0;
        for (int j = first; j < 60; j++) {
            double add = term / (b + 2 * j);
            sum += add;
            if (Math.abs(add) < 1e-18 * Math.abs(sum)) {
                break;
            }
            term *= (a - j) / (j + 1) * y;
        }
        return sum;
    }

    /** The relativity parameter x = p_F / (m c). */
    public double relativityParameter() {
        return x;
    }

    /** Number density n = x^3 / (3 pi^2 lambda^3) in m^-3. */
    public double numberDensity() {
        double lambda = Codata2018.HBAR / (mass * Codata2018.SPEED_OF_LIGHT);
        return x * x * x / (3 * Math.PI * Math.PI * lambda * lambda * lambda);
    }

    /** Pressure in Pa. */
    public double pressure() {
        return pressureScale(mass) * reducedPressure(x);
    }

    /** Kinetic energy density (rest mass excluded) in J/m^3. */
    public double kineticEnergyDensity() {
        return pressureScale(mass) * reducedKineticEnergy(x);
    }

    /** Fermi kinetic energy E_F = m c^2 (sqrt(1 + x^2) - 1) = m c^2 x^2 / (sqrt(1 + x^2) + 1) in J. */
    public double fermiKineticEnergy() {
        double c = Codata2018.SPEED_OF_LIGHT;
        return mass * c * c * x * x / (Math.sqrt(1 + x * x) + 1);
    }

    @Override
    public List<String> columnNames() {
        return List.of("quantity", "value", "unit", "note");
    }

    @Override
    public List<List<Object>> rows() {
        String model = "ideal " + particle + " gas at T = 0: no Coulomb corrections, no neutronisation";
        return List.of(
                List.of("x = p_F/(m c)", x, "", particle),
                List.of("number density n", numberDensity(), "m^-3", ""),
                List.of("pressure P", pressure(), "Pa", model),
                List.of("kinetic energy density u", kineticEnergyDensity(), "J/m^3", model),
                List.of("Fermi kinetic energy E_F", fermiKineticEnergy(), "J", ""));
    }
}
