package org.microtally;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertInstanceOf;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.junit.jupiter.api.Test;
import org.microtally.ensemble.Canonical;
import org.microtally.ensemble.EnsembleComparison;
import org.microtally.ensemble.GrandCanonical;
import org.microtally.ensemble.Microcanonical;
import org.microtally.spectrum.Spectra;
import org.microtally.spectrum.Spectrum;
import org.microtally.spectrum.Statistics;
import org.microtally.units.Energy;
import org.microtally.units.EnergyScale;
import org.microtally.units.EnergyUnit;

/** The one result shape: typed quantities, a missing value that is a value, physical units on request. */
class QuantityTableTest {
    private static final EnergyScale DOT_SCALE = EnergyScale.of("hbar*omega", Energy.of(3, EnergyUnit.MILLIELECTRONVOLT));

    @Test
    void canonicalRowsKeepTheirNamesAndValues() {
        Canonical c = Canonical.of(Spectra.twoLevel(1.0), Statistics.DISTINGUISHABLE, 1, 0.5);
        QuantityTable q = c.quantities();
        assertEquals(List.of("statistics", "counting", "N", "kT", "ln Z", "F", "U", "S/k", "C/k", "Var E", "<N_0>",
                "Var N_0"), q.quantities().stream().map(Quantity::name).toList());
        // Source: closed form for one particle on two levels 0 and 1 at kT = 1/2: Z = 1 + e^-2,
        // U = 1/(e^2 + 1), Var E = e^2/(e^2 + 1)^2
        double e2 = Math.exp(2);
        assertEquals(Math.log(1 + 1 / e2), (Double) q.get("ln Z").value(), 1e-15);
        assertEquals(1 / (e2 + 1), (Double) q.get("U").value(), 1e-15);
        assertEquals(e2 / ((e2 + 1) * (e2 + 1)), (Double) q.get("Var E").value(), 1e-15);
        assertEquals(1, q.get("N").value());
        assertEquals("unit", q.get("U").unit());
        assertEquals("unit^2", q.get("Var E").unit());
        assertEquals("", q.get("S/k").unit());
        for (int i = 0; i < q.rows().size(); i++) {
            assertEquals(c.rows().get(i), q.rows().get(i));
        }
    }

    @Test
    void grandCanonicalRowsKeepTheirValues() {
        GrandCanonical g = GrandCanonical.ofChemicalPotential(Spectra.twoLevel(1.0), Statistics.FERMI, 0.5, 0.0);
        // Source: Fermi-Dirac closed form, one state at 0 and one at 1, mu = 0, kT = 1/2:
        // <N> = 1/2 + 1/(e^2 + 1)
        assertEquals(0.5 + 1 / (Math.exp(2) + 1), (Double) g.quantities().get("<N>").value(), 1e-14);
        assertEquals(g.chemicalPotential(), (Double) g.quantities().get("mu").value());
    }

    @Test
    void missingIsAValueWithAReason() {
        // Einstein solid: 5 oscillators, E <= 6 quanta
        Microcanonical m = Microcanonical.of(Spectra.harmonicOscillator(1, 10), Statistics.DISTINGUISHABLE, 5, 6);
        List<Object> lowest = m.rows().get(0);
        Object betaB = lowest.get(m.columnNames().indexOf("beta_B"));
        assertInstanceOf(Missing.class, betaB);
        assertFalse(((Missing) betaB).reason().isBlank());
        assertEquals("n/a", betaB.toString());
        Quantity q = Quantity.missing("beta_B", Dimension.INVERSE_ENERGY, "meV", "no neighbour below E");
        assertTrue(q.isMissing());
        assertTrue(q.number().isEmpty());
        assertEquals("no neighbour below E", q.note());
        assertThrows(InvalidInputException.class, () -> Quantity.of("U", Double.NaN, Dimension.ENERGY, "meV"));
        assertThrows(InvalidInputException.class, () -> Missing.because(" "));
    }

    @Test
    void comparisonMarksTheUncomputedVarianceAsMissing() {
        var table = org.microtally.count.CountTable.of(Spectra.harmonicOscillator(1, 40), Statistics.BOSE, 6, 40);
        EnsembleComparison c = EnsembleComparison.overTemperatures(table, 6, 1.0);
        List<Object> micro = c.rows().get(c.rows().size() - 1);
        assertEquals("microcanonical", micro.get(0));
        assertInstanceOf(Missing.class, micro.get(c.columnNames().indexOf("Var N_0")));
    }

    @Test
    void physicalUnitsOnRequest() {
        // Halyard Bay quantum dot: 2D oscillator, hbar*omega = 3 meV, 12 electrons (spin-degenerate shells)
        Spectrum dot = Spectra.harmonicOscillator(2, 12).withInternalMultiplicity(2).withScale(DOT_SCALE);
        Canonical c = Canonical.of(dot, Statistics.FERMI, 12, 0.4);
        QuantityTable mev = c.quantities().inUnits(EnergyUnit.MILLIELECTRONVOLT);
        assertEquals("meV", mev.get("U").unit());
        assertEquals(3 * c.energy(), (Double) mev.get("U").value(), 1e-12 * 3 * c.energy());
        assertEquals(9 * c.energyVariance(), (Double) mev.get("Var E").value(), 1e-12 * 9 * c.energyVariance());
        assertEquals(c.entropy(), mev.get("S/k").value());
        // Source: CODATA 2018, e/k_B = 11604.51812 K/eV (exact ratio of defined constants), so kT = 1.2 meV
        // is T = 13.92542... K
        QuantityTable kelvin = c.quantities().inUnits(EnergyUnit.KELVIN);
        assertEquals(1.2e-3 * 11604.51812, (Double) kelvin.get("kT").value(), 1e-6);
        assertEquals("K", kelvin.get("kT").unit());
    }

    @Test
    void abstractScaleRefusesPhysicalUnitsAndSaysWhatToDo() {
        Canonical c = Canonical.of(Spectra.twoLevel(1.0), Statistics.FERMI, 1, 0.5);
        InvalidInputException e = assertThrows(InvalidInputException.class,
                () -> c.quantities().inUnits(EnergyUnit.KELVIN));
        assertTrue(e.getMessage().contains("EnergyScale.of("), e.getMessage());
    }

    @Test
    void groundStateAndOccupationsPrintReadably() {
        // 2D oscillator shells 1, 2, 3, ... states: 4 fermions fill 0 (1 state) and 1 (2 states), one in shell 2
        var g = Canonical.groundState(Spectra.harmonicOscillator(2, 4), Statistics.FERMI, 4);
        String text = g.toString();
        // Source: closed form, the last fermion has C(3, 1) = 3 places in shell 2; E = 0 + 2 x 1 + 2 = 4
        assertTrue(text.startsWith("GroundState[E = 4.0, 3 microstates (exact)"), text);
        assertFalse(text.contains("@"), text);
        assertFalse(g.occupations().toString().contains("@"));
    }
}
