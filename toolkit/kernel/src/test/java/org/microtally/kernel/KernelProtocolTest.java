package org.microtally.kernel;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.google.gson.JsonObject;
import com.google.gson.JsonParser;
import io.github.spencerpark.jupyter.kernel.KernelConnectionProperties;
import java.io.IOException;
import java.net.ServerSocket;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.HexFormat;
import java.util.List;
import java.util.Optional;
import java.util.UUID;
import java.util.concurrent.CopyOnWriteArrayList;
import java.util.concurrent.CountDownLatch;
import java.util.concurrent.TimeUnit;
import java.util.logging.Handler;
import java.util.logging.LogRecord;
import javax.crypto.Mac;
import javax.crypto.spec.SecretKeySpec;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.microtally.notebook.render.MimeBundle;
import org.microtally.notebook.session.CellError;
import org.microtally.notebook.session.CellOutput;
import org.microtally.notebook.session.CellResult;
import org.microtally.notebook.session.Completeness;
import org.microtally.notebook.session.Completions;
import org.microtally.notebook.session.Engine;
import org.zeromq.SocketType;
import org.zeromq.ZContext;
import org.zeromq.ZMQ;

/**
 * Drives the kernel over real ZeroMQ sockets on the loopback interface with a client written here
 * (its own framing and HMAC code), and a recording engine double in place of JShell.
 */
class KernelProtocolTest {
    private static final String KEY = "test-key-" + UUID.randomUUID();

    /** Engine double: records what it was asked to run; "boom" fails, "spin" runs until interrupted. */
    static final class RecordingEngine implements Engine {
        final List<String> ran = new CopyOnWriteArrayList<>();
        final CountDownLatch spinning = new CountDownLatch(1);
        volatile boolean interrupted;
        final java.util.concurrent.atomic.AtomicInteger interrupts = new java.util.concurrent.atomic.AtomicInteger();

        @Override
        public CellResult run(String code, CellOutput output) {
            ran.add(code);
            if (code.equals("boom")) {
                return new CellResult(CellResult.Outcome.RUNTIME_ERROR, Optional.empty(), Optional.empty(),
                        Optional.of(new CellError("java.lang.IllegalStateException", "boom", List.of("IllegalStateException: boom", "  at cell 1"), 1, 1)));
            }
            if (code.equals("deaf-once")) {
                // like an engine that is still compiling when the first interrupt arrives
                spinning.countDown();
                long end = System.nanoTime() + TimeUnit.SECONDS.toNanos(10);
                while (interrupts.get() < 2 && System.nanoTime() < end) {
                    Thread.onSpinWait();
                }
                return new CellResult(CellResult.Outcome.INTERRUPTED, Optional.empty(), Optional.empty(),
                        Optional.of(new CellError("Interrupted", "stopped after " + interrupts.get() + " interrupts", List.of(), 0, 0)));
            }
            if (code.equals("spin")) {
                spinning.countDown();
                long end = System.nanoTime() + TimeUnit.SECONDS.toNanos(10);
                while (!interrupted && System.nanoTime() < end) {
                    Thread.onSpinWait();
                }
                return new CellResult(CellResult.Outcome.INTERRUPTED, Optional.empty(), Optional.empty(),
                        Optional.of(new CellError("Interrupted", "the cell was interrupted", List.of(), 0, 0)));
            }
            output.stream(false, "printed " + code + "\n");
            output.display(MimeBundle.builder("shown").put(MimeBundle.TEXT_HTML, "<b>shown</b>").build(), "d1", false);
            return new CellResult(CellResult.Outcome.OK, Optional.of(MimeBundle.text("value of " + code)), Optional.of(code), Optional.empty());
        }

        @Override
        public void interrupt() {
            interrupts.incrementAndGet();
            interrupted = true;
        }

        @Override
        public Completions complete(String code, int cursor) {
            return new Completions(List.of("alpha", "alphabet"), Math.max(0, cursor - 2), cursor);
        }

        @Override
        public Optional<String> inspect(String code, int cursor) {
            return Optional.of("doc at " + cursor);
        }

        @Override
        public Completeness completeness(String code) {
            return new Completeness(code.endsWith("{") ? Completeness.Status.INCOMPLETE : Completeness.Status.COMPLETE, "    ");
        }

        @Override
        public void close() { }
    }

