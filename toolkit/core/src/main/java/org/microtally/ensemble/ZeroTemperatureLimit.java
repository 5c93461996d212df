package org.microtally.ensemble;

import java.math.BigDecimal;
import java.math.BigInteger;
import java.math.MathContext;
import java.util.List;
import org.apache.commons.math3.special.Gamma;
import org.microtally.InvalidInputException;
import org.microtally.exact.Combinatorics;
import org.microtally.occupation.CondensateDistribution;
import org.microtally.occupation.LevelOccupations;
import org.microtally.spectrum.Spectrum;
import org.microtally.spectrum.Statistics;

/**
 * When the canonical ensemble is in its T -&gt; 0 limit to double precision, and that limit's
 * ground-level distribution. Package-private helper of {@link Canonical}.
 *
 * <p>Criterion: the lowest N-particle excitation energy Delta (computed below from the filling of
 * energy shells) exceeds {@link #EXPONENT} kT, so every excited microstate carries a Boltzmann weight
 * below e^{-700} ~ 1e-304 relative to the ground states, times their number; every reported
 * quantity then equals its T -&gt; 0 value to far below double rounding, as long as the number of
 * excited states within a few Delta is below 1e290 (always, for spectra that fit in memory).
 *
 * <p>Delta for ideal particles (common practice, no source): with shells (distinct energies) filled
 * from the bottom, k per state (Fermi k = 1, Gentile k, Bose unlimited), the cheapest excitation moves
 * one particle: from the top occupied shell to the next shell, or, when the top shell is only partly
 * filled, also from the shell below into it. Bose and distinguishable particles: E_1 - E_0.
 */
final class ZeroTemperatureLimit {
    /** Delta/kT above which the T -&gt; 0 limit is taken. */
    static final double EXPONENT = 700;

    private ZeroTemperatureLimit() { }

    /** The lowest N-particle excitation energy, +infinity when there is none (one shell, or all filled). */
    static double gap(Spectrum s, Statistics st, int n) {
        int m = s.size();
        int firstEnd = shellEnd(s, 0);
        if (!st.capped()) {
            return firstEnd < m ? s.energy(firstEnd) - s.energy(0) : Double.POSITIVE_INFINITY;
        }
        long left = n;
        int start = 0;
        int previousStart = -1;
        while (true) {
            int end = shellEnd(s, start);
            long capacity = shellStates(s, start, end) * st.maxOccupancy();
            if (left <= capacity) {
                double up = end < m ? s.energy(end) - s.energy(start) : Double.POSITIVE_INFINITY;
                if (left < capacity && previousStart >= 0) {
                    return Math.min(up, s.energy(start) - s.energy(previousStart));
                }
                return up;
            }
            left -= capacity;
            previousStart = start;
            start = end;
        }
    }

    /**
     * The energy of the highest shell the N-particle ground states occupy (bosons and distinguishable
     * particles: the lowest level's): measured from it, with states below counted by vacancies, every
     * ground configuration has excitation energy 0 and every other one a positive excitation energy.
     */
    static double topShellEnergy(Spectrum s, Statistics st, int n) {
        if (!st.capped()) {
            return s.groundEnergy();
        }
        long left = n;
        int start = 0;
        while (true) {
            int end = shellEnd(s, start);
            long capacity = shellStates(s, start, end) * st.maxOccupancy();
            if (left <= capacity || end == s.size()) {
                return s.energy(start);
            }
            left -= capacity;
            start = end;
        }
    }

    static int shellEnd(Spectrum s, int from) {
        int top = from + 1;
        while (top < s.size() && s.energy(top) == s.energy(from)) {
            top++;
        }
        return top;
    }

    static long shellStates(Spectrum s, int from, int to) {
        long g = 0;
        for (int i = from; i < to; i++) {
            g += s.degeneracy(i);
        }
        return g;
    }

    /**
     * P(N_0 = j) in the limit, where N_0 counts the particles in level 0 only. It is a single value
     * unless level 0 shares its energy with other levels (labelled spectra) and that shell is partly
     * filled; then the ground states are equally likely and P(N_0 = j) = W(g_0, j) W(G - g_0, r - j) /
     * W(G, r), with G the shell's states, r its particles and W(g, j) the number of ways to put j
     * particles into g states (C(g, j) Fermi, C(g + j - 1, j) Bose: in ln Gamma, about 1e-13 relative;
     * Gentile: exact integers by {@link Statistics#levelWays}, rounded once).
     */
    static double[] groundLevelDistribution(Spectrum s, Statistics st, int n, double level0Particles) {
        double[] p = new double[n + 1];
        int end = shellEnd(s, 0);
        long shell = shellStates(s, 0, end);
        int g0 = s.degeneracy(0);
        long r = Math.round(level0Particles * shell / g0);
        if (end == 1 || (st.capped() && r == shell * st.maxOccupancy())) {
            p[(int) Math.round(level0Particles)] = 1;
            return p;
        }
        int rest = (int) (shell - g0);
        if (st.capped() && st.maxOccupancy() > 1) {
            int k = st.maxOccupancy();
            BigDecimal all = new BigDecimal(st.levelWays(shell, (int) r));
            for (int j = 0; j <= Math.min(r, (long) k * g0); j++) {
                BigInteger w = st.levelWays(g0, j).multiply(st.levelWays(rest, (int) r - j));
                p[j] = new BigDecimal(w).divide(all, MathContext.DECIMAL64).doubleValue();
            }
            return p;
        }
        boolean fermi = st.capped();
        double lnAll = lnWays(fermi, shell, r);
        for (int j = 0; j <= r; j++) {
            if (fermi && (j > g0 || r - j > rest)) {
                continue;
            }
            p[j] = Math.exp(lnWays(fermi, g0, j) + lnWays(fermi, rest, r - j) - lnAll);
        }
        return p;
    }

