package org.microtally.notebook.session;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.io.IOException;
import java.io.OutputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Set;
import java.util.jar.JarEntry;
import java.util.jar.JarOutputStream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class PackageProbeTest {
    @TempDir
    Path tmp;

    @Test
    void findsPackagesWithClassesInDirectoriesAndJarsOnly() throws IOException {
        Path dir = tmp.resolve("classes");
        Files.createDirectories(dir.resolve("org/microtally/count"));
        Files.write(dir.resolve("org/microtally/count/Table.class"), new byte[] {0});
        Files.createDirectories(dir.resolve("org/microtally/ensemble"));   // empty package directory: not a package
        Path jar = tmp.resolve("lib.jar");
        try (JarOutputStream out = new JarOutputStream(Files.newOutputStream(jar))) {
            out.putNextEntry(new JarEntry("org/microtally/special/"));
            out.closeEntry();
            out.putNextEntry(new JarEntry("org/microtally/special/Zeta.class"));
            OutputStream o = out;
            o.write(0);
            out.closeEntry();
            out.putNextEntry(new JarEntry("org/microtally/limit/readme.txt"));
            out.closeEntry();
        }
        Set<String> found = PackageProbe.existing(List.of(dir.toString(), jar.toString(), tmp.resolve("missing").toString()),
                List.of("org.microtally.count", "org.microtally.ensemble", "org.microtally.special", "org.microtally.limit"));
        assertEquals(Set.of("org.microtally.count", "org.microtally.special"), found);
    }
}