    private final RecordingEngine engine = new RecordingEngine();
    private final List<LogRecord> logged = new CopyOnWriteArrayList<>();
    private final Handler capture = new Handler() {
        @Override
        public void publish(LogRecord r) {
            logged.add(r);
        }

        @Override
        public void flush() { }

        @Override
        public void close() { }
    };
    private Kernel kernel;
    private ZContext ctx;
    private ZMQ.Socket shell;
    private ZMQ.Socket control;
    private ZMQ.Socket iopub;
    private ZMQ.Socket hb;
    private int stdinPort;

    private static int freePort() throws IOException {
        try (ServerSocket s = new ServerSocket(0)) {
            return s.getLocalPort();
        }
    }

    @BeforeEach
    void start() throws Exception {
        KernelLog.LOG.addHandler(capture);
        KernelLog.LOG.setUseParentHandlers(false); // keep the test output quiet
        int[] p = null;
        // a port found free may be taken by another process before the kernel binds it: try fresh ports
        for (int attempt = 1; kernel == null; attempt++) {
            p = new int[] {freePort(), freePort(), freePort(), freePort(), freePort()};
            KernelConnectionProperties props = new KernelConnectionProperties("127.0.0.1", p[0], p[1], p[2], p[3], p[4],
                    "tcp", "hmac-sha256", KEY);
            Kernel k = new Kernel(props, () -> engine);
            try {
                k.start();
                kernel = k;
            } catch (org.zeromq.ZMQException e) {
                if (attempt == 3) {
                    throw e;
                }
            }
        }
        stdinPort = p[2];
        ctx = new ZContext();
        // constructor order: control, shell, stdin, heartbeat, iopub
        control = connect(SocketType.DEALER, p[0]);
        shell = connect(SocketType.DEALER, p[1]);
        hb = connect(SocketType.REQ, p[3]);
        iopub = connect(SocketType.SUB, p[4]);
        iopub.subscribe(new byte[0]);
        Thread.sleep(150); // let the SUB subscription reach the PUB socket
    }

    @AfterEach
    void stop() {
        KernelLog.LOG.removeHandler(capture);
        KernelLog.LOG.setUseParentHandlers(true);
        kernel.stop();
        ctx.close();
    }

    private ZMQ.Socket connect(SocketType type, int port) {
        ZMQ.Socket s = ctx.createSocket(type);
        s.setLinger(0);
        s.setReceiveTimeOut(5000);
        s.connect("tcp://127.0.0.1:" + port);
        return s;
    }

    private static String hmac(String key, String... parts) throws Exception {
        Mac mac = Mac.getInstance("HmacSHA256");
        mac.init(new SecretKeySpec(key.getBytes(StandardCharsets.UTF_8), "HmacSHA256"));
        for (String part : parts) {
            mac.update(part.getBytes(StandardCharsets.UTF_8));
        }
        return HexFormat.of().formatHex(mac.doFinal());
    }

    /** Sends a request signed with {@code key}; returns its msg_id. */
    private String send(ZMQ.Socket s, String key, String type, String content) throws Exception {
        String id = UUID.randomUUID().toString();
        String header = "{\"msg_id\":\"" + id + "\",\"session\":\"test\",\"username\":\"t\",\"date\":\"2026-01-01T00:00:00.000Z\","
                + "\"msg_type\":\"" + type + "\",\"version\":\"5.3\"}";
        String[] body = {header, "{}", "{}", content};
        s.send("<IDS|MSG>", ZMQ.SNDMORE);
        s.send(hmac(key, body), ZMQ.SNDMORE);
        for (int i = 0; i < body.length; i++) {
            s.send(body[i], i < body.length - 1 ? ZMQ.SNDMORE : 0);
        }
        return id;
    }

    /** Sends an execute_request for {@code code} on the shell channel, signed with the key; returns its msg_id. */
    private String execute(String code) throws Exception {
        return send(shell, KEY, "execute_request", "{\"code\":\"" + code + "\",\"silent\":false,\"store_history\":true,"
                + "\"user_expressions\":{},\"allow_stdin\":false,\"stop_on_error\":true}");
    }

