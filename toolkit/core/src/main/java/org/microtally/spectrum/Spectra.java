package org.microtally.spectrum;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import org.microtally.Inputs;
import org.microtally.InvalidInputException;
import org.microtally.MemoryEstimate;
import org.microtally.units.EnergyScale;

/**
 * Builders for the standard single-particle spectra. Each takes an explicit cutoff, records it in
 * the spectrum and says in {@link Spectrum#cutoffNote()} what it costs. Degeneracies are obtained by
 * counting the quantum-number tuples (a dynamic-programming count), never from a closed-form
 * degeneracy formula, so the closed forms can serve as independent checks.
 *
 * <p>Energies of oscillators are excitation energies (zero-point energy omitted), so they are exact
 * integers in units of the (smallest) quantum.
 *
 * <p>Method: the degeneracy counts are the standard recursion for the number of ordered ways to
 * write a number as a sum of parts from a given set (the coin-change count, common practice, no
 * source); closed forms such as (n+1)(n+2)/2 for the 3D oscillator and n + 1 for the 2D one are
 * what the tests compare with. Accuracy: degeneracies are exact integers; energies are exact integers
 * in the stated unit for the oscillator, box, spin and rotor builders; {@code twoLevel} stores the
 * given gap as it is, and {@code equallySpaced} forms i * spacing in double, one rounding per level.
 */
public final class Spectra {
    private Spectra() { }

    private static final String OSCILLATOR_COST = "levels above %d quanta omitted: exact counts are complete for "
            + "total excitation <= %d quanta; a thermal result misses the occupation of the omitted levels, of "
            + "order g(E) exp(-(E - mu)/kT) at E = %d";

    /**
     * An isotropic harmonic oscillator in {@code dimensions} = 1, 2 or 3, energies n = 0..maxQuanta in
     * units of hbar*omega above the zero-point energy, degeneracy = number of ways to write n as an
     * ordered sum of {@code dimensions} non-negative integers.
     */
    public static Spectrum harmonicOscillator(int dimensions, int maxQuanta) {
        requireDimensions(dimensions);
        int[] ratios = new int[dimensions];
        Arrays.fill(ratios, 1);
        return harmonicOscillator(ratios, maxQuanta);
    }

    /**
     * An anisotropic harmonic oscillator with integer frequency ratios {@code omega_i = ratios[i] * omega}:
     * level energy e = sum ratios[i] n_i for e = 0..maxQuanta (in units of hbar*omega of the smallest
     * ratio unit), degeneracy = number of non-negative tuples (n_i) with that sum, counted by the
     * standard coin-change recursion. Energies with no tuple are omitted.
     *
     * @param ratios    1 to 3 positive integers, e.g. {4, 4, 1} for a cigar trap
     * @param maxQuanta cutoff on the excitation energy, &gt;= 0
     */
    public static Spectrum harmonicOscillator(int[] ratios, int maxQuanta) {
        requireDimensions(ratios.length);
        for (int i = 0; i < ratios.length; i++) {
            Inputs.atLeast("frequency ratio " + i, ratios[i], 1);
        }
        requireCutoff(maxQuanta);
        requireLevels("oscillator cutoff (max quanta)", maxQuanta, "maxQuanta + 1 energies", maxQuanta + 1.0);
        long[] ways = new long[maxQuanta + 1];
        ways[0] = 1;
        for (int r : ratios) {
            for (int e = r; e <= maxQuanta; e++) {
                ways[e] += ways[e - r];
            }
        }
        List<Level> levels = new ArrayList<>();
        for (int e = 0; e <= maxQuanta; e++) {
            if (ways[e] > 0) {
                levels.add(new Level(e, toDegeneracy(ways[e], e)));
            }
        }
        return Spectrum.of(levels, EnergyScale.abstractUnit("hbar*omega"), false, maxQuanta,
                String.format(OSCILLATOR_COST, maxQuanta, maxQuanta, maxQuanta + 1));
    }

