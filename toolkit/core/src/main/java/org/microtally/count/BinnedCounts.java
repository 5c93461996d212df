package org.microtally.count;

import java.math.BigInteger;
import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import org.microtally.Inputs;
import org.microtally.InvalidInputException;
import org.microtally.Tabular;
import org.microtally.spectrum.Level;
import org.microtally.spectrum.Spectrum;
import org.microtally.exact.ExactLog;
import org.microtally.exact.ExactRatio;

/**
 * Exact microstate counts of particles on spectra with real-valued energies, on a stated energy
 * grid: the binned density of states. Immutable.
 *
 * <p><b>Method.</b> Every level energy e of species s is replaced by its nearest grid point
 * e_0s + k delta (k = round((e - e_0s) / delta), e_0s the species' lowest level), and the microstates
 * of the rounded spectra are counted exactly (one exact row per species, the rows convolved in
 * BigInteger: the product rule for the independent species). Bin K then holds the microstates whose
 * rounded total energy is E_K = E_gs + K delta, E_gs the rounded ground-state energy.
 *
 * <p><b>Effect of the bin width (stated, not estimated).</b> Each particle's energy moves by at most
 * r = the largest rounding |e - e_0s - k delta| over the levels (r &lt;= delta / 2), so a microstate
 * counted in bin K has true energy within E_K +- {@link #smearing()} = (total particle number) x r.
 * The density Omega_K / delta is therefore the exact density of states averaged over a window of
 * width delta and smeared by at most that amount; it converges to the true smoothed density as
 * delta -&gt; 0 (at the cost of more bins). Spectra whose energies are multiples of delta from their
 * ground level give r = 0 and exact energies.
 *
 * <p>Bins start at the rounded ground state of the whole system: bin K = 0 is the lowest rounded
 * N-particle energy (for capped statistics the filled lowest rounded levels of each species), so
 * {@code bins} counts excitations. The counting still runs from each species' ground level up
 * (cost and memory grow with (N+1)(K_gs + bins) for a Fermi sea at K_gs); tables above 2 x 10^5 entries
 * use the memory-lean single-N rows of {@link SingleNumberCounts} (8 bytes per entry).
 *
 * <p><b>Cutoffs.</b> Bins are complete (equal to the untruncated spectra's counts) only while the
 * rounded excitation of any one particle stays below every species' cutoff; {@link #completeThroughBin()}
 * gives the safe bound.
 */
public final class BinnedCounts implements Tabular {
    private final List<Species> species;
    private final double binWidth;
    private final double groundEnergy;
    private final double smearing;
    private final BigInteger[] counts;
    private final int completeThrough;

    private BinnedCounts(List<Species> species, double binWidth, double groundEnergy, double smearing,
                         BigInteger[] counts, int completeThrough) {
        this.species = species;
        this.binWidth = binWidth;
        this.groundEnergy = groundEnergy;
        this.smearing = smearing;
        this.counts = counts;
        this.completeThrough = completeThrough;
    }

    /**
     * Counts for the species (each with its own spectrum, statistics and particle number) in bins
     * K = 0..{@code bins} of width {@code binWidth}.
     *
     * @throws InvalidInputException for a bin width that is not finite and &gt; 0, bins &lt; 0, an empty
     *                               list, or a level more than 2^31 bins above its ground level
     */
    public static BinnedCounts of(List<Species> species, double binWidth, int bins) {
        Objects.requireNonNull(species, "species");
        if (species.isEmpty()) {
            throw InvalidInputException.of("number of species", 0, ">= 1", "");
        }
        if (!(binWidth > 0) || !Double.isFinite(binWidth)) {
            throw InvalidInputException.of("bin width", binWidth, "a finite number > 0", "");
        }
        Inputs.atLeast("number of bins", bins, 0);
        List<Species> rounded = new ArrayList<>();
        List<Integer> grounds = new ArrayList<>();
        double ground = 0;
        double maxRounding = 0;
        long particles = 0;
        long groundBins = 0;
        double complete = Double.POSITIVE_INFINITY;
        for (Species s : species) {
            Spectrum sp = s.spectrum();
            double e0 = sp.groundEnergy();
            List<Level> levels = new ArrayList<>();
            for (Level l : sp.levels()) {
                double k = Math.rint((l.energy() - e0) / binWidth);
                if (k > Integer.MAX_VALUE) {
                    throw InvalidInputException.of("level energy " + l.energy() + " of species " + s.name(),
                            k + " bins above its ground level", "at most 2^31 - 1 bins", "Use a wider bin.");
                }
                maxRounding = Math.max(maxRounding, Math.abs(l.energy() - e0 - k * binWidth));
                levels.add(new Level(k, l.degeneracy()));
            }
            // the rounded N-particle ground state: fill the lowest rounded levels (capped statistics)
            long k0 = 0;
            long kTop = 0;
            if (s.statistics().capped()) {
                long left = s.particles();
                for (Level l : levels) {
                    long put = Math.min(left, (long) s.statistics().maxOccupancy() * l.degeneracy());
                    if (put > 0) {
                        k0 += put * (long) l.energy();
                        kTop = (long) l.energy();
                    }
                    left -= put;
                }
                if (left > 0) {
                    throw InvalidInputException.of("particle number of species " + s.name(), s.particles(),
                            "at most the capacity of its spectrum", "Raise the spectrum's cutoff.");
                }
            }
            if (k0 + bins > Integer.MAX_VALUE - 1) {
                throw InvalidInputException.of("ground-state energy of species " + s.name() + " in bins", k0,
                        "below 2^31 - 1 - bins", "Use a wider bin.");
            }
            double cut = sp.isTruncated() ? (sp.cutoffEnergy() - e0) / binWidth : Double.POSITIVE_INFINITY;
            // a microstate using an omitted level (rounded >= floor(cut - 0.5) + 1) lies at least that far
            // minus the top of the ground-state filling above the species' ground state
            complete = Math.min(complete, Math.floor(cut - 0.5) - kTop);
            rounded.add(new Species(s.name(), Spectrum.of(levels), s.statistics(), s.particles()));
            grounds.add((int) k0);
            ground += s.particles() * e0;
            groundBins += k0;
            particles += s.particles();
        }
        // one exact row per species from its ground state up, then the exact convolution of the rows
        BigInteger[] counts = new BigInteger[bins + 1];
        java.util.Arrays.fill(counts, BigInteger.ZERO);
        counts[0] = BigInteger.ONE;
        for (int si = 0; si < rounded.size(); si++) {
            Species s = rounded.get(si);
            int k0 = grounds.get(si);
            List<BigInteger> row = speciesRow(s, k0 + bins);
            BigInteger[] next = new BigInteger[bins + 1];
            for (int k = 0; k <= bins; k++) {
                BigInteger acc = BigInteger.ZERO;
                for (int j = 0; j <= k; j++) {
                    BigInteger r = row.get(k0 + j);
                    if (r.signum() != 0 && counts[k - j].signum() != 0) {
                        acc = acc.add(r.multiply(counts[k - j]));
                    }
                }
                next[k] = acc;
            }
            counts = next;
        }
        int completeThrough = complete >= bins ? bins : (int) Math.max(-1, complete);
        return new BinnedCounts(List.copyOf(species), binWidth, ground + groundBins * binWidth,
                particles * maxRounding, counts, completeThrough);
    }

