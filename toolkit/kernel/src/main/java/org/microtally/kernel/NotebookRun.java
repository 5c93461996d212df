package org.microtally.kernel;

import java.io.PrintStream;
import java.util.List;

/** The run command: delegates to the notebook module's headless runner. Pending: the runner is not merged yet. */
final class NotebookRun {
    private NotebookRun() { }

    static int run(List<String> args, PrintStream out, PrintStream err) {
        err.println("microtally: the headless runner is not part of this build yet");
        return 1;
    }
}
