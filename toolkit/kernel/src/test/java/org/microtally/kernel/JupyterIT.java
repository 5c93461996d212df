package org.microtally.kernel;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assertions.fail;

import com.google.gson.JsonArray;
import com.google.gson.JsonElement;
import com.google.gson.JsonObject;
import com.google.gson.JsonParser;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.concurrent.TimeUnit;
import java.util.stream.Stream;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;

/**
 * Integration tests with a real Jupyter: the kernelspec is installed into a temporary prefix with
 * {@code microtally install-kernel --prefix}, found through {@code JUPYTER_PATH}, and driven by
 * Debian's nbconvert/nbclient and jupyter_client. The checks compare against what Jupyter itself
 * records (the executed notebook, the client's replies), i.e. against the reference implementation
 * of the protocol's client side.
 *
 * <p>Without Jupyter the tests are skipped with a loud message, unless {@code CI=true}: then they fail.
 */
class JupyterIT {
    private static final Path JAR = Path.of(System.getProperty("microtally.jar", "target/microtally.jar")).toAbsolutePath();
    private static final Path REPO = Path.of(System.getProperty("microtally.repo", "../..")).toAbsolutePath().normalize();
    private static final Path WORK = Path.of(System.getProperty("microtally.itdir", "target/it")).toAbsolutePath();
    private static final Path PYTHON = Path.of("/usr/bin/python3");
    private static Path prefix;

    record Ran(int exit, String output, double seconds) { }

    static Ran exec(List<String> cmd, Map<String, String> env, long timeoutSeconds) throws IOException, InterruptedException {
        ProcessBuilder pb = new ProcessBuilder(cmd).redirectErrorStream(true);
        pb.environment().putAll(env);
        long t0 = System.nanoTime();
        Process p = pb.start();
        byte[][] out = new byte[1][];
        Thread reader = new Thread(() -> {
            try {
                out[0] = p.getInputStream().readAllBytes();
            } catch (IOException e) {
                out[0] = ("<output lost: " + e + ">").getBytes(StandardCharsets.UTF_8);
            }
        });
        reader.start();
        if (!p.waitFor(timeoutSeconds, TimeUnit.SECONDS)) {
            p.descendants().forEach(ProcessHandle::destroyForcibly);
            p.destroyForcibly();
            reader.join(5000);
            fail("timed out after " + timeoutSeconds + " s: " + String.join(" ", cmd) + "\n"
                    + (out[0] == null ? "" : new String(out[0], StandardCharsets.UTF_8)));
        }
        reader.join(5000);
        return new Ran(p.exitValue(), out[0] == null ? "" : new String(out[0], StandardCharsets.UTF_8),
                (System.nanoTime() - t0) / 1e9);
    }

    private static boolean jupyterPresent() {
        try {
            return KernelSpec.onPath("jupyter") != null && Files.isExecutable(PYTHON)
                    && exec(List.of("jupyter", "nbconvert", "--version"), Map.of(), 60).exit() == 0
                    && exec(List.of(PYTHON.toString(), "-c", "import jupyter_client, nbclient"), Map.of(), 60).exit() == 0;
        } catch (IOException | InterruptedException e) {
            return false;
        }
    }

    /** Environment that makes Jupyter see only our kernelspec prefix and keep its files in target/. */
    static Map<String, String> jupyterEnv() {
        return Map.of(
                "JUPYTER_PATH", prefix.resolve("share").resolve("jupyter").toString(),
                "JUPYTER_RUNTIME_DIR", WORK.resolve("runtime").toString(),
                "JUPYTER_CONFIG_DIR", WORK.resolve("config").toString(),
                "JUPYTER_PLATFORM_DIRS", "1",
                "PYDEVD_DISABLE_FILE_VALIDATION", "1");
    }

    @BeforeAll
    static void installKernelspec() throws Exception {
        if (!jupyterPresent()) {
            String msg = "\n**********************************************************************\n"
                    + "* JupyterIT SKIPPED: jupyter nbconvert / jupyter_client not found.    *\n"
                    + "* Install Debian's jupyter-nbconvert jupyter-client python3-ipykernel *\n"
                    + "* (.ci/run does) to run the real-Jupyter kernel tests.                *\n"
                    + "**********************************************************************";
            ExternalTools.skipOrFailInCi(msg, "CI=true but Jupyter is missing: the real-Jupyter kernel tests must run in CI.",
                    "Jupyter is not installed");
        }
        assertTrue(Files.isRegularFile(JAR), "shaded jar missing: " + JAR);
        Files.createDirectories(WORK);
        prefix = WORK.resolve("prefix");
        Ran r = exec(List.of(ExternalTools.javaExe(), "-jar", JAR.toString(), "install-kernel", "--prefix", prefix.toString()), Map.of(), 120);
        assertEquals(0, r.exit(), r.output());
        Path spec = prefix.resolve("share/jupyter/kernels/microtally/kernel.json");
        assertTrue(Files.isRegularFile(spec), "install-kernel did not write " + spec + ":\n" + r.output());
        JsonObject json = JsonParser.parseString(Files.readString(spec)).getAsJsonObject();
        // Source: Jupyter "Kernel specs" documentation: argv with {connection_file}, interrupt_mode message
        assertEquals("message", json.get("interrupt_mode").getAsString());
        assertTrue(json.getAsJsonArray("argv").toString().contains("{connection_file}"));
        Ran list = exec(List.of("jupyter", "kernelspec", "list"), jupyterEnv(), 60);
        assertTrue(list.output().contains("microtally"), "jupyter does not see the kernelspec:\n" + list.output());
    }

