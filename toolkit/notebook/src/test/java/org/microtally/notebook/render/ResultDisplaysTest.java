package org.microtally.notebook.render;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.math.BigInteger;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.microtally.count.CountTable;
import org.microtally.count.MacrostateHistogram;
import org.microtally.count.SharedTotal;
import org.microtally.limit.BoseGas;
import org.microtally.limit.HarmonicTrap;
import org.microtally.limit.ReferenceTable;
import org.microtally.spectrum.Spectra;
import org.microtally.spectrum.Statistics;
import org.knowm.xchart.XYChart;
import org.knowm.xchart.XYSeries;
import org.w3c.dom.Document;
import org.w3c.dom.Element;
import org.w3c.dom.NodeList;

class ResultDisplaysTest {

    static BigInteger binomial(int n, int k) {
        BigInteger r = BigInteger.ONE;
        for (int i = 1; i <= k; i++) {
            r = r.multiply(BigInteger.valueOf(n - k + i)).divide(BigInteger.valueOf(i));
        }
        return r;
    }

    /** Text of the td cells of the first data row whose first cell is {@code first}. */
    static List<String> rowStartingWith(Document d, String first) {
        NodeList trs = d.getElementsByTagName("tr");
        for (int i = 0; i < trs.getLength(); i++) {
            NodeList tds = ((Element) trs.item(i)).getElementsByTagName("td");
            if (tds.getLength() > 1 && tds.item(0).getTextContent().equals(first)) {
                List<String> out = new ArrayList<>();
                for (int j = 0; j < tds.getLength(); j++) {
                    out.add(tds.item(j).getTextContent());
                }
                return out;
            }
        }
        return List.of();
    }

    @Test
    void einsteinSolidCountTableShowsTheGridTheChartAndTheClosedForm() throws Exception {
        // Halyard Bay block B: 200 oscillators; 30 quanta keep the test quick
        CountTable t = CountTable.of(Spectra.harmonicOscillator(1, 30), Statistics.DISTINGUISHABLE, 200, 30);
        MimeBundle b = Renderers.render(t);
        assertEquals("$$\\Omega(n, E) = \\binom{E + n - 1}{E}$$", b.get(MimeBundle.TEXT_LATEX));
        Document d = TableDisplayTest.parse(b.get(MimeBundle.TEXT_HTML));
        NodeList ths = d.getElementsByTagName("th");
        int[] ns = ResultDisplays.gridColumns(t);
        assertEquals(1 + ns.length, ths.getLength());
        assertEquals("n=0", ths.item(1).getTextContent());
        assertEquals("n=200", ths.item(ns.length).getTextContent());
        // entries reach C(229, 30) ~ 1e37 (37 digits, shown as 10 digits and "(37 digits)": 22 characters,
        // 190 px), so only a few columns fit 880 px; the note names the rest
        assertTrue(ns.length >= 2 && ns.length < 9, java.util.Arrays.toString(ns));
        assertTrue(b.plain().contains("Not shown, to fit a 1280 px page: columns n = 1-"), b.plain());
        List<String> row = rowStartingWith(d, "30");
        for (int k = 0; k < ns.length; k++) {
            // Source: closed form, Einstein solid Omega(n, q) = C(q + n - 1, q); one format per column:
            // digit for digit when the column's largest count fits GRID_FORMAT, else scientific
            List<Object> column = new ArrayList<>();
            for (int q = 0; q <= 30; q++) {
                column.add(ns[k] == 0 ? (q == 0 ? BigInteger.ONE : BigInteger.ZERO) : binomial(q + ns[k] - 1, q));
            }
            ColumnNumbers f = ColumnNumbers.of(column, ResultDisplays.GRID_FORMAT);
            BigInteger omega = (BigInteger) column.get(30);
            String expected = f == null ? CellText.shown(omega, ResultDisplays.GRID_FORMAT) : f.shown(omega);
            assertEquals(expected, row.get(k + 1), "n = " + ns[k]);
            if (f != null) {
                assertTrue(expected.matches("[0-9]\\.[0-9]{5}e\\+[0-9]{2}"), expected);
            }
        }
        assertEquals(1, d.getElementsByTagName("svg").getLength());
        assertTrue(b.plain().contains("Closed form: Omega(n, E) = C(E + n - 1, E)"), b.plain());
        assertTrue(b.plain().endsWith("series n = 50, n = 100, n = 150, n = 200"), b.plain());
    }

