package org.microtally.notebook.render;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Random;
import org.junit.jupiter.api.Test;

class TicksTest {

    @Test
    void roundStepsOverTheDataRange() {
        // Source: Heckbert, "Nice numbers for graph labels", Graphics Gems (1990): steps 1, 2, 5 x 10^k
        Ticks t = Ticks.linear(0.3, 9.7, 10);
        assertArrayEquals(new String[] {"0", "2", "4", "6", "8", "10"}, t.labels());
        Ticks u = Ticks.linear(12, 115 * 9, 10);
        for (double v : u.values()) {
            assertEquals(0, v % 100, 1e-9, "tick " + v);
        }
    }

    @Test
    void atMostTenTicksAndAlwaysCoveringTheData() {
        Random rnd = new Random(12);
        for (int i = 0; i < 2000; i++) {
            double a = (rnd.nextDouble() - 0.5) * Math.pow(10, rnd.nextInt(20) - 10);
            double b = a + rnd.nextDouble() * Math.pow(10, rnd.nextInt(20) - 10);
            Ticks t = Ticks.linear(a, b, 10);
            // common practice, no source: a readable axis has at most ~10 ticks and spans the data
            assertTrue(t.values().length >= 2 && t.values().length <= 10, a + ".." + b + ": " + t.values().length);
            double slack = 1e-6 * (t.hi() - t.lo());
            assertTrue(t.lo() <= a + slack && t.hi() >= b - slack, a + ".." + b + " not within " + t.lo() + ".." + t.hi());
            if (b - a >= 1e-2 * Math.max(Math.abs(a), Math.abs(b))) {
                for (String l : t.labels()) {
                    assertTrue(l.length() <= 9, "label " + l + " for " + a + ".." + b);
                }
            }
        }
    }

    @Test
    void axisFitsTheDataInsteadOfAFarOuterTick() {
        // common practice, no source: a chemical potential from -0.2 to 33 meV is not drawn from -5
        Ticks t = Ticks.linear(-0.2, 33, 8);
        assertTrue(t.lo() > -1 && t.lo() <= -0.2, "lo " + t.lo());
        assertEquals("0", t.labels()[0]);
        for (double v : t.values()) {
            assertTrue(v >= t.lo() && v <= t.hi(), v + " outside " + t.lo() + ".." + t.hi());
        }
        // an outer tick close to the data still ends the axis
        Ticks close = Ticks.linear(0.3, 9.7, 10);
        assertEquals(0.0, close.lo());
        assertEquals(10.0, close.hi());
    }

    @Test
    void labelsShareOneFormatAndOneExponent() {
        Ticks t = Ticks.linear(6.8e-7, 1.9e-4, 10);
        assertEquals(-4, t.exponent());
        assertEquals(" (\u00d710\u207b\u2074)", t.exponentNote());
        int decimals = t.labels()[1].length() - t.labels()[1].indexOf('.');
        for (String l : t.labels()) {
            assertEquals(decimals, l.length() - l.indexOf('.'), l);
        }
        assertEquals("0.5", Ticks.linear(0, 2.5, 6).labels()[1]);
        // whole-number data (quanta, particle numbers) never get a fractional step such as 2.5
        assertArrayEquals(new String[] {"0", "5", "10", "15", "20"}, Ticks.linear(0, 20, 10, true).labels());
        assertEquals("2.5", Ticks.linear(0, 20, 10, false).labels()[1]);
    }

    @Test
    void logAxisHasDecades() {
        Ticks t = Ticks.logarithmic(1e-35, 0.05);
        assertTrue(t.values().length <= 10);
        assertEquals("10\u207b\u00b3\u2076", t.labels()[0]);
        Ticks n = Ticks.logarithmic(10, 2000);
        assertArrayEquals(new String[] {"10", "100", "1000", "10000"}, n.labels());
        Ticks few = Ticks.logarithmic(2, 30);
        assertArrayEquals(new String[] {"2", "5", "10", "20", "50"}, few.labels());
        // the axis ends at the first tick past the data, not at the next decade
        assertArrayEquals(new String[] {"10", "20", "50", "100", "200"}, Ticks.logarithmic(10, 200).labels());
        assertEquals(0.5, Ticks.logarithmic(1, 100).fraction(10), 1e-12);
    }
}
