package org.microtally.notebook.session;

import java.lang.reflect.Field;
import java.lang.reflect.InvocationTargetException;
import java.lang.reflect.Method;
import java.util.concurrent.Callable;
import java.util.concurrent.atomic.AtomicInteger;
import jdk.jshell.execution.DirectExecutionControl;
import jdk.jshell.spi.ExecutionControl;
import jdk.jshell.spi.ExecutionControlProvider;
import jdk.jshell.spi.ExecutionEnv;

/**
 * JShell's execution control for the engine: runs each snippet on a fresh thread of the
 * session's thread group (so it can be stopped), and keeps the real value and the real
 * exception of the last invocation instead of only their strings.
 */
final class EngineControl extends DirectExecutionControl {
    /** Marker for "no value captured". */
    static final Object NO_VALUE = new Object();
    private static final long STACK_SIZE = 64L << 20;
    /** How long threads get to end after an interrupt before they are stopped. */
    static final long GRACE_MS = 300;
    private static final AtomicInteger THREADS = new AtomicInteger();

    private final ThreadGroup group;
    private final Object stopLock = new Object();
    private final ClassLoader cellLoader;
    private volatile Thread running;
    private volatile boolean stopRequested;
    private volatile Object lastValue = NO_VALUE;
    private volatile Throwable lastThrown;
    private volatile Method lastBody;
    private volatile int invocations;
    private final CellPhases.Clock clock;

    EngineControl(SnippetLoader loader, ThreadGroup group, CellPhases.Clock clock) {
        super(loader);
        this.group = group;
        this.cellLoader = loader.classLoader();
        this.clock = clock;
    }

    /** A provider that hands JShell the given, already built control. */
    static ExecutionControlProvider provider(EngineControl control) {
        return new ExecutionControlProvider() {
            @Override
            public String name() {
                return "microtally-local";
            }

            @Override
            public ExecutionControl generate(ExecutionEnv env, java.util.Map<String, String> parameters) {
                return control;
            }
        };
    }

    void resetCapture() {
        lastValue = NO_VALUE;
        lastThrown = null;
    }

    Object lastValue() {
        return lastValue;
    }

    Throwable lastThrown() {
        return lastThrown;
    }

    /** The snippet body method invoked last (for {@link RepeatedSnippet}). */
    Method lastBody() {
        return lastBody;
    }

    /** How many snippet bodies were invoked since the engine was made (JShell invokes one per snippet it runs). */
    int invocations() {
        return invocations;
    }

    /**
     * Runs a snippet body JShell compiled and ran before ({@link RepeatedSnippet}), exactly as JShell
     * runs it: on a fresh thread of the session's group, value or throwable captured, stoppable.
     * Returns normally when the body returned; a throwable of the body is in {@link #lastThrown()}.
     *
     * @return true when the body returned, false when it threw or was stopped
     */
    boolean rerun(Method body) throws InterruptedException {
        try {
            invoke(body);
            return true;
        } catch (InterruptedException e) {
            throw e;
        } catch (Exception e) {
            return false;
        }
    }

    boolean stopRequested() {
        return stopRequested;
    }

    void clearStop() {
        synchronized (stopLock) {
            stopRequested = false;
        }
    }

    @Override
    protected String invoke(Method doitMethod) throws Exception {
        Object value;
        lastBody = doitMethod;
        invocations++;
        long t0 = System.nanoTime();
        try {
            value = callAsUser(() -> {
                try {
                    return doitMethod.invoke(null);
                } catch (InvocationTargetException e) {
                    throw new UserFailure(e.getCause());
                }
            });
        } catch (UserFailure f) {
            lastThrown = f.getCause();
            if (stopRequested) {
                throw new ExecutionControl.StoppedException();
            }
            throw new InvocationTargetException(f.getCause());
        } finally {
            clock.run(System.nanoTime() - t0);
        }
        lastValue = value;
        return "";   // the engine renders the real object itself
    }

