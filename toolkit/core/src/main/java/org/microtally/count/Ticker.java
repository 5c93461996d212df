package org.microtally.count;

import org.microtally.ProgressListener;

/**
 * Forwards work steps to a {@link ProgressListener} at most about 200 times per stage, in order,
 * one call at a time (steps may come from several threads). Public so that the other exact counters
 * (e.g. {@code lattice}) report progress the same way.
 */
public final class Ticker {
    private final ProgressListener listener;
    private final long total;
    private final String stage;
    private long done;

    /** Reports {@code total} steps (at least 1) of {@code stage} to {@code listener}. */
    public Ticker(ProgressListener listener, long total, String stage) {
        this.listener = listener;
        this.total = Math.max(1, total);
        this.stage = stage;
    }

    /** One step done; forwards (done, total, stage) when the done fraction crosses a 1/200 mark or reaches the end. */
    public synchronized void step() {
        done++;
        if (done == total || done * 200 / total != (done - 1) * 200 / total) {
            listener.progress(Math.min(done, total), total, stage);
        }
    }
}
