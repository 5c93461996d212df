package org.microtally.ensemble;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.math.BigDecimal;
import java.math.MathContext;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import java.util.stream.Stream;
import org.junit.jupiter.api.RepeatedTest;
import org.junit.jupiter.api.RepetitionInfo;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import org.microtally.occupation.LevelOccupations;
import org.microtally.spectrum.Level;
import org.microtally.spectrum.Spectra;
import org.microtally.spectrum.Spectrum;
import org.microtally.spectrum.Statistics;

class CanonicalTest {

    private static Spectrum randomSpectrum(Random rnd, int levels, int maxDeg) {
        List<Level> list = new ArrayList<>();
        double e = rnd.nextDouble() - 0.5;
        for (int i = 0; i < levels; i++) {
            list.add(new Level(e, 1 + rnd.nextInt(maxDeg)));
            e += 0.05 + rnd.nextDouble();
        }
        return Spectrum.of(list);
    }

    static Stream<Arguments> statistics() {
        return Stream.of(Arguments.of(Statistics.BOSE), Arguments.of(Statistics.FERMI),
                Arguments.of(Statistics.maxOccupancy(2)), Arguments.of(Statistics.DISTINGUISHABLE));
    }

    @ParameterizedTest
    @MethodSource("statistics")
    void smallSystemsAgreeWithBruteForceEnumeration(Statistics st) {
        Random rnd = new Random(20261201L + st.maxOccupancy());
        for (int trial = 0; trial < 12; trial++) {
            Spectrum s = randomSpectrum(rnd, 2 + rnd.nextInt(3), 2);
            int n = 1 + rnd.nextInt(st.indistinguishable() ? 5 : 4);
            if (st.capped() && n > st.maxOccupancy() * s.stateCount()) {
                n = (int) (st.maxOccupancy() * s.stateCount());
            }
            double kT = 0.2 + 2 * rnd.nextDouble();
            Canonical c = Canonical.of(s, st, n, kT);
            // Source: independent brute-force enumeration of all N-particle microstates (BruteForce, in this test)
            BruteForce ref = new BruteForce(s, st, n, kT);
            String ctx = st + " n=" + n + " kT=" + kT + " " + s.levels();
            ref.assertThermodynamicsMatch(c, n, ctx);
            LevelOccupations occ = c.occupations();
            for (int i = 0; i < s.size(); i++) {
                assertEquals(ref.perLevel[i], occ.perState(i), 1e-12 * Math.max(1e-3, ref.perLevel[i]), ctx + " level " + i);
            }
            for (int j = 0; j <= n; j++) {
                assertEquals(ref.groundLevelDistribution[j], c.groundLevelDistribution().probability(j), 1e-12,
                        ctx + " P(N0=" + j + ")");
            }
        }
    }

    @RepeatedTest(5)
    void occupationsSumToN(RepetitionInfo info) {
        Random rnd = new Random(77L * info.getCurrentRepetition());
        Spectrum s = randomSpectrum(rnd, 30, 6);
        for (Statistics st : List.of(Statistics.BOSE, Statistics.FERMI, Statistics.maxOccupancy(3),
                Statistics.DISTINGUISHABLE)) {
            int n = 5 + rnd.nextInt(60);
            Canonical c = Canonical.of(s, st, n, 0.3 + rnd.nextDouble());
            // Source: common practice, no source (sum rule: the level totals add up to N)
            assertEquals(n, c.occupations().total(), 1e-11 * n, st.toString());
        }
    }