    /** Omega(N_s, 0..top) of one rounded species: the full table when small, else the memory-lean row. */
    private static List<BigInteger> speciesRow(Species s, int top) {
        double cells = (s.particles() + 1.0) * (top + 1.0);
        return cells <= 2e5 ? CountTable.of(s.spectrum(), s.statistics(), s.particles(), top).row(s.particles())
                : SingleNumberCounts.of(s.spectrum(), s.statistics(), s.particles(), top).row();
    }

    private void check(int k) {
        if (k < 0 || k >= counts.length) {
            throw InvalidInputException.of("bin index K", k, "in [0, " + (counts.length - 1) + "]", "Build more bins.");
        }
    }

    /** Omega_K, the exact number of microstates in bin K. */
    public BigInteger count(int k) {
        check(k);
        return counts[k];
    }

    /** The bin's energy E_K = E_gs + K delta (E_gs the rounded ground-state energy, bin 0). */
    public double energy(int k) {
        check(k);
        return groundEnergy + k * binWidth;
    }

    /**
     * Density of states Omega_K / delta (states per unit energy); 0 for an empty bin.
     *
     * @throws InvalidInputException when Omega_K / delta is beyond the double range (use {@link #lnDensity})
     */
    public double density(int k) {
        double d = ExactRatio.toDouble(count(k), BigInteger.ONE) / binWidth;
        if (!Double.isFinite(d)) {
            throw InvalidInputException.of("density in bin " + k, "above the double range", "finite", "Use lnDensity(K).");
        }
        return d;
    }

    /** ln(Omega_K / delta), from the exact count (within a few ulp); refuses an empty bin. */
    public double lnDensity(int k) {
        BigInteger c = count(k);
        if (c.signum() == 0) {
            throw InvalidInputException.of("Omega in bin " + k, 0, "> 0 for a logarithm", "Skip empty bins.");
        }
        return ExactLog.ln(c) - Math.log(binWidth);
    }

    /** The bin width delta. */
    public double binWidth() {
        return binWidth;
    }

    /** Bound on |true energy - E_K| for every microstate counted in bin K (total particles x largest rounding). */
    public double smearing() {
        return smearing;
    }

    /** Largest bin index K. */
    public int bins() {
        return counts.length - 1;
    }

    /** The largest bin whose count is not affected by any species' spectrum cutoff (-1 if none). */
    public int completeThroughBin() {
        return completeThrough;
    }

    /** The species counted (with their unrounded spectra). */
    public List<Species> species() {
        return species;
    }

    /** Columns K, E, Omega, density. */
    @Override
    public List<String> columnNames() {
        return List.of("K", "E", "Omega", "density");
    }

    /** One row per bin. */
    @Override
    public List<List<Object>> rows() {
        List<List<Object>> r = new ArrayList<>(counts.length);
        for (int k = 0; k < counts.length; k++) {
            r.add(List.of(k, energy(k), counts[k], density(k)));
        }
        return r;
    }

    @Override
    public String toString() {
        return "BinnedCounts[" + species.size() + " species, bin width " + binWidth + ", " + counts.length
                + " bins, smearing <= " + smearing + "]";
    }
}
