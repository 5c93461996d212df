package org.microtally.special;

import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStream;
import java.io.InputStreamReader;
import java.math.BigDecimal;
import java.math.MathContext;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;

/**
 * The accuracy each special function states (its MAX_RELATIVE_ERROR constant, quoted in its Javadoc
 * and the README) is the measured maximum over the committed mpmath tables: the test fails if any
 * row is worse, and also if the statement is more than twice the measured maximum (so it stays a
 * measurement, not a loose promise).
 *
 * <p>Source: special/reference-mpmath.csv (generate_reference.py), special/zeta-grid-mpmath.csv
 * (generate_zeta_grid.py) and special/fd-grid-mpmath.csv (generate_fd_grid.py), all mpmath 1.3.0,
 * 30 digits, each value confirmed by a second route.
 */
class StatedAccuracyTest {

    private static List<String[]> rows(String resource) throws IOException {
        List<String[]> rows = new ArrayList<>();
        try (InputStream in = StatedAccuracyTest.class.getResourceAsStream(resource);
             BufferedReader r = new BufferedReader(new InputStreamReader(in, StandardCharsets.UTF_8))) {
            String line;
            while ((line = r.readLine()) != null) {
                if (!line.isBlank() && !line.startsWith("#")) {
                    rows.add(line.split(",", -1));
                }
            }
        }
        return rows;
    }

    /** |actual - reference| / |reference|, the difference taken in decimal so it is exact. */
    private static double relative(double actual, String reference) {
        BigDecimal ref = new BigDecimal(reference);
        return new BigDecimal(actual).subtract(ref).abs().divide(ref.abs(), MathContext.DECIMAL64).doubleValue();
    }

    private interface Evaluation {
        double at(double a, double b);
    }

    private static double worst(String function, Evaluation f, double minA, double maxA, String... resources)
            throws IOException {
        double worst = 0;
        String where = "";
        int counted = 0;
        for (String resource : resources) {
            for (String[] r : rows(resource)) {
                if (!r[0].equals(function) || new BigDecimal(r[3]).signum() == 0) {
                    continue;
                }
                double a = Double.parseDouble(r[1]);
                if (a < minA || a > maxA) {
                    continue;
                }
                double b = r[2].isEmpty() ? Double.NaN : Double.parseDouble(r[2]);
                double rel = relative(f.at(a, b), r[3]);
                counted++;
                if (rel > worst) {
                    worst = rel;
                    where = r[1] + ", " + r[2];
                }
            }
        }
        assertTrue(counted >= 10, function + ": only " + counted + " reference rows");
        System.out.printf("%s: worst relative error %.3g at (%s) over %d rows%n", function, worst, where, counted);
        return worst;
    }

    private static void assertStated(String function, double worst, double stated) {
        // Source: the mpmath tables named in the class comment
        assertTrue(worst <= stated, function + ": measured " + worst + " above the stated " + stated);
        // common practice, no source: a stated figure within 2x of the measurement
        assertTrue(stated <= 2 * worst, function + ": stated " + stated + " is loose against the measured " + worst);
    }

    @Test
    void zetaMeetsItsStatedAccuracy() throws IOException {
        double worst = worst("zeta", (s, unused) -> Zeta.zeta(s), 1, Double.POSITIVE_INFINITY,
                "/special/reference-mpmath.csv", "/special/zeta-grid-mpmath.csv");
        assertStated("zeta", worst, Zeta.MAX_RELATIVE_ERROR);
    }

    @Test
    void polylogMeetsItsStatedAccuracy() throws IOException {
        double worst = worst("polylog", Polylog::li, -2, 30, "/special/reference-mpmath.csv");
        assertStated("polylog", worst, Polylog.MAX_RELATIVE_ERROR);
    }

    @Test
    void fermiDiracMeetsItsStatedAccuracy() throws IOException {
        double worst = worst("fermidirac", FermiDirac::integral, -1, 20, "/special/reference-mpmath.csv",
                "/special/fd-grid-mpmath.csv");
        assertStated("Fermi-Dirac", worst, FermiDirac.MAX_RELATIVE_ERROR);
    }
}
