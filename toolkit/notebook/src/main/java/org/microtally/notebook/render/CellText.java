package org.microtally.notebook.render;

import java.math.BigDecimal;
import java.math.BigInteger;
import java.math.MathContext;
import java.math.RoundingMode;
import java.util.regex.Pattern;
import org.apache.commons.math3.fraction.BigFraction;
import org.apache.commons.math3.fraction.Fraction;

/**
 * The text of one table cell, for display ({@link #shown}) and in full ({@link #exact}).
 *
 * <ul>
 *   <li>Exact integers ({@link BigInteger}, {@code long}, {@code int}, and strings made only of
 *       digits, which is how {@link Tables} keeps big integers exact) are shown in full up to
 *       {@link TableFormat#maxDigits()} digits, beyond that as the leading digits, an ellipsis and
 *       the digit count: {@code 933262154439…(158 digits)}. Never rounded.</li>
 *   <li>Exact fractions ({@link BigFraction}, {@link Fraction}, strings {@code p/q}) as
 *       {@code p/q} while both parts fit in {@link TableFormat#maxDigits()} digits; otherwise as
 *       their value marked approximate, {@code ≈6.2682846e77} (p/q to the significant digits of the
 *       format, correctly rounded from the exact quotient), since truncated digits of p and q say
 *       nothing about the size of p/q. {@link #exact} keeps {@code p/q}.</li>
 *   <li>Floating-point numbers rounded half-even to {@link TableFormat#significantDigits()}
 *       significant digits (they are approximations already; {@link #exact} gives the shortest
 *       decimal that reads back to the same double), plain between 1e-4 and 1e9, otherwise in
 *       scientific notation {@code 1.2345e-12}.</li>
 *   <li>{@code null} (a missing value) as the empty string; anything else by {@code String.valueOf},
 *       line breaks shown as spaces.</li>
 * </ul>
 */
public final class CellText {
    private static final Pattern INTEGER = Pattern.compile("-?[0-9]+");
    private static final Pattern FRACTION = Pattern.compile("-?[0-9]+/[0-9]+");
    private static final String ELLIPSIS = "\u2026";
    private static final String APPROX = "\u2248";

    private CellText() { }

    /** The cell as shown under {@code format}. */
    public static String shown(Object value, TableFormat format) {
        if (value == null) {
            return "";
        }
        if (value instanceof BigInteger || value instanceof Long || value instanceof Integer
                || value instanceof Short || value instanceof Byte) {
            return integer(value.toString(), format);
        }
        if (value instanceof BigFraction f) {
            return fraction(f.getNumerator().toString(), f.getDenominator().toString(), format);
        }
        if (value instanceof Fraction f) {
            return fraction(Integer.toString(f.getNumerator()), Integer.toString(f.getDenominator()), format);
        }
        if (value instanceof Double || value instanceof Float) {
            return floating(((Number) value).doubleValue(), format.significantDigits());
        }
        if (value instanceof BigDecimal d) {
            return decimal(d, format);
        }
        if (value instanceof CharSequence cs) {
            String s = cs.toString();
            if (s.length() > format.maxDigits() && INTEGER.matcher(s).matches()) {
                return integer(s, format);
            }
            if (s.length() > format.maxDigits() && FRACTION.matcher(s).matches()) {
                int slash = s.indexOf('/');
                return fraction(s.substring(0, slash), s.substring(slash + 1), format);
            }
            return oneLine(s);
        }
        return oneLine(String.valueOf(value));
    }

    /** The complete value of the cell: every digit of an exact number, the shortest repr of a double. */
    public static String exact(Object value) {
        if (value == null) {
            return "";
        }
        if (value instanceof BigFraction f) {
            return f.getDenominator().equals(BigInteger.ONE) ? f.getNumerator().toString()
                    : f.getNumerator() + "/" + f.getDenominator();
        }
        if (value instanceof Fraction f) {
            return f.getDenominator() == 1 ? Integer.toString(f.getNumerator())
                    : f.getNumerator() + "/" + f.getDenominator();
        }
        if (value instanceof BigDecimal d) {
            return d.toString();
        }
        return String.valueOf(value);
    }

