package org.microtally.count;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.math.BigInteger;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.microtally.InvalidInputException;
import org.microtally.spectrum.Level;
import org.microtally.spectrum.Spectra;
import org.microtally.spectrum.Spectrum;
import org.microtally.spectrum.Statistics;

class BinnedCountsTest {

    @Test
    void everyMicrostateLiesWithinTheStatedSmearingOfItsBin() {
        // real energies: sqrt(2) k + 0.3 sin(k), no common quantum
        List<Level> levels = new ArrayList<>();
        for (int k = 0; k < 9; k++) {
            levels.add(new Level(Math.sqrt(2) * k + 0.3 * Math.sin(k), 1 + k % 2));
        }
        Spectrum real = Spectrum.of(levels);
        double delta = 0.5;
        int n = 3;
        BinnedCounts b = BinnedCounts.of(List.of(new Species("atoms", real, Statistics.BOSE, n)), delta, 40);
        // the rounded spectrum, rebuilt here, and every one of its microstates listed
        List<Level> rounded = new ArrayList<>();
        double e0 = real.groundEnergy();
        for (Level l : real.levels()) {
            rounded.add(new Level(Math.rint((l.energy() - e0) / delta), l.degeneracy()));
        }
        MicrostateEnumerator en = MicrostateEnumerator.of(Spectrum.of(rounded), Statistics.BOSE);
        double worst = 0;
        for (int k = 0; k <= 40; k++) {
            int[] levelOf = en.stateLevels(k);
            long[] listed = {0};
            final int bin = k;
            double[] dev = {0};
            en.microstates(n, k).forEach(m -> {
                double e = 0;
                for (int s = 0; s < m.length; s++) {
                    e += m[s] * real.energy(levelOf[s]);
                }
                dev[0] = Math.max(dev[0], Math.abs(e - b.energy(bin)));
                listed[0]++;
            });
            // Source: independent brute force, every microstate listed with its true (unrounded) energy
            assertEquals(BigInteger.valueOf(listed[0]), b.count(k), "bin " + k);
            worst = Math.max(worst, dev[0]);
        }
        assertTrue(worst <= b.smearing() + 1e-12, worst + " > " + b.smearing());
        assertTrue(b.smearing() <= n * delta / 2);
    }

    @Test
    void exactGridSpectraHaveNoSmearingAndReproduceTheCountTable() {
        Spectrum dot = Spectra.harmonicOscillator(2, 12);
        BinnedCounts b = BinnedCounts.of(List.of(new Species("e", dot, Statistics.FERMI, 6)), 1.0, 30);
        CountTable t = CountTable.of(dot, Statistics.FERMI, 6, 30);
        assertEquals(0.0, b.smearing());
        // the ground state of 6 fermions fills 0, 1, 1, 2, 2, 2: bin 0 is E = 8
        assertEquals(8.0, b.energy(0));
        for (int k = 0; k <= 22; k++) {
            // Source: the exact count table on the integer grid (CountTable)
            assertEquals(t.count(6, 8 + k), b.count(k));
        }
        // Source: common practice, no source (an omitted level above the cutoff 12 may round down to 12;
        // with five particles in their ground state (6 quanta) that microstate has 18 = bin 10)
        assertEquals(9, b.completeThroughBin());
    }

