package org.microtally.special;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.math.BigDecimal;
import java.util.List;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import org.microtally.MeasuredAccuracy;

/**
 * Every row of the committed 30-digit reference table against our double routines.
 *
 * <p>Source: special/reference-mpmath.csv, written by special/generate_reference.py with mpmath
 * 1.3.0 (each value confirmed by a second independent mpmath route to 20 digits).
 */
class ReferenceTableTest {
    /** The stated accuracy of Zeta, Polylog and FermiDirac. */
    static final double RELATIVE = 1e-13;

    record Row(String function, String a, String b, BigDecimal value) { }

    static List<Row> rows() throws IOException {
        return MeasuredAccuracy.rows(ReferenceTableTest.class, "/special/reference-mpmath.csv").stream()
                .map(f -> new Row(f[0], f[1], f[2], new BigDecimal(f[3]))).toList();
    }

    static Stream<Arguments> table() throws IOException {
        return rows().stream().map(row -> Arguments.of(row.function(), row.a(), row.b(), row.value()));
    }

    @ParameterizedTest(name = "{0}({1}, {2})")
    @MethodSource("table")
    void matchesMpmath(String function, String a, String b, BigDecimal reference) {
        double x = Double.parseDouble(a);
        double actual = switch (function) {
            case "zeta" -> Zeta.zeta(x);
            case "polylog" -> Polylog.li(x, Double.parseDouble(b));
            case "fermidirac" -> FermiDirac.integral(x, Double.parseDouble(b));
            default -> throw new AssertionError("unknown function " + function);
        };
        double expected = reference.doubleValue();
        // Source: special/reference-mpmath.csv (mpmath 1.3.0, 30 digits)
        if (expected == 0.0) {
            // an exact zero of the function (e.g. Li_-2(-1) = 0): absolute bound
            assertEquals(0.0, actual, 1e-15, function + "(" + a + ", " + b + ")");
        } else {
            double rel = Math.abs(actual - expected) / Math.abs(expected);
            assertTrue(rel <= RELATIVE, function + "(" + a + ", " + b + ") = " + actual + ", reference " + reference
                    + ", relative error " + rel);
        }
    }

    @Test
    void tableCoversAllThreeFunctions() throws IOException {
        List<Row> rows = rows();
        assertTrue(rows.stream().filter(r -> r.function().equals("zeta")).count() >= 10);
        assertTrue(rows.stream().filter(r -> r.function().equals("polylog")).count() >= 300);
        assertTrue(rows.stream().filter(r -> r.function().equals("fermidirac")).count() >= 200);
    }
}
