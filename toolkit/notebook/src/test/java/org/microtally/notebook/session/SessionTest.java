package org.microtally.notebook.session;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertSame;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.math.BigInteger;
import java.util.List;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.Timeout;
import org.microtally.notebook.render.MimeBundle;

/** The engine on one shared session (cells that break nothing only). */
@Timeout(value = 60, unit = TimeUnit.SECONDS)
class SessionTest extends SessionPerClass {

    @Test
    void lastExpressionValueIsTheRealObject() {
        CellResult r = run("BigInteger two = BigInteger.valueOf(2);\ntwo.pow(100)");
        assertTrue(r.ok(), () -> r.error().toString());
        // Source: closed form 2^100 = 1267650600228229401496703205376 (OEIS A000079, n = 100)
        assertEquals(new BigInteger("1267650600228229401496703205376"), r.raw().orElseThrow());
        assertEquals("1267650600228229401496703205376", r.value().orElseThrow().plain());
    }

    @Test
    void bareVariableNameGivesItsValue() {
        assertTrue(run("long answerOfSix = 6L * 7L;").ok());
        CellResult r = run("answerOfSix");
        // Source: arithmetic, 6 * 7 = 42 (common practice, no source)
        assertEquals(42L, r.raw().orElseThrow());
    }

    @Test
    void declarationAsLastSnippetHasNoValue() {
        CellResult r = run("int unshown = 3;");
        assertTrue(r.ok());
        assertTrue(r.value().isEmpty());
        assertTrue(r.raw().isEmpty());
    }

    @Test
    void printfAsLastExpressionPrintsButShowsNoStreamValue() {
        Collector c = new Collector();
        CellResult r = session.run("System.out.printf(\"%d quanta%n\", 100)", c);
        assertTrue(r.ok());
        assertEquals("100 quanta" + System.lineSeparator(), c.text(false));
        assertTrue(r.value().isEmpty(), "the PrintStream returned by printf is not shown as a value");
    }

    @Test
    void stdoutAndStderrAreCapturedSeparately() {
        Collector c = new Collector();
        CellResult r = session.run("System.out.println(\"to out\");\nSystem.err.println(\"to err\");", c);
        assertTrue(r.ok());
        assertEquals("to out\n", c.text(false));
        assertEquals("to err\n", c.text(true));
    }

    @Test
    void outputIsStreamedWhileTheCellRuns() {
        Collector c = new Collector();
        CellResult r = session.run("System.out.print(\"early\");\nThread.sleep(600);\nSystem.out.print(\"late\");", c);
        long end = System.nanoTime();
        assertTrue(r.ok(), () -> r.error().toString());
        Collector.Event first = c.events.get(0);
        assertEquals("early", first.text());
        // the first chunk arrived well before the cell finished (flush interval 50 ms, sleep 600 ms)
        assertTrue(end - first.nanos() > TimeUnit.MILLISECONDS.toNanos(400), "early text arrived only at the end");
        assertEquals("earlylate", c.text(false));
    }

    @Test
    void compileErrorHasCellLineColumnAndCaret() {
        CellResult r = run("int fine = 1;\nint bad = \"text\";");
        // Source: JLS 17 §5.2, a String is not assignable to int
        assertEquals(CellResult.Outcome.COMPILE_ERROR, r.outcome());
        CellError e = r.error().orElseThrow();
        assertEquals(2, e.line());
        assertEquals(11, e.column());
        assertTrue(e.message().contains("incompatible types"), e.message());
        List<String> tb = e.traceback();
        int i = tb.indexOf("int bad = \"text\";");
        assertTrue(i > 0, tb.toString());
        assertEquals("          ^", tb.get(i + 1));
    }

    @Test
    void runtimeErrorShowsUserFramesWithCellLines() {
        CellResult r = run("int ratio(int a) {\n    return 10 / a;\n}\nint q = 5;\nratio(q - 5)");
        // Source: JLS 17 §15.17.2, integer division by zero throws ArithmeticException
        assertEquals(CellResult.Outcome.RUNTIME_ERROR, r.outcome());
        CellError e = r.error().orElseThrow();
        assertEquals("java.lang.ArithmeticException", e.type());
        assertEquals("/ by zero", e.message());
        int cell = session.cellCount();
        assertEquals(List.of("java.lang.ArithmeticException: / by zero",
                "    at ratio (cell " + cell + ", line 2)",
                "    at cell " + cell + ", line 5"), e.traceback());
        assertEquals(2, e.line());
    }

