package org.microtally;

import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.Objects;
import java.util.Optional;
import org.microtally.units.EnergyScale;
import org.microtally.units.EnergyUnit;

/**
 * The one result shape of the ensembles: an immutable, ordered table of {@link Quantity} rows
 * (name, value, unit, note), in the energy unit of a declared {@link EnergyScale}. Undefined values
 * are {@link Missing} (a value, with its reason in the note), never a marker string.
 *
 * <p>{@link #inUnits(EnergyUnit)} gives the same table in a physical unit: every quantity of
 * dimension energy^p is multiplied by (size of one quantum in that unit)^p, exactly the
 * {@link EnergyScale} conversion (one rounding per multiplication). A scale without a physical size
 * is refused with a message saying how to declare it.
 */
public final class QuantityTable implements Tabular {
    private static final List<String> COLUMNS = List.of("quantity", "value", "unit", "note");

    private final EnergyScale scale;
    private final String energyUnit;
    private final List<Quantity> quantities;

    private QuantityTable(EnergyScale scale, String energyUnit, List<Quantity> quantities) {
        this.scale = scale;
        this.energyUnit = energyUnit;
        this.quantities = Collections.unmodifiableList(new ArrayList<>(quantities));
    }

    /** A builder for a table whose energies are multiples of {@code scale}. */
    public static Builder builder(EnergyScale scale) {
        return new Builder(Objects.requireNonNull(scale, "scale"));
    }

    /** The quantities in display order. */
    public List<Quantity> quantities() {
        return quantities;
    }

    /** The first quantity called {@code name}. */
    public Optional<Quantity> find(String name) {
        return quantities.stream().filter(q -> q.name().equals(name)).findFirst();
    }

    /**
     * The first quantity called {@code name}.
     *
     * @throws InvalidInputException when there is none (the message lists the names there are)
     */
    public Quantity get(String name) {
        return find(name).orElseThrow(() -> InvalidInputException.of("quantity name", "\"" + name + "\"",
                "one of " + quantities.stream().map(Quantity::name).distinct().toList(), ""));
    }

    /** The energy scale the table's energies were computed in. */
    public EnergyScale scale() {
        return scale;
    }

    /** The unit text of the table's energies (the scale's name, or a physical unit's symbol after conversion). */
    public String energyUnit() {
        return energyUnit;
    }

    /**
     * The same table with every energy-dimensioned value in {@code unit}.
     *
     * @throws InvalidInputException when the scale has no declared physical size (the message says how
     *                               to declare one: {@code EnergyScale.of(name, Energy.of(value, unit))})
     */
    public QuantityTable inUnits(EnergyUnit unit) {
        Objects.requireNonNull(unit, "unit");
        double factor = scale.energy(1.0).in(unit);
        List<Quantity> out = new ArrayList<>(quantities.size());
        for (Quantity q : quantities) {
            out.add(q.convert(factor, unit.symbol()));
        }
        return new QuantityTable(scale, unit.symbol(), out);
    }

    @Override
    public List<String> columnNames() {
        return COLUMNS;
    }

    @Override
    public List<List<Object>> rows() {
        List<List<Object>> r = new ArrayList<>(quantities.size());
        for (Quantity q : quantities) {
            r.add(List.of(q.name(), q.value(), q.unit(), q.note()));
        }
        return Collections.unmodifiableList(r);
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof QuantityTable t && t.quantities.equals(quantities) && t.energyUnit.equals(energyUnit);
    }

    @Override
    public int hashCode() {
        return Objects.hash(quantities, energyUnit);
    }

    /** One quantity per line, e.g. {@code "U = 1.25 meV"}. */
    @Override
    public String toString() {
        StringBuilder sb = new StringBuilder();
        for (Quantity q : quantities) {
            sb.append(q).append('\n');
        }
        return sb.toString();
    }

    /** Collects quantities in order; not thread-safe, used once. */
    public static final class Builder {
        private final EnergyScale scale;
        private final List<Quantity> quantities = new ArrayList<>();

        private Builder(EnergyScale scale) {
            this.scale = scale;
        }

        /** A quantity as it is (e.g. taken from another table in the same scale). */
        public Builder add(Quantity quantity) {
            quantities.add(Objects.requireNonNull(quantity, "quantity"));
            return this;
        }

        /** A pure number or a label. */
        public Builder value(String name, Object value) {
            quantities.add(Quantity.of(name, value));
            return this;
        }

        /** A number of the given dimension in the scale's unit. */
        public Builder value(String name, double value, Dimension dimension) {
            quantities.add(Quantity.of(name, value, dimension, scale.name()));
            return this;
        }

        /** A number of the given dimension, or {@link Missing} with {@code reason} when {@code value} is null. */
        public Builder valueOrMissing(String name, Double value, Dimension dimension, String reason) {
            quantities.add(value == null ? Quantity.missing(name, dimension, scale.name(), reason)
                    : Quantity.of(name, value, dimension, scale.name()));
            return this;
        }

        /** One row per warning, named "warning", the text as its value. */
        public Builder warnings(List<String> warnings) {
            for (String w : warnings) {
                quantities.add(Quantity.of("warning", w));
            }
            return this;
        }

        /** The table. */
        public QuantityTable build() {
            return new QuantityTable(scale, scale.name(), quantities);
        }
    }
}
