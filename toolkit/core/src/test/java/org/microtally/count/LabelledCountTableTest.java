package org.microtally.count;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.math.BigInteger;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import org.junit.jupiter.api.Test;
import org.microtally.InvalidInputException;
import org.microtally.spectrum.Level;
import org.microtally.spectrum.Spectra;
import org.microtally.spectrum.Spectrum;
import org.microtally.spectrum.Statistics;
import org.microtally.units.EnergyScale;

class LabelledCountTableTest {

    /** A shell of j-orbitals: one state per (j, m), labelled by 2m, all at energy 0. */
    static Spectrum shell(int... twoJ) {
        List<Level> levels = new ArrayList<>();
        for (int tj : twoJ) {
            for (int tm = -tj; tm <= tj; tm += 2) {
                levels.add(new Level(0, 1, tm));
            }
        }
        return Spectrum.of(levels, EnergyScale.abstractUnit("MeV"), true, Double.POSITIVE_INFINITY, "");
    }

    /** Brute force: number of n-subsets of the labels with the given sum. */
    static long subsetsWithSum(int[] labels, int n, int sum) {
        long count = 0;
        int s = labels.length;
        for (long mask = 0; mask < (1L << s); mask++) {
            if (Long.bitCount(mask) != n) {
                continue;
            }
            int t = 0;
            for (int i = 0; i < s; i++) {
                if ((mask >> i & 1) == 1) {
                    t += labels[i];
                }
            }
            if (t == sum) {
                count++;
            }
        }
        return count;
    }

    /** One entry per single-particle state (levels with equal energy and label are merged, so expand g). */
    static int[] labels(Spectrum s) {
        int[] out = new int[(int) s.stateCount()];
        int k = 0;
        for (int i = 0; i < s.size(); i++) {
            for (int d = 0; d < s.degeneracy(i); d++) {
                out[k++] = s.label(i);
            }
        }
        return out;
    }

    @Test
    void mSchemeDimensionsOfSdAndPShellNuclei() {
        Spectrum sd = shell(5, 1, 3); // d5/2, s1/2, d3/2: 12 states
        Spectrum p = shell(3, 1);     // p3/2, p1/2: 6 states
        SpeciesMix mg24 = SpeciesMix.ignoringEnergy(List.of(new Species("protons", sd, Statistics.FERMI, 4),
                new Species("neutrons", sd, Statistics.FERMI, 4)));
        SpeciesMix si28 = SpeciesMix.ignoringEnergy(List.of(new Species("protons", sd, Statistics.FERMI, 6),
                new Species("neutrons", sd, Statistics.FERMI, 6)));
        SpeciesMix c12 = SpeciesMix.ignoringEnergy(List.of(new Species("protons", p, Statistics.FERMI, 4),
                new Species("neutrons", p, Statistics.FERMI, 4)));
        // from memory: the widely quoted sd-shell M-scheme dimensions of 24Mg (28503) and 28Si (93710), and 51 for
        // 12C in the p shell; each also checked by brute force below
        assertEquals(BigInteger.valueOf(28503), mg24.countAtLabel(0));
        assertEquals(BigInteger.valueOf(93710), si28.countAtLabel(0));
        assertEquals(BigInteger.valueOf(51), c12.countAtLabel(0));
        int[] sdLabels = labels(sd);
        assertEquals(12, sdLabels.length);
        // Source: independent brute force: sum over proton label P of (#4-subsets with sum P) (#4-subsets with sum -P)
        long brute = 0;
        for (int pm = -20; pm <= 20; pm++) {
            brute += subsetsWithSum(sdLabels, 4, pm) * subsetsWithSum(sdLabels, 4, -pm);
        }
        assertEquals(BigInteger.valueOf(brute), mg24.countAtLabel(0));
        // Source: closed form: the sum over all M of the dimension is C(12, 4)^2
        BigInteger all = BigInteger.ZERO;
        for (int m = mg24.minLabelTotal(); m <= mg24.maxLabelTotal(); m++) {
            all = all.add(mg24.countAtLabel(m));
        }
        assertEquals(CountTableTest.binomial(12, 4).pow(2), all);
        assertEquals(all, mg24.total());
    }

    @Test
    void twoIdenticalFermionsInAJ72ShellCoupleToEvenJOnly() {
        LabelledCountTable t = LabelledCountTable.ignoringEnergy(shell(7), Statistics.FERMI, 2);
        // Source: two identical fermions in one j = 7/2 shell couple to J = 0, 2, 4, 6 only (standard
        // angular-momentum result, from memory), so the number of states with projection M is #{J >= |M|}
        long[] byM = {4, 3, 3, 2, 2, 1, 1};
        for (int m = 0; m <= 6; m++) {
            assertEquals(BigInteger.valueOf(byM[m]), t.countAtLabel(2, 2 * m), "M = " + m);
            assertEquals(BigInteger.valueOf(byM[m]), t.countAtLabel(2, -2 * m), "M = -" + m);
        }
        assertEquals(BigInteger.ZERO, t.countAtLabel(2, 14));
        assertEquals(List.of("n", "label total", "Omega"), t.columnNames());
    }

