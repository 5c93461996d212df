package org.microtally.ensemble;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.math.BigInteger;
import java.util.List;
import java.util.Random;
import org.apache.commons.math3.fraction.BigFraction;
import org.apache.commons.math3.special.Gamma;
import org.junit.jupiter.api.Test;
import org.microtally.InvalidInputException;
import org.microtally.count.CountTable;
import org.microtally.occupation.LevelOccupations;
import org.microtally.spectrum.Level;
import org.microtally.spectrum.Spectra;
import org.microtally.spectrum.Spectrum;
import org.microtally.spectrum.Statistics;
import org.microtally.exact.Combinatorics;

class MicrocanonicalTest {

    @Test
    void twoLevelSystemsHaveNegativeBoltzmannTemperatureAboveHalfFilling() {
        int n = 20;
        Microcanonical mc = Microcanonical.of(Spectra.twoLevel(1.0), Statistics.DISTINGUISHABLE, n, n);
        for (int e = 1; e < n; e++) {
            // Source: closed form Omega(N, E) = C(N, E) for N two-level units with E excited
            assertEquals(binomial(n, e), mc.count(e));
            // Source: closed form of the central difference, beta_B = (1/2) ln[(N-E+1)(N-E) / ((E+1) E)]
            double expected = 0.5 * Math.log((double) (n - e + 1) * (n - e) / ((double) (e + 1) * e));
            assertEquals(expected, mc.boltzmannBeta(e), 1e-13);
            // Source: Dunkel & Hilbert, Nature Physics 10, 67 (2014): Boltzmann T < 0 above half filling,
            // Gibbs T > 0 everywhere
            assertEquals(e > n / 2, mc.isNegativeBoltzmannTemperature(e), "E = " + e);
            assertTrue(mc.gibbsBeta(e) > 0, "Gibbs beta at E = " + e);
        }
        assertEquals(0.0, mc.boltzmannBeta(n / 2), 1e-15);
        assertEquals(n + 1, mc.rows().size());
    }

    @Test
    void occupationsAreRightWhenExactFractionsExceedDoubleRange() {
        int n = 60;
        int e = 60;
        int[] en = {0, 1, 30};
        int[] g = {1, 1_000_003, 1};
        Spectrum s = Spectrum.of(new double[] {0, 1, 30}, g);
        Microcanonical mc = Microcanonical.of(s, Statistics.DISTINGUISHABLE, n, e);
        // Independent brute force: Omega(M, E) = [x^E] (1 + 1000003 x + x^30)^M by repeated polynomial multiplication
        BigInteger[] previous = {BigInteger.ONE};
        BigInteger[] current = previous;
        for (int m = 1; m <= n; m++) {
            previous = current;
            current = new BigInteger[previous.length + 30];
            java.util.Arrays.fill(current, BigInteger.ZERO);
            for (int k = 0; k < previous.length; k++) {
                for (int i = 0; i < 3; i++) {
                    current[k + en[i]] = current[k + en[i]].add(previous[k].multiply(BigInteger.valueOf(g[i])));
                }
            }
        }
        BigFraction top = mc.exactOccupations(e).get(2);
        // precondition of this test, not a result check: the reduced fraction of the top level has a numerator
        // within double range over a denominator beyond 2^1024, where BigFraction.doubleValue() gives 0.0
        assertTrue(top.getNumerator().bitLength() < 1000 && top.getDenominator().bitLength() > 1030,
                top.getNumerator().bitLength() + " / " + top.getDenominator().bitLength() + " bits");
        LevelOccupations occ = mc.occupations(e);
        for (int i = 0; i < 3; i++) {
            BigInteger num = BigInteger.valueOf(n).multiply(previous[e - en[i]]);
            // Source: closed form <n_s> = N Omega(N-1, E - e_i) / Omega(N, E) (distinguishable particles), with
            // the counts from the brute-force product above and the division by independent BigDecimal arithmetic
            double expected = new java.math.BigDecimal(num).divide(new java.math.BigDecimal(current[e]),
                    new java.math.MathContext(40)).doubleValue();
            assertEquals(expected, occ.perState(i), 0.0, "level " + i);
        }
        assertTrue(occ.perState(2) > 0, "top level occupation " + occ.perState(2));
    }

