package org.microtally.ensemble;

import java.util.ArrayList;
import java.util.Collections;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import org.microtally.Inputs;
import org.microtally.InvalidInputException;
import org.microtally.Tabular;
import org.microtally.count.Species;
import org.microtally.occupation.CondensateDistribution;
import org.microtally.occupation.LevelOccupations;

/**
 * The canonical ensemble of several non-interacting species at one shared temperature, each with
 * its own fixed particle number N_a, spectrum and statistics (protons and neutrons, spin-up and
 * spin-down electrons, Bose-Bose and Bose-Fermi mixtures of atoms). Immutable.
 *
 * <h2>Formula</h2>
 * Particles of different species are told apart and do not interact, so a microstate of the mixture
 * is one microstate of each species and its energy is the sum: the partition function factorises,
 * Z = prod_a Z_{N_a}^{(a)}. Hence ln Z, F, U, S, Var E and C_V are the sums of the species' values
 * (Var E adds because the species' energies are independent under the product weight), and every
 * per-species quantity (occupations, ground-level number distribution P(N_0^(a) = j)) is that of the
 * species' own canonical ensemble. (Factorisation of independent subsystems: e.g. R. K. Pathria and
 * P. D. Beale, <i>Statistical Mechanics</i>, 3rd ed., sect. 3.5; from memory.)
 *
 * <h2>Method</h2>
 * One {@link Canonical} per species (positive-term symmetric-polynomial products, see that class).
 * Species with equal spectrum, statistics and N (spin-up and spin-down with N_up = N_down) are
 * computed once and shared; distinct species are computed in parallel on the common fork-join pool.
 *
 * <h2>Accuracy</h2>
 * Each species' quantities carry the bounds stated on {@link Canonical}; the totals add one rounding
 * per species. Warnings of every species are kept, prefixed with the species' name.
 *
 * <p>Model limits: non-interacting species only. A mixture with inter-species interactions (a
 * Bose-Fermi mixture with a scattering length, protons and neutrons with a residual interaction) is
 * not described by these numbers beyond the ideal-gas reference they provide.
 */
public final class CanonicalMixture implements Tabular {
    private final List<Species> species;
    private final List<Canonical> parts;
    private final double kT;
    private final List<String> warnings;

    private CanonicalMixture(List<Species> species, List<Canonical> parts, double kT) {
        this.species = species;
        this.parts = parts;
        this.kT = kT;
        this.warnings = prefixedWarnings(species, parts, Canonical::warnings);
    }

    /** Every species' warnings, each prefixed with the species' name (shared with the grand canonical mixture). */
    static <T> List<String> prefixedWarnings(List<Species> species, List<T> parts,
                                             java.util.function.Function<T, List<String>> warningsOf) {
        List<String> w = new ArrayList<>();
        for (int a = 0; a < species.size(); a++) {
            for (String s : warningsOf.apply(parts.get(a))) {
                w.add(species.get(a).name() + ": " + s);
            }
        }
        return Collections.unmodifiableList(w);
    }

    /** Runs {@code call} for one species, naming the species in any refusal. */
    static <T> T forSpecies(Species s, java.util.function.Supplier<T> call) {
        try {
            return call.get();
        } catch (InvalidInputException e) {
            throw new InvalidInputException("species " + s.name() + ": " + e.getMessage());
        }
    }

    /**
     * The canonical ensemble of the mixture at temperature {@code kT} (in the species' common unit).
     *
     * @param species at least one species, each with N &gt;= 1, all spectra in the same energy unit
     * @throws InvalidInputException for an empty list, a species with N = 0, spectra in different
     *                               units, or any input {@link Canonical#of} refuses (the message names
     *                               the species)
     */
    public static CanonicalMixture of(List<Species> species, double kT) {
        List<Species> list = validate(species);
        Inputs.temperature(kT);
        for (Species s : list) {
            requireParticles(s, "in a canonical mixture");
        }
        Map<Key, Canonical> computed = new HashMap<>();
        List<Key> distinct = new ArrayList<>();
        for (Species s : list) {
            Key k = new Key(s);
            if (!computed.containsKey(k)) {
                computed.put(k, null);
                distinct.add(k);
            }
        }
        List<Canonical> results = distinct.size() == 1 ? List.of(compute(distinct.get(0), kT))
                : distinct.parallelStream().map(k -> compute(k, kT)).toList();
        for (int i = 0; i < distinct.size(); i++) {
            computed.put(distinct.get(i), results.get(i));
        }
        List<Canonical> parts = new ArrayList<>(list.size());
        for (Species s : list) {
            parts.add(computed.get(new Key(s)));
        }
        return new CanonicalMixture(list, Collections.unmodifiableList(parts), kT);
    }

    private static Canonical compute(Key k, double kT) {
        Species s = k.species;
        return forSpecies(s, () -> Canonical.of(s.spectrum(), s.statistics(), s.particles(), kT));
    }

    /** Refuses a species with N &lt; 1 where {@code role} (e.g. "in a canonical mixture") needs particles. */
    static void requireParticles(Species s, String role) {
        if (s.particles() < 1) {
            throw InvalidInputException.of("particle number of species " + s.name(), s.particles(),
                    "an integer >= 1 " + role, "Leave an empty species out of the list.");
        }
    }

    /** The index {@code a} of one of {@code count} species, else an exception naming the range. */
    static int speciesIndex(int a, int count) {
        if (a < 0 || a >= count) {
            throw InvalidInputException.of("species index", a, "in [0, " + (count - 1) + "]", "");
        }
        return a;
    }

