package org.microtally.ensemble;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import org.microtally.occupation.ChemicalPotential;
import org.microtally.spectrum.Spectra;
import org.microtally.spectrum.Spectrum;
import org.microtally.spectrum.Statistics;

/** The cycle-sum recursion for bosons against closed forms and against the state-by-state moment pass. */
class BoseCycleMomentsTest {

    static Stream<Arguments> oscillators() {
        return Stream.of(10, 200, 2000).flatMap(n -> Stream.of(0.3, 3.0, 30.0, 300.0).map(kT -> Arguments.of(n, kT)));
    }

    /**
     * N bosons on the 1D oscillator truncated at L quanta (levels 0..L, hbar omega = 1): Z_N is the Gaussian
     * binomial [N + L, N]_q = prod_{k=1}^{N} (1 - q^{L+k})/(1 - q^k), q = e^{-1/kT}.
     */
    @ParameterizedTest
    @MethodSource("oscillators")
    void oneDimensionalOscillatorMatchesTheGaussianBinomialClosedForm(int n, double kT) {
        int cut = (int) Math.max(60, Math.ceil(60 * kT));
        Spectrum s = Spectra.harmonicOscillator(1, cut);
        double beta = 1 / kT;
        // Source: closed form, partitions into at most N parts of size at most L (Gaussian binomial generating
        // function, G. E. Andrews, The Theory of Partitions (1976), Thm 3.1); U and Var E are -d/dbeta and
        // d^2/dbeta^2 of its logarithm; the untruncated limit prod 1/(1 - q^k) is the form of Grossmann &
        // Holthaus, Z. Naturforsch. 50a, 921 (1995)
        double lnZ = 0;
        double u = 0;
        double var = 0;
        for (int k = 1; k <= n; k++) {
            lnZ += lnOneMinusQ(beta, cut + k) - lnOneMinusQ(beta, k);
            u += term(beta, k, 1) - term(beta, cut + k, 1);
            var += term(beta, k, 2) - term(beta, cut + k, 2);
        }
        double muStar = ChemicalPotential.forMeanNumber(s, Statistics.BOSE, kT, n);
        BoseCycleMoments got = BoseCycleMoments.of(s, n, kT, muStar, true);
        assertNotNull(got);
        double gotU = kT * got.mean;
        double gotVar = kT * kT * (got.second - got.mean * got.mean);
        assertEquals(lnZ, got.lnZ, 1e-12 * Math.max(1, Math.abs(lnZ)), "ln Z");
        assertEquals(u, gotU, 1e-12 * u, "U");
        assertEquals(var, gotVar, 1e-10 * var, "Var E");
        // the fugacity scale is only a scale: a nearby mu* gives the same numbers; a far one either the same
        // numbers or a refusal (null), never a wrong number
        for (double shift : new double[] {0.01, 0.5}) {
            BoseCycleMoments other = BoseCycleMoments.of(s, n, kT, muStar - shift * kT, false);
            if (shift < 0.1) {
                assertNotNull(other, "nearby mu*");
            }
            if (other != null) {
                assertEquals(got.lnZ, other.lnZ, 1e-12 * Math.max(1, Math.abs(lnZ)), "ln Z at mu* - " + shift + " kT");
                assertEquals(got.mean, other.mean, 1e-12 * got.mean, "U at mu* - " + shift + " kT");
            }
        }
    }

    /**
     * The group's 2,000-atom 4:4:1 trap (notebook 01) below, near and above T_c0: the recursion's Var E against
     * the state-by-state moment pass of the series (a different algorithm on 1e5 to 1.3e6 states).
     */
    @ParameterizedTest
    @MethodSource("trapTemperatures")
    void trapVarianceMatchesTheStateByStateMomentPass(double fraction) {
        int n = 2000;
        int[] ratios = {4, 4, 1};
        double kTc0 = Math.cbrt(16 * n / 1.2020569031595942);
        double kT = fraction * kTc0;
        Spectrum s = Spectra.harmonicOscillator(ratios, Math.max(60, (int) Math.ceil(15 * kT)));
        Canonical c = Canonical.of(s, Statistics.BOSE, n, kT);
        assertTrue(BoseCycleMoments.pays(s, n, kT, c.referenceChemicalPotential()));
        EnergyFluctuations cycles = EnergyFluctuations.boseByCycles(s, n, kT, c.referenceChemicalPotential(), c.energy(),
                c.lnZ());
        assertNotNull(cycles, "the recursion agreed with the series (ln Z, U) and was used");
        EnergyFluctuations series = EnergyFluctuations.bySeries(s, Statistics.BOSE, n, kT, c.referenceChemicalPotential(),
                c.energy());
        // Source: independent route, the particle-hole moment pass of ScaledSeries over every state
        // (EnergyFluctuations' documented bound: 1e-13 relative typical; allowed 1e-9)
        assertEquals(series.variance, cycles.variance, 1e-9 * series.variance);
        assertEquals(cycles.variance, c.energyVariance(), 0.0, "Canonical uses the recursion here");
        assertEquals(List.of(), cycles.notes, "both checks (U, dU/dT) pass");
        assertEquals(List.of(), series.notes);
    }

