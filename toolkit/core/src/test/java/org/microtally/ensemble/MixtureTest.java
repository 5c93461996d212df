package org.microtally.ensemble;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertSame;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.math.BigInteger;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.microtally.InvalidInputException;
import org.microtally.count.Species;
import org.microtally.count.SpeciesMix;
import org.microtally.spectrum.Spectra;
import org.microtally.spectrum.Spectrum;
import org.microtally.spectrum.Statistics;
import org.microtally.units.EnergyScale;

class MixtureTest {

    @Test
    void boseFermiMixtureOnLaddersMatchesGaussianBinomials() {
        Spectrum ladderA = Spectra.equallySpaced(12, 1.0);
        Spectrum ladderB = Spectra.equallySpaced(9, 1.0);
        double kT = 1.7;
        double beta = 1 / kT;
        CanonicalMixture mix = CanonicalMixture.of(List.of(
                new Species("fermions", ladderA, Statistics.FERMI, 5),
                new Species("bosons", ladderB, Statistics.BOSE, 7)), kT);
        // Source: Gaussian binomial closed forms (Andrews, The Theory of Partitions, Thm 3.1), see QBinomial
        double ref = QBinomial.fermiLadder(12, 5, beta) + QBinomial.boseLadder(9, 7, beta);
        assertEquals(ref, mix.lnZ(), 1e-12 * Math.abs(ref));
        // Source: U = -d lnZ/d beta of the same closed forms, central difference (~1e-9 relative)
        double u = QBinomial.energy(b -> QBinomial.fermiLadder(12, 5, b) + QBinomial.boseLadder(9, 7, b), beta);
        assertEquals(u, mix.energy(), 1e-7 * u);
        // Source: common practice, no source (S = ln Z + beta U)
        assertEquals(mix.lnZ() + beta * mix.energy(), mix.entropy(), 1e-12 * mix.entropy());
        // Source: common practice, no source (sum rule per species)
        assertEquals(5, mix.occupations(0).total(), 1e-11);
        assertEquals(7, mix.occupations(1).total(), 1e-11);
        assertEquals(12, mix.particleNumber());
    }

    @Test
    void mixtureAgreesWithTheExactJointCountOfBothSpecies() {
        Spectrum dot = Spectra.harmonicOscillator(2, 5);
        Spectrum line = Spectra.harmonicOscillator(1, 7);
        List<Species> species = List.of(new Species("up", dot, Statistics.FERMI, 4),
                new Species("atoms", line, Statistics.BOSE, 3), new Species("tagged", line, Statistics.DISTINGUISHABLE, 2));
        int maxE = 4 * 5 + 3 * 7 + 2 * 7;
        SpeciesMix joint = SpeciesMix.of(species, maxE);
        double kT = 1.3;
        double z = 0;
        double e1 = 0;
        double e2 = 0;
        for (int e = 0; e <= maxE; e++) {
            BigInteger c = joint.truncatedModelCount(e, 0); // the mixture is of the truncated spectra as given
            double w = c.doubleValue() * Math.exp(-e / kT);
            z += w;
            e1 += w * e;
            e2 += w * e * e;
        }
        CanonicalMixture mix = CanonicalMixture.of(species, kT);
        // Source: independent exact joint count Omega(E) of the whole mix (SpeciesMix, BigInteger), Z = sum Omega e^-E/kT
        assertEquals(Math.log(z), mix.lnZ(), 1e-12 * Math.abs(Math.log(z)));
        assertEquals(e1 / z, mix.energy(), 1e-11 * e1 / z);
        double var = e2 / z - (e1 / z) * (e1 / z);
        assertEquals(var, mix.energyVariance(), 1e-9 * var);
        assertEquals(var / (kT * kT), mix.heatCapacity(), 1e-9 * var / (kT * kT));
        assertEquals(4, mix.rows().size());
        for (List<Object> row : mix.rows()) {
            assertEquals(mix.columnNames().size(), row.size());
        }
    }

    @Test
    void spinUpAndDownWithEqualNumbersShareOneComputation() {
        Spectrum dot = Spectra.harmonicOscillator(2, 12);
        CanonicalMixture mix = CanonicalMixture.of(List.of(new Species("up", dot, Statistics.FERMI, 6),
                new Species("down", dot, Statistics.FERMI, 6)), 0.4);
        assertSame(mix.part(0), mix.part(1));
        // Source: factorisation Z = Z_6^2 of two independent identical species, against a direct Canonical
        Canonical one = Canonical.of(dot, Statistics.FERMI, 6, 0.4);
        assertEquals(2 * one.lnZ(), mix.lnZ(), 1e-13 * Math.abs(mix.lnZ()));
        // Source: P(N_0) of the lowest level of one species, brute-force enumeration (BruteForce)
        Spectrum small = Spectra.harmonicOscillator(2, 3);
        CanonicalMixture m2 = CanonicalMixture.of(List.of(new Species("up", small, Statistics.FERMI, 3),
                new Species("down", small, Statistics.FERMI, 2)), 0.8);
        BruteForce ref = new BruteForce(small, Statistics.FERMI, 2, 0.8);
        for (int j = 0; j <= 2; j++) {
            assertEquals(ref.groundLevelDistribution[j], m2.groundLevelDistribution(1).probability(j), 1e-12);
        }
    }

