package org.microtally;

/**
 * The input checks shared by the ensembles, occupations and reference formulas: one message for
 * each kind of value, built by {@link InvalidInputException#of} ("&lt;what&gt; = &lt;value&gt; is not
 * allowed: must be &lt;range&gt;. &lt;remedy&gt;"). Each method returns the value it accepts.
 */
public final class Inputs {
    private Inputs() { }

    /**
     * A temperature kT in a spectrum's energy unit: finite and &gt; 0.
     *
     * @throws InvalidInputException naming the value and the T -&gt; 0 calls to use instead
     */
    public static double temperature(double kT) {
        if (!(kT > 0) || !Double.isFinite(kT)) {
            throw InvalidInputException.of("temperature kT", kT, "a finite number > 0",
                    "T -> 0 limits are separate calls: Canonical.groundState (fixed N), ChemicalPotential.fermiLevel "
                            + "(fixed mu).");
        }
        return kT;
    }

    /**
     * A temperature given as an energy (e.g. {@code Energy.ofTemperature(4.2)}, or k_B T in meV) as a
     * number kT of the spectrum's energy unit {@code scale}; the same checks as {@link #temperature(double)}.
     *
     * @throws InvalidInputException when {@code scale} has no declared physical size (the message says how
     *                               to declare one, or to give kT as a number in the spectrum's unit)
     */
    public static double temperature(org.microtally.units.Energy kT, org.microtally.units.EnergyScale scale) {
        java.util.Objects.requireNonNull(kT, "kT");
        if (scale.quantum().isEmpty()) {
            throw new InvalidInputException("temperature " + kT + " cannot be expressed in the spectrum's energy unit \""
                    + scale.name() + "\", which has no physical size. Declare its size with withScale(EnergyScale.of(\"" + scale.name()
                    + "\", Energy.of(value, unit))) on the spectrum or density of states, or give kT as a number in units of "
                    + scale.name() + ".");
        }
        return temperature(kT.in(scale));
    }

    /** A temperature in kelvin: finite and &gt; 0. */
    public static double kelvin(double kelvin) {
        return positive("temperature T (K)", kelvin,
                "T = 0 is a limit, not a state: use the ground-state quantities (e.g. fermiEnergy()) instead.");
    }

    /**
     * A particle number N in [1, max].
     *
     * @param what   how the number is called here, e.g. {@code "particle number N"}
     * @param remedy what to do instead (may be empty)
     */
    public static int particleNumber(String what, int n, long max, String remedy) {
        if (n < 1 || n > max) {
            throw InvalidInputException.of(what, n, max == Integer.MAX_VALUE ? "an integer >= 1"
                    : "an integer in [1, " + max + "]", remedy);
        }
        return n;
    }

    /** A particle number N &gt;= 1. */
    public static int particleNumber(int n) {
        return particleNumber("particle number N", n, Integer.MAX_VALUE,
                "N = 0 is the empty system (Z = 1, U = S = C = 0) and needs no computation.");
    }

    /**
     * A particle number within the capacity of a spectrum whose states hold at most {@code perState}
     * particles each (Fermi 1, Gentile k); {@code perState = Integer.MAX_VALUE} means no cap.
     */
    public static int withinCapacity(String what, int n, int perState, long states) {
        if (perState != Integer.MAX_VALUE && n > (long) perState * states) {
            throw InvalidInputException.of(what, n, "at most the capacity " + (long) perState * states
                    + " of the spectrum (" + perState + " per state x " + states + " states)", "Raise the spectrum's cutoff.");
        }
        return n;
    }

    /** {@code value} if it is finite and &gt; 0, else an exception naming {@code what}. */
    public static double positive(String what, double value, String remedy) {
        if (!(value > 0) || !Double.isFinite(value)) {
            throw InvalidInputException.of(what, value, "a finite number > 0", remedy);
        }
        return value;
    }

    /** {@code value} if it is an integer &gt;= {@code min}, else an exception naming {@code what} and the bound. */
    public static int atLeast(String what, int value, int min) {
        if (value < min) {
            throw InvalidInputException.of(what, value, "an integer >= " + min, "");
        }
        return value;
    }

    /** {@code value} if it is an integer &gt;= {@code min}, else an exception naming {@code what} and the bound. */
    public static long atLeast(String what, long value, long min) {
        if (value < min) {
            throw InvalidInputException.of(what, value, "an integer >= " + min, "");
        }
        return value;
    }
}
