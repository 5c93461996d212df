package org.microtally.ensemble;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import org.junit.jupiter.api.Test;
import org.microtally.InvalidInputException;
import org.microtally.spectrum.Level;
import org.microtally.spectrum.Spectra;
import org.microtally.spectrum.Spectrum;
import org.microtally.spectrum.Statistics;

class CanonicalSweepTest {

    @Test
    void coldFermionsOnALadderMatchTheGaussianBinomialForEveryN() {
        int levels = 1500;
        double kT = 0.35;
        CanonicalSweep sweep = CanonicalSweep.of(Spectra.equallySpaced(levels, 1.0), Statistics.FERMI, 400, kT);
        assertTrue(sweep.passes() > 1, "cold fermions need several passes: " + sweep.passes());
        for (int n = 1; n <= 400; n++) {
            // Source: Gaussian binomial closed form Z_n = q^(n(n-1)/2) [M choose n]_q (Andrews, Thm 3.1; QBinomial)
            double ref = QBinomial.fermiLadder(levels, n, 1 / kT);
            assertEquals(ref, sweep.lnZ(n), 1e-10, "n=" + n);
        }
        // Source: same closed form, mu_n = -kT (ln Z_n - ln Z_{n-1}) and U_n = -d ln Z_n / d beta
        double mu = -kT * (QBinomial.fermiLadder(levels, 200, 1 / kT) - QBinomial.fermiLadder(levels, 199, 1 / kT));
        assertEquals(mu, sweep.chemicalPotential(200), 1e-9);
        double u = QBinomial.energy(b -> QBinomial.fermiLadder(levels, 200, b), 1 / kT);
        assertEquals(u, sweep.energy(200), 1e-8 * u);
        // deep Fermi sea: Var E is tiny next to the mean excitation, so the sweep refuses it
        assertTrue(sweep.energyVarianceError(400) > 1e-6 * kT * kT);
        assertThrows(InvalidInputException.class, () -> sweep.heatCapacity(400));
    }

    @Test
    void bosonsOnALadderMatchTheGaussianBinomialInOnePass() {
        int levels = 60;
        double kT = 4.0;
        CanonicalSweep sweep = CanonicalSweep.of(Spectra.equallySpaced(levels, 1.0), Statistics.BOSE, 300, kT);
        for (int n = 1; n <= 300; n += 7) {
            // Source: Gaussian binomial closed form Z_n = [n+M-1 choose n]_q (Andrews, Thm 3.1; QBinomial)
            assertEquals(QBinomial.boseLadder(levels, n, 1 / kT), sweep.lnZ(n), 1e-10, "n=" + n);
        }
        // Source: Var E = d^2 ln Z / d beta^2 of the same closed form, central second difference
        double beta = 1 / kT;
        double h = 1e-3 * beta;
        double d2 = (QBinomial.boseLadder(levels, 300, beta + h) - 2 * QBinomial.boseLadder(levels, 300, beta)
                + QBinomial.boseLadder(levels, 300, beta - h)) / (h * h);
        assertEquals(d2, sweep.energyVariance(300), 1e-5 * d2);
        assertEquals(d2 * beta * beta, sweep.heatCapacity(300), 1e-5 * d2 * beta * beta);
        // Source: common practice, no source (Z_0 = 1, U_0 = 0)
        assertEquals(0.0, sweep.lnZ(0));
        assertEquals(0.0, sweep.energy(0));
    }

