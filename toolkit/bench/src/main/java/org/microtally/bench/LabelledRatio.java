package org.microtally.bench;

import java.util.HashMap;
import java.util.Map;
import org.openjdk.jmh.results.RunResult;
import org.openjdk.jmh.runner.Runner;
import org.openjdk.jmh.runner.RunnerException;
import org.openjdk.jmh.runner.options.Options;
import org.openjdk.jmh.runner.options.OptionsBuilder;

/**
 * Runs {@link LabelledBenchmark} and prints each new ensemble's time as a ratio to the plain
 * canonical run on the same spectrum, measured in the same run:
 * {@code java -cp toolkit/bench/target/benchmarks.jar org.microtally.bench.LabelledRatio}.
 */
public final class LabelledRatio {
    private LabelledRatio() { }

    public static void main(String[] args) throws RunnerException {
        Options opt = new OptionsBuilder().include(LabelledBenchmark.class.getSimpleName()).forks(1)
                .warmupIterations(1).measurementIterations(3).build();
        Map<String, Double> score = new HashMap<>();
        for (RunResult r : new Runner(opt).run()) {
            String name = r.getParams().getBenchmark();
            score.put(name.substring(name.lastIndexOf('.') + 1), r.getPrimaryResult().getScore());
        }
        double dot = score.getOrDefault("dotCanonical", Double.NaN);
        double lab = score.getOrDefault("dotLabelledInField", Double.NaN);
        System.out.printf("dot, 12 electrons: canonical %.1f ms, resolved by L_z in a field %.1f ms = %.1f x%n", dot, lab,
                lab / dot);
        double trap = score.getOrDefault("trapCanonical", Double.NaN);
        double mc = score.getOrDefault("trapMicrocanonicalCondensate", Double.NaN);
        System.out.printf("1D trap, 150 bosons: canonical %.1f ms, exact microcanonical P(N_0) %.1f ms = %.1f x%n", trap,
                mc, mc / trap);
    }
}
