package org.microtally.notebook.session;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import jdk.jshell.JShell;
import jdk.jshell.Snippet;
import jdk.jshell.SourceCodeAnalysis;

/**
 * Translates the stack frames of a throwable thrown by snippet code that the engine ran itself (a
 * {@link RepeatedSnippet} re-run, outside {@code JShell.eval}) the way JShell translates them for
 * its own reports: a frame of a snippet's wrapper class becomes (class name without the wrapper
 * prefix, method name or "" for the snippet body, file "#" + snippet id, line in the snippet's
 * source), and the frames below the outermost snippet frame (reflection, the engine) are dropped.
 * Wrapper lines are mapped to source lines through JShell's public {@link SourceCodeAnalysis#wrapper}.
 */
final class SnippetFrames {
    private static final String WRAPPER_PREFIX = "REPL.$JShell$";
    private static final String BODY_METHOD = "do_it$";

    private final JShell jshell;
    private final Map<String, Snippet> byClass = new HashMap<>();
    private final Map<String, SourceCodeAnalysis.SnippetWrapper> wrappers = new HashMap<>();

    SnippetFrames(JShell jshell) {
        this.jshell = jshell;
    }

    /** The translated frames (a new array; {@code raw} is not changed). */
    StackTraceElement[] translate(StackTraceElement[] raw) {
        int last = -1;
        for (int i = 0; i < raw.length; i++) {
            if (raw[i].getClassName().startsWith(WRAPPER_PREFIX)) {
                last = i;
            }
        }
        if (last < 0) {
            return raw.clone();
        }
        List<StackTraceElement> out = new ArrayList<>();
        for (int i = 0; i <= last; i++) {
            StackTraceElement r = raw[i];
            String outer = outerClass(r.getClassName());
            Snippet s = outer == null ? null : snippetOf(outer);
            if (s == null) {
                out.add(r);
                continue;
            }
            String method = r.getMethodName().equals(BODY_METHOD) ? "" : r.getMethodName();
            String klass = r.getClassName().length() > outer.length() ? r.getClassName().substring(outer.length() + 1) : "";
            out.add(new StackTraceElement(klass, method, "#" + s.id(), sourceLine(wrappers.get(outer), r.getLineNumber())));
        }
        return out.toArray(new StackTraceElement[0]);
    }

    /** "REPL.$JShell$12" for "REPL.$JShell$12" or a nested "REPL.$JShell$12$Point", else null. */
    private static String outerClass(String name) {
        if (!name.startsWith(WRAPPER_PREFIX)) {
            return null;
        }
        int end = name.indexOf('$', WRAPPER_PREFIX.length());
        return end < 0 ? name : name.substring(0, end);
    }

    private Snippet snippetOf(String wrapperClass) {
        Snippet s = byClass.get(wrapperClass);
        if (s != null) {
            return s;
        }
        SourceCodeAnalysis analysis = jshell.sourceCodeAnalysis();
        jshell.snippets().forEach(sn -> {
            try {
                SourceCodeAnalysis.SnippetWrapper w = analysis.wrapper(sn);
                byClass.putIfAbsent(w.fullClassName(), sn);
                wrappers.putIfAbsent(w.fullClassName(), w);
            } catch (RuntimeException e) {
                // a snippet JShell keeps no wrapper for (rejected): it has no frames either
            }
        });
        return byClass.get(wrapperClass);
    }

    /** The 1-based source line of 1-based wrapper line {@code wrapperLine}, or 0 when it is not in the source. */
    static int sourceLine(SourceCodeAnalysis.SnippetWrapper w, int wrapperLine) {
        if (w == null || wrapperLine <= 0) {
            return 0;
        }
        String text = w.wrapped();
        int start = 0;
        for (int line = 1; line < wrapperLine; line++) {
            int nl = text.indexOf('\n', start);
            if (nl < 0) {
                return 0;
            }
            start = nl + 1;
        }
        int end = text.indexOf('\n', start);
        end = end < 0 ? text.length() : end;
        for (int p = start; p < end; p++) {
            int s = w.wrappedToSourcePosition(p);
            if (s >= 0) {
                return CellSplitter.lineOf(w.source(), s);
            }
        }
        return 0;
    }
}
