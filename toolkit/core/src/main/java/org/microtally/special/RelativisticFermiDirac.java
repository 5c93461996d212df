package org.microtally.special;

import org.apache.commons.math3.analysis.integration.gauss.GaussIntegrator;
import org.apache.commons.math3.analysis.integration.gauss.GaussIntegratorFactory;
import org.apache.commons.math3.linear.EigenDecomposition;
import org.microtally.InvalidInputException;

/**
 * The generalised (relativistic) Fermi-Dirac integrals of half-integer order,
 * F_k(eta, beta) = int_0^inf x^k sqrt(1 + beta x / 2) / (e^(x - eta) + 1) dx, for
 * k = -1/2, 1/2, 3/2, 5/2, every eta in [-700, 1e12] and every beta in [0, 1e6], with their
 * derivatives dF_k/deta = int x^k sqrt(1 + beta x/2) f (1 - f) dx and
 * dF_k/dbeta = int x^(k+1) / (4 sqrt(1 + beta x/2)) f dx (f the Fermi factor), and the entropy
 * integrals S_k(eta, beta) = int x^k sqrt(1 + beta x/2) [-f ln f - (1 - f) ln(1 - f)] dx. No
 * 1/Gamma(k+1) normalisation (the convention of the stellar equation-of-state literature). In an
 * electron gas x is the kinetic energy over kT, eta the kinetic chemical potential over kT and
 * beta = kT / (m c^2).
 *
 * <p><b>Method.</b> Interval splitting at the Fermi level followed by Gauss quadrature on each
 * piece, the scheme of Z. Gong, L. Zejda, W. Dappen and J. M. Aparicio, Comput. Phys. Commun. 136,
 * 294 (2001) (building on J. M. Aparicio, ApJS 117, 627 (1998)); here the pieces are:
 * <ul>
 *   <li>[0, x0], x0 = max(eta - 32, 2) (10 when eta &lt;= -10), in the variable theta with
 *       x = (2/beta) sinh^2 theta, which turns the integrand into an entire function (the x^k
 *       end-point singularity and the branch point of the square root at x = -2/beta disappear),
 *       or in u = sqrt(x) when beta x0 &lt; 1e-3; 20-point Gauss-Legendre on theta-pieces of length
 *       at most 1;</li>
 *   <li>[x0, eta + 32] cut at eta +- 3, 7, 13, 21, 32 into pieces whose Gauss-Legendre ellipses
 *       stay clear of the Fermi factor's poles at x = eta + i pi (2m + 1) (16 points; 12, 10 or 8 by
 *       distance from the Fermi level when the piece lies far from x = 0); the node offsets
 *       x - eta are formed without rounding through eta, so dF/deta keeps full accuracy even for
 *       eta = 1e6;</li>
 *   <li>[max(x0, eta + 32), inf): Gauss-Laguerre with weight e^(-(x - x_tail)) (nodes by the
 *       Golub-Welsch eigenvalue method, G. H. Golub and J. H. Welsch, Math. Comp. 23, 221 (1969)),
 *       24 nodes, or 12 when the tail starts beyond x = 400.</li>
 * </ul>
 * Every integrand is positive, so no digits are lost to cancellation; all four orders and all four
 * integral families are accumulated in one pass over 120 to 230 nodes. The nodes between two cuts and in the tail
 * from eta + 32 sit at fixed offsets t = x - eta, so their Fermi factors are computed once for all calls; the head
 * nodes for x0 = 2 and 10 depend on beta alone and are kept for the last beta used, so that a solver calling at one
 * beta pays one exponential per call for the head's Fermi factors. With the entropy integrals come the second
 * eta-derivatives d^2F_k/deta^2 and d^2S_k/deta^2 (integrands with f (1 - f) (1 - 2f)), from the same pass.
 *
 * <p>For eta &gt;= {@value #SOMMERFELD_FROM} the pieces about the Fermi level are replaced by the
 * Sommerfeld series (A. Sommerfeld, Z. Phys. 47, 1 (1928)): the step-function integral int_0^eta g
 * by the first rule (g = x^k sqrt(1 + beta x/2)), plus sum_n 2 eta_D(2n) g^(2n-1)(eta) with the
 * Dirichlet eta function eta_D; likewise dF/deta = g(eta) + sum_n 2 eta_D(2n) g^(2n)(eta), the
 * beta-derivative with d g/d beta in place of g, and S_k = sum_m 4 (m + 1) eta_D(2m + 2) g^(2m)(eta)
 * (its eta-derivative with g^(2m+1) in place of g^(2m)).
 * The derivatives come from the product of two binomial series (the Taylor series of x^k and of
 * the square root about eta, both of radius of convergence at least eta); the remainder, of order e^-eta and (2N+1)!/eta^(2N+1), is kept below 1e-19
 * relative by the number of terms N &lt;= 12.
 *
 * <p><b>Accuracy.</b> {@value #RELATIVE_ACCURACY} relative or better for every value over the whole
 * stated domain, tested against a 20-digit mpmath table
 * ({@code special/relativistic-fd-mpmath.csv}, 3088 values, generator beside it) that spans
 * eta from -300 to 1e6 and beta from 0 to 2000 (the test prints the worst deviation; the stated
 * figure keeps a margin for the parts of the domain the table does not reach), against the complete
 * integrals of {@link FermiDirac} at beta = 0 on a dense eta grid, and across the switch to the
 * Sommerfeld series. For eta &lt; -700 the values fall below about 1e-304 and the call is refused
 * rather than underflowing.
 */
