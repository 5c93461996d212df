package org.microtally.ensemble;

import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.Objects;
import org.microtally.Inputs;
import org.microtally.InvalidInputException;
import org.microtally.ProgressListener;
import org.microtally.Dimension;
import org.microtally.QuantityTable;
import org.microtally.QuantityResult;
import org.microtally.occupation.CondensateDistribution;
import org.microtally.occupation.LevelOccupations;
import org.microtally.spectrum.Spectrum;
import org.microtally.spectrum.Statistics;
import org.microtally.units.Energy;

/**
 * The canonical ensemble (fixed N, T) of N ideal particles on a spectrum: exact partition function
 * Z_N, thermodynamic quantities and exact mean occupations of every level, for Bose, Fermi,
 * Gentile (at most k per state) and distinguishable particles.
 *
 * <h2>Definitions (k = 1, energies and kT in the spectrum's unit, beta = 1/kT)</h2>
 * Z_N = sum over N-particle microstates of e^{-beta E}; F = -kT ln Z_N; U = &lt;E&gt;;
 * S = ln Z_N + beta U; Var E = &lt;E^2&gt; - U^2; C_V = beta^2 Var E (the fluctuation formula,
 * exact for dU/dT); &lt;n_i&gt; = mean number of particles in one state of level i.
 * Distinguishable (labelled) particles: Z_N = Z_1^N, with Z_1 = sum_i g_i e^{-beta e_i}.
 *
 * <h2>Method (indistinguishable particles)</h2>
 * Z_N is the coefficient of t^N in the generating product prod_states f(y_s t), with
 * f(w) = 1 + w (Fermi), 1/(1-w) (Bose), 1 + w + ... + w^k (Gentile). The product is built one state
 * at a time, level by level with degeneracy grouping, truncated at t^N: multiplying by (1 + y t)
 * gives the elementary symmetric polynomials of the Boltzmann factors, by 1/(1 - y t) the complete
 * homogeneous ones (the standard positive recurrences for these functions, e.g. Macdonald,
 * <i>Symmetric Functions and Hall Polynomials</i>, ch. I.2, cited from memory). Every term added is a product of
 * non-negative numbers. To keep magnitudes representable the Boltzmann factors are fugacity-scaled,
 * y_s = e^{-beta(e_s - mu*)} with mu* the grand canonical chemical potential for mean number N
 * (so the coefficients peak near t^N), and the mantissas share one exponent that is renormalised by
 * exact powers of two. The alternating recursion of Borrmann &amp; Franke (J. Chem. Phys. 98, 2484
 * (1993)) is available in {@link AlternatingRecursion} for comparison only.
 *
 * <p>Bosons where (N + 1)/2 + M &lt;= S (M levels, S states): the same series, coefficient n = Z_n e^{n beta mu*},
 * comes from the recursion over cycle sums n Z_n = sum_k Z_1(k beta) Z_{n-k} (positive terms for bosons; with
 * and without the lowest level, for the ground-level distribution), O(N^2 + N M) instead of O(S N); method,
 * bound and the guard that falls back to the product are stated on {@link BoseCycleMoments}.
 *
 * <p>Occupations. Bosons: P(n_s &gt;= j) = y_s^j Z_{N-j} / Z_N, so &lt;n_s&gt; = sum_{j&gt;=1}
 * y_s^j Z_{N-j}/Z_N (positive terms, Horner). Fermi and Gentile: P(n_s = j) = y_s^j Z^{(-s)}_{N-j}/Z_N
 * with Z^{(-s)} the partition functions without state s, obtained as the product of the prefix
 * series (all states before s, kept from the forward pass) and a suffix series (all states after,
 * built in a backward pass): again positive terms only, so deep levels keep full relative accuracy
 * in their hole probability P(n_s = 0) and no deflation (division by 1 + y t, which is unstable on
 * one side of mu) is used. The ground-level number distribution, P(N_0 = j) =
 * L_0[j] Z^{(-0)}_{N-j} / Z_N with L_0 the series of the lowest level's own g_0 states (bosons:
 * C(g_0 + j - 1, j) y_0^j), comes from the series of all other levels (bosons: kept before the last
 * level of the forward pass; Fermi and Gentile: the suffix series at the end of the backward pass).
 * When M levels x (N+1) exceeds 2^23 numbers the prefix series are kept at sqrt(M) checkpoints
 * and recomputed block-wise (one extra forward pass).
 *
 * <p>Heat capacity and energy variance (computed on first request, or by {@link #warnings()}) propagate,
 * next to the series, the first and second moments of the energy through the same steps, measured from
 * mu* in particle-hole form so that every term is non-negative (bosons: by the recursion over cycle sums
 * where it is cheaper, O(N^2 + N M); see {@link EnergyFluctuations}); the
 * result is checked against U from the occupations and against a forward difference dU/dT (one more
 * pass), and a disagreement is a warning.
 *
 * <h2>Accuracy</h2>
 * Rounding: each coefficient is a sum of products of non-negative numbers reached through at most
 * S + N operations (S = number of states), so its relative error is below (S + N) 2^-53 (a worst-case
 * bound; measured errors are stated below). Flushing of tiny mantissas adds a relative
 * error of at most S (N+1) 2^-1073 / P_GC(N), P_GC(N) being the grand canonical probability at mu*
 * of exactly N particles (each flushed mantissa is below 2^-1073 of its series' maximum, which is at
 * most the untruncated series value); a warning is added if that bound exceeds 1e-12. Occupations
 * share these bounds (bosons on the cycle sums: (N (N + 1)/2 + N (M + 5)) 2^-53 instead of (S + N) 2^-53, a
 * worst case; measured errors are near 1e-14, see BoseCycleMomentsTest). Var E: each moment carries the same relative bound, and the final subtraction
 * multiplies it by 1 + mean(X)^2/Var X, X the excitation energy above the mu*-reference (about the number
 * of thermally active particles and holes; 60 for 10^4 fermions in a 2D oscillator at kT = 0.5);
 * where Var E falls below 4 (S + N) 2^-53 &lt;X^2&gt; a warning says C_V is only an absolute statement.
 * Measured against a committed 60-digit mpmath table (test resource
 * {@code ensemble/canonical_moments_mpmath.csv}: fermions and bosons in a 2D oscillator, up to 200
 * particles and 1722 states): U within {@value #MEASURED_ENERGY_ERROR}, Var E and C_V within
 * {@value #MEASURED_VARIANCE_ERROR} relative. These are measurements on that table; the bounds above
 * are the guarantee.
 *
 * <p>Cost: forward pass at most S N multiply-adds; each step runs only over the non-zero support of
 * the series (entries that were never reached or were flushed to zero are skipped, which changes no
 * result), so series whose particle-number distribution is narrow cost far less than N per state;
 * Fermi and Gentile occupations add the backward pass (a second pass of the same kind); Bose
 * occupations add M N. A level of g states with g above 8 (N + 1) (Bose), 3 (N + 1) (Fermi) is multiplied in as one
 * closed-form factor ({@link LevelFactor}: O(N) to build and O(N^2) to apply, O(N^2 log g) for
 * Gentile), so the cost depends on the number of levels, not of states (two levels of 2^31 - 1
 * states, N = 1000: tens of milliseconds). C_V and Var E add a moment pass and a check pass when
 * first asked for. Memory: M (N+1) doubles for Fermi/Gentile (or 2 sqrt(M)(N+1) with checkpoints), checked
 * against half the heap before allocating.
 *
 * <p>Limits: ideal (non-interacting) particles only; kT &lt; 0 only for bounded spectra; where the
 * lowest excitation exceeds 700 kT the exact T -&gt; 0 limit is returned with a note. Truncated
 * spectra carry the estimated effect of their cutoff in {@link #warnings()}.
 */
