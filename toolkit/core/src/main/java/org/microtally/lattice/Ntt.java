package org.microtally.lattice;

/**
 * In-place iterative radix-2 number-theoretic transform (Cooley-Tukey, decimation in time with
 * bit-reversed input; e.g. Cormen et al., Introduction to Algorithms, 3rd ed., Sec. 30.3), on
 * values in Montgomery form.
 */
final class Ntt {
    private Ntt() { }

    /** a[j] := sum_i a[i] root^{ij}, for root of order a.length (a power of two). */
    static void transform(Montgomery f, long[] a, long root) {
        int n = a.length;
        for (int i = 1, j = 0; i < n; i++) {
            int bit = n >> 1;
            for (; (j & bit) != 0; bit >>= 1) {
                j ^= bit;
            }
            j ^= bit;
            if (i < j) {
                long tmp = a[i];
                a[i] = a[j];
                a[j] = tmp;
            }
        }
        for (int len = 2; len <= n; len <<= 1) {
            long wLen = f.pow(root, n / len);
            int half = len >> 1;
            long[] tw = new long[half];
            tw[0] = f.one;
            for (int i = 1; i < half; i++) {
                tw[i] = f.mul(tw[i - 1], wLen);
            }
            for (int i = 0; i < n; i += len) {
                for (int j = 0; j < half; j++) {
                    long u = a[i + j];
                    long v = f.mul(a[i + j + half], tw[j]);
                    a[i + j] = f.add(u, v);
                    a[i + j + half] = f.sub(u, v);
                }
            }
        }
    }
}
