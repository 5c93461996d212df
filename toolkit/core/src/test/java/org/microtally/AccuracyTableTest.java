package org.microtally;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.microtally.special.Zeta;

/** README.md's accuracy table is the one {@link AccuracyTable} generates from the stated constants. */
class AccuracyTableTest {

    /** README.md of the repository: the module runs its tests in toolkit/core. */
    private static Path readme() {
        Path dir = Path.of("").toAbsolutePath();
        while (dir != null && !Files.exists(dir.resolve("README.md")) || dir != null && !Files.exists(dir.resolve("toolkit"))) {
            dir = dir.getParent();
        }
        assertNotNull(dir, "no README.md above " + Path.of("").toAbsolutePath());
        return dir.resolve("README.md");
    }

    @Test
    void readmeTableIsTheGeneratedOne() throws IOException {
        String text = Files.readString(readme(), StandardCharsets.UTF_8);
        String section = AccuracyTable.section(text);
        assertNotNull(section, "README.md lost its " + AccuracyTable.BEGIN + " / " + AccuracyTable.END + " markers");
        // common practice, no source: generated documentation is compared verbatim
        assertEquals(AccuracyTable.markdown(), section, "README.md's accuracy table differs from the one generated "
                + "from the stated constants (org.microtally.AccuracyTable, test sources of toolkit/core). Edit rows "
                + "there, not in README.md, then regenerate from the repository root:\n  " + AccuracyTable.REGENERATE);
    }

    @Test
    void figuresAreFormattedFromTheConstants() {
        // common practice, no source: shortest decimal form of the double
        assertEquals("5e-16", AccuracyTable.figure(5e-16));
        assertEquals("1.6e-15", AccuracyTable.figure(1.6e-15));
        assertEquals("0.3", AccuracyTable.figure(0.3));
        assertTrue(AccuracyTable.markdown().contains("<= " + AccuracyTable.figure(Zeta.MAX_RELATIVE_ERROR) + " relative"));
    }

    @Test
    void regeneratingReplacesOnlyTheSection() {
        String readme = "# t\n\nbefore\n" + AccuracyTable.BEGIN + "\n| old |\n" + AccuracyTable.END + "\nafter\n";
        String updated = AccuracyTable.regenerated(readme);
        assertEquals("# t\n\nbefore\n" + AccuracyTable.BEGIN + "\n" + AccuracyTable.markdown() + AccuracyTable.END + "\nafter\n",
                updated);
        assertEquals(updated, AccuracyTable.regenerated(updated));
        assertThrows(IllegalArgumentException.class, () -> AccuracyTable.regenerated("no markers\n"));
    }
}
