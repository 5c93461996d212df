package org.microtally.occupation;

import org.apache.commons.math3.analysis.solvers.AllowedSolution;
import org.apache.commons.math3.analysis.solvers.BracketingNthOrderBrentSolver;
import org.microtally.InvalidInputException;
import org.microtally.spectrum.Spectrum;
import org.microtally.spectrum.Statistics;

/**
 * The grand canonical chemical potential that gives a prescribed mean particle number,
 * {@code sum_i g_i n(beta (e_i - mu)) = N}, and its T -&gt; 0 limit for capped statistics.
 *
 * <p>Method: a bracketed root search (Commons Math {@link BracketingNthOrderBrentSolver}, order 5)
 * on a bracket that is valid by construction, so the search cannot leave the physical domain:
 * <ul>
 *   <li>Bose-Einstein: the unknown is {@code u = ln(beta (e_0 - mu))}, so mu approaches the ground
 *       level e_0 on a log scale at condensation and never reaches it. Bracket: since
 *       g_0/(e^{bd}-1) &lt;= N(d) &lt;= S/(e^{bd}-1) (S = number of states, d = e_0 - mu),
 *       {@code bd_lo = ln(1 + g_0/N)} gives N(d_lo) &gt;= N and {@code bd_hi = ln(1 + S/N)} gives
 *       N(d_hi) &lt;= N. The function solved is ln N(u) - ln N.</li>
 *   <li>Fermi-Dirac and Gentile (at most k per state, capacity C = k S): n &lt;= k e^{-x} and the
 *       hole number k - n &lt;= k e^{x}, so {@code mu_lo = e_0 + kT ln(N/C)} and
 *       {@code mu_hi = e_top + kT ln(C/(C-N))} bracket the root. The residual N(mu) - N is
 *       evaluated as (capacity of the levels below mu - N) + (particles above) - (holes below),
 *       which keeps full relative accuracy at low T, where the plain sum would round to N across
 *       a whole gap.</li>
 *   <li>Maxwell-Boltzmann: closed form mu = kT (ln N - ln sum g_i e^{-e_i/kT}), log-sum-exp.</li>
 * </ul>
 * Accuracy: the root is located to 1e-15 relative in u (Bose) or about 4 ulp of the bracket end
 * magnitudes in mu (Fermi, Gentile), i.e. &lt;N&gt; is reproduced to about 1e-14 relative.
 */
public final class ChemicalPotential {
    private ChemicalPotential() { }

    private static final int MAX_EVALUATIONS = 400;

    /**
     * The chemical potential (in the spectrum's unit) at temperature {@code kT} for mean particle
     * number {@code targetN}.
     *
     * @throws InvalidInputException for kT &lt;= 0 or not finite, targetN &lt;= 0 or not finite, or
     *                               targetN at or above the capacity of a capped spectrum
     */
    public static double forMeanNumber(Spectrum spectrum, Statistics statistics, double kT, double targetN) {
        requireTemperature(kT);
        if (!(targetN > 0) || !Double.isFinite(targetN)) {
            throw InvalidInputException.of("target mean particle number <N>", targetN, "a finite number > 0",
                    "An empty system has mu = -infinity; give <N> > 0.");
        }
        double beta = 1.0 / kT;
        return switch (statistics.kind()) {
            case BOSE -> bose(spectrum, beta, targetN);
            case DISTINGUISHABLE -> maxwellBoltzmann(spectrum, beta, targetN);
            case FERMI, GENTILE -> capped(spectrum, statistics, beta, targetN);
        };
    }

