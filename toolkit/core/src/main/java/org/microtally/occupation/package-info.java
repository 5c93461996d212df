/**
 * Occupation numbers: the one-state grand canonical laws ({@link org.microtally.occupation.MeanOccupation}:
 * Bose-Einstein, Fermi-Dirac, Maxwell-Boltzmann, Gentile), the chemical-potential solver with proven
 * brackets ({@link org.microtally.occupation.ChemicalPotential}), per-level results
 * ({@link org.microtally.occupation.LevelOccupations}) and the condensate number distribution
 * ({@link org.microtally.occupation.CondensateDistribution}).
 */
package org.microtally.occupation;