    private static double lnWays(boolean fermi, long g, long j) {
        if (fermi) {
            return lnBinomial(g, j);
        }
        return g == 0 ? (j == 0 ? 0.0 : Double.NEGATIVE_INFINITY) : lnBinomial(g + j - 1, j);
    }

    private static double lnBinomial(long a, long b) {
        return Gamma.logGamma(a + 1.0) - Gamma.logGamma(b + 1.0) - Gamma.logGamma(a - b + 1.0);
    }

    /** The exact ground state (see {@link GroundState}); n already validated. */
    static GroundState groundState(Spectrum spectrum, Statistics statistics, int n) {
        int m = spectrum.size();
        double[] occ = new double[m];
        long cap = statistics.capped() ? statistics.maxOccupancy() : Long.MAX_VALUE;
        BigInteger degeneracy;
        double e;
        if (!statistics.capped()) {
            // every particle in the lowest energy, shared by all levels at that energy (labelled
            // spectra may hold several levels there, one per label)
            int top = shellEnd(spectrum, 0);
            long g0 = 0;
            for (int i = 0; i < top; i++) {
                g0 += spectrum.degeneracy(i);
            }
            for (int i = 0; i < top; i++) {
                occ[i] = (double) n / g0;
            }
            e = n * spectrum.groundEnergy();
            degeneracy = statistics.indistinguishable() ? Combinatorics.binomial(g0 + n - 1L, n)
                    : BigInteger.valueOf(g0).pow(n);
        } else {
            long left = n;
            e = 0;
            degeneracy = BigInteger.ONE;
            for (int i = 0; i < m && left > 0; ) {
                int top = shellEnd(spectrum, i);
                long g = 0;
                for (int j = i; j < top; j++) {
                    g += spectrum.degeneracy(j);
                }
                long put = Math.min(left, g * cap);
                for (int j = i; j < top; j++) {
                    occ[j] = (double) put / g;
                }
                e += put * spectrum.energy(i);
                if (put < g * cap) {
                    degeneracy = statistics.levelWays(g, (int) put);
                }
                left -= put;
                i = top;
            }
        }
        return new GroundState(e, degeneracy, new LevelOccupations(spectrum.energies(), spectrum.degeneracies(), occ));
    }

    /** Canonical in the T -&gt; 0 limit (see {@link ZeroTemperatureLimit}): every quantity from the ground states. */
    static Canonical canonical(Spectrum s, Statistics st, int n, double kT, double gap) {
        GroundState gs = groundState(s, st, n);
        double lnZ = gs.entropy() - gs.energy() / kT;
        if (!Double.isFinite(lnZ)) {
            throw InvalidInputException.of("temperature kT", kT, "large enough that E_0/kT is finite (E_0 = "
                    + gs.energy() + ")", "Measure energies from the ground level (E_0 = 0), or use Canonical.groundState.");
        }
        int m = s.size();
        double[] occ = new double[m];
        double[] vac = st.capped() ? new double[m] : null;
        double top = s.groundEnergy();
        for (int i = 0; i < m; i++) {
            occ[i] = gs.occupations().perState(i);
            if (vac != null) {
                vac[i] = st.maxOccupancy() - occ[i];
            }
            if (occ[i] > 0) {
                top = s.energy(i);
            }
        }
        String note = gap == Double.POSITIVE_INFINITY
                ? "no excitations: every N-particle state has the same energy, so ln Z = ln g - E_0/kT, U = E_0, "
                        + "S/k = ln g (g = " + gs.degeneracy() + " states), C_V = Var E = 0 and the occupations are "
                        + "exact at every temperature"
                : String.format("T -> 0 limit: the lowest excitation (%.6g) is %.3g kT, so every excited state is "
                        + "suppressed by a factor below e^-700; ln Z = ln g - E_0/kT, U = E_0, S/k = ln g (g = %s "
                        + "ground states), C_V = Var E = 0 (exponentially small) and the occupations and ground-level "
                        + "distribution are the ground-state values, all exact to double precision",
                        gap, gap / kT, gs.degeneracy());
        double[] dist = ZeroTemperatureLimit.groundLevelDistribution(s, st, n, occ[0] * s.degeneracy(0));
        return new Canonical(s, st, n, kT, top, lnZ, occ, vac, new CondensateDistribution(dist), List.of(note),
                EnergyFluctuations.exact(0), null, gs.entropy());
    }
}
