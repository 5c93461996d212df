package org.microtally.lattice;

import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.function.Executable;
import org.microtally.InvalidInputException;
import org.microtally.ProgressListener;
import org.microtally.lattice.Model.Coupling;

/** Bad input: each is refused with a message naming the value. */
class LatticeBadInputTest {
    private static void refused(Executable call, String... fragments) {
        InvalidInputException e = assertThrows(InvalidInputException.class, call);
        for (String f : fragments) {
            assertTrue(e.getMessage().contains(f), () -> "message '" + e.getMessage() + "' lacks '" + f + "'");
        }
    }

    @Test
    void sidesBelowOne() {
        // common practice, no source
        refused(() -> Lattice.square(0, 4, Boundary.FREE), "L (sites per row) = 0");
        refused(() -> Lattice.triangular(3, -1, Boundary.FREE), "M (rows) = -1");
        refused(() -> Lattice.graph(0, new int[0][]), "number of sites = 0");
    }

    @Test
    void periodicSidesBelowThreeWouldDoubleCountBonds() {
        // Source: closed form, with 2 sites the forward and wrap-around bonds join the same pair
        refused(() -> Lattice.square(2, 4, Boundary.PERIODIC), "L (sites per row) = 2", "count twice");
        refused(() -> Lattice.square(4, 2, Boundary.PERIODIC), "M (rows) = 2");
        refused(() -> Lattice.square(1, 4, Boundary.CYLINDER), "L (sites per row) = 1");
        refused(() -> Lattice.honeycomb(5, 4, Boundary.CYLINDER), "L (sites per row) = 5", "even");
        // A cylinder wraps rows only: two rows are fine.
        assertTrue(Lattice.square(4, 2, Boundary.CYLINDER).bonds() == 12);
    }

    @Test
    void selfLoopsAndDuplicateBonds() {
        // common practice, no source
        refused(() -> Lattice.graph(3, new int[][] {{0, 1}, {1, 1}}), "bond 1 = [1, 1]", "self-loops");
        refused(() -> Lattice.graph(3, new int[][] {{0, 1}, {1, 2}, {1, 0}}), "bond 2 = [1, 0]", "duplicate");
        refused(() -> Lattice.graph(3, new int[][] {{0, 3}}), "site in bond 0 = 3");
    }

    @Test
    void pottsNeedsTwoStatesAndHasNoMagnetisation() {
        // common practice, no source
        refused(() -> Model.potts(1, Coupling.FERROMAGNETIC), "q (Potts states per site) = 1");
        Model potts = Model.potts(3, Coupling.FERROMAGNETIC);
        Lattice l = Lattice.square(3, 3, Boundary.FREE);
        refused(() -> TransferMatrix.withMagnetisation(l, potts, ProgressListener.NONE), "magnetisation", "Potts");
        refused(() -> BruteForce.withMagnetisation(l, potts), "magnetisation");
        refused(() -> TransferMatrix.withMagnetisation(l, Model.hardCore(), ProgressListener.NONE), "magnetisation");
    }

    @Test
    void estimateBeyondMemoryIsRefusedWithTheEstimate() {
        Lattice wide = Lattice.square(12, 12, Boundary.PERIODIC);
        Model ising = Model.ising(Coupling.FERROMAGNETIC);
        TransferMatrix.Cost cost = TransferMatrix.estimate(wide, ising, false);
        // Source: closed form, a torus of width 12 scanned row by row keeps the first row (for the wrap bonds)
        // and the last 12 sites on the frontier: 2 x 12
        assertTrue(cost.maxFrontier() == 24, cost.toString());
        refused(() -> TransferMatrix.count(wide, ising, false, 100_000_000L, ProgressListener.NONE),
                "transfer-matrix cost", "frontier 24 sites", "at most 100 MB");
        refused(() -> BruteForce.densityOfStates(Lattice.square(6, 6, Boundary.FREE), ising), "at most 2^30");
    }

    @Test
    void kaufmanRefusesSidesBelowThreeAndTheFrustratedAntiferromagnet() {
        // common practice, no source
        refused(() -> Kaufman.densityOfStates(2, 4, ProgressListener.NONE), "L (sites per row) = 2");
        refused(() -> Kaufman.densityOfStates(5, 3, Model.Coupling.ANTIFERROMAGNETIC, ProgressListener.NONE),
                "L x M for the antiferromagnet = 5 x 3", "both sides even");
    }
}
