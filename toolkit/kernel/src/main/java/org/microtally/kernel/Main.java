package org.microtally.kernel;

import io.github.spencerpark.jupyter.kernel.KernelConnectionProperties;
import java.io.IOException;
import java.io.PrintStream;
import java.net.URISyntaxException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import org.microtally.notebook.session.Session;

/**
 * The {@code microtally} command: runs the Jupyter kernel, installs its kernelspec, runs notebooks
 * headless. Exit codes: 0 success, 1 a notebook failed or an operation failed, 2 bad usage.
 */
public final class Main {
    static final String USAGE = String.join("\n",
            "usage: microtally COMMAND [ARGS]",
            "",
            "commands:",
            "  run NOTEBOOK... [--out DIR] [--keep-going] [--cell-timeout SECONDS]",
            "        execute each notebook in a fresh session (no Python needed), write DIR/NAME.ipynb (executed)",
            "        and DIR/NAME.html (default DIR: ./microtally-out); exit 1 naming the first failing cell",
            "  install-kernel [--user | --prefix DIR | --sys-prefix]",
            "        install the Jupyter kernelspec 'microtally' (default --user); uses 'jupyter kernelspec install'",
            "        when jupyter is on the PATH, else writes the kernelspec directory itself",
            "  kernel CONNECTION_FILE",
            "        run the Jupyter kernel (Jupyter starts this itself through the kernelspec)",
            "  --help       this text",
            "  --version    the toolkit version");

    private Main() { }

    public static void main(String[] args) {
        int code;
        try {
            code = run(args, System.out, System.err);
        } catch (UsageException e) {
            System.err.println("microtally: " + e.getMessage());
            System.err.println("run 'microtally --help' for the commands");
            code = 2;
        }
        System.exit(code);
    }

    /** Bad command-line input; the message says what was wrong and what is allowed. */
    static final class UsageException extends RuntimeException {
        private static final long serialVersionUID = 1L;

        UsageException(String message) {
            super(message);
        }
    }

    /** Runs one command; returns the exit code. The kernel command returns when the kernel stops. */
    static int run(String[] args, PrintStream out, PrintStream err) {
        if (args.length == 0) {
            err.println(USAGE);
            return 2;
        }
        List<String> rest = List.of(args).subList(1, args.length);
        switch (args[0]) {
            case "--help", "-h", "help" -> {
                out.println(USAGE);
                return 0;
            }
            case "--version", "version" -> {
                out.println("microtally " + version());
                return 0;
            }
            case "kernel" -> {
                return kernel(rest);
            }
            case "install-kernel" -> {
                return installKernel(rest, out, err);
            }
            case "run" -> {
                return NotebookRun.run(rest, out, err);
            }
            case "warm-up" -> {
                // internal: the run install-kernel records the class data archive from
                try {
                    return ClassArchive.warmUp();
                } catch (java.io.IOException e) {
                    err.println("microtally warm-up failed: " + e.getMessage());
                    return 1;
                }
            }
            default -> throw new UsageException("unknown command '" + args[0]
                    + "'; allowed: run, install-kernel, kernel, --help, --version");
        }
    }

    /** The toolkit version from the jar manifest, or "dev" when run from classes. */
    static String version() {
        String v = Main.class.getPackage().getImplementationVersion();
        return v == null ? "dev" : v;
    }

    private static int kernel(List<String> args) {
        if (args.size() != 1) {
            throw new UsageException("kernel takes exactly one argument, the connection file; got " + args);
        }
        Path file = Path.of(args.get(0));
        String json;
        try {
            json = Files.readString(file, StandardCharsets.UTF_8);
        } catch (IOException e) {
            throw new UsageException("cannot read connection file " + file + ": " + e.getMessage());
        }
        KernelLog.configure(file);
        KernelConnectionProperties props = KernelConnectionProperties.parse(json);
        Kernel kernel = new Kernel(props, Session::open).onShutdown(() -> System.exit(0));
        kernel.start();
        ParentWatch.exitWhenParentDies(kernel);
        try {
            kernel.awaitStop();
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
        }
        return 0;
    }

    private static int installKernel(List<String> args, PrintStream out, PrintStream err) {
        KernelSpec.Scope scope = KernelSpec.Scope.USER;
        Path prefix = null;
        int chosen = 0;
        for (int i = 0; i < args.size(); i++) {
            String a = args.get(i);
            if (a.equals("--user")) {
                scope = KernelSpec.Scope.USER;
                chosen++;
            } else if (a.equals("--sys-prefix")) {
                scope = KernelSpec.Scope.SYS_PREFIX;
                chosen++;
            } else if (a.equals("--prefix") || a.startsWith("--prefix=")) {
                String value = a.startsWith("--prefix=") ? a.substring("--prefix=".length())
                        : (i + 1 < args.size() ? args.get(++i) : null);
                if (value == null || value.isBlank()) {
                    throw new UsageException("--prefix needs a directory, e.g. --prefix /tmp/jupyter-env");
                }
                scope = KernelSpec.Scope.PREFIX;
                prefix = Path.of(value);
                chosen++;
            } else {
                throw new UsageException("install-kernel: unknown option '" + a + "'; allowed: --user, --prefix DIR, --sys-prefix");
            }
        }
        if (chosen > 1) {
            throw new UsageException("install-kernel takes one of --user, --prefix DIR, --sys-prefix; got " + args);
        }
        Optional<Path> jar = ownJar();
        if (jar.isEmpty()) {
            err.println("microtally: install-kernel must run from the shaded jar (toolkit/bin/microtally install-kernel),"
                    + " so that the kernelspec can point at it");
            return 1;
        }
        try {
            KernelSpec.install(scope, prefix, jar.get(), out);
            return 0;
        } catch (IOException | IllegalStateException e) {
            err.println("microtally: install-kernel failed: " + e.getMessage());
            return 1;
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            return 1;
        }
    }

    /** The jar this class was loaded from, if it was loaded from a jar. */
    static Optional<Path> ownJar() {
        try {
            var src = Main.class.getProtectionDomain().getCodeSource();
            if (src == null) {
                return Optional.empty();
            }
            Path p = Path.of(src.getLocation().toURI());
            return Files.isRegularFile(p) && p.toString().endsWith(".jar") ? Optional.of(p.toAbsolutePath()) : Optional.empty();
        } catch (URISyntaxException | SecurityException e) {
            return Optional.empty();
        }
    }

    /** Splits {@code --opt=value} forms; kept for the run command's parser. */
    static List<String> expand(List<String> args) {
        List<String> out = new ArrayList<>();
        for (String a : args) {
            int eq = a.indexOf('=');
            if (a.startsWith("--") && eq > 2) {
                out.add(a.substring(0, eq));
                out.add(a.substring(eq + 1));
            } else {
                out.add(a);
            }
        }
        return out;
    }
}