    /**
     * The T -&gt; 0 limit of {@link #forMeanNumber} for Fermi or Gentile particles (the Fermi
     * level): fill the states from the bottom with at most k particles each. If {@code n} fills
     * levels exactly up to level h (a closed shell), the limit is the mid-gap energy
     * (e_h + e_{h+1})/2, since mu(T) = (e_h + e_{h+1})/2 + (kT/2) ln(g_h / g_{h+1}) + o(kT) balances
     * the holes below against the particles above; otherwise it is the energy of the partly filled
     * level.
     *
     * @throws InvalidInputException if n &lt; 1, or n fills the whole spectrum (no level above the
     *                               last filled one, mu would be +infinity), or the statistics are not capped
     */
    public static double fermiLevel(Spectrum spectrum, Statistics statistics, long n) {
        if (!statistics.capped()) {
            throw InvalidInputException.of("statistics for a Fermi level", statistics, "FERMI or maxOccupancy(k)",
                    "Bosons have no Fermi level; use forMeanNumber at a temperature.");
        }
        long k = statistics.maxOccupancy();
        long capacity = k * spectrum.stateCount();
        if (n < 1 || n >= capacity) {
            throw InvalidInputException.of("particle number for the Fermi level", n,
                    "between 1 and " + (capacity - 1) + " (capacity " + capacity + " of the spectrum, minus one)",
                    "Extend the spectrum's cutoff so that at least one state stays empty.");
        }
        long filled = 0;
        for (int i = 0; i < spectrum.size(); i++) {
            filled += k * spectrum.degeneracy(i);
            if (filled == n) {
                return 0.5 * (spectrum.energy(i) + spectrum.energy(i + 1));
            }
            if (filled > n) {
                return spectrum.energy(i);
            }
        }
        throw new IllegalStateException("unreachable: n below capacity");
    }

    static void requireTemperature(double kT) {
        if (!(kT > 0) || !Double.isFinite(kT)) {
            throw InvalidInputException.of("temperature kT", kT, "a finite number > 0",
                    "For T -> 0 use the explicit ground-state / Fermi-level calls.");
        }
    }

    private static double bose(Spectrum s, double beta, double target) {
        double e0 = s.groundEnergy();
        int g0 = s.degeneracy(0);
        double lo = Math.log1p(g0 / target);
        double hi = Math.log1p(s.stateCount() / target);
        if (hi <= lo * (1 + 1e-15)) {
            return e0 - lo / beta;
        }
        double lnTarget = Math.log(target);
        double[] e = s.energies();
        int[] g = s.degeneracies();
        BracketingNthOrderBrentSolver solver = new BracketingNthOrderBrentSolver(1e-15, 1e-15, 1e-300, 5);
        double u = solver.solve(MAX_EVALUATIONS, uu -> {
            double bd = Math.exp(uu);
            double sum = 0;
            for (int i = 0; i < e.length; i++) {
                sum += g[i] / Math.expm1(beta * (e[i] - e0) + bd);
            }
            return Math.log(sum) - lnTarget;
        }, Math.log(lo), Math.log(hi), AllowedSolution.ANY_SIDE);
        return e0 - Math.exp(u) / beta;
    }

    private static double maxwellBoltzmann(Spectrum s, double beta, double target) {
        double e0 = s.groundEnergy();
        double sum = 0;
        for (int i = 0; i < s.size(); i++) {
            sum += s.degeneracy(i) * Math.exp(-beta * (s.energy(i) - e0));
        }
        return e0 + (Math.log(target) - Math.log(sum)) / beta;
    }

    private static double capped(Spectrum s, Statistics st, double beta, double target) {
        int k = st.maxOccupancy();
        double capacity = (double) k * s.stateCount();
        if (target >= capacity) {
            throw InvalidInputException.of("target mean particle number <N>", target,
                    "below the capacity " + (long) capacity + " of the truncated spectrum (" + k
                            + " per state x " + s.stateCount() + " states)",
                    "Raise the spectrum's cutoff or lower <N>.");
        }
        double[] e = s.energies();
        int[] g = s.degeneracies();
        double lo = s.groundEnergy() + Math.log(target / capacity) / beta;
        double hi = s.topEnergy() + Math.log(capacity / (capacity - target)) / beta;
        BracketingNthOrderBrentSolver solver = new BracketingNthOrderBrentSolver(1e-16, 4 * Math.ulp(
                Math.max(Math.abs(lo), Math.abs(hi))), 1e-300, 5);
        return solver.solve(MAX_EVALUATIONS, mu -> cappedResidual(e, g, st, k, beta, mu, target), lo, hi,
                AllowedSolution.ANY_SIDE);
    }

    /** N(mu) - target as (capacity below mu - target) + particles above - holes below. */
    static double cappedResidual(double[] e, int[] g, Statistics st, int k, double beta, double mu, double target) {
        double base = -target;
        double above = 0;
        double holes = 0;
        for (int i = 0; i < e.length; i++) {
            double x = beta * (e[i] - mu);
            if (x > 0) {
                above += g[i] * MeanOccupation.mean(st, x);
            } else {
                base += (double) k * g[i];
                holes += g[i] * MeanOccupation.mean(st, -x);
            }
        }
        return base + (above - holes);
    }
}
