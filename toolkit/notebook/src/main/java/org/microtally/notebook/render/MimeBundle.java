package org.microtally.notebook.render;

import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.Map;
import java.util.Objects;

/**
 * One displayable result in several representations, keyed by MIME type, in the order of
 * preference of their producer. {@code text/plain} is always present. Binary payloads
 * ({@code image/png}) are stored base64-encoded, as nbformat and the Jupyter protocol carry them.
 * Immutable.
 */
public final class MimeBundle {
    public static final String TEXT_PLAIN = "text/plain";
    public static final String TEXT_HTML = "text/html";
    public static final String TEXT_MARKDOWN = "text/markdown";
    public static final String TEXT_LATEX = "text/latex";
    public static final String IMAGE_PNG = "image/png";
    public static final String IMAGE_SVG = "image/svg+xml";

    private final Map<String, String> data;

    private MimeBundle(Map<String, String> data) {
        if (!data.containsKey(TEXT_PLAIN)) {
            throw new IllegalArgumentException("a MIME bundle needs text/plain; got only " + data.keySet());
        }
        this.data = Collections.unmodifiableMap(new LinkedHashMap<>(data));
    }

    /** A bundle holding only plain text. */
    public static MimeBundle text(String plain) {
        return builder(plain).build();
    }

    /** Starts a bundle with its plain-text representation. */
    public static Builder builder(String plain) {
        return new Builder(plain);
    }

    /** MIME type to content, in insertion order; unmodifiable. */
    public Map<String, String> data() {
        return data;
    }

    /** The content for {@code mime}, or null. */
    public String get(String mime) {
        return data.get(mime);
    }

    /** Whether the bundle has the given representation. */
    public boolean has(String mime) {
        return data.containsKey(mime);
    }

    /** The plain-text representation. */
    public String plain() {
        return data.get(TEXT_PLAIN);
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof MimeBundle b && b.data.equals(data);
    }

    @Override
    public int hashCode() {
        return data.hashCode();
    }

    @Override
    public String toString() {
        return "MimeBundle" + data.keySet();
    }

    /** Accumulates representations; later puts of the same type replace earlier ones. */
    public static final class Builder {
        private final Map<String, String> data = new LinkedHashMap<>();

        private Builder(String plain) {
            data.put(TEXT_PLAIN, Objects.requireNonNull(plain, "plain"));
        }

        /** Adds a representation. */
        public Builder put(String mime, String content) {
            data.put(Objects.requireNonNull(mime, "mime"), Objects.requireNonNull(content, "content"));
            return this;
        }

        /** The finished, immutable bundle. */
        public MimeBundle build() {
            return new MimeBundle(data);
        }
    }
}
