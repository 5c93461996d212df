package org.microtally.notebook.run;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;

/** Expected HTML follows the CommonMark spec 0.31.2 examples (from memory); math as MathML. */
class PageMarkdownTest {
    /** One CommonMark case: its source beside it, the markdown, the HTML our page writes. */
    static Stream<Arguments> commonMarkCases() {
        String atx = "CommonMark spec 0.31.2, §4.2 ATX headings (from memory)";
        String emphasis = "CommonMark spec 0.31.2, §6.2 emphasis and strong emphasis (from memory)";
        String code = "CommonMark spec 0.31.2, §6.1 code spans and §4.5 fenced code blocks (from memory)";
        String blocks = "CommonMark spec 0.31.2, §5.2-5.3 lists, §6.3 links, §5.1 block quotes (from memory)";
        String safety = "common practice, no source: raw HTML and javascript: links are neutralised";
        return Stream.of(
                Arguments.of(atx, "# foo\n### bar ###", "<h1>foo</h1>\n<h3>bar</h3>\n"),
                Arguments.of(atx, "#5 bolt", "<p>#5 bolt</p>\n"),
                Arguments.of(emphasis, "*foo bar*", "<p><em>foo bar</em></p>\n"),
                Arguments.of(emphasis, "**foo bar**", "<p><strong>foo bar</strong></p>\n"),
                Arguments.of(emphasis, "aaa\nbbb\n\nccc", "<p>aaa\nbbb</p>\n<p>ccc</p>\n"),
                Arguments.of(emphasis, "snake_case_name stays", "<p>snake_case_name stays</p>\n"),
                Arguments.of(code, "`a *b* <c>`", "<p><code>a *b* &lt;c&gt;</code></p>\n"),
                Arguments.of(code, "```java\nint x = 1 < 2;\n```",
                        "<pre><code class=\"language-java\">int x = 1 &lt; 2;\n</code></pre>\n"),
                Arguments.of(code, "    indented", "<pre><code>indented\n</code></pre>\n"),
                Arguments.of(blocks, "- one\n- two", "<ul>\n<li>one</li>\n<li>two</li>\n</ul>\n"),
                Arguments.of(blocks, "1. one\n2. two", "<ol>\n<li>one</li>\n<li>two</li>\n</ol>\n"),
                Arguments.of(blocks, "[link](/uri)", "<p><a rel=\"nofollow\" href=\"/uri\">link</a></p>\n"),
                Arguments.of(blocks, "> quoted", "<blockquote>\n<p>quoted</p>\n</blockquote>\n"),
                Arguments.of(blocks, "***", "<hr />\n"),
                Arguments.of(safety, "<script>x</script>", "<p>&lt;script&gt;x&lt;/script&gt;</p>\n"),
                Arguments.of(safety, "[x](javascript:alert)", "<p><a rel=\"nofollow\" href=\"\">x</a></p>\n"));
    }

    @ParameterizedTest(name = "[{index}] {1}")
    @MethodSource("commonMarkCases")
    void commonMarkCase(String source, String markdown, String expectedHtml) {
        assertEquals(expectedHtml, PageMarkdown.toHtml(markdown), "Source: " + source);
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