public final class RelativisticFermiDirac {
    private RelativisticFermiDirac() { }

    /** Stated relative accuracy of every value returned. */
    public static final double RELATIVE_ACCURACY = 1e-12;
    /** Smallest accepted eta (values below ~1e-304 are refused rather than underflowing). */
    public static final double MIN_ETA = -700.0;
    /** Largest accepted eta. */
    public static final double MAX_ETA = 1e12;
    /** Largest accepted beta. */
    public static final double MAX_BETA = 1e6;

    private static final double[] CUTS = {-32, -21, -13, -7, -3, 0, 3, 7, 13, 21, 32};
    private static final double HEAD_MIN = 2.0;
    private static final double HEAD_MIN_NONDEGENERATE = 10.0;
    private static final double U_MAP_BELOW = 1e-3; // beta * x0 below this: u = sqrt(x) map
    private static final double THETA_PIECE = 1.0;
    /** From this eta on, the Sommerfeld series replaces the quadrature about the Fermi level. */
    public static final double SOMMERFELD_FROM = 50.0;
    private static final int SOMMERFELD_TERMS = 12;
    /** Dirichlet eta(2n), n = 0 .. SOMMERFELD_TERMS + 1. */
    private static final double[] ETA_EVEN = new double[SOMMERFELD_TERMS + 2];
    /** 1/(j+1), j = 0 .. 2 SOMMERFELD_TERMS + 2. */
    private static final double[] RECIPROCAL = new double[2 * SOMMERFELD_TERMS + 3];
    private static final double FAR_TAIL = 400.0; // tail start (in x) beyond which 12 Laguerre nodes suffice

    private static final double[] GL_NODE;
    private static final double[] GL_WEIGHT;
    /** Shorter rules (8, 10, 12 points) for pieces far from x = 0, by distance of the piece from the Fermi level. */
    private static final double[][] GL_SHORT_NODE = new double[3][];
    private static final double[][] GL_SHORT_WEIGHT = new double[3][];
    private static final double[] TAIL_NODE_SHORT;
    private static final double[] TAIL_WEIGHT_SHORT;
    private static final double[] GL_HEAD_NODE;
    private static final double[] GL_HEAD_WEIGHT;
    private static final double[] LAGUERRE_NODE;
    private static final double[] LAGUERRE_WEIGHT; // times e^node, so the integrand is used as is
    /** The pieces about the Fermi level between two cuts, unclipped: [piece][0 = 16 points, 1 = the short rule]. */
    private static final FixedNodes[][] PIECES = new FixedNodes[CUTS.length][2];
    /** The tail from t = 32 on: [0 = 24 Laguerre nodes, 1 = 12]. */
    private static final FixedNodes[] TAILS = new FixedNodes[2];

