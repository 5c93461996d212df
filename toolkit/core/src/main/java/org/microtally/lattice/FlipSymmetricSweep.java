package org.microtally.lattice;

/**
 * The Ising g(E) sweep using spin-flip symmetry: flipping every spin keeps the number of unequal
 * bonds, so the table of a frontier state s equals that of its complement ~s. Only states with the
 * spin in slot 0 down (bit 0 clear) are stored, at index s / 2; a read of any state goes through
 * its stored representative. Every update is destination-major over the stored states, so the
 * vector and the work are halved against {@link FrontierSweep}; the arithmetic (modular additions
 * of shifted rows) is the same, the first contribution to each destination being a plain copy.
 */
final class FlipSymmetricSweep {
    private final Schedule plan;
    private long[] bufferA = new long[0];
    private long[] bufferB = new long[0];

    FlipSymmetricSweep(Schedule plan) {
        this.plan = plan;
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

    private long[] spare(long[] inUse, long size) {
        int n = Math.toIntExact(size);
        if (inUse != bufferA) {
            if (bufferA.length < n) {
                bufferA = new long[n];
            }
            return bufferA;
        }
        if (bufferB.length < n) {
            bufferB = new long[n];
        }
        return bufferB;
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
            for (long i = 0; i < destinations; i++) {
                long dest = nf == 0 ? 0 : i << 1;
                int frame = (int) (i * nk);
                if (slot >= 0) {
                    int a = (int) ((dest >>> slot) & 1);
                    long s0 = dest & ~(1L << slot);
                    long s1 = s0 | (1L << slot);
                    copy(next, frame, nk, shift(s0, a, nb), vec, (int) (index(s0, f) * kRange), kRange);
                    add(next, frame + shift(s1, a, nb), vec, (int) (index(s1, f) * kRange), kRange, p);
                } else {
                    int a = (int) ((dest >>> f) & 1);
                    long s = dest & ~(1L << f);
                    copy(next, frame, nk, shift(s, a, nb), vec, (int) (index(s, f) * kRange), kRange);
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
        for (long i = 0; i < destinations; i++) {
            long dest = nf == 0 ? 0 : i << 1;
            int frame = (int) (i * block);
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
                    System.arraycopy(vec, from, next, frame, block);
                } else {
                    add(next, frame, vec, from, block, p);
                }
            }
        }
        return next;
    }

    /** Frame [frame, frame + width) := zeros with vec[from .. from + len) copied in at offset dk. */
    private static void copy(long[] next, int frame, int width, int dk, long[] vec, int from, int len) {
        java.util.Arrays.fill(next, frame, frame + dk, 0L);
        System.arraycopy(vec, from, next, frame + dk, len);
        java.util.Arrays.fill(next, frame + dk + len, frame + width, 0L);
    }

    private static void add(long[] next, int to, long[] vec, int from, int len, long p) {
        for (int i = 0; i < len; i++) {
            long x = next[to + i] + vec[from + i] - p;
            next[to + i] = x + ((x >> 63) & p);
        }
    }
}
