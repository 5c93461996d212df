package org.microtally.lattice;

import org.microtally.count.Ticker;
import org.microtally.count.WordPrimes;
import java.math.BigInteger;
import org.microtally.InvalidInputException;
import org.microtally.ProgressListener;
import org.microtally.ensemble.ExactDensityOfStates;

/**
 * The exact density of states g(E) of the ferromagnetic Ising model on the periodic n x m square
 * lattice from Kaufman's finite-lattice partition function.
 *
 * <h2>Formula</h2>
 * B. Kaufman, Phys. Rev. 76, 1232 (1949), in the form of P. D. Beale, Phys. Rev. Lett. 76, 78
 * (1996): with K = beta J,
 * Z = (1/2) (2 sinh 2K)^{nm/2} (Z_1 + Z_2 + Z_3 + Z_4), Z_1,2 = prod_{r=0}^{n-1} 2 cosh, sinh
 * (m gamma_{2r+1} / 2), Z_3,4 = the same over gamma_{2r}, where cosh gamma_k = cosh 2K coth 2K -
 * cos(pi k / n) and gamma_0 = 2K + ln tanh K (its sign matters). In x = e^{-2K}, pairing k with
 * 2n - k (equal gamma) turns every paired factor into a polynomial, Q_k^&plusmn; = D^m (V_m(y_k) &plusmn; 2)
 * with D = x (1 - x^2), y_k = (1 + x^2)^2 / D - 2 cos(pi k / n) and V_m the Lucas/Dickson polynomial
 * V_m(w + 1/w) = w^m + w^-m. The unpaired k = 0 and k = n factors, each with its share
 * ((1 - x^2)/x)^{m/2} x^m of the prefactor, are polynomials too (e^{gamma_0} = (1 - x)/(x (1 + x)),
 * e^{gamma_n} = (1 + x)/(x (1 - x)), so the half-integer powers cancel for odd m as well):
 * F_0^&plusmn; = (1 - x)^m &plusmn; x^m (1 + x)^m, F_n^&plusmn; = (1 + x)^m &plusmn; x^m (1 - x)^m. Then, with
 * products over 0 &lt; k &lt; n,
 * <ul>
 *   <li>n even: x^{nm} Z = (1/2) [prod_{odd k} Q_k^+ + prod_{odd k} Q_k^- + F_0^+ F_n^+ prod_{even k} Q_k^+
 *       + F_0^- F_n^- prod_{even k} Q_k^-];</li>
 *   <li>n odd (k = n is odd): x^{nm} Z = (1/2) [F_n^+ prod_{odd k} Q_k^+ + F_n^- prod_{odd k} Q_k^-
 *       + F_0^+ prod_{even k} Q_k^+ + F_0^- prod_{even k} Q_k^-].</li>
 * </ul>
 * In both, x^{nm} Z = sum_k g_k x^k, g_k = g(E = 2k - 2nm). The odd-n form is our own rearrangement
 * of Kaufman's product (the sign of gamma_0 carried through F_0^-); it is checked against the
 * transfer matrix and brute-force enumeration on odd x odd and odd x even tori, in both orientations.
 *
 * <h2>Method (ours)</h2>
 * Modulo primes p = 1 (mod lcm(2n, S)), S the power of two above 2nm (the degree), 2 cos(pi k / n) becomes
 * zeta^k + zeta^-k with zeta a primitive 2n-th root of unity in F_p (the right-hand side is an
 * integer polynomial, so any ring homomorphism from Z[zeta_2n] gives its residues). The polynomial
 * is evaluated at the S points c omega^j (omega of order S, c outside the subgroup so D never
 * vanishes), V_m by the doubling formulas V_2j = V_j^2 - 2, V_2j+1 = V_j V_j+1 - y, and the
 * coefficients come back by one inverse number-theoretic transform (only even powers occur, as
 * every site has four bonds, so half the points suffice: F(-x) = F(x)). Every g_k &lt;= 2^{nm}, so
 * floor(nm / 61) + 1 primes above 2^61 and Chinese remaindering give them exactly.
 *
 * <h2>Accuracy and limits</h2>
 * Exact integers; the result is checked against sum g = 2^{nm} before it is returned (a failed
 * check throws). Any L x M torus with L, M &gt;= 3 (n = the shorter side, m = the longer). Cost about
 * n (2 log2 m + 6) modular multiplications per point, S/2 points per prime, nm/61 + 1 primes:
 * O((nm)^2 n log m / 61).
 */
