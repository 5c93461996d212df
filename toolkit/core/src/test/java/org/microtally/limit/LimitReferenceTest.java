package org.microtally.limit;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
import org.microtally.InvalidInputException;
import org.microtally.units.Energy;
import org.microtally.units.EnergyUnit;

/**
 * Thermodynamic-limit formulas against hand calculations from CODATA 2018 constants (written out
 * here as literals, independent of {@code Codata2018}), published tables and closed forms.
 */
class LimitReferenceTest {
    // CODATA 2018 (Tiesinga et al., Rev. Mod. Phys. 93, 025010 (2021)), typed in by hand
    private static final double HBAR = 6.62607015e-34 / (2 * Math.PI);
    private static final double K_B = 1.380649e-23;
    private static final double U = 1.66053906660e-27;
    private static final double M_E = 9.1093837015e-31;
    private static final double EV = 1.602176634e-19;
    // OEIS A078434, A002117, A078437, and DLMF 25.6.1 for zeta(2), zeta(4)
    private static final double ZETA_3_2 = 2.612375348685488;
    private static final double ZETA_3 = 1.202056903159594;
    private static final double ZETA_5_2 = 1.341487257250917;
    private static final double ZETA_2 = Math.PI * Math.PI / 6.0;
    private static final double ZETA_4 = Math.pow(Math.PI, 4) / 90.0;

    /** The Halyard Bay magnetic trap: frequencies 4:4:1, slow axis 24 Hz. */
    private static final HarmonicTrap DEMO_TRAP = HarmonicTrap.ofHertz(96.0, 96.0, 24.0);

    private static void assertRelative(double expected, double actual, double tolerance, String what) {
        double rel = Math.abs(actual - expected) / Math.abs(expected);
        assertTrue(rel <= tolerance, what + ": expected " + expected + ", got " + actual + " (relative " + rel + ")");
    }

    @Test
    void harmonicTrapCriticalTemperatureOnTheDemoTrap() {
        BoseGas gas = BoseGas.inHarmonicTrap(DEMO_TRAP, 2000);
        double omegaG = 2 * Math.PI * Math.cbrt(96.0 * 96.0 * 24.0);
        // Source: k T_c = hbar omega_g (N / zeta(3))^(1/3) (Bagnato, Pritchard, Kleppner, PRA 35, 4354 (1987)),
        // hand calculation with CODATA 2018 and OEIS A002117: 34.392 nK
        double handTc = HBAR * omegaG * Math.cbrt(2000 / ZETA_3) / K_B;
        assertRelative(handTc, gas.criticalThermalEnergy().in(EnergyUnit.KELVIN), 1e-13, "T_c of the demo trap");
        assertEquals(34.392e-9, gas.criticalThermalEnergy().in(EnergyUnit.KELVIN), 0.001e-9);
    }

    @Test
    void boxCriticalTemperatureFromTheThermalWavelength() {
        double m = 87 * U;
        double n = 1.0e19;
        BoseGas gas = BoseGas.inBox(m, n);
        // Source: n lambda_T^3 = zeta(3/2), lambda_T = sqrt(2 pi hbar^2 / (m k T)) (K. Huang, Statistical
        // Mechanics, 2nd ed., ch. 12, from memory); hand calculation with CODATA 2018 and OEIS A078434: 85.728 nK
        double handTc = 2 * Math.PI * HBAR * HBAR / (m * K_B) * Math.pow(n / ZETA_3_2, 2.0 / 3.0);
        assertRelative(handTc, gas.criticalThermalEnergy().in(EnergyUnit.KELVIN), 1e-13, "box T_c");
        double tc = gas.criticalThermalEnergy().in(EnergyUnit.KELVIN);
        double lambda = Math.sqrt(2 * Math.PI * HBAR * HBAR / (m * K_B * tc));
        // Source: same definition, n lambda^3 at T_c equals zeta(3/2)
        assertRelative(ZETA_3_2, n * lambda * lambda * lambda, 1e-13, "n lambda^3 at T_c");
    }

