package org.microtally.notebook.run;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.google.gson.JsonArray;
import com.google.gson.JsonObject;
import com.google.gson.JsonParser;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.PrintStream;
import java.io.UncheckedIOException;
import java.net.URISyntaxException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.TimeUnit;
import java.util.stream.Stream;
import org.junit.jupiter.api.Assumptions;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.Timeout;
import org.junit.jupiter.api.io.TempDir;
import org.microtally.notebook.render.Renderers;

@Timeout(value = 120, unit = TimeUnit.SECONDS)
class NotebookRunnerTest {
    @TempDir
    Path tmp;

    final ByteArrayOutputStream logBytes = new ByteArrayOutputStream();
    final PrintStream log = new PrintStream(logBytes, true, StandardCharsets.UTF_8);

    static Path resource(String name) {
        try {
            return Path.of(NotebookRunnerTest.class.getResource("/notebooks/" + name).toURI());
        } catch (URISyntaxException e) {
            throw new IllegalStateException(e);
        }
    }

    /** Copies a test notebook into the temp dir so that "input untouched" can be checked byte for byte. */
    Path input(String name) throws IOException {
        Path in = tmp.resolve("in");
        Files.createDirectories(in);
        return Files.copy(resource(name), in.resolve(name));
    }

    int run(String... args) {
        return NotebookRunner.main(List.of(args), log, false);
    }

    String log() {
        return logBytes.toString(StandardCharsets.UTF_8);
    }

    static JsonObject readJson(Path p) throws IOException {
        return JsonParser.parseString(Files.readString(p)).getAsJsonObject();
    }

    static JsonArray outputs(JsonObject nb, int cell) {
        return nb.getAsJsonArray("cells").get(cell).getAsJsonObject().getAsJsonArray("outputs");
    }

    static JsonObject output(JsonObject nb, int cell, int index) {
        return outputs(nb, cell).get(index).getAsJsonObject();
    }

