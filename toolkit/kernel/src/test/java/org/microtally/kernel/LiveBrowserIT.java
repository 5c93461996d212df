package org.microtally.kernel;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assertions.fail;

import com.google.gson.JsonArray;
import com.google.gson.JsonElement;
import com.google.gson.JsonObject;
import com.google.gson.JsonParser;
import java.io.IOException;
import java.net.ServerSocket;
import java.net.URI;
import java.net.http.HttpClient;
import java.net.http.HttpRequest;
import java.net.http.HttpResponse;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.SecureRandom;
import java.time.Duration;
import java.util.ArrayList;
import java.util.HexFormat;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.concurrent.TimeUnit;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;

/**
 * One test in a real browser, as a user works: Debian's Jupyter Notebook server on loopback with our
 * kernelspec (installed into a temporary prefix), headless Chromium driven by playwright-core
 * (npm, pinned in {@code src/test/browser/package-lock.json}, installed with {@code npm ci} into
 * target/), opening a worked notebook, choosing Cell &gt; Run All, and checking what the live page
 * shows: tables, charts (svg with drawn paths), rendered math and an in-place progress display.
 *
 * <p>The reference here is the real front end: Jupyter's own page and MathJax, rendered by Chromium.
 * Bounded in time: the browser script stops itself after {@link #SCRIPT_SECONDS} s and is killed
 * after {@link #HARD_SECONDS} s. Without Chromium, Jupyter Notebook or node/npm it is skipped with a
 * loud message, unless {@code CI=true}: then it fails. Screenshots of the live page are left in
 * {@code target/it/browser/shots/}.
 */
class LiveBrowserIT {
    private static final Path REPO = Path.of(System.getProperty("microtally.repo", "../..")).toAbsolutePath().normalize();
    private static final Path JAR = Path.of(System.getProperty("microtally.jar", "target/microtally.jar")).toAbsolutePath();
    private static final Path WORK = Path.of(System.getProperty("microtally.itdir", "target/it")).toAbsolutePath().resolve("browser");
    private static final Path SCRIPTS = Path.of("src/test/browser").toAbsolutePath();
    /** The worked notebook opened in the browser: it has tables, charts, TeX math and a progress bar. */
    private static final String NOTEBOOK = System.getProperty("microtally.browser.notebook", "01-trap-of-bosons.ipynb");
    static final int SCRIPT_SECONDS = 220;
    static final int HARD_SECONDS = 240;

    /** Chromium's own binary (Debian's /usr/bin/chromium is a shell wrapper around it). */
    static Path chromium() {
        String env = System.getenv("MICROTALLY_CHROMIUM");
        if (env != null && !env.isBlank()) {
            return Files.isExecutable(Path.of(env)) ? Path.of(env) : null;
        }
        for (String candidate : List.of("/usr/lib/chromium/chromium", "/usr/lib/chromium-browser/chromium-browser")) {
            if (Files.isExecutable(Path.of(candidate))) {
                return Path.of(candidate);
            }
        }
        for (String name : List.of("chromium", "chromium-browser", "google-chrome")) {
            Path p = KernelSpec.onPath(name);
            if (p != null) {
                return p;
            }
        }
        return null;
    }

    private static boolean runs(List<String> cmd) {
        try {
            return JupyterIT.exec(cmd, Map.of(), 60).exit() == 0;
        } catch (IOException | InterruptedException e) {
            return false;
        }
    }

    /** What is missing for this test, with the Debian package that brings it; empty when all is there. */
    private static List<String> missing() {
        List<String> gaps = new ArrayList<>();
        if (chromium() == null) {
            gaps.add("Chromium (Debian: chromium; or set MICROTALLY_CHROMIUM to a Chromium binary)");
        }
        if (KernelSpec.onPath("jupyter") == null || !runs(List.of("jupyter", "notebook", "--version"))) {
            gaps.add("Jupyter Notebook server (Debian: jupyter-notebook)");
        }
        if (KernelSpec.onPath("node") == null || KernelSpec.onPath("npm") == null
                || !runs(List.of("node", "-e", "process.exit(Number(process.versions.node.split('.')[0]) >= 20 ? 0 : 1)"))) {
            gaps.add("node >= 20 and npm (Debian: nodejs npm)");
        }
        return gaps;
    }

