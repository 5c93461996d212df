package org.microtally.ensemble;

import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import org.microtally.spectrum.Spectrum;
import org.microtally.spectrum.Statistics;

/**
 * Canonical energy variance of ideal indistinguishable particles from the energy moments of the
 * generating product, with the two internal checks that decide whether it can be trusted.
 * Package-private engine of {@link Canonical#energyVariance()}.
 *
 * <p>Bosons, where it costs less (the estimate {@link BoseCycleMoments#pays}): the
 * moments come from the recursion over cycle sums, O(N^2 + N M) instead of O(S N) (2,000 atoms on 1.7e6
 * trap states: milliseconds instead of seconds), all terms non-negative, energies measured from the lowest
 * level. It is used only when its ln Z_N and U agree with those of the series of {@link Canonical} (an
 * independent algorithm) to 1e-8; otherwise, and for Fermi and Gentile statistics (whose cycle
 * recursion alternates in sign and loses digits), the moment pass below is used. The dU/dT check then
 * differences the recursion's U at kT and kT(1 + h), and the rounding bounds use the recursion's bound
 * (N(N + 1)/2 + N(M + 8)) 2^-53 in place of (S + N) 2^-53.
 *
 * <p>Moment pass: energies are measured from r, the energy of the highest shell the ground states occupy,
 * in the particle-hole form of {@link ScaledSeries#excitationMoments(int)} (states below r counted by
 * their vacancies), so every term of the moment recurrences is non-negative and the excitation energy
 * X is 0 in every ground state; Var E = v_N/c_N - (u_N/c_N)^2 then loses only the factor
 * 1 + mean(X)^2/Var X (of the order of the number of thermally active particles and holes, and below
 * 1 at low T) to the final subtraction.
 *
 * <p>Checks (each one a warning when it fails): (1) U from the moments, N r + shift + u_N/c_N,
 * against U from the occupations (a different pass), relative 1e-8; (2) the fluctuation value
 * C_V = Var E/(kT)^2 against an independent estimate dU/dT, the forward difference between kT and
 * kT(1 + h) of U (bosons: U from the occupations of {@link Canonical} and, at kT(1 + h), from the
 * plain product and its occupations the same way, no moments; capped statistics: the moment mean),
 * one extra pass, with h = 1e-4 / max(1, Delta/kT) and Delta = Var X / mean(X) the energy scale of
 * the excitations, so the O(h) truncation error stays near 5e-5; agreement required to 3e-4
 * relative plus the difference's rounding noise; (3) Var E against its rounding bound
 * 4 (S + N) 2^-53 (v_N/c_N + mean^2) (S states), below which C_V is only an upper bound.
 */
final class EnergyFluctuations {
    private static final double U_TOLERANCE = 1e-8;
    private static final double C_TOLERANCE = 3e-4;
    private static final double STEP = 1e-4;

    final double variance;
    final List<String> notes;

    private EnergyFluctuations(double variance, List<String> notes) {
        this.variance = variance;
        this.notes = Collections.unmodifiableList(notes);
    }

    /** A variance known in closed form (distinguishable particles): no checks needed. */
    static EnergyFluctuations exact(double variance) {
        return new EnergyFluctuations(variance, new ArrayList<>());
    }

    /** One moment pass: {mean of X, variance of X, shift}. */
    private static double[] pass(Spectrum s, Statistics st, int n, double kT, double muStar, double reference) {
        int m = s.size();
        int cap = st.capped() ? st.maxOccupancy() : Integer.MAX_VALUE;
        double beta = 1.0 / kT;
        ScaledSeries w = ScaledSeries.excitationMoments(n);
        for (int step = 0; step < m; step++) {
            int i = st.capped() ? step : m - 1 - step;
            w.multiplyStates(s.degeneracy(i), -beta * (s.energy(i) - muStar), cap, s.energy(i) - reference);
        }
        double c = w.c[n];
        double mean = w.u[n] / c;
        double second = w.v[n] / c;
        return new double[] {mean, second - mean * mean, w.momentShift, second};
    }

    /**
     * Bosons: U - N e_0 at kT from the plain generating product and the occupations
     * &lt;n_s&gt; = sum_j y_s^j Z_{N-j}/Z_N (the route of {@link Canonical}'s occupations, no moments),
     * a few times cheaper than a moment pass.
     */
    private static double boseExcitationEnergy(Spectrum s, int n, double kT, double muStar) {
        int m = s.size();
        double beta = 1.0 / kT;
        ScaledSeries z = new ScaledSeries(n, false);
        for (int i = m - 1; i >= 0; i--) {
            z.multiplyStates(s.degeneracy(i), -beta * (s.energy(i) - muStar), Integer.MAX_VALUE, 0);
        }
        double e0 = s.groundEnergy();
        double u = 0;
        for (int i = 1; i < m; i++) {
            double y = Math.exp(-beta * (s.energy(i) - muStar));
            double acc = 0;
            for (int k = 0; k < n; k++) {
                acc = acc * y + z.c[k];
            }
            u += s.degeneracy(i) * (s.energy(i) - e0) * y * acc / z.c[n];
        }
        return u;
    }

    /**
     * The variance and its checks: for bosons by the cycle-sum recursion ({@link BoseCycleMoments}) where it
     * costs less than the moment pass and agrees with {@code lnZ} and {@code energy} (from the series of
     * {@link Canonical}, an independent route), otherwise by the moment pass of the series.
     */
    static EnergyFluctuations of(Spectrum s, Statistics st, int n, double kT, double muStar, double energy, double lnZ) {
        if (!st.capped() && BoseCycleMoments.pays(s, n, kT, muStar)) {
            EnergyFluctuations viaCycles = boseByCycles(s, n, kT, muStar, energy, lnZ);
            if (viaCycles != null) {
                return viaCycles;
            }
        }
        return bySeries(s, st, n, kT, muStar, energy);
    }

