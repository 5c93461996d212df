package org.microtally.ensemble;

import java.util.Objects;
import java.util.function.IntFunction;
import org.microtally.Inputs;
import org.microtally.InvalidInputException;
import org.microtally.spectrum.Spectrum;
import org.microtally.spectrum.Statistics;

/**
 * Chooses the cutoff of an infinite spectrum from a tolerance instead of asking for one: the smallest
 * integer cutoff at which the estimated effect of the omitted levels on every reported quantity
 * (N, U, S and the lowest level's number, relative; {@link TruncationCheck}) is at most the
 * tolerance, for N particles at temperature kT (use the highest kT of a sweep).
 *
 * <p>Method: the cutoff is doubled from 8 until the estimate meets the tolerance, then bisected to
 * the smallest integer that meets it; each trial is the grand canonical ensemble at &lt;N&gt; = N
 * (whose top-level occupations equal the canonical ones to relative order e^{-(e_top - mu)/kT}, far
 * below the tolerance there). The ensembles built on the result check the cutoff again with their own
 * occupations and warn if it does not meet {@link TruncationCheck#TOLERANCE}. The estimate is an
 * extrapolation from the top two levels (stated in {@link TruncationCheck}); it is reliable where the
 * level occupations decay smoothly, as for oscillators, boxes and rotors.
 *
 * <pre>
 * Spectrum trap = Cutoffs.forTolerance(cut -&gt; Spectra.harmonicOscillator(3, cut), Statistics.BOSE, 1000, 7.5);
 * </pre>
 */
public final class Cutoffs {
    /** The default tolerance on every reported quantity. */
    public static final double DEFAULT_TOLERANCE = TruncationCheck.TOLERANCE;
    /**
     * How far a stated cutoff effect may be from the actual change when the cutoff is raised: the
     * tests (CutoffEffectTest, a trap cut at 175 quanta against the same at 400) require the estimate
     * within this fraction. An observed accuracy of an extrapolation, not a bound.
     */
    public static final double ESTIMATE_RELATIVE_ERROR = 0.3;
    private static final int LARGEST = 1 << 22;

    private Cutoffs() { }

    /** {@link #forTolerance(IntFunction, Statistics, int, double, double)} with tolerance {@value #DEFAULT_TOLERANCE}. */
    public static Spectrum forTolerance(IntFunction<Spectrum> builder, Statistics statistics, int n, double kT) {
        return forTolerance(builder, statistics, n, kT, DEFAULT_TOLERANCE);
    }

    /**
     * The spectrum {@code builder.apply(cutoff)} for the smallest cutoff meeting {@code tolerance}.
     *
     * @param builder   an existing cutoff builder, e.g. {@code cut -> Spectra.harmonicOscillator(3, cut)}
     * @param tolerance relative effect allowed on every reported quantity, in [1e-15, 0.1]
     * @throws InvalidInputException for a bad tolerance, N or kT, or when no cutoff up to 2^22 meets it
     */
    public static Spectrum forTolerance(IntFunction<Spectrum> builder, Statistics statistics, int n, double kT,
                                        double tolerance) {
        Objects.requireNonNull(builder, "builder");
        Objects.requireNonNull(statistics, "statistics");
        if (!(tolerance >= 1e-15 && tolerance <= 0.1)) {
            throw InvalidInputException.of("cutoff tolerance", tolerance, "in [1e-15, 0.1]",
                    "Below 1e-15 the estimate itself is not that accurate.");
        }
        Inputs.particleNumber(n);
        Inputs.temperature(kT);
        int hi = 8;
        while (!meets(builder.apply(hi), statistics, n, kT, tolerance)) {
            if (hi >= LARGEST) {
                throw InvalidInputException.of("cutoff needed for tolerance " + tolerance, "> " + LARGEST,
                        "at most " + LARGEST, "Lower kT or loosen the tolerance.");
            }
            hi *= 2;
        }
        int lo = hi / 2;
        while (hi - lo > 1) {
            int mid = lo + (hi - lo) / 2;
            if (meets(builder.apply(mid), statistics, n, kT, tolerance)) {
                hi = mid;
            } else {
                lo = mid;
            }
        }
        return builder.apply(hi);
    }

    private static boolean meets(Spectrum s, Statistics st, int n, double kT, double tolerance) {
        if (st.capped() && (double) st.maxOccupancy() * s.stateCount() <= n) {
            return false;
        }
        GrandCanonical g = GrandCanonical.ofMeanNumber(s, st, kT, n);
        double[] perState = new double[s.size()];
        for (int i = 0; i < perState.length; i++) {
            perState[i] = g.occupations().perState(i);
        }
        return TruncationCheck.effect(s, perState, n, kT, g.chemicalPotential(), g.energy(), g.entropy(),
                g.groundLevelMean()).worst() <= tolerance;
    }
}
