package org.microtally.kernel;

import java.util.Locale;
import java.util.regex.Pattern;

/**
 * The maximum heap of the JVMs the toolkit starts (launcher, kernel): a size such as {@code 4g} or
 * {@code 1500m}, passed to Java as {@code -Xmx}. Set by the environment variable {@value #ENV}
 * (read by {@code toolkit/bin/microtally} for its own JVM and, at install time, by
 * {@code install-kernel}) or by {@code install-kernel --heap SIZE}, which writes it into the
 * kernelspec's argv.
 */
final class HeapSize {
    /** The environment variable of our own name. */
    static final String ENV = "MICROTALLY_HEAP";
    /** The plain kernel's heap when nothing is set (a 55-cell session fits well within it: see Session's measured footprint). */
    static final String KERNEL_DEFAULT = "1g";
    /** The Spark kernel's heap when nothing is set (the driver holds Spark's own structures as well). */
    static final String SPARK_DEFAULT = "2g";
    /** How to raise the heap, for the toolkit's out-of-memory and refusal messages. */
    static final String HOW_TO_RAISE = "to give the kernel more heap, re-install it with "
            + "'microtally install-kernel --heap 4g' (or set " + ENV + "=4g before 'microtally run')";
    private static final Pattern SIZE = Pattern.compile("[1-9][0-9]{0,6}[mMgGtT]");

    private HeapSize() { }

    /**
     * Checks a heap size: a whole number with the unit m, g or t (a bare number would mean bytes to
     * Java and is refused).
     *
     * @throws IllegalArgumentException naming the value and the accepted form
     */
    static String check(String size, String from) {
        String s = size == null ? "" : size.strip();
        if (!SIZE.matcher(s).matches()) {
            throw new IllegalArgumentException(from + " '" + size + "' is not a heap size: give a whole number with the unit "
                    + "m, g or t, e.g. 4g or 1500m");
        }
        return s.toLowerCase(Locale.ROOT);
    }

    /** The heap asked for by {@value #ENV}, checked, or {@code fallback} when it is unset or empty. */
    static String fromEnvironment(String fallback) {
        String env = System.getenv(ENV);
        return env == null || env.isBlank() ? fallback : check(env, ENV);
    }

    /** The JVM option for {@code size}. */
    static String option(String size) {
        return "-Xmx" + size;
    }
}
