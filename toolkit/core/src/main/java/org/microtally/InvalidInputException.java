package org.microtally;

/**
 * Thrown when an input to a microtally computation is outside what the computation accepts.
 *
 * <p>Every message names the offending value, the range that is allowed and, where there is one,
 * what to do instead. Nothing is half-built when this is thrown: constructors validate before they
 * allocate results.
 */
public class InvalidInputException extends IllegalArgumentException {
    private static final long serialVersionUID = 1L;

    /** Creates the exception with a complete message (value, allowed range, remedy). */
    public InvalidInputException(String message) {
        super(message);
    }

    /**
     * Builds the standard message: {@code "<what> = <value> is not allowed: <allowed>. <remedy>"}.
     *
     * @param what   the name of the input, e.g. {@code "degeneracy of level 3"}
     * @param value  the value that was given
     * @param allowed the allowed range in words, e.g. {@code "an integer >= 1"}
     * @param remedy what the caller can do instead (may be empty)
     */
    public static InvalidInputException of(String what, Object value, String allowed, String remedy) {
        StringBuilder sb = new StringBuilder();
        sb.append(what).append(" = ").append(value).append(" is not allowed: must be ").append(allowed).append('.');
        if (remedy != null && !remedy.isBlank()) {
            sb.append(' ').append(remedy);
        }
        return new InvalidInputException(sb.toString());
    }
}
