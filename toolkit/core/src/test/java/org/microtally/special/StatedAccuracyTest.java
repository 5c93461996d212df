package org.microtally.special;

import java.io.IOException;
import java.math.BigDecimal;
import org.junit.jupiter.api.Test;
import org.microtally.MeasuredAccuracy;

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

    private interface Evaluation {
        double at(double a, double b);
    }

    private static void measure(String function, Evaluation f, double minA, double maxA, double stated,
            String... resources) throws IOException {
        double worst = 0;
        String where = "";
        int counted = 0;
        for (String resource : resources) {
            for (String[] r : MeasuredAccuracy.rows(StatedAccuracyTest.class, resource)) {
                if (!r[0].equals(function) || new BigDecimal(r[3]).signum() == 0) {
                    continue;
                }
                double a = Double.parseDouble(r[1]);
                if (a < minA || a > maxA) {
                    continue;
                }
                double b = r[2].isEmpty() ? Double.NaN : Double.parseDouble(r[2]);
                double rel = MeasuredAccuracy.relative(f.at(a, b), r[3]);
                counted++;
                if (rel > worst) {
                    worst = rel;
                    where = r[1] + ", " + r[2];
                }
            }
        }
        MeasuredAccuracy.assertStated(function + " (worst at " + where + ")", worst, stated, counted);
    }

    @Test
    void zetaMeetsItsStatedAccuracy() throws IOException {
        measure("zeta", (s, unused) -> Zeta.zeta(s), 1, Double.POSITIVE_INFINITY, Zeta.MAX_RELATIVE_ERROR,
                "/special/reference-mpmath.csv", "/special/zeta-grid-mpmath.csv");
    }

    @Test
    void polylogMeetsItsStatedAccuracy() throws IOException {
        measure("polylog", Polylog::li, -2, 30, Polylog.MAX_RELATIVE_ERROR, "/special/reference-mpmath.csv");
    }

    @Test
    void fermiDiracMeetsItsStatedAccuracy() throws IOException {
        measure("fermidirac", FermiDirac::integral, -1, 20, FermiDirac.MAX_RELATIVE_ERROR,
                "/special/reference-mpmath.csv", "/special/fd-grid-mpmath.csv");
    }
}