    static {
        for (int j = 0; j < RECIPROCAL.length; j++) {
            RECIPROCAL[j] = 1.0 / (j + 1);
        }
        ETA_EVEN[0] = 0.5;
        for (int n = 1; n < ETA_EVEN.length; n++) {
            ETA_EVEN[n] = Zeta.eta(2.0 * n);
        }
        double[][] piece = legendre(16);
        GL_NODE = piece[0];
        GL_WEIGHT = piece[1];
        int[] shortPoints = {8, 10, 12};
        for (int r = 0; r < 3; r++) {
            double[][] rule = legendre(shortPoints[r]);
            GL_SHORT_NODE[r] = rule[0];
            GL_SHORT_WEIGHT[r] = rule[1];
        }
        double[][] head = legendre(20);
        GL_HEAD_NODE = head[0];
        GL_HEAD_WEIGHT = head[1];
        double[][] tail = laguerre(24);
        LAGUERRE_NODE = tail[0];
        LAGUERRE_WEIGHT = tail[1];
        double[][] tailShort = laguerre(12);
        TAIL_NODE_SHORT = tailShort[0];
        TAIL_WEIGHT_SHORT = tailShort[1];
        for (int c = 1; c < CUTS.length; c++) {
            double a = CUTS[c - 1];
            double b = CUTS[c];
            double mid = 0.5 * (a + b);
            double half = 0.5 * (b - a);
            int r = shortRule(a, b);
            PIECES[c][0] = FixedNodes.legendre(mid, half, GL_NODE, GL_WEIGHT);
            PIECES[c][1] = FixedNodes.legendre(mid, half, GL_SHORT_NODE[r], GL_SHORT_WEIGHT[r]);
        }
        TAILS[0] = FixedNodes.tail(CUTS[CUTS.length - 1], LAGUERRE_NODE, LAGUERRE_WEIGHT);
        TAILS[1] = FixedNodes.tail(CUTS[CUTS.length - 1], TAIL_NODE_SHORT, TAIL_WEIGHT_SHORT);
    }

    /** Gauss-Legendre nodes and weights on [-1, 1] (Commons Math, computed in high precision). */
    private static double[][] legendre(int n) {
        GaussIntegrator rule = new GaussIntegratorFactory().legendreHighPrecision(n, -1.0, 1.0);
        double[] node = new double[n];
        double[] weight = new double[n];
        for (int i = 0; i < n; i++) {
            node[i] = rule.getPoint(i);
            weight[i] = rule.getWeight(i);
        }
        return new double[][] {node, weight};
    }

    /** Gauss-Laguerre nodes and weights times e^node by Golub-Welsch (Jacobi matrix diagonal 2i+1, off-diagonal i+1). */
    private static double[][] laguerre(int n) {
        double[] diagonal = new double[n];
        double[] off = new double[n - 1];
        for (int i = 0; i < n; i++) {
            diagonal[i] = 2 * i + 1;
            if (i < n - 1) {
                off[i] = i + 1;
            }
        }
        EigenDecomposition eigen = new EigenDecomposition(diagonal, off);
        double[] node = new double[n];
        double[] weight = new double[n];
        for (int i = 0; i < n; i++) {
            double first = eigen.getEigenvector(i).getEntry(0);
            node[i] = eigen.getRealEigenvalue(i);
            weight[i] = first * first * Math.exp(node[i]);
        }
        return new double[][] {node, weight};
    }

    /**
     * F_k(eta, beta) for one order.
     *
     * @param k    -0.5, 0.5, 1.5 or 2.5
     * @param eta  in [{@value #MIN_ETA}, {@value #MAX_ETA}]
     * @param beta in [0, {@value #MAX_BETA}]
     * @throws InvalidInputException outside these ranges
     */
    public static double integral(double k, double eta, double beta) {
        return evaluate(eta, beta, false).integral(k);
    }

    /** dF_k/deta at (eta, beta); arguments as for {@link #integral}. */
    public static double etaDerivative(double k, double eta, double beta) {
        return evaluate(eta, beta, false).etaDerivative(k);
    }

    /** dF_k/dbeta at (eta, beta); arguments as for {@link #integral}. */
    public static double betaDerivative(double k, double eta, double beta) {
        return evaluate(eta, beta, false).betaDerivative(k);
    }

    /**
     * All four orders of F_k, dF_k/deta and dF_k/dbeta at once (one pass over the nodes), and, if
     * {@code withEntropy}, the entropy integrals S_k as well.
     *
     * @throws InvalidInputException for eta or beta outside the stated domain
     */
    public static FermiDiracValues evaluate(double eta, double beta, boolean withEntropy) {
        if (!(eta >= MIN_ETA && eta <= MAX_ETA)) {
            throw InvalidInputException.of("relativistic Fermi-Dirac argument eta", eta,
                    "in [" + MIN_ETA + ", " + MAX_ETA + "]",
                    eta < MIN_ETA ? "The integrals are then below 1e-304: the gas is classical, use e^eta times the eta -> -inf limit."
                            : "Such a degenerate gas is at T = 0 to double precision: use the zero-temperature formulas.");
        }
        if (!(beta >= 0.0 && beta <= MAX_BETA)) {
            throw InvalidInputException.of("relativistic Fermi-Dirac argument beta = kT/(m c^2)", beta,
                    "in [0, " + MAX_BETA + "]", "");
        }
        if (eta >= SOMMERFELD_FROM) {
            return sommerfeld(eta, beta, withEntropy);
        }
        return quadrature(new Sum(eta, beta, withEntropy, false)).values();
    }

