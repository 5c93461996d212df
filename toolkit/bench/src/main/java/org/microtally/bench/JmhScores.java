package org.microtally.bench;

import java.util.HashMap;
import java.util.Map;
import org.openjdk.jmh.results.RunResult;
import org.openjdk.jmh.runner.Runner;
import org.openjdk.jmh.runner.RunnerException;
import org.openjdk.jmh.runner.options.Options;
import org.openjdk.jmh.runner.options.OptionsBuilder;

/**
 * The primary scores of one JMH run of one benchmark class (1 fork, 1 warm-up and 3 measurement
 * iterations), by benchmark method name: the one run-and-collect step of the {@code *Ratio} mains that
 * print ratios against a baseline measured in the same run.
 */
final class JmhScores {
    private final Map<String, Double> scores;

    private JmhScores(Map<String, Double> scores) {
        this.scores = scores;
    }

    /** Runs every benchmark method of {@code benchmarkClass} once, 1 fork, 1 + 3 iterations. */
    static JmhScores run(Class<?> benchmarkClass) throws RunnerException {
        Options opt = new OptionsBuilder().include(benchmarkClass.getSimpleName()).forks(1)
                .warmupIterations(1).measurementIterations(3).build();
        Map<String, Double> score = new HashMap<>();
        for (RunResult r : new Runner(opt).run()) {
            String name = r.getParams().getBenchmark();
            score.put(name.substring(name.lastIndexOf('.') + 1), r.getPrimaryResult().getScore());
        }
        return new JmhScores(score);
    }

    /**
     * The score of benchmark method {@code method}, in the benchmark's own time unit; throws when the
     * run produced none (a failed or filtered benchmark), instead of printing NaN as a ratio.
     */
    double of(String method) {
        Double s = scores.get(method);
        if (s == null) {
            throw new IllegalStateException("no score for benchmark method " + method + " in this run (it failed or was"
                    + " filtered out; see the JMH output above); measured: " + scores.keySet());
        }
        return s;
    }
}
