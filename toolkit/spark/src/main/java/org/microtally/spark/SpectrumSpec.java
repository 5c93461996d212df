package org.microtally.spark;

import java.io.Serializable;
import java.util.Arrays;
import java.util.Objects;
import java.util.stream.Collectors;
import org.microtally.InvalidInputException;
import org.microtally.spectrum.Spectra;
import org.microtally.spectrum.Spectrum;

/**
 * The arguments of one {@link Spectra} builder, small and {@link Serializable} so a sweep ships them to
 * its tasks and each task builds its spectrum where it runs. Immutable; validated when built (the
 * builder's own checks run once on the driver).
 *
 * <p>The cutoff is either fixed or follows the temperature ({@link #oscillatorFollowingKT}): cutoff =
 * max(minimum, ceil(c kT)) quanta, so every point of a sweep over a wide kT range keeps the levels that
 * matter (the occupation of a level c kT above the ground level is of order e^-c per state); the cost of a
 * point grows with the number of states kept, about cutoff^d / (d! product of the ratios) in d dimensions.
 * Each run's truncation warning says what the cutoff still costs.
 */
public final class SpectrumSpec implements Serializable {
    private static final long serialVersionUID = 1L;

    private enum Kind { OSCILLATOR, BOX, EQUALLY_SPACED }

    private final Kind kind;
    private final int[] ints;
    private final double spacing;
    private final double quantaPerKT;

    private SpectrumSpec(Kind kind, int[] ints, double spacing, double quantaPerKT) {
        this.kind = kind;
        this.ints = ints;
        this.spacing = spacing;
        this.quantaPerKT = quantaPerKT;
        build(1.0); // run the builder's validation now, on the caller's thread
    }

    /** {@link Spectra#harmonicOscillator(int[], int)}: integer frequency ratios, cutoff in quanta. */
    public static SpectrumSpec oscillator(int[] ratios, int maxQuanta) {
        Objects.requireNonNull(ratios, "ratios");
        int[] a = Arrays.copyOf(ratios, ratios.length + 1);
        a[ratios.length] = maxQuanta;
        return new SpectrumSpec(Kind.OSCILLATOR, a, 0, 0);
    }

    /**
     * {@link Spectra#harmonicOscillator(int[], int)} with the cutoff max(minQuanta, ceil(quantaPerKT * kT))
     * at each sweep point's kT (see the class notes).
     *
     * @throws InvalidInputException for quantaPerKT not finite or &lt;= 0, and whatever the builder refuses
     */
    public static SpectrumSpec oscillatorFollowingKT(int[] ratios, int minQuanta, double quantaPerKT) {
        Objects.requireNonNull(ratios, "ratios");
        if (!(quantaPerKT > 0) || !Double.isFinite(quantaPerKT)) {
            throw InvalidInputException.of("cutoff in units of kT", quantaPerKT, "a finite number > 0",
                    "About 15 keeps every omitted level below e^-15 per state.");
        }
        int[] a = Arrays.copyOf(ratios, ratios.length + 1);
        a[ratios.length] = minQuanta;
        return new SpectrumSpec(Kind.OSCILLATOR, a, 0, quantaPerKT);
    }

    /** {@link Spectra#particleInBox(int, int)}: a hard-wall cube, cutoff on n1^2 + ... + nd^2. */
    public static SpectrumSpec box(int dimensions, int maxSquareSum) {
        return new SpectrumSpec(Kind.BOX, new int[] {dimensions, maxSquareSum}, 0, 0);
    }

    /** {@link Spectra#equallySpaced(int, double)}: {@code count} non-degenerate equally spaced levels. */
    public static SpectrumSpec equallySpaced(int count, double spacing) {
        if (!(spacing > 0) || !Double.isFinite(spacing)) {
            throw InvalidInputException.of("level spacing", spacing, "a finite number > 0", "");
        }
        return new SpectrumSpec(Kind.EQUALLY_SPACED, new int[] {count}, spacing, 0);
    }

    /** The cutoff, in quanta, at temperature kT (the fixed cutoff unless it follows kT). */
    public int cutoffAt(double kT) {
        int fixed = ints[ints.length - 1];
        if (quantaPerKT == 0) {
            return fixed;
        }
        double c = Math.ceil(quantaPerKT * kT);
        if (!(c < Integer.MAX_VALUE)) {
            throw InvalidInputException.of("cutoff " + quantaPerKT + " kT at kT = " + kT, c, "below 2^31 quanta",
                    "Lower the temperature or the cutoff factor.");
        }
        return Math.max(fixed, (int) c);
    }

    /** Builds the spectrum for temperature kT (cheap compared with an ensemble run; done once per point). */
    public Spectrum build(double kT) {
        switch (kind) {
            case OSCILLATOR:
                return Spectra.harmonicOscillator(Arrays.copyOf(ints, ints.length - 1), cutoffAt(kT));
            case BOX:
                return Spectra.particleInBox(ints[0], ints[1]);
            default:
                return Spectra.equallySpaced(ints[0], spacing);
        }
    }

    /** A short description for the result rows, e.g. {@code oscillator 4:4:1 cutoff 60}. */
    @Override
    public String toString() {
        switch (kind) {
            case OSCILLATOR:
                return "oscillator " + Arrays.stream(ints, 0, ints.length - 1).mapToObj(Integer::toString)
                        .collect(Collectors.joining(":")) + " cutoff " + (quantaPerKT == 0 ? Integer.toString(ints[ints.length - 1])
                        : "max(" + ints[ints.length - 1] + ", " + quantaPerKT + " kT)");
            case BOX:
                return "box " + ints[0] + "D cutoff " + ints[1];
            default:
                return "equally spaced " + ints[0] + " x " + spacing;
        }
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof SpectrumSpec s && s.kind == kind && Arrays.equals(s.ints, ints)
                && Double.compare(s.spacing, spacing) == 0 && Double.compare(s.quantaPerKT, quantaPerKT) == 0;
    }

    @Override
    public int hashCode() {
        return Objects.hash(kind, Arrays.hashCode(ints), spacing, quantaPerKT);
    }
}
