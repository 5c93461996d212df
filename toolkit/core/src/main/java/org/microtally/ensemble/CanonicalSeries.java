package org.microtally.ensemble;

import java.util.ArrayList;
import java.util.List;
import org.microtally.MemoryEstimate;
import org.microtally.ProgressListener;
import org.microtally.occupation.ChemicalPotential;
import org.microtally.occupation.CondensateDistribution;
import org.microtally.spectrum.Spectrum;
import org.microtally.spectrum.Statistics;

/**
 * The series work behind {@link Canonical} at kT &gt; 0 away from the T -&gt; 0 limit: the three
 * algorithm paths (distinguishable particles in closed form, Bose by the forward product and
 * Horner occupations, Fermi/Gentile by prefix x suffix products with checkpoints), the
 * ground-level distributions and the underflow check. Method, accuracy and cost are stated on
 * {@link Canonical}; package-private.
 */
final class CanonicalSeries {
    private static final long STORE_ALL_LIMIT = 1L << 23;
    private static final double FLUSH_WARNING = 1e-12;

    private CanonicalSeries() { }

    /** Bose, Fermi or Gentile at kT &gt; 0: mu* from the grand canonical mean number, then the series. */
    static Canonical indistinguishable(Spectrum spectrum, Statistics statistics, int n, double kT,
                                       ProgressListener progress) {
        return indistinguishable(spectrum, statistics, n, kT, progress, STORE_ALL_LIMIT);
    }

    /** Test hook: Fermi/Gentile with a given prefix-memory limit (0 forces the checkpoint path). */
    static Canonical cappedWithPrefixLimit(Spectrum spectrum, Statistics statistics, int n, double kT, long limit) {
        return indistinguishable(spectrum, statistics, n, kT, ProgressListener.NONE, limit);
    }

    private static Canonical indistinguishable(Spectrum spectrum, Statistics statistics, int n, double kT,
                                               ProgressListener progress, long storeAllLimit) {
        double capacity = statistics.capped() ? (double) statistics.maxOccupancy() * spectrum.stateCount()
                : Double.POSITIVE_INFINITY;
        double target = Math.min(n, capacity - 0.5);
        double muStar = ChemicalPotential.forMeanNumber(spectrum, statistics, kT, target);
        return statistics.capped() ? capped(spectrum, statistics, n, kT, muStar, progress, storeAllLimit)
                : bose(spectrum, n, kT, muStar, progress);
    }

    static Canonical distinguishable(Spectrum s, int n, double kT) {
        double beta = 1.0 / kT;
        OneParticleMoments one = OneParticleMoments.of(s, beta);
        double e0 = one.groundEnergy();
        double z1 = one.shiftedSum();
        double var1 = one.excitationVariance();
        double lnZ1 = one.lnZ1();
        double[] occ = new double[s.size()];
        for (int i = 0; i < occ.length; i++) {
            occ[i] = n * Math.exp(-beta * (s.energy(i) - e0)) / z1;
        }
        double mu = ChemicalPotential.forMeanNumber(s, Statistics.DISTINGUISHABLE, kT, n);
        // each labelled particle is in the lowest level independently with p = g_0 / Z_1: binomial N_0
        double excited = z1 - s.degeneracy(0);
        double lnP = Math.log(s.degeneracy(0) / z1);
        double lnQ = excited > 0 ? Math.log(excited / z1) : Double.NEGATIVE_INFINITY;
        double[] dist = new double[n + 1];
        double lnBinom = 0;
        double total = 0;
        for (int j = 0; j <= n; j++) {
            if (j > 0) {
                lnBinom += Math.log((n - j + 1.0) / j);
            }
            double lq = n - j == 0 ? 0.0 : (n - j) * lnQ;
            dist[j] = lq == Double.NEGATIVE_INFINITY ? 0.0 : Math.exp(lnBinom + j * lnP + lq);
            total += dist[j];
        }
        for (int j = 0; j <= n; j++) {
            dist[j] /= total;
        }
        return new Canonical(s, Statistics.DISTINGUISHABLE, n, kT, mu, n * lnZ1, occ, null,
                new CondensateDistribution(dist), List.of(),
                EnergyFluctuations.exact(n * var1), null, null);
    }

    private static double lnY(Spectrum s, int i, double beta, double muStar) {
        return -beta * (s.energy(i) - muStar);
    }

