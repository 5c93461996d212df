package org.microtally.kernel;

import io.github.spencerpark.jupyter.kernel.LanguageInfo;
import io.github.spencerpark.jupyter.kernel.display.DisplayData;
import io.github.spencerpark.jupyter.messages.Message;
import io.github.spencerpark.jupyter.messages.MessageType;
import io.github.spencerpark.jupyter.messages.publish.PublishStatus;
import io.github.spencerpark.jupyter.messages.reply.CommInfoReply;
import io.github.spencerpark.jupyter.messages.reply.CompleteReply;
import io.github.spencerpark.jupyter.messages.reply.HistoryReply;
import io.github.spencerpark.jupyter.messages.reply.InspectReply;
import io.github.spencerpark.jupyter.messages.reply.InterruptReply;
import io.github.spencerpark.jupyter.messages.reply.IsCompleteReply;
import io.github.spencerpark.jupyter.messages.reply.KernelInfoReply;
import io.github.spencerpark.jupyter.messages.reply.ShutdownReply;
import io.github.spencerpark.jupyter.messages.request.CompleteRequest;
import io.github.spencerpark.jupyter.messages.request.InspectRequest;
import io.github.spencerpark.jupyter.messages.request.IsCompleteRequest;
import io.github.spencerpark.jupyter.messages.request.ShutdownRequest;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.concurrent.CountDownLatch;
import java.util.logging.Level;
import org.microtally.notebook.session.Completeness;
import org.microtally.notebook.session.Completions;
import org.microtally.notebook.session.Engine;
import org.microtally.notebook.session.KernelIdentity;
import org.microtally.notebook.session.Provenance;
import org.zeromq.ZMQ;

/**
 * Answers one decoded request (protocol 5.3): status busy, the reply, status idle. Execute requests
 * go to {@link CellExecution}; completion, inspection and is_complete ask the engine and convert
 * Jupyter's code-point cursors ({@link CodePoints}).
 */
final class Requests {
    static final String PROTOCOL_VERSION = "5.3";
    /** The banner's line when the connection file has no key. */
    static final String UNSIGNED_WARNING = "WARNING: the connection file has an empty key, so messages are not signed "
            + "and any local process that can reach the ports can run code here; install the kernel with "
            + "'microtally install-kernel --refuse-unsigned' (or start it with 'kernel --refuse-unsigned') to refuse such a connection file";

    /**
     * The kernel_info_reply's message metadata: {@code {"microtally": {"provenance": ...}}}. The
     * messaging protocol gives every message a metadata dict; Jupyter's clients do not copy it into
     * the notebook, so a notebook executed by Jupyter records only language_info, while the headless
     * runner writes the same record into {@code metadata.microtally.provenance}.
     */
    static final Map<String, Object> KERNEL_INFO_METADATA = Map.of("microtally",
            Map.of("provenance", Provenance.of("microtally kernel", null).asMap()));

    private final KernelWire wire;
    private final EngineSlot engine;
    private final CellExecution cells;
    private final boolean unsigned;
    private final Runnable shutdown;
    final CountDownLatch firstKernelInfo = new CountDownLatch(1);
    volatile long firstKernelInfoAt;

    Requests(KernelWire wire, EngineSlot engine, CellExecution cells, boolean unsigned, Runnable shutdown) {
        this.wire = wire;
        this.engine = engine;
        this.cells = cells;
        this.unsigned = unsigned;
        this.shutdown = shutdown;
    }

    void handle(ZMQ.Socket socket, String channel, Message<?> m, long receivedAt) {
        String type = WireCodec.typeName(m);
        if (type.equals(MessageType.INTERRUPT_REQUEST.getName())) {
            wire.status(m, PublishStatus.State.BUSY);
            cells.interruptRunningCell();
            wire.reply(socket, m, MessageType.INTERRUPT_REPLY, new InterruptReply());
            wire.status(m, PublishStatus.State.IDLE);
            return;
        }
        if (type.equals(MessageType.SHUTDOWN_REQUEST.getName())) {
            shutdown(socket, m);
            return;
        }
        wire.status(m, PublishStatus.State.BUSY);
        try {
            switch (type) {
                case "kernel_info_request" -> {
                    wire.reply(socket, m, MessageType.KERNEL_INFO_REPLY, kernelInfo(unsigned), KERNEL_INFO_METADATA);
                    if (firstKernelInfo.getCount() > 0) {
                        firstKernelInfoAt = System.currentTimeMillis();
                        firstKernelInfo.countDown();
                    }
                }
                case "execute_request" -> cells.execute(socket, m, receivedAt);
                case "complete_request" -> complete(socket, m);
                case "inspect_request" -> inspect(socket, m);
                case "is_complete_request" -> isComplete(socket, m);
                case "comm_info_request" -> wire.reply(socket, m, MessageType.COMM_INFO_REPLY, new CommInfoReply(Map.of()));
                case "history_request" -> wire.reply(socket, m, MessageType.HISTORY_REPLY, new HistoryReply(List.of()));
                default -> KernelLog.LOG.info(() -> "ignored " + type + " on " + channel);
            }
        } finally {
            wire.status(m, PublishStatus.State.IDLE);
        }
    }

