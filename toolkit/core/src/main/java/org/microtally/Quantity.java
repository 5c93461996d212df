package org.microtally;

import java.math.BigInteger;
import java.util.Objects;
import java.util.OptionalDouble;

/**
 * One reported quantity: its name, its value, the dimension and unit the value is in, and a note.
 *
 * <p>The value is a {@link Number} (exact numbers stay exact: {@link BigInteger}, BigFraction), a
 * {@link String} (a label such as the statistics, or a warning's text), a {@link Boolean}, or
 * {@link Missing} when the quantity is undefined (then the note says why). A double value must be
 * finite: a failed computation is never reported as NaN or Infinity.
 *
 * @param name      display name, e.g. {@code "U"} or {@code "S/k"}
 * @param value     the value (see above)
 * @param dimension how the value scales with the energy unit
 * @param unit      the unit text ("" for pure numbers)
 * @param note      a remark ("" for none); for a missing value, the reason
 */
public record Quantity(String name, Object value, Dimension dimension, String unit, String note) {

    /** Validates the parts. */
    public Quantity {
        Objects.requireNonNull(name, "name");
        Objects.requireNonNull(value, "value of " + name + " (use Quantity.missing for an undefined value)");
        Objects.requireNonNull(dimension, "dimension");
        Objects.requireNonNull(unit, "unit");
        Objects.requireNonNull(note, "note");
        if (!(value instanceof Number || value instanceof String || value instanceof Boolean
                || value instanceof Missing)) {
            throw InvalidInputException.of("value of quantity " + name, value.getClass().getName(),
                    "a Number, String, Boolean or Missing", "");
        }
        if ((value instanceof Double d && !Double.isFinite(d)) || (value instanceof Float f && !Float.isFinite(f))) {
            throw InvalidInputException.of("value of quantity " + name, value, "finite",
                    "Report an undefined value as Quantity.missing(name, reason).");
        }
        if (dimension != Dimension.NONE && !(value instanceof Number || value instanceof Missing)) {
            throw InvalidInputException.of("value of quantity " + name + " with dimension " + dimension, value,
                    "a number or missing", "");
        }
    }

    /** A pure number or a label, without unit or note. */
    public static Quantity of(String name, Object value) {
        return new Quantity(name, value, Dimension.NONE, "", "");
    }

    /** A quantity of the given dimension in the energy unit named {@code energyUnit}. */
    public static Quantity of(String name, double value, Dimension dimension, String energyUnit) {
        return new Quantity(name, value, dimension, dimension.unit(energyUnit), "");
    }

    /** An undefined quantity: the value is {@link Missing} with {@code reason}, which is also the note. */
    public static Quantity missing(String name, Dimension dimension, String energyUnit, String reason) {
        return new Quantity(name, Missing.because(reason), dimension, dimension.unit(energyUnit), reason);
    }

    /** Whether the value is {@link Missing}. */
    public boolean isMissing() {
        return value instanceof Missing;
    }

    /** The value as a double, empty when it is missing or not a number. */
    public OptionalDouble number() {
        return value instanceof Number x ? OptionalDouble.of(x.doubleValue()) : OptionalDouble.empty();
    }

    /**
     * This quantity with the energy unit changed: a number of dimension energy^p is multiplied by
     * {@code factor}^p (one or two roundings), its unit text becomes that of {@code energyUnit};
     * pure numbers, labels and missing values keep their value.
     */
    public Quantity convert(double factor, String energyUnit) {
        if (dimension == Dimension.NONE) {
            return this;
        }
        Object v = value instanceof Number x ? (Object) (x.doubleValue() * Math.pow(factor, dimension.power())) : value;
        return new Quantity(name, v, dimension, dimension.unit(energyUnit), note);
    }

    /** E.g. {@code "U = 1.25 meV"}, {@code "beta_B = n/a (no neighbour above E)"}. */
    @Override
    public String toString() {
        return name + " = " + value + (unit.isEmpty() ? "" : " " + unit) + (note.isEmpty() ? "" : " (" + note + ")");
    }
}
