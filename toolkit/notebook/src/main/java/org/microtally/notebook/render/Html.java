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

    /** Escapes {@code &, <, >, ", '} for element content or attributes ({@link Markup#escape}). */
    public static String escape(String text) {
        return Markup.escape(text);
    }

    /** The text a reader would see ({@link Markup#plainText}). */
    public String text() {
        return Markup.plainText(markup);
    }
}
