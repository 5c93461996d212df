package org.microtally.ensemble;

import java.math.BigInteger;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.Collections;
import java.util.Comparator;
import java.util.List;
import java.util.Objects;
import java.util.TreeMap;
import org.microtally.InvalidInputException;
import org.microtally.Tabular;
import org.microtally.units.EnergyScale;

/**
 * An exact density of states: the number g(E) of microstates at each energy E, as exact
 * {@link BigInteger} multiplicities, optionally resolved by a second integer label (for example the
 * magnetisation M of an Ising lattice, giving g(E, M)).
 *
 * <p>Energies are exact integers in units of {@link #scale()} (for lattice models: |J|). Entries are
 * kept sorted by energy, then label; only non-zero multiplicities are stored. This is the input that
 * {@link ExactCanonical} and {@link ExactMicrocanonical} turn into thermodynamics; any exact table
 * (a lattice count, a count table, a user's own table) can be wrapped in it. Immutable.
 */
public final class ExactDensityOfStates implements Tabular {
    private final EnergyScale scale;
    private final String labelName;      // null when unlabelled
    private final long[] energies;
    private final long[] labels;         // null when unlabelled
    private final BigInteger[] counts;

    private ExactDensityOfStates(EnergyScale scale, String labelName, long[] energies, long[] labels, BigInteger[] counts) {
        this.scale = scale;
        this.labelName = labelName;
        this.energies = energies;
        this.labels = labels;
        this.counts = counts;
    }

    /**
     * g(E) from parallel arrays. Zero multiplicities are dropped.
     *
     * @throws InvalidInputException for a negative multiplicity, a repeated energy, arrays of
     *         different lengths, or no non-zero multiplicity at all
     */
    public static ExactDensityOfStates of(EnergyScale scale, long[] energies, BigInteger[] multiplicities) {
        return build(scale, null, energies, null, multiplicities);
    }

    /** g(E, label) from parallel arrays, e.g. labelName {@code "M"}. Same rules as {@link #of}. */
    public static ExactDensityOfStates of(EnergyScale scale, String labelName, long[] energies, long[] labels,
                                          BigInteger[] multiplicities) {
        Objects.requireNonNull(labelName, "labelName");
        Objects.requireNonNull(labels, "labels");
        return build(scale, labelName, energies, labels, multiplicities);
    }

    private static ExactDensityOfStates build(EnergyScale scale, String labelName, long[] energies, long[] labels,
                                              BigInteger[] multiplicities) {
        Objects.requireNonNull(scale, "scale");
        int n = energies.length;
        if (multiplicities.length != n || (labels != null && labels.length != n)) {
            throw InvalidInputException.of("array lengths", n + " energies, " + multiplicities.length + " multiplicities"
                    + (labels == null ? "" : ", " + labels.length + " labels"), "equal", "");
        }
        Integer[] idx = new Integer[n];
        for (int i = 0; i < n; i++) {
            idx[i] = i;
            if (multiplicities[i] == null || multiplicities[i].signum() < 0) {
                throw InvalidInputException.of("multiplicity at E = " + energies[i], multiplicities[i], "an integer >= 0", "");
            }
        }
        Comparator<Integer> byKey = Comparator.comparingLong(i -> energies[i]);
        if (labels != null) {
            byKey = byKey.thenComparingLong(i -> labels[i]);
        }
        Arrays.sort(idx, byKey);
        List<Integer> kept = new ArrayList<>();
        for (int k = 0; k < n; k++) {
            int i = idx[k];
            if (k > 0 && byKey.compare(idx[k - 1], i) == 0) {
                throw InvalidInputException.of("energy" + (labels == null ? "" : " and label"),
                        energies[i] + (labels == null ? "" : ", " + labels[i]), "each given once", "Add the multiplicities first.");
            }
            if (multiplicities[i].signum() > 0) {
                kept.add(i);
            }
        }
        if (kept.isEmpty()) {
            throw InvalidInputException.of("total multiplicity", 0, ">= 1", "A density of states needs at least one state.");
        }
        int m = kept.size();
        long[] e = new long[m];
        long[] l = labels == null ? null : new long[m];
        BigInteger[] g = new BigInteger[m];
        for (int k = 0; k < m; k++) {
            int i = kept.get(k);
            e[k] = energies[i];
            g[k] = multiplicities[i];
            if (l != null) {
                l[k] = labels[i];
            }
        }
        return new ExactDensityOfStates(scale, labelName, e, l, g);
    }

