package org.microtally.bench;

import java.util.concurrent.TimeUnit;
import org.microtally.limit.RelativisticFermiGas;
import org.microtally.special.RelativisticFermiDirac;
import org.microtally.structure.MassRadiusCurve;
import org.microtally.structure.WhiteDwarf;
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
 * Cost of the degenerate-matter equation of state (P, U and S at a given density and temperature,
 * the chemical-potential solve included), of one evaluation of all relativistic Fermi-Dirac
 * integrals, and of a 200-model white-dwarf mass-radius curve, next to a baseline (one
 * {@link Math#exp} and one {@link Math#pow}) measured in the same run. Targets: EOS &lt;= 10 us per
 * call, the curve &lt;= 1 s. Run: {@code java -jar toolkit/bench/target/benchmarks.jar DegenerateMatter}.
 */
@State(Scope.Thread)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.MICROSECONDS)
@Warmup(iterations = 3, time = 1)
@Measurement(iterations = 5, time = 1)
@Fork(1)
public class DegenerateMatterBenchmark {

    /** log10 of (mass density in g/cm^3, temperature in K): degenerate core, partially degenerate, pair plasma. */
    @Param({"6:7", "3:7", "6:9.5"})
    public String state;

    private double rho;
    private double kelvin;
    private double wiggle = 1e-12;

    @org.openjdk.jmh.annotations.Setup
    public void setUp() {
        String[] p = state.split(":");
        rho = Math.pow(10, Double.parseDouble(p[0])) * 1e3;
        kelvin = Math.pow(10, Double.parseDouble(p[1]));
    }

    private double next() {
        wiggle = -wiggle; // defeat constant folding without changing the regime
        return wiggle;
    }

    @Benchmark
    public double baselineExpAndPow() {
        return Math.exp(1.5 + next()) + Math.pow(2.5 + next(), 1.5);
    }

    @Benchmark
    public double equationOfState() {
        RelativisticFermiGas gas = RelativisticFermiGas.electrons(rho * (1 + next()), 2.0, kelvin);
        return gas.pressure() + gas.energyDensity() + gas.entropyDensity();
    }

    @Benchmark
    public double fermiDiracAllOrders() {
        return RelativisticFermiDirac.evaluate(40.0 + next(), 0.3, true).integral(1.5);
    }

    @Benchmark
    @BenchmarkMode(Mode.SingleShotTime)
    @OutputTimeUnit(TimeUnit.MILLISECONDS)
    @Warmup(iterations = 2)
    @Measurement(iterations = 5)
    public MassRadiusCurve whiteDwarfCurve200() {
        return WhiteDwarf.massRadiusCurve(2.0, 1e9 * (1 + next()), 1e14, 200);
    }
}
