package org.microtally.kernel;

import java.util.Optional;

/**
 * Ends the kernel when the process that started it (the Jupyter server or client) dies, so no
 * orphaned JVM keeps a notebook session's memory. The parent is {@code JPY_PARENT_PID} when
 * Jupyter sets it, else the OS parent process; {@link ProcessHandle#onExit()} notifies us.
 */
final class ParentWatch {
    private ParentWatch() { }

    static void exitWhenParentDies(Kernel kernel) {
        parent().ifPresent(p -> p.onExit().thenRun(() -> {
            KernelLog.LOG.warning(() -> "parent process " + p.pid() + " ended: stopping the kernel");
            kernel.stop();
            System.exit(0);
        }));
    }

    static Optional<ProcessHandle> parent() {
        String env = System.getenv("JPY_PARENT_PID");
        if (env != null && !env.isBlank()) {
            try {
                Optional<ProcessHandle> p = ProcessHandle.of(Long.parseLong(env.strip()));
                if (p.isPresent()) {
                    return p;
                }
            } catch (NumberFormatException e) {
                KernelLog.LOG.warning(() -> "ignoring JPY_PARENT_PID=" + env + " (not a process id)");
            }
        }
        return ProcessHandle.current().parent();
    }
}
