package org.microtally.kernel;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.google.gson.JsonObject;
import com.google.gson.JsonParser;
import java.io.ByteArrayOutputStream;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.microtally.notebook.session.KernelIdentity;

/** What both front doors, the kernel and the headless runner, record about themselves in a notebook. */
class NotebookMetadataTest {
    private static final String ONE_CELL = "{\"nbformat\": 4, \"nbformat_minor\": 5, \"metadata\": {}, \"cells\": ["
            + "{\"cell_type\": \"code\", \"id\": \"a\", \"metadata\": {}, \"source\": \"int quanta = 100;\\nquanta * 2\","
            + " \"outputs\": [], \"execution_count\": null}]}";

    /** Runs the one-cell notebook through {@code microtally run} and returns the executed notebook. */
    static JsonObject runOneCell(Path dir) throws Exception {
        Path nb = dir.resolve("one.ipynb");
        Files.writeString(nb, ONE_CELL, StandardCharsets.UTF_8);
        ByteArrayOutputStream log = new ByteArrayOutputStream();
        PrintStream err = new PrintStream(log, true, StandardCharsets.UTF_8);
        int rc = Main.run(new String[] {"run", nb.toString(), "--out", dir.resolve("out").toString()}, System.out, err);
        assertEquals(0, rc, log.toString(StandardCharsets.UTF_8));
        return JsonParser.parseString(Files.readString(dir.resolve("out").resolve("one.ipynb"))).getAsJsonObject();
    }

    @Test
    void kernelAndRunnerRecordTheSameLanguageInfo(@TempDir Path dir) throws Exception {
        JsonObject kernelSide = WireCodec.gson().toJsonTree(Requests.kernelInfo(false)).getAsJsonObject()
                .getAsJsonObject("language_info");
        JsonObject runnerSide = runOneCell(dir).getAsJsonObject("metadata").getAsJsonObject("language_info");
        assertEquals(kernelSide, runnerSide);
        // Source: Jupyter messaging protocol 5.3, kernel_info_reply.language_info (name, version, mimetype,
        // file_extension, pygments_lexer, codemirror_mode); values: the JDK's Runtime.version() and its
        // .java / text/x-java-source conventions (KernelIdentity's Javadoc)
        assertEquals("java", kernelSide.get("name").getAsString());
        assertEquals(".java", kernelSide.get("file_extension").getAsString());
        assertEquals("text/x-java-source", kernelSide.get("mimetype").getAsString());
        assertEquals("java", kernelSide.get("pygments_lexer").getAsString());
        assertEquals("java", kernelSide.get("codemirror_mode").getAsString());
        // independent of KernelIdentity: the java.version property has the same feature.interim.update form
        assertEquals(System.getProperty("java.version").replaceAll("[^0-9.].*$", "").replaceAll("(\\.0)+$", ""),
                kernelSide.get("version").getAsString());
        assertTrue(kernelSide.get("version").getAsString().startsWith(Runtime.version().feature() + ""));
    }

    @Test
    void kernelAndRunnerNameTheSameKernelspec(@TempDir Path dir) throws Exception {
        JsonObject runnerSpec = runOneCell(dir).getAsJsonObject("metadata").getAsJsonObject("kernelspec");
        JsonObject installed = JsonParser.parseString(Files.readString(
                KernelSpec.write(dir.resolve("spec"), Path.of("/opt/jdk17/bin/java"), dir.resolve("microtally.jar"))))
                .getAsJsonObject();
        assertEquals(installed.get("display_name"), runnerSpec.get("display_name"));
        assertEquals(installed.get("language"), runnerSpec.get("language"));
        assertEquals("microtally", runnerSpec.get("name").getAsString());
        // Source: our own naming (issue 12): the display name is not "Java NN (...)"
        assertTrue(!runnerSpec.get("display_name").getAsString().startsWith("Java"), runnerSpec.toString());
    }

    @Test
    void bothFrontDoorsRecordTheSameBuildAndRuntime(@TempDir Path dir) throws Exception {
        JsonObject runner = runOneCell(dir).getAsJsonObject("metadata").getAsJsonObject("microtally").getAsJsonObject("provenance");
        JsonObject kernel = WireCodec.gson().toJsonTree(Requests.KERNEL_INFO_METADATA).getAsJsonObject()
                .getAsJsonObject("microtally").getAsJsonObject("provenance");
        for (String key : List.of("toolkit_version", "commit", "build_record", "java_version", "java_runtime", "platform")) {
            assertEquals(kernel.get(key), runner.get(key), key);
        }
        assertEquals("microtally run", runner.get("executed_by").getAsString());
        assertEquals("microtally kernel", kernel.get("executed_by").getAsString());
        assertEquals("found", runner.get("build_record").getAsString(), runner.toString());
        // Source: the project's pom (project.version) and git itself: the recorded commit names the checked-out HEAD
        assertEquals("0.1.0-SNAPSHOT", runner.get("toolkit_version").getAsString());
        Process git = new ProcessBuilder("git", "rev-parse", "--short=12", "HEAD").redirectErrorStream(true).start();
        String head = new String(git.getInputStream().readAllBytes(), StandardCharsets.UTF_8).strip();
        if (git.waitFor() == 0) {
            assertTrue(runner.get("commit").getAsString().contains(head), runner.get("commit") + " vs HEAD " + head);
        } else {
            System.err.println("NotebookMetadataTest: git is not available here; the recorded commit is not compared with HEAD");
        }
        // the one cell passes no seed and draws nothing random
        assertEquals(0, runner.getAsJsonArray("seeds").size());
        assertEquals(0, runner.getAsJsonArray("unseeded_random_in_cells").size());
    }
}
