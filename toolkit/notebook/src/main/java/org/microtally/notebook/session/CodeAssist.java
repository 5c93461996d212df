package org.microtally.notebook.session;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Optional;
import jdk.jshell.SourceCodeAnalysis;
import jdk.jshell.SourceCodeAnalysis.CompletionInfo;

/**
 * The editor's questions about code: completion, inspection and completeness, from JShell's source
 * analysis plus the toolkit's shipped Javadoc summaries ({@link DocIndex}).
 *
 * <p>Completion inside a call's argument list ({@code CountTable.of(sp, |}) offers first what fits
 * the argument position in one of the overloads: in-scope variables of a matching type (JShell's own
 * type match) and the public constants of the parameter's type ({@code Statistics.BOSE}); every
 * other name in scope follows only once a prefix has been typed, or when nothing fits. The overload
 * signatures come with the reply ({@link Completions#signatures()}).
 */
final class CodeAssist {
    private final SourceCodeAnalysis analysis;
    private final CellSplitter splitter;
    private final DocIndex docs;

    CodeAssist(SourceCodeAnalysis analysis, CellSplitter splitter) {
        this(analysis, splitter, DocIndex.shipped());
    }

    CodeAssist(SourceCodeAnalysis analysis, CellSplitter splitter, DocIndex docs) {
        this.analysis = analysis;
        this.splitter = splitter;
        this.docs = docs;
    }

    Completions complete(String code, int cursor) {
        int c = Math.max(0, Math.min(cursor, code.length()));
        int[] seg = splitter.segmentAt(code, c);
        String text = code.substring(seg[0], seg[1]);
        int rel = c - seg[0];
        int[] anchor = new int[1];
        List<SourceCodeAnalysis.Suggestion> suggestions = analysis.completionSuggestions(text, rel, anchor);
        String prefix = text.substring(Math.min(anchor[0], rel), rel);
        LinkedHashMap<String, String> fitting = new LinkedHashMap<>();
        LinkedHashSet<String> other = new LinkedHashSet<>();
        for (SourceCodeAnalysis.Suggestion s : suggestions) {
            if (s.matchesType()) {
                fitting.putIfAbsent(s.continuation(), "variable");
            } else {
                other.add(s.continuation());
            }
        }
        List<String> signatures = List.of();
        int open = CallSite.openParen(text, rel);
        if (open >= 0) {
            signatures = analysis.documentation(text.substring(0, rel), rel, false).stream()
                    .map(SourceCodeAnalysis.Documentation::signature).filter(sig -> sig.contains("(")).toList();
            int arg = CallSite.argumentIndex(text, open, rel);
            for (String type : CallSite.parameterTypesAt(signatures, arg)) {
                for (String constant : constantsOf(type)) {
                    if (constant.startsWith(prefix) || constant.substring(constant.indexOf('.') + 1).startsWith(prefix)) {
                        fitting.putIfAbsent(constant.startsWith(prefix) ? constant : constant.substring(constant.indexOf('.') + 1),
                                "constant");
                    }
                }
            }
        }
        List<String> matches = new ArrayList<>(fitting.keySet());
        List<String> kinds = new ArrayList<>(fitting.values());
        if (open < 0 || !prefix.isEmpty() || fitting.isEmpty()) {
            for (String o : other) {
                if (!fitting.containsKey(o)) {
                    matches.add(o);
                    kinds.add("");
                }
            }
        }
        return new Completions(matches, seg[0] + Math.min(anchor[0], rel), c, kinds, signatures);
    }

    /**
     * The public static fields of the reference type {@code type} (as a signature names it, simple or
     * qualified) whose type is that type itself, as {@code Type.NAME}; empty for primitives and types
     * this class loader cannot see.
     */
    private List<String> constantsOf(String type) {
        if (type.isEmpty() || Character.isLowerCase(type.charAt(0)) && !type.contains(".")) {
            return List.of();
        }
        List<SourceCodeAnalysis.Documentation> d = analysis.documentation(type, type.length(), false);
        String fqn = d.isEmpty() ? type : DocIndex.stripGenerics(d.get(0).signature()).strip();
        Class<?> k = CallSite.load(fqn);
        if (k == null) {
            return List.of();
        }
        String shown = type.contains(".") ? type.substring(type.lastIndexOf('.') + 1) : type;
        List<String> out = new ArrayList<>();
        for (java.lang.reflect.Field f : k.getFields()) {
            int mod = f.getModifiers();
            if (java.lang.reflect.Modifier.isStatic(mod) && k.isAssignableFrom(f.getType())) {
                out.add(shown + "." + f.getName());
            }
        }
        return out;
    }

