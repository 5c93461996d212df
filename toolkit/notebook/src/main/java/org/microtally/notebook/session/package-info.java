/**
 * The evaluation engine: a JShell session in the same JVM with the toolkit on its class path and
 * its packages imported, running one notebook cell at a time.
 *
 * <p>API contract (implementation class {@link org.microtally.notebook.session.Session}):
 * <pre>
 * Session s = Session.open();                       // imports org.microtally.* and the display helpers
 * CellResult r = s.run(code, cellOutput);           // blocks until the cell ends
 * s.interrupt();                                    // from another thread: stops the running cell
 * Completions c = s.complete(code, cursor);         // JShell completion suggestions, replacement range
 * Optional&lt;String&gt; doc = s.inspect(code, cursor); // signatures and first Javadoc sentence
 * Completeness k = s.completeness(code);            // complete / incomplete (+ indent) / invalid
 * s.close();
 * Session.consoleOut(), Session.consoleErr()        // the process's real streams (never routed to a cell)
 * </pre>
 *
 * <p>Threads: {@code run} blocks its caller; {@code interrupt} is called from another thread and
 * makes {@code run} return {@link org.microtally.notebook.session.CellResult.Outcome#INTERRUPTED}.
 * {@link org.microtally.notebook.session.CellOutput} callbacks may come from the cell's thread or the
 * engine's flusher thread, one at a time per cell, all before {@code run} returns. While a cell runs,
 * {@code System.out}/{@code System.err} writes from threads outside any session go to that cell too:
 * write engine diagnostics to {@code Session.consoleErr()}.
 *
 * <p>Cell code sees the static helpers of {@link org.microtally.notebook.session.Display}:
 * {@code show(Object)}, {@code show(MimeBundle)}, {@code html(String)}, {@code markdown(String)},
 * {@code latex(String)}, {@code progress(String label)} (a throttled, in-place updated
 * {@link org.microtally.ProgressListener}).
 */
package org.microtally.notebook.session;
