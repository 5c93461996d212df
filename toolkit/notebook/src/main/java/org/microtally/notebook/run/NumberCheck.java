package org.microtally.notebook.run;

import com.google.gson.JsonArray;
import com.google.gson.JsonElement;
import com.google.gson.JsonObject;
import java.math.BigDecimal;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.microtally.InvalidInputException;
import org.microtally.notebook.render.MimeBundle;

/**
 * Compares the numbers in the outputs of two executed notebooks, cell by cell: how a colleague
 * confirms "I get your numbers".
 *
 * <p>What is compared, for each code cell (cells are paired by position; the sources must match):
 * the text a reader sees of every output in order: stream text, the {@code text/plain} form of
 * results and displays, and the error name and message. Each text is split into its numbers and
 * the words between them. The words must be equal; two numbers {@code a}, {@code b} agree when
 * {@code |a - b| <= max(absolute, relative * max(|a|, |b|))} (numbers are read in full decimal
 * precision, so a tolerance of 0 asks for the same digits). Numbers are decimal literals with an
 * optional sign (also U+2212 minus), fraction and exponent ({@code e-7}); digits grouped by commas
 * in threes ({@code 2,000}) are one number. Charts and HTML are not compared: every chart and table
 * here also carries its numbers in its plain-text form.
 *
 * @param relative the relative tolerance (>= 0)
 * @param absolute the absolute tolerance (>= 0), for numbers near zero
 */
record NumberCheck(double relative, double absolute) {
    /** Differences listed per cell before the rest are only counted. */
    static final int SHOWN_PER_CELL = 10;
    /** The relative tolerance used when none is given. */
    static final double DEFAULT_RELATIVE = 1e-9;

    private static final Pattern NUMBER = Pattern.compile(
            "(?<![\\w.])[-+\u2212]?(?:\\d{1,3}(?:,\\d{3})+(?!\\d)|\\d+)(?:\\.\\d*)?(?:[eE][-+]?\\d+)?(?![\\w])"
            + "|(?<![\\w.])[-+\u2212]?\\.\\d+(?:[eE][-+]?\\d+)?(?![\\w])");

    NumberCheck {
        if (!(relative >= 0) || Double.isInfinite(relative)) {
            throw InvalidInputException.of("relative tolerance", relative, "a finite number >= 0", "For example 1e-9.");
        }
        if (!(absolute >= 0) || Double.isInfinite(absolute)) {
            throw InvalidInputException.of("absolute tolerance", absolute, "a finite number >= 0", "For example 1e-300, or 0.");
        }
    }

    /** One disagreement: where (cell number counting every cell from 1, output index from 1) and what. */
    record Difference(int cell, int output, String what) {
        String describe() {
            return "cell " + cell + (output > 0 ? ", output " + output : "") + ": " + what;
        }
    }

    /** The outcome: how many numbers were compared and every difference found (empty when they agree). */
    record Report(int cellsCompared, long numbersCompared, List<Difference> differences) {
        boolean agrees() {
            return differences.isEmpty();
        }
    }

    /** Compares {@code expected} (the reference run) with {@code actual}. */
    Report compare(Notebook expected, Notebook actual) {
        List<JsonObject> a = expected.cells();
        List<JsonObject> b = actual.cells();
        List<Difference> out = new ArrayList<>();
        if (a.size() != b.size()) {
            out.add(new Difference(Math.min(a.size(), b.size()) + 1, 0, "the notebooks have " + a.size() + " and " + b.size()
                    + " cells: not the same notebook"));
        }
        int cells = 0;
        long numbers = 0;
        for (int i = 0; i < Math.min(a.size(), b.size()); i++) {
            JsonObject x = a.get(i);
            JsonObject y = b.get(i);
            int cell = i + 1;
            if (!Notebook.type(x).equals("code") || !Notebook.type(y).equals("code")) {
                if (!Notebook.type(x).equals(Notebook.type(y))) {
                    out.add(new Difference(cell, 0, "a " + Notebook.type(x) + " cell against a " + Notebook.type(y) + " cell"));
                }
                continue;
            }
            cells++;
            if (!Notebook.text(x.get("source")).equals(Notebook.text(y.get("source")))) {
                out.add(new Difference(cell, 0, "the code differs, so its outputs are not compared"));
                continue;
            }
            List<String> tx = texts(x);
            List<String> ty = texts(y);
            List<Difference> here = new ArrayList<>();
            if (tx.size() != ty.size()) {
                here.add(new Difference(cell, 0, tx.size() + " outputs against " + ty.size()));
            }
            for (int k = 0; k < Math.min(tx.size(), ty.size()); k++) {
                numbers += compareText(cell, k + 1, tx.get(k), ty.get(k), here);
            }
            if (here.size() > SHOWN_PER_CELL) {
                int more = here.size() - SHOWN_PER_CELL;
                here = new ArrayList<>(here.subList(0, SHOWN_PER_CELL));
                here.add(new Difference(cell, 0, "and " + more + " more differences"));
            }
            out.addAll(here);
        }
        return new Report(cells, numbers, List.copyOf(out));
    }

