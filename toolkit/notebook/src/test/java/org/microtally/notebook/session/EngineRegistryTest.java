package org.microtally.notebook.session;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.Timeout;
import org.microtally.notebook.render.Renderers;

/** Each engine owns its renderer registry: a renderer one notebook adds changes only that notebook's displays. */
@Timeout(value = 120, unit = TimeUnit.SECONDS)
class EngineRegistryTest {
    static final String SHELL = "record Shell(int electrons) { }";

    @Test
    void aRendererAddedInOneSessionStaysInThatSession() {
        try (Session a = Session.open(); Session b = Session.open()) {
            assertTrue(a.run(SHELL, new Collector()).ok());
            assertTrue(b.run(SHELL, new Collector()).ok());
            var put = a.run("renderers().put(Shell.class, s -> MimeBundle.text(\"closed shell of \" + s.electrons()));", new Collector());
            assertTrue(put.ok(), () -> put.error().toString());

            Collector shownA = new Collector();
            var ra = a.run("show(new Shell(6));\nnew Shell(12)", shownA);
            assertTrue(ra.ok(), () -> ra.error().toString());
            assertEquals("closed shell of 6", shownA.displays().get(0).bundle().plain());
            assertEquals("closed shell of 12", ra.value().orElseThrow().plain());

            Collector shownB = new Collector();
            var rb = b.run("show(new Shell(6));\nnew Shell(12)", shownB);
            assertTrue(rb.ok());
            // the record's own toString (Java's record format; common practice, no source)
            assertEquals("Shell[electrons=6]", shownB.displays().get(0).bundle().plain());
            assertEquals("Shell[electrons=12]", rb.value().orElseThrow().plain());
        }
        // the shared default registry outside any engine was not touched either
        assertEquals("42", Renderers.render(42).plain());
        assertTrue(Display.renderers() == Renderers.standard());
    }
}