    private static void skipOrFail(String why) {
        String msg = "\n**********************************************************************\n"
                + "* LiveBrowserIT SKIPPED: " + why + "\n"
                + "* Install them (.ci/run does) to run the live-browser notebook test.   *\n"
                + "**********************************************************************";
        ExternalTools.skipOrFailInCi(msg, "CI=true but the live-browser test cannot run: " + why, why);
    }

    private static int freePort() throws IOException {
        try (ServerSocket s = new ServerSocket(0)) {
            return s.getLocalPort();
        }
    }

    @Test
    void aWorkedNotebookRunsInJupyterNotebookInChromiumWithTablesChartsMathAndProgress() throws Exception {
        List<String> gaps = missing();
        if (!gaps.isEmpty()) {
            skipOrFail("missing " + String.join("; ", gaps));
        }
        assertTrue(Files.isRegularFile(JAR), "shaded jar missing: " + JAR);
        long t0 = System.nanoTime();

        // playwright-core, pinned by the lock file, installed into target/ (never into src/)
        Path node = WORK.resolve("node");
        Files.createDirectories(node);
        for (String f : List.of("package.json", "package-lock.json", "live-notebook.mjs")) {
            Files.copy(SCRIPTS.resolve(f), node.resolve(f), java.nio.file.StandardCopyOption.REPLACE_EXISTING);
        }
        if (!Files.isDirectory(node.resolve("node_modules/playwright-core"))) {
            JupyterIT.Ran ci = JupyterIT.exec(List.of("npm", "ci", "--no-audit", "--no-fund", "--prefix", node.toString()),
                    Map.of("PLAYWRIGHT_SKIP_BROWSER_DOWNLOAD", "1"), 300);
            if (ci.exit() != 0) {
                skipOrFail("npm ci of playwright-core failed (no npm registry?):\n" + ci.output());
            }
        }

        // our kernelspec in a temporary prefix, seen by Jupyter through JUPYTER_PATH only
        Path prefix = WORK.resolve("prefix");
        JupyterIT.Ran install = JupyterIT.exec(List.of(ExternalTools.javaExe(), "-jar", JAR.toString(), "install-kernel", "--prefix",
                prefix.toString()), Map.of(), 120);
        assertEquals(0, install.exit(), install.output());

        // the notebook folder the server shows: a copy, so autosave never touches the repository
        Path notebooks = WORK.resolve("notebooks");
        Files.createDirectories(notebooks);
        try (Stream<Path> s = Files.list(REPO.resolve("notebooks"))) {
            for (Path p : s.filter(Files::isRegularFile).toList()) {
                Files.copy(p, notebooks.resolve(p.getFileName()), java.nio.file.StandardCopyOption.REPLACE_EXISTING);
            }
        }
        assertTrue(Files.isRegularFile(notebooks.resolve(NOTEBOOK)), "no worked notebook " + NOTEBOOK + " in " + REPO.resolve("notebooks"));

        Map<String, String> env = new LinkedHashMap<>();
        env.put("JUPYTER_PATH", prefix.resolve("share/jupyter").toString());
        env.put("JUPYTER_DATA_DIR", WORK.resolve("data").toString());
        env.put("JUPYTER_RUNTIME_DIR", WORK.resolve("runtime").toString());
        env.put("JUPYTER_CONFIG_DIR", WORK.resolve("config").toString());
        env.put("JUPYTER_PLATFORM_DIRS", "1");
        env.put("IPYTHONDIR", WORK.resolve("ipython").toString());
        String token = HexFormat.of().formatHex(new SecureRandom().generateSeed(16));
        int port = freePort();
        String base = "http://127.0.0.1:" + port;
        Path serverLog = WORK.resolve("server.log");
        ProcessBuilder pb = new ProcessBuilder("jupyter", "notebook", "--no-browser", "--ip=127.0.0.1",
                "--port=" + port, "--port-retries=0", "--allow-root", "--NotebookApp.token=" + token,
                "--notebook-dir=" + notebooks)
                .redirectErrorStream(true).redirectOutput(serverLog.toFile());
        pb.environment().putAll(env);
        Process server = pb.start();
        HttpClient http = HttpClient.newBuilder().connectTimeout(Duration.ofSeconds(5)).build();
        try {
            waitForServer(http, base, token, server, serverLog);
            double serverSeconds = (System.nanoTime() - t0) / 1e9;
            Path shots = WORK.resolve("shots");
            JupyterIT.Ran run = JupyterIT.exec(List.of("node", node.resolve("live-notebook.mjs").toString(),
                    "--base", base, "--token", token, "--notebook", NOTEBOOK, "--chromium", chromium().toString(),
                    "--shots", shots.toString(), "--timeout", String.valueOf(SCRIPT_SECONDS)), Map.of(), HARD_SECONDS);
            System.out.println(run.output().lines().filter(l -> !l.startsWith("LIVE-REPORT")).reduce("", (a, b) -> a + b + "\n"));
            String line = run.output().lines().filter(l -> l.startsWith("LIVE-REPORT ")).reduce((a, b) -> b)
                    .orElseThrow(() -> new AssertionError("the browser script gave no report (exit " + run.exit() + "):\n" + run.output()
                            + "\nserver log " + serverLog));
            JsonObject r = JsonParser.parseString(line.substring("LIVE-REPORT ".length())).getAsJsonObject();
            check(r, serverLog);
            System.out.printf("LiveBrowserIT: %s in Chromium: server up in %.1f s, browser part %.1f s, whole test %.1f s;"
                    + " %d tables, %d charts, %d rendered formulas, progress updated in place %d times; screenshots in %s%n",
                    NOTEBOOK, serverSeconds, r.get("seconds").getAsDouble(), (System.nanoTime() - t0) / 1e9,
                    r.getAsJsonArray("tables").size(), r.getAsJsonArray("charts").size(),
                    r.getAsJsonObject("math").get("total").getAsInt(), progressStates(r), shots);
        } finally {
            stop(http, base, token, server);
        }
    }

