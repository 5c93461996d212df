package org.microtally.lattice;

import org.microtally.InvalidInputException;

/**
 * An interacting model on the sites of a {@link Lattice}. Energies are exact integers in units of
 * |J| (the coupling's size); the sign of J is part of the model.
 *
 * <ul>
 * <li>Ising: spins s = +-1, E = -sign(J) sum over bonds s_i s_j, so E runs from -B to B in steps of
 *     2 (B bonds). Magnetisation M = sum s_i.</li>
 * <li>q-state Potts: sigma in {0..q-1}, E = -sign(J) x (number of bonds with sigma_i = sigma_j).</li>
 * <li>Hard-core lattice gas: occupations n_i in {0, 1} with no two neighbours occupied
 *     (independent sets of the graph), counted by the particle number n; there is no energy.</li>
 * </ul>
 */
public final class Model {
    /** Sign of the coupling J. */
    public enum Coupling {
        /** J &gt; 0: aligned (equal) neighbours lower the energy. */
        FERROMAGNETIC(1),
        /** J &lt; 0: aligned (equal) neighbours raise the energy. */
        ANTIFERROMAGNETIC(-1);

        final int sign;

        Coupling(int sign) {
            this.sign = sign;
        }
    }

    enum Kind { ISING, POTTS, HARD_CORE }

    private final Kind kind;
    private final int q;
    private final Coupling coupling;

    private Model(Kind kind, int q, Coupling coupling) {
        this.kind = kind;
        this.q = q;
        this.coupling = coupling;
    }

    /** The Ising model with the given sign of J. */
    public static Model ising(Coupling coupling) {
        return new Model(Kind.ISING, 2, java.util.Objects.requireNonNull(coupling, "coupling"));
    }

    /** The q-state Potts model, q &gt;= 2 (q = 2 is the Ising model with J halved and shifted). */
    public static Model potts(int q, Coupling coupling) {
        if (q < 2) {
            throw InvalidInputException.of("q (Potts states per site)", q, "an integer >= 2", "q = 1 has a single configuration.");
        }
        if (q > 64) {
            throw InvalidInputException.of("q (Potts states per site)", q, "at most 64", "Exact transfer matrices beyond that are out of reach.");
        }
        return new Model(Kind.POTTS, q, java.util.Objects.requireNonNull(coupling, "coupling"));
    }

    /** The hard-core lattice gas (nearest-neighbour exclusion), counted by particle number. */
    public static Model hardCore() {
        return new Model(Kind.HARD_CORE, 2, Coupling.FERROMAGNETIC);
    }

    Kind kind() {
        return kind;
    }

    /** States per site: 2 for Ising and hard core, q for Potts. */
    public int statesPerSite() {
        return q;
    }

    /** The sign of J (ferromagnetic for the hard-core gas, where it plays no role). */
    public Coupling coupling() {
        return coupling;
    }

    /** True for the Ising model, the only one with a magnetisation label here. */
    public boolean hasMagnetisation() {
        return kind == Kind.ISING;
    }

    /**
     * The energy in units of |J| of a configuration with {@code unequal} of the {@code bonds} bonds
     * joining unequal neighbours.
     */
    long energy(long unequal, long bonds) {
        long e = switch (kind) {
            case ISING -> 2 * unequal - bonds;
            case POTTS -> unequal - bonds;
            case HARD_CORE -> 0;
        };
        return coupling.sign * e;
    }

    @Override
    public String toString() {
        return switch (kind) {
            case ISING -> "Ising model, " + coupling.name().toLowerCase();
            case POTTS -> q + "-state Potts model, " + coupling.name().toLowerCase();
            case HARD_CORE -> "hard-core lattice gas";
        };
    }
}
