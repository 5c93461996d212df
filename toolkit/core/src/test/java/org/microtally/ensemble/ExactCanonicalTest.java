package org.microtally.ensemble;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.math.BigInteger;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.microtally.InvalidInputException;
import org.microtally.ProgressListener;
import org.microtally.lattice.Boundary;
import org.microtally.lattice.Kaufman;
import org.microtally.lattice.Lattice;
import org.microtally.lattice.Model;
import org.microtally.lattice.Model.Coupling;
import org.microtally.lattice.TransferMatrix;
import org.microtally.units.EnergyScale;

class ExactCanonicalTest {
    private static final Model FERRO = Model.ising(Coupling.FERROMAGNETIC);
    private static final double T_ONSAGER = 2 / Math.log(1 + Math.sqrt(2));

    @Test
    void isingRingMatchesItsClosedForm() {
        int n = 10;
        ExactDensityOfStates g = TransferMatrix.densityOfStates(Lattice.square(n, 1, Boundary.CYLINDER), FERRO, ProgressListener.NONE);
        ExactCanonical ring = ExactCanonical.of(g);
        for (double beta : new double[] {0.1, 0.7, 2.0, -0.4}) {
            // Source: closed form (transfer matrix of the periodic chain), Z = (2 cosh K)^N + (2 sinh K)^N
            double c = 2 * Math.cosh(beta);
            double s = 2 * Math.sinh(beta);
            double z = Math.pow(c, n) + Math.pow(s, n);
            double z1 = n * (Math.pow(c, n - 1) * s + Math.pow(s, n - 1) * c);
            double z2 = n * ((n - 1) * Math.pow(c, n - 2) * s * s + Math.pow(c, n) + (n - 1) * Math.pow(s, n - 2) * c * c + Math.pow(s, n));
            ExactCanonical.State st = ring.atBeta(beta);
            assertEquals(Math.log(z), st.lnZ(), 1e-13 * Math.abs(Math.log(z)));
            assertEquals(-z1 / z, st.energy(), 1e-12 * n);
            assertEquals(beta * beta * (z2 / z - (z1 / z) * (z1 / z)), st.heatCapacity(), 1e-10);
            assertEquals(Math.log(z) - beta * z1 / z, st.entropy(), 1e-12 * n);
            assertEquals(-Math.log(z) / beta, st.freeEnergy(), 1e-12 * n / Math.abs(beta));
        }
        // Source: closed form as above, through the sweep table (kT = 2: K = 1/2)
        ExactCanonical.Sweep sweep = ring.sweep(1.0, 2.0);
        assertEquals(List.of("kT [|J|]", "ln Z", "U [|J|]", "C [k]", "S [k]", "F [|J|]"), sweep.columnNames());
        double zHalf = Math.pow(2 * Math.cosh(0.5), n) + Math.pow(2 * Math.sinh(0.5), n);
        assertEquals(Math.log(zHalf), (Double) sweep.rows().get(1).get(1), 1e-12);
    }

    @Test
    void noOverflowAtLargeLattices() {
        // 64 x 64 would overflow double in Z; use a made-up density of the same size instead of the slow count:
        // g(E) = C(8192, k) at E = 2k, whose Z is (1 + e^{-2 beta})^8192 (binomial theorem).
        int n = 8192;
        long[] e = new long[n + 1];
        BigInteger[] g = new BigInteger[n + 1];
        BigInteger c = BigInteger.ONE;
        for (int k = 0; k <= n; k++) {
            e[k] = 2L * k;
            g[k] = c;
            c = c.multiply(BigInteger.valueOf(n - k)).divide(BigInteger.valueOf(k + 1));
        }
        ExactCanonical can = ExactCanonical.of(ExactDensityOfStates.of(EnergyScale.abstractUnit("J"), e, g));
        for (double beta : new double[] {-3, 0.01, 1, 50}) {
            // Source: closed form, binomial theorem
            double lnZ = n * Math.log1p(Math.exp(-2 * beta));
            assertEquals(lnZ, can.atBeta(beta).lnZ(), 1e-12 * Math.max(1, Math.abs(lnZ)));
            assertTrue(Double.isFinite(can.atBeta(beta).heatCapacity()));
        }
    }

    @Test
    void heatCapacityPeakShiftsAsFerdinandAndFisherFound() {
        double[] tMax = new double[3];
        double[] cMax = new double[3];
        int[] sizes = {4, 8, 16};
        for (int i = 0; i < 3; i++) {
            int l = sizes[i];
            ExactCanonical.Peak p = ExactCanonical.of(Kaufman.densityOfStates(l, l, ProgressListener.NONE)).heatCapacityPeak(1.5, 4);
            tMax[i] = p.kT();
            cMax[i] = p.heatCapacity() / (l * l);
            // The peak is a maximum: C just beside it is lower.
            ExactCanonical can = ExactCanonical.of(Kaufman.densityOfStates(l, l, ProgressListener.NONE));
            assertTrue(can.atTemperature(p.kT() * (1 + 1e-4)).heatCapacity() < p.heatCapacity());
            assertTrue(can.atTemperature(p.kT() * (1 - 1e-4)).heatCapacity() < p.heatCapacity());
        }
        // Source: A. E. Ferdinand and M. E. Fisher, Phys. Rev. 185, 832 (1969): on the L x L torus the peak lies
        // above T_c = 2/ln(1 + sqrt 2) (Onsager 1944) with (T_max - T_c)/T_c ~ b/L, b = 0.3603 (value from memory),
        // approached from below; and C_max/N grows as (8/pi) K_c^2 ln L (closed-form amplitude)
        for (int i = 0; i < 3; i++) {
            double bL = (tMax[i] / T_ONSAGER - 1) * sizes[i];
            assertTrue(bL > 0.28 && bL < 0.3603, "L = " + sizes[i] + ": " + bL);
            assertTrue(i == 0 || bL > (tMax[i - 1] / T_ONSAGER - 1) * sizes[i - 1]);
        }
        double kc = Math.log(1 + Math.sqrt(2)) / 2;
        assertEquals(8 / Math.PI * kc * kc * Math.log(2), cMax[2] - cMax[1], 0.03);
    }