    @Test
    void condensateFractionsBelowTc() {
        BoseGas trap = BoseGas.inHarmonicTrap(DEMO_TRAP, 2000);
        BoseGas box = BoseGas.inBox(87 * U, 1e19);
        // Source: N_0/N = 1 - (T/T_c)^3 in a harmonic trap, 1 - (T/T_c)^(3/2) in a box (Bagnato et al. 1987)
        assertEquals(0.875, trap.condensateFraction(0.5 * trap.criticalThermalEnergy().in(EnergyUnit.KELVIN)), 1e-15);
        assertEquals(1.0 - Math.pow(0.5, 1.5), box.condensateFraction(0.5 * box.criticalThermalEnergy().in(EnergyUnit.KELVIN)), 1e-15);
        // Source: no condensate above T_c (same)
        assertEquals(0.0, trap.condensateFraction(1.2 * trap.criticalThermalEnergy().in(EnergyUnit.KELVIN)));
        assertEquals(1.0, trap.fugacity(0.9 * trap.criticalThermalEnergy().in(EnergyUnit.KELVIN)));
    }

    @Test
    void finiteNumberShiftOfTc() {
        BoseGas gas = BoseGas.inHarmonicTrap(DEMO_TRAP, 2000);
        double omegaG = Math.cbrt(96.0 * 96.0 * 24.0);
        double omegaM = (96.0 + 96.0 + 24.0) / 3.0;
        // Source: Grossmann & Holthaus, Z. Naturforsch. 50a, 921 (1995); Ketterle & van Druten, PRA 54, 656 (1996):
        // delta T_c / T_c = -zeta(2)/(2 zeta(3)^(2/3)) (omega_m/omega_g) N^(-1/3), coefficient ~ 0.7275
        double coefficient = ZETA_2 / (2 * Math.pow(ZETA_3, 2.0 / 3.0));
        assertEquals(0.7275, coefficient, 5e-5);
        assertRelative(-coefficient * omegaM / omegaG * Math.pow(2000, -1.0 / 3.0), gas.criticalTemperatureShift(), 1e-13,
                "delta T_c / T_c");
        assertEquals(-0.06874, gas.criticalTemperatureShift(), 1e-5);
    }

    @Test
    void boseHeatCapacityAtTcFromBothSides() {
        BoseGas box = BoseGas.inBox(87 * U, 1e19);
        double tc = box.criticalThermalEnergy().in(EnergyUnit.KELVIN);
        // Source: C/(N k) at T_c = 15 zeta(5/2) / (4 zeta(3/2)) = 1.925 for the ideal Bose gas in a box, continuous
        // there (Huang, Statistical Mechanics, 2nd ed., sec. 12.3)
        double atTc = 15 * ZETA_5_2 / (4 * ZETA_3_2);
        assertRelative(atTc, box.heatCapacityPerParticle(tc), 1e-14, "box C at T_c from below");
        assertRelative(atTc, box.heatCapacityPerParticle(tc * (1 + 1e-10)), 1e-3, "box C at T_c from above");
        BoseGas trap = BoseGas.inHarmonicTrap(DEMO_TRAP, 2000);
        double tcTrap = trap.criticalThermalEnergy().in(EnergyUnit.KELVIN);
        // Source: harmonic trap, C/(N k) = 12 zeta(4)/zeta(3) just below T_c and 12 zeta(4)/zeta(3) - 9 zeta(3)/zeta(2)
        // just above (a jump; L. Pitaevskii and S. Stringari, Bose-Einstein Condensation (2003), ch. 10, from memory)
        assertRelative(12 * ZETA_4 / ZETA_3, trap.heatCapacityPerParticle(tcTrap), 1e-14, "trap C below T_c");
        assertRelative(12 * ZETA_4 / ZETA_3 - 9 * ZETA_3 / ZETA_2, trap.heatCapacityPerParticle(tcTrap * (1 + 1e-12)), 1e-6,
                "trap C above T_c");
    }

    @Test
    void bosePressureBelowTc() {
        double m = 87 * U;
        BoseGas box = BoseGas.inBox(m, 1e19);
        double t = 0.7 * box.criticalThermalEnergy().in(EnergyUnit.KELVIN);
        double lambda = Math.sqrt(2 * Math.PI * HBAR * HBAR / (m * K_B * t));
        // Source: P = kT zeta(5/2) / lambda^3 below T_c, independent of n (Huang, ch. 12, from memory; hand calculation)
        assertRelative(K_B * t * ZETA_5_2 / (lambda * lambda * lambda), box.pressure(t), 1e-13, "P below T_c");
    }