    /**
     * The combination of the number density, N = F_1/2 + beta F_3/2, and its eta-derivatives, as {N, dN/deta,
     * d^2N/deta^2}: the same rule as {@link #evaluate} (so the same {@value #RELATIVE_ACCURACY} relative accuracy for N
     * and dN/deta; d^2N/deta^2 changes sign at the Fermi level and carries that accuracy relative to dN/deta) with only
     * these sums, for equation-of-state solvers (Newton or Halley) that need nothing else per iteration.
     *
     * @throws InvalidInputException for eta or beta outside the stated domain
     */
    public static double[] numberIntegral(double eta, double beta) {
        if (eta >= SOMMERFELD_FROM || !(eta >= MIN_ETA) || !(beta >= 0.0 && beta <= MAX_BETA)) {
            FermiDiracValues v = evaluate(eta, beta, true); // validates; the series is cheap
            return new double[] {v.integral(0.5) + beta * v.integral(1.5), v.etaDerivative(0.5) + beta * v.etaDerivative(1.5),
                v.etaSecondDerivative(0.5) + beta * v.etaSecondDerivative(1.5)};
        }
        Sum sum = quadrature(new Sum(eta, beta, false, true));
        return new double[] {sum.number, sum.numberEta, sum.numberEta2};
    }

    /** The quadrature rule of the class description, eta &lt; {@value #SOMMERFELD_FROM}, into {@code sum}. */
    private static Sum quadrature(Sum sum) {
        double eta = sum.eta;
        double beta = sum.beta;
        double head = eta >= 32.0 + HEAD_MIN ? eta - 32.0 : (eta > -10.0 ? HEAD_MIN : HEAD_MIN_NONDEGENERATE);
        if (head == HEAD_MIN || head == HEAD_MIN_NONDEGENERATE) {
            sum.addHead(HeadNodes.of(head, beta), eta);
        } else {
            addHead(sum, head, beta, eta, false);
        }
        double tLow = head - eta; // offset of the end of the head piece
        for (int c = 1; c < CUTS.length; c++) {
            double a = Math.max(CUTS[c - 1], tLow);
            double b = CUTS[c];
            if (a == CUTS[c - 1]) {
                sum.addFixed(PIECES[c][eta + a >= 8.0 * 0.5 * (b - a) ? 1 : 0], eta);
            } else if (b > a) {
                addPiece(sum, eta, a, b);
            }
        }
        double tailStart = Math.max(tLow, CUTS[CUTS.length - 1]);
        boolean farTail = eta + tailStart >= FAR_TAIL; // g(x) nearly polynomial over the e-folding range
        if (tailStart == CUTS[CUTS.length - 1]) {
            sum.addFixed(TAILS[farTail ? 1 : 0], eta);
            return sum;
        }
        double[] tailNode = farTail ? TAIL_NODE_SHORT : LAGUERRE_NODE;
        double[] tailWeight = farTail ? TAIL_WEIGHT_SHORT : LAGUERRE_WEIGHT;
        for (int i = 0; i < tailNode.length; i++) {
            double t = tailStart + tailNode[i];
            double x = eta + t;
            sum.add(x, tailWeight[i] / Math.sqrt(x), t);
        }
        return sum;
    }

