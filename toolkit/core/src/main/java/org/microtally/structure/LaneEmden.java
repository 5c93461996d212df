package org.microtally.structure;

import java.util.List;
import org.microtally.InvalidInputException;
import org.microtally.Tabular;

/**
 * A polytrope P = K rho^(1 + 1/n): the Lane-Emden equation
 * (1/xi^2) d/dxi (xi^2 dtheta/dxi) = -theta^n, theta(0) = 1, theta'(0) = 0, with rho = rho_c theta^n,
 * r = a xi, a^2 = (n + 1) K rho_c^(1/n - 1) / (4 pi G). Its first zero xi_1 gives the radius
 * R = a xi_1, and omega_n = -xi_1^2 theta'(xi_1) the mass M = 4 pi a^3 rho_c omega_n.
 *
 * <p><b>Method.</b> The power series theta = 1 - xi^2/6 + n xi^4/120 - n(8n - 5) xi^6/15120 (S.
 * Chandrasekhar, An Introduction to the Study of Stellar Structure (1939), ch. IV) to xi = 1e-3, then
 * the adaptive Dormand-Prince 8(5,3) pair at relative and absolute tolerance 1e-13, the surface
 * theta = 0 found as a root (theta^n is taken as max(theta, 0)^n so that no step overshooting the
 * surface sees a negative base).
 *
 * <p><b>Accuracy.</b> xi_1 and omega_n within {@value #RELATIVE_ACCURACY} relative for
 * 0 &lt;= n &lt;= 4.5 (a bound, tested against the closed forms for n = 0 and 1, and by step refinement). n &gt;= 5 has no finite radius
 * and is refused.
 */
public final class LaneEmden implements Tabular {
    /** Stated relative accuracy of xi_1 and omega_n (a bound; LaneEmdenTest checks it). */
    public static final double RELATIVE_ACCURACY = 1e-10;
    private static final double START = 1e-3;
    static final double TOLERANCE = 1e-13;

    private final double index;
    private final double firstZero;
    private final double massConstant;

    private LaneEmden(double index, double firstZero, double massConstant) {
        this.index = index;
        this.firstZero = firstZero;
        this.massConstant = massConstant;
    }

    /**
     * Solves the Lane-Emden equation of index n to its first zero.
     *
     * @param n polytropic index, 0 &lt;= n &lt;= 4.5
     * @throws InvalidInputException for n outside [0, 4.5] (n &gt;= 5 has no surface)
     */
    public static LaneEmden solve(double n) {
        return solve(n, TOLERANCE);
    }

    /** As {@link #solve(double)} at a given integrator tolerance (for step-refinement checks). */
    static LaneEmden solve(double n, double tolerance) {
        if (!(n >= 0.0 && n <= 4.5)) {
            throw InvalidInputException.of("polytropic index n", n, "in [0, 4.5]",
                    "n >= 5 polytropes have no finite radius (n = 5: theta = (1 + xi^2/3)^-1/2); use theta(n, xi) for their profile.");
        }
        SurfaceIntegration.Surface s = SurfaceIntegration.toSurface(system(n), START, start(n, START), 0, 0.0, 100.0 + 50.0 * n,
                tolerance, new double[] {1.0, 1.0});
        double xi1 = s.radius();
        return new LaneEmden(n, xi1, -xi1 * xi1 * s.state()[1]);
    }

    /**
     * theta(xi) for index n (0 &lt;= n &lt;= 5), integrated from the centre; refuses xi beyond the first
     * zero (where rho = rho_c theta^n is no longer defined).
     */
    public static double theta(double n, double xi) {
        if (!(n >= 0.0 && n <= 5.0)) {
            throw InvalidInputException.of("polytropic index n", n, "in [0, 5]", "");
        }
        if (!(xi >= 0.0 && Double.isFinite(xi))) {
            throw InvalidInputException.of("Lane-Emden radius xi", xi, "finite and >= 0", "");
        }
        if (xi <= START) {
            return start(n, xi)[0];
        }
        double[] y = start(n, START);
        var integrator = new org.apache.commons.math3.ode.nonstiff.DormandPrince853Integrator(1e-12, xi, TOLERANCE, TOLERANCE);
        double[] out = new double[2];
        integrator.integrate(SurfaceIntegration.equations(system(n), 2), START, y, xi, out);
        if (out[0] < 0.0) {
            throw InvalidInputException.of("Lane-Emden radius xi (n = " + n + ")", xi,
                    "at most the first zero xi_1 = " + solve(n).firstZero(), "");
        }
        return out[0];
    }

    private static double[] start(double n, double xi) {
        double x2 = xi * xi;
        double theta = 1 - x2 / 6 + n * x2 * x2 / 120 - n * (8 * n - 5) * x2 * x2 * x2 / 15120;
        double slope = -xi / 3 + n * x2 * xi / 30 - n * (8 * n - 5) * x2 * x2 * xi / 2520;
        return new double[] {theta, slope};
    }

    private static SurfaceIntegration.Rhs system(double n) {
        return (xi, y, dy) -> {
            dy[0] = y[1];
            dy[1] = -Math.pow(Math.max(y[0], 0.0), n) - 2.0 * y[1] / xi;
        };
    }

    /** The polytropic index n. */
    public double index() {
        return index;
    }

    /** The first zero xi_1 of theta (the surface). */
    public double firstZero() {
        return firstZero;
    }

    /** omega_n = -xi_1^2 theta'(xi_1) (the mass constant: M = 4 pi a^3 rho_c omega_n). */
    public double massConstant() {
        return massConstant;
    }

    /** rho_c / rho_mean = xi_1^3 / (3 omega_n). */
    public double centralToMeanDensity() {
        return firstZero * firstZero * firstZero / (3.0 * massConstant);
    }

    @Override
    public List<String> columnNames() {
        return List.of("n", "xi_1", "-xi_1^2 theta'(xi_1)", "rho_c/rho_mean");
    }

    @Override
    public List<List<Object>> rows() {
        return List.of(List.of(index, firstZero, massConstant, centralToMeanDensity()));
    }
}
