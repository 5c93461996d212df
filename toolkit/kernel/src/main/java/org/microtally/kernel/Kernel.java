package org.microtally.kernel;

import io.github.spencerpark.jupyter.kernel.KernelConnectionProperties;
import io.github.spencerpark.jupyter.messages.Message;
import io.github.spencerpark.jupyter.messages.MessageType;
import io.github.spencerpark.jupyter.messages.publish.PublishError;
import java.lang.management.ManagementFactory;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.concurrent.CountDownLatch;
import java.util.concurrent.Executors;
import java.util.concurrent.ScheduledExecutorService;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicBoolean;
import java.util.logging.Level;
import org.microtally.notebook.session.Engine;
import org.zeromq.SocketType;
import org.zeromq.ZMQ;

/**
 * The Jupyter kernel: binds the five channels named in the connection file and answers the
 * messaging protocol (5.3) on top of an {@link Engine}. This class holds the lifecycle and the
 * socket loops; {@link KernelWire} the sockets and framing, {@link Requests} the answers,
 * {@link CellExecution} the execute requests, {@link EngineSlot} the engine.
 *
 * <p>Threads: one for the shell channel (requests are handled in order, an execute blocks it as in
 * every Jupyter kernel), one for the control channel (so an interrupt arrives while a cell runs),
 * one echoing heartbeats. Each waits in a ZeroMQ poll that returns as soon as a message arrives.
 * A request loop never ends on an exception: whatever a message does to its handler is logged and
 * the loop goes on with the next message.
 *
 * <p>Security: sockets bind only to the transport, ip and ports of the connection file; every
 * incoming message's HMAC-SHA256 signature is checked with the connection key, and a message that
 * fails, or is not a well-formed Jupyter message, is dropped and logged, never handled. An empty
 * key (allowed by the protocol: no signing) is warned about in the log and in the banner, or
 * refused when the kernel runs with {@code --refuse-unsigned}.
 */
final class Kernel {
    private final KernelConnectionProperties props;
    private final KernelWire wire;
    private final EngineSlot engine;
    private final CellExecution cells;
    private final Requests requests;
    private final boolean unsigned;
    private final AtomicBoolean running = new AtomicBoolean(true);
    private final CountDownLatch stopped = new CountDownLatch(1);
    private final List<Thread> threads = new ArrayList<>();
    private final ScheduledExecutorService timers = Executors.newSingleThreadScheduledExecutor(r -> {
        Thread t = new Thread(r, "microtally-kernel-timers");
        t.setDaemon(true);
        return t;
    });
    private Runnable onShutdown = () -> { };
    private ZMQ.Socket shell;

    /**
     * @throws IllegalArgumentException when the connection file has no key and {@code refuseUnsigned} is set
     */
    Kernel(KernelConnectionProperties props, Engine.Factory engines, boolean refuseUnsigned) {
        this.props = props;
        this.unsigned = props.getKey() == null || props.getKey().isEmpty();
        if (unsigned && refuseUnsigned) {
            throw new IllegalArgumentException("the connection file has an empty key (messages would not be signed) "
                    + "and --refuse-unsigned is set; let Jupyter write a connection file with a key");
        }
        this.wire = new KernelWire(props);
        this.engine = new EngineSlot(engines);
        this.cells = new CellExecution(wire, engine, timers, (socket, m) -> dispatch(socket, "shell", m, System.nanoTime()));
        this.requests = new Requests(wire, engine, cells, unsigned, () -> {
            stop();
            onShutdown.run();
        });
    }

    Kernel(KernelConnectionProperties props, Engine.Factory engines) {
        this(props, engines, false);
    }

    /** What to do after a shutdown request has been answered (Main exits the process). */
    Kernel onShutdown(Runnable action) {
        this.onShutdown = action;
        return this;
    }

    /**
     * Binds the sockets and starts answering at once; the engine opens on a background thread, and
     * requests that need it wait for it.
     */
    void start() {
        if (unsigned) {
            KernelLog.LOG.warning(Requests.UNSIGNED_WARNING);
        }
        ZMQ.Socket control;
        ZMQ.Socket heartbeat;
        try {
            shell = wire.bind(SocketType.ROUTER, props.getShellPort());
            control = wire.bind(SocketType.ROUTER, props.getControlPort());
            wire.bind(SocketType.ROUTER, props.getStdinPort());
            wire.bind(SocketType.PUB, props.getIopubPort());
            heartbeat = wire.bind(SocketType.REP, props.getHbPort());
        } catch (RuntimeException e) {
            KernelLog.LOG.severe(() -> "cannot bind the ports of the connection file: " + e.getMessage());
            running.set(false);
            timers.shutdownNow();
            wire.close();
            stopped.countDown();
            throw e;
        }
        Runtime.getRuntime().addShutdownHook(new Thread(this::reportUnexpectedExit, "microtally-exit-report"));
        thread("microtally-shell", () -> serve(shell, "shell"));
        thread("microtally-control", () -> serve(control, "control"));
        thread("microtally-heartbeat", () -> echoHeartbeats(heartbeat));
        // The engine opens once the first kernel_info reply is out (clients always ask first), or after
        // 2 s: starting JShell at once would compete for the CPU with answering that request.
        long listening = System.currentTimeMillis();
        Thread opener = new Thread(() -> {
            try {
                requests.firstKernelInfo.await(2, TimeUnit.SECONDS);
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
            }
            long jvmStart = ManagementFactory.getRuntimeMXBean().getStartTime();
            long first = requests.firstKernelInfoAt;
            KernelLog.LOG.info(() -> "kernel listening on " + props.getTransport() + "://" + props.getIp()
                    + " shell=" + props.getShellPort() + " control=" + props.getControlPort() + ", "
                    + (listening - jvmStart) + " ms after JVM start; first kernel_info answered "
                    + (first > 0 ? (first - jvmStart) + " ms after JVM start" : "not yet"));
            engine.open();
            wire.warm(running::get);
        }, "microtally-engine-open");
        opener.setDaemon(true);
        opener.start();
    }

