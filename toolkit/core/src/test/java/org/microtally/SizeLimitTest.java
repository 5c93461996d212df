package org.microtally;

import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.function.Executable;
import org.microtally.count.CountTable;
import org.microtally.count.LabelledCountTable;
import org.microtally.ensemble.Microcanonical;
import org.microtally.spectrum.Spectra;
import org.microtally.spectrum.Statistics;

/**
 * Sizes near Integer.MAX_VALUE are refused before anything is allocated, with the estimated memory
 * and a remedy in the message (never a NegativeArraySizeException or a bare index error).
 */
class SizeLimitTest {
    private static final int MAX = Integer.MAX_VALUE;

    private static void refusedWithEstimate(Executable call, String value) {
        InvalidInputException e = assertThrows(InvalidInputException.class, call);
        String m = e.getMessage();
        // Source: common practice, no source (the message names the value, the estimate and the remedy)
        assertTrue(m.contains(value), m);
        assertTrue(m.contains("MiB"), m);
        assertTrue(m.contains("-Xmx") || m.contains("Lower"), m);
        assertTrue(!m.contains("-2147483648"), m);
    }

    @Test
    void everyProbeOfTheIssueIsAClearRefusal() {
        refusedWithEstimate(() -> CountTable.of(Spectra.harmonicOscillator(1, 50), Statistics.BOSE, MAX, 10),
                "2147483648 x 11");
        refusedWithEstimate(() -> CountTable.of(Spectra.harmonicOscillator(1, 50), Statistics.BOSE, 5, MAX),
                "6 x 2147483648");
        refusedWithEstimate(() -> Microcanonical.of(Spectra.twoLevel(1), Statistics.DISTINGUISHABLE, MAX, 16),
                "2147483648 x 17");
        refusedWithEstimate(() -> Spectra.harmonicOscillator(3, MAX), "= 2147483647");
        refusedWithEstimate(() -> Spectra.particleInBox(3, MAX), "= 2147483647");
        refusedWithEstimate(() -> Spectra.oscillator2dByAngularMomentum(MAX), "= 2147483647");
        refusedWithEstimate(() -> Spectra.equallySpaced(MAX, 1.0), "= 2147483647");
        refusedWithEstimate(() -> LabelledCountTable.of(Spectra.oscillator2dByAngularMomentum(14), Statistics.FERMI,
                6, MAX), "7 x 2147483648");
    }

    @Test
    void sizesThatFitStillWork() {
        for (Executable ok : List.<Executable>of(() -> Spectra.particleInBox(3, 50_000),
                () -> Spectra.harmonicOscillator(1, 1_000_000))) {
            try {
                ok.execute();
            } catch (Throwable t) {
                throw new AssertionError(t);
            }
        }
        // Source: OEIS A000041 (partitions): p(10) = 42 ways to put 10 quanta into 1D oscillators, N >= 10
        assertTrue(CountTable.of(Spectra.harmonicOscillator(1, 10), Statistics.BOSE, 10, 10).count(10, 10)
                .intValueExact() == 42);
    }
}