    /** The assertions on what the live page showed (see live-notebook.mjs for how each is read). */
    private static void check(JsonObject r, Path serverLog) {
        assertTrue(r.get("ok").getAsBoolean(), "the browser script failed: " + r.get("error") + "\nserver log " + serverLog);
        String where = "in the live page of " + NOTEBOOK + ": ";
        // Source: kernel.json display_name written by install-kernel; the notebook asks for kernel "microtally"
        assertTrue(r.get("kernelName").getAsString().contains("microtally"), where + "kernel indicator shows " + r.get("kernelName"));
        int code = r.get("codeCells").getAsInt();
        assertTrue(code > 0, where + "no code cells");
        assertEquals(List.of(), list(r.getAsJsonArray("errors")), where + "cells with errors");
        assertEquals(code, r.get("executedCells").getAsInt(), where + "not every code cell got an execution count");
        assertEquals(List.of(), list(r.getAsJsonArray("consoleErrors")), where + "JavaScript errors in the page");

        // tables: an HTML table with several rows of numbers
        boolean table = false;
        for (JsonElement t : r.getAsJsonArray("tables")) {
            table |= t.getAsJsonObject().get("rows").getAsInt() >= 3 && t.getAsJsonObject().get("numericCells").getAsInt() >= 6;
        }
        assertTrue(table, where + "no table with rows of numbers: " + r.get("tables"));

        // charts: a visible svg (at least 200x100 px) with drawn paths and text
        boolean chart = false;
        for (JsonElement c : r.getAsJsonArray("charts")) {
            JsonObject o = c.getAsJsonObject();
            chart |= o.get("paths").getAsInt() >= 2 && o.get("drawn").getAsInt() >= 2 && o.get("texts").getAsInt() >= 2;
        }
        assertTrue(chart || r.getAsJsonArray("images").size() > 0, where + "no visible chart: " + r.get("charts"));

        // math: typeset by the page's MathJax, none left as raw TeX, no typesetting errors
        JsonObject math = r.getAsJsonObject("math");
        assertTrue(math.get("total").getAsInt() >= 1, where + "no rendered math element: " + math);
        assertEquals(List.of(), list(r.getAsJsonArray("mathErrors")), where + "math that failed to typeset");
        assertEquals(List.of(), list(r.getAsJsonArray("rawTex")), where + "TeX left untypeset in markdown");

        // progress: one display per cell at any moment (updated in place, not appended), and it moved
        JsonObject progress = r.getAsJsonObject("progress");
        JsonObject maxAtOnce = progress.getAsJsonObject("maxAtOnce");
        assertTrue(maxAtOnce.size() > 0, where + "no progress display appeared while the cells ran: " + progress);
        for (Map.Entry<String, JsonElement> e : maxAtOnce.entrySet()) {
            assertEquals(1, e.getValue().getAsInt(), where + "cell " + e.getKey() + " showed several progress displays at once"
                    + " (appended instead of updated in place)");
        }
        assertTrue(progressStates(r) >= 2, where + "the progress display never changed: " + progress.get("states"));
    }

