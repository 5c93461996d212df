package org.microtally.notebook.run;

import com.google.gson.JsonElement;
import com.google.gson.JsonObject;
import org.microtally.notebook.render.Markup;
import org.microtally.notebook.render.MimeBundle;

/**
 * A standalone HTML page of an executed notebook: no scripts, no external files, a small own
 * stylesheet (every class the page and the displays use starts with {@code mt-}); images are embedded as {@code data:} URIs, HTML outputs (tables, inline SVG charts)
 * are placed inline, all other text is escaped; Markdown and math go through {@link PageMarkdown}
 * (math as MathML, laid out by the browser with the first installed font that has an OpenType MATH
 * table, which places sub- and superscripts as TeX does). Code cells wrap long lines at the page
 * width (readable at 1280 px and in print); outputs that must keep their lines scroll. The page carries a Content-Security-Policy
 * ({@link #POLICY}) that allows exactly that: inline styles and {@code data:} images, nothing to load
 * and no script, so HTML outputs (trusted as written, as in any notebook) cannot fetch or run anything.
 */
final class HtmlPage {
    private static final String STYLE = """
            body { margin: 0; background: #f7f7f4; color: #1d232a; font: 16px/1.5 Georgia, 'Times New Roman', serif; }
            main { max-width: 62rem; margin: 0 auto; padding: 1.5rem 1rem 4rem; }
            header.mt-page { border-bottom: 2px solid #2f5d62; margin-bottom: 1.5rem; }
            header.mt-page h1 { font-size: 1.3rem; margin: 0.4rem 0; color: #2f5d62; }
            header.mt-page p { margin: 0 0 0.6rem; font-size: 0.85rem; color: #5b6770; }
            section.mt-cell { margin: 0.9rem 0; }
            .mt-code .mt-input { display: flex; gap: 0.6rem; }
            .mt-count { flex: 0 0 3.2rem; text-align: right; font: 0.8rem/1.9 monospace; color: #8a5a44; }
            pre { margin: 0; padding: 0.5rem 0.7rem; overflow-x: auto; font: 0.85rem/1.45 'DejaVu Sans Mono', monospace; }
            .mt-input pre { flex: 1; min-width: 0; white-space: pre-wrap; overflow-wrap: anywhere; background: #eef1ee; border-left: 3px solid #2f5d62; }
            .mt-outputs { margin-left: 3.8rem; }
            .mt-output { margin: 0.35rem 0; overflow-x: auto; }
            .mt-stream.mt-stderr pre { background: #fbeeee; }
            .mt-error pre { background: #fbe4e1; color: #7a1f12; border-left: 3px solid #b23a26; }
            .mt-output img { max-width: 100%; }
            .mt-output table:not(.mt-table) { border-collapse: collapse; font: 0.85rem monospace; }
            .mt-output table:not(.mt-table) th, .mt-output table:not(.mt-table) td { border: 1px solid #c9cfc9; padding: 0.15rem 0.5rem; text-align: right; }
            .mt-output math[display="block"] { margin: 0.4rem 0; }
            math { font-family: 'Latin Modern Math', 'STIX Two Math', 'DejaVu Math TeX Gyre', 'Cambria Math', math; }
            .mt-markdown code { background: #eef1ee; padding: 0 0.2rem; font-size: 0.9em; }
            .mt-markdown pre code { padding: 0; background: none; }
            .mt-markdown pre { background: #eef1ee; }
            blockquote { margin: 0.5rem 0; padding-left: 0.8rem; border-left: 3px solid #c9cfc9; color: #4b5660; }
            """;

    /** The page's Content-Security-Policy (W3C Content Security Policy Level 3, delivered by a meta element). */
    static final String POLICY = "default-src 'none'; style-src 'unsafe-inline'; img-src data:; base-uri 'none'; form-action 'none'";

    private HtmlPage() { }

    static String of(Notebook nb, String title) {
        StringBuilder sb = new StringBuilder();
        sb.append("<!DOCTYPE html>\n<html lang=\"en\">\n<head>\n<meta charset=\"utf-8\">\n")
                .append("<meta http-equiv=\"Content-Security-Policy\" content=\"").append(POLICY).append("\">\n")
                .append("<meta name=\"viewport\" content=\"width=device-width, initial-scale=1\">\n")
                .append("<title>").append(Markup.escape(title)).append("</title>\n<style>\n").append(STYLE)
                .append("</style>\n</head>\n<body>\n<main>\n<header class=\"mt-page\"><h1>").append(Markup.escape(title))
                .append("</h1><p>Executed by the microtally runner</p></header>\n");
        for (JsonObject cell : nb.cells()) {
            String type = Notebook.type(cell);
            String source = Notebook.text(cell.get("source"));
            switch (type) {
                case "markdown" -> sb.append("<section class=\"mt-cell mt-markdown\">\n").append(PageMarkdown.toHtml(source))
                        .append("</section>\n");
                case "raw" -> sb.append("<section class=\"mt-cell mt-raw\"><pre>").append(Markup.escape(source))
                        .append("</pre></section>\n");
                default -> code(sb, cell, source);
            }
        }
        sb.append("</main>\n</body>\n</html>\n");
        return sb.toString();
    }