    /** Blocks until the kernel has stopped. */
    void awaitStop() throws InterruptedException {
        stopped.await();
    }

    /**
     * Shutdown hook. The engine blocks System.exit written in a cell, but library code a cell calls
     * may still end the JVM; then the running cell's output says so before the process goes, so the
     * death is never silent. Does nothing when the kernel itself is stopping.
     */
    private void reportUnexpectedExit() {
        Message<?> cell = cells.runningCell();
        if (!running.get() || cell == null) {
            return;
        }
        KernelLog.LOG.severe("the JVM is exiting while a cell runs (System.exit or Runtime.halt called by code outside the cell)");
        wire.publish(cell, MessageType.PUBLISH_ERROR, new PublishError("KernelExit",
                "the kernel process is exiting: code called by this cell ended the JVM (System.exit); "
                        + "Jupyter will report the kernel as dead; restart it to go on",
                List.of("KernelExit: code called by this cell ended the JVM; the kernel process stops now")));
        try {
            Thread.sleep(200);
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
        }
    }

    /** Stops the threads, closes the sockets and the engine. */
    void stop() {
        if (!running.compareAndSet(true, false)) {
            return;
        }
        for (Thread t : threads) {
            if (t != Thread.currentThread()) {
                try {
                    t.join(2000);
                } catch (InterruptedException e) {
                    Thread.currentThread().interrupt();
                }
            }
        }
        engine.close();
        timers.shutdownNow();
        wire.close();
        stopped.countDown();
    }

    /** Messages dropped so far because their signature was wrong. */
    int droppedBadSignature() {
        return wire.droppedBadSignature();
    }

    /** Messages dropped so far because they were not well-formed Jupyter messages. */
    int droppedMalformed() {
        return wire.droppedMalformed();
    }

    private void thread(String name, Runnable body) {
        Thread t = new Thread(() -> {
            try {
                body.run();
            } catch (RuntimeException | Error e) {
                if (running.get()) {
                    KernelLog.LOG.log(Level.SEVERE, name + " thread failed", e);
                }
            }
        }, name);
        t.setDaemon(true);
        threads.add(t);
        t.start();
    }

    private void echoHeartbeats(ZMQ.Socket heartbeat) {
        ZMQ.Poller poller = wire.poller(heartbeat);
        while (running.get()) {
            if (poller.poll(250) > 0 && poller.pollin(0)) {
                List<byte[]> frames = KernelWire.receiveFrames(heartbeat);
                for (int i = 0; i < frames.size(); i++) {
                    heartbeat.send(frames.get(i), i < frames.size() - 1 ? ZMQ.SNDMORE : 0);
                }
            }
        }
        poller.close();
    }

    /** The request loop of one channel: it ends only when the kernel stops. */
    private void serve(ZMQ.Socket socket, String channel) {
        ZMQ.Poller poller = wire.poller(socket);
        while (running.get()) {
            try {
                if (poller.poll(250) <= 0 || !poller.pollin(0)) {
                    continue;
                }
                long received = System.nanoTime();
                Optional<Message<?>> m = wire.receive(socket, channel);
                if (m.isPresent()) {
                    dispatch(socket, channel, m.get(), received);
                }
            } catch (RuntimeException | Error e) {
                if (!running.get()) {
                    break;
                }
                KernelLog.LOG.log(Level.SEVERE, "failed handling a message on " + channel + "; the kernel goes on", e);
            }
        }
        poller.close();
    }

    private void dispatch(ZMQ.Socket socket, String channel, Message<?> m, long receivedAt) {
        try {
            requests.handle(socket, channel, m, receivedAt);
        } catch (RuntimeException | OutOfMemoryError | StackOverflowError e) {
            KernelLog.LOG.log(Level.SEVERE, "failed handling " + WireCodec.typeName(m) + " on " + channel, e);
        }
    }
}