public final class Kaufman {
    private Kaufman() { }

    /** g(E) of the ferromagnetic Ising model on the periodic L x M square lattice (E in units of J). */
    public static ExactDensityOfStates densityOfStates(int l, int m, ProgressListener progress) {
        return densityOfStates(l, m, Model.Coupling.FERROMAGNETIC, progress);
    }

    /**
     * g(E) of the Ising model with the given sign of J on the periodic L x M square lattice (E in
     * units of |J|). The antiferromagnet needs both sides even: the torus is then bipartite and
     * flipping one sublattice maps the antiferromagnet's E to the ferromagnet's, g_AF(E) = g_F(E);
     * on an odd side the antiferromagnet is frustrated and has a different spectrum (use
     * {@link TransferMatrix}).
     */
    public static ExactDensityOfStates densityOfStates(int l, int m, Model.Coupling coupling, ProgressListener progress) {
        java.util.Objects.requireNonNull(coupling, "coupling");
        if (coupling == Model.Coupling.ANTIFERROMAGNETIC && (l % 2 != 0 || m % 2 != 0)) {
            throw InvalidInputException.of("L x M for the antiferromagnet", l + " x " + m, "both sides even (a bipartite torus)",
                    "An odd period frustrates the antiferromagnet; use TransferMatrix for it.");
        }
        Lattice lattice = Lattice.square(l, m, Boundary.PERIODIC);   // validates L, M >= 3
        int n = Math.min(l, m);                 // the product runs over n factors: the shorter side is cheaper
        int mm = Math.max(l, m);
        BigInteger[] g = coefficients(n, mm, progress);
        BigInteger sum = BigInteger.ZERO;
        for (BigInteger c : g) {
            sum = sum.add(c);
        }
        if (!sum.equals(BigInteger.TWO.pow(n * mm))) {
            throw new IllegalStateException("Kaufman expansion failed its own check sum g = 2^N for " + l + " x " + m);
        }
        // Bipartite torus: the sublattice flip maps k unequal bonds to B - k, and g_k = g_{B-k}, so the
        // antiferromagnet has the same table g_k (energies E = B - 2k instead of 2k - B).
        return Tally.toDensityOfStates(lattice, Model.ising(coupling), false, g, 1);
    }

    static BigInteger[] coefficients(int n, int m, ProgressListener progress) {
        int sites = n * m;
        int degree = 2 * sites;
        int s = Integer.highestOneBit(degree) << 1;          // S > 2nm
        long step = lcm(2L * n, s);
        int k = WordPrimes.primesFor(sites);
        long[] primes = WordPrimes.primesCongruentToOne(step, k);
        long[][] residues = new long[k][];
        Ticker ticker = new Ticker(progress, k, "Kaufman primes");
        for (int i = 0; i < k; i++) {
            residues[i] = java.util.Arrays.copyOf(modular(n, m, s, primes[i]), degree + 1);
            ticker.step();
        }
        return WordPrimes.recombine(primes, residues);
    }

    private static long lcm(long a, long b) {
        return a / BigInteger.valueOf(a).gcd(BigInteger.valueOf(b)).longValueExact() * b;
    }

