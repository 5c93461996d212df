package org.microtally.notebook.render;

import java.util.Map;

/**
 * TeX math to MathML, for pages that must show formulas with no script and no network: browsers
 * lay out MathML themselves (MathML Core, W3C Recommendation 2023; native in Chromium since 109,
 * in Firefox and Safari for long before). Converting on the Java side keeps the page free of any
 * script, so its Content-Security-Policy can forbid scripts altogether, and adds a few hundred bytes
 * per formula instead of a typesetting library and its fonts in every page.
 *
 * <p>The TeX accepted is the subset the notebooks use, which covers most physics formulas:
 * letters, numbers and operators; groups {@code {...}}; sub- and superscripts; {@code \frac},
 * {@code \dfrac}, {@code \tfrac}, {@code \binom}, {@code \sqrt} (with an optional index);
 * {@code \left ... \right} with any delimiter; {@code \mathrm}, {@code \text}, {@code \operatorname},
 * {@code \mathbf}; accents {@code \hat \bar \tilde \dot \vec}; the Greek letters; the common
 * relations, operators, arrows, big operators, function names and spaces (the tables below).
 * Anything else is refused with {@link UnsupportedTexException} naming the command, so the caller can
 * show the source as it is: a formula is never rendered half-right.
 */
public final class TexMath {
    /** A TeX construct outside the supported subset. */
    public static final class UnsupportedTexException extends IllegalArgumentException {
        private static final long serialVersionUID = 1L;

        UnsupportedTexException(String message) {
            super(message);
        }
    }

    private static final Map<String, String> IDENTIFIERS = Map.ofEntries(
            Map.entry("alpha", "\u03b1"), Map.entry("beta", "\u03b2"), Map.entry("gamma", "\u03b3"),
            Map.entry("delta", "\u03b4"), Map.entry("epsilon", "\u03f5"), Map.entry("varepsilon", "\u03b5"),
            Map.entry("zeta", "\u03b6"), Map.entry("eta", "\u03b7"), Map.entry("theta", "\u03b8"),
            Map.entry("vartheta", "\u03d1"), Map.entry("iota", "\u03b9"), Map.entry("kappa", "\u03ba"),
            Map.entry("lambda", "\u03bb"), Map.entry("mu", "\u03bc"), Map.entry("nu", "\u03bd"),
            Map.entry("xi", "\u03be"), Map.entry("pi", "\u03c0"), Map.entry("rho", "\u03c1"),
            Map.entry("sigma", "\u03c3"), Map.entry("tau", "\u03c4"), Map.entry("upsilon", "\u03c5"),
            Map.entry("phi", "\u03d5"), Map.entry("varphi", "\u03c6"), Map.entry("chi", "\u03c7"),
            Map.entry("psi", "\u03c8"), Map.entry("omega", "\u03c9"), Map.entry("Gamma", "\u0393"),
            Map.entry("Delta", "\u0394"), Map.entry("Theta", "\u0398"), Map.entry("Lambda", "\u039b"),
            Map.entry("Xi", "\u039e"), Map.entry("Pi", "\u03a0"), Map.entry("Sigma", "\u03a3"),
            Map.entry("Phi", "\u03a6"), Map.entry("Psi", "\u03a8"), Map.entry("Omega", "\u03a9"),
            Map.entry("hbar", "\u210f"), Map.entry("ell", "\u2113"), Map.entry("infty", "\u221e"),
            Map.entry("partial", "\u2202"), Map.entry("nabla", "\u2207"));
    private static final Map<String, String> OPERATORS = Map.ofEntries(
            Map.entry("langle", "\u27e8"), Map.entry("rangle", "\u27e9"), Map.entry("approx", "\u2248"),
            Map.entry("le", "\u2264"), Map.entry("leq", "\u2264"), Map.entry("ge", "\u2265"),
            Map.entry("geq", "\u2265"), Map.entry("ne", "\u2260"), Map.entry("neq", "\u2260"),
            Map.entry("times", "\u00d7"), Map.entry("cdot", "\u22c5"), Map.entry("pm", "\u00b1"),
            Map.entry("mp", "\u2213"), Map.entry("sum", "\u2211"), Map.entry("prod", "\u220f"),
            Map.entry("int", "\u222b"), Map.entry("to", "\u2192"), Map.entry("rightarrow", "\u2192"),
            Map.entry("leftarrow", "\u2190"), Map.entry("Rightarrow", "\u21d2"), Map.entry("ll", "\u226a"),
            Map.entry("gg", "\u226b"), Map.entry("sim", "\u223c"), Map.entry("simeq", "\u2243"),
            Map.entry("propto", "\u221d"), Map.entry("equiv", "\u2261"), Map.entry("in", "\u2208"),
            Map.entry("ldots", "\u2026"), Map.entry("dots", "\u2026"), Map.entry("cdots", "\u22ef"),
            Map.entry("mid", "|"), Map.entry("{", "{"), Map.entry("}", "}"), Map.entry("%", "%"),
            Map.entry("_", "_"), Map.entry("lbrace", "{"), Map.entry("rbrace", "}"), Map.entry("vert", "|"),
            Map.entry("lvert", "|"), Map.entry("rvert", "|"), Map.entry("ast", "\u2217"));
    /** Delimiter commands: fixed size unless after {@code \left} or {@code \right}. */
    private static final java.util.Set<String> FENCES = java.util.Set.of("langle", "rangle", "{", "}", "lbrace",
            "rbrace", "vert", "lvert", "rvert", "mid");
    private static final java.util.Set<String> FUNCTIONS = java.util.Set.of("ln", "log", "exp", "sin", "cos",
            "tan", "sinh", "cosh", "tanh", "min", "max", "lim", "det", "arg", "deg", "dim", "Var");
    private static final Map<String, String> SPACES = Map.of(",", "0.1667em", ":", "0.2222em", ";", "0.2778em",
            " ", "0.25em", "quad", "1em", "qquad", "2em", "!", "-0.1667em");
    private static final Map<String, String> ACCENTS = Map.of("hat", "^", "bar", "\u00af", "tilde", "~",
            "dot", "\u02d9", "vec", "\u2192", "overline", "\u00af");

