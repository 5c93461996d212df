package org.microtally.count;

import java.math.BigInteger;
import java.util.ArrayList;
import java.util.List;

/**
 * Word-size modular arithmetic for the multi-modular counting path.
 *
 * <p>Two sets of moduli: the largest primes below 2^62 (all &gt; 2^61, {@link #primes}, Shoup
 * arithmetic in longs) and the largest primes below 2^50 (all &gt; 2^49, {@link #fmaPrimes}, the
 * double arithmetic of {@link FmaModulus} that count tables use). Both are proven prime by deterministic
 * Miller-Rabin with the first twelve prime bases, which is exact for every n &lt; 3.18e23
 * (J. Sorenson, J. Webster, "Strong pseudoprimes to twelve prime bases", Math. Comp. 86 (2017) 985-1003). Products by a fixed multiplier use
 * V. Shoup's precomputed-quotient method (as described in D. Harvey, "Faster arithmetic for
 * number-theoretic transforms", J. Symb. Comp. 60 (2014), Sec. 2): with w' = floor(w 2^63 / p) and
 * x &lt; p &lt; 2^62, q = floor(w' x / 2^63) is the true quotient or one less, so w x - q p lies in
 * [0, 2p) and one conditional subtraction finishes. Chinese remaindering uses Garner's mixed-radix
 * algorithm (Knuth, TAOCP Vol. 2, Sec. 4.3.2).
 */
final class Moduli {
    private Moduli() { }

    private static final List<Long> PRIMES = new ArrayList<>();
    private static final long[] MR_BASES = {2, 3, 5, 7, 11, 13, 17, 19, 23, 29, 31, 37};

    /** Every modulus exceeds 2^61, so k of them cover any value below 2^(61 k). */
    static final int BITS_PER_PRIME = 61;

    private static final List<Long> FMA_PRIMES = new ArrayList<>();

    /** Every modulus of {@link #fmaPrimes} exceeds this, 2^49. */
    static final long FMA_FLOOR = 1L << 49;

    /** Every modulus of {@link #fmaPrimes} exceeds 2^49, so k of them cover any value below 2^(49 k). */
    static final int FMA_BITS_PER_PRIME = 49;

    /**
     * The first {@code k} primes below 2^50, descending (all above 2^49, the range of
     * {@link FmaModulus}); proven prime as in {@link #primes}.
     */
    static synchronized long[] fmaPrimes(int k) {
        return firstPrimesBelow(FMA_PRIMES, FmaModulus.LIMIT, k);
    }

    private static long[] firstPrimesBelow(List<Long> cache, long limit, int k) {
        long candidate = cache.isEmpty() ? limit - 1 : cache.get(cache.size() - 1) - 2;
        while (cache.size() < k) {
            if (isPrime(candidate)) {
                cache.add(candidate);
            }
            candidate -= 2;
        }
        long[] out = new long[k];
        for (int i = 0; i < k; i++) {
            out[i] = cache.get(i);
        }
        return out;
    }

    /**
     * How many of {@link #tablePrimes} cover every value below 2^log2Bound: primes below 2^50 when
     * the JVM uses a hardware fused multiply-add ({@link FmaModulus#HARDWARE}), else below 2^62.
     */
    static int tablePrimeCount(double log2Bound) {
        return FmaModulus.HARDWARE ? CountBound.fmaPrimesFor(log2Bound) : CountBound.primesFor(log2Bound);
    }

    /** The first {@code k} primes of the set count tables use (see {@link #tablePrimeCount}). */
    static long[] tablePrimes(int k) {
        return FmaModulus.HARDWARE ? fmaPrimes(k) : primes(k);
    }

    /** The first {@code k} primes below 2^62, descending. */
    static synchronized long[] primes(int k) {
        return firstPrimesBelow(PRIMES, 1L << 62, k);
    }

    static boolean isPrime(long n) {
        if (n < 2) {
            return false;
        }
        for (long b : MR_BASES) {
            if (n % b == 0) {
                return n == b;
            }
        }
        BigInteger bn = BigInteger.valueOf(n);
        BigInteger nm1 = bn.subtract(BigInteger.ONE);
        int s = nm1.getLowestSetBit();
        BigInteger d = nm1.shiftRight(s);
        outer:
        for (long b : MR_BASES) {
            BigInteger x = BigInteger.valueOf(b).modPow(d, bn);
            if (x.equals(BigInteger.ONE) || x.equals(nm1)) {
                continue;
            }
            for (int r = 1; r < s; r++) {
                x = x.multiply(x).mod(bn);
                if (x.equals(nm1)) {
                    continue outer;
                }
            }
            return false;
        }
        return true;
    }

