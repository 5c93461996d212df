package org.microtally.notebook.session;

import com.google.gson.Gson;
import com.google.gson.JsonObject;
import com.google.gson.JsonParser;
import java.io.IOException;
import java.io.InputStream;
import java.io.InputStreamReader;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;

/**
 * The toolkit's Javadoc summaries shipped in the jar ({@value #RESOURCE}, written at build time by
 * the kernel module's {@code DocSummaries} from the sources), looked up by the signatures JShell's
 * source analysis reports. JShell itself has no Javadoc for classes without sources on its path,
 * so without this index inspection shows only signatures.
 *
 * <p>Keys: a class by its canonical name ({@code org.microtally.count.CountTable}); a method or
 * constructor by {@link #memberKey} (owner's canonical name, member name or {@value #CONSTRUCTOR},
 * parameter names), which JShell's signatures carry too.
 */
public final class DocIndex {
    /** The class-path resource. */
    public static final String RESOURCE = "META-INF/microtally/javadoc-summaries.json";
    /** JSON field names of an entry. */
    public static final String SIGNATURE = "sig";
    public static final String SUMMARY = "doc";
    public static final String PARAMS = "params";
    public static final String RETURNS = "returns";
    /** The member name of constructors. */
    public static final String CONSTRUCTOR = "<init>";

    private static volatile DocIndex shipped;

    private final Map<String, Entry> entries;
    private final List<String> classes = new ArrayList<>();

    /**
     * One documented element.
     *
     * @param signature the declaration as written in the source
     * @param summary   the first sentence of its Javadoc (empty when undocumented)
     * @param params    parameter (or record component) name to its description, in order
     * @param returns   the {@code @return} description (empty when none)
     */
    public record Entry(String signature, String summary, Map<String, String> params, String returns) {
        public Entry {
            params = java.util.Collections.unmodifiableMap(new LinkedHashMap<>(params));
        }
    }

    DocIndex(Map<String, Entry> entries) {
        this.entries = Map.copyOf(entries);
        for (String k : entries.keySet()) {
            if (k.indexOf('(') < 0) {
                classes.add(k);
            }
        }
    }

    /** The key of a method or constructor. */
    public static String memberKey(String owner, String name, List<String> parameterNames) {
        return owner + "." + name + "(" + String.join(",", parameterNames) + ")";
    }

    /** The index shipped on the class path; empty (and {@link #size()} 0) when the resource is missing. */
    public static DocIndex shipped() {
        DocIndex d = shipped;
        if (d == null) {
            d = read();
            shipped = d;
        }
        return d;
    }

    private static DocIndex read() {
        Map<String, Entry> map = new LinkedHashMap<>();
        try (InputStream in = DocIndex.class.getClassLoader().getResourceAsStream(RESOURCE)) {
            if (in != null) {
                JsonObject root = JsonParser.parseReader(new InputStreamReader(in, StandardCharsets.UTF_8)).getAsJsonObject();
                Gson gson = new Gson();
                for (var e : root.entrySet()) {
                    JsonObject o = e.getValue().getAsJsonObject();
                    @SuppressWarnings("unchecked")
                    Map<String, String> params = o.has(PARAMS) ? gson.fromJson(o.get(PARAMS), LinkedHashMap.class) : Map.of();
                    map.put(e.getKey(), new Entry(o.get(SIGNATURE).getAsString(), o.get(SUMMARY).getAsString(), params,
                            o.has(RETURNS) ? o.get(RETURNS).getAsString() : ""));
                }
            }
        } catch (IOException | RuntimeException e) {
            OutputRouter.CONSOLE_ERR.println("microtally: the Javadoc summaries " + RESOURCE + " are unreadable (" + e
                    + "); inspection shows signatures only");
        }
        return new DocIndex(map);
    }

    /** Number of entries. */
    public int size() {
        return entries.size();
    }

    /**
     * The entry for a signature as JShell's {@code SourceCodeAnalysis.documentation} prints it: a
     * class name ({@code org.microtally.count.CountTable}), a method
     * ({@code CountTable CountTable.of(Spectrum spectrum, ...)}) or a constructor
     * ({@code Energy(double value, EnergyUnit unit)}); owners may be simple or qualified names.
     */
    public Optional<Entry> lookup(String jshellSignature) {
        String sig = jshellSignature.strip();
        int paren = sig.indexOf('(');
        if (paren < 0) {
            return Optional.ofNullable(entries.get(stripGenerics(sig)));
        }
        String head = stripGenerics(sig.substring(0, paren)).strip();
        int space = head.lastIndexOf(' ');
        String token = head.substring(space + 1);
        String owner;
        String member;
        if (space < 0) {
            owner = token;
            member = CONSTRUCTOR;
        } else {
            int dot = token.lastIndexOf('.');
            if (dot < 0) {
                return Optional.empty();
            }
            owner = token.substring(0, dot);
            member = token.substring(dot + 1);
        }
        int close = sig.lastIndexOf(')');
        List<String> names = parameterNames(sig.substring(paren + 1, close < paren ? sig.length() : close));
        Entry direct = entries.get(memberKey(owner, member, names));
        if (direct != null) {
            return Optional.of(direct);
        }
        for (String c : classes) {
            if (c.endsWith("." + owner)) {
                Entry e = entries.get(memberKey(c, member, names));
                if (e != null) {
                    return Optional.of(e);
                }
            }
        }
        return Optional.empty();
    }

    /** The last word of each top-level comma-separated parameter ({@code Map<K, V> m, int... n} gives m, n). */
    static List<String> parameterNames(String params) {
        List<String> names = new ArrayList<>();
        int depth = 0;
        int start = 0;
        for (int i = 0; i <= params.length(); i++) {
            char ch = i < params.length() ? params.charAt(i) : ',';
            if (ch == '<') {
                depth++;
            } else if (ch == '>') {
                depth--;
            } else if (ch == ',' && depth == 0) {
                String p = params.substring(start, i).strip();
                if (!p.isEmpty()) {
                    names.add(p.substring(p.lastIndexOf(' ') + 1).replace("...", ""));
                }
                start = i + 1;
            }
        }
        return names;
    }

    /** The declared type of each top-level comma-separated parameter, generics removed ({@code Map<K, V> m} gives Map). */
    static List<String> parameterTypes(String params) {
        List<String> types = new ArrayList<>();
        String flat = stripGenerics(params);
        for (String p : flat.split(",")) {
            String s = p.strip();
            if (!s.isEmpty()) {
                int space = s.lastIndexOf(' ');
                types.add(space < 0 ? s : s.substring(0, space).strip());
            }
        }
        return types;
    }

    static String stripGenerics(String s) {
        StringBuilder sb = new StringBuilder();
        int depth = 0;
        for (char ch : s.toCharArray()) {
            if (ch == '<') {
                depth++;
            } else if (ch == '>') {
                depth--;
            } else if (depth == 0) {
                sb.append(ch);
            }
        }
        return sb.toString();
    }
}
