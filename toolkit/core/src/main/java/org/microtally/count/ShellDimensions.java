package org.microtally.count;

import java.math.BigInteger;
import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.Objects;
import org.microtally.InvalidInputException;
import org.microtally.Tabular;
import org.microtally.spectrum.ShellOrbits;
import org.microtally.spectrum.Statistics;

/**
 * Many-body basis dimensions of a shell-model valence space: the M-scheme dimension D(M), the number
 * of Slater determinants of Z protons and N neutrons (fermions, each kind in its own orbits) with
 * total projection M, and the J-projected dimension D(J) = D(M = J) - D(M = J + 1), the number of
 * multiplets of total angular momentum J (each multiplet has one state at every M = -J..J, so the
 * states at M = J not already counted at M = J + 1 start a new multiplet; common practice, e.g.
 * A. de-Shalit and I. Talmi, <i>Nuclear Shell Theory</i> (1963); from memory). Immutable.
 *
 * <p>Method: exact counting by total 2M through {@link SpeciesMix#ignoringEnergy} (protons and
 * neutrons as two Fermi species on the M-scheme spectra of {@link ShellOrbits}); BigInteger
 * throughout, so exact. Cost: that of the mix, O(W_p W_n) for label windows of widths W.
 */
public final class ShellDimensions implements Tabular {
    private final int particles;
    private final int minTwoM;
    private final BigInteger[] byTwoM; // index (2M - minTwoM) / 2

    private ShellDimensions(int particles, int minTwoM, BigInteger[] byTwoM) {
        this.particles = particles;
        this.minTwoM = minTwoM;
        this.byTwoM = byTwoM;
    }

    /**
     * Dimensions for {@code protons} protons in {@code protonOrbits} and {@code neutrons} neutrons in
     * {@code neutronOrbits} (pass the same orbits for both in an isospin-symmetric space).
     *
     * @throws InvalidInputException for negative numbers, no particles at all, or more particles of a
     *                               kind than its m-states
     */
    public static ShellDimensions of(ShellOrbits protonOrbits, int protons, ShellOrbits neutronOrbits, int neutrons) {
        Objects.requireNonNull(protonOrbits, "protonOrbits");
        Objects.requireNonNull(neutronOrbits, "neutronOrbits");
        require("proton number", protons, protonOrbits);
        require("neutron number", neutrons, neutronOrbits);
        if (protons + neutrons == 0) {
            throw InvalidInputException.of("number of valence particles", 0, ">= 1", "");
        }
        List<Species> species = List.of(new Species("protons", protonOrbits.spectrum(), Statistics.FERMI, protons),
                new Species("neutrons", neutronOrbits.spectrum(), Statistics.FERMI, neutrons));
        return fromMix(SpeciesMix.ignoringEnergy(species), protons + neutrons);
    }

    /** Dimensions for {@code particles} identical fermions in {@code orbits} (one kind of nucleon). */
    public static ShellDimensions identical(ShellOrbits orbits, int particles) {
        Objects.requireNonNull(orbits, "orbits");
        require("particle number", particles, orbits);
        if (particles == 0) {
            throw InvalidInputException.of("particle number", 0, ">= 1", "");
        }
        return fromMix(SpeciesMix.ignoringEnergy(List.of(new Species("nucleons", orbits.spectrum(), Statistics.FERMI,
                particles))), particles);
    }

    private static void require(String what, int k, ShellOrbits orbits) {
        if (k < 0 || k > orbits.stateCount()) {
            throw InvalidInputException.of(what, k, "in [0, " + orbits.stateCount() + "] (the m-states of " + orbits + ")",
                    "");
        }
    }

    private static ShellDimensions fromMix(SpeciesMix mix, int particles) {
        int lo = mix.minLabelTotal();
        int hi = mix.maxLabelTotal();
        // total 2M has the parity of the particle number (each 2m is odd)
        if (Math.floorMod(lo, 2) != particles % 2) {
            lo++;
        }
        BigInteger[] d = new BigInteger[Math.max(0, (hi - lo) / 2 + 1)];
        for (int i = 0; i < d.length; i++) {
            d[i] = mix.countAtLabel(lo + 2 * i);
        }
        return new ShellDimensions(particles, lo, d);
    }

    /** M-scheme dimension D(M) at total projection M = twoM / 2 (0 outside the range or for the wrong parity). */
    public BigInteger mScheme(int twoM) {
        if (Math.floorMod(twoM, 2) != particles % 2) {
            return BigInteger.ZERO;
        }
        long i = ((long) twoM - minTwoM) / 2;
        return i < 0 || i >= byTwoM.length ? BigInteger.ZERO : byTwoM[(int) i];
    }

    /**
     * J-projected dimension D(J) = D(M = J) - D(M = J + 1) for J = twoJ / 2.
     *
     * @throws InvalidInputException for twoJ &lt; 0 or of the wrong parity (half-integer J needs an odd
     *                               number of particles)
     */
    public BigInteger jProjected(int twoJ) {
        if (twoJ < 0 || Math.floorMod(twoJ, 2) != particles % 2) {
            throw InvalidInputException.of("2J", twoJ, ">= 0 and " + (particles % 2 == 0 ? "even" : "odd")
                    + " for " + particles + " particles", "");
        }
        return mScheme(twoJ).subtract(mScheme(twoJ + 2));
    }

    /** Largest 2J with a non-zero dimension. */
    public int maxTwoJ() {
        int top = minTwoM + 2 * (byTwoM.length - 1);
        while (top > 0 && mScheme(top).signum() == 0) {
            top -= 2;
        }
        return top;
    }

    /** Smallest allowed 2J (0 for an even, 1 for an odd number of particles). */
    public int minTwoJ() {
        return particles % 2;
    }

    /** Total number of Slater determinants, sum over M of D(M). */
    public BigInteger totalDimension() {
        BigInteger s = BigInteger.ZERO;
        for (BigInteger x : byTwoM) {
            s = s.add(x);
        }
        return s;
    }

    /** Columns 2J, J, D(M = J), D(J). */
    @Override
    public List<String> columnNames() {
        return List.of("2J", "J", "D(M=J)", "D(J)");
    }

    /** One row per 2J from {@link #minTwoJ()} to {@link #maxTwoJ()}. */
    @Override
    public List<List<Object>> rows() {
        List<List<Object>> r = new ArrayList<>();
        for (int tj = minTwoJ(); tj <= maxTwoJ(); tj += 2) {
            String j = tj % 2 == 0 ? String.valueOf(tj / 2) : tj + "/2";
            r.add(List.of(tj, j, mScheme(tj), jProjected(tj)));
        }
        return Collections.unmodifiableList(r);
    }

    @Override
    public String toString() {
        return "ShellDimensions[" + particles + " particles, D(M=" + (minTwoJ() == 0 ? "0" : "1/2") + ") = "
                + mScheme(minTwoJ()) + ", total " + totalDimension() + "]";
    }
}