    @Test
    void grandCanonicalMixtureMatchesTheJointSumOverBothParticleNumbers() {
        Spectrum ladderA = Spectra.equallySpaced(10, 1.0);
        Spectrum ladderB = Spectra.equallySpaced(6, 1.0);
        double kT = 1.1;
        double beta = 1 / kT;
        double muA = 3.2;
        double muB = -0.4;
        GrandCanonicalMixture g = GrandCanonicalMixture.ofChemicalPotentials(List.of(
                new Species("fermions", ladderA, Statistics.FERMI, 0),
                new Species("bosons", ladderB, Statistics.BOSE, 0)), kT, muA, muB);
        // Source: Xi = sum over (N_a, N_b) of e^{beta(mu_a N_a + mu_b N_b)} Z_{N_a} Z_{N_b}, Z from the
        // Gaussian binomial closed forms (QBinomial); the boson sum is cut where terms are below 1e-30
        double xi = 0;
        double na = 0;
        double nb = 0;
        for (int a = 0; a <= 10; a++) {
            for (int b = 0; b <= 400; b++) {
                double lnA = a == 0 ? 0 : QBinomial.fermiLadder(10, a, beta);
                double lnB = b == 0 ? 0 : QBinomial.boseLadder(6, b, beta);
                double w = Math.exp(beta * (muA * a + muB * b) + lnA + lnB);
                xi += w;
                na += a * w;
                nb += b * w;
            }
        }
        assertEquals(Math.log(xi), g.lnXi(), 1e-12 * Math.log(xi));
        assertEquals(na / xi, g.part(0).meanNumber(), 1e-11 * na / xi);
        assertEquals(nb / xi, g.part(1).meanNumber(), 1e-11 * nb / xi);
        assertEquals((na + nb) / xi, g.meanNumber(), 1e-11 * (na + nb) / xi);
    }

    @Test
    void grandCanonicalMixtureAtMeanNumbersHitsEveryTarget() {
        Spectrum trap = Spectra.harmonicOscillator(3, 40);
        GrandCanonicalMixture g = GrandCanonicalMixture.ofMeanNumbers(List.of(
                new Species("Rb", trap, Statistics.BOSE, 500), new Species("K", trap, Statistics.FERMI, 200)), 4.0);
        // Source: common practice, no source (the solved mu reproduces each target <N_a>)
        assertEquals(500, g.part(0).meanNumber(), 1e-9 * 500);
        assertEquals(200, g.part(1).meanNumber(), 1e-9 * 200);
        CanonicalMixture c = CanonicalMixture.of(g.species(), 4.0);
        // Source: Politzer, PRA 54, 5048 (1996): grand canonical condensate fluctuations exceed the canonical ones
        assertTrue(g.part(0).groundLevelVariance() > c.groundLevelDistribution(0).variance());
    }

    @Test
    void badInputsAreRefusedNamingTheSpecies() {
        Spectrum dot = Spectra.harmonicOscillator(2, 2);
        InvalidInputException tooMany = assertThrows(InvalidInputException.class, () -> CanonicalMixture.of(
                List.of(new Species("electrons", dot, Statistics.FERMI, 7)), 1.0));
        assertTrue(tooMany.getMessage().contains("electrons"), tooMany.getMessage());
        assertThrows(InvalidInputException.class, () -> CanonicalMixture.of(List.of(), 1.0));
        assertThrows(InvalidInputException.class, () -> CanonicalMixture.of(
                List.of(new Species("none", dot, Statistics.BOSE, 0)), 1.0));
        Spectrum other = dot.withScale(EnergyScale.abstractUnit("meV"));
        InvalidInputException units = assertThrows(InvalidInputException.class, () -> CanonicalMixture.of(
                List.of(new Species("a", dot, Statistics.BOSE, 2), new Species("b", other, Statistics.BOSE, 2)), 1.0));
        assertTrue(units.getMessage().contains("meV"), units.getMessage());
        assertThrows(InvalidInputException.class, () -> GrandCanonicalMixture.ofChemicalPotentials(
                List.of(new Species("a", dot, Statistics.BOSE, 2)), 1.0, 0.5, 0.1));
        assertThrows(InvalidInputException.class, () -> GrandCanonicalMixture.ofChemicalPotentials(
                List.of(new Species("a", dot, Statistics.BOSE, 2)), 1.0, 0.5));
    }
}
