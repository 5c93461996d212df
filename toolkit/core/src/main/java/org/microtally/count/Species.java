package org.microtally.count;

import java.util.Objects;
import org.microtally.Inputs;
import org.microtally.InvalidInputException;
import org.microtally.spectrum.Spectrum;
import org.microtally.spectrum.Statistics;

/**
 * One kind of particle in a {@link SpeciesMix}: a plain value holding its inputs. Nothing is
 * computed here, so there is no formula or accuracy to state; the counting is documented on
 * {@link SpeciesMix} and {@link LabelledCountTable}.
 *
 * <ul>
 *   <li>{@code name}: shown in tables and error messages only; any non-null string (names need not
 *       be unique, species are told apart by position).</li>
 *   <li>{@code spectrum}: the single-particle levels of this species, with their degeneracies and
 *       labels (an unlabelled spectrum contributes label 0 per particle). For
 *       {@link SpeciesMix#of} its energies must be integer multiples of its quantum and &gt;= 0, in
 *       the same quantum as the other species' spectra (the mix adds their integer energies as they
 *       are); {@link SpeciesMix#ignoringEnergy} does not use energies at all.</li>
 *   <li>{@code statistics}: how particles of this species share single-particle states (Bose, Fermi,
 *       maxOccupancy(k), or distinguishable); particles of different species are always told apart.</li>
 *   <li>{@code particles}: the fixed particle number n &gt;= 0 of this species. More fermions than
 *       states is allowed and simply gives zero counts.</li>
 * </ul>
 *
 * @param name       display name, non-null
 * @param spectrum   single-particle levels of this species, non-null
 * @param statistics statistics of this species, non-null
 * @param particles  fixed particle number, &gt;= 0
 */
public record Species(String name, Spectrum spectrum, Statistics statistics, int particles) {
    /**
     * Validates the record.
     *
     * @throws InvalidInputException if {@code particles} &lt; 0
     * @throws NullPointerException  if a component is null (the message names it)
     */
    public Species {
        Objects.requireNonNull(name, "name");
        Objects.requireNonNull(spectrum, "spectrum");
        Objects.requireNonNull(statistics, "statistics");
        Inputs.atLeast("particle number of species " + name, particles, 0);
    }
}
