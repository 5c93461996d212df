package org.microtally.kernel;

import java.io.PrintStream;
import java.util.List;
import org.microtally.notebook.run.NotebookRunner;

/** The run command: the notebook module's headless runner, which needs no Python or Jupyter. */
final class NotebookRun {
    private NotebookRun() { }

    /** Runs {@code microtally run ARGS...}; the runner prints its own progress and errors on stderr. */
    static int run(List<String> args, PrintStream out, PrintStream err) {
        return NotebookRunner.main(args);
    }
}
