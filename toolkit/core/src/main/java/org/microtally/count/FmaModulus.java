package org.microtally.count;

/**
 * Modular multiply-add on primes below 2^50 held in doubles, in a loop HotSpot's C2 compiles to SIMD
 * code (fused multiply-add, round and floor have vector forms on x86 AVX and AArch64 NEON).
 *
 * <p><b>Vectorisation.</b> C2's SuperWord pass (JDK 17) vectorises the row loop only when every array
 * access in it has the same index expression: with the source at another offset than the destination
 * (t[d + i] += c t[s + i], rows of one table) it proves no independence and stays scalar. So
 * {@link #mulAddRow} first copies the source range to a scratch row at the destination's column
 * ({@code System.arraycopy}, a memory copy) and then runs {@code dst[i] = f(dst[i], scratch[i])} over one
 * index. Measured on JDK 17.0.15 (AVX-512, 8 doubles per vector) with bench {@code ModularLoopBenchmark}
 * on a loaded 2-core machine: 2.8 ns per entry against 10.3 ns for the same arithmetic at two offsets
 * (3.7 times the throughput, copy included; about 0.4-0.7 ns per entry in CPU time). The result is the
 * same bits as the scalar loop (the operations are exact; the tests compare with BigInteger).
 *
 * <p><b>Method</b> (J. van der Hoeven, G. Lecerf, G. Quintin, "Modular SIMD arithmetic in
 * Mathemagix", ACM Trans. Math. Softw. 43 (2016), Sec. 3, floating-point products with an FMA).
 * For a prime 2^49 &lt; p &lt; 2^50, pinv = fl(1/p), a multiplier 0 &lt;= c &lt; p and entries
 * 0 &lt;= x, t &lt; p, all integers held exactly in doubles:
 * <ol>
 *   <li>h = fl(c x) and l = fma(c, x, -h), so c x = h + l exactly with |l| &lt;= ulp(h)/2 &lt;= 2^46
 *       &lt; p/8 (c x &lt; 2^100);</li>
 *   <li>q = rint(h pinv): h pinv differs from h/p by at most (h/p) 2^-52 &lt; 1/4, so
 *       r = fma(-q, p, h) is an integer of size &lt;= 3p/4 &lt; 2^50 and the fma is exact;</li>
 *   <li>s = r + l + t is exact and lies in (-7p/8, 15p/8);</li>
 *   <li>f = floor((s + 1/2) pinv) is exactly floor(s/p): (s + 1/2)/p is at least 1/(2p) &gt; 2^-51 away
 *       from every integer, while its computed value errs by at most (15/8) 2^-52 (1 + 2^-53)
 *       &lt; 2^-51 (two roundings of relative size 2^-53 on a quotient below 15/8); so s - f p lies
 *       in [0, p) and the final fma is exact.</li>
 * </ol>
 * Every step is exact integer arithmetic in doubles, so the result is the same bits on every
 * machine and equals (t + c x) mod p; the tests check it against BigInteger arithmetic.
 *
 * <p>Why not the incubating Vector API (jdk.incubator.vector): it would need
 * {@code --add-modules jdk.incubator.vector} in the build, the launcher, the kernelspec, JShell's
 * remote runtime, the tests and every Spark executor, prints an incubator warning on each start (into
 * notebook stderr), and its API may still change; the plain loop needs no flags and C2 vectorises it.
 * Primes below 2^50 instead of 2^62 cost 61/49 = 1.24 times as many primes (and as much CRT work per
 * entry); the vector loop repays that several times over.
 */
final class FmaModulus {
    private FmaModulus() { }

    /**
     * True when HotSpot reports a hardware fused multiply-add (flag UseFMA). Without it Math.fma is
     * exact but emulated in software, far slower than the long arithmetic, so count tables then use
     * primes below 2^62 instead (same exact results). False on JVMs that do not report the flag.
     */
    static final boolean HARDWARE = hardwareFma();

    private static boolean hardwareFma() {
        try {
            return Boolean.parseBoolean(java.lang.management.ManagementFactory
                    .getPlatformMXBean(com.sun.management.HotSpotDiagnosticMXBean.class).getVMOption("UseFMA").getValue());
        } catch (RuntimeException | LinkageError e) {
            return false;
        }
    }

    /** Largest modulus allowed (exclusive): the error analysis above needs p &lt; 2^50. */
    static final long LIMIT = 1L << 50;

    /** (t + c x) mod p for integers 0 &lt;= c, x, t &lt; p &lt; 2^50 held in doubles, pinv = 1.0 / p. */
    static double mulAdd(double t, double c, double x, double p, double pinv) {
        double h = c * x;
        double l = Math.fma(c, x, -h);
        double q = Math.rint(h * pinv);
        double s = Math.fma(-q, p, h) + l + t;
        return Math.fma(-Math.floor((s + 0.5) * pinv), p, s);
    }

    /**
     * dst[d + i] = (dst[d + i] + c src[s + i]) mod p for i = 0 .. len-1, through {@code scratch}
     * (length at least d + len; its range [d, d + len) is overwritten): the source range is copied
     * to scratch[d ..] and {@link #mulAddAligned} runs on one index. src may be dst (any offsets).
     */
    static void mulAddRow(double[] dst, int d, double[] src, int s, int len, double c, double p, double pinv,
                          double[] scratch) {
        System.arraycopy(src, s, scratch, d, len);
        mulAddAligned(dst, scratch, d, d + len, c, p, pinv);
    }

    /**
     * dst[i] = (dst[i] + c src[i]) mod p for from &lt;= i &lt; to, the loop C2 vectorises (one index
     * expression for every access); dst and src distinct arrays.
     */
    static void mulAddAligned(double[] dst, double[] src, int from, int to, double c, double p, double pinv) {
        for (int i = from; i < to; i++) {
            dst[i] = mulAdd(dst[i], c, src[i], p, pinv);
        }
    }
}