    static KernelInfoReply kernelInfo(boolean unsigned) {
        Map<String, String> info = KernelIdentity.languageInfo();
        LanguageInfo language = new LanguageInfo.Builder(info.get("name"))
                .version(info.get("version"))
                .mimetype(info.get("mimetype"))
                .fileExtension(info.get("file_extension"))
                .pygments(info.get("pygments_lexer"))
                .codemirror(info.get("codemirror_mode"))
                .build();
        Map<String, Object> provenance = Provenance.of("microtally kernel", null).asMap();
        String banner = "microtally " + provenance.get("toolkit_version") + " (" + provenance.get("commit") + "), Java "
                + KernelIdentity.javaVersion() + ": cells run in JShell with the microtally toolkit imported"
                + (unsigned ? "\n" + UNSIGNED_WARNING : "");
        return new KernelInfoReply(PROTOCOL_VERSION, KernelIdentity.KERNEL_NAME, Main.version(), language, banner, List.of());
    }

    private void shutdown(ZMQ.Socket socket, Message<?> m) {
        boolean restart = m.getContent() instanceof ShutdownRequest r && r.isRestart();
        wire.status(m, PublishStatus.State.BUSY);
        Engine running = engine.ifOpen();
        if (cells.runningCell() != null && running != null) {
            running.interrupt();
        }
        wire.reply(socket, m, MessageType.SHUTDOWN_REPLY, restart ? ShutdownReply.SHUTDOWN_AND_RESTART : ShutdownReply.SHUTDOWN);
        wire.status(m, PublishStatus.State.IDLE);
        KernelLog.LOG.info(() -> "shutdown requested (restart=" + restart + ")");
        Thread t = new Thread(shutdown, "microtally-shutdown");
        t.setDaemon(false);
        t.start();
    }

    private void complete(ZMQ.Socket socket, Message<?> m) {
        CompleteRequest req = (CompleteRequest) m.getContent();
        String code = req.getCode() == null ? "" : req.getCode();
        int cursor = CodePoints.toCharIndex(code, req.getCursorPos());
        Completions c;
        try {
            c = engine.get().complete(code, cursor);
        } catch (RuntimeException e) {
            KernelLog.LOG.log(Level.WARNING, "completion failed", e);
            c = new Completions(List.of(), cursor, cursor);
        }
        int start = CodePoints.toCodePoints(code, c.start());
        int end = CodePoints.toCodePoints(code, c.end());
        wire.reply(socket, m, MessageType.COMPLETE_REPLY, new CompleteReply(c.matches(), start, end, completionMetadata(c, start, end)));
    }

    /**
     * The complete_reply metadata: {@code _jupyter_types_experimental} (the per-match list JupyterLab
     * reads: start, end, text, and type for matches that fit the argument position, with the called
     * overloads as their signature) and {@code microtally_signatures} (those overloads).
     */
    static Map<String, Object> completionMetadata(Completions c, int start, int end) {
        List<Map<String, Object>> items = new java.util.ArrayList<>();
        String overloads = String.join("\n", c.signatures());
        for (int i = 0; i < c.matches().size(); i++) {
            Map<String, Object> item = new java.util.LinkedHashMap<>();
            item.put("start", start);
            item.put("end", end);
            item.put("text", c.matches().get(i));
            if (!c.kinds().get(i).isEmpty()) {
                item.put("type", c.kinds().get(i));
                if (!overloads.isEmpty()) {
                    item.put("signature", overloads);
                }
            }
            items.add(item);
        }
        Map<String, Object> meta = new java.util.LinkedHashMap<>();
        meta.put("_jupyter_types_experimental", items);
        if (!c.signatures().isEmpty()) {
            meta.put("microtally_signatures", c.signatures());
        }
        return meta;
    }

    private void inspect(ZMQ.Socket socket, Message<?> m) {
        InspectRequest req = (InspectRequest) m.getContent();
        String code = req.getCode() == null ? "" : req.getCode();
        int cursor = CodePoints.toCharIndex(code, req.getCursorPos());
        Optional<String> doc;
        try {
            doc = engine.get().inspect(code, cursor);
        } catch (RuntimeException e) {
            KernelLog.LOG.log(Level.WARNING, "inspection failed", e);
            doc = Optional.empty();
        }
        DisplayData data = new DisplayData();
        doc.ifPresent(data::putText);
        wire.reply(socket, m, MessageType.INSPECT_REPLY, new InspectReply(doc.isPresent(), data));
    }

    private void isComplete(ZMQ.Socket socket, Message<?> m) {
        IsCompleteRequest req = (IsCompleteRequest) m.getContent();
        IsCompleteReply r;
        try {
            Completeness k = engine.get().completeness(req.getCode() == null ? "" : req.getCode());
            r = switch (k.status()) {
                case COMPLETE -> IsCompleteReply.VALID_CODE;
                case INCOMPLETE -> IsCompleteReply.getIncompleteReplyWithIndent(k.indent() == null ? "" : k.indent());
                case INVALID -> IsCompleteReply.INVALID_CODE;
            };
        } catch (RuntimeException e) {
            KernelLog.LOG.log(Level.WARNING, "is_complete failed", e);
            r = IsCompleteReply.UNKNOWN;
        }
        wire.reply(socket, m, MessageType.IS_COMPLETE_REPLY, r);
    }
}
