package org.microtally.bench;

import java.util.HashMap;
import java.util.Map;
import org.openjdk.jmh.results.RunResult;
import org.openjdk.jmh.runner.Runner;
import org.openjdk.jmh.runner.RunnerException;
import org.openjdk.jmh.runner.options.Options;
import org.openjdk.jmh.runner.options.OptionsBuilder;

/**
 * Runs {@link MixtureBenchmark} and prints each two-species time as a ratio to the single-species
 * fermion time measured in the same run (target: at most 2):
 * {@code java -cp toolkit/bench/target/benchmarks.jar org.microtally.bench.MixtureRatio}.
 */
public final class MixtureRatio {
    private MixtureRatio() { }

    public static void main(String[] args) throws RunnerException {
        Options opt = new OptionsBuilder().include(MixtureBenchmark.class.getSimpleName()).forks(1)
                .warmupIterations(1).measurementIterations(3).build();
        Map<String, Double> score = new HashMap<>();
        for (RunResult r : new Runner(opt).run()) {
            String name = r.getParams().getBenchmark();
            score.put(name.substring(name.lastIndexOf('.') + 1), r.getPrimaryResult().getScore());
        }
        double base = score.getOrDefault("singleFermions", Double.NaN);
        System.out.printf("single species, 10^4 fermions on 102340 states: %.0f ms%n", base);
        for (String k : new String[] {"singleBosons", "mixtureSpinUpDownEqualN", "mixtureTwoFermionNumbers",
                "mixtureBoseFermi"}) {
            double t = score.getOrDefault(k, Double.NaN);
            System.out.printf("%s: %.0f ms = %.2f x single fermions%n", k, t, t / base);
        }
    }
}
