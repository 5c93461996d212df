package org.microtally.occupation;

import org.microtally.Inputs;
import org.microtally.InvalidInputException;
import org.microtally.Roots;
import org.microtally.spectrum.Spectrum;
import org.microtally.spectrum.Statistics;

/**
 * The grand canonical chemical potential that gives a prescribed mean particle number,
 * {@code sum_i g_i n(beta (e_i - mu)) = N}, and its T -&gt; 0 limit for capped statistics.
 *
 * <p>Method: a bracketed root search ({@link Roots}: Brent-type, order 5; its tolerance is stated there)
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
 * Speed (Fermi and Gentile): the proven bracket is first narrowed around the T = 0 filling energy by
 * outward steps of kT, 4 kT, 16 kT, ... (each sign verified by evaluation, so the narrowed bracket is
 * as valid as the original); for Fermi the Boltzmann factors within 12 kT (plus the window below) of
 * that energy are computed once, so each residual evaluation there costs one exponential in total.
 * Only levels whose contribution can matter are visited (see {@link Solver}).
 * Accuracy: the search stops when the residual is within its rounding noise (Fermi, Gentile:
 * 4 sqrt(terms) ulp of the summed particles and holes, plus 2 ulp(N) if N is not an integer; Bose:
 * |ln N(u) - ln N| &lt;= 4 ulp(1)) or the bracket is 1e-15 relative in u (Bose) or about 4 ulp in mu
 * wide. Measured against a committed mpmath table of roots (test resource
 * {@code occupation/chemical-potential-mpmath.csv}: Bose and Fermi gases in 2D and 3D oscillators of
 * up to 5,000 states, kT from 0.05 to 20 quanta), &lt;N&gt; at the returned mu is within
 * {@value #MEAN_NUMBER_ERROR} relative (worst error, rounded up); since the stopping noise grows like
 * sqrt(terms), a spectrum of 10^6 states can be up to about 15 times worse. mu in a gap at low T
 * (where N(mu) is flat) is found to the accuracy the small particle and hole sums allow.
 */
public final class ChemicalPotential {
    private ChemicalPotential() { }

    /**
     * Largest relative error of &lt;N&gt; at the returned mu measured against the committed mpmath table,
     * rounded up; ChemicalPotentialStatedAccuracyTest fails if any row is worse, or if this is more than
     * twice the maximum.
     */
    public static final double MEAN_NUMBER_ERROR = 3e-15;


    /**
     * The chemical potential (in the spectrum's unit) at temperature {@code kT} for mean particle
     * number {@code n}.
     *
     * @throws InvalidInputException for kT &lt;= 0 or not finite, n &lt;= 0 or not finite, or
     *                               n at or above the capacity of a capped spectrum
     */
    public static double forMeanNumber(Spectrum spectrum, Statistics statistics, double kT, double n) {
        return solver(spectrum, statistics).forMeanNumber(kT, n);
    }

    /**
     * A reusable solver for one spectrum and statistics: the per-spectrum arrays (energies,
     * degeneracies, cumulative state counts) are built once, so temperature sweeps pay only for the
     * root searches.
     */
    public static Solver solver(Spectrum spectrum, Statistics statistics) {
        return new Solver(spectrum, statistics);
    }

    /**
     * The chemical potential for one spectrum and statistics at any (kT, &lt;N&gt;). Each evaluation of
     * N(mu) skips the levels whose total contribution is provably below e^-45 of the target (sorted
     * energies, binary search for the window |e - mu| &lt;= X kT, X = 45 + ln(k S / N), at least 45):
     * the neglected particles above plus holes below are at most k S e^{-X} = e^{-45} N, below the
     * double rounding of the sum (bosons: k = 1 and the bound gains a factor 1/(1 - e^{-X})). Immutable and thread-safe.
     */
    public static final class Solver {
        private final Spectrum spectrum;
        private final Statistics statistics;
        private final double[] e;
        private final int[] g;
        private final long[] statesBelow;

        private Solver(Spectrum spectrum, Statistics statistics) {
            this.spectrum = spectrum;
            this.statistics = statistics;
            this.e = spectrum.energies();
            this.g = spectrum.degeneracies();
            this.statesBelow = new long[e.length + 1];
            for (int i = 0; i < e.length; i++) {
                statesBelow[i + 1] = statesBelow[i] + g[i];
            }
        }