    /** Shoup's precomputed quotient floor(w 2^63 / p) for a multiplier 0 &lt;= w &lt; p. */
    static long shoup(long w, long p) {
        return BigInteger.valueOf(w).shiftLeft(63).divide(BigInteger.valueOf(p)).longValueExact();
    }

    /** w x mod p for x, w in [0, p), given ws = shoup(w, p). */
    static long mulShoup(long w, long ws, long x, long p) {
        long q = (Math.multiplyHigh(ws, x) << 1) | ((ws * x) >>> 63);
        long r = w * x - q * p;
        return r >= p ? r - p : r;
    }

    /** (a + b) mod p for a, b in [0, p). */
    static long add(long a, long b, long p) {
        long s = a + b;
        return s >= p ? s - p : s;
    }

    /**
     * Garner reconstruction: the unique v in [0, p_0 ... p_{k-1}) with v = r_i mod p_i, from residues
     * laid out as {@code residues[i][index]}, for the primes of one of this class's sets (any
     * distinct primes below 2^62 whose largest is below twice the smallest). Holds its own scratch
     * buffers: one instance per thread.
     *
     * <p><b>Method.</b> Garner's mixed-radix digits (Knuth, TAOCP Vol. 2, Sec. 4.3.2): a_0 = r_0 and
     * a_i = (...((r_i - a_0) c_0i - a_1) c_1i - ... - a_(i-1)) c_(i-1)i mod p_i with c_ji = p_j^-1 mod p_i,
     * so v = a_0 + a_1 p_0 + ... + a_{k-1} p_0 ... p_{k-2}, evaluated by
     * Horner's rule in 64-bit limbs. Entries are rebuilt in blocks of up to {@link #BLOCK}: the digits
     * are computed prime by prime in loops over the block's entries (independent multiplies the
     * processor overlaps), for the entries whose residues are not all equal (an entry whose residues
     * all equal r is r itself: 0 &lt;= r &lt; every p_i and the representative below the product is
     * unique); a value of two digits is a_1 p_0 + a_0 in two limbs, a long when it fits. The limbs reach
     * BigInteger's byte constructor without leading zero bytes (its zero-skipping loop, whose trip count
     * changes from entry to entry, cost about 3 ns per entry at 4 primes). Exact; results do not depend
     * on the block size.
     *
     * <p><b>Digits in doubles.</b> With at least {@link #MIN_PRIMES_IN_DOUBLES} moduli, all below 2^50,
     * and a hardware FMA, the step t = (t - a_j) c_ji mod p_i runs on doubles over the gathered block in
     * a loop C2 vectorises: the floating-point reduction of {@link FmaModulus} (van der Hoeven, Lecerf,
     * Quintin, ACM TOMS 43 (2016), Sec. 3) applied to t - a_j in (-2 p_i, p_i) (a_j &lt; p_j &lt; 2 p_i),
     * exact by the error bounds in {@code garnerStep}. Otherwise, and for {@link #topDigits} (the
     * redundant-prime check, an independent arithmetic), Shoup multiplies in longs.
     */
    static final class Crt {
        /** Stores a long into a byte array as eight big-endian bytes. */
        private static final java.lang.invoke.VarHandle BIG_ENDIAN_LONGS =
                java.lang.invoke.MethodHandles.byteArrayViewVarHandle(long[].class, java.nio.ByteOrder.BIG_ENDIAN);

        /**
         * Fewest moduli for which {@link #reconstructRange} computes the digits in doubles (every modulus
         * below 2^50 and a hardware FMA), Shoup multiplies in longs below it: the vector steps save about
         * 1 ns per entry and prime pair (k (k-1)/2 pairs), against 2k - 1 conversion loops. Measured per
         * entry of a whole 3D-oscillator Bose table (one thread, CPU time, median of 31 rounds after 3 s of
         * warm-up), on the 2-core AMD EPYC machine with 512-bit vectors of 2026-12-04: 3 primes (30 x 150)
         * 27.5-28.0 ns either way, 4 primes (40 x 200) 36.6-36.8 against 40.1-41.4 ns, 5 primes (60 x 300)
         * 52.5-52.6 against 61.3-63.4 ns. An earlier machine with narrower vectors gained nothing at 4 primes
         * and lost 1-2 ns at 5, and 6 primes gained 9 % there; the digits are the same bits either way.
         */
        static final int MIN_PRIMES_IN_DOUBLES = 4;

