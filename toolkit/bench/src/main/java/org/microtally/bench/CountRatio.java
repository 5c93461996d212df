package org.microtally.bench;

import java.util.Collection;
import java.util.HashMap;
import java.util.Map;
import org.openjdk.jmh.results.RunResult;
import org.openjdk.jmh.runner.Runner;
import org.openjdk.jmh.runner.RunnerException;
import org.openjdk.jmh.runner.options.Options;
import org.openjdk.jmh.runner.options.OptionsBuilder;

/**
 * Runs {@link CountBenchmark} and prints, per statistics, the speed-up of the grouped update over the
 * per-state baseline measured in the same run:
 * {@code java -cp toolkit/bench/target/benchmarks.jar org.microtally.bench.CountRatio}.
 */
public final class CountRatio {
    private CountRatio() { }

    public static void main(String[] args) throws RunnerException {
        Options opt = new OptionsBuilder().include(CountBenchmark.class.getSimpleName()).forks(1)
                .warmupIterations(1).measurementIterations(3).build();
        Collection<RunResult> results = new Runner(opt).run();
        Map<String, Double> score = new HashMap<>();
        Map<String, Double> error = new HashMap<>();
        for (RunResult r : results) {
            String name = r.getParams().getBenchmark();
            String key = name.substring(name.lastIndexOf('.') + 1) + "/" + r.getParams().getParam("statistics");
            score.put(key, r.getPrimaryResult().getScore());
            error.put(key, r.getPrimaryResult().getScoreError());
        }
        for (String st : new String[] {"BOSE", "FERMI"}) {
            Double slow = score.get("perStateSmall/" + st);
            Double fast = score.get("groupedSmall/" + st);
            Double full = score.get("fullTable/" + st);
            if (full != null) {
                System.out.printf("%s N=100 E=600 full table: %.1f +- %.1f ms%n", st, full, error.get("fullTable/" + st));
            }
            if (slow != null && fast != null) {
                System.out.printf("%s N=%d E=%d: per-state %.1f ms, grouped %.2f ms, speed-up %.0fx%n", st,
                        CountBenchmark.SMALL_N, CountBenchmark.SMALL_E, slow, fast, slow / fast);
            }
        }
    }
}
