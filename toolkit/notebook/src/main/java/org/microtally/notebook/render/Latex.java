package org.microtally.notebook.render;

import java.util.Objects;

/**
 * A formula for {@code text/latex}. Jupyter typesets it with MathJax, which needs math delimiters:
 * {@link #of(String)} adds display delimiters {@code $$ ... $$}; the canonical constructor takes the
 * source as is (with its own {@code $ ... $} if wanted). The plain-text fallback is the source.
 *
 * @param source LaTeX source including its math delimiters
 */
public record Latex(String source) {
    public Latex {
        Objects.requireNonNull(source, "source");
    }

    /** A displayed formula: {@code formula} wrapped in {@code $$ ... $$}. */
    public static Latex of(String formula) {
        return new Latex("$$" + Objects.requireNonNull(formula, "formula") + "$$");
    }
}
