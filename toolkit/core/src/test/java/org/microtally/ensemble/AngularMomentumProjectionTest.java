package org.microtally.ensemble;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.math.BigInteger;
import org.junit.jupiter.api.Test;
import org.microtally.InvalidInputException;
import org.microtally.count.LabelledCountTable;
import org.microtally.spectrum.ShellOrbits;
import org.microtally.spectrum.Spectra;
import org.microtally.spectrum.Spectrum;
import org.microtally.spectrum.Statistics;
import org.microtally.units.EnergyScale;

class AngularMomentumProjectionTest {
    private static final EnergyScale MEV = EnergyScale.abstractUnit("MeV");

    @Test
    void degenerateSevenHalvesShellGivesTheMultipletCounts() {
        Spectrum f72 = ShellOrbits.builder(MEV).orbit(0, 3, 7, 0.0).build().spectrum();
        AngularMomentumProjection p = AngularMomentumProjection.of(LabelledCanonical.of(f72, Statistics.FERMI, 4, 1.0));
        // Source: (7/2)^4 has J = 0, 2, 2, 4, 4, 5, 6, 8 (de-Shalit & Talmi, Nuclear Shell Theory; from memory)
        int[] multiplets = {1, 0, 2, 0, 2, 1, 1, 0, 1};
        double total = 0;
        for (int j = 0; j <= 8; j++) {
            if (multiplets[j] == 0) {
                assertFalse(p.hasJ(2 * j), "J=" + j);
            } else {
                assertEquals(Math.log(multiplets[j]), p.lnZAtJ(2 * j), 1e-12, "J=" + j);
                total += p.spinProbability(2 * j);
            }
        }
        // Source: common practice, no source (the spin distribution is normalised)
        assertEquals(1.0, total, 1e-13);
    }

    @Test
    void sdShellProjectionMatchesTheExactCountDifference() {
        Spectrum sd = ShellOrbits.sdShell(MEV, 0, 1, 3).spectrum();
        int n = 4;
        double kT = 0.7;
        AngularMomentumProjection p = AngularMomentumProjection.of(LabelledCanonical.of(sd, Statistics.FERMI, n, kT));
        LabelledCountTable t = LabelledCountTable.of(sd, Statistics.FERMI, n, 3 * n);
        int checked = 0;
        for (int twoJ = 0; twoJ <= 20; twoJ += 2) {
            double z = 0;
            for (int e = 0; e <= 3 * n; e++) {
                BigInteger d = t.count(n, e, twoJ).subtract(t.count(n, e, twoJ + 2));
                z += d.doubleValue() * Math.exp(-e / kT);
            }
            if (z == 0) {
                assertFalse(p.hasJ(twoJ));
                continue;
            }
            // Source: exact labelled counts (LabelledCountTable), Z(J) = sum_E [Omega(2M=2J) - Omega(2M=2J+2)] e^-E/kT
            assertEquals(Math.log(z), p.lnZAtJ(twoJ), 1e-10 * Math.max(1, Math.abs(Math.log(z))), "2J=" + twoJ);
            assertTrue(p.cancellation(twoJ) >= 1);
            checked++;
        }
        assertTrue(checked >= 6, "J values checked: " + checked);
    }

    @Test
    void brokenSymmetryIsRefused() {
        assertThrows(InvalidInputException.class, () -> AngularMomentumProjection.of(
                LabelledCanonical.of(Spectra.spinInField(1.5), Statistics.FERMI, 2, 1.0)));
        Spectrum d52 = ShellOrbits.builder(MEV).orbit(0, 2, 5, 0.0).build().spectrum();
        assertThrows(InvalidInputException.class, () -> AngularMomentumProjection.of(
                LabelledCanonical.inField(d52, Statistics.FERMI, 2, 1.0, 0.1)));
        AngularMomentumProjection p = AngularMomentumProjection.of(LabelledCanonical.of(d52, Statistics.FERMI, 2, 1.0));
        assertThrows(InvalidInputException.class, () -> p.lnZAtJ(2 * 5));
    }
}
