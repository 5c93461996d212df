package org.microtally.count;

import java.math.BigInteger;
import java.util.Iterator;
import java.util.NoSuchElementException;
import java.util.Objects;
import java.util.Spliterator;
import java.util.Spliterators;
import java.util.stream.Stream;
import java.util.stream.StreamSupport;
import org.microtally.Inputs;
import org.microtally.InvalidInputException;
import org.microtally.ProgressListener;
import org.microtally.spectrum.Spectrum;
import org.microtally.spectrum.Statistics;

/**
 * Brute-force enumeration of the microstates with n particles and total energy e, as a lazy stream:
 * the independent cross-check of {@link CountTable}.
 *
 * <p>The single-particle states are the levels' states in level order (level 0's g_0 states, then
 * level 1's, ...), restricted to levels with energy &lt;= e, since no other state can be occupied;
 * {@link #stateLevels(int)} maps a state position to its level. For indistinguishable particles each
 * element is an occupation vector over those states (entries 0..k, summing to n); for
 * DISTINGUISHABLE particles each element is a label assignment: entry i is the state of particle i.
 * Elements are fresh arrays in a fixed order (occupation vectors in decreasing, label assignments in
 * increasing lexicographic order), produced one at a time by depth-first search with pruning on the
 * remaining particles and energy; nothing is stored.
 *
 * <p>Method and accuracy: plain depth-first generation of every occupation vector or assignment with
 * the given particle number and energy (common practice, no source); it is exact by construction,
 * using only integer arithmetic, and shares no code with the generating-function recursions of
 * {@link CountTable}, which is what makes it an independent check. Cost: proportional to the number
 * of microstates produced times the number of states, plus the pruned dead ends.
 *
 * <p>Cap: asking for more microstates than the cap (default 10^7) is refused before anything is
 * enumerated, with the exact number (taken from a {@link CountTable}) in the message; raise it with
 * {@link #withCap(long)}.
 */
public final class MicrostateEnumerator {
    /** The default cap, 10^7 microstates. */
    public static final long DEFAULT_CAP = 10_000_000L;

    private final Spectrum spectrum;
    private final Statistics statistics;
    private final long cap;
    private final int[] energy;
    private final int[] deg;

    private MicrostateEnumerator(Spectrum spectrum, Statistics statistics, long cap) {
        this.spectrum = spectrum;
        this.statistics = statistics;
        this.cap = cap;
        CountTable.Input in = CountTable.Input.validate(spectrum, statistics, 0, 0, ProgressListener.NONE);
        this.energy = in.energy;
        this.deg = in.deg;
    }

    /** An enumerator with the default cap. */
    public static MicrostateEnumerator of(Spectrum spectrum, Statistics statistics) {
        return new MicrostateEnumerator(Objects.requireNonNull(spectrum, "spectrum"),
                Objects.requireNonNull(statistics, "statistics"), DEFAULT_CAP);
    }

    /** The same enumerator with another cap (&gt;= 1). */
    public MicrostateEnumerator withCap(long newCap) {
        Inputs.atLeast("microstate cap", newCap, 1);
        return new MicrostateEnumerator(spectrum, statistics, newCap);
    }

    /** The cap in force. */
    public long cap() {
        return cap;
    }

    /** Exact number of microstates with n particles and energy e (from a count table). */
    public BigInteger microstateCount(int n, int e) {
        return CountTable.of(spectrum, statistics, n, e).count(n, e);
    }

    /** Level index of each state position used for total energy e. */
    public int[] stateLevels(int e) {
        int levels = CountEngine.relevantLevels(energy, e);
        int s = 0;
        for (int l = 0; l < levels; l++) {
            s += deg[l];
        }
        int[] out = new int[s];
        int k = 0;
        for (int l = 0; l < levels; l++) {
            for (int d = 0; d < deg[l]; d++) {
                out[k++] = l;
            }
        }
        return out;
    }

    /**
     * The microstates with n particles and total energy e, lazily.
     *
     * @throws InvalidInputException if n or e is negative, or there are more microstates than the cap
     */
    public Stream<int[]> microstates(int n, int e) {
        Inputs.atLeast("particle number n", n, 0);
        Inputs.atLeast("total energy e", e, 0);
        BigInteger total = microstateCount(n, e);
        if (total.compareTo(BigInteger.valueOf(cap)) > 0) {
            throw InvalidInputException.of("number of microstates with n = " + n + ", e = " + e, total,
                    "at most the cap " + cap, "Raise the cap with withCap(" + total + ") if you mean it, or "
                            + "use CountTable for the count alone.");
        }
        int[] levelOf = stateLevels(e);
        int[] se = new int[levelOf.length];
        for (int s = 0; s < se.length; s++) {
            se[s] = energy[levelOf[s]];
        }
        Iterator<int[]> it = statistics.indistinguishable()
                ? new OccupationIterator(se, n, e, statistics.maxOccupancy())
                : new AssignmentIterator(se, n, e);
        return StreamSupport.stream(Spliterators.spliteratorUnknownSize(it,
                Spliterator.ORDERED | Spliterator.NONNULL), false);
    }

