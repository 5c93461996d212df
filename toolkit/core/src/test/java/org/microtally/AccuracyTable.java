package org.microtally;

import java.io.IOException;
import java.math.BigDecimal;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.microtally.count.Multinomial;
import org.microtally.ensemble.AngularMomentumProjection;
import org.microtally.ensemble.Canonical;
import org.microtally.ensemble.CanonicalSweep;
import org.microtally.ensemble.Cutoffs;
import org.microtally.ensemble.GroundLevelComparison;
import org.microtally.ensemble.LabelResolvedGrandCanonical;
import org.microtally.ensemble.Microcanonical;
import org.microtally.ensemble.ExactCanonical;
import org.microtally.limit.BoseGas;
import org.microtally.limit.FermiGas;
import org.microtally.limit.MaxwellBoltzmannGas;
import org.microtally.occupation.ChemicalPotential;
import org.microtally.special.FermiDirac;
import org.microtally.special.Polylog;
import org.microtally.special.RelativisticFermiDirac;
import org.microtally.special.Zeta;
import org.microtally.structure.LaneEmden;
import org.microtally.structure.NeutronStar;
import org.microtally.structure.WhiteDwarf;

/**
 * The README's "Methods and accuracy" table, generated: every figure in the accuracy column is
 * formatted from the public constant that the class's Javadoc quotes ({@code {@value}}) and that a
 * test measures ({@link MeasuredAccuracy}), so the three cannot disagree. {@code AccuracyTableTest}
 * fails when README.md's section between {@value #BEGIN} and {@value #END} differs from
 * {@link #markdown()}.
 *
 * <p>To change a row, edit it here, then from the repository root:
 * <pre>{@value #REGENERATE}</pre>
 */
public final class AccuracyTable {
    /** The marker line before the table in README.md. */
    public static final String BEGIN = "<!-- accuracy:begin -->";
    /** The marker line after the table in README.md. */
    public static final String END = "<!-- accuracy:end -->";
    /** The command that rewrites README.md's table, run from the repository root. */
    public static final String REGENERATE = "mvn -B -q -pl toolkit/core test-compile && java -cp "
            + "toolkit/core/target/classes:toolkit/core/target/test-classes org.microtally.AccuracyTable README.md";

    /** How a figure that is a measured maximum is described. */
    private static final String MEASURED = "the worst error measured over committed mpmath tables, rounded up";

    private AccuracyTable() {
    }

    /** One table row: the routine, its method with published sources, and its accuracy. */
    record Row(String routine, String method, String accuracy) {
    }

    private static Row row(String routine, String method, String accuracy) {
        return new Row(routine, method, accuracy);
    }

    /** A stated figure as the README prints it: 5e-16, 1.6e-15, 0.3. */
    static String figure(double value) {
        String s = new BigDecimal(Double.toString(value)).stripTrailingZeros().toString();
        return s.replace("E", "e").replace("e+", "e");
    }

