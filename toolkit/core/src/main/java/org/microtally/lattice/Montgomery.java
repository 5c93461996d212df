package org.microtally.lattice;

import java.math.BigInteger;

/**
 * Montgomery multiplication modulo an odd prime p &lt; 2^62 with R = 2^64 (P. L. Montgomery,
 * "Modular multiplication without trial division", Math. Comp. 44 (1985) 519-521).
 *
 * <p>{@link #mul}(a, b) = a b R^-1 mod p for a, b in [0, p): the 128-bit product comes from
 * {@link Math#multiplyHigh}, and because (a b + m p) / R &lt; p (p / R + 1) &lt; 2p one conditional
 * subtraction finishes. Values kept "in Montgomery form" are a R mod p; {@link #in} and {@link #out}
 * convert.
 */
final class Montgomery {
    final long p;
    private final long negInv;   // -p^-1 mod 2^64
    private final long r2;       // R^2 mod p
    final long one;              // R mod p

    Montgomery(long p) {
        if (p % 2 == 0 || p >= 1L << 62 || p < 3) {
            throw new IllegalArgumentException("modulus " + p + " must be odd, in [3, 2^62)");
        }
        this.p = p;
        long inv = p;                       // Newton iteration for p^-1 mod 2^64: 5 steps double 3 bits to 96
        for (int i = 0; i < 5; i++) {
            inv *= 2 - p * inv;
        }
        this.negInv = -inv;
        BigInteger bp = BigInteger.valueOf(p);
        this.r2 = BigInteger.ONE.shiftLeft(128).mod(bp).longValueExact();
        this.one = BigInteger.ONE.shiftLeft(64).mod(bp).longValueExact();
    }

    /** a b R^-1 mod p. */
    long mul(long a, long b) {
        long lo = a * b;
        long hi = Math.multiplyHigh(a, b);
        long m = lo * negInv;
        long mpHi = Math.multiplyHigh(m, p) + ((m >> 63) & p);
        long t = hi + mpHi + (lo != 0 ? 1 : 0);
        return t >= p ? t - p : t;
    }

    /** a R mod p (into Montgomery form), for a in [0, p). */
    long in(long a) {
        return mul(a, r2);
    }

    /** a R^-1 mod p (out of Montgomery form). */
    long out(long a) {
        return mul(a, 1);
    }

    long add(long a, long b) {
        long s = a + b - p;
        return s + ((s >> 63) & p);
    }

    long sub(long a, long b) {
        long s = a - b;
        return s + ((s >> 63) & p);
    }

    /** a^e in Montgomery form, for a in Montgomery form and e &gt;= 0. */
    long pow(long a, long e) {
        long r = one;
        long b = a;
        while (e > 0) {
            if ((e & 1) != 0) {
                r = mul(r, b);
            }
            b = mul(b, b);
            e >>>= 1;
        }
        return r;
    }

    /** a^-1 in Montgomery form (Fermat), for a != 0 in Montgomery form. */
    long inverse(long a) {
        return pow(a, p - 2);
    }
}