    static Stream<Double> trapTemperatures() {
        return Stream.of(0.6, 0.9, 1.1);
    }

    @Test
    void theCostRuleChoosesTheRecursionOnlyWhereItIsCheaper() {
        // common practice, no source: few states per level, or a product whose series stay short, keep the product
        Spectrum line = Spectra.harmonicOscillator(1, 100);
        assertTrue(!BoseCycleMoments.pays(line, 50, 5.0, ChemicalPotential.forMeanNumber(line, Statistics.BOSE, 5.0, 50)));
        Spectrum wide = Spectra.harmonicOscillator(3, 83);
        assertTrue(!BoseCycleMoments.pays(wide, 10_000, 10.0, ChemicalPotential.forMeanNumber(wide, Statistics.BOSE, 10.0, 10_000)));
        Spectrum trap = Spectra.harmonicOscillator(new int[] {4, 4, 1}, 340);
        assertTrue(BoseCycleMoments.pays(trap, 2000, 22.6, ChemicalPotential.forMeanNumber(trap, Statistics.BOSE, 22.6, 2000)));
    }

    /**
     * Canonical's Bose path on the cycle sums (levels grouped: 31 levels, 5,456 states) against the state-by-state
     * product (the same states as 5,456 labelled one-state levels, where the cycle sums do not pay): ln Z, U, the
     * occupation of every energy, the ground-state number distribution and C.
     */
    @ParameterizedTest
    @MethodSource("isotropicTemperatures")
    void canonicalOnTheCycleSumsMatchesTheStateByStateProduct(double kT) {
        int n = 300;
        Spectrum grouped = Spectra.harmonicOscillator(3, 30);
        List<org.microtally.spectrum.Level> states = new java.util.ArrayList<>();
        for (int i = 0; i < grouped.size(); i++) {
            for (int g = 0; g < grouped.degeneracy(i); g++) {
                states.add(new org.microtally.spectrum.Level(grouped.energy(i), 1, states.size()));
            }
        }
        Spectrum split = Spectrum.of(states, grouped.scale(), true, Double.POSITIVE_INFINITY, "");
        Canonical a = Canonical.of(grouped, Statistics.BOSE, n, kT);
        Canonical b = Canonical.of(split, Statistics.BOSE, n, kT);
        double mu = a.referenceChemicalPotential();
        assertTrue(BoseCycleMoments.pays(grouped, n, kT, mu) && !BoseCycleMoments.pays(split, n, kT, mu));
        // Source: independent route, the state-by-state positive product of ScaledSeries (Canonical's class notes)
        assertEquals(b.lnZ(), a.lnZ(), 1e-12 * Math.abs(b.lnZ()), "ln Z");
        assertEquals(b.energy(), a.energy(), 1e-12 * b.energy(), "U");
        assertEquals(b.heatCapacity(), a.heatCapacity(), 1e-9 * b.heatCapacity(), "C");
        int j = 0;
        for (int i = 0; i < grouped.size(); i++) {
            double total = 0;
            for (int g = 0; g < grouped.degeneracy(i); g++, j++) {
                total += b.occupations().levelTotal(j);
            }
            double got = a.occupations().levelTotal(i);
            assertEquals(total, got, 1e-11 * total + 1e-300, "occupation of energy " + grouped.energy(i));
        }
        assertEquals(b.condensate().mean(), a.condensate().mean(), 1e-11 * b.condensate().mean(), "<N_0>");
        assertEquals(b.condensate().variance(), a.condensate().variance(), 1e-9 * b.condensate().variance(), "Var N_0");
        for (int k = 0; k <= n; k += 10) {
            double p = b.condensate().probability(k);
            assertEquals(p, a.condensate().probability(k), 1e-10 * p + 1e-300, "P(N_0 = " + k + ")");
        }
    }

    static Stream<Double> isotropicTemperatures() {
        // below, near and above T_c0 = (N / zeta(3))^(1/3) = 6.3 quanta for 300 atoms (closed form, Bagnato, Pritchard & Kleppner 1987)
        return Stream.of(4.0, 6.0, 9.0);
    }

    /** ln(1 - q^m), q = e^{-beta}, without cancellation. */
    private static double lnOneMinusQ(double beta, int m) {
        return Math.log(-Math.expm1(-m * beta));
    }

    /** m^p q^m / (1 - q^m)^p. */
    private static double term(double beta, int m, int p) {
        double qm = Math.exp(-m * beta);
        double d = -Math.expm1(-m * beta);
        return Math.pow(m, p) * qm / Math.pow(d, p);
    }
}
