package org.microtally;

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

/**
 * The one way a stated accuracy figure (a public constant quoted by {@code {@value}} in Javadoc and by
 * the README's generated accuracy table, see {@link AccuracyTable}) is checked: the test measures the
 * worst error against an outside reference and calls {@link #assertStated} for a figure that is a
 * measured maximum (fails if the measurement is above the figure, and also if the figure is more than
 * twice the measurement, so it stays a measurement, not a loose promise), or {@link #assertBound} for
 * a bound claimed beyond the measured points (fails if the measurement is above it).
 */
public final class MeasuredAccuracy {
    private MeasuredAccuracy() {
    }

    /** The comma-separated rows of a test resource, skipping blank lines and {@code #} comments. */
    public static List<String[]> rows(Class<?> anchor, String resource) throws IOException {
        List<String[]> rows = new ArrayList<>();
        try (InputStream in = anchor.getResourceAsStream(resource)) {
            if (in == null) {
                throw new IOException("missing test resource " + resource);
            }
            BufferedReader r = new BufferedReader(new InputStreamReader(in, StandardCharsets.UTF_8));
            String line;
            while ((line = r.readLine()) != null) {
                if (!line.isBlank() && !line.startsWith("#")) {
                    rows.add(line.split(",", -1));
                }
            }
        }
        return rows;
    }

    /** |actual - reference| / scale, the difference taken in decimal so it is exact. */
    public static double error(double actual, String reference, double scale) {
        BigDecimal ref = new BigDecimal(reference);
        return new BigDecimal(actual).subtract(ref).abs()
                .divide(new BigDecimal(Math.abs(scale)), MathContext.DECIMAL64).doubleValue();
    }

    /** |actual - reference| / |reference|, exact difference. */
    public static double relative(double actual, String reference) {
        return error(actual, reference, new BigDecimal(reference).doubleValue());
    }

    /**
     * Fails if the measured worst error is above the stated figure, or the figure is more than twice
     * the measurement; prints the measurement either way.
     */
    public static void assertStated(String what, double measured, double stated, int points) {
        System.out.printf("%s: worst error %.3g over %d reference points (stated %.3g)%n", what, measured, points, stated);
        assertTrue(points >= 10, what + ": only " + points + " reference points");
        // Source: the reference table named by the caller
        assertTrue(measured <= stated, what + ": measured " + measured + " above the stated " + stated);
        // common practice, no source: a stated figure within 2x of the measurement
        assertTrue(stated <= 2 * measured, what + ": stated " + stated + " is loose against the measured " + measured
                + "; lower the constant to the measurement rounded up");
    }

    /**
     * For a bound claimed over a domain larger than any table (e.g. every input): fails if the measured
     * worst error is above it; prints the measurement, so the margin is visible.
     */
    public static void assertBound(String what, double measured, double bound, int points) {
        System.out.printf("%s: worst error %.3g over %d reference points (bound %.3g)%n", what, measured, points, bound);
        assertTrue(points >= 10, what + ": only " + points + " reference points");
        // Source: the reference named by the caller
        assertTrue(measured <= bound, what + ": measured " + measured + " above the stated bound " + bound);
    }
}
