package org.microtally.limit;

/**
 * A three-dimensional anisotropic harmonic trap, V = (m/2) sum_i omega_i^2 x_i^2, given by its three
 * angular frequencies in rad/s.
 *
 * <p>A plain value: the only computations are omega = 2 pi f ({@link #ofHertz}) and the two means.
 * The geometric mean omega_g is the frequency that enters the semiclassical density of states
 * g(e) = e^2 / (2 (hbar omega_g)^3) (V. Bagnato, D. E. Pritchard and D. Kleppner, Phys. Rev. A 35,
 * 4354 (1987)); the arithmetic mean omega_m sets the leading finite-size correction (see
 * {@link DensityOfStates}). Accuracy: each is a few double operations ({@code Math.cbrt} is within
 * 1 ulp), relative error at most a few ulp.
 *
 * @param omegaX angular frequency along x, rad/s
 * @param omegaY angular frequency along y, rad/s
 * @param omegaZ angular frequency along z, rad/s
 */
public record HarmonicTrap(double omegaX, double omegaY, double omegaZ) {

    /** Validates that every frequency is finite and &gt; 0. */
    public HarmonicTrap {
        Checks.positive("trap angular frequency omega_x (rad/s)", omegaX, "");
        Checks.positive("trap angular frequency omega_y (rad/s)", omegaY, "");
        Checks.positive("trap angular frequency omega_z (rad/s)", omegaZ, "");
    }

    /** A trap from its three ordinary frequencies f_i in Hz (omega_i = 2 pi f_i). */
    public static HarmonicTrap ofHertz(double fx, double fy, double fz) {
        Checks.positive("trap frequency f_x (Hz)", fx, "");
        Checks.positive("trap frequency f_y (Hz)", fy, "");
        Checks.positive("trap frequency f_z (Hz)", fz, "");
        return new HarmonicTrap(2 * Math.PI * fx, 2 * Math.PI * fy, 2 * Math.PI * fz);
    }

    /** Geometric mean omega_g = (omega_x omega_y omega_z)^(1/3), rad/s. */
    public double geometricMean() {
        return Math.cbrt(omegaX * omegaY * omegaZ);
    }

    /** Arithmetic mean omega_m = (omega_x + omega_y + omega_z)/3, rad/s. */
    public double arithmeticMean() {
        return (omegaX + omegaY + omegaZ) / 3.0;
    }
}
