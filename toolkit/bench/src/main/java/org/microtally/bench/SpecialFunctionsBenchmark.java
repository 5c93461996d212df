package org.microtally.bench;

import java.util.concurrent.TimeUnit;
import org.microtally.limit.FermiGas;
import org.microtally.special.FermiDirac;
import org.microtally.special.Polylog;
import org.microtally.special.Zeta;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Fork;
import org.openjdk.jmh.annotations.Measurement;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Param;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.Warmup;

/**
 * Cost of one call of each special-function regime, next to a baseline (one {@link Math#exp} and one
 * {@link Math#pow}) measured in the same run, so the README can quote ratios that do not depend on
 * the machine. Run: {@code java -jar toolkit/bench/target/benchmarks.jar SpecialFunctions}.
 */
@State(Scope.Thread)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.NANOSECONDS)
@Warmup(iterations = 3, time = 1)
@Measurement(iterations = 5, time = 1)
@Fork(1)
public class SpecialFunctionsBenchmark {

    /** Fermi-Dirac arguments covering the series, Taylor, quadrature and Sommerfeld regimes. */
    @Param({"-5", "0.5", "10", "100"})
    public double eta;

    private double wiggle = 1e-12;
    private final FermiGas copper = FermiGas.freeElectrons(8.47e28);

    private double next() {
        wiggle = -wiggle; // defeat constant folding without changing the regime
        return wiggle;
    }

    @Benchmark
    public double baselineExpAndPow() {
        return Math.exp(eta + next()) + Math.pow(2.5 + next(), 1.5);
    }

    @Benchmark
    public double fermiDiracHalf() {
        return FermiDirac.integral(0.5, eta + next());
    }

    @Benchmark
    public double zetaThreeHalves() {
        return Zeta.zeta(1.5 + next());
    }

    @Benchmark
    public double boseFunctionNearOne() {
        return Polylog.li(1.5, 0.99 + next());
    }

    @Benchmark
    public double boseFunctionPowerSeries() {
        return Polylog.li(2.5, 0.3 + next());
    }

    @Benchmark
    public double fermiChemicalPotentialSolve() {
        return copper.chemicalPotential(3000.0 * (1 + next())).in(org.microtally.units.EnergyUnit.ELECTRONVOLT);
    }
}