    @Test
    void einsteinSolidCountsAndCanonicalRoute() {
        int n = 30;
        int maxE = 400;
        Spectrum osc = Spectra.harmonicOscillator(1, maxE);
        Microcanonical mc = Microcanonical.of(osc, Statistics.DISTINGUISHABLE, n, maxE);
        // Source: closed form Omega(N, q) = C(q + N - 1, q) for N oscillators sharing q quanta
        for (int q : new int[] {0, 1, 7, 100, 400}) {
            assertEquals(binomial(q + n - 1, q), mc.count(q));
        }
        // exact count-table route to the canonical ensemble: Z = sum_E Omega(N,E) e^{-E/kT}, U, C from its moments
        for (double kT : new double[] {0.5, 1.0, 2.0}) {
            double lnZ = mc.canonicalLnZ(kT);
            double x = 1 / kT;
            // Source: closed form Einstein solid ln Z = -N ln(1 - e^{-x}), U = N/(e^x - 1), C = N x^2 e^x/(e^x-1)^2
            assertEquals(-n * Math.log(-Math.expm1(-x)), lnZ, 1e-12 * Math.abs(lnZ));
            double m1 = 0;
            double m2 = 0;
            for (int e = 0; e <= maxE; e++) {
                double p = Math.exp(mc.boltzmannEntropyOrMinusInfinity(e) - e * x - lnZ);
                m1 += e * p;
                m2 += (double) e * e * p;
            }
            assertEquals(n / Math.expm1(x), m1, 1e-10 * n);
            double c = (m2 - m1 * m1) * x * x;
            assertEquals(n * x * x * Math.exp(x) / Math.pow(Math.expm1(x), 2), c, 1e-8 * n);
            // and the canonical class agrees with the same closed forms and with the counts
            Canonical can = Canonical.of(osc, Statistics.DISTINGUISHABLE, n, kT);
            assertEquals(lnZ, can.lnZ(), 1e-12 * Math.abs(lnZ));
        }
    }

    @Test
    void canonicalPartitionFunctionEqualsLaplaceTransformOfTheCountTable() {
        Spectrum dot = Spectra.harmonicOscillator(2, 60);
        int n = 12;
        int maxE = 60;
        for (Statistics st : List.of(Statistics.FERMI, Statistics.BOSE, Statistics.maxOccupancy(2))) {
            CountTable table = CountTable.of(dot, st, n, maxE);
            Microcanonical mc = Microcanonical.of(table, n);
            double kT = 0.6;
            // Source: the exact count table (org.microtally.count, an independent integer algorithm):
            // Z_N = sum_E Omega(N, E) e^{-E/kT}; the tail beyond E = 60 is below e^{-60/0.6} relative
            Canonical can = Canonical.of(dot, st, n, kT);
            assertEquals(mc.canonicalLnZ(kT), can.lnZ(), 1e-12 * Math.abs(can.lnZ()), st.toString());
        }
    }

    @Test
    void exactOccupationsAtFixedEnergyMatchBruteForceAndSumRules() {
        Random rnd = new Random(4242);
        for (Statistics st : List.of(Statistics.FERMI, Statistics.BOSE, Statistics.maxOccupancy(2),
                Statistics.DISTINGUISHABLE)) {
            for (int trial = 0; trial < 6; trial++) {
                int levels = 3 + rnd.nextInt(3);
                Level[] ls = new Level[levels];
                int e = 0;
                for (int i = 0; i < levels; i++) {
                    ls[i] = new Level(e, 1 + rnd.nextInt(2));
                    e += 1 + rnd.nextInt(3);
                }
                Spectrum s = Spectrum.of(List.of(ls));
                int n = 2 + rnd.nextInt(3);
                int maxE = 14;
                Microcanonical mc = Microcanonical.of(s, st, n, maxE);
                for (int total = 0; total <= maxE; total++) {
                    if (!mc.isAccessible(total)) {
                        continue;
                    }
                    List<BigFraction> occ = mc.exactOccupations(total);
                    BigFraction sumN = BigFraction.ZERO;
                    BigFraction sumE = BigFraction.ZERO;
                    for (int i = 0; i < levels; i++) {
                        sumN = sumN.add(occ.get(i).multiply(s.degeneracy(i)));
                        sumE = sumE.add(occ.get(i).multiply(s.degeneracy(i)).multiply((int) s.energy(i)));
                    }
                    // Source: common practice, no source (exact sum rules: sum g_i <n_i> = N, sum g_i e_i <n_i> = E)
                    assertEquals(new BigFraction(n), sumN, st + " E=" + total);
                    assertEquals(new BigFraction(total), sumE, st + " E=" + total);
                    // Source: independent brute-force enumeration of the microstates with energy exactly E
                    BigFraction[] ref = bruteForceOccupations(s, st, n, total);
                    for (int i = 0; i < levels; i++) {
                        assertEquals(ref[i], occ.get(i), st + " E=" + total + " level " + i);
                    }
                }
            }
        }
    }

