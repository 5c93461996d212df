package org.microtally.notebook.render;

import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import org.microtally.InvalidInputException;
import org.microtally.Tabular;

/**
 * Text and HTML views of a {@link Tabular}: an aligned plain-text table and an HTML table of our own
 * ({@code class="mt-table"}), both abbreviating exact numbers and eliding the middle of long tables
 * as {@link TableFormat} says, and both stating the full size when anything is left out. Every piece
 * of text that goes into the HTML (caption, column names, cells, notes, titles) is escaped.
 */
public final class TableDisplay {
    /** The style sheet scoped to our own class names; included once at the top of each HTML table. */
    public static final String STYLE = "<style>"
            + ".mt-table{border-collapse:collapse;font-size:0.9em;font-variant-numeric:tabular-nums;margin:0.3em 0}"
            + ".mt-caption{font-weight:600;color:#1f5f6b;margin:0.3em 0 0.1em 0}"
            + ".mt-table th{border-bottom:2px solid #1f5f6b;padding:0.25em 0.7em;text-align:right;color:#23343a;white-space:nowrap}"
            + ".mt-table th.mt-text{text-align:left}"
            + ".mt-table td{padding:0.2em 0.7em;border-bottom:1px solid #dde4e6}"
            + ".mt-table td.mt-num{text-align:right;white-space:nowrap}"
            + ".mt-table td.mt-text{text-align:left}"
            + ".mt-table td.mt-cut{color:#8a4b12;cursor:help}"
            + ".mt-table tr.mt-gap td{text-align:left;color:#6b7b80;font-style:italic;border-bottom:1px dashed #b8c4c7}"
            + ".mt-note{color:#55666b;font-size:0.85em;margin:0.15em 0}"
            + "</style>";

    private TableDisplay() { }

    /** Plain text and HTML for {@code table} with the default format. */
    public static MimeBundle bundle(Tabular table, String caption, List<String> notes) {
        return bundle(table, caption, notes, TableFormat.DEFAULT);
    }

    /** Plain text and HTML for {@code table}. */
    public static MimeBundle bundle(Tabular table, String caption, List<String> notes, TableFormat format) {
        Snapshot s = Snapshot.of(table, format);
        return MimeBundle.builder(plain(s, caption, notes))
                .put(MimeBundle.TEXT_HTML, html(s, caption, notes))
                .build();
    }

    /**
     * The aligned plain-text table: optional caption line, header, rule, rows (numbers right-aligned),
     * a {@code … n rows omitted …} line where rows were elided, a size line when anything was left out,
     * then the notes.
     */
    public static String plain(Tabular table, String caption, List<String> notes, TableFormat format) {
        return plain(Snapshot.of(table, format), caption, notes);
    }

    /**
     * The HTML view: {@code <div class="mt-result">} holding {@link #STYLE}, the caption as
     * {@code <div class="mt-caption">}, {@code <table class="mt-table">} and the size line and notes
     * as {@code <p class="mt-note">}. Well-formed XML as well as HTML.
     */
    public static String html(Tabular table, String caption, List<String> notes, TableFormat format) {
        return html(Snapshot.of(table, format), caption, notes);
    }

    /** The shown rows of a table, already formatted, with the size and elision position. */
    private record Snapshot(List<String> columns, List<Row> rows, int totalRows, int gapAfter, boolean[] numeric) {
        record Row(String[] shown, String[] exact) { }

        static Snapshot of(Tabular table, TableFormat format) {
            Objects.requireNonNull(table, "table");
            List<String> columns = List.copyOf(table.columnNames());
            List<List<Object>> all = table.rows();
            int total = all.size();
            List<Integer> indices = new ArrayList<>();
            int gapAfter = -1;
            if (format.elides(total)) {
                for (int i = 0; i < format.headRows(); i++) {
                    indices.add(i);
                }
                gapAfter = format.headRows();
                for (int i = total - format.tailRows(); i < total; i++) {
                    indices.add(i);
                }
            } else {
                for (int i = 0; i < total; i++) {
                    indices.add(i);
                }
            }
            int n = columns.size();
            boolean[] numeric = new boolean[n];
            boolean[] seen = new boolean[n];
            List<Row> rows = new ArrayList<>(indices.size());
            for (int i : indices) {
                List<Object> cells = all.get(i);
                if (cells.size() != n) {
                    throw InvalidInputException.of("number of cells in row " + i, cells.size(),
                            "equal to the number of columns (" + n + ")", "Fix the Tabular implementation.");
                }
                String[] shown = new String[n];
                String[] exact = new String[n];
                for (int c = 0; c < n; c++) {
                    Object v = cells.get(c);
                    shown[c] = CellText.shown(v, format);
                    exact[c] = CellText.exact(v);
                    if (!CellText.isMissing(v)) {
                        numeric[c] = seen[c] ? numeric[c] && CellText.isNumeric(v) : CellText.isNumeric(v);
                        seen[c] = true;
                    }
                }
                rows.add(new Row(shown, exact));
            }
            return new Snapshot(columns, rows, total, gapAfter, numeric);
        }

