package org.microtally.ensemble;

import org.microtally.spectrum.Spectrum;

/**
 * One particle alone in a spectrum at inverse temperature beta, energies measured from the lowest level
 * e0: the shifted one-particle sum Z_1' = sum_i g_i exp(-beta (e_i - e0)), the mean excitation energy
 * &lt;d&gt; = sum_i g_i d_i exp(-beta d_i) / Z_1' (d_i = e_i - e0) and its variance, which N labelled
 * particles multiply by N (ln Z_N = N ln Z_1, Var E = N Var d).
 *
 * <p>The variance is a second pass over (d_i - &lt;d&gt;)^2, never &lt;d^2&gt; - &lt;d&gt;^2, which loses
 * about log10(&lt;d&gt;^2 / Var d) digits when the excitation is sharp (common practice, no source: the
 * two-pass variance). Accuracy: each sum of positive terms carries at most (levels) roundings.
 */
record OneParticleMoments(double beta, double groundEnergy, double shiftedSum, double meanExcitation,
                          double excitationVariance) {

    static OneParticleMoments of(Spectrum spectrum, double beta) {
        double e0 = spectrum.groundEnergy();
        double z1 = 0;
        double m1 = 0;
        for (int i = 0; i < spectrum.size(); i++) {
            double d = spectrum.energy(i) - e0;
            double w = spectrum.degeneracy(i) * Math.exp(-beta * d);
            z1 += w;
            m1 += w * d;
        }
        double mean = m1 / z1;
        double v = 0;
        for (int i = 0; i < spectrum.size(); i++) {
            double d = spectrum.energy(i) - e0 - mean;
            v += spectrum.degeneracy(i) * Math.exp(-beta * (spectrum.energy(i) - e0)) * d * d;
        }
        return new OneParticleMoments(beta, e0, z1, mean, v / z1);
    }

    /** ln Z_1 = ln Z_1' - beta e0. */
    double lnZ1() {
        return Math.log(shiftedSum) - beta * groundEnergy;
    }
}