    @Test
    void twoKindFermiGasCountsFitTheBetheFormulaWithTheTheoreticalA() {
        // Excitations of a Fermi sea on equally spaced levels are counted by partitions of the excitation
        // energy (the bosonization identity, e.g. K. Schoenhammer and V. Meden, Am. J. Phys. 64, 1168
        // (1996), from memory); bosons on a ladder with N >= U count the same partitions from a ground
        // energy of 0, so two boson species give the two-kind Fermi gas counts without the Fermi sea.
        int u = 120;
        Spectrum ladder = Spectra.equallySpaced(u + 1, 1.0);
        BinnedCounts b = BinnedCounts.of(List.of(new Species("proton holes", ladder, Statistics.BOSE, u),
                new Species("neutron holes", ladder, Statistics.BOSE, u)), 1.0, u);
        // Source: OEIS A000712 (partitions of n into parts of 2 kinds): 1, 2, 5, 10, 20, 36, 65, 110
        long[] a712 = {1, 2, 5, 10, 20, 36, 65, 110};
        for (int k = 0; k < a712.length; k++) {
            assertEquals(BigInteger.valueOf(a712[k]), b.count(k));
        }
        LevelDensityFit fit = LevelDensityFit.fit(b, 40, u);
        // Source: Bethe (Phys. Rev. 50, 332 (1936)): a = pi^2 g / 6 with g = 2 single-particle states per
        // unit energy (two kinds, unit spacing), from memory
        assertEquals(Math.PI * Math.PI / 3, fit.a(), 0.01 * Math.PI * Math.PI / 3);
        assertTrue(fit.rmsResidual() < 0.01, "rms " + fit.rmsResidual());
        assertEquals(fit.lnStateDensityAt(100), LevelDensityFit.lnStateDensity(fit.a(), fit.backShift(), 100), 1e-12);
        LevelDensityFit bethe = LevelDensityFit.fitBethe(b, 40, u);
        // Source: the same theoretical a (Bethe 1936); without the shift the fit absorbs the finite-U
        // corrections into a, so it is looser (5 %)
        assertEquals(Math.PI * Math.PI / 3, bethe.a(), 0.05 * Math.PI * Math.PI / 3);
        assertEquals(0.0, bethe.backShift());
    }

    @Test
    void twoKindFermiSeaExcitationsAreCountedFromTheGroundState() {
        int n = 40;
        Spectrum ladder = Spectra.equallySpaced(2 * n, 1.0);
        BinnedCounts b = BinnedCounts.of(List.of(new Species("protons", ladder, Statistics.FERMI, n),
                new Species("neutrons", ladder, Statistics.FERMI, n)), 1.0, n);
        // Source: common practice, no source (two filled Fermi seas 0 + 1 + ... + 39)
        assertEquals(2.0 * n * (n - 1) / 2, b.energy(0));
        // partitions p(k) by the standard recurrence over parts, then the two-kind convolution
        long[] p = new long[n + 1];
        p[0] = 1;
        for (int part = 1; part <= n; part++) {
            for (int k = part; k <= n; k++) {
                p[k] += p[k - part];
            }
        }
        // Source: OEIS A000041, p(40) = 37338 (anchors the recurrence)
        assertEquals(37338L, p[40]);
        for (int k = 0; k <= n; k++) {
            long two = 0;
            for (int j = 0; j <= k; j++) {
                two += p[j] * p[k - j];
            }
            // Source: OEIS A000712 (partitions into parts of 2 kinds) = excitations of two equidistant
            // Fermi seas (Schoenhammer & Meden, Am. J. Phys. 64, 1168 (1996), from memory)
            assertEquals(BigInteger.valueOf(two), b.count(k), "k=" + k);
        }
    }

    @Test
    void badInputsAreRefused() {
        Spectrum s = Spectrum.ofEnergies(0, 0.7, 1.9);
        List<Species> one = List.of(new Species("a", s, Statistics.BOSE, 2));
        assertThrows(InvalidInputException.class, () -> BinnedCounts.of(one, 0.0, 10));
        assertThrows(InvalidInputException.class, () -> BinnedCounts.of(one, 0.1, -1));
        assertThrows(InvalidInputException.class, () -> BinnedCounts.of(List.of(), 0.1, 10));
        BinnedCounts b = BinnedCounts.of(one, 0.1, 50);
        assertThrows(InvalidInputException.class, () -> LevelDensityFit.fit(b, 5, 3));
        assertThrows(InvalidInputException.class, () -> LevelDensityFit.lnStateDensity(1.0, 2.0, 1.0));
    }
}
