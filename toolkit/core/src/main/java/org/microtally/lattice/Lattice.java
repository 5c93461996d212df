package org.microtally.lattice;

import java.util.ArrayDeque;
import java.util.Arrays;
import java.util.HashSet;
import java.util.Set;
import org.microtally.Inputs;
import org.microtally.InvalidInputException;

/**
 * An immutable finite graph of sites and bonds, with the order in which the transfer matrix visits
 * the sites.
 *
 * <p>Builders: {@link #square}, {@link #triangular} (square plus one diagonal per plaquette, every
 * site has six neighbours in the bulk), {@link #honeycomb} (the brick-wall drawing: a square lattice
 * with the vertical bond of (x, y) present only when x + y is even, three neighbours in the bulk),
 * and {@link #graph} for any other cluster. Site (x, y) of an L x M lattice has index x + L y.
 *
 * <p>Periodic directions need at least three sites (honeycomb: an even number, at least four):
 * with two, the forward and the wrap-around bond join the same pair and the bond would count twice;
 * with one, it would be a self-loop. Those inputs are refused; a graph with the bonds you want can
 * be given to {@link #graph} instead (it also refuses self-loops and duplicate bonds, because every
 * model here has at most one coupling per pair of sites).
 */
public final class Lattice {
    private final String name;
    private final int sites;
    private final int[] bondA;
    private final int[] bondB;
    private final int[] order;
    private final boolean bipartite;

    private Lattice(String name, int sites, int[] bondA, int[] bondB, int[] order) {
        this.name = name;
        this.sites = sites;
        this.bondA = bondA;
        this.bondB = bondB;
        this.order = order;
        this.bipartite = twoColourable();
    }

    /** The L x M square lattice (L sites per row, M rows). */
    public static Lattice square(int l, int m, Boundary boundary) {
        return grid("square", l, m, boundary, false, false);
    }

    /** The L x M triangular lattice: the square lattice plus the diagonal from (x, y) to (x+1, y+1). */
    public static Lattice triangular(int l, int m, Boundary boundary) {
        return grid("triangular", l, m, boundary, true, false);
    }

    /**
     * The honeycomb lattice of L x M sites in brick-wall form: row bonds (x, y)-(x+1, y) and the
     * bond (x, y)-(x, y+1) only when x + y is even.
     */
    public static Lattice honeycomb(int l, int m, Boundary boundary) {
        return grid("honeycomb", l, m, boundary, false, true);
    }

    /**
     * A general graph: {@code sites} sites numbered 0..sites-1, {@code bonds[i] = {a, b}}. The
     * transfer matrix adds sites in index order, so number a long thin cluster along its length.
     */
    public static Lattice graph(int sites, int[][] bonds) {
        Inputs.atLeast("number of sites", sites, 1);
        int[] a = new int[bonds.length];
        int[] b = new int[bonds.length];
        Set<Long> seen = new HashSet<>();
        for (int i = 0; i < bonds.length; i++) {
            int[] bond = bonds[i];
            if (bond == null || bond.length != 2) {
                throw InvalidInputException.of("bond " + i, Arrays.toString(bond), "a pair {a, b} of site indices", "");
            }
            for (int s : bond) {
                if (s < 0 || s >= sites) {
                    throw InvalidInputException.of("site in bond " + i, s, "in 0.." + (sites - 1), "");
                }
            }
            if (bond[0] == bond[1]) {
                throw InvalidInputException.of("bond " + i, Arrays.toString(bond), "a pair of two different sites (no self-loops)",
                        "A self-coupling s_i s_i is a constant; drop the bond.");
            }
            long key = (long) Math.min(bond[0], bond[1]) * sites + Math.max(bond[0], bond[1]);
            if (!seen.add(key)) {
                throw InvalidInputException.of("bond " + i, Arrays.toString(bond), "a pair not already bonded (no duplicate bonds)",
                        "Each pair of sites carries one coupling J; remove the repeated bond.");
            }
            a[i] = bond[0];
            b[i] = bond[1];
        }
        int[] order = new int[sites];
        for (int i = 0; i < sites; i++) {
            order[i] = i;
        }
        return new Lattice("graph of " + sites + " sites and " + bonds.length + " bonds", sites, a, b, order);
    }

