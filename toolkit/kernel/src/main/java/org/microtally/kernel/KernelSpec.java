package org.microtally.kernel;

import com.google.gson.GsonBuilder;
import java.io.IOException;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.TimeUnit;
import org.microtally.notebook.session.KernelIdentity;

/**
 * Writes and installs the Jupyter kernelspec {@code microtally}: a directory holding
 * {@code kernel.json} (the Jupyter "Kernel specs" format: argv, display_name, language,
 * interrupt_mode, metadata), its own copy of the shaded jar ({@value #JAR}) and the class data
 * archive recorded for that copy ({@link ClassArchive}). The kernelspec therefore survives
 * {@code mvn clean} and rebuilds of the checkout; re-installing replaces each file by an atomic
 * rename, so a kernel that is running keeps its open jar and one that starts sees either the old or
 * the new files.
 *
 * <p>The argv runs this JVM's own {@code java} executable with {@link #jvmOptions(String)} on the
 * copied jar. The heap settings keep a long notebook session small: a session of 55 cells grows far
 * beyond what is live with the default collector and heap, and stays small with
 * {@code -Xmx1g -XX:+UseSerialGC} (the measured figures and the command that measured them are in
 * {@code org.microtally.notebook.session.Session}'s documentation); SerialGC also starts fastest on a
 * 2-core machine. The heap is
 * settable ({@link HeapSize}: {@code install-kernel --heap SIZE} or {@code MICROTALLY_HEAP}).
 */
final class KernelSpec {
    static final String NAME = KernelIdentity.KERNEL_NAME;
    static final String DISPLAY_NAME = KernelIdentity.DISPLAY_NAME;
    /** The name of the jar copy inside the kernelspec directory. */
    static final String JAR = "microtally.jar";

    /** Where to install, mirroring the three scopes Jupyter knows. */
    enum Scope { USER, PREFIX, SYS_PREFIX }

    /**
     * What the kernel is started with.
     *
     * @param heap           the maximum heap, checked by {@link HeapSize#check}
     * @param refuseUnsigned start the kernel with {@code --refuse-unsigned} (a connection file with an
     *                       empty key is refused)
     */
    record Settings(String heap, boolean refuseUnsigned) {
        static final Settings DEFAULT = new Settings(HeapSize.KERNEL_DEFAULT, false);

        Settings {
            heap = HeapSize.check(heap, "heap");
        }
    }

    private KernelSpec() { }

    /** The JVM options of the kernel with maximum heap {@code heap}. */
    static List<String> jvmOptions(String heap) {
        return List.of(HeapSize.option(heap), "-XX:+UseSerialGC");
    }

    /** The kernel.json content for a kernel run from {@code jar} by the JVM at {@code java}, default settings. */
    static Map<String, Object> kernelJson(Path java, Path jar) {
        return kernelJson(java, jar, null, Settings.DEFAULT);
    }

    /** The kernel.json content, using the class data archive {@code archive} if not null. */
    static Map<String, Object> kernelJson(Path java, Path jar, Path archive, Settings settings) {
        List<String> argv = new ArrayList<>();
        argv.add(java.toAbsolutePath().toString());
        argv.addAll(jvmOptions(settings.heap()));
        if (archive != null) {
            argv.addAll(ClassArchive.jvmOptions(archive));
        }
        argv.add("-jar");
        argv.add(jar.toAbsolutePath().toString());
        argv.add("kernel");
        if (settings.refuseUnsigned()) {
            argv.add("--refuse-unsigned");
        }
        argv.add("{connection_file}");
        Map<String, Object> spec = new LinkedHashMap<>();
        spec.put("argv", argv);
        spec.put("display_name", DISPLAY_NAME);
        spec.put("language", KernelIdentity.LANGUAGE);
        spec.put("interrupt_mode", "message");
        spec.put("env", Map.of());
        spec.put("metadata", Map.of("debugger", false, "microtally_version", Main.version()));
        return spec;
    }

    /** Writes {@code dir/kernel.json} with default settings, creating {@code dir}. */
    static Path write(Path dir, Path java, Path jar) throws IOException {
        return write(dir, java, jar, null, Settings.DEFAULT);
    }

    /** Writes {@code dir/kernel.json} (atomically) using the class data archive {@code archive} (may be null). */
    static Path write(Path dir, Path java, Path jar, Path archive, Settings settings) throws IOException {
        return writeJson(dir, kernelJson(java, jar, archive, settings));
    }

    /** Writes {@code spec} as {@code dir/kernel.json} by an atomic rename, creating {@code dir}. */
    static Path writeJson(Path dir, Map<String, Object> spec) throws IOException {
        Files.createDirectories(dir);
        Path file = dir.resolve("kernel.json");
        String json = new GsonBuilder().setPrettyPrinting().disableHtmlEscaping().create().toJson(spec);
        Path tmp = temporarySibling(file);
        Files.writeString(tmp, json + "\n", StandardCharsets.UTF_8);
        Files.move(tmp, file, StandardCopyOption.REPLACE_EXISTING, StandardCopyOption.ATOMIC_MOVE);
        return file;
    }

