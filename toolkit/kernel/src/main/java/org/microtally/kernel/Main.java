package org.microtally.kernel;

import io.github.spencerpark.jupyter.kernel.KernelConnectionProperties;
import java.io.IOException;
import java.io.PrintStream;
import java.net.URISyntaxException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Optional;
import java.util.concurrent.Callable;
import org.microtally.notebook.run.Cli;
import org.microtally.notebook.run.RunCommand;
import org.microtally.notebook.session.Session;
import picocli.CommandLine;
import picocli.CommandLine.ArgGroup;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

/**
 * The {@code microtally} command: runs the Jupyter kernel, installs its kernelspec, runs notebooks
 * headless. One parser (picocli, configured by {@link Cli}) for every command, with generated help
 * ({@code microtally --help}, {@code microtally COMMAND --help}). Exit codes: 0 success, 1 a notebook
 * failed or an operation failed, 2 bad usage or input.
 */
@Command(name = "microtally", mixinStandardHelpOptions = true, versionProvider = Main.Version.class,
        description = "Exact statistical mechanics of finite systems in Java 17 notebooks.",
        subcommands = {RunCommand.class, org.microtally.notebook.run.ConfirmCommand.class, Main.InstallKernel.class, Main.KernelCommand.class, Main.WarmUp.class})
public final class Main implements Callable<Integer> {
    private final PrintStream err;

    private Main(PrintStream err) {
        this.err = err;
    }

    public static void main(String[] args) {
        System.exit(run(args, System.out, System.err));
    }

    /** Runs one command; returns the exit code. The kernel command returns when the kernel stops. */
    static int run(String[] args, PrintStream out, PrintStream err) {
        CommandLine cli = new CommandLine(new Main(err), new Factory(out, err));
        return Cli.configure(cli, out, err).execute(args);
    }

    /** Without a command: the usage text on stderr, status 2. */
    @Override
    public Integer call() {
        new CommandLine(this).usage(err);
        return 2;
    }

    /** Builds the commands with the streams of this call (the run command reports on stderr). */
    private record Factory(PrintStream out, PrintStream err) implements CommandLine.IFactory {
        @Override
        public <K> K create(Class<K> type) throws Exception {
            if (type == RunCommand.class) {
                return type.cast(new RunCommand(err == System.err ? Session.consoleErr() : err, System.console() != null));
            }
            if (type == InstallKernel.class) {
                return type.cast(new InstallKernel(out, err));
            }
            return CommandLine.defaultFactory().create(type);
        }
    }

    /** The toolkit version from the jar manifest, or "dev" when run from classes. */
    static String version() {
        String v = Main.class.getPackage().getImplementationVersion();
        return v == null ? "dev" : v;
    }

    static final class Version implements CommandLine.IVersionProvider {
        @Override
        public String[] getVersion() {
            return new String[] {"microtally " + version()};
        }
    }

    @Command(name = "kernel", mixinStandardHelpOptions = true,
            description = "Run the Jupyter kernel (Jupyter starts this itself through the kernelspec).")
    static final class KernelCommand implements Callable<Integer> {
        @Parameters(paramLabel = "CONNECTION_FILE", description = "the connection file Jupyter wrote")
        Path file;

        @Option(names = "--refuse-unsigned", description = "refuse a connection file with an empty key (unsigned messages)")
        boolean refuseUnsigned;

        @Override
        public Integer call() {
            String json;
            try {
                json = Files.readString(file, StandardCharsets.UTF_8);
            } catch (IOException e) {
                throw new CommandLine.ParameterException(new CommandLine(this), "cannot read connection file " + file + ": "
                        + (e instanceof java.nio.file.NoSuchFileException ? "not found" : e.getMessage()));
            }
            KernelLog.configure(file);
            KernelConnectionProperties props = KernelConnectionProperties.parse(json);
            Kernel kernel;
            try {
                kernel = new Kernel(props, Session::open, refuseUnsigned).onShutdown(() -> System.exit(0));
            } catch (IllegalArgumentException e) {
                KernelLog.LOG.severe(e.getMessage());
                System.err.println("microtally: kernel: " + e.getMessage());
                return 1;
            }
            kernel.start();
            ParentWatch.exitWhenParentDies(kernel);
            try {
                kernel.awaitStop();
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
            }
            return 0;
        }
    }

