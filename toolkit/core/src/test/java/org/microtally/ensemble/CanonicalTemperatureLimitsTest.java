package org.microtally.ensemble;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import org.microtally.InvalidInputException;
import org.microtally.spectrum.Level;
import org.microtally.spectrum.Spectra;
import org.microtally.spectrum.Spectrum;
import org.microtally.spectrum.Statistics;

/** The T -> 0 path (kT down to 1e-300) and negative temperatures on bounded spectra. */
class CanonicalTemperatureLimitsTest {
    private static final Statistics[] ALL = {Statistics.BOSE, Statistics.FERMI, Statistics.maxOccupancy(2),
            Statistics.DISTINGUISHABLE};

    @ParameterizedTest
    @ValueSource(doubles = {1e-300, 1e-100, 1e-10, 1.0 / 720})
    void tinyTemperaturesGiveTheGroundStateLimitWithANote(double kT) {
        Spectrum osc = Spectra.harmonicOscillator(3, 40);
        for (Statistics st : ALL) {
            Canonical c = Canonical.of(osc, st, 10, kT);
            GroundState gs = Canonical.groundState(osc, st, 10);
            // Source: closed forms of the 3D oscillator ground states (shells of 1, 3, 6 states):
            // bosons and labelled particles E_0 = 0, g = 1; fermions 1 + 3 + 6 filled, E_0 = 15, g = 1;
            // two per state: 2 + 6 filled and 2 in the 6 states of shell 2, E_0 = 10, g = C(6,2) + 6 = 21
            double e0 = st.kind() == Statistics.Kind.FERMI ? 15 : st.capped() ? 10 : 0;
            double g = st.capped() && st.maxOccupancy() == 2 ? 21 : 1;
            assertEquals(e0, gs.energy(), 0.0);
            assertEquals(e0, c.energy(), 1e-12, st.toString());
            assertEquals(Math.log(g), c.entropy(), 1e-15, st.toString());
            assertEquals(Math.log(g) - e0 / kT, c.lnZ(), 1e-15 * Math.abs(e0 / kT) + 1e-15, st.toString());
            assertEquals(0.0, c.heatCapacity(), 0.0, st.toString());
            assertEquals(0.0, c.energyVariance(), 0.0, st.toString());
            assertTrue(c.warnings().stream().anyMatch(w -> w.contains("T -> 0 limit")), c.warnings().toString());
            assertEquals(10, c.occupations().total(), 1e-12, st.toString());
        }
    }

    @Test
    void justAboveTheLimitTheComputedHeatCapacityMatchesTheOneExcitationAsymptote() {
        Spectrum osc = Spectra.harmonicOscillator(3, 40);
        double kT = 1.0 / 650;
        double w = 3 * Math.exp(-650.0);
        // Source: closed form, lowest excitation only: one boson in the 3 states of shell 1 (weight w),
        // so Var E = p (1 - p) with p = w/(1 + w) and C = (Delta/kT)^2 p (1 - p); next terms ~ e^-1300
        double expected = 650.0 * 650.0 * w / ((1 + w) * (1 + w));
        Canonical c = Canonical.of(osc, Statistics.BOSE, 10, kT);
        assertEquals(expected, c.heatCapacity(), 1e-9 * expected);
        assertTrue(c.warnings().isEmpty(), c.warnings().toString());
        // Source: same asymptote for 10 labelled particles, each excited independently: C = 10 (Delta/kT)^2 w
        Canonical d = Canonical.of(osc, Statistics.DISTINGUISHABLE, 10, kT);
        assertEquals(10 * expected, d.heatCapacity(), 1e-9 * 10 * expected);
    }

