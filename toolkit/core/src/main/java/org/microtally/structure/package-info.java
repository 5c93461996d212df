/**
 * Hydrostatic stellar models on the ideal degenerate equations of state of {@code limit}:
 * Lane-Emden polytropes, white dwarfs (Newtonian, exact T = 0 electron gas, the Chandrasekhar mass)
 * and ideal-neutron-gas stars in general relativity (Tolman-Oppenheimer-Volkoff). One adaptive
 * integrator with the surface found as a root; every result states its model limits. The models are
 * research baselines, not for engineering or safety use.
 */
package org.microtally.structure;
