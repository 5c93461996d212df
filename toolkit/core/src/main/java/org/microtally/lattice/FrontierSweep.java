package org.microtally.lattice;

/**
 * One transfer-matrix sweep modulo one prime p: the vector of partial counts over the frontier
 * states, each entry a table over (number of unequal bonds so far k, label so far u), updated one
 * site at a time.
 *
 * <p>Adding a site with value a maps each frontier state s to s + a q^f and shifts its table by
 * (dk, du): dk = number of added neighbours with a different value (Ising, Potts), du = 1 when the
 * site is up/occupied and the label is tracked. The hard-core gas drops states with two occupied
 * neighbours. Retiring a site sums its value out (modular additions). All weights are shifts, so
 * the only arithmetic is addition modulo p (p &lt; 2^62, so a + b never overflows a long).
 */
final class FrontierSweep {
    private final Schedule plan;
    private final int q;
    private final boolean hardCore;
    private final boolean trackEnergy;
    private final boolean trackLabel;
    private final long[] pow;

    FrontierSweep(Schedule plan, Model model, boolean trackLabel) {
        this.plan = plan;
        this.q = model.statesPerSite();
        this.hardCore = model.kind() == Model.Kind.HARD_CORE;
        this.trackEnergy = !hardCore;
        this.trackLabel = trackLabel;
        this.pow = new long[plan.maxFrontier + 2];
        pow[0] = 1;
        for (int i = 1; i < pow.length; i++) {
            pow[i] = pow[i - 1] * q;
        }
        this.largestReplace = Math.toIntExact((long) largestReplace(plan, q, trackEnergy, trackLabel));
    }

    /** Entries of the largest fused replace step's vector (the size of the reused buffers). */
    private final int largestReplace;

    /** Largest vector of a fused replace step (entries), used for the buffers and the memory estimate. */
    static double largestReplace(Schedule plan, double q, boolean trackEnergy, boolean trackLabel) {
        double k = 1;
        double u = 1;
        double largest = 0;
        int f = 0;
        for (int t = 0; t < plan.sites; t++) {
            k += trackEnergy ? plan.neighbourSlots[t].length : 0;
            u += trackLabel ? 1 : 0;
            if (plan.replaceSlot[t] >= 0) {
                largest = Math.max(largest, Math.pow(q, f) * k * u);
            } else {
                f++;
            }
            f -= plan.retireSlots[t].length;
        }
        return largest;
    }

    /** Width of the energy axis after all sites (k = 0..bonds). */
    static int energyRange(Schedule plan, boolean trackEnergy) {
        if (!trackEnergy) {
            return 1;
        }
        int k = 1;
        for (int[] nb : plan.neighbourSlots) {
            k += nb.length;
        }
        return k;
    }

    private int digit(long s, int j) {
        return q == 2 ? (int) ((s >>> j) & 1) : (int) ((s / pow[j]) % q);
    }

    /**
     * Runs the sweep modulo p and returns the final table, index k * uRange + u with
     * uRange = sites + 1 when the label is tracked (else 1).
     */
    long[] run(long p, Runnable afterSite) {
        long[] vec = {1};
        int kRange = 1;
        int uRange = 1;
        int f = 0;
        for (int t = 0; t < plan.sites; t++) {
            int[] nb = plan.neighbourSlots[t];
            int nk = trackEnergy ? kRange + nb.length : 1;
            int nu = trackLabel ? uRange + 1 : 1;
            long states = pow[f];
            int oldBlock = kRange * uRange;
            int newBlock = nk * nu;
            int replace = plan.replaceSlot[t];
            if (replace >= 0) {
                vec = replace(vec, states, replace, nb, kRange, uRange, nk, nu, p);
                kRange = nk;
                uRange = nu;
                for (int slot : plan.retireSlots[t]) {
                    vec = retire(vec, f, slot, newBlock, p);
                    f--;
                }
                afterSite.run();
                continue;
            }
            long[] next = new long[Math.toIntExact(pow[f + 1] * nk * nu)];
            for (long s = 0; s < states; s++) {
                int src = (int) (s * oldBlock);
                for (int a = 0; a < q; a++) {
                    int dk = shift(s, a, nb);
                    if (dk < 0) {
                        continue;
                    }
                    int du = trackLabel && a == 1 ? 1 : 0;
                    int dst = (int) ((s + a * pow[f]) * newBlock) + dk * nu + du;
                    if (uRange == 1 && nu == 1) {
                        System.arraycopy(vec, src, next, dst, kRange);
                    } else {
                        for (int k = 0; k < kRange; k++) {
                            System.arraycopy(vec, src + k * uRange, next, dst + k * nu, uRange);
                        }
                    }
                }
            }
            vec = next;
            kRange = nk;
            uRange = nu;
            f++;
            for (int slot : plan.retireSlots[t]) {
                vec = retire(vec, f, slot, newBlock, p);
                f--;
            }
            afterSite.run();
        }
        return java.util.Arrays.copyOf(vec, kRange * uRange);
    }

