package org.microtally.bench;

import org.openjdk.jmh.runner.RunnerException;

/**
 * Runs {@link EnsembleBenchmark} and prints the canonical timings as ratios to the bare M x N
 * multiply-add baseline measured in the same run (target: at most 2), and the mu-sweep timings
 * (target: at most 1 s):
 * {@code java -cp toolkit/bench/target/benchmarks.jar org.microtally.bench.EnsembleRatio}.
 */
public final class EnsembleRatio {
    private EnsembleRatio() { }

    public static void main(String[] args) throws RunnerException {
        JmhScores score = JmhScores.run(EnsembleBenchmark.class);
        double base = score.of("baselineMultiplyAdd");
        System.out.printf("baseline M x N multiply-add (M = 102340 states, N = 10000): %.0f ms%n", base);
        for (String k : new String[] {"canonicalFermionsZAndOccupations", "canonicalBosonsZAndOccupations"}) {
            double t = score.of(k);
            System.out.printf("%s: %.0f ms = %.2f x baseline%n", k, t, t / base);
        }
        for (String k : new String[] {"chemicalPotentialMillionStatesHundredTemperatures",
                "chemicalPotentialMillionLevelsHundredTemperatures"}) {
            System.out.printf("%s: %.0f ms%n", k, score.of(k));
        }
    }
}
