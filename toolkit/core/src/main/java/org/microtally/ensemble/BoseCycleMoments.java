package org.microtally.ensemble;

import org.microtally.MemoryEstimate;
import org.microtally.spectrum.Spectrum;

/**
 * Canonical Z_N and the first two moments of the excitation energy of N ideal bosons from the
 * recursion over permutation-cycle sums, in O(N^2 + N M) operations for M levels (the state-by-state
 * moment pass of {@link ScaledSeries} costs O(S N) for S states). Package-private engine of
 * {@link EnergyFluctuations} and of the Bose path of {@link CanonicalSeries}.
 *
 * <p>Formula: with C_k = sum_i g_i y_i^k the single-particle sum at k beta (y_i = e^{-beta(e_i - mu*)},
 * fugacity-scaled, y_i &lt; 1 for bosons), the canonical sums W_n = Z_n e^{n beta mu*} obey
 * n W_n = sum_{k=1}^{n} C_k W_{n-k}, W_0 = 1 (P. T. Landsberg, <i>Thermodynamics and Statistical
 * Mechanics</i> (1961); Borrmann &amp; Franke, J. Chem. Phys. 98, 2484 (1993), whose sign (+1)^{k+1}
 * for bosons makes every term non-negative). Differentiating with respect to a factor lambda on the
 * energies (x_i = beta (e_i - e_0) &gt;= 0, e_0 the lowest level) gives the sums U_n and V_n of the weight
 * times beta X and (beta X)^2, X = E - n e_0 the excitation energy:
 * n U_n = sum_k (D_k W_{n-k} + C_k U_{n-k}), n V_n = sum_k (Q_k W_{n-k} + 2 D_k U_{n-k} + C_k V_{n-k}),
 * with D_k = sum_i g_i k x_i y_i^k and Q_k = sum_i g_i (k x_i)^2 y_i^k (derivation: the recursion holds
 * at every lambda; common practice, no source). Every term is a product of non-negative numbers.
 *
 * <p>Range: the sums are kept as mantissas times one scale e^{logScale}; when W_n passes 2^400 all
 * entries so far are divided by an exact power of two, and entries that fall below 2^-1074 of the
 * current one are flushed to zero. That is harmless while W_N is the largest sum or near it (mu* the grand
 * canonical chemical potential for mean number N puts the peak of W_n there); when W_N ends more than
 * 2^64 below the largest W_n, the flushed and subnormal entries could matter and the result is refused
 * (null: the series path is used). The ln Z and U checks of {@link EnergyFluctuations} against the series
 * of {@link Canonical} catch anything else, and then too the series path is used instead.
 *
 * <p>Accuracy: worst-case relative rounding bound of W_N, U_N and V_N, to first order,
 * (N (N + 1)/2 + N (M + 8)) 2^-53 (the longest chain of dependent roundings: powers y^k, level sums, products,
 * the n-term sum and the division at each of at most N steps); measured errors are far smaller: ln Z and U
 * within 4e-14 relative, Var E within 5.3e-13 where mean^2/Var = 249 (1D oscillator, N &lt;= 2000, against
 * the Gaussian-binomial closed form; BoseCycleMomentsTest). The variance V/W - (U/W)^2 loses the factor 1 + mean^2/Var as in
 * {@link EnergyFluctuations}. Fermions are not offered: their cycle signs alternate, (-1)^{k+1}, and
 * the same recursion loses digits to cancellation (the series path stays in use for them).
 */
final class BoseCycleMoments {
    private static final int RESCALE_EXPONENT = 400;
    /** W_N this far below the largest W_n means mu* is far from the canonical N: refused (series path used). */
    private static final double FAR_BELOW_MAX = 0x1p-64;

    /** ln Z_N (true energies, not shifted). */
    final double lnZ;
    /** Mean of beta X. */
    final double mean;
    /** Mean of (beta X)^2, or NaN when only the first moment was asked for. */
    final double second;
    /** Worst-case relative rounding bound of each moment sum, in units of 2^-53. */
    final double roundingUnits;

