package org.microtally.units;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
import org.microtally.InvalidInputException;

class UnitsTest {

    @Test
    void electronvoltConversionsMatchCodata2018() {
        Energy ev = Energy.of(1, EnergyUnit.ELECTRONVOLT);
        // Source: CODATA 2018 (Tiesinga et al., RMP 93, 025010): 1 eV = 1.602176634e-19 J (exact)
        assertEquals(1.602176634e-19, ev.in(EnergyUnit.JOULE), 1e-34);
        // Source: CODATA 2018 energy conversion table: 1 eV = 1.160451812e4 K (exact)
        assertEquals(11604.51812, ev.in(EnergyUnit.KELVIN), 1e-5);
        // Source: CODATA 2018: 1 eV = 2.417989242e14 Hz (exact)
        assertEquals(2.417989242e14, ev.in(EnergyUnit.HERTZ), 1e4);
        // Source: CODATA 2018: 1 eV = 8065.543937 cm^-1 (exact)
        assertEquals(8065.543937, ev.in(EnergyUnit.WAVENUMBER), 1e-5);
        // Source: CODATA 2018 second radiation constant c2 = hc/k = 1.438776877e-2 m K: 1 cm^-1 = 1.438776877 K
        assertEquals(1.438776877, Energy.of(1, EnergyUnit.WAVENUMBER).in(EnergyUnit.KELVIN), 1e-9);
        assertEquals(1000.0, ev.in(EnergyUnit.MILLIELECTRONVOLT), 1e-9);
    }

    @Test
    void scalesConvertOnlyWithADeclaredQuantum() {
        EnergyScale dot = EnergyScale.of("hbar*omega", Energy.of(3, EnergyUnit.MILLIELECTRONVOLT));
        // 3 meV in kelvin: 3e-3 * 11604.51812 (CODATA 2018)
        assertEquals(34.81355436, dot.energy(1).in(EnergyUnit.KELVIN), 1e-7);
        assertEquals(2.0, dot.multiples(Energy.of(6, EnergyUnit.MILLIELECTRONVOLT)), 1e-12);
        EnergyScale abs = EnergyScale.abstractUnit("unit");
        InvalidInputException ex = assertThrows(InvalidInputException.class, () -> abs.energy(1));
        assertTrue(ex.getMessage().contains("unit"), ex.getMessage());
        assertThrows(InvalidInputException.class, () -> Energy.of(Double.NaN, EnergyUnit.KELVIN));
        Energy sum = Energy.of(1, EnergyUnit.MILLIELECTRONVOLT).plus(Energy.ofTemperature(11.60451812));
        assertEquals(2.0, sum.in(EnergyUnit.MILLIELECTRONVOLT), 1e-9);
    }

    @Test
    void astronomicalAndNuclearConstants() {
        // Source: IAU 2015 Resolution B3 (Prsa et al., AJ 152, 41 (2016)): nominal GM_sun = 1.3271244e20 m^3/s^2,
        // R_sun = 6.957e8 m
        assertEquals(1.3271244e20, Iau2015.SOLAR_MASS_PARAMETER, 0.0);
        assertEquals(6.957e8, Iau2015.SOLAR_RADIUS, 0.0);
        // Source: from memory, M_sun = 1.98847(7)e30 kg (2014 G); with CODATA 2018 G = 6.67430e-11 it is 1.98841e30
        assertEquals(1.9884e30, Iau2015.SOLAR_MASS, 1e-4 * 1.9884e30);
        // Source: CODATA 2018 neutron-electron mass ratio 1838.68366173 and m_n c^2 = 939.56542052 MeV
        assertEquals(1838.68366173, Codata2018.NEUTRON_MASS / Codata2018.ELECTRON_MASS, 2e-8);
        double mev = Codata2018.NEUTRON_MASS * Codata2018.SPEED_OF_LIGHT * Codata2018.SPEED_OF_LIGHT
                / Codata2018.ELEMENTARY_CHARGE / 1e6;
        assertEquals(939.56542052, mev, 1e-6);
        // Source: CODATA 2018 G = 6.67430(15)e-11 m^3 kg^-1 s^-2; Planck length sqrt(hbar G/c^3) = 1.616255e-35 m
        assertEquals(1.616255e-35, Math.sqrt(Codata2018.HBAR * Codata2018.GRAVITATION / Math.pow(Codata2018.SPEED_OF_LIGHT, 3)),
                2e-41);
    }
}
