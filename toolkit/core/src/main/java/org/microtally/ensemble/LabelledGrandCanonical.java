package org.microtally.ensemble;

import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import org.microtally.Dimension;
import org.microtally.Quantity;
import org.microtally.QuantityTable;
import org.microtally.InvalidInputException;
import org.microtally.QuantityResult;
import org.microtally.occupation.MeanOccupation;
import org.microtally.spectrum.Spectrum;
import org.microtally.spectrum.Statistics;

/**
 * The grand canonical ensemble of ideal particles on a labelled spectrum coupled to the field h
 * conjugate to the total label: H = H_0 - h L - mu N, so each state of level i (energy e_i, label m_i)
 * is an independent mode at e_i - h m_i. Immutable.
 *
 * <p>Formula (states independent; common practice, no source): with x_i = beta (e_i - h m_i - mu) and
 * the one-state laws n(x), var(x) of {@link MeanOccupation},
 * &lt;L&gt; = sum_i g_i m_i n(x_i), Var L = sum_i g_i m_i^2 var(x_i), susceptibility
 * d&lt;L&gt;/dh = beta Var L, and the energy without the field term U_0 = U + h &lt;L&gt;, U being the
 * {@link GrandCanonical} energy of the shifted spectrum. Everything else (ln Xi, &lt;N&gt;, S, C) is
 * the {@link #ensemble()} of the shifted spectrum.
 *
 * <p>Accuracy: a few ulp per term, sums of M terms (Var L of non-negative terms); as
 * {@link GrandCanonical}. Model limits: the truncation warning of a truncated spectrum in a field
 * carries the caveat of {@link LabelledCanonical} (omitted levels may carry large labels).
 */
public final class LabelledGrandCanonical implements QuantityResult {
    private final Spectrum spectrum;
    private final double field;
    private final GrandCanonical ensemble;
    private final double meanLabel;
    private final double labelVariance;

    private LabelledGrandCanonical(Spectrum spectrum, double field, GrandCanonical ensemble) {
        this.spectrum = spectrum;
        this.field = field;
        this.ensemble = ensemble;
        double beta = 1 / ensemble.kT();
        double mean = 0;
        double var = 0;
        for (int i = 0; i < spectrum.size(); i++) {
            double x = beta * (spectrum.energy(i) - field * spectrum.label(i) - ensemble.chemicalPotential());
            double m = spectrum.label(i);
            mean += spectrum.degeneracy(i) * m * MeanOccupation.mean(ensemble.statistics(), x);
            var += spectrum.degeneracy(i) * m * m * MeanOccupation.variance(ensemble.statistics(), x);
        }
        this.meanLabel = mean;
        this.labelVariance = var;
    }

    /**
     * At chemical potential {@code mu} and field {@code h}.
     *
     * @throws InvalidInputException for an unlabelled spectrum, h not finite, or what
     *                               {@link GrandCanonical#ofChemicalPotential} refuses on the shifted spectrum
     */
    public static LabelledGrandCanonical inField(Spectrum spectrum, Statistics statistics, double kT, double mu, double h) {
        requireLabelled(spectrum, h);
        Spectrum shifted = LabelledCanonical.shifted(spectrum, h);
        return new LabelledGrandCanonical(spectrum, h, GrandCanonical.ofChemicalPotential(shifted, statistics, kT, mu));
    }

    /** At the mu that gives mean number {@code targetN} in the field {@code h}. */
    public static LabelledGrandCanonical ofMeanNumber(Spectrum spectrum, Statistics statistics, double kT,
                                                      double targetN, double h) {
        requireLabelled(spectrum, h);
        Spectrum shifted = LabelledCanonical.shifted(spectrum, h);
        return new LabelledGrandCanonical(spectrum, h, GrandCanonical.ofMeanNumber(shifted, statistics, kT, targetN));
    }

    private static void requireLabelled(Spectrum spectrum, double h) {
        Objects.requireNonNull(spectrum, "spectrum");
        if (!spectrum.isLabelled()) {
            throw InvalidInputException.of("spectrum labels", "none (unlabelled spectrum)", "a labelled spectrum",
                    "Without labels the field does nothing: use GrandCanonical.");
        }
        if (!Double.isFinite(h)) {
            throw InvalidInputException.of("field h", h, "a finite number", "");
        }
    }

    /** The grand canonical ensemble of the field-shifted spectrum (ln Xi, &lt;N&gt;, S, C, occupations). */
    public GrandCanonical ensemble() {
        return ensemble;
    }

    /** The field h. */
    public double field() {
        return field;
    }

    /** &lt;L&gt;. */
    public double meanLabel() {
        return meanLabel;
    }

    /** Var L. */
    public double labelVariance() {
        return labelVariance;
    }

    /** d&lt;L&gt;/dh = beta Var L. */
    public double susceptibility() {
        return labelVariance / ensemble.kT();
    }

    /** U_0 = &lt;H_0&gt;, the energy without the field term. */
    public double energyWithoutField() {
        return ensemble.energy() + field * meanLabel;
    }

    /** The labelled spectrum (without the field shift). */
    public Spectrum spectrum() {
        return spectrum;
    }

    /** Warnings of the shifted ensemble, plus the field caveat for truncated spectra. */
    public List<String> warnings() {
        List<String> w = new ArrayList<>(ensemble.warnings());
        if (field != 0 && spectrum.isTruncated()) {
            w.add("spectrum truncated at " + spectrum.cutoffEnergy() + " and coupled to a field h = " + field
                    + ": omitted levels may carry labels the field lowers by h x label");
        }
        return List.copyOf(w);
    }

    /**
     * The grand canonical quantities ({@link GrandCanonical#quantities()}) with the field h after the
     * statistics, and &lt;L&gt;, Var L and U_0 (the mean energy without the field term) at the end.
     */
    @Override
    public QuantityTable quantities() {
        List<Quantity> base = ensemble.quantities().quantities();
        QuantityTable.Builder t = QuantityTable.builder(ensemble.spectrum().scale()).add(base.get(0))
                .value("h", field, Dimension.ENERGY);
        base.subList(1, base.size()).forEach(t::add);
        return t.value("<L>", meanLabel).value("Var L", labelVariance)
                .value("U_0 (without field term)", energyWithoutField(), Dimension.ENERGY).build();
    }

    @Override
    public String toString() {
        return "LabelledGrandCanonical[h=" + field + ", <L>=" + meanLabel + ", " + ensemble + "]";
    }
}
