package org.microtally.kernel;

import java.util.concurrent.CompletableFuture;
import java.util.concurrent.ExecutionException;
import java.util.logging.Level;
import org.microtally.notebook.session.Engine;

/**
 * The kernel's one evaluation engine, opened in the background (JShell takes a second or more to
 * start) so that kernel_info is answered meanwhile; requests that need the engine wait for it.
 */
final class EngineSlot {
    private final Engine.Factory factory;
    private volatile CompletableFuture<Engine> engine = new CompletableFuture<>();

    EngineSlot(Engine.Factory factory) {
        this.factory = factory;
    }

    /** Opens the engine into the slot (on the calling thread); a failure is kept and reported to every user. */
    void open() {
        CompletableFuture<Engine> f = engine;
        try {
            long t0 = System.nanoTime();
            f.complete(factory.open());
            KernelLog.LOG.info(() -> String.format(java.util.Locale.ROOT, "engine open in %.0f ms", (System.nanoTime() - t0) / 1e6));
        } catch (RuntimeException | Error e) {
            KernelLog.LOG.log(Level.SEVERE, "the evaluation engine failed to start", e);
            f.completeExceptionally(e);
        }
    }

    /** The engine, waiting for it to finish opening. */
    Engine get() {
        try {
            return engine.get();
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new IllegalStateException("interrupted while the evaluation engine was starting", e);
        } catch (ExecutionException e) {
            throw new IllegalStateException("the evaluation engine failed to start: " + e.getCause(), e.getCause());
        }
    }

    /** The engine if it is open, else null (for interrupts, which must not wait). */
    Engine ifOpen() {
        CompletableFuture<Engine> f = engine;
        return f.isDone() && !f.isCompletedExceptionally() ? f.join() : null;
    }

    /** Closes the open engine (if any) and opens a fresh one on the calling thread. */
    void replace() {
        close();
        engine = new CompletableFuture<>();
        System.gc();
        open();
    }

    void close() {
        Engine old = ifOpen();
        try {
            if (old != null) {
                old.close();
            }
        } catch (RuntimeException e) {
            KernelLog.LOG.log(Level.WARNING, "closing the engine failed", e);
        }
    }
}
