package org.microtally.kernel;

import java.io.File;
import java.io.IOException;
import java.io.PrintStream;
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
 * Spark module. So that the kernelspec survives {@code mvn clean}, every class-path entry that is a
 * build output (a path with a {@code target} directory, such as the Spark module's own jar) and the
 * options file are copied into the kernelspec directory ({@value #LIB}/ and {@code jvm.options}, by
 * atomic renames); the kernel jar is the copy in the plain kernelspec beside it. Spark's own jars
 * (about 300 MB) stay where Maven keeps them, in the local Maven repository, which {@code mvn clean}
 * does not touch; deleting that repository needs a re-install.
 */
final class SparkKernelSpec {
    static final String NAME = KernelIdentity.SPARK_KERNEL_NAME;
    static final String DISPLAY_NAME = KernelIdentity.SPARK_DISPLAY_NAME;
    static final String OPTION = "--with-spark";
    static final String CLASSPATH_PROPERTY = org.microtally.notebook.session.KernelIdentity.SPARK_CLASSPATH_PROPERTY;
    static final String OPTIONS_PROPERTY = "microtally.spark.jvmoptions";
    static final String LOG_CONFIG = "-Dlog4j2.configurationFile=classpath:org/microtally/spark/log4j2-quiet.properties";
    /** The folder in the kernelspec directory that holds the copied build outputs. */
    static final String LIB = "lib";

    private SparkKernelSpec() { }

    /** The kernel.json content: this kernel's main class on the jar plus the Spark class path. */
    static Map<String, Object> kernelJson(Path java, Path jar, String sparkClassPath, Path jvmOptions, String heap) {
        List<String> argv = new ArrayList<>();
        argv.add(java.toAbsolutePath().toString());
        argv.add(HeapSize.option(heap));
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
     * Writes the kernelspec into the Jupyter data directory of {@code scope}, copying build outputs
     * (see the class description); prints where.
     *
     * @param jar the kernel jar, normally the copy inside the installed {@code microtally} kernelspec
     * @throws IllegalStateException when the launcher did not provide the Spark class path
     */
    static Path install(KernelSpec.Scope scope, Path prefix, Path jar, PrintStream out, String heap) throws IOException {
        String cp = System.getProperty(CLASSPATH_PROPERTY);
        String options = System.getProperty(OPTIONS_PROPERTY);
        if (cp == null || cp.isBlank() || options == null || !Files.isRegularFile(Path.of(options))) {
            throw new IllegalStateException(OPTION + " needs the Spark module's class path; run it through the launcher "
                    + "(toolkit/bin/microtally install-kernel " + OPTION + "), which builds toolkit/spark and passes it");
        }
        Path java = Path.of(System.getProperty("java.home"), "bin", "java");
        Path dir = KernelSpec.dataDir(scope, prefix).resolve("kernels").resolve(NAME);
        List<String> entries = new ArrayList<>();
        int copied = 0;
        for (String entry : cp.split(File.pathSeparator)) {
            if (entry.isBlank()) {
                continue;
            }
            Path p = Path.of(entry);
            if (isBuildOutput(p)) {
                if (!Files.isRegularFile(p)) {
                    throw new IllegalStateException("the Spark class path names " + p + ", which does not exist; "
                            + "rebuild the Spark module (toolkit/bin/microtally install-kernel " + OPTION + " builds it)");
                }
                Path copy = dir.resolve(LIB).resolve(p.getFileName());
                KernelSpec.copyAtomically(p, copy);
                entries.add(copy.toAbsolutePath().toString());
                copied++;
            } else {
                entries.add(entry);
            }
        }
        Path optionsCopy = dir.resolve("jvm.options");
        KernelSpec.copyAtomically(Path.of(options), optionsCopy);
        KernelSpec.writeJson(dir, kernelJson(java, jar, String.join(File.pathSeparator, entries), optionsCopy, heap));
        out.println("installed kernelspec '" + NAME + "' (" + DISPLAY_NAME + ") in " + dir + " (" + copied
                + " build output(s) copied into it; Spark's jars are used from the local Maven repository)");
        return dir;
    }

    /** True for a path inside a Maven {@code target} directory (deleted by {@code mvn clean}). */
    static boolean isBuildOutput(Path p) {
        for (Path part : p.toAbsolutePath().normalize()) {
            if (part.toString().equals("target")) {
                return true;
            }
        }
        return false;
    }
}
