package org.microtally.lattice;

import java.io.Serializable;
import java.math.BigInteger;
import java.util.Arrays;
import java.util.Objects;
import org.microtally.InvalidInputException;
import org.microtally.count.WordPrimes;
import org.microtally.ensemble.ExactDensityOfStates;

/**
 * An exact lattice density of states cut into independent tasks for engines that run them elsewhere
 * (a cluster) and combine the results on the caller: one task per prime of the transfer-matrix count,
 * or one task per prefix of the brute-force enumeration. {@link Serializable}: a worker gets the
 * graph as a bond list (sites renumbered in the transfer matrix's visiting order, so the sweep is the
 * one {@link TransferMatrix} runs) and the model's kind; the lattice and model objects stay with the
 * plan that was built, which alone turns results into an {@link ExactDensityOfStates}.
 *
 * <p><b>Prime tasks.</b> {@link #residues(int)} is one sweep of {@link TransferMatrix} modulo one
 * prime (&gt; 2^61); {@link #fromResidues} recombines the required primes by Garner's Chinese
 * remaindering ({@link WordPrimes#recombine}; Knuth, TAOCP Vol. 2, Sec. 4.3.2), checks every count
 * against the {@value #REDUNDANT_PRIMES} redundant prime (a corrupted residue is refused, not
 * returned) and, for Ising and Potts, the sum g = q^N, as {@link TransferMatrix#count} does. The
 * prime count comes from the same bound: every count is at most q^N.
 *
 * <p><b>Prefix tasks.</b> {@link #walkPrefix} fixes the values of the first P sites (the digits of
 * the prefix index in base q) and visits every value of the other N - P sites in the q-ary reflected
 * Gray code (Knuth, TAOCP Vol. 4A, Sec. 7.2.1.1, Algorithm H), so consecutive configurations differ
 * at one site and the number of unequal bonds, the label and the hard-core conflicts are updated
 * from that site's neighbours only; {@link #fromHistograms} adds the q^P histograms exactly. It shares
 * no code with the transfer matrix, which is what makes it a cross-check.
 *
 * <p><b>Accuracy.</b> Exact, both ways; the prime tasks give {@link TransferMatrix#count}'s result
 * entry by entry, the prefix tasks {@link BruteForce}'s.
 */
public final class LatticeTasks implements Serializable {
    private static final long serialVersionUID = 1L;

    /** Redundant primes added to every plan for the consistency check. */
    public static final int REDUNDANT_PRIMES = 1;
    /** Largest number of configurations {@link #walkPrefix} tasks may visit together (2^40). */
    public static final long MAX_ENUMERATED = 1L << 40;

    private final int sites;
    private final int[][] bonds;         // renumbered: site t is the t-th site of the visiting order
    private final Model.Kind kind;
    private final int q;
    private final Model.Coupling coupling;
    private final boolean withLabel;
    private final long[] primes;
    private final int required;
    private final transient Lattice lattice;
    private final transient Model model;
    private transient Schedule schedule;
    private transient int[][] adjacency;

    private LatticeTasks(Lattice lattice, Model model, boolean withLabel, int required) {
        this.sites = lattice.sites();
        int[] order = lattice.order();
        int[] position = new int[sites];
        for (int t = 0; t < sites; t++) {
            position[order[t]] = t;
        }
        this.bonds = new int[lattice.bonds()][];
        for (int i = 0; i < bonds.length; i++) {
            int[] b = lattice.bond(i);
            bonds[i] = new int[] {position[b[0]], position[b[1]]};
        }
        this.kind = model.kind();
        this.q = model.statesPerSite();
        this.coupling = model.coupling();
        this.withLabel = withLabel;
        this.required = required;
        this.primes = WordPrimes.primes(required + REDUNDANT_PRIMES);
        this.lattice = lattice;
        this.model = model;
    }

    /**
     * The tasks for g(E) (Ising, Potts), g(E, M) (Ising, {@code withMagnetisation}) or g(n) (hard-core
     * gas, always by particle number), refused like {@link TransferMatrix#count} when the transfer
     * matrix's state vectors would not fit in 3/4 of this JVM's heap (the same state vectors are
     * held by each executor).
     *
     * @throws InvalidInputException for a magnetisation label on a Potts or hard-core model, or a
     *         sweep beyond the memory limit (the message gives the estimate)
     */
    public static LatticeTasks of(Lattice lattice, Model model, boolean withMagnetisation) {
        Objects.requireNonNull(lattice, "lattice");
        Objects.requireNonNull(model, "model");
        if (withMagnetisation && !model.hasMagnetisation()) {
            throw InvalidInputException.of("magnetisation resolution for the " + model, "requested", "an Ising model",
                    "The Potts and hard-core models here have no magnetisation label; count g(E) (or g(n)) instead.");
        }
        boolean label = withMagnetisation || model.kind() == Model.Kind.HARD_CORE;
        TransferMatrix.Cost cost = TransferMatrix.estimate(lattice, model, label);
        long limit = TransferMatrix.defaultMemoryLimit();
        if (cost.peakBytes() > limit || cost.peakBytes() / 8 > Integer.MAX_VALUE - 16) {
            throw InvalidInputException.of("transfer-matrix cost for the " + model + " on the " + lattice, cost,
                    "at most " + limit / 1_000_000 + " MB of state vectors per executor",
                    "Use a narrower lattice, a cylinder instead of a torus, or executors with a larger heap.");
        }
        return new LatticeTasks(lattice, model, label, cost.primes());
    }