    @Test
    void exceptionCauseChainIsReported() {
        CellResult r = run("throw new IllegalStateException(\"outer\", new ArithmeticException(\"inner\"))");
        assertEquals(CellResult.Outcome.RUNTIME_ERROR, r.outcome());
        CellError e = r.error().orElseThrow();
        assertEquals("java.lang.IllegalStateException", e.type());
        assertTrue(e.traceback().contains("Caused by: java.lang.ArithmeticException: inner"), e.traceback().toString());
        assertFalse(e.traceback().stream().anyMatch(l -> l.contains("jdk.jshell") || l.contains("EngineControl")),
                "engine frames were not trimmed: " + e.traceback());
    }

    @Test
    void unresolvedReferenceIsAnError() {
        CellResult r = run("double usesMissing() { return notDefinedYet(2.0); }");
        assertEquals(CellResult.Outcome.COMPILE_ERROR, r.outcome());
        assertEquals("UnresolvedReference", r.error().orElseThrow().type());
        assertTrue(r.error().orElseThrow().message().contains("notDefinedYet"));
        CellResult call = run("usesMissing()");
        assertEquals(CellResult.Outcome.RUNTIME_ERROR, call.outcome());
        assertEquals("UnresolvedReference", call.error().orElseThrow().type());
    }

    @Test
    void errorStopsTheRestOfTheCell() {
        Collector c = new Collector();
        CellResult r = session.run("System.out.println(\"before\");\nInteger.parseInt(\"x\");\nSystem.out.println(\"after\");", c);
        // Source: JDK 17 API, Integer.parseInt throws NumberFormatException for non-digits
        assertEquals("java.lang.NumberFormatException", r.error().orElseThrow().type());
        assertEquals("before\n", c.text(false));
    }

    @Test
    void toolkitPackagesAreImportedWhenTheyExist() {
        ClassLoader app = Session.class.getClassLoader();
        for (String p : Session.TOOLKIT_PACKAGES) {
            // independent probe: the class loader's resource lookup of the package directory
            boolean exists = app.getResource(p.replace('.', '/') + "/") != null;
            assertEquals(exists, session.imports().contains("import " + p + ".*;"), p);
        }
        assertTrue(session.imports().contains("import org.microtally.spectrum.*;"));
        assertTrue(session.imports().contains("import static org.microtally.notebook.session.Display.*;"));
        CellResult r = run("Spectrum.class.getName()");
        assertEquals("org.microtally.spectrum.Spectrum", r.raw().orElseThrow());
    }

    @Test
    void displayTypesAreImportedButNotTheRenderHelpers() {
        assertEquals("org.microtally.notebook.render.Tables", run("Tables.class.getName()").raw().orElseThrow());
        assertEquals("org.microtally.notebook.render.MimeBundle", run("MimeBundle.class.getName()").raw().orElseThrow());
        // an internal helper of the display layer is not imported into cells
        assertEquals(CellResult.Outcome.COMPILE_ERROR, run("TableFormat.class").outcome());
        assertEquals(CellResult.Outcome.COMPILE_ERROR, run("DisplayEnvironment.class").outcome());
    }

    @Test
    void streamsAndDisplaysKeepTheOrderTheCellWroteThem() {
        Collector c = new Collector();
        CellResult r = session.run("for (int i = 0; i < 40; i++) {\n  System.out.print(\"o\" + i + \" \");\n"
                + "  System.err.print(\"e\" + i + \" \");\n  if (i % 10 == 0) show(\"d\" + i);\n}", c);
        assertTrue(r.ok(), () -> r.error().toString());
        StringBuilder expected = new StringBuilder();
        StringBuilder got = new StringBuilder();
        for (int i = 0; i < 40; i++) {
            expected.append("o").append(i).append(" e").append(i).append(" ");
            if (i % 10 == 0) {
                expected.append("[d").append(i).append("]");
            }
        }
        for (Collector.Event e : c.events) {
            got.append(e.kind().equals("display") ? "[" + e.bundle().plain().replace("\"", "") + "]" : e.text());
        }
        assertEquals(expected.toString(), got.toString());
    }