    /** The piece [0, x0] in theta (x = (2/beta) sinh^2 theta) or in u = sqrt(x). */
    private static void addHead(Sum sum, double x0, double beta, double eta, boolean step) {
        if (beta * x0 < U_MAP_BELOW) {
            double half = 0.5 * Math.sqrt(x0);
            for (int i = 0; i < GL_HEAD_NODE.length; i++) {
                double u = half * (1.0 + GL_HEAD_NODE[i]);
                double x = u * u;
                sum.add(x, 2.0 * half * GL_HEAD_WEIGHT[i], step ? Double.NEGATIVE_INFINITY : x - eta);
            }
            return;
        }
        double thetaEnd = org.apache.commons.math3.util.FastMath.asinh(Math.sqrt(0.5 * beta * x0));
        int pieces = (int) Math.ceil(thetaEnd / THETA_PIECE);
        double width = thetaEnd / pieces;
        double scale = 2.0 / beta;
        double jacobian = 2.0 * Math.sqrt(scale); // x^-1/2 dx = 2 sqrt(2/beta) cosh(theta) dtheta
        for (int p = 0; p < pieces; p++) {
            double mid = (p + 0.5) * width;
            double half = 0.5 * width;
            for (int i = 0; i < GL_HEAD_NODE.length; i++) {
                double theta = mid + half * GL_HEAD_NODE[i];
                double sh = sinh(theta);
                double x = scale * sh * sh;
                double ch = Math.sqrt(1.0 + sh * sh);
                sum.add(x, jacobian * ch * half * GL_HEAD_WEIGHT[i], step ? Double.NEGATIVE_INFINITY : x - eta);
            }
        }
    }

    /**
     * eta &gt;= {@value #SOMMERFELD_FROM}: the step-function integrals int_0^eta by the head rule (t = -inf makes the
     * Fermi factor exactly 1 and its derivative 0), plus the Sommerfeld series in the derivatives of the integrand at
     * the Fermi level, whose neglected remainder is of order e^-eta and (2N+1)!/eta^(2N+1) &lt; 1e-17 relative.
     */
    private static FermiDiracValues sommerfeld(double eta, double beta, boolean withEntropy) {
        Sum sum = new Sum(eta, beta, false, false);
        addHead(sum, eta, beta, eta, true);
        double[] f = sum.f.clone();
        double[] dEta = new double[4];
        double[] dBeta = sum.dBeta.clone();
        double[] entropy = new double[4];
        double[] entropyEta = new double[4];
        double[] etaSecond = new double[4];
        double[] entropyEtaSecond = new double[4];
        double s = Math.sqrt(1.0 + 0.5 * beta * eta);
        double b = 0.5 * beta / (1.0 + 0.5 * beta * eta); // (1 + beta x/2) = (1 + beta eta/2)(1 + b t)
        // terms: the neglected one is ~ (2N+1)! / eta^(2N+1) of g, against F ~ g eta: stop below 1e-19
        int terms = 2;
        for (double bound = 120.0 / Math.pow(eta, 5); bound > 1e-19 && terms < SOMMERFELD_TERMS; terms++) {
            bound *= (2.0 * terms + 2) * (2.0 * terms + 3) / (eta * eta);
        }
        int order = 2 * terms + 2; // the second eta-derivatives need g^(2N+1) and g^(2N+2)
        double[] rootSeries = binomialSeries(0.5, b, order);
        double[] inverseRootSeries = binomialSeries(-0.5, b, order);
        double power = 1.0 / Math.sqrt(eta); // eta^k
        for (int index = 0; index < 4; index++) {
            double k = index - 0.5;
            double[] g = derivatives(power * s, binomialSeries(k, 1.0 / eta, order), rootSeries);
            double[] h = derivatives(0.25 * power * eta / s, binomialSeries(k + 1, 1.0 / eta, order), inverseRootSeries);
            dEta[index] = g[0];
            etaSecond[index] = g[1];
            for (int n = 1; n <= terms; n++) {
                double c = 2.0 * ETA_EVEN[n];
                f[index] += c * g[2 * n - 1];
                dEta[index] += c * g[2 * n];
                etaSecond[index] += c * g[2 * n + 1];
                dBeta[index] += c * h[2 * n - 1];
            }
            for (int m = 0; m < terms; m++) {
                double c = 4.0 * (m + 1) * ETA_EVEN[m + 1];
                entropy[index] += c * g[2 * m];
                entropyEta[index] += c * g[2 * m + 1];
                entropyEtaSecond[index] += c * g[2 * m + 2];
            }
            power *= eta;
        }
        return new FermiDiracValues(eta, beta, f, dEta, dBeta, withEntropy ? entropy : null, entropyEta, etaSecond,
                entropyEtaSecond);
    }

    /** Taylor coefficients of (1 + r t)^p in t, orders 0 .. order. */
    private static double[] binomialSeries(double p, double r, int order) {
        double[] c = new double[order + 1];
        c[0] = 1.0;
        for (int j = 0; j < order; j++) {
            c[j + 1] = c[j] * (p - j) * RECIPROCAL[j] * r;
        }
        return c;
    }

