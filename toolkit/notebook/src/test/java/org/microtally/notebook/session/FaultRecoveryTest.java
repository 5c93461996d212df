package org.microtally.notebook.session;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
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
            assertEquals(CellResult.Outcome.OUT_OF_MEMORY, r.outcome());
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
    void deepRecursionIsReportedInAFewLines() {
        try (Session s = Session.open()) {
            CellResult r = s.run("int down(int n) { return down(n + 1) + 1; }\ndown(0)", new Collector());
            assertEquals(CellResult.Outcome.RUNTIME_ERROR, r.outcome());
            CellError e = r.error().orElseThrow();
            // Source: JVM specification SE 17 §2.5.2, a thread needing more stack than allowed throws StackOverflowError
            assertEquals("java.lang.StackOverflowError", e.type());
            assertTrue(e.traceback().size() < 20, e.traceback().toString());
            assertTrue(e.traceback().stream().anyMatch(l -> l.matches("    \\.\\.\\. the frame above repeated \\d+ more times")),
                    e.traceback().toString());
            assertEquals(3, s.run("1 + 2", new Collector()).raw().orElseThrow());
        }
    }

    @Test
    void threadsACellLeftRunningAreStoppedWhenTheSessionCloses() throws Exception {
        Thread spinner;
        try (Session s = Session.open()) {
            CellResult r = s.run("Thread spin = new Thread(() -> { while (true) { } });\nspin.start();\nspin", new Collector());
            assertTrue(r.ok(), () -> r.error().toString());
            spinner = (Thread) r.raw().orElseThrow();
            assertTrue(spinner.isAlive());
        }
        spinner.join(5000);
        assertFalse(spinner.isAlive(), "a busy thread of the closed session is still running");
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
