package org.microtally.ensemble;

import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.Objects;
import org.microtally.InvalidInputException;
import org.microtally.Tabular;
import org.microtally.count.Species;

/**
 * The grand canonical ensemble of several non-interacting species at one shared temperature, each
 * with its own chemical potential mu_a (given, or solved so that &lt;N_a&gt; equals the species'
 * particle number). Immutable.
 *
 * <h2>Formula</h2>
 * Species are told apart and independent, so Xi = prod_a Xi_a(T, mu_a): ln Xi, &lt;N&gt;, U, S and
 * Var E are sums over species; Var N_a and the ground-level law of each species are those of its own
 * {@link GrandCanonical}; numbers of different species are uncorrelated. The heat capacity reported
 * is the one at fixed every &lt;N_a&gt;, C/k = sum_a (Var E_a - Cov(E_a, N_a)^2 / Var N_a)/(kT)^2,
 * the quantity to compare with {@link CanonicalMixture#heatCapacity()} (independent species, so the
 * constraint on each &lt;N_a&gt; acts on its own species only; common practice, no source).
 *
 * <h2>Method and accuracy</h2>
 * One {@link GrandCanonical} per species (closed-form one-state laws; chemical potentials by
 * {@link org.microtally.occupation.ChemicalPotential#forMeanNumber}); accuracy as stated there, one
 * more rounding per species in the totals.
 *
 * <p>Model limits: non-interacting species; the grand canonical ground-level variance of bosons
 * (n_0 (n_0 + 1)) overestimates the canonical one below condensation (Politzer, PRA 54, 5048 (1996)),
 * so compare with {@link CanonicalMixture} before using it for a closed trap.
 */
public final class GrandCanonicalMixture implements Tabular {
    private final List<Species> species;
    private final List<GrandCanonical> parts;
    private final double kT;
    private final List<String> warnings;

    private GrandCanonicalMixture(List<Species> species, List<GrandCanonical> parts, double kT) {
        this.species = species;
        this.parts = parts;
        this.kT = kT;
        this.warnings = CanonicalMixture.prefixedWarnings(species, parts, GrandCanonical::warnings);
    }

    /**
     * The mixture at given chemical potentials, one per species in list order (the species' particle
     * numbers are not used).
     *
     * @throws InvalidInputException for a wrong number of chemical potentials, or any input
     *                               {@link GrandCanonical#ofChemicalPotential} refuses (the message names
     *                               the species)
     */
    public static GrandCanonicalMixture ofChemicalPotentials(List<Species> species, double kT, double... mu) {
        List<Species> list = CanonicalMixture.validate(species);
        Objects.requireNonNull(mu, "mu");
        if (mu.length != list.size()) {
            throw InvalidInputException.of("number of chemical potentials", mu.length,
                    "one per species (" + list.size() + ")", "");
        }
        List<GrandCanonical> parts = new ArrayList<>();
        for (int a = 0; a < list.size(); a++) {
            Species s = list.get(a);
            double m = mu[a];
            parts.add(CanonicalMixture.forSpecies(s, () -> GrandCanonical.ofChemicalPotential(s.spectrum(),
                    s.statistics(), kT, m)));
        }
        return new GrandCanonicalMixture(list, Collections.unmodifiableList(parts), kT);
    }

    /**
     * The mixture whose chemical potentials give &lt;N_a&gt; = the particle number of each species.
     *
     * @throws InvalidInputException for a species with N = 0, or any input
     *                               {@link GrandCanonical#ofMeanNumber} refuses (the message names the species)
     */
    public static GrandCanonicalMixture ofMeanNumbers(List<Species> species, double kT) {
        List<Species> list = CanonicalMixture.validate(species);
        List<GrandCanonical> parts = new ArrayList<>();
        for (Species s : list) {
            CanonicalMixture.requireParticles(s, "as a target mean number");
            parts.add(CanonicalMixture.forSpecies(s, () -> GrandCanonical.ofMeanNumber(s.spectrum(), s.statistics(),
                    kT, s.particles())));
        }
        return new GrandCanonicalMixture(list, Collections.unmodifiableList(parts), kT);
    }

    /** The species, in the order given. */
    public List<Species> species() {
        return species;
    }

    /** The grand canonical ensemble of species {@code a} alone. */
    public GrandCanonical part(int a) {
        return parts.get(CanonicalMixture.speciesIndex(a, parts.size()));
    }

    /** Temperature kT. */
    public double kT() {
        return kT;
    }

    /** ln Xi = sum_a ln Xi_a. */
    public double lnXi() {
        return sum(GrandCanonical::lnXi);
    }

    /** Total mean particle number. */
    public double meanNumber() {
        return sum(GrandCanonical::meanNumber);
    }

    /** U = sum_a U_a. */
    public double energy() {
        return sum(GrandCanonical::energy);
    }

    /** S/k = sum_a S_a. */
    public double entropy() {
        return sum(GrandCanonical::entropy);
    }

    /** Var E = sum_a Var E_a. */
    public double energyVariance() {
        return sum(GrandCanonical::energyVariance);
    }

    /** Heat capacity at fixed every &lt;N_a&gt;: sum_a C_a (see the class notes). */
    public double heatCapacity() {
        return sum(GrandCanonical::heatCapacity);
    }

    /** Warnings of every species, each prefixed with the species' name; empty when none. */
    public List<String> warnings() {
        return warnings;
    }

    private double sum(java.util.function.ToDoubleFunction<GrandCanonical> f) {
        return CanonicalMixture.total(parts, f);
    }

    /** Columns: species, statistics, mu, &lt;N&gt;, Var N, U, S/k, C/k, &lt;N_0&gt;, Var N_0, warnings. */
    @Override
    public List<String> columnNames() {
        return List.of("species", "statistics", "mu", "<N>", "Var N", "U", "S/k", "C/k (fixed <N>)", "<N_0>",
                "Var N_0", "warnings");
    }

    /** One row per species, then a row "total" (blank cells where a total has no meaning). */
    @Override
    public List<List<Object>> rows() {
        List<List<Object>> r = new ArrayList<>();
        for (int a = 0; a < parts.size(); a++) {
            GrandCanonical g = parts.get(a);
            Species s = species.get(a);
            r.add(List.of(s.name(), s.statistics().toString(), g.chemicalPotential(), g.meanNumber(),
                    g.numberVariance(), g.energy(), g.entropy(), g.heatCapacity(), g.groundLevelMean(),
                    g.groundLevelVariance(), String.join("; ", g.warnings())));
        }
        r.add(List.of("total", "", "", meanNumber(), sum(GrandCanonical::numberVariance), energy(), entropy(),
                heatCapacity(), "", "", warnings.isEmpty() ? "" : warnings.size() + " warning(s)"));
        return r;
    }

    @Override
    public String toString() {
        return "GrandCanonicalMixture[" + species.size() + " species, kT=" + kT + ", lnXi=" + lnXi() + ", <N>="
                + meanNumber() + (warnings.isEmpty() ? "" : ", " + warnings.size() + " warning(s)") + "]";
    }
}
