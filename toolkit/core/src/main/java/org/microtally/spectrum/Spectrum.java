package org.microtally.spectrum;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.Collections;
import java.util.Comparator;
import java.util.List;
import java.util.Objects;
import org.microtally.Inputs;
import org.microtally.InvalidInputException;
import org.microtally.units.EnergyScale;

/**
 * An immutable list of single-particle levels, sorted by energy (then label), in the unit of a
 * declared {@link EnergyScale}.
 *
 * <p>Normalisation (documented behaviour, not an error): input levels are sorted by energy and
 * label; levels with equal energy and equal label are merged into one level whose degeneracy is
 * the sum. A spectrum may be <em>labelled</em>: every level then carries an integer label of a
 * second conserved quantity (such as 2m), and exact counting can resolve totals of that label.
 *
 * <p>Exactness test: a level energy counts as an integer multiple of the quantum, for
 * {@link #isExact()} and {@link #integerEnergies()}, only when it equals its nearest integer exactly
 * (no tolerance) and lies within int range; an energy such as 0.1 + 0.2 is therefore not exact, and
 * rounding to integers is the caller's deliberate choice. Equal energies are merged by exact double
 * comparison in the same way.
 *
 * <p>Every builder in {@link Spectra} truncates an infinite spectrum at an explicit cutoff;
 * {@link #cutoffEnergy()} records it and {@link #cutoffNote()} says what it costs. Exact counts
 * of total energy E are unaffected by the cutoff when E - (lowest energy of the other N-1
 * particles) stays at or below the cutoff; thermal results are affected by the occupation of the
 * omitted levels.
 */
public final class Spectrum {
    private static final double INTEGER_LIMIT = 2147483647.0;

    private final List<Level> levels;
    private final EnergyScale scale;
    private final boolean labelled;
    private final double cutoffEnergy;
    private final String cutoffNote;
    private final long stateCount;
    private final boolean completenessUndeclared;

    private Spectrum(List<Level> levels, EnergyScale scale, boolean labelled, double cutoffEnergy, String cutoffNote) {
        this(levels, scale, labelled, cutoffEnergy, cutoffNote, false);
    }

    private Spectrum(List<Level> levels, EnergyScale scale, boolean labelled, double cutoffEnergy, String cutoffNote,
                     boolean completenessUndeclared) {
        this.completenessUndeclared = completenessUndeclared;
        this.levels = levels;
        this.scale = scale;
        this.labelled = labelled;
        this.cutoffEnergy = cutoffEnergy;
        this.cutoffNote = cutoffNote;
        long states = 0;
        for (Level l : levels) {
            states += l.degeneracy();
        }
        this.stateCount = states;
    }

    /**
     * A spectrum from a list of levels (sorted and merged as described above).
     *
     * @param levels       at least one level
     * @param scale        the unit of every energy
     * @param labelled     whether the levels' labels are meaningful
     * @param cutoffEnergy energy above which levels were omitted ({@code Double.POSITIVE_INFINITY}
     *                     for a complete finite spectrum)
     * @param cutoffNote   what the cutoff costs, in words (may be empty for a complete spectrum)
     */
    public static Spectrum of(List<Level> levels, EnergyScale scale, boolean labelled, double cutoffEnergy,
                              String cutoffNote) {
        Objects.requireNonNull(levels, "levels");
        Objects.requireNonNull(scale, "scale");
        if (levels.isEmpty()) {
            throw InvalidInputException.of("number of levels", 0, ">= 1", "Give at least one level.");
        }
        if (Double.isNaN(cutoffEnergy)) {
            throw InvalidInputException.of("cutoff energy", cutoffEnergy, "a number or +infinity", "");
        }
        List<Level> sorted = new ArrayList<>(levels);
        for (int i = 0; i < sorted.size(); i++) {
            Level l = sorted.get(i);
            if (l == null) {
                throw InvalidInputException.of("level " + i, "null", "a Level", "");
            }
            if (!labelled && l.label() != 0) {
                sorted.set(i, new Level(l.energy(), l.degeneracy(), 0)); // drop labels before merging
            }
        }
        sorted.sort(Comparator.comparingDouble(Level::energy).thenComparingInt(Level::label));
        List<Level> merged = new ArrayList<>(sorted.size());
        for (Level l : sorted) {
            Level last = merged.isEmpty() ? null : merged.get(merged.size() - 1);
            if (last != null && last.energy() == l.energy() && last.label() == l.label()) {
                long g = (long) last.degeneracy() + l.degeneracy();
                if (g > Integer.MAX_VALUE) {
                    throw InvalidInputException.of("merged degeneracy at energy " + l.energy(), g,
                            "at most 2^31 - 1", "");
                }
                merged.set(merged.size() - 1, new Level(l.energy(), (int) g, l.label()));
            } else {
                merged.add(l);
            }
        }
        return new Spectrum(Collections.unmodifiableList(merged), scale, labelled, cutoffEnergy,
                cutoffNote == null ? "" : cutoffNote);
    }

