package org.microtally.notebook.render;

import java.math.BigDecimal;
import java.math.BigInteger;
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
            + ".mt-result{margin:0.4em 0}"
            + ".mt-caption{color:#1f5f6b;font-weight:600;border-left:3px solid #d08c2b;padding:0 0 0 0.45em;margin:0.3em 0}"
            + ".mt-table{border-collapse:collapse;font-variant-numeric:tabular-nums;margin:0.2em 0}"
            + ".mt-table th{background:#eef4f4;color:#35545b;font-weight:500;font-size:0.8em;padding:0.3em 0.6em;"
            + "text-align:right;vertical-align:bottom;white-space:normal;max-width:8.5em;line-height:1.2}"
            + ".mt-table th.mt-text{text-align:left}"
            + ".mt-table td{padding:0.12em 0.6em;font-family:'DejaVu Sans Mono',monospace;font-size:0.82em;white-space:nowrap}"
            + ".mt-table tbody tr:nth-child(5n) td{border-bottom:1px solid #dfe6e7}"
            + ".mt-table td.mt-num{text-align:right}"
            + ".mt-table td.mt-text{text-align:left;white-space:normal}"   // long text wraps when the table is wider than the page
            + ".mt-table td.mt-cut{color:#8a4b12;cursor:help}"
            + ".mt-table tr.mt-gap td{text-align:center;color:#8a6d3b;background:#fbf7ef;font-family:inherit;font-style:normal}"
            + ".mt-note{color:#55666b;font-size:0.85em;margin:0.2em 0;max-width:46em}"
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
     * The aligned plain-text table: optional caption line, header, a light rule, rows (numbers
     * right-aligned, one format per number column, {@link ColumnNumbers}), a
     * {@code ⋮ n rows not shown} line at each gap of a shortened table ({@link TableFormat}), a note
     * saying which rows are shown and how to see all,
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

    /** The shown rows of a table, already formatted, with the size and the gaps. */
    private record Snapshot(List<String> columns, List<Row> rows, int totalRows, boolean[] gapBefore, boolean[] numeric,
                            String sizeNote) {
        record Row(int index, String[] shown, String[] exact) { }

        static Snapshot of(Tabular table, TableFormat format) {
            Objects.requireNonNull(table, "table");
            List<String> columns = List.copyOf(table.columnNames());
            List<List<Object>> all = table.rows();
            int total = all.size();
            int n = columns.size();
            for (int i = 0; i < total; i++) {
                if (all.get(i).size() != n) {
                    throw InvalidInputException.of("number of cells in row " + i, all.get(i).size(),
                            "equal to the number of columns (" + n + ")", "Fix the Tabular implementation.");
                }
            }
            java.util.TreeSet<Integer> indices = new java.util.TreeSet<>();
            String sizeNote = null;
            if (format.elides(total)) {
                int edge = format.edgeRows();
                int w = format.windowRows();
                int[] peak = peak(all, n);
                int from = peak == null ? 0 : Math.max(0, Math.min(total - w, peak[0] - w / 2));
                for (int i = 0; i < edge; i++) {
                    indices.add(i);
                    indices.add(total - 1 - i);
                }
                for (int i = from; i < from + w; i++) {
                    indices.add(i);
                }
                sizeNote = String.format("%,d of %,d rows shown: %s. Every row: show(Tables.allRows(table)).",
                        indices.size(), total, peak == null ? "the first " + w + " and the last " + edge
                        : "first and last " + edge + ", and " + w + " around the largest '" + columns.get(peak[1])
                        + "' (row " + (peak[0] + 1) + ")");
            } else {
                for (int i = 0; i < total; i++) {
                    indices.add(i);
                }
            }
            List<Integer> shownIdx = new ArrayList<>(indices);
            ColumnNumbers[] formats = new ColumnNumbers[n];
            for (int c = 0; c < n; c++) {
                List<Object> cells = new ArrayList<>(shownIdx.size());
                for (int i : shownIdx) {
                    cells.add(all.get(i).get(c));
                }
                formats[c] = ColumnNumbers.of(cells, format);
            }
            boolean[] numeric = new boolean[n];
            boolean[] seen = new boolean[n];
            List<Row> rows = new ArrayList<>(shownIdx.size());
            boolean[] gapBefore = new boolean[shownIdx.size() + 1];
            int previous = -1;
            for (int k = 0; k < shownIdx.size(); k++) {
                int i = shownIdx.get(k);
                gapBefore[k] = i != previous + 1;
                previous = i;
                List<Object> cells = all.get(i);
                String[] shown = new String[n];
                String[] exact = new String[n];
                for (int c = 0; c < n; c++) {
                    Object v = cells.get(c);
                    shown[c] = formats[c] != null && !CellText.isMissing(v) ? formats[c].shown(v) : CellText.shown(v, format);
                    exact[c] = CellText.exact(v);
                    if (!CellText.isMissing(v)) {
                        numeric[c] = seen[c] ? numeric[c] && CellText.isNumeric(v) : CellText.isNumeric(v);
                        seen[c] = true;
                    }
                }
                rows.add(new Row(i, shown, exact));
            }
            gapBefore[shownIdx.size()] = previous != total - 1;
            return new Snapshot(columns, rows, total, gapBefore, numeric, sizeNote);
        }

        /** Row and column of the largest value of the first numeric column (after the first) peaking inside, or null. */
        private static int[] peak(List<List<Object>> all, int n) {
            for (int c = 1; c < n; c++) {
                BigDecimal best = null;
                int at = -1;
                boolean usable = true;
                for (int i = 0; i < all.size() && usable; i++) {
                    BigDecimal v = key(all.get(i).get(c));
                    if (v == null) {
                        usable = CellText.isMissing(all.get(i).get(c));
                    } else if (best == null || v.compareTo(best) > 0) {
                        best = v;
                        at = i;
                    }
                }
                if (usable && at > 0 && at < all.size() - 1) {
                    return new int[] {at, c};
                }
            }
            return null;
        }

        private static BigDecimal key(Object v) {
            if (v instanceof BigInteger b) {
                return new BigDecimal(b);
            }
            if (v instanceof BigDecimal d) {
                return d;
            }
            if (v instanceof Long || v instanceof Integer || v instanceof Short || v instanceof Byte) {
                return BigDecimal.valueOf(((Number) v).longValue());
            }
            if ((v instanceof Double || v instanceof Float) && Double.isFinite(((Number) v).doubleValue())) {
                return new BigDecimal(((Number) v).doubleValue());
            }
            return null;
        }

        /** The text of the gap before shown row k (k == rows().size() for a gap after the last). */
        String gapText(int k) {
            int from = k == 0 ? 0 : rows.get(k - 1).index() + 1;
            int to = k == rows.size() ? totalRows : rows.get(k).index();
            return String.format("\u22ee %,d %s not shown", to - from, to - from == 1 ? "row" : "rows");
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
            rule[c] = "\u2500".repeat(Math.max(1, width[c]));
        }
        appendLine(sb, rule, width, s.numeric());
        for (int i = 0; i <= s.rows().size(); i++) {
            if (s.gapBefore()[i] && s.totalRows() > 0) {
                sb.append("  ").append(s.gapText(i)).append('\n');
            }
            if (i < s.rows().size()) {
                appendLine(sb, s.rows().get(i).shown(), width, s.numeric());
            }
        }
        if (s.totalRows() == 0) {
            sb.append("(no rows)\n");
        }
        if (s.sizeNote() != null) {
            sb.append(s.sizeNote()).append('\n');
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
        for (int i = 0; i <= s.rows().size(); i++) {
            if (s.gapBefore()[i] && s.totalRows() > 0) {
                sb.append("<tr class=\"mt-gap\"><td colspan=\"").append(Math.max(1, n)).append("\">")
                        .append(Html.escape(s.gapText(i))).append("</td></tr>");
            }
            if (i == s.rows().size()) {
                break;
            }
            Snapshot.Row r = s.rows().get(i);
            sb.append("<tr>");
            for (int c = 0; c < n; c++) {
                boolean differs = !r.shown()[c].equals(r.exact()[c]);
                boolean cut = differs && (r.shown()[c].indexOf('\u2026') >= 0 || r.shown()[c].startsWith("\u2248")
                        || r.exact()[c].matches("-?[0-9]+") && roundsAway(r.shown()[c], r.exact()[c]));
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
        if (s.sizeNote() != null) {
            sb.append("<p class=\"mt-note\">").append(Html.escape(s.sizeNote())).append("</p>");
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

    /** Whether a scientific cell of an exact integer column shows a rounded value (120 as 1.20000e+02 does not). */
    private static boolean roundsAway(String shown, String exact) {
        try {
            return new java.math.BigDecimal(shown).compareTo(new java.math.BigDecimal(exact)) != 0;
        } catch (NumberFormatException e) {
            return true;
        }
    }
}