    /** The next message on a socket as {header, parent_header, content}, or null on timeout. */
    private JsonObject[] receive(ZMQ.Socket s) throws Exception {
        List<String> frames = new ArrayList<>();
        byte[] first = s.recv(0);
        if (first == null) {
            return null;
        }
        frames.add(new String(first, StandardCharsets.UTF_8));
        while (s.hasReceiveMore()) {
            frames.add(new String(s.recv(0), StandardCharsets.UTF_8));
        }
        int d = frames.indexOf("<IDS|MSG>");
        assertTrue(d >= 0, "no delimiter in " + frames);
        // The kernel's replies are signed with the connection key too.
        assertEquals(hmac(KEY, frames.get(d + 2), frames.get(d + 3), frames.get(d + 4), frames.get(d + 5)), frames.get(d + 1));
        return new JsonObject[] {
            JsonParser.parseString(frames.get(d + 2)).getAsJsonObject(),
            JsonParser.parseString(frames.get(d + 3)).getAsJsonObject(),
            JsonParser.parseString(frames.get(d + 5)).getAsJsonObject(),
            JsonParser.parseString(frames.get(d + 4)).getAsJsonObject()};
    }

    /** IOPub messages for {@code parentId} up to and including its idle status. */
    private List<JsonObject[]> iopubUntilIdle(String parentId) throws Exception {
        List<JsonObject[]> out = new ArrayList<>();
        while (true) {
            JsonObject[] m = receive(iopub);
            assertNotNull(m, "iopub went quiet before idle");
            if (!m[1].has("msg_id") || !m[1].get("msg_id").getAsString().equals(parentId)) {
                continue;
            }
            out.add(m);
            if (m[0].get("msg_type").getAsString().equals("status")
                    && m[2].get("execution_state").getAsString().equals("idle")) {
                return out;
            }
        }
    }

    private static List<String> types(List<JsonObject[]> msgs) {
        List<String> t = new ArrayList<>();
        for (JsonObject[] m : msgs) {
            t.add(m[0].get("msg_type").getAsString());
        }
        return t;
    }

    @Test
    void kernelInfoDescribesJava17() throws Exception {
        String id = send(shell, KEY, "kernel_info_request", "{}");
        JsonObject[] reply = receive(shell);
        assertEquals("kernel_info_reply", reply[0].get("msg_type").getAsString());
        assertEquals(id, reply[1].get("msg_id").getAsString());
        JsonObject lang = reply[2].getAsJsonObject("language_info");
        // Source: Jupyter messaging protocol 5.3, kernel_info_reply fields; values from the kernel brief
        assertEquals("java", lang.get("name").getAsString());
        assertEquals(org.microtally.notebook.session.KernelIdentity.javaVersion(), lang.get("version").getAsString());
        assertEquals("text/x-java-source", lang.get("mimetype").getAsString());
        assertEquals(".java", lang.get("file_extension").getAsString());
        assertEquals("5.3", reply[2].get("protocol_version").getAsString());
    }

    @Test
    void aMessageWithABadSignatureIsDroppedAndLoggedNotExecuted() throws Exception {
        send(shell, "not-the-key", "execute_request",
                "{\"code\":\"forged\",\"silent\":false,\"store_history\":true,\"user_expressions\":{},\"allow_stdin\":false,\"stop_on_error\":true}");
        shell.setReceiveTimeOut(700);
        assertNull(receive(shell), "the kernel answered a forged message");
        shell.setReceiveTimeOut(5000);
        assertTrue(engine.ran.isEmpty(), "the forged cell ran: " + engine.ran);
        assertEquals(1, kernel.droppedBadSignature());
        assertTrue(logged.stream().anyMatch(r -> r.getMessage().contains("bad signature")), "no log record of the drop");

        // The same request with the right key runs: the check above can fail.
        execute("genuine");
        JsonObject[] reply = receive(shell);
        assertEquals("ok", reply[2].get("status").getAsString());
        assertEquals(List.of("genuine"), engine.ran);
    }

    @Test
    void executePublishesInputStreamDisplayResultAndReplies() throws Exception {
        String id = execute("x");
        JsonObject[] reply = receive(shell);
        assertEquals("execute_reply", reply[0].get("msg_type").getAsString());
        assertEquals("ok", reply[2].get("status").getAsString());
        assertEquals(1, reply[2].get("execution_count").getAsInt());
        assertTrue(reply[3].get("microtally_eval_seconds").getAsDouble() >= 0, reply[3].toString());
        List<JsonObject[]> pub = iopubUntilIdle(id);
        // Source: Jupyter messaging protocol 5.3, "Execution results" and "Kernel status" message order
        assertEquals(List.of("status", "execute_input", "stream", "display_data", "execute_result", "status"), types(pub));
        assertEquals("busy", pub.get(0)[2].get("execution_state").getAsString());
        assertEquals("printed x\n", pub.get(2)[2].get("text").getAsString());
        assertEquals("stdout", pub.get(2)[2].get("name").getAsString());
        assertEquals("<b>shown</b>", pub.get(3)[2].getAsJsonObject("data").get("text/html").getAsString());
        assertEquals("d1", pub.get(3)[2].getAsJsonObject("transient").get("display_id").getAsString());
        assertEquals("value of x", pub.get(4)[2].getAsJsonObject("data").get("text/plain").getAsString());
        assertEquals(1, pub.get(4)[2].get("execution_count").getAsInt());
    }

