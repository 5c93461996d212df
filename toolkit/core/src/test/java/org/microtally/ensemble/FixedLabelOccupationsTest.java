package org.microtally.ensemble;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.util.List;
import org.junit.jupiter.api.Test;
import org.microtally.InvalidInputException;
import org.microtally.count.MicrostateEnumerator;
import org.microtally.occupation.LevelOccupations;
import org.microtally.spectrum.Spectra;
import org.microtally.spectrum.Spectrum;
import org.microtally.spectrum.Statistics;

class FixedLabelOccupationsTest {

    @Test
    void occupationsAtFixedAngularMomentumAgreeWithListedMicrostates() {
        Spectrum dot = Spectra.oscillator2dByAngularMomentum(3).withInternalMultiplicity(2);
        double kT = 0.9;
        double h = 0.2;
        int n = 3;
        for (Statistics st : List.of(Statistics.FERMI, Statistics.BOSE, Statistics.maxOccupancy(2),
                Statistics.DISTINGUISHABLE)) {
            LabelledCanonical c = LabelledCanonical.inField(dot, st, n, kT, h);
            MicrostateEnumerator en = MicrostateEnumerator.of(dot, st);
            for (int target : new int[] {-2, 1, 3}) {
                double[] acc = new double[dot.size()];
                double z = 0;
                for (int e = 0; e <= n * 3; e++) {
                    int[] levelOf = en.stateLevels(e);
                    final int energy = e;
                    double[] zs = {0};
                    en.microstates(n, e).forEach(m -> {
                        int[] perLevel = new int[dot.size()];
                        int label = 0;
                        if (st.indistinguishable()) {
                            for (int k = 0; k < m.length; k++) {
                                perLevel[levelOf[k]] += m[k];
                                label += m[k] * dot.label(levelOf[k]);
                            }
                        } else {
                            for (int state : m) {
                                perLevel[levelOf[state]]++;
                                label += dot.label(levelOf[state]);
                            }
                        }
                        if (label != target) {
                            return;
                        }
                        double w = Math.exp(-(energy - h * label) / kT);
                        zs[0] += w;
                        for (int l = 0; l < perLevel.length; l++) {
                            acc[l] += w * perLevel[l];
                        }
                    });
                    z += zs[0];
                }
                LevelOccupations occ = FixedLabelOccupations.of(c, target);
                for (int l = 0; l < dot.size(); l++) {
                    double ref = acc[l] / z / dot.degeneracy(l);
                    // Source: independent brute force, every microstate listed (MicrostateEnumerator) with its label
                    assertEquals(ref, occ.perState(l), 1e-12 * Math.max(1e-3, ref), st + " L=" + target + " level " + l);
                }
                // Source: common practice, no source (sum rule: the level totals add up to N)
                assertEquals(n, occ.total(), 1e-11 * n);
            }
        }
    }

    @Test
    void unreachedLabelsAreRefused() {
        LabelledCanonical c = LabelledCanonical.of(Spectra.spinInField(0.5), Statistics.FERMI, 1, 1.0);
        assertThrows(InvalidInputException.class, () -> FixedLabelOccupations.of(c, 0));
    }
}