        /** mu at temperature kT for mean number n; see {@link ChemicalPotential#forMeanNumber}. */
        public double forMeanNumber(double kT, double n) {
            Inputs.temperature(kT);
            if (!(n > 0) || !Double.isFinite(n)) {
                throw InvalidInputException.of("target mean particle number <N>", n, "a finite number > 0",
                        "An empty system has mu = -infinity; give <N> > 0.");
            }
            double beta = 1.0 / kT;
            double cap = statistics.capped() ? statistics.maxOccupancy() : 1.0;
            double window = Math.max(45.0, 45.0 + Math.log(cap * spectrum.stateCount() / n));
            return switch (statistics.kind()) {
                case BOSE -> bose(beta, n, window);
                case DISTINGUISHABLE -> maxwellBoltzmann(spectrum, beta, n);
                case FERMI, GENTILE -> capped(beta, n, window);
            };
        }

        /** First index with e[i] &gt; x (sorted energies). */
        private int upper(double x) {
            int lo = 0;
            int hi = e.length;
            while (lo < hi) {
                int mid = (lo + hi) >>> 1;
                if (e[mid] <= x) {
                    lo = mid + 1;
                } else {
                    hi = mid;
                }
            }
            return lo;
        }

        private double bose(double beta, double target, double window) {
            double e0 = e[0];
            int g0 = g[0];
            double lo = Math.log1p(g0 / target);
            double hi = Math.log1p(spectrum.stateCount() / target);
            if (hi <= lo * (1 + 1e-15)) {
                return e0 - lo / beta;
            }
            double lnTarget = Math.log(target);
            int end = upper(e0 + window / beta);
            double u = Roots.solve("ln(beta (e_0 - mu)) of the Bose chemical potential", uu -> {
                double bd = Math.exp(uu);
                double sum = 0;
                for (int i = 0; i < end; i++) {
                    sum += g[i] / Math.expm1(beta * (e[i] - e0) + bd);
                }
                double v = Math.log(sum) - lnTarget;
                // within 4 ulp of 1 in ln <N>: rounding noise, reported as an exact root to end the search there
                return Math.abs(v) <= 4 * Math.ulp(1.0) ? 0.0 : v;
            }, Math.log(lo), Math.log(hi), 1e-15);
            return e0 - Math.exp(u) / beta;
        }

        private double capped(double beta, double target, double window) {
            int k = statistics.maxOccupancy();
            double capacity = (double) k * spectrum.stateCount();
            if (target >= capacity) {
                throw InvalidInputException.of("target mean particle number <N>", target,
                        "below the capacity " + (long) capacity + " of the truncated spectrum (" + k
                                + " per state x " + spectrum.stateCount() + " states)",
                        "Raise the spectrum's cutoff or lower <N>.");
            }
            double lo = e[0] + Math.log(target / capacity) / beta;
            double hi = e[e.length - 1] + Math.log(capacity / (capacity - target)) / beta;
            double half = window / beta;
            double guess = Math.min(hi, Math.max(lo, fillingEnergy(target / k)));
            double[] noise = new double[1];
            java.util.function.DoubleUnaryOperator exact = mu -> residual(mu, beta, half, k, target, noise);
            java.util.function.DoubleUnaryOperator f = exact;
            double reach = 12 / beta;
            if (statistics.kind() == Statistics.Kind.FERMI) {
                // Boltzmann factors about the T = 0 guess, computed once for |mu - guess| <= 12 kT: evaluations there
                // are then exp-free (one exp for the fugacity); outside, the direct evaluation is used
                int from = upper(guess - reach - half);
                int to = upper(guess + reach + half);
                double[] w = new double[to - from];
                for (int i = from; i < to; i++) {
                    w[i - from] = Math.exp(-beta * (e[i] - guess));
                }
                f = mu -> Math.abs(mu - guess) <= reach
                        ? fastFermiResidual(mu, beta, half, target, guess, w, from, noise)
                        : exact.applyAsDouble(mu);
            }
            // narrow the proven bracket [lo, hi] around the T = 0 filling energy by outward steps (f is increasing)
            double a = guess;
            double b = guess;
            double fg = f.applyAsDouble(guess);
            if (fg == 0) {
                return guess;
            }
            double step = 1.0 / beta;
            if (fg < 0) {
                do {
                    a = b;
                    b = Math.min(hi, b + step);
                    step *= 4;
                } while (b < hi && f.applyAsDouble(b) < 0);
            } else {
                do {
                    b = a;
                    a = Math.max(lo, a - step);
                    step *= 4;
                } while (a > lo && f.applyAsDouble(a) > 0);
            }
            // a residual within its own rounding noise is reported as an exact root, which ends the search there
            // (the solver otherwise insists on shrinking the bracket from both sides)
            java.util.function.DoubleUnaryOperator g = f;
            return Roots.solve("chemical potential mu", mu -> {
                double v = g.applyAsDouble(mu);
                return Math.abs(v) <= noise[0] ? 0.0 : v;
            }, a, b, 4 * Math.ulp(Math.max(Math.abs(a), Math.abs(b))));
        }

