package org.microtally.notebook.session;

import java.lang.reflect.Method;
import java.util.Optional;
import jdk.jshell.JShell;
import jdk.jshell.Snippet;

/**
 * The engine's one-entry cache of compiled code: the last snippet evaluated on the route of
 * {@link ValueExpression}, kept so that the same source evaluated again, with nothing evaluated or
 * dropped in between, runs the class JShell already compiled for it instead of compiling it again.
 *
 * <p>Why the result is the same: JShell would compile the same declaration
 * {@code Object $value = (EXPRESSION);} against the same environment (no snippet was added,
 * replaced or dropped since, which the engine counts in {@link #changed()}), so the new class would
 * have the same code as the kept one; running the kept class's body again evaluates the expression
 * again (side effects happen again, a new value is made) and assigns it to the same variable. The
 * only thing that does not happen is JShell's bookkeeping of a new snippet replacing the old one,
 * which nothing can observe: the route's variable is the engine's own, and a source that names it
 * (then its old value would be read through a different field) is never kept. Errors of a re-run
 * are reported with the frames translated as JShell translates them ({@link SnippetFrames}), and
 * an interrupt stops it as any snippet (it runs through {@link EngineControl}).
 *
 * <p>Measured with toolkit/bench/kernel-latency.py through the real kernel (2-core machine, load
 * average 12-13, medians of 50 cells): the engine's time for a repeated {@code 1 + 1} was 3.7 ms
 * (round trip 13.6 ms), for a new cell each time 76 ms (round trip 97 ms, almost all of it javac
 * inside JShell); a cell whose source differs from the previous one compiles exactly as before.
 */
final class RepeatedSnippet {
    private long generation;
    private String source;
    private Snippet snippet;
    private Method body;
    private long keptAt = -1;

    /** Counts a change of JShell's state (an eval or a drop); the kept snippet no longer applies. */
    void changed() {
        generation++;
    }

    /**
     * Keeps {@code snippet} (the value route's declaration of the expression {@code source}, just
     * evaluated: valid, its body {@code body} run once without an exception) as the one to re-run;
     * call after {@link #changed()}. A source that names the route's variable is not kept.
     */
    void keep(String source, Snippet snippet, Method body) {
        if (body == null || source.contains(ValueExpression.VARIABLE)) {
            forget();
            return;
        }
        this.source = source;
        this.snippet = snippet;
        this.body = body;
        this.keptAt = generation;
    }

    void forget() {
        source = null;
        snippet = null;
        body = null;
        keptAt = -1;
    }

    /** The kept snippet when {@code source} may re-run it: same source, nothing changed since, still valid. */
    Optional<Kept> lookup(String source, JShell jshell) {
        if (keptAt != generation || this.source == null || !this.source.equals(source)
                || jshell.status(snippet) != Snippet.Status.VALID) {
            return Optional.empty();
        }
        return Optional.of(new Kept(snippet, body));
    }

    /** A kept snippet and the body method of its class. */
    record Kept(Snippet snippet, Method body) { }
}
