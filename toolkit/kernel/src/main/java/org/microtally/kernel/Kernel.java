package org.microtally.kernel;

import io.github.spencerpark.jupyter.kernel.KernelConnectionProperties;
import io.github.spencerpark.jupyter.kernel.LanguageInfo;
import io.github.spencerpark.jupyter.kernel.display.DisplayData;
import io.github.spencerpark.jupyter.messages.Header;
import io.github.spencerpark.jupyter.messages.Message;
import io.github.spencerpark.jupyter.messages.MessageType;
import io.github.spencerpark.jupyter.messages.publish.PublishDisplayData;
import io.github.spencerpark.jupyter.messages.publish.PublishError;
import io.github.spencerpark.jupyter.messages.publish.PublishExecuteInput;
import io.github.spencerpark.jupyter.messages.publish.PublishExecuteResult;
import io.github.spencerpark.jupyter.messages.publish.PublishStatus;
import io.github.spencerpark.jupyter.messages.publish.PublishStream;
import io.github.spencerpark.jupyter.messages.publish.PublishUpdateDisplayData;
import io.github.spencerpark.jupyter.messages.reply.CommInfoReply;
import io.github.spencerpark.jupyter.messages.reply.CompleteReply;
import io.github.spencerpark.jupyter.messages.reply.ErrorReply;
import io.github.spencerpark.jupyter.messages.reply.HistoryReply;
import io.github.spencerpark.jupyter.messages.reply.InspectReply;
import io.github.spencerpark.jupyter.messages.reply.InterruptReply;
import io.github.spencerpark.jupyter.messages.reply.IsCompleteReply;
import io.github.spencerpark.jupyter.messages.reply.KernelInfoReply;
import io.github.spencerpark.jupyter.messages.reply.ShutdownReply;
import io.github.spencerpark.jupyter.messages.request.CompleteRequest;
import io.github.spencerpark.jupyter.messages.request.ExecuteRequest;
import io.github.spencerpark.jupyter.messages.request.InspectRequest;
import io.github.spencerpark.jupyter.messages.request.IsCompleteRequest;
import io.github.spencerpark.jupyter.messages.request.ShutdownRequest;
import java.lang.management.ManagementFactory;
import java.lang.management.MemoryUsage;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.concurrent.CountDownLatch;
import java.util.concurrent.atomic.AtomicBoolean;
import java.util.logging.Level;
import org.microtally.notebook.render.MimeBundle;
import org.microtally.notebook.session.CellError;
import org.microtally.notebook.session.CellOutput;
import org.microtally.notebook.session.CellResult;
import org.zeromq.SocketType;
import org.zeromq.ZContext;
import org.zeromq.ZMQ;

/**
 * The Jupyter kernel: binds the five channels named in the connection file and answers the
 * messaging protocol (5.3) on top of a {@link CellEngine}.
 *
 * <p>Threads: one for the shell channel (requests are handled in order, an execute blocks it as in
 * every Jupyter kernel), one for the control channel (so an interrupt arrives while a cell runs),
 * one echoing heartbeats. Each waits in a ZeroMQ poll that returns as soon as a message arrives,
 * so no request waits for a polling interval. IOPub is shared and written under a lock.
 *
 * <p>Security: sockets bind only to the transport, ip and ports of the connection file; every
 * incoming message's HMAC-SHA256 signature is checked with the connection key, and a message that
 * fails is dropped and logged, never handled.
 */
final class Kernel {
    static final String PROTOCOL_VERSION = "5.3";
    /** Heap still in use after a full GC, as a fraction of the maximum, above which the engine is reset. */
    static final double RESET_AFTER_OOM_FRACTION = 0.6;

