package org.microtally.units;

import java.util.Objects;
import java.util.Optional;
import org.microtally.InvalidInputException;

/**
 * The declared quantum in which a spectrum's energies are written: a name (for display, e.g.
 * {@code "hbar*omega"}) and, where known, its physical size as an {@link Energy}.
 *
 * <p>A scale without a physical size (see {@link #abstractUnit(String)}) is fine for counting and for
 * temperatures given as kT in the same unit; converting to a physical unit then throws with a
 * message saying how to declare the size.
 *
 * <p>Conversions are one multiplication ({@link #energy}) or one division ({@link #multiples}) of
 * the stored joules: one rounding each, on top of the accuracy of the declared quantum.
 */
public final class EnergyScale {
    private final String name;
    private final Energy quantum;

    private EnergyScale(String name, Energy quantum) {
        Objects.requireNonNull(name, "name");
        if (name.isBlank()) {
            throw InvalidInputException.of("energy scale name", "\"" + name + "\"", "non-blank", "");
        }
        if (quantum != null && quantum.in(EnergyUnit.JOULE) <= 0) {
            throw InvalidInputException.of("quantum of scale " + name, quantum, "a positive energy", "");
        }
        this.name = name;
        this.quantum = quantum;
    }

    /** A quantum of known physical size, e.g. {@code EnergyScale.of("hbar*omega", Energy.of(3, MILLIELECTRONVOLT))}. */
    public static EnergyScale of(String name, Energy quantum) {
        return new EnergyScale(name, Objects.requireNonNull(quantum, "quantum"));
    }

    /** A named unit whose physical size is not declared. */
    public static EnergyScale abstractUnit(String name) {
        return new EnergyScale(name, null);
    }

    /** The scale's display name. */
    public String name() {
        return name;
    }

    /** The physical size of one unit, if declared. */
    public Optional<Energy> quantum() {
        return Optional.ofNullable(quantum);
    }

    /** The physical energy of {@code multiples} units of this scale. */
    public Energy energy(double multiples) {
        return requireQuantum().times(multiples);
    }

    /** How many units of this scale the energy {@code e} is. */
    public double multiples(Energy e) {
        return e.ratio(requireQuantum());
    }

    private Energy requireQuantum() {
        if (quantum == null) {
            throw new InvalidInputException("energy scale \"" + name + "\" has no physical size: declare one with "
                    + "EnergyScale.of(\"" + name + "\", Energy.of(value, unit)) before converting to physical units.");
        }
        return quantum;
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof EnergyScale s && s.name.equals(name) && Objects.equals(s.quantum, quantum);
    }

    @Override
    public int hashCode() {
        return Objects.hash(name, quantum);
    }

    @Override
    public String toString() {
        return quantum == null ? name : name + " (= " + quantum + ")";
    }
}
