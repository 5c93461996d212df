package org.microtally.notebook.session;

import java.lang.reflect.Field;
import java.lang.reflect.Modifier;
import java.net.MalformedURLException;
import java.net.URL;
import java.net.URLClassLoader;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.concurrent.ConcurrentHashMap;
import jdk.jshell.execution.LoaderDelegate;
import jdk.jshell.spi.ExecutionControl.ClassBytecodes;
import jdk.jshell.spi.ExecutionControl.ClassInstallException;

/**
 * Loads the classes JShell compiles from cells. Its parent is the class loader of the engine
 * itself, so a cell that calls {@code show(...)} or any toolkit class reaches exactly the classes
 * (and static state) the engine uses. Every class file passes through {@link ExitCallRewriter}.
 */
final class SnippetLoader implements LoaderDelegate {
    private final Loader loader;
    private final Map<String, Class<?>> loaded = new ConcurrentHashMap<>();
    private final Set<String> parentPath;
    private final List<String> sinceMark = new ArrayList<>();
    private final CellPhases.Clock clock;

    SnippetLoader(ClassLoader parent, Set<String> parentPath, CellPhases.Clock clock) {
        this.loader = new Loader(parent);
        this.parentPath = parentPath;
        this.clock = clock;
    }

    ClassLoader classLoader() {
        return loader;
    }

    @Override
    public void load(ClassBytecodes[] cbcs) throws ClassInstallException {
        long t0 = System.nanoTime();
        boolean[] installed = new boolean[cbcs.length];
        try {
            for (ClassBytecodes cbc : cbcs) {
                loader.declare(cbc.name(), ExitCallRewriter.rewrite(cbc.bytecodes()));
            }
            for (int i = 0; i < cbcs.length; i++) {
                Class<?> c = loader.loadClass(cbcs[i].name());
                loaded.put(cbcs[i].name(), c);
                synchronized (sinceMark) {
                    sinceMark.add(cbcs[i].name());
                }
                installed[i] = true;
                c.getDeclaredMethods(); // link now, so verification problems surface at load time
            }
        } catch (Throwable t) {
            throw new ClassInstallException("load: " + t, installed);
        } finally {
            clock.define(System.nanoTime() - t0);
        }
    }

    @Override
    public void classesRedefined(ClassBytecodes[] cbcs) {
        long t0 = System.nanoTime();
        for (ClassBytecodes cbc : cbcs) {
            loader.declare(cbc.name(), ExitCallRewriter.rewrite(cbc.bytecodes()));
        }
        clock.define(System.nanoTime() - t0);
    }

    @Override
    public void addToClasspath(String path) {
        for (String entry : path.split(java.io.File.pathSeparator)) {
            if (entry.isEmpty() || parentPath.contains(entry)) {
                continue; // already visible through the parent loader
            }
            try {
                loader.addURL(Path.of(entry).toUri().toURL());
            } catch (MalformedURLException e) {
                throw new IllegalArgumentException("class path entry " + entry + " is not a valid path", e);
            }
        }
    }

    @Override
    public Class<?> findClass(String name) throws ClassNotFoundException {
        Class<?> c = loaded.get(name);
        if (c == null) {
            c = loader.loadClass(name);
        }
        return c;
    }

    /** Starts recording the classes loaded from now on (one cell). */
    void mark() {
        synchronized (sinceMark) {
            sinceMark.clear();
        }
    }

    /**
     * Sets the static reference fields of the classes loaded since {@link #mark()} to null, so
     * that whatever a failed cell allocated can be collected. Returns the names of the fields reset.
     */
    List<String> releaseSinceMark() {
        List<String> names;
        synchronized (sinceMark) {
            names = new ArrayList<>(sinceMark);
        }
        List<String> reset = new ArrayList<>();
        for (String n : names) {
            Class<?> c = loaded.get(n);
            if (c == null) {
                continue;
            }
            for (Field f : c.getDeclaredFields()) {
                int m = f.getModifiers();
                if (Modifier.isStatic(m) && !Modifier.isFinal(m) && !f.getType().isPrimitive()) {
                    try {
                        f.setAccessible(true);
                        if (f.get(null) != null) {
                            f.set(null, null);
                            reset.add(f.getName());
                        }
                    } catch (ReflectiveOperationException | RuntimeException ignored) {
                        // a field we cannot reset keeps its value
                    }
                }
            }
        }
        return reset;
    }

    private static final class Loader extends URLClassLoader {
        static {
            registerAsParallelCapable();
        }

        private final Map<String, byte[]> declared = new ConcurrentHashMap<>();

        Loader(ClassLoader parent) {
            super("microtally-cells", new URL[0], parent);
        }

        void declare(String name, byte[] bytes) {
            declared.put(name, bytes);
        }

        @Override
        protected Class<?> findClass(String name) throws ClassNotFoundException {
            byte[] bytes = declared.get(name);
            if (bytes != null) {
                return defineClass(name, bytes, 0, bytes.length);
            }
            return super.findClass(name);
        }

        @Override
        protected void addURL(URL url) {
            super.addURL(url);
        }
    }
}
