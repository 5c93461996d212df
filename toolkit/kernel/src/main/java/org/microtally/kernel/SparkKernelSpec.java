package org.microtally.kernel;

import com.google.gson.GsonBuilder;
import java.io.File;
import java.io.IOException;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.microtally.notebook.session.KernelIdentity;

/**
 * The second kernelspec, {@code microtally-spark}: the same kernel with the Spark module
 * ({@code toolkit/spark}) and Spark's jars on its class path, for notebooks that run distributed
 * computations (their metadata names this kernelspec). Installed by {@code install-kernel --with-spark}
 * next to the plain {@code microtally} kernelspec, written straight into the scope's Jupyter data
 * directory.
 *
 * <p>The class path and the Spark JVM options file come from the system properties
 * {@value #CLASSPATH_PROPERTY} and {@value #OPTIONS_PROPERTY}, which the launcher
 * ({@code toolkit/bin/microtally}, through {@code toolkit/spark/bin/java-args}) sets after building the
 * Spark module; the kernelspec records them as absolute paths.
 */
final class SparkKernelSpec {
    static final String NAME = KernelIdentity.SPARK_KERNEL_NAME;
    static final String DISPLAY_NAME = KernelIdentity.SPARK_DISPLAY_NAME;
    static final String OPTION = "--with-spark";
    static final String CLASSPATH_PROPERTY = "microtally.spark.classpath";
    static final String OPTIONS_PROPERTY = "microtally.spark.jvmoptions";
    static final String LOG_CONFIG = "-Dlog4j2.configurationFile=classpath:org/microtally/spark/log4j2-quiet.properties";

    private SparkKernelSpec() { }

    /** The kernel.json content: this kernel's main class on the jar plus the Spark class path. */
    static Map<String, Object> kernelJson(Path java, Path jar, String sparkClassPath, Path jvmOptions) {
        List<String> argv = new ArrayList<>();
        argv.add(java.toAbsolutePath().toString());
        argv.add("-Xmx2g");
        argv.add("-XX:+UseSerialGC");
        argv.add("@" + jvmOptions.toAbsolutePath());
        argv.add(LOG_CONFIG);
        argv.add("-cp");
        argv.add(jar.toAbsolutePath() + File.pathSeparator + sparkClassPath);
        argv.add(Main.class.getName());
        argv.add("kernel");
        argv.add("{connection_file}");
        // the plain kernelspec's fields, with this argv, name and environment
        Map<String, Object> spec = new LinkedHashMap<>(KernelSpec.kernelJson(java, jar));
        spec.put("argv", argv);
        spec.put("display_name", DISPLAY_NAME);
        spec.put("env", Map.of("SPARK_LOCAL_IP", "127.0.0.1"));
        return spec;
    }

    /**
     * Writes the kernelspec into the Jupyter data directory of {@code scope}; prints where.
     *
     * @throws IllegalStateException when the launcher did not provide the Spark class path
     */
    static Path install(KernelSpec.Scope scope, Path prefix, Path jar, PrintStream out) throws IOException {
        String cp = System.getProperty(CLASSPATH_PROPERTY);
        String options = System.getProperty(OPTIONS_PROPERTY);
        if (cp == null || cp.isBlank() || options == null || !Files.isRegularFile(Path.of(options))) {
            throw new IllegalStateException(OPTION + " needs the Spark module's class path; run it through the launcher "
                    + "(toolkit/bin/microtally install-kernel " + OPTION + "), which builds toolkit/spark and passes it");
        }
        Path java = Path.of(System.getProperty("java.home"), "bin", "java");
        Path dir = KernelSpec.dataDir(scope, prefix).resolve("kernels").resolve(NAME);
        Files.createDirectories(dir);
        String json = new GsonBuilder().setPrettyPrinting().disableHtmlEscaping().create()
                .toJson(kernelJson(java, jar, cp, Path.of(options)));
        Files.writeString(dir.resolve("kernel.json"), json + "\n", StandardCharsets.UTF_8);
        out.println("installed kernelspec '" + NAME + "' (" + DISPLAY_NAME + ") in " + dir);
        return dir;
    }
}
