package org.microtally.notebook.session;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.nio.charset.StandardCharsets;
import org.junit.jupiter.api.Test;

class CellContextTest {
    @Test
    void utf8PrefixNeverEndsInsideACharacter() {
        // Source: RFC 3629 §3, byte sequences: é = C3 A9, € = E2 82 AC, U+1F600 = F0 9F 98 80
        byte[] e = "aé".getBytes(StandardCharsets.UTF_8);
        assertEquals(3, CellContext.completeUtf8Prefix(e));
        assertEquals(1, CellContext.completeUtf8Prefix(new byte[] {'a', (byte) 0xC3}));
        assertEquals(1, CellContext.completeUtf8Prefix(new byte[] {'a', (byte) 0xE2, (byte) 0x82}));
        assertEquals(4, CellContext.completeUtf8Prefix(new byte[] {'a', (byte) 0xE2, (byte) 0x82, (byte) 0xAC}));
        assertEquals(0, CellContext.completeUtf8Prefix(new byte[] {(byte) 0xF0, (byte) 0x9F, (byte) 0x98}));
        assertEquals(4, CellContext.completeUtf8Prefix(new byte[] {(byte) 0xF0, (byte) 0x9F, (byte) 0x98, (byte) 0x80}));
    }

    @Test
    void splitCharacterIsDeliveredWhole() {
        Collector c = new Collector();
        CellContext ctx = new CellContext(new ThreadGroup("t"), c);
        byte[] euro = "€".getBytes(StandardCharsets.UTF_8);
        ctx.write(false, euro, 0, 1);
        ctx.flush(false);
        ctx.write(false, euro, 1, 2);
        ctx.flush(true);
        assertEquals("€", c.text(false));
        assertEquals(1, c.events.size());
    }

    @Test
    void repeatedFramesAreFoldedIntoOneLine() {
        java.util.List<String> frames = new java.util.ArrayList<>(java.util.List.of("    at top"));
        for (int i = 0; i < 500; i++) {
            frames.add("    at even");
            frames.add("    at odd");
        }
        frames.add("    at bottom");
        // common practice, no source: a cycle of two frames repeated 500 times folds to one copy and a count
        assertEquals(java.util.List.of("    at top", "    at even", "    at odd", "    ... the 2 frames above repeated 499 more times",
                "    at bottom"), CellErrors.fold(frames));
        assertEquals(java.util.List.of("    at a", "    at a", "    at b"), CellErrors.fold(java.util.List.of("    at a", "    at a", "    at b")));
    }

    @Test
    void firstJavadocSentence() {
        // Source: Documentation Comment Specification for the Standard Doclet (JDK 17): the first
        // sentence ends at the first period followed by white space, or at the first block tag
        assertEquals("Returns the absolute value of an int value.",
                CodeAssist.firstSentence("Returns the absolute value of an {@code int} value.\n If the argument is not negative..."));
        assertEquals("Two levels", CodeAssist.firstSentence("Two <b>levels</b>\n@param gap the gap"));
        assertEquals("", CodeAssist.firstSentence(null));
    }
}
