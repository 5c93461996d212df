package org.microtally.spark;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.math.BigInteger;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import org.apache.spark.sql.SparkSession;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.microtally.InvalidInputException;
import org.microtally.count.CountTable;
import org.microtally.count.PrimePlan;
import org.microtally.spectrum.Spectra;
import org.microtally.spectrum.Spectrum;
import org.microtally.spectrum.Statistics;

class DistributedCountTableTest {
    private static SparkSession spark;

    @BeforeAll
    static void start() {
        spark = SharedSpark.get();
    }

    private static void assertSameAsLocal(Spectrum s, Statistics st, int n, int e) {
        DistributedCountTable d = DistributedCountTable.of(spark, s, st, n, e);
        CountTable local = CountTable.of(s, st, n, e);
        // Source: independent computation, the local CountTable (every entry compared)
        Optional<String> diff = d.firstDifference(local);
        assertTrue(diff.isEmpty(), () -> diff.get());
        assertEquals(DistributedCountTable.REDUNDANT_PRIMES, d.redundantPrimes());
    }

    @Test
    void boseOn3dOscillatorIsIdenticalToTheLocalMultiModularTable() {
        // large enough that the local table takes its multi-modular path (more than one prime)
        Spectrum s = Spectra.harmonicOscillator(3, 60);
        assertSameAsLocal(s, Statistics.BOSE, 30, 60);
        assertTrue(PrimePlan.of(s, Statistics.BOSE, 30, 60, 0).requiredPrimes() >= 1);
    }

    @Test
    void fermiGentileAndDistinguishableAreIdenticalToTheLocalTable() {
        Spectrum s = Spectra.harmonicOscillator(2, 30);
        assertSameAsLocal(s, Statistics.FERMI, 12, 30);
        assertSameAsLocal(s, Statistics.maxOccupancy(2), 12, 30);
        assertSameAsLocal(s, Statistics.DISTINGUISHABLE, 8, 30);
    }

    @Test
    void degenerateShapesNoParticlesOrNoEnergyMatchTheLocalTable() {
        Spectrum s = Spectra.harmonicOscillator(3, 5);
        assertSameAsLocal(s, Statistics.BOSE, 0, 5);
        assertSameAsLocal(s, Statistics.FERMI, 4, 0);
        // Source: definition: the empty microstate is the only one with n = 0, so Omega(0, 0) = 1
        assertEquals(BigInteger.ONE, DistributedCountTable.of(spark, s, Statistics.BOSE, 0, 0).count(0, 0));
    }

    @Test
    void oneDimensionalOscillatorGivesPartitionNumbers() {
        DistributedCountTable d = DistributedCountTable.of(spark, Spectra.harmonicOscillator(1, 100),
                Statistics.BOSE, 100, 100);
        // Source: OEIS A000041 (partition numbers), p(100) = 190569292, p(50) = 204226: bosons on the levels
        // 0, 1, 2, ... with total energy e and n >= e particles form the partitions of e
        assertEquals(BigInteger.valueOf(190569292L), d.count(100, 100));
        assertEquals(BigInteger.valueOf(204226L), d.count(100, 50));
    }

    @Test
    void einsteinSolidMatchesTheBinomialClosedForm() {
        DistributedCountTable d = DistributedCountTable.of(spark, Spectra.harmonicOscillator(1, 100),
                Statistics.DISTINGUISHABLE, 40, 100);
        // Source: closed form C(q + N - 1, q) for N distinguishable oscillators sharing q quanta
        // (Einstein solid multiplicity, e.g. Schroeder, An Introduction to Thermal Physics, eq. 2.9)
        BigInteger expected = BigInteger.ONE;
        for (int i = 1; i <= 100; i++) {
            expected = expected.multiply(BigInteger.valueOf(39 + i)).divide(BigInteger.valueOf(i));
        }
        assertEquals(expected, d.count(40, 100));
    }

    @Test
    void progressReachesTheTotalMonotonically() {
        List<long[]> calls = new ArrayList<>();
        DistributedCountTable d = DistributedCountTable.of(spark, Spectra.harmonicOscillator(3, 40),
                Statistics.BOSE, 20, 40, (done, total, stage) -> {
                    synchronized (calls) {
                        calls.add(new long[] {done, total});
                    }
                    assertEquals("primes", stage);
                });
        // the required primes dealt to one task per worker thread (local[2, 2]: two), at most one task per
        // prime; the redundant prime is computed on the driver, not in a task
        long tasks = PrimeTasks.taskCount(d.requiredPrimes(), 2);
        assertEquals(Math.min(2, d.requiredPrimes()), tasks);
        assertEquals(9, PrimeTasks.taskCount(9, 64));
        // common practice, no source: a progress sequence rises to (total, total), counting finished tasks
        assertTrue(!calls.isEmpty());
        for (int i = 0; i < calls.size(); i++) {
            assertEquals(tasks, calls.get(i)[1]);
            if (i > 0) {
                assertTrue(calls.get(i)[0] > calls.get(i - 1)[0]);
            }
        }
        assertEquals(tasks, calls.get(calls.size() - 1)[0]);
    }

    @Test
    void aSecondSessionOnAnotherMasterIsRefusedNotSilentlyReplaced() {
        // common practice, no source: Spark keeps one context per JVM; asking for another master must not
        // quietly return the running local[2,2] session
        InvalidInputException ex = assertThrows(InvalidInputException.class, () -> Clusters.local(1));
        assertTrue(ex.getMessage().contains("local[2,2]"), ex.getMessage());
        assertEquals(spark, Clusters.localWithRetries(2, 2));
    }

    @Test
    void refusesBadInputBeforeStartingAnyTask() {
        InvalidInputException ex = assertThrows(InvalidInputException.class, () -> DistributedCountTable.of(spark,
                Spectra.harmonicOscillator(1, 10), Statistics.BOSE, -1, 10));
        // common practice, no source: the refusal names the offending value
        assertTrue(ex.getMessage().contains("-1"), ex.getMessage());
    }
}
