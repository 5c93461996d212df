/**
 * The evaluation engine: a JShell session in the same JVM with the toolkit on its class path and
 * its packages imported, running one notebook cell at a time.
 *
 * <p>API contract (implementation class {@code Session}):
 * <pre>
 * Session s = Session.open();                       // imports org.microtally.* and the display helpers
 * CellResult r = s.run(code, cellOutput);           // blocks until the cell ends
 * s.interrupt();                                    // from another thread: stops the running cell
 * Completions c = s.complete(code, cursor);         // JShell completion suggestions
 * Optional&lt;String&gt; doc = s.inspect(code, cursor); // signature and first Javadoc sentence
 * Completeness k = s.completeness(code);            // complete / incomplete / invalid
 * s.close();
 * </pre>
 */
package org.microtally.notebook.session;
