package org.microtally.spark;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.atomic.AtomicInteger;
import java.util.stream.IntStream;
import java.util.stream.Stream;
import org.apache.spark.api.java.JavaRDD;
import org.apache.spark.api.java.JavaSparkContext;
import org.apache.spark.scheduler.SparkListener;
import org.apache.spark.scheduler.SparkListenerJobStart;
import org.apache.spark.sql.Dataset;
import org.apache.spark.sql.Row;
import org.apache.spark.sql.SparkSession;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.microtally.InvalidInputException;
import org.microtally.Tabular;
import org.microtally.spectrum.Statistics;

class SweepTest {
    private static SparkSession spark;
    private static SweepResult twoLevel;
    private static final double[] TEMPERATURES = {0.25, 0.5, 1.0, 2.0, 4.0};
    private static final int[] PARTICLES = {1, 3, 10};

    @BeforeAll
    static void start() {
        spark = SharedSpark.get();
        // two non-degenerate levels 0 and 1, labelled particles and Fermi, both ensembles: 60 points
        twoLevel = Sweep.run(spark, SweepGrid.of(List.of(SpectrumSpec.equallySpaced(2, 1.0)), PARTICLES,
                TEMPERATURES, List.of(Statistics.DISTINGUISHABLE, Statistics.FERMI),
                List.of(Ensemble.CANONICAL, Ensemble.GRAND_CANONICAL)));
    }

    private static int column(Tabular t, String name) {
        return t.columnNames().indexOf(name);
    }

    @Test
    void distinguishableTwoLevelRowsMatchTheSchottkyClosedForm() {
        List<List<Object>> rows = twoLevel.rows();
        assertEquals(PARTICLES.length * TEMPERATURES.length * 4, rows.size());
        int checked = 0;
        for (List<Object> r : rows) {
            if (!"DISTINGUISHABLE".equals(r.get(column(twoLevel, "statistics")))
                    || !"CANONICAL".equals(r.get(column(twoLevel, "ensemble")))) {
                continue;
            }
            int n = (Integer) r.get(column(twoLevel, "N"));
            double kT = (Double) r.get(column(twoLevel, "kT"));
            double x = Math.exp(-1 / kT);
            // Source: closed form for N independent two-level systems (Schottky anomaly, e.g. Kittel & Kroemer,
            // Thermal Physics, ch. 3): ln Z = N ln(1 + x), U = N x/(1 + x), C = N (1/kT)^2 x/(1 + x)^2, x = e^(-1/kT)
            assertEquals(n * Math.log1p(x), (Double) r.get(column(twoLevel, "lnZ")), 1e-12 * n);
            assertEquals(n * x / (1 + x), (Double) r.get(column(twoLevel, "U")), 1e-12 * n);
            assertEquals(n * x / ((1 + x) * (1 + x)) / (kT * kT), (Double) r.get(column(twoLevel, "C")), 1e-10 * n);
            assertNull(r.get(column(twoLevel, "mu")));
            checked++;
        }
        assertEquals(PARTICLES.length * TEMPERATURES.length, checked);
    }

    @Test
    void grandCanonicalFermiGroundOccupationFollowsItsChemicalPotential() {
        Dataset<Row> fermi = twoLevel.sql("SELECT N, kT, mu, n0_mean FROM sweep "
                + "WHERE statistics = 'FERMI' AND ensemble = 'GRAND_CANONICAL' AND N = 1");
        List<Row> rows = fermi.collectAsList();
        assertEquals(TEMPERATURES.length, rows.size());
        for (Row r : rows) {
            double kT = r.getDouble(1);
            double mu = r.getDouble(2);
            // Source: Fermi-Dirac occupation 1/(e^((e - mu)/kT) + 1) of the level at e = 0 (closed form)
            assertEquals(1 / (Math.exp(-mu / kT) + 1), r.getDouble(3), 1e-12);
        }
    }

