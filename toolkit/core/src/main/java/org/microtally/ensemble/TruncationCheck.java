package org.microtally.ensemble;

import java.util.List;
import org.microtally.spectrum.Spectrum;

/**
 * The cutoff warning shared by the thermal ensembles: the estimated effect of the levels a cutoff
 * omits on each reported quantity, against the project's target of {@link #TOLERANCE} relative.
 *
 * <p>Estimate (an extrapolation, not a bound): the total occupations a_1 of the top level and a_0 of
 * the one below give the ratio r = a_1/a_0 per level spacing delta; the omitted levels are taken to
 * continue it geometrically, so they would hold about dN = a_1 r/(1 - r) particles at a mean energy
 * e_bar = e_top + delta/(1 - r). At fixed N those particles come from the levels near mu, so
 * U changes by about dN (e_bar - mu), S by dN ((e_bar - mu)/kT + 1) (the Maxwell-Boltzmann tail's
 * entropy per particle), C_V by about dN ((e_bar - mu)/kT)^2 and the lowest level's number by at most
 * dN. Where the top levels are not yet decaying (r &gt;= 0.999) no estimate is possible and the warning
 * says so. Spectra whose completeness was not declared ({@link Spectrum#isCompletenessUndeclared()})
 * are checked as if truncated at their top level.
 */
final class TruncationCheck {
    private TruncationCheck() { }

    /** Target relative effect of a cutoff on every reported quantity. */
    static final double TOLERANCE = 1e-12;

    /** Top-level occupation (times max(1, N)) above which {@link #warnings(Spectrum, double, double)} flags. */
    static final double THRESHOLD = 1e-8;

    /** The estimated effects of a cutoff; {@link #worst} is the largest relative one. */
    record Effect(double topOccupation, double omitted, double energy, double entropy, double heatCapacity,
                  double groundLevel, boolean estimable) {
        double worst() {
            return estimable ? Math.max(Math.max(omitted, energy), Math.max(entropy, groundLevel))
                    : Double.POSITIVE_INFINITY;
        }
    }

    static boolean applies(Spectrum s) {
        return s.isTruncated() || s.isCompletenessUndeclared();
    }

    /**
     * The estimate above for occupations per state {@code perState}, N = {@code n}, at kT and
     * chemical potential (or fugacity reference) {@code mu}, with U, S and the lowest level's number
     * as computed (relative effects are taken against their magnitudes).
     */
    static Effect effect(Spectrum s, double[] perState, double n, double kT, double mu, double energy,
                         double entropy, double groundMean) {
        int top = s.size() - 1;
        double a1 = s.degeneracy(top) * perState[top];
        if (a1 == 0) {
            return new Effect(0, 0, 0, 0, 0, 0, true);
        }
        double a0 = top > 0 ? s.degeneracy(top - 1) * perState[top - 1] : 0;
        double r = a0 > 0 ? a1 / a0 : Double.POSITIVE_INFINITY;
        if (!(r < 0.999)) {
            return new Effect(a1, 0, 0, 0, 0, 0, false);
        }
        double dN = a1 * r / (1 - r);
        double delta = s.energy(top) - s.energy(top - 1);
        double x = (s.energy(top) + delta / (1 - r) - mu) / kT;
        double tiny = Double.MIN_NORMAL;
        return new Effect(a1, dN / Math.max(n, tiny), dN * Math.abs(x * kT) / Math.max(Math.abs(energy), tiny),
                dN * (Math.abs(x) + 1) / Math.max(Math.abs(entropy), tiny), dN * x * x,
                groundMean > 0 ? dN / groundMean : 0, true);
    }

    /** The warning for {@link #effect}, or none when every relative effect is within {@link #TOLERANCE}. */
    static List<String> warnings(Spectrum s, double[] perState, double n, double kT, double mu, double energy,
                                 double entropy, double groundMean) {
        if (!applies(s)) {
            return List.of();
        }
        Effect f = effect(s, perState, n, kT, mu, energy, entropy, groundMean);
        if (f.worst() <= TOLERANCE) {
            return List.of();
        }
        String what = s.isTruncated()
                ? String.format("spectrum truncated at %s %s", s.topEnergy(), s.scale().name())
                : String.format("spectrum of undeclared completeness (its source gave no cutoff; top level at %s %s)",
                        s.topEnergy(), s.scale().name());
        String note = s.cutoffNote().isEmpty() ? "" : " (" + s.cutoffNote() + ")";
        if (!f.estimable()) {
            return List.of(String.format("%s: its top level still holds %.3g particles and the top levels are not yet "
                    + "thinning out, so the effect of the cutoff cannot be estimated; raise the cutoff or lower kT%s",
                    what, f.topOccupation(), note));
        }
        return List.of(String.format("%s: its top level still holds %.3g particles; the omitted levels would hold "
                        + "about %.2g more (%.2g of N, extrapolated from the top two levels), changing U by about %.2g, "
                        + "S by %.2g and <N_0> by %.2g (relative) and C_V by %.2g (absolute), against a target of "
                        + "%.0e; raise the cutoff, or choose it with Cutoffs.forTolerance%s",
                what, f.topOccupation(), f.omitted() * n, f.omitted(), f.energy(), f.entropy(), f.groundLevel(),
                f.heatCapacity(), TOLERANCE, note));
    }

    /**
     * The earlier, coarser check kept for callers that have only the top level's occupation: a warning
     * when the spectrum is truncated (or of undeclared completeness) and its top level holds more than
     * {@link #THRESHOLD} max(1, N) particles.
     */
    static List<String> warnings(Spectrum spectrum, double topLevelOccupation, double n) {
        if (applies(spectrum) && topLevelOccupation > THRESHOLD * Math.max(1.0, n)) {
            return List.of(String.format(
                    "spectrum truncated at %s %s and its top level still holds %.3g particles (%.3g of N): the "
                            + "result depends on the cutoff at about this level; raise the cutoff or lower kT (%s)",
                    spectrum.topEnergy(), spectrum.scale().name(), topLevelOccupation, topLevelOccupation / n,
                    spectrum.cutoffNote()));
        }
        return List.of();
    }
}
