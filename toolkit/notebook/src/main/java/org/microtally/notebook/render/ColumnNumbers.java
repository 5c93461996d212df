package org.microtally.notebook.render;

import java.math.BigDecimal;
import java.math.MathContext;
import java.math.RoundingMode;
import java.util.List;

/**
 * One number format per table column of floating-point values, so that decimal points line up:
 * either fixed decimals (as many as the largest value needs for the format's significant digits,
 * fewer when no value needs them), or, when the column spans more than {@code significantDigits - 3}
 * decades or leaves the range 1e-4 to 1e9, scientific notation with one mantissa width. Exact numbers
 * (integers, fractions) and text are never reformatted; a column with any of them keeps the cell
 * formats of {@link CellText}. Values are rounded half-even from their exact binary value
 * ({@link BigDecimal}); the full value stays in the cell's title when shown shorter.
 */
final class ColumnNumbers {
    private final boolean scientific;
    private final int decimals;

    private ColumnNumbers(boolean scientific, int decimals) {
        this.scientific = scientific;
        this.decimals = decimals;
    }

    /** The format of a column from its shown cells, or null when the column is not all floating point. */
    static ColumnNumbers of(List<Object> cells, int significantDigits) {
        double maxAbs = 0;
        double minAbs = Double.POSITIVE_INFINITY;
        int count = 0;
        for (Object v : cells) {
            if (CellText.isMissing(v)) {
                continue;
            }
            if (!(v instanceof Double || v instanceof Float)) {
                return null;
            }
            double d = Math.abs(((Number) v).doubleValue());
            if (!Double.isFinite(d)) {
                continue;
            }
            count++;
            maxAbs = Math.max(maxAbs, d);
            if (d > 0) {
                minAbs = Math.min(minAbs, d);
            }
        }
        if (count == 0 || maxAbs == 0) {
            return null;
        }
        int eMax = exponent(maxAbs);
        int eMin = exponent(minAbs);
        boolean sci = eMax >= 9 || eMax < -4 || eMax - eMin > significantDigits - 3;
        int needed = 0;
        for (Object v : cells) {
            if (v instanceof Double || v instanceof Float) {
                double d = ((Number) v).doubleValue();
                if (Double.isFinite(d) && d != 0) {
                    BigDecimal r = round(d, significantDigits);
                    needed = Math.max(needed, sci ? r.precision() - 1 : Math.max(0, r.scale()));
                }
            }
        }
        int decimals = sci ? needed : Math.min(needed, Math.max(0, significantDigits - 1 - eMax));
        return new ColumnNumbers(sci, decimals);
    }

    /** The cell as shown in this column (non-finite values by name). */
    String shown(Object v) {
        double d = ((Number) v).doubleValue();
        if (!Double.isFinite(d)) {
            return Double.toString(d);
        }
        if (!scientific) {
            String s = new BigDecimal(d).setScale(decimals, RoundingMode.HALF_EVEN).toPlainString();
            return s.matches("-0(\\.0*)?") ? s.substring(1) : s;
        }
        if (d == 0) {
            return "0";
        }
        BigDecimal r = new BigDecimal(d).round(new MathContext(decimals + 1, RoundingMode.HALF_EVEN));
        int e = r.precision() - r.scale() - 1;
        BigDecimal mantissa = r.movePointLeft(e).setScale(decimals, RoundingMode.HALF_EVEN);
        return mantissa.toPlainString() + "e" + e;
    }

    private static BigDecimal round(double d, int sig) {
        return new BigDecimal(d).round(new MathContext(sig, RoundingMode.HALF_EVEN)).stripTrailingZeros();
    }

    private static int exponent(double d) {
        return (int) Math.floor(Math.log10(d));
    }
}
