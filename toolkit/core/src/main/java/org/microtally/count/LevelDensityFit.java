package org.microtally.count;

import java.util.ArrayList;
import java.util.List;
import org.apache.commons.math3.fitting.leastsquares.LeastSquaresBuilder;
import org.apache.commons.math3.fitting.leastsquares.LeastSquaresOptimizer;
import org.apache.commons.math3.fitting.leastsquares.LevenbergMarquardtOptimizer;
import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.ArrayRealVector;
import org.apache.commons.math3.linear.RealMatrix;
import org.apache.commons.math3.linear.RealVector;
import org.apache.commons.math3.util.Pair;
import org.microtally.InvalidInputException;
import org.microtally.Tabular;

/**
 * A fit of the back-shifted Fermi-gas state density to exact binned counts: the parameters a (level
 * density parameter) and Delta (back shift) of
 * <pre>
 *   omega(E) = sqrt(pi) / 12 * exp(2 sqrt(a U)) / (a^(1/4) U^(5/4)),   U = E - E_gs - Delta,
 * </pre>
 * the Bethe state density of a two-kind (proton-neutron) Fermi gas at fixed particle numbers
 * (H. A. Bethe, Phys. Rev. 50, 332 (1936); T. Ericson, Adv. Phys. 9, 425 (1960)) with the
 * excitation energy shifted by Delta (the back-shifted Fermi gas: W. Dilg, W. Schantl, H. Vonach and
 * M. Uhl, Nucl. Phys. A217, 269 (1973)); all from memory. For equally spaced single-particle levels
 * of total density g (both kinds), a = pi^2 g / 6. {@link #fit} fits a and Delta (back-shifted Fermi
 * gas); {@link #fitBethe} fits a alone with Delta = 0 (the Bethe formula). Immutable.
 *
 * <p><b>Method.</b> Least squares on the logarithm, sum over non-empty bins K in the window of
 * (ln omega(E_K) - ln(Omega_K / delta))^2, by Levenberg-Marquardt (J. J. More, Lecture Notes in
 * Mathematics 630 (1978); the Commons Math 3.6.1 implementation) with the analytic Jacobian, started
 * at Delta = 0 and a from the slope of ln omega against 2 sqrt(U) between the window's ends. E_gs is the energy of the lowest non-empty bin.
 *
 * <p><b>Accuracy and limits.</b> The fit is a description, not a derivation: the formula is the
 * saddle-point asymptote of a Fermi gas, so a and Delta depend on the window (the residual rms is
 * reported) and on the bin width through the stated smearing of {@link BinnedCounts}. The formula
 * counts states (all M); for levels of given J multiply by the spin distribution. It knows nothing
 * of pairing, shell effects or collective enhancement beyond what Delta absorbs.
 */
public final class LevelDensityFit implements Tabular {
    private final double a;
    private final double delta;
    private final double groundEnergy;
    private final double rms;
    private final int points;

    private LevelDensityFit(double a, double delta, double groundEnergy, double rms, int points) {
        this.a = a;
        this.delta = delta;
        this.groundEnergy = groundEnergy;
        this.rms = rms;
        this.points = points;
    }

    /** ln omega at excitation energy above the ground, for given a and Delta (U = x - Delta must be &gt; 0). */
    public static double lnStateDensity(double a, double delta, double excitation) {
        double u = excitation - delta;
        if (!(a > 0) || !(u > 0) || !Double.isFinite(a) || !Double.isFinite(u)) {
            throw InvalidInputException.of("(a, U = E - Delta)", "(" + a + ", " + u + ")", "a > 0 and U > 0", "");
        }
        return Math.log(Math.sqrt(Math.PI) / 12) + 2 * Math.sqrt(a * u) - 0.25 * Math.log(a) - 1.25 * Math.log(u);
    }

    /**
     * Fits a and Delta to the bins {@code fromBin..toBin} of {@code counts}.
     *
     * @throws InvalidInputException for a window outside the table, fewer than 3 non-empty bins, a
     *                               window beyond the cutoff-complete bins, or a fit that does not converge
     */
    public static LevelDensityFit fit(BinnedCounts counts, int fromBin, int toBin) {
        return fit(counts, fromBin, toBin, true);
    }

    /**
     * The plain Bethe formula (Delta = 0, a fitted alone) on bins {@code fromBin..toBin}; refusals as
     * for {@link #fit(BinnedCounts, int, int)}.
     */
    public static LevelDensityFit fitBethe(BinnedCounts counts, int fromBin, int toBin) {
        return fit(counts, fromBin, toBin, false);
    }

