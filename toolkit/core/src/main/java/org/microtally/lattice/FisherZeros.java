package org.microtally.lattice;

import java.math.BigDecimal;
import java.math.BigInteger;
import java.math.MathContext;
import java.math.RoundingMode;
import java.util.ArrayList;
import java.util.Collections;
import java.util.Comparator;
import java.util.List;
import org.microtally.InvalidInputException;
import org.microtally.Tabular;
import org.microtally.ensemble.ExactDensityOfStates;

/**
 * Partition-function zeros in the complex plane of z = e^{-beta s} (Fisher zeros; M. E. Fisher, in
 * Lectures in Theoretical Physics VII C, Univ. of Colorado Press (1965)). For the Ising model with
 * s = 2 (energies in units of J) z is x = e^{-2 beta J}, and Z = e^{-beta E_0} sum_k g(E_0 + k s) x^k.
 *
 * <h2>Method and accuracy</h2>
 * The polynomial has exact integer coefficients. When only every d-th power occurs (d = gcd of the
 * exponents, e.g. d = 2 on even tori) the roots are found in y = z^d and their d-th roots taken.
 * Roots: Aberth-Ehrlich simultaneous iteration (O. Aberth, Math. Comp. 27 (1973) 339; L. W. Ehrlich,
 * Comm. ACM 10 (1967) 107), first in double precision from points on the circle of radius
 * |a_0/a_n|^{1/n}, then in {@link BigDecimal} complex arithmetic at the requested number of digits
 * plus 20 guard digits: Newton's method on each root (kept when all converge and the inclusion
 * discs below are disjoint), otherwise Aberth-Ehrlich sweeps, until every correction is below
 * 10^-(digits+5) |y|. Each root carries the
 * inclusion radius n |p(y)/p'(y)| (a disc about y of that radius holds a root of p; P. Henrici,
 * Applied and Computational Complex Analysis Vol. 1 (1974), Sec. 6.4), mapped to z to first order
 * (|dz| = |dy| / (d |z|^{d-1})); disjoint discs hold one root each. The result is
 * refused (exception) unless every radius is below 10^-digits |z| and the discs are disjoint, so
 * the stated digits are guaranteed, not hoped for.
 */
public final class FisherZeros implements Tabular {
    /** One zero z = re + i im with its guaranteed error radius. */
    public record Zero(BigDecimal re, BigDecimal im, double errorRadius) {
        /** |z| as a double. */
        public double abs() {
            return Math.hypot(re.doubleValue(), im.doubleValue());
        }
    }

    private final List<Zero> zeros;
    private final int digits;
    private final int step;

    private FisherZeros(List<Zero> zeros, int digits, int step) {
        this.zeros = zeros;
        this.digits = digits;
        this.step = step;
    }

    /**
     * The zeros of Z in z = e^{-beta step} to {@code digits} significant digits (10..200).
     *
     * @throws InvalidInputException when an energy difference is not a multiple of {@code step}, or
     *         digits or the degree (&lt;= 2000) is out of range
     */
    public static FisherZeros of(ExactDensityOfStates dos, int step, int digits) {
        if (digits < 10 || digits > 200) {
            throw InvalidInputException.of("digits", digits, "in 10..200", "");
        }
        if (step < 1) {
            throw InvalidInputException.of("step", step, ">= 1", "");
        }
        ExactDensityOfStates g = dos.byEnergy();
        long e0 = g.groundEnergy();
        long top = g.energy(g.size() - 1);
        if ((top - e0) % step != 0 || (top - e0) / step > 2000) {
            throw InvalidInputException.of("degree (E_max - E_0) / step", (double) (top - e0) / step, "an integer <= 2000", "");
        }
        int degree = (int) ((top - e0) / step);
        if (degree < 1) {
            throw InvalidInputException.of("number of distinct energies", g.size(), ">= 2 (a constant Z has no zeros)", "");
        }
        BigInteger[] coef = new BigInteger[degree + 1];
        java.util.Arrays.fill(coef, BigInteger.ZERO);
        int d = 0;
        for (int i = 0; i < g.size(); i++) {
            long diff = g.energy(i) - e0;
            if (diff % step != 0) {
                throw InvalidInputException.of("energy difference E - E_0", diff, "a multiple of step = " + step,
                        "Choose step as the energy spacing (2 for Ising energies in units of J).");
            }
            int k = (int) (diff / step);
            coef[k] = g.multiplicity(i);
            d = BigInteger.valueOf(d).gcd(BigInteger.valueOf(k)).intValue();
        }
        int n = degree / d;
        BigInteger[] reduced = new BigInteger[n + 1];
        for (int k = 0; k <= n; k++) {
            reduced[k] = coef[k * d];
        }
        MathContext mc = new MathContext(digits + 20, RoundingMode.HALF_EVEN);
        Cx[] roots = refine(reduced, start(reduced), mc, digits);
        List<Zero> out = new ArrayList<>();
        for (Cx y : roots) {
            for (Cx z : y.roots(d, mc)) {
                out.add(new Zero(z.re.round(new MathContext(digits)), z.im.round(new MathContext(digits)), 0));
            }
        }
        // error radii in z: |dz| <= |dy| / (d |z|^{d-1})
        List<Zero> withErrors = new ArrayList<>();
        double[] radiusY = new double[roots.length];
        for (int i = 0; i < roots.length; i++) {
            radiusY[i] = roots[i].radius;
        }
        for (int i = 0; i < out.size(); i++) {
            Zero z = out.get(i);
            double abs = z.abs();
            double r = radiusY[i / d] / (d * Math.pow(abs, d - 1));
            if (!(r <= Math.pow(10, -digits) * abs)) {
                throw new IllegalStateException("Fisher zero " + z + " not resolved to " + digits + " digits (radius " + r + ")");
            }
            withErrors.add(new Zero(z.re, z.im, r));
        }
        withErrors.sort(Comparator.comparingDouble((Zero z) -> z.im().doubleValue()).thenComparingDouble(z -> z.re().doubleValue()));
        return new FisherZeros(Collections.unmodifiableList(withErrors), digits, step);
    }

