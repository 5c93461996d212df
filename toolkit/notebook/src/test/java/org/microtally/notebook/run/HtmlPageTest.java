package org.microtally.notebook.run;

import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.google.gson.JsonObject;
import com.google.gson.JsonParser;
import java.io.StringReader;
import org.junit.jupiter.api.Test;

class HtmlPageTest {
    private static final String NB = """
            {"nbformat": 4, "nbformat_minor": 5, "metadata": {},
             "cells": [
              {"cell_type": "markdown", "id": "a", "metadata": {}, "source": "# Halyard Bay foil\\n\\n$E_F = \\\\frac{\\\\hbar^2 k_F^2}{2m}$"},
              {"cell_type": "code", "id": "b", "metadata": {}, "execution_count": 1, "source": "latex(..)",
               "outputs": [{"output_type": "display_data", "metadata": {},
                 "data": {"text/plain": "$$\\\\langle n \\\\rangle$$", "text/latex": "$$\\\\langle n \\\\rangle$$"}}]}
             ]}
            """;

    @Test
    void pageAllowsNoScriptAndNothingToLoad() throws Exception {
        String page = HtmlPage.of(Notebook.parse(new StringReader(NB), "t.ipynb"), "t");
        // Source: W3C Content Security Policy Level 3, default-src 'none' blocks every fetch and script
        assertTrue(page.contains("<meta http-equiv=\"Content-Security-Policy\" content=\"default-src 'none'; "
                + "style-src 'unsafe-inline'; img-src data:;"), page);
        assertFalse(page.contains("<script"), page);
        assertFalse(page.contains("src=\"http"), page);
    }

    @Test
    void markdownMathAndLatexOutputsAreMathMl() throws Exception {
        String page = HtmlPage.of(Notebook.parse(new StringReader(NB), "t.ipynb"), "t");
        assertTrue(page.contains("<mfrac><mrow><msup><mi>\u210f</mi>"), page);
        JsonObject data = JsonParser.parseString("{\"text/plain\": \"x\", \"text/latex\": \"$$\\\\langle n \\\\rangle$$\"}")
                .getAsJsonObject();
        String best = HtmlPage.bestOf(data);
        assertTrue(best.contains("display=\"block\"><semantics><mrow><mo stretchy=\"false\">\u27e8</mo><mi>n</mi><mo stretchy=\"false\">\u27e9</mo>"), best);
    }

    @Test
    void longCodeLinesWrapAtThePageWidthAndMathUsesAMathFont() throws Exception {
        String page = HtmlPage.of(Notebook.parse(new StringReader(NB), "t.ipynb"), "t");
        // common practice, no source: a flex item needs min-width: 0 to shrink below its content's width,
        // and pre-wrap keeps indentation while breaking lines that do not fit (CSS Text Level 3, white-space)
        String rule = page.lines().filter(l -> l.strip().startsWith(".mt-input pre {")).findFirst().orElse("");
        assertTrue(rule.contains("min-width: 0") && rule.contains("white-space: pre-wrap")
                && rule.contains("overflow-wrap: anywhere"), rule);
        // MathML Core, section 3.1: script placement reads the font's OpenType MATH table; list such fonts first
        assertTrue(page.contains("math { font-family: 'Latin Modern Math'"), page);
    }
}