    private static void code(StringBuilder sb, JsonObject cell, String source) {
        JsonElement count = cell.get("execution_count");
        String label = count == null || count.isJsonNull() ? "[ ]" : "[" + count.getAsInt() + "]";
        sb.append("<section class=\"mt-cell mt-code\">\n<div class=\"mt-input\"><div class=\"mt-count\">").append(label)
                .append("</div><pre><code>").append(Markup.escape(source)).append("</code></pre></div>\n");
        JsonElement outputs = cell.get("outputs");
        if (outputs != null && outputs.isJsonArray() && outputs.getAsJsonArray().size() > 0) {
            sb.append("<div class=\"mt-outputs\">\n");
            for (JsonElement e : outputs.getAsJsonArray()) {
                output(sb, e.getAsJsonObject());
            }
            sb.append("</div>\n");
        }
        sb.append("</section>\n");
    }

    private static void output(StringBuilder sb, JsonObject o) {
        String type = o.get("output_type").getAsString();
        switch (type) {
            case "stream" -> sb.append("<div class=\"mt-output mt-stream mt-").append(Markup.escape(o.get("name").getAsString()))
                    .append("\"><pre>").append(Markup.escape(Notebook.text(o.get("text")))).append("</pre></div>\n");
            case "error" -> {
                StringBuilder tb = new StringBuilder();
                JsonElement lines = o.get("traceback");
                if (lines != null && lines.isJsonArray() && lines.getAsJsonArray().size() > 0) {
                    for (JsonElement l : lines.getAsJsonArray()) {
                        tb.append(stripAnsi(l.getAsString())).append('\n');
                    }
                } else {
                    tb.append(o.get("ename").getAsString()).append(": ").append(o.get("evalue").getAsString());
                }
                sb.append("<div class=\"mt-output mt-error\"><pre>").append(Markup.escape(tb.toString())).append("</pre></div>\n");
            }
            default -> {
                JsonElement d = o.get("data");
                if (d != null && d.isJsonObject()) {
                    sb.append("<div class=\"mt-output ").append(type.equals("execute_result") ? "mt-result" : "mt-display")
                            .append("\">").append(bestOf(d.getAsJsonObject())).append("</div>\n");
                }
            }
        }
    }

    /** The richest representation a page without scripts can show. */
    static String bestOf(JsonObject data) {
        if (data.has(MimeBundle.TEXT_HTML)) {
            return Notebook.text(data.get(MimeBundle.TEXT_HTML));
        }
        if (data.has(MimeBundle.IMAGE_SVG)) {
            String svg = Notebook.text(data.get(MimeBundle.IMAGE_SVG));
            String b64 = java.util.Base64.getEncoder().encodeToString(svg.getBytes(java.nio.charset.StandardCharsets.UTF_8));
            return "<img alt=\"chart\" src=\"data:image/svg+xml;base64," + b64 + "\">";
        }
        for (String img : new String[] {MimeBundle.IMAGE_PNG, "image/jpeg", "image/gif"}) {
            if (data.has(img)) {
                String b64 = Notebook.text(data.get(img)).replaceAll("\\s+", "");
                return "<img alt=\"image\" src=\"data:" + img + ";base64," + b64 + "\">";
            }
        }
        if (data.has(MimeBundle.TEXT_MARKDOWN)) {
            return "<div class=\"mt-markdown\">" + PageMarkdown.toHtml(Notebook.text(data.get(MimeBundle.TEXT_MARKDOWN))) + "</div>";
        }
        if (data.has(MimeBundle.TEXT_LATEX)) {
            return "<div class=\"mt-latex\">" + PageMarkdown.latexOutput(Notebook.text(data.get(MimeBundle.TEXT_LATEX))) + "</div>";
        }
        return "<pre>" + Markup.escape(Notebook.text(data.get(MimeBundle.TEXT_PLAIN))) + "</pre>";
    }

    private static String stripAnsi(String s) {
        return s.replaceAll("\u001B\\[[0-9;]*m", "");
    }
}
