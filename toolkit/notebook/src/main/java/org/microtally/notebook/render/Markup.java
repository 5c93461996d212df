package org.microtally.notebook.render;

import java.util.regex.Pattern;

/**
 * The one place that escapes text for HTML/XML and turns markup back into the text a reader sees.
 * Every display in this package, the standalone page and the chart writer use it, so that
 * {@code html("...")} and {@code show(new Html("..."))} give the same plain-text fallback.
 *
 * <p>Method: character replacement as in the HTML Living Standard's "escaping a string" (section
 * 13.3, serialising HTML fragments), extended to quotes so that the result is safe in attribute
 * values as well as element content; tag stripping drops {@code script}/{@code style} elements with
 * their content, turns line breaks and block ends into new lines and decodes the five predefined
 * entities plus {@code &nbsp;}. It is a reader's fallback, not a sanitiser.
 */
public final class Markup {
    private static final Pattern BREAKS = Pattern.compile("(?i)<br\\s*/?>|</(p|div|tr|h[1-6]|li|table|caption|figure)>");
    private static final Pattern SCRIPTS = Pattern.compile("(?is)<(script|style)[^>]*>.*?</\\1\\s*>");
    private static final Pattern TAGS = Pattern.compile("(?s)<[^>]*>");

    private Markup() { }

    /** Escapes {@code &, <, >, ", '} so that {@code text} can be placed in element content or an attribute value. */
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

    /** The text a reader would see: tags dropped, {@code <br>} and block ends as line breaks, entities decoded. */
    public static String plainText(String markup) {
        String s = SCRIPTS.matcher(markup).replaceAll("");
        s = BREAKS.matcher(s).replaceAll("\n");
        s = TAGS.matcher(s).replaceAll("");
        s = s.replace("&lt;", "<").replace("&gt;", ">").replace("&quot;", "\"").replace("&#39;", "'")
                .replace("&nbsp;", " ").replace("&amp;", "&");
        return s.strip();
    }
}
