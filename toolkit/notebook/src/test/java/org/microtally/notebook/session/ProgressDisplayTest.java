package org.microtally.notebook.session;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
import org.microtally.notebook.render.MimeBundle;

class ProgressDisplayTest {
    @Test
    void showsCountPercentAndATrackInWords() {
        // 7 of 12 is 58.3 %, floor 58; 20 * 7 / 12 = 11.67, so 11 cells done (arithmetic; common practice, no source)
        MimeBundle b = ProgressDisplay.bundle("exact canonical sweep", 7, 12, "temperatures");
        assertEquals("exact canonical sweep, temperatures: 7 of 12 (58%)  " + "|".repeat(11) + ".".repeat(9), b.plain());
        String html = b.get(MimeBundle.TEXT_HTML);
        assertTrue(html.startsWith("<div class=\"mt-progress\""), html);
        assertTrue(html.contains("width:58%"), html);
        assertFalse(html.contains("<progress"), html);
    }

    @Test
    void groupsLargeCountsAndEscapesTheLabel() {
        MimeBundle b = ProgressDisplay.bundle("<levels>", 1_500, 20_000, "");
        assertEquals("<levels>: 1,500 of 20,000 (7%)  |" + ".".repeat(19), b.plain());
        assertTrue(b.get(MimeBundle.TEXT_HTML).contains("&lt;levels&gt;: 1,500 of 20,000 (7%)"));
    }

    @Test
    void aFinishedStageShowsOneLineWithoutTheBar() {
        MimeBundle b = ProgressDisplay.finished("counting trap levels", 20, "shell 20");
        assertEquals("counting trap levels, shell 20: done (20 of 20)", b.plain());
        assertFalse(b.get(MimeBundle.TEXT_HTML).contains("width:"), b.get(MimeBundle.TEXT_HTML));
    }
}
