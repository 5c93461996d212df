package org.microtally.spark;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assertions.fail;

import java.io.File;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.HashSet;
import java.util.List;
import java.util.Set;
import java.util.concurrent.TimeUnit;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;

/**
 * A killed executor in {@code local-cluster} mode does not corrupt the Parquet output of a sweep.
 *
 * <p>{@code local-cluster[2,1,1024]} starts a master and two workers inside the driver JVM; each worker
 * launches its executor as a separate JVM whose class path Spark's launcher builds from
 * {@code SPARK_HOME/jars} (without a Spark distribution it fails with "Cannot find any build
 * directories", which is what happens with no SPARK_HOME). This test builds a minimal SPARK_HOME under
 * target/it (a {@code jars/} folder of links to the jars of this test's class path, the toolkit's
 * classes given to the executors with {@code spark.executor.extraClassPath}), runs
 * {@link LocalClusterFaultDriver} in a child JVM with it, and asserts the driver's verdict: an executor
 * killed in the middle of its write task, the task rerun, the committed output complete, each point
 * once, equal to the driver's own evaluation, no temporary files left (Spark's file output commit:
 * task files are moved into place only when the job commits). About 1-2 minutes on two busy cores.
 */
class LocalClusterFaultIT {
    @Test
    void aKilledExecutorDoesNotCorruptTheCommittedParquetOutput() throws Exception {
        Path repo = Path.of(System.getProperty("microtally.repo", "../..")).toAbsolutePath().normalize();
        Path dir = Path.of(System.getProperty("microtally.itdir", "target/it")).toAbsolutePath().resolve("local-cluster");
        deleteTree(dir);
        Path home = Files.createDirectories(dir.resolve("spark-home"));
        Path jars = Files.createDirectories(home.resolve("jars"));
        List<String> classDirs = new ArrayList<>();
        Set<String> names = new HashSet<>();
        for (String entry : System.getProperty("java.class.path").split(File.pathSeparator)) {
            Path p = Path.of(entry).toAbsolutePath();
            if (Files.isDirectory(p)) {
                classDirs.add(p.toString());
            } else if (Files.isRegularFile(p) && p.toString().endsWith(".jar") && names.add(p.getFileName().toString())) {
                Files.createSymbolicLink(jars.resolve(p.getFileName()), p);
            }
        }
        Path out = dir.resolve("sweep.parquet");
        Path log = dir.resolve("driver.log");
        String java = ProcessHandle.current().info().command().orElse("java");
        List<String> cmd = new ArrayList<>(List.of(java, "@" + repo.resolve("toolkit/spark/jvm.options"), "-Xmx1g",
                "-XX:+UseSerialGC", "-Dspark.executor.extraClassPath=" + String.join(File.pathSeparator, classDirs),
                "-Dspark.executor.memory=1g",
                "-Dlog4j2.configurationFile=classpath:org/microtally/spark/log4j2-quiet.properties",
                "-cp", System.getProperty("java.class.path"), LocalClusterFaultDriver.class.getName(), out.toString()));
        ProcessBuilder pb = new ProcessBuilder(cmd).directory(dir.toFile()).redirectErrorStream(true)
                .redirectOutput(log.toFile());
        pb.environment().put("SPARK_HOME", home.toString());
        pb.environment().put("SPARK_SCALA_VERSION", "2.13");
        pb.environment().put("SPARK_LOCAL_IP", "127.0.0.1");
        long t0 = System.nanoTime();
        Process driver = pb.start();
        if (!driver.waitFor(600, TimeUnit.SECONDS)) {
            driver.descendants().forEach(ProcessHandle::destroyForcibly);
            driver.destroyForcibly();
            fail("the local-cluster driver did not finish within 600 s; see " + log);
        }
        String text = Files.readString(log);
        System.err.printf("local-cluster fault run: %.1f s, exit %d%n", (System.nanoTime() - t0) / 1e9, driver.exitValue());
        // common practice, no source: Spark reruns a task lost with its executor; the committed output is whole
        assertEquals(0, driver.exitValue(), () -> "the local-cluster driver failed; its log " + log + ":\n" + tail(text));
        assertTrue(text.contains("local-cluster fault check passed"), () -> tail(text));
    }

    private static String tail(String text) {
        return text.length() <= 6000 ? text : text.substring(text.length() - 6000);
    }

    private static void deleteTree(Path dir) throws IOException {
        if (!Files.exists(dir)) {
            return;
        }
        try (Stream<Path> all = Files.walk(dir)) {
            for (Path p : all.sorted(Comparator.reverseOrder()).toList()) {
                Files.delete(p);
            }
        }
    }
}
