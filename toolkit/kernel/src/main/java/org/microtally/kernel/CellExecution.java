package org.microtally.kernel;

import io.github.spencerpark.jupyter.kernel.display.DisplayData;
import io.github.spencerpark.jupyter.messages.Message;
import io.github.spencerpark.jupyter.messages.MessageType;
import io.github.spencerpark.jupyter.messages.publish.PublishDisplayData;
import io.github.spencerpark.jupyter.messages.publish.PublishError;
import io.github.spencerpark.jupyter.messages.publish.PublishExecuteInput;
import io.github.spencerpark.jupyter.messages.publish.PublishExecuteResult;
import io.github.spencerpark.jupyter.messages.publish.PublishStatus;
import io.github.spencerpark.jupyter.messages.publish.PublishStream;
import io.github.spencerpark.jupyter.messages.publish.PublishUpdateDisplayData;
import io.github.spencerpark.jupyter.messages.reply.ErrorReply;
import io.github.spencerpark.jupyter.messages.request.ExecuteRequest;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.concurrent.ScheduledExecutorService;
import java.util.concurrent.TimeUnit;
import java.util.function.BiConsumer;
import org.microtally.notebook.render.MimeBundle;
import org.microtally.notebook.session.CellError;
import org.microtally.notebook.session.CellOutput;
import org.microtally.notebook.session.CellResult;
import org.microtally.notebook.session.Engine;
import org.zeromq.ZMQ;

/**
 * execute_request: publishes the input, forwards the cell's output to IOPub as the engine delivers
 * it (the engine batches stream text; this class adds no second batching), publishes the result or
 * the error, replies, and after a failure with stop_on_error answers the queued execute requests
 * with "aborted". Interrupts from the control channel stop the running cell.
 */
final class CellExecution {
    private final KernelWire wire;
    private final EngineSlot engine;
    private final ScheduledExecutorService timers;
    private final BiConsumer<ZMQ.Socket, Message<?>> otherRequests;
    private volatile Message<?> runningCell;
    private int executionCount;

    CellExecution(KernelWire wire, EngineSlot engine, ScheduledExecutorService timers,
                  BiConsumer<ZMQ.Socket, Message<?>> otherRequests) {
        this.wire = wire;
        this.engine = engine;
        this.timers = timers;
        this.otherRequests = otherRequests;
    }

    /** The execute request whose cell is running, or null. */
    Message<?> runningCell() {
        return runningCell;
    }

    /**
     * Runs the cell of {@code m}; {@code receivedAt} ({@link System#nanoTime()}) is when the request
     * arrived, reported in the reply's metadata with the engine's own time.
     */
    void execute(ZMQ.Socket socket, Message<?> m, long receivedAt) {
        ExecuteRequest req = (ExecuteRequest) m.getContent();
        String code = req.getCode() == null ? "" : req.getCode();
        if (!req.isSilent() && req.shouldStoreHistory()) {
            executionCount++;
        }
        int n = executionCount;
        if (!req.isSilent()) {
            wire.publish(m, MessageType.PUBLISH_EXECUTE_INPUT, new PublishExecuteInput(code, n));
        }
        CellResult result;
        runningCell = m;
        long t0 = System.nanoTime();
        long evalNanos;
        try {
            result = engine.get().run(code, new IopubOutput(m, req.isSilent()));
        } catch (RuntimeException | StackOverflowError e) {
            result = failed(CellResult.Outcome.RUNTIME_ERROR, e, "engine failure: " + e);
        } catch (OutOfMemoryError e) {
            result = failed(CellResult.Outcome.OUT_OF_MEMORY, e, e.toString());
        } finally {
            evalNanos = System.nanoTime() - t0;
            runningCell = null;
        }
        // execute_reply metadata: the engine's own time for the cell and its phases, so a client can
        // tell the kernel's overhead from the evaluation time (toolkit/bench/kernel-latency.py uses it).
        long t1 = System.nanoTime();
        Map<String, Object> metadata = new LinkedHashMap<>();
        metadata.put("microtally_eval_seconds", evalNanos / 1e9);
        if (!req.isSilent() && result.ok() && result.value().isPresent()) {
            wire.publish(m, MessageType.PUBLISH_EXECUTION_RESULT, new PublishExecuteResult(n, displayData(result.value().get(), null)));
        }
        long done = System.nanoTime();
        metadata.put("microtally_kernel_seconds", (done - receivedAt) / 1e9);
        Map<String, Double> phases = new LinkedHashMap<>();
        phases.put("kernel_in", (t0 - receivedAt) / 1e6);   // decode, status busy, execute_input
        phases.putAll(result.phases().millis());
        phases.put("kernel_out", (done - t1) / 1e6);        // execute_result built and published
        metadata.put("microtally_phases_ms", phases);
        metadata.put("microtally_reran_snippets", result.phases().reran());   // snippets run again without compiling
        if (result.ok()) {
            wire.reply(socket, m, executeReplyType(), new ExecuteOk(n), metadata);
            return;
        }
        CellResult r = result;
        CellError err = r.error().orElseGet(() -> new CellError(r.outcome().name(), "cell failed", List.of(), 0, 0));
        List<String> traceback = err.traceback().isEmpty() ? List.of(err.type() + ": " + err.message()) : err.traceback();
        if (!req.isSilent()) {
            wire.publish(m, MessageType.PUBLISH_ERROR, new PublishError(err.type(), err.message(), traceback));
        }
        ErrorReply reply = new ErrorReply(err.type(), err.message(), traceback);
        reply.setExecutionCount(n);
        wire.reply(socket, m, MessageType.EXECUTE_REPLY.error(), reply, metadata);
        if (r.outcome() == CellResult.Outcome.OUT_OF_MEMORY) {
            wire.publish(m, MessageType.PUBLISH_STREAM, new PublishStream(PublishStream.StreamType.ERR, HeapCheck.recover(engine)));
        }
        if (req.shouldStopOnError()) {
            abortQueued(socket);
        }
    }