    @Test
    void bothBoxGasesApproachTheClassicalHeatCapacity() {
        double m = 87 * U;
        double n = 1e19;
        BoseGas bose = BoseGas.inBox(m, n);
        FermiGas fermi = FermiGas.inBox(m, n, 1);
        double t = 300 * bose.criticalThermalEnergy().in(EnergyUnit.KELVIN);
        double lambda = Math.sqrt(2 * Math.PI * HBAR * HBAR / (m * K_B * t));
        double degeneracy = n * lambda * lambda * lambda; // ~ 1.5e-4
        // Source: C/(N k) -> 3/2 for the classical ideal gas, with the first quantum correction
        // +- (3/2) n lambda^3 / 2^(7/2) from the second virial coefficient -+ n lambda^3 / 2^(5/2)
        // (Huang, Statistical Mechanics, 2nd ed., ch. 8 and 12, from memory; differentiated by hand)
        double correction = 1.5 * degeneracy / Math.pow(2, 3.5);
        double cBose = bose.heatCapacityPerParticle(t);
        double cFermi = fermi.heatCapacityPerParticle(t);
        assertEquals(1.5, cBose, 1e-4);
        assertEquals(1.5, cFermi, 1e-4);
        assertRelative(correction, cBose - 1.5, 2e-3, "Bose correction to 3/2");
        assertRelative(-correction, cFermi - 1.5, 2e-3, "Fermi correction to 3/2");
    }

    @Test
    void copperFreeElectronGas() {
        FermiGas cu = FermiGas.freeElectrons(8.47e28);
        // Source: Ashcroft & Mermin, Solid State Physics (1976), Table 2.1, Cu: E_F = 7.00 eV, T_F = 8.16e4 K
        // (the table's E_F and T_F are rounded separately; E_F = hbar^2 (3 pi^2 n)^(2/3) / 2m gives 7.03 eV)
        assertEquals(7.00, cu.fermiEnergy().in(EnergyUnit.ELECTRONVOLT), 0.05);
        assertEquals(8.16e4, cu.fermiEnergy().in(EnergyUnit.KELVIN), 0.01e4);
        // Source: E_F = hbar^2/(2 m_e) (3 pi^2 n)^(2/3), Ashcroft & Mermin ch. 2 with k_F^3 = 3 pi^2 n, hand calculation
        double hand = HBAR * HBAR / (2 * M_E) * Math.pow(3 * Math.PI * Math.PI * 8.47e28, 2.0 / 3.0);
        assertRelative(hand / EV, cu.fermiEnergy().in(EnergyUnit.ELECTRONVOLT), 1e-13, "E_F(Cu)");
        assertRelative(hand / K_B, cu.fermiEnergy().in(EnergyUnit.KELVIN), 1e-13, "T_F(Cu)");
        // Source: ground-state pressure P = (2/5) n E_F (Ashcroft & Mermin ch. 2, from memory), at T = 1e-4 T_F
        // where the thermal correction (5 pi^2/12)(T/T_F)^2 ~ 4e-8 is below the tolerance
        assertRelative(0.4 * 8.47e28 * hand, cu.pressure(1e-4 * cu.fermiEnergy().in(EnergyUnit.KELVIN)), 1e-7, "P(Cu)");
    }

    @Test
    void trappedAndTwoDimensionalFermiEnergies() {
        FermiGas trapped = FermiGas.inHarmonicTrap(DEMO_TRAP, 1000);
        double omegaG = 2 * Math.PI * Math.cbrt(96.0 * 96.0 * 24.0);
        // Source: E_F = hbar omega_g (6N)^(1/3) for one species in a 3D harmonic trap (D. A. Butts and
        // D. S. Rokhsar, PRA 55, 4346 (1997)), hand calculation
        assertRelative(HBAR * omegaG * Math.cbrt(6000), trapped.fermiEnergy().in(EnergyUnit.JOULE), 1e-13, "trap E_F");
        double omega = 3e-3 * EV / HBAR; // Halyard Bay quantum dot, hbar omega = 3 meV
        FermiGas dot = FermiGas.inOscillator2D(omega, 42, 2);
        // Source: 2D oscillator, density of states g_s e/(hbar omega)^2, so E_F = hbar omega sqrt(2N/g_s)
        // (closed form, common practice)
        assertRelative(3.0 * Math.sqrt(42.0), dot.fermiEnergy().in(EnergyUnit.MILLIELECTRONVOLT), 1e-13, "dot E_F");
    }

