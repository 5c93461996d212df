package org.microtally.ensemble;

import java.math.BigDecimal;
import java.math.BigInteger;
import java.math.MathContext;
import org.apache.commons.math3.special.Gamma;
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
     * Gentile: exact integers by {@link Canonical#cappedWays}, rounded once).
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
            BigDecimal all = new BigDecimal(Canonical.cappedWays(shell, k, (int) r));
            for (int j = 0; j <= Math.min(r, (long) k * g0); j++) {
                BigInteger w = Canonical.cappedWays(g0, k, j).multiply(Canonical.cappedWays(rest, k, (int) r - j));
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
}
