package org.microtally.notebook.session;

import java.io.File;
import java.io.IOException;
import java.net.URISyntaxException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.CodeSource;
import java.util.LinkedHashSet;
import java.util.Set;
import java.util.jar.Attributes;
import java.util.jar.JarFile;
import org.microtally.notebook.render.MimeBundle;

/** The class path cells are compiled against. */
final class EngineClassPath {
    private EngineClassPath() { }

    /**
     * The engine's class path for compiling cells: {@code java.class.path}, the {@code Class-Path}
     * entries of manifest-only jars on it (as build tools use), and the code sources of the engine
     * and core classes. Without Spark ({@code withSpark} false), the entries the launcher lists in
     * {@link KernelIdentity#SPARK_CLASSPATH_PROPERTY} are left out: what the plain kernel compiles against.
     */
    static Set<String> classPath(boolean withSpark) {
        Set<String> spark = new java.util.HashSet<>();
        if (!withSpark) {
            for (String e : System.getProperty(KernelIdentity.SPARK_CLASSPATH_PROPERTY, "").split(File.pathSeparator)) {
                if (!e.isEmpty()) {
                    spark.add(Path.of(e).toAbsolutePath().normalize().toString());
                }
            }
        }
        LinkedHashSet<String> out = new LinkedHashSet<>();
        for (String e : System.getProperty("java.class.path", "").split(File.pathSeparator)) {
            addEntry(out, e, spark);
        }
        for (Class<?> c : new Class<?>[] {EngineClassPath.class, org.microtally.ProgressListener.class, MimeBundle.class}) {
            CodeSource cs = c.getProtectionDomain().getCodeSource();
            if (cs != null && cs.getLocation() != null) {
                try {
                    addEntry(out, Path.of(cs.getLocation().toURI()).toString(), Set.of());
                } catch (URISyntaxException | IllegalArgumentException ignored) {
                    // not a file location; the class is still visible to cells through the loader
                }
            }
        }
        return out;
    }

    /**
     * Builds a JShell (by {@code build}) whose compiler sees exactly {@code classPath}. JShell's compiler
     * starts from the JVM's {@code java.class.path}, read once while the JShell is built, and appends
     * what {@code addToClasspath} adds; so the property is set to the first entry for the build (under a
     * lock, restored at once) and the whole path is added after it. Without this a plain notebook in a
     * runner JVM that holds Spark would compile against Spark's jars, and every entry would be listed
     * twice. Other threads that read {@code java.class.path} during the build (a few milliseconds) would
     * see the shorter value; nothing in the engine does.
     */
    static jdk.jshell.JShell compilingAgainst(Set<String> classPath, java.util.function.Supplier<jdk.jshell.JShell> build) {
        if (classPath.isEmpty()) { // no file behind the engine's classes: nothing to compile against but the JDK
            return build.get();
        }
        String first = classPath.iterator().next();
        jdk.jshell.JShell jshell;
        synchronized (EngineClassPath.class) {
            String jvm = System.getProperty("java.class.path");
            System.setProperty("java.class.path", first);
            try {
                jshell = build.get();
            } finally {
                if (jvm == null) {
                    System.clearProperty("java.class.path");
                } else {
                    System.setProperty("java.class.path", jvm);
                }
            }
        }
        jshell.addToClasspath(String.join(File.pathSeparator, classPath));
        return jshell;
    }

    /** Adds entry (and the Class-Path entries of its manifest) unless it is in {@code leftOut}. */
    private static void addEntry(Set<String> out, String entry, Set<String> leftOut) {
        if (entry.isEmpty()) {
            return;
        }
        Path p = Path.of(entry).toAbsolutePath().normalize();
        if (leftOut.contains(p.toString()) || !Files.exists(p) || !out.add(p.toString())) {
            return;
        }
        if (Files.isRegularFile(p) && p.toString().endsWith(".jar")) {
            try (JarFile jar = new JarFile(p.toFile())) {
                if (jar.getManifest() == null) {
                    return;
                }
                String cp = jar.getManifest().getMainAttributes().getValue(Attributes.Name.CLASS_PATH);
                if (cp == null) {
                    return;
                }
                for (String ref : cp.trim().split("\\s+")) {
                    try {
                        Path resolved = Path.of(p.getParent().toUri().resolve(ref));
                        addEntry(out, resolved.toString(), leftOut);
                    } catch (IllegalArgumentException ignored) {
                        // unusable manifest entry
                    }
                }
            } catch (IOException ignored) {
                // unreadable jar: javac will report what it cannot find
            }
        }
    }
}
