package org.microtally.lattice;

import java.math.BigInteger;
import java.util.ArrayList;
import java.util.List;

/**
 * Word-size primes and Chinese remaindering for the lattice counts.
 *
 * <p>A small copy of what {@code org.microtally.count.Moduli} does (that class is package-private
 * and being reworked for speed): primes below 2^62, each above 2^61, proven prime by deterministic
 * Miller-Rabin with the first twelve prime bases, exact for every n &lt; 3.18e23 (J. Sorenson,
 * J. Webster, Math. Comp. 86 (2017) 985-1003); recombination by Garner's mixed-radix method (Knuth,
 * TAOCP Vol. 2, Sec. 4.3.2) in BigInteger arithmetic. To be folded into one shared facade later.
 */
final class LatticeModuli {
    private LatticeModuli() { }

    /** Every prime here exceeds 2^61, so k of them exceed any value below 2^(61 k). */
    static final int BITS_PER_PRIME = 61;
    private static final long[] MR_BASES = {2, 3, 5, 7, 11, 13, 17, 19, 23, 29, 31, 37};
    private static final List<Long> PRIMES = new ArrayList<>();

    /** Number of primes whose product exceeds every value below 2^bits. */
    static int primesFor(double bits) {
        return (int) Math.floor(bits / BITS_PER_PRIME) + 1;
    }

    /** The first k primes below 2^62, descending. */
    static synchronized long[] primes(int k) {
        long candidate = PRIMES.isEmpty() ? (1L << 62) - 1 : PRIMES.get(PRIMES.size() - 1) - 2;
        while (PRIMES.size() < k) {
            if (isPrime(candidate)) {
                PRIMES.add(candidate);
            }
            candidate -= 2;
        }
        long[] out = new long[k];
        for (int i = 0; i < k; i++) {
            out[i] = PRIMES.get(i);
        }
        return out;
    }

    /**
     * The first k primes p below 2^62 (each above 2^61) with p = 1 (mod step), descending; for
     * these, F_p contains the roots of unity of every order dividing step.
     */
    static long[] primesCongruentToOne(long step, int k) {
        long[] out = new long[k];
        long t = ((1L << 62) - 1) / step;
        int found = 0;
        while (found < k) {
            long p = t * step + 1;
            if (p <= 1L << 61) {
                throw new IllegalStateException("fewer than " + k + " primes = 1 mod " + step + " in (2^61, 2^62)");
            }
            if (isPrime(p)) {
                out[found++] = p;
            }
            t--;
        }
        return out;
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

    /**
     * The unique v in [0, prod p_i) with v = residues[i][index] mod primes[i], for every index.
     */
    static BigInteger[] recombine(long[] primes, long[][] residues) {
        int k = primes.length;
        int len = residues[0].length;
        BigInteger[] out = new BigInteger[len];
        BigInteger[] prefix = new BigInteger[k];   // p_0 ... p_{i-1}
        long[] prefixInv = new long[k];            // (p_0 ... p_{i-1})^-1 mod p_i
        prefix[0] = BigInteger.ONE;
        for (int i = 1; i < k; i++) {
            prefix[i] = prefix[i - 1].multiply(BigInteger.valueOf(primes[i - 1]));
            BigInteger pi = BigInteger.valueOf(primes[i]);
            prefixInv[i] = prefix[i].mod(pi).modInverse(pi).longValueExact();
        }
        for (int j = 0; j < len; j++) {
            BigInteger v = BigInteger.valueOf(residues[0][j]);
            for (int i = 1; i < k; i++) {
                BigInteger pi = BigInteger.valueOf(primes[i]);
                long vi = v.mod(pi).longValueExact();
                long diff = Math.floorMod(residues[i][j] - vi, primes[i]);
                long t = BigInteger.valueOf(diff).multiply(BigInteger.valueOf(prefixInv[i])).mod(pi).longValueExact();
                if (t != 0) {
                    v = v.add(prefix[i].multiply(BigInteger.valueOf(t)));
                }
            }
            out[j] = v;
        }
        return out;
    }
}
