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
     * and core classes.
     */
    static Set<String> classPath() {
        LinkedHashSet<String> out = new LinkedHashSet<>();
        for (String e : System.getProperty("java.class.path", "").split(File.pathSeparator)) {
            addEntry(out, e);
        }
        for (Class<?> c : new Class<?>[] {EngineClassPath.class, org.microtally.ProgressListener.class, MimeBundle.class}) {
            CodeSource cs = c.getProtectionDomain().getCodeSource();
            if (cs != null && cs.getLocation() != null) {
                try {
                    addEntry(out, Path.of(cs.getLocation().toURI()).toString());
                } catch (URISyntaxException | IllegalArgumentException ignored) {
                    // not a file location; the class is still visible to cells through the loader
                }
            }
        }
        return out;
    }

    private static void addEntry(Set<String> out, String entry) {
        if (entry.isEmpty()) {
            return;
        }
        Path p = Path.of(entry).toAbsolutePath().normalize();
        if (!Files.exists(p) || !out.add(p.toString())) {
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
                        addEntry(out, resolved.toString());
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
