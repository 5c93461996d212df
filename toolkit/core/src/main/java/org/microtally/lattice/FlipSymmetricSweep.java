package org.microtally.lattice;

/**
 * The Ising g(E) sweep using spin-flip symmetry: flipping every spin keeps the number of unequal
 * bonds, so the table of a frontier state s equals that of its complement ~s. Only states with the
 * spin in slot 0 down (bit 0 clear) are stored, at index s / 2; a read of any state goes through
 * its stored representative. Every update is destination-major over the stored states, so the
 * vector and the work are halved against {@link FrontierSweep}; the arithmetic (modular additions
 * of shifted rows) is the same. Each destination row is the sum of two shifted source rows: the
 * first is copied into the new vector, the second into a third vector at the same index, and the two
 * are added a chunk at a time ({@link RowSum}), so memory is three vectors (the estimate counts them).
 */
final class FlipSymmetricSweep {
    private final Schedule plan;
    /** Largest stored vector (entries). */
    private final int largest;

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

    /** Final table over k = 0..bonds modulo p. */
    long[] run(long p, Runnable afterSite) {
        long[] a = new long[largest];
        long[] b = new long[largest];
        long[] term = new long[largest];
        long[] vec = a;
        vec[0] = 1;
        int kRange = 1;
        int f = 0;
        for (int t = 0; t < plan.sites; t++) {
            int[] nb = plan.neighbourSlots[t];
            int nk = kRange + nb.length;
            int slot = plan.replaceSlot[t];
            int nf = slot >= 0 ? f : f + 1;
            long destinations = stored(nf);
            long[] next = vec == a ? b : a;
            int chunk = RowSum.rowsPerChunk(nk);
            for (long i0 = 0; i0 < destinations; i0 += chunk) {
                long i1 = Math.min(destinations, i0 + chunk);
                for (long i = i0; i < i1; i++) {
                    long dest = nf == 0 ? 0 : i << 1;
                    int frame = (int) (i * nk);
                    if (slot >= 0) {
                        int bit = (int) ((dest >>> slot) & 1);
                        long s0 = dest & ~(1L << slot);
                        long s1 = s0 | (1L << slot);
                        RowSum.place(next, frame, nk, shift(s0, bit, nb), vec, (int) (index(s0, f) * kRange), kRange);
                        RowSum.place(term, frame, nk, shift(s1, bit, nb), vec, (int) (index(s1, f) * kRange), kRange);
                    } else {
                        int bit = (int) ((dest >>> f) & 1);
                        long s = dest & ~(1L << f);
                        RowSum.place(next, frame, nk, shift(s, bit, nb), vec, (int) (index(s, f) * kRange), kRange);
                    }
                }
                if (slot >= 0) {
                    RowSum.addMod(next, term, (int) (i0 * nk), (int) ((i1 - i0) * nk), p);
                }
            }
            vec = next;
            kRange = nk;
            f = nf;
            for (int r : plan.retireSlots[t]) {
                next = vec == a ? b : a;
                retire(vec, next, term, f, r, kRange, p);
                vec = next;
                f--;
            }
            afterSite.run();
        }
        return java.util.Arrays.copyOf(vec, kRange);
    }

    /** Sums out slot j of an f-site frontier from vec into next; the top slot moves into j. */
    private static void retire(long[] vec, long[] next, long[] term, int f, int j, int block, long p) {
        int nf = f - 1;
        long destinations = stored(nf);
        int chunk = RowSum.rowsPerChunk(block);
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
                    System.arraycopy(vec, (int) (index(s, f) * block), d == 0 ? next : term, (int) (i * block), block);
                }
            }
            RowSum.addMod(next, term, (int) (i0 * block), (int) ((i1 - i0) * block), p);
        }
    }
}
