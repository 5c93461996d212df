package org.microtally.notebook.session;

import java.io.IOException;
import java.nio.file.DirectoryStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Collection;
import java.util.Enumeration;
import java.util.HashSet;
import java.util.List;
import java.util.Set;
import java.util.jar.JarEntry;
import java.util.jar.JarFile;

/**
 * Finds which of a list of packages have at least one class on a class path (directories and
 * jars), so that a session imports only packages that exist: an on-demand import of a missing
 * package is a compile error.
 */
final class PackageProbe {
    private PackageProbe() { }

    static Set<String> existing(Collection<String> classPath, List<String> packages) {
        Set<String> wanted = new HashSet<>();
        for (String p : packages) {
            wanted.add(p.replace('.', '/'));
        }
        Set<String> found = new HashSet<>();
        for (String entry : classPath) {
            Path path = Path.of(entry);
            if (Files.isDirectory(path)) {
                for (String w : wanted) {
                    if (hasClass(path.resolve(w))) {
                        found.add(w);
                    }
                }
            } else if (Files.isRegularFile(path)) {
                try (JarFile jar = new JarFile(path.toFile())) {
                    Enumeration<JarEntry> e = jar.entries();
                    while (e.hasMoreElements()) {
                        String n = e.nextElement().getName();
                        if (!n.endsWith(".class")) {
                            continue;
                        }
                        int slash = n.lastIndexOf('/');
                        if (slash > 0) {
                            String dir = n.substring(0, slash);
                            if (wanted.contains(dir)) {
                                found.add(dir);
                            }
                        }
                    }
                } catch (IOException ignored) {
                    // not a readable jar
                }
            }
        }
        Set<String> out = new HashSet<>();
        for (String f : found) {
            out.add(f.replace('/', '.'));
        }
        return out;
    }

    private static boolean hasClass(Path dir) {
        if (!Files.isDirectory(dir)) {
            return false;
        }
        try (DirectoryStream<Path> s = Files.newDirectoryStream(dir, "*.class")) {
            return s.iterator().hasNext();
        } catch (IOException e) {
            return false;
        }
    }
}