    private final String src;
    private int pos;

    private TexMath(String src) {
        this.src = src;
    }

    /**
     * The formula as a MathML {@code <math>} element ({@code display="block"} when {@code display}),
     * with the TeX source kept as its annotation, so that it can be copied.
     *
     * @throws UnsupportedTexException for a construct outside the subset, or unbalanced braces
     */
    public static String toMathMl(String tex, boolean display) {
        TexMath p = new TexMath(tex);
        String body = p.sequence('\0');
        if (p.pos < tex.length()) {
            throw new UnsupportedTexException("unbalanced '}' at position " + p.pos + " in TeX: " + tex);
        }
        return "<math xmlns=\"http://www.w3.org/1998/Math/MathML\"" + (display ? " display=\"block\"" : "")
                + "><semantics><mrow>" + body + "</mrow><annotation encoding=\"application/x-tex\">"
                + Markup.escape(tex) + "</annotation></semantics></math>";
    }

    /** Parses atoms with their scripts until {@code end} (or the end of input for '\0'). */
    private String sequence(char end) {
        StringBuilder out = new StringBuilder();
        while (true) {
            skipSpace();
            if (pos >= src.length()) {
                if (end != '\0') {
                    throw new UnsupportedTexException("missing '" + end + "' in TeX: " + src);
                }
                return out.toString();
            }
            char c = src.charAt(pos);
            if (c == end) {
                return out.toString();
            }
            if (end == '\0' && c == '}') {
                return out.toString();
            }
            if (src.startsWith("\\right", pos) && end == 'R') {
                return out.toString();
            }
            out.append(scripted());
        }
    }

    private String scripted() {
        String base = atom();
        String sub = null;
        String sup = null;
        while (true) {
            skipSpace();
            if (pos < src.length() && (src.charAt(pos) == '_' || src.charAt(pos) == '^')) {
                char k = src.charAt(pos++);
                skipSpace();
                String arg = argument();
                if (k == '_') {
                    sub = arg;
                } else {
                    sup = arg;
                }
            } else if (pos < src.length() && src.charAt(pos) == '\'') {
                pos++;
                sup = (sup == null ? "" : sup) + "<mo>\u2032</mo>";
            } else {
                break;
            }
        }
        if (sub != null && sup != null) {
            return "<msubsup>" + base + row(sub) + row(sup) + "</msubsup>";
        }
        if (sub != null) {
            return "<msub>" + base + row(sub) + "</msub>";
        }
        if (sup != null) {
            return "<msup>" + base + row(sup) + "</msup>";
        }
        return base;
    }