    @Test
    void sommerfeldChemicalPotentialAgreesToFourthOrderThenFails() {
        FermiGas cu = FermiGas.freeElectrons(8.47e28);
        double tf = cu.fermiEnergy().in(EnergyUnit.KELVIN);
        Energy ef = cu.fermiEnergy();
        double t = 0.01;
        double exact = cu.chemicalPotential(t * tf).ratio(ef);
        double sommerfeld = cu.sommerfeldChemicalPotential(t * tf).ratio(ef);
        // Source: mu/E_F = 1 - (pi^2/12) t^2 - (pi^4/80) t^4 + O(t^6) in a 3D box (R. K. Pathria and P. D. Beale,
        // Statistical Mechanics, 3rd ed., sec. 8.1, from memory; coefficient re-derived with mpmath): the second-order form misses -pi^4/80 t^4
        double fourth = -Math.pow(Math.PI, 4) / 80 * Math.pow(t, 4);
        assertRelative(fourth, exact - sommerfeld, 2e-3, "mu - mu_Sommerfeld at T/T_F = 0.01");
        // at T/T_F = 0.5 the expansion is visibly off (by more than 5% of E_F)
        double exactHalf = cu.chemicalPotential(0.5 * tf).ratio(ef);
        double sommerfeldHalf = cu.sommerfeldChemicalPotential(0.5 * tf).ratio(ef);
        assertTrue(sommerfeldHalf - exactHalf > 0.05, exactHalf + " vs " + sommerfeldHalf);
        // Source: same expansion order by order for U: U/(N E_F) = (3/5)[1 + (5 pi^2/12) t^2 - (pi^4/16) t^4]
        // (Pathria and Beale sec. 8.1, from memory; re-derived with mpmath), and C/(N k) = (pi^2/2) t [1 - (3 pi^2/10) t^2]
        double u = cu.energyPerParticle(t * tf).ratio(ef) - cu.sommerfeldEnergyPerParticle(t * tf).ratio(ef);
        assertRelative(-0.6 * Math.pow(Math.PI, 4) / 16 * Math.pow(t, 4), u, 2e-3, "U - U_Sommerfeld");
        double c = cu.heatCapacityPerParticle(t * tf) - cu.sommerfeldHeatCapacityPerParticle(t * tf);
        assertRelative(-Math.PI * Math.PI / 2 * 0.3 * Math.PI * Math.PI * t * t * t, c, 2e-3, "C - C_Sommerfeld");
    }

    @Test
    void degenerateHeatCapacityIsContinuousAcrossTheSeriesSwitch() {
        FermiGas cu = FermiGas.freeElectrons(8.47e28);
        double tf = cu.fermiEnergy().in(EnergyUnit.KELVIN);
        // the exact route switches to the cancellation-free series at eta = 60 (T/T_F ~ 1/60):
        // Source: Sommerfeld series C/(N k) = (pi^2/2) t - (3 pi^4/20) t^3 + O(t^5) (as above), both sides
        for (double t : new double[] {1.0 / 59.0, 1.0 / 61.0, 1e-3, 1e-6}) {
            double expected = Math.PI * Math.PI / 2 * t - 3 * Math.pow(Math.PI, 4) / 20 * t * t * t;
            assertRelative(expected, cu.heatCapacityPerParticle(t * tf), Math.max(500 * Math.pow(t, 4), 1e-14), "C at t = " + t);
        }
    }

