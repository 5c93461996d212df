package org.microtally.count;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.ByteArrayInputStream;
import java.io.ByteArrayOutputStream;
import java.io.ObjectInputStream;
import java.io.ObjectOutputStream;
import java.math.BigInteger;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import org.junit.jupiter.api.Test;
import org.microtally.spectrum.Level;
import org.microtally.spectrum.Spectra;
import org.microtally.spectrum.Spectrum;
import org.microtally.spectrum.Statistics;
import org.microtally.units.EnergyScale;

/**
 * The multi-modular path of labelled tables and species mixes against the BigInteger path (an
 * independent implementation of the same recursion in exact integers) and against closed forms.
 */
class LabelledPrimePlanTest {
    private static final Statistics[] ALL = {Statistics.BOSE, Statistics.FERMI, Statistics.DISTINGUISHABLE,
            Statistics.maxOccupancy(3)};

    /** A random labelled spectrum: integer energies 0..maxLevelEnergy, degeneracies 1..4, labels -3..3. */
    private static Spectrum randomSpectrum(Random rnd, int levels, int maxLevelEnergy) {
        List<Level> out = new ArrayList<>();
        for (int i = 0; i < levels; i++) {
            out.add(new Level(rnd.nextInt(maxLevelEnergy + 1), 1 + rnd.nextInt(4), rnd.nextInt(7) - 3));
        }
        out.sort((a, b) -> Double.compare(a.energy(), b.energy()));
        return Spectrum.of(out, EnergyScale.abstractUnit("quanta"), true, Double.POSITIVE_INFINITY, "");
    }

    private static void assertSameTable(LabelledCountTable want, LabelledCountTable got, String what) {
        assertEquals(want.minLabelTotal(), got.minLabelTotal(), what);
        assertEquals(want.maxLabelTotal(), got.maxLabelTotal(), what);
        for (int n = 0; n <= want.maxParticles(); n++) {
            for (int e = 0; e <= want.maxEnergy(); e++) {
                for (int l = want.minLabelTotal(); l <= want.maxLabelTotal(); l++) {
                    assertEquals(want.truncatedModelCount(n, e, l), got.truncatedModelCount(n, e, l),
                            what + " n=" + n + " e=" + e + " L=" + l);
                }
            }
        }
        assertEquals(want.rows(), got.rows(), what);
    }

    private static void assertSameMix(SpeciesMix want, SpeciesMix got, String what) {
        assertEquals(want.minLabelTotal(), got.minLabelTotal(), what);
        assertEquals(want.maxLabelTotal(), got.maxLabelTotal(), what);
        assertEquals(want.completeThroughEnergy(), got.completeThroughEnergy(), what);
        assertEquals(want.rows(), got.rows(), what);
    }

    @Test
    void randomTablesEqualTheBigIntegerPathEntryByEntry() {
        Random rnd = new Random(20261202L);
        for (int trial = 0; trial < 24; trial++) {
            Spectrum s = randomSpectrum(rnd, 1 + rnd.nextInt(6), 4);
            Statistics st = ALL[trial % ALL.length];
            int n = rnd.nextInt(7);
            int e = rnd.nextInt(13);
            // Source: the BigInteger recursion of LabelledCountTable.of (exact integers, no modular step)
            assertSameTable(LabelledCountTable.of(s, st, n, e), LabelledCountTable.multiModular(s, st, n, e),
                    "trial " + trial + " " + st);
            assertSameTable(LabelledCountTable.ignoringEnergy(s, st, n),
                    LabelledCountTable.multiModularIgnoringEnergy(s, st, n), "ignoring energy, trial " + trial);
        }
    }

