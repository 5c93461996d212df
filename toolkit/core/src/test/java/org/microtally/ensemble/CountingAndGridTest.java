package org.microtally.ensemble;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.math.BigDecimal;
import java.math.BigInteger;
import java.math.MathContext;
import org.apache.commons.math3.special.Gamma;
import org.junit.jupiter.api.Test;
import org.microtally.InvalidInputException;
import org.microtally.count.CountTable;
import org.microtally.spectrum.Spectra;
import org.microtally.spectrum.Spectrum;
import org.microtally.spectrum.Statistics;

/** Labelled vs corrected-Boltzmann counting in every ensemble; microcanonical temperatures without cancellation. */
class CountingAndGridTest {

    @Test
    void gibbsBetaOfFourHundredSpinOneMomentsKeepsItsTinyValue() {
        int n = 400;
        Microcanonical m = Microcanonical.of(Spectra.spinInField(1), Statistics.DISTINGUISHABLE, n, 602);
        // Source: independent brute force, trinomial counts Omega(N, E) = [x^E] (1 + x + x^2)^N by an exact
        // BigInteger polynomial power, then ln(cum(601)/cum(599)) / 2 in 60-digit BigDecimal (ln(1 + r) = r - r^2/2 + ...)
        BigInteger[] poly = {BigInteger.ONE};
        for (int k = 0; k < n; k++) {
            BigInteger[] next = new BigInteger[poly.length + 2];
            java.util.Arrays.fill(next, BigInteger.ZERO);
            for (int i = 0; i < poly.length; i++) {
                for (int j = 0; j < 3; j++) {
                    next[i + j] = next[i + j].add(poly[i]);
                }
            }
            poly = next;
        }
        BigInteger below = BigInteger.ZERO;
        for (int e = 0; e <= 599; e++) {
            below = below.add(poly[e]);
        }
        MathContext mc = new MathContext(60);
        BigDecimal r = new BigDecimal(poly[600].add(poly[601])).divide(new BigDecimal(below), mc);
        double expected = r.subtract(r.pow(2).divide(BigDecimal.valueOf(2), mc)).doubleValue() / 2;
        // Source: issue 9's report of the true value, 1.06e-36
        assertEquals(1.06e-36, expected, 0.01e-36);
        assertEquals(expected, m.gibbsBeta(600), 1e-14 * expected);
        // Source: same brute force, beta_B = ln(Omega(601)/Omega(599)) / 2 (negative: above half filling)
        double bB = (Math.log(new BigDecimal(poly[601]).divide(new BigDecimal(poly[599]), mc).doubleValue())) / 2;
        assertEquals(bB, m.boltzmannBeta(600), 1e-13 * Math.abs(bB));
    }

    @Test
    void unresolvedMicrocanonicalHeatCapacitiesAreFlaggedInTheComparison() {
        Spectrum trap = Spectra.harmonicOscillator(new int[] {4, 4, 1}, 60);
        CountTable counts = CountTable.of(trap, Statistics.BOSE, 20, 60);
        EnsembleComparison cmp = EnsembleComparison.overTemperatures(counts, 20, 1.5);
        // Source: common practice, no source (a central difference over a grid of a few quanta is not a
        // derivative: here C = -2.64 at E* = 5 for an ideal gas at positive temperature)
        assertTrue(cmp.notes().stream().anyMatch(s -> s.startsWith("kT = 1.5: the microcanonical C")),
                cmp.notes().toString());
        Microcanonical m = Microcanonical.of(counts, 20);
        assertFalse(m.isHeatCapacityResolved(5));
        assertTrue(m.rows().stream().anyMatch(r -> r.get(0).equals(5) && String.valueOf(r.get(6)).endsWith("(grid artefact?)")));
        CountTable spins = CountTable.of(Spectra.spinInField(1), Statistics.DISTINGUISHABLE, 20, 40);
        EnsembleComparison fine = EnsembleComparison.overTemperatures(spins, 20, 1.0);
        assertFalse(fine.notes().stream().anyMatch(s -> s.contains("not resolved")), fine.notes().toString());
    }