    /** The rows, in README order. */
    static List<Row> rows() {
        return List.of(
            row("`CountTable` Omega(n, e)",
                    "degeneracy-grouped generating functions, one truncated binomial series per level; modulo primes between 2^49 and 2^50 held in doubles, (t + c x) mod p by an exact FMA product and remainder (van der Hoeven, Lecerf & Quintin, ACM TOMS 43 (2016)), or primes below 2^62 with Shoup's method where the processor has no fused multiply-add; recombined by Garner's method row by row on first read; number of primes from a proven saddle-point bound (Flajolet & Sedgewick, *Analytic Combinatorics*, ch. VIII) minimised by projected Newton steps",
                    "exact"),
            row("`ExactLog`, `CountTable.lnCount`",
                    "from the exact integer by bit-length shift",
                    "within 2 ulp at any size"),
            row("`LabelledCountTable`, `SpeciesMix`",
                    "trivariate generating function; 2D convolution in BigInteger; row n complete through floor(C) + lowest energy of n - 1 particles, beyond refused",
                    "exact"),
            row("`ShellDimensions`",
                    "exact counting by 2M (SpeciesMix), D(J) = D(M=J) - D(M=J+1)",
                    "exact"),
            row("`SingleNumberCounts`",
                    "labelled: p_k = (1/(k a_0)) sum ((N+1)i - k) a_i p_{k-i} for Z_1^N (J. C. P. Miller; Knuth TAOCP vol. 2, 4.7), exact division checked; indistinguishable: the CountTable level recursion modulo one 31-bit prime at a time, row N rebuilt by Chinese remaindering, prime count from the bound C(S_E+N-1, N)",
                    "exact"),
            row("`BinnedCounts`",
                    "levels rounded to the grid, exact counts, rows convolved",
                    "exact counts; energies within the stated smearing N x max rounding <= N delta/2"),
            row("`LevelDensityFit`",
                    "back-shifted Bethe state density (Bethe, PR 50, 332 (1936); Dilg et al., NPA 217, 269 (1973)) by Levenberg-Marquardt (More 1978; Commons Math)",
                    "a description: rms residual reported; a matches pi^2 g/6 on the two-kind Fermi-gas test"),
            row("`MicrostateEnumerator`",
                    "depth-first enumeration, lazy, capped at 10^7 by default",
                    "exact (the independent cross-check)"),
            row("`Multinomial` logs",
                    "exact rearrangement into non-negative terms plus the Stirling remainder (DLMF 5.11.1)",
                    "<= " + figure(Multinomial.MAX_ERROR) + " relative to max(1, abs ln) for every input (`Multinomial.MAX_ERROR`: a "
                            + "bound; measured on exact logarithms and Stirling closed forms up to N ~ 1e27)"),
            row("`SharedTotal` mean and width",
                    "exact rational moments, rounded once",
                    "a few ulp"),
            row("`Canonical` Z_N",
                    "positive-term elementary / complete symmetric-polynomial products level by level, Boltzmann factors scaled by the grand canonical mu, one shared power-of-two exponent",
                    "<= (S+N) 2^-53 relative worst case; U within " + figure(Canonical.MEASURED_ENERGY_ERROR)
                            + " relative on a 60-digit mpmath table (`Canonical.MEASURED_ENERGY_ERROR`: " + MEASURED + ")"),
            row("`Canonical` <n_i>, holes",
                    "Bose: sum of y^j Z_{N-j}/Z_N; Fermi/Gentile: prefix x suffix series (no deflation)",
                    "same relative bound, holes included"),
            row("`Canonical` C_V, Var E",
                    "energy moments through the same products, measured from the ground states' top shell in particle-hole form (non-negative terms); checked against U from occupations and a forward-difference dU/dT, disagreement warned",
                    "~(S+N) 2^-53 (1 + <X>^2/Var X) relative, X the excitation energy; Var E within "
                            + figure(Canonical.MEASURED_VARIANCE_ERROR) + " relative on the same table (`Canonical.MEASURED_VARIANCE_ERROR`)"),
            row("`Canonical` large levels",
                    "a level of many states (g > 8(N+1) Bose, 3(N+1) Fermi, a cost model for Gentile) as one closed-form factor: binomial / negative binomial series, binary powering for Gentile",
                    "about 3 N 2^-53 relative per level; cost independent of g"),
            row("`Canonical` T -> 0, kT < 0",
                    "exact ground-state limit where the lowest excitation > 700 kT; kT < 0 via Z_N(beta; e) = Z_N(-beta; -e) on bounded spectra",
                    "limit exact to double precision; as at kT > 0"),
            row("cutoff effect (`warnings()`, `Cutoffs`)",
                    "geometric extrapolation of the top two level occupations; effect stated on N, U, S, <N_0>, C_V; warned above "
                            + figure(Cutoffs.DEFAULT_TOLERANCE) + " (`Cutoffs.DEFAULT_TOLERANCE`)",
                    "an estimate: within " + Math.round(100 * Cutoffs.ESTIMATE_RELATIVE_ERROR) + "% of the actual change in the tests "
                            + "(`Cutoffs.ESTIMATE_RELATIVE_ERROR`)"),
            row("`AlternatingRecursion`",
                    "Borrmann & Franke, J. Chem. Phys. 98, 2484 (1993); for comparison only",
                    "loses all digits for fermions at low T (shown in a test)"),
            row("`GrandCanonical`",
                    "closed-form one-state laws (expm1/log1p branches); S from one-state entropies in particle-hole symmetric form, C as a weighted variance of e - mu (non-negative terms)",
                    "a few ulp per term; no cancellation at low T"),
            row("`CanonicalMixture`, `GrandCanonicalMixture`",
                    "Z = prod Z_a of independent species (factorisation); one Canonical / GrandCanonical per species, identical species shared, distinct ones in parallel",
                    "as Canonical / GrandCanonical, one rounding per species in the totals"),
            row("`CanonicalSweep` ln Z_n, U_n, mu_n, addition energies",
                    "the Canonical generating product read at every n; extra passes at lower mu* until every n meets the flushing bound S(N+1)2^-1073/P_GC(n) <= " + figure(CanonicalSweep.FLUSH_TOLERANCE) + " (`CanonicalSweep.FLUSH_TOLERANCE`); odd-even staggering (Satula, Dobaczewski & Nazarewicz, PRL 81, 3599 (1998))",
                    "ln Z_n absolute <= (S+n)2^-53 + " + figure(CanonicalSweep.FLUSH_TOLERANCE) + "; mu_n, Delta_n absolute ~2-4 kT times that"),
            row("`LabelledCanonical`, `LabelResolvedGrandCanonical`",
                    "positive-term series in particle number and label (symmetric-polynomial recurrences with a label exponent), fugacity-scaled; exact bit-set reachability for empty vs flushed labels",
                    "Z(L) relative <= (S+N)2^-53; labels with flushing bound > 1e-12 refused"),
            row("`LabelledGrandCanonical`",
                    "independent states at e - h m - mu",
                    "a few ulp per term"),
            row("`FixedLabelOccupations`",
                    "P(n_s = j at fixed L) from the fixed-label series rebuilt without state s (no deflation)",
                    "2(S+N)2^-53 relative + 1e-12 absolute"),
            row("`LabelResolvedGrandCanonical` (bosons)",
                    "particle numbers summed to n_max from a Chernoff bound e^{K - theta(n_max+1)} <= e^-60",
                    "labels refused where the tail exceeds " + figure(LabelResolvedGrandCanonical.FLUSH_TOLERANCE) + " of P(L) (`LabelResolvedGrandCanonical.FLUSH_TOLERANCE`)"),
            row("`AngularMomentumProjection`",
                    "Z(J) = Z(M=J) - Z(M=J+1) (de-Shalit & Talmi)",
                    "Z(M) accuracy x the stated cancellation factor; refused above " + figure(AngularMomentumProjection.MAX_CANCELLATION) + " (`AngularMomentumProjection.MAX_CANCELLATION`)"),
            row("`ChemicalPotential`",
                    "Brent (order 5) on a bracket valid by construction; bosons solved in ln(beta(e0 - mu))",
                    "<N> within " + figure(ChemicalPotential.MEAN_NUMBER_ERROR) + " relative on an mpmath table of roots up to 5,000 "
                            + "states (`ChemicalPotential.MEAN_NUMBER_ERROR`: " + MEASURED + "); the stopping noise grows like "
                            + "sqrt(terms)"),
            row("`Microcanonical`",
                    "exact counts; central differences on the integer grid; exact integer deflation for occupations",
                    "counts exact, logs within 2 ulp"),
            row("`Microcanonical` beta_B, beta_G, C",
                    "central differences formed from exact integer ratios (log1p of a correctly rounded ratio)",
                    "a few ulp relative, also for beta_G ~ 1e-36; C flagged where steps d and 2d disagree by > " + Math.round(100 * Microcanonical.HEAT_CAPACITY_STEP_AGREEMENT) + "%"),
            row("`MicrocanonicalLevelNumber`",
                    "Omega_l(j) = w_j Omega'(N-j, E-j e_l), Omega' the exact counts without level l",
                    "exact (BigFraction), doubles correctly rounded"),
            row("`GroundLevelComparison`",
                    "kT from U(kT) = E by Brent in ln kT (Brent 1973)",
                    "kT bracketed to " + figure(GroundLevelComparison.LN_KT_TOLERANCE) + " in ln kT (`GroundLevelComparison.LN_KT_TOLERANCE`), "
                            + "the root of U(kT) as accurate as Canonical's U"),
            row("`Zeta.zeta(s)`, s > 1",
                    "eta(s)/(1 - 2^(1-s)) by Borwein's algorithm with 24 terms (CMS Conf. Proc. 27, 2000); direct sum for s >= 16; powers k^-s from one exponential per prime",
                    "<= " + figure(Zeta.MAX_RELATIVE_ERROR) + " relative (`Zeta.MAX_RELATIVE_ERROR`: " + MEASURED + ")"),
            row("`Polylog.li(s, z)`",
                    "power series (DLMF 25.12.10); Wood's series in ln z about 1 (Wood 1992; DLMF 25.12.12); Taylor series about -1; via Fermi-Dirac for z < -e",
                    "<= " + figure(Polylog.MAX_RELATIVE_ERROR) + " relative for -2 <= s <= 30 (`Polylog.MAX_RELATIVE_ERROR`: " + MEASURED + ")"),
            row("`FermiDirac.integral(j, eta)`",
                    "alternating series in e^eta; Taylor about 0; tanh-sinh quadrature (Takahasi & Mori 1974) read through degree-16 Chebyshev interpolants per unit interval (Trefethen, ATAP; barycentric formula, Berrut & Trefethen 2004); Sommerfeld / inversion series for large eta (Dingle 1957; Blakemore 1982)",
                    "<= " + figure(FermiDirac.MAX_RELATIVE_ERROR) + " relative for -1 < j <= 20, all eta (`FermiDirac.MAX_RELATIVE_ERROR`: "
                            + MEASURED + ")"),
            row("`RelativisticFermiDirac` F_k(eta, beta), dF/deta, dF/dbeta, S_k, k = -1/2..5/2",
                    "splitting at the Fermi level (Gong, Zejda, Dappen & Aparicio, CPC 136, 294 (2001); Aparicio, ApJS 117, 627 (1998)); Gauss-Legendre in theta (x = (2/beta) sinh^2 theta) and on pieces about eta, Gauss-Laguerre tail (Golub & Welsch 1969); for eta >= 50 the Sommerfeld series (remainder < 1e-19)",
                    "<= " + figure(RelativisticFermiDirac.RELATIVE_ACCURACY) + " relative for eta in [-700, 1e12], beta in [0, 1e6] "
                            + "(`RelativisticFermiDirac.RELATIVE_ACCURACY`: a bound, checked on every row of a 20-digit mpmath "
                            + "table that reaches eta 1e6, beta 2000)"),
            row("`BoseGas`, `FermiGas`",
                    "power-law density-of-states formulas (Bagnato, Pritchard & Kleppner, PRA 35, 4354 (1987)); Brent on a proven bracket",
                    "Bose fugacity, U/N, C within " + figure(BoseGas.MAX_RELATIVE_ERROR) + " relative; Fermi U/N within "
                            + figure(FermiGas.MAX_RELATIVE_ERROR) + ", C within " + figure(FermiGas.MAX_HEAT_CAPACITY_ERROR)
                            + " relative, mu within " + figure(FermiGas.MAX_CHEMICAL_POTENTIAL_ERROR)
                            + " x max(abs mu, kT) (`BoseGas.MAX_RELATIVE_ERROR`, `FermiGas.MAX_RELATIVE_ERROR`, `MAX_HEAT_CAPACITY_ERROR`, "
                            + "`MAX_CHEMICAL_POTENTIAL_ERROR`: " + MEASURED + ")"),
            row("`MaxwellBoltzmannGas`",
                    "closed forms (series for small x in the cdf)",
                    "a few ulp; speed and energy cdf within " + figure(MaxwellBoltzmannGas.MAX_CDF_ABSOLUTE_ERROR)
                            + " absolute (`MaxwellBoltzmannGas.MAX_CDF_ABSOLUTE_ERROR`: " + MEASURED + ")"),
            row("`ColdFermiGas`",
                    "Chandrasekhar's closed forms (MNRAS 95, 207 (1935)); binomial series for x < 0.5",
                    "a few ulp"),
            row("`RelativisticFermiGas`",
                    "Timmes & Arnett, ApJS 125, 277 (1999) ideal electron-positron formulas; entropy from the positive entropy integral; Newton on ln n from a Sommerfeld / Maxwell-Boltzmann start",
                    "each integral within " + figure(RelativisticFermiDirac.RELATIVE_ACCURACY) + " relative, and n, P, U (checked "
                            + "against the T = 0 closed forms); eta loses digits where pairs outnumber net electrons 1000-fold: flagged"),
            row("`LaneEmden`",
                    "series to xi = 1e-3, Dormand-Prince 8(5,3) (Hairer, Norsett & Wanner 1993) at 1e-13, surface as event root",
                    "<= " + figure(LaneEmden.RELATIVE_ACCURACY) + " relative (`LaneEmden.RELATIVE_ACCURACY`: a bound; closed forms n = 0, 1; refinement)"),
            row("`WhiteDwarf`, `NeutronStar`",
                    "hydrostatic / TOV (Oppenheimer & Volkoff 1939) in the Fermi-energy variable, DP853 at 1e-12, surface (E_F = rest energy) as event root; maximum mass by Brent",
                    "<= " + figure(WhiteDwarf.RELATIVE_ACCURACY) + " / " + figure(NeutronStar.RELATIVE_ACCURACY)
                            + " relative (`RELATIVE_ACCURACY` constants: bounds, checked by refinement against tolerance 3e-15)"),
            row("lattice g(E), g(E, M), Potts g(E), hard-core g(n) (`TransferMatrix`)",
                    "site-by-site frontier transfer matrix, modular additions over floor(N log2 q/61)+1 primes in (2^61, 2^62), Garner CRT; checked sum = q^N; rows summed with one index (`RowSum`, vectorised by C2), three vectors (two state vectors and a term vector)",
                    "exact"),
            row("periodic square Ising g(E) (`Kaufman`)",
                    "Kaufman (1949) in Beale's (1996) form, as an integer polynomial evaluated at NTT points modulo primes = 1 mod lcm(2n, S), CRT; the unpaired k = 0 and k = n factors written as polynomials so odd sides work; checked sum = 2^N",
                    "exact (any L x M torus, L, M >= 3; antiferromagnet: both sides even)"),
            row("lattice brute force",
                    "q-ary reflected Gray code (Knuth 7.2.1.1 H), one site per step",
                    "exact, <= 2^30 configurations"),
            row("`ExactCanonical` ln Z, U, C, S, F from exact g(E)",
                    "log-sum-exp over ln g (2 ulp), central moments in a second pass",
                    "~ (levels) x 2^-53 relative"),
            row("`ExactCanonical` C peak",
                    "400-point scan, Brent root of dC/dbeta = beta(2k2 - beta k3)",
                    "within " + figure(ExactCanonical.PEAK_LOCATION_ERROR) + " relative in kT on Ising rings of 4-32 spins "
                            + "(`ExactCanonical.PEAK_LOCATION_ERROR`: " + MEASURED + "); more energies, more rounding"),
            row("<abs M>, <M^2>, chi, Binder U_4",
                    "from g(E, M), same weights",
                    "~ (entries) x 2^-53 relative"),
            row("`FisherZeros`",
                    "Aberth-Ehrlich (double) then BigDecimal Newton/Aberth at digits+20, inclusion radius n abs(p/p')",
                    "requested digits, guaranteed (disjoint discs)"),
            row("`DistributedCountTable`",
                    "CountTable's multi-modular recursion, the required primes dealt to one Spark task per worker thread (one task per prime when there are as many threads); Garner CRT on the driver (Knuth TAOCP 2, 4.3.2); one redundant prime, computed on the driver while the tasks run, checks every entry",
                    "exact; entry-by-entry identical to `CountTable` (tested); a corrupted residue is refused (tested)"),
            row("`Sweep`",
                    "one `Canonical` / `GrandCanonical` run per grid point in Spark tasks",
                    "as those classes; refused points are rows with nulls and the refusal in `warnings`"),
            row("`PrefixEnumeration`",
                    "depth-first enumeration of occupation vectors, split by prefix, histograms added exactly",
                    "exact (integer counting); cost ~ number of microstates, cap 10^8")
        );
    }

