package org.microtally.notebook.render;

import java.util.Objects;

/**
 * Markdown text to be shown formatted ({@code text/markdown}); the plain-text fallback is the source
 * itself, which Markdown is designed to be readable as.
 *
 * @param source the Markdown source (CommonMark as rendered by Jupyter)
 */
public record Markdown(String source) {
    public Markdown {
        Objects.requireNonNull(source, "source");
    }
}
