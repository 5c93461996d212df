package org.microtally.notebook.run;

import com.google.gson.Gson;
import com.google.gson.GsonBuilder;
import com.google.gson.JsonArray;
import com.google.gson.JsonElement;
import com.google.gson.JsonObject;
import com.google.gson.JsonParseException;
import com.google.gson.Strictness;
import com.google.gson.TypeAdapter;
import com.google.gson.stream.JsonReader;
import com.google.gson.stream.JsonToken;
import java.io.IOException;
import java.io.Reader;
import java.io.StringReader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * A notebook in nbformat 4 (the Jupyter notebook format, <a href="https://nbformat.readthedocs.io">
 * nbformat documentation</a>), held as its JSON tree so that everything the runner does not touch
 * (metadata, attachments, unknown fields) is written back unchanged.
 */
final class Notebook {
    private static final Gson GSON = new GsonBuilder().setPrettyPrinting().disableHtmlEscaping().create();
    private static final Pattern POSITION = Pattern.compile("at line (\\d+) column (\\d+)");

    private final JsonObject root;
    private final String name;

    private Notebook(JsonObject root, String name) {
        this.root = root;
        this.name = name;
    }

    /**
     * Reads and checks a notebook file. Every problem is a {@link NotebookFormatException} whose
     * message names the file and says what is wrong in our words: a missing or unreadable file (with
     * the operating system's reason), bytes that are not UTF-8 (with the byte offset), JSON errors
     * (line and column), or a JSON shape that is not nbformat 4 (the JSON path).
     */
    static Notebook read(Path file) throws NotebookFormatException {
        byte[] bytes;
        try {
            bytes = Files.readAllBytes(file);
        } catch (java.nio.file.NoSuchFileException e) {
            throw new NotebookFormatException("cannot read " + file + ": not found (no such file)", e);
        } catch (IOException e) {
            throw new NotebookFormatException("cannot read " + file + ": " + OutputFolder.reason(e), e);
        }
        java.nio.charset.CharsetDecoder utf8 = StandardCharsets.UTF_8.newDecoder()
                .onMalformedInput(java.nio.charset.CodingErrorAction.REPORT)
                .onUnmappableCharacter(java.nio.charset.CodingErrorAction.REPORT);
        java.nio.ByteBuffer in = java.nio.ByteBuffer.wrap(bytes);
        java.nio.CharBuffer text = java.nio.CharBuffer.allocate(bytes.length);
        java.nio.charset.CoderResult r = utf8.decode(in, text, true);
        if (r.isError()) {
            throw new NotebookFormatException(file + " is not valid UTF-8 at byte " + in.position() + " (0x"
                    + String.format("%02X", bytes[in.position()] & 0xFF) + "): notebooks are UTF-8 JSON; save it as UTF-8");
        }
        utf8.flush(text);
        text.flip();
        return parse(new StringReader(text.toString()), file.toString());
    }

