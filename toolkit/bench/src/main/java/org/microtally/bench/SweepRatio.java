package org.microtally.bench;

import org.openjdk.jmh.runner.RunnerException;

/**
 * Runs {@link SweepBenchmark} and prints each sweep's time as a ratio to the separate canonical runs
 * measured in the same run:
 * {@code java -cp toolkit/bench/target/benchmarks.jar org.microtally.bench.SweepRatio}.
 */
public final class SweepRatio {
    private SweepRatio() { }

    public static void main(String[] args) throws RunnerException {
        JmhScores score = JmhScores.run(SweepBenchmark.class);
        double dotRuns = score.of("dotSeparateRuns");
        double dot = score.of("dotSweep");
        System.out.printf("dot, n = 1..42: 42 canonical runs %.0f ms, sweep %.0f ms = %.3f x%n", dotRuns, dot, dot / dotRuns);
        double trapRuns = score.of("trapSeparateRunsEveryTenth");
        double trap = score.of("trapSweepEveryN");
        System.out.printf("trap, 1000 bosons: 100 canonical runs (every 10th n) %.0f ms, sweep of every n %.0f ms = %.3f x%n",
                trapRuns, trap, trap / trapRuns);
    }
}
