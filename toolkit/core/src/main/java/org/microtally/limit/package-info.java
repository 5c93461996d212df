/**
 * Thermodynamic-limit reference formulas: the ideal Bose and Fermi gases for power-law densities
 * of states (3D box, 3D harmonic trap, 2D oscillator) and the classical Maxwell-Boltzmann gas.
 *
 * <p>SI in (kg, m^-3, K, rad/s), SI or {@link org.microtally.units.Energy} out. These are the
 * N -&gt; infinity answers that the finite-N results of {@code org.microtally.ensemble} are compared
 * with; they are built on the special functions of {@link org.microtally.special}.
 */
package org.microtally.limit;