    @Test
    void canonicalBosonsOnALadderMatchThePartitionGeneratingFunction() {
        int[] particles = {2, 5};
        double[] temps = {0.7, 1.5};
        SweepResult ladder = Sweep.run(spark, SweepGrid.of(List.of(SpectrumSpec.oscillator(new int[] {1}, 400)),
                particles, temps, List.of(Statistics.BOSE), List.of(Ensemble.CANONICAL)));
        for (List<Object> r : ladder.rows()) {
            int n = (Integer) r.get(column(ladder, "N"));
            double kT = (Double) r.get(column(ladder, "kT"));
            // Source: generating function of partitions into at most N parts, prod_{k=1..N} 1/(1 - x^k)
            // (G. E. Andrews, The Theory of Partitions, 1976, eq. 1.2.4 (from memory)), x = e^(-1/kT):
            // Z_N of N bosons on the levels 0, 1, 2, ... (cutoff 400 changes nothing at these kT)
            double lnZ = 0;
            for (int k = 1; k <= n; k++) {
                lnZ -= Math.log1p(-Math.exp(-k / kT));
            }
            assertEquals(lnZ, (Double) r.get(column(ladder, "lnZ")), 1e-12 * Math.max(1, lnZ));
        }
    }

    @Test
    void aPointItsEnsembleRefusesBecomesARowWithTheRefusal() {
        // four fermions do not fit on three single-particle states
        SweepResult r = Sweep.run(spark, SweepGrid.of(List.of(SpectrumSpec.equallySpaced(3, 1.0)), new int[] {2, 4},
                new double[] {1.0}, List.of(Statistics.FERMI), List.of(Ensemble.CANONICAL)));
        List<List<Object>> rows = r.rows();
        // common practice, no source: at most one fermion per state, so 4 fermions on 3 states have no microstate
        assertEquals(2, rows.size());
        assertTrue(rows.get(0).get(column(r, "lnZ")) instanceof Double);
        assertNull(rows.get(1).get(column(r, "lnZ")));
        String w = (String) rows.get(1).get(column(r, "warnings"));
        assertTrue(w.startsWith("refused: "), w);
    }

    @Test
    void parquetAndCsvRoundTripEveryRow(@TempDir Path dir) throws IOException {
        String pq = dir.resolve("sweep.parquet").toString();
        twoLevel.writeParquet(pq);
        assertTrue(Files.exists(dir.resolve("sweep.parquet/_SUCCESS")));
        Tabular back = SweepResult.tabular(spark.read().parquet(pq).orderBy("point"));
        // common practice, no source: a round trip through a file format loses no row and changes no value
        assertEquals(twoLevel.columnNames(), back.columnNames());
        assertEquals(twoLevel.rows(), back.rows());
        String csv = dir.resolve("sweep.csv").toString();
        twoLevel.writeCsv(csv);
        Dataset<Row> csvBack = spark.read().option("header", "true").csv(csv);
        assertEquals(twoLevel.size(), csvBack.count());
        assertEquals(twoLevel.columnNames(), List.of(csvBack.columns()));
        assertThrows(Exception.class, () -> twoLevel.writeParquet(pq), "refuses to overwrite");
    }

    @Test
    void gridWrittenStraightToFilesHoldsTheRowsOfTheHeldSweep(@TempDir Path dir) {
        SweepGrid grid = SweepGrid.of(List.of(SpectrumSpec.equallySpaced(2, 1.0)), PARTICLES, TEMPERATURES,
                List.of(Statistics.DISTINGUISHABLE, Statistics.FERMI), List.of(Ensemble.CANONICAL, Ensemble.GRAND_CANONICAL));
        String pq = dir.resolve("grid.parquet").toString();
        Sweep.writeParquet(spark, grid, pq, org.microtally.ProgressListener.NONE);
        Tabular back = SweepResult.tabular(spark.read().parquet(pq).orderBy("point"));
        // independent route: the same grid evaluated by Sweep.run and held on the driver (rows identical)
        assertEquals(twoLevel.columnNames(), back.columnNames());
        assertEquals(twoLevel.rows(), back.rows());
        String csv = dir.resolve("grid.csv").toString();
        Sweep.writeCsv(spark, grid, csv, org.microtally.ProgressListener.NONE);
        // common practice, no source: one CSV line a grid point, with a header
        assertEquals(twoLevel.size(), spark.read().option("header", "true").csv(csv).count());
    }

