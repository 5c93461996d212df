package org.microtally.notebook.run;

import java.util.ArrayList;
import java.util.List;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * A small Markdown-to-HTML converter for notebook text cells: ATX headings, paragraphs, emphasis
 * and strong emphasis, inline code, fenced and indented code blocks, bullet and numbered lists (one
 * level), block quotes, horizontal rules, links and images. Everything else is escaped text;
 * inline and display math ({@code $...$}, {@code $$...$$}) is kept as text for a math renderer or
 * the reader. Raw HTML in the source is escaped, not passed through.
 */
final class Markdown {
    private static final Pattern HEADING = Pattern.compile("^(#{1,6})\\s+(.*?)\\s*#*\\s*$");
    private static final Pattern BULLET = Pattern.compile("^\\s{0,3}[-*+]\\s+(.*)$");
    private static final Pattern NUMBERED = Pattern.compile("^\\s{0,3}\\d{1,9}[.)]\\s+(.*)$");
    private static final Pattern RULE = Pattern.compile("^\\s{0,3}([-*_])(\\s*\\1){2,}\\s*$");
    private static final Pattern FENCE = Pattern.compile("^\\s{0,3}(```+|~~~+)\\s*([\\w+-]*).*$");

    private Markdown() { }

    static String toHtml(String markdown) {
        String[] lines = markdown.replace("\r\n", "\n").split("\n", -1);
        StringBuilder out = new StringBuilder();
        List<String> para = new ArrayList<>();
        int i = 0;
        while (i < lines.length) {
            String line = lines[i];
            Matcher fence = FENCE.matcher(line);
            if (fence.matches()) {
                flushParagraph(out, para);
                String marker = fence.group(1);
                String lang = fence.group(2);
                StringBuilder code = new StringBuilder();
                i++;
                while (i < lines.length && !lines[i].strip().startsWith(marker)) {
                    code.append(lines[i]).append('\n');
                    i++;
                }
                i++;
                out.append("<pre><code").append(lang.isEmpty() ? "" : " class=\"language-" + escape(lang) + "\"")
                        .append('>').append(escape(code.toString())).append("</code></pre>\n");
                continue;
            }
            if (line.isBlank()) {
                flushParagraph(out, para);
                i++;
                continue;
            }
            Matcher h = HEADING.matcher(line);
            if (h.matches()) {
                flushParagraph(out, para);
                int level = h.group(1).length();
                out.append("<h").append(level).append('>').append(inline(h.group(2))).append("</h").append(level).append(">\n");
                i++;
                continue;
            }
            if (RULE.matcher(line).matches() && para.isEmpty()) {
                out.append("<hr>\n");
                i++;
                continue;
            }
            if (line.startsWith("    ") && para.isEmpty()) {
                StringBuilder code = new StringBuilder();
                while (i < lines.length && (lines[i].startsWith("    ") || lines[i].isBlank())) {
                    code.append(lines[i].length() >= 4 ? lines[i].substring(4) : "").append('\n');
                    i++;
                }
                out.append("<pre><code>").append(escape(code.toString().stripTrailing() + "\n")).append("</code></pre>\n");
                continue;
            }
            if (line.stripLeading().startsWith(">")) {
                flushParagraph(out, para);
                StringBuilder quoted = new StringBuilder();
                while (i < lines.length && lines[i].stripLeading().startsWith(">")) {
                    String q = lines[i].stripLeading().substring(1);
                    quoted.append(q.startsWith(" ") ? q.substring(1) : q).append('\n');
                    i++;
                }
                out.append("<blockquote>\n").append(toHtml(quoted.toString())).append("</blockquote>\n");
                continue;
            }
            boolean bullet = BULLET.matcher(line).matches();
            boolean numbered = NUMBERED.matcher(line).matches();
            if (bullet || numbered) {
                flushParagraph(out, para);
                Pattern item = bullet ? BULLET : NUMBERED;
                String tag = bullet ? "ul" : "ol";
                out.append('<').append(tag).append(">\n");
                StringBuilder current = null;
                while (i < lines.length && !lines[i].isBlank()) {
                    Matcher m = item.matcher(lines[i]);
                    if (m.matches()) {
                        if (current != null) {
                            out.append("<li>").append(inline(current.toString().strip())).append("</li>\n");
                        }
                        current = new StringBuilder(m.group(1));
                    } else if (current != null) {
                        current.append(' ').append(lines[i].strip());
                    }
                    i++;
                }
                if (current != null) {
                    out.append("<li>").append(inline(current.toString().strip())).append("</li>\n");
                }
                out.append("</").append(tag).append(">\n");
                continue;
            }
            para.add(line.strip());
            i++;
        }
        flushParagraph(out, para);
        return out.toString();
    }