    /**
     * The 2D isotropic oscillator resolved by angular momentum: level (n, m) with energy n (quanta
     * above zero point) and label m, where m runs over -n, -n+2, ..., n. Each (n, m) is one state;
     * counted from the polar quantum numbers n = 2 n_r + |m|, n_r &gt;= 0.
     */
    public static Spectrum oscillator2dByAngularMomentum(int maxQuanta) {
        requireCutoff(maxQuanta);
        requireLevels("oscillator cutoff (max quanta)", maxQuanta, "(maxQuanta + 1)(maxQuanta + 2)/2 levels",
                (maxQuanta + 1.0) * (maxQuanta + 2.0) / 2);
        List<Level> levels = new ArrayList<>();
        for (int nr = 0; 2 * nr <= maxQuanta; nr++) {
            for (int absM = 0; 2 * nr + absM <= maxQuanta; absM++) {
                int n = 2 * nr + absM;
                levels.add(new Level(n, 1, absM));
                if (absM != 0) {
                    levels.add(new Level(n, 1, -absM));
                }
            }
        }
        return Spectrum.of(levels, EnergyScale.abstractUnit("hbar*omega"), true, maxQuanta,
                String.format(OSCILLATOR_COST, maxQuanta, maxQuanta, maxQuanta + 1));
    }

    /**
     * A particle in a cubic box with hard walls in 1, 2 or 3 dimensions: energies s = sum n_i^2,
     * n_i &gt;= 1, in units of h^2 / (8 m L^2); degeneracy = number of ordered representations of s
     * as such a sum. Values of s with no representation are omitted.
     *
     * @param maxSquareSum cutoff on s, &gt;= dimensions
     */
    public static Spectrum particleInBox(int dimensions, int maxSquareSum) {
        requireDimensions(dimensions);
        if (maxSquareSum < dimensions) {
            throw InvalidInputException.of("cutoff on n1^2+...+nd^2", maxSquareSum,
                    ">= the ground value " + dimensions + " for d = " + dimensions, "");
        }
        requireLevels("cutoff on n1^2+...+nd^2", maxSquareSum, "maxSquareSum + 1 values of the sum",
                maxSquareSum + 1.0);
        long[] ways = new long[maxSquareSum + 1];
        ways[0] = 1;
        for (int d = 0; d < dimensions; d++) {
            long[] next = new long[maxSquareSum + 1];
            for (int s = 0; s <= maxSquareSum; s++) {
                if (ways[s] == 0) {
                    continue;
                }
                for (long n = 1; s + n * n <= maxSquareSum; n++) {
                    next[(int) (s + n * n)] += ways[s];
                }
            }
            ways = next;
        }
        List<Level> levels = new ArrayList<>();
        for (int s = 0; s <= maxSquareSum; s++) {
            if (ways[s] > 0) {
                levels.add(new Level(s, toDegeneracy(ways[s], s)));
            }
        }
        return Spectrum.of(levels, EnergyScale.abstractUnit("h^2/(8 m L^2)"), false, maxSquareSum,
                "levels with n1^2+...+nd^2 > " + maxSquareSum + " omitted: exact counts are complete while the "
                        + "total energy minus the other particles' minimum stays <= " + maxSquareSum
                        + "; a thermal result misses the occupation of the omitted levels");
    }

    /** Two non-degenerate levels at 0 and {@code gap}. */
    public static Spectrum twoLevel(double gap) {
        return twoLevel(gap, 1, 1);
    }

    /** Two levels at 0 and {@code gap} (&gt; 0) with degeneracies g0 and g1. */
    public static Spectrum twoLevel(double gap, int g0, int g1) {
        if (!(gap > 0) || !Double.isFinite(gap)) {
            throw InvalidInputException.of("two-level gap", gap, "a finite number > 0", "");
        }
        return Spectrum.of(List.of(new Level(0, g0), new Level(gap, g1)));
    }