    @Test
    void aFailingCellPublishesAnErrorAndTheNextCellRuns() throws Exception {
        String id = execute("boom");
        JsonObject[] reply = receive(shell);
        assertEquals("error", reply[2].get("status").getAsString());
        assertEquals("java.lang.IllegalStateException", reply[2].get("ename").getAsString());
        assertEquals("boom", reply[2].get("evalue").getAsString());
        assertEquals(2, reply[2].getAsJsonArray("traceback").size());
        List<JsonObject[]> pub = iopubUntilIdle(id);
        assertTrue(types(pub).contains("error"), types(pub).toString());

        execute("after");
        JsonObject[] second = receive(shell);
        assertEquals("ok", second[2].get("status").getAsString());
        assertEquals(2, second[2].get("execution_count").getAsInt());
    }

    @Test
    void interruptOnTheControlChannelStopsARunningCell() throws Exception {
        execute("spin");
        assertTrue(engine.spinning.await(5, TimeUnit.SECONDS));
        send(control, KEY, "interrupt_request", "{}");
        JsonObject[] ir = receive(control);
        assertEquals("interrupt_reply", ir[0].get("msg_type").getAsString());
        JsonObject[] reply = receive(shell);
        assertEquals("error", reply[2].get("status").getAsString());
        assertEquals("Interrupted", reply[2].get("ename").getAsString());
        assertTrue(engine.interrupted);
    }

    @Test
    void anInterruptThatFindsNothingToStopYetIsRepeated() throws Exception {
        execute("deaf-once");
        assertTrue(engine.spinning.await(5, TimeUnit.SECONDS));
        long t0 = System.nanoTime();
        send(control, KEY, "interrupt_request", "{}");
        assertEquals("interrupt_reply", receive(control)[0].get("msg_type").getAsString());
        JsonObject[] reply = receive(shell);
        assertEquals("Interrupted", reply[2].get("ename").getAsString());
        assertTrue(System.nanoTime() - t0 < TimeUnit.SECONDS.toNanos(3), "the repeated interrupt came late");
        assertTrue(engine.interrupts.get() >= 2);
    }

    @Test
    void completeInspectAndIsCompleteUseCodePointCursors() throws Exception {
        // "\uD83D\uDE00al" : the emoji is 1 code point (2 chars); cursor 3 code points = after "al"
        send(shell, KEY, "complete_request", "{\"code\":\"\\uD83D\\uDE00al\",\"cursor_pos\":3}");
        JsonObject[] c = receive(shell);
        assertEquals("complete_reply", c[0].get("msg_type").getAsString());
        assertEquals(2, c[2].getAsJsonArray("matches").size());
        assertEquals(1, c[2].get("cursor_start").getAsInt());
        assertEquals(3, c[2].get("cursor_end").getAsInt());

        send(shell, KEY, "inspect_request", "{\"code\":\"\\uD83D\\uDE00al\",\"cursor_pos\":3,\"detail_level\":0}");
        JsonObject[] i = receive(shell);
        assertTrue(i[2].get("found").getAsBoolean());
        assertEquals("doc at 4", i[2].getAsJsonObject("data").get("text/plain").getAsString());

        send(shell, KEY, "is_complete_request", "{\"code\":\"for (;;) {\"}");
        JsonObject[] k = receive(shell);
        assertEquals("incomplete", k[2].get("status").getAsString());
        assertEquals("    ", k[2].get("indent").getAsString());
    }

