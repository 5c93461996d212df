package org.microtally.notebook.session;

import java.io.OutputStream;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.util.concurrent.CopyOnWriteArrayList;
import java.util.concurrent.Executors;
import java.util.concurrent.ScheduledExecutorService;
import java.util.concurrent.TimeUnit;

/**
 * Routes {@code System.out} and {@code System.err} to the running cell. Installed once per JVM:
 * a write from a thread of a session's thread group goes to that session's cell; a write from any
 * other thread goes to the running cell when exactly one cell runs (threads of the common pool,
 * for example), and otherwise to the streams the process started with.
 */
final class OutputRouter {
    /** The process's own standard streams, as they were before the engine was first used. */
    static final PrintStream CONSOLE_OUT = System.out;
    static final PrintStream CONSOLE_ERR = System.err;

    private static final CopyOnWriteArrayList<CellContext> ACTIVE = new CopyOnWriteArrayList<>();
    private static boolean installed;
    private static PrintStream routedOut;
    private static PrintStream routedErr;
    private static ScheduledExecutorService flusher;

    private OutputRouter() { }

    static synchronized void install() {
        if (installed) {
            return;
        }
        routedOut = new PrintStream(new Routed(false), true, StandardCharsets.UTF_8);
        routedErr = new PrintStream(new Routed(true), true, StandardCharsets.UTF_8);
        System.setOut(routedOut);
        System.setErr(routedErr);
        flusher = Executors.newSingleThreadScheduledExecutor(r -> {
            Thread t = new Thread(r, "microtally-output-flusher");
            t.setDaemon(true);
            return t;
        });
        flusher.scheduleWithFixedDelay(() -> {
            for (CellContext c : ACTIVE) {
                c.flush(false);
            }
        }, CellContext.FLUSH_INTERVAL_MS, CellContext.FLUSH_INTERVAL_MS, TimeUnit.MILLISECONDS);
        installed = true;
    }

    /** Cells read an empty standard input: a notebook has no console to type into. */
    private static final java.io.InputStream NO_INPUT = java.io.InputStream.nullInputStream();
    private static java.io.InputStream savedIn;

    static void begin(CellContext c) {
        synchronized (OutputRouter.class) {
            if (ACTIVE.isEmpty() && System.in != NO_INPUT) {
                savedIn = System.in;
                System.setIn(NO_INPUT);
            }
            // an earlier cell may have replaced the streams with System.setOut/setErr: route again
            if (System.out != routedOut) {
                System.setOut(routedOut);
            }
            if (System.err != routedErr) {
                System.setErr(routedErr);
            }
        }
        ACTIVE.add(c);
    }

    static void end(CellContext c) {
        ACTIVE.remove(c);
        c.flush(true);
        synchronized (OutputRouter.class) {
            if (ACTIVE.isEmpty() && savedIn != null) {
                System.setIn(savedIn);
                savedIn = null;
            }
        }
    }

    /** The cell the current thread writes to, or null. */
    static CellContext current() {
        ThreadGroup mine = Thread.currentThread().getThreadGroup();
        for (CellContext c : ACTIVE) {
            for (ThreadGroup g = mine; g != null; g = g.getParent()) {
                if (g == c.group) {
                    return c;
                }
            }
        }
        return ACTIVE.size() == 1 ? ACTIVE.get(0) : null;
    }

    private static final class Routed extends OutputStream {
        private final boolean stderr;

        Routed(boolean stderr) {
            this.stderr = stderr;
        }

        @Override
        public void write(int b) {
            write(new byte[] {(byte) b}, 0, 1);
        }

        @Override
        public void write(byte[] b, int off, int len) {
            CellContext c = current();
            if (c != null) {
                c.write(stderr, b, off, len);
            } else {
                PrintStream p = stderr ? CONSOLE_ERR : CONSOLE_OUT;
                p.write(b, off, len);
            }
        }

        @Override
        public void flush() {
            CellContext c = current();
            if (c == null) {
                (stderr ? CONSOLE_ERR : CONSOLE_OUT).flush();
            }
        }
    }
}