    @Test
    void heatCapacityOfTheEinsteinSolidFromTheBoltzmannEntropy() {
        int n = 50;
        Microcanonical mc = Microcanonical.of(Spectra.harmonicOscillator(1, 300), Statistics.DISTINGUISHABLE, n, 300);
        for (int q : new int[] {20, 100, 250}) {
            // Source: closed form S(q) = ln C(q + N - 1, q) (log-gamma), differentiated by the same central
            // differences as documented: beta = (S(q+1) - S(q-1))/2, C = -beta^2 / (S(q+1) - 2 S(q) + S(q-1))
            double sm = lnBinomial(q - 1 + n - 1, q - 1);
            double s0 = lnBinomial(q + n - 1, q);
            double sp = lnBinomial(q + 1 + n - 1, q + 1);
            double beta = (sp - sm) / 2;
            assertEquals(beta, mc.boltzmannBeta(q), 1e-11);
            assertEquals(-beta * beta / (sp - 2 * s0 + sm), mc.heatCapacity(q), 1e-6 * n);
            assertEquals(s0, mc.boltzmannEntropy(q), 1e-10 * s0);
        }
    }

    @Test
    void badInputNamesTheValue() {
        Microcanonical mc = Microcanonical.of(Spectra.twoLevel(1.0), Statistics.DISTINGUISHABLE, 5, 5);
        InvalidInputException e = assertThrows(InvalidInputException.class, () -> mc.boltzmannEntropy(9));
        assertTrue(e.getMessage().contains("= 9"), e.getMessage());
        assertThrows(InvalidInputException.class, () -> mc.boltzmannBeta(0));
        assertFalse(mc.hasBoltzmannTemperature(5));
        assertThrows(InvalidInputException.class, () -> Microcanonical.of(Spectra.twoLevel(1.0), Statistics.FERMI, 0, 3));
    }

    private static BigInteger binomial(int a, int b) {
        return org.microtally.exact.Combinatorics.binomial(a, b);
    }

    private static double lnBinomial(int a, int b) {
        return Gamma.logGamma(a + 1.0) - Gamma.logGamma(b + 1.0) - Gamma.logGamma(a - b + 1.0);
    }

    /** Mean occupation per state of each level over all microstates with energy exactly E, by enumeration. */
    private static BigFraction[] bruteForceOccupations(Spectrum s, Statistics st, int n, int energy) {
        int states = (int) s.stateCount();
        int[] lvl = new int[states];
        int k = 0;
        for (int i = 0; i < s.size(); i++) {
            for (int d = 0; d < s.degeneracy(i); d++) {
                lvl[k++] = i;
            }
        }
        long[] occ = new long[s.size()];
        long[] count = {0};
        if (st.indistinguishable()) {
            int cap = st.capped() ? st.maxOccupancy() : n;
            enumerate(s, lvl, 0, n, energy, cap, new int[states], occ, count);
        } else {
            int[] assign = new int[n];
            long total = 1;
            for (int p = 0; p < n; p++) {
                total *= states;
            }
            for (long code = 0; code < total; code++) {
                long c = code;
                int e = 0;
                for (int p = 0; p < n; p++) {
                    assign[p] = (int) (c % states);
                    c /= states;
                    e += (int) s.energy(lvl[assign[p]]);
                }
                if (e == energy) {
                    count[0]++;
                    for (int p = 0; p < n; p++) {
                        occ[lvl[assign[p]]]++;
                    }
                }
            }
        }
        BigFraction[] out = new BigFraction[s.size()];
        for (int i = 0; i < s.size(); i++) {
            out[i] = new BigFraction(BigInteger.valueOf(occ[i]), BigInteger.valueOf(count[0] * s.degeneracy(i)));
        }
        return out;
    }

    private static void enumerate(Spectrum s, int[] lvl, int state, int left, int energyLeft, int cap, int[] cfg,
                                  long[] occ, long[] count) {
        if (state == lvl.length) {
            if (left == 0 && energyLeft == 0) {
                count[0]++;
                for (int t = 0; t < cfg.length; t++) {
                    occ[lvl[t]] += cfg[t];
                }
            }
            return;
        }
        int e = (int) s.energy(lvl[state]);
        for (int m = 0; m <= Math.min(cap, left) && m * e <= energyLeft; m++) {
            cfg[state] = m;
            enumerate(s, lvl, state + 1, left - m, energyLeft - m * e, cap, cfg, occ, count);
        }
        cfg[state] = 0;
    }
}
