package org.microtally.lattice;

import org.microtally.count.Ticker;
import org.microtally.count.WordPrimes;
import java.math.BigInteger;
import java.util.Objects;
import org.microtally.InvalidInputException;
import org.microtally.ProgressListener;
import org.microtally.ensemble.ExactDensityOfStates;

/**
 * Exact densities of states of a model on a lattice by a site-by-site transfer matrix.
 *
 * <h2>Method</h2>
 * The sites are added in the lattice's order ({@link Lattice#order()}); the state vector runs over
 * the values of the frontier (added sites with a neighbour still to come), each entry a table of
 * partial counts over (unequal bonds so far[, label so far]). Adding a site shifts tables; retiring
 * a site sums its value out ("one site at a time" sparse updates: the row transfer matrix factored
 * into single-site steps, a standard technique cited here from memory rather than from one source).
 * Each new site takes over the slot of the frontier site it retires, so the vector never grows
 * beyond q^(frontier). For Ising g(E) (no label) the spin-flip symmetry halves the stored states
 * (a state and its complement have the same table). Every count is at most q^N (q values per site, N sites; 2^N for
 * Ising and the hard-core gas), so the sweep runs modulo floor(N log2 q / 61) + 1 primes above
 * 2^61 and the counts are recovered exactly by Chinese remaindering (see {@link org.microtally.count.WordPrimes}).
 *
 * <h2>Accuracy and cost</h2>
 * Exact (integer arithmetic throughout). Memory about 3 x 8 bytes x q^f x (table size) for the
 * largest frontier f (f = L for an L-wide free or cylindrical strip, 2L for a torus); the table
 * has (bonds + 1) entries, times (N + 1) with the label: two state vectors and one for the second
 * and further terms of each sum, see {@link RowSum}; the Ising g(E) sweep holds three vectors of
 * half that size. Work: about q^(f+1) x (table) modular
 * additions per site and prime. {@link #estimate} gives the numbers before any work starts, and the counting methods refuse
 * (with the estimate) when the largest state vector would not fit in the memory allowed.
 */
public final class TransferMatrix {
    private TransferMatrix() { }

    /** Element updates per second assumed for the time estimate (a conservative figure for this code on one core). */
    static final double ASSUMED_UPDATES_PER_SECOND = 3e8;

    /**
     * The cost of a sweep, known before it starts.
     *
     * @param maxFrontier    the largest number of frontier sites (states per vector q^maxFrontier)
     * @param peakBytes      the largest memory held at once by the state vectors (two state vectors and a term vector)
     * @param updates        element updates per prime
     * @param primes         number of 62-bit primes
     * @param estimatedSeconds updates x primes / {@value #ASSUMED_UPDATES_PER_SECOND} (a rough guide)
     */
    public record Cost(int maxFrontier, double peakBytes, double updates, int primes, double estimatedSeconds) {
        @Override
        public String toString() {
            return String.format("frontier %d sites, peak memory %.3g MB, %.3g updates x %d primes, about %.3g s",
                    maxFrontier, peakBytes / 1e6, updates, primes, estimatedSeconds);
        }
    }

    /** The cost of counting {@code model} on {@code lattice} (with the magnetisation / particle label when asked). */
    public static Cost estimate(Lattice lattice, Model model, boolean withLabel) {
        Schedule plan = new Schedule(lattice);
        return estimate(plan, lattice, model, withLabel);
    }

    /** Ising g(E) without a label: the spin-flip symmetric sweep stores half the states. */
    private static boolean flipSymmetric(Model model, boolean withLabel) {
        return model.kind() == Model.Kind.ISING && !withLabel;
    }

    private static Cost estimate(Schedule plan, Lattice lattice, Model model, boolean withLabel) {
        double q = model.statesPerSite();
        boolean energy = model.kind() != Model.Kind.HARD_CORE;
        double k = 1;
        double u = 1;
        int f = 0;
        double peak = 8;
        double biggest = 1;
        double updates = 0;
        double replaceMax = FrontierSweep.largestReplace(plan, q, energy, withLabel);
        boolean held = false;                        // the sweep's reused buffers allocated yet
        for (int t = 0; t < plan.sites; t++) {
            double oldSize = Math.pow(q, f) * k * u;
            if (energy) {
                k += plan.neighbourSlots[t].length;
            }
            if (withLabel) {
                u += 1;
            }
            double size;
            if (plan.replaceSlot[t] >= 0) {
                size = Math.pow(q, f) * k * u;
                // the old vector, the new one and the term vector (both reused buffers of the largest replace size)
                peak = Math.max(peak, 8 * (Math.max(oldSize, held ? replaceMax : 0) + 2 * replaceMax));
                held = true;
                updates += q * oldSize;
            } else {
                f++;
                size = Math.pow(q, f) * k * u;
                peak = Math.max(peak, 8 * (oldSize + size + (held ? 3 * replaceMax : 0)));
                updates += size;
            }
            biggest = Math.max(biggest, size);
            for (int ignored : plan.retireSlots[t]) {
                double smaller = size / q;
                // old vector, destination and term vector; the three reused buffers are at least replaceMax long
                peak = Math.max(peak, 8 * (Math.max(size, replaceMax) + 2 * Math.max(smaller, replaceMax)));
                held = true;
                updates += size;
                size = smaller;
                f--;
            }
        }
        if (flipSymmetric(model, withLabel)) {
            peak = 3 * 8 * biggest / 2;              // three half-size vectors: two state vectors and the second-term vector
            updates /= 2;
        }
        int primes = WordPrimes.primesFor(lattice.sites() * Math.log(q) / Math.log(2));
        return new Cost(plan.maxFrontier, peak, updates, primes, updates * primes / ASSUMED_UPDATES_PER_SECOND);
    }