public final class Canonical implements QuantityResult {
    /**
     * Largest relative error of U measured against the committed mpmath table, rounded up;
     * CanonicalStatedAccuracyTest fails if any row is worse, or if this is more than twice the maximum.
     */
    public static final double MEASURED_ENERGY_ERROR = 3e-14;
    /** Largest relative error of Var E (and so C_V) measured against the same table, rounded up (checked the same way). */
    public static final double MEASURED_VARIANCE_ERROR = 1.5e-13;

    private static final int MAX_N = 10_000_000;

    private final Spectrum spectrum;
    private final Statistics statistics;
    private final int n;
    private final double kT;
    private final double beta;
    private final double muStar;
    private final double lnZ;
    private final double energy;
    private final double entropy;
    private final double[] perState;
    private final double[] vacancies;
    private final CondensateDistribution condensate;
    private final List<String> warnings;
    private final List<String> extraWarnings;
    private final Counting counting;
    private final Object momentLock = new Object();
    private EnergyFluctuations fluctuations;
    /** At kT &lt; 0: the ensemble of the mirrored spectrum at -kT, whose moment pass gives Var E. */
    private final Canonical mirror;

    Canonical(Spectrum spectrum, Statistics statistics, int n, double kT, double muStar, double lnZ,
                      double[] perState, double[] vacancies, CondensateDistribution condensate,
                      List<String> extraWarnings, EnergyFluctuations knownFluctuations, Canonical mirror,
                      Double exactEntropy) {
        this.spectrum = spectrum;
        this.statistics = statistics;
        this.n = n;
        this.kT = kT;
        this.beta = 1.0 / kT;
        this.muStar = muStar;
        this.lnZ = lnZ;
        this.perState = perState;
        this.vacancies = vacancies;
        this.condensate = condensate;
        double e0 = spectrum.groundEnergy();
        double u = 0;
        for (int i = 0; i < perState.length; i++) {
            u += spectrum.degeneracy(i) * (spectrum.energy(i) - e0) * perState[i];
        }
        this.energy = n * e0 + u;
        this.entropy = exactEntropy != null ? exactEntropy : lnZ + energy / kT;
        double ground = condensate != null ? condensate.mean() : spectrum.degeneracy(0) * perState[0];
        List<String> w = new ArrayList<>(TruncationCheck.warnings(spectrum, perState, n, kT, muStar, energy,
                entropy, ground));
        w.addAll(extraWarnings);
        this.extraWarnings = List.copyOf(extraWarnings);
        this.counting = Counting.defaultFor(statistics);
        this.warnings = Collections.unmodifiableList(w);
        this.fluctuations = knownFluctuations;
        this.mirror = mirror;
    }

