package org.microtally.notebook.render;

import java.util.Objects;

/**
 * A fragment of HTML to be shown as such ({@code text/html}). Wrapping is explicit: a plain
 * {@link String} is always shown as text, never guessed to be markup. The plain-text fallback of
 * the bundle is the markup with its tags removed and the common entities decoded.
 *
 * @param markup the HTML fragment; the caller is responsible for escaping what it interpolates
 *               (see {@link #escape(String)})
 */
public record Html(String markup) {
    public Html {
        Objects.requireNonNull(markup, "markup");
    }

    /** Escapes {@code &, <, >, ", '} so that {@code text} can be placed in element content or an attribute. */
    public static String escape(String text) {
        StringBuilder sb = new StringBuilder(text.length() + 16);
        for (int i = 0; i < text.length(); i++) {
            char c = text.charAt(i);
            switch (c) {
                case '&' -> sb.append("&amp;");
                case '<' -> sb.append("&lt;");
                case '>' -> sb.append("&gt;");
                case '"' -> sb.append("&quot;");
                case '\'' -> sb.append("&#39;");
                default -> sb.append(c);
            }
        }
        return sb.toString();
    }

    /** The text a reader would see: tags dropped, {@code <br>}/block ends as line breaks, entities decoded. */
    public String text() {
        String s = markup.replaceAll("(?i)<br\\s*/?>|</(p|div|tr|h[1-6]|li|table|caption)>", "\n");
        s = s.replaceAll("(?s)<(script|style)[^>]*>.*?</\\1>", "");
        s = s.replaceAll("(?s)<[^>]*>", "");
        s = s.replace("&lt;", "<").replace("&gt;", ">").replace("&quot;", "\"").replace("&#39;", "'")
                .replace("&nbsp;", " ").replace("&amp;", "&");
        return s.strip();
    }
}