    /** sum_a q(part a), added in species order (the one summation of both mixtures' totals). */
    static <T> double total(List<T> parts, java.util.function.ToDoubleFunction<T> q) {
        double s = 0;
        for (T p : parts) {
            s += q.applyAsDouble(p);
        }
        return s;
    }

    /** Checks the list shared by the canonical and grand canonical mixtures; returns an unmodifiable copy. */
    static List<Species> validate(List<Species> species) {
        Objects.requireNonNull(species, "species");
        if (species.isEmpty()) {
            throw InvalidInputException.of("number of species", 0, ">= 1", "Give at least one species.");
        }
        List<Species> list = List.copyOf(species);
        String unit = list.get(0).spectrum().scale().name();
        for (Species s : list) {
            if (!s.spectrum().scale().equals(list.get(0).spectrum().scale())) {
                throw InvalidInputException.of("energy unit of species " + s.name(), s.spectrum().scale().name(),
                        "the unit of the first species (" + unit + ")",
                        "Express every spectrum in one unit (Spectrum.withScale) so one kT applies to all.");
            }
        }
        return list;
    }

    /** Species identity for sharing computations: equal spectrum, statistics and N. */
    private record Key(Species species) {
        @Override
        public boolean equals(Object o) {
            return o instanceof Key k && k.species.spectrum().equals(species.spectrum())
                    && k.species.statistics().equals(species.statistics())
                    && k.species.particles() == species.particles();
        }

        @Override
        public int hashCode() {
            return Objects.hash(species.spectrum(), species.statistics(), species.particles());
        }
    }

    /** The species, in the order given. */
    public List<Species> species() {
        return species;
    }

    /** Number of species. */
    public int speciesCount() {
        return species.size();
    }

    /** The canonical ensemble of species {@code a} alone (its occupations, P(N_0), warnings). */
    public Canonical part(int a) {
        return parts.get(speciesIndex(a, species.size()));
    }

    /** Exact mean occupation of every level of species {@code a}'s spectrum. */
    public LevelOccupations occupations(int a) {
        return part(a).occupations();
    }

    /** P(N_0 = j) for the lowest level of species {@code a}, j = 0..N_a. */
    public CondensateDistribution groundLevelDistribution(int a) {
        return part(a).groundLevelDistribution();
    }

    /** Temperature kT. */
    public double kT() {
        return kT;
    }

    /** Total particle number sum_a N_a. */
    public long particleNumber() {
        long n = 0;
        for (Species s : species) {
            n += s.particles();
        }
        return n;
    }

    /** ln Z = sum_a ln Z_{N_a}. */
    public double lnZ() {
        return total(parts, Canonical::lnZ);
    }

    /** F = -kT ln Z. */
    public double freeEnergy() {
        return -kT * lnZ();
    }

    /** U = sum_a U_a. */
    public double energy() {
        return total(parts, Canonical::energy);
    }

    /** S/k = ln Z + U/kT. */
    public double entropy() {
        return lnZ() + energy() / kT;
    }

    /**
     * Var E = sum_a Var E_a (independent species).
     *
     * @throws IllegalStateException if a species' variance came back negative or not finite (a failed
     *                               computation must not pass silently into the total)
     */
    public double energyVariance() {
        double s = 0;
        for (int a = 0; a < parts.size(); a++) {
            double v = parts.get(a).energyVariance();
            if (!(v >= 0) || !Double.isFinite(v)) {
                throw new IllegalStateException("energy variance of species " + species.get(a).name() + " is " + v
                        + ": the canonical variance pass failed for this input; please report it");
            }
            s += v;
        }
        return s;
    }

    /** C_V/k = Var E/(kT)^2 = sum_a C_a. */
    public double heatCapacity() {
        return energyVariance() / (kT * kT);
    }

    /** Warnings of every species, each prefixed with the species' name; empty when none. */
    public List<String> warnings() {
        return warnings;
    }

    /** Columns: species, statistics, N, ln Z, U, S/k, C/k, &lt;N_0&gt;, Var N_0, warnings. */
    @Override
    public List<String> columnNames() {
        return List.of("species", "statistics", "N", "ln Z", "U", "S/k", "C/k", "<N_0>", "Var N_0", "warnings");
    }

    /** One row per species, then a row "total" (blank cells where a total has no meaning). */
    @Override
    public List<List<Object>> rows() {
        List<List<Object>> r = new ArrayList<>();
        for (int a = 0; a < parts.size(); a++) {
            Canonical c = parts.get(a);
            Species s = species.get(a);
            double ca = c.heatCapacity();
            r.add(List.of(s.name(), s.statistics().toString(), s.particles(), c.lnZ(), c.energy(), c.entropy(),
                    Double.isFinite(ca) ? ca : "failed", c.groundLevelDistribution().mean(),
                    c.groundLevelDistribution().variance(),
                    String.join("; ", c.warnings())));
        }
        Object total;
        try {
            total = heatCapacity();
        } catch (IllegalStateException e) {
            total = "failed";
        }
        r.add(List.of("total", "", particleNumber(), lnZ(), energy(), entropy(), total, "", "",
                warnings.isEmpty() ? "" : warnings.size() + " warning(s)"));
        return r;
    }

    @Override
    public String toString() {
        return "CanonicalMixture[" + species.size() + " species, N=" + particleNumber() + ", kT=" + kT + ", lnZ="
                + lnZ() + ", U=" + energy() + (warnings.isEmpty() ? "" : ", " + warnings.size() + " warning(s)") + "]";
    }
}
