package org.microtally.count;

import java.math.BigInteger;
import org.microtally.ProgressListener;
import org.microtally.spectrum.Statistics;

/**
 * The counting recursions behind {@link CountTable}, in two arithmetics that share one algorithm:
 * exact BigInteger (reference path, used for small tables and to test the other) and multi-modular
 * (word-size primes + Chinese remaindering, the production path).
 *
 * <p>Indistinguishable particles: the table T[n][e] holds the coefficients of x^n q^e of the
 * bivariate generating function prod_l F_l(x q^(e_l)), with F_l the level factor of
 * {@link LevelSeries}. A level is applied once, in place, as the truncated series
 * T'[n][e] = sum_{j=0..J} c_j T[n-j][e - j e_l], J = min(N, E / e_l) (J = N for e_l = 0), sweeping n
 * downwards so every read sees the old row. Cost per level O(J N E), independent of the degeneracy.
 *
 * <p>Distinguishable particles: row n is the polynomial Z1(q)^n truncated at q^E, Z1 = sum_l g_l q^(e_l),
 * obtained as row n = row (n-1) * Z1. Cost O(N E L) for L levels below E.
 */
final class CountEngine {
    private CountEngine() { }

    /** Exact table, row-major (N+1) x (E+1), by BigInteger arithmetic. */
    static BigInteger[] bigInteger(int[] energy, int[] deg, Statistics stats, int maxN, int maxE,
                                   ProgressListener progress) {
        int w = maxE + 1;
        BigInteger[] t = new BigInteger[(maxN + 1) * w];
        java.util.Arrays.fill(t, BigInteger.ZERO);
        int levels = relevantLevels(energy, maxE);
        Ticker ticker = new Ticker(progress, stats.indistinguishable() ? levels : maxN,
                stats.indistinguishable() ? "levels" : "particles");
        if (stats.indistinguishable()) {
            t[0] = BigInteger.ONE;
            for (int l = 0; l < levels; l++) {
                int el = energy[l];
                BigInteger[] c = LevelSeries.coefficients(stats, deg[l], maxJ(el, maxN, maxE));
                for (int n = maxN; n >= 1; n--) {
                    int jTop = Math.min(n, c.length - 1);
                    for (int j = 1; j <= jTop; j++) {
                        int off = j * el;
                        if (off > maxE) {
                            break;
                        }
                        int dst = n * w;
                        int src = (n - j) * w - off;
                        for (int e = off; e <= maxE; e++) {
                            BigInteger s = t[src + e];
                            if (s.signum() != 0) {
                                t[dst + e] = t[dst + e].add(c[j].multiply(s));
                            }
                        }
                    }
                }
                ticker.step();
            }
        } else {
            t[0] = BigInteger.ONE;
            for (int n = 1; n <= maxN; n++) {
                int dst = n * w;
                int src = (n - 1) * w;
                for (int l = 0; l < levels; l++) {
                    BigInteger g = BigInteger.valueOf(deg[l]);
                    int el = energy[l];
                    for (int e = el; e <= maxE; e++) {
                        BigInteger s = t[src + e - el];
                        if (s.signum() != 0) {
                            t[dst + e] = t[dst + e].add(g.multiply(s));
                        }
                    }
                }
                ticker.step();
            }
        }
        return t;
    }

    /**
     * The same table modulo each prime, then reconstructed by Garner's algorithm. Exact provided every
     * entry is below the product of the primes (the caller guarantees it with {@link CountBound}).
     */
    static BigInteger[] multiModular(int[] energy, int[] deg, Statistics stats, int maxN, int maxE, long[] primes,
                                     ProgressListener progress) {
        int w = maxE + 1;
        int size = (maxN + 1) * w;
        int levels = relevantLevels(energy, maxE);
        long[][] res = new long[primes.length][];
        BigInteger[][] coef = new BigInteger[levels][];
        if (stats.indistinguishable()) {
            for (int l = 0; l < levels; l++) {
                coef[l] = LevelSeries.coefficients(stats, deg[l], maxJ(energy[l], maxN, maxE));
            }
        }
        long steps = (long) primes.length * (stats.indistinguishable() ? levels : maxN);
        Ticker ticker = new Ticker(progress, steps, stats.indistinguishable() ? "levels x primes" : "particles x primes");
        Runnable tick = ticker::step;
        boolean fma = fitsFma(primes);
        // primes are independent: one task each, run on the common fork-join pool
        java.util.stream.IntStream.range(0, primes.length).parallel().forEach(pi ->
                res[pi] = fma ? toLong(fmaResidues(energy, deg, stats, maxN, maxE, levels, coef, primes[pi], tick))
                        : residues(energy, deg, stats, maxN, maxE, levels, coef, primes[pi], tick));
        Moduli.Crt crt = new Moduli.Crt(primes);
        long[] scratch = new long[primes.length];
        BigInteger[] out = new BigInteger[size];
        for (int i = 0; i < size; i++) {
            out[i] = crt.reconstruct(res, i, scratch);
        }
        return out;
    }