    @Test
    void aFailedWriteLeavesNoPartialOutput(@TempDir Path dir) throws IOException {
        // every attempt of the task holding point 7 fails while the job writes its files
        JavaRDD<Row> failing = twoLevel.dataset().toJavaRDD().map(r -> {
            if (r.getLong(0) == 7) {
                throw new IllegalStateException("injected failure while writing point 7");
            }
            return r;
        });
        Dataset<Row> broken = spark.createDataFrame(failing, Sweep.SCHEMA);
        Path out = dir.resolve("broken.parquet");
        assertThrows(Exception.class, () -> SweepResult.writeParquet(broken, out.toString()));
        // Source: Hadoop FileOutputCommitter protocol (task output under _temporary, moved into place only on
        // job commit, _temporary removed on abort): no _SUCCESS marker and no part file is visible
        if (Files.exists(out)) {
            try (Stream<Path> files = Files.walk(out)) {
                List<String> visible = new ArrayList<>();
                files.filter(Files::isRegularFile).map(p -> out.relativize(p).toString())
                        .filter(p -> !p.startsWith("_temporary") && !p.startsWith("."))
                        .forEach(visible::add);
                assertTrue(visible.isEmpty(), visible.toString());
            }
        }
        assertFalse(Files.exists(out.resolve("_SUCCESS")));
    }

    @Test
    void theDriverRefusesResultsBeyondItsMemoryAndSaysHowLarge() {
        InvalidInputException ex = assertThrows(InvalidInputException.class,
                () -> Sweep.requireDriverMemory(1_000_000_000L, 1L << 30));
        // common practice, no source: the refusal states the grid size, the estimate (10^9 rows x 2560 bytes =
        // 2.44e6 MiB), the limit (half of 1 GiB at 2560 bytes a row = 209715 rows, by hand) and the ways out
        String m = ex.getMessage();
        assertTrue(m.contains("1000000000 grid points") && m.contains("2560 bytes") && m.contains("2.44e+06 MiB"), m);
        assertTrue(m.contains("at most 209715 rows"), m);
        assertTrue(m.contains("Sweep.writeParquet") && m.contains("-Xmx") && m.contains("MICROTALLY_HEAP")
                && m.contains("split the grid"), m);
        Sweep.requireDriverMemory(209_715L, 1L << 30);   // exactly at the limit: accepted
        assertThrows(InvalidInputException.class, () -> Sweep.requireDriverMemory(209_716L, 1L << 30));
        assertThrows(InvalidInputException.class, () -> SweepResult.collect(twoLevel.dataset(), 1000));
        assertEquals(twoLevel.size(), SweepResult.collect(twoLevel.dataset(), Runtime.getRuntime().maxMemory()).size());
    }

    @Test
    void aSweepBeyondTheDriversMemoryIsRefusedBeforeAnyJobRuns() throws InterruptedException {
        long limit = Sweep.driverRowLimit(Runtime.getRuntime().maxMemory());
        int side = (int) Math.ceil(Math.sqrt((limit + 1) / 2.0)) + 1;
        double[] temps = IntStream.range(0, side).mapToDouble(i -> 1.0 + i).toArray();
        int[] particles = IntStream.range(1, side + 1).toArray();
        SweepGrid big = SweepGrid.of(List.of(SpectrumSpec.equallySpaced(2, 1.0)), particles, temps,
                List.of(Statistics.BOSE), List.of(Ensemble.CANONICAL, Ensemble.GRAND_CANONICAL));
        assertTrue(big.size() > limit);
        AtomicInteger jobs = new AtomicInteger();
        AtomicInteger markerJobs = new AtomicInteger();
        SparkListener counter = new SparkListener() {
            @Override
            public void onJobStart(SparkListenerJobStart start) {
                String g = start.properties() == null ? null : start.properties().getProperty("spark.jobGroup.id");
                (("refusal-marker").equals(g) ? markerJobs : jobs).incrementAndGet();
            }
        };
        spark.sparkContext().addSparkListener(counter);
        try {
            InvalidInputException ex = assertThrows(InvalidInputException.class, () -> Sweep.run(spark, big));
            assertTrue(ex.getMessage().contains(big.size() + " grid points"), ex.getMessage());
            // a marker job after the refusal: the listener sees job starts in order, so once it has seen the
            // marker it has seen any job the refused run started
            spark.sparkContext().setJobGroup("refusal-marker", "marker", false);
            JavaSparkContext.fromSparkContext(spark.sparkContext()).parallelize(List.of(1), 1).count();
            spark.sparkContext().clearJobGroup();
            long deadline = System.nanoTime() + 30_000_000_000L;
            while (markerJobs.get() == 0 && System.nanoTime() < deadline) {
                Thread.sleep(20);
            }
            assertEquals(1, markerJobs.get());
            // common practice, no source: the refusal comes from the grid size alone, before any Spark job
            assertEquals(0, jobs.get());
        } finally {
            spark.sparkContext().removeSparkListener(counter);
        }
    }