        /** True when this instance computes Garner's digits in doubles ({@link #MIN_PRIMES_IN_DOUBLES}). */
        boolean digitsInDoubles() {
            return inDoubles;
        }

        /** Entries rebuilt per block; the block's digits (8 k BLOCK bytes) stay in the first-level cache. */
        static final int BLOCK = 256;

        private final long[] p;
        private final long[][] inv;       // inv[i][j] = p_j^-1 mod p_i, j < i
        private final long[][] invShoup;
        private final boolean inDoubles;  // digits by garnerStep: see MIN_PRIMES_IN_DOUBLES
        private final double[] pd;        // p_i as doubles
        private final double[] pdInv;     // fl(1 / p_i)
        private final double[][] invd;    // inv[i][j] as doubles
        private final double[][] digitsd; // the gathered digits as doubles while the vector loops run
        private final long[][] digits;    // digits[i][m]: Garner digit i of the m-th gathered entry of the block
        private final int[] at;           // the m-th gathered entry is entry (block start + at[m])
        private final int[] mixed;        // 1 where an entry's residues are not all equal, else 0
        private final long[] digit;       // the digits of one entry, for the limbs
        private final long[] mag;         // its magnitude in 64-bit limbs, least significant first
        private final byte[] bytes;       // and big-endian, for the BigInteger constructor

        /**
         * @throws IllegalArgumentException for no primes, a prime outside (1, 2^62), a repeated one, or
         *         a largest prime not below twice the smallest (one conditional subtraction reduces a
         *         digit modulo a later prime only then)
         */
        Crt(long[] primes) {
            this.p = primes.clone();
            int k = p.length;
            long min = Long.MAX_VALUE;
            long max = 0;
            for (long q : p) {
                if (q < 2 || q >= 1L << 62) {
                    throw new IllegalArgumentException("CRT modulus " + q + " outside (1, 2^62)");
                }
                min = Math.min(min, q);
                max = Math.max(max, q);
            }
            if (k == 0 || max / 2 >= min || java.util.Arrays.stream(p).distinct().count() != k) {
                throw new IllegalArgumentException("CRT moduli must be distinct, at least one, the largest below "
                        + "twice the smallest: " + java.util.Arrays.toString(p));
            }
            inv = new long[k][];
            invShoup = new long[k][];
            for (int i = 0; i < k; i++) {
                BigInteger bi = BigInteger.valueOf(p[i]);
                inv[i] = new long[i];
                invShoup[i] = new long[i];
                for (int j = 0; j < i; j++) {
                    inv[i][j] = BigInteger.valueOf(p[j]).modInverse(bi).longValueExact();
                    invShoup[i][j] = shoup(inv[i][j], p[i]);
                }
            }
            inDoubles = FmaModulus.HARDWARE && max < FmaModulus.LIMIT && k >= MIN_PRIMES_IN_DOUBLES;
            pd = new double[k];
            pdInv = new double[k];
            invd = new double[k][];
            for (int i = 0; i < k; i++) {
                pd[i] = p[i];
                pdInv[i] = 1.0 / p[i];
                invd[i] = new double[i];
                for (int j = 0; j < i; j++) {
                    invd[i][j] = inv[i][j];
                }
            }
            digitsd = inDoubles ? new double[k][BLOCK] : null;
            digits = new long[k][BLOCK];
            at = new int[BLOCK];
            mixed = new int[BLOCK];
            digit = new long[k];
            mag = new long[k + 1];
            bytes = new byte[8 * (k + 1)];
        }

        /** Every entry: {@code out[index] = reconstruct(residues, index)} for index &lt; residues[0].length. */
        BigInteger[] reconstructAll(long[][] residues) {
            return reconstructRange(residues, 0, residues[0].length);
        }