    /** One argument: a group, a command with its arguments, or one character. */
    private String argument() {
        if (pos >= src.length()) {
            throw new UnsupportedTexException("missing argument at the end of TeX: " + src);
        }
        if (src.charAt(pos) == '{') {
            pos++;
            String inner = sequence('}');
            pos++;
            return "<mrow>" + inner + "</mrow>";
        }
        return atom();
    }

    private String atom() {
        char c = src.charAt(pos);
        if (c == '{') {
            return argument();
        }
        if (c == '\\') {
            return command();
        }
        if (Character.isDigit(c) || (c == '.' && pos + 1 < src.length() && Character.isDigit(src.charAt(pos + 1)))) {
            int start = pos;
            while (pos < src.length() && (Character.isDigit(src.charAt(pos)) || src.charAt(pos) == '.')) {
                pos++;
            }
            return "<mn>" + src.substring(start, pos) + "</mn>";
        }
        pos++;
        if (Character.isLetter(c)) {
            return "<mi>" + Markup.escape(String.valueOf(c)) + "</mi>";
        }
        if ("()[]|/".indexOf(c) >= 0) {
            return fixedSize(String.valueOf(c));
        }
        if ("+-=<>,;:!*".indexOf(c) >= 0) {
            String op = c == '-' ? "\u2212" : c == '*' ? "\u2217" : String.valueOf(c);
            return "<mo>" + Markup.escape(op) + "</mo>";
        }
        if (c == '&' || c == '#' || c == '$' || c == '~' || c == '^' || c == '_') {
            throw new UnsupportedTexException("'" + c + "' at position " + (pos - 1) + " is not supported in TeX: " + src);
        }
        return "<mo>" + Markup.escape(String.valueOf(c)) + "</mo>";
    }

    private String command() {
        pos++;
        int start = pos;
        if (pos < src.length() && !Character.isLetter(src.charAt(pos))) {
            pos++;
        } else {
            while (pos < src.length() && Character.isLetter(src.charAt(pos))) {
                pos++;
            }
        }
        String name = src.substring(start, pos);
        if (IDENTIFIERS.containsKey(name)) {
            String v = IDENTIFIERS.get(name);
            return Character.isUpperCase(name.charAt(0)) ? "<mi mathvariant=\"normal\">" + v + "</mi>" : "<mi>" + v + "</mi>";
        }
        if (name.equals("mid")) {
            return "<mo stretchy=\"false\">|</mo>";   // a relation in TeX: spaced, unlike a plain |
        }
        if (FENCES.contains(name)) {
            return fixedSize(OPERATORS.get(name));
        }
        if (OPERATORS.containsKey(name)) {
            return "<mo>" + Markup.escape(OPERATORS.get(name)) + "</mo>";
        }
        if (FUNCTIONS.contains(name)) {
            // TeX puts a thin space between an operator name and an ordinary symbol on either side,
            // none before an opening delimiter (The TeXbook, ch. 18, the inter-atom spacing table):
            // \ln L, k \ln 2 get it, \ln(2) does not. MathML's function application has no width.
            int before = start - 2;
            while (before >= 0 && Character.isWhitespace(src.charAt(before))) {
                before--;
            }
            int after = pos;
            while (after < src.length() && Character.isWhitespace(src.charAt(after))) {
                after++;
            }
            char next = after < src.length() ? src.charAt(after) : '\0';
            if (next == '^' || next == '_') {
                return "<mi>" + name + "</mi><mo>\u2061</mo>";   // scripts attach to the name as before
            }
            boolean spaceBefore = before >= 0 && "({[,=+-<>|".indexOf(src.charAt(before)) < 0;
            boolean spaceAfter = next != '\0' && next != '(' && next != '['
                    && !(next == '\\' && after + 1 < src.length() && !Character.isLetter(src.charAt(after + 1)))
                    && !src.startsWith("\\left", after);
            return (spaceBefore ? "<mspace width=\"0.1667em\"/>" : "") + "<mi>" + name + "</mi><mo"
                    + (spaceAfter ? " rspace=\"0.1667em\"" : "") + ">\u2061</mo>";
        }
        if (SPACES.containsKey(name)) {
            return "<mspace width=\"" + SPACES.get(name) + "\"/>";
        }
        if (ACCENTS.containsKey(name)) {
            skipSpace();
            return "<mover accent=\"true\">" + row(argument()) + "<mo>" + ACCENTS.get(name) + "</mo></mover>";
        }
        switch (name) {
            case "frac", "dfrac", "tfrac" -> {
                skipSpace();
                String num = argument();
                skipSpace();
                return "<mfrac>" + row(num) + row(argument()) + "</mfrac>";
            }
            case "binom" -> {
                skipSpace();
                String top = argument();
                skipSpace();
                return "<mrow><mo>(</mo><mfrac linethickness=\"0\">" + row(top) + row(argument())
                        + "</mfrac><mo>)</mo></mrow>";
            }
            case "sqrt" -> {
                skipSpace();
                if (pos < src.length() && src.charAt(pos) == '[') {
                    pos++;
                    String index = sequence(']');
                    pos++;
                    skipSpace();
                    return "<mroot>" + row(argument()) + "<mrow>" + index + "</mrow></mroot>";
                }
                return "<msqrt>" + row(argument()) + "</msqrt>";
            }
            case "mathrm", "operatorname", "text", "mathbf", "textrm", "mbox" -> {
                skipSpace();
                String text = rawGroup();
                if (name.equals("mathbf")) {
                    return "<mi mathvariant=\"bold\">" + Markup.escape(text) + "</mi>";
                }
                return name.startsWith("text") || name.equals("mbox") ? "<mtext>" + Markup.escape(text) + "</mtext>"
                        : "<mi mathvariant=\"normal\">" + Markup.escape(text) + "</mi>";
            }
            case "left" -> {
                String open = delimiter();
                String inner = sequence('R');
                if (!src.startsWith("\\right", pos)) {
                    throw new UnsupportedTexException("\\left without \\right in TeX: " + src);
                }
                pos += "\\right".length();
                String close = delimiter();
                return "<mrow>" + open + inner + close + "</mrow>";
            }
            default -> throw new UnsupportedTexException("\\" + name + " is not in the supported TeX subset: " + src);
        }
    }

