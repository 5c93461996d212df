package org.microtally.spark;

import java.util.List;
import org.apache.spark.sql.SparkSession;
import org.microtally.ProgressListener;
import org.microtally.count.LabelledCountTable;
import org.microtally.count.LabelledPrimePlan;
import org.microtally.count.Species;
import org.microtally.count.SpeciesMix;
import org.microtally.spectrum.Spectrum;
import org.microtally.spectrum.Statistics;

/**
 * Labelled count tables Omega(n, e, L) and species mixes Omega(e, L) computed on Spark: one task per
 * prime of {@link LabelledPrimePlan}, Chinese remaindering and the redundant-prime check on the
 * driver. The results are the core types themselves, entry by entry equal to
 * {@link LabelledCountTable#of} and {@link SpeciesMix#of} (tested by comparing every entry); the
 * formula, method, bound and sources are documented on {@link LabelledPrimePlan}.
 *
 * <p>Cost: one prime's share of the local work per task, plus (N+1)(E+1)W x 8 bytes per prime
 * shipped to the driver (W the label window), plus the driver's reconstruction. A task that throws
 * is retried by Spark; a wrong residue makes the check fail and the counts are refused with an
 * {@link IllegalStateException}.
 */
public final class DistributedLabelledCounts {
    private DistributedLabelledCounts() { }

    /** As {@link LabelledCountTable#of}(spectrum, statistics, N, E), tasks reported as stage {@code "primes"}. */
    public static LabelledCountTable table(SparkSession spark, Spectrum spectrum, Statistics statistics,
                                           int maxParticles, int maxEnergy, ProgressListener progress) {
        LabelledPrimePlan plan = LabelledPrimePlan.forTable(spectrum, statistics, maxParticles, maxEnergy, 1);
        return plan.table(residues(spark, plan, progress, TaskFault.NONE));
    }

    /** As {@link LabelledCountTable#ignoringEnergy}(spectrum, statistics, N). */
    public static LabelledCountTable tableIgnoringEnergy(SparkSession spark, Spectrum spectrum, Statistics statistics,
                                                         int maxParticles, ProgressListener progress) {
        LabelledPrimePlan plan = LabelledPrimePlan.forTableIgnoringEnergy(spectrum, statistics, maxParticles, 1);
        return plan.table(residues(spark, plan, progress, TaskFault.NONE));
    }

    /** As {@link SpeciesMix#of}(species, E). */
    public static SpeciesMix mix(SparkSession spark, List<Species> species, int maxEnergy, ProgressListener progress) {
        LabelledPrimePlan plan = LabelledPrimePlan.forMix(species, maxEnergy, 1);
        return plan.mix(residues(spark, plan, progress, TaskFault.NONE));
    }

    /** As {@link SpeciesMix#ignoringEnergy}(species). */
    public static SpeciesMix mixIgnoringEnergy(SparkSession spark, List<Species> species, ProgressListener progress) {
        LabelledPrimePlan plan = LabelledPrimePlan.forMixIgnoringEnergy(species, 1);
        return plan.mix(residues(spark, plan, progress, TaskFault.NONE));
    }

    static long[][] residues(SparkSession spark, LabelledPrimePlan plan, ProgressListener progress, TaskFault fault) {
        return PrimeTasks.run(spark, plan.primeCount(), plan::residues, "primes", progress, fault);
    }
}
