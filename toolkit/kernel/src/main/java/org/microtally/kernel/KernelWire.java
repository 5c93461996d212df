package org.microtally.kernel;

import io.github.spencerpark.jupyter.kernel.KernelConnectionProperties;
import io.github.spencerpark.jupyter.messages.Header;
import io.github.spencerpark.jupyter.messages.Message;
import io.github.spencerpark.jupyter.messages.MessageType;
import io.github.spencerpark.jupyter.messages.publish.PublishStatus;
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

    WireCodec codec() {
        return codec;
    }

    String kernelSession() {
        return kernelSession;
    }

    ZContext context() {
        return zmq;
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
