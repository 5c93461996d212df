package org.microtally.notebook.run;

import com.google.gson.JsonArray;
import com.google.gson.JsonObject;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.function.Consumer;
import org.microtally.notebook.render.MimeBundle;
import org.microtally.notebook.session.CellError;
import org.microtally.notebook.session.CellOutput;

/**
 * Collects one cell's outputs as nbformat 4 output objects, in the order the engine delivers them:
 * consecutive chunks of the same stream are merged (in a growing buffer, so the cost is linear in
 * the size of the output); a display update replaces the data of the earlier display with that id
 * (in this cell or an earlier one of the same notebook).
 *
 * <p>Progress displays are not kept: they go to the runner's progress line only, so a saved
 * notebook holds no finished bar. Nothing that changes from run to run is written into the
 * outputs; the cell's start and end times go into its metadata instead, under the keys Jupyter's
 * own front ends record ({@value #EXECUTION}{@code .}{@value #STARTED} and
 * {@value #EXECUTION}{@code .}{@value #FINISHED}, ISO 8601 UTC, as in the nbformat documentation's
 * cell-metadata section), so two runs of an unchanged notebook give byte-identical outputs.
 *
 * <p>Each output keeps at most {@code limitBytes} bytes of UTF-8 text; what is cut is counted and a
 * note saying "N bytes not kept" (and how to raise the limit) takes its place. A display larger than
 * the limit keeps only such a note as its plain text.
 */
final class OutputCollector implements CellOutput {
    /** The cell-metadata object holding execution times (nbformat's documented key). */
    static final String EXECUTION = "execution";
    /** When the cell's code was handed to the engine. */
    static final String STARTED = "iopub.execute_input";
    /** When the engine returned the cell's result. */
    static final String FINISHED = "shell.execute_reply";

    private final Instant started = Instant.now();
    private final List<Object> outputs = new ArrayList<>();   // Stream or JsonObject, in order
    private final Map<String, JsonObject> displaysById;
    private final Consumer<String> progress;
    private final long limitBytes;

    /** One stream output being gathered. */
    private final class Stream {
        final String name;
        final StringBuilder text = new StringBuilder();
        long keptBytes;
        long droppedBytes;

        Stream(String name) {
            this.name = name;
        }

        void add(String chunk) {
            long room = limitBytes - keptBytes;
            long size = utf8Length(chunk, 0, chunk.length());
            if (size <= room) {
                text.append(chunk);
                keptBytes += size;
                return;
            }
            int cut = prefixWithin(chunk, room);
            long kept = utf8Length(chunk, 0, cut);
            text.append(chunk, 0, cut);
            keptBytes += kept;
            droppedBytes += size - kept;
        }

        JsonObject toJson() {
            if (droppedBytes > 0) {
                text.append(text.length() == 0 || text.charAt(text.length() - 1) == '\n' ? "" : "\n").append(notKept(droppedBytes));
            }
            JsonObject o = new JsonObject();
            o.addProperty("output_type", "stream");
            o.addProperty("name", name);
            o.add("text", Notebook.lines(text.toString()));
            return o;
        }
    }

    /** {@code progress} receives the plain text of every progress display and update. */
    OutputCollector(Map<String, JsonObject> displaysById, Consumer<String> progress, long limitBytes) {
        this.displaysById = displaysById;
        this.progress = progress;
        this.limitBytes = limitBytes;
    }

    String notKept(long bytes) {
        return String.format(Locale.ROOT, "[microtally: %,d bytes of this output not kept; the runner keeps %,d bytes per output, "
                + "raise it with --output-limit BYTES]%n", bytes, limitBytes);
    }

    @Override
    public synchronized void stream(boolean stderr, String text) {
        String name = stderr ? "stderr" : "stdout";
        Object last = outputs.isEmpty() ? null : outputs.get(outputs.size() - 1);
        Stream s = last instanceof Stream st && st.name.equals(name) ? st : null;
        if (s == null) {
            s = new Stream(name);
            outputs.add(s);
        }
        s.add(text);
    }

    @Override
    public synchronized void progress(MimeBundle bundle, String displayId, boolean update) {
        progress.accept(bundle.plain());
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

    /**
     * Ends the cell: writes the outputs into {@code cell} and its start and end times into the
     * cell's metadata (see the class comment); other metadata is kept.
     */
    synchronized void finishInto(JsonObject cell) {
        Instant finished = Instant.now();
        cell.add("outputs", toJson());
        if (!(cell.get("metadata") instanceof JsonObject)) {
            cell.add("metadata", new JsonObject());
        }
        JsonObject times = new JsonObject();
        times.addProperty(STARTED, started.toString());
        times.addProperty(FINISHED, finished.toString());
        cell.getAsJsonObject("metadata").add(EXECUTION, times);
    }

    /** The outputs gathered so far, as an nbformat "outputs" array. */
    synchronized JsonArray toJson() {
        JsonArray a = new JsonArray();
        for (Object o : outputs) {
            a.add(o instanceof Stream s ? s.toJson() : (JsonObject) o);
        }
        return a;
    }

    private JsonObject data(MimeBundle bundle) {
        long size = 0;
        for (String v : bundle.data().values()) {
            size += utf8Length(v, 0, v.length());
        }
        if (size > limitBytes) {
            JsonObject d = new JsonObject();
            d.add(MimeBundle.TEXT_PLAIN, Notebook.lines("[microtally: a display of " + String.format(Locale.ROOT, "%,d", size)
                    + " bytes was not kept; the runner keeps " + String.format(Locale.ROOT, "%,d", limitBytes)
                    + " bytes per output, raise it with --output-limit BYTES]"));
            return d;
        }
        return data(bundle.data());
    }

    static JsonObject data(Map<String, String> bundle) {
        JsonObject d = new JsonObject();
        for (Map.Entry<String, String> e : bundle.entrySet()) {
            boolean binary = e.getKey().startsWith("image/") && !e.getKey().equals(MimeBundle.IMAGE_SVG);
            if (binary) {
                d.addProperty(e.getKey(), e.getValue());
            } else {
                d.add(e.getKey(), Notebook.lines(e.getValue()));
            }
        }
        return d;
    }

    /** UTF-8 length of {@code s[from, to)} (an unpaired surrogate counts as the 3 bytes of U+FFFD). */
    static long utf8Length(CharSequence s, int from, int to) {
        long n = 0;
        for (int i = from; i < to; i++) {
            char c = s.charAt(i);
            if (c < 0x80) {
                n++;
            } else if (c < 0x800) {
                n += 2;
            } else if (Character.isHighSurrogate(c) && i + 1 < to && Character.isLowSurrogate(s.charAt(i + 1))) {
                n += 4;
                i++;
            } else {
                n += 3;
            }
        }
        return n;
    }

    /** The longest prefix of {@code s} (not splitting a surrogate pair) whose UTF-8 form fits in {@code room} bytes. */
    static int prefixWithin(String s, long room) {
        long n = 0;
        int i = 0;
        while (i < s.length()) {
            char c = s.charAt(i);
            int w = c < 0x80 ? 1 : c < 0x800 ? 2 : Character.isHighSurrogate(c) && i + 1 < s.length() ? 4 : 3;
            if (n + w > room) {
                break;
            }
            n += w;
            i += w == 4 ? 2 : 1;
        }
        return i;
    }
}
