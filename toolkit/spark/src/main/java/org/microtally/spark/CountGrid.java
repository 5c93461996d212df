package org.microtally.spark;

import java.math.BigInteger;
import java.util.Objects;
import java.util.Optional;
import org.microtally.count.CountTable;

/**
 * A read-only view of an exact table Omega(n, e), n &lt;= N, e &lt;= E, whatever computed it, so two
 * tables from different methods can be compared entry by entry.
 */
public interface CountGrid {
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
}
