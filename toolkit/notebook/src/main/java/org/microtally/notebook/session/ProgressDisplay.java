package org.microtally.notebook.session;

import org.microtally.ProgressListener;
import org.microtally.notebook.render.MimeBundle;

/**
 * A progress listener shown as one display that is updated in place. Throttled: updates are at
 * least {@link #MIN_INTERVAL_MS} apart, at most {@link #MAX_UPDATES} in total, and the final report
 * of a stage (done == total) is always shown. Thread-safe.
 */
final class ProgressDisplay implements ProgressListener {
    static final long MIN_INTERVAL_MS = 100;
    static final int MAX_UPDATES = 200;
    private static final int BAR = 30;

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
        Display.emitTo(target(), bundle(0, 1, "starting"), id, false, true);
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
            b = bundle(d, t, stage);
            if (b.plain().equals(lastShown)) {
                return;
            }
            lastShown = b.plain();
            lastNanos = now;
            updates++;
        }
        Display.emitTo(target(), b, id, true, true);
    }

    private MimeBundle bundle(long done, long total, String stage) {
        int pct = (int) Math.floor(100.0 * done / total);
        int filled = (int) (BAR * done / total);
        String s = stage == null ? "" : stage;
        String plain = label + (s.isEmpty() ? "" : " (" + s + ")") + " [" + "#".repeat(filled)
                + " ".repeat(BAR - filled) + "] " + pct + "% " + done + "/" + total;
        String html = "<div class=\"microtally-progress\"><span>" + escape(label)
                + (s.isEmpty() ? "" : " (" + escape(s) + ")") + "</span> <progress max=\"" + total + "\" value=\""
                + done + "\"></progress> <span>" + pct + "% " + done + "/" + total + "</span></div>";
        return MimeBundle.builder(plain).put(MimeBundle.TEXT_HTML, html).build();
    }

    static String escape(String s) {
        return s.replace("&", "&amp;").replace("<", "&lt;").replace(">", "&gt;").replace("\"", "&quot;");
    }
}
