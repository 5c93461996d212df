package org.microtally.notebook.data;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.microtally.spectrum.Spectrum;

class NotebookFolderTest {
    @TempDir
    Path tmp;

    @Test
    void relativeNamesResolveInTheNotebookFolderWhileAScopeIsOpen() throws IOException {
        Path nbFolder = Files.createDirectories(tmp.resolve("notebooks"));
        // the quantum dot's lowest shells with spin: 2, 4, 6 states at 0, 1, 2 quanta (2D oscillator; from memory)
        Files.writeString(nbFolder.resolve("dot-levels.csv"), "energy,degeneracy\n0,2\n1,4\n2,6\n");
        assertEquals(Path.of("x.csv"), NotebookFolder.resolve(Path.of("x.csv")));   // no scope: the working directory
        try (NotebookFolder.Scope s = NotebookFolder.use(nbFolder)) {
            Spectrum dot = SpectrumReader.fromCsv(Path.of("dot-levels.csv"), SpectrumReaderTest.MEV);
            assertEquals(12, dot.stateCount());
            Path written = Csv.write(org.microtally.notebook.render.Tables.tabular(List.of("n"), List.of(List.of(1))),
                    Path.of("out.csv"));
            assertEquals(nbFolder.resolve("out.csv").toAbsolutePath(), written);
            assertTrue(Files.exists(nbFolder.resolve("out.csv")));
            Path absolute = tmp.resolve("elsewhere.csv").toAbsolutePath();
            assertEquals(absolute, NotebookFolder.resolve(absolute));
            assertEquals(nbFolder.toAbsolutePath().normalize(), NotebookFolder.current());
        }
        assertEquals(Path.of("").toAbsolutePath(), NotebookFolder.current());
    }
}
