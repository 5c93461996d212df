package org.microtally.count;

import java.math.BigInteger;

/** Bench-side access to the package-private Chinese-remaindering stage, with the library's own primes. */
final class CountStages {
    private CountStages() { }

    /** Residues of an exact table modulo the library's first {@code k} primes. */
    static final class Prepared {
        final long[] primes;
        final long[][] residues;
        final int size;

        Prepared(long[] primes, long[][] residues, int size) {
            this.primes = primes;
            this.residues = residues;
            this.size = size;
        }
    }

    static Prepared prepare(BigInteger[] exact, int k) {
        long[] p = Moduli.tablePrimes(Math.max(1, k));
        long[][] r = new long[p.length][exact.length];
        for (int i = 0; i < p.length; i++) {
            BigInteger bp = BigInteger.valueOf(p[i]);
            for (int j = 0; j < exact.length; j++) {
                r[i][j] = exact[j].mod(bp).longValue();
            }
        }
        return new Prepared(p, r, exact.length);
    }

    static BigInteger[] reconstruct(Prepared in) {
        return new Moduli.Crt(in.primes).reconstructAll(in.residues);
    }
}
