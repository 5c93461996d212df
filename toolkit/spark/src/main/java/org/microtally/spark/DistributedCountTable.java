package org.microtally.spark;

import java.math.BigInteger;
import java.util.List;
import java.util.Objects;
import java.util.Optional;
import org.apache.spark.sql.SparkSession;
import org.microtally.InvalidInputException;
import org.microtally.ProgressListener;
import org.microtally.count.CountTable;
import org.microtally.count.PrimePlan;
import org.microtally.spectrum.Spectrum;
import org.microtally.spectrum.Statistics;

/**
 * The exact table Omega(n, e) of {@link CountTable} computed on Spark: the primes of the multi-modular
 * method dealt to one task per worker thread (one task per prime when there are as many threads),
 * Chinese remaindering on the driver. Immutable.
 *
 * <p><b>Method.</b> {@link PrimePlan} fixes the primes from the proven bound on every entry and adds
 * one redundant prime; each Spark task computes the whole table modulo each of its required primes by the
 * same recursion {@link CountTable} uses (the class notes there give the formula and cost), and the driver
 * computes the table modulo the redundant prime by the same code while the tasks run (one prime's working
 * memory is one residue array, which the driver holds for every prime anyway; so the check is computed
 * by another process than the residues it checks and adds no round of tasks); the driver
 * collects the residues and checks every entry against the redundant prime (Garner's mixed-radix
 * digits over all primes, Knuth, TAOCP Vol. 2, Sec. 4.3.2, in long arithmetic: the residues agree
 * exactly when the digit of the redundant prime is zero); the entries themselves are rebuilt by Garner's
 * algorithm row by row when first read, by the same code as {@link CountTable} ({@link PrimePlan#table}). A task that fails is retried by Spark (up to
 * {@code spark.task.maxFailures} attempts, or the {@code local[n,attempts]} form); a task that returns
 * a wrong residue (or a driver whose own residue is wrong) makes the check fail and the table is refused
 * with an {@link IllegalStateException}.
 *
 * <p><b>Accuracy.</b> Exact, entry by entry identical to {@link CountTable#of} (tested by comparing
 * every entry). Cost: the {@link CountTable} work per prime spread over the executors, plus shipping
 * 8 (N+1)(E+1) bytes per prime to the driver, the driver's check, and the reconstruction of the rows read.
 */
public final class DistributedCountTable implements CountGrid {
    /** Redundant primes added to every plan for the consistency check. */
    public static final int REDUNDANT_PRIMES = 1;

    /** The recombined table: rows rebuilt from the residues when first read, exactly as {@link CountTable#of}. */
    private final CountTable table;
    private final int requiredPrimes;
    private final int redundantPrimes;

    private DistributedCountTable(PrimePlan plan, CountTable table) {
        this.table = table;
        this.requiredPrimes = plan.requiredPrimes();
        this.redundantPrimes = plan.redundantPrimes();
    }

    /** As {@link #of(SparkSession, Spectrum, Statistics, int, int, ProgressListener)} without progress. */
    public static DistributedCountTable of(SparkSession spark, Spectrum spectrum, Statistics statistics,
                                           int maxParticles, int maxEnergy) {
        return of(spark, spectrum, statistics, maxParticles, maxEnergy, ProgressListener.NONE);
    }

    /**
     * Computes Omega(n, e) for n &lt;= maxParticles, e &lt;= maxEnergy on {@code spark}, reporting the
     * finished prime tasks (stage {@code "primes"}) through {@code progress}.
     *
     * @throws InvalidInputException as {@link CountTable#of}
     * @throws IllegalStateException when a task's residues fail the redundant-prime check
     * @throws org.apache.spark.SparkException when a task fails more often than Spark allows
     */
    public static DistributedCountTable of(SparkSession spark, Spectrum spectrum, Statistics statistics,
                                           int maxParticles, int maxEnergy, ProgressListener progress) {
        return compute(spark, spectrum, PrimePlan.of(spectrum, statistics, maxParticles, maxEnergy, REDUNDANT_PRIMES),
                progress, TaskFault.NONE);
    }

    static DistributedCountTable compute(SparkSession spark, Spectrum spectrum, PrimePlan plan,
                                         ProgressListener progress, TaskFault fault) {
        long[][] residues = PrimeTasks.run(spark, plan.primeCount(), plan.redundantPrimes(),
                i -> plan.residues(i, ProgressListener.NONE), "primes", progress, fault);
        return new DistributedCountTable(plan, plan.table(spectrum, residues));
    }

    /** Omega(n, e). */
    @Override
    public BigInteger count(int n, int e) {
        return table.count(n, e);
    }

    /**
     * The first entry where this table and {@code local} differ, as a sentence, or empty when they have
     * the same statistics, shape and every entry equal.
     */
    public Optional<String> firstDifference(CountTable local) {
        Objects.requireNonNull(local, "local");
        if (!local.statistics().equals(statistics())) {
            return Optional.of("statistics differ: distributed " + statistics() + ", local " + local.statistics());
        }
        return firstDifference(CountGrid.of(local));
    }

    /** The row Omega(n, 0..E). */
    public List<BigInteger> row(int n) {
        return table.row(n);
    }

    /** Primes whose product the bound proves exceeds every entry (each computed in a Spark task). */
    public int requiredPrimes() {
        return requiredPrimes;
    }

    /** Extra primes (computed on the driver while the tasks ran) that verified the reconstruction. */
    public int redundantPrimes() {
        return redundantPrimes;
    }

    /** N. */
    @Override
    public int maxParticles() {
        return table.maxParticles();
    }

    /** E. */
    @Override
    public int maxEnergy() {
        return table.maxEnergy();
    }

    /** The statistics counted. */
    public Statistics statistics() {
        return table.statistics();
    }

    @Override
    public String toString() {
        return "DistributedCountTable[" + statistics() + ", N = " + maxParticles() + ", E = " + maxEnergy() + ", "
                + requiredPrimes + " + " + redundantPrimes + " primes]";
    }
}
