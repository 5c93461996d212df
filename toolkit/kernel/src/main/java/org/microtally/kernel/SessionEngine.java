package org.microtally.kernel;

import java.util.Optional;
import org.microtally.notebook.session.CellOutput;
import org.microtally.notebook.session.CellResult;
import org.microtally.notebook.session.Completions;
import org.microtally.notebook.session.Session;

/** The production {@link CellEngine}: the notebook module's JShell {@link Session}, one per kernel session. */
final class SessionEngine implements CellEngine {
    private final Session session;

    private SessionEngine(Session session) {
        this.session = session;
    }

    /** Opens a fresh JShell session with the toolkit imported. */
    static CellEngine open() {
        return new SessionEngine(Session.open());
    }

    @Override
    public CellResult run(String code, CellOutput output) {
        return session.run(code, output);
    }

    @Override
    public void interrupt() {
        session.interrupt();
    }

    @Override
    public Completion complete(String code, int cursor) {
        Completions c = session.complete(code, cursor);
        return new Completion(c.matches(), c.start(), c.end());
    }

    @Override
    public Optional<String> inspect(String code, int cursor) {
        return session.inspect(code, cursor);
    }

    @Override
    public CellEngine.Completeness completeness(String code) {
        org.microtally.notebook.session.Completeness k = session.completeness(code);
        CellEngine.Completeness.Kind kind = switch (k.status()) {
            case COMPLETE -> CellEngine.Completeness.Kind.COMPLETE;
            case INCOMPLETE -> CellEngine.Completeness.Kind.INCOMPLETE;
            case INVALID -> CellEngine.Completeness.Kind.INVALID;
        };
        return new CellEngine.Completeness(kind, k.indent());
    }

    @Override
    public void close() {
        session.close();
    }
}