    @Test
    void checkpointedPrefixesGiveTheSameOccupations() {
        Random rnd = new Random(99);
        Spectrum s = randomSpectrum(rnd, 45, 3);
        for (Statistics st : List.of(Statistics.FERMI, Statistics.maxOccupancy(2))) {
            Canonical stored = Canonical.of(s, st, 30, 0.7);
            Canonical checkpointed = CanonicalSeries.cappedWithPrefixLimit(s, st, 30, 0.7, 0);
            // Source: common practice, no source (the same exact computation with prefixes recomputed block-wise
            // from sqrt(M) checkpoints must reproduce the stored-prefix result)
            for (int i = 0; i < s.size(); i++) {
                assertEquals(stored.occupations().perState(i), checkpointed.occupations().perState(i),
                        1e-13 * stored.occupations().perState(i) + 1e-300, st + " level " + i);
                assertEquals(stored.vacancies().perState(i), checkpointed.vacancies().perState(i),
                        1e-13 * stored.vacancies().perState(i) + 1e-300, st + " level " + i);
            }
            assertEquals(stored.groundLevelDistribution().variance(), checkpointed.groundLevelDistribution().variance(),
                    1e-12 * stored.groundLevelDistribution().variance());
        }
    }

    @Test
    void distinguishablePartitionFunctionIsSingleParticleToThePowerN() {
        Spectrum s = Spectrum.of(new double[] {0, 0.7, 1.9}, new int[] {1, 2, 1});
        double kT = 0.8;
        int n = 4;
        // Source: independent brute force over all 4^4 assignments of 4 labelled particles to the 4 states;
        // closed form Z_N = Z_1^N for independent labelled particles
        BruteForce ref = new BruteForce(s, Statistics.DISTINGUISHABLE, n, kT);
        double z1 = 1 + 2 * Math.exp(-0.7 / kT) + Math.exp(-1.9 / kT);
        assertEquals(n * Math.log(z1), ref.lnZ(n), 1e-12);
        assertEquals(n * Math.log(z1), Canonical.of(s, Statistics.DISTINGUISHABLE, n, kT).lnZ(), 1e-12);
    }

    @Test
    void schottkyHeatCapacityPeak() {
        Spectrum two = Spectra.twoLevel(1.0);
        double bestC = 0;
        double bestT = 0;
        for (double t = 0.30; t <= 0.55; t += 0.0005) {
            double c = Canonical.of(two, Statistics.DISTINGUISHABLE, 1, t).heatCapacity();
            if (c > bestC) {
                bestC = c;
                bestT = t;
            }
        }
        // Source: closed form of the Schottky anomaly, C/k = x^2 e^x/(1+e^x)^2 with x = Delta/kT; its maximum is
        // C/k = 0.4392 at kT/Delta = 0.4168 (the root of x tanh(x/2) = 2)
        assertEquals(0.4392, bestC, 1e-4);
        assertEquals(0.4168, bestT, 1e-3);
        // one Fermi particle on the same two levels is the same system
        // Source: closed form, C/k = x^2 e^x/(1+e^x)^2
        double x = 1 / 0.5;
        assertEquals(x * x * Math.exp(x) / Math.pow(1 + Math.exp(x), 2),
                Canonical.of(two, Statistics.FERMI, 1, 0.5).heatCapacity(), 1e-12);
    }

    @Test
    void einsteinSolidClosedForms() {
        Spectrum osc = Spectra.harmonicOscillator(1, 400);
        int n = 300;
        for (double kT : new double[] {0.3, 1.0, 4.0}) {
            Canonical c = Canonical.of(osc, Statistics.DISTINGUISHABLE, n, kT);
            double x = 1 / kT;
            // Source: closed form of the Einstein solid (excitation energies): U = N/(e^x - 1),
            // C/k = N x^2 e^x / (e^x - 1)^2, x = hbar omega / kT
            assertEquals(n / Math.expm1(x), c.energy(), 1e-11 * n);
            assertEquals(n * x * x * Math.exp(x) / Math.pow(Math.expm1(x), 2), c.heatCapacity(), 1e-10 * n);
        }
    }