    /** Parses notebook JSON; {@code name} is used in messages. */
    static Notebook parse(Reader in, String name) throws NotebookFormatException {
        JsonElement tree;
        try {
            JsonReader reader = new JsonReader(in);
            reader.setStrictness(Strictness.STRICT);
            TypeAdapter<JsonElement> adapter = GSON.getAdapter(JsonElement.class);
            tree = adapter.read(reader);
            if (reader.peek() != JsonToken.END_DOCUMENT) {
                throw new NotebookFormatException(name + " is not valid JSON: unexpected text after the end of the notebook "
                        + position(reader.toString()));
            }
        } catch (IOException | JsonParseException | IllegalStateException e) {
            String msg = e.getMessage() == null ? e.toString() : e.getMessage();
            Matcher m = POSITION.matcher(msg);
            // Gson counts the column after the character it stopped at; name the character itself.
            String where = m.find() ? "at line " + m.group(1) + ", column " + Math.max(1, Integer.parseInt(m.group(2)) - 1)
                    : "(position unknown)";
            String what = msg.replaceAll("\\s*at line \\d+ column \\d+ path \\S*", "")
                    .replaceAll("\\s*See https://\\S+", "")
                    .replaceAll("\\s*;?\\s*Use JsonReader\\.set\\w+\\([^)]*\\) to accept malformed JSON", "")
                    .replaceAll("^com\\.google\\.gson\\.[\\w.]+:\\s*", "").strip();
            throw new NotebookFormatException(name + " is not valid JSON " + where + ": " + what, e);
        }
        if (!tree.isJsonObject()) {
            throw shape(name, "$", "must be a JSON object");
        }
        JsonObject root = tree.getAsJsonObject();
        JsonElement major = root.get("nbformat");
        if (major == null || !major.isJsonPrimitive() || !major.getAsJsonPrimitive().isNumber()) {
            throw shape(name, "$.nbformat", "must be the number 4 (an nbformat 4 notebook)");
        }
        if (major.getAsInt() != 4) {
            throw shape(name, "$.nbformat", "is " + major + "; only nbformat 4 is supported "
                    + "(upgrade an older notebook to version 4 with Jupyter first)");
        }
        JsonElement cells = root.get("cells");
        if (cells == null || !cells.isJsonArray()) {
            throw shape(name, "$.cells", "must be an array of cells");
        }
        JsonArray array = cells.getAsJsonArray();
        for (int i = 0; i < array.size(); i++) {
            String path = "$.cells[" + i + "]";
            JsonElement c = array.get(i);
            if (!c.isJsonObject()) {
                throw shape(name, path, "must be an object");
            }
            JsonElement type = c.getAsJsonObject().get("cell_type");
            if (type == null || !type.isJsonPrimitive() || !List.of("code", "markdown", "raw").contains(type.getAsString())) {
                throw shape(name, path + ".cell_type", "must be \"code\", \"markdown\" or \"raw\"");
            }
            JsonElement src = c.getAsJsonObject().get("source");
            if (src == null || !(isString(src) || isStringArray(src))) {
                throw shape(name, path + ".source", "must be a string or an array of strings");
            }
        }
        return new Notebook(root, name);
    }

    private static String position(String readerDescription) {
        Matcher m = POSITION.matcher(readerDescription);
        return m.find() ? "at line " + m.group(1) + ", column " + m.group(2) : "";
    }

    private static NotebookFormatException shape(String name, String path, String problem) {
        return new NotebookFormatException(name + " is not an nbformat 4 notebook: " + path + " " + problem);
    }

    private static boolean isString(JsonElement e) {
        return e.isJsonPrimitive() && e.getAsJsonPrimitive().isString();
    }

    private static boolean isStringArray(JsonElement e) {
        if (!e.isJsonArray()) {
            return false;
        }
        for (JsonElement x : e.getAsJsonArray()) {
            if (!isString(x)) {
                return false;
            }
        }
        return true;
    }

    String name() {
        return name;
    }

    JsonObject root() {
        return root;
    }

    /** The cells, live (changes write through to the tree). */
    List<JsonObject> cells() {
        List<JsonObject> out = new ArrayList<>();
        for (JsonElement e : root.getAsJsonArray("cells")) {
            out.add(e.getAsJsonObject());
        }
        return out;
    }

    /** A deep copy, for executing without touching the parsed input. */
    Notebook copy() {
        return new Notebook(root.deepCopy(), name);
    }

    static String type(JsonObject cell) {
        return cell.get("cell_type").getAsString();
    }

    /** A multiline string field (string or array of strings) as one string. */
    static String text(JsonElement e) {
        if (e == null || e.isJsonNull()) {
            return "";
        }
        if (e.isJsonArray()) {
            StringBuilder sb = new StringBuilder();
            for (JsonElement x : e.getAsJsonArray()) {
                sb.append(x.getAsString());
            }
            return sb.toString();
        }
        return e.getAsString();
    }

    /** Splits text into the list-of-lines form nbformat uses (each line keeps its newline). */
    static JsonArray lines(String text) {
        JsonArray a = new JsonArray();
        int start = 0;
        for (int i = 0; i < text.length(); i++) {
            if (text.charAt(i) == '\n') {
                a.add(text.substring(start, i + 1));
                start = i + 1;
            }
        }
        if (start < text.length()) {
            a.add(text.substring(start));
        }
        return a;
    }

