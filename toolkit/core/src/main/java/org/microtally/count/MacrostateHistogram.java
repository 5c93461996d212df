package org.microtally.count;

import java.math.BigInteger;
import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.TreeMap;
import org.apache.commons.math3.fraction.BigFraction;
import org.microtally.Inputs;
import org.microtally.InvalidInputException;
import org.microtally.Tabular;

/**
 * The exact multiplicity of every value of an additive macro variable (the total) for k independent
 * units, each with a finite set of integer outcomes carrying multiplicities. Immutable.
 *
 * <p><b>Formula.</b> With unit i having outcome o of multiplicity w_i(o), the multiplicity of total t
 * is W(t) = sum over outcome tuples (o_1, ..., o_k) with o_1 + ... + o_k = t of prod_i w_i(o_i), that is
 * the coefficient of s^t in prod_i P_i(s), P_i(s) = sum_o w_i(o) s^o. The probability of t is
 * W(t) / prod_i P_i(1) (every tuple equally likely, weighted by multiplicity).
 *
 * <p><b>Method.</b> Exact BigInteger convolution of the units' outcome polynomials, one unit at a time
 * (the product rule for ordinary generating functions, H. S. Wilf, generatingfunctionology, 2nd ed.
 * (1994), ch. 1-2, from memory); cost O(k * span * outcomes) multiply-adds, with the span of the total
 * capped at {@link #MAX_SPAN}.
 *
 * <p><b>Accuracy.</b> Exact: multiplicities are BigInteger and probabilities BigFraction; no double
 * is involved.
 */
public final class MacrostateHistogram implements Tabular {
    /** Largest allowed span of the total (max - min + 1). */
    public static final int MAX_SPAN = 10_000_000;

    private final int minTotal;
    private final BigInteger[] multiplicity;
    private final BigInteger all;

    private MacrostateHistogram(int minTotal, BigInteger[] multiplicity) {
        this.minTotal = minTotal;
        this.multiplicity = multiplicity;
        BigInteger s = BigInteger.ZERO;
        for (BigInteger m : multiplicity) {
            s = s.add(m);
        }
        this.all = s;
    }

    /**
     * k identical units, each taking every value of {@code outcomes} once (repeated values add up).
     *
     * @param units    k &gt;= 0 (k = 0 gives the single total 0)
     * @param outcomes at least one integer outcome
     */
    public static MacrostateHistogram ofIdenticalUnits(int units, int... outcomes) {
        Objects.requireNonNull(outcomes, "outcomes");
        long[] ones = new long[outcomes.length];
        java.util.Arrays.fill(ones, 1);
        return ofIdenticalUnits(units, outcomes, ones);
    }

    /** k identical units with outcome {@code outcomes[i]} of multiplicity {@code multiplicities[i]} (&gt;= 1). */
    public static MacrostateHistogram ofIdenticalUnits(int units, int[] outcomes, long[] multiplicities) {
        Inputs.atLeast("number of units", units, 0);
        Map<Integer, BigInteger> one = unit(outcomes, multiplicities);
        List<Map<Integer, BigInteger>> all = new ArrayList<>(Collections.nCopies(units, one));
        return ofUnits(all);
    }