    /** Coefficients of x^{nm} Z modulo p (plain residues), indices 0..S-1. */
    static long[] modular(int n, int m, int s, long p) {
        Montgomery f = new Montgomery(p);
        long omega = rootOfOrder(f, s);
        long zeta = rootOfOrder(f, 2L * n);
        long[] t = new long[n];                             // t[k] = zeta^k + zeta^-k
        long zk = f.one;
        long zinv = f.inverse(zeta);
        long zik = f.one;
        for (int kk = 0; kk < n; kk++) {
            t[kk] = f.add(zk, zik);
            zk = f.mul(zk, zeta);
            zik = f.mul(zik, zinv);
        }
        long c = f.in(3);
        while (f.pow(c, s) == f.one) {
            c = f.add(c, f.one);
        }
        long one = f.one;
        long two = f.add(one, one);
        long half = f.inverse(two);
        long[] values = new long[s];
        long x = c;
        // Every site has four bonds, so a spin flip changes the number of unequal bonds by an even
        // number: only even powers of x occur, F(-x) = F(x), and the points c omega^{j + S/2} =
        // -c omega^j need no second evaluation.
        int points = s / 2;
        for (int j = 0; j < points; j++) {
            long x2 = f.mul(x, x);
            long oneMinusX2 = f.sub(one, x2);
            long d = f.mul(x, oneMinusX2);
            long onePlusX2 = f.add(one, x2);
            long a = f.mul(f.mul(onePlusX2, onePlusX2), f.inverse(d));
            long dm = f.pow(d, m);
            long oddPlus = one;
            long oddMinus = one;
            long evenPlus = one;
            long evenMinus = one;
            for (int kk = 1; kk < n; kk++) {
                long v = lucas(f, f.sub(a, t[kk]), m, two);
                long plus = f.mul(dm, f.add(v, two));
                long minus = f.mul(dm, f.sub(v, two));
                if (kk % 2 == 1) {
                    oddPlus = f.mul(oddPlus, plus);
                    oddMinus = f.mul(oddMinus, minus);
                } else {
                    evenPlus = f.mul(evenPlus, plus);
                    evenMinus = f.mul(evenMinus, minus);
                }
            }
            // The unpaired factors k = 0 (gamma_0, its sign kept) and k = n, each with its share of the
            // prefactor: F_0^+- = (1 - x)^m +- x^m (1 + x)^m, F_n^+- = (1 + x)^m +- x^m (1 - x)^m.
            long xm = f.pow(x, m);
            long down = f.pow(f.sub(one, x), m);
            long up = f.pow(f.add(one, x), m);
            long zeroPlus = f.add(down, f.mul(xm, up));
            long zeroMinus = f.sub(down, f.mul(xm, up));
            long nPlus = f.add(up, f.mul(xm, down));
            long nMinus = f.sub(up, f.mul(xm, down));
            long total;
            if (n % 2 == 0) {       // k = n is even: both unpaired factors sit in the gamma_{2r} products
                total = f.add(f.add(oddPlus, oddMinus),
                        f.add(f.mul(f.mul(zeroPlus, nPlus), evenPlus), f.mul(f.mul(zeroMinus, nMinus), evenMinus)));
            } else {                // k = n is odd: it joins the gamma_{2r+1} products
                total = f.add(f.add(f.mul(nPlus, oddPlus), f.mul(nMinus, oddMinus)),
                        f.add(f.mul(zeroPlus, evenPlus), f.mul(zeroMinus, evenMinus)));
            }
            values[j] = f.mul(total, half);
            values[j + s / 2] = values[j];
            x = f.mul(x, omega);
        }
        // Inverse transform: values[j] = sum_i h_i omega^{ij}, h_i = g_i c^i.
        Ntt.transform(f, values, f.inverse(omega));
        long scale = f.inverse(f.in(s));
        long cInv = f.inverse(c);
        long w = scale;
        for (int i = 0; i < s; i++) {
            values[i] = f.out(f.mul(values[i], w));
            w = f.mul(w, cInv);
        }
        return values;
    }

    /** V_e(y) in Montgomery form (V_0 = 2, V_1 = y, V_{j+1} = y V_j - V_{j-1}) by doubling. */
    private static long lucas(Montgomery f, long y, int e, long two) {
        long v0 = two;
        long v1 = y;
        for (int bit = 31 - Integer.numberOfLeadingZeros(e); bit >= 0; bit--) {
            long cross = f.sub(f.mul(v0, v1), y);
            if (((e >>> bit) & 1) == 0) {
                v0 = f.sub(f.mul(v0, v0), two);
                v1 = cross;
            } else {
                v0 = cross;
                v1 = f.sub(f.mul(v1, v1), two);
            }
        }
        return v0;
    }

    /** An element of exact multiplicative order {@code order} (which divides p - 1), in Montgomery form. */
    static long rootOfOrder(Montgomery f, long order) {
        long[] primeFactors = primeFactors(order);
        for (long g = 2; ; g++) {
            long z = f.pow(f.in(g), (f.p - 1) / order);
            boolean exact = true;
            for (long r : primeFactors) {
                exact &= f.pow(z, order / r) != f.one;
            }
            if (exact) {
                return z;
            }
        }
    }

    private static long[] primeFactors(long v) {
        java.util.List<Long> out = new java.util.ArrayList<>();
        for (long r = 2; r * r <= v; r++) {
            if (v % r == 0) {
                out.add(r);
                while (v % r == 0) {
                    v /= r;
                }
            }
        }
        if (v > 1) {
            out.add(v);
        }
        return out.stream().mapToLong(Long::longValue).toArray();
    }
}
