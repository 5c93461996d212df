package org.microtally.notebook.render;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.microtally.ensemble.Canonical;
import org.microtally.ensemble.EnsembleComparison;
import org.microtally.ensemble.GrandCanonical;
import org.microtally.ensemble.Microcanonical;
import org.microtally.occupation.LevelOccupations;
import org.microtally.spectrum.Spectra;
import org.microtally.spectrum.Spectrum;
import org.microtally.spectrum.Statistics;
import org.knowm.xchart.XYChart;
import org.knowm.xchart.XYSeries;
import org.w3c.dom.Document;

class EnsembleDisplaysTest {

    /** The value cell of the plain-text line of a quantity table whose first cell is {@code quantity} (cells are
     * separated by runs of 2+ spaces). */
    static String valueOf(MimeBundle b, String quantity) {
        return b.plain().lines().filter(l -> l.startsWith(quantity + " ")).findFirst()
                .map(l -> l.substring(quantity.length()).strip().split(" {2,}")[0]).orElse(null);
    }

    @Test
    void quantitiesInKelvinShowTheirUnit() {
        // Halyard Bay quantum dot, hbar*omega = 3 meV; kT = 0.4 hbar*omega = 1.2 meV
        var scale = org.microtally.units.EnergyScale.of("hbar*omega",
                org.microtally.units.Energy.of(3, org.microtally.units.EnergyUnit.MILLIELECTRONVOLT));
        Spectrum dot = Spectra.harmonicOscillator(2, 10).withInternalMultiplicity(2).withScale(scale);
        var q = Canonical.of(dot, Statistics.FERMI, 12, 0.4).quantities().inUnits(org.microtally.units.EnergyUnit.KELVIN);
        MimeBundle b = Renderers.render(q);
        assertTrue(b.plain().startsWith("Quantities (energies in K)"), b.plain());
        // Source: CODATA 2018, e/k_B = 11604.51812 K/eV: 1.2 meV is 13.9254 K
        String kt = b.plain().lines().filter(l -> l.startsWith("kT ")).findFirst().orElseThrow();
        assertTrue(kt.contains("13.9254") && kt.strip().endsWith("K"), kt);
    }

    @Test
    void missingCellsAreShownAsNotAvailable() {
        Microcanonical m = Microcanonical.of(Spectra.harmonicOscillator(1, 10), Statistics.DISTINGUISHABLE, 5, 6);
        MimeBundle b = Renderers.render(m);
        String first = b.plain().lines().filter(l -> l.strip().startsWith("0 ")).findFirst().orElseThrow();
        assertTrue(first.contains("n/a"), first);
    }

    @Test
    void canonicalTwoLevelSystemShowsItsQuantities() {
        Canonical c = Canonical.of(Spectra.twoLevel(1.0), Statistics.DISTINGUISHABLE, 1, 0.5);
        MimeBundle b = Renderers.render(c);
        assertTrue(b.plain().startsWith("Canonical ensemble: N = 1, DISTINGUISHABLE, kT = 0.5 unit"), b.plain());
        // Source: closed form for a two-level system with gap 1 at kT = 1/2: U = 1/(e^2 + 1)
        assertEquals(CellText.floating(1 / (Math.exp(2) + 1), TableFormat.DEFAULT.significantDigits()), valueOf(b, "U"));
        assertTrue(b.get(MimeBundle.TEXT_HTML).contains("<table class=\"mt-table\">"));
    }

    @Test
    void grandCanonicalFermionsCarryTheOccupationLaw() {
        // Halyard Bay quantum dot: 2D oscillator levels (hbar omega units), 12 electrons in spin-degenerate shells
        Spectrum dot = Spectra.harmonicOscillator(2, 10).withInternalMultiplicity(2);
        GrandCanonical g = GrandCanonical.ofMeanNumber(dot, Statistics.FERMI, 0.3, 12);
        MimeBundle b = Renderers.render(g);
        assertEquals("$$\\langle n \\rangle = \\frac{1}{e^{(\\varepsilon - \\mu)/kT} + 1}$$", b.get(MimeBundle.TEXT_LATEX));
        assertTrue(b.plain().contains("Occupation of one state: <n> = 1/(exp((e - mu)/kT) + 1)"), b.plain());
        assertTrue(b.plain().startsWith("Grand canonical ensemble: FERMI, kT = 0.3, mu = "
                + CellText.floating(g.chemicalPotential(), 10) + " hbar*omega"), b.plain());
    }

