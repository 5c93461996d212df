package org.microtally.notebook.session;

import java.util.List;
import java.util.Optional;
import jdk.jshell.JShell;
import jdk.jshell.JShellException;
import jdk.jshell.Snippet;
import jdk.jshell.SnippetEvent;

/**
 * Evaluates one snippet of a cell, and is the only place the engine changes JShell's state
 * ({@link #eval}, {@link #drop}), so that {@link RepeatedSnippet} knows when its kept snippet still
 * applies. Three routes: the re-run of the kept snippet (same source, nothing changed since), the
 * shorter route of {@link ValueExpression} for an expression, and the snippet as written.
 */
final class SnippetEvaluator {
    /**
     * What evaluating a snippet gave: JShell's own event, or the outcome of a re-run.
     *
     * @param exception    JShell's report of a runtime exception (null if none, and always for re-runs)
     * @param rerun        true when the kept snippet was re-run without JShell.eval
     * @param rerunFailed  true when that re-run threw (the throwable is {@link EngineControl#lastThrown()})
     */
    record Evaluated(Snippet snippet, Snippet.Status status, JShellException exception, boolean rerun, boolean rerunFailed) {
        static Evaluated of(SnippetEvent e) {
            return e == null ? null : new Evaluated(e.snippet(), e.status(), e.exception(), false, false);
        }
    }

    private final JShell jshell;
    private final EngineControl control;
    private final RepeatedSnippet repeated = new RepeatedSnippet();
    /** The last snippet evaluated on the route of {@link ValueExpression} (its value is the cell's value). */
    private Snippet valueRoute;

    SnippetEvaluator(JShell jshell, EngineControl control) {
        this.jshell = jshell;
        this.control = control;
    }

    /** JShell.eval, counted as a change of state. */
    List<SnippetEvent> eval(String source) {
        repeated.changed();
        return jshell.eval(source);
    }

    /** JShell.drop, counted as a change of state. */
    void drop(Snippet s) {
        repeated.changed();
        jshell.drop(s);
    }

    /** True when {@code s} was evaluated on the value route (its value is {@link EngineControl#lastValue()}). */
    boolean onValueRoute(Snippet s) {
        return s == valueRoute;
    }

    /**
     * Evaluates one snippet and returns its own outcome (not that of snippets it updated), or null
     * when it produced none. An expression goes the shorter route of {@link ValueExpression} when
     * it can (re-running the kept class when the same declaration was the last thing evaluated);
     * when that declaration is not valid it ran nothing, is removed, and the snippet is evaluated as
     * written (so its errors are reported as JShell reports them).
     */
    Evaluated evaluate(String source) throws InterruptedException {
        Optional<String> declaration = ValueExpression.declaration(source);
        if (declaration.isPresent()) {
            String d = declaration.get();
            Optional<RepeatedSnippet.Kept> kept = repeated.lookup(source, jshell);
            if (kept.isPresent()) {
                return rerun(kept.get());
            }
            int before = control.invocations();
            SnippetEvent main = mainEvent(eval(d));
            if (main != null && (main.status() == Snippet.Status.VALID || control.stopRequested())) {
                valueRoute = main.snippet();
                boolean clean = main.status() == Snippet.Status.VALID && main.exception() == null
                        && !control.stopRequested() && control.invocations() == before + 1;
                if (clean) {
                    repeated.keep(source, main.snippet(), control.lastBody());
                }
                return Evaluated.of(main);
            }
            if (main != null && main.status().isActive()) {
                drop(main.snippet());
            }
            control.resetCapture();
        }
        return Evaluated.of(mainEvent(eval(source)));
    }

    private Evaluated rerun(RepeatedSnippet.Kept kept) throws InterruptedException {
        valueRoute = kept.snippet();
        boolean ok = control.rerun(kept.body());
        if (!ok) {
            repeated.forget();   // the next identical cell compiles again: simpler than reasoning about a half-run body
        }
        return new Evaluated(kept.snippet(), Snippet.Status.VALID, null, true, !ok);
    }

    private static SnippetEvent mainEvent(List<SnippetEvent> events) {
        return events.stream().filter(e -> e.causeSnippet() == null).findFirst().orElse(null);
    }
}
