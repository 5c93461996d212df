package org.microtally.count;

import java.math.BigInteger;

/**
 * The count package's word-size primes and Chinese remaindering, for other exact multi-modular
 * computations in the toolkit (the lattice transfer matrix and Kaufman expansion).
 *
 * <p>Primes lie in (2^61, 2^62) and are proven prime by deterministic Miller-Rabin with the first
 * twelve prime bases (Sorenson and Webster, Math. Comp. 86 (2017) 985-1003); recombination is
 * Garner's mixed-radix algorithm (Knuth, TAOCP Vol. 2, Sec. 4.3.2), exact. See {@link Moduli}.
 */
public final class WordPrimes {
    private WordPrimes() { }

    /** Every prime here exceeds 2^61. */
    public static final int BITS_PER_PRIME = Moduli.BITS_PER_PRIME;

    /** The number of primes whose product exceeds every value up to and including 2^bits. */
    public static int primesFor(double bits) {
        return (int) Math.floor(bits / BITS_PER_PRIME) + 1;
    }

    /** The first k primes below 2^62, descending. */
    public static long[] primes(int k) {
        return Moduli.primes(k);
    }

    /**
     * The first k primes p below 2^62 (each above 2^61) with p = 1 (mod step), descending; for
     * these, F_p contains the roots of unity of every order dividing step.
     *
     * @throws IllegalStateException if (2^61, 2^62) holds fewer than k such primes
     */
    public static long[] primesCongruentToOne(long step, int k) {
        long[] out = new long[k];
        long t = ((1L << 62) - 1) / step;
        int found = 0;
        while (found < k) {
            long p = t * step + 1;
            if (p <= 1L << 61) {
                throw new IllegalStateException("fewer than " + k + " primes = 1 mod " + step + " in (2^61, 2^62)");
            }
            if (Moduli.isPrime(p)) {
                out[found++] = p;
            }
            t--;
        }
        return out;
    }

    /** The unique v in [0, prod p_i) with v = residues[i][index] mod primes[i], for every index. */
    public static BigInteger[] recombine(long[] primes, long[][] residues) {
        return new Moduli.Crt(primes).reconstructAll(residues);
    }
}
