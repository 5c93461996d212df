package org.microtally.notebook.run;

import java.util.ArrayList;
import java.util.List;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.commonmark.parser.Parser;
import org.commonmark.renderer.html.HtmlRenderer;
import org.microtally.notebook.render.Markup;
import org.microtally.notebook.render.TexMath;

/**
 * Markdown of notebook cells and {@code text/markdown} outputs as HTML for the standalone page:
 * CommonMark (the specification Jupyter's renderers follow) by the commonmark-java library, with
 * math as Jupyter writes it, {@code $...$} inline and {@code $$...$$} displayed, converted to MathML
 * by {@link TexMath} so that the page needs no script. Math is found outside code spans and fenced
 * code; {@code \$} is a literal dollar. A formula outside the supported TeX subset is shown as its
 * source in {@code <code class="mt-tex">}, with the reason in its title.
 *
 * <p>Raw HTML in the Markdown source is shown as text, not passed through, and link targets with
 * script schemes are dropped ({@code sanitizeUrls}): the page trusts no markup it did not write
 * (Jupyter itself sanitises such HTML in untrusted notebooks).
 */
final class PageMarkdown {
    private static final Parser PARSER = Parser.builder().build();
    private static final HtmlRenderer RENDERER = HtmlRenderer.builder().escapeHtml(true).sanitizeUrls(true).build();
    private static final Pattern FENCE = Pattern.compile("^\\s{0,3}(```+|~~~+)");
    private static final Pattern PLACEHOLDER = Pattern.compile("MTMATH(\\d+)X");

    private PageMarkdown() { }

    /** The HTML of a Markdown text, math as MathML. */
    static String toHtml(String markdown) {
        List<String> math = new ArrayList<>();
        String protectedText = extractMath(markdown.replace("\r\n", "\n"), math);
        String html = RENDERER.render(PARSER.parse(protectedText));
        Matcher m = PLACEHOLDER.matcher(html);
        StringBuilder sb = new StringBuilder();
        while (m.find()) {
            int i = Integer.parseInt(m.group(1));
            m.appendReplacement(sb, Matcher.quoteReplacement(i < math.size() ? math.get(i) : m.group()));
        }
        m.appendTail(sb);
        return sb.toString();
    }

    /** A formula (with or without its $ or $$ delimiters) as MathML, or its source marked as not rendered. */
    static String formula(String tex, boolean display) {
        try {
            return TexMath.toMathMl(tex, display);
        } catch (TexMath.UnsupportedTexException e) {
            String delim = display ? "$$" : "$";
            return "<code class=\"mt-tex\" title=\"" + Markup.escape("not rendered: " + e.getMessage()) + "\">"
                    + Markup.escape(delim + tex + delim) + "</code>";
        }
    }

    /** A text/latex output: its $$...$$ or $...$ delimiters removed, shown as displayed math. */
    static String latexOutput(String latex) {
        String s = latex.strip();
        if (s.startsWith("$$") && s.endsWith("$$") && s.length() >= 4) {
            s = s.substring(2, s.length() - 2);
        } else if (s.startsWith("$") && s.endsWith("$") && s.length() >= 2) {
            s = s.substring(1, s.length() - 1);
        } else if (s.startsWith("\\[") && s.endsWith("\\]")) {
            s = s.substring(2, s.length() - 2);
        }
        return formula(s.strip(), true);
    }

    /** Replaces math outside code by placeholders, collecting the rendered MathML in {@code math}. */
    static String extractMath(String text, List<String> math) {
        StringBuilder out = new StringBuilder();
        String[] lines = text.split("\n", -1);
        String fence = null;
        StringBuilder chunk = new StringBuilder();
        for (int li = 0; li < lines.length; li++) {
            String line = lines[li];
            Matcher f = FENCE.matcher(line);
            if (fence == null && f.find()) {
                out.append(replaceMath(chunk.toString(), math));
                chunk.setLength(0);
                fence = f.group(1);
                out.append(line).append(li < lines.length - 1 ? "\n" : "");
                continue;
            }
            if (fence != null) {
                if (line.strip().startsWith(fence)) {
                    fence = null;
                }
                out.append(line).append(li < lines.length - 1 ? "\n" : "");
                continue;
            }
            chunk.append(line).append(li < lines.length - 1 ? "\n" : "");
        }
        out.append(fence == null ? replaceMath(chunk.toString(), math) : chunk);
        return out.toString();
    }

    private static String replaceMath(String s, List<String> math) {
        StringBuilder out = new StringBuilder();
        int i = 0;
        while (i < s.length()) {
            char c = s.charAt(i);
            if (c == '\\' && i + 1 < s.length() && s.charAt(i + 1) == '$') {
                out.append("\\$");
                i += 2;
                continue;
            }
            if (c == '`') {
                int run = 1;
                while (i + run < s.length() && s.charAt(i + run) == '`') {
                    run++;
                }
                int close = s.indexOf("`".repeat(run), i + run);
                int end = close < 0 ? i + run : close + run;
                out.append(s, i, end);
                i = end;
                continue;
            }
            if (c == '$') {
                boolean display = i + 1 < s.length() && s.charAt(i + 1) == '$';
                int open = display ? 2 : 1;
                int close = display ? s.indexOf("$$", i + 2) : closingDollar(s, i + 1);
                if (close > i + open) {
                    String tex = s.substring(i + open, close);
                    if (display || (!Character.isWhitespace(tex.charAt(0)) && !Character.isWhitespace(tex.charAt(tex.length() - 1)))) {
                        out.append("MTMATH").append(math.size()).append('X');
                        math.add(formula(tex.strip(), display));
                        i = close + open;
                        continue;
                    }
                }
            }
            out.append(c);
            i++;
        }
        return out.toString();
    }

    /** The next unescaped '$' on the same paragraph line run (no blank line in between), or -1. */
    private static int closingDollar(String s, int from) {
        for (int j = from; j < s.length(); j++) {
            char c = s.charAt(j);
            if (c == '\\') {
                j++;
            } else if (c == '$') {
                return j;
            } else if (c == '\n' && j + 1 < s.length() && s.charAt(j + 1) == '\n') {
                return -1;
            }
        }
        return -1;
    }
}
