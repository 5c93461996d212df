package org.microtally;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.math.BigInteger;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.microtally.count.CountTable;
import org.microtally.ensemble.Canonical;
import org.microtally.ensemble.GroundState;
import org.microtally.limit.FermiGas;
import org.microtally.occupation.CondensateDistribution;
import org.microtally.spectrum.Level;
import org.microtally.spectrum.Spectra;
import org.microtally.spectrum.Spectrum;
import org.microtally.spectrum.Statistics;
import org.microtally.units.EnergyUnit;

/**
 * The closing checks of the worked notebooks in notebooks/ that no other unit test makes, kept here so that
 * they also run with the test suite (the notebooks run them again on their own output).
 */
class WorkedNotebookChecksTest {
    // Source: OEIS A002117, zeta(3)
    private static final double ZETA3 = 1.2020569031595942;
    private static final int[] TRAP = {4, 4, 1};
    private static final int ATOMS = 2000;

    /** Notebook 01: k T_c0 = hbar omega_g (N / zeta(3))^(1/3) in quanta of the slow axis, omega_g = 16^(1/3) omega_z. */
    private static double kTc0() {
        return Math.cbrt(16.0 * ATOMS / ZETA3);
    }

    private static Spectrum trapAt(double kT) {
        return Spectra.harmonicOscillator(TRAP, Math.max(60, (int) Math.ceil(15 * kT)));
    }

    private static double logSumExp(double a, double b) {
        return a == Double.NEGATIVE_INFINITY ? b : Math.max(a, b) + Math.log1p(Math.exp(-Math.abs(a - b)));
    }

    @Test
    void trapCondensateAgreesWithTheLandsbergRecursion() {
        for (double f : new double[] {0.5, 0.95}) {
            double kT = f * kTc0();
            Spectrum s = trapAt(kT);
            // Source: Z_N = (1/N) sum_{k=1..N} Z_1(k beta) Z_{N-k} (P. T. Landsberg, Thermodynamics and Statistical
            // Mechanics (1961); Borrmann & Franke, J. Chem. Phys. 98, 2484 (1993)); P(N_0 >= j) = Z_{N-j} / Z_N for a
            // non-degenerate ground level at energy 0
            double[] lnZ1 = new double[ATOMS + 1];
            for (int k = 1; k <= ATOMS; k++) {
                double z = 0;
                for (Level l : s.levels()) {
                    z += l.degeneracy() * Math.exp(-k * l.energy() / kT);
                }
                lnZ1[k] = Math.log(z);
            }
            double[] lnZ = new double[ATOMS + 1];
            for (int n = 1; n <= ATOMS; n++) {
                double acc = Double.NEGATIVE_INFINITY;
                for (int k = 1; k <= n; k++) {
                    acc = logSumExp(acc, lnZ1[k] + lnZ[n - k]);
                }
                lnZ[n] = acc - Math.log(n);
            }
            double mean = 0;
            double second = 0;
            for (int j = 1; j <= ATOMS; j++) {
                double tail = Math.exp(lnZ[ATOMS - j] - lnZ[ATOMS]);
                mean += tail;
                second += (2 * j - 1) * tail;
            }
            double variance = second - mean * mean;
            CondensateDistribution d = Canonical.of(s, Statistics.BOSE, ATOMS, kT).condensate();
            assertEquals(mean, d.mean(), 1e-9 * mean, "<N_0> at " + f + " T_c0");
            assertEquals(variance, d.variance(), 1e-7 * variance, "Var N_0 at " + f + " T_c0");
        }
    }

    @Test
    void deepCondensateFluctuationsFollowTheExcitedStateFormula() {
        double kT = 0.3 * kTc0();
        Spectrum s = trapAt(kT);
        // Source: Var N_0 = sum_{i>0} g_i n_i (n_i + 1), n_i = 1/(e^{e_i/kT} - 1), well below T_c (Politzer, PRA 54,
        // 5048 (1996); Grossmann & Holthaus, PRL 79, 3557 (1997)); corrections are of the order of the probability
        // that the excited atoms exceed N, negligible at 0.3 T_c0
        double var = 0;
        for (Level l : s.levels()) {
            if (l.energy() > 0) {
                double n = 1 / Math.expm1(l.energy() / kT);
                var += l.degeneracy() * n * (n + 1);
            }
        }
        assertEquals(var, Canonical.of(s, Statistics.BOSE, ATOMS, kT).condensate().variance(), 1e-6 * var);
    }