    private static CellResult failed(CellResult.Outcome outcome, Throwable e, String line) {
        return new CellResult(outcome, Optional.empty(), Optional.empty(),
                Optional.of(new CellError(e.getClass().getName(), String.valueOf(e.getMessage()), List.of(line), 0, 0)));
    }

    /**
     * Stops the running cell. An interrupt that lands while the engine is still compiling the cell
     * may find nothing to stop yet, so it is repeated every 200 ms (at most 10 times) while that
     * same cell is still running.
     */
    void interruptRunningCell() {
        Message<?> cell = runningCell;
        Engine e = engine.ifOpen();
        if (cell == null || e == null) {
            return;
        }
        e.interrupt();
        for (int i = 1; i <= 10; i++) {
            timers.schedule(() -> {
                if (runningCell == cell) {
                    e.interrupt();
                }
            }, 200L * i, TimeUnit.MILLISECONDS);
        }
    }

    /** After a failed cell with stop_on_error, answers execute requests already queued with "aborted". */
    private void abortQueued(ZMQ.Socket socket) {
        ZMQ.Poller poller = wire.poller(socket);
        try {
            while (poller.poll(0) > 0 && poller.pollin(0)) {
                Optional<Message<?>> next = wire.receive(socket, "shell");
                if (next.isEmpty()) {
                    continue;
                }
                Message<?> q = next.get();
                if (WireCodec.typeName(q).equals("execute_request")) {
                    wire.status(q, PublishStatus.State.BUSY);
                    wire.reply(socket, q, executeReplyType(), new AbortedReply());
                    wire.status(q, PublishStatus.State.IDLE);
                } else {
                    otherRequests.accept(socket, q);
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
    static <T> MessageType<T> executeReplyType() {
        return (MessageType) MessageType.EXECUTE_REPLY;
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

    /** Forwards a cell's output to IOPub, one message per chunk the engine delivers, in its order. */
    private final class IopubOutput implements CellOutput {
        private final Message<?> parent;
        private final boolean silent;

        IopubOutput(Message<?> parent, boolean silent) {
            this.parent = parent;
            this.silent = silent;
        }

        @Override
        public void stream(boolean stderr, String text) {
            if (silent || text == null || text.isEmpty()) {
                return;
            }
            wire.publish(parent, MessageType.PUBLISH_STREAM,
                    new PublishStream(stderr ? PublishStream.StreamType.ERR : PublishStream.StreamType.OUT, text));
        }

        @Override
        public void display(MimeBundle bundle, String displayId, boolean update) {
            if (silent) {
                return;
            }
            DisplayData d = displayData(bundle, displayId);
            if (update && displayId != null) {
                wire.publish(parent, MessageType.PUBLISH_UPDATE_DISPLAY_DATA, new PublishUpdateDisplayData(d));
            } else {
                wire.publish(parent, MessageType.PUBLISH_DISPLAY_DATA, new PublishDisplayData(d));
            }
        }
    }
}