    /** Runs nbconvert --execute on one notebook; returns the executed notebook. */
    static JsonObject nbconvert(Path notebook, Path outDir, List<String> extra) throws Exception {
        Files.createDirectories(outDir);
        List<String> cmd = new ArrayList<>(List.of("jupyter", "nbconvert", "--to", "notebook", "--execute",
                "--ExecutePreprocessor.kernel_name=microtally", "--ExecutePreprocessor.startup_timeout=60",
                "--output-dir", outDir.toString()));
        cmd.addAll(extra);
        cmd.add(notebook.toString());
        Ran r = exec(cmd, jupyterEnv(), 170);
        assertEquals(0, r.exit(), "nbconvert failed on " + notebook + " after " + r.seconds() + " s:\n" + r.output());
        String name = notebook.getFileName().toString();
        Path executed = outDir.resolve(name.substring(0, name.length() - ".ipynb".length()) + ".ipynb");
        return JsonParser.parseString(Files.readString(executed)).getAsJsonObject();
    }

    private static String text(JsonElement e) {
        if (e == null || e.isJsonNull()) {
            return "";
        }
        if (e.isJsonArray()) {
            StringBuilder sb = new StringBuilder();
            e.getAsJsonArray().forEach(x -> sb.append(x.getAsString()));
            return sb.toString();
        }
        return e.getAsString();
    }

    private static String unquote(String s) {
        String t = s.strip();
        return t.length() >= 2 && t.startsWith("\"") && t.endsWith("\"") ? t.substring(1, t.length() - 1) : t;
    }

    /** Checks every code cell that carries {@code microtally_check} metadata against its outputs. */
    static int checkCells(JsonObject nb, String label) {
        int checked = 0;
        JsonArray cells = nb.getAsJsonArray("cells");
        for (int i = 0; i < cells.size(); i++) {
            JsonObject cell = cells.get(i).getAsJsonObject();
            if (!cell.get("cell_type").getAsString().equals("code")) {
                continue;
            }
            JsonObject meta = cell.getAsJsonObject("metadata");
            String where = label + " cell " + i + " (" + text(cell.get("source")).lines().findFirst().orElse("") + ")";
            JsonArray outputs = cell.getAsJsonArray("outputs");
            if (meta == null || !meta.has("microtally_check")) {
                continue;
            }
            JsonObject want = meta.getAsJsonObject("microtally_check");
            StringBuilder stdout = new StringBuilder();
            StringBuilder stderr = new StringBuilder();
            String result = null;
            JsonObject error = null;
            List<JsonObject> displays = new ArrayList<>();
            for (JsonElement oe : outputs) {
                JsonObject o = oe.getAsJsonObject();
                switch (o.get("output_type").getAsString()) {
                    case "stream" -> (o.get("name").getAsString().equals("stdout") ? stdout : stderr).append(text(o.get("text")));
                    case "execute_result" -> result = text(o.getAsJsonObject("data").get("text/plain"));
                    case "display_data" -> displays.add(o.getAsJsonObject("data"));
                    case "error" -> error = o;
                    default -> { }
                }
            }
            if (want.has("stdout")) {
                assertTrue(stdout.toString().contains(want.get("stdout").getAsString()), where + ": stdout was " + stdout);
            }
            if (want.has("stderr")) {
                assertTrue(stderr.toString().contains(want.get("stderr").getAsString()), where + ": stderr was " + stderr);
            }
            if (want.has("result")) {
                assertEquals(unquote(want.get("result").getAsString()), result == null ? null : unquote(result), where + ": outputs " + outputs);
            }
            if (want.has("mime")) {
                String mime = want.get("mime").getAsString();
                JsonObject d = displays.stream().filter(x -> x.has(mime)).findFirst().orElse(null);
                assertTrue(d != null, where + ": no display with " + mime + " in " + outputs);
                assertTrue(d.has("text/plain"), where + ": display without text/plain");
                if (want.has("contains")) {
                    assertTrue(text(d.get(mime)).contains(want.get("contains").getAsString()), where + ": " + mime + " was " + d.get(mime));
                }
            }
            if (want.has("ename")) {
                assertTrue(error != null, where + ": expected an error output, got " + outputs);
                assertEquals(want.get("ename").getAsString(), error.get("ename").getAsString(), where);
                assertFalse(error.getAsJsonArray("traceback").isEmpty(), where + ": empty traceback");
            }
            if (want.has("evalue")) {
                assertTrue(text(error.get("evalue")).contains(want.get("evalue").getAsString()), where + ": evalue " + error.get("evalue"));
            }
            if (want.has("error")) {
                assertTrue(error != null, where + ": expected an error output, got " + outputs);
            }
            if (!want.has("ename") && !want.has("error")) {
                assertTrue(error == null, where + ": unexpected error " + error);
            }
            checked++;
        }
        return checked;
    }

