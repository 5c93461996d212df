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
 */
public final class SpectrumSpec implements Serializable {
    private static final long serialVersionUID = 1L;

    private enum Kind { OSCILLATOR, BOX, EQUALLY_SPACED }

    private final Kind kind;
    private final int[] ints;
    private final double spacing;

    private SpectrumSpec(Kind kind, int[] ints, double spacing) {
        this.kind = kind;
        this.ints = ints;
        this.spacing = spacing;
        build(); // run the builder's validation now, on the caller's thread
    }

    /** {@link Spectra#harmonicOscillator(int[], int)}: integer frequency ratios, cutoff in quanta. */
    public static SpectrumSpec oscillator(int[] ratios, int maxQuanta) {
        Objects.requireNonNull(ratios, "ratios");
        int[] a = Arrays.copyOf(ratios, ratios.length + 1);
        a[ratios.length] = maxQuanta;
        return new SpectrumSpec(Kind.OSCILLATOR, a, 0);
    }

    /** {@link Spectra#particleInBox(int, int)}: a hard-wall cube, cutoff on n1^2 + ... + nd^2. */
    public static SpectrumSpec box(int dimensions, int maxSquareSum) {
        return new SpectrumSpec(Kind.BOX, new int[] {dimensions, maxSquareSum}, 0);
    }

    /** {@link Spectra#equallySpaced(int, double)}: {@code count} non-degenerate equally spaced levels. */
    public static SpectrumSpec equallySpaced(int count, double spacing) {
        if (!(spacing > 0) || !Double.isFinite(spacing)) {
            throw InvalidInputException.of("level spacing", spacing, "a finite number > 0", "");
        }
        return new SpectrumSpec(Kind.EQUALLY_SPACED, new int[] {count}, spacing);
    }

    /** Builds the spectrum (cheap compared with an ensemble run; done once per grid point). */
    public Spectrum build() {
        switch (kind) {
            case OSCILLATOR:
                return Spectra.harmonicOscillator(Arrays.copyOf(ints, ints.length - 1), ints[ints.length - 1]);
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
                        .collect(Collectors.joining(":")) + " cutoff " + ints[ints.length - 1];
            case BOX:
                return "box " + ints[0] + "D cutoff " + ints[1];
            default:
                return "equally spaced " + ints[0] + " x " + spacing;
        }
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof SpectrumSpec s && s.kind == kind && Arrays.equals(s.ints, ints)
                && Double.compare(s.spacing, spacing) == 0;
    }

    @Override
    public int hashCode() {
        return Objects.hash(kind, Arrays.hashCode(ints), spacing);
    }
}
