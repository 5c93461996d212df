package org.microtally.kernel;

import io.github.spencerpark.jupyter.kernel.KernelConnectionProperties;
import io.github.spencerpark.jupyter.messages.Header;
import io.github.spencerpark.jupyter.messages.Message;
import io.github.spencerpark.jupyter.messages.MessageType;
import io.github.spencerpark.jupyter.messages.request.ExecuteRequest;
import io.github.spencerpark.jupyter.messages.request.KernelInfoRequest;
import java.io.IOException;
import java.io.PrintStream;
import java.net.ServerSocket;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.UUID;
import java.util.concurrent.TimeUnit;
import org.microtally.notebook.session.Session;
import org.zeromq.SocketType;
import org.zeromq.ZContext;
import org.zeromq.ZMQ;

/**
 * An application class-data archive for faster kernel start (JDK "AppCDS", dynamic archiving,
 * JEP 350): the JVM maps the already parsed and verified classes of the kernel, ZeroMQ, Gson and
 * JShell from {@code microtally.jsa} beside the jar instead of loading them from the jar.
 *
 * <p>{@code install-kernel} creates it by running the kernel once with
 * {@code -XX:ArchiveClassesAtExit} through a warm-up (a loopback client sends kernel_info and
 * runs one cell), then points the kernelspec at it. If the jar is rebuilt the archive no longer
 * matches; the JVM then ignores it (its warning is switched off with {@code -Xlog:cds*=off}) and
 * the kernel starts as fast as without one. Re-run {@code install-kernel} to refresh it.
 */
final class ClassArchive {
    static final String FILE = "microtally.jsa";

    private ClassArchive() { }

    /** Where the archive for {@code jar} lives. */
    static Path pathFor(Path jar) {
        return jar.toAbsolutePath().resolveSibling(FILE);
    }

    /** The JVM options that use {@code archive}. */
    static List<String> jvmOptions(Path archive) {
        return List.of("-XX:SharedArchiveFile=" + archive.toAbsolutePath(), "-Xlog:cds*=off");
    }

    /**
     * Creates (or replaces, by an atomic rename) the archive for {@code jar}, recorded with the kernel's
     * options for maximum heap {@code heap}; returns it, or empty when the JVM could not
     * make one (the kernel then runs without).
     */
    static Optional<Path> create(Path java, Path jar, String heap, PrintStream out) {
        Path target = pathFor(jar);
        Path tmp = target.resolveSibling(FILE + ".tmp-" + ProcessHandle.current().pid());
        List<String> cmd = new ArrayList<>(List.of(java.toString(), "-XX:ArchiveClassesAtExit=" + tmp));
        cmd.addAll(KernelSpec.jvmOptions(heap));
        cmd.addAll(List.of("-Xlog:cds*=off", "-jar", jar.toString(), "warm-up"));
        try {
            Process p = new ProcessBuilder(cmd).redirectErrorStream(true).start();
            String log = new String(p.getInputStream().readAllBytes(), StandardCharsets.UTF_8);
            if (!p.waitFor(180, TimeUnit.SECONDS) || p.exitValue() != 0 || !Files.isRegularFile(tmp)) {
                p.destroyForcibly();
                out.println("  class data archive: not created (the kernel works without it): " + log.strip());
                Files.deleteIfExists(tmp);
                return Optional.empty();
            }
            Files.move(tmp, target, StandardCopyOption.REPLACE_EXISTING, StandardCopyOption.ATOMIC_MOVE);
            out.println("  class data archive: " + target + " (" + Files.size(target) / (1 << 20) + " MiB; faster kernel start)");
            return Optional.of(target);
        } catch (IOException e) {
            out.println("  class data archive: not created (" + e.getMessage() + "); the kernel works without it");
            return Optional.empty();
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            return Optional.empty();
        }
    }

    private static int freePort() throws IOException {
        try (ServerSocket s = new ServerSocket(0)) {
            return s.getLocalPort();
        }
    }

    /**
     * The warm-up the archive is recorded from: a kernel on loopback ports with the real engine,
     * and a client in this process that asks kernel_info and runs one cell. Returns 0 on success.
     */
    static int warmUp() throws IOException {
        String key = UUID.randomUUID().toString();
        KernelConnectionProperties props = new KernelConnectionProperties("127.0.0.1", freePort(), freePort(),
                freePort(), freePort(), freePort(), "tcp", "hmac-sha256", key);
        Kernel kernel = new Kernel(props, Session::open);
        kernel.start();
        WireCodec codec = new WireCodec("hmac-sha256", key);
        try (ZContext ctx = new ZContext()) {
            ZMQ.Socket shell = ctx.createSocket(SocketType.DEALER);
            shell.setLinger(0);
            shell.setReceiveTimeOut(120_000);
            shell.connect(KernelWire.address("tcp", "127.0.0.1", props.getShellPort()));
            boolean ok = ask(shell, codec, MessageType.KERNEL_INFO_REQUEST, new KernelInfoRequest(), "kernel_info_reply")
                    && ask(shell, codec, MessageType.EXECUTE_REQUEST,
                    new ExecuteRequest("int quanta = 100;\nquanta * 2", false, true, Map.of(), false, true), "execute_reply");
            return ok ? 0 : 1;
        } finally {
            kernel.stop();
        }
    }

    private static <T> boolean ask(ZMQ.Socket shell, WireCodec codec, MessageType<T> type, T content, String replyType) {
        Message<T> m = new Message<>(List.of(), new Header<>("warm-up", type), null, new LinkedHashMap<>(), content, null);
        List<byte[]> frames = codec.encode(m);
        for (int i = 0; i < frames.size(); i++) {
            shell.send(frames.get(i), i < frames.size() - 1 ? ZMQ.SNDMORE : 0);
        }
        List<byte[]> reply = new ArrayList<>();
        byte[] f = shell.recv(0);
        if (f == null) {
            return false;
        }
        reply.add(f);
        while (shell.hasReceiveMore()) {
            reply.add(shell.recv(0));
        }
        try {
            return WireCodec.typeName(codec.decode(reply)).equals(replyType);
        } catch (WireCodec.BadSignatureException | WireCodec.MalformedMessageException e) {
            return false;
        }
    }
}