    @Command(name = "install-kernel", mixinStandardHelpOptions = true,
            description = {"Install the Jupyter kernelspec 'microtally' (default --user): writes the kernelspec directory "
                    + "itself and copies the toolkit jar into it, so the kernel survives 'mvn clean'."})
    static final class InstallKernel implements Callable<Integer> {
        @ArgGroup(exclusive = true)
        Where where;

        static final class Where {
            @Option(names = "--user", description = "for the current user (the default)")
            boolean user;

            @Option(names = "--prefix", paramLabel = "DIR", description = "under DIR/share/jupyter (e.g. a virtual environment)")
            Path prefix;

            @Option(names = "--sys-prefix", description = "under the Python prefix Jupyter runs from")
            boolean sysPrefix;
        }

        @Option(names = "--refuse-unsigned",
                description = "make the kernel refuse a connection file with an empty key (unsigned messages)")
        boolean refuseUnsigned;

        @Option(names = "--heap", paramLabel = "SIZE",
                description = {"maximum heap of the kernel, e.g. 4g or 1500m (default: $" + HeapSize.ENV + " if set, else "
                        + HeapSize.KERNEL_DEFAULT + ", and " + HeapSize.SPARK_DEFAULT + " for the Spark kernel)"})
        String heap;

        @CommandLine.Spec
        CommandLine.Model.CommandSpec spec;

        @Option(names = SparkKernelSpec.OPTION,
                description = "also install 'microtally-spark', the kernel with the Spark module on its class path")
        boolean withSpark;

        private final PrintStream out;
        private final PrintStream err;

        InstallKernel(PrintStream out, PrintStream err) {
            this.out = out;
            this.err = err;
        }

        @Override
        public Integer call() {
            KernelSpec.Scope scope = where == null || where.user ? KernelSpec.Scope.USER
                    : where.sysPrefix ? KernelSpec.Scope.SYS_PREFIX : KernelSpec.Scope.PREFIX;
            String plainHeap;
            String sparkHeap;
            try {
                String asked = heap != null ? HeapSize.check(heap, "--heap") : HeapSize.fromEnvironment(null);
                plainHeap = asked != null ? asked : HeapSize.KERNEL_DEFAULT;
                sparkHeap = asked != null ? asked : HeapSize.SPARK_DEFAULT;
            } catch (IllegalArgumentException e) {
                throw new CommandLine.ParameterException(spec.commandLine(), e.getMessage());
            }
            Optional<Path> jar = ownJar();
            if (jar.isEmpty()) {
                err.println("microtally: install-kernel must run from the shaded jar (toolkit/bin/microtally install-kernel),"
                        + " so that it can copy that jar into the kernelspec");
                return 1;
            }
            try {
                Path prefix = scope == KernelSpec.Scope.PREFIX ? where.prefix : null;
                Path installed = KernelSpec.install(scope, prefix, jar.get(), out, new KernelSpec.Settings(plainHeap, refuseUnsigned));
                if (withSpark) {
                    SparkKernelSpec.install(scope, prefix, installed.resolve(KernelSpec.JAR), out, sparkHeap);
                }
                return 0;
            } catch (IOException | IllegalStateException e) {
                err.println("microtally: install-kernel failed: " + e.getMessage());
                return 1;
            }
        }
    }

    /** Internal: the run install-kernel records the class data archive from. */
    @Command(name = "warm-up", hidden = true)
    static final class WarmUp implements Callable<Integer> {
        @Override
        public Integer call() {
            try {
                return ClassArchive.warmUp();
            } catch (IOException e) {
                System.err.println("microtally: warm-up failed: " + e.getMessage());
                return 1;
            }
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
}
