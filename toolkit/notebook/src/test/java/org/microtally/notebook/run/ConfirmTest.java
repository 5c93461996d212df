package org.microtally.notebook.run;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.google.gson.JsonArray;
import com.google.gson.JsonObject;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.Timeout;
import org.junit.jupiter.api.io.TempDir;
import org.microtally.notebook.session.Session;
import picocli.CommandLine;

/** Reruns give the same outputs byte for byte, and {@code microtally confirm} confirms or reports numbers. */
@Timeout(value = 180, unit = TimeUnit.SECONDS)
class ConfirmTest {
    /** What the runner and the confirm command report, gathered for the assertions. */
    final ByteArrayOutputStream logBytes = new ByteArrayOutputStream();
    final PrintStream log = new PrintStream(logBytes, true, StandardCharsets.UTF_8);

    @TempDir
    Path tmp;

    String log() {
        return logBytes.toString(StandardCharsets.UTF_8);
    }

    int confirm(String... args) {
        CommandLine cli = Cli.configure(new CommandLine(new ConfirmCommand(log, Session::forKernel)), log, log);
        return cli.execute(args);
    }

    Path executed(String out) throws IOException {
        Path in = tmp.resolve("in");
        Files.createDirectories(in);
        Path nb = in.resolve("dot-shells.ipynb");
        if (!Files.exists(nb)) {
            Files.copy(NotebookRunnerTest.resource("dot-shells.ipynb"), nb);
        }
        assertEquals(0, NotebookRunner.main(List.of(nb.toString(), "--out", tmp.resolve(out).toString()), log, false), log());
        return tmp.resolve(out).resolve("dot-shells.ipynb");
    }

    static String outputsOf(Path executed) throws IOException {
        StringBuilder sb = new StringBuilder();
        for (var cell : NotebookRunnerTest.readJson(executed).getAsJsonArray("cells")) {
            JsonObject c = cell.getAsJsonObject();
            sb.append(c.has("outputs") ? c.get("outputs").toString() : "-").append('\n');
        }
        return sb.toString();
    }

    @Test
    void twoRunsOfAnUnchangedNotebookGiveByteIdenticalOutputsAndConfirmAgrees() throws IOException {
        Path first = executed("one");
        Path second = executed("two");
        String a = outputsOf(first);
        assertTrue(a.contains("closed shell at 12"), a);   // the runs did produce outputs
        assertEquals(a, outputsOf(second));
        // the notebooks differ only in the cells' times (metadata.execution)
        assertTrue(Files.readString(first).contains("\"iopub.execute_input\""));

        assertEquals(0, confirm(first.toString(), second.toString()), log());
        assertTrue(log().contains("agree: "), log());
        // one notebook: its code is run again and compared with the saved outputs
        assertEquals(0, confirm(first.toString()), log());
        assertTrue(log().contains(first + " and its rerun agree"), log());
    }

    @Test
    void aChangedNumberIsReportedWithItsCellAndTheToleranceDecides() throws IOException {
        Path first = executed("one");
        JsonObject nb = NotebookRunnerTest.readJson(first);
        // cell 2 (index 1) ends in the value 4 (the degeneracy of the k = 3 level): make it 4.000001
        JsonObject result = nb.getAsJsonArray("cells").get(1).getAsJsonObject().getAsJsonArray("outputs").get(1).getAsJsonObject();
        JsonArray plain = new JsonArray();
        plain.add("4.000001");
        result.getAsJsonObject("data").add("text/plain", plain);
        Path changed = tmp.resolve("changed.ipynb");
        Files.writeString(changed, nb.toString());

        assertEquals(1, confirm(first.toString(), changed.toString()));
        assertTrue(log().contains("cell 2, output 2: 4 against 4.000001 (relative difference 2.5e-07)"), log());
        assertTrue(log().contains("DIFFER (1 differences"), log());
        assertEquals(0, confirm(first.toString(), changed.toString(), "--rel-tol", "1e-6"), log());
        assertEquals(2, confirm(first.toString(), changed.toString(), "--rel-tol", "-1"));
        assertEquals(2, confirm(tmp.resolve("missing.ipynb").toString()));
        assertTrue(log().contains("not found"), log());
    }

    @Test
    void relativePathsInCellsAreTheNotebooksNeighbours() throws IOException {
        Path folder = Files.createDirectories(tmp.resolve("shared"));
        // the quantum dot's lowest shells with spin: 2, 4, 6 states (2D oscillator; from memory)
        Files.writeString(folder.resolve("dot-levels.csv"), "energy,degeneracy\n0,2\n1,4\n2,6\n");
        String code = "Spectrum dot = SpectrumReader.fromCsv(Path.of(\"dot-levels.csv\"), "
                + "EnergyScale.of(\"meV\", Energy.of(1, EnergyUnit.MILLIELECTRONVOLT)));\n"
                + "Csv.write(Tables.levels(dot), Path.of(\"copy.csv\"));\ndot.stateCount()";
        Path nb = folder.resolve("reads-csv.ipynb");
        Files.writeString(nb, "{\"nbformat\": 4, \"nbformat_minor\": 5, \"metadata\": {}, \"cells\": [{\"cell_type\": \"code\", "
                + "\"metadata\": {}, \"source\": " + new com.google.gson.Gson().toJson(code) + ", \"outputs\": [], \"execution_count\": null}]}");
        // the test's working directory is the module folder, not the notebook's
        assertEquals(0, NotebookRunner.main(List.of(nb.toString(), "--out", tmp.resolve("o").toString()), log, false), log());
        JsonObject result = NotebookRunnerTest.output(NotebookRunnerTest.readJson(tmp.resolve("o").resolve("reads-csv.ipynb")), 0, 0);
        assertEquals("12", org.microtally.notebook.run.Notebook.text(result.getAsJsonObject("data").get("text/plain")));
        assertTrue(Files.exists(folder.resolve("copy.csv")));
    }
}
