package org.microtally.spark;

/** Which ensemble a sweep point runs. */
public enum Ensemble {
    /** {@link org.microtally.ensemble.Canonical}: exactly N particles. */
    CANONICAL,
    /** {@link org.microtally.ensemble.GrandCanonical#ofMeanNumber}: mean particle number N. */
    GRAND_CANONICAL
}
