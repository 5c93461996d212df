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
import java.util.stream.Stream;
import org.apache.spark.api.java.JavaRDD;
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
        Tabular back = new SweepResult(spark, spark.read().parquet(pq), twoLevel.size());
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
    void aFailedWriteLeavesNoPartialOutput(@TempDir Path dir) throws IOException {
        // every attempt of the task holding point 7 fails while the job writes its files
        JavaRDD<Row> failing = twoLevel.dataset().toJavaRDD().map(r -> {
            if (r.getLong(0) == 7) {
                throw new IllegalStateException("injected failure while writing point 7");
            }
            return r;
        });
        SweepResult broken = new SweepResult(spark, spark.createDataFrame(failing, Sweep.SCHEMA), twoLevel.size());
        Path out = dir.resolve("broken.parquet");
        assertThrows(Exception.class, () -> broken.writeParquet(out.toString()));
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
                () -> Sweep.requireDriverMemory(1_000_000_000L, 1L << 30, "collect it"));
        // common practice, no source: the refusal states the estimate (10^9 rows x 640 bytes) and the limit
        assertTrue(ex.getMessage().contains("1000000000 rows x 640 bytes"), ex.getMessage());
        assertTrue(ex.getMessage().contains("512 MiB"), ex.getMessage());
        assertThrows(InvalidInputException.class, () -> SweepResult.collect(twoLevel.dataset(), 1000));
        assertEquals(twoLevel.size(), SweepResult.collect(twoLevel.dataset(), Runtime.getRuntime().maxMemory()).size());
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
