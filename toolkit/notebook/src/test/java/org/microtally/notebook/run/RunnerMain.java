package org.microtally.notebook.run;

import java.util.List;

/** The runner as a process of its own, for tests of what happens when a cell ends the JVM. */
final class RunnerMain {
    private RunnerMain() { }

    public static void main(String[] args) {
        System.exit(NotebookRunner.main(List.of(args)));
    }
}