    /** True when the cell's metadata.tags contains {@code tag}. */
    static boolean hasTag(JsonObject cell, String tag) {
        JsonElement md = cell.get("metadata");
        if (md == null || !md.isJsonObject()) {
            return false;
        }
        JsonElement tags = md.getAsJsonObject().get("tags");
        if (tags == null || !tags.isJsonArray()) {
            return false;
        }
        for (JsonElement t : tags.getAsJsonArray()) {
            if (isString(t) && t.getAsString().equals(tag)) {
                return true;
            }
        }
        return false;
    }

    /**
     * The kernelspec name in the notebook's metadata ({@code metadata.kernelspec.name}), or the plain
     * kernel's name when there is none.
     */
    String kernelName() {
        JsonElement md = root.get("metadata");
        if (md != null && md.isJsonObject() && md.getAsJsonObject().get("kernelspec") instanceof JsonObject ks
                && ks.get("name") != null && isString(ks.get("name"))) {
            return ks.get("name").getAsString();
        }
        return org.microtally.notebook.session.KernelIdentity.KERNEL_NAME;
    }

    /**
     * Prepares the tree for output as an executed notebook: kernel and language metadata (the Spark
     * kernel's when the notebook names it, else the plain kernel's), provenance
     * ({@code metadata.microtally.provenance}), required
     * fields of every cell, and cell ids where the declared minor version requires them (4.5+).
     */
    void normalize() {
        boolean spark = org.microtally.notebook.session.KernelIdentity.SPARK_KERNEL_NAME.equals(kernelName());
        JsonObject md = root.has("metadata") && root.get("metadata").isJsonObject()
                ? root.getAsJsonObject("metadata") : new JsonObject();
        root.add("metadata", md);
        JsonObject kernelspec = new JsonObject();
        kernelspec.addProperty("name", spark ? org.microtally.notebook.session.KernelIdentity.SPARK_KERNEL_NAME
                : org.microtally.notebook.session.KernelIdentity.KERNEL_NAME);
        kernelspec.addProperty("display_name", spark ? org.microtally.notebook.session.KernelIdentity.SPARK_DISPLAY_NAME
                : org.microtally.notebook.session.KernelIdentity.DISPLAY_NAME);
        kernelspec.addProperty("language", org.microtally.notebook.session.KernelIdentity.LANGUAGE);
        md.add("kernelspec", kernelspec);
        JsonObject lang = GSON.toJsonTree(org.microtally.notebook.session.KernelIdentity.languageInfo()).getAsJsonObject();
        md.add("language_info", lang);
        JsonObject own = md.has("microtally") && md.get("microtally").isJsonObject() ? md.getAsJsonObject("microtally") : new JsonObject();
        own.add("provenance", GSON.toJsonTree(org.microtally.notebook.session.Provenance.of("microtally run",
                cells().stream().map(c -> type(c).equals("code") ? text(c.get("source")) : "").toList()).asMap()));
        md.add("microtally", own);
        if (!root.has("nbformat_minor") || !root.get("nbformat_minor").isJsonPrimitive()) {
            root.addProperty("nbformat_minor", 5);
        }
        int minor = root.get("nbformat_minor").getAsInt();
        int n = 0;
        java.util.Set<String> ids = new java.util.HashSet<>();
        for (JsonObject cell : cells()) {
            n++;
            if (!cell.has("metadata") || !cell.get("metadata").isJsonObject()) {
                cell.add("metadata", new JsonObject());
            }
            if (minor >= 5) {
                JsonElement id = cell.get("id");
                String s = id != null && isString(id) ? id.getAsString() : "";
                if (!s.matches("[a-zA-Z0-9_-]{1,64}") || !ids.add(s)) {
                    String fresh = "cell-" + n;
                    while (!ids.add(fresh)) {
                        fresh = fresh + "x";
                    }
                    cell.addProperty("id", fresh);
                }
            } else {
                cell.remove("id");
            }
            if (type(cell).equals("code")) {
                if (!cell.has("outputs")) {
                    cell.add("outputs", new JsonArray());
                }
                if (!cell.has("execution_count")) {
                    cell.add("execution_count", com.google.gson.JsonNull.INSTANCE);
                }
            } else {
                cell.remove("outputs");
                cell.remove("execution_count");
            }
        }
    }

    /** The notebook as JSON text (pretty-printed). */
    String toJson() {
        return GSON.toJson(root) + "\n";
    }
}
