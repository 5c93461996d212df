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
        long largest = 0;
        long k = 1;
        long u = 1;
        int f = 0;
        for (int t = 0; t < plan.sites; t++) {
            k += trackEnergy ? plan.neighbourSlots[t].length : 0;
            u += trackLabel ? 1 : 0;
            if (plan.replaceSlot[t] >= 0) {
                largest = Math.max(largest, pow[f] * k * u);
            } else {
                f++;
            }
            f -= plan.retireSlots[t].length;
        }
        this.largestReplace = Math.toIntExact(largest);
    }

    private final int largestReplace;

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
     * digit b of old[t with digit b] shifted by (dk, du). The first contribution is copied into a
     * zeroed frame, the rest added, so every entry is written without a separate clearing pass and
     * the two vectors live in reused buffers.
     */
    private long[] replace(long[] vec, long states, int slot, int[] nb, int kRange, int uRange, int nk, int nu, long p) {
        int oldBlock = kRange * uRange;
        int newBlock = nk * nu;
        long[] next = spare(vec, Math.toIntExact(states * newBlock));
        long place = pow[slot];
        boolean rows = uRange == 1 && nu == 1;
        for (long t = 0; t < states; t++) {
            int a = digit(t, slot);
            long base = t - a * place;
            int frame = (int) (t * newBlock);
            boolean first = true;
            for (int b = 0; b < q; b++) {
                long s = base + b * place;
                int dk = shift(s, a, nb);
                if (dk < 0) {
                    continue;
                }
                int du = trackLabel && a == 1 ? 1 : 0;
                int src = (int) (s * oldBlock);
                int dst = frame + dk * nu + du;
                if (first && rows) {
                    java.util.Arrays.fill(next, frame, dst, 0L);
                    System.arraycopy(vec, src, next, dst, kRange);
                    java.util.Arrays.fill(next, dst + kRange, frame + newBlock, 0L);
                    first = false;
                    continue;
                }
                if (first) {
                    java.util.Arrays.fill(next, frame, frame + newBlock, 0L);
                    first = false;
                }
                if (rows) {
                    addRow(next, dst, vec, src, kRange, p);
                } else {
                    for (int k = 0; k < kRange; k++) {
                        addRow(next, dst + k * nu, vec, src + k * uRange, uRange, p);
                    }
                }
            }
            if (first) {
                java.util.Arrays.fill(next, frame, frame + newBlock, 0L);
            }
        }
        return next;
    }

    private long[] bufferA = new long[0];
    private long[] bufferB = new long[0];

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

    /** next[to .. to+len) += vec[from .. from+len) mod p. */
    private static void addRow(long[] next, int to, long[] vec, int from, int len, long p) {
        for (int i = 0; i < len; i++) {
            long x = next[to + i] + vec[from + i] - p;
            next[to + i] = x + ((x >> 63) & p);
        }
    }

    private long[] retire(long[] vec, int f, int slot, int block, long p) {
        long top = pow[f - 1];
        long[] next = new long[Math.toIntExact(top * block)];
        long states = pow[f];
        for (long s = 0; s < states; s++) {
            int dTop = digit(s, f - 1);
            long low = s - dTop * top;
            long target = slot == f - 1 ? low : low + (dTop - digit(s, slot)) * pow[slot];
            int src = (int) (s * block);
            int dst = (int) (target * block);
            addRow(next, dst, vec, src, block, p);
        }
        return next;
    }
}
