package org.microtally.notebook.run;

import com.google.gson.JsonArray;
import com.google.gson.JsonObject;
import java.util.Map;
import org.microtally.notebook.render.MimeBundle;
import org.microtally.notebook.session.CellError;
import org.microtally.notebook.session.CellOutput;

/**
 * Collects one cell's outputs as nbformat 4 output objects: consecutive stream chunks of the same
 * stream are merged; a display update replaces the data of the earlier display with that id (in
 * this cell or an earlier one of the same notebook).
 */
final class OutputCollector implements CellOutput {
    private final JsonArray outputs;
    private final Map<String, JsonObject> displaysById;
    private final java.util.function.Consumer<String> progress;

    /** {@code progress} receives the plain text of every progress display and update. */
    OutputCollector(JsonArray outputs, Map<String, JsonObject> displaysById, java.util.function.Consumer<String> progress) {
        this.outputs = outputs;
        this.displaysById = displaysById;
        this.progress = progress;
    }

    @Override
    public synchronized void stream(boolean stderr, String text) {
        String name = stderr ? "stderr" : "stdout";
        if (outputs.size() > 0) {
            JsonObject last = outputs.get(outputs.size() - 1).getAsJsonObject();
            if (last.get("output_type").getAsString().equals("stream") && last.get("name").getAsString().equals(name)) {
                last.add("text", Notebook.lines(Notebook.text(last.get("text")) + text));
                return;
            }
        }
        JsonObject o = new JsonObject();
        o.addProperty("output_type", "stream");
        o.addProperty("name", name);
        o.add("text", Notebook.lines(text));
        outputs.add(o);
    }

    @Override
    public synchronized void progress(MimeBundle bundle, String displayId, boolean update) {
        progress.accept(bundle.plain());
        display(bundle, displayId, update);
    }

    @Override
    public synchronized void display(MimeBundle bundle, String displayId, boolean update) {
        if (update && displayId != null) {
            JsonObject earlier = displaysById.get(displayId);
            if (earlier != null) {
                earlier.add("data", data(bundle));
                return;
            }
        }
        JsonObject o = new JsonObject();
        o.addProperty("output_type", "display_data");
        o.add("data", data(bundle));
        o.add("metadata", new JsonObject());
        outputs.add(o);
        if (displayId != null) {
            displaysById.put(displayId, o);
        }
    }

    synchronized void result(MimeBundle bundle, int executionCount) {
        JsonObject o = new JsonObject();
        o.addProperty("output_type", "execute_result");
        o.addProperty("execution_count", executionCount);
        o.add("data", data(bundle));
        o.add("metadata", new JsonObject());
        outputs.add(o);
    }

    synchronized void error(CellError e) {
        JsonObject o = new JsonObject();
        o.addProperty("output_type", "error");
        o.addProperty("ename", e.type());
        o.addProperty("evalue", e.message());
        JsonArray tb = new JsonArray();
        e.traceback().forEach(tb::add);
        o.add("traceback", tb);
        outputs.add(o);
    }

    static JsonObject data(MimeBundle bundle) {
        JsonObject d = new JsonObject();
        for (Map.Entry<String, String> e : bundle.data().entrySet()) {
            boolean binary = e.getKey().startsWith("image/") && !e.getKey().equals(MimeBundle.IMAGE_SVG);
            if (binary) {
                d.addProperty(e.getKey(), e.getValue());
            } else {
                d.add(e.getKey(), Notebook.lines(e.getValue()));
            }
        }
        return d;
    }
}
