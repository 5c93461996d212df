package org.microtally.kernel;

import com.google.gson.GsonBuilder;
import com.sun.source.doctree.DocCommentTree;
import com.sun.source.doctree.DocTree;
import com.sun.source.doctree.EntityTree;
import com.sun.source.doctree.LinkTree;
import com.sun.source.doctree.LiteralTree;
import com.sun.source.doctree.ParamTree;
import com.sun.source.doctree.ReturnTree;
import com.sun.source.doctree.TextTree;
import com.sun.source.doctree.ValueTree;
import com.sun.source.tree.ClassTree;
import com.sun.source.tree.CompilationUnitTree;
import com.sun.source.tree.MethodTree;
import com.sun.source.tree.Tree;
import com.sun.source.tree.VariableTree;
import com.sun.source.util.DocTrees;
import com.sun.source.util.JavacTask;
import com.sun.source.util.TreePath;
import com.sun.source.util.TreePathScanner;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayDeque;
import java.util.ArrayList;
import java.util.Deque;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import java.util.stream.Stream;
import javax.lang.model.element.Modifier;
import javax.tools.JavaCompiler;
import javax.tools.JavaFileObject;
import javax.tools.StandardJavaFileManager;
import javax.tools.ToolProvider;
import org.microtally.notebook.session.DocIndex;

/**
 * Build step (kernel module, {@code process-classes}): scans the toolkit's sources with the JDK's
 * own parser (the {@code com.sun.source} tree and doc-comment API; parse only, no compilation) and
 * writes {@value DocIndex#RESOURCE}: for every public class its first Javadoc sentence, for every
 * public method and constructor its signature, first sentence, parameter docs (with the units the
 * author wrote) and return doc. A parameter documented on only one overload is documented for the
 * overloads with the same parameter name as well. Entries are sorted, so the same sources give the
 * same file.
 *
 * <p>Usage: {@code DocSummaries OUTPUT_FILE SOURCE_DIR...}
 */
final class DocSummaries {
    private DocSummaries() { }

    public static void main(String[] args) throws IOException {
        if (args.length < 2) {
            System.err.println("microtally: usage: DocSummaries OUTPUT_FILE SOURCE_DIR...");
            System.exit(2);
        }
        Map<String, Map<String, Object>> index = scan(Stream.of(args).skip(1).map(Path::of).toList());
        Path out = Path.of(args[0]);
        Files.createDirectories(out.toAbsolutePath().getParent());
        Files.writeString(out, new GsonBuilder().disableHtmlEscaping().create().toJson(index) + "\n", StandardCharsets.UTF_8);
        System.out.println("DocSummaries: " + index.size() + " entries, " + Files.size(out) / 1024 + " KiB in " + out);
    }

    /** The index of the sources under {@code roots}, keyed as {@link DocIndex} reads it. */
    static Map<String, Map<String, Object>> scan(List<Path> roots) throws IOException {
        List<Path> files = new ArrayList<>();
        for (Path root : roots) {
            try (Stream<Path> walk = Files.walk(root)) {
                walk.filter(p -> p.toString().endsWith(".java") && !p.getFileName().toString().contains("-")).sorted()
                        .forEach(files::add);
            }
        }
        JavaCompiler javac = ToolProvider.getSystemJavaCompiler();
        Map<String, Map<String, Object>> index = new TreeMap<>();
        try (StandardJavaFileManager fm = javac.getStandardFileManager(null, null, StandardCharsets.UTF_8)) {
            Iterable<? extends JavaFileObject> units = fm.getJavaFileObjectsFromPaths(files);
            JavacTask task = (JavacTask) javac.getTask(null, fm, d -> { }, List.of("-proc:none"), null, units);
            DocTrees docs = DocTrees.instance(task);
            for (CompilationUnitTree unit : task.parse()) {
                new Scanner(docs, unit, index).scan(unit, null);
            }
        }
        shareParameterDocs(index);
        return index;
    }

    /** Fills undocumented parameters from an overload (same owner and name) that documents the same parameter name. */
    @SuppressWarnings("unchecked")
    private static void shareParameterDocs(Map<String, Map<String, Object>> index) {
        Map<String, Map<String, String>> byMember = new LinkedHashMap<>();
        for (var e : index.entrySet()) {
            int paren = e.getKey().indexOf('(');
            if (paren > 0) {
                Map<String, String> known = byMember.computeIfAbsent(e.getKey().substring(0, paren), k -> new LinkedHashMap<>());
                ((Map<String, String>) e.getValue().get(DocIndex.PARAMS)).forEach((n, d) -> {
                    if (!d.isEmpty()) {
                        known.putIfAbsent(n, d);
                    }
                });
            }
        }
        for (var e : index.entrySet()) {
            int paren = e.getKey().indexOf('(');
            if (paren > 0) {
                Map<String, String> known = byMember.get(e.getKey().substring(0, paren));
                ((Map<String, String>) e.getValue().get(DocIndex.PARAMS)).replaceAll((n, d) -> d.isEmpty() ? known.getOrDefault(n, "") : d);
            }
        }
    }

    private static final class Scanner extends TreePathScanner<Void, Void> {
        private final DocTrees docs;
        private final Map<String, Map<String, Object>> index;
        private final Deque<String> owners = new ArrayDeque<>();
        private final Deque<Boolean> interfaces = new ArrayDeque<>();

        Scanner(DocTrees docs, CompilationUnitTree unit, Map<String, Map<String, Object>> index) {
            this.docs = docs;
            this.index = index;
            owners.push(unit.getPackageName() == null ? "" : unit.getPackageName().toString());
        }

