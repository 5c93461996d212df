package org.microtally.ensemble;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.math.BigDecimal;
import java.math.BigInteger;
import java.math.MathContext;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import org.microtally.spectrum.Level;
import org.microtally.spectrum.Spectrum;
import org.microtally.spectrum.Statistics;

/** Whole levels multiplied in by their closed-form factor (cost per level, not per state). */
class LevelFactorTest {

    /**
     * Two levels (0 and 1) of g states each at kT = 1/ln 2, so e^{-1/kT} = 1/2 exactly and
     * Z_N 2^N = sum_j W(g, j) W(g, N - j) 2^j is an exact integer (j particles in the lower level).
     */
    @ParameterizedTest
    @ValueSource(ints = {10_000_000, Integer.MAX_VALUE})
    void twoHugeLevelsAgreeWithTheExactRationalSum(int g) {
        int n = 1000;
        double kT = 1 / Math.log(2);
        Spectrum s = Spectrum.of(new double[] {0, 1}, new int[] {g, g});
        for (boolean fermi : new boolean[] {true, false}) {
            BigInteger[] w = new BigInteger[n + 1];
            w[0] = BigInteger.ONE;
            for (int j = 1; j <= n; j++) {
                long top = fermi ? (long) g - j + 1 : (long) g + j - 1;
                w[j] = w[j - 1].multiply(BigInteger.valueOf(top)).divide(BigInteger.valueOf(j));
            }
            BigInteger z = BigInteger.ZERO;
            BigInteger e1 = BigInteger.ZERO;
            BigInteger e2 = BigInteger.ZERO;
            for (int j = 0; j <= n; j++) {
                BigInteger t = w[j].multiply(w[n - j]).shiftLeft(j);
                z = z.add(t);
                e1 = e1.add(t.multiply(BigInteger.valueOf(n - j)));
                e2 = e2.add(t.multiply(BigInteger.valueOf((long) (n - j) * (n - j))));
            }
            MathContext mc = new MathContext(40);
            BigDecimal zd = new BigDecimal(z);
            double u = new BigDecimal(e1).divide(zd, mc).doubleValue();
            double var = new BigDecimal(e2).divide(zd, mc).subtract(new BigDecimal(e1).divide(zd, mc).pow(2), mc)
                    .doubleValue();
            // ln Z = ln(z) - N ln 2, ln z from the exact integer's bit length
            int shift = Math.max(0, z.bitLength() - 60);
            double lnZ = Math.log(z.shiftRight(shift).doubleValue()) + shift * Math.log(2) - n * Math.log(2);
            Canonical c = Canonical.of(s, fermi ? Statistics.FERMI : Statistics.BOSE, n, kT);
            String ctx = (fermi ? "FERMI" : "BOSE") + " g=" + g;
            // Source: exact rational sum by the binomial theorem / negative binomial series (closed form),
            // evaluated in BigInteger and 40-digit BigDecimal
            assertEquals(lnZ, c.lnZ(), 1e-12 * Math.abs(lnZ), ctx);
            assertEquals(u, c.energy(), 1e-11 * u, ctx);
            assertEquals(var, c.energyVariance(), 1e-10 * var, ctx);
        }
    }

    /** A level of g states split into several labelled levels at the same energy takes the per-state path. */
    @Test
    void closedFormLevelsAgreeWithSingleStateStepsOnRandomSpectra() {
        Random rnd = new Random(1402L);
        for (int trial = 0; trial < 9; trial++) {
            Statistics st = new Statistics[] {Statistics.FERMI, Statistics.BOSE, Statistics.maxOccupancy(3)}[trial % 3];
            int n = 30 + rnd.nextInt(20);
            List<Level> whole = new ArrayList<>();
            List<Level> split = new ArrayList<>();
            double e = 0;
            for (int i = 0; i < 3; i++) {
                int parts = 12;
                int part = 40 + rnd.nextInt(20);
                whole.add(new Level(e, parts * part, 0));
                for (int p = 0; p < parts; p++) {
                    split.add(new Level(e, part, p));
                }
                e += 0.3 + rnd.nextDouble();
            }
            Spectrum a = Spectrum.of(whole);
            Spectrum b = Spectrum.of(split, a.scale(), true, Double.POSITIVE_INFINITY, "");
            double kT = 0.3 + rnd.nextDouble();
            int cap = st.capped() ? st.maxOccupancy() : Integer.MAX_VALUE;
            // the whole levels take the closed form, the parts single-state steps
            assertEquals(true, LevelFactor.pays(a.degeneracy(0), cap, n), ctx(st, n, whole));
            assertEquals(false, LevelFactor.pays(b.degeneracy(0), cap, n), ctx(st, n, whole));
            Canonical ca = Canonical.of(a, st, n, kT);
            Canonical cb = Canonical.of(b, st, n, kT);
            String ctx = st + " n=" + n + " kT=" + kT + " " + whole;
            // Source: independent route, the same spectrum as small levels multiplied in one state at a time
            assertEquals(cb.lnZ(), ca.lnZ(), 1e-12 * Math.abs(cb.lnZ()), ctx);
            assertEquals(cb.energy(), ca.energy(), 1e-11 * Math.abs(cb.energy()), ctx);
            assertEquals(cb.heatCapacity(), ca.heatCapacity(), 1e-10 * cb.heatCapacity(), ctx);
            for (int i = 0; i < a.size(); i++) {
                assertEquals(cb.occupations().perState(12 * i), ca.occupations().perState(i),
                        1e-12 * Math.max(1e-3, ca.occupations().perState(i)), ctx + " level " + i);
            }
        }
    }

    private static String ctx(Statistics st, int n, List<Level> levels) {
        return st + " n=" + n + " " + levels;
    }

    @Test
    void cappedWaysAgreesWithAStateByStateCount() {
        Random rnd = new Random(7L);
        for (int trial = 0; trial < 40; trial++) {
            int g = 1 + rnd.nextInt(12);
            int k = 1 + rnd.nextInt(4);
            int r = rnd.nextInt(g * k + 3);
            // Source: independent brute force, dynamic programme over the g states (0..k particles each)
            BigInteger[] ways = new BigInteger[r + 1];
            java.util.Arrays.fill(ways, BigInteger.ZERO);
            ways[0] = BigInteger.ONE;
            for (int st = 0; st < g; st++) {
                for (int t = r; t >= 1; t--) {
                    for (int j = 1; j <= Math.min(k, t); j++) {
                        ways[t] = ways[t].add(ways[t - j]);
                    }
                }
            }
            assertEquals(ways[r], Statistics.maxOccupancy(k).levelWays(g, r), "g=" + g + " k=" + k + " r=" + r);
        }
    }
}