    @ParameterizedTest
    @CsvSource({"1, 0.3", "2, -0.7", "3, 1.9", "5, 0.05"})
    void gentileOccupationLawMatchesTheDirectSum(int k, double x) {
        // Source: Gentile, Nuovo Cimento 17, 493 (1940): <n> = 1/(e^x - 1) - (k+1)/(e^{(k+1)x} - 1);
        // checked here against the direct sum over occupations 0..k with weights e^{-jx}
        double num = 0;
        double den = 0;
        for (int j = 0; j <= k; j++) {
            num += j * Math.exp(-j * x);
            den += Math.exp(-j * x);
        }
        double formula = 1 / Math.expm1(x) - (k + 1) / Math.expm1((k + 1) * x);
        assertEquals(num / den, formula, 1e-9 * Math.max(1, num / den));
        String latex = EnsembleDisplays.occupationLaw(Statistics.maxOccupancy(k));
        assertTrue(latex.contains("\\frac{" + (k + 1) + "}{e^{" + (k + 1) + "x} - 1}"), latex);
    }

    @Test
    void microcanonicalEinsteinSolidChartsBothEntropies() throws Exception {
        Microcanonical m = Microcanonical.of(Spectra.harmonicOscillator(1, 40), Statistics.DISTINGUISHABLE, 20, 40);
        MimeBundle b = Renderers.render(m);
        assertTrue(b.plain().startsWith("Microcanonical ensemble: N = 20, E <= 40 (DISTINGUISHABLE)"), b.plain());
        Document d = TableDisplayTest.parse(b.get(MimeBundle.TEXT_HTML));
        assertEquals(1, d.getElementsByTagName("svg").getLength());
        XYChart chart = Charts.line(m, "E", "S_B", "S_G");
        XYSeries sb = chart.getSeries("S_B");
        for (int i = 0; i < sb.getXData().length; i++) {
            int q = (int) sb.getXData()[i];
            // Source: closed form, Einstein solid S_B = ln C(q + N - 1, q)
            double expected = Math.log(ResultDisplaysTest.binomial(q + 19, q).doubleValue());
            assertEquals(expected, sb.getYData()[i], 1e-12 * Math.max(1, expected));
        }
    }

    @Test
    void comparisonHasOneSeriesPerEnsembleInTwoCharts() throws Exception {
        Spectrum trap = Spectra.harmonicOscillator(3, 30);
        EnsembleComparison c = EnsembleComparison.overTemperatures(trap, Statistics.BOSE, 50, 1.0, 2.0, 3.0);
        MimeBundle b = Renderers.render(c);
        Document d = TableDisplayTest.parse(b.get(MimeBundle.TEXT_HTML));
        assertEquals(2, d.getElementsByTagName("svg").getLength());
        XYChart u = Charts.grouped(c, "ensemble", "kT", "U");
        assertEquals(List.of("canonical", "grand canonical"),
                u.getSeriesCollection().stream().map(XYSeries::getName).toList());
        assertEquals(3, u.getSeries("canonical").getXData().length);
        assertTrue(b.plain().startsWith("Ensemble comparison"), b.plain());
    }