    /** Number of primes whose product exceeds q^N, the bound on every count. */
    public int requiredPrimes() {
        return required;
    }

    /** requiredPrimes() + {@value #REDUNDANT_PRIMES}: the number of prime tasks. */
    public int primeCount() {
        return primes.length;
    }

    /** Number of sites N. */
    public int sites() {
        return sites;
    }

    /** Values per site q. */
    public int statesPerSite() {
        return q;
    }

    private Model workerModel() {
        return switch (kind) {
            case ISING -> Model.ising(coupling);
            case POTTS -> Model.potts(q, coupling);
            case HARD_CORE -> Model.hardCore();
        };
    }

    private synchronized Schedule schedule() {
        if (schedule == null) {
            schedule = new Schedule(Lattice.graph(sites, bonds));
        }
        return schedule;
    }

    private synchronized int[][] adjacency() {
        if (adjacency == null) {
            adjacency = Lattice.graph(sites, bonds).adjacency();
        }
        return adjacency;
    }

    /** The final transfer-matrix table modulo prime i (index k (uRange) + u); independent of every other i. */
    public long[] residues(int i) {
        if (i < 0 || i >= primes.length) {
            throw InvalidInputException.of("prime index", i, "in [0, " + primes.length + ")", "");
        }
        Schedule plan = schedule();
        if (kind == Model.Kind.ISING && !withLabel) {
            return new FlipSymmetricSweep(plan).run(primes[i], () -> { });
        }
        return new FrontierSweep(plan, workerModel(), withLabel).run(primes[i], () -> { });
    }

    /**
     * The density of states from every prime's residues ({@code residues[i]} for prime i), checked
     * against the redundant prime and (Ising, Potts) against sum g = q^N. Only on the plan built by
     * {@link #of}, not on a deserialized copy.
     *
     * @throws IllegalStateException when a check fails (a corrupted residue); the message names it
     */
    public ExactDensityOfStates fromResidues(long[][] residues) {
        Objects.requireNonNull(residues, "residues");
        requireBuiltHere();
        if (residues.length != primes.length) {
            throw InvalidInputException.of("number of residue arrays", residues.length, "exactly " + primes.length,
                    "Pass one array per prime, in prime order.");
        }
        int size = residues[0].length;
        for (int i = 0; i < residues.length; i++) {
            if (residues[i].length != size) {
                throw InvalidInputException.of("length of residues[" + i + "]", residues[i].length, "exactly " + size,
                        "Each array holds the whole table modulo one prime.");
            }
        }
        BigInteger[] counts = WordPrimes.recombine(Arrays.copyOf(primes, required), Arrays.copyOf(residues, required));
        BigInteger check = BigInteger.valueOf(primes[required]);
        for (int j = 0; j < size; j++) {
            long got = counts[j].mod(check).longValue();
            if (got != residues[required][j]) {
                throw new IllegalStateException("CRT consistency check failed at table entry " + j + " of the " + model
                        + " on the " + lattice + ": " + got + " modulo the redundant prime " + check + ", whose own "
                        + "residue is " + residues[required][j] + ". A task returned a wrong residue; recompute.");
            }
        }
        return toDensityOfStates(counts, "transfer-matrix");
    }

    private ExactDensityOfStates toDensityOfStates(BigInteger[] counts, String how) {
        if (kind != Model.Kind.HARD_CORE) {
            BigInteger sum = BigInteger.ZERO;
            for (BigInteger c : counts) {
                sum = sum.add(c);
            }
            if (!sum.equals(BigInteger.valueOf(q).pow(sites))) {
                throw new IllegalStateException(how + " counts of the " + model + " on the " + lattice
                        + " failed the check sum g = q^N: " + sum);
            }
        }
        return Tally.toDensityOfStates(lattice, model, withLabel, counts, withLabel ? sites + 1 : 1);
    }

