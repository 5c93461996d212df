package org.microtally.spark;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Map;
import java.util.Optional;
import java.util.concurrent.ConcurrentHashMap;
import org.apache.spark.TaskContext;
import org.apache.spark.sql.SparkSession;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.microtally.InvalidInputException;
import org.microtally.ProgressListener;
import org.microtally.count.CountTable;
import org.microtally.count.PrimePlan;
import org.microtally.spectrum.Spectra;
import org.microtally.spectrum.Spectrum;
import org.microtally.spectrum.Statistics;

class FaultToleranceTest {
    private static SparkSession spark;
    private static final Spectrum SPECTRUM = Spectra.harmonicOscillator(3, 40);

    @BeforeAll
    static void start() {
        spark = SharedSpark.get();
    }

    private static PrimePlan plan() {
        return PrimePlan.of(SPECTRUM, Statistics.BOSE, 24, 40, 1);
    }

    @Test
    void aTaskThatThrowsOnItsFirstAttemptIsRetriedAndTheTableIsUnchanged() {
        PrimePlan plan = plan();
        // every Spark task (the required primes; the redundant one is computed on the driver) fails its first
        // attempt; with local[2,2] the job only completes if Spark retried each
        TaskFault firstAttemptFails = (task, attempt, result) -> {
            if (attempt == 0 && task < plan.requiredPrimes()) {
                throw new IllegalStateException("injected failure of task " + task + ", attempt 0");
            }
            return result;
        };
        DistributedCountTable d = DistributedCountTable.compute(spark, SPECTRUM, plan, ProgressListener.NONE, firstAttemptFails);
        // Source: independent computation, the local CountTable (every entry compared)
        Optional<String> diff = d.firstDifference(CountTable.of(SPECTRUM, Statistics.BOSE, 24, 40));
        assertTrue(diff.isEmpty(), () -> diff.get());
    }

    @Test
    void aCorruptedRequiredResidueIsDetectedByTheRedundantPrime() {
        PrimePlan plan = plan();
        int entry = 20 * 41 + 33;
        TaskFault corruptFirstPrime = (task, attempt, result) -> {
            if (task == 0) {
                result[entry] = (result[entry] + 1) % plan.prime(0);
            }
            return result;
        };
        IllegalStateException ex = assertThrows(IllegalStateException.class,
                () -> DistributedCountTable.compute(spark, SPECTRUM, plan, ProgressListener.NONE, corruptFirstPrime));
        // common practice, no source: the message names the entry that failed the check
        assertTrue(ex.getMessage().contains("Omega(20, 33)"), ex.getMessage());
    }

    @Test
    void aCorruptedRedundantResidueIsDetectedToo() {
        // the redundant prime is computed on the driver; the hook corrupts it there
        PrimePlan plan = plan();
        int last = plan.primeCount() - 1;
        TaskFault corruptRedundant = (task, attempt, result) -> {
            if (task == last) {
                result[5] = (result[5] + 7) % plan.prime(last);
            }
            return result;
        };
        assertThrows(IllegalStateException.class,
                () -> DistributedCountTable.compute(spark, SPECTRUM, plan, ProgressListener.NONE, corruptRedundant));
        // (common practice, no source: a wrong redundant residue disagrees with the correct reconstruction)
    }

    /** Where each prime ran, recorded by the hook: index -> true inside a Spark task (same JVM in local mode). */
    private static final Map<Integer, Boolean> RAN_IN_TASK = new ConcurrentHashMap<>();

    @Test
    void theRequiredPrimesRunAsSparkTasksAndTheRedundantOneOnTheDriver() {
        PrimePlan plan = plan();
        RAN_IN_TASK.clear();
        TaskFault record = (task, attempt, result) -> {
            RAN_IN_TASK.put(task, TaskContext.get() != null);
            return result;
        };
        DistributedCountTable d = DistributedCountTable.compute(spark, SPECTRUM, plan, ProgressListener.NONE, record);
        // common practice, no source: every prime computed once, the required ones in tasks, the check prime not
        assertEquals(plan.primeCount(), RAN_IN_TASK.size());
        for (int i = 0; i < plan.primeCount(); i++) {
            assertEquals(i < plan.requiredPrimes(), RAN_IN_TASK.get(i), "prime " + i);
        }
        // Source: independent computation, the local CountTable (every entry compared)
        Optional<String> diff = d.firstDifference(CountTable.of(SPECTRUM, Statistics.BOSE, 24, 40));
        assertTrue(diff.isEmpty(), () -> diff.get());
    }

    private static long[][] residues(PrimePlan plan) {
        long[][] r = new long[plan.primeCount()][];
        for (int i = 0; i < r.length; i++) {
            r[i] = plan.residues(i, ProgressListener.NONE);
        }
        return r;
    }

    @Test
    void recombineRefusesResiduesOutOfRangeOrOfTheWrongShape() {
        PrimePlan plan = PrimePlan.of(Spectra.harmonicOscillator(1, 10), Statistics.BOSE, 5, 10, 1);
        long[][] r = residues(plan);
        // common practice, no source: (N + 1)(E + 1) entries; malformed residue arrays are refused, not recombined
        assertEquals(plan.entries(), plan.recombine(r).length);
        long[][] tooFew = {r[0]};
        assertThrows(InvalidInputException.class, () -> plan.recombine(tooFew));
        r[0] = r[0].clone();
        r[0][3] = -1;
        assertThrows(InvalidInputException.class, () -> plan.recombine(r));
    }

    @Test
    void residuesAreRefusedForASpectrumOtherThanThePlans() {
        PrimePlan plan = PrimePlan.of(Spectra.harmonicOscillator(1, 10), Statistics.BOSE, 5, 10, 1);
        long[][] r = residues(plan);
        // Source: OEIS A026820 T(10, 5) = 30, partitions of 10 into at most 5 parts (5 bosons on the 1D ladder;
        // from memory, recomputed by the partition recursion p(n, k) = p(n, k - 1) + p(n - k, k) when writing this)
        assertEquals(java.math.BigInteger.valueOf(30), plan.table(Spectra.harmonicOscillator(1, 10), r).count(5, 10));
        // common practice, no source: residues of one spectrum's table are not a table of another spectrum
        assertThrows(InvalidInputException.class, () -> plan.table(Spectra.harmonicOscillator(2, 10), r));
    }
}