    private BoseCycleMoments(double lnZ, double mean, double second, double roundingUnits) {
        this.lnZ = lnZ;
        this.mean = mean;
        this.second = second;
        this.roundingUnits = roundingUnits;
    }

    /**
     * Whether the recursion costs less than the state-by-state product of {@link ScaledSeries}. Cycle sums: two
     * recursions of N(N + 1)/2 dependent multiply-adds and 2 N M for the sums C_k, taken as 4x the cost per
     * operation of the product's pipelined steps (a rough ratio, from timing both paths at N = 10^4 on 102,340
     * states and at notebook 01's trap, under load). The product,
     * built from the highest level down, runs each state over the support of its series only; that support is
     * estimated as min(N, n + sqrt(1490 n) + 745/|ln y|), with n the grand canonical mean number in the levels
     * taken so far (a Gaussian tail down to e^-745, where entries flush) and 745/|ln y| the reach of one
     * state's own factor. An estimate only: it chooses the faster of two correct paths.
     */
    static boolean pays(Spectrum s, int n, double kT, double muStar) {
        int m = s.size();
        double beta = 1.0 / kT;
        double cycles = (double) n * (n + 1) + 2.0 * n * m;
        double series = 0;
        double mean = 0;
        for (int i = m - 1; i >= 0; i--) {
            double lnY = -beta * (s.energy(i) - muStar);
            double perState = -1.0 / Math.expm1(lnY) - 1.0; // y / (1 - y)
            mean += s.degeneracy(i) * perState;
            double support = Math.min(n, mean + Math.sqrt(1490 * mean) + 745 / Math.max(-lnY, 1e-300));
            series += s.degeneracy(i) * (support + 1);
            if (4 * cycles <= series) {
                return true;
            }
        }
        return false;
    }

    /**
     * The moments of N bosons at kT with fugacity scale {@code muStar} (below the lowest level).
     *
     * @param withSecond whether to form the second moment (else only W and U: cheaper)
     * @return the moments, or null when the sums are not usable (W_N not finite, zero, or more than 2^64 below
 *         the largest W_n)
     */
    static BoseCycleMoments of(Spectrum s, int n, double kT, double muStar, boolean withSecond) {
        Sums z = sums(s, n, kT, muStar, -1, withSecond ? 2 : 1);
        if (z == null || !z.usable() || !Double.isFinite(z.u[n]) || (z.v != null && !Double.isFinite(z.v[n]))) {
            return null;
        }
        double beta = 1.0 / kT;
        double lnZ = Math.log(z.w[n]) + z.logScale - beta * muStar * n;
        double units = n * (n + 1) / 2.0 + n * (s.size() + 8.0);
        return new BoseCycleMoments(lnZ, z.u[n] / z.w[n], z.v == null ? Double.NaN : z.v[n] / z.w[n], units);
    }

    /**
     * The generating series of {@link CanonicalSeries}' Bose path from the cycle sums: {all levels, all levels but
     * level 0} as series whose coefficient n is Z_n e^{n beta mu*} (times their scale), in O(N^2 + N M); null
     * when the sums are not usable (then the state-by-state product is used). Rounding bound of each coefficient
     * n: (n (n + 1)/2 + n (M + 5)) 2^-53 relative, worst case (see the class notes).
     */
    static ScaledSeries[] partitionSeries(Spectrum s, int n, double kT, double muStar) {
        Sums all = sums(s, n, kT, muStar, -1, 0);
        if (all == null || !all.usable()) {
            return null;
        }
        Sums others = sums(s, n, kT, muStar, 0, 0);
        if (others == null) {
            return null;
        }
        return new ScaledSeries[] {all.series(n), others.series(n)};
    }

