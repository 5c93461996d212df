package org.microtally.limit;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.junit.jupiter.api.Test;
import org.microtally.InvalidInputException;
import org.microtally.units.Codata2018;
import org.microtally.units.EnergyUnit;

/** Temperature sweeps as tables, the density-of-states normalisation and the classical limits in a trap. */
class SweepAndDensityOfStatesTest {
    private static final HarmonicTrap DEMO_TRAP = HarmonicTrap.ofHertz(96.0, 96.0, 24.0);

    @Test
    void fermiSweepPutsExactNextToSommerfeld() {
        FermiGas foil = FermiGas.freeElectrons(5.0e28); // the Halyard Bay metal foil (demo)
        double tf = foil.fermiEnergy().in(EnergyUnit.KELVIN);
        ReferenceTable table = foil.sweep(1e-3 * tf, 0.1 * tf, 2.0 * tf);
        assertEquals(8, table.columnNames().size());
        assertEquals(3, table.rows().size());
        List<Object> cold = table.rows().get(0);
        assertEquals(1e-3, (Double) cold.get(1), 1e-15);
        // Source: mu/E_F = 1 - (pi^2/12) t^2 - (pi^4/80) t^4 (Pathria and Beale sec. 8.1, from memory) at t = 1e-3
        double t = 1e-3;
        assertEquals(1 - Math.PI * Math.PI / 12 * t * t - Math.pow(Math.PI, 4) / 80 * Math.pow(t, 4), (Double) cold.get(2), 1e-15);
        // Source: ground state U/N = (3/5) E_F (Ashcroft and Mermin ch. 2, from memory) plus (pi^2/4) t^2 E_F
        assertEquals(0.6 + Math.PI * Math.PI / 4 * t * t, (Double) cold.get(4), 1e-11);
        // at T = 2 T_F the exact heat capacity is near, and below, the classical 3/2 (Source: virial correction
        // -(3/2) n lambda^3 / 2^(7/2) g, Huang ch. 8, from memory), while the linear Sommerfeld law is far off
        List<Object> hot = table.rows().get(2);
        double exactC = (Double) hot.get(6);
        assertTrue(exactC > 1.3 && exactC < 1.5, hot.toString());
        // Source: Sommerfeld C/(N k) = (pi^2/2) T/T_F (Ashcroft and Mermin ch. 2, from memory), the table's formula column
        assertEquals(Math.PI * Math.PI / 2 * 2.0, (Double) hot.get(7), 1e-12);
    }

    @Test
    void boseSweepAcrossTc() {
        BoseGas gas = BoseGas.inHarmonicTrap(DEMO_TRAP, 2000);
        double tc = gas.criticalThermalEnergy().in(EnergyUnit.KELVIN);
        ReferenceTable table = gas.sweep(0.5 * tc, tc, 2 * tc);
        assertEquals(6, table.columnNames().size());
        // Source: condensate fraction 1 - (T/T_c)^3 (Bagnato et al. 1987)
        assertEquals(0.875, (Double) table.rows().get(0).get(3), 1e-15);
        // Source: fugacity 1 at and below T_c (same)
        assertEquals(1.0, (Double) table.rows().get(1).get(2), 0.0);
        double z = (Double) table.rows().get(2).get(2);
        // Source: above T_c, g_3(z) = zeta(3) (T_c/T)^3 (Bagnato et al. 1987); check by the series of Li_3
        double g3 = 0;
        for (int k = 1; k < 2000; k++) {
            g3 += Math.pow(z, k) / Math.pow(k, 3);
        }
        assertEquals(1.202056903159594 / 8, g3, 1e-13);
    }

    @Test
    void densityOfStatesCountsTheParticlesAtTheFermiEnergy() {
        double n = 8.47e28;
        FermiGas cu = FermiGas.freeElectrons(n);
        DensityOfStates dos = cu.densityOfStates();
        // Source: at T = 0 every state below E_F is filled, so the states below E_F number n (definition)
        assertEquals(1.0, dos.statesBelow(cu.fermiEnergy().in(EnergyUnit.JOULE)) / n, 1e-14);
        assertTrue(dos.perVolume());
        assertEquals(1.5, dos.exponent());
        // Source: free-electron density of states per volume g(E_F) = 3n/(2 E_F) (Ashcroft and Mermin ch. 2, from memory)
        double ef = cu.fermiEnergy().in(EnergyUnit.JOULE);
        assertEquals(1.5 * n / ef, dos.coefficient() * Math.sqrt(ef), 1e-14 * 1.5 * n / ef);
    }

    @Test
    void powerLawTrapReducesToTheHarmonicTrap() {
        double m = 87 * 1.66053906660e-27;
        double[] omega = {2 * Math.PI * 96, 2 * Math.PI * 96, 2 * Math.PI * 24};
        double[] c = {m * omega[0] * omega[0] / 2, m * omega[1] * omega[1] / 2, m * omega[2] * omega[2] / 2};
        DensityOfStates general = DensityOfStates.powerLawTrap(m, c, new double[] {2, 2, 2}, 1);
        DensityOfStates harmonic = DensityOfStates.harmonic(DEMO_TRAP, 1);
        // Source: harmonic-trap density of states e^2 / (2 (hbar omega_g)^3) (Bagnato, Pritchard, Kleppner,
        // PRA 35, 4354 (1987)), the p_i = 2 case of the power-law formula
        assertEquals(3.0, general.exponent(), 1e-15);
        assertEquals(1.0, general.coefficient() / harmonic.coefficient(), 1e-13);
        // Source: same paper, alpha = 3/2 + sum 1/p_i: 9/2 for a spherical quadrupole trap (p_i = 1)
        DensityOfStates quadrupole = DensityOfStates.powerLawTrap(m, new double[] {1e-25, 1e-25, 2e-25},
                new double[] {1, 1, 1}, 1);
        assertEquals(4.5, quadrupole.exponent(), 1e-15);
        BoseGas gas = BoseGas.of(quadrupole, 2000);
        // Source: condensate fraction 1 - (T/T_c)^alpha for a power-law density of states (same paper)
        assertEquals(1 - Math.pow(0.5, 4.5), gas.condensateFraction(0.5 * gas.criticalThermalEnergy().in(EnergyUnit.KELVIN)), 1e-15);
    }

    @Test
    void trappedGasesBecomeClassicalAtHighTemperature() {
        BoseGas bose = BoseGas.inHarmonicTrap(DEMO_TRAP, 2000);
        FermiGas fermi = FermiGas.inHarmonicTrap(DEMO_TRAP, 2000);
        double t = 1000 * bose.criticalThermalEnergy().in(EnergyUnit.KELVIN);
        // Source: classical gas in a 3D harmonic trap, U = 3 N kT and C = 3 N k (equipartition, common practice)
        assertEquals(3.0, bose.heatCapacityPerParticle(t), 1e-4);
        assertEquals(3.0, fermi.heatCapacityPerParticle(t), 1e-4);
        double kt = Codata2018.BOLTZMANN * t;
        assertEquals(3.0, bose.energyPerParticle(t).in(EnergyUnit.JOULE) / kt, 1e-4);
        assertEquals(3.0, fermi.energyPerParticle(t).in(EnergyUnit.JOULE) / kt, 1e-4);
        assertThrows(InvalidInputException.class, () -> fermi.pressure(t));
    }
}