    @Test
    void everyParticleNumberThatFitsIsAColumn() {
        // 15 distinguishable oscillators, E <= 2: entries at most C(2 + 15 - 1, 2) = 120 (Einstein solid closed
        // form), so the 16 columns n=0..15 take 10 x 40 + 6 x 48 px = 688 px: all fit, none is omitted
        CountTable t = CountTable.of(Spectra.harmonicOscillator(1, 2), Statistics.DISTINGUISHABLE, 15, 2);
        assertEquals(16, ResultDisplays.gridColumns(t).length);
        String plain = Renderers.render(t).plain();
        assertTrue(plain.contains("n=14  n=15"), plain);
        assertFalse(plain.contains("Not shown"), plain);
        assertEquals("1-3, 5, 7-9", ResultDisplays.omitted(new int[] {0, 4, 6, 10}, 10));
        assertEquals("", ResultDisplays.omitted(new int[] {0, 1, 2}, 2));
    }

    @Test
    void bosonCountTableHasNoEinsteinFormula() {
        CountTable t = CountTable.of(Spectra.harmonicOscillator(1, 12), Statistics.BOSE, 5, 12);
        MimeBundle b = Renderers.render(t);
        assertFalse(b.has(MimeBundle.TEXT_LATEX));
        // all particle numbers 0..5 fit as columns
        assertTrue(b.plain().contains("E  n=0  n=1  n=2  n=3  n=4  n=5"), b.plain());
        // Source: OEIS A008284, partitions of 12 into at most 5 parts = 47 (bosons on 0,1,2,...)
        assertTrue(b.plain().lines().anyMatch(l -> l.matches("\\s*12\\s+0\\s+1\\s+7\\s+19\\s+34\\s+47")), b.plain());
    }

    @Test
    void gridTableHoldsEveryExactCount() {
        CountTable t = CountTable.of(Spectra.harmonicOscillator(1, 40), Statistics.DISTINGUISHABLE, 60, 40);
        tech.tablesaw.api.Table grid = Tables.grid(t);
        assertEquals(62, grid.columnCount());
        assertEquals(41, grid.rowCount());
        for (int n = 1; n <= 60; n += 7) {
            for (int q = 0; q <= 40; q += 5) {
                // Source: closed form, Einstein solid Omega(n, q) = C(q + n - 1, q)
                assertEquals(binomial(q + n - 1, q), new BigInteger(grid.stringColumn("n=" + n).get(q)));
            }
        }
    }

    @Test
    void labelResolvedCountsOfSpinsAreAGridOverTheLabelTotal() {
        // 6 distinguishable spin-1/2 moments (labels 2m = +1, -1): Omega(6, 2M) = C(6, (6 + 2M)/2)
        org.microtally.count.LabelledCountTable t = org.microtally.count.LabelledCountTable.ignoringEnergy(
                Spectra.spinInField(0.5), Statistics.DISTINGUISHABLE, 6);
        MimeBundle b = Renderers.render(t);
        assertTrue(b.plain().startsWith("Label-resolved counts: DISTINGUISHABLE, n <= 6, "), b.plain());
        List<String> lines = b.plain().lines().toList();
        assertTrue(lines.get(1).matches("label total\\s+n=0\\s+n=1.*n=6"), lines.get(1));
        int checked = 0;
        for (String line : lines) {
            String[] cells = line.strip().split("\\s+");
            if (cells.length == 8 && cells[0].matches("-?[0-9]+")) {
                checked++;
                int twoM = Integer.parseInt(cells[0]);
                int ups = (6 + twoM) / 2;
                // Source: closed form, C(6, k) spin configurations with k up spins (OEIS A007318, row 6)
                String expected = (6 + twoM) % 2 == 0 ? binomial(6, ups).toString() : "0";
                assertEquals(expected, cells[7], line);
            }
        }
        assertEquals(13, checked, b.plain()); // label totals -6..6
    }

    @Test
    void countChartPlotsLnOmegaOfTheExactCounts() {
        CountTable t = CountTable.of(Spectra.harmonicOscillator(1, 20), Statistics.DISTINGUISHABLE, 10, 20);
        XYChart chart = CountCharts.counts(t, 10);
        XYSeries s = chart.getSeries("n = 10");
        assertEquals(21, s.getXData().length);
        for (int q = 0; q <= 20; q++) {
            // Source: closed form, Einstein solid Omega(10, q) = C(q + 9, q)
            assertEquals(Math.log(binomial(q + 9, q).doubleValue()), s.getYData()[q], 1e-12);
        }
        assertEquals("E [hbar*omega]", chart.getXAxisTitle());
        assertEquals("ln Omega", chart.getYAxisTitle());
    }