    /** All zeros, sorted by imaginary part then real part. */
    public List<Zero> zeros() {
        return zeros;
    }

    /** Guaranteed significant digits of every zero. */
    public int digits() {
        return digits;
    }

    /**
     * The zero with Re z &gt; 0 and Im z &gt; 0 closest to the positive real axis (smallest Im z),
     * the one that pinches the physical line as the lattice grows.
     */
    public Zero leading() {
        Zero best = null;
        for (Zero z : zeros) {
            if (z.re().signum() > 0 && z.im().signum() > 0 && (best == null || z.im().compareTo(best.im()) < 0)) {
                best = z;
            }
        }
        if (best == null) {
            throw InvalidInputException.of("zeros in the first quadrant", 0, ">= 1", "This Z has no zero with Re z > 0, Im z > 0.");
        }
        return best;
    }

    /**
     * Two-size estimate of the scaling exponent 1/nu from the leading zeros of lattices of linear
     * sizes l1 &lt; l2: Im z_1 ~ L^{-1/nu} (C. Itzykson, R. B. Pearson, J. B. Zuber, Nucl. Phys. B 220
     * (1983) 415) gives 1/nu = ln(Im z(l1) / Im z(l2)) / ln(l2 / l1). A finite-size estimate: its
     * corrections fall off with L (for the square Ising torus: 1.08 from L = 4, 6 and 1.05 from 6, 8
     * against the exact 1).
     */
    public static double scalingExponent(int l1, Zero z1, int l2, Zero z2) {
        if (l1 < 1 || l2 <= l1) {
            throw InvalidInputException.of("sizes l1, l2", l1 + ", " + l2, "1 <= l1 < l2", "");
        }
        double im1 = z1.im().doubleValue();
        double im2 = z2.im().doubleValue();
        if (!(im1 > 0 && im2 > 0)) {
            throw InvalidInputException.of("Im z of the leading zeros", im1 + ", " + im2, "both > 0",
                    "Pass the zeros returned by leading().");
        }
        return Math.log(im1 / im2) / Math.log((double) l2 / l1);
    }

    @Override
    public List<String> columnNames() {
        return List.of("Re z", "Im z", "|z|", "error radius");
    }

    @Override
    public List<List<Object>> rows() {
        List<List<Object>> rows = new ArrayList<>();
        for (Zero z : zeros) {
            rows.add(List.of(z.re(), z.im(), z.abs(), z.errorRadius()));
        }
        return Collections.unmodifiableList(rows);
    }

    @Override
    public String toString() {
        return zeros.size() + " zeros in z = e^{-" + step + " beta} to " + digits + " digits";
    }

