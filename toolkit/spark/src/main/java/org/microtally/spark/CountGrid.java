package org.microtally.spark;

import java.math.BigInteger;
import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.Objects;
import java.util.Optional;
import org.microtally.Tabular;
import org.microtally.count.CountTable;

/**
 * A read-only view of an exact table Omega(n, e), n &lt;= N, e &lt;= E, whatever computed it, so two
 * tables from different methods can be compared entry by entry; shown as a table with the columns of
 * {@link CountTable} (n, E, Omega).
 */
public interface CountGrid extends Tabular {
    /** N. */
    int maxParticles();

    /** E. */
    int maxEnergy();

    /** Omega(n, e). */
    BigInteger count(int n, int e);

    /** A local {@link CountTable} seen as a grid. */
    static CountGrid of(CountTable table) {
        Objects.requireNonNull(table, "table");
        return new CountGrid() {
            @Override
            public int maxParticles() {
                return table.maxParticles();
            }

            @Override
            public int maxEnergy() {
                return table.maxEnergy();
            }

            @Override
            public BigInteger count(int n, int e) {
                return table.count(n, e);
            }
        };
    }

    /**
     * The first entry (n-major order) where this grid and {@code other} differ, as a sentence, or
     * empty when both have the same N, E and every entry equal.
     */
    default Optional<String> firstDifference(CountGrid other) {
        Objects.requireNonNull(other, "other");
        if (other.maxParticles() != maxParticles() || other.maxEnergy() != maxEnergy()) {
            return Optional.of("shapes differ: N = " + maxParticles() + ", E = " + maxEnergy() + " vs N = "
                    + other.maxParticles() + ", E = " + other.maxEnergy());
        }
        for (int n = 0; n <= maxParticles(); n++) {
            for (int e = 0; e <= maxEnergy(); e++) {
                BigInteger a = count(n, e);
                BigInteger b = other.count(n, e);
                if (!a.equals(b)) {
                    return Optional.of("Omega(" + n + ", " + e + "): " + a + " vs " + b);
                }
            }
        }
        return Optional.empty();
    }

    /** Columns n, E, Omega, as {@link CountTable}. */
    @Override
    default List<String> columnNames() {
        return List.of("n", "E", "Omega");
    }

    /** One row per (n, e), n-major, Omega as an exact BigInteger. */
    @Override
    default List<List<Object>> rows() {
        List<List<Object>> out = new ArrayList<>((maxParticles() + 1) * (maxEnergy() + 1));
        for (int n = 0; n <= maxParticles(); n++) {
            for (int e = 0; e <= maxEnergy(); e++) {
                out.add(List.of(n, e, count(n, e)));
            }
        }
        return Collections.unmodifiableList(out);
    }

    /** Refuses a cell outside 0 &lt;= n &lt;= N, 0 &lt;= e &lt;= E; otherwise returns its row-major index. */
    static int cellIndex(int n, int e, int maxN, int maxE) {
        if (n < 0 || n > maxN) {
            throw org.microtally.InvalidInputException.of("particle number n", n, "in [0, " + maxN + "]",
                    "Build a larger table.");
        }
        if (e < 0 || e > maxE) {
            throw org.microtally.InvalidInputException.of("total energy e", e, "in [0, " + maxE + "]",
                    "Build a larger table.");
        }
        return n * (maxE + 1) + e;
    }
}