    private final KernelConnectionProperties props;
    private final CellEngine.Factory engines;
    private final WireCodec codec;
    private final ZContext zmq = new ZContext(1);
    private final AtomicBoolean running = new AtomicBoolean(true);
    private final CountDownLatch stopped = new CountDownLatch(1);
    private final CountDownLatch firstKernelInfo = new CountDownLatch(1);
    private volatile long firstKernelInfoAt;
    private final Object iopubLock = new Object();
    private final String kernelSession = java.util.UUID.randomUUID().toString();
    private final List<Thread> threads = new ArrayList<>();
    private final java.util.concurrent.ScheduledExecutorService flusher =
            java.util.concurrent.Executors.newSingleThreadScheduledExecutor(r -> {
                Thread t = new Thread(r, "microtally-output-flush");
                t.setDaemon(true);
                return t;
            });
    /** The engine; opened in the background so kernel_info is answered while JShell starts. */
    private volatile java.util.concurrent.CompletableFuture<CellEngine> engine;
    private volatile boolean executing;
    private volatile Message<?> runningCell;
    /** System.nanoTime() when the shell request being handled was received (shell thread only). */
    private long shellReceivedAt;
    private final java.util.concurrent.atomic.AtomicInteger droppedBadSignature = new java.util.concurrent.atomic.AtomicInteger();
    private int executionCount;
    private ZMQ.Socket shell;
    private ZMQ.Socket control;
    private ZMQ.Socket iopub;
    private ZMQ.Socket stdin;
    private ZMQ.Socket heartbeat;
    private Runnable onShutdown = () -> { };

    Kernel(KernelConnectionProperties props, CellEngine.Factory engines) {
        this.props = props;
        this.engines = engines;
        this.codec = new WireCodec(props.getSignatureScheme(), props.getKey());
    }

    /** What to do after a shutdown request has been answered (Main exits the process). */
    Kernel onShutdown(Runnable action) {
        this.onShutdown = action;
        return this;
    }

    /**
     * Binds the sockets and starts answering at once; the engine opens on a background thread
     * (JShell takes a few seconds to start), and requests that need it wait for it.
     */
    void start() {
        engine = new java.util.concurrent.CompletableFuture<>();
        Runtime.getRuntime().addShutdownHook(new Thread(this::reportUnexpectedExit, "microtally-exit-report"));
        shell = bind(SocketType.ROUTER, props.getShellPort());
        control = bind(SocketType.ROUTER, props.getControlPort());
        stdin = bind(SocketType.ROUTER, props.getStdinPort());
        iopub = bind(SocketType.PUB, props.getIopubPort());
        heartbeat = bind(SocketType.REP, props.getHbPort());
        thread("microtally-shell", () -> serve(shell, "shell"));
        thread("microtally-control", () -> serve(control, "control"));
        thread("microtally-heartbeat", this::echoHeartbeats);
        // The engine opens once the first kernel_info reply is out (clients always ask first), or after
        // 2 s: starting JShell at once would compete for the CPU with answering that request. The
        // startup log line is written then too, so formatting it is not on the critical path.
        long listening = System.currentTimeMillis();
        Thread opener = new Thread(() -> {
            try {
                firstKernelInfo.await(2, java.util.concurrent.TimeUnit.SECONDS);
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
            }
            long jvmStart = ManagementFactory.getRuntimeMXBean().getStartTime();
            KernelLog.LOG.info(() -> "kernel listening on " + props.getTransport() + "://" + props.getIp()
                    + " shell=" + props.getShellPort() + " control=" + props.getControlPort() + ", "
                    + (listening - jvmStart) + " ms after JVM start; first kernel_info answered "
                    + (firstKernelInfoAt > 0 ? (firstKernelInfoAt - jvmStart) + " ms after JVM start" : "not yet"));
            openInto(engine);
            warmMessagePath();
        }, "microtally-engine-open");
        opener.setDaemon(true);
        opener.start();
    }

