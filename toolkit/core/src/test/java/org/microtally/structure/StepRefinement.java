package org.microtally.structure;

import static org.junit.jupiter.api.Assertions.assertEquals;

/** The step-refinement check shared by the compact-star tests. */
final class StepRefinement {
    /** Reference tolerance, far below every default: its solution stands in for the exact one. */
    static final double REFERENCE_TOLERANCE = 3e-15;

    private StepRefinement() {
    }

    /** A model solved at central relativity parameter x_c with integration tolerance tol. */
    interface Solver {
        CompactStar solve(double centralX, double tolerance);
    }

    /**
     * At each x_c, mass and radius solved at {@code tolerance} agree with those solved at
     * {@link #REFERENCE_TOLERANCE} within {@code accuracy} relative (common practice, no source:
     * refining the step until the answer stops moving).
     */
    static void assertRefined(Solver model, double tolerance, double accuracy, double... centralX) {
        for (double xc : centralX) {
            CompactStar ref = model.solve(xc, REFERENCE_TOLERANCE);
            CompactStar std = model.solve(xc, tolerance);
            assertEquals(ref.mass(), std.mass(), accuracy * ref.mass(), "M at x_c = " + xc);
            assertEquals(ref.radius(), std.radius(), accuracy * ref.radius(), "R at x_c = " + xc);
        }
    }
}