    @Test
    void cellCodeSharesTheEngineClasses() {
        CellResult r = run("org.microtally.notebook.session.Display.class");
        assertSame(Display.class, r.raw().orElseThrow());
        assertSame(Session.class.getClassLoader(), session.cellClassLoader().getParent());
        assertSame(session.cellClassLoader(), run("Thread.currentThread().getContextClassLoader()").raw().orElseThrow());
        Collector c = new Collector();
        assertTrue(session.run("show(\"shared\");\nhtml(\"<b>bold</b>\");", c).ok());
        List<Collector.Event> d = c.displays();
        assertEquals(2, d.size());
        assertEquals("shared", d.get(0).bundle().plain());
        assertEquals("<b>bold</b>", d.get(1).bundle().get(MimeBundle.TEXT_HTML));
        assertEquals("bold", d.get(1).bundle().plain());
    }

    @Test
    void markdownAndLatexHelpers() {
        Collector c = new Collector();
        assertTrue(session.run("markdown(\"# Trap\");\nlatex(\"$Z = \\\\sum_i g_i e^{-\\\\beta E_i}$\");", c).ok());
        assertEquals("# Trap", c.displays().get(0).bundle().get(MimeBundle.TEXT_MARKDOWN));
        assertEquals("$Z = \\sum_i g_i e^{-\\beta E_i}$", c.displays().get(1).bundle().get(MimeBundle.TEXT_LATEX));
    }

    @Test
    void systemExitIsBlockedAndTheSessionStaysAlive() {
        for (String call : List.of("System.exit(3);", "Runtime.getRuntime().exit(4);", "Runtime.getRuntime().halt(5);",
                "java.util.function.IntConsumer bye = System::exit;\nbye.accept(6);")) {
            CellResult r = run(call);
            assertEquals(CellResult.Outcome.RUNTIME_ERROR, r.outcome(), call);
            CellError e = r.error().orElseThrow();
            assertEquals(ExitBlockedException.class.getName(), e.type());
            assertTrue(e.message().contains("session stays alive"), e.message());
        }
        assertEquals(2, run("1 + 1").raw().orElseThrow());
    }

    @Test
    void exitThroughReflectionMethodHandlesAndThreadsIsBlockedToo() {
        // every route below ends the JVM when not blocked, which would end this test run
        List<String> direct = List.of(
                "MethodHandles.lookup().findStatic(System.class, \"exit\", java.lang.invoke.MethodType.methodType(void.class, int.class)).invoke(7);",
                "MethodHandles.publicLookup().findVirtual(Runtime.class, \"halt\", java.lang.invoke.MethodType.methodType(void.class, int.class))"
                        + ".invoke(Runtime.getRuntime(), 8);",
                "MethodHandles.lookup().unreflect(System.class.getMethod(\"exit\", int.class)).invoke(9);",
                "java.util.function.IntConsumer stop = Runtime.getRuntime()::halt;\nstop.accept(12);",
                "MethodHandles.lookup().bind(Runtime.getRuntime(), \"exit\", java.lang.invoke.MethodType.methodType(void.class, int.class)).invoke(14);");
        for (String call : direct) {
            CellResult r = run("import java.lang.invoke.MethodHandles;\n" + call);
            assertEquals(ExitBlockedException.class.getName(), r.error().orElseThrow().type(), call);
        }
        List<String> reflective = List.of(
                "Class.forName(\"java.lang.System\").getMethod(\"exit\", int.class).invoke(null, 5);",
                "Method.class.getMethod(\"invoke\", Object.class, Object[].class)"
                        + ".invoke(System.class.getMethod(\"exit\", int.class), null, new Object[] {10});",
                "Runtime.class.getMethod(\"exit\", int.class).invoke(Runtime.getRuntime(), 13);");
        for (String call : reflective) {
            CellResult r = run("import java.lang.reflect.Method;\n" + call);
            CellError e = r.error().orElseThrow();
            // Source: JDK 17 API, Method.invoke wraps an exception of the invoked method in InvocationTargetException
            assertEquals("java.lang.reflect.InvocationTargetException", e.type(), call);
            assertTrue(e.traceback().stream().anyMatch(l -> l.contains(ExitBlockedException.class.getName())), e.traceback().toString());
        }
        Collector c = new Collector();
        CellResult t = session.run("Thread quitter = new Thread(() -> System.exit(11));\nquitter.start();\nquitter.join();\n\"joined\"", c);
        assertEquals("joined", t.raw().orElseThrow());
        assertTrue(c.text(true).contains("was blocked"), c.text(true));
        // reflection that does not exit works as before
        assertEquals(4, run("Math.class.getMethod(\"abs\", int.class).invoke(null, -4)").raw().orElseThrow());
        assertEquals(3, run("1 + 2").raw().orElseThrow());
    }

