package org.microtally.ensemble;

import java.util.ArrayList;
import java.util.List;
import org.microtally.InvalidInputException;
import org.microtally.ProgressListener;
import org.microtally.spectrum.Level;
import org.microtally.spectrum.Spectrum;
import org.microtally.spectrum.Statistics;

/**
 * Canonical ensembles at negative temperature (kT &lt; 0), defined only for bounded spectra: the
 * Boltzmann weights e^{-E/kT} then favour high energies, and the sum converges only because the
 * spectrum has a top. Package-private helper of {@link Canonical}.
 *
 * <p>Method: the exact identity Z_N(beta; e_i) = Z_N(-beta; -e_i) (every Boltzmann weight is the same
 * number), so the ensemble at kT &lt; 0 is the ensemble of the mirrored spectrum (energies negated) at
 * |kT| &gt; 0, computed by the same positive-term method, with U, F and the occupations mapped back:
 * ln Z, S and C_V = Var E / kT^2 are equal, U changes sign. Same accuracy as at positive T. Negative
 * absolute temperature in this canonical sense is the population inversion of a bounded system
 * (Ramsey, Phys. Rev. 103, 20 (1956)); which temperature to quote for an isolated system is a
 * separate question (Dunkel &amp; Hilbert, Nature Physics 10, 67 (2014); see {@link Microcanonical}).
 */
final class NegativeTemperature {
    private NegativeTemperature() { }

    static Canonical canonical(Spectrum s, Statistics st, int n, double kT, ProgressListener progress) {
        if (s.isTruncated() || s.isCompletenessUndeclared()) {
            throw InvalidInputException.of("temperature kT", kT, "> 0 for this spectrum: it is "
                            + (s.isTruncated() ? "truncated at " + s.cutoffEnergy() + " from an infinite one"
                                    : "of undeclared completeness (read without a cutoff)")
                            + ", and e^{-E/kT} grows without bound above its top when kT < 0",
                    "Negative temperatures need a bounded spectrum with every level given (cutoff +infinity), "
                            + "such as Spectra.twoLevel or Spectra.spinInField.");
        }
        List<Level> flipped = new ArrayList<>(s.size());
        for (Level l : s.levels()) {
            flipped.add(new Level(-l.energy(), l.degeneracy(), l.label()));
        }
        Spectrum mirror = Spectrum.of(flipped, s.scale(), s.isLabelled(), Double.POSITIVE_INFINITY, "");
        int[] map = new int[s.size()];
        int j = 0;
        for (int end = s.size(); end > 0; ) {
            int start = end - 1;
            while (start > 0 && s.energy(start - 1) == s.energy(end - 1)) {
                start--;
            }
            for (int i = start; i < end; i++) {
                map[i] = j++;
            }
            end = start;
        }
        return Canonical.mirrored(s, Canonical.of(mirror, st, n, -kT, progress), kT, map);
    }
}
