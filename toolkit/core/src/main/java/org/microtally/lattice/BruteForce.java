package org.microtally.lattice;

import java.math.BigInteger;
import org.microtally.InvalidInputException;
import org.microtally.ensemble.ExactDensityOfStates;

/**
 * Exact densities of states by visiting every configuration: the independent cross-check of
 * {@link TransferMatrix} and {@link Kaufman} for small lattices.
 *
 * <p>Method: the q-ary reflected Gray code (Knuth, TAOCP Vol. 4A, Sec. 7.2.1.1, Algorithm H,
 * loopless reflected mixed-radix Gray generation), so consecutive configurations differ at one site
 * and the number of unequal bonds (and the label) is updated from that site's neighbours only.
 * Cost q^N x (mean degree) steps; refused above 2^30 configurations.
 */
public final class BruteForce {
    private BruteForce() { }

    /** Largest number of configurations visited. */
    public static final long MAX_CONFIGURATIONS = 1L << 30;

    /** g(E) (Ising, Potts) or g(n) (hard-core gas). */
    public static ExactDensityOfStates densityOfStates(Lattice lattice, Model model) {
        return enumerate(lattice, model, model.kind() == Model.Kind.HARD_CORE);
    }

    /** Ising g(E, M). */
    public static ExactDensityOfStates withMagnetisation(Lattice lattice, Model model) {
        if (!model.hasMagnetisation()) {
            throw InvalidInputException.of("magnetisation resolution for the " + model, "requested", "an Ising model",
                    "Count g(E) instead.");
        }
        return enumerate(lattice, model, true);
    }

    private static ExactDensityOfStates enumerate(Lattice lattice, Model model, boolean withLabel) {
        int n = lattice.sites();
        int q = model.statesPerSite();
        double configurations = Math.pow(q, n);
        if (configurations > MAX_CONFIGURATIONS) {
            throw InvalidInputException.of("configurations of the " + model + " on the " + lattice,
                    String.format("%.3g", configurations), "at most 2^30 for brute force", "Use TransferMatrix.");
        }
        boolean hardCore = model.kind() == Model.Kind.HARD_CORE;
        int[][] adj = lattice.adjacency();
        int bonds = lattice.bonds();
        int uRange = withLabel ? n + 1 : 1;
        int kRange = hardCore ? 1 : bonds + 1;
        long[] counts = new long[kRange * uRange];
        int[] a = new int[n];
        int[] focus = new int[n + 1];
        int[] dir = new int[n];
        for (int j = 0; j <= n; j++) {
            focus[j] = j;
        }
        java.util.Arrays.fill(dir, 1);
        // All sites at value 0: every bond joins equal values, nothing occupied.
        int unequal = 0;
        int occupied = 0;
        int conflicts = 0;
        while (true) {
            if (!hardCore) {
                counts[unequal * uRange + (withLabel ? occupied : 0)]++;
            } else if (conflicts == 0) {
                counts[occupied]++;
            }
            int j = focus[0];
            focus[0] = 0;
            if (j == n) {
                break;
            }
            int old = a[j];
            int now = old + dir[j];
            for (int nb : adj[j]) {
                int other = a[nb];
                if (hardCore) {
                    if (other == 1) {
                        conflicts += now - old;
                    }
                } else {
                    unequal += (other != now ? 1 : 0) - (other != old ? 1 : 0);
                }
            }
            if (now == 1) {
                occupied++;
            } else if (old == 1) {
                occupied--;
            }
            a[j] = now;
            if (now == 0 || now == q - 1) {
                dir[j] = -dir[j];
                focus[j] = focus[j + 1];
                focus[j + 1] = j + 1;
            }
        }
        BigInteger[] big = new BigInteger[counts.length];
        for (int i = 0; i < counts.length; i++) {
            big[i] = BigInteger.valueOf(counts[i]);
        }
        return Tally.toDensityOfStates(lattice, model, withLabel, big, uRange);
    }
}