        /** Entries {@code from .. from + count - 1}: {@code out[j] = reconstruct(residues, from + j)}. */
        BigInteger[] reconstructRange(long[][] residues, int from, int count) {
            BigInteger[] out = new BigInteger[count];
            long[] r0 = residues[0];
            for (int b = 0; b < count; b += BLOCK) {
                int c = Math.min(BLOCK, count - b);
                int start = from + b;
                blockDigits(residues, start, c, inDoubles);
                for (int j = 0, m = 0; j < c; j++) {
                    if (mixed[j] == 0) {
                        long v = r0[start + j];
                        out[b + j] = v == 0 ? BigInteger.ZERO : BigInteger.valueOf(v);
                    } else {
                        out[b + j] = fromDigits(m++);
                    }
                }
            }
            return out;
        }

        /** The unique v in [0, p_0 ... p_{k-1}) with v = residues[i][index] mod p_i. */
        BigInteger reconstruct(long[][] residues, int index) {
            return reconstructRange(residues, index, 1)[0];
        }

        /**
         * {@code top[j]} = the index of the highest non-zero mixed-radix (Garner) digit of entry
         * {@code from + j}, -1 for zero, for j &lt; count, block by block. The digits are unique, so an entry
         * is below p_0 ... p_(m-1) exactly when this index is below m: with the redundant primes placed
         * last, that is the consistency check without forming the BigInteger.
         */
        void topDigits(long[][] residues, int from, int count, int[] top) {
            long[] r0 = residues[0];
            for (int b = 0; b < count; b += BLOCK) {
                int c = Math.min(BLOCK, count - b);
                int start = from + b;
                blockDigits(residues, start, c, false);
                for (int j = 0, m = 0; j < c; j++) {
                    top[b + j] = mixed[j] == 0 ? (r0[start + j] == 0 ? -1 : 0) : topOf(m++);
                }
            }
        }

        /**
         * Marks in {@link #mixed} the entries {@code start .. start + c - 1} (c &lt;= BLOCK) whose residues are
         * not all equal, gathers their residues into {@link #digits} (positions in {@link #at}) and turns
         * them into Garner's digits there, by {@link #garnerStep} in doubles when {@code inDoubles} (every
         * modulus below 2^50), else by Shoup multiplies in longs; returns how many were gathered.
         */
        private int blockDigits(long[][] residues, int start, int c, boolean inDoubles) {
            int k = p.length;
            int[] mix = mixed;
            java.util.Arrays.fill(mix, 0, c, 0);
            long[] r0 = residues[0];
            for (int i = 1; i < k; i++) {
                long[] ri = residues[i];
                for (int j = 0; j < c; j++) {
                    mix[j] |= ri[start + j] != r0[start + j] ? 1 : 0;
                }
            }
            int g = 0;
            int[] pos = at;
            for (int j = 0; j < c; j++) {
                pos[g] = j;
                g += mix[j];
            }
            if (g == 0) {
                return 0;
            }
            long[] d0 = digits[0];
            for (int m = 0; m < g; m++) {
                d0[m] = r0[start + pos[m]];
            }
            if (inDoubles) {
                digitsInDoubles(residues, start, g);
                return g;
            }
            for (int i = 1; i < k; i++) {
                long[] ri = residues[i];
                long[] d = digits[i];
                for (int m = 0; m < g; m++) {
                    d[m] = ri[start + pos[m]];
                }
            }
            for (int i = 1; i < k; i++) {
                long pi = p[i];
                long[] t = digits[i];
                for (int j = 0; j < i; j++) {
                    long w = inv[i][j];
                    long ws = invShoup[i][j];
                    long[] a = digits[j];
                    for (int m = 0; m < g; m++) {
                        long aj = a[m] >= pi ? a[m] - pi : a[m]; // a_j < p_j < 2 p_i
                        long diff = t[m] - aj;
                        if (diff < 0) {
                            diff += pi;
                        }
                        t[m] = mulShoup(w, ws, diff, pi);
                    }
                }
            }
            return g;
        }