    @Test
    void labelResolvedCountsSumToTheUnlabelledCount() {
        Spectrum osc = Spectra.oscillator2dByAngularMomentum(12);
        Statistics[] all = {Statistics.BOSE, Statistics.FERMI, Statistics.DISTINGUISHABLE, Statistics.maxOccupancy(2)};
        for (Statistics st : all) {
            LabelledCountTable lt = LabelledCountTable.of(osc, st, 5, 12);
            CountTable ct = CountTable.of(Spectra.harmonicOscillator(2, 12), st, 5, 12);
            for (int n = 0; n <= 5; n++) {
                for (int e = 0; e <= 12; e++) {
                    // Source: the 2D oscillator's (n, m) states are its Cartesian states regrouped (degeneracy n + 1)
                    assertEquals(ct.count(n, e), lt.countAllLabels(n, e), st + " n=" + n + " e=" + e);
                    for (int m = lt.minLabelTotal(); m <= lt.maxLabelTotal(); m++) {
                        // common practice, no source: m -> -m is a symmetry of the spectrum, so of the counts
                        assertEquals(lt.count(n, e, m), lt.count(n, e, -m));
                    }
                }
            }
        }
    }

    @Test
    void spinClusterMagnetisationIsBinomial() {
        // 12 distinguishable spin-1/2 moments, energy unconstrained: states with total 2M = 2k - 12 number C(12, k)
        Spectrum spin = Spectra.spinInField(0.5);
        LabelledCountTable t = LabelledCountTable.ignoringEnergy(spin, Statistics.DISTINGUISHABLE, 12);
        for (int k = 0; k <= 12; k++) {
            // Source: closed form C(N, N_up) (Schroeder, Sec. 2.1)
            assertEquals(CountTableTest.binomial(12, k), t.countAtLabel(12, 2 * k - 12));
        }
        // spin-1 moments: the number of states with total M is the trinomial coefficient (OEIS A027907 row 4: 1,4,10,16,19,...)
        LabelledCountTable s1 = LabelledCountTable.ignoringEnergy(Spectra.spinInField(1), Statistics.DISTINGUISHABLE, 4);
        long[] row = {1, 4, 10, 16, 19, 16, 10, 4, 1};
        for (int i = 0; i < row.length; i++) {
            // Source: OEIS A027907 (trinomial coefficients), row 4
            assertEquals(BigInteger.valueOf(row[i]), s1.countAtLabel(4, 2 * (i - 4)));
        }
    }

    @Test
    void spinResolvedElectronsInTheQuantumDot() {
        // Halyard Bay dot: spin-up and spin-down electrons in the 2D oscillator, labelled 2 S_z = +-1 per electron
        Spectrum orbit = Spectra.harmonicOscillator(2, 6);
        List<Level> up = new ArrayList<>();
        List<Level> down = new ArrayList<>();
        for (Level l : orbit.levels()) {
            up.add(new Level(l.energy(), l.degeneracy(), 1));
            down.add(new Level(l.energy(), l.degeneracy(), -1));
        }
        Spectrum su = Spectrum.of(up, orbit.scale(), true, orbit.cutoffEnergy(), orbit.cutoffNote());
        Spectrum sdn = Spectrum.of(down, orbit.scale(), true, orbit.cutoffEnergy(), orbit.cutoffNote());
        Random rnd = new Random(5L);
        for (int trial = 0; trial < 6; trial++) {
            int nu = rnd.nextInt(5);
            int nd = rnd.nextInt(5);
            SpeciesMix mix = SpeciesMix.of(List.of(new Species("up", su, Statistics.FERMI, nu),
                    new Species("down", sdn, Statistics.FERMI, nd)), 6);
            CountTable cu = CountTable.of(orbit, Statistics.FERMI, nu, 6);
            CountTable cd = CountTable.of(orbit, Statistics.FERMI, nd, 6);
            for (int e = 0; e <= 6; e++) {
                BigInteger conv = BigInteger.ZERO;
                for (int e1 = 0; e1 <= e; e1++) {
                    conv = conv.add(cu.count(nu, e1).multiply(cd.count(nd, e - e1)));
                }
                // Source: independent convolution of two unlabelled count tables; all weight at 2S_z = nu - nd
                assertEquals(conv, mix.count(e, nu - nd));
                assertEquals(BigInteger.ZERO, mix.count(e, nu - nd + 2));
            }
        }
        SpeciesMix two = SpeciesMix.of(List.of(new Species("up", su, Statistics.FERMI, 2),
                new Species("down", sdn, Statistics.FERMI, 2)), 6);
        assertTrue(two.rows().size() > 0);
        assertEquals(List.of("E", "label total", "Omega"), two.columnNames());
    }

    @Test
    void badInputIsRefused() {
        Spectrum osc = Spectra.oscillator2dByAngularMomentum(4);
        assertThrows(InvalidInputException.class, () -> LabelledCountTable.of(osc, Statistics.BOSE, -1, 3));
        assertThrows(InvalidInputException.class, () -> LabelledCountTable.ignoringEnergy(osc, Statistics.BOSE, -2));
        assertTrue(assertThrows(InvalidInputException.class,
                () -> LabelledCountTable.of(Spectra.spinInField(500), Statistics.BOSE, 2000, 2000))
                .getMessage().contains("MiB"));
        assertThrows(InvalidInputException.class, () -> new Species("x", osc, Statistics.FERMI, -1));
        assertThrows(InvalidInputException.class, () -> SpeciesMix.of(List.of(), 3));
    }
}
