package org.microtally.notebook.session;

/**
 * Whether a cell's text is ready to run (used for the console's "is it complete?" question).
 *
 * @param status complete, incomplete (more input expected) or invalid (will not compile as is)
 * @param indent for an incomplete cell, the indentation suggested for the next line (else empty)
 */
public record Completeness(Status status, String indent) {
    /** The three answers. */
    public enum Status { COMPLETE, INCOMPLETE, INVALID }
}
