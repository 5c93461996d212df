package org.microtally.notebook.session;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;

class ProvenanceTest {

    @Test
    void seedsAreReadFromTheCellsAndUnseededSourcesFlagged() {
        // hand-written cells (common practice, no source): cell 1 markdown, 2 a seeded Random and a
        // seeded speed sample, 3 Math.random, 4 an unseeded Random, 5 a seed only in a comment
        List<String> cells = List.of("",
                "var rnd = new java.util.Random(20261202L);\ndouble[] v = gas.sampleSpeeds(1000, seed);",
                "double x = Math.random();",
                "Random r = new Random();",
                "// new Random(99) was used before\nint quanta = 100;");
        Provenance p = Provenance.of("microtally run", cells);
        assertEquals(List.of(new Provenance.Seed(2, "Random", "20261202L"), new Provenance.Seed(2, "sampleSpeeds", "seed")),
                p.seeds());
        assertEquals(List.of(3, 4), p.unseededCells());
        assertEquals("microtally run", p.executedBy());
    }

    @Test
    void withoutTheBuildRecordVersionAndCommitAreUnknownAndTheRecordSaysWhy() {
        // the notebook module's tests run without the kernel module's build record on the class path
        Provenance p = Provenance.of("microtally kernel", null);
        assertEquals("unknown", p.commit());
        assertEquals("unknown", p.toolkitVersion());
        assertTrue(p.buildRecord().startsWith("missing: " + Provenance.BUILD_RECORD), p.buildRecord());
        Map<String, Object> m = p.asMap();
        assertEquals("not recorded: no notebook was scanned", m.get("seeds"));
        // Source: JEP 322 version string: the feature release leads java.specification.version's number
        assertTrue(p.javaVersion().startsWith(System.getProperty("java.specification.version")), p.javaVersion());
    }
}
