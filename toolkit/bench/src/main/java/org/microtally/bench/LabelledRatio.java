package org.microtally.bench;

import org.openjdk.jmh.runner.RunnerException;

/**
 * Runs {@link LabelledBenchmark} and prints each new ensemble's time as a ratio to the plain
 * canonical run on the same spectrum, measured in the same run:
 * {@code java -cp toolkit/bench/target/benchmarks.jar org.microtally.bench.LabelledRatio}.
 */
public final class LabelledRatio {
    private LabelledRatio() { }

    public static void main(String[] args) throws RunnerException {
        JmhScores score = JmhScores.run(LabelledBenchmark.class);
        double dot = score.of("dotCanonical");
        double lab = score.of("dotLabelledInField");
        System.out.printf("dot, 12 electrons: canonical %.1f ms, resolved by L_z in a field %.1f ms = %.1f x%n", dot, lab,
                lab / dot);
        double trap = score.of("trapCanonical");
        double mc = score.of("trapMicrocanonicalCondensate");
        System.out.printf("1D trap, 150 bosons: canonical %.1f ms, exact microcanonical P(N_0) %.1f ms = %.1f x%n", trap,
                mc, mc / trap);
    }
}
