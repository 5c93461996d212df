package org.microtally.notebook.session;

import java.util.ArrayList;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Optional;
import jdk.jshell.SourceCodeAnalysis;
import jdk.jshell.SourceCodeAnalysis.CompletionInfo;

/** The editor's questions about code: completion, inspection and completeness, from JShell's source analysis. */
final class CodeAssist {
    private final SourceCodeAnalysis analysis;
    private final CellSplitter splitter;

    CodeAssist(SourceCodeAnalysis analysis, CellSplitter splitter) {
        this.analysis = analysis;
        this.splitter = splitter;
    }

    Completions complete(String code, int cursor) {
        int c = Math.max(0, Math.min(cursor, code.length()));
        int[] seg = splitter.segmentAt(code, c);
        String text = code.substring(seg[0], seg[1]);
        int[] anchor = new int[1];
        List<SourceCodeAnalysis.Suggestion> suggestions = analysis.completionSuggestions(text, c - seg[0], anchor);
        LinkedHashSet<String> typed = new LinkedHashSet<>();
        LinkedHashSet<String> other = new LinkedHashSet<>();
        for (SourceCodeAnalysis.Suggestion s : suggestions) {
            (s.matchesType() ? typed : other).add(s.continuation());
        }
        typed.addAll(other);
        return new Completions(new ArrayList<>(typed), seg[0] + anchor[0], c);
    }

    Optional<String> inspect(String code, int cursor) {
        int c = Math.max(0, Math.min(cursor, code.length()));
        int[] seg = splitter.segmentAt(code, c);
        String text = code.substring(seg[0], seg[1]);
        int rel = c - seg[0];
        List<SourceCodeAnalysis.Documentation> docs = analysis.documentation(text, rel, true);
        if (docs.isEmpty()) {
            // On a name rather than inside its parentheses: ask as if the call were opened.
            int end = rel;
            while (end < text.length() && Character.isJavaIdentifierPart(text.charAt(end))) {
                end++;
            }
            String opened = text.substring(0, end) + "(";
            docs = analysis.documentation(opened, opened.length(), true);
        }
        if (docs.isEmpty()) {
            return Optional.empty();
        }
        StringBuilder sb = new StringBuilder();
        for (SourceCodeAnalysis.Documentation d : docs) {
            if (sb.length() > 0) {
                sb.append('\n');
            }
            sb.append(d.signature());
            String first = firstSentence(d.javadoc());
            if (!first.isEmpty()) {
                sb.append("\n    ").append(first);
            }
        }
        return Optional.of(sb.toString());
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
        boolean str = false;
        boolean chr = false;
        for (int i = 0; i < code.length(); i++) {
            char ch = code.charAt(i);
            if ((str || chr) && ch == '\\') {
                i++;
            } else if (ch == '"' && !chr) {
                str = !str;
            } else if (ch == '\'' && !str) {
                chr = !chr;
            } else if (!str && !chr) {
                if (ch == '{' || ch == '(') {
                    depth++;
                } else if (ch == '}' || ch == ')') {
                    depth--;
                }
            }
        }
        return depth;
    }
}
