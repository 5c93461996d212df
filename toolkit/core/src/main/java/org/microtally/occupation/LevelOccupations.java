package org.microtally.occupation;

import java.util.ArrayList;
import java.util.List;
import org.microtally.InvalidInputException;
import org.microtally.Tabular;

/**
 * Mean occupation of every single-particle level of a spectrum in one ensemble: the mean number of
 * particles in one state of the level and in the whole level (degeneracy times that).
 *
 * <p>Immutable; arrays are copied in and out. How the numbers were computed (and their accuracy) is
 * stated by the ensemble that made them.
 */
public final class LevelOccupations implements Tabular {
    private final double[] energies;
    private final int[] degeneracies;
    private final double[] perState;

    /**
     * @param energies     level energies
     * @param degeneracies level degeneracies
     * @param perState     mean occupation of one state of each level; finite and &gt;= 0
     */
    public LevelOccupations(double[] energies, int[] degeneracies, double[] perState) {
        if (energies.length != degeneracies.length || energies.length != perState.length) {
            throw InvalidInputException.of("lengths of energies/degeneracies/occupations",
                    energies.length + "/" + degeneracies.length + "/" + perState.length, "equal", "");
        }
        for (int i = 0; i < perState.length; i++) {
            if (!(perState[i] >= 0) || !Double.isFinite(perState[i])) {
                throw InvalidInputException.of("occupation of level " + i, perState[i], "a finite number >= 0", "");
            }
        }
        this.energies = energies.clone();
        this.degeneracies = degeneracies.clone();
        this.perState = perState.clone();
    }

    /** Number of levels. */
    public int size() {
        return energies.length;
    }

    /** Energy of level i. */
    public double energy(int i) {
        return energies[i];
    }

    /** Degeneracy of level i. */
    public int degeneracy(int i) {
        return degeneracies[i];
    }

    /** Mean number of particles in one state of level i. */
    public double perState(int i) {
        return perState[i];
    }

    /** Mean number of particles in the whole level i (degeneracy x per state). */
    public double levelTotal(int i) {
        return degeneracies[i] * perState[i];
    }

    /** Mean occupations per state, one per level (a copy). */
    public double[] perStateArray() {
        return perState.clone();
    }

    /** Sum over all levels of the level totals (the mean particle number). */
    public double total() {
        double s = 0;
        for (int i = 0; i < perState.length; i++) {
            s += levelTotal(i);
        }
        return s;
    }

    @Override
    public List<String> columnNames() {
        return List.of("level", "energy", "degeneracy", "mean per state", "mean in level");
    }

    @Override
    public List<List<Object>> rows() {
        List<List<Object>> rows = new ArrayList<>(energies.length);
        for (int i = 0; i < energies.length; i++) {
            rows.add(List.of(i, energies[i], degeneracies[i], perState[i], levelTotal(i)));
        }
        return rows;
    }

    /** E.g. {@code "LevelOccupations[13 levels, 12.0 particles, lowest level 1.0 per state]"}. */
    @Override
    public String toString() {
        return "LevelOccupations[" + perState.length + " levels, " + total() + " particles"
                + (perState.length > 0 ? ", lowest level " + perState[0] + " per state" : "") + "]";
    }
}