    /** True when every prime lies in (2^49, 2^50), the range of {@link FmaModulus}. */
    static boolean fitsFma(long[] primes) {
        for (long p : primes) {
            if (p <= Moduli.FMA_FLOOR || p >= FmaModulus.LIMIT) {
                return false;
            }
        }
        return true;
    }

    /**
     * The whole table modulo one prime p, row-major (N+1) x (E+1), entries in [0, p): the per-prime
     * entry point (any prime below 2^62; primes in (2^49, 2^50) take the vectorised loop).
     */
    static long[] residuesModulo(int[] energy, int[] deg, Statistics stats, int maxN, int maxE, long p) {
        int levels = relevantLevels(energy, maxE);
        BigInteger[][] coef = new BigInteger[levels][];
        if (stats.indistinguishable()) {
            for (int l = 0; l < levels; l++) {
                coef[l] = LevelSeries.coefficients(stats, deg[l], maxJ(energy[l], maxN, maxE));
            }
        }
        Runnable none = () -> { };
        return fitsFma(new long[] {p}) ? toLong(fmaResidues(energy, deg, stats, maxN, maxE, levels, coef, p, none))
                : residues(energy, deg, stats, maxN, maxE, levels, coef, p, none);
    }

    private static long[] toLong(double[] t) {
        long[] out = new long[t.length];
        for (int i = 0; i < t.length; i++) {
            out[i] = (long) t[i];
        }
        return out;
    }

    /** The whole table modulo one prime 2^49 &lt; p &lt; 2^50, in doubles ({@link FmaModulus}). */
    private static double[] fmaResidues(int[] energy, int[] deg, Statistics stats, int maxN, int maxE, int levels,
                                        BigInteger[][] coef, long p, Runnable tick) {
        int w = maxE + 1;
        double[] t = new double[(maxN + 1) * w];
        t[0] = 1;
        double dp = p;
        double pinv = 1.0 / dp;
        BigInteger bp = BigInteger.valueOf(p);
        if (stats.indistinguishable()) {
            int[] lo = groundEnergies(energy, deg, stats, maxN, maxE, levels);
            for (int l = 0; l < levels; l++) {
                BigInteger[] c = coef[l];
                double[] cm = new double[c.length];
                for (int j = 0; j < c.length; j++) {
                    cm[j] = c[j].mod(bp).longValue();
                }
                int el = energy[l];
                int prevTop = l == 0 ? -1 : energy[l - 1];
                for (int n = maxN; n >= 1; n--) {
                    int jTop = Math.min(n, cm.length - 1);
                    for (int j = 1; j <= jTop; j++) {
                        int off = j * el;
                        if (off > maxE) {
                            break;
                        }
                        if (cm[j] == 0) {
                            continue;
                        }
                        int m = n - j;
                        int from = lo[m];
                        int to = (int) Math.min(maxE - off, sourceTop(m, prevTop));
                        if (to >= from) {
                            FmaModulus.mulAddRow(t, n * w + off + from, t, m * w + from, to - from + 1, cm[j], dp, pinv);
                        }
                    }
                }
                tick.run();
            }
        } else {
            for (int n = 1; n <= maxN; n++) {
                for (int l = 0; l < levels; l++) {
                    int el = energy[l];
                    FmaModulus.mulAddRow(t, n * w + el, t, (n - 1) * w, maxE - el + 1, deg[l] % p, dp, pinv);
                }
                tick.run();
            }
        }
        return t;
    }