    @Test
    void interruptStopsABusyLoopFromAnotherThread() throws Exception {
        assertInterrupted("long spins = 0;\nwhile (true) { spins++; }");
        // blocking call: ends through the thread interrupt
        assertInterrupted("Thread.sleep(60_000);");
        assertEquals("alive", run("\"alive\"").raw().orElseThrow());
    }

    private void assertInterrupted(String code) throws Exception {
        Thread stopper = DelayedInterrupt.after(session, 400);
        long t0 = System.nanoTime();
        CellResult r = run(code);
        stopper.join();
        assertEquals(CellResult.Outcome.INTERRUPTED, r.outcome());
        assertEquals("Interrupted", r.error().orElseThrow().type());
        assertTrue(System.nanoTime() - t0 < TimeUnit.SECONDS.toNanos(20), "interrupt took too long");
    }

    @Test
    void interruptStopsARenderingThatNeverEnds() throws Exception {
        // the value's text form is computed on a stoppable thread too
        assertInterrupted("new Object() { public String toString() { while (true) { } } }");
        assertEquals(3, run("1 + 2").raw().orElseThrow());
    }

    @Test
    void heavyPrintingArrivesWholeInFewChunks() {
        Collector c = new Collector();
        CellResult r = session.run("for (int i = 0; i < 100_000; i++) System.out.println(i);", c);
        assertTrue(r.ok());
        StringBuilder expected = new StringBuilder();
        for (int i = 0; i < 100_000; i++) {
            expected.append(i).append('\n');
        }
        assertEquals(expected.toString(), c.text(false));
        // 589 KB of text: chunks of up to 8 KB or 50 ms, never one event per line
        assertTrue(c.events.size() < 1_000, "output flooded: " + c.events.size() + " chunks");
    }

    @Test
    void outputOfThreadsStartedByTheCellIsCaptured() {
        Collector c = new Collector();
        CellResult r = session.run("Thread t = new Thread(() -> System.out.println(\"from a worker\"));\nt.start(); t.join();\n"
                + "java.util.stream.IntStream.range(0, 4).parallel().forEach(i -> System.out.print(\"\"));\n"
                + "java.util.concurrent.ForkJoinPool.commonPool().submit(() -> System.out.println(\"from the pool\")).get();", c);
        assertTrue(r.ok(), () -> r.error().toString());
        assertEquals("from a worker\nfrom the pool\n", c.text(false));
    }

    @Test
    void classesAndRedefinitionsAcrossCells() {
        assertTrue(run("record Trap(int atoms, double slowHz) { double ratio() { return 4.0; } }").ok());
        CellResult r = run("new Trap(2000, 24.0).atoms()");
        assertEquals(2000, r.raw().orElseThrow());
        assertTrue(run("int atomsNow = 1;").ok());
        assertTrue(run("String atomsNow = \"redefined\";").ok());
        assertEquals("redefined", run("atomsNow").raw().orElseThrow());
        CellResult empty = run("// only a comment\n");
        assertTrue(empty.ok() && empty.value().isEmpty());
        assertEquals(12, run("10 + 2 // trailing comment").raw().orElseThrow());
    }

    @Test
    void outputIsRoutedAgainAfterACellReplacedSystemOut() {
        assertTrue(run("System.setOut(new PrintStream(OutputStream.nullOutputStream()));").ok());
        Collector c = new Collector();
        assertTrue(session.run("System.out.println(\"visible again\");", c).ok());
        assertEquals("visible again\n", c.text(false));
    }

    @Test
    void aFailingOutputSinkDoesNotBreakTheCell() {
        CellOutput broken = new CellOutput() {
            @Override
            public void stream(boolean stderr, String text) {
                throw new IllegalStateException("channel closed");
            }

            @Override
            public void display(MimeBundle bundle, String displayId, boolean update) {
                throw new IllegalStateException("channel closed");
            }
        };
        CellResult r = session.run("System.out.println(\"lost\");\nshow(\"lost too\");\n5 * 5", broken);
        assertTrue(r.ok(), () -> r.error().toString());
        assertEquals(25, r.raw().orElseThrow());
    }

