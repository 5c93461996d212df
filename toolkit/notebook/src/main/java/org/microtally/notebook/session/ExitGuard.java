package org.microtally.notebook.session;

/**
 * The targets that cell bytecode calls instead of the JVM exit methods. The engine rewrites
 * {@code invokestatic java/lang/System.exit(I)V} and {@code invokevirtual java/lang/Runtime.exit/halt(I)V}
 * in every class compiled from a cell into calls of these methods (see {@code ExitCallRewriter}).
 * Public only because rewritten cell classes must be able to link against it; not for direct use.
 */
public final class ExitGuard {
    private ExitGuard() { }

    /** Replaces {@code System.exit(status)}: always throws. */
    public static void exit(int status) {
        throw new ExitBlockedException("System.exit", status);
    }

    /** Replaces {@code runtime.exit(status)}: always throws. */
    public static void runtimeExit(Runtime runtime, int status) {
        throw new ExitBlockedException("Runtime.exit", status);
    }

    /** Replaces {@code runtime.halt(status)}: always throws. */
    public static void runtimeHalt(Runtime runtime, int status) {
        throw new ExitBlockedException("Runtime.halt", status);
    }
}
