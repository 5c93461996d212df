package org.microtally.notebook.session;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.api.Test;

class JavaTextTest {
    private static String outside(String text) {
        StringBuilder kept = new StringBuilder();
        JavaText scan = JavaText.scan(text, 0, text.length());
        for (int i = scan.next(); i >= 0; i = scan.next()) {
            kept.append(text.charAt(i));
        }
        return kept.toString();
    }

    // Java literal rules (JLS 17, 3.10.4-3.10.5, from memory): escapes inside quotes do not end them.
    @Test
    void skipsStringAndCharLiteralsWithEscapes() {
        assertEquals("f(, , );", outside("f(\"a(\\\"b\", ')', '\\'');"));
        assertEquals("g()", outside("g(\"'\")"));
        assertEquals("h()", outside("h('\"')"));
    }

    @Test
    void unclosedLiteralHidesTheRest() {
        assertEquals("x(", outside("x(\"open ( [ {"));
    }

    @Test
    void endIsClampedAndStartRespected() {
        String text = "ab(cd)";
        JavaText scan = JavaText.scan(text, 3, 99);
        assertEquals(3, scan.next());
        assertEquals(4, scan.next());
        assertEquals(5, scan.next());
        assertEquals(-1, scan.next());
    }

    // Brute force by hand: the cursor sits after the second top-level comma.
    @Test
    void argumentIndexIgnoresCommasAndBracketsInLiterals() {
        String text = "f(',', \"a,(b\", ";
        int open = CallSite.openParen(text, text.length());
        assertEquals(1, open);
        assertEquals(2, CallSite.argumentIndex(text, open, text.length()));
    }
}
