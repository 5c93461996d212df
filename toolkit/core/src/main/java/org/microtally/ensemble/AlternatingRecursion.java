package org.microtally.ensemble;

import org.microtally.Inputs;
import org.microtally.InvalidInputException;
import org.microtally.spectrum.Spectrum;
import org.microtally.spectrum.Statistics;

/**
 * FOR COMPARISON ONLY: the alternating particle-number recursion of Borrmann &amp; Franke
 * (J. Chem. Phys. 98, 2484 (1993)),
 * Z_N = (1/N) sum_{k=1..N} (+-1)^{k+1} Z_1(k beta) Z_{N-k}, with + for bosons and alternating signs for
 * fermions, evaluated in plain double arithmetic.
 *
 * <p>For fermions the terms cancel: the result loses roughly log10(largest term / Z_N) digits and
 * at low temperature or moderate N it has no correct digit at all (and may even come out negative).
 * {@link Canonical} never uses it; it is here so that the loss can be shown next to the exact
 * positive-term result. Energies are measured from the ground level and scaled by the fugacity
 * e^{beta mu*} given by the caller, which keeps the values in range but cannot cure the cancellation.
 */
public final class AlternatingRecursion {
    private AlternatingRecursion() { }

    /**
     * ln of the scaled values Z_n e^{beta mu* n}, n = 0..maxN, for Bose or Fermi statistics;
     * {@code NaN} entries mark values that came out zero or negative (total loss of digits).
     */
    public static double[] lnScaledPartitionFunctions(Spectrum spectrum, Statistics statistics, int maxN, double kT,
                                                      double muStar) {
        if (statistics.kind() != Statistics.Kind.BOSE && statistics.kind() != Statistics.Kind.FERMI) {
            throw InvalidInputException.of("statistics for the alternating recursion", statistics, "BOSE or FERMI", "");
        }
        Inputs.temperature(kT);
        Inputs.atLeast("maxN", maxN, 1);
        double beta = 1.0 / kT;
        double[] z1 = new double[maxN + 1];
        for (int k = 1; k <= maxN; k++) {
            double s = 0;
            for (int i = 0; i < spectrum.size(); i++) {
                s += spectrum.degeneracy(i) * Math.exp(-k * beta * (spectrum.energy(i) - muStar));
            }
            z1[k] = s;
        }
        double sign = statistics.kind() == Statistics.Kind.FERMI ? -1 : 1;
        double[] z = new double[maxN + 1];
        z[0] = 1;
        for (int m = 1; m <= maxN; m++) {
            double s = 0;
            double sg = 1;
            for (int k = 1; k <= m; k++) {
                s += sg * z1[k] * z[m - k];
                sg *= sign;
            }
            z[m] = s / m;
        }
        double[] out = new double[maxN + 1];
        for (int m = 0; m <= maxN; m++) {
            out[m] = z[m] > 0 ? Math.log(z[m]) : Double.NaN;
        }
        return out;
    }
}