    @Test
    void sharedTotalShowsItsSplitDistribution() throws Exception {
        // Halyard Bay blocks A (300) and B (200) sharing quanta, scaled down to 30 and 20 oscillators, 10 quanta
        CountTable a = CountTable.of(Spectra.harmonicOscillator(1, 10), Statistics.DISTINGUISHABLE, 30, 10);
        CountTable bb = CountTable.of(Spectra.harmonicOscillator(1, 10), Statistics.DISTINGUISHABLE, 20, 10);
        SharedTotal s = SharedTotal.of(a, 30, bb, 20, 10);
        MimeBundle b = Renderers.render(s);
        assertTrue(b.plain().startsWith("Shared total q = 10: most probable q_A = 6"), b.plain());
        XYSeries p = CountCharts.split(s).getSeries("probability");
        // Source: closed form, P(q_A) = C(q_A + 29, q_A) C(10 - q_A + 19, 10 - q_A) / C(10 + 49, 10)
        BigInteger all = binomial(59, 10);
        for (int qa = 0; qa <= 10; qa++) {
            double expected = new java.math.BigDecimal(binomial(qa + 29, qa).multiply(binomial(10 - qa + 19, 10 - qa)))
                    .divide(new java.math.BigDecimal(all), java.math.MathContext.DECIMAL64).doubleValue();
            assertEquals(expected, p.getYData()[qa], 1e-15);
        }
        Document d = TableDisplayTest.parse(b.get(MimeBundle.TEXT_HTML));
        assertEquals(1, d.getElementsByTagName("svg").getLength());
    }

    @Test
    void histogramOfSpinHalfMomentsHasBarsOfTheExactProbabilities() {
        // Source: closed form C(10, k) / 2^10 for the total 2*S_z of ten spin-1/2 moments (outcomes -1 and +1 each)
        MacrostateHistogram h = MacrostateHistogram.ofIdenticalUnits(10, -1, 1);
        MimeBundle b = Renderers.render(h);
        assertTrue(b.plain().startsWith("Macrostate histogram: totals -10..10, 1024 microstates in all, most probable [0]"),
                b.plain());
        var chart = (org.knowm.xchart.CategoryChart) CountCharts.histogram(h);
        double[] ys = chart.getSeries("probability").getYData();
        int shown = 0;
        for (int i = 0; i < ys.length; i++) {
            if (ys[i] != 0.0) {
                shown++;
            }
        }
        assertEquals(11, shown, "bars with non-zero probability (totals -10, -8, ..., 10)");
        double sum = 0;
        long binom = 1;
        for (int k = 0; k <= 10; k++) {
            double p = binom / 1024.0;
            boolean found = false;
            for (double y : ys) {
                found |= Math.abs(y - p) < 1e-16;
            }
            assertTrue(found, "a bar of height C(10," + k + ")/1024 = " + p);
            sum += p;
            binom = binom * (10 - k) / (k + 1);
        }
        assertEquals(1.0, sum, 1e-15);
    }

    @Test
    void massRadiusCurveHasACaptionWithUnitsAndItsModelLimits() {
        // the group's visiting astrophysicist: carbon-oxygen white dwarfs, mu_e = 2, rho_c 1e6 to 1e9 g/cm^3
        var curve = org.microtally.structure.WhiteDwarf.massRadiusCurve(2.0, 1e9, 1e12, 4);
        String plain = Renderers.render(curve).plain();
        assertFalse(plain.contains("MassRadiusCurve"), plain);
        assertTrue(plain.startsWith("White-dwarf mass-radius curve, mu_e = 2: 4 models, rho_c = 1e6 to 1e9 g/cm^3, M = "),
                plain);
        assertTrue(plain.contains(" M_sun, R = ") && plain.contains(" km\n"), plain);
        assertTrue(plain.contains("Model limits: ideal cold electrons"), plain);
        // Source: closed form, M_Ch = 5.83/mu_e^2 M_sun (Chandrasekhar 1939, ch. XI): masses stay below 1.46
        for (var m : curve.models()) {
            assertTrue(m.solarMasses() < 5.84 / 4, "M = " + m.solarMasses());
        }
    }

    @Test
    void oneCompactStarIsCaptionedWithWhatItIsAndItsUnits() {
        String ns = Renderers.render(org.microtally.structure.NeutronStar.ofCentralDensity(1e18)).plain();
        assertFalse(ns.startsWith("NeutronStar"), ns);
        assertTrue(ns.startsWith("Neutron star (toy model): M = ") && ns.contains(" M_sun, R = ")
                && ns.contains(" km, rho_c = 1e15 g/cm^3"), ns);
        assertTrue(ns.contains("Model limits: ideal cold neutron gas"), ns);
        var wd = org.microtally.structure.WhiteDwarf.ofCentralDensity(1e10, 2.0);
        String w = Renderers.render(wd).plain();
        assertTrue(w.startsWith("White dwarf, mu_e = 2: M = ") && w.contains("rho_c = 1e7 g/cm^3"), w);
        // Source: closed form, M_Ch = 5.83/mu_e^2 M_sun (Chandrasekhar 1939, ch. XI): a model stays below it
        assertTrue(wd.solarMasses() < 5.84 / 4, w);
    }

