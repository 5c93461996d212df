package org.microtally.notebook.render;

import java.math.BigDecimal;
import java.math.RoundingMode;
import java.util.ArrayList;
import java.util.List;

/**
 * Round-numbered axis ticks: at most {@value #MAX_TICKS} on a linear axis, stepped by 1, 2, 2.5 or 5
 * times a power of ten, and whole decades (or 1-2-5 within few decades) on a logarithmic axis. A
 * linear axis is widened to an outer tick when that tick lies within a tenth of the data's span,
 * else it ends 2 % past the data (ticks only inside). All labels of one axis share one format: the same number of
 * decimals, and, where the values are very large or very small, one power of ten stated once (as
 * {@link #exponent()}).
 *
 * <p>Method: the "nice numbers" step choice of P. S. Heckbert, "Nice numbers for graph labels",
 * Graphics Gems (Academic Press, 1990), pp. 61-63, with 2.5 added to the step set and the count
 * bounded from above rather than aimed at. Positions are exact multiples of the step computed in
 * decimal ({@link BigDecimal}), so labels never show binary rounding such as 0.30000000000000004.
 *
 * @param values    tick positions in data units, increasing
 * @param labels    one label per tick
 * @param lo        lower end of the axis in data units
 * @param hi        upper end of the axis in data units
 * @param log       whether the axis is logarithmic
 * @param exponent  the power of ten factored out of every label (0 when none): a label {@code 2.5}
 *                  with exponent -7 stands for 2.5e-7
 */
record Ticks(double[] values, String[] labels, double lo, double hi, boolean log, int exponent) {
    /** Most ticks on an axis. */
    static final int MAX_TICKS = 10;

    private static final double[] STEPS = {1, 2, 2.5, 5, 10};
    private static final String SUPERSCRIPTS = "\u2070\u00b9\u00b2\u00b3\u2074\u2075\u2076\u2077\u2078\u2079";

    /** Ticks for data in [min, max] on a linear axis, at most {@code maxTicks} (2..10). */
    static Ticks linear(double min, double max, int maxTicks) {
        return linear(min, max, maxTicks, false);
    }

    /**
     * As {@link #linear(double, double, int)}; with {@code integral} (data that are whole numbers, such
     * as particle numbers or quanta) no fractional step is used.
     */
    static Ticks linear(double min, double max, int maxTicks, boolean integral) {
        if (!(min <= max) || !Double.isFinite(min) || !Double.isFinite(max)) {
            throw new IllegalArgumentException("axis range [" + min + ", " + max + "] is not a finite interval");
        }
        if (max - min <= 1e-9 * Math.max(Math.abs(min), Math.abs(max))) {
            // a flat series (or one flat to nine digits): centre it in a visible band
            double pad = min == 0 ? 1 : Math.abs(min) * 0.1;
            min -= pad;
            max += pad;
        }
        int n = Math.max(2, Math.min(MAX_TICKS, maxTicks));
        double raw = (max - min) / (n - 1);
        double mag = Math.pow(10, Math.floor(Math.log10(raw)));
        BigDecimal step = null;
        for (int e = 0; step == null; e++) {
            for (double s : STEPS) {
                BigDecimal candidate = new BigDecimal(s).multiply(BigDecimal.valueOf(mag)).scaleByPowerOfTen(e)
                        .stripTrailingZeros();
                double st = candidate.doubleValue();
                if (integral && candidate.stripTrailingZeros().scale() > 0) {
                    continue;
                }
                if (Math.ceil(max / st - 1e-9) - Math.floor(min / st + 1e-9) + 1 <= n) {
                    step = candidate;
                    break;
                }
            }
        }
        double st = step.doubleValue();
        long first = (long) Math.floor(min / st + 1e-9);
        long last = (long) Math.ceil(max / st - 1e-9);
        int count = (int) (last - first + 1);
        double[] values = new double[count];
        BigDecimal[] exact = new BigDecimal[count];
        for (int i = 0; i < count; i++) {
            exact[i] = step.multiply(BigDecimal.valueOf(first + i));
            values[i] = exact[i].doubleValue();
        }
        double top = Math.max(Math.abs(values[0]), Math.abs(values[count - 1]));
        int exponent = top >= 1e6 || top < 1e-3 ? (int) Math.floor(Math.log10(top)) : 0;
        BigDecimal scaledStep = step.movePointLeft(exponent);
        int decimals = Math.max(0, scaledStep.stripTrailingZeros().scale());
        String[] labels = new String[count];
        for (int i = 0; i < count; i++) {
            labels[i] = exact[i].movePointLeft(exponent).setScale(decimals, RoundingMode.HALF_EVEN).toPlainString();
            if (labels[i].matches("-0(\\.0*)?")) {
                labels[i] = labels[i].substring(1);
            }
        }
        // the axis ends at an outer tick only when that tick is close to the data (within a tenth of
        // their span); otherwise just past the data, so that -0.2..33 is not drawn from -5
        double span = max - min;
        double lo = min - values[0] > 0.1 * span ? min - 0.02 * span : values[0];
        double hi = values[count - 1] - max > 0.1 * span ? max + 0.02 * span : values[count - 1];
        int from = 0;
        int to = count;
        while (from < to && values[from] < lo - 1e-9 * span) {
            from++;
        }
        while (to > from && values[to - 1] > hi + 1e-9 * span) {
            to--;
        }
        if (to - from < 2) {
            return new Ticks(values, labels, values[0], values[count - 1], false, exponent);
        }
        return new Ticks(java.util.Arrays.copyOfRange(values, from, to), java.util.Arrays.copyOfRange(labels, from, to),
                lo, hi, false, exponent);
    }