    @Test
    void smallRandomSpectraAgreeWithBruteForceForEveryN() {
        Random rnd = new Random(20261202L);
        for (Statistics st : List.of(Statistics.BOSE, Statistics.FERMI, Statistics.maxOccupancy(2),
                Statistics.DISTINGUISHABLE)) {
            for (int trial = 0; trial < 4; trial++) {
                List<Level> list = new ArrayList<>();
                double e = rnd.nextDouble() - 0.5;
                for (int i = 0; i < 3; i++) {
                    list.add(new Level(e, 1 + rnd.nextInt(2)));
                    e += 0.1 + rnd.nextDouble();
                }
                Spectrum s = Spectrum.of(list);
                int maxN = (int) Math.min(st.indistinguishable() ? 5 : 4, (long) st.maxOccupancy() * s.stateCount());
                double kT = 0.3 + rnd.nextDouble();
                CanonicalSweep sweep = CanonicalSweep.of(s, st, maxN, kT);
                for (int n = 1; n <= maxN; n++) {
                    // Source: independent brute-force enumeration of all n-particle microstates (BruteForce)
                    BruteForce ref = new BruteForce(s, st, n, kT);
                    String ctx = st + " n=" + n + " " + s.levels();
                    assertEquals(ref.lnZ(n), sweep.lnZ(n), 1e-12 * Math.max(1, Math.abs(ref.lnZ(n))), ctx);
                    assertEquals(ref.u, sweep.energy(n), 1e-11 * Math.max(1, Math.abs(ref.u)), ctx);
                    assertEquals(ref.varE, sweep.energyVariance(n), 1e-9 * Math.max(1, ref.varE), ctx);
                }
            }
        }
    }

    @Test
    void spinDegenerateShellsShowTheEvenOddAdditionEnergies() {
        // levels 0, 1, 2, ... each holding two spin states; kT small enough that e^{-1/kT} ~ 1e-22
        Spectrum s = Spectra.equallySpaced(30, 1.0).withInternalMultiplicity(2);
        double kT = 0.02;
        CanonicalSweep sweep = CanonicalSweep.of(s, Statistics.FERMI, 40, kT);
        for (int n = 1; n < 40; n++) {
            // Source: T -> 0 closed form F_n = E_0(n) - kT ln d_n, E_0 filling two electrons per level,
            // d_n = 2 for a half-filled top level; so Delta_n = 1 - kT ln 4 for even n, 2 kT ln 2 for odd n
            double expected = n % 2 == 0 ? 1 - 2 * kT * Math.log(2) : 2 * kT * Math.log(2);
            assertEquals(expected, sweep.additionEnergy(n), 1e-9, "n=" + n);
            assertEquals((n % 2 == 0 ? 0.5 : -0.5) * expected, sweep.oddEvenStaggering(n), 1e-9);
        }
    }

    @Test
    void sweepAgreesWithSeparateCanonicalRunsOnADotWithSpin() {
        Spectrum dot = Spectra.harmonicOscillator(2, 25).withInternalMultiplicity(2);
        CanonicalSweep sweep = CanonicalSweep.of(dot, Statistics.FERMI, 42, 0.1);
        for (int n : new int[] {1, 2, 6, 12, 20, 41, 42}) {
            Canonical c = Canonical.of(dot, Statistics.FERMI, n, 0.1);
            // Source: common practice, no source (the same Z_n by a separate single-N run at its own mu*)
            assertEquals(c.lnZ(), sweep.lnZ(n), 1e-11 * Math.max(1, Math.abs(c.lnZ())), "n=" + n);
            assertEquals(c.energy(), sweep.energy(n), 1e-11 * c.energy(), "n=" + n);
        }
        assertEquals(43, sweep.rows().size());
        assertEquals(sweep.columnNames().size(), sweep.rows().get(0).size());
    }

    @Test
    void badInputsAreRefused() {
        Spectrum two = Spectra.twoLevel(1.0);
        assertThrows(InvalidInputException.class, () -> CanonicalSweep.of(two, Statistics.FERMI, 3, 1.0));
        assertThrows(InvalidInputException.class, () -> CanonicalSweep.of(two, Statistics.BOSE, 0, 1.0));
        assertThrows(InvalidInputException.class, () -> CanonicalSweep.of(two, Statistics.BOSE, 3, -1.0));
        CanonicalSweep s = CanonicalSweep.of(two, Statistics.BOSE, 3, 1.0);
        assertThrows(InvalidInputException.class, () -> s.chemicalPotential(0));
        assertThrows(InvalidInputException.class, () -> s.additionEnergy(3));
        assertThrows(InvalidInputException.class, () -> s.lnZ(4));
    }
}
