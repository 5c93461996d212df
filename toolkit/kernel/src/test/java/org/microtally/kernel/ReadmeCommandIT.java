package org.microtally.kernel;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

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
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;

/**
 * Runs the README's main command exactly as a newcomer would (the first line of the README that
 * starts with {@code toolkit/bin/microtally run}), from the repository root, and checks that every
 * committed notebook got its executed .ipynb and its HTML page and that no cell failed.
 */
class ReadmeCommandIT {
    private static final Path REPO = Path.of(System.getProperty("microtally.repo", "../..")).toAbsolutePath().normalize();
    private static final String COMMAND_START = "toolkit/bin/microtally run ";

    @Test
    void readmeMainCommandRendersEveryNotebook() throws IOException, InterruptedException {
        String command = readmeMainCommand();
        String outDir = outputDirectory(command);
        Path out = REPO.resolve(outDir);
        List<Path> notebooks = committedNotebooks();
        assertFalse(notebooks.isEmpty(), "notebooks/ holds no .ipynb files");
        for (Path nb : notebooks) {
            Files.deleteIfExists(out.resolve(baseName(nb) + ".ipynb"));
            Files.deleteIfExists(out.resolve(baseName(nb) + ".html"));
        }

        JupyterIT.Ran ran = JupyterIT.exec(List.of("bash", "-c", "cd '" + REPO + "' && " + command), Map.of(), 900);
        assertEquals(0, ran.exit(), "the README's main command failed:\n" + ran.output());
        System.out.printf("ReadmeCommandIT: '%s' ran %d notebooks in %.1f s%n", command, notebooks.size(), ran.seconds());

        for (Path nb : notebooks) {
            Path executed = out.resolve(baseName(nb) + ".ipynb");
            Path html = out.resolve(baseName(nb) + ".html");
            assertTrue(Files.isRegularFile(executed), "missing executed notebook " + executed);
            assertTrue(Files.isRegularFile(html), "missing HTML page " + html);
            assertTrue(Files.size(html) > 1000, "suspiciously small HTML page " + html);
            JsonObject doc = JsonParser.parseString(Files.readString(executed, StandardCharsets.UTF_8)).getAsJsonObject();
            assertEquals(4, doc.get("nbformat").getAsInt(), executed + " is not nbformat 4");
            int codeCells = 0;
            for (JsonElement cell : doc.getAsJsonArray("cells")) {
                JsonObject c = cell.getAsJsonObject();
                if (!"code".equals(c.get("cell_type").getAsString())) {
                    continue;
                }
                codeCells++;
                assertFalse(c.get("execution_count").isJsonNull(), executed + ": a code cell was not executed");
                for (JsonElement o : c.getAsJsonArray("outputs")) {
                    assertFalse("error".equals(o.getAsJsonObject().get("output_type").getAsString()),
                            executed + ": a cell failed: " + o);
                }
            }
            assertTrue(codeCells > 0, executed + " has no code cells");
        }
    }

    private static String readmeMainCommand() throws IOException {
        for (String line : Files.readAllLines(REPO.resolve("README.md"), StandardCharsets.UTF_8)) {
            if (line.startsWith(COMMAND_START)) {
                return line.trim();
            }
        }
        throw new AssertionError("README.md has no line starting with '" + COMMAND_START + "'");
    }

    private static String outputDirectory(String command) {
        String[] words = command.split("\\s+");
        for (int i = 0; i + 1 < words.length; i++) {
            if (words[i].equals("--out")) {
                return words[i + 1];
            }
        }
        throw new AssertionError("the README's main command names no --out directory: " + command);
    }

    private static List<Path> committedNotebooks() throws IOException {
        try (Stream<Path> s = Files.list(REPO.resolve("notebooks"))) {
            List<Path> list = new ArrayList<>(s.filter(p -> p.toString().endsWith(".ipynb")).sorted().toList());
            return list;
        }
    }

    private static String baseName(Path nb) {
        String f = nb.getFileName().toString();
        return f.substring(0, f.length() - ".ipynb".length());
    }
}