    /**
     * Ticks for positive data in [min, max] on a logarithmic axis: every k-th decade so that at most
     * {@value #MAX_TICKS} remain; with at most two decades 1, 2 and 5 times each power of ten.
     */
    static Ticks logarithmic(double min, double max) {
        if (!(min > 0) || !(min <= max) || !Double.isFinite(max)) {
            throw new IllegalArgumentException("log axis range [" + min + ", " + max + "] is not positive and finite");
        }
        int d0 = (int) Math.floor(Math.log10(min) + 1e-12);
        int d1 = (int) Math.ceil(Math.log10(max) - 1e-12);
        if (d1 == d0) {
            d1++;
        }
        List<Double> values = new ArrayList<>();
        List<String> labels = new ArrayList<>();
        boolean plain = d0 >= -3 && d1 <= 4;   // one label style per axis
        if (d1 - d0 <= 2) {
            for (int d = d0; d <= d1; d++) {
                for (int m : new int[] {1, 2, 5}) {
                    double v = m * Math.pow(10, d);
                    if (d == d1 && m > 1) {
                        break;
                    }
                    values.add(v);
                    labels.add(decadeLabel(m, d, plain));
                }
            }
        } else {
            int k = (int) Math.ceil((d1 - d0 + 1) / (double) MAX_TICKS);
            d0 = Math.floorDiv(d0, k) * k;
            d1 = -Math.floorDiv(-d1, k) * k;
            for (int d = d0; d <= d1; d += k) {
                values.add(Math.pow(10, d));
                labels.add(decadeLabel(1, d, plain));
            }
        }
        // keep the ticks from the last one at or below min to the first one at or above max
        while (values.size() > 2 && values.get(values.size() - 2) >= max * (1 - 1e-12)) {
            values.remove(values.size() - 1);
            labels.remove(labels.size() - 1);
        }
        while (values.size() > 2 && values.get(1) <= min * (1 + 1e-12)) {
            values.remove(0);
            labels.remove(0);
        }
        double[] v = values.stream().mapToDouble(Double::doubleValue).toArray();
        return new Ticks(v, labels.toArray(new String[0]), v[0], v[v.length - 1], true, 0);
    }

    /** Ticks at chosen positions (increasing, finite) on an axis spanning them and [min, max]. */
    static Ticks at(double[] positions, double min, double max, boolean log) {
        String[] labels = new String[positions.length];
        for (int i = 0; i < positions.length; i++) {
            labels[i] = CellText.floating(positions[i], 6);
        }
        double lo = Math.min(min, positions[0]);
        double hi = Math.max(max, positions[positions.length - 1]);
        if (!log && hi > lo) {
            double pad = 0.02 * (hi - lo);
            lo -= pad;
            hi += pad;
        }
        return new Ticks(positions.clone(), labels, lo, hi == lo ? lo + 1 : hi, log, 0);
    }

    /** {@code m} times ten to the {@code d}: plain ({@code 0.005}), or as {@code 10⁻⁷} and {@code 5×10⁻⁷}. */
    static String decadeLabel(int m, int d, boolean plain) {
        if (plain) {
            return BigDecimal.valueOf(m).scaleByPowerOfTen(d).stripTrailingZeros().toPlainString();
        }
        return (m == 1 ? "" : m + "\u00d7") + "10" + superscript(d);
    }

    /** An integer in Unicode superscript digits, e.g. {@code ⁻¹²}. */
    static String superscript(int n) {
        StringBuilder sb = new StringBuilder(n < 0 ? "\u207b" : "");
        for (char c : Integer.toString(Math.abs(n)).toCharArray()) {
            sb.append(SUPERSCRIPTS.charAt(c - '0'));
        }
        return sb.toString();
    }

    /** The fraction of the axis length at which {@code v} lies (0 at {@link #lo}, 1 at {@link #hi}). */
    double fraction(double v) {
        if (log) {
            return (Math.log10(v) - Math.log10(lo)) / (Math.log10(hi) - Math.log10(lo));
        }
        return (v - lo) / (hi - lo);
    }

    /** The axis-title suffix naming the factored-out power of ten, e.g. {@code " (×10⁻⁷)"}; empty when none. */
    String exponentNote() {
        return exponent == 0 ? "" : " (\u00d710" + superscript(exponent) + ")";
    }
}