        /**
         * Garner's digits of the g entries gathered at {@link #at} (digit 0, the residue itself, already in
         * {@link #digits}), for moduli below 2^50: the residues gathered straight into doubles,
         * {@link #garnerStep} prime pair by prime pair, and the digits back into longs.
         */
        private void digitsInDoubles(long[][] residues, int start, int g) {
            int k = p.length;
            int[] pos = at;
            toDoubles(digits[0], digitsd[0], g);
            for (int i = 1; i < k; i++) {
                double[] f = digitsd[i];
                long[] ri = residues[i];
                for (int m = 0; m < g; m++) {
                    f[m] = Double.longBitsToDouble(ri[start + pos[m]] | TWO_TO_52_BITS) - 0x1p52; // as toDoubles
                }
                for (int j = 0; j < i; j++) {
                    garnerStep(f, digitsd[j], g, invd[i][j], pd[i], pdInv[i]);
                }
                toLongs(f, digits[i], g);
            }
        }

        /**
         * to[m] = from[m] for 0 &lt;= from[m] &lt; 2^52: the bits of 2^52 + from[m] (exponent 52, the value in
         * the mantissa) minus 2^52, both exact; a loop C2 vectorises, where the plain long-to-double
         * conversion stays scalar.
         */
        private static void toDoubles(long[] from, double[] to, int c) {
            for (int m = 0; m < c; m++) {
                to[m] = Double.longBitsToDouble(from[m] | TWO_TO_52_BITS) - 0x1p52;
            }
        }

        /** to[m] = from[m] for integers 0 &lt;= from[m] &lt; 2^52: the mantissa bits of from[m] + 2^52 (exact). */
        private static void toLongs(double[] from, long[] to, int c) {
            for (int m = 0; m < c; m++) {
                to[m] = Double.doubleToRawLongBits(from[m] + 0x1p52) ^ TWO_TO_52_BITS;
            }
        }

        private static final long TWO_TO_52_BITS = Double.doubleToRawLongBits(0x1p52);

        /**
         * t[m] = (t[m] - a[m]) w mod p for m &lt; g, with 0 &lt;= t[m] &lt; p &lt; 2^50, 0 &lt;= a[m] &lt; 2p and
         * 0 &lt;= w &lt; p integers in doubles, pinv = fl(1/p); one index for every access, so C2 vectorises
         * the loop. The steps of {@link FmaModulus#mulAdd} (van der Hoeven, Lecerf, Quintin 2016, Sec. 3)
         * on a multiplicand d = t - a in (-2p, p), exact, not reduced first:
         * <ol>
         *   <li>h = fl(w d), l = fma(w, d, -h): w d = h + l exactly, |w d| &lt; 2 p^2 &lt; 2^101, so l is an
         *       integer with |l| &lt;= |h| 2^-53 &lt; p (p 2^-52) &lt; p/4;</li>
         *   <li>q = rint(h pinv): h pinv errs from h/p by at most |h/p| (2^-52 + 2^-106) &lt; 2^51 (2^-52 +
         *       2^-106) = 1/2 + 2^-55, so |h - q p| &lt; p (1 + 2^-55) and r = fma(-q, p, h) is that integer,
         *       exactly (below 2^51);</li>
         *   <li>s = r + l is exact, |s| &lt; 1.26 p;</li>
         *   <li>f = floor((s + 1/2) pinv) = floor(s/p): s + 1/2 is exact, (s + 1/2)/p lies at least 1/(2p)
         *       &gt; 2^-51 from every integer, its computed value errs by at most 1.27 (2^-52 + 2^-106)
         *       &lt; 2^-51, so fma(-f, p, s) = s mod p in [0, p), exactly.</li>
         * </ol>
         * Every value is an integer the doubles hold exactly, so the digits are the same bits as the
         * Shoup path's; the tests compare both with the textbook CRT sum.
         */
        private static void garnerStep(double[] t, double[] a, int g, double w, double p, double pinv) {
            for (int m = 0; m < g; m++) {
                double d = t[m] - a[m];
                double h = w * d;
                double l = Math.fma(w, d, -h);
                double s = Math.fma(-Math.rint(h * pinv), p, h) + l;
                t[m] = Math.fma(-Math.floor((s + 0.5) * pinv), p, s);
            }
        }

        /** The highest non-zero digit of gathered entry m (at least 0: its residues are not all 0). */
        private int topOf(int m) {
            int top = p.length - 1;
            while (top > 0 && digits[top][m] == 0) {
                top--;
            }
            return top;
        }