    /**
     * Runs the message encoding and decoding code a few thousand times on dummy messages (never
     * sent), so the JIT compiles it before the first cells instead of during them: measured, the
     * first few hundred requests otherwise take about 3x longer than later ones.
     */
    void warmMessagePath() {
        long t0 = System.nanoTime();
        Header<PublishStatus> h = new Header<>(kernelSession, MessageType.PUBLISH_STATUS);
        Message<PublishStatus> status = new Message<>(List.of(new byte[8]), h, h, new LinkedHashMap<>(),
                PublishStatus.forState(PublishStatus.State.IDLE), null);
        Message<ExecuteOk> reply = new Message<>(List.of(new byte[8]), new Header<>(kernelSession, executeReplyType()), h,
                new LinkedHashMap<>(Map.of("microtally_eval_seconds", 0.001)), new ExecuteOk(1), null);
        Message<io.github.spencerpark.jupyter.messages.request.ExecuteRequest> request = new Message<>(List.of(new byte[8]),
                new Header<>(kernelSession, MessageType.EXECUTE_REQUEST), null, new LinkedHashMap<>(),
                new io.github.spencerpark.jupyter.messages.request.ExecuteRequest("1 + 1", false, true, Map.of(), false, true), null);
        int n = 0;
        try {
            for (int i = 0; i < 1500 && running.get(); i++) {
                n += codec.encode(status).size() + codec.encode(reply).size();
                n += codec.decode(codec.encode(request)).getIdentities().size();
                new Header<>(request, MessageType.PUBLISH_STREAM);
            }
        } catch (WireCodec.BadSignatureException | WireCodec.MalformedMessageException e) {
            KernelLog.LOG.log(Level.WARNING, "message warm-up failed", e);
        }
        int frames = n;
        KernelLog.LOG.info(() -> String.format(java.util.Locale.ROOT, "message path warmed in %.0f ms (%d frames)",
                (System.nanoTime() - t0) / 1e6, frames));
    }

    private void openInto(java.util.concurrent.CompletableFuture<CellEngine> f) {
        try {
            long t0 = System.nanoTime();
            f.complete(engines.open());
            KernelLog.LOG.info(() -> String.format(java.util.Locale.ROOT, "engine open in %.0f ms", (System.nanoTime() - t0) / 1e6));
        } catch (RuntimeException | Error e) {
            KernelLog.LOG.log(Level.SEVERE, "the evaluation engine failed to start", e);
            f.completeExceptionally(e);
        }
    }

    /** The engine, waiting for it to finish opening. */
    private CellEngine engine() {
        try {
            return engine.get();
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new IllegalStateException("interrupted while the evaluation engine was starting", e);
        } catch (java.util.concurrent.ExecutionException e) {
            throw new IllegalStateException("the evaluation engine failed to start: " + e.getCause(), e.getCause());
        }
    }