    static List<String> listing(Path dir) {
        if (!Files.exists(dir)) {
            return List.of();
        }
        try (Stream<Path> s = Files.list(dir)) {
            return s.map(p -> p.getFileName().toString()).sorted().toList();
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    @Test
    void executesNotebookAndWritesNotebookAndPage() throws IOException {
        Path nbFile = input("dot-shells.ipynb");
        byte[] before = Files.readAllBytes(nbFile);
        Path out = tmp.resolve("out");
        assertEquals(0, run(nbFile.toString(), "--out", out.toString()), log());
        assertTrue(java.util.Arrays.equals(before, Files.readAllBytes(nbFile)), "the input was modified");
        assertEquals(List.of("dot-shells.html", "dot-shells.ipynb"), listing(out));

        JsonObject nb = readJson(out.resolve("dot-shells.ipynb"));
        NbformatShape.check(nb);
        assertEquals("microtally", nb.getAsJsonObject("metadata").getAsJsonObject("kernelspec").get("name").getAsString());
        assertEquals("java", nb.getAsJsonObject("metadata").getAsJsonObject("language_info").get("name").getAsString());

        // cell 1: stdout then the value
        JsonObject code1 = nb.getAsJsonArray("cells").get(1).getAsJsonObject();
        assertEquals(1, code1.get("execution_count").getAsInt());
        assertEquals("stream", output(nb, 1, 0).get("output_type").getAsString());
        assertEquals("levels: 5\n", Notebook.text(output(nb, 1, 0).get("text")));
        JsonObject result = output(nb, 1, 1);
        assertEquals("execute_result", result.get("output_type").getAsString());
        assertEquals(1, result.get("execution_count").getAsInt());
        // Source: the 2D isotropic oscillator level with k quanta has orbital degeneracy k + 1 (from memory)
        assertEquals("4", Notebook.text(result.getAsJsonObject("data").get("text/plain")));

        // cell 2: merged stdout, stderr, three displays in order
        JsonArray o2 = outputs(nb, 2);
        // Source: closed shells of a 2D parabolic dot at 2, 6, 12 electrons (the 2D oscillator magic
        // numbers 2, 6, 12, 20, ...; from memory)
        assertEquals("closed shell at 2\nclosed shell at 6\nclosed shell at 12\n", Notebook.text(o2.get(0).getAsJsonObject().get("text")));
        assertEquals("stderr", o2.get(1).getAsJsonObject().get("name").getAsString());
        assertEquals(5, o2.size(), o2.toString());
        assertEquals("display_data", o2.get(2).getAsJsonObject().get("output_type").getAsString());
        assertTrue(o2.get(3).getAsJsonObject().getAsJsonObject("data").has("text/html"));
        assertTrue(o2.get(4).getAsJsonObject().getAsJsonObject("data").has("text/markdown"));

        // cell 3: the progress display went to the progress line only: the saved notebook keeps no bar
        JsonArray o3 = outputs(nb, 3);
        assertEquals(0, o3.size(), o3.toString());
        // the cell's times are in its metadata (nbformat's execution keys), not in the outputs
        JsonObject times = nb.getAsJsonArray("cells").get(3).getAsJsonObject().getAsJsonObject("metadata").getAsJsonObject("execution");
        java.time.Instant started = java.time.Instant.parse(times.get("iopub.execute_input").getAsString());
        java.time.Instant finished = java.time.Instant.parse(times.get("shell.execute_reply").getAsString());
        // the cell sleeps 50 x 2 ms (common practice, no source: Thread.sleep waits at least as long as asked)
        assertTrue(java.time.Duration.between(started, finished).toMillis() >= 100, times.toString());

        String html = Files.readString(out.resolve("dot-shells.html"));
        assertTrue(html.startsWith("<!DOCTYPE html>"));
        assertTrue(html.contains("<h1>Halyard Bay quantum dot</h1>"), html);
        assertTrue(html.contains("<em>2D isotropic oscillator</em>"));
        assertTrue(html.contains("<strong>hbar omega = 3 meV</strong>"));
        assertTrue(html.contains("<code>Spectra</code>"));
        assertTrue(html.contains("href=\"https://nbformat.readthedocs.io\">the nbformat docs</a>"));
        // math as MathML, its TeX kept as the annotation
        assertTrue(html.contains("<annotation encoding=\"application/x-tex\">E_k = (k+1)\\hbar\\omega</annotation>"), html);
        assertTrue(html.contains("<li>closed shells at &lt;2, 6, 12&gt; electrons</li>"));
        assertTrue(html.contains("<table><tr><th>k</th>"), "html output not inline");
        assertTrue(html.contains("System.out.println(&quot;levels: &quot; + dot.size());"), "source not escaped");
        assertFalse(html.contains("<script"));
        assertTrue(log().contains("dot-shells.ipynb  cell 4 (3 of 3)  ok  "), log());
    }

    /**
     * A notebook that names the Spark kernel keeps that kernelspec in its executed copy (so Jupyter and the
     * runner open it with Spark again), and its cells run; one without a kernelspec gets the plain kernel's.
     */
    @Test
    void theExecutedCopyNamesTheKernelTheNotebookNamed() throws IOException {
        Path in = tmp.resolve("in");
        Files.createDirectories(in);
        String cells = "\"cells\": [{\"cell_type\": \"code\", \"metadata\": {}, \"execution_count\": null, "
                + "\"outputs\": [], \"source\": [\"6 * 7\"]}]";
        Path spark = Files.writeString(in.resolve("on-spark.ipynb"), "{\"nbformat\": 4, \"nbformat_minor\": 5, "
                + "\"metadata\": {\"kernelspec\": {\"name\": \"microtally-spark\", \"display_name\": \"old name\"}}, " + cells + "}");
        Path plain = Files.writeString(in.resolve("no-kernel.ipynb"), "{\"nbformat\": 4, \"nbformat_minor\": 5, "
                + "\"metadata\": {}, " + cells + "}");
        Path out = tmp.resolve("out");
        assertEquals(0, run(spark.toString(), plain.toString(), "--out", out.toString()), log());
        JsonObject ks = readJson(out.resolve("on-spark.ipynb")).getAsJsonObject("metadata").getAsJsonObject("kernelspec");
        assertEquals(org.microtally.notebook.session.KernelIdentity.SPARK_KERNEL_NAME, ks.get("name").getAsString());
        assertEquals(org.microtally.notebook.session.KernelIdentity.SPARK_DISPLAY_NAME, ks.get("display_name").getAsString());
        JsonObject nb = readJson(out.resolve("no-kernel.ipynb"));
        NbformatShape.check(nb);
        assertEquals(org.microtally.notebook.session.KernelIdentity.KERNEL_NAME,
                nb.getAsJsonObject("metadata").getAsJsonObject("kernelspec").get("name").getAsString());
        // Source: arithmetic, 6 * 7 = 42 (common practice, no source)
        assertEquals("42", Notebook.text(output(nb, 0, 0).getAsJsonObject("data").get("text/plain")));
    }

    @Test
    void expectedFailuresAreRecordedAndTheSessionSurvives() throws IOException {
        Path nbFile = input("expected-faults.ipynb");
        Path out = tmp.resolve("out");
        assertEquals(0, run(nbFile.toString(), "--out", out.toString()), log());
        JsonObject nb = readJson(out.resolve("expected-faults.ipynb"));
        NbformatShape.check(nb);
        assertEquals("CompileError", output(nb, 0, 0).get("ename").getAsString());
        // Source: JLS 17 §15.17.2, integer division by zero throws ArithmeticException
        assertEquals("java.lang.ArithmeticException", output(nb, 1, 0).get("ename").getAsString());
        assertEquals("org.microtally.notebook.session.ExitBlockedException", output(nb, 2, 0).get("ename").getAsString());
        assertEquals("java.lang.OutOfMemoryError", output(nb, 3, 0).get("ename").getAsString());
        JsonObject last = output(nb, 4, 0);
        assertEquals(Renderers.render("survived: true").plain(), Notebook.text(last.getAsJsonObject("data").get("text/plain")));
        String html = Files.readString(out.resolve("expected-faults.html"));
        assertTrue(html.contains("class=\"mt-output mt-error\""));
    }

    @Test
    void failingCellStopsTheRunAndWritesNothing() throws IOException {
        Path nbFile = input("stops-at-failure.ipynb");
        Path out = tmp.resolve("out");
        Files.createDirectories(out);
        Files.writeString(out.resolve("stops-at-failure.ipynb"), "earlier result");
        assertEquals(1, run(nbFile.toString(), "--out", out.toString()));
        // Source: JLS 17 §15.10.4, an index outside the array throws ArrayIndexOutOfBoundsException
        assertTrue(log().contains("FAILED " + nbFile + ", cell 2 (In [2]): java.lang.ArrayIndexOutOfBoundsException: "
                + "Index 3 out of bounds for length 3"), log());
        assertEquals(List.of("stops-at-failure.ipynb"), listing(out), "output dir changed");
        assertEquals("earlier result", Files.readString(out.resolve("stops-at-failure.ipynb")));
        assertFalse(log().contains("third cell"));
    }

    @Test
    void keepGoingRunsEveryCellAndStillFails() throws IOException {
        Path nbFile = input("stops-at-failure.ipynb");
        Path out = tmp.resolve("out");
        assertEquals(1, run("--keep-going", nbFile.toString(), "--out", out.toString()));
        JsonObject nb = readJson(out.resolve("stops-at-failure.ipynb"));
        NbformatShape.check(nb);
        assertEquals("error", output(nb, 1, 0).get("output_type").getAsString());
        assertEquals("third cell ran\n", Notebook.text(output(nb, 2, 0).get("text")));
        assertEquals(3, nb.getAsJsonArray("cells").get(2).getAsJsonObject().get("execution_count").getAsInt());
    }

    @Test
    void cellTimeoutInterruptsARunawayCell() throws IOException {
        Path nbFile = input("runaway.ipynb");
        Path out = tmp.resolve("out");
        long t0 = System.nanoTime();
        assertEquals(1, run(nbFile.toString(), "--out", out.toString(), "--cell-timeout", "0.5", "--keep-going"));
        assertTrue(System.nanoTime() - t0 < TimeUnit.SECONDS.toNanos(30));
        assertTrue(log().contains("cell 1 (In [1]): Interrupted: the cell ran longer than the time limit of 0.5 s"), log());
        JsonObject nb = readJson(out.resolve("runaway.ipynb"));
        assertEquals("Interrupted", output(nb, 0, 0).get("ename").getAsString());
        assertEquals(Renderers.render("after the runaway").plain(), Notebook.text(output(nb, 1, 0).getAsJsonObject("data").get("text/plain")));
    }

    @Test
    void malformedJsonNamesFileAndPosition() throws IOException {
        Path nbFile = input("malformed.ipynb");
        Path out = tmp.resolve("out");
        assertEquals(2, run(nbFile.toString(), "--out", out.toString()));
        // the object opened on line 3 is closed by "]" on line 6 instead of "}"
        assertTrue(log().contains(nbFile + " is not valid JSON at line 6, column 2"), log());
        assertEquals(List.of(), listing(out));
    }

    @Test
    void wrongShapeNamesTheJsonPath() throws IOException {
        Path f = tmp.resolve("old.ipynb");
        Files.writeString(f, "{\"nbformat\": 3, \"worksheets\": []}");
        assertEquals(2, run(f.toString(), "--out", tmp.resolve("o").toString()));
        assertTrue(log().contains("old.ipynb is not an nbformat 4 notebook: $.nbformat is 3"), log());
        Path g = tmp.resolve("badcell.ipynb");
        Files.writeString(g, "{\"nbformat\": 4, \"nbformat_minor\": 4, \"metadata\": {}, \"cells\": [{\"cell_type\": \"code\", \"source\": 7}]}");
        assertEquals(2, run(g.toString(), "--out", tmp.resolve("o").toString()));
        assertTrue(log().contains("$.cells[0].source must be a string or an array of strings"), log());
    }

    @Test
    void terminalProgressShowsComputationsInPlace() throws IOException {
        Path nbFile = input("dot-shells.ipynb");
        assertEquals(0, NotebookRunner.main(List.of(nbFile.toString(), "--out", tmp.resolve("out").toString()), log, true));
        String text = log();
        assertTrue(text.contains("\rdot-shells.ipynb  cell 4  sweep, kT: "), text);
        assertTrue(text.contains("\rdot-shells.ipynb  cell 4 (3 of 3)  ok  "), text);
        // String.lines() would also split at \r: split at \n only
        assertFalse(java.util.Arrays.stream(text.split("\n")).anyMatch(l -> l.startsWith("dot-shells.ipynb  cell")),
                "terminal mode printed a line per cell");
    }

    @Test
    void usageErrors() {
        assertEquals(2, run());
        assertEquals(2, run("--bogus", "x.ipynb"));
        assertEquals(2, run("x.ipynb", "--cell-timeout", "-1"));
        assertEquals(0, run("--help"));
        assertTrue(log().contains("Usage: microtally run"), log());
    }

    @Test
    void atomicWriteLeavesNoPartialFiles() throws IOException {
        Path dir = tmp.resolve("w");
        OutputFolder.writeAtomically(List.of(dir.resolve("a.ipynb"), dir.resolve("a.html")), List.of("{}", "<p>"));
        assertEquals(List.of("a.html", "a.ipynb"), listing(dir));
        if (dir.getFileSystem().supportedFileAttributeViews().contains("posix")) {
            // outputs get the permissions of any new file in that directory (not a temp file's owner-only mode)
            Path plain = Files.createFile(tmp.resolve("plain.txt"));
            assertEquals(Files.getPosixFilePermissions(plain), Files.getPosixFilePermissions(dir.resolve("a.ipynb")));
        }
        // a target that cannot be replaced (a non-empty directory) makes the write fail: nothing else changes
        Files.createDirectories(dir.resolve("b.html").resolve("blocker"));
        List<String> beforeFail = listing(dir);
        boolean failed = false;
        try {
            OutputFolder.writeAtomically(List.of(dir.resolve("b.html"), dir.resolve("c.ipynb")), List.of("x", "y"));
        } catch (IOException e) {
            failed = true;
        }
        assertTrue(failed);
        assertEquals(beforeFail, listing(dir));
    }

    /** A notebook of code cells with the given sources, written to the temp dir. */
    Path notebook(String name, String metadata, String... sources) throws IOException {
        JsonArray cells = new JsonArray();
        for (String src : sources) {
            JsonObject c = new JsonObject();
            c.addProperty("cell_type", "code");
            c.add("metadata", new JsonObject());
            c.add("outputs", new JsonArray());
            c.add("execution_count", com.google.gson.JsonNull.INSTANCE);
            c.addProperty("source", src);
            cells.add(c);
        }
        JsonObject nb = new JsonObject();
        nb.add("cells", cells);
        nb.add("metadata", JsonParser.parseString(metadata));
        nb.addProperty("nbformat", 4);
        nb.addProperty("nbformat_minor", 4);
        Path in = Files.createDirectories(tmp.resolve("gen"));
        return Files.writeString(in.resolve(name), nb.toString());
    }

    @Test
    void outEqualsFormAndAnOutputLimitWithAVisibleNote() throws IOException {
        Path nb = notebook("chatty.ipynb", "{}",
                "String block = \"x\".repeat(200_000);\nfor (int i = 0; i < 10; i++) System.out.print(block);\nSystem.err.print(\"done\");");
        Path out = tmp.resolve("out");
        assertEquals(0, run(nb.toString(), "--out=" + out, "--output-limit=1000"), log());
        JsonObject o = output(readJson(out.resolve("chatty.ipynb")), 0, 0);
        String text = Notebook.text(o.get("text"));
        // 10 * 200,000 ASCII bytes written, 1,000 kept (common practice, no source: arithmetic)
        assertTrue(text.startsWith("x".repeat(1000) + "\n[microtally: 1,999,000 bytes of this output not kept"), text.substring(0, 1100));
        assertFalse(text.startsWith("x".repeat(1001)));
        assertEquals("done", Notebook.text(output(readJson(out.resolve("chatty.ipynb")), 0, 1).get("text")));
    }

    @Test
    void eachNotebookLineNamesItsSlowestCellsAndTheRunEndsWithItsTotal() throws IOException {
        Path a = notebook("slow.ipynb", "{}", "int x = 1;", "Thread.sleep(600);", "Thread.sleep(200);");
        Path b = notebook("quick.ipynb", "{}", "int y = 2;");
        assertEquals(0, run(a.toString(), b.toString(), "--out", tmp.resolve("timed").toString()), log());
        java.util.regex.Matcher line = java.util.regex.Pattern.compile(java.util.regex.Pattern.quote(a.toString())
                + ": 3 of 3 code cells run in [0-9.]+ s; slowest: (.*)").matcher(log());
        assertTrue(line.find(), log());
        String slowest = line.group(1);
        // common practice, no source: Thread.sleep waits at least as long as asked, so the 600 ms cell comes first
        assertTrue(slowest.indexOf("cell 2 ") >= 0 && slowest.indexOf("cell 2 ") < slowest.indexOf("cell 3 "), slowest);
        assertTrue(log().contains("microtally: 2 notebooks run in "), log());
    }

    @Test
    void anUnwritableOutputIsFoundBeforeAnyCellRunsAndKeepGoingTriesTheRest() throws IOException {
        Path a = notebook("first.ipynb", "{}", "System.out.println(\"first ran\");");
        Path b = notebook("second.ipynb", "{}", "System.out.println(\"second ran\");");
        Path file = Files.writeString(tmp.resolve("plain-file"), "not a folder");
        assertEquals(2, run("--keep-going", a.toString(), b.toString(), "--out", file.toString()));
        assertTrue(log().contains(a + " not run: " + file + " is a regular file, not a folder"), log());
        assertTrue(log().contains(b + " not run: "), "--keep-going did not try the second notebook: " + log());
        assertFalse(log().contains("cell 1 ok"), "a cell ran although the output could not be written: " + log());

        Path through = tmp.resolve("exists").resolve("missing").resolve("..");
        Files.createDirectories(tmp.resolve("exists"));
        assertEquals(2, run(a.toString(), "--out", through.toString()));
        assertTrue(log().contains("goes through " + tmp.resolve("exists").resolve("missing") + ", which does not exist"), log());

        Path locked = Files.createDirectories(tmp.resolve("locked"));
        if (locked.toFile().setWritable(false) && !Files.isWritable(locked)) {   // not as root
            assertEquals(2, run(a.toString(), "--out", locked.toString()));
            assertTrue(log().contains("permission denied"), log());
        }
    }

    @Test
    void ioFailuresAreGivenInTheOperatingSystemsWords() {
        // common practice, no source: EACCES is reported as "permission denied" by POSIX strerror
        assertEquals("permission denied (/srv/out)", OutputFolder.reason(new java.nio.file.AccessDeniedException("/srv/out")));
        assertEquals("no space left on device (/srv/out/a.ipynb)",
                OutputFolder.reason(new java.nio.file.FileSystemException("/srv/out/a.ipynb", null, "No space left on device")));
    }

    @Test
    void exitThroughReflectionInACellIsBlockedAndTheRunGoesOn() throws IOException {
        Path quitter = notebook("quitter.ipynb", "{}", "Class.forName(\"java.lang.System\").getMethod(\"exit\", int.class).invoke(null, 5);",
                "\"still running\"");
        Path after = notebook("after.ipynb", "{}", "\"the next notebook ran\"");
        Path out = tmp.resolve("out");
        assertEquals(1, run("--keep-going", quitter.toString(), after.toString(), "--out", out.toString()));
        assertTrue(log().contains("FAILED " + quitter + ", cell 1 (In [1]): java.lang.reflect.InvocationTargetException"), log());
        JsonObject nb = readJson(out.resolve("quitter.ipynb"));
        assertTrue(output(nb, 0, 0).get("traceback").toString().contains("System.exit(5) was blocked"), output(nb, 0, 0).toString());
        assertTrue(Files.exists(out.resolve("after.ipynb")), log());
    }

    @Test
    void libraryCodeThatEndsTheJvmIsReportedWithItsCellAndAFailingStatus() throws Exception {
        // javac's command-line entry point ends the JVM itself (System.exit in library code, not rewritten)
        Path nb = notebook("javac.ipynb", "{}", "\"before\"", "com.sun.tools.javac.Main.main(new String[] {\"-version\"});", "\"never\"");
        String java = Path.of(System.getProperty("java.home"), "bin", "java").toString();
        Process p = new ProcessBuilder(java, "-Xmx256m", "-XX:+UseSerialGC", "-cp", System.getProperty("java.class.path"),
                RunnerMain.class.getName(), nb.toString(), "--out", tmp.resolve("out").toString()).redirectErrorStream(true).start();
        String text = new String(p.getInputStream().readAllBytes(), StandardCharsets.UTF_8);
        assertTrue(p.waitFor(90, TimeUnit.SECONDS), text);
        // Source: JDK 17 source, com.sun.tools.javac.Main.main ends with System.exit(compile(args)), here status 0
        assertEquals(ExitWatch.EXIT_STATUS, p.exitValue(), text);
        assertTrue(text.contains("FAILED " + nb + ", cell 2: code called by that cell ended the JVM"), text);
    }

    @Test
    void stalePartialFilesOfTheNotebookAreRemoved() throws IOException {
        Path nb = notebook("tidy.ipynb", "{}", "1 + 1");
        Path out = Files.createDirectories(tmp.resolve("out"));
        Files.writeString(out.resolve(".tidy.ipynb.1f2e.partial"), "{");
        Files.writeString(out.resolve(".tidy.html.77.partial"), "<p");
        Files.writeString(out.resolve(".other.ipynb.5.partial"), "kept: another notebook's");
        assertEquals(0, run(nb.toString(), "--out", out.toString()), log());
        assertEquals(List.of(".other.ipynb.5.partial", "tidy.html", "tidy.ipynb"), listing(out));
        assertTrue(log().contains("removed 2 temporary file(s)"), log());
        // the pair rule: the page is renamed first, so the executed notebook is at least as new as its page
        assertFalse(Files.getLastModifiedTime(out.resolve("tidy.html")).compareTo(Files.getLastModifiedTime(out.resolve("tidy.ipynb"))) > 0);
    }

    @Test
    void aNotebookCanSetItsCellTimeLimitAndTheCommandLineWins() throws IOException {
        Path nb = notebook("slow.ipynb", "{\"microtally\": {\"cell_timeout_seconds\": 0.5}}", "while (true) { }", "\"next\"");
        Path out = tmp.resolve("out");
        assertEquals(1, run(nb.toString(), "--out", out.toString(), "--keep-going"));
        assertTrue(log().contains("the time limit of 0.5 s"), log());
        logBytes.reset();
        Path fast = notebook("quick.ipynb", "{\"microtally\": {\"cell_timeout_seconds\": 600}}", "Thread.sleep(5_000); 1");
        assertEquals(1, run(fast.toString(), "--out", out.toString(), "--cell-timeout", "0.3"));
        assertTrue(log().contains("the time limit of 0.3 s"), log());
        logBytes.reset();
        Path bad = notebook("badlimit.ipynb", "{\"microtally\": {\"cell_timeout_seconds\": \"soon\"}}", "1");
        assertEquals(2, run(bad.toString(), "--out", out.toString()));
        assertTrue(log().contains("cell_timeout_seconds = \"soon\" is not allowed"), log());
    }

    @Test
    void readingErrorsSpeakOurWords() throws IOException {
        Path latin1 = tmp.resolve("latin1.ipynb");
        byte[] head = "{\"nbformat\": 4, \"cells\": [], \"metadata\": {\"author\": \"".getBytes(StandardCharsets.US_ASCII);
        byte[] bytes = java.util.Arrays.copyOf(head, head.length + 3);
        bytes[head.length] = (byte) 0xE9;   // é in ISO-8859-1, not a UTF-8 sequence
        bytes[head.length + 1] = '"';
        bytes[head.length + 2] = '}';
        Files.write(latin1, bytes);
        assertEquals(2, run(latin1.toString(), "--out", tmp.resolve("o").toString()));
        // Source: RFC 3629 §3, 0xE9 starts a 3-byte sequence and must be followed by continuation bytes 10xxxxxx
        assertTrue(log().contains("latin1.ipynb is not valid UTF-8 at byte " + head.length + " (0xE9)"), log());
        Path lenient = Files.writeString(tmp.resolve("single-quotes.ipynb"), "{'nbformat': 4}");
        assertEquals(2, run(lenient.toString(), "--out", tmp.resolve("o").toString()));
        assertTrue(log().contains("single-quotes.ipynb is not valid JSON at line 1"), log());
        assertFalse(log().contains("Strictness") || log().contains("LENIENT") || log().contains("com.google"), log());
        assertEquals(2, run(tmp.resolve("absent.ipynb").toString(), "--out", tmp.resolve("o").toString()));
        assertTrue(log().contains("absent.ipynb: not found"), log());
    }

    /** Validates with the reference implementation when a Python with nbformat is installed. */
    @Test
    void executedNotebookValidatesWithNbformat() throws IOException, InterruptedException {
        String python = findPythonWithNbformat();
        if (python == null) {
            System.err.println("\n*** SKIPPED nbformat validation: no python3 with the nbformat module "
                    + "(install Debian's python3-nbformat to run it) ***\n");
            Assumptions.abort("nbformat not installed");
        }
        Path out = tmp.resolve("out");
        List<String> files = new ArrayList<>();
        assertEquals(0, run(input("dot-shells.ipynb").toString(), "--out", out.toString()), log());
        files.add(out.resolve("dot-shells.ipynb").toString());
        // error, stream and result outputs, a cell left unexecuted is not possible with --keep-going: all ran
        assertEquals(1, run("--keep-going", input("stops-at-failure.ipynb").toString(), "--out", out.toString()), log());
        files.add(out.resolve("stops-at-failure.ipynb").toString());
        List<String> cmd = new ArrayList<>(List.of(python, "-c",
                "import sys, nbformat\nfor f in sys.argv[1:]:\n    nbformat.validate(nbformat.read(f, as_version=4))\n    print('valid', f)"));
        cmd.addAll(files);
        Process p = new ProcessBuilder(cmd).redirectErrorStream(true).start();
        String text = new String(p.getInputStream().readAllBytes(), StandardCharsets.UTF_8);
        assertEquals(0, p.waitFor(), text);
        assertEquals(2, text.lines().filter(l -> l.startsWith("valid ")).count(), text);
    }

    static String findPythonWithNbformat() throws InterruptedException {
        for (String py : List.of("/usr/bin/python3", "python3")) {
            try {
                Process p = new ProcessBuilder(py, "-c", "import nbformat").redirectErrorStream(true).start();
                p.getInputStream().readAllBytes();
                if (p.waitFor() == 0) {
                    return py;
                }
            } catch (IOException e) {
                // not there
            }
        }
        return null;
    }
}
