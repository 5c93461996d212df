package org.microtally.lattice;

/**
 * The site-by-site plan of a transfer-matrix sweep: for each site in the lattice's order, the
 * frontier slots of its already-added neighbours, and which frontier sites retire after it.
 *
 * <p>The frontier holds every added site that still has a neighbour to come. A site retires (its
 * state is summed out) right after the last of its neighbours has been added. When some site w
 * retires at the step that adds v, v takes over w's slot in one fused "replace" update (w summed
 * out while v is added, so the vector never grows); otherwise v goes into a new top slot. Other
 * retiring sites are summed out afterwards, the top slot moving into each freed slot, so slots
 * stay dense.
 */
final class Schedule {
    final int sites;
    /** neighbourSlots[t] = slots (before the add) of the frontier neighbours of the t-th site. */
    final int[][] neighbourSlots;
    /** retireSlots[t] = slots to sum out after the t-th add, in order (each relative to the then-current frontier). */
    final int[][] retireSlots;
    /** replaceSlot[t] = slot whose site is summed out while the t-th site takes it over, or -1 (new top slot). */
    final int[] replaceSlot;
    /** frontier size before the t-th add. */
    final int[] frontierBefore;
    final int maxFrontier;

    Schedule(Lattice lattice) {
        int n = lattice.sites();
        int[] order = lattice.order();
        int[][] adj = lattice.adjacency();
        int[] position = new int[n];
        for (int t = 0; t < n; t++) {
            position[order[t]] = t;
        }
        int[] last = new int[n];
        for (int s = 0; s < n; s++) {
            last[s] = position[s];
            for (int nb : adj[s]) {
                last[s] = Math.max(last[s], position[nb]);
            }
        }
        int[] slotOf = new int[n];
        java.util.Arrays.fill(slotOf, -1);
        int[] slotSite = new int[n + 1];
        int f = 0;
        int maxF = 0;
        sites = n;
        neighbourSlots = new int[n][];
        retireSlots = new int[n][];
        frontierBefore = new int[n];
        replaceSlot = new int[n];
        for (int t = 0; t < n; t++) {
            int v = order[t];
            frontierBefore[t] = f;
            int[] nbSlots = new int[adj[v].length];
            int c = 0;
            for (int nb : adj[v]) {
                if (position[nb] < t) {
                    nbSlots[c++] = slotOf[nb];
                }
            }
            neighbourSlots[t] = java.util.Arrays.copyOf(nbSlots, c);
            int fused = -1;
            for (int j = 0; j < c && fused < 0; j++) {
                if (last[slotSite[nbSlots[j]]] == t) {
                    fused = nbSlots[j];
                }
            }
            replaceSlot[t] = fused;
            if (fused >= 0) {
                slotOf[slotSite[fused]] = -1;
                slotSite[fused] = v;
                slotOf[v] = fused;
            } else {
                slotOf[v] = f;
                slotSite[f++] = v;
            }
            maxF = Math.max(maxF, f);
            int[] retire = new int[f];
            int r = 0;
            for (int slot = f - 1; slot >= 0; slot--) {
                int w = slotSite[slot];
                if (last[w] == t) {
                    // Sum out slot 'slot'; the top slot moves into it.
                    retire[r++] = slot;
                    int top = slotSite[f - 1];
                    slotSite[slot] = top;
                    slotOf[top] = slot;
                    slotOf[w] = -1;
                    f--;
                }
            }
            retireSlots[t] = java.util.Arrays.copyOf(retire, r);
        }
        maxFrontier = maxF;
    }
}