    private static Lattice grid(String kind, int l, int m, Boundary boundary, boolean diagonal, boolean brick) {
        checkSide("L (sites per row)", l, boundary.wrapsRows(), brick);
        checkSide("M (rows)", m, boundary.wrapsColumns(), brick);
        long n = (long) l * m;
        if (n > 1 << 24) {
            throw InvalidInputException.of("L x M", n, "at most 2^24 sites", "Exact counts of larger lattices are out of reach.");
        }
        int sites = (int) n;
        int[] a = new int[3 * sites];
        int[] b = new int[3 * sites];
        int count = 0;
        for (int y = 0; y < m; y++) {
            for (int x = 0; x < l; x++) {
                int s = x + l * y;
                boolean right = x + 1 < l || (boundary.wrapsRows() && l > 1);
                boolean up = y + 1 < m || (boundary.wrapsColumns() && m > 1);
                if (right) {
                    a[count] = s;
                    b[count++] = (x + 1) % l + l * y;
                }
                if (up && (!brick || (x + y) % 2 == 0)) {
                    a[count] = s;
                    b[count++] = x + l * ((y + 1) % m);
                }
                if (diagonal && right && up) {
                    a[count] = s;
                    b[count++] = (x + 1) % l + l * ((y + 1) % m);
                }
            }
        }
        // Scan so that the frontier is short: along the periodic rows of a cylinder, otherwise
        // across the shorter side.
        boolean byRows = boundary == Boundary.CYLINDER || l <= m;
        int[] order = new int[sites];
        int k = 0;
        if (byRows) {
            for (int y = 0; y < m; y++) {
                for (int x = 0; x < l; x++) {
                    order[k++] = x + l * y;
                }
            }
        } else {
            for (int x = 0; x < l; x++) {
                for (int y = 0; y < m; y++) {
                    order[k++] = x + l * y;
                }
            }
        }
        String name = l + " x " + m + " " + kind + " lattice, " + boundary.name().toLowerCase() + " boundary";
        return new Lattice(name, sites, Arrays.copyOf(a, count), Arrays.copyOf(b, count), order);
    }

    private static void checkSide(String what, int side, boolean wraps, boolean brick) {
        Inputs.atLeast(what, side, 1);
        if (wraps && side < 3) {
            throw InvalidInputException.of(what, side, "at least 3 in a periodic direction",
                    "With 2 sites the wrap-around bond repeats the forward bond (it would count twice), with 1 it is a "
                            + "self-loop; use Boundary.FREE (or CYLINDER) for that direction, or Lattice.graph with the bonds you mean.");
        }
        if (wraps && brick && side % 2 != 0) {
            throw InvalidInputException.of(what, side, "even in a periodic direction of the honeycomb lattice",
                    "An odd period breaks the brick-wall pattern (a site would get two or no vertical bonds).");
        }
    }

    private boolean twoColourable() {
        int[][] adj = adjacency();
        int[] colour = new int[sites];
        Arrays.fill(colour, -1);
        ArrayDeque<Integer> queue = new ArrayDeque<>();
        for (int start = 0; start < sites; start++) {
            if (colour[start] >= 0) {
                continue;
            }
            colour[start] = 0;
            queue.add(start);
            while (!queue.isEmpty()) {
                int s = queue.poll();
                for (int t : adj[s]) {
                    if (colour[t] < 0) {
                        colour[t] = 1 - colour[s];
                        queue.add(t);
                    } else if (colour[t] == colour[s]) {
                        return false;
                    }
                }
            }
        }
        return true;
    }

    /** Neighbour lists, one array per site (a fresh copy). */
    public int[][] adjacency() {
        int[] deg = new int[sites];
        for (int i = 0; i < bondA.length; i++) {
            deg[bondA[i]]++;
            deg[bondB[i]]++;
        }
        int[][] adj = new int[sites][];
        for (int s = 0; s < sites; s++) {
            adj[s] = new int[deg[s]];
        }
        int[] fill = new int[sites];
        for (int i = 0; i < bondA.length; i++) {
            adj[bondA[i]][fill[bondA[i]]++] = bondB[i];
            adj[bondB[i]][fill[bondB[i]]++] = bondA[i];
        }
        return adj;
    }

    /** A short description, e.g. {@code "4 x 4 square lattice, periodic boundary"}. */
    public String name() {
        return name;
    }

    /** Number of sites N. */
    public int sites() {
        return sites;
    }

    /** Number of bonds B. */
    public int bonds() {
        return bondA.length;
    }

    /** Bond i as {a, b}. */
    public int[] bond(int i) {
        return new int[] {bondA[i], bondB[i]};
    }

    /** The order in which the transfer matrix adds the sites (a copy). */
    public int[] order() {
        return order.clone();
    }

    /** True when the sites split into two classes with every bond joining the classes. */
    public boolean bipartite() {
        return bipartite;
    }

    @Override
    public String toString() {
        return name;
    }
}
