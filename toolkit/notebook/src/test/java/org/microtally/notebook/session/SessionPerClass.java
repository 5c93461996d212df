package org.microtally.notebook.session;

import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.TestInstance;

/**
 * Test fixture: one {@link Session} for all tests of a class, opened with the test instance and
 * closed after the last test. For classes whose cells leave the session usable for the next test.
 */
@TestInstance(TestInstance.Lifecycle.PER_CLASS)
abstract class SessionPerClass {
    final Session session = Session.open();

    @AfterAll
    final void closeSession() {
        session.close();
    }

    /** Runs one cell on the shared session, its output collected and dropped. */
    final CellResult run(String code) {
        return session.run(code, new Collector());
    }
}
