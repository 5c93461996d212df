package org.microtally.notebook.session;

/** Test support: interrupts a session's running cell from another thread after a delay. */
final class DelayedInterrupt {
    private DelayedInterrupt() { }

    /**
     * Starts a thread that calls {@code session.interrupt()} after {@code millis} ms (and does nothing
     * if itself interrupted first); join it after the cell returns.
     */
    static Thread after(Session session, long millis) {
        Thread stopper = new Thread(() -> {
            try {
                Thread.sleep(millis);
            } catch (InterruptedException e) {
                return;
            }
            session.interrupt();
        });
        stopper.start();
        return stopper;
    }
}