    @Test
    void dotGroundStatesFillShellsAndCloseAtOblongNumbers() {
        Spectrum dot = Spectra.harmonicOscillator(2, 12).withInternalMultiplicity(2);
        double[] e0 = new double[45];
        List<Integer> closed = new ArrayList<>();
        for (int n = 1; n <= 43; n++) {
            GroundState gs = Canonical.groundState(dot, Statistics.FERMI, n);
            e0[n] = gs.energy();
            // Source: closed form, shells n of energy n and 2(n+1) seats filled from below; an open shell holding m
            // of its g seats can be filled in C(g, m) ways (common practice, no source)
            int left = n;
            int shell = 0;
            double energy = 0;
            while (left > 2 * (shell + 1)) {
                energy += shell * 2.0 * (shell + 1);
                left -= 2 * (shell + 1);
                shell++;
            }
            energy += (double) shell * left;
            BigInteger ways = BigInteger.ONE;
            for (int j = 0; j < left; j++) {
                ways = ways.multiply(BigInteger.valueOf(2L * (shell + 1) - j)).divide(BigInteger.valueOf(j + 1));
            }
            assertEquals(energy, gs.energy(), 0.0, "E_0(" + n + ")");
            assertEquals(ways, gs.degeneracy(), "degeneracy of the ground state of " + n + " electrons");
        }
        for (int n = 1; n <= 42; n++) {
            if (e0[n + 1] - 2 * e0[n] + e0[n - 1] > 0.5) {
                closed.add(n);
            }
        }
        // Source: OEIS A002378 (oblong numbers n(n+1)), the closed shells of the 2D oscillator with spin
        assertEquals(List.of(2, 6, 12, 20, 30, 42), closed);
    }

    @Test
    void cappedCountsOverAllParticleNumbersFollowGlaisher() {
        double[] energies = new double[20];
        int[] ones = new int[20];
        for (int i = 0; i < 20; i++) {
            energies[i] = i + 1;
            ones[i] = 1;
        }
        Spectrum rungs = Spectrum.of(energies, ones);
        for (int k = 2; k <= 3; k++) {
            CountTable capped = CountTable.of(rungs, Statistics.maxOccupancy(k), 20, 20);
            // Source: Glaisher's theorem (J. W. L. Glaisher, Messenger Math. 12 (1883) 158): partitions with no part
            // repeated more than k times are equinumerous with partitions with no part divisible by k + 1; the latter
            // counted here by the coin-change recursion
            long[] noMultiple = new long[21];
            noMultiple[0] = 1;
            for (int part = 1; part <= 20; part++) {
                if (part % (k + 1) != 0) {
                    for (int s = part; s <= 20; s++) {
                        noMultiple[s] += noMultiple[s - part];
                    }
                }
            }
            for (int e = 0; e <= 20; e++) {
                BigInteger sum = BigInteger.ZERO;
                for (int n = 0; n <= 20; n++) {
                    sum = sum.add(capped.count(n, e));
                }
                assertEquals(BigInteger.valueOf(noMultiple[e]), sum, "k = " + k + ", E = " + e);
            }
        }
    }

    @Test
    void foilChemicalPotentialVanishesAtTheClosedFormTemperature() {
        FermiGas foil = FermiGas.freeElectrons(5.0e28);
        // Source: mu = 0 requires F_1/2(0) = (T_F/T)^(3/2) / Gamma(5/2), F_1/2(0) = (1 - 2^-1/2) zeta(3/2) (DLMF 25.12.15);
        // zeta(3/2) = 2.612375348685488 (OEIS A078434)
        double t0 = Math.pow(0.75 * Math.sqrt(Math.PI) * (1 - Math.pow(2, -0.5)) * 2.612375348685488, -2.0 / 3.0);
        assertEquals(0.0, foil.chemicalPotential(t0 * foil.fermiEnergy().in(EnergyUnit.KELVIN)).ratio(foil.fermiEnergy()), 1e-12);
    }

    @Test
    void foilAtRoomTemperatureFollowsSommerfeldToNextOrder() {
        FermiGas foil = FermiGas.freeElectrons(5.0e28);
        double t = 300 / foil.fermiEnergy().in(EnergyUnit.KELVIN);
        // Source: Sommerfeld expansion of the 3D free-electron gas (from memory; e.g. R. K. Pathria, Statistical
        // Mechanics, sec. 8.1): mu/E_F = 1 - (pi^2/12) t^2 - (pi^4/80) t^4, C/(Nk) = (pi^2/2) t (1 - (3 pi^2/10) t^2);
        // the next heat-capacity term is of relative order 20 t^4 = 1.5e-8
        assertEquals(1 - Math.PI * Math.PI / 12 * t * t - Math.pow(Math.PI, 4) / 80 * Math.pow(t, 4),
                foil.chemicalPotential(300).ratio(foil.fermiEnergy()), 1e-12);
        double c = Math.PI * Math.PI / 2 * t * (1 - 3 * Math.PI * Math.PI / 10 * t * t);
        assertEquals(c, foil.heatCapacityPerParticle(300), 5e-8 * c);
        // Source: Ashcroft & Mermin, Solid State Physics (1976), Table 2.1 (values from memory): Cu n = 8.47e28 m^-3,
        // T_F = 8.16e4 K; Na n = 2.65e28 m^-3, E_F = 3.24 eV (three printed digits)
        assertEquals(8.16e4, FermiGas.freeElectrons(8.47e28).fermiEnergy().in(EnergyUnit.KELVIN), 3e-3 * 8.16e4);
        assertEquals(3.24, FermiGas.freeElectrons(2.65e28).fermiEnergy().in(EnergyUnit.ELECTRONVOLT), 3e-3 * 3.24);
    }
}
