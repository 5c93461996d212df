/**
 * The evaluation engine: a JShell session in the same JVM with the toolkit on its class path and
 * a documented set of imports, running one notebook cell at a time.
 *
 * <p>API contract: the interface {@link org.microtally.notebook.session.Engine}, used by both front
 * doors (the Jupyter kernel and the headless runner); implementation
 * {@link org.microtally.notebook.session.Session}:
 * <pre>
 * Engine e = Session.open();                        // imports (see Session) and the display helpers
 * CellResult r = e.run(code, cellOutput);           // blocks until the cell ends
 * e.interrupt();                                    // from another thread: stops the running cell
 * Completions c = e.complete(code, cursor);         // JShell completion suggestions, replacement range
 * Optional&lt;String&gt; doc = e.inspect(code, cursor); // signatures and first Javadoc sentence
 * Completeness k = e.completeness(code);            // complete / incomplete (+ indent) / invalid
 * e.close();                                        // also stops threads the cells left running
 * Session.consoleOut(), Session.consoleErr()        // the process's real streams (never routed to a cell)
 * </pre>
 *
 * <p>Outcomes are values: {@link org.microtally.notebook.session.CellResult.Outcome} (OK,
 * COMPILE_ERROR, RUNTIME_ERROR, OUT_OF_MEMORY, INTERRUPTED); progress displays arrive through
 * {@link org.microtally.notebook.session.CellOutput#progress}, other displays through
 * {@code display}.
 *
 * <p>Threads and order: {@code run} blocks its caller; {@code interrupt} is called from another
 * thread and makes {@code run} return INTERRUPTED. Stdout, stderr and displays of a cell go through
 * one ordered queue ({@code CellContext}), so the {@link org.microtally.notebook.session.CellOutput}
 * receives them in the order the cell wrote them, one call at a time, all before {@code run}
 * returns (except output of threads the cell leaves running). Text is batched there only (8 KiB or
 * 50 ms). While a cell runs, {@code System.out}/{@code System.err} writes from threads outside any
 * session go to that cell too: write engine diagnostics to {@code Session.consoleErr()}.
 *
 * <p>Inside: {@code CellSplitter} (snippets, lines and columns), {@code CellErrors} (error reports,
 * stack remapping and folding), {@code CodeAssist} (completion, inspection, completeness),
 * {@code EngineClassPath}, {@code PackageProbe}, {@code EngineControl} (JShell execution on
 * stoppable threads), {@code SnippetLoader} with {@code ExitCallRewriter} (ASM) and
 * {@link org.microtally.notebook.session.ExitGuard}, {@code OutputRouter}.
 *
 * <p>Cell code sees the static helpers of {@link org.microtally.notebook.session.Display}:
 * {@code show(Object)}, {@code show(MimeBundle)}, {@code html(String)}, {@code markdown(String)},
 * {@code latex(String)}, {@code progress(String label)} (a throttled, in-place updated
 * {@link org.microtally.ProgressListener}).
 */
package org.microtally.notebook.session;
