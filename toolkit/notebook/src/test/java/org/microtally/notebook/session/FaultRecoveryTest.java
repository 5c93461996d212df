package org.microtally.notebook.session;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.Timeout;

/** Faults that must leave the session usable; each is followed by a successful cell. */
@Timeout(value = 90, unit = TimeUnit.SECONDS)
class FaultRecoveryTest {
    @Test
    void outOfMemoryIsReportedAndTheMemoryIsReleased() {
        try (Session s = Session.open()) {
            Collector c = new Collector();
            CellResult r = s.run("List<long[]> hog = new ArrayList<>();\nwhile (true) hog.add(new long[1 << 26]);", c);
            assertEquals(CellResult.Outcome.RUNTIME_ERROR, r.outcome());
            CellError e = r.error().orElseThrow();
            assertEquals("java.lang.OutOfMemoryError", e.type());
            assertTrue(e.traceback().stream().anyMatch(l -> l.contains("set to null: hog")), e.traceback().toString());
            // the variable was reset and the heap is usable again: a quarter of the heap can be allocated
            CellResult after = s.run("hog == null ? new long[(int) (Runtime.getRuntime().maxMemory() / 32)].length : -1", new Collector());
            assertTrue(after.ok(), () -> after.error().toString());
            assertEquals((int) (Runtime.getRuntime().maxMemory() / 32), after.raw().orElseThrow());
        }
    }

    @Test
    void exceptionThenSuccessfulCell() {
        try (Session s = Session.open()) {
            assertEquals(CellResult.Outcome.RUNTIME_ERROR, s.run("Object o = null;\no.hashCode()", new Collector()).outcome());
            CellResult ok = s.run("\"still here\".length()", new Collector());
            assertEquals(10, ok.raw().orElseThrow());
        }
    }
}