    @Test
    void heldRowsAreIdenticalToPointByPointEvaluationAndToTheDistributedPath() {
        // notebook 08's kind of grid, small: cutoffs that follow kT, two traps, both statistics and ensembles
        SweepGrid grid = SweepGrid.of(List.of(SpectrumSpec.oscillatorFollowingKT(new int[] {4, 4, 1}, 12, 6),
                SpectrumSpec.oscillator(new int[] {3, 3, 1}, 14)), new int[] {2, 5, 9}, new double[] {0.4, 1.1, 2.5, 3.0},
                List.of(Statistics.BOSE, Statistics.FERMI), List.of(Ensemble.CANONICAL, Ensemble.GRAND_CANONICAL));
        SweepResult held = Sweep.run(spark, grid);
        List<Row> distributed = Sweep.distributed(spark, grid).orderBy("point").collectAsList();
        assertEquals(grid.size(), held.size());
        assertEquals(grid.size(), distributed.size());
        List<List<Object>> rows = held.rows();
        for (int i = 0; i < grid.size(); i++) {
            // Source: independent computation, each point evaluated alone on the test thread (its own spectrum
            // build, no task split); every cell bit for bit
            Row alone = Sweep.evaluate(grid.point(i));
            for (int c = 0; c < Sweep.SCHEMA.size(); c++) {
                assertEquals(alone.get(c), rows.get(i).get(c), "point " + i + " column " + Sweep.SCHEMA.fieldNames()[c]);
                assertEquals(alone.get(c), distributed.get(i).get(c), "point " + i + " column " + Sweep.SCHEMA.fieldNames()[c]);
            }
        }
    }

    @Test
    void tasksTakeInterleavedBlocksThatCoverEveryPointOnce() {
        SweepGrid grid = SweepGrid.of(List.of(SpectrumSpec.equallySpaced(3, 1.0)), new int[] {1, 2, 3},
                new double[] {0.5, 1, 2, 4, 8}, List.of(Statistics.BOSE, Statistics.FERMI),
                List.of(Ensemble.CANONICAL, Ensemble.GRAND_CANONICAL));
        // common practice, no source: a partition of the points: each exactly once over the tasks, blocks of the
        // 4 points (2 statistics x 2 ensembles) that share a spectrum build kept together, blocks dealt in turn
        for (int tasks : new int[] {1, 2, 3, 7, 60}) {
            boolean[] seen = new boolean[(int) grid.size()];
            for (int t = 0; t < tasks; t++) {
                java.util.Iterator<Row> it = Sweep.taskRows(grid, t, tasks);
                while (it.hasNext()) {
                    long id = it.next().getLong(0);
                    assertFalse(seen[(int) id], "point " + id + " twice");
                    assertEquals(t, (id / 4) % tasks, "point " + id + " in task " + t + " of " + tasks);
                    seen[(int) id] = true;
                }
            }
            for (int i = 0; i < seen.length; i++) {
                assertTrue(seen[i], "point " + i + " missing with " + tasks + " tasks");
            }
        }
        assertEquals(2, Sweep.taskCount(2000, 2));
        assertEquals(64, Sweep.taskCount(1_000_000, 64));
        assertEquals(128, Sweep.taskCount(10_000_000, 64));   // 78125 points a task, under the 100000 cap
        assertEquals(3, Sweep.taskCount(3, 8));
    }

    @Test
    void theSessionHasOneShufflePartitionPerWorkerThread() {
        // common practice, no source: local[2, 2] has two worker threads
        assertEquals(2, spark.sparkContext().defaultParallelism());
        assertEquals("2", spark.conf().get("spark.sql.shuffle.partitions"));
    }

    @Test
    void gridsRefuseEmptyAxesAndBadTemperatures() {
        // common practice, no source: inputs outside the domain are refused with the value named
        assertThrows(InvalidInputException.class, () -> SweepGrid.of(List.of(), new int[] {1}, new double[] {1},
                List.of(Statistics.BOSE), List.of(Ensemble.CANONICAL)));
        InvalidInputException ex = assertThrows(InvalidInputException.class, () -> SweepGrid.of(
                List.of(SpectrumSpec.equallySpaced(2, 1)), new int[] {1}, new double[] {1, Double.NaN},
                List.of(Statistics.BOSE), List.of(Ensemble.CANONICAL)));
        assertTrue(ex.getMessage().contains("NaN"), ex.getMessage());
    }
}