    /**
     * Copies {@code source} to {@code target} through a temporary file in the target's directory and
     * an atomic rename (a reader sees the old or the new file, never a part). Nothing is copied when
     * both are the same file.
     */
    static void copyAtomically(Path source, Path target) throws IOException {
        if (Files.exists(target) && Files.isSameFile(source, target)) {
            return;
        }
        Files.createDirectories(target.getParent());
        Path tmp = temporarySibling(target);
        try {
            Files.copy(source, tmp, StandardCopyOption.REPLACE_EXISTING, StandardCopyOption.COPY_ATTRIBUTES);
            Files.move(tmp, target, StandardCopyOption.REPLACE_EXISTING, StandardCopyOption.ATOMIC_MOVE);
        } finally {
            Files.deleteIfExists(tmp);
        }
    }

    private static Path temporarySibling(Path file) {
        return file.resolveSibling("." + file.getFileName() + ".tmp-" + ProcessHandle.current().pid());
    }

    /**
     * Installs the kernelspec into the Jupyter data directory of the scope ({@link #dataDir}): copies
     * the jar, records the class data archive for the copy, then writes kernel.json pointing at both.
     * Prints what it did.
     *
     * @return the installed kernelspec directory
     */
    static Path install(Scope scope, Path prefix, Path jar, PrintStream out, Settings settings) throws IOException {
        Path java = Path.of(System.getProperty("java.home"), "bin", "java");
        Path target = dataDir(scope, prefix).resolve("kernels").resolve(NAME);
        Path installedJar = target.resolve(JAR);
        copyAtomically(jar, installedJar);
        out.println("copied the toolkit jar to " + installedJar + " (" + Files.size(installedJar) / (1 << 20)
                + " MiB; the kernelspec no longer depends on " + jar.getParent() + ")");
        out.println("recording the kernel's class data archive (one warm-up run, a few seconds)...");
        Path archive = ClassArchive.create(java, installedJar, settings.heap(), out).orElse(null);
        write(target, java, installedJar, archive, settings);
        out.println("installed kernelspec '" + NAME + "' (" + DISPLAY_NAME + ") in " + target);
        out.println("  runs: " + String.join(" ", argv(java, installedJar, archive, settings)));
        return target;
    }

    @SuppressWarnings("unchecked")
    private static List<String> argv(Path java, Path jar, Path archive, Settings settings) {
        return (List<String>) kernelJson(java, jar, archive, settings).get("argv");
    }

    /**
     * The Jupyter data directory of a scope: {@code PREFIX/share/jupyter}; for the user
     * {@code $JUPYTER_DATA_DIR}, else {@code ~/Library/Jupyter} on macOS, {@code %APPDATA%\jupyter}
     * on Windows, {@code $XDG_DATA_HOME/jupyter} or {@code ~/.local/share/jupyter} elsewhere
     * (the rules of jupyter_core's paths module).
     */
    static Path dataDir(Scope scope, Path prefix) {
        switch (scope) {
            case PREFIX:
                return prefix.toAbsolutePath().resolve("share").resolve("jupyter");
            case SYS_PREFIX:
                String sys = pythonSysPrefix();
                if (sys == null) {
                    throw new IllegalStateException("--sys-prefix needs python3 on the PATH to find sys.prefix; "
                            + "use --user or --prefix DIR instead");
                }
                return Path.of(sys, "share", "jupyter");
            default:
                String env = System.getenv("JUPYTER_DATA_DIR");
                if (env != null && !env.isBlank()) {
                    return Path.of(env);
                }
                String os = System.getProperty("os.name", "").toLowerCase(Locale.ROOT);
                Path home = Path.of(System.getProperty("user.home"));
                if (os.contains("mac")) {
                    return home.resolve("Library").resolve("Jupyter");
                }
                if (os.contains("win")) {
                    String appdata = System.getenv("APPDATA");
                    return appdata != null ? Path.of(appdata, "jupyter") : home.resolve("AppData").resolve("Roaming").resolve("jupyter");
                }
                String xdg = System.getenv("XDG_DATA_HOME");
                return (xdg != null && !xdg.isBlank() ? Path.of(xdg) : home.resolve(".local").resolve("share")).resolve("jupyter");
        }
    }

    private static String pythonSysPrefix() {
        Path py = onPath("python3");
        if (py == null) {
            return null;
        }
        try {
            Process p = new ProcessBuilder(py.toString(), "-c", "import sys; print(sys.prefix)").redirectErrorStream(true).start();
            String s = new String(p.getInputStream().readAllBytes(), StandardCharsets.UTF_8).strip();
            return p.waitFor(20, TimeUnit.SECONDS) && p.exitValue() == 0 ? s : null;
        } catch (IOException e) {
            return null;
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            return null;
        }
    }

    /** The executable {@code name} on the PATH, or null. */
    static Path onPath(String name) {
        String path = System.getenv("PATH");
        if (path == null) {
            return null;
        }
        for (String dir : path.split(java.io.File.pathSeparator)) {
            if (dir.isEmpty()) {
                continue;
            }
            Path p = Path.of(dir, name);
            if (Files.isRegularFile(p) && Files.isExecutable(p)) {
                return p;
            }
        }
        return null;
    }
}
