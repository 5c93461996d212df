package org.microtally.spark;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.microtally.notebook.run.NotebookRunner;

/**
 * Runs notebooks/cluster/08-trap-sweep-cluster.ipynb through the headless runner in this JVM, whose
 * class path holds the Spark module and Spark (what the {@code microtally-spark} kernelspec gives a
 * notebook). The notebook's last cell checks its results against outside values (the local exact
 * table, the brute-force enumeration, OEIS A000041, the Landsberg recursion) and throws on any
 * mismatch, which fails the run and this test.
 */
class Notebook08IT {
    @Test
    void theClusterNotebookRunsAndPassesItsOwnChecks() throws Exception {
        Path repo = Path.of(System.getProperty("microtally.repo", "../..")).toAbsolutePath().normalize();
        Path notebook = repo.resolve("notebooks/cluster/08-trap-sweep-cluster.ipynb");
        assertTrue(Files.isRegularFile(notebook), notebook + " missing");
        Path out = Files.createDirectories(Path.of(System.getProperty("microtally.itdir", "target/it"))
                .resolve("notebook-08"));
        long t0 = System.nanoTime();
        int status = NotebookRunner.main(List.of(notebook.toString(), "--out", out.toString()));
        System.err.printf("notebook 08 ran in %.1f s (status %d)%n", (System.nanoTime() - t0) / 1e9, status);
        assertEquals(0, status, "the headless run of notebook 08 failed; see the cell output above");
        assertTrue(Files.isRegularFile(out.resolve("08-trap-sweep-cluster.ipynb")), "executed notebook written");
    }
}