    private static Canonical bose(Spectrum s, int n, double kT, double muStar, ProgressListener progress) {
        double beta = 1.0 / kT;
        int m = s.size();
        // where cheaper, the same series from the cycle sums (BoseCycleMoments: O(N^2 + N M) instead of O(S N))
        ScaledSeries[] fromCycles = BoseCycleMoments.pays(s, n, kT, muStar) ? BoseCycleMoments.partitionSeries(s, n, kT, muStar) : null;
        ScaledSeries z = fromCycles != null ? fromCycles[0] : new ScaledSeries(n, false);
        ScaledSeries others = fromCycles != null ? fromCycles[1] : null;
        long every = Math.max(1, m / 100);
        for (int i = m - 1; i >= 0 && fromCycles == null; i--) {
            if (i == 0) {
                others = z.copy();
            }
            z.multiplyStates(s.degeneracy(i), lnY(s, i, beta, muStar), Integer.MAX_VALUE, 0);
            if ((m - i) % every == 0) {
                progress.progress(m - i, m, "levels");
            }
        }
        double cn = z.c[n];
        double[] occ = new double[m];
        for (int i = 0; i < m; i++) {
            double y = Math.exp(lnY(s, i, beta, muStar));
            double acc = 0;
            for (int k = 0; k < n; k++) {
                acc = acc * y + z.c[k];
            }
            occ[i] = y * acc / cn;
        }
        double lnZn = z.logCoefficient(n);
        double[] p = new double[n + 1];
        double lnY0 = lnY(s, 0, beta, muStar);
        int g0 = s.degeneracy(0);
        double lnL = 0;
        double sum = 0;
        for (int j = 0; j <= n; j++) {
            if (j > 0) {
                lnL += lnY0 + Math.log(((double) g0 + j - 1) / j);
            }
            double lc = others.logCoefficient(n - j);
            p[j] = lc == Double.NEGATIVE_INFINITY ? 0.0 : Math.exp(lnL + lc - lnZn);
            sum += p[j];
        }
        for (int j = 0; j <= n; j++) {
            p[j] /= sum;
        }
        List<String> extra = new ArrayList<>();
        flushCheck(s, Statistics.BOSE, kT, muStar, n, lnZn, extra);
        if (Math.abs(sum - 1) > 1e-9) {
            extra.add("internal consistency: condensate probabilities summed to " + sum + " before normalisation");
        }
        return new Canonical(s, Statistics.BOSE, n, kT, muStar, lnZn - beta * muStar * n, occ, null,
                new CondensateDistribution(p), extra, null, null, null);
    }