    /** The text core results put in a cell whose value is undefined. */
    public static final String NOT_AVAILABLE = "n/a";

    /**
     * Whether the cell holds no value: {@code null}, a core {@link org.microtally.Missing} value, or (in
     * tables users build by hand) the marker {@value #NOT_AVAILABLE}. Such cells do not decide a
     * column's alignment or type, and charts leave them out.
     */
    public static boolean isMissing(Object value) {
        return value == null || value instanceof org.microtally.Missing
                || (value instanceof CharSequence cs && NOT_AVAILABLE.contentEquals(cs));
    }

    /** Whether the cell is a number (shown right-aligned). */
    public static boolean isNumeric(Object value) {
        if (value instanceof Number) {
            return true;
        }
        if (value instanceof CharSequence cs) {
            String s = cs.toString();
            return !s.isEmpty() && (INTEGER.matcher(s).matches() || FRACTION.matcher(s).matches());
        }
        return false;
    }

    /** Number of decimal digits of an integer given by its digits (sign not counted). */
    static int digitCount(String digits) {
        return digits.startsWith("-") ? digits.length() - 1 : digits.length();
    }

    private static String integer(String digits, TableFormat format) {
        boolean negative = digits.startsWith("-");
        String body = negative ? digits.substring(1) : digits;
        if (body.length() <= format.maxDigits()) {
            return digits;
        }
        return (negative ? "-" : "") + body.substring(0, format.leadingDigits()) + ELLIPSIS + "(" + body.length()
                + " digits)";
    }

    private static String fraction(String num, String den, TableFormat format) {
        if (den.equals("1")) {
            return integer(num, format);
        }
        if (digitCount(num) <= format.maxDigits() && digitCount(den) <= format.maxDigits()) {
            return num + "/" + den;
        }
        return APPROX + floating(decimalValue(new BigInteger(num), new BigInteger(den)), format.significantDigits());
    }

    /** The double nearest to p/q for any size of p and q (0 or infinity only beyond the double range). */
    public static double decimalValue(BigInteger p, BigInteger q) {
        return new BigDecimal(p).divide(new BigDecimal(q), MathContext.DECIMAL128).doubleValue();
    }

    private static String decimal(BigDecimal d, TableFormat format) {
        if (d.precision() <= format.maxDigits()) {
            int exp = d.precision() - d.scale() - 1;
            return (exp >= -4 && exp < format.maxDigits()) ? d.toPlainString() : d.toString();
        }
        BigDecimal lead = d.round(new MathContext(format.leadingDigits(), RoundingMode.DOWN));
        return sci(lead) + ELLIPSIS + "(" + d.precision() + " digits)";
    }

    /** A double to {@code sig} significant digits, half-even; non-finite values by name. */
    public static String floating(double v, int sig) {
        if (!Double.isFinite(v)) {
            return Double.toString(v);
        }
        if (v == 0.0) {
            return (1 / v < 0) ? "-0" : "0";
        }
        BigDecimal d = new BigDecimal(Double.toString(v)).round(new MathContext(sig, RoundingMode.HALF_EVEN))
                .stripTrailingZeros();
        int exp = d.precision() - d.scale() - 1;
        if (exp >= -4 && exp < 9) {
            return d.toPlainString();
        }
        return sci(d);
    }

    private static String sci(BigDecimal d) {
        BigDecimal s = d.stripTrailingZeros();
        int exp = s.precision() - s.scale() - 1;
        String digits = s.unscaledValue().abs().toString();
        StringBuilder sb = new StringBuilder();
        if (s.signum() < 0) {
            sb.append('-');
        }
        sb.append(digits.charAt(0));
        if (digits.length() > 1) {
            sb.append('.').append(digits, 1, digits.length());
        }
        return sb.append('e').append(exp).toString();
    }

    private static String oneLine(String s) {
        return s.indexOf('\n') < 0 && s.indexOf('\r') < 0 ? s : s.replaceAll("\r\n|[\r\n]", " ");
    }
}