    /** Double-precision Aberth-Ehrlich starting values. */
    private static double[][] start(BigInteger[] c) {
        int n = c.length - 1;
        double maxLog = 0;
        for (BigInteger b : c) {
            maxLog = Math.max(maxLog, b.signum() == 0 ? 0 : b.bitLength());
        }
        double shift = Math.max(0, maxLog - 900);
        double[] a = new double[n + 1];
        for (int k = 0; k <= n; k++) {
            a[k] = new BigDecimal(c[k]).multiply(BigDecimal.valueOf(Math.pow(2, -Math.min(shift, 1000)))).doubleValue();
        }
        double radius = Math.pow(Math.abs(a[0] / a[n]), 1.0 / n);
        double[] re = new double[n];
        double[] im = new double[n];
        for (int i = 0; i < n; i++) {
            double t = 2 * Math.PI * i / n + 0.4;
            re[i] = radius * Math.cos(t);
            im[i] = radius * Math.sin(t);
        }
        for (int iter = 0; iter < 500; iter++) {
            double worst = 0;
            for (int i = 0; i < n; i++) {
                // p and p' by Horner
                double pr = a[n];
                double pi = 0;
                double dr = 0;
                double di = 0;
                for (int k = n - 1; k >= 0; k--) {
                    double ndr = dr * re[i] - di * im[i] + pr;
                    double ndi = dr * im[i] + di * re[i] + pi;
                    dr = ndr;
                    di = ndi;
                    double npr = pr * re[i] - pi * im[i] + a[k];
                    double npi = pr * im[i] + pi * re[i];
                    pr = npr;
                    pi = npi;
                }
                double den = dr * dr + di * di;
                if (den == 0 || !Double.isFinite(den)) {
                    continue;
                }
                double wr = (pr * dr + pi * di) / den;   // w = p / p'
                double wi = (pi * dr - pr * di) / den;
                double sr = 0;
                double si = 0;
                for (int j = 0; j < n; j++) {
                    if (j != i) {
                        double xr = re[i] - re[j];
                        double xi = im[i] - im[j];
                        double m = xr * xr + xi * xi;
                        sr += xr / m;
                        si -= xi / m;
                    }
                }
                // correction = w / (1 - w s)
                double br = 1 - (wr * sr - wi * si);
                double bi = -(wr * si + wi * sr);
                double bm = br * br + bi * bi;
                double cr = (wr * br + wi * bi) / bm;
                double ci = (wi * br - wr * bi) / bm;
                if (Double.isFinite(cr) && Double.isFinite(ci)) {
                    re[i] -= cr;
                    im[i] -= ci;
                    worst = Math.max(worst, Math.hypot(cr, ci) / Math.max(1e-300, Math.hypot(re[i], im[i])));
                }
            }
            if (worst < 1e-14) {
                break;
            }
        }
        return new double[][] {re, im};
    }

    private static Cx[] refine(BigInteger[] c, double[][] start, MathContext mc, int digits) {
        int n = c.length - 1;
        Cx[] a = new Cx[n + 1];
        for (int k = 0; k <= n; k++) {
            a[k] = new Cx(new BigDecimal(c[k]), BigDecimal.ZERO);
        }
        Cx[] z = new Cx[n];
        for (int i = 0; i < n; i++) {
            z[i] = new Cx(new BigDecimal(start[0][i]), new BigDecimal(start[1][i]));
        }
        BigDecimal tol = BigDecimal.ONE.movePointLeft(digits + 5);
        // Fast path: Newton on each root from the double-precision start (quadratic); kept only when
        // every root converges and the inclusion discs come out disjoint (no two starts fell to one root).
        Cx[] newton = z.clone();
        boolean converged = true;
        for (int i = 0; i < n && converged; i++) {
            boolean ok = false;
            for (int it = 0; it < 12 && !ok; it++) {
                Cx[] pd = horner(a, newton[i], mc);
                Cx corr = pd[0].div(pd[1], mc);
                newton[i] = newton[i].sub(corr);
                ok = corr.absApprox().compareTo(tol.multiply(newton[i].absApprox(), mc)) <= 0;
            }
            converged = ok;
        }
        if (converged && withRadii(a, newton, mc)) {
            return newton;
        }
        for (int iter = 0; iter < 200; iter++) {
            boolean done = true;
            for (int i = 0; i < n; i++) {
                Cx[] pd = horner(a, z[i], mc);
                Cx w = pd[0].div(pd[1], mc);
                Cx s = Cx.ZERO;
                for (int j = 0; j < n; j++) {
                    if (j != i) {
                        s = s.add(Cx.ONE.div(z[i].sub(z[j]), mc));
                    }
                }
                Cx corr = w.div(Cx.ONE.sub(w.mul(s, mc)), mc);
                z[i] = z[i].sub(corr);
                if (corr.absApprox().compareTo(tol.multiply(z[i].absApprox().max(BigDecimal.ONE.movePointLeft(300)), mc)) > 0) {
                    done = false;
                }
            }
            if (done) {
                if (!withRadii(a, z, mc)) {
                    throw new IllegalStateException("Fisher zeros are not separated by their error radii at " + digits + " digits");
                }
                return z;
            }
        }
        throw new IllegalStateException("Aberth-Ehrlich iteration did not converge to " + digits + " digits in 200 sweeps");
    }

