package org.microtally.structure;

import java.util.ArrayList;
import java.util.List;
import org.microtally.InvalidInputException;
import org.microtally.limit.ColdFermiGas;
import org.microtally.units.Codata2018;

/**
 * A white dwarf in Newtonian hydrostatic equilibrium on the exact T = 0 ideal electron equation of
 * state ({@link ColdFermiGas}), mass per electron mu_e m_u (the atomic mass constant m_u, not the
 * hydrogen mass).
 *
 * <p><b>Equations.</b> With y = sqrt(1 + x^2) = (E_F + m_e c^2)/(m_e c^2), hydrostatic equilibrium
 * dP/dr = -G m rho / r^2 and the T = 0 relation dP = n_e d(m_e c^2 y) give
 * dy/ds = -q / s^2, dq/ds = s^2 (y^2 - 1)^(3/2), with r = L s, m = M_u q (integrated in w = y - 1),
 * rho0 = mu_e m_u / (3 pi^2 lambda_e^3), L^2 = m_e c^2 / (4 pi G rho0 mu_e m_u), M_u = 4 pi L^3 rho0
 * (S. Chandrasekhar, MNRAS 95, 207 (1935); An Introduction to the Study of Stellar Structure (1939),
 * ch. XI). The surface is where the Fermi energy reaches the rest energy, y = 1, found as a root.
 * The Chandrasekhar mass is the limit of M as rho_c -&gt; inf,
 * M_Ch = (sqrt(3 pi)/2) omega_3 (hbar c / G)^(3/2) / (mu_e m_u)^2 (omega_3 = 2.01824 from
 * {@link LaneEmden}), about 5.83 / mu_e^2 solar masses with CODATA 2018 constants and IAU 2015 M_sun.
 *
 * <p><b>Method and accuracy.</b> Power series to s = 1e-4 of the central scale, then the adaptive
 * Dormand-Prince 8(5,3) pair at tolerance 1e-12 ({@link SurfaceIntegration}); mass and radius within
 * {@value #RELATIVE_ACCURACY} relative (a bound, tested by step refinement).
 *
 * <p><b>Model limits.</b> Ideal, cold, non-rotating, non-magnetic, Newtonian gravity; no Coulomb
 * (lattice) corrections, no inverse beta decay (neutronisation, which sets in near 1e10-1e11 g/cm^3
 * for carbon and oxygen), no general-relativistic instability. Real white dwarfs have smaller radii
 * and a maximum mass somewhat below M_Ch. Results are a research baseline, not for engineering or
 * safety use.
 */
public final class WhiteDwarf extends CompactStar {
    /** Stated relative accuracy of mass and radius (a bound; WhiteDwarfTest checks it by step refinement). */
    public static final double RELATIVE_ACCURACY = 1e-9;
    /** Central densities accepted, kg/m^3 (1e3 to 1e11 g/cm^3). */
    public static final double MIN_CENTRAL_DENSITY = 1e6;
    /** Largest accepted central density, kg/m^3 (1e11 g/cm^3). */
    public static final double MAX_CENTRAL_DENSITY = 1e14;
    static final double TOLERANCE = 1e-12;

    private final double muE;

    private WhiteDwarf(double muE, double centralDensity, double centralX, double mass, double radius) {
        super(centralDensity, centralX, mass, radius);
        this.muE = muE;
    }

    /**
     * The model of central mass density rho_c (kg/m^3).
     *
     * @throws InvalidInputException for mu_e &lt; 1, or rho_c outside [1e6, 1e14] kg/m^3, where the
     *         ideal cold electron gas is not a model of white-dwarf matter
     */
    public static WhiteDwarf ofCentralDensity(double centralDensity, double muE) {
        ColdFermiGas gas = ColdFermiGas.electrons(centralDensity, muE); // validates rho > 0 and mu_e
        if (centralDensity < MIN_CENTRAL_DENSITY || centralDensity > MAX_CENTRAL_DENSITY) {
            throw InvalidInputException.of("white-dwarf central density rho_c (kg/m^3)", centralDensity,
                    "in [1e6, 1e14] kg/m^3 (1e3 to 1e11 g/cm^3)", centralDensity < MIN_CENTRAL_DENSITY
                            ? "Below that the ideal degenerate-electron model fails (Coulomb energy and incomplete ionisation dominate)."
                            : "Above that inverse beta decay (neutronisation) and general relativity change the star: the ideal model is out of its range.");
        }
        return solve(gas.relativityParameter(), muE, centralDensity, TOLERANCE);
    }

    /** The model of central relativity parameter x_c (any x_c &gt; 0, beyond the physical range; for limit checks). */
    static WhiteDwarf ofCentralRelativityParameter(double xc, double muE, double tolerance) {
        double rho = xc * xc * xc * referenceDensity(muE);
        return solve(xc, muE, rho, tolerance);
    }

