package org.microtally.notebook.session;

import java.util.Optional;
import java.util.Set;
import java.util.regex.Pattern;

/**
 * The engine's shorter route for a snippet that is an expression: it is evaluated as the
 * initializer of one engine variable, {@code Object $value = (EXPRESSION);}, instead of as a bare
 * expression. For a bare expression JShell first runs a separate javac analysis to learn the
 * expression's type, so that it can declare a new temporary variable {@code $N} of that type, and
 * then compiles that declaration (five javac tasks in all, measured through JShell's task pool);
 * a declaration with a written type takes three. Measured in one JVM (bare JShell, 150 evaluations
 * of {@code 1 + 1}, loaded 2-core machine): 71 ms per bare expression against 20 ms per typed
 * declaration.
 *
 * <p>What differs for the user: such a cell does not create JShell's temporary variables
 * {@code $1, $2, ...}; the last value is kept in {@link #VARIABLE} (typed {@code Object}) and
 * replaced by the next one, so earlier values are no longer held in memory. The value shown is
 * the same object. The route is only taken where it cannot change what the snippet means:
 * {@link #declaration} returns empty for everything that might be void (anything ending in a
 * call), a declaration, a statement or a bare name, and the engine evaluates the snippet as
 * written whenever the declaration is not valid (a compile error, an unresolved name), so errors
 * are reported exactly as before. The declaration never runs code when it is not valid.
 */
final class ValueExpression {
    /** The engine variable holding the value of the last expression evaluated on this route. */
    static final String VARIABLE = "$value";

    /** First words of snippets that are not expressions (declarations and statements). */
    private static final Set<String> NOT_EXPRESSION = Set.of("import", "class", "interface", "enum", "record", "if",
            "for", "while", "do", "try", "switch", "return", "throw", "break", "continue", "assert", "synchronized",
            "final", "public", "private", "protected", "static", "abstract", "var", "void", "yield", "sealed", "default");
    /** A declaration: a type (possibly generic or an array) followed by a name and '=', ';', ',' or the end. */
    private static final Pattern DECLARATION = Pattern.compile(
            "^[A-Za-z_$][\\w$.]*(\\s*<[\\w$.<>,?\\s\\[\\]&]*>)?(\\s*\\[\\s*])*\\s+[A-Za-z_$][\\w$]*\\s*(=|;|,|$)[\\s\\S]*");
    private static final Pattern NAME = Pattern.compile("^[A-Za-z_$][\\w$]*$");

    private ValueExpression() { }

    /**
     * The declaration that evaluates {@code source} on the shorter route, or empty when the snippet
     * is not certainly a non-void expression (then it is evaluated as written).
     */
    static Optional<String> declaration(String source) {
        String s = source.strip();
        while (s.endsWith(";")) {
            s = s.substring(0, s.length() - 1).strip();
        }
        if (s.isEmpty() || s.endsWith(")") || s.endsWith("}") || s.startsWith("@") || s.startsWith("{")
                || NAME.matcher(s).matches() || DECLARATION.matcher(s).matches()) {
            return Optional.empty();
        }
        int word = 0;
        while (word < s.length() && Character.isJavaIdentifierPart(s.charAt(word))) {
            word++;
        }
        if (NOT_EXPRESSION.contains(s.substring(0, word)) || !balanced(s)) {
            return Optional.empty();
        }
        // on the first line, so that line numbers in stack traces stay those of the cell
        return Optional.of("Object " + VARIABLE + " = (" + s + "\n);");
    }

    /**
     * True when the parentheses of {@code s} (outside string, text block, character literals and
     * comments) never close more than they opened and end balanced, and there is no ';' outside
     * them: then {@code (s)} is one parenthesized expression or a syntax error, never two pieces.
     */
    static boolean balanced(String s) {
        int depth = 0;
        int i = 0;
        int n = s.length();
        while (i < n) {
            char c = s.charAt(i);
            if (s.startsWith("\"\"\"", i)) {
                int end = s.indexOf("\"\"\"", i + 3);
                while (end > 0 && s.charAt(end - 1) == '\\') {
                    end = s.indexOf("\"\"\"", end + 1);
                }
                if (end < 0) {
                    return false;
                }
                i = end + 3;
                continue;
            }
            if (c == '"' || c == '\'') {
                int j = i + 1;
                while (j < n && s.charAt(j) != c) {
                    j += s.charAt(j) == '\\' ? 2 : 1;
                }
                if (j >= n) {
                    return false;
                }
                i = j + 1;
                continue;
            }
            if (s.startsWith("//", i) || s.startsWith("/*", i)) {
                return false;   // keep it simple: a snippet with a comment takes the usual route
            }
            if (c == '(') {
                depth++;
            } else if (c == ')') {
                depth--;
                if (depth < 0) {
                    return false;
                }
            } else if (c == ';' && depth == 0) {
                return false;
            }
            i++;
        }
        return depth == 0;
    }
}