    @Test
    void correctedBoltzmannCountingShiftsLnZAndEntropyByLnNFactorialOnly() {
        Spectrum osc = Spectra.harmonicOscillator(1, 200);
        int n = 20;
        double kT = 5;
        Canonical labelled = Canonical.of(osc, Statistics.DISTINGUISHABLE, n, kT);
        Canonical classical = Canonical.of(osc, Statistics.DISTINGUISHABLE, n, kT, Counting.CORRECTED_BOLTZMANN);
        double lnNf = Gamma.logGamma(n + 1.0);
        // Source: closed form, Z_1 = 1/(1 - e^{-1/kT}) for the 1D oscillator (cut far above kT), Z_N = Z_1^N / N!
        double lnZ1 = -Math.log(-Math.expm1(-1 / kT));
        assertEquals(n * lnZ1 - lnNf, classical.lnZ(), 1e-12 * n * lnZ1);
        assertEquals(labelled.entropy() - lnNf, classical.entropy(), 1e-12 * labelled.entropy());
        assertEquals(labelled.energy(), classical.energy(), 0.0);
        assertEquals(labelled.heatCapacity(), classical.heatCapacity(), 0.0);
        assertEquals(Counting.CORRECTED_BOLTZMANN, classical.counting());
        assertThrows(InvalidInputException.class, () -> Canonical.of(osc, Statistics.BOSE, n, kT, Counting.LABELLED));
        Microcanonical mLab = Microcanonical.of(Spectra.harmonicOscillator(1, 60), Statistics.DISTINGUISHABLE, 10, 60);
        Microcanonical mCls = Microcanonical.of(Spectra.harmonicOscillator(1, 60), Statistics.DISTINGUISHABLE, 10, 60,
                Counting.CORRECTED_BOLTZMANN);
        // Source: closed form, Omega = C(E + N - 1, E) for N labelled oscillators (Einstein solid), divided by N!
        assertEquals(Math.log(2042975.0) - Math.log(3628800.0), mCls.boltzmannEntropy(16), 1e-12);
        assertEquals(mLab.boltzmannBeta(16), mCls.boltzmannBeta(16), 0.0);
    }

    @Test
    void theComparisonOfLabelledParticlesComparesLikeWithLike() {
        Spectrum osc = Spectra.harmonicOscillator(1, 400);
        int n = 20;
        double kT = 5;
        for (Counting counting : new Counting[] {Counting.CORRECTED_BOLTZMANN, Counting.LABELLED}) {
            EnsembleComparison cmp = EnsembleComparison.overTemperatures(osc, Statistics.DISTINGUISHABLE, n, counting, kT);
            EnsembleComparison.Row can = cmp.comparisonRows().get(0);
            EnsembleComparison.Row gc = cmp.comparisonRows().get(1);
            // Source: closed forms, S_canonical = N (ln Z_1 + beta U_1) - [ln N!], and the grand canonical
            // entropy at <N> = N differs from it only by the number fluctuation, O(ln N), not by ln N! ~ 42
            assertTrue(Math.abs(gc.entropy() - can.entropy()) < 3 * Math.log(n), counting + ": " + can + " vs " + gc);
        }
        // default for distinguishable particles: corrected Boltzmann in every row
        EnsembleComparison def = EnsembleComparison.overTemperatures(osc, Statistics.DISTINGUISHABLE, n, kT);
        assertEquals(EnsembleComparison.overTemperatures(osc, Statistics.DISTINGUISHABLE, n, Counting.CORRECTED_BOLTZMANN,
                kT).comparisonRows(), def.comparisonRows());
        // Source: closed form for labelled particles in the grand canonical ensemble, <N> = w/(1 - w) at w = z Z_1
        GrandCanonical lab = GrandCanonical.ofMeanNumber(osc, Statistics.DISTINGUISHABLE, kT, n, Counting.LABELLED);
        assertEquals(n, lab.meanNumber(), 1e-12 * n);
        assertEquals(n * (n + 1.0), lab.numberVariance(), 1e-10 * n * n);
        assertEquals(n * 1 / Math.expm1(1 / kT), lab.energy(), 1e-10 * n * kT);
        // Source: closed form, <N_0> = <N> p_0 with p_0 = 1/Z_1 = 1 - e^{-1/kT}
        assertEquals(n * -Math.expm1(-1 / kT), lab.groundLevelMean(), 1e-12 * n);
    }
}