    @Test
    void negativeTemperaturesOnBoundedSpectraAgreeWithBruteForce() {
        Random rnd = new Random(20261202L);
        for (int trial = 0; trial < 12; trial++) {
            Statistics st = ALL[trial % ALL.length];
            List<Level> levels = new ArrayList<>();
            double e = rnd.nextDouble();
            int count = 2 + rnd.nextInt(3);
            for (int i = 0; i < count; i++) {
                levels.add(new Level(e, 1 + rnd.nextInt(2)));
                e += 0.1 + rnd.nextDouble();
            }
            Spectrum s = Spectrum.of(levels);
            int n = 1 + rnd.nextInt(4);
            if (st.capped()) {
                n = (int) Math.min(n, st.maxOccupancy() * s.stateCount());
            }
            double kT = -(0.2 + 2 * rnd.nextDouble());
            Canonical c = Canonical.of(s, st, n, kT);
            // Source: independent brute-force enumeration of every microstate with weights e^{-E/kT}, kT < 0
            BruteForce ref = new BruteForce(s, st, n, kT);
            String ctx = st + " n=" + n + " kT=" + kT + " " + s.levels();
            ref.assertThermodynamicsMatch(c, n, ctx);
            assertEquals(ref.varE / (kT * kT), c.heatCapacity(), 1e-10 * Math.max(1, ref.varE / (kT * kT)), ctx);
            for (int i = 0; i < s.size(); i++) {
                assertEquals(ref.perLevel[i], c.occupations().perState(i), 1e-12, ctx + " level " + i);
            }
        }
    }

    @Test
    void negativeTemperatureOfTwoLevelMomentsIsTheInvertedSchottkyGas() {
        Canonical c = Canonical.of(Spectra.twoLevel(1.0), Statistics.DISTINGUISHABLE, 100, -0.5);
        // Source: closed form for N independent two-level systems, U = N Delta / (1 + e^{Delta/kT})
        assertEquals(100 / (1 + Math.exp(-2.0)), c.energy(), 1e-12 * 100);
        assertThrows(InvalidInputException.class, c::groundLevelDistribution);
    }

    @Test
    void negativeTemperatureOnATruncatedSpectrumIsRefused() {
        InvalidInputException e = assertThrows(InvalidInputException.class,
                () -> Canonical.of(Spectra.harmonicOscillator(2, 40), Statistics.FERMI, 6, -1.0));
        // Source: common practice, no source (the message names the value and the remedy)
        assertTrue(e.getMessage().contains("-1.0") && e.getMessage().contains("truncated"), e.getMessage());
        assertThrows(InvalidInputException.class,
                () -> Canonical.of(Spectra.twoLevel(1.0), Statistics.FERMI, 1, 0.0));
    }

    @Test
    void theLimitSharesAPartlyFilledLowestShellAmongItsLevelsAsEnumerationDoes() {
        Random rnd = new Random(314L);
        for (int trial = 0; trial < 12; trial++) {
            Statistics st = ALL[trial % 3];
            List<Level> levels = new ArrayList<>();
            int shellStates = 0;
            int parts = 2 + rnd.nextInt(2);
            for (int l = 0; l < parts; l++) {
                int g = 1 + rnd.nextInt(2);
                levels.add(new Level(0, g, l - 1));
                shellStates += g;
            }
            levels.add(new Level(1.5, 2, 0));
            Spectrum s = Spectrum.of(levels, org.microtally.units.EnergyScale.abstractUnit("unit"), true,
                    Double.POSITIVE_INFINITY, "");
            int capacity = st.capped() ? st.maxOccupancy() * shellStates : 4;
            int n = 1 + rnd.nextInt(Math.min(4, capacity - 1));
            Canonical c = Canonical.of(s, st, n, 1e-200);
            // Source: independent brute-force enumeration at the same kT, where every excited microstate has
            // weight e^{-1.5e200} = 0 and the ground microstates (all in the lowest shell) weight 1
            BruteForce ref = new BruteForce(s, st, n, 1e-200);
            String ctx = st + " n=" + n + " " + s.levels();
            assertTrue(c.warnings().stream().anyMatch(w -> w.contains("T -> 0 limit")), ctx);
            for (int j = 0; j <= n; j++) {
                assertEquals(ref.groundLevelDistribution[j], c.groundLevelDistribution().probability(j), 1e-12,
                        ctx + " P(N0=" + j + ")");
            }
            for (int i = 0; i < s.size(); i++) {
                assertEquals(ref.perLevel[i], c.occupations().perState(i), 1e-12, ctx + " level " + i);
            }
        }
    }
}
