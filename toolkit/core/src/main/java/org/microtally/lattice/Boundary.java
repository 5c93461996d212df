package org.microtally.lattice;

/**
 * Boundary conditions of an L x M lattice (L sites along a row, M rows).
 */
public enum Boundary {
    /** Open edges in both directions: no bond leaves the L x M block. */
    FREE,
    /** Periodic along the rows (a site in column L-1 bonds to column 0), open between row 0 and row M-1. */
    CYLINDER,
    /** Periodic in both directions (a torus). */
    PERIODIC;

    boolean wrapsRows() {
        return this != FREE;
    }

    boolean wrapsColumns() {
        return this == PERIODIC;
    }
}
