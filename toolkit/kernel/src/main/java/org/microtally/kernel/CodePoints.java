package org.microtally.kernel;

/**
 * Converts between the Jupyter protocol's cursor positions (counted in Unicode code points since
 * messaging protocol 5.2) and Java's UTF-16 char indexes. They differ only for characters outside
 * the Basic Multilingual Plane, which take two chars.
 */
final class CodePoints {
    private CodePoints() { }

    /** The UTF-16 index of code point number {@code codePoints} in {@code s}, clamped to the string. */
    static int toCharIndex(String s, int codePoints) {
        if (codePoints <= 0) {
            return 0;
        }
        int total = s.codePointCount(0, s.length());
        if (codePoints >= total) {
            return s.length();
        }
        return s.offsetByCodePoints(0, codePoints);
    }

    /** The number of code points before UTF-16 index {@code charIndex} in {@code s}. */
    static int toCodePoints(String s, int charIndex) {
        int clamped = Math.max(0, Math.min(charIndex, s.length()));
        return s.codePointCount(0, clamped);
    }
}