    /** The whole table modulo one prime p (62-bit Shoup arithmetic). */
    private static long[] residues(int[] energy, int[] deg, Statistics stats, int maxN, int maxE, int levels,
                                   BigInteger[][] coef, long p, Runnable tick) {
        int w = maxE + 1;
        long[] t = new long[(maxN + 1) * w];
        t[0] = 1;
        BigInteger bp = BigInteger.valueOf(p);
        if (stats.indistinguishable()) {
            int[] lo = groundEnergies(energy, deg, stats, maxN, maxE, levels);
            for (int l = 0; l < levels; l++) {
                BigInteger[] c = coef[l];
                long[] cm = new long[c.length];
                long[] cs = new long[c.length];
                for (int j = 0; j < c.length; j++) {
                    cm[j] = c[j].mod(bp).longValue();
                    cs[j] = Moduli.shoup(cm[j], p);
                }
                applyLevel(t, w, maxN, maxE, energy[l], l == 0 ? -1 : energy[l - 1], lo, cm, cs, p);
                tick.run();
            }
        } else {
            long[] gm = new long[levels];
            long[] gs = new long[levels];
            for (int l = 0; l < levels; l++) {
                gm[l] = deg[l] % p;
                gs[l] = Moduli.shoup(gm[l], p);
            }
            for (int n = 1; n <= maxN; n++) {
                int dst = n * w;
                int src = (n - 1) * w;
                for (int l = 0; l < levels; l++) {
                    int el = energy[l];
                    long g = gm[l];
                    long gsh = gs[l];
                    for (int e = el; e <= maxE; e++) {
                        long x = t[src + e - el];
                        long q = (Math.multiplyHigh(gsh, x) << 1) | ((gsh * x) >>> 63);
                        long r = g * x - q * p;
                        if (r >= p) {
                            r -= p;
                        }
                        long s = t[dst + e] + r;
                        t[dst + e] = s >= p ? s - p : s;
                    }
                }
                tick.run();
            }
        }
        return t;
    }

    /**
     * One level, in place, modulo p: T[n][e] += sum_{j>=1} c_j T[n-j][e - j el], n descending. Source
     * row m = n - j can be non-zero only for lo[m] &lt;= e' &lt;= m * prevTop (prevTop = energy of the
     * last level already applied, -1 before the first), so only that window is swept.
     */
    private static void applyLevel(long[] t, int w, int maxN, int maxE, int el, int prevTop, int[] lo,
                                   long[] cm, long[] cs, long p) {
        for (int n = maxN; n >= 1; n--) {
            int jTop = Math.min(n, cm.length - 1);
            int dst = n * w;
            for (int j = 1; j <= jTop; j++) {
                int off = j * el;
                if (off > maxE) {
                    break;
                }
                long c = cm[j];
                long csh = cs[j];
                if (c == 0) {
                    continue;
                }
                int m = n - j;
                int from = lo[m];
                int to = (int) Math.min(maxE - off, sourceTop(m, prevTop));
                int src = m * w;
                int d = dst + off;
                for (int e = from; e <= to; e++) {
                    long x = t[src + e];
                    long q = (Math.multiplyHigh(csh, x) << 1) | ((csh * x) >>> 63);
                    long r = c * x - q * p;
                    if (r >= p) {
                        r -= p;
                    }
                    long s = t[d + e] + r;
                    t[d + e] = s >= p ? s - p : s;
                }
            }
        }
    }

    /** Largest energy m particles can have using only levels up to energy prevTop (-1: none applied yet). */
    private static long sourceTop(int m, int prevTop) {
        if (m == 0) {
            return 0;
        }
        return prevTop < 0 ? -1 : (long) m * prevTop;
    }

    /**
     * lo[n] = lowest total energy of n particles on these levels (at most k per state), or maxE + 1
     * if n particles do not fit below maxE; every entry T[n][e] with e &lt; lo[n] is zero at every
     * stage of the recursion.
     */
    static int[] groundEnergies(int[] energy, int[] deg, Statistics stats, int maxN, int maxE, int levels) {
        int[] lo = new int[maxN + 1];
        long e = 0;
        int l = 0;
        long slotsLeft = levels > 0 ? slots(deg[0], stats) : 0;
        for (int n = 1; n <= maxN; n++) {
            while (l < levels && slotsLeft == 0) {
                l++;
                slotsLeft = l < levels ? slots(deg[l], stats) : 0;
            }
            if (l >= levels || e > maxE) {
                lo[n] = maxE + 1;
                continue;
            }
            e += energy[l];
            slotsLeft--;
            lo[n] = (int) Math.min(e, maxE + 1L);
        }
        return lo;
    }

    private static long slots(int g, Statistics stats) {
        return stats.capped() ? (long) g * stats.maxOccupancy() : Long.MAX_VALUE;
    }

    /** Number of leading levels (sorted by energy) with energy &lt;= maxE. */
    static int relevantLevels(int[] energy, int maxE) {
        int l = 0;
        while (l < energy.length && energy[l] <= maxE) {
            l++;
        }
        return l;
    }

    /** Largest number of particles a level of energy el can hold within the table. */
    static int maxJ(int el, int maxN, int maxE) {
        return el == 0 ? maxN : Math.min(maxN, maxE / el);
    }
}