    /** The engine if it is open, else null (for interrupts, which must not wait). */
    private CellEngine engineIfOpen() {
        java.util.concurrent.CompletableFuture<CellEngine> f = engine;
        return f != null && f.isDone() && !f.isCompletedExceptionally() ? f.join() : null;
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
        Message<?> cell = runningCell;
        if (!running.get() || cell == null) {
            return;
        }
        KernelLog.LOG.severe("the JVM is exiting while a cell runs (System.exit or Runtime.halt called by code outside the cell)");
        publish(cell, MessageType.PUBLISH_ERROR, new PublishError("KernelExit",
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
        try {
            CellEngine e = engineIfOpen();
            if (e != null) {
                e.close();
            }
        } catch (RuntimeException ex) {
            KernelLog.LOG.log(Level.WARNING, "engine close failed", ex);
        }
        flusher.shutdownNow();
        zmq.close();
        stopped.countDown();
    }

    /** Messages dropped so far because their signature was wrong. */
    int droppedBadSignature() {
        return droppedBadSignature.get();
    }

    private ZMQ.Socket bind(SocketType type, int port) {
        ZMQ.Socket s = zmq.createSocket(type);
        s.setLinger(0);
        s.bind(address(props.getTransport(), props.getIp(), port));
        return s;
    }

    /** The ZeroMQ endpoint for one channel: tcp://ip:port, or ipc://ip-port as Jupyter writes it. */
    static String address(String transport, String ip, int port) {
        if ("ipc".equals(transport)) {
            return "ipc://" + ip + "-" + port;
        }
        return transport + "://" + ip + ":" + port;
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

    // ------------------------------------------------------------------ socket loops

    private void echoHeartbeats() {
        ZMQ.Poller poller = zmq.createPoller(1);
        poller.register(heartbeat, ZMQ.Poller.POLLIN);
        while (running.get()) {
            if (poller.poll(250) > 0 && poller.pollin(0)) {
                List<byte[]> frames = receiveFrames(heartbeat);
                for (int i = 0; i < frames.size(); i++) {
                    heartbeat.send(frames.get(i), i < frames.size() - 1 ? ZMQ.SNDMORE : 0);
                }
            }
        }
        poller.close();
    }

    private void serve(ZMQ.Socket socket, String channel) {
        ZMQ.Poller poller = zmq.createPoller(1);
        poller.register(socket, ZMQ.Poller.POLLIN);
        while (running.get()) {
            if (poller.poll(250) <= 0 || !poller.pollin(0)) {
                continue;
            }
            long received = System.nanoTime();
            Optional<Message<?>> m = receive(socket, channel);
            if (m.isEmpty()) {
                continue;
            }
            if (socket == shell) {
                shellReceivedAt = received;
            }
            try {
                handle(socket, channel, m.get());
            } catch (RuntimeException | OutOfMemoryError e) {
                KernelLog.LOG.log(Level.SEVERE, "failed handling " + WireCodec.typeName(m.get()) + " on " + channel, e);
            }
        }
        poller.close();
    }

    private static List<byte[]> receiveFrames(ZMQ.Socket socket) {
        List<byte[]> frames = new ArrayList<>();
        do {
            frames.add(socket.recv(0));
        } while (socket.hasReceiveMore());
        return frames;
    }

    private Optional<Message<?>> receive(ZMQ.Socket socket, String channel) {
        List<byte[]> frames = receiveFrames(socket);
        try {
            return Optional.of(codec.decode(frames));
        } catch (WireCodec.BadSignatureException e) {
            droppedBadSignature.incrementAndGet();
            KernelLog.LOG.warning(() -> "dropped a message on " + channel + " with a bad signature ("
                    + frames.size() + " frames): not handled");
        } catch (WireCodec.MalformedMessageException e) {
            KernelLog.LOG.warning(() -> "dropped a malformed message on " + channel + ": " + e.getMessage());
        }
        return Optional.empty();
    }

    private void send(ZMQ.Socket socket, Message<?> message) {
        List<byte[]> frames = codec.encode(message);
        for (int i = 0; i < frames.size(); i++) {
            socket.send(frames.get(i), i < frames.size() - 1 ? ZMQ.SNDMORE : 0);
        }
    }

    private <T> void reply(ZMQ.Socket socket, Message<?> request, MessageType<T> type, T content) {
        reply(socket, request, type, content, new LinkedHashMap<>());
    }

    private <T> void reply(ZMQ.Socket socket, Message<?> request, MessageType<T> type, T content, Map<String, Object> metadata) {
        send(socket, new Message<>(request.getIdentities(), new Header<>(request, type), request.getHeader(),
                metadata, content, null));
    }

    private <T> void publish(Message<?> parent, MessageType<T> type, T content) {
        Header<T> header = parent == null ? new Header<>(kernelSession, type) : new Header<>(parent, type);
        Message<T> m = new Message<>(List.of(("kernel." + kernelSession + "." + type.getName())
                .getBytes(StandardCharsets.UTF_8)), header, parent == null ? null : parent.getHeader(),
                new LinkedHashMap<>(), content, null);
        synchronized (iopubLock) {
            if (running.get()) {
                send(iopub, m);
            }
        }
    }

    private void status(Message<?> parent, PublishStatus.State state) {
        publish(parent, MessageType.PUBLISH_STATUS, PublishStatus.forState(state));
    }

    // ------------------------------------------------------------------ dispatch

    private void handle(ZMQ.Socket socket, String channel, Message<?> m) {
        String type = WireCodec.typeName(m);
        if (type.equals(MessageType.INTERRUPT_REQUEST.getName())) {
            status(m, PublishStatus.State.BUSY);
            interruptRunningCell();
            reply(socket, m, MessageType.INTERRUPT_REPLY, new InterruptReply());
            status(m, PublishStatus.State.IDLE);
            return;
        }
        if (type.equals(MessageType.SHUTDOWN_REQUEST.getName())) {
            shutdown(socket, m);
            return;
        }
        status(m, PublishStatus.State.BUSY);
        try {
            switch (type) {
                case "kernel_info_request" -> {
                    reply(socket, m, MessageType.KERNEL_INFO_REPLY, kernelInfo());
                    if (firstKernelInfo.getCount() > 0) {
                        firstKernelInfoAt = System.currentTimeMillis();
                        firstKernelInfo.countDown();
                    }
                }
                case "execute_request" -> execute(socket, m);
                case "complete_request" -> complete(socket, m);
                case "inspect_request" -> inspect(socket, m);
                case "is_complete_request" -> isComplete(socket, m);
                case "comm_info_request" -> reply(socket, m, MessageType.COMM_INFO_REPLY, new CommInfoReply(Map.of()));
                case "history_request" -> reply(socket, m, MessageType.HISTORY_REPLY, new HistoryReply(List.of()));
                default -> KernelLog.LOG.info(() -> "ignored " + type + " on " + channel);
            }
        } finally {
            status(m, PublishStatus.State.IDLE);
        }
    }

    /**
     * Stops the running cell. An interrupt that lands while the engine is still compiling the cell
     * may find nothing to stop yet, so it is repeated every 200 ms (at most 10 times) while that
     * same cell is still running.
     */
    private void interruptRunningCell() {
        Message<?> cell = runningCell;
        CellEngine e = engineIfOpen();
        if (cell == null || e == null) {
            return;
        }
        e.interrupt();
        for (int i = 1; i <= 10; i++) {
            flusher.schedule(() -> {
                if (runningCell == cell) {
                    e.interrupt();
                }
            }, 200L * i, java.util.concurrent.TimeUnit.MILLISECONDS);
        }
    }

    static KernelInfoReply kernelInfo() {
        LanguageInfo language = new LanguageInfo.Builder("java")
                .version("17")
                .mimetype("text/x-java")
                .fileExtension(".jshell")
                .pygments("java")
                .codemirror("text/x-java")
                .build();
        return new KernelInfoReply(PROTOCOL_VERSION, "microtally", Main.version(), language,
                "microtally " + Main.version() + ": Java 17 cells (JShell) with the microtally toolkit imported",
                List.of());
    }

    private void shutdown(ZMQ.Socket socket, Message<?> m) {
        Object content = m.getContent();
        boolean restart = content instanceof ShutdownRequest r && r.isRestart();
        status(m, PublishStatus.State.BUSY);
        CellEngine running = engineIfOpen();
        if (executing && running != null) {
            running.interrupt();
        }
        reply(socket, m, MessageType.SHUTDOWN_REPLY, restart ? ShutdownReply.SHUTDOWN_AND_RESTART : ShutdownReply.SHUTDOWN);
        status(m, PublishStatus.State.IDLE);
        KernelLog.LOG.info(() -> "shutdown requested (restart=" + restart + ")");
        Thread t = new Thread(() -> {
            stop();
            onShutdown.run();
        }, "microtally-shutdown");
        t.setDaemon(false);
        t.start();
    }

    private void execute(ZMQ.Socket socket, Message<?> m) {
        ExecuteRequest req = (ExecuteRequest) m.getContent();
        String code = req.getCode() == null ? "" : req.getCode();
        boolean count = !req.isSilent() && req.shouldStoreHistory();
        if (count) {
            executionCount++;
        }
        int n = executionCount;
        if (!req.isSilent()) {
            publish(m, MessageType.PUBLISH_EXECUTE_INPUT, new PublishExecuteInput(code, n));
        }
        IopubOutput out = new IopubOutput(m, req.isSilent());
        CellResult result;
        executing = true;
        runningCell = m;
        java.util.concurrent.ScheduledFuture<?> ticker = flusher.scheduleAtFixedRate(out::flushIfDue, 100, 100,
                java.util.concurrent.TimeUnit.MILLISECONDS);
        long t0 = System.nanoTime();
        long evalNanos;
        try {
            result = engine().run(code, out);
        } catch (RuntimeException | StackOverflowError e) {
            result = new CellResult(CellResult.Outcome.RUNTIME_ERROR, Optional.empty(), Optional.empty(),
                    Optional.of(new CellError(e.getClass().getName(), String.valueOf(e.getMessage()),
                            List.of("engine failure: " + e), 0, 0)));
        } catch (OutOfMemoryError e) {
            result = new CellResult(CellResult.Outcome.RUNTIME_ERROR, Optional.empty(), Optional.empty(),
                    Optional.of(new CellError(e.getClass().getName(), String.valueOf(e.getMessage()),
                            List.of(e.toString()), 0, 0)));
        } finally {
            evalNanos = System.nanoTime() - t0;
            executing = false;
            runningCell = null;
            ticker.cancel(false);
            out.flush();
        }
        // execute_reply metadata: the engine's own time for the cell, so a client can tell the
        // kernel's overhead from the evaluation time (toolkit/bench/kernel-latency.py uses it).
        Map<String, Object> metadata = new LinkedHashMap<>();
        metadata.put("microtally_eval_seconds", evalNanos / 1e9);
        if (!req.isSilent() && result.ok() && result.value().isPresent()) {
            publish(m, MessageType.PUBLISH_EXECUTION_RESULT, new PublishExecuteResult(n, displayData(result.value().get(), null)));
        }
        metadata.put("microtally_kernel_seconds", (System.nanoTime() - shellReceivedAt) / 1e9);
        if (result.ok()) {
            reply(socket, m, executeReplyType(), new ExecuteOk(n), metadata);
            return;
        }
        CellResult failed = result;
        CellError err = failed.error().orElseGet(() -> new CellError(failed.outcome().name(), "cell failed", List.of(), 0, 0));
        List<String> traceback = err.traceback().isEmpty() ? List.of(err.type() + ": " + err.message()) : err.traceback();
        if (!req.isSilent()) {
            publish(m, MessageType.PUBLISH_ERROR, new PublishError(err.type(), err.message(), traceback));
        }
        ErrorReply reply = new ErrorReply(err.type(), err.message(), traceback);
        reply.setExecutionCount(n);
        reply(socket, m, MessageType.EXECUTE_REPLY.error(), reply, metadata);
        if (err.type().contains("OutOfMemoryError")) {
            recoverHeap(m);
        }
        if (req.shouldStopOnError()) {
            abortQueued(socket);
        }
    }

    /**
     * After an OutOfMemoryError: if the heap is still mostly full after a collection (the cell kept
     * references in session variables), replace the engine with a fresh one and say so.
     */
    private void recoverHeap(Message<?> parent) {
        System.gc();
        MemoryUsage heap = ManagementFactory.getMemoryMXBean().getHeapMemoryUsage();
        long max = heap.getMax() > 0 ? heap.getMax() : Runtime.getRuntime().maxMemory();
        double used = (double) heap.getUsed() / max;
        String mib = String.format(java.util.Locale.ROOT, "%.0f of %.0f MiB", heap.getUsed() / 1048576.0, max / 1048576.0);
        if (used < RESET_AFTER_OOM_FRACTION) {
            publish(parent, MessageType.PUBLISH_STREAM, new PublishStream(PublishStream.StreamType.ERR,
                    "[microtally] heap recovered after the OutOfMemoryError (" + mib
                            + " in use after a collection); the kernel session goes on.\n"));
            return;
        }
        KernelLog.LOG.warning(() -> "heap still full after OutOfMemoryError (" + mib + "): resetting the engine");
        CellEngine old = engineIfOpen();
        try {
            if (old != null) {
                old.close();
            }
        } catch (RuntimeException e) {
            KernelLog.LOG.log(Level.WARNING, "closing the exhausted engine failed", e);
        }
        engine = new java.util.concurrent.CompletableFuture<>();
        System.gc();
        openInto(engine);
        MemoryUsage after = ManagementFactory.getMemoryMXBean().getHeapMemoryUsage();
        publish(parent, MessageType.PUBLISH_STREAM, new PublishStream(PublishStream.StreamType.ERR,
                "[microtally] the cell ran out of heap and the session still held " + mib
                        + ", so the kernel started a fresh session (" + after.getUsed() / 1048576
                        + " MiB in use now): variables and definitions from earlier cells are gone; re-run the cells you need.\n"));
    }

    /** After a failed cell with stop_on_error, answers execute requests already queued with "aborted". */
    private void abortQueued(ZMQ.Socket socket) {
        ZMQ.Poller poller = zmq.createPoller(1);
        poller.register(socket, ZMQ.Poller.POLLIN);
        try {
            while (poller.poll(0) > 0 && poller.pollin(0)) {
                Optional<Message<?>> next = receive(socket, "shell");
                if (next.isEmpty()) {
                    continue;
                }
                Message<?> q = next.get();
                if (WireCodec.typeName(q).equals("execute_request")) {
                    status(q, PublishStatus.State.BUSY);
                    reply(socket, q, executeReplyType(), new AbortedReply());
                    status(q, PublishStatus.State.IDLE);
                } else {
                    handle(socket, "shell", q);
                }
            }
        } finally {
            poller.close();
        }
    }

    /** execute_reply content for a request skipped because an earlier cell failed (the library has none). */
    static final class AbortedReply {
        @SuppressWarnings("unused")
        private final String status = "aborted";
    }

    /**
     * execute_reply content for a cell that succeeded. The library's ExecuteReply serializes its
     * status as "error" even when it is OK (its enum's JSON names are wrong), so this one is ours.
     */
    static final class ExecuteOk {
        @SuppressWarnings("unused")
        private final String status = "ok";
        @com.google.gson.annotations.SerializedName("execution_count")
        private final int executionCount;
        @SuppressWarnings("unused")
        @com.google.gson.annotations.SerializedName("user_expressions")
        private final Map<String, Object> userExpressions = Map.of();
        @SuppressWarnings("unused")
        private final List<Object> payload = List.of();

        ExecuteOk(int executionCount) {
            this.executionCount = executionCount;
        }
    }

    @SuppressWarnings({"unchecked", "rawtypes"})
    private static <T> MessageType<T> executeReplyType() {
        return (MessageType) MessageType.EXECUTE_REPLY;
    }

    private void complete(ZMQ.Socket socket, Message<?> m) {
        CompleteRequest req = (CompleteRequest) m.getContent();
        String code = req.getCode() == null ? "" : req.getCode();
        int cursor = CodePoints.toCharIndex(code, req.getCursorPos());
        CellEngine.Completion c;
        try {
            c = engine().complete(code, cursor);
        } catch (RuntimeException e) {
            KernelLog.LOG.log(Level.WARNING, "completion failed", e);
            c = new CellEngine.Completion(List.of(), cursor, cursor);
        }
        reply(socket, m, MessageType.COMPLETE_REPLY, new CompleteReply(c.matches(),
                CodePoints.toCodePoints(code, c.start()), CodePoints.toCodePoints(code, c.end()), Map.of()));
    }

    private void inspect(ZMQ.Socket socket, Message<?> m) {
        InspectRequest req = (InspectRequest) m.getContent();
        String code = req.getCode() == null ? "" : req.getCode();
        int cursor = CodePoints.toCharIndex(code, req.getCursorPos());
        Optional<String> doc;
        try {
            doc = engine().inspect(code, cursor);
        } catch (RuntimeException e) {
            KernelLog.LOG.log(Level.WARNING, "inspection failed", e);
            doc = Optional.empty();
        }
        DisplayData data = new DisplayData();
        doc.ifPresent(data::putText);
        reply(socket, m, MessageType.INSPECT_REPLY, new InspectReply(doc.isPresent(), data));
    }

    private void isComplete(ZMQ.Socket socket, Message<?> m) {
        IsCompleteRequest req = (IsCompleteRequest) m.getContent();
        CellEngine.Completeness k;
        try {
            k = engine().completeness(req.getCode() == null ? "" : req.getCode());
        } catch (RuntimeException e) {
            k = CellEngine.Completeness.UNKNOWN;
        }
        IsCompleteReply r = switch (k.kind()) {
            case COMPLETE -> IsCompleteReply.VALID_CODE;
            case INCOMPLETE -> IsCompleteReply.getIncompleteReplyWithIndent(k.indent() == null ? "" : k.indent());
            case INVALID -> IsCompleteReply.INVALID_CODE;
            case UNKNOWN -> IsCompleteReply.UNKNOWN;
        };
        reply(socket, m, MessageType.IS_COMPLETE_REPLY, r);
    }

    static DisplayData displayData(MimeBundle bundle, String displayId) {
        DisplayData d = new DisplayData();
        for (Map.Entry<String, String> e : bundle.data().entrySet()) {
            d.putData(e.getKey(), e.getValue());
        }
        if (displayId != null) {
            d.setDisplayId(displayId);
        }
        return d;
    }

    // ------------------------------------------------------------------ cell output

    /**
     * Forwards a cell's output to IOPub. Stream text is batched: sent when 4 KiB have gathered, at
     * the next display, 100 ms after the first unsent write, or at the end of the cell, so a loop
     * printing many short lines does not send one message per line.
     */
    private final class IopubOutput implements CellOutput {
        private static final int BATCH = 4096;
        private final Message<?> parent;
        private final boolean silent;
        private final StringBuilder out = new StringBuilder();
        private final StringBuilder err = new StringBuilder();
        private long firstUnsent = -1;

        IopubOutput(Message<?> parent, boolean silent) {
            this.parent = parent;
            this.silent = silent;
        }

        @Override
        public synchronized void stream(boolean stderr, String text) {
            if (silent || text == null || text.isEmpty()) {
                return;
            }
            (stderr ? err : out).append(text);
            long now = System.nanoTime();
            if (firstUnsent < 0) {
                firstUnsent = now;
            }
            if (out.length() + err.length() >= BATCH || now - firstUnsent > 100_000_000L) {
                flush();
            }
        }

        @Override
        public synchronized void display(MimeBundle bundle, String displayId, boolean update) {
            if (silent) {
                return;
            }
            flush();
            DisplayData d = displayData(bundle, displayId);
            if (update && displayId != null) {
                publish(parent, MessageType.PUBLISH_UPDATE_DISPLAY_DATA, new PublishUpdateDisplayData(d));
            } else {
                publish(parent, MessageType.PUBLISH_DISPLAY_DATA, new PublishDisplayData(d));
            }
        }

        synchronized void flushIfDue() {
            if (firstUnsent >= 0 && System.nanoTime() - firstUnsent > 100_000_000L) {
                flush();
            }
        }

        synchronized void flush() {
            if (out.length() > 0) {
                publish(parent, MessageType.PUBLISH_STREAM, new PublishStream(PublishStream.StreamType.OUT, out.toString()));
                out.setLength(0);
            }
            if (err.length() > 0) {
                publish(parent, MessageType.PUBLISH_STREAM, new PublishStream(PublishStream.StreamType.ERR, err.toString()));
                err.setLength(0);
            }
            firstUnsent = -1;
        }
    }
}
