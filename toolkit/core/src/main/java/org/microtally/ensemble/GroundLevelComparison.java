package org.microtally.ensemble;

import java.util.List;
import java.util.Objects;
import org.microtally.Roots;
import org.microtally.InvalidInputException;
import org.microtally.Tabular;
import org.microtally.spectrum.Spectrum;
import org.microtally.spectrum.Statistics;

/**
 * The number N_0 in the lowest level in the three ensembles side by side, at matched conditions: the
 * exact microcanonical distribution at (N, E) ({@link MicrocanonicalLevelNumber}), the canonical
 * ensemble at the temperature whose mean energy is E ({@link Canonical}), and the grand canonical
 * ensemble at that temperature with mean number N ({@link GrandCanonical}). This is the comparison
 * of H. D. Politzer, PRA 54, 5048 (1996) and M. Wilkens and C. Weiss, J. Mod. Opt. 44, 1801 (1997):
 * for a condensed Bose gas the grand canonical variance n_0 (n_0 + 1) is of order N^2, the canonical
 * and microcanonical ones are far smaller, and the microcanonical one is the smallest. Immutable.
 *
 * <p>Method: the canonical temperature is the root of U(kT) = E in ln kT by {@link org.microtally.Roots}
 * (Brent-type bracketed search, R. P. Brent, <i>Algorithms for Minimization without Derivatives</i>
 * (1973)), bracketed to {@value #LN_KT_TOLERANCE} + 1e-15 |ln kT| in ln kT, i.e. kT within about
 * {@value #LN_KT_TOLERANCE} relative of the root of the computed U(kT) (whose accuracy is Canonical's); each
 * evaluation is one canonical run. The grand canonical ensemble at that kT has mean number N but a mean energy that differs from
 * E at finite N (reported by {@link #grandCanonicalEnergy()}).
 *
 * <p>Accuracy: microcanonical values exact (correctly rounded); canonical and grand canonical as
 * stated on their classes.
 */
public final class GroundLevelComparison implements Tabular {
    /** Absolute tolerance of the matched ln kT (so kT is bracketed to about this relative). */
    public static final double LN_KT_TOLERANCE = 1e-12;
    private final MicrocanonicalLevelNumber micro;
    private final Canonical canonical;
    private final GrandCanonical grand;

    private GroundLevelComparison(MicrocanonicalLevelNumber micro, Canonical canonical, GrandCanonical grand) {
        this.micro = micro;
        this.canonical = canonical;
        this.grand = grand;
    }

    /**
     * The comparison at N particles and total energy E (integer quanta of an integer spectrum).
     *
     * @throws InvalidInputException for inputs {@link MicrocanonicalLevelNumber} refuses, or an E at or
     *                               below the ground energy or beyond what the (truncated) spectrum's
     *                               canonical energy reaches for kT up to 1e6 times the largest level
     */
    public static GroundLevelComparison of(Spectrum spectrum, Statistics statistics, int n, int e) {
        Objects.requireNonNull(spectrum, "spectrum");
        MicrocanonicalLevelNumber micro = MicrocanonicalLevelNumber.groundLevel(spectrum, statistics, n, e);
        double eGround = Canonical.groundState(spectrum, statistics, n).energy();
        if (!(e > eGround)) {
            throw InvalidInputException.of("total energy E", e, "above the N-particle ground energy " + eGround,
                    "At the ground energy the temperature is 0; no canonical match exists.");
        }
        double scale = Math.max(1.0, spectrum.topEnergy() - spectrum.groundEnergy());
        double lo = Math.log(1e-3 * scale / Math.max(1, n));
        double hi = Math.log(1e6 * scale);
        java.util.function.DoubleUnaryOperator gap = x -> Canonical.of(spectrum, statistics, n, Math.exp(x)).energy() - e;
        while (gap.applyAsDouble(lo) > 0 && lo > Math.log(1e-300)) {
            lo -= 5;
        }
        if (gap.applyAsDouble(hi) < 0) {
            throw InvalidInputException.of("total energy E", e, "below the mean energy the spectrum reaches at high T ("
                    + Canonical.of(spectrum, statistics, n, Math.exp(hi)).energy() + ")",
                    "Raise the spectrum's cutoff.");
        }
        double lnKT = Roots.solve("ln kT at which the canonical U equals E = " + e, gap, lo, hi, LN_KT_TOLERANCE);
        double kT = Math.exp(lnKT);
        Canonical canonical = Canonical.of(spectrum, statistics, n, kT);
        GrandCanonical grand = GrandCanonical.ofMeanNumber(spectrum, statistics, kT, n);
        return new GroundLevelComparison(micro, canonical, grand);
    }

    /** The exact microcanonical distribution of N_0. */
    public MicrocanonicalLevelNumber microcanonical() {
        return micro;
    }

    /** The canonical ensemble at the matched temperature. */
    public Canonical canonical() {
        return canonical;
    }

    /** The grand canonical ensemble at the matched temperature and mean number N. */
    public GrandCanonical grandCanonical() {
        return grand;
    }

    /** The matched temperature kT (canonical U = E). */
    public double kT() {
        return canonical.kT();
    }

    /** The grand canonical mean energy at the matched kT (differs from E at finite N). */
    public double grandCanonicalEnergy() {
        return grand.energy();
    }

    /** Columns ensemble, kT, U, &lt;N_0&gt;, Var N_0. */
    @Override
    public List<String> columnNames() {
        return List.of("ensemble", "kT", "U", "<N_0>", "Var N_0");
    }

    /** One row per ensemble (microcanonical kT blank: it is fixed by E, not a parameter). */
    @Override
    public List<List<Object>> rows() {
        return List.of(
                List.of("microcanonical", "", (double) micro.totalEnergy(), micro.mean(), micro.variance()),
                List.of("canonical", kT(), canonical.energy(), canonical.groundLevelDistribution().mean(),
                        canonical.groundLevelDistribution().variance()),
                List.of("grand canonical", kT(), grand.energy(), grand.groundLevelMean(), grand.groundLevelVariance()));
    }

    @Override
    public String toString() {
        return "GroundLevelComparison[N=" + micro.particleNumber() + ", E=" + micro.totalEnergy() + ", kT=" + kT()
                + ", Var N_0 mc/c/gc = " + micro.variance() + " / " + canonical.groundLevelDistribution().variance()
                + " / " + grand.groundLevelVariance() + "]";
    }
}