    /** Independent, possibly different, units: each map sends an outcome to its multiplicity (&gt;= 1). */
    public static MacrostateHistogram ofUnits(List<Map<Integer, BigInteger>> units) {
        Objects.requireNonNull(units, "units");
        long lo = 0;
        long hi = 0;
        for (int u = 0; u < units.size(); u++) {
            Map<Integer, BigInteger> m = units.get(u);
            if (m == null || m.isEmpty()) {
                throw InvalidInputException.of("outcomes of unit " + u, m, "at least one outcome", "");
            }
            for (Map.Entry<Integer, BigInteger> e : m.entrySet()) {
                if (e.getValue() == null || e.getValue().signum() <= 0) {
                    throw InvalidInputException.of("multiplicity of outcome " + e.getKey() + " of unit " + u,
                            e.getValue(), "an integer >= 1", "Leave impossible outcomes out.");
                }
            }
            lo += Collections.min(m.keySet());
            hi += Collections.max(m.keySet());
        }
        if (hi - lo + 1 > MAX_SPAN || lo < Integer.MIN_VALUE || hi > Integer.MAX_VALUE) {
            throw InvalidInputException.of("span of the total", "[" + lo + ", " + hi + "]",
                    "at most " + MAX_SPAN + " values within int range", "Use fewer units or a narrower outcome range.");
        }
        BigInteger[] cur = {BigInteger.ONE};
        long curLo = 0;
        for (Map<Integer, BigInteger> m : units) {
            int uLo = Collections.min(m.keySet());
            int uHi = Collections.max(m.keySet());
            BigInteger[] next = new BigInteger[cur.length + (uHi - uLo)];
            java.util.Arrays.fill(next, BigInteger.ZERO);
            for (Map.Entry<Integer, BigInteger> o : m.entrySet()) {
                int shift = o.getKey() - uLo;
                BigInteger w = o.getValue();
                for (int i = 0; i < cur.length; i++) {
                    if (cur[i].signum() != 0) {
                        next[i + shift] = next[i + shift].add(cur[i].multiply(w));
                    }
                }
            }
            cur = next;
            curLo += uLo;
        }
        return new MacrostateHistogram((int) curLo, cur);
    }

    private static Map<Integer, BigInteger> unit(int[] outcomes, long[] multiplicities) {
        Objects.requireNonNull(outcomes, "outcomes");
        Objects.requireNonNull(multiplicities, "multiplicities");
        if (outcomes.length == 0) {
            throw InvalidInputException.of("number of outcomes", 0, ">= 1", "");
        }
        if (outcomes.length != multiplicities.length) {
            throw InvalidInputException.of("number of multiplicities", multiplicities.length,
                    "equal to the number of outcomes (" + outcomes.length + ")", "");
        }
        Map<Integer, BigInteger> m = new TreeMap<>();
        for (int i = 0; i < outcomes.length; i++) {
            Inputs.atLeast("multiplicity of outcome " + outcomes[i], multiplicities[i], 1);
            m.merge(outcomes[i], BigInteger.valueOf(multiplicities[i]), BigInteger::add);
        }
        return m;
    }

    /** Smallest possible total. */
    public int minTotal() {
        return minTotal;
    }

    /** Largest possible total. */
    public int maxTotal() {
        return minTotal + multiplicity.length - 1;
    }

    /** Exact multiplicity of {@code total} (0 outside [minTotal, maxTotal]). */
    public BigInteger multiplicity(int total) {
        long i = (long) total - minTotal;
        return i < 0 || i >= multiplicity.length ? BigInteger.ZERO : multiplicity[(int) i];
    }

    /** Sum of all multiplicities (the number of weighted outcome tuples). */
    public BigInteger totalMultiplicity() {
        return all;
    }

    /** Exact probability of {@code total}. */
    public BigFraction probability(int total) {
        return new BigFraction(multiplicity(total), all);
    }

    /** The totals of largest multiplicity, ascending. */
    public List<Integer> mostProbableTotals() {
        BigInteger best = BigInteger.ZERO;
        List<Integer> out = new ArrayList<>();
        for (int i = 0; i < multiplicity.length; i++) {
            int c = multiplicity[i].compareTo(best);
            if (c > 0) {
                best = multiplicity[i];
                out.clear();
            }
            if (c >= 0) {
                out.add(minTotal + i);
            }
        }
        return Collections.unmodifiableList(out);
    }

    /** Columns total, multiplicity, probability. */
    @Override
    public List<String> columnNames() {
        return List.of("total", "multiplicity", "probability");
    }

    /** One row per total from minTotal to maxTotal, exact values. */
    @Override
    public List<List<Object>> rows() {
        List<List<Object>> out = new ArrayList<>(multiplicity.length);
        for (int i = 0; i < multiplicity.length; i++) {
            out.add(List.of(minTotal + i, multiplicity[i], new BigFraction(multiplicity[i], all)));
        }
        return Collections.unmodifiableList(out);
    }
}