    /** A copy of {@code o} with every count divided by e^{lnDivisor} under {@code counting}. */
    private Canonical(Canonical o, Counting counting) {
        double d = counting.lnDivisor(o.n);
        this.spectrum = o.spectrum;
        this.statistics = o.statistics;
        this.n = o.n;
        this.kT = o.kT;
        this.beta = o.beta;
        this.muStar = o.muStar;
        this.lnZ = o.lnZ - d;
        this.perState = o.perState;
        this.vacancies = o.vacancies;
        this.condensate = o.condensate;
        this.energy = o.energy;
        this.entropy = o.entropy - d;
        this.warnings = o.warnings;
        this.extraWarnings = o.extraWarnings;
        this.fluctuations = o.fluctuations();
        this.mirror = o.mirror;
        this.counting = counting;
    }

    /**
     * The canonical ensemble with an explicit {@link Counting}: for distinguishable particles
     * LABELLED (Z_1^N, the default of {@link #of(Spectrum, Statistics, int, double)}) or
     * CORRECTED_BOLTZMANN (Z_1^N / N!: ln Z, F and S shifted by ln N!, all else unchanged); quantum
     * statistics take IDENTICAL only.
     */
    public static Canonical of(Spectrum spectrum, Statistics statistics, int n, double kT, Counting counting) {
        Objects.requireNonNull(statistics, "statistics");
        Counting.require(statistics, counting);
        Canonical c = of(spectrum, statistics, n, kT);
        return counting == Counting.CORRECTED_BOLTZMANN ? new Canonical(c, counting) : c;
    }

