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
 *   <li>a column of exact fractions is shown as p/q while every p and q fits
 *       {@link TableFormat#maxDigits()}; when any does not, the whole column is shown as values
 *       marked approximate ({@code ≈0.0741361}, {@code ≈2.99313e-35}), by the floating-point rule
 *       above applied to the quotients (computed to 34 digits, so beyond the range of a double too);</li>
 *   <li>anything else (text, a mix of exact and floating values) keeps the cell formats of
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

    private static final Pattern FRACTION = Pattern.compile("-?[0-9]+/[0-9]+");
    /** Digits of p/q kept before the column's rounding (far more than any shown column needs). */
    private static final MathContext QUOTIENT = MathContext.DECIMAL128;

    private final boolean scientific;
    private final int decimals;
    private final int exponentDigits;
    private final boolean approximate;

    private ColumnNumbers(boolean scientific, int decimals, int exponentDigits, boolean approximate) {
        this.scientific = scientific;
        this.decimals = decimals;
        this.exponentDigits = exponentDigits;
        this.approximate = approximate;
    }

    /** The format of a column from its shown cells, or null when its cells keep {@link CellText}'s formats. */
    static ColumnNumbers of(List<Object> cells, TableFormat format) {
        boolean allFloating = true;
        boolean allInteger = true;
        boolean allRational = true;
        boolean anyTooLongFraction = false;
        int present = 0;
        for (Object v : cells) {
            if (CellText.isMissing(v)) {
                continue;
            }
            present++;
            allFloating &= v instanceof Double || v instanceof Float;
            allInteger &= integer(v) != null;
            String[] pq = fraction(v);
            allRational &= integer(v) != null || pq != null;
            anyTooLongFraction |= pq != null && (CellText.digitCount(pq[0]) > format.maxDigits()
                    || CellText.digitCount(pq[1]) > format.maxDigits());
        }
        if (present == 0) {
            return null;
        }
        if (allFloating) {
            return decimal(cells, format.significantDigits(), false);
        }
        if (allInteger) {
            return integers(cells, format);
        }
        if (allRational && anyTooLongFraction) {
            // some p/q cannot be shown as p/q: the whole column as values marked approximate, one format
            return decimal(cells, format.significantDigits(), true);
        }
        return null;
    }

    private static ColumnNumbers decimal(List<Object> cells, int significantDigits, boolean approximate) {
        BigDecimal maxAbs = BigDecimal.ZERO;
        BigDecimal minAbs = null;
        for (Object v : cells) {
            BigDecimal d = value(v);
            if (d != null && d.signum() != 0) {
                maxAbs = maxAbs.max(d.abs());
                minAbs = minAbs == null ? d.abs() : minAbs.min(d.abs());
            }
        }
        if (minAbs == null) {
            return null;
        }
        int eMax = exponent(maxAbs);
        int eMin = exponent(minAbs);
        boolean sci = eMax >= 9 || eMax < -4 || eMax - eMin > significantDigits - 3;
        int needed = 0;
        int widestExponent = 0;
        for (Object v : cells) {
            BigDecimal d = value(v);
            if (d != null && d.signum() != 0) {
                BigDecimal r = round(d, significantDigits);
                needed = Math.max(needed, sci ? r.precision() - 1 : Math.max(0, r.scale()));
                widestExponent = Math.max(widestExponent, Math.abs(exponent(r)));
            }
        }
        int decimals = sci ? needed : Math.min(needed, Math.max(0, significantDigits - 1 - eMax));
        return new ColumnNumbers(sci, decimals, Math.max(2, String.valueOf(widestExponent).length()), approximate);
    }

    /** The value of a finite number cell (exact for integers and doubles, p/q to 34 digits), else null. */
    private static BigDecimal value(Object v) {
        BigInteger i = integer(v);
        if (i != null) {
            return new BigDecimal(i);
        }
        String[] pq = fraction(v);
        if (pq != null) {
            return new BigDecimal(new BigInteger(pq[0])).divide(new BigDecimal(new BigInteger(pq[1])), QUOTIENT);
        }
        if (v instanceof Double || v instanceof Float) {
            double d = ((Number) v).doubleValue();
            return Double.isFinite(d) ? new BigDecimal(d) : null;
        }
        return null;
    }

    /** Numerator and denominator of a fraction cell (BigFraction, Fraction, "p/q"), or null. */
    private static String[] fraction(Object v) {
        if (v instanceof org.apache.commons.math3.fraction.BigFraction f) {
            return new String[] {f.getNumerator().toString(), f.getDenominator().toString()};
        }
        if (v instanceof org.apache.commons.math3.fraction.Fraction f) {
            return new String[] {Integer.toString(f.getNumerator()), Integer.toString(f.getDenominator())};
        }
        if (v instanceof CharSequence cs && FRACTION.matcher(cs).matches()) {
            String s = cs.toString();
            int slash = s.indexOf('/');
            return new String[] {s.substring(0, slash), s.substring(slash + 1)};
        }
        return null;
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
        return new ColumnNumbers(true, needed, Math.max(2, String.valueOf(widestExponent).length()), false);
    }

    /** The cell as shown in this column (non-finite values by name). */
    String shown(Object v) {
        BigDecimal exact = value(v);
        if (exact == null) {
            return Double.toString(((Number) v).doubleValue());   // NaN and the infinities by name
        }
        String mark = approximate ? "\u2248" : "";
        if (!scientific) {
            String s = exact.setScale(decimals, RoundingMode.HALF_EVEN).toPlainString();
            return mark + (s.matches("-0(\\.0*)?") ? s.substring(1) : s);
        }
        int e = 0;
        BigDecimal mantissa = BigDecimal.ZERO.setScale(decimals);
        if (exact.signum() != 0) {
            BigDecimal r = exact.round(new MathContext(decimals + 1, RoundingMode.HALF_EVEN));
            e = exponent(r);
            mantissa = r.movePointLeft(e).setScale(decimals, RoundingMode.HALF_EVEN);
        }
        String digits = String.valueOf(Math.abs(e));
        return mark + mantissa.toPlainString() + "e" + (e < 0 ? "-" : "+")
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
