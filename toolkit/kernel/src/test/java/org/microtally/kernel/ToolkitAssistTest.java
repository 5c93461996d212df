package org.microtally.kernel;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.microtally.notebook.session.CellOutput;
import org.microtally.notebook.session.Completions;
import org.microtally.notebook.session.DocIndex;
import org.microtally.notebook.session.Session;

/**
 * Inspection and completion on real toolkit classes, with the Javadoc summaries the kernel module's
 * build writes (target/classes is on this test's class path, as the resource is in the shaded jar).
 * Expected texts are quoted from the Javadoc in toolkit/core's sources (CountTable, Statistics).
 */
class ToolkitAssistTest {
    private static Session session;

    @BeforeAll
    static void open() {
        session = Session.open();
        assertTrue(session.run("Spectrum sp = Spectra.harmonicOscillator(1, 10);\nint quanta = 40;\nString label = \"trap\";",
                CellOutput.DISCARD).ok());
    }

    @AfterAll
    static void close() {
        session.close();
    }

    @Test
    void theShippedIndexCoversTheToolkit() {
        DocIndex index = DocIndex.shipped();
        assertTrue(index.size() > 500, "only " + index.size() + " entries");
        // Source: toolkit/core CountTable.of(Spectrum, Statistics, int, int, ProgressListener) Javadoc
        DocIndex.Entry of = index.lookup("CountTable CountTable.of(Spectrum spectrum, Statistics statistics, int maxParticles, "
                + "int maxEnergy, org.microtally.ProgressListener progress)").orElseThrow();
        assertEquals("E >= 0, in quanta of the spectrum's unit", of.params().get("maxEnergy"));
    }

    @Test
    void inspectingACallShowsFirstSentenceSignatureAndParameterDocsWithUnits() {
        String code = "CountTable.of(";
        String doc = session.inspect(code, code.length()).orElseThrow();
        // Source: toolkit/core CountTable.java Javadoc of both overloads of of(...)
        assertTrue(doc.contains("CountTable.of(Spectrum spectrum, Statistics statistics, int maxParticles, int maxEnergy)"), doc);
        assertTrue(doc.contains("Builds the table, reporting progress per level"), doc);
        assertTrue(doc.contains("maxEnergy     E >= 0, in quanta of the spectrum's unit"), doc);
        // the four-argument overload documents no @param itself: its parameters share the other overload's docs
        String first = doc.substring(0, doc.indexOf("\nCountTable CountTable.of(", 1) < 0 ? doc.length()
                : doc.indexOf("\nCountTable CountTable.of(", 1));
        assertTrue(first.contains("spectrum      levels with integer energies >= 0"), first);
    }

    @Test
    void inspectingAClassNameShowsItsFirstSentence() {
        String doc = session.inspect("CountTable", 4).orElseThrow();
        // Source: toolkit/core CountTable.java class Javadoc, first sentence
        assertTrue(doc.contains("Exact microstate counts Omega(n, e)"), doc);
    }

    @Test
    void completingAnArgumentOffersWhatFitsFirst() {
        Completions first = session.complete("CountTable.of(", 14);
        // Source: CountTable.of's first parameter is a Spectrum; sp is the only Spectrum in scope
        assertEquals(List.of("sp"), first.matches(), first.toString());
        assertEquals("variable", first.kinds().get(0));
        assertEquals(2, first.signatures().size(), first.signatures().toString());

        String second = "CountTable.of(sp, ";
        Completions stats = session.complete(second, second.length());
        // Source: toolkit/core Statistics.java: public constants DISTINGUISHABLE, BOSE, FERMI
        assertTrue(stats.matches().containsAll(List.of("Statistics.BOSE", "Statistics.FERMI", "Statistics.DISTINGUISHABLE")),
                stats.toString());
        assertTrue(stats.matches().size() < 10, "unrelated names offered: " + stats.matches());

        String third = "CountTable.of(sp, Statistics.BOSE, ";
        Completions n = session.complete(third, third.length());
        assertEquals("quanta", n.matches().get(0), n.matches().toString());
        assertTrue(!n.matches().contains("label"), "a String offered for an int: " + n.matches());

        // after a typed prefix the other names in scope follow the fitting ones
        String typed = "CountTable.of(sp, Statistics.B";
        Completions b = session.complete(typed, typed.length());
        assertTrue(b.matches().contains("BOSE"), b.toString());
    }

    @Test
    void theCompleteReplyCarriesKindsAndOverloads() {
        Completions c = session.complete("CountTable.of(", 14);
        var meta = Requests.completionMetadata(c, 14, 14);
        // Source: JupyterLab's completion reply metadata _jupyter_types_experimental (start, end, text, type, signature)
        @SuppressWarnings("unchecked")
        List<java.util.Map<String, Object>> items = (List<java.util.Map<String, Object>>) meta.get("_jupyter_types_experimental");
        assertEquals("sp", items.get(0).get("text"));
        assertEquals("variable", items.get(0).get("type"));
        assertTrue(items.get(0).get("signature").toString().contains("ProgressListener"), items.toString());
        assertEquals(c.signatures(), meta.get("microtally_signatures"));
    }
}