    private static LevelDensityFit fit(BinnedCounts counts, int fromBin, int toBin, boolean withShift) {
        if (fromBin < 0 || toBin > counts.bins() || fromBin >= toBin) {
            throw InvalidInputException.of("fit window", "[" + fromBin + ", " + toBin + "]",
                    "within [0, " + counts.bins() + "] with from < to", "");
        }
        if (toBin > counts.completeThroughBin()) {
            throw InvalidInputException.of("upper end of the fit window", toBin,
                    "at most the last cutoff-complete bin " + counts.completeThroughBin(), "Raise the spectra's cutoffs.");
        }
        int gs = 0;
        while (gs <= counts.bins() && counts.count(gs).signum() == 0) {
            gs++;
        }
        double eGs = counts.energy(gs);
        List<double[]> data = new ArrayList<>();
        for (int k = Math.max(fromBin, gs + 1); k <= toBin; k++) {
            if (counts.count(k).signum() > 0) {
                data.add(new double[] {counts.energy(k) - eGs, counts.lnDensity(k)});
            }
        }
        if (data.size() < 3) {
            throw InvalidInputException.of("non-empty bins in the fit window", data.size(), ">= 3", "Widen the window.");
        }
        double xMin = data.get(0)[0];
        double[] x = new double[data.size()];
        double[] y = new double[data.size()];
        for (int i = 0; i < x.length; i++) {
            x[i] = data.get(i)[0];
            y[i] = data.get(i)[1];
        }
        // start: Delta = 0 and a from the slope of ln omega ~ 2 sqrt(a U) between the window ends
        double slope = (y[y.length - 1] - y[0]) / (2 * (Math.sqrt(x[x.length - 1]) - Math.sqrt(x[0])));
        double a0 = Math.max(1e-6, slope * slope);
        LeastSquaresOptimizer.Optimum opt;
        try {
            opt = new LevenbergMarquardtOptimizer().optimize(new LeastSquaresBuilder()
                    .start(withShift ? new double[] {a0, 0.0} : new double[] {a0})
                    .model(p -> model(p, x, xMin, withShift))
                    .target(y)
                    .maxEvaluations(1000)
                    .maxIterations(1000)
                    .build());
        } catch (RuntimeException e) {
            throw new InvalidInputException("level-density fit did not converge on bins [" + fromBin + ", " + toBin
                    + "]: " + e.getMessage() + ". Choose a window well above the ground state.");
        }
        RealVector p = opt.getPoint();
        double shift = withShift ? p.getEntry(1) : 0.0;
        if (!(p.getEntry(0) > 1e-9) || !(shift < xMin - 1e-6)) {
            throw new InvalidInputException("level-density fit on bins [" + fromBin + ", " + toBin + "] ran to the edge "
                    + "of its domain (a = " + p.getEntry(0) + ", Delta = " + shift + ", lowest excitation "
                    + xMin + "): the counts do not follow the formula there. Choose a window well above the ground state.");
        }
        return new LevelDensityFit(p.getEntry(0), shift, eGs, opt.getRMS(), x.length);
    }

    /** Model values and Jacobian; parameters are kept in the domain a &gt; 0, Delta &lt; smallest x. */
    private static Pair<RealVector, RealMatrix> model(RealVector p, double[] x, double xMin, boolean withShift) {
        double a = Math.max(1e-12, p.getEntry(0));
        double d = withShift ? Math.min(p.getEntry(1), xMin - 1e-9) : 0.0;
        double[] v = new double[x.length];
        double[][] j = new double[x.length][withShift ? 2 : 1];
        for (int i = 0; i < x.length; i++) {
            double u = x[i] - d;
            v[i] = lnStateDensity(a, d, x[i]);
            j[i][0] = Math.sqrt(u / a) - 0.25 / a;
            if (withShift) {
                j[i][1] = -Math.sqrt(a / u) + 1.25 / u;
            }
        }
        return new Pair<>(new ArrayRealVector(v, false), new Array2DRowRealMatrix(j, false));
    }

    /** The level density parameter a (per unit energy). */
    public double a() {
        return a;
    }

    /** The back shift Delta (energy unit of the counts). */
    public double backShift() {
        return delta;
    }

    /** The ground-state energy E_gs used (the lowest non-empty bin). */
    public double groundEnergy() {
        return groundEnergy;
    }

    /** Root-mean-square residual in ln omega over the fitted bins. */
    public double rmsResidual() {
        return rms;
    }

    /** Number of bins fitted. */
    public int points() {
        return points;
    }

    /** The fitted state density at total energy E (refused where E - E_gs - Delta &lt;= 0). */
    public double lnStateDensityAt(double energy) {
        return lnStateDensity(a, delta, energy - groundEnergy);
    }

    @Override
    public List<String> columnNames() {
        return List.of("quantity", "value");
    }

    @Override
    public List<List<Object>> rows() {
        return List.of(List.of("a", a), List.of("Delta", delta), List.of("E_gs", groundEnergy),
                List.of("rms residual in ln omega", rms), List.of("bins fitted", points));
    }

    @Override
    public String toString() {
        return "LevelDensityFit[a=" + a + ", Delta=" + delta + ", rms=" + rms + ", " + points + " bins]";
    }
}