    /** Sends the JSON frames as they are, signed with the test key. */
    private void sendRaw(ZMQ.Socket s, List<String> jsonFrames, List<String> extra) throws Exception {
        s.send("<IDS|MSG>", ZMQ.SNDMORE);
        String[] four = jsonFrames.size() >= 4 ? jsonFrames.subList(0, 4).toArray(new String[0]) : jsonFrames.toArray(new String[0]);
        s.send(hmac(KEY, four), jsonFrames.isEmpty() && extra.isEmpty() ? 0 : ZMQ.SNDMORE);
        List<String> rest = new ArrayList<>(jsonFrames);
        rest.addAll(extra);
        for (int i = 0; i < rest.size(); i++) {
            s.send(rest.get(i), i < rest.size() - 1 ? ZMQ.SNDMORE : 0);
        }
    }

    /** Waits for the shell reply whose parent is {@code id}, skipping replies to earlier requests. */
    private JsonObject[] replyTo(String id) throws Exception {
        long end = System.nanoTime() + TimeUnit.SECONDS.toNanos(20);
        while (System.nanoTime() < end) {
            JsonObject[] m = receive(shell);
            if (m != null && m[1].has("msg_id") && m[1].get("msg_id").getAsString().equals(id)) {
                return m;
            }
        }
        return null;
    }


    @Test
    void aSignedMessageWithAnEmptyHeaderIsDroppedAndTheKernelStillExecutes() throws Exception {
        sendRaw(shell, List.of("{}", "{}", "{}", "{\"code\":\"never\"}"), List.of());
        sendRaw(shell, List.of("{\"msg_type\":\"execute_request\"}", "{}", "{}", "{\"code\":\"never\"}"), List.of());
        String id = execute("after");
        JsonObject[] reply = replyTo(id);
        assertNotNull(reply, "no reply after the malformed messages: the request loop died");
        assertEquals("ok", reply[2].get("status").getAsString());
        assertEquals(List.of("after"), engine.ran);
        assertEquals(2, kernel.droppedMalformed());
        assertTrue(logged.stream().anyMatch(r -> r.getMessage().contains("malformed") && r.getMessage().contains("no msg_id")),
                "no log line for the dropped message");
    }

    private static final String[] TYPES = {"kernel_info_request", "execute_request", "complete_request", "inspect_request",
        "is_complete_request", "comm_info_request", "history_request", "interrupt_request", "no_such_request", "", "status"};

    private static String randomJson(java.util.Random rnd, int depth) {
        switch (rnd.nextInt(depth > 2 ? 5 : 8)) {
            case 0: return "null";
            case 1: return Integer.toString(rnd.nextInt(2000) - 1000);
            case 2: return rnd.nextBoolean() ? "true" : "1e309";
            case 3: return "\"" + "x\\u00e9\\ud83d".substring(0, rnd.nextInt(8)) + "\"";
            case 4: return rnd.nextBoolean() ? "{" : "[1,";   // truncated JSON
            case 5: {
                StringBuilder sb = new StringBuilder("[");
                for (int i = rnd.nextInt(3); i > 0; i--) {
                    sb.append(randomJson(rnd, depth + 1)).append(i > 1 ? "," : "");
                }
                return sb.append("]").toString();
            }
            default: {
                String[] keys = {"code", "cursor_pos", "silent", "store_history", "stop_on_error", "msg_id", "msg_type",
                    "user_expressions", "detail_level", "restart", "hist_access_type", "date", "session", "x"};
                StringBuilder sb = new StringBuilder("{");
                for (int i = rnd.nextInt(5); i > 0; i--) {
                    sb.append('"').append(keys[rnd.nextInt(keys.length)]).append("\":").append(randomJson(rnd, depth + 1))
                            .append(i > 1 ? "," : "");
                }
                return sb.append("}").toString();
            }
        }
    }

    private static String randomHeader(java.util.Random rnd) {
        switch (rnd.nextInt(6)) {
            case 0: return "{}";
            case 1: return randomJson(rnd, 0);
            case 2: return "{\"msg_type\":\"" + TYPES[rnd.nextInt(TYPES.length)] + "\"}";
            case 3: return "{\"msg_id\":" + randomJson(rnd, 2) + ",\"msg_type\":" + randomJson(rnd, 2) + "}";
            default: return "{\"msg_id\":\"f" + rnd.nextInt() + "\",\"msg_type\":\"" + TYPES[rnd.nextInt(TYPES.length)]
                    + "\",\"session\":\"fuzz\",\"username\":\"f\",\"version\":\"5.3\""
                    + (rnd.nextBoolean() ? ",\"date\":" + randomJson(rnd, 2) : "") + "}";
        }
    }

