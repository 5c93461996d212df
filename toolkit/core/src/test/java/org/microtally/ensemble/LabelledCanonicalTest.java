package org.microtally.ensemble;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.microtally.InvalidInputException;
import org.microtally.exact.Combinatorics;
import org.microtally.count.LabelledCountTable;
import org.microtally.spectrum.Level;
import org.microtally.spectrum.Spectra;
import org.microtally.spectrum.Spectrum;
import org.microtally.spectrum.Statistics;
import org.microtally.units.EnergyScale;

class LabelledCanonicalTest {

    /** 2J + 1 degenerate states at energy 0 labelled 2m: a free spin J. */
    private static Spectrum freeSpin(int twoJ) {
        List<Level> levels = new ArrayList<>();
        for (int tm = -twoJ; tm <= twoJ; tm += 2) {
            levels.add(new Level(0, 1, tm));
        }
        return Spectrum.of(levels, EnergyScale.abstractUnit("muB*B"), true, Double.POSITIVE_INFINITY, "");
    }

    @Test
    void fixedLabelPartitionFunctionsMatchTheExactLabelledCounts() {
        Spectrum dot = Spectra.oscillator2dByAngularMomentum(5);
        for (Statistics st : List.of(Statistics.FERMI, Statistics.BOSE, Statistics.maxOccupancy(2),
                Statistics.DISTINGUISHABLE)) {
            int n = 4;
            double kT = 0.9;
            double h = 0.35;
            LabelledCountTable t = LabelledCountTable.of(dot, st, n, n * 5);
            LabelledCanonical c = LabelledCanonical.of(dot, st, n, kT);
            LabelledCanonical f = LabelledCanonical.inField(dot, st, n, kT, h);
            for (int l = t.minLabelTotal(); l <= t.maxLabelTotal(); l++) {
                double z = 0;
                double e1 = 0;
                for (int e = 0; e <= n * 5; e++) {
                    double w = t.truncatedModelCount(n, e, l).doubleValue() * Math.exp(-e / kT);
                    z += w;
                    e1 += w * e;
                }
                if (z == 0) {
                    assertFalse(c.hasLabel(l), st + " L=" + l);
                    continue;
                }
                // Source: independent exact counts Omega(N, E, L) (LabelledCountTable, BigInteger), Z(L) = sum_E Omega e^-E/kT
                assertEquals(Math.log(z), c.lnZAtLabel(l), 1e-12 * Math.max(1, Math.abs(Math.log(z))), st + " L=" + l);
                assertEquals(e1 / z, c.energyAtLabel(l), 1e-11 * Math.max(1, e1 / z), st + " L=" + l);
                // Source: same counts; the field enters Z(L) as e^{beta h L} only
                assertEquals(Math.log(z) + h * l / kT, f.lnZAtLabel(l), 1e-11 * Math.max(1, Math.abs(Math.log(z))));
                assertEquals(c.entropyAtLabel(l), f.entropyAtLabel(l), 1e-10 * Math.max(1, c.entropyAtLabel(l)));
            }
        }
    }

    @Test
    void freeSpinsInAFieldFollowTheBrillouinFunction() {
        int twoJ = 3;
        int n = 40;
        double kT = 1.3;
        double h = 0.2;
        LabelledCanonical c = LabelledCanonical.inField(freeSpin(twoJ), Statistics.DISTINGUISHABLE, n, kT, h);
        double j = twoJ / 2.0;
        double x = 2 * h / kT;
        // Source: Brillouin function, <m> = J B_J(x J) = (2J+1)/2 coth((2J+1)x/2) - 1/2 coth(x/2) per spin,
        // x = 2 h / kT for the coupling -h * 2m (Pathria & Beale, Statistical Mechanics, sect. 3.9; from memory)
        double meanM = (2 * j + 1) / 2 / Math.tanh((2 * j + 1) * x / 2) - 0.5 / Math.tanh(x / 2);
        assertEquals(2 * n * meanM, c.meanLabel(), 1e-11 * n);
        // Source: ln Z = N ln[sinh((2J+1)x/2) / sinh(x/2)] (same)
        double lnZ1 = Math.log(Math.sinh((2 * j + 1) * x / 2) / Math.sinh(x / 2));
        assertEquals(n * lnZ1, c.lnZ(), 1e-12 * n * lnZ1);
        // Source: d<L>/dh = beta Var L, checked by a central difference of the closed form
        double dh = 1e-5;
        double up = 2 * n * ((2 * j + 1) / 2 / Math.tanh((2 * j + 1) * (x + 2 * dh / kT) / 2) - 0.5 / Math.tanh((x + 2 * dh / kT) / 2));
        double dn = 2 * n * ((2 * j + 1) / 2 / Math.tanh((2 * j + 1) * (x - 2 * dh / kT) / 2) - 0.5 / Math.tanh((x - 2 * dh / kT) / 2));
        assertEquals((up - dn) / (2 * dh), c.susceptibility(), 1e-6 * c.susceptibility());
    }

