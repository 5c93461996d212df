package org.microtally.spark;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.math.BigInteger;
import java.util.Optional;
import org.apache.spark.sql.SparkSession;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.microtally.InvalidInputException;
import org.microtally.ProgressListener;
import org.microtally.spectrum.Spectra;
import org.microtally.spectrum.Spectrum;
import org.microtally.spectrum.Statistics;

class PrefixEnumerationTest {
    private static SparkSession spark;

    @BeforeAll
    static void start() {
        spark = SharedSpark.get();
    }

    @Test
    void enumerationAgreesWithTheDistributedExactTableForEveryStatistics() {
        Spectrum s = Spectra.harmonicOscillator(2, 12);
        for (Statistics st : new Statistics[] {Statistics.BOSE, Statistics.FERMI, Statistics.maxOccupancy(2)}) {
            PrefixEnumeration brute = PrefixEnumeration.of(spark, s, st, 6, 12);
            DistributedCountTable exact = DistributedCountTable.of(spark, s, st, 6, 12);
            // Source: independent brute force (depth-first walk over occupation vectors) vs the distributed
            // generating-function table, every entry compared
            Optional<String> diff = brute.firstDifference(exact);
            assertTrue(diff.isEmpty(), () -> st + ": " + diff.get());
            assertTrue(brute.prefixCount() >= 2, "the walk was split: " + brute);
        }
    }

    @Test
    void bosonsOnALadderGivePartitionNumbers() {
        PrefixEnumeration brute = PrefixEnumeration.of(spark, Spectra.harmonicOscillator(1, 30), Statistics.BOSE,
                30, 30);
        // Source: OEIS A000041, p(30) = 5604, p(20) = 627 (partitions of e into at most n >= e parts)
        assertEquals(BigInteger.valueOf(5604), brute.count(30, 30));
        assertEquals(BigInteger.valueOf(627), brute.count(30, 20));
        // Source: OEIS A008284 row 10, partitions of 10 into exactly 3 parts = 8; into at most 3 parts
        // 1 + 5 + 8 = 14 (a non-degenerate ladder with a level at 0 counts partitions into at most n parts)
        assertEquals(BigInteger.valueOf(14), brute.count(3, 10));
    }

    @Test
    void refusesLabelledParticlesAndRunsBeyondTheCap() {
        Spectrum s = Spectra.harmonicOscillator(3, 20);
        assertThrows(InvalidInputException.class, () -> PrefixEnumeration.of(spark, s, Statistics.DISTINGUISHABLE, 3, 5));
        InvalidInputException ex = assertThrows(InvalidInputException.class,
                () -> PrefixEnumeration.of(spark, s, Statistics.BOSE, 10, 20, 1000, ProgressListener.NONE));
        assertTrue(ex.getMessage().contains("cap 1000"), ex.getMessage());
    }
}