    @Test
    void standardInputIsEmptyInACell() {
        java.io.InputStream before = System.in;
        // Source: JDK 17 API, InputStream.read() returns -1 at end of stream
        assertEquals(-1, run("System.in.read()").raw().orElseThrow());
        assertSame(before, System.in);
    }

    @Test
    void interruptWithoutRunningCellDoesNothing() {
        session.interrupt();
        assertTrue(run("int afterIdleInterrupt = 1;").ok());
    }

    @Test
    void completionGivesJShellSuggestionsWithReplacementRange() {
        String code = "int k = 1;\nMath.ab";
        Completions c = session.complete(code, code.length());
        // Source: JDK 17 API, java.lang.Math has abs(...) and absExact(...)
        assertTrue(c.matches().contains("abs("), c.toString());
        assertTrue(c.matches().contains("absExact("), c.toString());
        assertEquals(code.indexOf("ab"), c.start());
        assertEquals(code.length(), c.end());
    }

    @Test
    void inspectionGivesSignatures() {
        String code = "Math.floorMod(";
        String doc = session.inspect(code, code.length()).orElseThrow();
        // Source: JDK 17 API, Math.floorMod(int x, int y)
        assertTrue(doc.contains("floorMod(int x, int y)"), doc);
        String onName = "Math.floorMod";
        assertTrue(session.inspect(onName, 8).orElseThrow().contains("floorMod(long x, long y)"));
        assertTrue(session.inspect("   ", 1).isEmpty());
    }

    @Test
    void completenessOfCells() {
        assertEquals(Completeness.Status.COMPLETE, session.completeness("int a = 1;\nint b = 2").status());
        Completeness open = session.completeness("int f(int x) {\n    if (x > 0) {");
        assertEquals(Completeness.Status.INCOMPLETE, open.status());
        assertEquals("        ", open.indent());
        assertEquals(Completeness.Status.INCOMPLETE, session.completeness("int a = 1;\nint b =").status());
        assertEquals(Completeness.Status.INVALID, session.completeness("int a = 1;\n)))").status());
        assertEquals(Completeness.Status.COMPLETE, session.completeness("").status());
    }

    @Test
    void progressIsThrottledAndEndsAtFullCount() {
        Collector c = new Collector();
        CellResult r = session.run("var p = progress(\"levels\");\nfor (int i = 1; i <= 200_000; i++) p.progress(i, 200_000, \"sum\");", c);
        assertTrue(r.ok(), () -> r.error().toString());
        List<Collector.Event> d = c.displays();
        assertFalse(d.get(0).update());
        String id = d.get(0).id();
        assertTrue(id != null && d.stream().allMatch(e -> id.equals(e.id())));
        assertTrue(d.stream().skip(1).allMatch(Collector.Event::update));
        assertTrue(d.size() <= ProgressDisplay.MAX_UPDATES + 1, "too many updates: " + d.size());
        // the finished display is one line without the bar, so no bar stays in a saved notebook
        assertEquals("levels, sum: done (200,000 of 200,000)", d.get(d.size() - 1).bundle().plain());
        // every earlier display is the bar (the start, or a throttled update), none says done
        assertTrue(d.subList(0, d.size() - 1).stream().map(e -> e.bundle().plain())
                .allMatch(p -> p.startsWith("levels, ") && p.contains("%)  ") && !p.contains("done")), d.toString());
    }

    @Test
    void progressUpdatesAtMostTenPerSecond() {
        Collector c = new Collector();
        CellResult r = session.run("var p = progress(\"slow\");\nfor (int i = 1; i <= 60; i++) { Thread.sleep(10); p.progress(i, 60, \"\"); }", c);
        assertTrue(r.ok());
        List<Collector.Event> d = c.displays();
        double seconds = (d.get(d.size() - 1).nanos() - d.get(0).nanos()) / 1e9;
        // at most one update per 100 ms, plus the first display and the final report
        assertTrue(d.size() - 2 <= Math.ceil(seconds * 10) + 1, d.size() + " displays in " + seconds + " s");
        assertEquals("slow: done (60 of 60)", d.get(d.size() - 1).bundle().plain());
    }
}