    /** The sums W (and U, V up to {@code moments}) of the class notes, without level {@code skip} (-1: none). */
    private record Sums(double[] w, double[] u, double[] v, int low, double logScale, double max) {
        /** W_N finite, positive and not far below the largest W_n (see the class notes). */
        boolean usable() {
            double last = w[w.length - 1];
            return last >= FAR_BELOW_MAX * max;
        }

        ScaledSeries series(int n) {
            ScaledSeries z = new ScaledSeries(n, false);
            System.arraycopy(w, 0, z.c, 0, n + 1);
            int top = n;
            while (top > low && w[top] == 0) {
                top--;
            }
            z.low = low;
            z.degree = top;
            z.logScale = logScale;
            return z;
        }
    }

    private static Sums sums(Spectrum s, int n, double kT, double muStar, int skip, int moments) {
        int m = s.size();
        MemoryEstimate.requireHeap("particle number N", n, "the cycle sums, " + 2 * (moments + 1)
                        + " series of N + 1 numbers", 2 * (moments + 1) * (n + 1.0), 8,
                "Lower N, or give Java more heap (-Xmx; MICROTALLY_HEAP=4g for toolkit/bin/microtally).");
        double beta = 1.0 / kT;
        double e0 = s.groundEnergy();
        double[] c = new double[n + 1];
        double[] d = moments >= 1 ? new double[n + 1] : null;
        double[] q = moments >= 2 ? new double[n + 1] : null;
        for (int i = 0; i < m; i++) {
            if (i == skip) {
                continue;
            }
            double y = Math.exp(-beta * (s.energy(i) - muStar));
            double x = beta * (s.energy(i) - e0);
            double g = s.degeneracy(i);
            double p = y;
            for (int k = 1; k <= n && p != 0; k++) {
                double gp = g * p;
                c[k] += gp;
                if (d != null) {
                    double kx = k * x;
                    d[k] += kx * gp;
                    if (q != null) {
                        q[k] += kx * kx * gp;
                    }
                }
                p *= y;
            }
        }
        double[] w = new double[n + 1];
        double[] u = d != null ? new double[n + 1] : null;
        double[] v = q != null ? new double[n + 1] : null;
        w[0] = 1;
        int low = 0;
        double logScale = 0;
        double max = 1;
        for (int j = 1; j <= n; j++) {
            double sw = 0;
            double su = 0;
            double sv = 0;
            if (u == null) {
                for (int k = 1; k <= j - low; k++) {
                    sw += c[k] * w[j - k];
                }
            } else {
                for (int k = 1; k <= j - low; k++) {
                    double wk = w[j - k];
                    double uk = u[j - k];
                    sw += c[k] * wk;
                    su += d[k] * wk + c[k] * uk;
                    if (v != null) {
                        sv += q[k] * wk + 2 * d[k] * uk + c[k] * v[j - k];
                    }
                }
                u[j] = su / j;
                if (v != null) {
                    v[j] = sv / j;
                }
            }
            w[j] = sw / j;
            if (!Double.isFinite(w[j])) {
                return null;
            }
            max = Math.max(max, w[j]);
            int e = Math.getExponent(w[j]);
            if (e > RESCALE_EXPONENT) {
                low = rescale(w, u, v, low, j, e);
                logScale += e * Math.log(2.0);
                max = Math.scalb(max, -e);
            }
        }
        return new Sums(w, u, v, low, logScale, max);
    }

    /** Divides entries low..top by 2^e; returns the new first index whose W is not zero. */
    private static int rescale(double[] w, double[] u, double[] v, int low, int top, int e) {
        for (int j = low; j <= top; j++) {
            w[j] = Math.scalb(w[j], -e);
            if (u != null) {
                u[j] = Math.scalb(u[j], -e);
            }
            if (v != null) {
                v[j] = Math.scalb(v[j], -e);
            }
        }
        int first = low;
        while (first < top && w[first] == 0) {
            if (u != null) {
                u[first] = 0;
            }
            if (v != null) {
                v[first] = 0;
            }
            first++;
        }
        return first;
    }
}