        /** The value of gathered entry m from its digits. */
        private BigInteger fromDigits(int m) {
            int top = topOf(m);
            long a0 = digits[0][m];
            if (top == 0) {
                return BigInteger.valueOf(a0);
            }
            if (top == 1) { // a_1 p_0 + a_0 < 2^124, in two unsigned limbs (a_1, p_0 < 2^62: the signed high word is the unsigned one)
                long a1 = digits[1][m];
                long lo = a1 * p[0];
                long hi = Math.multiplyHigh(a1, p[0]);
                long sum = lo + a0;
                if (Long.compareUnsigned(sum, lo) < 0) {
                    hi++;
                }
                if (hi == 0 && sum >= 0) {
                    return BigInteger.valueOf(sum);
                }
                long[] two = mag;
                two[0] = sum;
                two[1] = hi;
                return ofLimbs(two, 2);
            }
            if (top == 2) {
                return threeDigits(digits[2][m], digits[1][m], a0);
            }
            long[] a = digit;
            for (int i = 0; i <= top; i++) {
                a[i] = digits[i][m];
            }
            return horner(a, top);
        }

        /**
         * (a_2 p_1 + a_1) p_0 + a_0 for digits a_i &lt; p_i &lt; 2^62 in three unsigned limbs: t = a_2 p_1 + a_1
         * &lt; 2^124 in (th, tl), then t p_0 = tl p_0 + th p_0 2^64 (th &lt; 2^60, so th p_0 &lt; 2^122).
         */
        private BigInteger threeDigits(long a2, long a1, long a0) {
            long q0 = p[0];
            long tl = a2 * p[1];
            long th = Math.multiplyHigh(a2, p[1]);
            long s = tl + a1;
            th += Long.compareUnsigned(s, tl) < 0 ? 1 : 0;
            tl = s;
            long lo0 = tl * q0;
            long hi0 = Math.multiplyHigh(tl, q0) + ((tl >> 63) & q0); // unsigned high word of tl p_0
            long lo1 = th * q0;
            long hi1 = Math.multiplyHigh(th, q0);
            long limb0 = lo0 + a0;
            long c0 = Long.compareUnsigned(limb0, lo0) < 0 ? 1 : 0;
            long limb1 = hi0 + lo1;
            long c1 = Long.compareUnsigned(limb1, hi0) < 0 ? 1 : 0;
            long limb1c = limb1 + c0;
            c1 += Long.compareUnsigned(limb1c, limb1) < 0 ? 1 : 0;
            long limb2 = hi1 + c1;
            long[] l = mag;
            l[0] = limb0;
            l[1] = limb1c;
            l[2] = limb2;
            return ofLimbs(l, limb2 != 0 ? 3 : 2);
        }

        /**
         * v = a_top, then v = v p_i + a_i for i = top-1 .. 0, in unsigned 64-bit limbs (limb x p_i &lt;
         * 2^126 by Math.multiplyHigh, corrected for the unsigned limb), turned into a BigInteger once.
         */
        private BigInteger horner(long[] a, int top) {
            long[] m = mag;
            m[0] = a[top];
            int len = 1;
            for (int i = top - 1; i >= 0; i--) {
                long q = p[i]; // 0 < q < 2^62
                long carry = a[i];
                for (int l = 0; l < len; l++) {
                    long x = m[l];
                    long lo = x * q;
                    long hi = Math.multiplyHigh(x, q) + ((x >> 63) & q); // unsigned high word, < 2^62
                    long sum = lo + carry;
                    if (Long.compareUnsigned(sum, lo) < 0) {
                        hi++;
                    }
                    m[l] = sum;
                    carry = hi;
                }
                if (carry != 0) {
                    m[len++] = carry;
                }
            }
            return ofLimbs(m, len);
        }

        /**
         * The BigInteger of the unsigned limbs {@code limb[0 .. len-1]} (least significant first, the top
         * one non-zero): written big-endian and handed to the constructor without leading zero bytes.
         */
        private BigInteger ofLimbs(long[] limb, int len) {
            byte[] b = bytes;
            for (int l = 0; l < len; l++) {
                BIG_ENDIAN_LONGS.set(b, 8 * (len - 1 - l), limb[l]);
            }
            int skip = Long.numberOfLeadingZeros(limb[len - 1]) >>> 3;
            return new BigInteger(1, b, skip, 8 * len - skip);
        }
    }
}