    private static void flushParagraph(StringBuilder out, List<String> para) {
        if (para.isEmpty()) {
            return;
        }
        out.append("<p>").append(inline(String.join("\n", para))).append("</p>\n");
        para.clear();
    }

    /** Inline markup: code spans first (their content is literal), then images, links, emphasis. */
    static String inline(String text) {
        StringBuilder out = new StringBuilder();
        int i = 0;
        while (i < text.length()) {
            char c = text.charAt(i);
            if (c == '`') {
                int run = 1;
                while (i + run < text.length() && text.charAt(i + run) == '`') {
                    run++;
                }
                String ticks = "`".repeat(run);
                int close = text.indexOf(ticks, i + run);
                if (close > 0) {
                    out.append("<code>").append(escape(text.substring(i + run, close).strip())).append("</code>");
                    i = close + run;
                    continue;
                }
            }
            int next = text.indexOf('`', i + 1);
            int end = c == '`' ? i + 1 : (next < 0 ? text.length() : next);
            out.append(spans(text.substring(i, end)));
            i = end;
        }
        return out.toString();
    }

    private static final Pattern IMAGE = Pattern.compile("!\\[([^\\]]*)]\\(([^)\\s]+)(?:\\s+\"([^\"]*)\")?\\)");
    private static final Pattern LINK = Pattern.compile("\\[([^\\]]+)]\\(([^)\\s]+)(?:\\s+\"([^\"]*)\")?\\)");
    private static final Pattern STRONG = Pattern.compile("(\\*\\*|__)(?=\\S)(.+?)(?<=\\S)\\1");
    private static final Pattern EM = Pattern.compile("(?<![\\w*])([*_])(?=\\S)(.+?)(?<=\\S)\\1(?![\\w*])");

    private static String spans(String raw) {
        String s = escape(raw);
        s = replace(IMAGE, s, m -> "<img src=\"" + safeUrl(m.group(2)) + "\" alt=\"" + m.group(1) + "\">");
        s = replace(LINK, s, m -> "<a href=\"" + safeUrl(m.group(2)) + "\">" + m.group(1) + "</a>");
        s = replace(STRONG, s, m -> "<strong>" + m.group(2) + "</strong>");
        s = replace(EM, s, m -> "<em>" + m.group(2) + "</em>");
        s = s.replace("  \n", "<br>\n");
        return s;
    }

    private static String replace(Pattern p, String s, java.util.function.Function<Matcher, String> f) {
        Matcher m = p.matcher(s);
        StringBuilder sb = new StringBuilder();
        while (m.find()) {
            m.appendReplacement(sb, Matcher.quoteReplacement(f.apply(m)));
        }
        m.appendTail(sb);
        return sb.toString();
    }

    /** Drops script URLs; the text is already HTML-escaped. */
    private static String safeUrl(String url) {
        String lower = url.toLowerCase(java.util.Locale.ROOT).strip();
        if (lower.startsWith("javascript:") || lower.startsWith("vbscript:")) {
            return "#";
        }
        return url.replace("\"", "&quot;");
    }

    static String escape(String s) {
        StringBuilder sb = new StringBuilder(s.length() + 16);
        for (int i = 0; i < s.length(); i++) {
            char c = s.charAt(i);
            switch (c) {
                case '&' -> sb.append("&amp;");
                case '<' -> sb.append("&lt;");
                case '>' -> sb.append("&gt;");
                case '"' -> sb.append("&quot;");
                default -> sb.append(c);
            }
        }
        return sb.toString();
    }
}
