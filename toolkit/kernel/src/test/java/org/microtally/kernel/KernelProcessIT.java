package org.microtally.kernel;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.net.ServerSocket;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Optional;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Test;

/**
 * The kernel as a process, from the shaded jar, without Jupyter: it must exit when its parent
 * dies, and keep its diagnostics out of stderr (they go to the log file beside the connection file).
 */
class KernelProcessIT {
    private static final Path JAR = Path.of(System.getProperty("microtally.jar", "target/microtally.jar")).toAbsolutePath();
    private static final Path WORK = Path.of(System.getProperty("microtally.itdir", "target/it")).toAbsolutePath();

    private static int freePort() throws IOException {
        try (ServerSocket s = new ServerSocket(0)) {
            return s.getLocalPort();
        }
    }

    @Test
    void theKernelExitsWhenItsParentDiesAndWritesNothingToStderr() throws Exception {
        Path dir = Files.createDirectories(WORK.resolve("orphan-" + System.nanoTime()));
        Path conn = dir.resolve("kernel-orphan.json");
        Files.writeString(conn, "{\"ip\":\"127.0.0.1\",\"transport\":\"tcp\",\"signature_scheme\":\"hmac-sha256\","
                + "\"key\":\"orphan-test-key\",\"shell_port\":" + freePort() + ",\"iopub_port\":" + freePort()
                + ",\"stdin_port\":" + freePort() + ",\"control_port\":" + freePort() + ",\"hb_port\":" + freePort() + "}");
        Path stderr = dir.resolve("kernel.stderr");
        String java = ExternalTools.javaExe();
        // The shell is the kernel's parent: it starts the kernel in the background, prints its pid,
        // waits 4 s and exits, orphaning the kernel.
        String script = "'" + java + "' -Xmx256m -XX:+UseSerialGC -jar '" + JAR + "' kernel '" + conn + "' 2>'" + stderr
                + "' >/dev/null & echo $!; sleep 4";
        Process parent = new ProcessBuilder("/bin/sh", "-c", script).redirectErrorStream(true).start();
        String first = new java.io.BufferedReader(new java.io.InputStreamReader(parent.getInputStream(),
                StandardCharsets.US_ASCII)).readLine();
        long kernelPid = Long.parseLong(first.strip());
        Optional<ProcessHandle> kernel = ProcessHandle.of(kernelPid);
        assertTrue(kernel.isPresent(), "kernel process not found");
        Thread.sleep(2500);
        assertTrue(kernel.get().isAlive(), "the kernel died while its parent was still alive");
        assertTrue(parent.waitFor(20, TimeUnit.SECONDS));
        long deadline = System.nanoTime() + TimeUnit.SECONDS.toNanos(15);
        while (kernel.get().isAlive() && System.nanoTime() < deadline) {
            Thread.sleep(100);
        }
        boolean orphanAlive = kernel.get().isAlive();
        if (orphanAlive) {
            kernel.get().destroyForcibly();
        }
        assertFalse(orphanAlive, "the kernel outlived its parent by 15 s");
        String err = Files.readString(stderr);
        // common practice, no source: java.util.logging's default ConsoleHandler writes
        // "INFO: ..." / "WARNING: ..." lines to stderr; none must appear.
        assertFalse(err.contains("INFO:") || err.contains("WARNING:") || err.contains("SEVERE:"), "kernel stderr: " + err);
        Path log = dir.resolve("microtally-kernel.0.log");
        assertTrue(Files.isRegularFile(log), "no kernel log beside the connection file");
        List<String> lines = Files.readAllLines(log);
        assertTrue(lines.stream().anyMatch(l -> l.contains("parent process") && l.contains("ended")), String.join("\n", lines));
        assertEquals(List.of(), List.of(err.lines().filter(l -> !l.isBlank()).toArray()), "kernel wrote to stderr");
    }
}
