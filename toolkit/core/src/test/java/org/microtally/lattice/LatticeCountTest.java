package org.microtally.lattice;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.math.BigInteger;
import java.util.ArrayList;
import java.util.List;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import org.microtally.ProgressListener;
import org.microtally.ensemble.ExactDensityOfStates;
import org.microtally.lattice.Model.Coupling;

class LatticeCountTest {
    private static final Model FERRO = Model.ising(Coupling.FERROMAGNETIC);

    static Stream<Arguments> smallLattices() {
        List<Arguments> out = new ArrayList<>();
        for (Boundary b : Boundary.values()) {
            out.add(Arguments.of(Lattice.square(4, 4, b)));
            out.add(Arguments.of(Lattice.square(3, 5, b)));
            out.add(Arguments.of(Lattice.triangular(3, 4, b)));
            out.add(Arguments.of(Lattice.triangular(4, 3, b)));
            out.add(Arguments.of(Lattice.honeycomb(4, 4, b)));
        }
        out.add(Arguments.of(Lattice.square(5, 3, Boundary.FREE)));
        out.add(Arguments.of(Lattice.graph(7, new int[][] {{0, 1}, {1, 2}, {2, 0}, {2, 3}, {3, 4}, {4, 5}, {5, 6}, {6, 3}, {0, 5}})));
        out.add(Arguments.of(Lattice.graph(6, new int[][] {{0, 2}, {2, 4}, {4, 5}})));   // sites 1 and 3 isolated
        return out.stream();
    }

    @ParameterizedTest
    @MethodSource("smallLattices")
    void isingTransferMatrixEqualsGrayCodeEnumeration(Lattice lattice) {
        // Source: independent brute force (Gray-code enumeration of all 2^N configurations)
        assertEquals(BruteForce.withMagnetisation(lattice, FERRO).rows(),
                TransferMatrix.withMagnetisation(lattice, FERRO, ProgressListener.NONE).rows());
        Model anti = Model.ising(Coupling.ANTIFERROMAGNETIC);
        assertEquals(BruteForce.densityOfStates(lattice, anti).rows(),
                TransferMatrix.densityOfStates(lattice, anti, ProgressListener.NONE).rows());
        // Source: independent brute force; g(E) alone runs the spin-flip symmetric sweep
        assertEquals(BruteForce.densityOfStates(lattice, FERRO).rows(),
                TransferMatrix.densityOfStates(lattice, FERRO, ProgressListener.NONE).rows());
        // Source: closed form, every configuration counted once: sum g = 2^N
        assertEquals(BigInteger.TWO.pow(lattice.sites()),
                TransferMatrix.densityOfStates(lattice, FERRO, ProgressListener.NONE).total());
    }

    @ParameterizedTest
    @MethodSource("smallLattices")
    void hardCoreTransferMatrixEqualsGrayCodeEnumeration(Lattice lattice) {
        // Source: independent brute force (Gray-code enumeration of all subsets)
        assertEquals(BruteForce.densityOfStates(lattice, Model.hardCore()).rows(),
                TransferMatrix.densityOfStates(lattice, Model.hardCore(), ProgressListener.NONE).rows());
    }

    @Test
    void pottsTransferMatrixEqualsGrayCodeEnumeration() {
        for (Lattice lattice : List.of(Lattice.square(3, 3, Boundary.PERIODIC), Lattice.triangular(3, 3, Boundary.CYLINDER),
                Lattice.square(2, 5, Boundary.FREE))) {
            for (int q : new int[] {3, 4}) {
                Model potts = Model.potts(q, Coupling.FERROMAGNETIC);
                ExactDensityOfStates tm = TransferMatrix.densityOfStates(lattice, potts, ProgressListener.NONE);
                // Source: independent brute force (q-ary reflected Gray code, Knuth TAOCP 7.2.1.1 Algorithm H)
                assertEquals(BruteForce.densityOfStates(lattice, potts).rows(), tm.rows());
                // Source: closed form, sum g = q^N
                assertEquals(BigInteger.valueOf(q).pow(lattice.sites()), tm.total());
                // Source: closed form, the ferromagnetic ground states are the q uniform colourings
                assertEquals(BigInteger.valueOf(q), tm.groundDegeneracy());
                assertEquals(-lattice.bonds(), tm.groundEnergy());
            }
        }
    }

    @Test
    void manyPrimesAreRecombinedExactly() {
        // 12 x 12 free square lattice: counts up to 2^144 need three primes.
        Lattice lattice = Lattice.square(12, 12, Boundary.FREE);
        ExactDensityOfStates g = TransferMatrix.densityOfStates(lattice, FERRO, ProgressListener.NONE);
        assertEquals(3, TransferMatrix.estimate(lattice, FERRO, false).primes());
        // Source: closed form, sum g = 2^N
        assertEquals(BigInteger.TWO.pow(144), g.total());
        // Source: closed form, the two uniform states at E = -B; one flipped corner spin costs 2 x 2 bonds
        // (4 corners), an edge spin 2 x 3 (4 x 10 edges)
        assertEquals(BigInteger.TWO, g.count(-lattice.bonds()));
        assertEquals(BigInteger.valueOf(8), g.count(-lattice.bonds() + 4));
        // Source: closed form, free square lattices are bipartite: flipping one sublattice maps E to -E
        long[] es = g.distinctEnergies();
        for (long e : es) {
            assertEquals(g.count(e), g.count(-e));
        }
        assertTrue(lattice.bipartite());
    }

    @Test
    void progressReachesTheEndAndStaysThrottled() {
        List<long[]> calls = new ArrayList<>();
        ProgressListener record = (done, total, stage) -> calls.add(new long[] {done, total});
        Lattice lattice = Lattice.square(12, 12, Boundary.FREE);
        TransferMatrix.densityOfStates(lattice, FERRO, record);
        // common practice, no source: at most ~200 reports, ending at done == total = sites x primes
        long[] last = calls.get(calls.size() - 1);
        assertEquals(144L * 3, last[1]);
        assertEquals(last[1], last[0]);
        assertTrue(calls.size() <= 201, "calls " + calls.size());
        calls.clear();
        Kaufman.densityOfStates(8, 8, record);
        assertEquals(calls.get(calls.size() - 1)[1], calls.get(calls.size() - 1)[0]);
    }
}
