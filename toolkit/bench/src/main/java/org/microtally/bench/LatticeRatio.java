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
 * Runs {@link LatticeRateBenchmark} (and, with the argument {@code all}, {@link LatticeBenchmark}) and
 * prints the transfer matrix's update rate as a fraction of the bare modular-add rate measured in the
 * same run: {@code java -cp toolkit/bench/target/benchmarks.jar org.microtally.bench.LatticeRatio [all]}.
 */
public final class LatticeRatio {
    private LatticeRatio() { }

    public static void main(String[] args) throws RunnerException {
        OptionsBuilder b = new OptionsBuilder();
        b.include(LatticeRateBenchmark.class.getSimpleName());
        if (args.length > 0 && "all".equals(args[0])) {
            b.include(LatticeBenchmark.class.getSimpleName());
        }
        Options opt = b.build();
        Collection<RunResult> results = new Runner(opt).run();
        Map<String, Double> score = new HashMap<>();
        for (RunResult r : results) {
            String name = r.getParams().getBenchmark();
            String key = name.substring(name.lastIndexOf('.') + 1);
            score.put(key, r.getPrimaryResult().getScore());
            System.out.printf("%s: %.3f %s +- %.3f%n", key, r.getPrimaryResult().getScore(), r.getPrimaryResult().getScoreUnit(),
                    r.getPrimaryResult().getScoreError());
        }
        Double tm = score.get("transferMatrix12");
        Double bare = score.get("bareModularAdd");
        if (tm != null && bare != null) {
            double updates = LatticeRateBenchmark.updates();
            System.out.printf("transfer matrix %.3g updates/s, bare modular add %.3g adds/s: %.0f%% of the bare rate%n",
                    updates / (tm / 1e3), updates / (bare / 1e3), 100 * bare / tm);
        }
    }
}