    /** Sets each root's inclusion radius n |p/p'|; true when the discs are pairwise disjoint. */
    private static boolean withRadii(Cx[] a, Cx[] z, MathContext mc) {
        int n = z.length;
        for (int i = 0; i < n; i++) {
            Cx[] pd = horner(a, z[i], mc);
            z[i].radius = n * pd[0].div(pd[1], mc).absApprox().doubleValue();
        }
        for (int i = 0; i < n; i++) {
            for (int j = i + 1; j < n; j++) {
                double dist = z[i].sub(z[j]).absApprox().doubleValue();
                if (!(dist > z[i].radius + z[j].radius)) {
                    return false;
                }
            }
        }
        return true;
    }

    private static Cx[] horner(Cx[] a, Cx z, MathContext mc) {
        int n = a.length - 1;
        Cx p = a[n];
        Cx d = Cx.ZERO;
        for (int k = n - 1; k >= 0; k--) {
            d = d.mul(z, mc).add(p);
            p = p.mul(z, mc).add(a[k]);
        }
        return new Cx[] {p, d};
    }

    /** Minimal complex arithmetic on BigDecimal. */
    private static final class Cx {
        static final Cx ZERO = new Cx(BigDecimal.ZERO, BigDecimal.ZERO);
        static final Cx ONE = new Cx(BigDecimal.ONE, BigDecimal.ZERO);
        final BigDecimal re;
        final BigDecimal im;
        double radius;

        Cx(BigDecimal re, BigDecimal im) {
            this.re = re;
            this.im = im;
        }

        Cx add(Cx o) {
            return new Cx(re.add(o.re), im.add(o.im));
        }

        Cx sub(Cx o) {
            return new Cx(re.subtract(o.re), im.subtract(o.im));
        }

        Cx mul(Cx o, MathContext mc) {
            return new Cx(re.multiply(o.re, mc).subtract(im.multiply(o.im, mc), mc),
                    re.multiply(o.im, mc).add(im.multiply(o.re, mc), mc));
        }

        Cx div(Cx o, MathContext mc) {
            BigDecimal den = o.re.multiply(o.re, mc).add(o.im.multiply(o.im, mc), mc);
            BigDecimal r = re.multiply(o.re, mc).add(im.multiply(o.im, mc), mc).divide(den, mc);
            BigDecimal i = im.multiply(o.re, mc).subtract(re.multiply(o.im, mc), mc).divide(den, mc);
            return new Cx(r, i);
        }

        BigDecimal absApprox() {
            return BigDecimal.valueOf(Math.hypot(re.doubleValue(), im.doubleValue()));
        }

        /** The d complex d-th roots, by Newton from the double-precision polar form. */
        Cx[] roots(int d, MathContext mc) {
            if (d == 1) {
                return new Cx[] {this};
            }
            double r = Math.pow(Math.hypot(re.doubleValue(), im.doubleValue()), 1.0 / d);
            double phi = Math.atan2(im.doubleValue(), re.doubleValue());
            Cx[] out = new Cx[d];
            BigDecimal bd = BigDecimal.valueOf(d);
            for (int k = 0; k < d; k++) {
                double t = (phi + 2 * Math.PI * k) / d;
                Cx w = new Cx(BigDecimal.valueOf(r * Math.cos(t)), BigDecimal.valueOf(r * Math.sin(t)));
                for (int it = 0; it < 12; it++) {   // w <- w - (w^d - y) / (d w^{d-1}), quadratic from 1e-16
                    Cx wd1 = ONE;
                    for (int j = 0; j < d - 1; j++) {
                        wd1 = wd1.mul(w, mc);
                    }
                    Cx f = wd1.mul(w, mc).sub(this);
                    w = w.sub(f.div(new Cx(wd1.re.multiply(bd, mc), wd1.im.multiply(bd, mc)), mc));
                }
                out[k] = w;
            }
            return out;
        }
    }
}
