package org.microtally.ensemble;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.math.BigInteger;
import org.junit.jupiter.api.Test;
import org.microtally.InvalidInputException;
import org.microtally.ProgressListener;
import org.microtally.lattice.Boundary;
import org.microtally.lattice.Lattice;
import org.microtally.lattice.Model;
import org.microtally.lattice.TransferMatrix;
import org.microtally.spectrum.Spectra;
import org.microtally.spectrum.Spectrum;
import org.microtally.spectrum.Statistics;
import org.microtally.units.Energy;
import org.microtally.units.EnergyScale;
import org.microtally.units.EnergyUnit;

/** An exact density of states and a temperature as an Energy enter through Canonical and Microcanonical. */
class ExactFrontDoorTest {
    private static final Model FERRO = Model.ising(Model.Coupling.FERROMAGNETIC);

    @Test
    void fourByFourIsingMatchesAllConfigurationsListedHere() {
        ExactDensityOfStates g = TransferMatrix.densityOfStates(Lattice.square(4, 4, Boundary.PERIODIC), FERRO,
                ProgressListener.NONE);
        double kT = 2.5;
        // independent brute force: all 2^16 spin configurations of the periodic 4 x 4 lattice,
        // E = -sum over the 32 nearest-neighbour bonds of s_i s_j (units of J)
        double[] w = new double[65];
        for (int c = 0; c < 1 << 16; c++) {
            int e = 0;
            for (int x = 0; x < 4; x++) {
                for (int y = 0; y < 4; y++) {
                    int s = spin(c, x, y);
                    e -= s * spin(c, (x + 1) % 4, y) + s * spin(c, x, (y + 1) % 4);
                }
            }
            w[e + 32] += 1;
        }
        double z = 0;
        double m1 = 0;
        double m2 = 0;
        for (int i = 0; i < w.length; i++) {
            double e = i - 32;
            double b = w[i] * Math.exp(-(e + 32) / kT);
            z += b;
            m1 += b * e;
            m2 += b * e * e;
        }
        double u = m1 / z;
        ExactCanonical.State s = Canonical.of(g, kT);
        assertEquals(Math.log(z) + 32 / kT, s.lnZ(), 1e-12);
        assertEquals(u, s.energy(), 1e-11);
        assertEquals((m2 / z - u * u) / (kT * kT), s.heatCapacity(), 1e-10);
        // two ground states (all up, all down), and the brute-force count of the first excited energy
        ExactMicrocanonical m = Microcanonical.of(g);
        assertEquals(Math.log(2), m.boltzmannEntropy(-32), 1e-15);
        assertEquals(Math.log(w[8]), m.boltzmannEntropy(-24), 1e-14);
    }

    private static int spin(int c, int x, int y) {
        return ((c >> (4 * x + y)) & 1) == 1 ? 1 : -1;
    }

    @Test
    void sixBySixIsingFollowsTheHighTemperatureSeries() {
        ExactDensityOfStates g = TransferMatrix.densityOfStates(Lattice.square(6, 6, Boundary.PERIODIC), FERRO,
                ProgressListener.NONE);
        assertEquals(BigInteger.TWO.pow(36), g.total());
        int n = 36;
        double k = 0.01;
        double t = Math.tanh(k);
        // Source: high-temperature expansion of the periodic square-lattice Ising model (from memory):
        // Z = 2^N cosh^{2N}(K) (1 + N t^4 + 2N t^6 + O(N^2 t^8)), t = tanh K (closed loops of 4 and 6 bonds);
        // on the 6 x 6 torus the 2 x 6 straight loops winding around it add 12 t^6 (counted here, closed form)
        double lnZ = n * Math.log(2) + 2 * n * Math.log(Math.cosh(k))
                + Math.log1p(n * Math.pow(t, 4) + (2 * n + 12) * Math.pow(t, 6));
        assertEquals(lnZ, Canonical.of(g, 1 / k).lnZ(), 1e-12);
    }

    @Test
    void temperatureAsAnEnergyNeedsAPhysicalScale() {
        // Halyard Bay quantum dot: hbar*omega = 3 meV, 12 electrons at 4.2 K
        EnergyScale meV3 = EnergyScale.of("hbar*omega", Energy.of(3, EnergyUnit.MILLIELECTRONVOLT));
        Spectrum dot = Spectra.harmonicOscillator(2, 12).withInternalMultiplicity(2).withScale(meV3);
        Canonical c = Canonical.of(dot, Statistics.FERMI, 12, Energy.ofTemperature(4.2));
        // Source: CODATA 2018 / SI 2019 exact constants, k_B = 1.380649e-23 J/K, e = 1.602176634e-19 C:
        // 4.2 K is 0.36193 meV, i.e. 0.120643 hbar*omega
        assertEquals(4.2 * (1.380649e-23 / 1.602176634e-19) / 3e-3, c.kT(), 1e-14);
        assertEquals(c.lnZ(), Canonical.of(dot, Statistics.FERMI, 12, c.kT()).lnZ(), 0.0);
        GrandCanonical gc = GrandCanonical.ofMeanNumber(dot, Statistics.FERMI, Energy.ofTemperature(4.2), 12);
        assertEquals(c.kT(), gc.kT(), 0.0);
        InvalidInputException e = assertThrows(InvalidInputException.class, () -> Canonical.of(
                Spectra.harmonicOscillator(2, 12), Statistics.FERMI, 12, Energy.ofTemperature(4.2)));
        assertTrue(e.getMessage().contains("no physical size") && e.getMessage().contains("withScale"), e.getMessage());
        // the molecular magnet's cluster: coupling J/k = 12 K, so 24 K is kT = 2 J
        ExactDensityOfStates ising = TransferMatrix.densityOfStates(Lattice.square(4, 4, Boundary.PERIODIC), FERRO,
                ProgressListener.NONE);
        ExactDensityOfStates magnet = ising.withScale(EnergyScale.of("J", Energy.ofTemperature(12)));
        assertEquals(Canonical.of(ising, 2.0).lnZ(), Canonical.of(magnet, Energy.ofTemperature(24)).lnZ(), 1e-13);
    }
}
