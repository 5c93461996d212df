package org.microtally.kernel;

import static org.junit.jupiter.api.Assertions.fail;

import java.nio.file.Path;
import org.junit.jupiter.api.Assumptions;

/** What the integration tests share about the programs they start outside the test JVM. */
final class ExternalTools {
    private ExternalTools() { }

    /** The java launcher of the JVM running the tests, so a started kernel runs on the same Java. */
    static String javaExe() {
        return Path.of(System.getProperty("java.home"), "bin", "java").toString();
    }

    /**
     * For a test whose tools (Jupyter, node) are missing: prints {@code banner} to stderr and skips
     * the test with {@code skipReason}; under {@code CI=true}, where every tool must be installed,
     * fails it instead with {@code ciFailure} followed by the banner.
     */
    static void skipOrFailInCi(String banner, String ciFailure, String skipReason) {
        System.err.println(banner);
        if ("true".equalsIgnoreCase(System.getenv("CI"))) {
            fail(ciFailure + banner);
        }
        Assumptions.abort(skipReason);
    }
}
