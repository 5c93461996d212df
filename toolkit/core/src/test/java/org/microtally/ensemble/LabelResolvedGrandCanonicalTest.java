package org.microtally.ensemble;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.util.List;
import org.junit.jupiter.api.Test;
import org.microtally.InvalidInputException;
import org.microtally.count.LabelledCountTable;
import org.microtally.spectrum.Level;
import org.microtally.spectrum.ShellOrbits;
import org.microtally.spectrum.Spectra;
import org.microtally.spectrum.Spectrum;
import org.microtally.spectrum.Statistics;
import org.microtally.units.EnergyScale;

class LabelResolvedGrandCanonicalTest {
    private static final Spectrum SD = ShellOrbits.sdShell(EnergyScale.abstractUnit("MeV"), 0, 1, 3).spectrum();

    @Test
    void fixedLabelGrandSumsMatchTheExactLabelledCounts() {
        for (Statistics st : List.of(Statistics.FERMI, Statistics.maxOccupancy(2))) {
            double kT = 0.8;
            double mu = 1.4;
            int cap = st.maxOccupancy() * 12;
            int maxE = cap * 3;
            LabelledCountTable t = LabelledCountTable.of(SD, st, cap, maxE);
            LabelResolvedGrandCanonical g = LabelResolvedGrandCanonical.of(SD, st, kT, mu, 0.0);
            double h = 0.15;
            LabelResolvedGrandCanonical f = LabelResolvedGrandCanonical.of(SD, st, kT, mu, h);
            for (int l = t.minLabelTotal(); l <= t.maxLabelTotal(); l++) {
                double xi = 0;
                double n1 = 0;
                double e1 = 0;
                for (int n = 0; n <= cap; n++) {
                    for (int e = 0; e <= maxE; e++) {
                        double w = t.count(n, e, l).doubleValue() * Math.exp(-(e - mu * n) / kT);
                        xi += w;
                        n1 += n * w;
                        e1 += e * w;
                    }
                }
                if (xi == 0) {
                    assertFalse(g.hasLabel(l), st + " L=" + l);
                    continue;
                }
                // Source: independent exact counts Omega(n, E, L) (LabelledCountTable, BigInteger)
                assertEquals(Math.log(xi), g.lnXiAtLabel(l), 1e-12 * Math.max(1, Math.abs(Math.log(xi))), st + " L=" + l);
                assertEquals(n1 / xi, g.meanNumberAtLabel(l), 1e-11 * n1 / xi, st + " L=" + l);
                assertEquals(e1 / xi, g.energyAtLabel(l), 1e-11 * Math.max(1, e1 / xi), st + " L=" + l);
                // Source: same counts, the field enters Xi(L) as e^{beta h L} only
                assertEquals(Math.log(xi) + h * l / kT, f.lnXiAtLabel(l), 1e-11 * Math.max(1, Math.abs(Math.log(xi))));
            }
            // Source: closed form product over independent states (LabelledGrandCanonical / GrandCanonical)
            assertEquals(LabelledGrandCanonical.inField(SD, st, kT, mu, h).ensemble().lnXi(), f.lnXi(), 1e-13);
        }
    }

    @Test
    void twoBosonModesOfOppositeLabelFollowTheGeometricSums() {
        Spectrum modes = Spectrum.of(List.of(new Level(0.2, 1, 1), new Level(0.5, 1, -1)),
                EnergyScale.abstractUnit("unit"), true, Double.POSITIVE_INFINITY, "");
        double kT = 1.0;
        double mu = -0.3;
        LabelResolvedGrandCanonical g = LabelResolvedGrandCanonical.of(modes, Statistics.BOSE, kT, mu, 0.0);
        double y1 = Math.exp(-(0.2 - mu) / kT);
        double y2 = Math.exp(-(0.5 - mu) / kT);
        double x = y1 * y2;
        for (int l = -6; l <= 6; l++) {
            // Source: closed form, Xi(L) = sum_b y1^(L+b) y2^b = y1^L / (1 - y1 y2) for L >= 0 (y2^|L| for L < 0),
            // <N>_L = |L| + 2 x / (1 - x) with x = y1 y2 (geometric series; common practice, no source)
            double lnXi = (l >= 0 ? l * Math.log(y1) : -l * Math.log(y2)) - Math.log1p(-x);
            assertEquals(lnXi, g.lnXiAtLabel(l), 1e-12 * Math.max(1, Math.abs(lnXi)), "L=" + l);
            assertEquals(Math.abs(l) + 2 * x / (1 - x), g.meanNumberAtLabel(l), 1e-11, "L=" + l);
        }
        // Source: closed form ln Xi = -ln(1 - y1) - ln(1 - y2) summed over all labels
        assertEquals(-Math.log1p(-y1) - Math.log1p(-y2), g.lnXi(), 1e-14);
    }

    @Test
    void uncappedOrTruncatedInputsAreRefused() {
        assertThrows(InvalidInputException.class, () -> LabelResolvedGrandCanonical.of(SD, Statistics.DISTINGUISHABLE, 1,
                -1, 0));
        assertThrows(InvalidInputException.class, () -> LabelResolvedGrandCanonical.of(SD, Statistics.BOSE, 1, 0.5, 0));
        assertThrows(InvalidInputException.class, () -> LabelResolvedGrandCanonical.of(
                Spectra.oscillator2dByAngularMomentum(4), Statistics.FERMI, 1, 1, 0));
        LabelResolvedGrandCanonical g = LabelResolvedGrandCanonical.of(SD, Statistics.FERMI, 1, 1, 0);
        // a total label no sd-shell microstate reaches (12 states with |2m| <= 5 stay within |2M| <= 60)
        assertThrows(InvalidInputException.class, () -> g.lnXiAtLabel(1000));
        assertFalse(g.hasLabel(1000));
    }
}