    /** A delimiter after \left or \right: one character or a delimiter command; '.' is none. */
    private String delimiter() {
        skipSpace();
        if (pos >= src.length()) {
            throw new UnsupportedTexException("missing delimiter at the end of TeX: " + src);
        }
        if (src.charAt(pos) == '.') {
            pos++;
            return "";
        }
        String atom = atom();
        return atom.replace("<mo stretchy=\"false\">", "<mo stretchy=\"true\">").replace("<mo>", "<mo stretchy=\"true\">");
    }

    /**
     * A delimiter written without {@code \left}/{@code \right}: TeX sets it at its normal size
     * whatever stands between (The TeXbook, ch. 17: only {@code \left ... \right} grows a
     * delimiter to fit the enclosed subformula). MathML's operator dictionary makes fences and the
     * solidus stretchy by default, so that {@code g(E)} next to a fraction in the same row would get
     * parentheses as tall as the fraction; {@code stretchy="false"} keeps TeX's rule.
     */
    private static String fixedSize(String delimiter) {
        // TeX sets '/' and '|' as ordinary symbols, without the operator spacing MathML gives them
        // (The TeXbook, ch. 17 and appendix B: both have math class 0); |x \pm 1| has no space inside the bars
        String spacing = delimiter.equals("/") || delimiter.equals("|") ? " lspace=\"0\" rspace=\"0\"" : "";
        return "<mo stretchy=\"false\"" + spacing + ">" + Markup.escape(delimiter) + "</mo>";
    }

    /** The literal text of a {...} group (for \text and \mathrm), braces balanced. */
    private String rawGroup() {
        if (pos >= src.length() || src.charAt(pos) != '{') {
            throw new UnsupportedTexException("a {group} must follow \\mathrm/\\text in TeX: " + src);
        }
        int depth = 0;
        int start = pos + 1;
        for (; pos < src.length(); pos++) {
            char c = src.charAt(pos);
            if (c == '{') {
                depth++;
            } else if (c == '}' && --depth == 0) {
                pos++;
                return src.substring(start, pos - 1).replace("\\ ", " ").replace("\\,", " ");
            }
        }
        throw new UnsupportedTexException("missing '}' in TeX: " + src);
    }

    private static String row(String s) {
        return s.startsWith("<mrow>") && s.endsWith("</mrow>") ? s : "<mrow>" + s + "</mrow>";
    }

    private void skipSpace() {
        while (pos < src.length() && Character.isWhitespace(src.charAt(pos))) {
            pos++;
        }
    }
}
