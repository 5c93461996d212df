package org.microtally.ensemble;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
import org.microtally.occupation.ChemicalPotential;
import org.microtally.occupation.MeanOccupation;
import org.microtally.spectrum.Spectra;
import org.microtally.spectrum.Spectrum;
import org.microtally.spectrum.Statistics;

class GrandCanonicalTest {

    @Test
    void boseOccupationsFollowTheClosedForm() {
        Spectrum s = Spectra.harmonicOscillator(3, 40);
        double kT = 4.0;
        GrandCanonical g = GrandCanonical.ofMeanNumber(s, Statistics.BOSE, kT, 500);
        assertEquals(500, g.meanNumber(), 1e-10 * 500);
        for (int i = 0; i < s.size(); i++) {
            double x = (s.energy(i) - g.chemicalPotential()) / kT;
            // Source: closed form Bose-Einstein occupation 1/(e^x - 1), evaluated here with Math.exp
            assertEquals(1 / (Math.exp(x) - 1), g.occupations().perState(i), 1e-13 / (Math.exp(x) - 1) + 1e-300);
        }
        // single level: mu has the closed form e0 - kT ln(1 + g/N)
        Spectrum one = Spectrum.of(new double[] {2.0}, new int[] {3});
        double mu = ChemicalPotential.forMeanNumber(one, Statistics.BOSE, 0.5, 1e6);
        // Source: closed form from N = g/(e^{(e0-mu)/kT} - 1)
        assertEquals(2.0 - 0.5 * Math.log1p(3 / 1e6), mu, 1e-15);
    }

    @Test
    void deepCondensationApproachesTheGroundLevelWithoutNaN() {
        Spectrum s = Spectra.harmonicOscillator(3, 30);
        GrandCanonical g = GrandCanonical.ofMeanNumber(s, Statistics.BOSE, 1.0, 1e12);
        assertTrue(g.chemicalPotential() < 0);
        // Source: closed form, N_0 = 1/(e^{-mu/kT} - 1) ~ N - N_thermal when condensed; here the ground level holds
        // nearly all of 1e12
        assertEquals(1e12, g.meanNumber(), 1e-13 * 1e12);
        assertTrue(g.groundLevelMean() > 0.999_999 * 1e12);
        // Source: Politzer, PRA 54, 5048 (1996): grand canonical Var N_0 = N_0 (N_0 + 1)
        assertEquals(g.groundLevelMean() * (g.groundLevelMean() + 1), g.groundLevelVariance(), 1e-9 * g.groundLevelVariance());
    }

    @Test
    void highTemperatureQuantumOccupationsApproachMaxwellBoltzmann() {
        for (double x = 3; x <= 15; x += 1) {
            double mb = MeanOccupation.maxwellBoltzmann(x);
            double be = MeanOccupation.boseEinstein(x);
            double fd = MeanOccupation.fermiDirac(x);
            double ex = Math.exp(-x);
            // Source: common practice, no source: (n - n_MB)/n_MB = +-e^{-x} (1 + O(e^{-x})) for e - mu >> kT
            assertEquals(1.0, ((be - mb) / mb) / ex, 2 * ex + 1e-8, "BE at x=" + x);
            assertEquals(-1.0, ((fd - mb) / mb) / ex, 2 * ex + 1e-8, "FD at x=" + x);
        }
        // and the same through a grand canonical state on a spectrum
        Spectrum s = Spectrum.ofEnergies(0, 1, 2, 3);
        GrandCanonical b = GrandCanonical.ofChemicalPotential(s, Statistics.BOSE, 1.0, -12);
        GrandCanonical m = GrandCanonical.ofChemicalPotential(s, Statistics.DISTINGUISHABLE, 1.0, -12);
        for (int i = 0; i < 4; i++) {
            double ex = Math.exp(-(i + 12));
            double rel = b.occupations().perState(i) / m.occupations().perState(i) - 1;
            assertEquals(1.0, rel / ex, 2 * ex + 1e-6);
        }
    }

