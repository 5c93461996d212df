package org.microtally.count;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.math.BigInteger;
import java.util.ArrayList;
import java.util.List;
import org.apache.commons.math3.fraction.BigFraction;
import org.junit.jupiter.api.Test;
import org.microtally.InvalidInputException;
import org.microtally.spectrum.Spectra;
import org.microtally.spectrum.Statistics;
import org.microtally.exact.ExactLog;

/** Halyard Bay demo: oscillator blocks A (300) and B (200) sharing 100 quanta. */
class SharedTotalTest {

    @Test
    void oscillatorBlocksSharingQuanta() {
        int q = 100;
        CountTable a = CountTable.of(Spectra.harmonicOscillator(1, q), Statistics.DISTINGUISHABLE, 300, q);
        CountTable b = CountTable.of(Spectra.harmonicOscillator(1, q), Statistics.DISTINGUISHABLE, 200, q);
        SharedTotal st = SharedTotal.of(a, 300, b, 200, q);
        for (int qa = 0; qa <= q; qa++) {
            // Source: Einstein-solid closed form C(q + N - 1, q) for each block (Schroeder, Sec. 2.2)
            BigInteger expect = CountTableTest.binomial(qa + 299, qa).multiply(CountTableTest.binomial(q - qa + 199, q - qa));
            assertEquals(expect, st.jointCount(qa));
        }
        // Source: Vandermonde identity: sum_qA C(qA+299, qA) C(q-qA+199, q-qA) = C(q + 499, q)
        assertEquals(CountTableTest.binomial(q + 499, q), st.totalCount());
        assertEquals(60, st.mostProbableSplit()); // brute-force argmax checked below
        int arg = 0;
        for (int qa = 0; qa <= q; qa++) {
            if (st.jointCount(qa).compareTo(st.jointCount(arg)) > 0) {
                arg = qa;
            }
        }
        assertEquals(arg, st.mostProbableSplit());
        // Source: the split is beta-binomial(n = q, alpha = N_A, beta = N_B): mean q N_A/(N_A+N_B) = 60, variance
        // q N_A N_B (N_A+N_B+q) / ((N_A+N_B)^2 (N_A+N_B+1)) (standard beta-binomial moments, from memory)
        double na = 300;
        double nb = 200;
        assertEquals(60.0, st.mean(), 1e-12);
        double var = q * na * nb * (na + nb + q) / ((na + nb) * (na + nb) * (na + nb + 1));
        assertEquals(Math.sqrt(var), st.width(), 1e-12 * Math.sqrt(var));
        // Source: closed form: ln(Omega_A Omega_B) = ln Omega_A + ln Omega_B
        assertEquals(st.entropyA(60) + st.entropyB(60), st.entropy(60), 1e-9);
        // Source: Vandermonde identity, total C(q + 499, q) = C(599, 100) as above
        assertEquals(ExactLog.ln(CountTableTest.binomial(599, 100)), st.totalEntropy(), 1e-12 * st.totalEntropy());
        BigFraction sum = BigFraction.ZERO;
        for (int qa = 0; qa <= q; qa++) {
            sum = sum.add(st.probability(qa));
        }
        // Source: normalisation, closed form
        assertEquals(BigFraction.ONE, sum);
        // common practice, no source: one row per split q_A = 0..100
        assertEquals(101, st.rows().size());
    }

    @Test
    void sequencesWorkAndBadInputIsRefused() {
        List<BigInteger> ones = new ArrayList<>();
        for (int i = 0; i <= 4; i++) {
            ones.add(BigInteger.ONE);
        }
        SharedTotal st = SharedTotal.of(ones, ones, 4);
        // Source: uniform split distribution on 0..4 (common practice, no source): mean 2, variance 2
        assertEquals(2.0, st.mean(), 1e-15);
        assertEquals(Math.sqrt(2.0), st.width(), 1e-15);
        assertEquals(0, st.mostProbableSplit()); // all tie: the smallest is returned
        assertThrows(InvalidInputException.class, () -> SharedTotal.of(ones, ones, 5));
        assertThrows(InvalidInputException.class, () -> SharedTotal.of(ones, ones, -1));
        assertTrue(assertThrows(InvalidInputException.class, () -> st.jointCount(7)).getMessage().contains("7"));
    }
}
