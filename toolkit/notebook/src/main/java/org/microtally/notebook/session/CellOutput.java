package org.microtally.notebook.session;

import org.microtally.notebook.render.MimeBundle;

/**
 * Where a running cell's output goes, as it happens, in the order the cell wrote it (stdout,
 * stderr and displays share one ordered queue, see the engine). The kernel forwards these to the
 * Jupyter iopub channel; the headless runner collects them into the executed notebook.
 */
public interface CellOutput {
    /** Text written by the cell to {@code System.out} ({@code stderr == false}) or {@code System.err}. */
    void stream(boolean stderr, String text);

    /**
     * A display produced by {@code show(...)} or a progress display.
     *
     * @param bundle    what to show
     * @param displayId id of the display for later in-place updates, or null
     * @param update    true to replace the earlier display with the same id instead of adding one
     */
    void display(MimeBundle bundle, String displayId, boolean update);

    /**
     * A progress display ({@code progress(label)} in a cell): the same as {@link #display}, told
     * apart as a value so that a front end can also show it elsewhere (the runner's terminal line).
     */
    default void progress(MimeBundle bundle, String displayId, boolean update) {
        display(bundle, displayId, update);
    }

    /** An output that discards everything. */
    CellOutput DISCARD = new CellOutput() {
        @Override
        public void stream(boolean stderr, String text) { }

        @Override
        public void display(MimeBundle bundle, String displayId, boolean update) { }
    };
}
