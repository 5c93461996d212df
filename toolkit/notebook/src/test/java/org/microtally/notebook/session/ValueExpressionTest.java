package org.microtally.notebook.session;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.Timeout;

/**
 * The shorter route for expressions: which snippets take it, and that a cell means the same on it
 * (value, errors with their lines, no code run twice, interrupt) as when JShell evaluates it as written.
 */
@Timeout(value = 90, unit = TimeUnit.SECONDS)
class ValueExpressionTest extends SessionPerClass {

    @Test
    void onlyCertainNonVoidExpressionsTakeTheRoute() {
        // common practice, no source: Java syntax (JLS 15: only a method invocation can be void)
        for (String e : List.of("1 + 1", "x * 2;", "a[0]", "s.length", "\"a(\" + b", "(1 + 2) * 3", "x = 5", "i++", "new int[3].length",
                "flag ? 1 : 2", "'('")) {
            assertTrue(ValueExpression.declaration(e).isPresent(), e);
        }
        for (String n : List.of("show(x)", "foo();", "x", "int n = 3", "List<String> xs = new ArrayList<>()", "double[] d = {1}",
                "import java.util.*", "for (int i = 0; i < 3; i++) { }", "var y = 2", "class A { }", "a) + (b", "1 + 1 // note",
                "{ 1; }", "return 1", "@Deprecated int q = 1", "x -> { return 1; }", "")) {
            assertFalse(ValueExpression.declaration(n).isPresent(), n);
        }
        assertEquals("Object $value = (1 + 1\n);", ValueExpression.declaration("1 + 1;").orElseThrow());
    }

    @Test
    void valueIsTheSameObjectAsWrittenAndPrimitivesAreBoxedAlike() {
        CellResult r = run("int seven = 7;\nseven * 6");
        assertTrue(r.ok(), () -> r.error().toString());
        // Source: arithmetic, 7 * 6 = 42 (common practice, no source)
        assertEquals(42, r.raw().orElseThrow());
        assertEquals("42", r.value().orElseThrow().plain());
        CellResult c = run("'a' + 1");
        assertEquals(98, c.raw().orElseThrow());   // Source: Unicode, 'a' is U+0061 = 97
    }

    @Test
    void compileErrorIsReportedAsForTheSnippetAsWritten() {
        CellResult r = run("int ok = 1;\n\"text\" - 1");
        assertEquals(CellResult.Outcome.COMPILE_ERROR, r.outcome());
        assertEquals(2, r.error().orElseThrow().line());
        assertFalse(r.error().orElseThrow().message().contains("$value"), r.error().toString());
    }

    @Test
    void unresolvedNameLeavesNothingBehindThatRunsLater() {
        CellResult r = run("laterDefined + 1");
        assertFalse(r.ok());
        assertFalse(r.error().orElseThrow().message().contains("$value"), r.error().toString());
        // if the failed declaration were kept, defining the name would run its initializer again
        assertTrue(run("int laterDefined = 1000;").ok());
        CellResult v = run("$value");
        assertTrue(v.ok() || v.outcome() == CellResult.Outcome.COMPILE_ERROR);
        if (v.ok()) {
            assertFalse(Integer.valueOf(1001).equals(v.raw().orElse(null)), "the failed cell's expression ran later");
        }
    }

    @Test
    void sideEffectsHappenOnce() {
        assertTrue(run("int[] counter = {0};").ok());
        CellResult r = run("counter[0]++ + 10");
        assertTrue(r.ok(), () -> r.error().toString());
        // Source: Java post-increment (JLS 15.14.2), value before the increment (common practice, no source)
        assertEquals(10, r.raw().orElseThrow());
        assertEquals(1, run("counter[0]").raw().orElseThrow());
    }

    @Test
    void runtimeErrorKeepsTheCellLine() {
        CellResult r = run("int zero = 0;\n\n7 / zero");
        assertEquals(CellResult.Outcome.RUNTIME_ERROR, r.outcome());
        assertEquals("java.lang.ArithmeticException", r.error().orElseThrow().type());
        assertTrue(String.join("\n", r.error().orElseThrow().traceback()).contains("line 3"), r.error().toString());
    }

    @Test
    void expressionOnTheRouteCanBeInterrupted() throws InterruptedException {
        assertTrue(run("long spinForever() { long s = 0; while (true) { s++; } }").ok());
        assertTrue(ValueExpression.declaration("spinForever() + 1").isPresent());
        Thread stopper = DelayedInterrupt.after(session, 800);
        CellResult r = run("spinForever() + 1");
        stopper.join();
        assertEquals(CellResult.Outcome.INTERRUPTED, r.outcome());
        assertTrue(run("1 + 2").ok());
    }

    @Test
    void phasesAreMeasured() {
        CellResult r = run("2 + 3");
        CellPhases p = r.phases();
        assertEquals(1, p.snippets());
        assertTrue(p.compileNanos() > 0 && p.runNanos() > 0 && p.defineNanos() > 0, p.toString());
        assertTrue(p.totalNanos() >= p.splitNanos() + p.compileNanos() + p.defineNanos() + p.runNanos() + p.displayNanos(), p.toString());
    }
}