    /** g(E) (Ising, Potts) or g(n) (hard-core gas), with a memory limit of 3/4 of the JVM's maximum heap. */
    public static ExactDensityOfStates densityOfStates(Lattice lattice, Model model, ProgressListener progress) {
        return count(lattice, model, model.kind() == Model.Kind.HARD_CORE, defaultMemoryLimit(), progress);
    }

    /** Ising g(E, M), M = sum of spins. */
    public static ExactDensityOfStates withMagnetisation(Lattice lattice, Model model, ProgressListener progress) {
        if (!model.hasMagnetisation()) {
            throw InvalidInputException.of("magnetisation resolution for the " + model, "requested", "an Ising model",
                    "The Potts and hard-core models here have no magnetisation label; count g(E) (or g(n)) instead.");
        }
        return count(lattice, model, true, defaultMemoryLimit(), progress);
    }

    static long defaultMemoryLimit() {
        return Runtime.getRuntime().maxMemory() / 4 * 3;
    }

    /**
     * The general entry: counts with or without the label (the hard-core gas always carries its
     * particle number), refusing when the estimate exceeds {@code memoryLimitBytes}. Ising and Potts
     * counts are checked against sum g = q^N before they are returned (a failure throws).
     */
    public static ExactDensityOfStates count(Lattice lattice, Model model, boolean withLabel, long memoryLimitBytes,
                                             ProgressListener progress) {
        Objects.requireNonNull(lattice, "lattice");
        Objects.requireNonNull(model, "model");
        Objects.requireNonNull(progress, "progress");
        if (withLabel && model.kind() == Model.Kind.POTTS) {
            throw InvalidInputException.of("magnetisation resolution for the " + model, "requested", "an Ising model",
                    "Count g(E) of the Potts model instead.");
        }
        boolean hardCore = model.kind() == Model.Kind.HARD_CORE;
        withLabel |= hardCore;                     // the hard-core gas is always counted by particle number
        Schedule plan = new Schedule(lattice);
        Cost cost = estimate(plan, lattice, model, withLabel);
        double largestArray = cost.peakBytes() / 8;
        if (cost.peakBytes() > memoryLimitBytes || largestArray > Integer.MAX_VALUE - 16) {
            throw InvalidInputException.of("transfer-matrix cost for the " + model + " on the " + lattice, cost,
                    "at most " + memoryLimitBytes / 1_000_000 + " MB of state vectors (and arrays below 2^31 entries)",
                    "Use a narrower lattice (the frontier is set by the shorter side), a cylinder instead of a torus, "
                            + "Kaufman's solution for the periodic square Ising lattice, or more heap (-Xmx; MICROTALLY_HEAP=4g for toolkit/bin/microtally, install-kernel --heap 4g for the kernel).");
        }
        long[] primes = WordPrimes.primes(cost.primes());
        long[][] residues = new long[primes.length][];
        Ticker ticker = new Ticker(progress, (long) primes.length * plan.sites, "lattice sites");
        if (flipSymmetric(model, withLabel)) {
            FlipSymmetricSweep sweep = new FlipSymmetricSweep(plan);
            for (int i = 0; i < primes.length; i++) {
                residues[i] = sweep.run(primes[i], ticker::step);
            }
        } else {
            FrontierSweep sweep = new FrontierSweep(plan, model, withLabel);
            for (int i = 0; i < primes.length; i++) {
                residues[i] = sweep.run(primes[i], ticker::step);
            }
        }
        BigInteger[] counts = WordPrimes.recombine(primes, residues);
        if (!hardCore) {
            BigInteger sum = BigInteger.ZERO;
            for (BigInteger c : counts) {
                sum = sum.add(c);
            }
            if (!sum.equals(BigInteger.valueOf(model.statesPerSite()).pow(lattice.sites()))) {
                throw new IllegalStateException("transfer-matrix counts of the " + model + " on the " + lattice
                        + " failed their own check sum g = q^N");
            }
        }
        int uRange = withLabel ? lattice.sites() + 1 : 1;
        return Tally.toDensityOfStates(lattice, model, withLabel, counts, uRange);
    }
}