    /** value * d^m/dt^m [A(t) B(t)] at t = 0 for m = 0 .. 2N, from the Taylor coefficients of A and B. */
    private static double[] derivatives(double value, double[] a, double[] b) {
        double[] d = new double[a.length];
        double factorial = 1.0;
        for (int m = 0; m < a.length; m++) {
            double c = 0.0;
            for (int i = 0; i <= m; i++) {
                c += a[i] * b[m - i];
            }
            d[m] = value * factorial * c;
            factorial *= m + 1;
        }
        return d;
    }

    /**
     * sinh for theta &gt;= 0 from the (intrinsic, fast) exponential, with the Taylor series below 0.1 where
     * e^theta - e^-theta would cancel; a few ulp.
     */
    static double sinh(double theta) {
        if (theta < 0.1) {
            double t2 = theta * theta;
            return theta * (1.0 + t2 / 6.0 * (1.0 + t2 / 20.0 * (1.0 + t2 / 42.0 * (1.0 + t2 / 72.0 * (1.0 + t2 / 110.0)))));
        }
        double e = Math.exp(theta);
        return 0.5 * (e - 1.0 / e);
    }

    /** ln(1 + e) for 0 &lt;= e &lt;= 1: the intrinsic logarithm above 0.01, the alternating series below; ~1e-14 relative. */
    static double log1p(double e) {
        if (e > 0.01) {
            return Math.log(1.0 + e);
        }
        return e * (1.0 - e * (0.5 - e * (1.0 / 3 - e * (0.25 - e * (0.2 - e * (1.0 / 6 - e / 7))))));
    }

    /**
     * The shorter rule (index into GL_SHORT_*) for a piece [a, b] in t far from the singularities of x^k sqrt(1 + beta x/2)
     * at x &lt;= 0: only the Fermi poles at t = i pi (2m+1) limit the rule, and they are farther (relative to the piece) the
     * farther the piece is from t = 0.
     */
    private static int shortRule(double a, double b) {
        double distance = Math.min(Math.abs(a), Math.abs(b));
        return distance >= 13 ? 0 : (distance >= 7 ? 1 : 2);
    }

    /**
     * The head piece [0, x0] for x0 = 2 or 10 at one beta: the nodes, weights and square roots of {@link #addHead} depend on
     * (x0, beta) alone, and the Fermi factor at a node is e^-|x - eta| = e^(+-x) e^(-+eta), so an evaluation at another eta
     * needs one exponential for the whole piece. The last beta of each x0 is kept (immutable, published through a
     * volatile field: safe across threads; threads alternating between betas only lose the reuse).
     */
    private static final class HeadNodes {
        private static volatile HeadNodes lastDegenerate;
        private static volatile HeadNodes lastClassical;

        final double x0;
        final double beta;
        final double[] x;
        final double[] a;      // weight x^-1/2 sqrt(1 + beta x/2)
        final double[] b;      // weight x^-1/2 / sqrt(1 + beta x/2)
        final double[] number; // weight x^1/2 (1 + beta x) sqrt(1 + beta x/2)
        final double[] up;     // e^x
        final double[] down;   // e^-x

        static HeadNodes of(double x0, double beta) {
            HeadNodes h = x0 == HEAD_MIN ? lastDegenerate : lastClassical;
            if (h != null && h.beta == beta) {
                return h;
            }
            h = new HeadNodes(x0, beta);
            if (x0 == HEAD_MIN) {
                lastDegenerate = h;
            } else {
                lastClassical = h;
            }
            return h;
        }

        private HeadNodes(double x0, double beta) {
            this.x0 = x0;
            this.beta = beta;
            Sum nodes = new Sum(0.0, beta, false, false);
            nodes.collect = true;
            RelativisticFermiDirac.addHead(nodes, x0, beta, 0.0, false);
            int n = nodes.collected;
            x = java.util.Arrays.copyOf(nodes.collectedX, n);
            a = new double[n];
            b = new double[n];
            number = new double[n];
            up = new double[n];
            down = new double[n];
            for (int i = 0; i < n; i++) {
                double root = Math.sqrt(1.0 + 0.5 * beta * x[i]);
                double wr = nodes.collectedWeight[i];
                a[i] = wr * root;
                b[i] = wr / root;
                number[i] = wr * root * x[i] * (1.0 + beta * x[i]);
                up[i] = Math.exp(x[i]);
                down[i] = 1.0 / up[i]; // x <= 10: no overflow, one rounding
            }
        }
    }