    /** An unlabelled, complete spectrum in an abstract unit named {@code "unit"}. */
    public static Spectrum of(List<Level> levels) {
        return of(levels, EnergyScale.abstractUnit("unit"), false, Double.POSITIVE_INFINITY, "");
    }

    /** An unlabelled, complete spectrum from parallel arrays of energies and degeneracies. */
    public static Spectrum of(double[] energies, int[] degeneracies) {
        Objects.requireNonNull(energies, "energies");
        Objects.requireNonNull(degeneracies, "degeneracies");
        if (energies.length != degeneracies.length) {
            throw InvalidInputException.of("length of degeneracies", degeneracies.length,
                    "equal to the number of energies (" + energies.length + ")", "");
        }
        List<Level> list = new ArrayList<>(energies.length);
        for (int i = 0; i < energies.length; i++) {
            if (!Double.isFinite(energies[i])) {
                throw InvalidInputException.of("energy of level " + i, energies[i], "a finite number", "");
            }
            Inputs.atLeast("degeneracy of level " + i, degeneracies[i], 1);
            list.add(new Level(energies[i], degeneracies[i]));
        }
        return of(list);
    }

    /**
     * An unlabelled, complete spectrum from columns read as numbers (for example from a table): each
     * degeneracy must be a whole number &gt;= 1 (2.0 is accepted, 2.5 is refused, naming the level).
     */
    public static Spectrum of(double[] energies, double[] degeneracies) {
        Objects.requireNonNull(degeneracies, "degeneracies");
        int[] g = new int[degeneracies.length];
        for (int i = 0; i < g.length; i++) {
            double d = degeneracies[i];
            if (!(d >= 1) || d != Math.rint(d) || d > Integer.MAX_VALUE) {
                throw InvalidInputException.of("degeneracy of level " + i, d, "a whole number >= 1 (at most 2^31 - 1)",
                        "Degeneracies count states; round or fix the input column.");
            }
            g[i] = (int) d;
        }
        return of(energies, g);
    }

    /** An unlabelled, complete spectrum of non-degenerate levels. */
    public static Spectrum ofEnergies(double... energies) {
        int[] g = new int[energies.length];
        Arrays.fill(g, 1);
        return of(energies, g);
    }

    /** The levels, sorted by energy then label; unmodifiable. */
    public List<Level> levels() {
        return levels;
    }

    /** Number of distinct levels. */
    public int size() {
        return levels.size();
    }

    /** Level {@code i} (0-based, in energy order). */
    public Level level(int i) {
        return levels.get(i);
    }

    /** Energy of level {@code i}. */
    public double energy(int i) {
        return levels.get(i).energy();
    }

    /** Degeneracy of level {@code i}. */
    public int degeneracy(int i) {
        return levels.get(i).degeneracy();
    }

    /** Label of level {@code i} (0 for unlabelled spectra). */
    public int label(int i) {
        return levels.get(i).label();
    }

    /** Total number of single-particle states, the sum of degeneracies. */
    public long stateCount() {
        return stateCount;
    }

    /** Whether labels carry a second conserved quantity. */
    public boolean isLabelled() {
        return labelled;
    }

    /** The unit of the energies. */
    public EnergyScale scale() {
        return scale;
    }

    /** Lowest level energy. */
    public double groundEnergy() {
        return levels.get(0).energy();
    }

    /** Highest level energy kept. */
    public double topEnergy() {
        return levels.get(levels.size() - 1).energy();
    }

    /** Energy above which levels were omitted; +infinity when the spectrum is complete. */
    public double cutoffEnergy() {
        return cutoffEnergy;
    }

    /** Whether levels above {@link #cutoffEnergy()} were omitted from an infinite spectrum. */
    public boolean isTruncated() {
        return cutoffEnergy != Double.POSITIVE_INFINITY;
    }

    /**
     * Whether the source of this spectrum declared neither a cutoff nor that it is complete (a table
     * read without a cutoff): it is then used as complete ({@link #isTruncated()} is false), but the
     * ensembles warn when its top level is populated, since levels above it may have been left out.
     */
    public boolean isCompletenessUndeclared() {
        return completenessUndeclared;
    }