    @Test
    void fermiGasClassicalLimitChemicalPotential() {
        double m = 6 * U;
        double n = 1e18;
        FermiGas gas = FermiGas.inBox(m, n, 2);
        double t = 1000 * gas.fermiEnergy().in(EnergyUnit.KELVIN);
        double lambda = Math.sqrt(2 * Math.PI * HBAR * HBAR / (m * K_B * t));
        double y = n * lambda * lambda * lambda / 2;
        // Source: classical limit mu/kT = ln(n lambda^3 / g) + (n lambda^3/g)/2^(3/2) + O((n lambda^3)^2)
        // (inverting n lambda^3/g = f_{3/2}(z) = z - z^2/2^(3/2) + ...; Huang ch. 8, from memory)
        double expected = Math.log(y) + y / Math.pow(2, 1.5);
        assertRelative(expected, gas.chemicalPotential(t).in(EnergyUnit.KELVIN) / t, 1e-9, "mu/kT classical");
    }

    @Test
    void nitrogenSpeedsAt300K() {
        MaxwellBoltzmannGas n2 = MaxwellBoltzmannGas.ofAtomicMass(28.0134, 300);
        // Source: closed forms sqrt(2kT/m), sqrt(8kT/(pi m)), sqrt(3kT/m) with CODATA 2018, N2 = 28.0134 u:
        // ~ 422 / 476 / 517 m/s
        assertEquals(422.0, n2.mostProbableSpeed(), 0.5);
        assertEquals(476.0, n2.meanSpeed(), 0.5);
        assertEquals(517.0, n2.rmsSpeed(), 0.5);
    }

    @Test
    void distributionsAreNormalisedAndConsistent() {
        MaxwellBoltzmannGas gas = MaxwellBoltzmannGas.ofAtomicMass(87, 1e-6);
        // Source: normalisation of a probability distribution (common practice, no source)
        assertEquals(1.0, gas.speedCdf(Double.POSITIVE_INFINITY));
        assertEquals(0.0, gas.speedCdf(0.0));
        double vp = gas.mostProbableSpeed();
        // Source: P(v_p) = erf(1) - 2/(e sqrt pi) = 0.427593295529... (closed form, erf(1) from DLMF 7.2/A&S Table 7.1)
        assertEquals(0.8427007929497149 - 2 / (Math.E * Math.sqrt(Math.PI)), gas.speedCdf(vp), 1e-15);
        // small-x branch of the cdf joins the erf branch: check by Simpson integration of the pdf
        // Source: cdf = integral of the pdf (independent numerical integration, common practice)
        for (double x : new double[] {0.1, 0.49, 0.51, 2.0}) {
            int steps = 2000;
            double h = x * vp / steps;
            double sum = gas.speedPdf(0) + gas.speedPdf(x * vp);
            for (int i = 1; i < steps; i++) {
                sum += (i % 2 == 1 ? 4 : 2) * gas.speedPdf(i * h);
            }
            assertRelative(sum * h / 3, gas.speedCdf(x * vp), 1e-11, "cdf at x = " + x);
        }
        // Source: energy cdf = P(3/2, E/kT), at E = kT: erf(1) - 2/(e sqrt pi) as well (same closed form)
        Energy kt = Energy.ofTemperature(1e-6);
        assertEquals(0.8427007929497149 - 2 / (Math.E * Math.sqrt(Math.PI)), gas.energyCdf(kt), 1e-15);
        // Source: mean kinetic energy (3/2) kT (equipartition, common practice)
        assertRelative(1.5 * K_B * 1e-6, gas.meanEnergy().in(EnergyUnit.JOULE), 1e-15, "mean energy");
    }

    @Test
    void seededSampleMatchesTheDistribution() {
        MaxwellBoltzmannGas n2 = MaxwellBoltzmannGas.ofAtomicMass(28.0134, 300);
        int n = 100_000;
        double[] v = n2.sampleSpeeds(n, 20261201L);
        double mean = 0;
        for (double x : v) {
            mean += x;
        }
        mean /= n;
        // Source: central limit theorem, sample mean within 4 standard errors sigma/sqrt(n) (common practice)
        assertTrue(Math.abs(mean - n2.meanSpeed()) < 4 * n2.speedStandardDeviation() / Math.sqrt(n),
                "sample mean " + mean + " vs " + n2.meanSpeed());
        // Source: Kolmogorov-Smirnov test, 99.9% critical value 1.95/sqrt(n) (common practice)
        double[] sorted = v.clone();
        java.util.Arrays.sort(sorted);
        double d = 0;
        for (int i = 0; i < n; i++) {
            double f = n2.speedCdf(sorted[i]);
            d = Math.max(d, Math.max(Math.abs(f - (double) i / n), Math.abs(f - (double) (i + 1) / n)));
        }
        assertTrue(d < 1.95 / Math.sqrt(n), "KS distance " + d);
        // same seed, same sample
        assertEquals(v[12345], n2.sampleSpeeds(n, 20261201L)[12345]);
    }