    @Test
    void outputsValuesMimeTypesAndErrorsThroughNbconvert() throws Exception {
        Path nb = Path.of("src/test/resources/notebooks/kernel-outputs.ipynb").toAbsolutePath();
        JsonObject executed = nbconvert(nb, WORK.resolve("out"), List.of());
        assertEquals(11, checkCells(executed, "kernel-outputs"));
        // Source: nbformat 4 schema: the executed notebook records the kernel's language_info
        assertEquals("java", executed.getAsJsonObject("metadata").getAsJsonObject("language_info").get("name").getAsString());
    }

    @Test
    void faultsAreSurvivedAndTimeoutsInterruptTheCell() throws Exception {
        Path nb = Path.of("src/test/resources/notebooks/kernel-faults.ipynb").toAbsolutePath();
        JsonObject executed = nbconvert(nb, WORK.resolve("out"), List.of(
                "--ExecutePreprocessor.timeout=15", "--ExecutePreprocessor.interrupt_on_timeout=True"));
        assertEquals(9, checkCells(executed, "kernel-faults"));
    }

    @Test
    void everyNotebookInTheRepositoryRuns() throws Exception {
        Path dir = REPO.resolve("notebooks");
        assertTrue(Files.isDirectory(dir), "no notebooks/ folder in " + REPO);
        List<Path> notebooks;
        try (Stream<Path> s = Files.list(dir)) {
            notebooks = s.filter(p -> p.toString().endsWith(".ipynb")).sorted().toList();
        }
        assertFalse(notebooks.isEmpty(), "notebooks/ holds no .ipynb files");
        for (Path nb : notebooks) {
            JsonObject executed = nbconvert(nb, WORK.resolve("repo-notebooks"), List.of("--ExecutePreprocessor.timeout=120"));
            checkCells(executed, nb.getFileName().toString());
        }
    }

    @Test
    void completionInspectionForgeryAndRestartThroughJupyterClient() throws Exception {
        Path script = Path.of("src/test/resources/jupyter/client_check.py").toAbsolutePath();
        Ran r = exec(List.of(PYTHON.toString(), script.toString(), "microtally"), jupyterEnv(), 170);
        assertEquals(0, r.exit(), r.output());
        String last = r.output().strip().lines().reduce((a, b) -> b).orElse("{}");
        JsonObject o = JsonParser.parseString(last).getAsJsonObject();
        assertEquals("java", o.get("language").getAsString());
        assertEquals("ok", o.get("define_status").getAsString());
        assertEquals("ok", o.get("complete_status").getAsString());
        // Source: java.lang.String Javadoc (Java SE 17): String has exactly one method starting with "len", length()
        assertTrue(o.getAsJsonArray("complete_matches").toString().contains("length("), o.toString());
        JsonArray range = o.getAsJsonArray("complete_range");
        assertEquals("halyardTrap.".length(), range.get(0).getAsInt(), o.toString());
        assertEquals("halyardTrap.len".length(), range.get(1).getAsInt(), o.toString());
        assertTrue(o.get("inspect_found").getAsBoolean(), o.toString());
        assertTrue(o.get("inspect_text").getAsString().contains("length"), o.toString());
        // Source: Jupyter messaging protocol 5.3, is_complete_reply statuses
        assertEquals("incomplete", o.get("is_complete_open").getAsString());
        assertEquals("complete", o.get("is_complete_closed").getAsString());
        // The forged request (wrong HMAC key) got no reply and defined nothing.
        assertFalse(o.get("forged_answered").getAsBoolean(), o.toString());
        assertEquals("error", o.get("forged_probe_status").getAsString(), o.toString());
        // After a restart the old variable is gone and new cells run.
        assertEquals("error", o.get("after_restart_status").getAsString(), o.toString());
        assertEquals("[\"42\"]", o.getAsJsonArray("after_restart_value").toString(), o.toString());
        assertTrue(o.get("shutdown_clean").getAsBoolean(), o.toString());
        System.err.printf("JupyterIT: kernel ready in %.2f s, restart in %.2f s%n",
                o.get("ready_seconds").getAsDouble(), o.get("restart_seconds").getAsDouble());
    }
}