    /**
     * The canonical ensemble at a temperature given as an energy, e.g.
     * {@code Canonical.of(dot, FERMI, 12, Energy.ofTemperature(4.2))}: kT is converted to the spectrum's
     * unit through its {@link org.microtally.units.EnergyScale} (one division).
     *
     * @throws InvalidInputException when the spectrum's scale has no physical size (the message says how to
     *                               declare one), and as {@link #of(Spectrum, Statistics, int, double)}
     */
    public static Canonical of(Spectrum spectrum, Statistics statistics, int n, Energy kT) {
        Objects.requireNonNull(spectrum, "spectrum");
        return of(spectrum, statistics, n, Inputs.temperature(kT, spectrum.scale()));
    }

    /**
     * The canonical ensemble of an exact density of states g(E) with BigInteger multiplicities
     * (interacting lattices, count tables, user tables), through the same front door: delegates to
     * {@link ExactCanonical} (method and accuracy stated there: log-sum-exp over ln g(E), no overflow
     * at any size).
     */
    public static ExactCanonical of(ExactDensityOfStates g) {
        return ExactCanonical.of(g);
    }

    /** The thermodynamic state (ln Z, U, C, S, F) of the exact density of states {@code g} at kT &gt; 0 in its unit. */
    public static ExactCanonical.State of(ExactDensityOfStates g, double kT) {
        return ExactCanonical.of(g).atTemperature(Inputs.temperature(kT));
    }

    /**
     * As {@link #of(ExactDensityOfStates, double)} with the temperature as an energy (e.g. kelvin), converted
     * through the density of states' scale; refused, saying how to declare it, when the scale has no physical size.
     */
    public static ExactCanonical.State of(ExactDensityOfStates g, Energy kT) {
        Objects.requireNonNull(g, "g");
        return of(g, Inputs.temperature(kT, g.scale()));
    }

    /** The canonical ensemble of {@code n} particles at temperature {@code kT}; see the class notes. */
    public static Canonical of(Spectrum spectrum, Statistics statistics, int n, double kT) {
        return of(spectrum, statistics, n, kT, ProgressListener.NONE);
    }

    /**
     * As {@link #of(Spectrum, Statistics, int, double)}, reporting progress over the levels.
     *
     * <p>kT &lt; 0 is allowed for bounded spectra (not truncated from an infinite one) and computed
     * exactly as the mirrored spectrum at |kT| ({@link NegativeTemperature}). Where the lowest N-particle
     * excitation exceeds 700 kT the T -&gt; 0 limit is returned, exact to double precision, with a note in
     * {@link #warnings()} ({@link ZeroTemperatureLimit}).
     *
     * @throws InvalidInputException for kT = 0 or not finite, kT &lt; 0 on a truncated spectrum; n &lt; 1
     *                               or n &gt; 10^7; n above the capacity (k per state) of a capped spectrum
     */
    public static Canonical of(Spectrum spectrum, Statistics statistics, int n, double kT, ProgressListener progress) {
        Objects.requireNonNull(spectrum, "spectrum");
        Objects.requireNonNull(statistics, "statistics");
        Objects.requireNonNull(progress, "progress");
        if (kT == 0 || !Double.isFinite(kT)) {
            throw InvalidInputException.of("temperature kT", kT, "a finite number, not 0 (negative only for a "
                    + "spectrum that is bounded, not truncated)",
                    "For T -> 0 give a tiny kT (the limit is then taken exactly) or call Canonical.groundState.");
        }
        requireParticleNumber(spectrum, statistics, n);
        if (kT < 0) {
            return NegativeTemperature.canonical(spectrum, statistics, n, kT, progress);
        }
        double gap = ZeroTemperatureLimit.gap(spectrum, statistics, n);
        if (gap > ZeroTemperatureLimit.EXPONENT * kT) {
            return ZeroTemperatureLimit.canonical(spectrum, statistics, n, kT, gap);
        }
        if (statistics.kind() == Statistics.Kind.DISTINGUISHABLE) {
            return CanonicalSeries.distinguishable(spectrum, n, kT);
        }
        return CanonicalSeries.indistinguishable(spectrum, statistics, n, kT, progress);
    }

