package org.microtally.notebook.session;

import java.util.LinkedHashSet;
import java.util.List;
import java.util.Set;

/** Where the cursor stands in a call: the call's open parenthesis and the argument position, by a scan of the text. */
final class CallSite {
    private CallSite() { }

    /**
     * The index of the unclosed {@code (} of a call around {@code cursor} (a name must precede it), or
     * -1; string and character literals are skipped.
     */
    static int openParen(String text, int cursor) {
        java.util.ArrayDeque<Integer> opens = new java.util.ArrayDeque<>();
        JavaText code = JavaText.scan(text, 0, cursor);
        for (int i = code.next(); i >= 0; i = code.next()) {
            char ch = text.charAt(i);
            if (ch == '(' || ch == '[' || ch == '{') {
                opens.push(ch == '(' ? i : -1 - i);
            } else if ((ch == ')' || ch == ']' || ch == '}') && !opens.isEmpty()) {
                opens.pop();
            } else if (ch == ';') {
                opens.clear();
            }
        }
        if (opens.isEmpty() || opens.peek() < 0) {
            return -1;
        }
        int open = opens.peek();
        int j = open - 1;
        while (j >= 0 && Character.isWhitespace(text.charAt(j))) {
            j--;
        }
        return j >= 0 && Character.isJavaIdentifierPart(text.charAt(j)) ? open : -1;
    }

    /** The 0-based argument index at {@code cursor} in the call opened at {@code open} (top-level commas before it; string and
     * character literals are skipped). */
    static int argumentIndex(String text, int open, int cursor) {
        int depth = 0;
        int commas = 0;
        JavaText code = JavaText.scan(text, open + 1, cursor);
        for (int i = code.next(); i >= 0; i = code.next()) {
            char ch = text.charAt(i);
            if (ch == '(' || ch == '[' || ch == '{' || ch == '<') {
                depth++;
            } else if (ch == ')' || ch == ']' || ch == '}' || ch == '>') {
                depth--;
            } else if (ch == ',' && depth == 0) {
                commas++;
            }
        }
        return commas;
    }

    /** The distinct parameter types at position {@code arg} over the overload signatures that have that many parameters. */
    static Set<String> parameterTypesAt(List<String> signatures, int arg) {
        Set<String> types = new LinkedHashSet<>();
        for (String sig : signatures) {
            int p = sig.indexOf('(');
            int q = sig.lastIndexOf(')');
            if (p < 0 || q < p) {
                continue;
            }
            List<String> t = DocIndex.parameterTypes(sig.substring(p + 1, q));
            if (arg < t.size()) {
                types.add(t.get(arg).replace("...", "").strip());
            } else if (!t.isEmpty() && t.get(t.size() - 1).endsWith("...")) {
                types.add(t.get(t.size() - 1).replace("...", "").strip());
            }
        }
        return types;
    }

    /** The class named {@code fqn} (nested classes with dots too) without initialising it, or null when this loader does not see it. */
    static Class<?> load(String fqn) {
        String name = fqn;
        for (int tries = 0; tries < 4; tries++) {
            try {
                return Class.forName(name, false, CallSite.class.getClassLoader());
            } catch (ClassNotFoundException | LinkageError e) {
                int dot = name.lastIndexOf('.');
                if (dot < 0) {
                    return null;
                }
                name = name.substring(0, dot) + "$" + name.substring(dot + 1);
            }
        }
        return null;
    }
}
