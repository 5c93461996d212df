/**
 * Exact arithmetic helpers at the bottom of the core: nothing here imports another toolkit package,
 * so {@code special}, {@code count}, {@code ensemble} and {@code lattice} can all use it.
 * <ul>
 *   <li>{@link org.microtally.exact.Combinatorics}: the one exact binomial coefficient and factorial
 *       (BigInteger, exact for every argument that fits in memory).</li>
 *   <li>{@link org.microtally.exact.ExactLog}: ln of a BigInteger of any size, within 2 ulp of the
 *       exact value.</li>
 *   <li>{@link org.microtally.exact.ExactRatio}: the double nearest to an exact ratio of integers of
 *       any size, correctly rounded.</li>
 * </ul>
 */
package org.microtally.exact;
