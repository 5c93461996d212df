/**
 * Special functions of statistical mechanics in double precision, each with its method, published
 * source and accuracy in its documentation: the Riemann zeta function ({@link org.microtally.special.Zeta}),
 * the polylogarithm / Bose-Einstein function ({@link org.microtally.special.Polylog}) and the
 * complete Fermi-Dirac integral ({@link org.microtally.special.FermiDirac}). Target accuracy 1e-13
 * relative, checked against a committed 30-digit mpmath table.
 */
package org.microtally.special;
