package org.microtally;

import java.util.function.DoubleUnaryOperator;
import org.apache.commons.math3.analysis.solvers.AllowedSolution;
import org.apache.commons.math3.analysis.solvers.BracketingNthOrderBrentSolver;
import org.apache.commons.math3.exception.MathIllegalArgumentException;
import org.apache.commons.math3.exception.MathIllegalStateException;

/**
 * The one root finder of the core: a bracketed search for a sign change of f in [lo, hi].
 *
 * <p>Method: Brent's method generalised to inverse polynomial interpolation of order 5 with a
 * bisection safeguard (Commons Math 3.6.1 {@code BracketingNthOrderBrentSolver}; R. P. Brent,
 * <i>Algorithms for Minimization without Derivatives</i>, Prentice-Hall 1973, ch. 4). The bracket
 * always holds a sign change, so the search cannot leave it and ends after at most
 * {@link #MAX_EVALUATIONS} evaluations.
 *
 * <p>Tolerance (the one stated accuracy of every root in the core): the returned x lies within
 * {@code absolute + }{@link #RELATIVE_ACCURACY}{@code  |x|} of a sign change of f, or f(x) is within
 * {@code residual} of 0. Callers choose {@code absolute} from the scale of x (e.g. 4 ulp of the
 * bracket ends) and {@code residual} from the rounding noise of f (0 when f is evaluated without
 * noise to report).
 */
public final class Roots {
    /** Relative accuracy in x of every root: 1e-15 (about 5 ulp). */
    public static final double RELATIVE_ACCURACY = 1e-15;
    /** Largest number of evaluations of f. */
    public static final int MAX_EVALUATIONS = 500;

    private static final int ORDER = 5;

    private Roots() { }

    /**
     * A root of {@code f} in [lo, hi], to {@code absolute + 1e-15 |x|} in x or {@code residual} in f.
     *
     * @param what a description of the root for error messages, e.g. {@code "chemical potential mu"}
     * @throws IllegalStateException when f does not change sign over the bracket or the search does not
     *                               converge (the message names {@code what}, the bracket and f at its ends)
     */
    public static double solve(String what, DoubleUnaryOperator f, double lo, double hi, double absolute,
                               double residual) {
        BracketingNthOrderBrentSolver solver = new BracketingNthOrderBrentSolver(RELATIVE_ACCURACY, absolute,
                Math.max(residual, Double.MIN_NORMAL), ORDER);
        try {
            return solver.solve(MAX_EVALUATIONS, f::applyAsDouble, lo, hi, AllowedSolution.ANY_SIDE);
        } catch (MathIllegalArgumentException | MathIllegalStateException e) {
            throw new IllegalStateException("the root search for " + what + " in [" + lo + ", " + hi
                    + "] failed (f = " + safe(f, lo) + " and " + safe(f, hi) + " at the ends): " + e.getMessage(), e);
        }
    }

    /** As {@link #solve(String, DoubleUnaryOperator, double, double, double, double)} with residual 0 (ends by x only). */
    public static double solve(String what, DoubleUnaryOperator f, double lo, double hi, double absolute) {
        return solve(what, f, lo, hi, absolute, 0.0);
    }

    private static String safe(DoubleUnaryOperator f, double x) {
        try {
            return Double.toString(f.applyAsDouble(x));
        } catch (RuntimeException e) {
            return "(" + e.getClass().getSimpleName() + ")";
        }
    }
}