    @Test
    void binderCumulantLimitsAndCrossing() {
        ExactCanonical l4 = ExactCanonical.of(TransferMatrix.withMagnetisation(Lattice.square(4, 4, Boundary.PERIODIC), FERRO, ProgressListener.NONE));
        ExactCanonical l6 = ExactCanonical.of(TransferMatrix.withMagnetisation(Lattice.square(6, 6, Boundary.PERIODIC), FERRO, ProgressListener.NONE));
        // Source: closed form, at T -> 0 only M = +-N: U_4 = 1 - N^4 / (3 N^4) = 2/3
        assertEquals(2.0 / 3, l4.magnetisation(20).binder(), 1e-12);
        // Source: closed form, at beta = 0 the spins are independent: <M^2> = N, <M^4> = 3N^2 - 2N, U_4 = 2/(3N)
        assertEquals(2.0 / 48, l4.magnetisation(1e-12).binder(), 1e-9);
        // Source: K. Binder, Z. Phys. B 43, 119 (1981): the curves for two sizes cross near T_c (Onsager 1944);
        // locate the crossing by bisection
        double lo = 1.8;
        double hi = 3.0;
        for (int i = 0; i < 50; i++) {
            double mid = (lo + hi) / 2;
            double d = l4.magnetisation(1 / mid).binder() - l6.magnetisation(1 / mid).binder();
            if (d < 0) {
                lo = mid;
            } else {
                hi = mid;
            }
        }
        assertEquals(T_ONSAGER, lo, 0.05 * T_ONSAGER);
        // Source: closed form, Z2 symmetry gives <M> = 0, so chi = beta <M^2>
        ExactCanonical.Magnetisation m = l4.magnetisation(0.3);
        assertEquals(0.3 * m.meanSquare(), m.susceptibility(), 1e-12 * m.susceptibility());
    }

    @Test
    void pottsPeaksApproachTheSelfDualPoint() {
        // Source: closed form, the q-state Potts self-dual point e^{K_c} = 1 + sqrt q (R. B. Potts 1952;
        // F. Y. Wu, Rev. Mod. Phys. 54, 235 (1982)); peaks on L x L tori lie above it and move down with L
        double tc = 1 / Math.log(1 + Math.sqrt(3));
        double previous = Double.POSITIVE_INFINITY;
        for (int l : new int[] {3, 4, 5}) {
            ExactDensityOfStates g = TransferMatrix.densityOfStates(Lattice.square(l, l, Boundary.PERIODIC),
                    Model.potts(3, Coupling.FERROMAGNETIC), ProgressListener.NONE);
            double t = ExactCanonical.of(g).heatCapacityPeak(0.5, 2).kT();
            assertTrue(t > tc && t < previous, "L = " + l + ": " + t);
            previous = t;
        }
        assertTrue(previous < 1.07 * tc);
    }

    @Test
    void microcanonicalTemperatures() {
        ExactDensityOfStates g = Kaufman.densityOfStates(6, 6, ProgressListener.NONE);
        ExactMicrocanonical micro = ExactMicrocanonical.of(g);
        // Source: closed form, g(E) = g(-E) on the bipartite torus, so S_B is even and beta_B odd in E
        assertEquals(micro.boltzmannBeta(-8), -micro.boltzmannBeta(8), 1e-12);
        assertTrue(micro.boltzmannBeta(8) < 0);
        // Source: Dunkel & Hilbert, Nature Physics 10, 67 (2014): the Gibbs temperature is never negative
        for (long e : g.distinctEnergies()) {
            if (micro.hasTemperature(e)) {
                assertTrue(micro.gibbsBeta(e) > 0, "E = " + e);
            }
        }
        // Source: closed form, S_G at the top energy is ln 2^N
        long top = g.distinctEnergies()[g.distinctEnergies().length - 1];
        assertEquals(36 * Math.log(2), micro.gibbsEntropy(top), 1e-12);
        assertThrows(InvalidInputException.class, () -> micro.boltzmannBeta(-70));
    }

    @Test
    void badInput() {
        EnergyScale j = EnergyScale.abstractUnit("J");
        // common practice, no source
        assertThrows(InvalidInputException.class, () -> ExactDensityOfStates.of(j, new long[] {0, 0},
                new BigInteger[] {BigInteger.ONE, BigInteger.ONE}));
        assertThrows(InvalidInputException.class, () -> ExactDensityOfStates.of(j, new long[] {0},
                new BigInteger[] {BigInteger.valueOf(-1)}));
        assertThrows(InvalidInputException.class, () -> ExactDensityOfStates.of(j, new long[] {0},
                new BigInteger[] {BigInteger.ZERO}));
        ExactCanonical can = ExactCanonical.of(ExactDensityOfStates.of(j, new long[] {0, 1},
                new BigInteger[] {BigInteger.ONE, BigInteger.TWO}));
        assertThrows(InvalidInputException.class, () -> can.atBeta(0));
        assertThrows(InvalidInputException.class, () -> can.atBeta(Double.NaN));
        assertThrows(InvalidInputException.class, () -> can.atTemperature(-1));
        assertThrows(InvalidInputException.class, () -> can.magnetisation(1));
        // A two-level system has its Schottky peak at kT = 0.42 (in units of the gap), outside [1, 2].
        assertThrows(InvalidInputException.class, () -> can.heatCapacityPeak(1, 2));
    }
}