        /** The energy at which filling the states from below reaches {@code states} (T = 0 estimate of mu). */
        private double fillingEnergy(double states) {
            int lo = 0;
            int hi = e.length - 1;
            while (lo < hi) {
                int mid = (lo + hi) >>> 1;
                if (statesBelow[mid + 1] < states) {
                    lo = mid + 1;
                } else {
                    hi = mid;
                }
            }
            return e[lo];
        }

        /** N(mu) - target as (capacity below mu - target) + particles above - holes below, over the window. */
        private double residual(double mu, double beta, double half, int k, double target, double[] noise) {
            boolean fermi = statistics.kind() == Statistics.Kind.FERMI;
            int from = upper(mu - half);
            int split = upper(mu);
            int to = upper(mu + half);
            double base = (double) k * statesBelow[split] - target;
            double above = 0;
            double holes = 0;
            for (int i = from; i < to; i++) {
                double x = beta * (e[i] - mu);
                if (i >= split) {
                    above += g[i] * (fermi ? fermiMean(x) : statistics.meanOccupation(x));
                } else {
                    holes += g[i] * (fermi ? fermiMean(-x) : statistics.meanOccupation(-x));
                }
            }
            noise[0] = noiseLevel(above + holes, to - from, target);
            return base + (above - holes);
        }

        /**
         * The rounding noise of a residual: 4 sqrt(terms) ulp of the summed magnitude, plus 2 ulp of the
         * target when the integer base term is not exact.
         */
        private static double noiseLevel(double magnitude, int terms, double target) {
            double inexactBase = target == Math.rint(target) && target < 0x1p52 ? 0.0 : 2 * Math.ulp(target);
            return 4 * Math.sqrt(Math.max(1, terms)) * Math.ulp(magnitude) + inexactBase;
        }

        /** The Fermi residual with y_i = w_i e^{beta(mu - centre)}: n = y/(1+y) above mu, hole = 1/(1+y) below. */
        private double fastFermiResidual(double mu, double beta, double half, double target, double centre,
                                         double[] w, int offset, double[] noise) {
            int from = Math.max(offset, upper(mu - half));
            int split = upper(mu);
            int to = Math.min(offset + w.length, upper(mu + half));
            double z = Math.exp(beta * (mu - centre));
            double base = (double) statesBelow[split] - target;
            double above = 0;
            double holes = 0;
            for (int i = from; i < Math.min(split, to); i++) {
                double y = w[i - offset] * z;
                holes += g[i] / (1.0 + y);
            }
            for (int i = Math.max(split, from); i < to; i++) {
                double y = w[i - offset] * z;
                above += g[i] * y / (1.0 + y);
            }
            noise[0] = noiseLevel(above + holes, to - from, target);
            return base + (above - holes);
        }

        private static double fermiMean(double x) {
            if (x > 0) {
                double t = Math.exp(-x);
                return t / (1.0 + t);
            }
            return 1.0 / (1.0 + Math.exp(x));
        }
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

    private static double maxwellBoltzmann(Spectrum s, double beta, double target) {
        double e0 = s.groundEnergy();
        double sum = 0;
        for (int i = 0; i < s.size(); i++) {
            sum += s.degeneracy(i) * Math.exp(-beta * (s.energy(i) - e0));
        }
        return e0 + (Math.log(target) - Math.log(sum)) / beta;
    }
}
