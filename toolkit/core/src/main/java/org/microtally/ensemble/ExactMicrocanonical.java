package org.microtally.ensemble;

import java.math.BigInteger;
import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.Objects;
import org.microtally.InvalidInputException;
import org.microtally.Missing;
import org.microtally.Tabular;
import org.microtally.exact.ExactLog;

/**
 * Microcanonical entropies and temperatures of an exact density of states g(E).
 *
 * <h2>Definitions (k = 1)</h2>
 * Boltzmann S_B(E) = ln g(E); Gibbs S_G(E) = ln sum_{E' &lt;= E} g(E') (see Dunkel &amp; Hilbert,
 * Nature Physics 10, 67 (2014) for the distinction). Inverse temperatures by the central difference
 * over the neighbouring occupied energies, beta(E_i) = (S(E_{i+1}) - S(E_{i-1})) / (E_{i+1} - E_{i-1});
 * where an energy between them has g = 0 (e.g. E = -2N + 4 on an Ising torus) this is the secant
 * across the gap. Undefined ({@link Missing}, shown "n/a") at the lowest and highest energy.
 *
 * <p>Accuracy: counts exact; logarithms within 2 ulp; the finite difference is the meaning of a
 * temperature on a discrete spectrum, with O(spacing^2 S''') discretisation error, not a rounding error.
 */
public final class ExactMicrocanonical implements Tabular {
    private final ExactDensityOfStates dos;
    private final long[] energy;
    private final BigInteger[] count;
    private final double[] boltzmann;
    private final double[] gibbs;

    private ExactMicrocanonical(ExactDensityOfStates dos) {
        this.dos = dos.byEnergy();
        int n = this.dos.size();
        energy = new long[n];
        count = new BigInteger[n];
        boltzmann = new double[n];
        gibbs = new double[n];
        BigInteger cumulative = BigInteger.ZERO;
        for (int i = 0; i < n; i++) {
            energy[i] = this.dos.energy(i);
            count[i] = this.dos.multiplicity(i);
            cumulative = cumulative.add(count[i]);
            boltzmann[i] = ExactLog.ln(count[i]);
            gibbs[i] = ExactLog.ln(cumulative);
        }
    }

    /** The microcanonical view of an exact density of states (labels are summed out). */
    public static ExactMicrocanonical of(ExactDensityOfStates dos) {
        return new ExactMicrocanonical(Objects.requireNonNull(dos, "dos"));
    }

    private int index(long e) {
        int i = java.util.Arrays.binarySearch(energy, e);
        if (i < 0) {
            throw InvalidInputException.of("E", e, "an energy with g(E) > 0", "Use one of distinctEnergies().");
        }
        return i;
    }

    /** S_B(E) = ln g(E). */
    public double boltzmannEntropy(long e) {
        return boltzmann[index(e)];
    }

    /** S_G(E) = ln (number of states with energy at most E). */
    public double gibbsEntropy(long e) {
        return gibbs[index(e)];
    }

    /** True when E has occupied neighbours on both sides (so beta(E) is defined). */
    public boolean hasTemperature(long e) {
        int i = index(e);
        return i > 0 && i < energy.length - 1;
    }

    /** Boltzmann beta(E) by the central difference of S_B. */
    public double boltzmannBeta(long e) {
        return difference(boltzmann, e);
    }

    /** Gibbs beta(E) by the central difference of S_G. */
    public double gibbsBeta(long e) {
        return difference(gibbs, e);
    }

    private double difference(double[] s, long e) {
        if (!hasTemperature(e)) {
            throw InvalidInputException.of("E", e, "strictly between the lowest and highest occupied energy",
                    "A central difference needs a neighbour on each side.");
        }
        int i = index(e);
        return (s[i + 1] - s[i - 1]) / (energy[i + 1] - energy[i - 1]);
    }

    @Override
    public List<String> columnNames() {
        String u = dos.scale().name();
        return List.of("E [" + u + "]", "g", "S_B [k]", "S_G [k]", "beta_B [1/" + u + "]", "beta_G [1/" + u + "]");
    }

    private static final Missing AT_EDGE = Missing.because(
            "a temperature needs energy levels on both sides: undefined at the lowest and highest energy");

    @Override
    public List<List<Object>> rows() {
        List<List<Object>> rows = new ArrayList<>();
        for (int i = 0; i < energy.length; i++) {
            boolean t = i > 0 && i < energy.length - 1;
            rows.add(List.of(energy[i], count[i], boltzmann[i], gibbs[i],
                    t ? (Object) boltzmannBeta(energy[i]) : AT_EDGE, t ? (Object) gibbsBeta(energy[i]) : AT_EDGE));
        }
        return Collections.unmodifiableList(rows);
    }
}
