package org.microtally.limit;

import java.util.Random;
import org.apache.commons.math3.special.Erf;
import org.microtally.Inputs;
import org.microtally.InvalidInputException;
import org.microtally.units.Codata2018;
import org.microtally.units.Energy;
import org.microtally.units.EnergyUnit;

/**
 * The classical ideal gas in three dimensions: the Maxwell-Boltzmann distributions of speed and of
 * kinetic energy of particles of mass m at temperature T (J. C. Maxwell, Phil. Mag. 19, 19 (1860);
 * e.g. F. Reif, Fundamentals of Statistical and Thermal Physics (1965), sec. 7.10). Immutable.
 *
 * <p>With v_p = sqrt(2kT/m) and x = v/v_p:
 * <ul>
 *   <li>speed pdf f(v) = 4 pi (m/(2 pi kT))^(3/2) v^2 exp(-m v^2/(2kT)), in s/m;</li>
 *   <li>speed cdf P(v) = erf(x) - (2/sqrt pi) x e^(-x^2) (Commons Math {@link Erf}); for x &lt; 1/2 the
 *       power series (4/sqrt pi) sum_k (-1)^k x^(2k+3)/(k! (2k+3)), which avoids the cancellation;</li>
 *   <li>most probable speed v_p, mean speed sqrt(8kT/(pi m)), rms speed sqrt(3kT/m);</li>
 *   <li>energy pdf f(E) = 2 sqrt(E/pi) (kT)^(-3/2) e^(-E/kT), in 1/J; energy cdf = the speed cdf at
 *       x = sqrt(E/kT) (the regularised incomplete gamma P(3/2, E/kT)); mean energy (3/2) kT.</li>
 * </ul>
 * Sampling: each velocity component is normal with variance kT/m (three draws of
 * {@link Random#nextGaussian()} from a {@code java.util.Random} seeded by the caller), the speed is
 * the length of the velocity, so the same seed gives the same speeds on every JVM.
 * Temperatures go in as kelvin and come out as an {@link Energy} ({@link #thermalEnergy()}).
 *
 * <p><b>Accuracy.</b> Speeds, densities and the mean energy are closed forms, a few ulp. The speed
 * and energy cdfs are within {@value #MAX_CDF_ABSOLUTE_ERROR} absolute, the largest error measured
 * against a committed 30-digit mpmath table (test resource {@code limit/ideal-gas-mpmath.csv},
 * 0 &lt; v/v_p &lt;= 6), rounded up.
 */
public final class MaxwellBoltzmannGas {
    /**
     * Largest absolute error of the cdf measured against the committed mpmath table, rounded up;
     * LimitStatedAccuracyTest fails if any row is worse, or if this is more than twice the maximum.
     */
    public static final double MAX_CDF_ABSOLUTE_ERROR = 3e-16;

    private static final double SQRT_PI = Math.sqrt(Math.PI);

    private final double massKg;
    private final double kelvin;
    private final double kt; // J

    /**
     * A gas of particles of mass m (kg) at temperature T (K).
     *
     * @throws InvalidInputException for a mass or temperature that is not finite and &gt; 0
     */
    public MaxwellBoltzmannGas(double massKg, double temperatureK) {
        this.massKg = Checks.positive("particle mass (kg)", massKg, "Masses in u: use MaxwellBoltzmannGas.ofAtomicMass.");
        this.kelvin = Checks.temperature(temperatureK);
        this.kt = Codata2018.BOLTZMANN * temperatureK;
    }

    /** A gas of particles of mass {@code massU} in unified atomic mass units u (CODATA 2018 m_u). */
    public static MaxwellBoltzmannGas ofAtomicMass(double massU, double temperatureK) {
        Checks.positive("particle mass (u)", massU, "");
        return new MaxwellBoltzmannGas(massU * Codata2018.ATOMIC_MASS_UNIT, temperatureK);
    }

    /** The particle mass in kg. */
    public double massKg() {
        return massKg;
    }

    /** The thermal energy k T, shown in kelvin ({@code .in(EnergyUnit.KELVIN)} is T in K). */
    public Energy thermalEnergy() {
        return Energy.of(kelvin, EnergyUnit.KELVIN);
    }