    /** The energy unit: every energy is an integer multiple of it. */
    public EnergyScale scale() {
        return scale;
    }

    /** Number of stored (energy[, label]) entries with non-zero multiplicity. */
    public int size() {
        return energies.length;
    }

    /** Energy of entry i, in units of {@link #scale()}. */
    public long energy(int i) {
        return energies[i];
    }

    /** Multiplicity of entry i (&gt;= 1). */
    public BigInteger multiplicity(int i) {
        return counts[i];
    }

    /** True when entries carry a second label. */
    public boolean labelled() {
        return labels != null;
    }

    /** Name of the second label, e.g. {@code "M"}. */
    public String labelName() {
        requireLabel();
        return labelName;
    }

    /** Second label of entry i. */
    public long label(int i) {
        requireLabel();
        return labels[i];
    }

    private void requireLabel() {
        if (labels == null) {
            throw InvalidInputException.of("label of an unlabelled density of states", "requested", "a density of states built with labels",
                    "Count with a second label (e.g. the magnetisation) to use it.");
        }
    }

    /** The sum of all multiplicities (the total number of microstates). */
    public BigInteger total() {
        BigInteger t = BigInteger.ZERO;
        for (BigInteger g : counts) {
            t = t.add(g);
        }
        return t;
    }

    /** g(E) summed over labels (zero where E does not occur). */
    public BigInteger count(long energy) {
        BigInteger t = BigInteger.ZERO;
        for (int i = 0; i < energies.length; i++) {
            if (energies[i] == energy) {
                t = t.add(counts[i]);
            }
        }
        return t;
    }

    /** g(E, label) (zero where it does not occur). */
    public BigInteger count(long energy, long label) {
        requireLabel();
        for (int i = 0; i < energies.length; i++) {
            if (energies[i] == energy && labels[i] == label) {
                return counts[i];
            }
        }
        return BigInteger.ZERO;
    }

    /** The lowest energy. */
    public long groundEnergy() {
        return energies[0];
    }

    /** The number of microstates at the lowest energy. */
    public BigInteger groundDegeneracy() {
        return count(energies[0]);
    }

    /** The distinct energies, ascending. */
    public long[] distinctEnergies() {
        return Arrays.stream(energies).distinct().toArray();
    }

    /**
     * The same counts with energies in another declared unit (no numeric change: the integers are
     * re-labelled), e.g. {@code withScale(EnergyScale.of("J", Energy.ofTemperature(12)))} for a
     * coupling J/k = 12 K, so temperatures can then be given in kelvin.
     */
    public ExactDensityOfStates withScale(EnergyScale newScale) {
        return new ExactDensityOfStates(Objects.requireNonNull(newScale, "scale"), labelName, energies, labels, counts);
    }

    /** g(E) with the labels summed out (this object itself when unlabelled). */
    public ExactDensityOfStates byEnergy() {
        if (labels == null) {
            return this;
        }
        TreeMap<Long, BigInteger> sum = new TreeMap<>();
        for (int i = 0; i < energies.length; i++) {
            sum.merge(energies[i], counts[i], BigInteger::add);
        }
        long[] e = sum.keySet().stream().mapToLong(Long::longValue).toArray();
        return new ExactDensityOfStates(scale, null, e, null, sum.values().toArray(new BigInteger[0]));
    }

    @Override
    public List<String> columnNames() {
        return labels == null ? List.of("E [" + scale.name() + "]", "g")
                : List.of("E [" + scale.name() + "]", labelName, "g");
    }

    @Override
    public List<List<Object>> rows() {
        List<List<Object>> rows = new ArrayList<>(energies.length);
        for (int i = 0; i < energies.length; i++) {
            rows.add(labels == null ? List.of(energies[i], counts[i]) : List.of(energies[i], labels[i], counts[i]));
        }
        return Collections.unmodifiableList(rows);
    }

    @Override
    public String toString() {
        return "exact density of states: " + energies.length + " entries, " + total() + " microstates, E in " + scale.name();
    }
}
