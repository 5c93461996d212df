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
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class SparkKernelSpecTest {

    @Test
    void kernelJsonPutsTheSparkClassPathBehindTheKernelJar(@TempDir Path dir) {
        Path jar = dir.resolve("microtally.jar");
        Path options = dir.resolve("jvm.options");
        Map<String, Object> spec = SparkKernelSpec.kernelJson(Path.of("/opt/jdk17/bin/java"), jar, "/a/spark.jar:/b/x.jar", options, "2g");
        JsonObject json = JsonParser.parseString(new com.google.gson.Gson().toJson(spec)).getAsJsonObject();
        JsonArray argv = json.getAsJsonArray("argv");
        List<String> args = argv.asList().stream().map(e -> e.getAsString()).toList();
        // Source: Jupyter client documentation, "Kernel specs": argv ending in {connection_file}, display_name,
        // language, interrupt_mode; java launcher documentation (JDK 17): @argfiles and -cp before the main class
        assertEquals("{connection_file}", args.get(args.size() - 1));
        assertTrue(args.contains("@" + options.toAbsolutePath()), args.toString());
        int cp = args.indexOf("-cp");
        assertEquals(jar.toAbsolutePath() + ":/a/spark.jar:/b/x.jar", args.get(cp + 1));
        assertEquals(Main.class.getName(), args.get(cp + 2));
        assertEquals("kernel", args.get(cp + 3));
        assertEquals("message", json.get("interrupt_mode").getAsString());
        assertEquals("microtally \u2014 exact counts on Spark", json.get("display_name").getAsString());
    }

    @Test
    void installWritesTheSecondKernelspecIntoThePrefixOrRefusesWithoutTheClassPath(@TempDir Path dir) throws Exception {
        ByteArrayOutputStream buf = new ByteArrayOutputStream();
        PrintStream out = new PrintStream(buf, true, StandardCharsets.UTF_8);
        System.clearProperty(SparkKernelSpec.CLASSPATH_PROPERTY);
        IllegalStateException refused = assertThrows(IllegalStateException.class,
                () -> SparkKernelSpec.install(KernelSpec.Scope.PREFIX, dir, dir.resolve("microtally.jar"), out, "2g"));
        assertTrue(refused.getMessage().contains("--with-spark"), refused.getMessage());

        Path options = Files.writeString(dir.resolve("jvm.options"), "--add-opens=java.base/java.nio=ALL-UNNAMED\n");
        Path module = Files.createDirectories(dir.resolve("checkout/toolkit/spark/target")).resolve("microtally-spark.jar");
        Files.writeString(module, "module");
        System.setProperty(SparkKernelSpec.CLASSPATH_PROPERTY, module + ":/m2/spark-core.jar");
        System.setProperty(SparkKernelSpec.OPTIONS_PROPERTY, options.toString());
        try {
            Path installed = SparkKernelSpec.install(KernelSpec.Scope.PREFIX, dir, dir.resolve("microtally.jar"), out, "3g");
            // Source: jupyter_core paths documentation: PREFIX/share/jupyter/kernels/NAME for a prefix install
            assertEquals(dir.toAbsolutePath().resolve("share/jupyter/kernels/microtally-spark"), installed);
            Files.delete(module);   // what mvn clean does to the Spark module's jar
            Files.delete(options);
            List<String> argv = JsonParser.parseString(Files.readString(installed.resolve("kernel.json"))).getAsJsonObject()
                    .getAsJsonArray("argv").asList().stream().map(e -> e.getAsString()).toList();
            String cp = argv.get(argv.indexOf("-cp") + 1);
            Path copy = installed.resolve("lib/microtally-spark.jar");
            assertEquals(dir.resolve("microtally.jar").toAbsolutePath() + ":" + copy + ":/m2/spark-core.jar", cp);
            assertEquals("module", Files.readString(copy));
            assertTrue(argv.contains("@" + installed.resolve("jvm.options")) && Files.isRegularFile(installed.resolve("jvm.options")),
                    argv.toString());
            assertTrue(argv.contains("-Xmx3g"), argv.toString());
        } finally {
            System.clearProperty(SparkKernelSpec.CLASSPATH_PROPERTY);
            System.clearProperty(SparkKernelSpec.OPTIONS_PROPERTY);
        }
    }
}