    /**
     * Nodes at fixed offsets t = x - eta (a piece between two cuts, or the tail from t = 32): the Fermi factor and the
     * entropy weights depend on t alone, so they are computed once here, with the very expressions of {@link Sum#add}.
     */
    private static final class FixedNodes {
        final double[] t;
        final double[] weight;
        final double[] fermi;
        final double[] hole;
        final double[] hole2;
        final double[] entropy;

        private FixedNodes(int n) {
            t = new double[n];
            weight = new double[n];
            fermi = new double[n];
            hole = new double[n];
            hole2 = new double[n];
            entropy = new double[n];
        }

        private void set(int i, double ti, double wi) {
            t[i] = ti;
            weight[i] = wi;
            double e = Math.exp(-Math.abs(ti));
            double onePlus = 1.0 + e;
            fermi[i] = ti > 0 ? e / onePlus : 1.0 / onePlus;
            hole[i] = e / (onePlus * onePlus);
            hole2[i] = hole[i] * (ti > 0 ? 1.0 - e : e - 1.0) / onePlus;
            entropy[i] = log1p(e) + Math.abs(ti) * e / onePlus;
        }

        static FixedNodes legendre(double mid, double half, double[] node, double[] w) {
            FixedNodes f = new FixedNodes(node.length);
            for (int i = 0; i < node.length; i++) {
                f.set(i, mid + half * node[i], half * w[i]);
            }
            return f;
        }

        static FixedNodes tail(double start, double[] node, double[] w) {
            FixedNodes f = new FixedNodes(node.length);
            for (int i = 0; i < node.length; i++) {
                f.set(i, start + node[i], w[i]);
            }
            return f;
        }
    }

    /** A piece t in [a, b] of t = x - eta, nodes placed in t so that t carries no rounding from eta. */
    private static void addPiece(Sum sum, double eta, double a, double b) {
        double mid = 0.5 * (a + b);
        double half = 0.5 * (b - a);
        double[] node = GL_NODE;
        double[] weight = GL_WEIGHT;
        if (eta + a >= 8.0 * half) {
            int r = shortRule(a, b);
            node = GL_SHORT_NODE[r];
            weight = GL_SHORT_WEIGHT[r];
        }
        for (int i = 0; i < node.length; i++) {
            double t = mid + half * node[i];
            double x = eta + t;
            sum.add(x, half * weight[i] / Math.sqrt(x), t);
        }
    }

    /** Accumulates every family and order; {@code add} takes x, (weight x^-1/2) and t = x - eta. */
    private static final class Sum {
        private final double eta;
        private final double beta;
        private final double halfBeta;
        private final boolean entropy;    // also the second eta-derivatives
        private final boolean numberOnly; // only N = F_1/2 + beta F_3/2 and its first two eta-derivatives
        private final double[] f = new double[4];
        private final double[] dEta = new double[4];
        private final double[] dBeta = new double[4];
        private final double[] s = new double[4];
        private final double[] sEta = new double[4];
        private final double[] d2Eta = new double[4];
        private final double[] s2Eta = new double[4];
        private double number;
        private double numberEta;
        private double numberEta2;
        private boolean collect; // only record the nodes (for HeadNodes)
        private int collected;
        private double[] collectedX;      // allocated in collect mode only
        private double[] collectedWeight;

        Sum(double eta, double beta, boolean entropy, boolean numberOnly) {
            this.numberOnly = numberOnly;
            this.eta = eta;
            this.beta = beta;
            this.halfBeta = 0.5 * beta;
            this.entropy = entropy;
        }

        /**
         * Nodes at fixed t = x - eta, their Fermi factors precomputed; one square root per node, q = sqrt(x (1 + beta x/2)) =
         * x^1/2 sqrt(1 + beta x/2), gives both weight factors.
         */
        void addFixed(FixedNodes nodes, double eta) {
            double[] t = nodes.t;
            double[] weight = nodes.weight;
            if (numberOnly) {
                double[] fermi = nodes.fermi;
                double[] hole = nodes.hole;
                double[] hole2 = nodes.hole2;
                for (int i = 0; i < t.length; i++) {
                    double x = eta + t[i];
                    double onePlus = 1.0 + halfBeta * x;
                    double w = weight[i] * Math.sqrt(x * onePlus) * (onePlus + halfBeta * x); // x^1/2 (1 + beta x) sqrt(1 + beta x/2)
                    number += w * fermi[i];
                    numberEta += w * hole[i];
                    numberEta2 += w * hole2[i];
                }
                return;
            }
            for (int i = 0; i < t.length; i++) {
                double x = eta + t[i];
                double onePlus = 1.0 + halfBeta * x;
                double inverse = weight[i] / Math.sqrt(x * onePlus);
                accumulate(x, inverse * onePlus, inverse, t[i], nodes.fermi[i], nodes.hole[i], nodes.hole2[i], nodes.entropy[i]);
            }
        }

