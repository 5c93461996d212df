package org.microtally.bench;

import java.util.HashMap;
import java.util.Map;
import org.openjdk.jmh.results.RunResult;
import org.openjdk.jmh.runner.Runner;
import org.openjdk.jmh.runner.RunnerException;
import org.openjdk.jmh.runner.options.Options;
import org.openjdk.jmh.runner.options.OptionsBuilder;

/**
 * Runs {@link SweepBenchmark} and prints each sweep's time as a ratio to the separate canonical runs
 * measured in the same run:
 * {@code java -cp toolkit/bench/target/benchmarks.jar org.microtally.bench.SweepRatio}.
 */
public final class SweepRatio {
    private SweepRatio() { }

    public static void main(String[] args) throws RunnerException {
        Options opt = new OptionsBuilder().include(SweepBenchmark.class.getSimpleName()).forks(1)
                .warmupIterations(1).measurementIterations(3).build();
        Map<String, Double> score = new HashMap<>();
        for (RunResult r : new Runner(opt).run()) {
            String name = r.getParams().getBenchmark();
            score.put(name.substring(name.lastIndexOf('.') + 1), r.getPrimaryResult().getScore());
        }
        double dotRuns = score.getOrDefault("dotSeparateRuns", Double.NaN);
        double dot = score.getOrDefault("dotSweep", Double.NaN);
        System.out.printf("dot, n = 1..42: 42 canonical runs %.0f ms, sweep %.0f ms = %.3f x%n", dotRuns, dot, dot / dotRuns);
        double trapRuns = score.getOrDefault("trapSeparateRunsEveryTenth", Double.NaN);
        double trap = score.getOrDefault("trapSweepEveryN", Double.NaN);
        System.out.printf("trap, 1000 bosons: 100 canonical runs (every 10th n) %.0f ms, sweep of every n %.0f ms = %.3f x%n",
                trapRuns, trap, trap / trapRuns);
    }
}
