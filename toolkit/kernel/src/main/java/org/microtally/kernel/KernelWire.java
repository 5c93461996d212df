package org.microtally.kernel;

import io.github.spencerpark.jupyter.kernel.KernelConnectionProperties;
import io.github.spencerpark.jupyter.messages.Header;
import io.github.spencerpark.jupyter.messages.Message;
import io.github.spencerpark.jupyter.messages.MessageType;
import io.github.spencerpark.jupyter.messages.publish.PublishStatus;
import io.github.spencerpark.jupyter.messages.request.ExecuteRequest;
import java.util.Locale;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.concurrent.atomic.AtomicBoolean;
import java.util.concurrent.atomic.AtomicInteger;
import org.zeromq.SocketType;
import org.zeromq.ZContext;
import org.zeromq.ZMQ;

/**
 * The kernel's sockets and what travels on them: binding the channels of the connection file,
 * receiving and decoding (a message that fails is dropped with a log line, never handled), replying
 * and publishing on IOPub (shared by the threads, written under a lock).
 */
final class KernelWire {
    private final KernelConnectionProperties connection;
    private final WireCodec codec;
    private final ZContext zmq = new ZContext(1);
    private final Object iopubLock = new Object();
    private final String kernelSession = java.util.UUID.randomUUID().toString();
    private final AtomicBoolean open = new AtomicBoolean(true);
    private final AtomicInteger droppedBadSignature = new AtomicInteger();
    private final AtomicInteger droppedMalformed = new AtomicInteger();
    private ZMQ.Socket iopub;

    KernelWire(KernelConnectionProperties connection) {
        this.connection = connection;
        this.codec = new WireCodec(connection.getSignatureScheme(), connection.getKey());
    }

    /** A poller that waits for input on {@code socket}. */
    ZMQ.Poller poller(ZMQ.Socket socket) {
        ZMQ.Poller poller = zmq.createPoller(1);
        poller.register(socket, ZMQ.Poller.POLLIN);
        return poller;
    }

    /**
     * Runs the message encoding and decoding code a few thousand times on dummy messages (never
     * sent), so the JIT compiles it before the first cells instead of during them: measured, the
     * first few hundred requests otherwise take about 3x longer than later ones.
     */
    void warm(java.util.function.BooleanSupplier keepGoing) {
        long t0 = System.nanoTime();
        String session = kernelSession;
        Header<PublishStatus> h = new Header<>(session, MessageType.PUBLISH_STATUS);
        Message<PublishStatus> status = new Message<>(List.of(new byte[8]), h, h, new LinkedHashMap<>(),
                PublishStatus.forState(PublishStatus.State.IDLE), null);
        Message<CellExecution.ExecuteOk> reply = new Message<>(List.of(new byte[8]),
                new Header<>(session, CellExecution.<CellExecution.ExecuteOk>executeReplyType()), h,
                new LinkedHashMap<>(Map.of("microtally_eval_seconds", 0.001)), new CellExecution.ExecuteOk(1), null);
        Message<ExecuteRequest> request = new Message<>(List.of(new byte[8]),
                new Header<>(session, MessageType.EXECUTE_REQUEST), null, new LinkedHashMap<>(),
                new ExecuteRequest("1 + 1", false, true, Map.of(), false, true), null);
        int n = 0;
        try {
            for (int i = 0; i < 1500 && keepGoing.getAsBoolean(); i++) {
                n += codec.encode(status).size() + codec.encode(reply).size();
                n += codec.decode(codec.encode(request)).getIdentities().size();
                new Header<>(request, MessageType.PUBLISH_STREAM);
            }
        } catch (WireCodec.BadSignatureException | WireCodec.MalformedMessageException e) {
            KernelLog.LOG.log(java.util.logging.Level.WARNING, "message warm-up failed", e);
        }
        int frames = n;
        KernelLog.LOG.info(() -> String.format(Locale.ROOT, "message path warmed in %.0f ms (%d frames)",
                (System.nanoTime() - t0) / 1e6, frames));
    }

    ZMQ.Socket bind(SocketType type, int port) {
        ZMQ.Socket s = zmq.createSocket(type);
        s.setLinger(0);
        s.bind(address(connection.getTransport(), connection.getIp(), port));
        if (type == SocketType.PUB) {
            iopub = s;
        }
        return s;
    }

    /** The ZeroMQ endpoint for one channel: tcp://ip:port, or ipc://ip-port as Jupyter writes it. */
    static String address(String transport, String ip, int port) {
        if ("ipc".equals(transport)) {
            return "ipc://" + ip + "-" + port;
        }
        return transport + "://" + ip + ":" + port;
    }

    static List<byte[]> receiveFrames(ZMQ.Socket socket) {
        List<byte[]> frames = new ArrayList<>();
        do {
            byte[] f = socket.recv(0);
            if (f == null) {
                break;
            }
            frames.add(f);
        } while (socket.hasReceiveMore());
        return frames;
    }

    /** The next message on {@code socket}, or empty when it was dropped (bad signature, not a Jupyter message). */
    Optional<Message<?>> receive(ZMQ.Socket socket, String channel) {
        List<byte[]> frames = receiveFrames(socket);
        try {
            return Optional.of(codec.decode(frames));
        } catch (WireCodec.BadSignatureException e) {
            droppedBadSignature.incrementAndGet();
            KernelLog.LOG.warning(() -> "dropped a message on " + channel + " with a bad signature ("
                    + frames.size() + " frames): not handled");
        } catch (WireCodec.MalformedMessageException e) {
            droppedMalformed.incrementAndGet();
            KernelLog.LOG.warning(() -> "dropped a malformed message on " + channel + ": " + e.getMessage());
        }
        return Optional.empty();
    }

    int droppedBadSignature() {
        return droppedBadSignature.get();
    }

    int droppedMalformed() {
        return droppedMalformed.get();
    }

    void send(ZMQ.Socket socket, Message<?> message) {
        List<byte[]> frames = codec.encode(message);
        for (int i = 0; i < frames.size(); i++) {
            socket.send(frames.get(i), i < frames.size() - 1 ? ZMQ.SNDMORE : 0);
        }
    }

    <T> void reply(ZMQ.Socket socket, Message<?> request, MessageType<T> type, T content) {
        reply(socket, request, type, content, new LinkedHashMap<>());
    }

    <T> void reply(ZMQ.Socket socket, Message<?> request, MessageType<T> type, T content, Map<String, Object> metadata) {
        send(socket, new Message<>(request.getIdentities(), new Header<>(request, type), request.getHeader(),
                metadata, content, null));
    }

    <T> void publish(Message<?> parent, MessageType<T> type, T content) {
        Header<T> header = parent == null ? new Header<>(kernelSession, type) : new Header<>(parent, type);
        Message<T> m = new Message<>(List.of(("kernel." + kernelSession + "." + type.getName())
                .getBytes(StandardCharsets.UTF_8)), header, parent == null ? null : parent.getHeader(),
                new LinkedHashMap<>(), content, null);
        synchronized (iopubLock) {
            if (open.get() && iopub != null) {
                send(iopub, m);
            }
        }
    }

    void status(Message<?> parent, PublishStatus.State state) {
        publish(parent, MessageType.PUBLISH_STATUS, PublishStatus.forState(state));
    }

    /** Stops publishing and closes every socket. */
    void close() {
        synchronized (iopubLock) {
            open.set(false);
        }
        zmq.close();
    }
}