    /** {@code count} non-degenerate levels at 0, spacing, 2*spacing, ... (an n-level system). */
    public static Spectrum equallySpaced(int count, double spacing) {
        Inputs.atLeast("number of levels", count, 1);
        if (!(spacing > 0) || !Double.isFinite(spacing)) {
            throw InvalidInputException.of("level spacing", spacing, "a finite number > 0", "");
        }
        requireLevels("number of levels", count, "that many levels", count);
        double[] e = new double[count];
        for (int i = 0; i < count; i++) {
            e[i] = i * spacing;
        }
        return Spectrum.ofEnergies(e);
    }

    /**
     * A spin J in a magnetic field: 2J+1 non-degenerate levels m = J, J-1, ..., -J with energy
     * J - m in units of the Zeeman splitting g mu_B B (so the m = J state is the ground level at 0),
     * labelled by 2m. J may be a half-integer.
     *
     * @param j the spin, a positive multiple of 1/2
     */
    public static Spectrum spinInField(double j) {
        double twoJ = 2 * j;
        if (!(j > 0) || twoJ != Math.rint(twoJ) || twoJ > 1_000_000) {
            throw InvalidInputException.of("spin J", j, "a positive multiple of 1/2 (0.5, 1, 1.5, ...) up to 500000",
                    "Round J to the nearest half-integer.");
        }
        int tj = (int) twoJ;
        List<Level> levels = new ArrayList<>(tj + 1);
        for (int k = 0; k <= tj; k++) {
            levels.add(new Level(k, 1, tj - 2 * k));
        }
        return Spectrum.of(levels, EnergyScale.abstractUnit("g*muB*B"), true, Double.POSITIVE_INFINITY, "");
    }

    /**
     * A rigid rotor: levels J = 0..maxJ with energy J(J+1) in units of hbar^2 / (2I) and degeneracy
     * 2J+1.
     */
    public static Spectrum rigidRotor(int maxJ) {
        if (maxJ < 0 || maxJ > 46_000) {
            throw InvalidInputException.of("rotor cutoff J", maxJ, "an integer in [0, 46000]", "");
        }
        List<Level> levels = new ArrayList<>(maxJ + 1);
        for (int j = 0; j <= maxJ; j++) {
            levels.add(new Level((double) j * (j + 1), 2 * j + 1));
        }
        return Spectrum.of(levels, EnergyScale.abstractUnit("hbar^2/(2I)"), false, (double) maxJ * (maxJ + 1),
                "rotor levels with J > " + maxJ + " omitted: a thermal result misses their occupation, of order "
                        + (2 * maxJ + 3) + " exp(-" + ((long) (maxJ + 1) * (maxJ + 2)) + " / kT) per particle");
    }

    private static void requireDimensions(int d) {
        if (d < 1 || d > 3) {
            throw InvalidInputException.of("number of dimensions", d, "1, 2 or 3", "");
        }
    }

    /** Bytes per level while building: the level record, its list slot, the spectrum's arrays, a count. */
    private static final double BYTES_PER_LEVEL = 64;

    private static void requireLevels(String what, int value, String sizeInWords, double levels) {
        MemoryEstimate.require(what, value, sizeInWords, levels, BYTES_PER_LEVEL,
                "Lower the cutoff (thermal results need levels up to about mu + 40 kT), or give Java more heap (-Xmx; MICROTALLY_HEAP=4g for toolkit/bin/microtally, install-kernel --heap 4g for the kernel).");
    }

    private static void requireCutoff(int maxQuanta) {
        Inputs.atLeast("cutoff (max quanta)", maxQuanta, 0);
    }

    private static int toDegeneracy(long ways, int energy) {
        if (ways > Integer.MAX_VALUE) {
            throw InvalidInputException.of("degeneracy at energy " + energy, ways, "at most 2^31 - 1",
                    "Lower the cutoff.");
        }
        return (int) ways;
    }
}