    private void requireBuiltHere() {
        if (lattice == null) {
            throw new IllegalStateException("needs the plan as built by LatticeTasks.of on this machine, not a "
                    + "deserialized copy");
        }
    }

    /** Length of every histogram {@link #walkPrefix} returns: (bonds + 1) (N + 1) with the label, else bonds + 1 (hard core: N + 1). */
    public int histogramLength() {
        int kRange = kind == Model.Kind.HARD_CORE ? 1 : bonds.length + 1;
        return kRange * (withLabel ? sites + 1 : 1);
    }

    /**
     * The number of prefix tasks q^P for P fixed sites.
     *
     * @throws InvalidInputException for P outside [0, N], or q^N beyond {@link #MAX_ENUMERATED}
     */
    public long prefixCount(int prefixSites) {
        if (prefixSites < 0 || prefixSites > sites) {
            throw InvalidInputException.of("number of prefix sites P", prefixSites, "in [0, " + sites + "]", "");
        }
        double all = Math.pow(q, sites);
        if (all > MAX_ENUMERATED) {
            throw InvalidInputException.of("configurations of the " + kind.name().toLowerCase() + " model on "
                            + sites + " sites", String.format("%.3g", all), "at most 2^40 for enumeration",
                    "Use the transfer matrix (prime tasks); enumeration is the cross-check of small lattices.");
        }
        return (long) Math.pow(q, prefixSites);
    }

    /**
     * The histogram over (unequal bonds k, label u) (index k (uRange) + u, see {@link #histogramLength})
     * of every configuration whose first P sites (visiting order) carry the base-q digits of
     * {@code prefix} (site 0 the least significant), the other sites walked in Gray-code order.
     */
    public long[] walkPrefix(int prefixSites, long prefix) {
        long count = prefixCount(prefixSites);
        if (prefix < 0 || prefix >= count) {
            throw InvalidInputException.of("prefix index", prefix, "in [0, " + count + ")", "");
        }
        int[][] adj = adjacency();
        boolean hardCore = kind == Model.Kind.HARD_CORE;
        int uRange = withLabel ? sites + 1 : 1;
        int[] value = new int[sites];
        long rest = prefix;
        for (int s = 0; s < prefixSites; s++) {
            value[s] = (int) (rest % q);
            rest /= q;
        }
        int unequal = 0;
        int conflicts = 0;
        int up = 0;
        for (int[] b : bonds) {
            unequal += value[b[0]] != value[b[1]] ? 1 : 0;
            conflicts += value[b[0]] == 1 && value[b[1]] == 1 ? 1 : 0;
        }
        for (int v : value) {
            up += v == 1 ? 1 : 0;
        }
        long[] h = new long[histogramLength()];
        int free = sites - prefixSites;
        int[] focus = new int[free + 1];
        int[] step = new int[free];
        for (int j = 0; j <= free; j++) {
            focus[j] = j;
        }
        Arrays.fill(step, 1);
        for (;;) {
            if (!hardCore) {
                h[unequal * uRange + (withLabel ? up : 0)]++;
            } else if (conflicts == 0) {
                h[up]++;
            }
            int j = focus[0];
            focus[0] = 0;
            if (j == free) {
                return h;
            }
            int site = prefixSites + j;
            int from = value[site];
            int to = from + step[j];
            for (int nb : adj[site]) {
                int other = value[nb];
                unequal += (other != to ? 1 : 0) - (other != from ? 1 : 0);
                conflicts += other == 1 ? to - from : 0;
            }
            up += (to == 1 ? 1 : 0) - (from == 1 ? 1 : 0);
            value[site] = to;
            if (to == 0 || to == q - 1) {
                step[j] = -step[j];
                focus[j] = focus[j + 1];
                focus[j + 1] = j + 1;
            }
        }
    }

    /**
     * The density of states from the sum of the histograms of all q^P prefixes (each prefix exactly
     * once), checked against sum g = q^N (Ising, Potts). Only on the plan built by {@link #of}.
     */
    public ExactDensityOfStates fromHistograms(long[] merged) {
        Objects.requireNonNull(merged, "merged");
        requireBuiltHere();
        if (merged.length != histogramLength()) {
            throw InvalidInputException.of("histogram length", merged.length, "exactly " + histogramLength(), "");
        }
        BigInteger[] counts = new BigInteger[merged.length];
        for (int i = 0; i < merged.length; i++) {
            counts[i] = BigInteger.valueOf(merged[i]);
        }
        return toDensityOfStates(counts, "enumerated");
    }

    @Override
    public String toString() {
        return "LatticeTasks[" + (model == null ? kind.name().toLowerCase() : model) + ", " + sites + " sites, "
                + required + " + " + REDUNDANT_PRIMES + " primes]";
    }
}