    /**
     * The same spectrum marked {@link #isCompletenessUndeclared() completeness undeclared}, with
     * {@code note} saying where it came from (for readers of level tables without a stated cutoff).
     *
     * @throws InvalidInputException if this spectrum is already truncated at a declared cutoff
     */
    public Spectrum withCompletenessUndeclared(String note) {
        if (isTruncated()) {
            throw InvalidInputException.of("cutoff of a spectrum marked as of undeclared completeness", cutoffEnergy,
                    "+infinity (no declared cutoff)", "A declared cutoff already says what is missing.");
        }
        return new Spectrum(levels, scale, labelled, cutoffEnergy, note == null ? "" : note, true);
    }

    /** What the cutoff costs, in words; empty for a complete spectrum. */
    public String cutoffNote() {
        return cutoffNote;
    }

    /** True when every energy is an integer multiple of the quantum (within int range). */
    public boolean isExact() {
        for (Level l : levels) {
            if (!isInteger(l.energy())) {
                return false;
            }
        }
        return true;
    }

    /**
     * The energies as integers, one per level, for exact counting.
     *
     * @throws NonIntegerEnergyException naming the first level whose energy is not an integer
     */
    public int[] integerEnergies() {
        int[] e = new int[levels.size()];
        for (int i = 0; i < e.length; i++) {
            double v = levels.get(i).energy();
            if (!isInteger(v)) {
                throw new NonIntegerEnergyException(i, v, scale.name());
            }
            e[i] = (int) v;
        }
        return e;
    }

    /** The degeneracies, one per level. */
    public int[] degeneracies() {
        int[] g = new int[levels.size()];
        for (int i = 0; i < g.length; i++) {
            g[i] = levels.get(i).degeneracy();
        }
        return g;
    }

    /** The energies, one per level. */
    public double[] energies() {
        double[] e = new double[levels.size()];
        for (int i = 0; i < e.length; i++) {
            e[i] = levels.get(i).energy();
        }
        return e;
    }

    /**
     * The same spectrum with every degeneracy multiplied by {@code factor}: an internal multiplicity
     * such as spin (2S+1 = 2 for spin-1/2) that does not change the energy.
     */
    public Spectrum withInternalMultiplicity(int factor) {
        if (factor < 1) {
            throw InvalidInputException.of("internal multiplicity", factor, "an integer >= 1",
                    "Use 2 for spin-1/2 particles.");
        }
        List<Level> scaled = new ArrayList<>(levels.size());
        for (Level l : levels) {
            long g = (long) l.degeneracy() * factor;
            if (g > Integer.MAX_VALUE) {
                throw InvalidInputException.of("degeneracy at energy " + l.energy() + " times " + factor, g,
                        "at most 2^31 - 1", "");
            }
            scaled.add(new Level(l.energy(), (int) g, l.label()));
        }
        return new Spectrum(Collections.unmodifiableList(scaled), scale, labelled, cutoffEnergy, cutoffNote,
                completenessUndeclared);
    }

    /** The same levels in another declared unit (no numeric change: the numbers are re-labelled). */
    public Spectrum withScale(EnergyScale newScale) {
        return new Spectrum(levels, Objects.requireNonNull(newScale, "scale"), labelled, cutoffEnergy, cutoffNote,
                completenessUndeclared);
    }

    /** The levels with energy &lt;= {@code maxEnergy}; the new cutoff is the smaller of the two. */
    public Spectrum truncatedAt(double maxEnergy) {
        List<Level> kept = new ArrayList<>();
        for (Level l : levels) {
            if (l.energy() <= maxEnergy) {
                kept.add(l);
            }
        }
        if (kept.isEmpty()) {
            throw InvalidInputException.of("truncation energy", maxEnergy,
                    ">= the ground energy " + groundEnergy(), "");
        }
        double cut = Math.min(cutoffEnergy, maxEnergy);
        String note = "levels above " + maxEnergy + " " + scale.name() + " omitted"
                + (cutoffNote.isEmpty() ? "" : "; " + cutoffNote);
        return new Spectrum(Collections.unmodifiableList(kept), scale, labelled, cut, note);
    }

    private static boolean isInteger(double v) {
        return v == Math.rint(v) && Math.abs(v) <= INTEGER_LIMIT;
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof Spectrum s && s.levels.equals(levels) && s.scale.equals(scale) && s.labelled == labelled
                && Double.compare(s.cutoffEnergy, cutoffEnergy) == 0;
    }

    @Override
    public int hashCode() {
        return Objects.hash(levels, scale, labelled, cutoffEnergy);
    }

    @Override
    public String toString() {
        StringBuilder sb = new StringBuilder("Spectrum[").append(levels.size()).append(" levels, ")
                .append(stateCount).append(" states, unit ").append(scale.name());
        if (isTruncated()) {
            sb.append(", cutoff ").append(cutoffEnergy);
        }
        return sb.append(']').toString();
    }
}