    /** Most probable speed sqrt(2kT/m), m/s. */
    public double mostProbableSpeed() {
        return Math.sqrt(2.0 * kt / massKg);
    }

    /** Mean speed sqrt(8kT/(pi m)), m/s. */
    public double meanSpeed() {
        return Math.sqrt(8.0 * kt / (Math.PI * massKg));
    }

    /** Root-mean-square speed sqrt(3kT/m), m/s. */
    public double rmsSpeed() {
        return Math.sqrt(3.0 * kt / massKg);
    }

    /** Standard deviation of the speed, sqrt((3 - 8/pi) kT/m), m/s. */
    public double speedStandardDeviation() {
        return Math.sqrt((3.0 - 8.0 / Math.PI) * kt / massKg);
    }

    /** The speed probability density at v &gt;= 0 (m/s), in s/m. */
    public double speedPdf(double speed) {
        double x = checkSpeed(speed) / mostProbableSpeed();
        if (Double.isInfinite(x)) {
            return 0.0;
        }
        return 4.0 / SQRT_PI * x * x * Math.exp(-x * x) / mostProbableSpeed();
    }

    /** The probability that a particle is slower than v (m/s, v &gt;= 0, +infinity allowed). */
    public double speedCdf(double speed) {
        double x = checkSpeed(speed) / mostProbableSpeed();
        return reducedCdf(x);
    }

    /** The mean kinetic energy (3/2) kT. */
    public Energy meanEnergy() {
        return Energy.of(1.5 * kt, EnergyUnit.JOULE);
    }

    /** The kinetic-energy probability density at E &gt;= 0, per joule. */
    public double energyPdf(Energy energy) {
        double y = checkEnergy(energy) / kt;
        return 2.0 * Math.sqrt(y / Math.PI) * Math.exp(-y) / kt;
    }

    /** The probability that a particle's kinetic energy is below E (E &gt;= 0). */
    public double energyCdf(Energy energy) {
        return reducedCdf(Math.sqrt(checkEnergy(energy) / kt));
    }

    /**
     * n speeds drawn from this distribution with a {@code java.util.Random} seeded by {@code seed}
     * (three normal velocity components of variance kT/m each).
     */
    public double[] sampleSpeeds(int n, long seed) {
        Inputs.atLeast("sample size n", n, 0);
        Random rnd = new Random(seed);
        double sigma = Math.sqrt(kt / massKg);
        double[] v = new double[n];
        for (int i = 0; i < n; i++) {
            double vx = rnd.nextGaussian();
            double vy = rnd.nextGaussian();
            double vz = rnd.nextGaussian();
            v[i] = sigma * Math.sqrt(vx * vx + vy * vy + vz * vz);
        }
        return v;
    }

    /** P(x) = erf(x) - (2/sqrt pi) x e^(-x^2), the speed cdf in units of v_p. */
    private static double reducedCdf(double x) {
        if (Double.isInfinite(x)) {
            return 1.0;
        }
        if (x < 0.5) {
            double x2 = x * x;
            double sum = 0.0;
            double power = x2 * x; // x^(2k+3) / k! with alternating sign
            for (int k = 0; k < 40; k++) {
                double term = power / (2 * k + 3);
                sum += term;
                if (Math.abs(term) < 1e-18 * Math.abs(sum)) {
                    break;
                }
                power *= -x2 / (k + 1);
            }
            return 4.0 / SQRT_PI * sum;
        }
        return Erf.erf(x) - 2.0 / SQRT_PI * x * Math.exp(-x * x);
    }

    private static double checkSpeed(double v) {
        if (!(v >= 0)) {
            throw InvalidInputException.of("speed v (m/s)", v, "a number >= 0 (+infinity allowed)", "");
        }
        return v;
    }

    private static double checkEnergy(Energy e) {
        double j = e.in(EnergyUnit.JOULE);
        if (!(j >= 0)) {
            throw InvalidInputException.of("kinetic energy", e, ">= 0", "");
        }
        return j;
    }

    @Override
    public String toString() {
        return "Maxwell-Boltzmann gas, m = " + massKg + " kg, T = " + kelvin + " K";
    }
}
