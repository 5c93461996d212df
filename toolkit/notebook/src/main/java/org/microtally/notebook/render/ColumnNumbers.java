package org.microtally.notebook.render;

import java.math.BigDecimal;
import java.math.BigInteger;
import java.math.MathContext;
import java.math.RoundingMode;
import java.util.List;
import java.util.regex.Pattern;

/**
 * One number format per table column, so that a column reads in one style and its decimal points
 * line up when the cells are right-aligned:
 * <ul>
 *   <li>a column of floating-point values is either fixed (as many decimals as the largest value
 *       needs for the format's significant digits, fewer when no value needs them) or, when it spans
 *       more than {@code significantDigits - 3} decades or leaves the range 1e-4 to 1e9, scientific;</li>
 *   <li>a column of exact integers is shown digit for digit while every one of them fits
 *       {@link TableFormat#maxDigits()}; when any does not, the whole column is scientific, so that
 *       whole numbers and shortened big numbers are never mixed in one column;</li>
 *   <li>anything else (fractions, text, a mix of exact and floating values) keeps the cell formats of
 *       {@link CellText}.</li>
 * </ul>
 * Scientific cells have one mantissa width and one exponent style per column: a signed exponent of
 * at least two digits, {@code 1.66674e+03}, {@code 6.81724e-07}, {@code 2.50000e+00} (the form of the
 * C library's {@code %e} conversion, ISO/IEC 9899:2018 7.21.6.1), padded to the column's widest
 * exponent, so that the mantissas' points align. Values are rounded half-even from their exact value
 * ({@link BigDecimal}); the full value stays in the cell's title whenever it is shown shorter.
 */
final class ColumnNumbers {
    private static final Pattern INTEGER = Pattern.compile("-?[0-9]+");

    private final boolean scientific;
    private final int decimals;
    private final int exponentDigits;

    private ColumnNumbers(boolean scientific, int decimals, int exponentDigits) {
        this.scientific = scientific;
        this.decimals = decimals;
        this.exponentDigits = exponentDigits;
    }

    /** The format of a column from its shown cells, or null when its cells keep {@link CellText}'s formats. */
    static ColumnNumbers of(List<Object> cells, TableFormat format) {
        boolean allFloating = true;
        boolean allInteger = true;
        int present = 0;
        for (Object v : cells) {
            if (CellText.isMissing(v)) {
                continue;
            }
            present++;
            allFloating &= v instanceof Double || v instanceof Float;
            allInteger &= integer(v) != null;
        }
        if (present == 0) {
            return null;
        }
        if (allFloating) {
            return floating(cells, format.significantDigits());
        }
        if (allInteger) {
            return integers(cells, format);
        }
        return null;
    }

    private static ColumnNumbers floating(List<Object> cells, int significantDigits) {
        double maxAbs = 0;
        double minAbs = Double.POSITIVE_INFINITY;
        for (Object v : cells) {
            if (v instanceof Double || v instanceof Float) {
                double d = Math.abs(((Number) v).doubleValue());
                if (Double.isFinite(d)) {
                    maxAbs = Math.max(maxAbs, d);
                    if (d > 0) {
                        minAbs = Math.min(minAbs, d);
                    }
                }
            }
        }
        if (maxAbs == 0) {
            return null;
        }
        int eMax = exponent(new BigDecimal(maxAbs));
        int eMin = exponent(new BigDecimal(minAbs));
        boolean sci = eMax >= 9 || eMax < -4 || eMax - eMin > significantDigits - 3;
        int needed = 0;
        int widestExponent = 0;
        for (Object v : cells) {
            if (v instanceof Double || v instanceof Float) {
                double d = ((Number) v).doubleValue();
                if (Double.isFinite(d) && d != 0) {
                    BigDecimal r = round(new BigDecimal(d), significantDigits);
                    needed = Math.max(needed, sci ? r.precision() - 1 : Math.max(0, r.scale()));
                    widestExponent = Math.max(widestExponent, Math.abs(exponent(r)));
                }
            }
        }
        int decimals = sci ? needed : Math.min(needed, Math.max(0, significantDigits - 1 - eMax));
        return new ColumnNumbers(sci, decimals, Math.max(2, String.valueOf(widestExponent).length()));
    }

    private static ColumnNumbers integers(List<Object> cells, TableFormat format) {
        int needed = 0;
        int widestExponent = 0;
        boolean tooLong = false;
        for (Object v : cells) {
            BigInteger i = integer(v);
            if (i != null && i.abs().toString().length() > format.maxDigits()) {
                tooLong = true;
            }
        }
        if (!tooLong) {
            return null;
        }
        for (Object v : cells) {
            BigInteger i = integer(v);
            if (i != null && i.signum() != 0) {
                BigDecimal r = round(new BigDecimal(i), format.significantDigits());
                needed = Math.max(needed, r.precision() - 1);
                widestExponent = Math.max(widestExponent, Math.abs(exponent(r)));
            }
        }
        return new ColumnNumbers(true, needed, Math.max(2, String.valueOf(widestExponent).length()));
    }

    /** The cell as shown in this column (non-finite values by name). */
    String shown(Object v) {
        BigDecimal exact;
        BigInteger i = integer(v);
        if (i != null) {
            exact = new BigDecimal(i);
        } else {
            double d = ((Number) v).doubleValue();
            if (!Double.isFinite(d)) {
                return Double.toString(d);
            }
            exact = new BigDecimal(d);
        }
        if (!scientific) {
            String s = exact.setScale(decimals, RoundingMode.HALF_EVEN).toPlainString();
            return s.matches("-0(\\.0*)?") ? s.substring(1) : s;
        }
        int e = 0;
        BigDecimal mantissa = BigDecimal.ZERO.setScale(decimals);
        if (exact.signum() != 0) {
            BigDecimal r = exact.round(new MathContext(decimals + 1, RoundingMode.HALF_EVEN));
            e = exponent(r);
            mantissa = r.movePointLeft(e).setScale(decimals, RoundingMode.HALF_EVEN);
        }
        String digits = String.valueOf(Math.abs(e));
        return mantissa.toPlainString() + "e" + (e < 0 ? "-" : "+")
                + "0".repeat(Math.max(0, exponentDigits - digits.length())) + digits;
    }

    /** The exact integer a cell holds (integral types and digit strings), or null. */
    private static BigInteger integer(Object v) {
        if (v instanceof BigInteger b) {
            return b;
        }
        if (v instanceof Long || v instanceof Integer || v instanceof Short || v instanceof Byte) {
            return BigInteger.valueOf(((Number) v).longValue());
        }
        if (v instanceof CharSequence cs && INTEGER.matcher(cs).matches()) {
            return new BigInteger(cs.toString());
        }
        return null;
    }

    private static BigDecimal round(BigDecimal d, int sig) {
        return d.round(new MathContext(sig, RoundingMode.HALF_EVEN)).stripTrailingZeros();
    }

    /** The decimal exponent of a non-zero value: floor(log10 |d|), exactly. */
    private static int exponent(BigDecimal d) {
        return d.precision() - d.scale() - 1;
    }
}
