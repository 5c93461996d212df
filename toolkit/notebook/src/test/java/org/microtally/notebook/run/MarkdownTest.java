package org.microtally.notebook.run;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.api.Test;

/** Expected HTML follows the CommonMark spec 0.31.2 examples for the constructs we support (from memory). */
class MarkdownTest {
    @Test
    void headings() {
        // Source: CommonMark spec 0.31.2, §4.2 ATX headings (from memory)
        assertEquals("<h1>foo</h1>\n<h3>bar</h3>\n", Markdown.toHtml("# foo\n### bar ###"));
        assertEquals("<p>#5 bolt</p>\n", Markdown.toHtml("#5 bolt"));
    }

    @Test
    void paragraphsAndEmphasis() {
        // Source: CommonMark spec 0.31.2, §6.2 emphasis and strong emphasis (from memory)
        assertEquals("<p><em>foo bar</em></p>\n", Markdown.toHtml("*foo bar*"));
        assertEquals("<p><strong>foo bar</strong></p>\n", Markdown.toHtml("**foo bar**"));
        assertEquals("<p>aaa\nbbb</p>\n<p>ccc</p>\n", Markdown.toHtml("aaa\nbbb\n\nccc"));
        assertEquals("<p>snake_case_name stays</p>\n", Markdown.toHtml("snake_case_name stays"));
    }

    @Test
    void codeIsLiteral() {
        // Source: CommonMark spec 0.31.2, §6.1 code spans and §4.5 fenced code blocks (from memory)
        assertEquals("<p><code>a *b* &lt;c&gt;</code></p>\n", Markdown.toHtml("`a *b* <c>`"));
        assertEquals("<pre><code class=\"language-java\">int x = 1 &lt; 2;\n</code></pre>\n",
                Markdown.toHtml("```java\nint x = 1 < 2;\n```"));
        assertEquals("<pre><code>indented\n</code></pre>\n", Markdown.toHtml("    indented"));
    }

    @Test
    void listsLinksQuotes() {
        // Source: CommonMark spec 0.31.2, §5.2-5.3 lists, §6.3 links, §5.1 block quotes (from memory)
        assertEquals("<ul>\n<li>one</li>\n<li>two</li>\n</ul>\n", Markdown.toHtml("- one\n- two"));
        assertEquals("<ol>\n<li>one</li>\n<li>two</li>\n</ol>\n", Markdown.toHtml("1. one\n2. two"));
        assertEquals("<p><a href=\"/uri\">link</a></p>\n", Markdown.toHtml("[link](/uri)"));
        assertEquals("<blockquote>\n<p>quoted</p>\n</blockquote>\n", Markdown.toHtml("> quoted"));
        assertEquals("<hr>\n", Markdown.toHtml("***"));
    }

    @Test
    void htmlAndScriptsAreNeutralised() {
        assertEquals("<p>&lt;script&gt;x&lt;/script&gt;</p>\n", Markdown.toHtml("<script>x</script>"));
        assertEquals("<p><a href=\"#\">x</a></p>\n", Markdown.toHtml("[x](javascript:alert)"));
    }
}
