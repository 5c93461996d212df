package org.microtally.lattice;

import java.math.BigInteger;
import java.util.ArrayList;
import java.util.List;
import org.microtally.ensemble.ExactDensityOfStates;
import org.microtally.units.EnergyScale;

/** Turns a table of counts over (unequal bonds k, label u) into an {@link ExactDensityOfStates}. */
final class Tally {
    private Tally() { }

    /** The energy unit of every Ising and Potts density of states here. */
    static final EnergyScale COUPLING = EnergyScale.abstractUnit("|J|");
    /** The "energy" column of a hard-core count holds the particle number n. */
    static final EnergyScale PARTICLES = EnergyScale.abstractUnit("n (particles)");

    static ExactDensityOfStates toDensityOfStates(Lattice lattice, Model model, boolean withLabel, BigInteger[] counts,
                                                  int uRange) {
        boolean hardCore = model.kind() == Model.Kind.HARD_CORE;
        List<Long> e = new ArrayList<>();
        List<Long> label = new ArrayList<>();
        List<BigInteger> g = new ArrayList<>();
        int kRange = counts.length / uRange;
        for (int k = 0; k < kRange; k++) {
            for (int u = 0; u < uRange; u++) {
                BigInteger c = counts[k * uRange + u];
                if (c.signum() == 0) {
                    continue;
                }
                if (hardCore) {
                    e.add((long) u);
                } else {
                    e.add(model.energy(k, lattice.bonds()));
                    label.add(2L * u - lattice.sites());
                }
                g.add(c);
            }
        }
        long[] energies = e.stream().mapToLong(Long::longValue).toArray();
        BigInteger[] mult = g.toArray(new BigInteger[0]);
        if (hardCore) {
            return ExactDensityOfStates.of(PARTICLES, energies, mult);
        }
        if (withLabel) {
            return ExactDensityOfStates.of(COUPLING, "M", energies, label.stream().mapToLong(Long::longValue).toArray(), mult);
        }
        return ExactDensityOfStates.of(COUPLING, energies, mult);
    }
}
