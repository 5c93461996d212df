package org.microtally.structure;

import java.util.List;
import org.apache.commons.math3.optim.MaxEval;
import org.apache.commons.math3.optim.nonlinear.scalar.GoalType;
import org.apache.commons.math3.optim.univariate.BrentOptimizer;
import org.apache.commons.math3.optim.univariate.SearchInterval;
import org.apache.commons.math3.optim.univariate.UnivariateObjectiveFunction;
import org.apache.commons.math3.optim.univariate.UnivariatePointValuePair;
import org.microtally.InvalidInputException;
import org.microtally.limit.ColdFermiGas;
import org.microtally.units.Codata2018;

/**
 * A neutron star of the ideal cold neutron gas in general relativity: the Tolman-Oppenheimer-Volkoff
 * equation dP/dr = -G (eps + P)(m + 4 pi r^3 P / c^2) / (c^2 r^2 (1 - 2 G m / (r c^2))),
 * dm/dr = 4 pi r^2 eps / c^2, eps the energy density with rest mass (J. R. Oppenheimer and G. M.
 * Volkoff, Phys. Rev. 55, 374 (1939); R. C. Tolman, Phys. Rev. 55, 364 (1939)), with the T = 0 ideal
 * neutron-gas equation of state of {@link ColdFermiGas} (neutron mass m_n).
 *
 * <p><b>Method.</b> At T = 0, dP = n d mu and eps + P = n mu with mu = m_n c^2 y, y = sqrt(1 + x^2), so
 * d ln y / ds = -(q + s^3 P/A) / (s^2 (1 - 2 q / s)) and dq/ds = s^2 eps/A, with
 * A = m_n^4 c^5 / (24 pi^2 hbar^3), r = L s, L = c^2 / sqrt(4 pi A G), m = (c^2 L / G) q. Power series
 * near the centre, then the adaptive Dormand-Prince 8(5,3) pair at tolerance 1e-12; the surface is
 * the root of ln y = 0 (chemical potential equal to the rest energy). The maximum mass is located by
 * Brent's minimiser over ln rho_c (relative tolerance 1e-8 in rho_c). Mass and radius within
 * {@value #RELATIVE_ACCURACY} relative (a bound, tested by step refinement); locating the maximum
 * mass adds only about 1e-12 relative to that (the mass is stationary in rho_c there).
 *
 * <p><b>Model limits.</b> A toy: pure neutrons without protons, electrons or nuclear forces,
 * non-rotating, cold. Its maximum mass (about 0.71 M_sun) is far below that of observed neutron stars;
 * the models beyond the maximum-mass density are unstable. Not for engineering or safety use.
 */
public final class NeutronStar extends CompactStar {
    /** Stated relative accuracy of mass and radius (a bound; NeutronStarTest checks it by step refinement). */
    public static final double RELATIVE_ACCURACY = 1e-9;
    /** Smallest accepted central density, kg/m^3 (1e14 g/cm^3). */
    public static final double MIN_CENTRAL_DENSITY = 1e17;
    /** Largest accepted central density, kg/m^3 (1e18 g/cm^3). */
    public static final double MAX_CENTRAL_DENSITY = 1e21;
    static final double TOLERANCE = 1e-12;

    private NeutronStar(double centralDensity, double centralX, double mass, double radius) {
        super(centralDensity, centralX, mass, radius);
    }

    /**
     * The model of central rest-mass density rho_c = m_n n_c (kg/m^3).
     *
     * @throws InvalidInputException for rho_c outside [1e17, 1e21] kg/m^3
     */
    public static NeutronStar ofCentralDensity(double centralDensity) {
        ColdFermiGas gas = ColdFermiGas.neutrons(centralDensity);
        if (centralDensity < MIN_CENTRAL_DENSITY || centralDensity > MAX_CENTRAL_DENSITY) {
            throw InvalidInputException.of("neutron-star central density rho_c (kg/m^3)", centralDensity,
                    "in [1e17, 1e21] kg/m^3 (1e14 to 1e18 g/cm^3)", centralDensity < MIN_CENTRAL_DENSITY
                            ? "Below nuclear density the matter is nuclei and electrons, not a neutron gas."
                            : "Far above the maximum-mass density the ideal-gas toy has no meaning.");
        }
        return solve(gas.relativityParameter(), centralDensity, TOLERANCE);
    }

    /** The maximum-mass model of the ideal neutron gas. */
    public static NeutronStar maximumMass() {
        BrentOptimizer brent = new BrentOptimizer(1e-8, 1e-12);
        UnivariatePointValuePair best = brent.optimize(new MaxEval(200), GoalType.MAXIMIZE,
                new SearchInterval(Math.log(1e18), Math.log(2e20)),
                new UnivariateObjectiveFunction(lnRho -> ofCentralDensity(Math.exp(lnRho)).mass()));
        return ofCentralDensity(Math.exp(best.getPoint()));
    }

    static NeutronStar solve(double xc, double rho, double tolerance) {
        double yc = Math.sqrt(1 + xc * xc);
        double pc = ColdFermiGas.reducedPressure(xc);
        double ec = ColdFermiGas.reducedKineticEnergy(xc) + 8 * xc * xc * xc;
        double curvature = ec / 3 + pc; // d ln y/ds = -curvature s near the centre
        double lnyc = Math.log1p(xc * xc / (yc + 1));
        double scale = Math.sqrt(lnyc / curvature);
        double s0 = 1e-5 * scale;
        double[] start = {lnyc - 0.5 * curvature * s0 * s0, ec * s0 * s0 * s0 / 3};
        SurfaceIntegration.Rhs system = (s, y, dy) -> {
            double x = Math.sqrt(Math.max(Math.expm1(2 * y[0]), 0.0));
            double p = ColdFermiGas.reducedPressure(x);
            double e = ColdFermiGas.reducedKineticEnergy(x) + 8 * x * x * x;
            dy[0] = -(y[1] + s * s * s * p) / (s * s * (1 - 2 * y[1] / s));
            dy[1] = s * s * e;
        };
        SurfaceIntegration.Surface surface = SurfaceIntegration.toSurface(system, s0, start, 0, 0.0, 100 * scale, tolerance,
                new double[] {lnyc, ec * scale * scale * scale / 3});
        double c = Codata2018.SPEED_OF_LIGHT;
        double length = c * c / Math.sqrt(4 * Math.PI * pressureScale() * Codata2018.GRAVITATION);
        return new NeutronStar(rho, xc, c * c * length / Codata2018.GRAVITATION * surface.state()[1], length * surface.radius());
    }

    private static double pressureScale() {
        return ColdFermiGas.ofRelativityParameter(1.0, Codata2018.NEUTRON_MASS).pressure()
                / ColdFermiGas.reducedPressure(1.0);
    }






    @Override
    public List<String> columnNames() {
        return List.of("rho_c (g/cm^3)", "x_c", "M (M_sun)", "R (km)", "model");
    }

    @Override
    public List<List<Object>> rows() {
        return List.of(List.of(centralDensity() / 1e3, centralRelativityParameter(), solarMasses(), radiusKm(),
                "ideal cold neutron gas, TOV; a toy: no nuclear forces, no protons"));
    }
}
