package org.microtally.notebook.session;

/**
 * A forward scan over Java source text that reports only the characters outside string and character
 * literals (the quotes themselves and everything between them, escapes included, are skipped). Text blocks
 * and comments are not recognised: a text block reads as empty strings around its content. Enough for
 * bracket counting in the cell editor's assists; the compiler's own analysis decides what a cell means.
 */
final class JavaText {
    private final String text;
    private final int end;
    private int pos;

    private JavaText(String text, int start, int end) {
        this.text = text;
        this.end = Math.min(end, text.length());
        this.pos = start;
    }

    /** A scan of {@code text} from {@code start} (inclusive) to {@code end} (exclusive, clamped to the length). */
    static JavaText scan(String text, int start, int end) {
        return new JavaText(text, start, end);
    }

    /** The index of the next character outside literals, or -1 when the scan has reached its end. */
    int next() {
        boolean str = false;
        boolean chr = false;
        while (pos < end) {
            int i = pos++;
            char ch = text.charAt(i);
            if ((str || chr) && ch == '\\') {
                pos++;
            } else if (ch == '"' && !chr) {
                str = !str;
            } else if (ch == '\'' && !str) {
                chr = !chr;
            } else if (!str && !chr) {
                return i;
            }
        }
        return -1;
    }
}
