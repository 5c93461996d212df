package org.microtally.bench;

import org.openjdk.jmh.runner.RunnerException;

/**
 * Runs {@link MixtureBenchmark} and prints each two-species time as a ratio to the single-species
 * fermion time measured in the same run (target: at most 2):
 * {@code java -cp toolkit/bench/target/benchmarks.jar org.microtally.bench.MixtureRatio}.
 */
public final class MixtureRatio {
    private MixtureRatio() { }

    public static void main(String[] args) throws RunnerException {
        JmhScores score = JmhScores.run(MixtureBenchmark.class);
        double base = score.of("singleFermions");
        System.out.printf("single species, 10^4 fermions on 102340 states: %.0f ms%n", base);
        for (String k : new String[] {"singleBosons", "mixtureSpinUpDownEqualN", "mixtureTwoFermionNumbers",
                "mixtureBoseFermi"}) {
            double t = score.of(k);
            System.out.printf("%s: %.0f ms = %.2f x single fermions%n", k, t, t / base);
        }
    }
}
