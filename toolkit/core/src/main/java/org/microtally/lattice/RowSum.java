package org.microtally.lattice;

/**
 * Row operations of the transfer-matrix sweeps: destination rows (tables over the energy index) are
 * sums modulo p of source rows copied in at an offset (their energy shift).
 *
 * <p>A row-by-row add {@code next[to + i] += vec[from + i]} with two unrelated offsets is left scalar
 * by the JIT compiler (it cannot rule out that the two ranges overlap in one array). So the sweeps
 * copy the first term of each destination row into the destination vector and the second term into
 * a third vector at the same index ({@link #place}, {@link System#arraycopy}), and then run
 * {@link #addMod} over a chunk of {@link #CHUNK} entries with one index for both arrays, a loop the
 * compiler vectorises, while the chunk is still in cache. Common practice, no source: the aliasing
 * rule is the observed behaviour of HotSpot C2 on JDK 17 (measured in notes/lattice.md: the scalar
 * row add is about 4x slower than the one-index loop on the same data).
 */
final class RowSum {
    private RowSum() { }

    /** Entries per chunk between copying and adding (32 KB of longs, within the first-level cache). */
    static final int CHUNK = 4096;

    /** Destination rows of {@code width} entries per chunk (at least 1). */
    static int rowsPerChunk(int width) {
        return Math.max(1, CHUNK / width);
    }

    /** dst[frame .. frame + width) := zeros with src[from .. from + len) copied in at offset shift. */
    static void place(long[] dst, int frame, int width, int shift, long[] src, int from, int len) {
        for (int j = frame; j < frame + shift; j++) {
            dst[j] = 0;
        }
        System.arraycopy(src, from, dst, frame + shift, len);
        for (int j = frame + shift + len; j < frame + width; j++) {
            dst[j] = 0;
        }
    }

    /**
     * a[i] := a[i] + b[i] mod p for i in [from, from + len), inputs in [0, p), p &lt; 2^62 (so a + b
     * never overflows). One index for both arrays: the JIT compiler vectorises this loop.
     */
    static void addMod(long[] a, long[] b, int from, int len, long p) {
        for (int i = from; i < from + len; i++) {
            long x = a[i] + b[i] - p;
            a[i] = x + ((x >> 63) & p);
        }
    }
}
