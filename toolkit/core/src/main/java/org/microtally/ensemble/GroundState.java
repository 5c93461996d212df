package org.microtally.ensemble;

import java.math.BigInteger;
import java.util.List;
import org.microtally.Tabular;
import org.microtally.exact.ExactLog;
import org.microtally.occupation.LevelOccupations;
import org.microtally.exact.Combinatorics;

/**
 * The T -&gt; 0 limit of the canonical ensemble: lowest N-particle energy, its exact number of
 * microstates (so S(T -&gt; 0)/k = ln degeneracy) and the limiting occupations. Built by
 * {@link Canonical#groundState}.
 *
 * <p><b>How the degeneracy is obtained</b> (exact, BigInteger, by direct counting of the lowest
 * configuration; closed forms are common practice, no source). With g_0 the degeneracy of the
 * lowest energy shell:
 * <ul>
 *   <li>Bose: all N particles in the lowest level, C(g_0 + N - 1, N) ways (multisets of size N from
 *       g_0 states, {@link org.microtally.exact.Combinatorics#binomial}); energy N e_0.</li>
 *   <li>distinguishable: every labelled particle in one of the g_0 lowest states, g_0^N ways.</li>
 *   <li>Fermi and maxOccupancy(k): levels are filled from the bottom, k per state; the last,
 *       partly filled level of degeneracy g holding r particles gives the number of ways to put r
 *       indistinguishable particles into g states with at most k each, counted exactly by a small
 *       dynamic programme over the states (for k = 1 this is C(g, r)). Completely filled levels
 *       contribute one way.</li>
 * </ul>
 * The occupations give each state of a partly filled level the same share, the limit of the
 * canonical occupations by symmetry.
 *
 * <p><b>Energy shells.</b> "Level" above means all levels of the spectrum at one energy: a
 * labelled spectrum holds one level per label at an energy (e.g. the 2D oscillator resolved by m),
 * and their degeneracies are added before counting, so g_0 and g are shell degeneracies.
 *
 * <p><b>Accuracy.</b> {@code degeneracy} is exact. {@code energy} is N e_0, or the sum of (particles
 * put in level i) e_i, formed in double: exact when the level energies are integers and every
 * partial result stays below 2^53, otherwise rounded once per operation.
 * {@link #entropy()} is ln of the exact degeneracy by {@link ExactLog#ln}: within 2 ulp of the true
 * ln for integers of any size (no overflow for degeneracies beyond 10^308).
 *
 * @param energy      lowest total energy
 * @param degeneracy  exact number of N-particle microstates at that energy
 * @param occupations mean occupation of every level in the limit
 */
public record GroundState(double energy, BigInteger degeneracy, LevelOccupations occupations) implements Tabular {
    /** S/k = ln(degeneracy), the T -&gt; 0 entropy, by {@link ExactLog#ln} (within 2 ulp). */
    public double entropy() {
        return ExactLog.ln(degeneracy);
    }

    /** E.g. {@code "GroundState[E = 19.0, 3 microstates (exact), S/k = 1.0986, 12 particles on 5 of 13 levels]"}. */
    @Override
    public String toString() {
        int occupied = 0;
        for (int i = 0; i < occupations.size(); i++) {
            if (occupations.perState(i) > 0) {
                occupied++;
            }
        }
        return "GroundState[E = " + energy + ", " + degeneracy + " microstates (exact), S/k = " + entropy() + ", "
                + occupations.total() + " particles on " + occupied + " of " + occupations.size() + " levels]";
    }

    @Override
    public List<String> columnNames() {
        return List.of("quantity", "value");
    }

    @Override
    public List<List<Object>> rows() {
        return List.of(List.of("ground energy", energy), List.of("degeneracy", degeneracy),
                List.of("S/k = ln degeneracy", entropy()));
    }
}
