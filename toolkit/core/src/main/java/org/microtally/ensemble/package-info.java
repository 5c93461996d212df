/**
 * Thermodynamics of finite ideal systems in each ensemble, with their definitions, methods and
 * accuracy stated on each class:
 * {@link org.microtally.ensemble.Canonical} (exact Z_N by positive-term generating products),
 * {@link org.microtally.ensemble.GrandCanonical} (mu given or solved from &lt;N&gt;),
 * {@link org.microtally.ensemble.Microcanonical} (from the exact count table),
 * {@link org.microtally.ensemble.EnsembleComparison} (side by side, and a convergence sweep in N),
 * {@link org.microtally.ensemble.GroundState} (the explicit T -&gt; 0 limit) and, for comparison only,
 * {@link org.microtally.ensemble.AlternatingRecursion}.
 */
package org.microtally.ensemble;