    @Test
    void countsWiderThanOnePrimeAreReconstructedExactly() {
        // 60 distinguishable spin-1 moments: entries up to 3^60 / sqrt(...) ~ 2^93, so at least two primes
        LabelledPrimePlan plan = LabelledPrimePlan.forTableIgnoringEnergy(Spectra.spinInField(1),
                Statistics.DISTINGUISHABLE, 60, 1);
        assertTrue(plan.requiredPrimes() >= 2, plan.toString());
        LabelledCountTable t = plan.table(plan.residuesLocally());
        BigInteger sum = BigInteger.ZERO;
        for (int m = t.minLabelTotal(); m <= t.maxLabelTotal(); m++) {
            sum = sum.add(t.countAtLabel(60, m));
        }
        // Source: closed form, 3^N states of N distinguishable spin-1 moments
        assertEquals(BigInteger.valueOf(3).pow(60), sum);
        // Source: closed form, the M = 0 count of N spin-1 moments is the central trinomial coefficient,
        // sum_k C(N, 2k) C(2k, k) (OEIS A002426)
        BigInteger central = BigInteger.ZERO;
        for (int k = 0; 2 * k <= 60; k++) {
            central = central.add(CountTableTest.binomial(60, 2 * k).multiply(CountTableTest.binomial(2 * k, k)));
        }
        assertEquals(central, t.countAtLabel(60, 0));
        assertSameTable(LabelledCountTable.ignoringEnergy(Spectra.spinInField(1), Statistics.DISTINGUISHABLE, 60), t,
                "spin-1 x 60");
    }

    @Test
    void mixesEqualTheBigIntegerPath() {
        Random rnd = new Random(77L);
        for (int trial = 0; trial < 10; trial++) {
            List<Species> species = new ArrayList<>();
            int count = 1 + rnd.nextInt(3);
            for (int i = 0; i < count; i++) {
                species.add(new Species("s" + i, randomSpectrum(rnd, 1 + rnd.nextInt(4), 3), ALL[rnd.nextInt(4)],
                        rnd.nextInt(4)));
            }
            int e = rnd.nextInt(10);
            // Source: the BigInteger convolution of SpeciesMix.of, an independent exact implementation
            assertSameMix(SpeciesMix.of(species, e), SpeciesMix.multiModular(species, e), "trial " + trial);
            assertSameMix(SpeciesMix.ignoringEnergy(species), SpeciesMix.multiModularIgnoringEnergy(species),
                    "ignoring energy, trial " + trial);
        }
        // a truncated spectrum: the completeness limit is carried over unchanged
        Spectrum orbit = Spectra.harmonicOscillator(2, 6);
        List<Species> dot = List.of(new Species("up", orbit, Statistics.FERMI, 3),
                new Species("down", orbit, Statistics.FERMI, 2));
        assertSameMix(SpeciesMix.of(dot, 10), SpeciesMix.multiModular(dot, 10), "dot");
    }

    @Test
    void aCorruptedResidueIsRefusedAndAPlanSurvivesSerialization() throws Exception {
        Spectrum osc = Spectra.oscillator2dByAngularMomentum(8);
        LabelledPrimePlan plan = LabelledPrimePlan.forTable(osc, Statistics.BOSE, 6, 8, 1);
        ByteArrayOutputStream bytes = new ByteArrayOutputStream();
        try (ObjectOutputStream out = new ObjectOutputStream(bytes)) {
            out.writeObject(plan);
        }
        LabelledPrimePlan copy;
        try (ObjectInputStream in = new ObjectInputStream(new ByteArrayInputStream(bytes.toByteArray()))) {
            copy = (LabelledPrimePlan) in.readObject();
        }
        long[][] res = new long[plan.primeCount()][];
        for (int i = 0; i < res.length; i++) {
            res[i] = copy.residues(i);          // computed by the copy, as a worker would
        }
        // Source: the BigInteger recursion of LabelledCountTable.of
        assertSameTable(LabelledCountTable.of(osc, Statistics.BOSE, 6, 8), plan.table(res), "from a copy's residues");
        assertThrows(IllegalStateException.class, () -> copy.table(res));
        long[][] bad = res.clone();
        bad[0] = res[0].clone();
        int j = bad[0].length / 2;
        bad[0][j] = (bad[0][j] + 1) % plan.prime(0);
        assertTrue(assertThrows(IllegalStateException.class, () -> plan.table(bad)).getMessage()
                .contains("CRT consistency check failed"));
    }
}
