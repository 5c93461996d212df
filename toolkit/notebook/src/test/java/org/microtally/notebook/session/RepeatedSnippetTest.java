package org.microtally.notebook.session;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotSame;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.Timeout;

/**
 * The re-run of the last compiled expression ({@link RepeatedSnippet}): it happens only for the same
 * source with nothing evaluated in between, and a re-run is indistinguishable from JShell compiling
 * the cell again. The reference for every check is JShell itself: the same cell after a change in
 * between (which forces a fresh compile) must give the same values, errors and interrupts.
 */
@Timeout(value = 90, unit = TimeUnit.SECONDS)
class RepeatedSnippetTest extends SessionPerClass {
    /** Makes the next cell compile afresh: a change of JShell's state in between. */
    void change() {
        assertTrue(run("int unrelatedChange = 0;").ok());
    }

    @Test
    void sameCellAgainRunsAgainWithoutCompiling() {
        assertTrue(run("int counter = 0;").ok());
        String cell = "++counter * 10";
        CellResult first = run(cell);
        CellResult second = run(cell);
        CellResult third = run(cell);
        // Source: the cell's own arithmetic, each run increments counter once (common practice, no source)
        assertEquals(10, first.raw().orElseThrow());
        assertEquals(20, second.raw().orElseThrow());
        assertEquals(30, third.raw().orElseThrow());
        assertEquals(0, first.phases().reran());
        assertEquals(1, second.phases().reran());
        assertEquals(1, third.phases().reran());
        assertEquals(0, second.phases().defineNanos(), "a re-run defines no class");
        assertEquals("30", third.value().orElseThrow().plain());
        change();
        CellResult fresh = run(cell);
        assertEquals(0, fresh.phases().reran());
        assertEquals(40, fresh.raw().orElseThrow(), "the fresh compile sees the same state the re-runs left");
        assertEquals(4, run("counter").raw().orElseThrow());
    }

    @Test
    void eachRunMakesANewValue() {
        String cell = "new StringBuilder[] {new StringBuilder(\"v\")}[0]";   // ends in "]": on the value route
        Object a = run(cell).raw().orElseThrow();
        CellResult again = run(cell);
        assertEquals(1, again.phases().reran());
        assertNotSame(a, again.raw().orElseThrow());
        assertEquals("v", again.raw().orElseThrow().toString());
    }

    @Test
    void anythingEvaluatedInBetweenMeansACompile() {
        assertTrue(run("int base = 1;").ok());
        assertEquals(2, run("base + 1").raw().orElseThrow());
        assertTrue(run("int base = 5;").ok());   // redefinition
        CellResult afterRedefinition = run("base + 1");
        assertEquals(0, afterRedefinition.phases().reran());
        assertEquals(6, afterRedefinition.raw().orElseThrow());
        CellResult repeated = run("base + 1");
        assertEquals(1, repeated.phases().reran());
        assertEquals(6, repeated.raw().orElseThrow());
        // a failed compile in between changes nothing but still counts as a change
        assertEquals(CellResult.Outcome.COMPILE_ERROR, run("int broken = \"text\";").outcome());
        assertEquals(0, run("base + 1").phases().reran());
        // a different source compiles
        assertEquals(0, run("base + 2").phases().reran());
        // a cell of two snippets evaluates its first one, so its last one is never a re-run
        assertEquals(0, run("int more = 1;\nbase + 2").phases().reran());
    }

    @Test
    void aSourceNamingTheEngineVariableIsNeverReRun() {
        assertTrue(run("7 * 6").ok());
        String cell = "String.valueOf($value).length() + 0";
        run(cell);
        assertEquals(0, run(cell).phases().reran());
    }

    @Test
    void errorOfAReRunIsReportedAsJShellReportsIt() {
        assertTrue(run("int ratio(int a) {\n    return 10 / a;\n}").ok());
        int ratioCell = session.cellCount();
        assertTrue(run("int den = 2;").ok());
        String cell = "0 +\n    ratio(den--) * 1";
        assertEquals(5, run(cell).raw().orElseThrow());
        assertEquals(10, run(cell).raw().orElseThrow());
        CellResult failedReRun = run(cell);   // den is 0 now
        assertEquals(1, failedReRun.phases().reran());
        int reRunCell = session.cellCount();
        assertTrue(run("den = 0;").ok());
        CellResult failedFresh = run(cell);   // compiled again: the report is JShell's own
        assertEquals(0, failedFresh.phases().reran());
        int freshCell = session.cellCount();
        // Source: JLS 17 §15.17.2, integer division by zero throws ArithmeticException
        assertEquals(CellResult.Outcome.RUNTIME_ERROR, failedReRun.outcome());
        CellError reRun = failedReRun.error().orElseThrow();
        CellError fresh = failedFresh.error().orElseThrow();
        assertEquals(fresh.type(), reRun.type());
        assertEquals(fresh.message(), reRun.message());
        assertEquals(fresh.line(), reRun.line());
        assertEquals(2, reRun.line());
        assertEquals(fresh.traceback(), reRun.traceback().stream()
                .map(l -> l.replace("cell " + reRunCell + ",", "cell " + freshCell + ",")).toList());
        assertEquals(List.of("java.lang.ArithmeticException: / by zero",
                "    at ratio (cell " + ratioCell + ", line 2)",
                "    at cell " + reRunCell + ", line 2"), reRun.traceback().subList(0, 3));
        // after a failed re-run the next identical cell compiles again
        assertEquals(0, run(cell).phases().reran());
    }

    @Test
    void aReRunCanBeInterrupted() throws Exception {
        assertTrue(run("long spinForever() { long s = 0; while (true) { s++; } }").ok());
        assertTrue(run("java.util.concurrent.atomic.AtomicInteger calls = new java.util.concurrent.atomic.AtomicInteger();").ok());
        String cell = "calls.incrementAndGet() > 1 ? spinForever() : 0L";
        assertEquals(0L, run(cell).raw().orElseThrow());
        Thread stopper = new Thread(() -> {
            try {
                Thread.sleep(600);
            } catch (InterruptedException e) {
                return;
            }
            session.interrupt();
        });
        stopper.start();
        CellResult r = run(cell);
        stopper.join();
        assertEquals(1, r.phases().reran());
        assertEquals(CellResult.Outcome.INTERRUPTED, r.outcome());
        assertEquals(3, run("1 + 2").raw().orElseThrow());
    }
}
