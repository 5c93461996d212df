package org.microtally.count;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.math.BigInteger;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Random;
import java.util.Set;
import org.junit.jupiter.api.Test;
import org.microtally.spectrum.Level;
import org.microtally.spectrum.Spectrum;
import org.microtally.spectrum.Statistics;

/** Every exact table against independent brute-force enumeration of microstates. */
class BruteForceCrossCheckTest {

    private static final Statistics[] ALL = {Statistics.BOSE, Statistics.FERMI, Statistics.DISTINGUISHABLE,
        Statistics.maxOccupancy(2), Statistics.maxOccupancy(3)};

    static Spectrum randomSpectrum(Random rnd, boolean labelled) {
        int levels = 1 + rnd.nextInt(5);
        List<Level> list = new ArrayList<>();
        for (int l = 0; l < levels; l++) {
            list.add(new Level(rnd.nextInt(5), 1 + rnd.nextInt(3), labelled ? rnd.nextInt(5) - 2 : 0));
        }
        return Spectrum.of(list, org.microtally.units.EnergyScale.abstractUnit("unit"), labelled,
                Double.POSITIVE_INFINITY, "");
    }

    @Test
    void countTablesAgreeWithEnumerationOnRandomSpectra() {
        Random rnd = new Random(424242L);
        int checked = 0;
        for (int trial = 0; trial < 260; trial++) {
            Spectrum s = randomSpectrum(rnd, false);
            Statistics st = ALL[trial % ALL.length];
            int maxN = rnd.nextInt(5);
            int maxE = rnd.nextInt(9);
            CountTable t = CountTable.of(s, st, maxN, maxE);
            MicrostateEnumerator en = MicrostateEnumerator.of(s, st);
            for (int n = 0; n <= maxN; n++) {
                for (int e = 0; e <= maxE; e++) {
                    int[] lv = en.stateLevels(e);
                    Set<List<Integer>> seen = new HashSet<>();
                    final int nn = n;
                    final int ee = e;
                    long c = en.microstates(n, e).peek(v -> {
                        // each microstate really has n particles and energy e, and is distinct
                        List<Integer> key = new ArrayList<>();
                        for (int x : v) {
                            key.add(x);
                        }
                        assertTrue(seen.add(key), "duplicate microstate");
                        assertEquals(nn, st.indistinguishable() ? sum(v) : v.length);
                        assertEquals(ee, energy(s, lv, v, st));
                        if (st.indistinguishable()) {
                            for (int x : v) {
                                assertTrue(x >= 0 && x <= st.maxOccupancy());
                            }
                        }
                    }).count();
                    // Source: independent brute force (depth-first enumeration of occupation vectors / label assignments)
                    assertEquals(BigInteger.valueOf(c), t.count(n, e), s + " " + st + " n=" + n + " e=" + e);
                }
            }
            checked++;
        }
        assertEquals(260, checked);
    }

    @Test
    void labelledTablesAgreeWithEnumerationOnRandomSpectra() {
        Random rnd = new Random(99L);
        for (int trial = 0; trial < 120; trial++) {
            Spectrum s = randomSpectrum(rnd, true);
            Statistics st = ALL[trial % ALL.length];
            int maxN = rnd.nextInt(4);
            int maxE = rnd.nextInt(7);
            LabelledCountTable t = LabelledCountTable.of(s, st, maxN, maxE);
            MicrostateEnumerator en = MicrostateEnumerator.of(s, st);
            for (int n = 0; n <= maxN; n++) {
                for (int e = 0; e <= maxE; e++) {
                    int[] lv = en.stateLevels(e);
                    Map<Integer, Long> byLabel = new HashMap<>();
                    en.microstates(n, e).forEach(v -> byLabel.merge(label(s, lv, v, st), 1L, Long::sum));
                    for (int lab = t.minLabelTotal() - 1; lab <= t.maxLabelTotal() + 1; lab++) {
                        // Source: independent brute force, label total of each enumerated microstate
                        assertEquals(BigInteger.valueOf(byLabel.getOrDefault(lab, 0L)), t.count(n, e, lab),
                                s + " " + st + " n=" + n + " e=" + e + " L=" + lab);
                    }
                }
            }
        }
    }

    static int sum(int[] v) {
        int s = 0;
        for (int x : v) {
            s += x;
        }
        return s;
    }

    static int energy(Spectrum s, int[] levelOf, int[] v, Statistics st) {
        int e = 0;
        if (st.indistinguishable()) {
            for (int i = 0; i < v.length; i++) {
                e += v[i] * (int) s.energy(levelOf[i]);
            }
        } else {
            for (int state : v) {
                e += (int) s.energy(levelOf[state]);
            }
        }
        return e;
    }

    static int label(Spectrum s, int[] levelOf, int[] v, Statistics st) {
        int m = 0;
        if (st.indistinguishable()) {
            for (int i = 0; i < v.length; i++) {
                m += v[i] * s.label(levelOf[i]);
            }
        } else {
            for (int state : v) {
                m += s.label(levelOf[state]);
            }
        }
        return m;
    }
}