    @Test
    void temperaturesLeaveAsEnergiesShownInKelvin() {
        BoseGas bose = BoseGas.inHarmonicTrap(DEMO_TRAP, 2000);
        FermiGas foil = FermiGas.freeElectrons(5.0e28);
        MaxwellBoltzmannGas n2 = MaxwellBoltzmannGas.ofAtomicMass(28.0134, 300);
        // Source: T = E / k_B with CODATA 2018 k_B (exact since 2019), typed in by hand above
        assertRelative(bose.criticalThermalEnergy().in(EnergyUnit.JOULE) / K_B, bose.criticalThermalEnergy().in(EnergyUnit.KELVIN), 4e-16, "T_c");
        assertRelative(foil.fermiEnergy().in(EnergyUnit.JOULE) / K_B, foil.fermiEnergy().in(EnergyUnit.KELVIN), 4e-16, "T_F");
        assertRelative(300 * K_B, n2.thermalEnergy().in(EnergyUnit.JOULE), 4e-16, "k T");
        // common practice, no source: an energy made from a temperature prints in kelvin
        assertTrue(bose.criticalThermalEnergy().toString().endsWith(" K"), bose.criticalThermalEnergy().toString());
    }

    @Test
    void badInputsNameTheValue() {
        InvalidInputException t0 = assertThrows(InvalidInputException.class,
                () -> FermiGas.freeElectrons(8.47e28).chemicalPotential(0.0));
        assertTrue(t0.getMessage().contains("temperature") && t0.getMessage().contains("0.0"), t0.getMessage());
        assertThrows(InvalidInputException.class, () -> FermiGas.freeElectrons(8.47e28).energyPerParticle(Double.NaN));
        assertThrows(InvalidInputException.class, () -> BoseGas.inBox(87 * U, 1e19).fugacity(-1.0));
        InvalidInputException dens = assertThrows(InvalidInputException.class, () -> FermiGas.freeElectrons(-5e28));
        assertTrue(dens.getMessage().contains("-5.0E28"), dens.getMessage());
        assertThrows(InvalidInputException.class, () -> BoseGas.inHarmonicTrap(DEMO_TRAP, 0));
        assertThrows(InvalidInputException.class, () -> BoseGas.inBox(0.0, 1e19));
        assertThrows(InvalidInputException.class, () -> HarmonicTrap.ofHertz(96, Double.NaN, 24));
        assertThrows(InvalidInputException.class, () -> FermiGas.inBox(U, 1e19, 0));
        assertThrows(InvalidInputException.class, () -> new MaxwellBoltzmannGas(28 * U, 0.0));
        assertThrows(InvalidInputException.class, () -> MaxwellBoltzmannGas.ofAtomicMass(28, 300).speedPdf(-1.0));
        assertThrows(InvalidInputException.class, () -> MaxwellBoltzmannGas.ofAtomicMass(28, 300).sampleSpeeds(-1, 1L));
        InvalidInputException alpha = assertThrows(InvalidInputException.class,
                () -> BoseGas.of(DensityOfStates.powerLaw(1e30, 1.0, true), 1e19));
        assertTrue(alpha.getMessage().contains("1.0") && alpha.getMessage().contains("condensation"), alpha.getMessage());
        assertThrows(InvalidInputException.class, () -> BoseGas.inHarmonicTrap(DEMO_TRAP, 2000).pressure(1e-8));
        assertThrows(InvalidInputException.class, () -> BoseGas.inBox(87 * U, 1e19).criticalTemperatureShift());
    }
}