    @Test
    void occupationProfilesOfSeveralStatisticsShareOneChart() {
        Spectrum s = Spectra.equallySpaced(6, 1.0);
        Map<String, LevelOccupations> profiles = new LinkedHashMap<>();
        for (Statistics st : List.of(Statistics.FERMI, Statistics.BOSE, Statistics.DISTINGUISHABLE)) {
            profiles.put(st.toString(), GrandCanonical.ofChemicalPotential(s, st, 1.0, -0.5).occupations());
        }
        XYChart chart = OccupationCharts.occupations(profiles);
        assertEquals(3, chart.getSeriesCollection().size());
        double[] fd = chart.getSeries("FERMI").getYData();
        double[] be = chart.getSeries("BOSE").getYData();
        double[] mb = chart.getSeries("DISTINGUISHABLE").getYData();
        for (int i = 0; i < 6; i++) {
            double x = i + 0.5; // (e - mu)/kT
            // Source: closed forms, FD 1/(e^x+1), BE 1/(e^x-1), MB e^-x
            assertEquals(1 / (Math.exp(x) + 1), fd[i], 1e-14);
            assertEquals(1 / Math.expm1(x), be[i], 1e-13);
            assertEquals(Math.exp(-x), mb[i], 1e-14);
        }
        MimeBundle b = Renderers.render(profiles.get("FERMI"));
        assertTrue(b.plain().startsWith("Mean occupations of 6 levels"), b.plain());
    }

    @Test
    void groundStateShowsItsExactDegeneracy() {
        // 3 fermions on the 2D oscillator with spin: shell n = 0 holds 2, the third goes into shell n = 1 (4 states)
        Spectrum dot = Spectra.harmonicOscillator(2, 6).withInternalMultiplicity(2);
        MimeBundle b = Renderers.render(Canonical.groundState(dot, Statistics.FERMI, 3));
        // Source: closed form, ground energy 1 hbar omega with C(4, 1) = 4 microstates, S/k = ln 4
        assertTrue(b.plain().startsWith("Ground state (T -> 0): E = 1, 4 microstates (exact), S/k = "
                + CellText.floating(Math.log(4), 12)), b.plain());
    }

    @Test
    void condensateDistributionShowsMeanAndVariance() {
        Canonical c = Canonical.of(Spectra.harmonicOscillator(3, 20), Statistics.BOSE, 40, 0.8);
        MimeBundle b = Renderers.render(c.condensate());
        assertTrue(b.plain().startsWith("Ground-level number distribution: <N_0> = "
                + CellText.floating(c.condensate().mean(), 8)), b.plain());
        assertTrue(b.get(MimeBundle.TEXT_HTML).contains("<svg"));
    }

    @Test
    void convergenceSweepIsCaptionedWithItsRangeAndChartedOnLogLogAxes() throws Exception {
        Spectrum s = Spectra.harmonicOscillator(3, 40);
        var sweep = EnsembleComparison.convergence(s, Statistics.BOSE, new int[] {5, 10, 20}, n -> 2.0);
        MimeBundle b = Renderers.render(sweep);
        assertTrue(b.plain().startsWith("Canonical vs grand canonical as N grows: N = 5..20, kT = 2\n"), b.plain());
        String html = b.get(MimeBundle.TEXT_HTML);
        Document d = TableDisplayTest.parse(html);
        assertEquals(2, d.getElementsByTagName("svg").getLength());
        assertTrue(html.contains(">Fluctuation of the ground-level number, kT = 2</text>"), html);
        // a second sweep at other temperatures gets charts titled apart (common practice, no source)
        var warmer = EnsembleComparison.convergence(s, Statistics.BOSE, new int[] {5, 10, 20}, n -> 0.5 * n);
        String other = Renderers.render(warmer).get(MimeBundle.TEXT_HTML);
        assertTrue(other.contains(">Fluctuation of the ground-level number, kT = 2.5..10</text>"), other);
        assertTrue(html.contains(">N (particles)</text>"), html);
        // absolute differences on a log axis: every point is drawn
        assertTrue(!html.contains("not drawn"), html);
        for (var p : sweep.points()) {
            double n0 = p.grandCanonical().groundMean();
            // Source: closed form, grand canonical variance of one Bose state n0 (n0 + 1)
            assertEquals(n0 * (n0 + 1), p.grandCanonical().groundVariance(), 1e-9 * n0 * (n0 + 1));
        }
    }
}