    /**
     * Fused update: the site in slot {@code slot} is summed out while the new site takes the slot.
     * Destination-major: for each new state t (slot digit a), next[t] = sum over the old slot
     * digit b of old[t with digit b] shifted by (dk, du). A chunk of destination states at a time
     * ({@link RowSum}): the b = 0 terms are placed into {@code next}, each further term into the third
     * buffer at the same index, and added with one index for both arrays while the chunk is in cache.
     * Every entry is written without a separate clearing pass; the three vectors are reused buffers.
     */
    private long[] replace(long[] vec, long states, int slot, int[] nb, int kRange, int uRange, int nk, int nu, long p) {
        int oldBlock = kRange * uRange;
        int newBlock = nk * nu;
        int size = Math.toIntExact(states * newBlock);
        long[] next = spare(vec, size);
        long[] term = term(size);
        long place = pow[slot];
        int chunk = RowSum.rowsPerChunk(newBlock);
        for (long t0 = 0; t0 < states; t0 += chunk) {
            long t1 = Math.min(states, t0 + chunk);
            for (int b = 0; b < q; b++) {
                long[] into = b == 0 ? next : term;
                boolean any = false;
                for (long t = t0; t < t1; t++) {
                    int a = digit(t, slot);
                    long s = t + (b - a) * place;
                    int frame = (int) (t * newBlock);
                    int dk = shift(s, a, nb);
                    if (dk < 0) {
                        java.util.Arrays.fill(into, frame, frame + newBlock, 0L);
                        continue;
                    }
                    any = true;
                    int du = trackLabel && a == 1 ? 1 : 0;
                    placeBlock(into, frame, newBlock, dk * nu + du, nu, vec, (int) (s * oldBlock), kRange, uRange);
                }
                if (b > 0 && any) {
                    RowSum.addMod(next, term, (int) (t0 * newBlock), (int) ((t1 - t0) * newBlock), p);
                }
            }
        }
        return next;
    }

    /**
     * dst[frame .. frame + width) := zeros with the source table (kRange rows of uRange entries from
     * src[from ..)) copied in, row k starting at frame + offset + k * nu.
     */
    private static void placeBlock(long[] dst, int frame, int width, int offset, int nu, long[] src, int from,
            int kRange, int uRange) {
        if (uRange == nu) {
            RowSum.place(dst, frame, width, offset, src, from, kRange * uRange);
            return;
        }
        java.util.Arrays.fill(dst, frame, frame + width, 0L);
        for (int k = 0; k < kRange; k++) {
            System.arraycopy(src, from + k * uRange, dst, frame + offset + k * nu, uRange);
        }
    }

    private long[] bufferA = new long[0];
    private long[] bufferB = new long[0];
    private long[] bufferTerm = new long[0];

    /** A reused buffer of at least {@code size} entries that is not {@code inUse}. */
    private long[] spare(long[] inUse, int size) {
        if (inUse != bufferA) {
            if (bufferA.length < size) {
                bufferA = new long[Math.max(size, largestReplace)];
            }
            return bufferA;
        }
        if (bufferB.length < size) {
            bufferB = new long[Math.max(size, largestReplace)];
        }
        return bufferB;
    }

    /** The reused buffer for second and further terms, at least {@code size} entries. */
    private long[] term(int size) {
        if (bufferTerm.length < size) {
            bufferTerm = new long[Math.max(size, largestReplace)];
        }
        return bufferTerm;
    }

    /**
     * The energy shift of giving value a to the new site in frontier state s: the number of its
     * added neighbours (slots nb) with a different value; -1 when the hard-core gas forbids it.
     */
    private int shift(long s, int a, int[] nb) {
        int dk = 0;
        for (int j : nb) {
            int d = digit(s, j);
            if (hardCore) {
                if (a == 1 && d == 1) {
                    return -1;
                }
            } else if (d != a) {
                dk++;
            }
        }
        return dk;
    }

    /**
     * Sums out slot {@code slot} of an f-site frontier; the top site moves into that slot. Destination-major
     * over the q^(f-1) new states, a chunk at a time as in {@link #replace}: source d (the summed-out digit)
     * is placed into the destination buffer (d = 0) or the third buffer (d > 0) and added with one index.
     */
    private long[] retire(long[] vec, int f, int slot, int block, long p) {
        long top = pow[f - 1];
        int size = Math.toIntExact(top * block);
        long[] next = spare(vec, size);
        long[] term = term(size);
        int chunk = RowSum.rowsPerChunk(block);
        for (long t0 = 0; t0 < top; t0 += chunk) {
            long t1 = Math.min(top, t0 + chunk);
            for (int d = 0; d < q; d++) {
                long[] into = d == 0 ? next : term;
                for (long t = t0; t < t1; t++) {
                    long s;
                    if (slot == f - 1) {
                        s = t + d * top;
                    } else {
                        int c = digit(t, slot);                    // the top site's digit, now in the slot
                        s = t + (d - c) * pow[slot] + c * top;
                    }
                    System.arraycopy(vec, (int) (s * block), into, (int) (t * block), block);
                }
                if (d > 0) {
                    RowSum.addMod(next, term, (int) (t0 * block), (int) ((t1 - t0) * block), p);
                }
            }
        }
        return next;
    }
}