        /** The head piece from its cached nodes: e^-|t| from e^(+-x) and one exponential of eta. */
        void addHead(HeadNodes head, double eta) {
            double up = Math.exp(eta);
            double down = 1.0 / up;
            double[] x = head.x;
            for (int i = 0; i < x.length; i++) {
                double t = x[i] - eta;
                double e = t > 0 ? head.down[i] * up : head.up[i] * down; // e^-|t|
                double onePlus = 1.0 + e;
                double fermi = t > 0 ? e / onePlus : 1.0 / onePlus;
                double fermiHole = e / (onePlus * onePlus);
                double hole2 = fermiHole * (t > 0 ? 1.0 - e : e - 1.0) / onePlus;
                if (numberOnly) {
                    double w = head.number[i];
                    number += w * fermi;
                    numberEta += w * fermiHole;
                    numberEta2 += w * hole2;
                } else {
                    accumulate(x[i], head.a[i], head.b[i], t, fermi, fermiHole, hole2,
                            entropy ? log1p(e) + Math.abs(t) * e / onePlus : 0.0);
                }
            }
        }

        /** A node x of weight {@code weightOverRoot} (the weight times x^-1/2), t = x - eta. */
        void add(double x, double weightOverRoot, double t) {
            if (collect) {
                if (collectedX == null) {
                    collectedX = new double[20];
                    collectedWeight = new double[20];
                } else if (collected == collectedX.length) {
                    collectedX = java.util.Arrays.copyOf(collectedX, 2 * collected);
                    collectedWeight = java.util.Arrays.copyOf(collectedWeight, 2 * collected);
                }
                collectedX[collected] = x;
                collectedWeight[collected++] = weightOverRoot;
                return;
            }
            double e = Math.exp(-Math.abs(t));        // e^-|t|, no overflow
            double onePlus = 1.0 + e;
            double fermi = t > 0 ? e / onePlus : 1.0 / onePlus;
            double fermiHole = e / (onePlus * onePlus); // f (1 - f)
            double hole2 = fermiHole * (t > 0 ? 1.0 - e : e - 1.0) / onePlus; // f (1 - f) (1 - 2 f)
            double root = Math.sqrt(1.0 + halfBeta * x);
            if (numberOnly) {
                double w = weightOverRoot * root * x * (1.0 + beta * x);
                number += w * fermi;
                numberEta += w * fermiHole;
                numberEta2 += w * hole2;
                return;
            }
            accumulate(x, weightOverRoot * root, weightOverRoot / root, t, fermi, fermiHole, hole2,
                    entropy ? log1p(e) + Math.abs(t) * e / onePlus : 0.0);
        }

        /**
         * One node: x, a = weight x^-1/2 sqrt(1 + beta x/2), b = weight x^-1/2 / sqrt(1 + beta x/2), t, f, f (1 - f),
         * f (1 - f) (1 - 2f) and the entropy of the state, -f ln f - (1 - f) ln(1 - f).
         */
        private void accumulate(double x, double a, double b, double t, double fermi, double fermiHole, double hole2,
                                double stateEntropy) {
            double wF = a * fermi;
            double wE = a * fermiHole;
            double wB = 0.25 * b * x * fermi;
            double power = 1.0; // x^(k + 1/2)
            if (!entropy) {
                for (int k = 0; k < 4; k++) {
                    f[k] += wF * power;
                    dEta[k] += wE * power;
                    dBeta[k] += wB * power;
                    power *= x;
                }
                return;
            }
            double wS = a * stateEntropy;
            double wSE = t * wE; // t finite whenever the entropy is summed
            double wE2 = a * hole2;
            double wS2 = t * wE2 - wE;
            for (int k = 0; k < 4; k++) {
                f[k] += wF * power;
                dEta[k] += wE * power;
                dBeta[k] += wB * power;
                s[k] += wS * power;
                sEta[k] += wSE * power;
                d2Eta[k] += wE2 * power;
                s2Eta[k] += wS2 * power;
                power *= x;
            }
        }

        FermiDiracValues values() {
            return new FermiDiracValues(eta, beta, f, dEta, dBeta, entropy ? s : null, sEta, d2Eta, s2Eta);
        }
    }
}
