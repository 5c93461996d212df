package org.microtally.kernel;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.api.Test;

class CodePointsTest {

    @Test
    void charactersOutsideTheBmpCountOnceAsCodePointsAndTwiceAsChars() {
        // U+1F600 is one code point stored as the surrogate pair D83D DE00.
        // Source: The Unicode Standard, section 3.9 (UTF-16 encoding form); Jupyter messaging
        // protocol 5.2 "cursor_pos is in unicode code points"
        String s = "a\uD83D\uDE00b.";
        assertEquals(5, s.length());
        assertEquals(3, CodePoints.toCharIndex(s, 2));
        assertEquals(4, CodePoints.toCharIndex(s, 3));
        assertEquals(2, CodePoints.toCodePoints(s, 3));
        assertEquals(4, CodePoints.toCodePoints(s, 5));
    }

    @Test
    void positionsAreClampedToTheString() {
        // common practice, no source: a cursor past the end means the end
        assertEquals(3, CodePoints.toCharIndex("abc", 99));
        assertEquals(0, CodePoints.toCharIndex("abc", -1));
        assertEquals(3, CodePoints.toCodePoints("abc", 10));
    }
}
