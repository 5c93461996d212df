package org.microtally.bench;

import java.util.HashMap;
import java.util.Map;
import org.openjdk.jmh.results.RunResult;
import org.openjdk.jmh.runner.Runner;
import org.openjdk.jmh.runner.RunnerException;
import org.openjdk.jmh.runner.options.Options;
import org.openjdk.jmh.runner.options.OptionsBuilder;

/**
 * Runs {@link EnsembleBenchmark} and prints the canonical timings as ratios to the bare M x N
 * multiply-add baseline measured in the same run (target: at most 2), and the mu-sweep timings
 * (target: at most 1 s):
 * {@code java -cp toolkit/bench/target/benchmarks.jar org.microtally.bench.EnsembleRatio}.
 */
public final class EnsembleRatio {
    private EnsembleRatio() { }

    public static void main(String[] args) throws RunnerException {
        Options opt = new OptionsBuilder().include(EnsembleBenchmark.class.getSimpleName()).forks(1)
                .warmupIterations(1).measurementIterations(3).build();
        Map<String, Double> score = new HashMap<>();
        for (RunResult r : new Runner(opt).run()) {
            String name = r.getParams().getBenchmark();
            score.put(name.substring(name.lastIndexOf('.') + 1), r.getPrimaryResult().getScore());
        }
        double base = score.getOrDefault("baselineMultiplyAdd", Double.NaN);
        System.out.printf("baseline M x N multiply-add (M = 102340 states, N = 10000): %.0f ms%n", base);
        for (String k : new String[] {"canonicalFermionsZAndOccupations", "canonicalBosonsZAndOccupations"}) {
            double t = score.getOrDefault(k, Double.NaN);
            System.out.printf("%s: %.0f ms = %.2f x baseline%n", k, t, t / base);
        }
        for (String k : new String[] {"chemicalPotentialMillionStatesHundredTemperatures",
                "chemicalPotentialMillionLevelsHundredTemperatures"}) {
            System.out.printf("%s: %.0f ms%n", k, score.getOrDefault(k, Double.NaN));
        }
    }
}