    /**
     * The T -&gt; 0 limit: the lowest N-particle energy, its exact degeneracy and the occupations
     * (each state of a partly filled level holds the same share, the limit of the canonical
     * occupations by symmetry). How the degeneracy is counted (by energy shell, so labelled spectra
     * with several levels at one energy are handled) and its accuracy are stated on {@link GroundState}.
     */
    public static GroundState groundState(Spectrum spectrum, Statistics statistics, int n) {
        requireParticleNumber(spectrum, statistics, n);
        return ZeroTemperatureLimit.groundState(spectrum, statistics, n);
    }

    /**
     * The ensemble at {@code kT} &lt; 0 on {@code original} from the ensemble {@code mirror} of its
     * energy-negated spectrum at -kT ({@link NegativeTemperature}); {@code map[i]} is the mirror's index
     * of level i. The ground-level distribution is not carried over (it belongs to the mirror's lowest,
     * this spectrum's highest level).
     */
    static Canonical mirrored(Spectrum original, Canonical mirror, double kT, int[] map) {
        int m = original.size();
        double[] occ = new double[m];
        double[] vac = mirror.vacancies == null ? null : new double[m];
        for (int i = 0; i < m; i++) {
            occ[i] = mirror.perState[map[i]];
            if (vac != null) {
                vac[i] = mirror.vacancies[map[i]];
            }
        }
        Canonical c = new Canonical(original, mirror.statistics, mirror.n, kT, -mirror.muStar, mirror.lnZ, occ, vac,
                null, mirror.warnings, null, mirror, mirror.entropy);
        return c;
    }


    static void requireParticleNumber(Spectrum spectrum, Statistics statistics, int n) {
        Inputs.particleNumber("particle number N", n, MAX_N,
                "N = 0 is the empty system (Z = 1, U = S = C = 0) and needs no computation.");
        Inputs.withinCapacity("particle number N", n, statistics.maxOccupancy(), spectrum.stateCount());
    }


    private EnergyFluctuations fluctuations() {
        synchronized (momentLock) {
            if (fluctuations == null) {
                fluctuations = mirror != null ? mirror.fluctuations()
                        : EnergyFluctuations.of(spectrum, statistics, n, kT, muStar, energy, lnZ);
            }
            return fluctuations;
        }
    }

    /** The spectrum. */
    public Spectrum spectrum() {
        return spectrum;
    }

    /** How microstates are counted ({@link Counting}); ln Z, F and S depend on it. */
    public Counting counting() {
        return counting;
    }

    /** The statistics. */
    public Statistics statistics() {
        return statistics;
    }

    /** Particle number N. */
    public int particleNumber() {
        return n;
    }

    /** Temperature kT in the spectrum's unit. */
    public double kT() {
        return kT;
    }

    /** beta = 1/kT. */
    public double beta() {
        return beta;
    }

    /** ln Z_N. */
    public double lnZ() {
        return lnZ;
    }

    /** Helmholtz free energy F = -kT ln Z_N. */
    public double freeEnergy() {
        return -kT * lnZ;
    }

    /** Mean energy U = sum_i g_i e_i &lt;n_i&gt;. */
    public double energy() {
        return energy;
    }

    /** Entropy S/k = ln Z_N + U/kT (in the T -&gt; 0 limit: ln of the exact ground-state degeneracy). */
    public double entropy() {
        return entropy;
    }

    /** Energy variance &lt;E^2&gt; - U^2 (computed on first request: a moment pass and a check pass; see the class notes). */
    public double energyVariance() {
        return fluctuations().variance;
    }

    /** Heat capacity C_V/k = Var E / (kT)^2. */
    public double heatCapacity() {
        return energyVariance() * beta * beta;
    }

    /** Exact mean occupation of every level. */
    public LevelOccupations occupations() {
        return new LevelOccupations(spectrum.energies(), spectrum.degeneracies(), perState);
    }

    /**
     * Fermi and Gentile: the mean number of vacancies k - &lt;n_s&gt; in one state of each level, computed
     * from the probabilities P(n_s = j) directly (sum (k - j) P_j), not as k minus the occupation, so
     * deep levels keep full relative accuracy in their tiny hole numbers.
     *
     * @throws InvalidInputException for Bose and distinguishable particles (no cap)
     */
    public LevelOccupations vacancies() {
        if (vacancies == null) {
            throw InvalidInputException.of("statistics for vacancies", statistics, "FERMI or maxOccupancy(k)",
                    "Uncapped statistics have no vacancies.");
        }
        return new LevelOccupations(spectrum.energies(), spectrum.degeneracies(), vacancies);
    }

