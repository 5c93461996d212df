package org.microtally.ensemble;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.junit.jupiter.api.Test;
import org.microtally.count.CountTable;
import org.microtally.spectrum.Spectra;
import org.microtally.spectrum.Spectrum;
import org.microtally.spectrum.Statistics;

class EnsembleComparisonTest {

    @Test
    void condensateFluctuationsCanonicalVersusGrandCanonical() {
        Spectrum trap = Spectra.harmonicOscillator(3, 60);
        int n = 1000;
        // ideal-gas T_c in an isotropic trap, kT_c = hbar omega (N / zeta(3))^(1/3); zeta(3) = 1.2020569031595942
        // Source: DLMF 25.6 / OEIS A002117 for zeta(3)
        double kTc = Math.cbrt(n / 1.2020569031595942);
        double kT = 0.5 * kTc;
        EnsembleComparison cmp = EnsembleComparison.overTemperatures(trap, Statistics.BOSE, n, kT);
        EnsembleComparison.Row can = cmp.comparisonRows().get(0);
        EnsembleComparison.Row gc = cmp.comparisonRows().get(1);
        // Source: Politzer, PRA 54, 5048 (1996): grand canonical Var N_0 = N_0 (N_0 + 1)
        assertEquals(gc.groundMean() * (gc.groundMean() + 1), gc.groundVariance(), 1e-9 * gc.groundVariance());
        // Source: Wilkens & Weiss, J. Mod. Opt. 44, 1801 (1997); Politzer (1996): below T_c the canonical
        // Var N_0 is the sum over excited states of n_k (n_k + 1) with n_k = 1/(e^{e_k/kT} - 1) (the "Maxwell demon"
        // ensemble: exact up to the probability, here below 1e-100, that the excited states hold all N particles)
        double sum = 0;
        for (int i = 1; i < trap.size(); i++) {
            double nk = 1 / Math.expm1(trap.energy(i) / kT);
            sum += trap.degeneracy(i) * nk * (nk + 1);
        }
        assertEquals(sum, can.groundVariance(), 1e-10 * sum);
        assertTrue(gc.groundVariance() > 100 * can.groundVariance(), gc + " vs " + can);
        // the two ensembles still agree on U to a few per cent
        assertTrue(Math.abs(gc.relEnergy()) < 0.05, gc.toString());
        assertEquals(11, cmp.columnNames().size());
        assertEquals(2, cmp.rows().size());
    }

    @Test
    void microcanonicalRowsFromTheCountTable() {
        int n = 200;
        int maxE = 700;
        Spectrum osc = Spectra.harmonicOscillator(1, maxE);
        CountTable table = CountTable.of(osc, Statistics.DISTINGUISHABLE, n, maxE);
        EnsembleComparison cmp = EnsembleComparison.overTemperatures(table, n, 1.0, 2.0);
        assertEquals(6, cmp.comparisonRows().size(), cmp.notes().toString());
        for (int t = 0; t < 2; t++) {
            EnsembleComparison.Row can = cmp.comparisonRows().get(3 * t);
            EnsembleComparison.Row micro = cmp.comparisonRows().get(3 * t + 2);
            assertEquals("microcanonical", micro.ensemble());
            double x = 1 / can.kT();
            // Source: closed form Einstein solid U = N/(e^x - 1), C = N x^2 e^x/(e^x - 1)^2 (canonical row)
            assertEquals(n / Math.expm1(x), can.energy(), 1e-10 * n);
            assertEquals(n * x * x * Math.exp(x) / Math.pow(Math.expm1(x), 2), can.heatCapacity(), 1e-8 * n);
            // Source: common practice, no source (ensemble equivalence: the microcanonical temperature at E ~ U and
            // its heat capacity differ from the canonical ones by O(1/N); allow 2 %)
            assertEquals(can.kT(), micro.ownKT(), 0.02 * can.kT());
            assertEquals(0, micro.relHeatCapacity(), 0.02);
            assertEquals(0, micro.relEnergy(), 0.5 / can.energy() + 1e-12);
        }
    }

    @Test
    void convergenceSweepDifferencesShrinkWithN() {
        Spectrum dot = Spectra.harmonicOscillator(2, 80);
        int[] ns = {20, 80, 320};
        EnsembleComparison.ConvergenceSweep sweep = EnsembleComparison.convergence(dot, Statistics.FERMI, ns,
                nn -> 0.3 * Math.sqrt(nn));
        List<EnsembleComparison.ConvergenceSweep.Point> p = sweep.points();
        // Source: common practice, no source (canonical and grand canonical per-particle quantities differ by
        // O(1/N)): quadrupling N must cut the relative energy difference by roughly 4 (accept 2.5..6)
        for (int k = 1; k < p.size(); k++) {
            double ratio = Math.abs(p.get(k - 1).grandCanonical().relEnergy() / p.get(k).grandCanonical().relEnergy());
            assertTrue(ratio > 2.5 && ratio < 6, "ratio " + ratio + " at N=" + p.get(k).n());
        }
        assertEquals(3, sweep.rows().size());
    }
}