    private static int progressStates(JsonObject r) {
        int most = 0;
        for (Map.Entry<String, JsonElement> e : r.getAsJsonObject("progress").getAsJsonObject("states").entrySet()) {
            most = Math.max(most, e.getValue().getAsJsonArray().size());
        }
        return most;
    }

    private static List<String> list(JsonArray a) {
        List<String> out = new ArrayList<>();
        a.forEach(e -> out.add(e.toString()));
        return out;
    }

    private static void waitForServer(HttpClient http, String base, String token, Process server, Path log) throws Exception {
        long deadline = System.nanoTime() + TimeUnit.SECONDS.toNanos(90);
        while (System.nanoTime() < deadline) {
            if (!server.isAlive()) {
                fail("jupyter notebook exited with " + server.exitValue() + ":\n" + Files.readString(log));
            }
            try {
                HttpResponse<String> r = http.send(HttpRequest.newBuilder(URI.create(base + "/api/status?token=" + token))
                        .timeout(Duration.ofSeconds(5)).build(), HttpResponse.BodyHandlers.ofString());
                if (r.statusCode() == 200) {
                    return;
                }
            } catch (IOException notYet) {
                // not listening yet
            }
            Thread.sleep(300);
        }
        fail("jupyter notebook did not answer on " + base + " within 90 s:\n" + Files.readString(log));
    }

    /** Asks the server to shut down (it stops its kernels), then ends whatever is left of it. */
    private static void stop(HttpClient http, String base, String token, Process server) throws InterruptedException {
        List<ProcessHandle> children = server.descendants().toList();
        try {
            http.send(HttpRequest.newBuilder(URI.create(base + "/api/shutdown?token=" + token))
                    .timeout(Duration.ofSeconds(10)).POST(HttpRequest.BodyPublishers.noBody()).build(),
                    HttpResponse.BodyHandlers.discarding());
        } catch (IOException e) {
            System.err.println("LiveBrowserIT: shutdown request failed (" + e + "); ending the server");
        }
        if (!server.waitFor(20, TimeUnit.SECONDS)) {
            server.destroy();
            server.waitFor(5, TimeUnit.SECONDS);
        }
        for (ProcessHandle h : children) {
            h.destroyForcibly();
        }
        server.destroyForcibly();
    }
}