    /** Whether {@link #condensate()} is available (bosons). */
    public boolean hasCondensate() {
        return statistics.condenses();
    }

    /**
     * The exact canonical distribution of the number of particles in the lowest level (bosons: the
     * condensate number distribution).
     *
     * @throws InvalidInputException for other statistics (use {@link #groundLevelDistribution()})
     */
    public CondensateDistribution condensate() {
        if (!hasCondensate()) {
            throw InvalidInputException.of("statistics for the condensate distribution", statistics, "BOSE",
                    "Use groundLevelDistribution() for the number distribution of the lowest level.");
        }
        return requireDistribution();
    }

    private CondensateDistribution requireDistribution() {
        if (condensate == null) {
            throw InvalidInputException.of("temperature kT for the ground-level distribution", kT, "> 0",
                    "At kT < 0 the particles crowd into the highest level: call Canonical.of on the spectrum with "
                            + "energies negated, at -kT, whose lowest level is this one's highest.");
        }
        return condensate;
    }

    /**
     * The exact canonical distribution P(N_0 = j), j = 0..N, of the number of particles in the lowest
     * level (all its states together), for every statistics: bosons from the series of the other
     * levels (see the class notes); Fermi and Gentile as (level factor series)[j] x (suffix series of
     * the other levels)[N - j] / Z_N; distinguishable particles binomial with p = g_0 e^{-e_0/kT}/Z_1.
     */
    public CondensateDistribution groundLevelDistribution() {
        return requireDistribution();
    }

    /** The fugacity scale mu* used internally (the grand canonical mu for mean number N;
     * Maxwell-Boltzmann mu for distinguishable particles). */
    public double referenceChemicalPotential() {
        return muStar;
    }

    /**
     * Warnings about every reported quantity (cutoff that matters, numerical bounds exceeded, internal
     * consistency checks that failed); empty when none. The list does not depend on which quantity
     * was asked for first: it includes the checks of C_V and Var E, running their pass if it has not
     * run yet.
     */
    public List<String> warnings() {
        List<String> late = fluctuations().notes;
        if (late.isEmpty()) {
            return warnings;
        }
        List<String> all = new ArrayList<>(warnings);
        all.addAll(late);
        return Collections.unmodifiableList(all);
    }

    /**
     * The reported quantities in the spectrum's energy unit: statistics, counting (labelled particles),
     * N, kT, ln Z, F, U, S/k, C/k, Var E, the ground-level &lt;N_0&gt; and Var N_0 (where defined), and one
     * row per warning. For physical units: {@code quantities().inUnits(EnergyUnit.KELVIN)} (needs a
     * spectrum scale with a declared size).
     */
    @Override
    public QuantityTable quantities() {
        QuantityTable.Builder t = QuantityTable.builder(spectrum.scale()).value("statistics", statistics.toString());
        if (!statistics.indistinguishable()) {
            t.value("counting", counting.toString());
        }
        t.value("N", n).value("kT", kT, Dimension.ENERGY).value("ln Z", lnZ)
                .value("F", freeEnergy(), Dimension.ENERGY).value("U", energy, Dimension.ENERGY)
                .value("S/k", entropy()).value("C/k", heatCapacity())
                .value("Var E", energyVariance(), Dimension.ENERGY_SQUARED);
        if (condensate != null) {
            t.value("<N_0>", condensate.mean()).value("Var N_0", condensate.variance());
        }
        return t.warnings(warnings()).build();
    }

    /** A one-line summary (statistics, N, kT, ln Z, U, number of warnings); runs the C_V checks if not yet run. */
    @Override
    public String toString() {
        List<String> all = warnings();
        return "Canonical[" + statistics + ", N=" + n + ", kT=" + kT + ", lnZ=" + lnZ + ", U=" + energy
                + (all.isEmpty() ? "" : ", " + all.size() + " warning(s)") + "]";
    }
}