    @Override
    public String varValue(String className, String varName) throws ExecutionControl.RunException,
            ExecutionControl.EngineTerminationException, ExecutionControl.InternalException {
        try {
            Class<?> c = findClass(className);
            Field f = c.getDeclaredField(varName);
            f.setAccessible(true);
            lastValue = f.get(null);
            return "";
        } catch (ReflectiveOperationException | RuntimeException e) {
            throw new ExecutionControl.InternalException("cannot read " + varName + ": " + e);
        }
    }

    /**
     * Runs {@code task} on a new thread of the session's group and waits for it; a throwable of the
     * task is rethrown wrapped in {@link UserFailure}. Stoppable with {@link #stop()}.
     */
    <T> T callAsUser(Callable<T> task) throws UserFailure, InterruptedException {
        Object[] result = new Object[1];
        Throwable[] failure = new Throwable[1];
        Thread t = new Thread(group, () -> {
            try {
                result[0] = task.call();
            } catch (UserFailure f) {
                failure[0] = f.getCause();
            } catch (Throwable e) {
                failure[0] = e;
            }
        }, "microtally-cell-" + THREADS.incrementAndGet(), STACK_SIZE);
        t.setDaemon(true);
        t.setContextClassLoader(cellLoader);   // cell classes, and through the parent all engine classes
        try {
            synchronized (stopLock) {
                if (stopRequested) {
                    // stopped while JShell was still compiling: do not start the snippet at all
                    throw new UserFailure(new InterruptedException("stopped before the snippet started"));
                }
                running = t;
                t.start();
            }
            t.join();
        } finally {
            running = null;
        }
        if (failure[0] != null) {
            throw new UserFailure(failure[0]);
        }
        @SuppressWarnings("unchecked")
        T r = (T) result[0];
        return r;
    }

    /**
     * Stops the running snippet: first a thread interrupt (lets blocking calls end cleanly), then,
     * if it is still running after a grace period, {@link Thread#stop()} on it and on the other
     * threads it started in the session's group.
     */
    @Override
    @SuppressWarnings({"deprecation", "removal"})
    public void stop() {
        Thread t;
        synchronized (stopLock) {
            stopRequested = true;
            t = running;
        }
        if (t == null) {
            return;
        }
        t.interrupt();
        try {
            t.join(GRACE_MS);
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
        }
        if (t.isAlive()) {
            stopGroup();
        }
    }

    /**
     * Ends every thread of the session's group (threads cells started and left running): interrupts
     * them, waits up to {@link #GRACE_MS} ms, then stops the rest. Returns how many were running.
     */
    int stopAll() {
        Thread[] all = threads();
        for (Thread t : all) {
            t.interrupt();
        }
        long end = System.nanoTime() + GRACE_MS * 1_000_000L;
        for (Thread t : all) {
            long left = (end - System.nanoTime()) / 1_000_000L;
            if (left > 0) {
                try {
                    t.join(left);
                } catch (InterruptedException e) {
                    Thread.currentThread().interrupt();
                    break;
                }
            }
        }
        stopGroup();
        return all.length;
    }

    @SuppressWarnings({"deprecation", "removal"})
    private void stopGroup() {
        for (Thread t : threads()) {
            t.stop();
        }
    }

    private Thread[] threads() {
        Thread[] all = new Thread[group.activeCount() + 8];
        int n = group.enumerate(all);
        return java.util.Arrays.stream(all, 0, n).filter(t -> t != Thread.currentThread()).toArray(Thread[]::new);
    }

    /** Carries a throwable of user code through the engine without confusing it with engine errors. */
    static final class UserFailure extends Exception {
        private static final long serialVersionUID = 1L;

        UserFailure(Throwable cause) {
            super(cause);
        }
    }

    /** Used by the engine to read a static field. */
    @Override
    protected Class<?> findClass(String name) throws ClassNotFoundException {
        return super.findClass(name);
    }
}
