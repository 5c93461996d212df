package org.microtally.special;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.Random;
import org.junit.jupiter.api.Test;

class FermiDiracTableTest {

    @Test
    void valuesDoNotDependOnWhatWasComputedBefore() {
        Random rnd = new Random(12L);
        double[] j = new double[200];
        double[] eta = new double[200];
        double[] first = new double[200];
        for (int i = 0; i < j.length; i++) {
            j[i] = i % 4 == 0 ? 0.5 : -0.9 + 20 * rnd.nextDouble();
            eta[i] = 1 + 39.999 * rnd.nextDouble();
            first[i] = FermiDirac.integral(j[i], eta[i]);
        }
        FermiDiracTable.forgetAll();
        for (int i = j.length - 1; i >= 0; i--) {
            // common practice, no source: a result must not depend on the order of earlier calls
            assertEquals(Double.doubleToLongBits(first[i]), Double.doubleToLongBits(FermiDirac.integral(j[i], eta[i])),
                    "F_" + j[i] + "(" + eta[i] + ")");
        }
    }

    @Test
    void integerArgumentsReturnTheQuadratureItself() {
        for (double j : new double[] {-0.5, 0.5, 1.5, 7.25}) {
            for (int eta = 2; eta < 40; eta += 3) {
                // Source: the interpolant passes through its end nodes (Chebyshev points of the second kind)
                assertEquals(FermiDirac.quadrature(j, eta), FermiDirac.integral(j, eta), 0.0, "F_" + j + "(" + eta + ")");
            }
        }
    }
}
