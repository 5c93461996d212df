/**
 * Special functions of statistical mechanics in double precision, each with its method, published
 * source and accuracy in its documentation: the Riemann zeta function ({@link org.microtally.special.Zeta}),
 * the polylogarithm / Bose-Einstein function ({@link org.microtally.special.Polylog}) and the
 * complete Fermi-Dirac integral ({@link org.microtally.special.FermiDirac}), and the relativistic
 * Fermi-Dirac integrals ({@link org.microtally.special.RelativisticFermiDirac}). Each states its
 * accuracy once, as a public constant ({@code MAX_RELATIVE_ERROR}, {@code RELATIVE_ACCURACY}) that its
 * documentation quotes and that a test measures against committed 30-digit mpmath tables.
 */
package org.microtally.special;
