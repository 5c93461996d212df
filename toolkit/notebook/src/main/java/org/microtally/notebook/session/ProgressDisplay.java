package org.microtally.notebook.session;

import java.util.Locale;
import org.microtally.ProgressListener;
import org.microtally.notebook.render.Markup;
import org.microtally.notebook.render.MimeBundle;

/**
 * A progress listener shown as one display that is updated in place. Throttled: updates are at
 * least {@link #MIN_INTERVAL_MS} apart, at most {@link #MAX_UPDATES} in total, and the final report
 * of a stage (done == total) is always shown. Thread-safe.
 *
 * <p>Look: {@code label, stage: 7 of 12 (58%)} followed by a track of {@value #TRACK} cells,
 * {@code |} for done and {@code .} for to do (HTML: a slim bar of our own, class {@code mt-progress}).
 * When a stage reports done == total the display is cleared (an empty bundle), so a saved notebook
 * keeps no finished bar; a later stage shows it again.
 */
final class ProgressDisplay implements ProgressListener {
    static final long MIN_INTERVAL_MS = 100;
    static final int MAX_UPDATES = 200;
    static final int TRACK = 20;
    /** The bundle that replaces a finished display: nothing to see. */
    static final MimeBundle CLEARED = MimeBundle.builder("").put(MimeBundle.TEXT_HTML, "").build();

    private final String label;
    private final String id;
    private final CellContext home;
    private long lastNanos;
    private int updates;
    private String lastShown = "";

    ProgressDisplay(String label, String id, CellContext home) {
        this.label = label;
        this.id = id;
        this.home = home;
    }

    void start() {
        Display.emitTo(target(), bundle(label, 0, 1, "starting"), id, false, true);
        lastNanos = System.nanoTime();
    }

    private CellContext target() {
        CellContext now = OutputRouter.current();
        return now != null ? now : home;
    }

    @Override
    public void progress(long done, long total, String stage) {
        long t = Math.max(total, 1);
        long d = Math.max(0, Math.min(done, t));
        boolean last = d == t;
        MimeBundle b;
        synchronized (this) {
            long now = System.nanoTime();
            if (!last && (updates >= MAX_UPDATES || now - lastNanos < MIN_INTERVAL_MS * 1_000_000L)) {
                return;
            }
            b = last ? CLEARED : bundle(label, d, t, stage);
            if (b.plain().equals(lastShown)) {
                return;
            }
            lastShown = b.plain();
            lastNanos = now;
            updates++;
        }
        Display.emitTo(target(), b, id, true, true);
    }

    /** The display of {@code done} of {@code total} (total >= 1, 0 <= done <= total). */
    static MimeBundle bundle(String label, long done, long total, String stage) {
        int pct = (int) Math.floor(100.0 * done / total);
        int filled = (int) (TRACK * done / total);
        String s = stage == null || stage.isBlank() ? "" : ", " + stage;
        String count = String.format(Locale.ROOT, "%,d of %,d (%d%%)", done, total, pct);
        String plain = label + s + ": " + count + "  " + "|".repeat(filled) + ".".repeat(TRACK - filled);
        String html = "<div class=\"mt-progress\" style=\"font:13px sans-serif;margin:2px 0\">"
                + "<span>" + Markup.escape(label + s) + ": " + count + "</span>"
                + "<span style=\"display:inline-block;vertical-align:middle;margin-left:8px;width:160px;height:5px;"
                + "background:#e4e8ee;border-radius:3px\"><span style=\"display:block;height:5px;border-radius:3px;"
                + "background:#2f6f8f;width:" + pct + "%\"></span></span></div>";
        return MimeBundle.builder(plain).put(MimeBundle.TEXT_HTML, html).build();
    }
}