    @Test
    @org.junit.jupiter.api.Timeout(value = 60, unit = TimeUnit.SECONDS)
    void fuzzedSignedMessagesOnEveryChannelLeaveTheKernelWorking() throws Exception {
        java.util.Random rnd = new java.util.Random(20261202L);
        ZMQ.Socket stdin = connect(SocketType.DEALER, stdinPort);
        ZMQ.Socket[] channels = {shell, control, stdin};
        for (int i = 0; i < 300; i++) {
            List<String> frames = new ArrayList<>(List.of(randomHeader(rnd),
                    rnd.nextInt(4) == 0 ? randomJson(rnd, 0) : "{}",
                    rnd.nextInt(4) == 0 ? randomJson(rnd, 0) : "{}",
                    randomJson(rnd, 0)));
            int cut = rnd.nextInt(10) == 0 ? rnd.nextInt(4) : 4;   // sometimes too few frames
            List<String> extra = rnd.nextInt(8) == 0 ? List.of("blob", randomJson(rnd, 0)) : List.of();
            sendRaw(channels[rnd.nextInt(channels.length)], frames.subList(0, cut), extra);
            if (rnd.nextInt(20) == 0) {
                hb.send("fuzz-" + i);
                assertEquals("fuzz-" + i, hb.recvStr());
            }
        }
        String id = execute("after");
        JsonObject[] reply = replyTo(id);
        assertNotNull(reply, "no execute_reply after the fuzzed messages");
        assertEquals("ok", reply[2].get("status").getAsString());
        assertTrue(engine.ran.contains("after"), engine.ran.toString());
        String info = send(control, KEY, "kernel_info_request", "{}");
        JsonObject[] ir = null;
        for (int i = 0; i < 400 && ir == null; i++) {
            JsonObject[] m = receive(control);
            assertNotNull(m, "the control channel went quiet");
            ir = m[1].has("msg_id") && m[1].get("msg_id").getAsString().equals(info) ? m : null;
        }
        assertEquals("kernel_info_reply", ir[0].get("msg_type").getAsString());
        assertTrue(kernel.droppedMalformed() > 50, "the fuzz sent few malformed messages: " + kernel.droppedMalformed());
        assertTrue(logged.stream().noneMatch(r -> r.getMessage() != null && r.getMessage().contains("thread failed")));
    }

    @Test
    void anEmptyKeyIsWarnedAboutOrRefused() throws Exception {
        KernelConnectionProperties open = new KernelConnectionProperties("127.0.0.1", freePort(), freePort(), freePort(),
                freePort(), freePort(), "tcp", "", "");
        IllegalArgumentException e = org.junit.jupiter.api.Assertions.assertThrows(IllegalArgumentException.class,
                () -> new Kernel(open, () -> engine, true));
        assertTrue(e.getMessage().contains("empty key"), e.getMessage());
        Kernel unsigned = new Kernel(open, () -> engine, false);
        unsigned.start();
        try {
            assertTrue(logged.stream().anyMatch(r -> r.getMessage().contains("empty key")), "no warning in the log");
            ZMQ.Socket s = connect(SocketType.DEALER, open.getShellPort());
            String id = UUID.randomUUID().toString();
            // Source: Jupyter messaging protocol 5.3, "The Wire Protocol": with an empty key the signature frame is empty
            s.send("<IDS|MSG>", ZMQ.SNDMORE);
            s.send("", ZMQ.SNDMORE);
            s.send("{\"msg_id\":\"" + id + "\",\"msg_type\":\"kernel_info_request\",\"session\":\"t\",\"username\":\"t\",\"version\":\"5.3\"}", ZMQ.SNDMORE);
            s.send("{}", ZMQ.SNDMORE);
            s.send("{}", ZMQ.SNDMORE);
            s.send("{}", 0);
            List<String> frames = new ArrayList<>();
            frames.add(s.recvStr());
            while (s.hasReceiveMore()) {
                frames.add(s.recvStr());
            }
            String banner = JsonParser.parseString(frames.get(frames.indexOf("<IDS|MSG>") + 5)).getAsJsonObject().get("banner").getAsString();
            assertTrue(banner.contains("empty key") && banner.contains("--refuse-unsigned"), banner);
        } finally {
            unsigned.stop();
        }
    }

    @Test
    void heartbeatEchoes() {
        hb.send("ping-42");
        assertEquals("ping-42", hb.recvStr());
    }
}
