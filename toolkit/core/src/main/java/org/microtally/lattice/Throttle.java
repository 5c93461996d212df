package org.microtally.lattice;

import org.microtally.ProgressListener;

/** Forwards work steps to a {@link ProgressListener} at most about 200 times per stage. */
final class Throttle {
    private final ProgressListener listener;
    private final long total;
    private final String stage;
    private long done;

    Throttle(ProgressListener listener, long total, String stage) {
        this.listener = listener;
        this.total = Math.max(1, total);
        this.stage = stage;
    }

    void step() {
        done++;
        if (done == total || done * 200 / total != (done - 1) * 200 / total) {
            listener.progress(Math.min(done, total), total, stage);
        }
    }
}