    Optional<String> inspect(String code, int cursor) {
        int c = Math.max(0, Math.min(cursor, code.length()));
        int[] seg = splitter.segmentAt(code, c);
        String text = code.substring(seg[0], seg[1]);
        int rel = c - seg[0];
        List<SourceCodeAnalysis.Documentation> found = analysis.documentation(text, rel, true);
        if (found.isEmpty()) {
            // On a name rather than inside its parentheses: ask as if the call were opened.
            int end = rel;
            while (end < text.length() && Character.isJavaIdentifierPart(text.charAt(end))) {
                end++;
            }
            String opened = text.substring(0, end) + "(";
            found = analysis.documentation(opened, opened.length(), true);
            if (found.isEmpty()) {
                found = analysis.documentation(text.substring(0, end), end, true);
            }
        }
        if (found.isEmpty()) {
            return Optional.empty();
        }
        StringBuilder sb = new StringBuilder();
        for (SourceCodeAnalysis.Documentation d : found) {
            if (sb.length() > 0) {
                sb.append('\n');
            }
            sb.append(d.signature());
            Optional<DocIndex.Entry> shipped = docs.lookup(d.signature());
            if (shipped.isPresent()) {
                describe(sb, shipped.get());
            } else {
                String first = firstSentence(d.javadoc());
                if (!first.isEmpty()) {
                    sb.append("\n    ").append(first);
                }
            }
        }
        return Optional.of(sb.toString());
    }

    /** The summary, parameter docs (aligned names) and return doc of an entry, indented under its signature. */
    private static void describe(StringBuilder sb, DocIndex.Entry e) {
        if (!e.summary().isEmpty()) {
            sb.append("\n    ").append(e.summary());
        }
        int width = e.params().keySet().stream().mapToInt(String::length).max().orElse(0);
        e.params().forEach((name, doc) -> {
            if (!doc.isEmpty()) {
                sb.append("\n      ").append(name).append(" ".repeat(width - name.length() + 2)).append(doc);
            }
        });
        if (!e.returns().isEmpty()) {
            sb.append("\n      returns ").append(e.returns());
        }
    }

    static String firstSentence(String javadoc) {
        if (javadoc == null) {
            return "";
        }
        String text = javadoc.replaceAll("(?s)<[^>]*>", "").replaceAll("\\{@\\w+\\s+([^}]*)}", "$1");
        int tag = text.indexOf("\n@");
        if (tag >= 0) {
            text = text.substring(0, tag);
        }
        text = text.replaceAll("\\s+", " ").strip();
        int dot = text.indexOf(". ");
        return dot >= 0 ? text.substring(0, dot + 1) : text;
    }

    Completeness completeness(String code) {
        String rest = code;
        while (true) {
            if (rest.isBlank()) {
                return new Completeness(Completeness.Status.COMPLETE, "");
            }
            CompletionInfo ci = analysis.analyzeCompletion(rest);
            switch (ci.completeness()) {
                case EMPTY:
                    return new Completeness(Completeness.Status.COMPLETE, "");
                case COMPLETE:
                case COMPLETE_WITH_SEMI:
                    if (ci.remaining().length() >= rest.length()) {
                        return new Completeness(Completeness.Status.COMPLETE, "");
                    }
                    rest = ci.remaining();
                    break;
                case DEFINITELY_INCOMPLETE:
                case CONSIDERED_INCOMPLETE:
                    return new Completeness(Completeness.Status.INCOMPLETE, "    ".repeat(Math.max(0, openBraces(code))));
                default:
                    return new Completeness(Completeness.Status.INVALID, "");
            }
        }
    }

    private static int openBraces(String code) {
        int depth = 0;
        JavaText scan = JavaText.scan(code, 0, code.length());
        for (int i = scan.next(); i >= 0; i = scan.next()) {
            char ch = code.charAt(i);
            if (ch == '{' || ch == '(') {
                depth++;
            } else if (ch == '}' || ch == ')') {
                depth--;
            }
        }
        return depth;
    }
}