    /** 50 fermions in a 2D oscillator (open shell) at low T against a 50-digit reference. */
    @Test
    void fermionsAtLowTemperatureMatch50DigitReferenceWhileAlternatingRecursionFails() {
        Spectrum s = Spectra.harmonicOscillator(2, 14);
        int n = 50;
        double kT = 0.12;
        Canonical c = Canonical.of(s, Statistics.FERMI, n, kT);

        // Source: independent evaluation of the elementary symmetric polynomial e_N of the Boltzmann factors,
        // state by state, in BigDecimal with MathContext(50) (no scaling, no grouping, no renormalisation)
        MathContext mc = new MathContext(50);
        List<BigDecimal> weights = new ArrayList<>();
        for (int i = 0; i < s.size(); i++) {
            BigDecimal w = bigExp(-s.energy(i) / kT, mc);
            for (int d = 0; d < s.degeneracy(i); d++) {
                weights.add(w);
            }
        }
        BigDecimal[] e = elementary(weights, -1, n, mc);
        double refLnZ = bigLn(e[n], mc);
        assertEquals(refLnZ, c.lnZ(), 1e-12 * Math.abs(refLnZ));
        // occupations, including the hole probabilities of deep levels
        int stateIndex = 0;
        for (int i = 0; i < s.size(); i++) {
            BigDecimal[] without = elementary(weights, stateIndex, n, mc);
            BigDecimal hole = without[n].divide(e[n], mc);
            BigDecimal particle = BigDecimal.ONE.subtract(hole, mc);
            double holeRef = hole.doubleValue();
            double occRef = particle.doubleValue();
            assertEquals(occRef, c.occupations().perState(i), 1e-12 * occRef, "level " + i);
            assertEquals(holeRef, c.vacancies().perState(i), 1e-12 * holeRef, "hole of level " + i);
            stateIndex += s.degeneracy(i);
        }
        // Source: Borrmann & Franke, J. Chem. Phys. 98, 2484 (1993): the alternating recursion in doubles, same
        // fugacity scaling; it cancels catastrophically for fermions
        double[] alt = AlternatingRecursion.lnScaledPartitionFunctions(s, Statistics.FERMI, n, kT,
                c.referenceChemicalPotential());
        double altLnZ = alt[n] - n * c.referenceChemicalPotential() / kT;
        boolean failed = Double.isNaN(altLnZ) || Math.abs(altLnZ - refLnZ) > 1e-3 * Math.abs(refLnZ);
        assertTrue(failed, "alternating recursion unexpectedly accurate: " + altLnZ + " vs " + refLnZ);
        // at N = 3 and high temperature it is still fine (so the comparison is of the method, not of a bug)
        double[] altSmall = AlternatingRecursion.lnScaledPartitionFunctions(s, Statistics.FERMI, 3, 5.0, 0.0);
        assertEquals(Canonical.of(s, Statistics.FERMI, 3, 5.0).lnZ(), altSmall[3], 1e-9);
    }

    /** e_0..e_n of the weights, skipping index {@code skip} (or none if -1). */
    private static BigDecimal[] elementary(List<BigDecimal> w, int skip, int n, MathContext mc) {
        BigDecimal[] e = new BigDecimal[n + 1];
        java.util.Arrays.fill(e, BigDecimal.ZERO);
        e[0] = BigDecimal.ONE;
        for (int s = 0; s < w.size(); s++) {
            if (s == skip) {
                continue;
            }
            for (int m = n; m >= 1; m--) {
                e[m] = e[m].add(w.get(s).multiply(e[m - 1], mc), mc);
            }
        }
        return e;
    }

    /** e^x for moderate |x| by argument halving and a Taylor series, to mc's precision. */
    static BigDecimal bigExp(double x, MathContext mc) {
        MathContext wide = new MathContext(mc.getPrecision() + 20);
        BigDecimal a = new BigDecimal(x).divide(BigDecimal.valueOf(1024), wide);
        BigDecimal term = BigDecimal.ONE;
        BigDecimal sum = BigDecimal.ONE;
        for (int k = 1; k < 200; k++) {
            term = term.multiply(a, wide).divide(BigDecimal.valueOf(k), wide);
            sum = sum.add(term, wide);
        }
        for (int i = 0; i < 10; i++) {
            sum = sum.multiply(sum, wide);
        }
        return sum.round(mc);
    }