    @Test
    void sommerfeldColumnsAreChartedAsTheirRelativeDifferenceOnLogAxes() throws Exception {
        // Halyard Bay metal foil: 5.0e28 conduction electrons per m^3
        org.microtally.limit.FermiGas foil = org.microtally.limit.FermiGas.freeElectrons(5.0e28);
        ReferenceTable sweep = foil.sweep(300, 1000, 3000);
        String html = Renderers.render(sweep).get(MimeBundle.TEXT_HTML);
        Document d = TableDisplayTest.parse(html);
        assertEquals(2, d.getElementsByTagName("svg").getLength());
        assertTrue(html.contains(">Sommerfeld relative to the exact value, against T/TF</text>"), html);
        assertTrue(html.contains(">mu/EF against T/TF</text>"), html);
        java.util.Map<String, List<String>> groups = new java.util.LinkedHashMap<>();
        groups.put("mu/EF", List.of("mu/EF", "mu/EF Sommerfeld"));
        XYChart c = LimitDisplays.variantAgreement(sweep, "T/TF", groups);
        assertTrue(c.getStyler().isYAxisLogarithmic());
        double t = 3000 / foil.fermiEnergy().in(org.microtally.units.EnergyUnit.KELVIN);
        double rel = c.getSeries("mu/EF").getYData()[2];
        // from memory (Sommerfeld expansion, next term): mu/EF = 1 - (pi^2/12) t^2 - (pi^4/80) t^4 + O(t^6),
        // so the two-term series is off by (pi^4/80) t^4 relative, to leading order
        assertEquals(Math.pow(Math.PI, 4) / 80 * Math.pow(t, 4), rel, 0.05 * rel);
    }

    @Test
    void referenceSweepIsChartedAgainstReducedTemperature() throws Exception {
        // Halyard Bay trap: 2000 atoms, 4:4:1 with the slow axis at 24 Hz
        BoseGas gas = BoseGas.inHarmonicTrap(HarmonicTrap.ofHertz(96, 96, 24), 2000);
        double tc = gas.criticalThermalEnergy().in(org.microtally.units.EnergyUnit.KELVIN);
        ReferenceTable sweep = gas.sweep(0.5 * tc, 0.8 * tc, 1.2 * tc, 1.5 * tc);
        List<String> ys = new ArrayList<>();
        assertEquals("T/Tc", LimitDisplays.referenceAxes(sweep, ys));
        assertEquals(List.of("fugacity", "condensate fraction", "C/(N k)"), ys);
        MimeBundle b = Renderers.render(sweep);
        Document d = TableDisplayTest.parse(b.get(MimeBundle.TEXT_HTML));
        // one chart per quantity, at most two
        assertEquals(2, d.getElementsByTagName("svg").getLength());
        assertTrue(b.get(MimeBundle.TEXT_HTML).contains(">fugacity against T/Tc</text>"));
        // Source: closed form for a harmonic trap, condensate fraction 1 - (T/Tc)^3 below Tc: 1 - 0.125 = 0.875
        List<Object> temperatures = List.of(0.5 * tc, 0.8 * tc, 1.2 * tc, 1.5 * tc);
        String first = ColumnNumbers.of(temperatures, TableFormat.DEFAULT).shown(0.5 * tc);
        assertEquals("0.875", rowStartingWith(d, first).get(3));
    }

    @Test
    void aLabelResolvedTableOnATruncatedSpectrumShowsOnlyItsCompleteEnergies() {
        org.microtally.count.LabelledCountTable t = org.microtally.count.LabelledCountTable.of(
                Spectra.oscillator2dByAngularMomentum(6), Statistics.FERMI, 3, 12);
        org.microtally.count.LabelledCountTable ref = org.microtally.count.LabelledCountTable.of(
                Spectra.oscillator2dByAngularMomentum(12), Statistics.FERMI, 3, 12);
        MimeBundle b = Renderers.render(t);
        assertTrue(b.plain().contains("completeThroughEnergy(n)"), b.plain());
        // Source: independent route, the same counts on a spectrum cut at 12 summed over E <= 6 + E_low(2) = 7
        BigInteger expected = BigInteger.ZERO;
        for (int e = 0; e <= t.completeThroughEnergy(3); e++) {
            expected = expected.add(ref.count(3, e, 1));
        }
        assertEquals(7, t.completeThroughEnergy(3));
        assertTrue(b.plain().contains(expected.toString()), b.plain());
    }
}