    /** The table in Markdown, header and rows, one line each, ending with a newline. */
    public static String markdown() {
        StringBuilder out = new StringBuilder("| routine | method (source) | accuracy |\n|---|---|---|\n");
        for (Row r : rows()) {
            out.append("| ").append(r.routine()).append(" | ").append(r.method()).append(" | ")
                    .append(r.accuracy()).append(" |\n");
        }
        return out.toString();
    }

    /** The text between the markers (exclusive) of a README, or null if either marker is missing. */
    static String section(String readme) {
        int begin = readme.indexOf(BEGIN + "\n");
        int end = readme.indexOf(END, Math.max(begin, 0));
        if (begin < 0 || end < 0) {
            return null;
        }
        return readme.substring(begin + BEGIN.length() + 1, end);
    }

    /** The README with its section replaced by {@link #markdown()}. */
    static String regenerated(String readme) {
        String old = section(readme);
        if (old == null) {
            throw new IllegalArgumentException("README has no " + BEGIN + " ... " + END + " section");
        }
        int begin = readme.indexOf(BEGIN + "\n") + BEGIN.length() + 1;
        return readme.substring(0, begin) + markdown() + readme.substring(begin + old.length());
    }

    /** Rewrites the table in the README given as the only argument (default README.md). */
    public static void main(String[] args) throws IOException {
        Path readme = Path.of(args.length > 0 ? args[0] : "README.md");
        String text = Files.readString(readme, StandardCharsets.UTF_8);
        String updated = regenerated(text);
        if (!updated.equals(text)) {
            Files.writeString(readme, updated, StandardCharsets.UTF_8);
            System.out.println("rewrote the accuracy table in " + readme);
        } else {
            System.out.println("the accuracy table in " + readme + " is current");
        }
    }
}
