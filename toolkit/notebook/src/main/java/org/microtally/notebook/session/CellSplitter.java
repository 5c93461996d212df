package org.microtally.notebook.session;

import java.util.ArrayList;
import java.util.List;
import jdk.jshell.SourceCodeAnalysis;
import jdk.jshell.SourceCodeAnalysis.CompletionInfo;

/**
 * Splits a cell into the snippets JShell evaluates one by one ({@code analyzeCompletion} loop), and
 * maps offsets in the cell to lines and columns.
 */
final class CellSplitter {
    /** A snippet of a cell: the source given to JShell and where it stands in the cell. */
    record Piece(String source, int start, int end) { }

    private final SourceCodeAnalysis analysis;

    CellSplitter(SourceCodeAnalysis analysis) {
        this.analysis = analysis;
    }

    List<Piece> split(String code) {
        List<Piece> pieces = new ArrayList<>();
        int pos = 0;
        while (pos < code.length()) {
            String rest = code.substring(pos);
            if (rest.isBlank()) {
                break;
            }
            CompletionInfo ci = analysis.analyzeCompletion(rest);
            SourceCodeAnalysis.Completeness c = ci.completeness();
            if (c == SourceCodeAnalysis.Completeness.EMPTY) {
                break;
            }
            String source;
            int consumed;
            if (c.isComplete() && ci.source() != null) {
                source = ci.source();
                consumed = rest.length() - ci.remaining().length();
                if (consumed <= 0) {
                    consumed = rest.length();
                }
            } else {
                source = rest;
                consumed = rest.length();
            }
            source = source.stripLeading();   // so that line 1 of the snippet is the line it starts on
            pieces.add(new Piece(source, pos + offsetIn(rest, source), pos + consumed));
            pos += consumed;
        }
        return pieces;
    }

    /** {start, end} of the snippet of {@code code} that contains offset {@code cursor}. */
    int[] segmentAt(String code, int cursor) {
        int start = 0;
        for (Piece p : split(code)) {
            if (cursor <= p.end()) {
                return new int[] {start, p.end()};
            }
            start = p.end();
        }
        return new int[] {Math.min(start, code.length()), code.length()};
    }

    /** Where {@code source} (possibly with a semicolon added by the analysis) starts in {@code text}. */
    private static int offsetIn(String text, String source) {
        String core = source.endsWith(";") ? source.substring(0, source.length() - 1) : source;
        core = core.strip();
        if (!core.isEmpty()) {
            int i = text.indexOf(core);
            if (i >= 0) {
                int j = source.indexOf(core);
                return Math.max(0, i - Math.max(0, j));
            }
        }
        int i = 0;
        while (i < text.length() && Character.isWhitespace(text.charAt(i))) {
            i++;
        }
        return i;
    }

    /** 1-based line of offset {@code pos} in {@code code}. */
    static int lineOf(String code, int pos) {
        int line = 1;
        for (int i = 0; i < Math.min(pos, code.length()); i++) {
            if (code.charAt(i) == '\n') {
                line++;
            }
        }
        return line;
    }

    static int columnOf(String code, int pos) {
        int p = Math.min(pos, code.length());
        int lineStart = code.lastIndexOf('\n', p - 1) + 1;
        return p - lineStart + 1;
    }

    static String lineText(String code, int line) {
        String[] lines = code.split("\n", -1);
        return line >= 1 && line <= lines.length ? lines[line - 1] : "";
    }
}