    @Test
    void gentileInterpolatesBetweenFermiAndBose() {
        for (double x : new double[] {-3, -0.5, 0.2, 1, 4}) {
            // Source: closed form, Gentile with k = 1 is Fermi-Dirac
            assertEquals(MeanOccupation.fermiDirac(x), MeanOccupation.gentile(1, x), 1e-15);
            // Source: closed form n = 1/(e^x - 1) - (k+1)/(e^{(k+1)x} - 1) for Gentile statistics
            int k = 3;
            double closed = 1 / Math.expm1(x) - (k + 1) / Math.expm1((k + 1) * x);
            assertEquals(closed, MeanOccupation.gentile(k, x), 1e-12);
        }
        // Source: closed form; at x = 0 every occupancy 0..k is equally likely, mean k/2
        assertEquals(2.5, MeanOccupation.gentile(5, 0.0), 1e-15);
    }

    @Test
    void fermiLevelIsMidGapForAClosedShell() {
        Spectrum dot = Spectra.harmonicOscillator(2, 10);
        // 1 + 2 + 3 = 6 electrons (spinless) fill shells 0..2; gap to shell 3 (degeneracy 4)
        // Source: shell filling, closed form: mid-gap between the last filled and first empty level
        assertEquals(2.5, ChemicalPotential.fermiLevel(dot, Statistics.FERMI, 6), 0);
        // Source: shell filling, closed form: mid-gap between the last filled and first empty level
        assertEquals(2.0, ChemicalPotential.fermiLevel(dot, Statistics.FERMI, 4), 0);
        double kT = 0.02;
        double mu = ChemicalPotential.forMeanNumber(dot, Statistics.FERMI, kT, 6);
        // Source: closed form low-T expansion (holes below balance particles above):
        // mu = (e_h + e_l)/2 + (kT/2) ln(g_h/g_l) + O(e^{-gap/kT})
        assertEquals(2.5 + 0.5 * kT * Math.log(3.0 / 4.0), mu, 1e-12);
        GrandCanonical g = GrandCanonical.ofChemicalPotential(dot, Statistics.FERMI, kT, mu);
        assertEquals(6, g.meanNumber(), 1e-12);
    }

    @Test
    void windowedSolverReproducesTheFullSum() {
        Spectrum many = Spectra.equallySpaced(200_000, 1e-3);
        ChemicalPotential.Solver fermi = ChemicalPotential.solver(many, Statistics.FERMI);
        ChemicalPotential.Solver gentile = ChemicalPotential.solver(many, Statistics.maxOccupancy(3));
        for (double kT : new double[] {0.01, 0.5, 20}) {
            // Source: common practice, no source (the full, unwindowed grand canonical sum at the solved mu must give
            // back the target; the window only drops terms below e^-50 of it)
            double mu = fermi.forMeanNumber(kT, 10_000);
            assertEquals(10_000, GrandCanonical.ofChemicalPotential(many, Statistics.FERMI, kT, mu).meanNumber(), 1e-8);
            double mu3 = gentile.forMeanNumber(kT, 10_000);
            assertEquals(10_000, GrandCanonical.ofChemicalPotential(many, Statistics.maxOccupancy(3), kT, mu3)
                    .meanNumber(), 1e-8);
        }
    }

    @Test
    void fixedNumberHeatCapacityMatchesTemperatureDerivative() {
        Spectrum s = Spectra.harmonicOscillator(3, 60);
        double kT = 3.0;
        double h = 1e-4;
        GrandCanonical g = GrandCanonical.ofMeanNumber(s, Statistics.FERMI, kT, 200);
        double up = GrandCanonical.ofMeanNumber(s, Statistics.FERMI, kT + h, 200).energy();
        double dn = GrandCanonical.ofMeanNumber(s, Statistics.FERMI, kT - h, 200).energy();
        // Source: common practice, no source (C = dU/dT at fixed <N>; central difference as an independent check)
        assertEquals((up - dn) / (2 * h), g.heatCapacity(), 1e-5 * g.heatCapacity());
        // and S = -dOmega/dT at fixed mu
        double mu = g.chemicalPotential();
        double om1 = GrandCanonical.ofChemicalPotential(s, Statistics.FERMI, kT + h, mu).grandPotential();
        double om0 = GrandCanonical.ofChemicalPotential(s, Statistics.FERMI, kT - h, mu).grandPotential();
        // Source: common practice, no source (thermodynamic identity S = -(dOmega/dT)_mu)
        assertEquals(-(om1 - om0) / (2 * h), g.entropy(), 1e-6 * g.entropy());
    }
}
