package org.microtally.notebook.session;

/**
 * Thrown in place of {@code System.exit}, {@code Runtime.exit} or {@code Runtime.halt} called by
 * cell code: ending the JVM would end the whole notebook session without a word, so the engine
 * turns the call into this exception and the session stays alive.
 */
public final class ExitBlockedException extends RuntimeException {
    private static final long serialVersionUID = 1L;

    ExitBlockedException(String call, int status) {
        super(call + "(" + status + ") was blocked: it would end the whole notebook session. "
                + "The session stays alive; to stop a computation, throw an exception or let the cell return.");
    }
}
