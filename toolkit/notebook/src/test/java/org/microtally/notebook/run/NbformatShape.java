package org.microtally.notebook.run;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.google.gson.JsonElement;
import com.google.gson.JsonObject;
import java.util.Set;

/**
 * Checks a notebook tree against the required and allowed properties of the nbformat 4 JSON
 * schema. Source: nbformat v4 schema (nbformat/v4/nbformat.v4.schema.json, versions 4.4/4.5),
 * definitions "code_cell", "markdown_cell", "raw_cell", "stream", "display_data",
 * "execute_result", "error" (from memory of the published schema).
 */
final class NbformatShape {
    private NbformatShape() { }

    static void check(JsonObject nb) {
        assertEquals(Set.of("cells", "metadata", "nbformat", "nbformat_minor"), nb.keySet());
        assertEquals(4, nb.get("nbformat").getAsInt());
        int minor = nb.get("nbformat_minor").getAsInt();
        for (JsonElement e : nb.getAsJsonArray("cells")) {
            JsonObject c = e.getAsJsonObject();
            String type = c.get("cell_type").getAsString();
            Set<String> allowed;
            switch (type) {
                case "code" -> {
                    allowed = Set.of("id", "cell_type", "metadata", "source", "outputs", "execution_count");
                    assertTrue(c.has("outputs") && c.has("execution_count") && c.has("metadata") && c.has("source"), c.toString());
                    JsonElement count = c.get("execution_count");
                    assertTrue(count.isJsonNull() || count.getAsInt() >= 0);
                    for (JsonElement o : c.getAsJsonArray("outputs")) {
                        output(o.getAsJsonObject());
                    }
                }
                case "markdown", "raw" -> allowed = Set.of("id", "cell_type", "metadata", "source", "attachments");
                default -> throw new AssertionError("cell_type " + type);
            }
            assertTrue(allowed.containsAll(c.keySet()), "unexpected keys in " + c.keySet());
            if (minor >= 5) {
                assertTrue(c.has("id") && c.get("id").getAsString().matches("^[a-zA-Z0-9-_]+$"), "cell id required from 4.5");
            }
        }
    }

    private static void output(JsonObject o) {
        String t = o.get("output_type").getAsString();
        switch (t) {
            case "stream" -> {
                assertEquals(Set.of("output_type", "name", "text"), o.keySet());
                assertTrue(Set.of("stdout", "stderr").contains(o.get("name").getAsString()));
            }
            case "display_data" -> assertEquals(Set.of("output_type", "data", "metadata"), o.keySet());
            case "execute_result" -> {
                assertEquals(Set.of("output_type", "execution_count", "data", "metadata"), o.keySet());
                assertTrue(o.get("execution_count").getAsInt() >= 0);
            }
            case "error" -> {
                assertEquals(Set.of("output_type", "ename", "evalue", "traceback"), o.keySet());
                assertTrue(o.get("traceback").isJsonArray());
            }
            default -> throw new AssertionError("output_type " + t);
        }
        if (o.has("data")) {
            for (String mime : o.getAsJsonObject("data").keySet()) {
                assertTrue(mime.matches("^[a-zA-Z0-9]+/[a-zA-Z0-9\\-+.]+$"), mime);
            }
            assertTrue(o.getAsJsonObject("data").has("text/plain"));
        }
    }
}
