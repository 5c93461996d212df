package org.microtally.count;

import java.math.BigInteger;
import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import org.microtally.Inputs;
import org.microtally.InvalidInputException;

/**
 * Multiplicity sequences of standard blocks in closed form, for {@link SharedTotal#of(List, List, int)}
 * without building a count table: exact BigInteger, each entry from the previous one by one exact
 * multiplication and division (the ratio of consecutive binomial coefficients).
 */
public final class ClosedFormBlocks {
    private ClosedFormBlocks() {
    }

    /**
     * An Einstein solid of N oscillators holding q = 0..maxQuanta quanta: Omega(q) = C(q + N - 1, q)
     * (D. V. Schroeder, <i>An Introduction to Thermal Physics</i> (2000), eq. 2.9).
     *
     * @throws InvalidInputException for N &lt; 1 or maxQuanta &lt; 0
     */
    public static List<BigInteger> einsteinSolid(int oscillators, int maxQuanta) {
        Inputs.atLeast("number of oscillators", oscillators, 1);
        Inputs.atLeast("largest number of quanta", maxQuanta, 0);
        // C(q + N - 1, q) = C(q - 1 + N - 1, q - 1) (q + N - 1) / q
        return binomialRun(maxQuanta, q -> (long) q + oscillators - 1);
    }

    /**
     * N two-state elements (spin-1/2 moments in a field, two-level atoms) with k = 0..N of them
     * excited: Omega(k) = C(N, k) (Schroeder, sect. 2.1); entries beyond N are 0 up to maxExcited.
     *
     * @throws InvalidInputException for N &lt; 1 or maxExcited &lt; 0
     */
    public static List<BigInteger> twoState(int elements, int maxExcited) {
        Inputs.atLeast("number of two-state elements", elements, 1);
        Inputs.atLeast("largest number excited", maxExcited, 0);
        // C(N, k) = C(N, k - 1) (N - k + 1) / k; the factor 0 at k = N + 1 makes every later entry 0
        return binomialRun(maxExcited, k -> elements - k + 1L);
    }

    /**
     * c_0 = 1, c_k = c_{k-1} factor(k) / k for k = 1..max: the multiplicative recurrence of a row of
     * binomial coefficients. Each division is exact because every c_k is a binomial coefficient
     * (or 0 once a factor 0 has occurred), so the entries are exact integers.
     */
    private static List<BigInteger> binomialRun(int max, java.util.function.IntToLongFunction factor) {
        List<BigInteger> out = new ArrayList<>(max + 1);
        BigInteger c = BigInteger.ONE;
        out.add(c);
        for (int k = 1; k <= max; k++) {
            c = c.signum() == 0 ? c : c.multiply(BigInteger.valueOf(factor.applyAsLong(k))).divide(BigInteger.valueOf(k));
            out.add(c);
        }
        return Collections.unmodifiableList(out);
    }
}
