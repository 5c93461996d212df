package org.microtally;

import java.util.Objects;

/**
 * A cell or quantity value that is undefined, with the reason why: e.g. the Boltzmann temperature
 * at an energy whose neighbours lie outside the grid. A missing value is a value, not a marker
 * string: displays and writers recognise it by type ({@code instanceof Missing}) and show it as
 * {@value #TEXT}, CSV writers leave the field empty, charts leave the point out.
 *
 * @param reason why there is no value, in words (never blank)
 */
public record Missing(String reason) {
    /** How a missing value is shown in plain text. */
    public static final String TEXT = "n/a";

    /** Validates the reason. */
    public Missing {
        Objects.requireNonNull(reason, "reason");
        if (reason.isBlank()) {
            throw new InvalidInputException("the reason of a missing value must not be blank: say why there is no value");
        }
    }

    /** A missing value for {@code reason}. */
    public static Missing because(String reason) {
        return new Missing(reason);
    }

    /** {@value #TEXT}: the reason is in {@link #reason()} (and in a quantity's note). */
    @Override
    public String toString() {
        return TEXT;
    }
}