    /**
     * Bosons by the cycle sums; null (use the series) when the recursion's ln Z or U disagrees with the
     * series of {@link Canonical} beyond 1e-8, or its sums were not usable (package-private for the tests).
     */
    static EnergyFluctuations boseByCycles(Spectrum s, int n, double kT, double muStar, double energy,
                                                   double lnZ) {
        BoseCycleMoments at = BoseCycleMoments.of(s, n, kT, muStar, true);
        if (at == null || !(Math.abs(at.lnZ - lnZ) <= U_TOLERANCE * Math.max(1.0, Math.abs(lnZ)))) {
            return null;
        }
        double e0 = s.groundEnergy();
        double mean = kT * at.mean;
        double second = kT * kT * at.second;
        double uMoments = n * e0 + mean;
        double uScale = Math.max(Math.abs(energy), n * Math.abs(e0));
        if (!(Math.abs(uMoments - energy) <= U_TOLERANCE * Math.max(uScale, Double.MIN_NORMAL))) {
            return null;
        }
        double var = second - mean * mean;
        return checked(new ArrayList<>(), kT, mean, var, second, at.roundingUnits, h -> {
            BoseCycleMoments up = BoseCycleMoments.of(s, n, kT * (1 + h), muStar, false);
            return up == null ? Double.NaN : kT * (1 + h) * up.mean;
        });
    }

    /** The moment pass of the series with its checks (all statistics; package-private for the tests). */
    static EnergyFluctuations bySeries(Spectrum s, Statistics st, int n, double kT, double muStar,
                                               double energy) {
        List<String> notes = new ArrayList<>();
        double reference = ZeroTemperatureLimit.topShellEnergy(s, st, n);
        double[] at = pass(s, st, n, kT, muStar, reference);
        double mean = at[0];
        double var = at[1];
        if (!(Double.isFinite(mean) && Double.isFinite(var))) {
            throw new IllegalStateException("energy moments not finite (mean " + mean + ", variance " + var
                    + "); please report this input");
        }
        double uMoments = n * reference + at[2] + mean;
        double uScale = Math.max(Math.abs(energy), n * Math.abs(reference)) + Math.abs(at[2]);
        if (Math.abs(uMoments - energy) > U_TOLERANCE * Math.max(uScale, Double.MIN_NORMAL)) {
            notes.add(String.format("internal consistency: U from the energy moments (%.12g) differs from U from the "
                    + "occupations (%.12g); C_V and Var E may be inaccurate", uMoments, energy));
        }
        double here = st.capped() ? mean : energy - n * s.groundEnergy();
        return checked(notes, kT, mean, var, at[3], s.stateCount() + (double) n, h -> h == 0 ? here
                : st.capped() ? pass(s, st, n, kT * (1 + h), muStar, reference)[0]
                : boseExcitationEnergy(s, n, kT * (1 + h), muStar));
    }

    /**
     * Checks (2) and (3) of the class notes on a variance {@code var} of the excitation energy with mean
     * {@code mean} and second moment {@code second}, {@code units} the rounding bound of the moments in units
     * of 2^-53; {@code excitationEnergy} gives the mean excitation energy at kT(1 + h) (at h = 0: the value the
     * difference starts from).
     */
    private static EnergyFluctuations checked(List<String> notes, double kT, double mean, double var, double second,
                                              double units, java.util.function.DoubleUnaryOperator excitationEnergy) {
        double bound = 4 * units * 0x1p-53 * (second + mean * mean);
        if (var <= bound) {
            if (mean == 0 && var <= 0) {
                notes.add("C_V and Var E underflow to 0: kT is far below the lowest excitation energy (the T -> 0 "
                        + "limit, exponentially small); exact value below " + String.format("%.3g", bound / (kT * kT)));
            } else {
                notes.add(String.format("Var E (%.3g) is at or below its rounding bound %.3g: C_V is accurate only to "
                        + "%.3g absolute", var, bound, bound / (kT * kT)));
            }
            return new EnergyFluctuations(Math.max(0.0, var), notes);
        }
        double delta = var / Math.max(mean, Double.MIN_NORMAL);
        double h = STEP / Math.max(1.0, delta / kT);
        double here = excitationEnergy.applyAsDouble(0);
        double up = excitationEnergy.applyAsDouble(h);
        double cFluct = var / (kT * kT);
        double cDiff = (up - here) / (h * kT);
        double noise = 8 * units * 0x1p-53 * (Math.abs(up) + Math.abs(here)) / (h * kT);
        if (!Double.isFinite(cDiff)) {
            notes.add("internal consistency: the dU/dT check of C_V could not be formed (U at kT(1 + h) = " + up
                    + "); C_V and Var E are unchecked");
        } else if (Math.abs(cFluct - cDiff) > C_TOLERANCE * Math.max(cFluct, Math.abs(cDiff)) + noise) {
            notes.add(String.format("internal consistency: C_V from the energy fluctuations (%.10g) and from dU/dT "
                    + "(%.10g, forward difference over kT(1 + %.1g)) disagree; C_V and Var E may be inaccurate",
                    cFluct, cDiff, h));
        }
        return new EnergyFluctuations(var, notes);
    }
}
