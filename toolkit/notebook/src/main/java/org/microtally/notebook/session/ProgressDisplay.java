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
 * When a stage reports done == total the bar is replaced by one line without it,
 * {@code label, stage: done (12 of 12)} ({@link #finished}), so a notebook Jupyter saves keeps no
 * finished bar; a later stage shows the bar again. (The headless runner saves no progress display.)
 */
final class ProgressDisplay implements ProgressListener {
    static final long MIN_INTERVAL_MS = 100;
    static final int MAX_UPDATES = 200;
    static final int TRACK = 20;

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
            b = last ? finished(label, t, stage) : bundle(label, d, t, stage);
            if (b.plain().equals(lastShown)) {
                return;
            }
            lastShown = b.plain();
            lastNanos = now;
            updates++;
        }
        Display.emitTo(target(), b, id, true, true);
    }

    /** The line that replaces the bar when a stage is done: no bar, no timing. */
    static MimeBundle finished(String label, long total, String stage) {
        String s = stage == null || stage.isBlank() ? "" : ", " + stage;
        String plain = label + s + String.format(Locale.ROOT, ": done (%,d of %,d)", total, total);
        return MimeBundle.builder(plain).put(MimeBundle.TEXT_HTML,
                "<div class=\"mt-progress mt-done\" style=\"font:13px sans-serif;margin:2px 0;color:#55666b\">"
                        + Markup.escape(plain) + "</div>").build();
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
