package org.microtally.kernel;

import static org.junit.jupiter.api.Assertions.assertEquals;
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
        assertEquals("microtally \u2014 exact counts", spec.get("display_name").getAsString());
        assertEquals("java", spec.get("language").getAsString());
        assertEquals("message", spec.get("interrupt_mode").getAsString());

        Path strict = KernelSpec.write(dir.resolve("strict"), java, jar, null, new KernelSpec.Settings("3g", true));
        JsonArray strictArgv = JsonParser.parseString(Files.readString(strict)).getAsJsonObject().getAsJsonArray("argv");
        assertEquals(List.of("kernel", "--refuse-unsigned", "{connection_file}"),
                strictArgv.asList().subList(strictArgv.size() - 3, strictArgv.size()).stream().map(e -> e.getAsString()).toList());
        // Source: java launcher documentation (JDK 17): -Xmx<size> with a k, m or g suffix sets the maximum heap
        assertEquals("-Xmx3g", strictArgv.get(1).getAsString());
    }

    @Test
    void theInstalledKernelspecOwnsItsJarAndSurvivesDeletingTheBuild(@TempDir Path dir) throws Exception {
        // a stand-in for the shaded jar (the class data archive then cannot be recorded, which install reports)
        Path build = Files.createDirectories(dir.resolve("checkout/toolkit/kernel/target"));
        Path jar = Files.write(build.resolve("microtally.jar"), new byte[] {'P', 'K', 5, 6, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0});
        ByteArrayOutputStream buf = new ByteArrayOutputStream();
        PrintStream out = new PrintStream(buf, true, StandardCharsets.UTF_8);
        Path prefix = dir.resolve("prefix");
        Path installed = KernelSpec.install(KernelSpec.Scope.PREFIX, prefix, jar, out, new KernelSpec.Settings("2g", false));
        // Source: jupyter_core paths documentation: PREFIX/share/jupyter/kernels/NAME
        assertEquals(prefix.toAbsolutePath().resolve("share/jupyter/kernels/microtally"), installed);
        Files.delete(jar);   // what mvn clean does
        Files.delete(build);
        JsonArray argv = JsonParser.parseString(Files.readString(installed.resolve("kernel.json"))).getAsJsonObject().getAsJsonArray("argv");
        List<String> args = argv.asList().stream().map(e -> e.getAsString()).toList();
        String named = args.get(args.indexOf("-jar") + 1);
        assertTrue(Path.of(named).startsWith(installed) && Files.isRegularFile(Path.of(named)), "kernel.json names " + named);
        assertTrue(args.contains("-Xmx2g"), args.toString());
        for (String a : args) {
            if (a.startsWith("-XX:SharedArchiveFile=")) {
                assertTrue(Files.isRegularFile(Path.of(a.substring(a.indexOf('=') + 1))), a);
            }
        }
        // a re-install replaces the copy in place and leaves no temporary files behind
        Path again = Files.write(dir.resolve("other.jar"), new byte[] {'P', 'K', 5, 6, 1, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0, 0});
        KernelSpec.install(KernelSpec.Scope.PREFIX, prefix, again, out, KernelSpec.Settings.DEFAULT);
        assertEquals(1, Files.readAllBytes(installed.resolve(KernelSpec.JAR))[4], "the re-install did not replace the jar copy");
        try (var files = Files.list(installed)) {
            List<String> names = files.map(p -> p.getFileName().toString()).sorted().toList();
            assertTrue(names.stream().noneMatch(n -> n.contains(".tmp-")), names.toString());
        }
        assertTrue(Files.readString(installed.resolve("kernel.json")).contains("-Xmx1g"));
    }

    @Test
    void heapSizesAreCheckedAndBadOnesRefusedAsUsage() {
        // Source: java launcher documentation (JDK 17), -Xmx: a number with k/m/g; a bare number means bytes
        assertEquals("1500m", HeapSize.check("1500M", "--heap"));
        assertEquals("4g", HeapSize.check(" 4g ", "--heap"));
        for (String bad : List.of("", "4", "4gb", "0g", "-1g", "four")) {
            IllegalArgumentException e = org.junit.jupiter.api.Assertions.assertThrows(IllegalArgumentException.class,
                    () -> HeapSize.check(bad, "--heap"));
            assertTrue(e.getMessage().contains("'" + bad + "'") && e.getMessage().contains("4g"), e.getMessage());
        }
        ByteArrayOutputStream buf = new ByteArrayOutputStream();
        PrintStream err = new PrintStream(buf, true, StandardCharsets.UTF_8);
        assertEquals(2, Main.run(new String[] {"install-kernel", "--heap", "12"}, System.out, err));
        assertTrue(buf.toString(StandardCharsets.UTF_8).contains("not a heap size"), buf.toString(StandardCharsets.UTF_8));
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
        ByteArrayOutputStream buf = new ByteArrayOutputStream();
        PrintStream err = new PrintStream(buf, true, StandardCharsets.UTF_8);
        assertEquals(2, Main.run(new String[] {"brew"}, System.out, err));
        String text = buf.toString(StandardCharsets.UTF_8);
        assertTrue(text.contains("brew") && text.contains("install-kernel"), text);
        buf.reset();
        assertEquals(2, Main.run(new String[] {"install-kernel", "--user", "--sys-prefix"}, System.out, err));
        assertTrue(buf.toString(StandardCharsets.UTF_8).contains("mutually exclusive"), buf.toString(StandardCharsets.UTF_8));
        buf.reset();
        assertEquals(2, Main.run(new String[] {"install-kernel", "--prefix"}, System.out, err));
        assertTrue(buf.toString(StandardCharsets.UTF_8).contains("--prefix"), buf.toString(StandardCharsets.UTF_8));
    }

    @Test
    void optionsTakeTheirValueAfterASpaceOrAnEqualsSign() {
        ByteArrayOutputStream buf = new ByteArrayOutputStream();
        PrintStream err = new PrintStream(buf, true, StandardCharsets.UTF_8);
        // both forms parse; from test classes (not the shaded jar) install-kernel then stops with status 1, not a usage error
        assertEquals(1, Main.run(new String[] {"install-kernel", "--prefix=" + System.getProperty("java.io.tmpdir")}, System.out, err));
        assertEquals(1, Main.run(new String[] {"install-kernel", "--prefix", System.getProperty("java.io.tmpdir")}, System.out, err));
        assertTrue(buf.toString(StandardCharsets.UTF_8).contains("must run from the shaded jar"), buf.toString(StandardCharsets.UTF_8));
        buf.reset();
        // the run command shares the parser: --out=DIR is accepted (the missing notebook is then bad input, status 2)
        assertEquals(2, Main.run(new String[] {"run", "--out=" + System.getProperty("java.io.tmpdir"), "no-such.ipynb"}, System.out, err));
        assertTrue(buf.toString(StandardCharsets.UTF_8).contains("no-such.ipynb: not found"), buf.toString(StandardCharsets.UTF_8));
    }

    @Test
    void helpAndVersionPrintAndSucceed() {
        ByteArrayOutputStream buf = new ByteArrayOutputStream();
        PrintStream out = new PrintStream(buf, true, StandardCharsets.UTF_8);
        assertEquals(0, Main.run(new String[] {"--help"}, out, System.err));
        String help = buf.toString(StandardCharsets.UTF_8);
        assertTrue(help.contains("run") && help.contains("install-kernel") && help.contains("kernel"), help);
        buf.reset();
        assertEquals(0, Main.run(new String[] {"run", "--help"}, out, System.err));
        assertTrue(buf.toString(StandardCharsets.UTF_8).contains("--cell-timeout=SECONDS"), buf.toString(StandardCharsets.UTF_8));
        buf.reset();
        assertEquals(0, Main.run(new String[] {"--version"}, out, System.err));
        assertTrue(buf.toString(StandardCharsets.UTF_8).startsWith("microtally "));
    }
}
