package org.microtally.kernel;

import com.google.gson.GsonBuilder;
import java.io.IOException;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.microtally.notebook.session.KernelIdentity;
import java.util.concurrent.TimeUnit;

/**
 * Writes and installs the Jupyter kernelspec {@code microtally}: a directory holding
 * {@code kernel.json} (the Jupyter "Kernel specs" format: argv, display_name, language,
 * interrupt_mode, metadata).
 *
 * <p>The argv runs this JVM's own {@code java} executable with {@link #JVM_OPTIONS} on the shaded
 * jar. The heap settings keep a long notebook session small: measured for issue 4, a session of 55
 * cells grew to about 1.8 GB with the default collector and heap, and stayed near 470 MB with
 * {@code -Xmx1g -XX:+UseSerialGC}; SerialGC also starts fastest on a 2-core machine.
 */
final class KernelSpec {
    static final String NAME = KernelIdentity.KERNEL_NAME;
    static final String DISPLAY_NAME = KernelIdentity.DISPLAY_NAME;
    static final List<String> JVM_OPTIONS = List.of("-Xmx1g", "-XX:+UseSerialGC");

    /** Where to install, mirroring the three scopes Jupyter knows. */
    enum Scope { USER, PREFIX, SYS_PREFIX }

    private KernelSpec() { }

    /** The kernel.json content for a kernel run from {@code jar} by the JVM at {@code java}. */
    static Map<String, Object> kernelJson(Path java, Path jar) {
        return kernelJson(java, jar, null);
    }

    /** As {@link #kernelJson(Path, Path)}, using the class data archive {@code archive} if not null. */
    static Map<String, Object> kernelJson(Path java, Path jar, Path archive) {
        return kernelJson(java, jar, archive, false);
    }

    /**
     * As {@link #kernelJson(Path, Path, Path)}; with {@code refuseUnsigned} the kernel is started with
     * {@code --refuse-unsigned} (a connection file with an empty key is refused).
     */
    static Map<String, Object> kernelJson(Path java, Path jar, Path archive, boolean refuseUnsigned) {
        List<String> argv = new ArrayList<>();
        argv.add(java.toAbsolutePath().toString());
        argv.addAll(JVM_OPTIONS);
        if (archive != null) {
            argv.addAll(ClassArchive.jvmOptions(archive));
        }
        argv.add("-jar");
        argv.add(jar.toAbsolutePath().toString());
        argv.add("kernel");
        if (refuseUnsigned) {
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

    @SuppressWarnings("unchecked")
    private static List<String> argv(Path java, Path jar, Path archive, boolean refuseUnsigned) {
        return (List<String>) kernelJson(java, jar, archive, refuseUnsigned).get("argv");
    }

    /** Writes {@code dir/kernel.json}, creating {@code dir}. */
    static Path write(Path dir, Path java, Path jar) throws IOException {
        return write(dir, java, jar, null);
    }

    /** Writes {@code dir/kernel.json} using the class data archive {@code archive} (may be null). */
    static Path write(Path dir, Path java, Path jar, Path archive) throws IOException {
        return write(dir, java, jar, archive, false);
    }

    /** As {@link #write(Path, Path, Path, Path)}, with the kernel's {@code --refuse-unsigned} when asked. */
    static Path write(Path dir, Path java, Path jar, Path archive, boolean refuseUnsigned) throws IOException {
        Files.createDirectories(dir);
        Path file = dir.resolve("kernel.json");
        String json = new GsonBuilder().setPrettyPrinting().disableHtmlEscaping().create()
                .toJson(kernelJson(java, jar, archive, refuseUnsigned));
        Files.writeString(file, json + "\n", StandardCharsets.UTF_8);
        return file;
    }

    /**
     * Installs the kernelspec: through {@code jupyter kernelspec install} when {@code jupyter} is on
     * the PATH, else by writing it into the standard data directory of the scope. Prints what it did.
     *
     * @return the installed kernelspec directory
     */
    static Path install(Scope scope, Path prefix, Path jar, PrintStream out) throws IOException, InterruptedException {
        return install(scope, prefix, jar, out, false);
    }

    /** As {@link #install(Scope, Path, Path, PrintStream)}; {@code refuseUnsigned} adds the kernel's {@code --refuse-unsigned}. */
    static Path install(Scope scope, Path prefix, Path jar, PrintStream out, boolean refuseUnsigned)
            throws IOException, InterruptedException {
        Path java = Path.of(System.getProperty("java.home"), "bin", "java");
        Path staging = Files.createTempDirectory("microtally-kernelspec");
        Path specDir = staging.resolve(NAME);
        try {
            out.println("recording the kernel's class data archive (one warm-up run, a few seconds)...");
            Path archive = ClassArchive.create(java, jar, out).orElse(null);
            write(specDir, java, jar, archive, refuseUnsigned);
            Path jupyter = onPath("jupyter");
            if (jupyter != null) {
                List<String> cmd = new ArrayList<>(List.of(jupyter.toString(), "kernelspec", "install", "--name", NAME));
                switch (scope) {
                    case USER -> cmd.add("--user");
                    case PREFIX -> cmd.add("--prefix=" + prefix.toAbsolutePath());
                    case SYS_PREFIX -> cmd.add("--sys-prefix");
                }
                cmd.add(specDir.toString());
                Process p = new ProcessBuilder(cmd).redirectErrorStream(true).start();
                String log = new String(p.getInputStream().readAllBytes(), StandardCharsets.UTF_8);
                if (!p.waitFor(60, TimeUnit.SECONDS) || p.exitValue() != 0) {
                    throw new IOException("jupyter kernelspec install failed:\n" + log.strip());
                }
                Path installed = installedDir(log, scope, prefix);
                out.println("installed kernelspec '" + NAME + "' (" + DISPLAY_NAME + ") with: " + String.join(" ", cmd));
                out.println("  location: " + installed);
                out.println("  runs: " + String.join(" ", argv(java, jar, archive, refuseUnsigned)));
                return installed;
            }
            Path target = dataDir(scope, prefix).resolve("kernels").resolve(NAME);
            write(target, java, jar, archive, refuseUnsigned);
            out.println("jupyter is not on the PATH: wrote kernelspec '" + NAME + "' (" + DISPLAY_NAME + ") directly to " + target);
            out.println("  runs: " + String.join(" ", argv(java, jar, archive, refuseUnsigned)));
            return target;
        } finally {
            deleteTree(staging);
        }
    }

    /** Jupyter prints "Installed kernelspec NAME in DIR"; fall back to the data directory rule. */
    private static Path installedDir(String log, Scope scope, Path prefix) {
        for (String line : log.split("\\R")) {
            int i = line.indexOf(" in /");
            if (line.contains("Installed kernelspec") && i > 0) {
                return Path.of(line.substring(i + 4).strip());
            }
        }
        return dataDir(scope, prefix).resolve("kernels").resolve(NAME);
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

    private static void deleteTree(Path root) {
        try (var walk = Files.walk(root)) {
            walk.sorted(java.util.Comparator.reverseOrder()).forEach(p -> p.toFile().delete());
        } catch (IOException e) {
            // a leftover temp directory is harmless
        }
    }
}