    @Test
    void spinHalfMomentsAtFixedMagnetisationAreBinomial() {
        int n = 30;
        LabelledCanonical c = LabelledCanonical.of(freeSpin(1), Statistics.DISTINGUISHABLE, n, 1.0);
        for (int k = 0; k <= n; k++) {
            // Source: closed form Omega(2M = 2k - N) = C(N, k) for N labelled spin-1/2 moments (zero energy)
            assertEquals(Math.log(Combinatorics.binomial(n, k).doubleValue()), c.lnZAtLabel(2 * k - n), 1e-12 * n);
        }
        assertFalse(c.hasLabel(1 - n));
    }

    @Test
    void farTailsAreRefusedAndAFieldBringsThemBack() {
        int n = 1100; // P(all up) = 2^-1100 ~ e^-762, below the flushing tolerance
        LabelledCanonical c = LabelledCanonical.of(freeSpin(1), Statistics.DISTINGUISHABLE, n, 1.0);
        InvalidInputException ex = assertThrows(InvalidInputException.class, () -> c.lnZAtLabel(n));
        assertTrue(ex.getMessage().contains("field"), ex.getMessage());
        assertFalse(c.warnings().isEmpty());
        double h = 3.0;
        LabelledCanonical f = LabelledCanonical.inField(freeSpin(1), Statistics.DISTINGUISHABLE, n, 1.0, h);
        // Source: closed form, one microstate with every moment up: Z(L = N) = e^{beta h N}
        assertEquals(h * n, f.lnZAtLabel(n), 1e-12 * h * n);
        // Source: closed form ln Z(L = N - 2) = ln N + beta h (N - 2) (one moment flipped)
        assertEquals(Math.log(n) + h * (n - 2), f.lnZAtLabel(n - 2), 1e-12 * h * n);
    }

    @Test
    void grandCanonicalInAFieldMatchesTheFermiFunction() {
        // one orbital at energy 0.4 holding spin up (label +1) and down (label -1)
        Spectrum orbital = Spectrum.of(List.of(new Level(0.4, 1, 1), new Level(0.4, 1, -1)),
                EnergyScale.abstractUnit("meV"), true, Double.POSITIVE_INFINITY, "");
        double kT = 0.25;
        double mu = 0.3;
        double h = 0.1;
        LabelledGrandCanonical g = LabelledGrandCanonical.inField(orbital, Statistics.FERMI, kT, mu, h);
        // Source: Fermi-Dirac occupation f(x) = 1/(e^{x/kT} + 1) of each spin state at e - h m - mu
        double up = 1 / (Math.exp((0.4 - h - mu) / kT) + 1);
        double dn = 1 / (Math.exp((0.4 + h - mu) / kT) + 1);
        assertEquals(up - dn, g.meanLabel(), 1e-15);
        assertEquals(up * (1 - up) + dn * (1 - dn), g.labelVariance(), 1e-15);
        assertEquals(up + dn, g.ensemble().meanNumber(), 1e-15);
        assertEquals(0.4 * (up + dn), g.energyWithoutField(), 1e-15);
    }

    @Test
    void badInputsAreRefused() {
        assertThrows(InvalidInputException.class, () -> LabelledCanonical.of(Spectra.twoLevel(1), Statistics.BOSE, 2, 1));
        assertThrows(InvalidInputException.class, () -> LabelledCanonical.inField(freeSpin(1), Statistics.FERMI, 3, 1, 0));
        assertThrows(InvalidInputException.class, () -> LabelledCanonical.inField(freeSpin(1), Statistics.BOSE, 2, 1,
                Double.NaN));
        assertThrows(InvalidInputException.class, () -> LabelledCanonical.of(freeSpin(1), Statistics.BOSE, 2, 0));
        assertThrows(InvalidInputException.class, () -> LabelledGrandCanonical.inField(Spectra.twoLevel(1),
                Statistics.FERMI, 1, 0, 0.1));
    }
}