    private static Canonical capped(Spectrum s, Statistics st, int n, double kT, double muStar,
                                    ProgressListener progress, long storeAllLimit) {
        double beta = 1.0 / kT;
        int m = s.size();
        int cap = st.maxOccupancy();
        boolean storeAll = (long) m * (n + 1) <= storeAllLimit;
        int block = storeAll ? m : (int) Math.ceil(Math.sqrt(m));
        int blocks = (m + block - 1) / block;
        MemoryEstimate.requireHeap("particle number N", n, "the kept partial products, " + (storeAll ? m : block + blocks)
                        + " series of N + 1 numbers", (storeAll ? (double) m : (double) block + blocks) * (n + 1.0), 8,
                "Lower N, or merge levels of equal energy (each level is one series), or give Java more heap (-Xmx; MICROTALLY_HEAP=4g for toolkit/bin/microtally, install-kernel --heap 4g for the kernel).");
        ScaledSeries[] checkpoints = new ScaledSeries[blocks];
        ScaledSeries[] q = new ScaledSeries[storeAll ? m : block];
        ScaledSeries z = new ScaledSeries(n, false);
        long total = 2L * m;
        long every = Math.max(1, m / 50);
        for (int i = 0; i < m; i++) {
            if (i % block == 0) {
                checkpoints[i / block] = storeAll ? null : z.copy();
            }
            double ly = lnY(s, i, beta, muStar);
            z.multiplyStates(s.degeneracy(i) - 1, ly, cap, 0);
            if (storeAll) {
                q[i] = z.copy();
            }
            z.multiplyStates(1, ly, cap, 0);
            if ((i + 1) % every == 0) {
                progress.progress(i + 1, total, "levels (forward)");
            }
        }
        double lnZn = z.logCoefficient(n);
        double[] occ = new double[m];
        double[] vac = new double[m];
        double worstMismatch = 0;
        ScaledSeries suffix = new ScaledSeries(n, false);
        double[] lp = new double[cap + 1];
        double[] groundDistribution = null;
        for (int b = blocks - 1; b >= 0; b--) {
            int from = b * block;
            int to = Math.min(m, from + block);
            if (!storeAll) {
                ScaledSeries w = checkpoints[b].copy();
                for (int i = from; i < to; i++) {
                    double ly = lnY(s, i, beta, muStar);
                    w.multiplyStates(s.degeneracy(i) - 1, ly, cap, 0);
                    q[i - from] = w.copy();
                    w.multiplyStates(1, ly, cap, 0);
                }
            }
            for (int i = to - 1; i >= from; i--) {
                ScaledSeries qi = q[storeAll ? i : i - from];
                double ly = lnY(s, i, beta, muStar);
                double max = Double.NEGATIVE_INFINITY;
                for (int j = 0; j <= cap; j++) {
                    double c = qi.logProductCoefficient(suffix, n - j);
                    lp[j] = c == Double.NEGATIVE_INFINITY ? c : c + j * ly;
                    max = Math.max(max, lp[j]);
                }
                double s0 = 0;
                double s1 = 0;
                double sv = 0;
                for (int j = 0; j <= cap; j++) {
                    double w = lp[j] == Double.NEGATIVE_INFINITY ? 0.0 : Math.exp(lp[j] - max);
                    s0 += w;
                    s1 += j * w;
                    sv += (cap - j) * w;
                }
                occ[i] = s1 / s0;
                vac[i] = sv / s0;
                worstMismatch = Math.max(worstMismatch, Math.abs(max + Math.log(s0) - lnZn));
                q[storeAll ? i : i - from] = null;
                if (i == 0) {
                    groundDistribution = levelDistribution(s.degeneracy(0), ly, cap, n, suffix, lnZn);
                }
                suffix.multiplyStates(s.degeneracy(i), ly, cap, 0);
                long done = m + (m - i);
                if ((m - i) % every == 0) {
                    progress.progress(done, total, "levels (occupations)");
                }
            }
        }
        List<String> extra = new ArrayList<>();
        flushCheck(s, st, kT, muStar, n, lnZn, extra);
        if (worstMismatch > 1e-8) {
            extra.add("internal consistency: a prefix x suffix product differed from Z_N by " + worstMismatch
                    + " in ln; occupations may be inaccurate");
        }
        return new Canonical(s, st, n, kT, muStar, lnZn - beta * muStar * n, occ, vac,
                new CondensateDistribution(groundDistribution), extra, null, null, null);
    }

    /**
     * P(N_0 = j) for the lowest level: (level factor series of its g states)[j] x (series of all other
     * levels)[N - j] / Z_N, positive terms only; normalised (the raw sum is Z_N / Z_N = 1 to rounding).
     */
    private static double[] levelDistribution(int g, double lnY, int cap, int n, ScaledSeries others, double lnZn) {
        ScaledSeries level = new ScaledSeries(n, false);
        level.multiplyStates(g, lnY, cap, 0);
        double[] p = new double[n + 1];
        double sum = 0;
        for (int j = 0; j <= n; j++) {
            double a = level.logCoefficient(j);
            double b = others.logCoefficient(n - j);
            p[j] = a == Double.NEGATIVE_INFINITY || b == Double.NEGATIVE_INFINITY ? 0.0 : Math.exp(a + b - lnZn);
            sum += p[j];
        }
        for (int j = 0; j <= n; j++) {
            p[j] /= sum;
        }
        return p;
    }

    private static void flushCheck(Spectrum s, Statistics st, double kT, double muStar, int n, double lnZnScaled,
                                   List<String> out) {
        double lnXi = GrandCanonical.ofChemicalPotential(s, st, kT, muStar).lnXi();
        double lnPgc = lnZnScaled - lnXi;
        double lnBound = Math.log((double) s.stateCount()) + Math.log(n + 1.0) - 1073 * Math.log(2.0) - lnPgc;
        if (lnBound > Math.log(FLUSH_WARNING)) {
            out.add("underflow bound on the relative error of Z_N is e^" + lnBound
                    + " (grand canonical probability of exactly N at mu* is e^" + lnPgc + ")");
        }
    }
}
