package org.microtally.ensemble;

import org.microtally.InvalidInputException;
import org.microtally.occupation.LevelOccupations;
import org.microtally.spectrum.Spectrum;
import org.microtally.spectrum.Statistics;

/**
 * Exact mean occupations of every level in the canonical ensemble at fixed total label L (and field
 * h) of a {@link LabelledCanonical}: &lt;n_s&gt;_L for one state s of each level.
 *
 * <p><b>Formula.</b> Indistinguishable particles: P(n_s = j | L) = e^{-beta j (e_s - h m_s)}
 * Z^{(-s)}_{N-j}(L - j m_s) / Z_N(L), with Z^{(-s)} the fixed-label partition functions of the spectrum
 * without state s (j = 0..k; bosons j = 0..N). Labelled particles: &lt;n_s&gt;_L = N e^{-beta (e_s -
 * h m_s)} Z_{N-1}(L - m_s) / Z_N(L) (particle 1 in state s, times N). (The conditional form of the
 * canonical occupation; common practice, no source.)
 *
 * <p><b>Method and cost.</b> The series without state s is rebuilt from scratch for each level (no
 * deflation, so every term stays non-negative), with the same scaled Boltzmann factors as the source
 * ensemble: cost (M + 1) times one {@link LabelledCanonical} build for M levels, O(M S N W k)
 * multiply-adds. Meant for shells and small dots (M up to a few hundred levels); the source
 * ensemble's memory check applies to each build.
 *
 * <p><b>Accuracy.</b> Each P(n_s = j | L) is a ratio of non-negative sums: relative rounding error
 * below 2 (S + N) 2^-53, plus an absolute error below the source's flushing tolerance (1e-12) from
 * flushed mantissas, since L itself is resolved.
 */
public final class FixedLabelOccupations {
    private FixedLabelOccupations() {
    }

    /**
     * The occupations at total label {@code labelTotal}.
     *
     * @throws InvalidInputException when {@code c} cannot give Z(L) at this label (unreached or unresolved)
     */
    public static LevelOccupations of(LabelledCanonical c, int labelTotal) {
        c.lnZAtLabel(labelTotal); // refuses unreached and unresolved labels with its own message
        Spectrum s = c.spectrum();
        Statistics st = c.statistics();
        int n = c.particleNumber();
        double beta = 1 / c.kT();
        double h = c.field();
        double mu = c.scaleChemicalPotential();
        LabelSeries full = LabelledCanonical.series(s, st, n, beta, h, mu, -1);
        int li = labelTotal - full.lo;
        double cFull = full.c[n][li];
        if (!(cFull > 0)) {
            throw new IllegalStateException("fixed-label series lost Z(L) at a resolved label; please report");
        }
        double[] occ = new double[s.size()];
        for (int i = 0; i < s.size(); i++) {
            int m = s.label(i);
            double lnY = -beta * (s.energy(i) - h * m - mu);
            if (!st.indistinguishable()) {
                int src = li - m;
                double prev = src >= 0 && src < full.width ? full.c[n - 1][src] : 0.0;
                occ[i] = n * Math.exp(lnY) * prev / cFull;
                continue;
            }
            LabelSeries rest = LabelledCanonical.series(s, st, n, beta, h, mu, i);
            int jMax = st.capped() ? Math.min(st.maxOccupancy(), n) : n;
            double mean = 0;
            for (int j = 1; j <= jMax; j++) {
                int src = li - j * m;
                if (src < 0 || src >= rest.width) {
                    continue;
                }
                double cr = rest.c[n - j][src];
                if (cr > 0) {
                    mean += j * Math.exp(Math.log(cr) + rest.logScale - full.logScale + j * lnY - Math.log(cFull));
                }
            }
            occ[i] = mean;
        }
        return new LevelOccupations(s.energies(), s.degeneracies(), occ);
    }
}
