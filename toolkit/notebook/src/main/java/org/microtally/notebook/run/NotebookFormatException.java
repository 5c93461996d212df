package org.microtally.notebook.run;

/**
 * An input file that is not a readable nbformat 4 notebook: malformed JSON (the message gives
 * line and column) or JSON that does not have a notebook's shape (the message gives the JSON path).
 */
public final class NotebookFormatException extends Exception {
    private static final long serialVersionUID = 1L;

    NotebookFormatException(String message) {
        super(message);
    }

    NotebookFormatException(String message, Throwable cause) {
        super(message, cause);
    }
}
