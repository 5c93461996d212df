/**
 * Exact microstate counting for non-interacting particles on a given spectrum.
 *
 * <ul>
 *   <li>{@link org.microtally.count.CountTable}: Omega(n, e) for every n &lt;= N, e &lt;= E, exact
 *       (degeneracy-grouped generating functions, multi-modular arithmetic with a proven bound).</li>
 *   <li>{@link org.microtally.count.LabelledCountTable}: the same resolved by a second conserved
 *       label (e.g. 2M), or by (n, label) alone; {@link org.microtally.count.SpeciesMix} combines
 *       several {@link org.microtally.count.Species} (M-scheme basis sizes, spin-resolved counts).</li>
 *   <li>{@link org.microtally.count.MicrostateEnumerator}: brute-force lazy enumeration with a cap,
 *       the independent cross-check.</li>
 *   <li>{@link org.microtally.count.MacrostateHistogram}: totals of independent units with finite
 *       integer outcomes; {@link org.microtally.count.Multinomial}: occupancy of boxes by labelled
 *       objects, exact and logarithmic (to N ~ 1e27).</li>
 *   <li>{@link org.microtally.count.SharedTotal}: two subsystems sharing a conserved total.</li>
 *   <li>{@link org.microtally.exact.ExactLog}: ln of BigIntegers of any size;
 *       {@link org.microtally.exact.Combinatorics}: the one exact binomial coefficient and factorial.</li>
 * </ul>
 *
 * <p>All results are immutable; every bad input throws {@link org.microtally.InvalidInputException}
 * naming the value, the allowed range and a remedy.
 */
package org.microtally.count;
