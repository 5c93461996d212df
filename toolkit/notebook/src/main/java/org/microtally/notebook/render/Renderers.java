package org.microtally.notebook.render;

/**
 * Turns any value into a {@link MimeBundle}: the single entry point the evaluation engine, the
 * kernel and the headless runner use for display.
 *
 * <p>Placeholder during scaffolding: renders {@code String.valueOf(value)} as text/plain only. The
 * render work replaces this with type-specific renderers (core results, Tablesaw tables, XChart
 * charts, images, HTML strings).
 */
public final class Renderers {
    private Renderers() { }

    /** The bundle for {@code value} (never null; {@code null} renders as the text "null"). */
    public static MimeBundle render(Object value) {
        return MimeBundle.text(String.valueOf(value));
    }
}
