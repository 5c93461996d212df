package org.microtally;

/**
 * Receives progress reports from long computations (exact counting, canonical recursions, sweeps).
 *
 * <p>Implementations must be cheap: computations call {@link #progress} at most a few hundred times
 * per run, never once per inner-loop step. The notebook module turns these calls into a display that
 * updates in place (kernel) or a progress bar on stderr (headless runner).
 */
@FunctionalInterface
public interface ProgressListener {
    /** A listener that ignores every report. */
    ProgressListener NONE = (done, total, stage) -> { };

    /**
     * Reports that {@code done} of {@code total} work units of {@code stage} are complete.
     *
     * @param done  units finished so far, 0 &lt;= done &lt;= total
     * @param total total units of this stage (&gt;= 1)
     * @param stage short human-readable name of the stage, e.g. {@code "levels"}
     */
    void progress(long done, long total, String stage);
}