        @Override
        public Void visitClass(ClassTree c, Void v) {
            boolean isPublic = c.getModifiers().getFlags().contains(Modifier.PUBLIC)
                    || (!interfaces.isEmpty() && interfaces.peek());
            String fqn = owners.peek().isEmpty() ? c.getSimpleName().toString() : owners.peek() + "." + c.getSimpleName();
            if (!isPublic || c.getSimpleName().isEmpty()) {
                return null;    // nothing inside a non-public class is visible to cells
            }
            DocCommentTree dc = docs.getDocCommentTree(getCurrentPath());
            Map<String, Object> entry = new LinkedHashMap<>();
            entry.put(DocIndex.SIGNATURE, c.getKind().name().toLowerCase(java.util.Locale.ROOT).replace('_', ' ') + " " + fqn);
            entry.put(DocIndex.SUMMARY, dc == null ? "" : text(dc.getFirstSentence()));
            entry.put(DocIndex.PARAMS, recordComponents(c, dc));
            index.put(fqn, entry);
            owners.push(fqn);
            interfaces.push(c.getKind() == Tree.Kind.INTERFACE || c.getKind() == Tree.Kind.ANNOTATION_TYPE);
            try {
                return super.visitClass(c, v);
            } finally {
                owners.pop();
                interfaces.pop();
            }
        }

        private Map<String, String> recordComponents(ClassTree c, DocCommentTree dc) {
            Map<String, String> params = new LinkedHashMap<>();
            if (dc != null && c.getKind() == Tree.Kind.RECORD) {
                for (DocTree t : dc.getBlockTags()) {
                    if (t instanceof ParamTree p && !p.isTypeParameter()) {
                        params.put(p.getName().toString(), text(p.getDescription()));
                    }
                }
            }
            return params;
        }

        @Override
        public Void visitMethod(MethodTree m, Void v) {
            boolean inInterface = interfaces.peek();
            var flags = m.getModifiers().getFlags();
            if (!(flags.contains(Modifier.PUBLIC) || (inInterface && !flags.contains(Modifier.PRIVATE)))) {
                return null;
            }
            String owner = owners.peek();
            String simpleOwner = owner.substring(owner.lastIndexOf('.') + 1);
            boolean ctor = m.getName().contentEquals("<init>");
            String name = ctor ? DocIndex.CONSTRUCTOR : m.getName().toString();
            List<String> names = new ArrayList<>();
            List<String> shown = new ArrayList<>();
            for (VariableTree p : m.getParameters()) {
                names.add(p.getName().toString());
                shown.add(p.getType() + " " + p.getName());
            }
            DocCommentTree dc = docs.getDocCommentTree(getCurrentPath());
            Map<String, String> params = new LinkedHashMap<>();
            names.forEach(n -> params.put(n, ""));
            String returns = "";
            if (dc != null) {
                for (DocTree t : dc.getBlockTags()) {
                    if (t instanceof ParamTree p && !p.isTypeParameter() && params.containsKey(p.getName().toString())) {
                        params.put(p.getName().toString(), text(p.getDescription()));
                    } else if (t instanceof ReturnTree r) {
                        returns = text(r.getDescription());
                    }
                }
            }
            String modifiers = flags.contains(Modifier.STATIC) ? "static " : "";
            String head = ctor ? simpleOwner : modifiers + m.getReturnType() + " " + simpleOwner + "." + name;
            Map<String, Object> entry = new LinkedHashMap<>();
            entry.put(DocIndex.SIGNATURE, head + "(" + String.join(", ", shown) + ")");
            entry.put(DocIndex.SUMMARY, dc == null ? "" : text(dc.getFirstSentence()));
            entry.put(DocIndex.PARAMS, params);
            entry.put(DocIndex.RETURNS, returns);
            index.put(DocIndex.memberKey(owner, name, names), entry);
            return null;
        }

        @Override
        public Void visitVariable(VariableTree node, Void v) {
            return null;
        }
    }

    /** Plain text of doc-comment nodes: inline code and links as their text, entities decoded, HTML tags dropped. */
    static String text(List<? extends DocTree> trees) {
        StringBuilder sb = new StringBuilder();
        for (DocTree t : trees) {
            if (t instanceof TextTree x) {
                sb.append(x.getBody());
            } else if (t instanceof LiteralTree x) {
                sb.append(x.getBody().getBody());
            } else if (t instanceof LinkTree x) {
                sb.append(x.getLabel().isEmpty() ? x.getReference().getSignature().replace('#', '.').replaceFirst("^\\.", "")
                        : text(x.getLabel()));
            } else if (t instanceof ValueTree x) {
                sb.append(x.getReference() == null ? "" : x.getReference().getSignature().replace('#', '.'));
            } else if (t instanceof EntityTree x) {
                sb.append(switch (x.getName().toString()) {
                    case "lt" -> "<";
                    case "gt" -> ">";
                    case "amp" -> "&";
                    case "nbsp" -> " ";
                    case "le" -> "<=";
                    case "ge" -> ">=";
                    default -> "&" + x.getName() + ";";
                });
            } else if (t.getKind() == DocTree.Kind.START_ELEMENT || t.getKind() == DocTree.Kind.END_ELEMENT) {
                String tag = t.toString().toLowerCase(java.util.Locale.ROOT);
                if (tag.startsWith("<sup")) {
                    sb.append('^');
                } else if (tag.startsWith("<sub")) {
                    sb.append('_');
                }
            } else {
                sb.append(t);
            }
        }
        return sb.toString().replaceAll("\\s+", " ").strip();
    }
}
