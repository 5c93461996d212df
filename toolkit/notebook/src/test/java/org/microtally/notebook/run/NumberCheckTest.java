package org.microtally.notebook.run;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.StringReader;
import java.math.BigDecimal;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;

class NumberCheckTest {
    /** A notebook of one markdown cell and one code cell with a stream and a result. */
    static Notebook executed(String stdout, String result) throws NotebookFormatException {
        String json = "{\"nbformat\": 4, \"nbformat_minor\": 5, \"metadata\": {}, \"cells\": ["
                + "{\"cell_type\": \"markdown\", \"metadata\": {}, \"source\": \"# trap\"},"
                + "{\"cell_type\": \"code\", \"metadata\": {}, \"execution_count\": 1, \"source\": \"x\", \"outputs\": ["
                + "{\"output_type\": \"stream\", \"name\": \"stdout\", \"text\": [\"" + stdout + "\"]},"
                + "{\"output_type\": \"execute_result\", \"execution_count\": 1, \"metadata\": {}, \"data\": "
                + "{\"text/plain\": [\"" + result + "\"], \"text/html\": [\"<b>ignored 1</b>\"]}}]}]}";
        return Notebook.parse(new StringReader(json), "test");
    }

    @Test
    void equalNotebooksAgreeAndEveryNumberIsCounted() throws NotebookFormatException {
        Notebook a = executed("N0/N = 0.8123, T = 12.5 nK, 2,000 atoms\\n", "Omega = 1.0e-7 of 3");
        NumberCheck.Report r = new NumberCheck(0, 0).compare(a, executed("N0/N = 0.8123, T = 12.5 nK, 2,000 atoms\\n",
                "Omega = 1.0e-7 of 3"));
        assertTrue(r.agrees(), r.differences().toString());
        // 0.8123, 12.5, 2,000 in the stream; 1.0e-7 and 3 in the result; "N0" is a word (common practice, no source)
        assertEquals(5, r.numbersCompared());
        assertEquals(1, r.cellsCompared());
    }

    @Test
    void aChangedNumberIsReportedWithItsCellAndOutput() throws NotebookFormatException {
        Notebook a = executed("N0/N = 0.8123\\n", "C/(Nk) = 2.75");
        Notebook b = executed("N0/N = 0.8123\\n", "C/(Nk) = 2.76");
        NumberCheck.Report r = new NumberCheck(1e-9, 0).compare(a, b);
        assertEquals(1, r.differences().size(), r.differences().toString());
        NumberCheck.Difference d = r.differences().get(0);
        assertEquals(2, d.cell());
        assertEquals(2, d.output());
        // |2.75 - 2.76| / 2.76 = 3.6e-3 (arithmetic; common practice, no source)
        assertEquals("cell 2, output 2: 2.75 against 2.76 (relative difference 0.0036)", d.describe());
    }

    @Test
    void theToleranceDecides() throws NotebookFormatException {
        Notebook a = executed("E = 1.0000001e5\\n", "0");
        Notebook b = executed("E = 1.0000002e5\\n", "0");
        // relative difference 1e-7 / 1.0000002 = 9.9999980e-8 (arithmetic; common practice, no source)
        assertFalse(new NumberCheck(1e-8, 0).compare(a, b).agrees());
        assertTrue(new NumberCheck(1e-7, 0).compare(a, b).agrees());
        Notebook z1 = executed("mu = 1e-20\\n", "0");
        Notebook z2 = executed("mu = -3e-20\\n", "0");
        assertFalse(new NumberCheck(1e-3, 0).compare(z1, z2).agrees());
        assertTrue(new NumberCheck(1e-3, 1e-19).compare(z1, z2).agrees());
    }

    @Test
    void changedWordsAndLongCountsAreDifferences() throws NotebookFormatException {
        NumberCheck.Report words = new NumberCheck(1, 0).compare(executed("converged: true\\n", "1"), executed("converged: false\\n", "1"));
        assertEquals(1, words.differences().size());
        assertTrue(words.differences().get(0).what().contains("\"stdout: converged: true\" against \"stdout: converged: false\""),
                words.differences().toString());
        // exact counts beyond double range: 400 digits differing in the last one are not equal at tolerance 0
        String big = "9".repeat(399);
        NumberCheck.Report counts = new NumberCheck(0, 0).compare(executed("Omega = " + big + "8\\n", "1"),
                executed("Omega = " + big + "9\\n", "1"));
        assertEquals(1, counts.differences().size(), counts.differences().toString());
        assertTrue(new NumberCheck(1e-300, 0).compare(executed("Omega = " + big + "8\\n", "1"),
                executed("Omega = " + big + "9\\n", "1")).agrees());
    }

    @Test
    void numbersAreReadWithSignsGroupsAndExponents() {
        List<String> n = new ArrayList<>();
        String words = NumberCheck.split("x = -1.5e-3, y = \u22122, 12,345 atoms, N0 at .5, list [1, 2]", n);
        assertEquals(List.of("-1.5e-3", "\u22122", "12,345", ".5", "1", "2"), n);
        assertEquals("x = #, y = #, # atoms, N0 at #, list [#, #]", words);
        assertEquals(0, new BigDecimal("-2").compareTo(NumberCheck.parse("\u22122")));
        assertEquals(0, new BigDecimal("12345").compareTo(NumberCheck.parse("12,345")));
    }

    @Test
    void badTolerancesAreRefused() {
        assertThrows(IllegalArgumentException.class, () -> new NumberCheck(-1, 0));
        assertThrows(IllegalArgumentException.class, () -> new NumberCheck(0, Double.NaN));
    }
}
