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

    /** One random case: a spectrum, a statistics and the table bounds. */
    record Case(Spectrum spectrum, Statistics statistics, int maxN, int maxE) {
        /** Runs {@code check} on every cell (n, e) within the bounds, with the enumerator and its state levels at e. */
        void forEachCell(CellCheck check) {
            MicrostateEnumerator en = MicrostateEnumerator.of(spectrum, statistics);
            for (int n = 0; n <= maxN; n++) {
                for (int e = 0; e <= maxE; e++) {
                    check.check(en, n, e, en.stateLevels(e));
                }
            }
        }
    }

    /** A check of one cell of a case. */
    interface CellCheck {
        void check(MicrostateEnumerator en, int n, int e, int[] levelOf);
    }

    /** {@code trials} random cases, the statistics in turn, maxN below {@code nBound} and maxE below {@code eBound}. */
    static List<Case> randomCases(long seed, int trials, boolean labelled, int nBound, int eBound) {
        Random rnd = new Random(seed);
        List<Case> cases = new ArrayList<>();
        for (int trial = 0; trial < trials; trial++) {
            Spectrum s = randomSpectrum(rnd, labelled);
            Statistics st = ALL[trial % ALL.length];
            int maxN = rnd.nextInt(nBound);
            int maxE = rnd.nextInt(eBound);
            cases.add(new Case(s, st, maxN, maxE));
        }
        return cases;
    }

    @Test
    void countTablesAgreeWithEnumerationOnRandomSpectra() {
        for (Case c : randomCases(424242L, 260, false, 5, 9)) {
            Spectrum s = c.spectrum();
            Statistics st = c.statistics();
            CountTable t = CountTable.of(s, st, c.maxN(), c.maxE());
            c.forEachCell((en, n, e, lv) -> {
                Set<List<Integer>> seen = new HashSet<>();
                long count = en.microstates(n, e).peek(v -> {
                    // each microstate really has n particles and energy e, and is distinct
                    List<Integer> key = new ArrayList<>();
                    for (int x : v) {
                        key.add(x);
                    }
                    assertTrue(seen.add(key), "duplicate microstate");
                    assertEquals(n, st.indistinguishable() ? sum(v) : v.length);
                    assertEquals(e, total(l -> (int) s.energy(l), lv, v, st));
                    if (st.indistinguishable()) {
                        for (int x : v) {
                            assertTrue(x >= 0 && x <= st.maxOccupancy());
                        }
                    }
                }).count();
                // Source: independent brute force (depth-first enumeration of occupation vectors / label assignments)
                assertEquals(BigInteger.valueOf(count), t.count(n, e), s + " " + st + " n=" + n + " e=" + e);
            });
        }
    }

    @Test
    void labelledTablesAgreeWithEnumerationOnRandomSpectra() {
        for (Case c : randomCases(99L, 120, true, 4, 7)) {
            Spectrum s = c.spectrum();
            Statistics st = c.statistics();
            LabelledCountTable t = LabelledCountTable.of(s, st, c.maxN(), c.maxE());
            c.forEachCell((en, n, e, lv) -> {
                Map<Integer, Long> byLabel = new HashMap<>();
                en.microstates(n, e).forEach(v -> byLabel.merge(total(s::label, lv, v, st), 1L, Long::sum));
                for (int lab = t.minLabelTotal() - 1; lab <= t.maxLabelTotal() + 1; lab++) {
                    // Source: independent brute force, label total of each enumerated microstate
                    assertEquals(BigInteger.valueOf(byLabel.getOrDefault(lab, 0L)), t.count(n, e, lab),
                            s + " " + st + " n=" + n + " e=" + e + " L=" + lab);
                }
            });
        }
    }

    static int sum(int[] v) {
        int s = 0;
        for (int x : v) {
            s += x;
        }
        return s;
    }

    /**
     * sum over the particles of a microstate of ofLevel(level): occupation vectors (indistinguishable)
     * weight each state's level by its occupation, label assignments (distinguishable) add one per particle.
     */
    static int total(java.util.function.IntUnaryOperator ofLevel, int[] levelOf, int[] v, Statistics st) {
        int m = 0;
        if (st.indistinguishable()) {
            for (int i = 0; i < v.length; i++) {
                m += v[i] * ofLevel.applyAsInt(levelOf[i]);
            }
        } else {
            for (int state : v) {
                m += ofLevel.applyAsInt(levelOf[state]);
            }
        }
        return m;
    }
}
