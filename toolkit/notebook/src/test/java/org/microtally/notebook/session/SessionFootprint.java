package org.microtally.notebook.session;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;

/**
 * A measurement, not a test: session start time, trivial-cell time and the resident set size of
 * the JVM over a long session of 55 cells. Run it with the JVM flags under study, e.g.
 * <pre>
 * mvn -B -q -o -pl toolkit/core,toolkit/notebook test-compile dependency:build-classpath \
 *     -Dmdep.includeScope=test -Dmdep.outputFile=/tmp/microtally-notebook.classpath
 * java -Xmx1g -XX:+UseSerialGC \
 *     -cp toolkit/notebook/target/test-classes:toolkit/notebook/target/classes:$(cat /tmp/microtally-notebook.classpath) \
 *     org.microtally.notebook.session.SessionFootprint
 * </pre>
 * (the session needs the notebook module's whole class path, Tablesaw included). The figures quoted in
 * {@link Session}'s documentation and the README come from this program; quote them from there.
 * Each cell allocates and sums a fresh array of 200,000 doubles, defines a method and a record,
 * and prints a line: the kind of work a notebook cell does, not a stress test.
 */
public final class SessionFootprint {
    private SessionFootprint() { }

    public static void main(String[] args) throws IOException {
        long t0 = System.nanoTime();
        Session s = Session.open();
        double openMs = (System.nanoTime() - t0) / 1e6;
        System.out.printf(Locale.ROOT, "session open: %.0f ms, RSS %d MB%n", openMs, rssMb());
        for (int i = 1; i <= 55; i++) {
            String cell = "double[] a" + i + " = new double[200_000];\n"
                    + "for (int j = 0; j < a" + i + ".length; j++) a" + i + "[j] = Math.sqrt(j + " + i + ");\n"
                    + "double sum" + i + "(double[] x) { double t = 0; for (double v : x) t += v; return t; }\n"
                    + "record Row" + i + "(int k, double v) { }\n"
                    + "System.out.println(new Row" + i + "(" + i + ", sum" + i + "(a" + i + ")));\n"
                    + "sum" + i + "(a" + i + ")";
            CellResult r = s.run(cell, CellOutput.DISCARD);
            if (!r.ok()) {
                throw new IllegalStateException("cell " + i + " failed: " + r.error());
            }
            if (i % 11 == 0) {
                System.out.printf(Locale.ROOT, "after %2d cells: RSS %d MB%n", i, rssMb());
            }
        }
        int n = 20;
        long t1 = System.nanoTime();
        for (int i = 0; i < n; i++) {
            s.run("1 + 1", CellOutput.DISCARD);
        }
        System.out.printf(Locale.ROOT, "trivial cell (1 + 1): %.1f ms mean over %d%n", (System.nanoTime() - t1) / 1e6 / n, n);
        System.out.printf(Locale.ROOT, "final RSS %d MB (heap used %d MB, committed %d MB)%n", rssMb(),
                (Runtime.getRuntime().totalMemory() - Runtime.getRuntime().freeMemory()) >> 20, Runtime.getRuntime().totalMemory() >> 20);
        s.close();
    }

    static long rssMb() throws IOException {
        for (String line : Files.readAllLines(Path.of("/proc/self/status"))) {
            if (line.startsWith("VmRSS:")) {
                return Long.parseLong(line.replaceAll("\\D+", "")) / 1024;
            }
        }
        return -1;
    }
}
