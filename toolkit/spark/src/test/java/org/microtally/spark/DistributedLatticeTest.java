package org.microtally.spark;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.math.BigInteger;
import org.apache.spark.sql.SparkSession;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.microtally.ProgressListener;
import org.microtally.ensemble.ExactDensityOfStates;
import org.microtally.lattice.Boundary;
import org.microtally.lattice.BruteForce;
import org.microtally.lattice.Lattice;
import org.microtally.lattice.LatticeTasks;
import org.microtally.lattice.Model;
import org.microtally.lattice.TransferMatrix;

class DistributedLatticeTest {
    private static SparkSession spark;
    private static final Model ISING = Model.ising(Model.Coupling.FERROMAGNETIC);

    @BeforeAll
    static void start() {
        spark = SharedSpark.get();
    }

    /** The distributed transfer matrix against {@code local}, and the distributed enumeration against both. */
    private static ExactDensityOfStates assertBothWays(Lattice lattice, Model model, boolean label,
                                                       ExactDensityOfStates local) {
        ExactDensityOfStates d = DistributedLattice.densityOfStates(spark, lattice, model, label, ProgressListener.NONE);
        // Source: independent computation, lattice's local result (every row compared)
        assertEquals(local.rows(), d.rows(), lattice + " " + model);
        // Source: independent computation, the prefix-split Gray-code enumeration of every configuration
        assertEquals(d.rows(), DistributedLattice.enumerate(spark, lattice, model, label, ProgressListener.NONE).rows());
        return d;
    }

    @Test
    void periodic4x4IsingMatchesThePublishedCountsTheLocalSweepAndTheEnumeration() {
        Lattice torus = Lattice.square(4, 4, Boundary.PERIODIC);
        ExactDensityOfStates d = assertBothWays(torus, ISING, false,
                TransferMatrix.densityOfStates(torus, ISING, ProgressListener.NONE));
        // Source: from memory (the 4 x 4 periodic Ising g(E), e.g. P. D. Beale, PRL 76 (1996) 78), checked here by
        // its sum 2^16 and by the two computations above; E = -28 has no configuration (g symmetric in E)
        long[] e = {-32, -28, -24, -20, -16, -12, -8, -4, 0};
        long[] g = {2, 0, 32, 64, 424, 1728, 6688, 13568, 20524};
        for (int i = 0; i < g.length; i++) {
            assertEquals(BigInteger.valueOf(g[i]), d.count(e[i]), "E = " + e[i]);
            assertEquals(BigInteger.valueOf(g[i]), d.count(-e[i]), "E = " + -e[i]);
        }
    }

    @Test
    void free5x5WithMagnetisationPottsAndHardCoreMatchTheLocalResults() {
        Lattice free = Lattice.square(5, 5, Boundary.FREE);
        ExactDensityOfStates em = assertBothWays(free, ISING, true,
                TransferMatrix.withMagnetisation(free, ISING, ProgressListener.NONE));
        // Source: closed form: one configuration has M = N (all 25 spins up, all 40 bonds satisfied, E = -40),
        // and there are 2^25 in all
        assertEquals(BigInteger.ONE, em.count(-40, 25));
        assertEquals(BigInteger.ONE.shiftLeft(25), em.total());

        Lattice small = Lattice.square(3, 3, Boundary.PERIODIC);
        Model potts = Model.potts(3, Model.Coupling.FERROMAGNETIC);
        // Source: independent brute force over all 3^9 configurations (lattice's BruteForce)
        assertBothWays(small, potts, false, BruteForce.densityOfStates(small, potts));

        Lattice gas = Lattice.square(4, 4, Boundary.FREE);
        // Source: lattice's BruteForce, and OEIS A006506 (independent vertex sets of the n x n grid graph), a(4) = 1234
        ExactDensityOfStates hc = assertBothWays(gas, Model.hardCore(), false,
                BruteForce.densityOfStates(gas, Model.hardCore()));
        assertEquals(BigInteger.valueOf(1234), hc.total());
    }

    @Test
    void aCorruptedResidueIsRefusedAndATaskThatThrowsOnceIsRetried() {
        LatticeTasks tasks = LatticeTasks.of(Lattice.square(4, 5, Boundary.CYLINDER), ISING, true);
        ExactDensityOfStates local = TransferMatrix.withMagnetisation(Lattice.square(4, 5, Boundary.CYLINDER), ISING,
                ProgressListener.NONE);
        TaskFault firstAttemptFails = (task, attempt, result) -> {
            if (attempt == 0) {
                throw new IllegalStateException("injected failure of task " + task);
            }
            return result;
        };
        // Source: independent computation, lattice's local transfer matrix
        assertEquals(local.rows(), DistributedLattice.byPrimes(spark, tasks, ProgressListener.NONE, firstAttemptFails)
                .rows());
        TaskFault corrupt = (task, attempt, result) -> {
            if (task == 0) {
                int j = result.length / 2;
                result[j] = result[j] == 0 ? 1 : result[j] - 1;
            }
            return result;
        };
        IllegalStateException ex = assertThrows(IllegalStateException.class,
                () -> DistributedLattice.byPrimes(spark, tasks, ProgressListener.NONE, corrupt));
        assertTrue(ex.getMessage().contains("CRT consistency check failed"), ex.getMessage());
    }
}