    private static WhiteDwarf solve(double xc, double muE, double rho, double tolerance) {
        // state: w = y - 1 (Fermi kinetic energy over m_e c^2, so that it keeps its relative accuracy when small), q
        double wc = xc * xc / (Math.sqrt(1 + xc * xc) + 1);
        double fc = xc * xc * xc;
        double slope = 3 * (1 + wc) * xc; // d/dy (y^2 - 1)^(3/2) at the centre
        double scale = Math.sqrt(6 * wc / fc);
        double s0 = 1e-4 * scale;
        double s2 = s0 * s0;
        double[] start = {wc - fc * s2 / 6 + fc * slope * s2 * s2 / 120, fc * s2 * s0 / 3 - fc * slope * s2 * s2 * s0 / 30};
        SurfaceIntegration.Rhs system = (s, y, dy) -> {
            double x2 = Math.max(y[0] * (y[0] + 2), 0.0);
            dy[0] = -y[1] / (s * s);
            dy[1] = s * s * x2 * Math.sqrt(x2);
        };
        double[] magnitudes = {wc, fc * scale * scale * scale / 3};
        SurfaceIntegration.Surface surface = SurfaceIntegration.toSurface(system, s0, start, 0, 0.0, 100 * scale, tolerance,
                magnitudes);
        double length = lengthUnit(muE);
        return new WhiteDwarf(muE, rho, xc, massUnit(muE) * surface.state()[1], length * surface.radius());
    }

    /** rho0 = mu_e m_u / (3 pi^2 lambda_e^3), the density at x = 1 (kg/m^3). */
    static double referenceDensity(double muE) {
        double lambda = Codata2018.HBAR / (Codata2018.ELECTRON_MASS * Codata2018.SPEED_OF_LIGHT);
        return muE * Codata2018.ATOMIC_MASS_UNIT / (3 * Math.PI * Math.PI * lambda * lambda * lambda);
    }

    static double lengthUnit(double muE) {
        double c = Codata2018.SPEED_OF_LIGHT;
        return Math.sqrt(Codata2018.ELECTRON_MASS * c * c
                / (4 * Math.PI * Codata2018.GRAVITATION * referenceDensity(muE) * muE * Codata2018.ATOMIC_MASS_UNIT));
    }

    static double massUnit(double muE) {
        double l = lengthUnit(muE);
        return 4 * Math.PI * l * l * l * referenceDensity(muE);
    }

    /**
     * The Chandrasekhar mass (sqrt(3 pi)/2) omega_3 (hbar c / G)^(3/2) / (mu_e m_u)^2 in kg, omega_3
     * from {@link LaneEmden#solve(double)} (1e-10 relative); constants CODATA 2018.
     */
    public static double chandrasekharMass(double muE) {
        ColdFermiGas.electrons(1.0, muE); // validates mu_e
        return chandrasekharMassOf(muE);
    }

    /** Models at {@code count} central densities spaced evenly in log rho_c over [rhoMin, rhoMax] (kg/m^3). */
    public static MassRadiusCurve massRadiusCurve(double muE, double rhoMin, double rhoMax, int count) {
        if (count < 2) {
            throw InvalidInputException.of("number of models", count, "an integer >= 2", "");
        }
        if (!(rhoMax > rhoMin)) {
            throw InvalidInputException.of("largest central density (kg/m^3)", rhoMax, "> the smallest, " + rhoMin, "");
        }
        List<WhiteDwarf> models = new ArrayList<>(count);
        double a = Math.log(rhoMin);
        double b = Math.log(rhoMax);
        for (int i = 0; i < count; i++) {
            double rho = i == count - 1 ? rhoMax : Math.exp(a + (b - a) * i / (count - 1));
            models.add(ofCentralDensity(rho, muE));
        }
        return new MassRadiusCurve(models);
    }

    /** mu_e, nucleon masses (m_u) per electron. */
    public double muE() {
        return muE;
    }







    @Override
    public List<String> columnNames() {
        return MassRadiusCurve.COLUMNS;
    }

    @Override
    public List<List<Object>> rows() {
        return List.of(row());
    }

    List<Object> row() {
        return List.of(muE, centralDensity() / 1e3, centralRelativityParameter(), solarMasses(), radiusKm(), mass() / chandrasekharMassOf(muE));
    }

    /** omega_3, solved once on first use. */
    private static final class Omega3 {
        static final double VALUE = LaneEmden.solve(3.0).massConstant();
    }

    private static double chandrasekharMassOf(double muE) {
        double hcg = Codata2018.HBAR * Codata2018.SPEED_OF_LIGHT / Codata2018.GRAVITATION;
        double mu = muE * Codata2018.ATOMIC_MASS_UNIT;
        return Math.sqrt(3 * Math.PI) / 2 * Omega3.VALUE * Math.pow(hcg, 1.5) / (mu * mu);
    }
}
