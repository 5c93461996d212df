package org.microtally.lattice;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.math.BigInteger;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.microtally.ProgressListener;
import org.microtally.exact.ExactLog;
import org.microtally.ensemble.ExactDensityOfStates;
import org.microtally.lattice.Model.Coupling;
import org.microtally.exact.Combinatorics;

/** Lattice counts against published values and closed forms. */
class LatticeReferenceTest {
    private static final Model FERRO = Model.ising(Coupling.FERROMAGNETIC);
    private static final Model ANTI = Model.ising(Coupling.ANTIFERROMAGNETIC);

    private static ExactDensityOfStates tm(Lattice lattice, Model model) {
        return TransferMatrix.densityOfStates(lattice, model, ProgressListener.NONE);
    }

    @Test
    void independentSetsOfTheGridGraph() {
        // Source: OEIS A006506 (number of independent vertex sets in the n x n grid graph), n = 1..8;
        // n <= 5 as quoted in the issue, n = 6..8 from memory of the OEIS entry
        long[] a006506 = {2, 7, 63, 1234, 55447, 5598861L, 1280128950L, 660647962955L};
        for (int n = 1; n <= a006506.length; n++) {
            assertEquals(BigInteger.valueOf(a006506[n - 1]), tm(Lattice.square(n, n, Boundary.FREE), Model.hardCore()).total(),
                    "n = " + n);
        }
        // Source: closed form, the 4 x 4 grid holds at most 8 particles (one checkerboard colour), in 2 ways
        ExactDensityOfStates g = tm(Lattice.square(4, 4, Boundary.FREE), Model.hardCore());
        assertEquals(BigInteger.TWO, g.count(8));
        assertEquals(BigInteger.ZERO, g.count(9));
    }

    @Test
    void hardSquareEntropyConstantIsApproachedOnCylinders() {
        // Source: R. J. Baxter, "Planar lattice gases with nearest-neighbour exclusion", Annals of Combinatorics 3 (1999) 191 (value as quoted in the issue); OEIS A085850, kappa = 1.50304808247533...
        double kappa = 1.50304808247533;
        double previous = Double.POSITIVE_INFINITY;
        for (int width : new int[] {4, 6, 8, 10}) {
            BigInteger z8 = tm(Lattice.square(width, 8, Boundary.CYLINDER), Model.hardCore()).total();
            BigInteger z9 = tm(Lattice.square(width, 9, Boundary.CYLINDER), Model.hardCore()).total();
            double estimate = Math.exp((ExactLog.ln(z9) - ExactLog.ln(z8)) / width);
            double error = Math.abs(estimate - kappa);
            assertTrue(error < previous, "width " + width + ": " + estimate);
            previous = error;
        }
        assertTrue(previous < 2e-5, "width 10 error " + previous);
    }

    @Test
    void wannierResidualEntropyIsApproachedOnTori() {
        // Source: G. H. Wannier, Phys. Rev. 79, 357 (1950): S_0/N = 0.3230659669... for the triangular
        // Ising antiferromagnet. Ratio of ground-state counts three rows apart (the ground states are
        // commensurate with three sublattices) on L x M tori, L = 3, 6.
        double wannier = 0.3230659669;
        double[] error = new double[2];
        int[] widths = {3, 6};
        for (int i = 0; i < 2; i++) {
            int l = widths[i];
            BigInteger g6 = tm(Lattice.triangular(l, 6, Boundary.PERIODIC), ANTI).groundDegeneracy();
            BigInteger g9 = tm(Lattice.triangular(l, 9, Boundary.PERIODIC), ANTI).groundDegeneracy();
            error[i] = Math.abs((ExactLog.ln(g9) - ExactLog.ln(g6)) / (3 * l) - wannier);
        }
        assertTrue(error[1] < error[0] && error[1] < 0.005, java.util.Arrays.toString(error));
    }

    @ParameterizedTest
    @CsvSource({"6, 6", "8, 6", "6, 7", "8, 8", "10, 6", "7, 7", "7, 9"})
    void bealeLowTemperatureSeries(int l, int m) {
        ExactDensityOfStates g = Kaufman.densityOfStates(l, m, ProgressListener.NONE);
        long n = (long) l * m;
        long e0 = -2 * n;
        // Source: P. D. Beale, PRL 76, 78 (1996): g at 0, 4, 8, 12, 16, 20 J above the ground state of the
        // periodic square lattice with L, M > 5 is 2, 0, 2N, 4N, N^2 + 9N, 4N^2 + 24N
        long[] expected = {2, 0, 2 * n, 4 * n, n * n + 9 * n, 4 * n * n + 24 * n};
        for (int j = 0; j < expected.length; j++) {
            assertEquals(BigInteger.valueOf(expected[j]), g.count(e0 + 4L * j), "E - E0 = " + 4 * j);
        }
        // Source: closed form, sum g = 2^N
        assertEquals(BigInteger.TWO.pow((int) n), g.total());
    }

    @Test
    void bipartiteLatticesHaveSymmetricSpectra() {
        for (Lattice lattice : new Lattice[] {Lattice.square(6, 4, Boundary.PERIODIC), Lattice.honeycomb(4, 4, Boundary.PERIODIC),
                Lattice.honeycomb(5, 3, Boundary.FREE), Lattice.square(6, 3, Boundary.CYLINDER)}) {
            ExactDensityOfStates g = tm(lattice, FERRO);
            // Source: closed form, on a bipartite graph flipping one sublattice maps E to -E, so g(E) = g(-E)
            for (long e : g.distinctEnergies()) {
                assertEquals(g.count(e), g.count(-e), lattice + ", E = " + e);
            }
            assertTrue(lattice.bipartite());
        }
        // Source: closed form, odd loops (triangles, a 5-site ring) cannot have every bond broken, so these
        // lattices are not bipartite and their highest energy lies below -E0
        for (Lattice odd : new Lattice[] {Lattice.triangular(3, 3, Boundary.PERIODIC), Lattice.square(5, 3, Boundary.CYLINDER)}) {
            assertTrue(!odd.bipartite(), odd.name());
            ExactDensityOfStates g = tm(odd, FERRO);
            long top = g.distinctEnergies()[g.distinctEnergies().length - 1];
            assertTrue(top < -g.groundEnergy(), odd.name());
        }
    }

    @Test
    void groundStateDegeneracies() {
        // Source: closed form, the Neel states: 2 antiferromagnetic ground states on an even torus, E0 = -2N
        ExactDensityOfStates af = tm(Lattice.square(4, 6, Boundary.PERIODIC), ANTI);
        assertEquals(-48, af.groundEnergy());
        assertEquals(BigInteger.TWO, af.groundDegeneracy());
        // Source: closed form, ferromagnet: the 2 uniform states at E0 = -B on any connected graph
        ExactDensityOfStates ferro = tm(Lattice.triangular(4, 4, Boundary.PERIODIC), FERRO);
        assertEquals(-48, ferro.groundEnergy());
        assertEquals(BigInteger.TWO, ferro.groundDegeneracy());
        // Source: closed form, the 3-colourings of an even ring: (q-1)^n + (q-1) = 2^6 + 2 = 66
        // proper colourings of C_6 are the antiferromagnetic 3-state Potts ground states (E0 = 0 satisfied bonds)
        ExactDensityOfStates potts = tm(Lattice.square(6, 1, Boundary.CYLINDER), Model.potts(3, Coupling.ANTIFERROMAGNETIC));
        assertEquals(0, potts.groundEnergy());
        assertEquals(BigInteger.valueOf(66), potts.groundDegeneracy());
    }
}
