package org.microtally.notebook.render;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.math.BigDecimal;
import java.math.BigInteger;
import java.util.Random;
import org.apache.commons.math3.fraction.BigFraction;
import org.junit.jupiter.api.Test;
import org.microtally.InvalidInputException;

class CellTextTest {
    static BigInteger factorial(int n) {
        BigInteger f = BigInteger.ONE;
        for (int i = 2; i <= n; i++) {
            f = f.multiply(BigInteger.valueOf(i));
        }
        return f;
    }

    @Test
    void hundredFactorialIsAbbreviatedWithItsDigitCountAndLeadingDigits() {
        BigInteger f = factorial(100);
        // Source: OEIS A000142 (100! = 93326215443944152681...000, 158 digits); closed form
        // floor(log10 100!) + 1 = 158.
        assertEquals(158, f.toString().length());
        String shown = CellText.shown(f, TableFormat.DEFAULT);
        // Source: OEIS A000142, leading digits of 100! are 933262154439 44152681...
        assertEquals("933262154439\u2026(158 digits)", shown);
        assertEquals(f.toString(), CellText.exact(f));
    }

    @Test
    void hundredFactorialIsShownInFullWhenTheWidthAllowsIt() {
        BigInteger f = factorial(100);
        TableFormat wide = new TableFormat(160, 12, 8, 20, 5);
        String shown = CellText.shown(f, wide);
        assertEquals(f.toString(), shown);
        // Source: OEIS A000142, 100! starts 93326215443944152681 and ends in 24 zeros (floor(100/5) + floor(100/25)).
        assertTrue(shown.startsWith("93326215443944152681"));
        assertTrue(shown.endsWith("0".repeat(24)));
        assertFalse(shown.endsWith("0".repeat(25)));
    }

    @Test
    void exactlyMaxDigitsIsStillFullAndOneMoreIsAbbreviated() {
        BigInteger forty = BigInteger.TEN.pow(39); // 40 digits: common practice, no source
        assertEquals(forty.toString(), CellText.shown(forty, TableFormat.DEFAULT));
        BigInteger fortyOne = BigInteger.TEN.pow(40);
        assertEquals("100000000000\u2026(41 digits)", CellText.shown(fortyOne, TableFormat.DEFAULT));
        assertEquals("-100000000000\u2026(41 digits)", CellText.shown(fortyOne.negate(), TableFormat.DEFAULT));
    }

    @Test
    void digitStringsFromTablesAreAbbreviatedLikeIntegers() {
        String digits = factorial(100).toString();
        assertEquals("933262154439\u2026(158 digits)", CellText.shown(digits, TableFormat.DEFAULT));
        assertTrue(CellText.isNumeric(digits));
        assertFalse(CellText.isNumeric("n = 3"));
    }

    @Test
    void fractionsAreExact() {
        assertEquals("1/3", CellText.shown(new BigFraction(1, 3), TableFormat.DEFAULT));
        assertEquals("-7/2", CellText.shown(new BigFraction(-7, 2), TableFormat.DEFAULT));
        assertEquals("5", CellText.shown(new BigFraction(10, 2), TableFormat.DEFAULT));
        // 101 is prime and larger than 100, so 100!/101^40 is already in lowest terms.
        BigFraction big = new BigFraction(factorial(100), BigInteger.valueOf(101).pow(40));
        String shown = CellText.shown(big, new TableFormat(40, 12, 8, 60, 20));
        // Source: OEIS A000142 (100!: 158 digits, leading 933262154439); closed form
        // 100!/101^40 = 6.26828455408906...e77: computed independently with Python 3 fractions and
        // decimal (30 digits), rounded here to 8 significant digits.
        assertEquals("\u22486.2682846e77", shown);
        BigFraction small = new BigFraction(BigInteger.valueOf(3), BigInteger.TEN.pow(60).add(BigInteger.ONE));
        // Source: closed form, 3/(10^60 + 1) = 3e-60 to 60 significant digits
        assertEquals("\u22483e-60", CellText.shown(small, TableFormat.DEFAULT));
        assertEquals(3e-60, CellText.decimalValue(small.getNumerator(), small.getDenominator()));
        assertEquals(big.getNumerator() + "/" + big.getDenominator(), CellText.exact(big));
    }

    @Test
    void doublesShowSignificantDigitsHalfEven() {
        TableFormat f = new TableFormat(40, 12, 8, 60, 20);
        assertEquals("0.33333333", CellText.shown(1.0 / 3, f));
        assertEquals("0.333333", CellText.shown(1.0 / 3, TableFormat.DEFAULT));
        assertEquals("2.5", CellText.shown(2.5, f));
        assertEquals("3", CellText.shown(3.0, f));
        assertEquals("1.5e-12", CellText.shown(1.5e-12, f));
        assertEquals("1.2345679e11", CellText.shown(123456789012.0, f));
        assertEquals("0.00012345", CellText.shown(1.2345e-4, f));
        assertEquals("1.2345e-5", CellText.shown(1.2345e-5, f));
        assertEquals("-0", CellText.shown(-0.0, f));
        assertEquals("NaN", CellText.shown(Double.NaN, f));
        // half-even at the 2nd significant digit: 0.125 (exact in binary) -> 0.12, 0.375 -> 0.38
        assertEquals("0.12", CellText.floating(0.125, 2));
        assertEquals("0.38", CellText.floating(0.375, 2));
        assertEquals("1e9", CellText.floating(1e9, 8));
        assertEquals("99999999", CellText.floating(99999999.0, 8));
    }

    @Test
    void seventeenSignificantDigitsReadBackToTheSameDouble() {
        Random rnd = new Random(20261201L);
        for (int i = 0; i < 2000; i++) {
            double v = Double.longBitsToDouble(rnd.nextLong());
            if (!Double.isFinite(v)) {
                continue;
            }
            String s = CellText.floating(v, 17);
            // Source: IEEE 754-2008 section 5.12.2: 17 significant digits identify every binary64 value.
            assertEquals(v, Double.parseDouble(s), s);
        }
    }

    @Test
    void bigDecimalIsNeverSilentlyRounded() {
        BigDecimal d = new BigDecimal(factorial(50)).movePointLeft(30);
        String shown = CellText.shown(d, TableFormat.DEFAULT);
        // Source: OEIS A000142, 50! has 65 digits and starts 304140932017...
        assertTrue(shown.startsWith("3.04140932017"), shown);
        assertTrue(shown.endsWith("\u2026(65 digits)"), shown);
    }

    @Test
    void nullIsEmptyAndLineBreaksBecomeSpaces() {
        assertEquals("", CellText.shown(null, TableFormat.DEFAULT));
        assertEquals("a b c", CellText.shown("a\nb\r\nc", TableFormat.DEFAULT));
    }

    @Test
    void formatRejectsBadSettings() {
        InvalidInputException e = assertThrows(InvalidInputException.class, () -> new TableFormat(10, 11, 8, 5, 5));
        assertTrue(e.getMessage().contains("leadingDigits = 11"), e.getMessage());
        assertThrows(InvalidInputException.class, () -> new TableFormat(10, 5, 18, 5, 5));
        assertThrows(InvalidInputException.class, () -> new TableFormat(10, 5, 8, 0, 5));
        assertThrows(InvalidInputException.class, () -> new TableFormat(10, 5, 8, 5, 6));
        assertThrows(InvalidInputException.class, () -> new TableFormat(10, 5, 2, 5, 5));
    }
}
