package org.microtally.kernel;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.google.gson.JsonArray;
import com.google.gson.JsonObject;
import com.google.gson.JsonParser;
import java.io.ByteArrayOutputStream;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class KernelSpecTest {

    @Test
    void kernelJsonFollowsTheKernelspecFormat(@TempDir Path dir) throws Exception {
        Path jar = dir.resolve("microtally.jar");
        Path java = Path.of("/opt/jdk17/bin/java");
        Path file = KernelSpec.write(dir.resolve("microtally"), java, jar);
        JsonObject spec = JsonParser.parseString(Files.readString(file)).getAsJsonObject();
        // Source: Jupyter client documentation, "Kernel specs": argv (with {connection_file}),
        // display_name, language, interrupt_mode "signal" or "message"
        JsonArray argv = spec.getAsJsonArray("argv");
        assertEquals("/opt/jdk17/bin/java", argv.get(0).getAsString());
        assertEquals(List.of("-Xmx1g", "-XX:+UseSerialGC", "-jar", jar.toAbsolutePath().toString(), "kernel", "{connection_file}"),
                argv.asList().subList(1, argv.size()).stream().map(e -> e.getAsString()).toList());
        assertEquals("Java 17 (microtally)", spec.get("display_name").getAsString());
        assertEquals("java", spec.get("language").getAsString());
        assertEquals("message", spec.get("interrupt_mode").getAsString());
    }

    @Test
    void dataDirectoriesFollowJupyterRules(@TempDir Path dir) {
        // Source: jupyter_core paths documentation: PREFIX/share/jupyter for a prefix install
        assertEquals(dir.toAbsolutePath().resolve("share/jupyter"), KernelSpec.dataDir(KernelSpec.Scope.PREFIX, dir));
    }

    @Test
    void addressesFollowTheConnectionFileTransport() {
        // Source: Jupyter client documentation, "Connection files": tcp uses ip:port; ipc uses ip-port as a path
        assertEquals("tcp://127.0.0.1:5555", KernelWire.address("tcp", "127.0.0.1", 5555));
        assertEquals("ipc:///tmp/kernel-1-5555", KernelWire.address("ipc", "/tmp/kernel-1", 5555));
    }

    @Test
    void usageErrorsNameTheBadInputAndTheChoices() {
        Main.UsageException e = assertThrows(Main.UsageException.class,
                () -> Main.run(new String[] {"brew"}, System.out, System.err));
        assertTrue(e.getMessage().contains("brew") && e.getMessage().contains("install-kernel"), e.getMessage());
        Main.UsageException twoScopes = assertThrows(Main.UsageException.class,
                () -> Main.run(new String[] {"install-kernel", "--user", "--sys-prefix"}, System.out, System.err));
        assertTrue(twoScopes.getMessage().contains("one of"), twoScopes.getMessage());
    }

    @Test
    void helpAndVersionPrintAndSucceed() {
        ByteArrayOutputStream buf = new ByteArrayOutputStream();
        PrintStream out = new PrintStream(buf, true, StandardCharsets.UTF_8);
        assertEquals(0, Main.run(new String[] {"--help"}, out, System.err));
        assertTrue(buf.toString(StandardCharsets.UTF_8).contains("run NOTEBOOK..."));
        buf.reset();
        assertEquals(0, Main.run(new String[] {"--version"}, out, System.err));
        assertTrue(buf.toString(StandardCharsets.UTF_8).startsWith("microtally "));
    }
}
