package org.microtally.lattice;

/**
 * The Ising g(E) sweep using spin-flip symmetry: flipping every spin keeps the number of unequal
 * bonds, so the table of a frontier state s equals that of its complement ~s. Only states with the
 * spin in slot 0 down (bit 0 clear) are stored, at index s / 2; a read of any state goes through
 * its stored representative. Every update is destination-major over the stored states, so the
 * vector and the work are halved against {@link FrontierSweep}; the arithmetic (modular additions
 * of shifted rows) is the same, the rows being built by {@link RowSum}.
 */
final class FlipSymmetricSweep {
    private final Schedule plan;
    private long[] bufferA = new long[0];
    private long[] bufferB = new long[0];

    private final int largest;
    private final RowSum rows;

    FlipSymmetricSweep(Schedule plan) {
        this.plan = plan;
        long most = 1;
        int kRange = 1;
        int f = 0;
        for (int t = 0; t < plan.sites; t++) {
            kRange += plan.neighbourSlots[t].length;
            f = plan.replaceSlot[t] >= 0 ? f : f + 1;
            most = Math.max(most, stored(f) * kRange);
            f -= plan.retireSlots[t].length;
        }
        this.largest = Math.toIntExact(most);
        this.rows = new RowSum(kRange);
    }

    /** Stored index of frontier state s (f sites). */
    private static long index(long s, int f) {
        long mask = (1L << f) - 1;
        return ((s & 1) == 0 ? s : ~s & mask) >>> 1;
    }

    private static long stored(int f) {
        return f == 0 ? 1 : 1L << (f - 1);
    }

    private static int shift(long s, int a, int[] nb) {
        int dk = 0;
        for (int j : nb) {
            dk += (int) ((s >>> j) & 1) ^ a;
        }
        return dk;
    }

    /** A reused buffer of {@code size} entries (allocated once at the sweep's largest size) that is not {@code inUse}. */
    private long[] spare(long[] inUse, long size) {
        int n = Math.toIntExact(size);
        if (bufferA.length < n || bufferB.length < n) {
            bufferA = new long[Math.max(n, largest)];
            bufferB = new long[Math.max(n, largest)];
        }
        return inUse == bufferA ? bufferB : bufferA;
    }

    /** Final table over k = 0..bonds modulo p. */
    long[] run(long p, Runnable afterSite) {
        long[] vec = {1};
        int kRange = 1;
        int f = 0;
        for (int t = 0; t < plan.sites; t++) {
            int[] nb = plan.neighbourSlots[t];
            int nk = kRange + nb.length;
            int slot = plan.replaceSlot[t];
            int nf = slot >= 0 ? f : f + 1;
            long destinations = stored(nf);
            long[] next = spare(vec, destinations * nk);
            int chunk = rows.begin(nk);
            for (long i0 = 0; i0 < destinations; i0 += chunk) {
                long i1 = Math.min(destinations, i0 + chunk);
                for (long i = i0; i < i1; i++) {
                    long dest = nf == 0 ? 0 : i << 1;
                    if (slot >= 0) {
                        int a = (int) ((dest >>> slot) & 1);
                        long s0 = dest & ~(1L << slot);
                        long s1 = s0 | (1L << slot);
                        rows.first(shift(s0, a, nb), vec, (int) (index(s0, f) * kRange), kRange);
                        rows.second(shift(s1, a, nb), vec, (int) (index(s1, f) * kRange), kRange);
                    } else {
                        int a = (int) ((dest >>> f) & 1);
                        long s = dest & ~(1L << f);
                        rows.first(shift(s, a, nb), vec, (int) (index(s, f) * kRange), kRange);
                    }
                }
                if (slot >= 0) {
                    rows.flushSum(next, i0, p);
                } else {
                    rows.flush(next, i0);
                }
            }
            vec = next;
            kRange = nk;
            f = nf;
            for (int r : plan.retireSlots[t]) {
                vec = retire(vec, f, r, kRange, p);
                f--;
            }
            afterSite.run();
        }
        return java.util.Arrays.copyOf(vec, kRange);
    }

    /** Sums out slot j of an f-site frontier; the top slot moves into j. */
    private long[] retire(long[] vec, int f, int j, int block, long p) {
        int nf = f - 1;
        long destinations = stored(nf);
        long[] next = spare(vec, destinations * block);
        int chunk = rows.begin(block);
        for (long i0 = 0; i0 < destinations; i0 += chunk) {
            long i1 = Math.min(destinations, i0 + chunk);
            for (long i = i0; i < i1; i++) {
                long dest = nf == 0 ? 0 : i << 1;
                for (int d = 0; d < 2; d++) {
                    long s;
                    if (j == f - 1) {
                        s = dest | ((long) d << j);
                    } else {
                        long top = (dest >>> j) & 1;                // the top site now sits in slot j
                        s = (dest & ~(1L << j)) | ((long) d << j) | (top << (f - 1));
                    }
                    int from = (int) (index(s, f) * block);
                    if (d == 0) {
                        rows.first(0, vec, from, block);
                    } else {
                        rows.second(0, vec, from, block);
                    }
                }
            }
            rows.flushSum(next, i0, p);
        }
        return next;
    }
}