        boolean elided() {
            return gapAfter >= 0;
        }

        int omitted() {
            return totalRows - rows.size();
        }

        String sizeLine() {
            return String.format("%,d rows \u00d7 %d columns; showing the first %d and the last %d", totalRows,
                    columns.size(), gapAfter, rows.size() - gapAfter);
        }

        String gapLine() {
            return String.format("\u2026 %,d rows omitted \u2026", omitted());
        }
    }

    private static String plain(Snapshot s, String caption, List<String> notes) {
        int n = s.columns().size();
        int[] width = new int[n];
        for (int c = 0; c < n; c++) {
            width[c] = s.columns().get(c).length();
            for (Snapshot.Row r : s.rows()) {
                width[c] = Math.max(width[c], r.shown()[c].length());
            }
        }
        StringBuilder sb = new StringBuilder();
        if (caption != null && !caption.isBlank()) {
            sb.append(caption).append('\n');
        }
        String[] header = s.columns().toArray(new String[0]);
        appendLine(sb, header, width, s.numeric());
        String[] rule = new String[n];
        for (int c = 0; c < n; c++) {
            rule[c] = "-".repeat(Math.max(1, width[c]));
        }
        appendLine(sb, rule, width, s.numeric());
        for (int i = 0; i < s.rows().size(); i++) {
            if (i == s.gapAfter()) {
                sb.append(s.gapLine()).append('\n');
            }
            appendLine(sb, s.rows().get(i).shown(), width, s.numeric());
        }
        if (s.totalRows() == 0) {
            sb.append("(no rows)\n");
        }
        if (s.elided()) {
            sb.append('(').append(s.sizeLine()).append(")\n");
        }
        if (notes != null) {
            for (String note : notes) {
                if (note != null && !note.isBlank()) {
                    sb.append(note).append('\n');
                }
            }
        }
        return sb.toString().stripTrailing();
    }

    private static void appendLine(StringBuilder sb, String[] cells, int[] width, boolean[] numeric) {
        StringBuilder line = new StringBuilder();
        for (int c = 0; c < cells.length; c++) {
            if (c > 0) {
                line.append("  ");
            }
            String pad = " ".repeat(width[c] - cells[c].length());
            line.append(numeric[c] ? pad + cells[c] : cells[c] + pad);
        }
        sb.append(line.toString().stripTrailing()).append('\n');
    }

    private static String html(Snapshot s, String caption, List<String> notes) {
        int n = s.columns().size();
        StringBuilder sb = new StringBuilder("<div class=\"mt-result\">").append(STYLE);
        if (caption != null && !caption.isBlank()) {
            sb.append("<div class=\"mt-caption\">").append(Html.escape(caption)).append("</div>");
        }
        sb.append("<table class=\"mt-table\">");
        sb.append("<thead><tr>");
        for (int c = 0; c < n; c++) {
            sb.append(s.numeric()[c] ? "<th>" : "<th class=\"mt-text\">")
                    .append(Html.escape(s.columns().get(c))).append("</th>");
        }
        sb.append("</tr></thead><tbody>");
        for (int i = 0; i < s.rows().size(); i++) {
            if (i == s.gapAfter()) {
                sb.append("<tr class=\"mt-gap\"><td colspan=\"").append(Math.max(1, n)).append("\">")
                        .append(Html.escape(s.gapLine())).append("</td></tr>");
            }
            Snapshot.Row r = s.rows().get(i);
            sb.append("<tr>");
            for (int c = 0; c < n; c++) {
                boolean differs = !r.shown()[c].equals(r.exact()[c]);
                boolean cut = differs && (r.shown()[c].indexOf('\u2026') >= 0 || r.shown()[c].startsWith("\u2248"));
                sb.append("<td class=\"").append(s.numeric()[c] ? "mt-num" : "mt-text").append(cut ? " mt-cut\"" : "\"");
                if (differs) {
                    sb.append(" title=\"").append(Html.escape(r.exact()[c])).append('"');
                }
                sb.append('>').append(Html.escape(r.shown()[c])).append("</td>");
            }
            sb.append("</tr>");
        }
        sb.append("</tbody></table>");
        if (s.totalRows() == 0) {
            sb.append("<p class=\"mt-note\">(no rows)</p>");
        }
        if (s.elided()) {
            sb.append("<p class=\"mt-note\">").append(Html.escape(s.sizeLine())).append("</p>");
        }
        if (notes != null) {
            for (String note : notes) {
                if (note != null && !note.isBlank()) {
                    sb.append("<p class=\"mt-note\">").append(Html.escape(note)).append("</p>");
                }
            }
        }
        return sb.append("</div>").toString();
    }
}