    /** ln of a positive BigDecimal as a double (exponent split off exactly). */
    static double bigLn(BigDecimal v, MathContext mc) {
        int shift = v.precision() - v.scale() - 1;
        BigDecimal mant = v.movePointLeft(shift);
        return Math.log(mant.doubleValue()) + shift * Math.log(10);
    }

    @Test
    void largeSystemAtVeryLowTemperatureGivesFiniteLogs() {
        Spectrum s = Spectra.harmonicOscillator(3, 40);
        int n = 10_000;
        for (double kT : new double[] {0.002, 1e-5}) {
            for (Statistics st : List.of(Statistics.FERMI, Statistics.BOSE)) {
                Canonical c = Canonical.of(s, st, n, kT);
                GroundState g = Canonical.groundState(s, st, n);
                // Source: closed form T -> 0 limit, F -> E_ground: -kT ln Z = E_0 - kT ln(degeneracy) + O(e^-gap/kT)
                assertTrue(Double.isFinite(c.lnZ()), st.toString());
                assertEquals(g.energy() - kT * g.entropy(), c.freeEnergy(), 1e-9 * Math.max(1, g.energy()),
                        st + " kT=" + kT);
                assertEquals(n, c.occupations().total(), 1e-8 * n);
            }
        }
    }

    @Test
    void groundStateOfALabelledSpectrumCountsWholeEnergyShells() {
        // the 2D oscillator resolved by m holds one level per label at each energy
        Spectrum byM = Spectra.oscillator2dByAngularMomentum(8);
        for (Statistics st : List.of(Statistics.FERMI, Statistics.BOSE, Statistics.maxOccupancy(2),
                Statistics.DISTINGUISHABLE)) {
            for (int n = 1; n <= 7; n++) {
                GroundState g = Canonical.groundState(byM, st, n);
                // Source: independent brute force: the exact count table's lowest non-empty energy and its count
                org.microtally.count.CountTable t = org.microtally.count.CountTable.of(byM, st, n, 30);
                int e0 = 0;
                while (t.isZero(n, e0)) {
                    e0++;
                }
                assertEquals(e0, g.energy(), 0.0, st + " N=" + n);
                assertEquals(t.count(n, e0), g.degeneracy(), st + " N=" + n);
                assertEquals(n, g.occupations().total(), 1e-12, st + " N=" + n);
            }
        }
    }

    @Test
    void canonicalAndGrandCanonicalConvergeAsOneOverN() {
        // Fermions in a 3D oscillator at kT = 1: energy per particle, canonical vs grand canonical
        Spectrum s = Spectra.harmonicOscillator(3, 60);
        double[] diff = new double[3];
        int[] ns = {80, 320, 1280};
        for (int k = 0; k < ns.length; k++) {
            int n = ns[k];
            double kT = 0.5 * Math.cbrt(n);
            Canonical c = Canonical.of(s, Statistics.FERMI, n, kT);
            GrandCanonical g = GrandCanonical.ofMeanNumber(s, Statistics.FERMI, kT, n);
            diff[k] = Math.abs(c.entropy() - g.entropy()) / n;
        }
        // Source: common practice, no source (ensemble equivalence: per-particle differences are O(ln N / N))
        // quadrupling N should shrink the per-particle difference by about 4 (allow 2.5 to 6)
        for (int k = 1; k < ns.length; k++) {
            double ratio = diff[k - 1] / diff[k];
            assertTrue(ratio > 2.5 && ratio < 6, "ratio " + ratio + " diffs " + java.util.Arrays.toString(diff));
        }
    }

    @Test
    void truncatedSpectrumWarnsWithTopLevelOccupation() {
        Spectrum s = Spectra.harmonicOscillator(1, 5);
        Canonical hot = Canonical.of(s, Statistics.BOSE, 10, 3.0);
        assertFalse(hot.warnings().isEmpty());
        String w = hot.warnings().get(0);
        double top = hot.occupations().levelTotal(5);
        assertTrue(w.contains(String.format("%.3g", top)), w);
        Canonical cold = Canonical.of(s, Statistics.BOSE, 10, 0.1);
        assertTrue(cold.warnings().isEmpty(), cold.warnings().toString());
    }
}
