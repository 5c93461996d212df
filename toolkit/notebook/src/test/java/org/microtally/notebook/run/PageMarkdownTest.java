package org.microtally.notebook.run;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

/** Expected HTML follows the CommonMark spec 0.31.2 examples (from memory); math as MathML. */
class PageMarkdownTest {
    @Test
    void headings() {
        // Source: CommonMark spec 0.31.2, §4.2 ATX headings (from memory)
        assertEquals("<h1>foo</h1>\n<h3>bar</h3>\n", PageMarkdown.toHtml("# foo\n### bar ###"));
        assertEquals("<p>#5 bolt</p>\n", PageMarkdown.toHtml("#5 bolt"));
    }

    @Test
    void paragraphsAndEmphasis() {
        // Source: CommonMark spec 0.31.2, §6.2 emphasis and strong emphasis (from memory)
        assertEquals("<p><em>foo bar</em></p>\n", PageMarkdown.toHtml("*foo bar*"));
        assertEquals("<p><strong>foo bar</strong></p>\n", PageMarkdown.toHtml("**foo bar**"));
        assertEquals("<p>aaa\nbbb</p>\n<p>ccc</p>\n", PageMarkdown.toHtml("aaa\nbbb\n\nccc"));
        assertEquals("<p>snake_case_name stays</p>\n", PageMarkdown.toHtml("snake_case_name stays"));
    }

    @Test
    void codeIsLiteral() {
        // Source: CommonMark spec 0.31.2, §6.1 code spans and §4.5 fenced code blocks (from memory)
        assertEquals("<p><code>a *b* &lt;c&gt;</code></p>\n", PageMarkdown.toHtml("`a *b* <c>`"));
        assertEquals("<pre><code class=\"language-java\">int x = 1 &lt; 2;\n</code></pre>\n",
                PageMarkdown.toHtml("```java\nint x = 1 < 2;\n```"));
        assertEquals("<pre><code>indented\n</code></pre>\n", PageMarkdown.toHtml("    indented"));
    }

    @Test
    void listsLinksQuotes() {
        // Source: CommonMark spec 0.31.2, §5.2-5.3 lists, §6.3 links, §5.1 block quotes (from memory)
        assertEquals("<ul>\n<li>one</li>\n<li>two</li>\n</ul>\n", PageMarkdown.toHtml("- one\n- two"));
        assertEquals("<ol>\n<li>one</li>\n<li>two</li>\n</ol>\n", PageMarkdown.toHtml("1. one\n2. two"));
        assertEquals("<p><a rel=\"nofollow\" href=\"/uri\">link</a></p>\n", PageMarkdown.toHtml("[link](/uri)"));
        assertEquals("<blockquote>\n<p>quoted</p>\n</blockquote>\n", PageMarkdown.toHtml("> quoted"));
        assertEquals("<hr />\n", PageMarkdown.toHtml("***"));
    }

    @Test
    void htmlAndScriptsAreNeutralised() {
        assertEquals("<p>&lt;script&gt;x&lt;/script&gt;</p>\n", PageMarkdown.toHtml("<script>x</script>"));
        assertEquals("<p><a rel=\"nofollow\" href=\"\">x</a></p>\n", PageMarkdown.toHtml("[x](javascript:alert)"));
    }

    @Test
    void mathBecomesMathMlOutsideCode() {
        String html = PageMarkdown.toHtml("Energy $E_n = n \\hbar\\omega$ and `$not math$`, cost \\$5.\n\n$$Z = \\sum_i g_i e^{-\\beta E_i}$$");
        assertTrue(html.contains("<math xmlns=\"http://www.w3.org/1998/Math/MathML\"><semantics><mrow><msub><mi>E</mi><mrow><mi>n</mi></mrow></msub>"), html);
        assertTrue(html.contains("<code>$not math$</code>"), html);
        assertTrue(html.contains("cost $5."), html);
        assertTrue(html.contains("<math xmlns=\"http://www.w3.org/1998/Math/MathML\" display=\"block\">"), html);
        // underscores inside math are not emphasis
        assertFalse(html.contains("<em>"), html);
    }

    @Test
    void unsupportedTexIsShownAsSourceNotHalfRendered() {
        String html = PageMarkdown.toHtml("see $\\begin{matrix} a \\end{matrix}$");
        assertTrue(html.contains("<code class=\"mt-tex\" title=\"not rendered: \\begin is not in the supported TeX subset"), html);
        assertFalse(html.contains("<math"), html);
    }

    @Test
    void everyFormulaOfTheWorkedNotebooksIsInTheSupportedSubset() throws Exception {
        java.nio.file.Path dir = java.nio.file.Path.of("../../notebooks");
        int formulas = 0;
        try (var files = java.nio.file.Files.list(dir)) {
            for (java.nio.file.Path f : files.filter(p -> p.getFileName().toString().matches("0[1-6]-.*\\.ipynb")).sorted().toList()) {
                var doc = com.google.gson.JsonParser.parseString(java.nio.file.Files.readString(f)).getAsJsonObject();
                for (var c : doc.getAsJsonArray("cells")) {
                    var cell = c.getAsJsonObject();
                    if (!cell.get("cell_type").getAsString().equals("markdown")) {
                        continue;
                    }
                    String html = PageMarkdown.toHtml(Notebook.text(cell.get("source")));
                    assertFalse(html.contains("mt-tex"), f.getFileName() + ": a formula is outside the TeX subset: " + html);
                    formulas += html.split("<math ", -1).length - 1;
                }
            }
        }
        assertTrue(formulas > 50, "only " + formulas + " formulas found in the notebooks");
    }
}