    /** Shared look-ahead logic: subclasses find the next solution in place. */
    private abstract static class Search implements Iterator<int[]> {
        private boolean started;
        private boolean ready;
        private boolean done;

        /** Extends the partial solution at the current position to a full one (backtracking); false when none is left. */
        abstract boolean descend();

        /** The position being chosen: a state index (occupations) or a particle index (assignments). */
        int pos;

        /**
         * Moves the deepest choice that can still change to its next value and the position past it;
         * false when all are exhausted.
         */
        final boolean retreat() {
            while (--pos >= 0) {
                if (nextChoiceAtPos()) {
                    pos++;
                    return true;
                }
            }
            return false;
        }

        /** Changes the choice at {@link #pos} to its next feasible value, undoing the current one; false if none. */
        abstract boolean nextChoiceAtPos();

        /** Puts the position back at the end of the solution last found, so that {@link #retreat()} moves past it. */
        abstract void returnToLastSolution();

        abstract int[] current();

        private boolean findNext() {
            returnToLastSolution();
            return retreat() && descend();
        }

        @Override
        public boolean hasNext() {
            if (!ready && !done) {
                boolean found = started ? findNext() : descend();
                started = true;
                ready = found;
                done = !found;
            }
            return ready;
        }

        @Override
        public int[] next() {
            if (!hasNext()) {
                throw new NoSuchElementException();
            }
            ready = false;
            return current().clone();
        }
    }

    /** Occupation vectors over states sorted by energy, at most k per state. */
    private static final class OccupationIterator extends Search {
        private final int[] se;
        private final int[] occ;
        private final int k;
        private int lastPos;
        private long remN;
        private long remE;

        OccupationIterator(int[] se, int n, int e, int k) {
            this.se = se;
            this.occ = new int[se.length];
            this.k = k;
            this.remN = n;
            this.remE = e;
        }

        @Override
        void returnToLastSolution() {
            pos = lastPos;
        }

        @Override
        int[] current() {
            return occ;
        }

        private boolean feasible() {
            int s = se.length;
            if (pos >= s) {
                return false;
            }
            return remN <= (long) k * (s - pos) && se[pos] * remN <= remE && remE <= remN * se[s - 1];
        }

        @Override
        boolean descend() {
            while (true) {
                if (remN == 0 && remE == 0) {
                    for (int s = pos; s < occ.length; s++) {
                        occ[s] = 0;
                    }
                    lastPos = pos;
                    return true;
                }
                if (!feasible()) {
                    if (!retreat()) {
                        return false;
                    }
                    continue;
                }
                long c = Math.min(k, remN);
                if (se[pos] > 0) {
                    c = Math.min(c, remE / se[pos]);
                }
                occ[pos] = (int) c;
                remN -= c;
                remE -= c * se[pos];
                pos++;
            }
        }

        @Override
        boolean nextChoiceAtPos() {
            if (occ[pos] == 0) {
                return false;
            }
            occ[pos]--;
            remN++;
            remE += se[pos];
            return true;
        }
    }

    /** Label assignments: particle i sits in state a[i]. */
    private static final class AssignmentIterator extends Search {
        private final int[] se;
        private final int[] a;
        private final int n;
        private long remE;
        private final long eMin;
        private final long eMax;

        AssignmentIterator(int[] se, int n, int e) {
            this.se = se;
            this.a = new int[n];
            this.n = n;
            this.remE = e;
            this.eMin = se.length == 0 ? 0 : se[0];
            this.eMax = se.length == 0 ? 0 : se[se.length - 1];
        }

        @Override
        void returnToLastSolution() {
            pos = n;
        }

        @Override
        int[] current() {
            return a;
        }

        /** Smallest state >= from that particle pos can take with the rest still feasible, or -1. */
        private int choice(int from) {
            long rest = n - pos - 1;
            for (int s = from; s < se.length; s++) {
                long left = remE - se[s];
                if (left < rest * eMin) {
                    return -1;
                }
                if (left <= rest * eMax) {
                    return s;
                }
            }
            return -1;
        }

        @Override
        boolean descend() {
            while (true) {
                if (pos == n) {
                    if (remE == 0) {
                        return true;
                    }
                    if (!retreat()) {
                        return false;
                    }
                    continue;
                }
                int s = choice(0);
                if (s < 0) {
                    if (!retreat()) {
                        return false;
                    }
                    continue;
                }
                a[pos] = s;
                remE -= se[s];
                pos++;
            }
        }

        @Override
        boolean nextChoiceAtPos() {
            remE += se[a[pos]];
            int s = choice(a[pos] + 1);
            if (s < 0) {
                return false;
            }
            a[pos] = s;
            remE -= se[s];
            return true;
        }
    }
}
