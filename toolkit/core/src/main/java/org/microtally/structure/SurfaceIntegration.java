package org.microtally.structure;

import org.apache.commons.math3.ode.FirstOrderDifferentialEquations;
import org.apache.commons.math3.ode.events.EventHandler;
import org.apache.commons.math3.ode.nonstiff.DormandPrince853Integrator;

/**
 * Integrates a stellar-structure system outward from a point near the centre until one component
 * falls to a surface value, found as a root (package-private; the one integrator of this package).
 *
 * <p>Method: the adaptive Dormand-Prince 8(5,3) Runge-Kutta pair (J. R. Dormand and P. J. Prince,
 * J. Comput. Appl. Math. 6, 19 (1980); E. Hairer, S. P. Norsett, G. Wanner, Solving Ordinary
 * Differential Equations I (1993), sec. II.10) as implemented in Commons Math, with local error
 * control at the given relative tolerance and an absolute tolerance of the same size times the typical
 * magnitude of each component (so that small components are resolved to the same relative
 * accuracy); the surface is the root of
 * (component - surface value), located by the integrator's event detection (bracketing solver,
 * convergence {@code 1e-14} of the radius scale).
 */
final class SurfaceIntegration {
    private SurfaceIntegration() { }

    /** Cap on right-hand-side evaluations per model (a model in the stated ranges needs a few thousand). */
    static final int MAX_EVALUATIONS = 2_000_000;

    /** The right-hand side dy/ds of a structure system. */
    interface Rhs {
        void derivatives(double s, double[] y, double[] dy);
    }

    /** The system in the integrator's form. */
    static FirstOrderDifferentialEquations equations(Rhs rhs, int dimension) {
        return new FirstOrderDifferentialEquations() {
            @Override
            public int getDimension() {
                return dimension;
            }

            @Override
            public void computeDerivatives(double s, double[] y, double[] dy) {
                rhs.derivatives(s, y, dy);
            }
        };
    }

    /** The state at the surface: the radius variable and every component. */
    record Surface(double radius, double[] state) { }

    static Surface toSurface(Rhs rhs, double r0, double[] y0, int component,
            double surfaceValue, double rMax, double tolerance, double[] magnitudes) {
        double scale = Math.abs(rMax);
        double[] absolute = new double[magnitudes.length];
        double[] relative = new double[magnitudes.length];
        for (int i = 0; i < magnitudes.length; i++) {
            absolute[i] = tolerance * magnitudes[i];
            relative[i] = tolerance;
        }
        DormandPrince853Integrator integrator = new DormandPrince853Integrator(1e-14 * scale, rMax, absolute, relative);
        final double[] found = new double[1];
        found[0] = Double.NaN;
        integrator.addEventHandler(new EventHandler() {
            @Override
            public void init(double t0, double[] y, double t) { }

            @Override
            public double g(double t, double[] y) {
                return y[component] - surfaceValue;
            }

            @Override
            public Action eventOccurred(double t, double[] y, boolean increasing) {
                found[0] = t;
                return Action.STOP;
            }

            @Override
            public void resetState(double t, double[] y) { }
        }, 0.01 * scale, 1e-14 * scale, 1000);
        integrator.setMaxEvaluations(MAX_EVALUATIONS);
        double[] y = y0.clone();
        double end;
        try {
            end = integrator.integrate(equations(rhs, y0.length), r0, y0.clone(), rMax, y);
        } catch (org.apache.commons.math3.exception.MaxCountExceededException e) {
            throw new IllegalStateException("the structure integration did not reach the surface within " + MAX_EVALUATIONS
                    + " right-hand-side evaluations (an extreme central condition); no result is returned", e);
        }
        if (Double.isNaN(found[0])) {
            throw new IllegalStateException("no surface before radius variable " + rMax + " (reached " + end
                    + " with state " + java.util.Arrays.toString(y) + ")");
        }
        return new Surface(end, y);
    }
}
