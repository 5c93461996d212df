package org.microtally.ensemble;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import org.microtally.InvalidInputException;
import org.microtally.Tabular;
import org.microtally.spectrum.Level;
import org.microtally.spectrum.Spectrum;

/**
 * The canonical ensemble at fixed total angular momentum J, projected from the fixed-projection
 * partition functions of a {@link LabelledCanonical} whose labels are 2m:
 * Z(J) = Z(M = J) - Z(M = J + 1), the partition function of the (2J+1)-fold multiplets counted once
 * (each multiplet of total J contributes one state at every M = -J..J, and H_0 commutes with J^2;
 * the same difference as the J-projected dimensions of {@link org.microtally.count.ShellDimensions};
 * common practice, e.g. de-Shalit and Talmi, <i>Nuclear Shell Theory</i> (1963), from memory).
 * The spin distribution of levels, (2J + 1) Z(J) / Z, follows. Immutable.
 *
 * <p>Requirement, checked: the spectrum must consist of complete m-multiplets at each energy (the
 * number of states with label 2m at an energy is even in m and does not grow with |m|), as the
 * orbits of {@link org.microtally.spectrum.ShellOrbits} are; otherwise the projection has no meaning
 * and is refused. The field must be 0 (a field breaks the rotational symmetry).
 *
 * <p>Accuracy: a difference of two positive numbers, so the relative error is the relative error of
 * Z(M) (see {@link LabelledCanonical}) times the cancellation factor Z(M = J) / Z(J), which is reported
 * ({@link #cancellation(int)}); J with a factor above 1e6 are refused rather than returned with few
 * digits. A J whose Z(J) is zero to rounding (no multiplet) reads as no states: {@link #hasJ(int)}.
 */
public final class AngularMomentumProjection implements Tabular {
    /** Largest cancellation factor Z(M=J) / Z(J) accepted; beyond it Z(J) is refused (too few digits left). */
    public static final double MAX_CANCELLATION = 1e6;

    private final LabelledCanonical source;
    private final int parity;

    private AngularMomentumProjection(LabelledCanonical source, int parity) {
        this.source = source;
        this.parity = parity;
    }

    /**
     * The projection of {@code c} (labels 2m, field 0).
     *
     * @throws InvalidInputException for a non-zero field or a spectrum that is not made of complete
     *                               m-multiplets
     */
    public static AngularMomentumProjection of(LabelledCanonical c) {
        Objects.requireNonNull(c, "canonical");
        if (c.field() != 0) {
            throw InvalidInputException.of("field h", c.field(), "0 for a J projection",
                    "A field breaks rotational symmetry; project at h = 0.");
        }
        requireMultiplets(c.spectrum());
        return new AngularMomentumProjection(c, Math.floorMod(c.minLabelTotal(), 2));
    }

    private static void requireMultiplets(Spectrum s) {
        Map<Double, Map<Integer, Integer>> byEnergy = new HashMap<>();
        for (Level l : s.levels()) {
            byEnergy.computeIfAbsent(l.energy(), k -> new HashMap<>()).merge(l.label(), l.degeneracy(), Integer::sum);
        }
        for (Map.Entry<Double, Map<Integer, Integer>> e : byEnergy.entrySet()) {
            Map<Integer, Integer> m = e.getValue();
            for (Map.Entry<Integer, Integer> x : m.entrySet()) {
                int tm = x.getKey();
                int inward = Math.abs(tm) - 2;
                boolean symmetric = m.getOrDefault(-tm, 0).equals(x.getValue());
                boolean nested = inward < 0 || m.getOrDefault(inward, 0) >= x.getValue();
                if (!symmetric || !nested) {
                    throw InvalidInputException.of("labels 2m at energy " + e.getKey(), m,
                            "complete m-multiplets (as many states at 2m as at -2m, never more at |2m| than at |2m| - 2)",
                            "Build the spectrum from whole j-orbits (ShellOrbits).");
                }
            }
        }
    }

    /**
     * Whether Z(J) can be given: some multiplet of total 2J exists and is resolved, and the
     * cancellation factor is below 1e6 (false also when only rounding separates Z(M = J) from
     * Z(M = J + 1), which is how an empty J shows in floating point).
     */
    public boolean hasJ(int twoJ) {
        if (twoJ < 0 || Math.floorMod(twoJ, 2) != parity || !source.hasLabel(twoJ)) {
            return false;
        }
        double lnTop = source.hasLabel(twoJ + 2) ? source.lnZAtLabel(twoJ + 2) : Double.NEGATIVE_INFINITY;
        double ratio = Math.exp(lnTop - source.lnZAtLabel(twoJ));
        return 1 - ratio > 1 / MAX_CANCELLATION;
    }

    /** The cancellation factor Z(M = J) / Z(J) (1 when no state at M = J + 1). */
    public double cancellation(int twoJ) {
        require(twoJ);
        return 1 / -Math.expm1(lnRatio(twoJ));
    }

    private double lnRatio(int twoJ) {
        return source.hasLabel(twoJ + 2) ? source.lnZAtLabel(twoJ + 2) - source.lnZAtLabel(twoJ)
                : Double.NEGATIVE_INFINITY;
    }

    private void require(int twoJ) {
        if (!hasJ(twoJ)) {
            throw InvalidInputException.of("2J", twoJ, "a total angular momentum with multiplets, resolved, and a "
                    + "cancellation factor below " + MAX_CANCELLATION, "Test hasJ(2J) first.");
        }
    }

    /** ln Z(J) = ln Z(M = J) + ln(1 - Z(M = J + 1)/Z(M = J)). */
    public double lnZAtJ(int twoJ) {
        require(twoJ);
        return source.lnZAtLabel(twoJ) + Math.log(-Math.expm1(lnRatio(twoJ)));
    }

    /** The probability that the system is in some state of total J: (2J + 1) Z(J) / Z. */
    public double spinProbability(int twoJ) {
        return (twoJ + 1) * Math.exp(lnZAtJ(twoJ) - source.lnZ());
    }

    /** The canonical ensemble projected. */
    public LabelledCanonical source() {
        return source;
    }

    /** Columns 2J, ln Z(J), P(J), cancellation factor. */
    @Override
    public List<String> columnNames() {
        return List.of("2J", "ln Z(J)", "P(J)", "cancellation");
    }

    /** One row per 2J that has multiplets. */
    @Override
    public List<List<Object>> rows() {
        List<List<Object>> r = new ArrayList<>();
        for (int tj = parity; tj <= source.maxLabelTotal(); tj += 2) {
            if (hasJ(tj)) {
                r.add(List.of(tj, lnZAtJ(tj), spinProbability(tj), cancellation(tj)));
            }
        }
        return r;
    }
}
