package org.microtally.spectrum;

import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.Objects;
import org.microtally.InvalidInputException;
import org.microtally.units.EnergyScale;

/**
 * A valence space of spherical single-particle orbits (n, l, j) with their single-particle energies,
 * as used by the nuclear shell model (and by shell models of clusters and dots), turned into an
 * M-scheme spectrum: every orbit contributes its 2j + 1 magnetic substates m = -j..j as levels of
 * degeneracy 1 at the orbit's energy, labelled by 2m. Immutable.
 *
 * <p>Conventions (common practice, no source): n counts radial nodes from 0 (the sd shell is 0d5/2,
 * 1s1/2, 0d3/2), j = l +- 1/2 is given as the integer 2j, labels are 2m so that half-integer
 * projections stay integers. Counting with the spectrum ({@link #spectrum()}) through
 * {@link org.microtally.count.LabelledCountTable#ignoringEnergy} or
 * {@link org.microtally.count.SpeciesMix#ignoringEnergy} gives M-scheme dimensions;
 * {@link org.microtally.count.ShellDimensions} adds the J-projected ones.
 *
 * <p>Model limits: the orbits describe an independent-particle basis; single-particle energies
 * enter only thermal results (not basis dimensions), and a spectrum built here knows nothing of the
 * residual interaction.
 */
public final class ShellOrbits {
    /** One orbit: radial quantum number n &gt;= 0, orbital l &gt;= 0, 2j = 2l +- 1, energy e. */
    public record Orbit(int n, int l, int twoJ, double energy) {
        /** Validates the quantum numbers and the energy. */
        public Orbit {
            if (n < 0 || n > 100) {
                throw InvalidInputException.of("radial quantum number n", n, "an integer in [0, 100]", "");
            }
            if (l < 0 || l > 100) {
                throw InvalidInputException.of("orbital angular momentum l", l, "an integer in [0, 100]", "");
            }
            if (twoJ != 2 * l + 1 && twoJ != 2 * l - 1) {
                throw InvalidInputException.of("2j of the orbit with l = " + l, twoJ,
                        "2l + 1 = " + (2 * l + 1) + (l > 0 ? " or 2l - 1 = " + (2 * l - 1) : ""),
                        "Give 2j as an integer, e.g. 5 for j = 5/2.");
            }
            if (!Double.isFinite(energy)) {
                throw InvalidInputException.of("single-particle energy of orbit " + name(n, l, twoJ), energy,
                        "a finite number", "");
            }
        }

        /** The orbit's name in spectroscopic notation, e.g. "0d5/2". */
        public String name() {
            return name(n, l, twoJ);
        }

        private static String name(int n, int l, int twoJ) {
            String letters = "spdfghiklmnoqrtuvwxyz";
            String letter = l < letters.length() ? String.valueOf(letters.charAt(l)) : "[l=" + l + "]";
            return n + letter + twoJ + "/2";
        }
    }

    private final List<Orbit> orbits;
    private final EnergyScale scale;

    private ShellOrbits(List<Orbit> orbits, EnergyScale scale) {
        this.orbits = orbits;
        this.scale = scale;
    }

    /** A builder for a valence space in the energy unit {@code scale}. */
    public static Builder builder(EnergyScale scale) {
        return new Builder(Objects.requireNonNull(scale, "scale"));
    }

    /** The sd shell (0d5/2, 1s1/2, 0d3/2) with the given single-particle energies, in the unit {@code scale}. */
    public static ShellOrbits sdShell(EnergyScale scale, double d5, double s1, double d3) {
        return builder(scale).orbit(0, 2, 5, d5).orbit(1, 0, 1, s1).orbit(0, 2, 3, d3).build();
    }

    /** Accumulates orbits; each (n, l, j) at most once. */
    public static final class Builder {
        private final EnergyScale scale;
        private final List<Orbit> orbits = new ArrayList<>();

        private Builder(EnergyScale scale) {
            this.scale = scale;
        }

        /** Adds orbit (n, l, 2j) at single-particle energy {@code energy}. */
        public Builder orbit(int n, int l, int twoJ, double energy) {
            Orbit o = new Orbit(n, l, twoJ, energy);
            for (Orbit p : orbits) {
                if (p.n() == n && p.l() == l && p.twoJ() == twoJ) {
                    throw InvalidInputException.of("orbit " + o.name(), "given twice", "each orbit at most once",
                            "An orbit already holds all its 2j + 1 substates.");
                }
            }
            orbits.add(o);
            return this;
        }

        /** The valence space. */
        public ShellOrbits build() {
            if (orbits.isEmpty()) {
                throw InvalidInputException.of("number of orbits", 0, ">= 1", "Add an orbit first.");
            }
            return new ShellOrbits(Collections.unmodifiableList(new ArrayList<>(orbits)), scale);
        }
    }

    /** The orbits, in the order given. */
    public List<Orbit> orbits() {
        return orbits;
    }

    /** Number of single-particle m-states, sum of (2j + 1). */
    public int stateCount() {
        int s = 0;
        for (Orbit o : orbits) {
            s += o.twoJ() + 1;
        }
        return s;
    }

    /** The largest 2j of any orbit. */
    public int maxTwoJ() {
        int m = 0;
        for (Orbit o : orbits) {
            m = Math.max(m, o.twoJ());
        }
        return m;
    }

    /**
     * The M-scheme spectrum: one level per (orbit, m) of degeneracy 1 at the orbit's energy, labelled
     * 2m; complete (no cutoff). Orbits of equal energy with equal 2m merge into one level of
     * degeneracy 2 (the counting is unchanged).
     */
    public Spectrum spectrum() {
        List<Level> levels = new ArrayList<>();
        for (Orbit o : orbits) {
            for (int twoM = -o.twoJ(); twoM <= o.twoJ(); twoM += 2) {
                levels.add(new Level(o.energy(), 1, twoM));
            }
        }
        return Spectrum.of(levels, scale, true, Double.POSITIVE_INFINITY, "");
    }

    @Override
    public String toString() {
        StringBuilder sb = new StringBuilder("ShellOrbits[");
        for (int i = 0; i < orbits.size(); i++) {
            sb.append(i == 0 ? "" : ", ").append(orbits.get(i).name()).append(" at ").append(orbits.get(i).energy());
        }
        return sb.append(" ").append(scale.name()).append("]").toString();
    }
}
