package org.microtally.spark;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import org.apache.spark.sql.SparkSession;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.microtally.ProgressListener;
import org.microtally.count.LabelledCountTable;
import org.microtally.count.LabelledPrimePlan;
import org.microtally.count.Species;
import org.microtally.count.SpeciesMix;
import org.microtally.spectrum.Level;
import org.microtally.spectrum.Spectra;
import org.microtally.spectrum.Spectrum;
import org.microtally.spectrum.Statistics;

class DistributedLabelledCountsTest {
    private static SparkSession spark;

    @BeforeAll
    static void start() {
        spark = SharedSpark.get();
    }

    /** The Halyard Bay dot's orbitals with every level labelled 2 S_z = spin. */
    private static Spectrum dotSpin(int spin, int cutoff) {
        Spectrum orbit = Spectra.harmonicOscillator(2, cutoff);
        List<Level> out = new ArrayList<>();
        for (Level l : orbit.levels()) {
            out.add(new Level(l.energy(), l.degeneracy(), spin));
        }
        return Spectrum.of(out, orbit.scale(), true, orbit.cutoffEnergy(), orbit.cutoffNote());
    }

    @Test
    void tablesEqualTheLocalBigIntegerTables() {
        Spectrum osc = Spectra.oscillator2dByAngularMomentum(14);
        for (Statistics st : new Statistics[] {Statistics.BOSE, Statistics.FERMI, Statistics.maxOccupancy(2),
                Statistics.DISTINGUISHABLE}) {
            LabelledCountTable d = DistributedLabelledCounts.table(spark, osc, st, 6, 14, ProgressListener.NONE);
            // Source: independent computation, the local BigInteger recursion (every non-zero entry and its position)
            assertEquals(LabelledCountTable.of(osc, st, 6, 14).rows(), d.rows(), st.toString());
        }
        // 40 spin-1 moments, energy ignored: counts up to 3^40 ~ 2^63.4, two primes
        LabelledCountTable spins = DistributedLabelledCounts.tableIgnoringEnergy(spark, Spectra.spinInField(1),
                Statistics.DISTINGUISHABLE, 40, ProgressListener.NONE);
        assertEquals(LabelledCountTable.ignoringEnergy(Spectra.spinInField(1), Statistics.DISTINGUISHABLE, 40).rows(),
                spins.rows());
    }

    @Test
    void spinResolvedDotMixEqualsTheLocalMix() {
        List<Species> dot = List.of(new Species("up", dotSpin(1, 12), Statistics.FERMI, 6),
                new Species("down", dotSpin(-1, 12), Statistics.FERMI, 5));
        SpeciesMix d = DistributedLabelledCounts.mix(spark, dot, 12, ProgressListener.NONE);
        SpeciesMix local = SpeciesMix.of(dot, 12);
        // Source: independent computation, the local BigInteger convolution of SpeciesMix.of
        assertEquals(local.rows(), d.rows());
        assertEquals(local.completeThroughEnergy(), d.completeThroughEnergy());
        List<Species> shell = List.of(new Species("p", Spectra.spinInField(2.5), Statistics.FERMI, 3),
                new Species("n", Spectra.spinInField(2.5), Statistics.FERMI, 2));
        assertEquals(SpeciesMix.ignoringEnergy(shell).rows(),
                DistributedLabelledCounts.mixIgnoringEnergy(spark, shell, ProgressListener.NONE).rows());
    }

    @Test
    void aCorruptedResidueIsRefused() {
        Spectrum osc = Spectra.oscillator2dByAngularMomentum(10);
        LabelledPrimePlan plan = LabelledPrimePlan.forTable(osc, Statistics.BOSE, 5, 10, 1);
        TaskFault corrupt = (task, attempt, result) -> {
            if (task == 0) {
                int j = result.length / 3;
                result[j] = (result[j] + 1) % plan.prime(0);
            }
            return result;
        };
        IllegalStateException ex = assertThrows(IllegalStateException.class,
                () -> plan.table(DistributedLabelledCounts.residues(spark, plan, ProgressListener.NONE, corrupt)));
        assertTrue(ex.getMessage().contains("CRT consistency check failed"), ex.getMessage());
    }
}
