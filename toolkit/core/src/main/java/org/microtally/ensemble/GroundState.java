package org.microtally.ensemble;

import java.math.BigInteger;
import java.util.List;
import org.microtally.Tabular;
import org.microtally.count.ExactLog;
import org.microtally.occupation.LevelOccupations;

/**
 * The T -&gt; 0 limit of the canonical ensemble: lowest N-particle energy, its exact number of
 * microstates (so S(T -&gt; 0)/k = ln degeneracy) and the limiting occupations.
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