    /** Compares one output's text; returns how many numbers were compared. */
    private long compareText(int cell, int output, String x, String y, List<Difference> out) {
        List<String> nx = new ArrayList<>();
        List<String> ny = new ArrayList<>();
        String wx = split(x, nx);
        String wy = split(y, ny);
        if (!wx.equals(wy) || nx.size() != ny.size()) {
            out.add(new Difference(cell, output, "the text differs: " + firstDifferentLine(x, y)));
            return 0;
        }
        for (int i = 0; i < nx.size(); i++) {
            BigDecimal p = parse(nx.get(i));
            BigDecimal q = parse(ny.get(i));
            if (!agree(p, q)) {
                double rel = relativeDifference(p, q);
                out.add(new Difference(cell, output, String.format(Locale.ROOT, "%s against %s (relative difference %.2g)",
                        nx.get(i), ny.get(i), rel)));
            }
        }
        return nx.size();
    }

    /** Whether two numbers agree within the tolerances (exact decimal arithmetic: no overflow for long counts). */
    boolean agree(BigDecimal p, BigDecimal q) {
        if (p.compareTo(q) == 0) {
            return true;
        }
        BigDecimal diff = p.subtract(q).abs();
        BigDecimal scale = p.abs().max(q.abs());
        BigDecimal allowed = new BigDecimal(absolute).max(new BigDecimal(relative).multiply(scale));
        return diff.compareTo(allowed) <= 0;
    }

    /** |p - q| / max(|p|, |q|), for the report (p and q differ, so the scale is not zero). */
    private static double relativeDifference(BigDecimal p, BigDecimal q) {
        BigDecimal scale = p.abs().max(q.abs());
        return p.subtract(q).abs().divide(scale, java.math.MathContext.DECIMAL64).doubleValue();
    }

    /** The words of {@code text} with every number replaced by {@code #}; the numbers go to {@code numbers}. */
    static String split(String text, List<String> numbers) {
        Matcher m = NUMBER.matcher(text);
        StringBuilder words = new StringBuilder();
        int at = 0;
        while (m.find()) {
            words.append(text, at, m.start()).append('#');
            numbers.add(m.group());
            at = m.end();
        }
        return words.append(text.substring(at)).toString();
    }

    static BigDecimal parse(String number) {
        String s = number.replace("\u2212", "-").replace(",", "");
        if (s.startsWith("+")) {
            s = s.substring(1);
        }
        if (s.endsWith(".")) {
            s = s.substring(0, s.length() - 1);
        }
        s = s.replaceFirst("\\.(?=[eE])", "");
        return new BigDecimal(s);
    }

    private static String firstDifferentLine(String x, String y) {
        String[] a = x.split("\n", -1);
        String[] b = y.split("\n", -1);
        for (int i = 0; i < Math.max(a.length, b.length); i++) {
            String p = i < a.length ? a[i] : "(no line)";
            String q = i < b.length ? b[i] : "(no line)";
            if (!p.equals(q)) {
                return "line " + (i + 1) + " \"" + clip(p) + "\" against \"" + clip(q) + "\"";
            }
        }
        return "(same lines)";
    }

    private static String clip(String s) {
        return s.length() <= 80 ? s : s.substring(0, 77) + "...";
    }

    /** The reader-visible text of each output of a code cell, in order. */
    static List<String> texts(JsonObject cell) {
        List<String> out = new ArrayList<>();
        JsonElement outputs = cell.get("outputs");
        if (!(outputs instanceof JsonArray array)) {
            return out;
        }
        for (JsonElement e : array) {
            if (!(e instanceof JsonObject o) || !o.has("output_type")) {
                continue;
            }
            switch (o.get("output_type").getAsString()) {
                case "stream" -> out.add(o.get("name").getAsString() + ": " + Notebook.text(o.get("text")));
                case "error" -> out.add("error " + Notebook.text(o.get("ename")) + ": " + Notebook.text(o.get("evalue")));
                default -> {
                    JsonElement data = o.get("data");
                    if (data instanceof JsonObject d && d.has(MimeBundle.TEXT_PLAIN)) {
                        out.add(Notebook.text(d.get(MimeBundle.TEXT_PLAIN)));
                    }
                }
            }
        }
        return out;
    }
}
