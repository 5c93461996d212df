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
 *
 * <p>Modulo one prime the recursion runs on one of two row kernels: primes in (2^49, 2^50), the ones
 * {@link CountTable} asks for, in doubles with the FMA reduction of {@link FmaModulus}; any other prime below 2^62 (such as {@link Moduli#primes}) in
 * longs with Shoup's precomputed quotients. Both give the same exact table after Chinese remaindering.
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
        return new Moduli.Crt(primes).reconstructAll(
                multiModularResidues(energy, deg, stats, maxN, maxE, primes, progress));
    }

    /**
     * The residues of {@link #multiModular} before reconstruction: {@code [prime][n (E + 1) + e]}, so
     * a caller can rebuild entries when they are first read.
     */
    static long[][] multiModularResidues(int[] energy, int[] deg, Statistics stats, int maxN, int maxE,
                                         long[] primes, ProgressListener progress) {
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
        // primes are independent: one task each, run on the common fork-join pool
        java.util.stream.IntStream.range(0, primes.length).parallel().forEach(pi ->
                res[pi] = residues(energy, deg, stats, maxN, maxE, levels, coef, primes[pi], tick));
        return res;
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
     * entry point (any prime below 2^62; primes in (2^49, 2^50) take the FMA loop).
     */
    static long[] residuesModulo(int[] energy, int[] deg, Statistics stats, int maxN, int maxE, long p) {
        return residuesModulo(energy, deg, stats, maxN, maxE, p, ProgressListener.NONE);
    }

    /** {@link #residuesModulo(int[], int[], Statistics, int, int, long)} with progress (levels, or particles). */
    static long[] residuesModulo(int[] energy, int[] deg, Statistics stats, int maxN, int maxE, long p,
                                 ProgressListener progress) {
        int levels = relevantLevels(energy, maxE);
        BigInteger[][] coef = new BigInteger[levels][];
        if (stats.indistinguishable()) {
            for (int l = 0; l < levels; l++) {
                coef[l] = LevelSeries.coefficients(stats, deg[l], maxJ(energy[l], maxN, maxE));
            }
        }
        Ticker ticker = new Ticker(progress, stats.indistinguishable() ? levels : maxN,
                stats.indistinguishable() ? "levels" : "particles");
        return residues(energy, deg, stats, maxN, maxE, levels, coef, p, ticker::step);
    }

    /**
     * Row multiply-add in one modular arithmetic on a table it owns, rows of w = E + 1 entries:
     * T[dstRow][dstCol + i] += c T[srcRow][srcCol + i] mod p for i &lt; len (srcRow != dstRow), with c the
     * multiplier at {@code index} of the last {@link #multipliers} call.
     */
    private interface RowKernel {
        void multipliers(BigInteger[] c);

        void mulAdd(int dstRow, int dstCol, int srcRow, int srcCol, int len, int index);
    }

    /** Primes in (2^49, 2^50) held in doubles ({@link FmaModulus}), one array per row plus a scratch row. */
    private static final class FmaKernel implements RowKernel {
        final double[][] t;
        final double[] scratch;
        final double p;
        final double pinv;
        final BigInteger bp;
        double[] c = new double[0];

        FmaKernel(int rows, int w, long p) {
            this.t = new double[rows][w];
            this.scratch = new double[w];
            this.p = p;
            this.pinv = 1.0 / p;
            this.bp = BigInteger.valueOf(p);
            t[0][0] = 1;
        }

        @Override
        public void multipliers(BigInteger[] coef) {
            c = new double[coef.length];
            for (int j = 0; j < coef.length; j++) {
                c[j] = coef[j].mod(bp).longValue();
            }
        }

        @Override
        public void mulAdd(int dstRow, int dstCol, int srcRow, int srcCol, int len, int index) {
            FmaModulus.mulAddRow(t[dstRow], dstCol, t[srcRow], srcCol, len, c[index], p, pinv, scratch);
        }

        long[] residues() {
            int w = scratch.length;
            long[] out = new long[t.length * w];
            for (int n = 0; n < t.length; n++) {
                double[] row = t[n];
                for (int e = 0; e < w; e++) {
                    out[n * w + e] = (long) row[e];
                }
            }
            return out;
        }
    }

    /** Any prime below 2^62, in longs with Shoup's precomputed quotients ({@link Moduli#mulShoup}). */
    private static final class ShoupKernel implements RowKernel {
        final long[] t;
        final int w;
        final long p;
        final BigInteger bp;
        long[] c = new long[0];
        long[] cs = new long[0];

        ShoupKernel(int rows, int w, long p) {
            this.t = new long[rows * w];
            this.w = w;
            this.p = p;
            this.bp = BigInteger.valueOf(p);
            t[0] = 1;
        }

        @Override
        public void multipliers(BigInteger[] coef) {
            c = new long[coef.length];
            cs = new long[coef.length];
            for (int j = 0; j < coef.length; j++) {
                c[j] = coef[j].mod(bp).longValue();
                cs[j] = Moduli.shoup(c[j], p);
            }
        }

        @Override
        public void mulAdd(int dstRow, int dstCol, int srcRow, int srcCol, int len, int index) {
            long cm = c[index];
            long csh = cs[index];
            int dst = dstRow * w + dstCol;
            int src = srcRow * w + srcCol;
            for (int i = 0; i < len; i++) {
                t[dst + i] = Moduli.add(t[dst + i], Moduli.mulShoup(cm, csh, t[src + i], p), p);
            }
        }
    }

    /** The whole table modulo one prime p: the FMA kernel for primes in (2^49, 2^50), Shoup's otherwise. */
    private static long[] residues(int[] energy, int[] deg, Statistics stats, int maxN, int maxE, int levels,
                                   BigInteger[][] coef, long p, Runnable tick) {
        if (fitsFma(new long[] {p})) {
            FmaKernel k = new FmaKernel(maxN + 1, maxE + 1, p);
            sweep(k, energy, deg, stats, maxN, maxE, levels, coef, tick);
            return k.residues();
        }
        ShoupKernel k = new ShoupKernel(maxN + 1, maxE + 1, p);
        sweep(k, energy, deg, stats, maxN, maxE, levels, coef, tick);
        return k.t;
    }

    /**
     * The recursion of the class description on kernel k. Indistinguishable: one level at a time,
     * T[n][e] += sum_{j>=1} c_j T[n-j][e - j el], n descending; source row m = n - j can be non-zero
     * only for lo[m] &lt;= e' &lt;= m * prevTop (prevTop = energy of the last level already applied, -1
     * before the first), so only that window is swept. Distinguishable: row n += g_l row (n-1) shifted by e_l.
     */
    private static void sweep(RowKernel k, int[] energy, int[] deg, Statistics stats, int maxN, int maxE, int levels,
                              BigInteger[][] coef, Runnable tick) {
        if (!stats.indistinguishable()) {
            BigInteger[] g = new BigInteger[levels];
            for (int l = 0; l < levels; l++) {
                g[l] = BigInteger.valueOf(deg[l]);
            }
            k.multipliers(g);
            for (int n = 1; n <= maxN; n++) {
                for (int l = 0; l < levels; l++) {
                    k.mulAdd(n, energy[l], n - 1, 0, maxE - energy[l] + 1, l);
                }
                tick.run();
            }
            return;
        }
        int[] lo = groundEnergies(energy, deg, stats, maxN, maxE, levels);
        for (int l = 0; l < levels; l++) {
            BigInteger[] c = coef[l];
            k.multipliers(c);
            int el = energy[l];
            int prevTop = l == 0 ? -1 : energy[l - 1];
            for (int n = maxN; n >= 1; n--) {
                int jTop = Math.min(n, c.length - 1);
                for (int j = 1; j <= jTop; j++) {
                    int off = j * el;
                    if (off > maxE) {
                        break;
                    }
                    int m = n - j;
                    int from = lo[m];
                    int to = (int) Math.min(maxE - off, sourceTop(m, prevTop));
                    if (to >= from) {
                        k.mulAdd(n, off + from, m, from, to - from + 1, j);
                    }
                }
            }
            tick.run();
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
