package org.microtally.lattice;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.microtally.ProgressListener;
import org.microtally.lattice.Model.Coupling;

class KaufmanTest {
    @ParameterizedTest
    @CsvSource({"4, 4", "4, 3", "3, 4", "4, 5", "6, 4", "6, 6", "4, 7", "3, 3", "3, 5", "5, 3", "5, 5", "5, 7", "7, 3", "3, 6", "5, 4"})
    void kaufmanEqualsTransferMatrix(int l, int m) {
        Lattice torus = Lattice.square(l, m, Boundary.PERIODIC);
        // Source: independent route, site-by-site transfer matrix on the same torus
        assertEquals(TransferMatrix.densityOfStates(torus, Model.ising(Coupling.FERROMAGNETIC), ProgressListener.NONE).rows(),
                Kaufman.densityOfStates(l, m, ProgressListener.NONE).rows());
    }

    @ParameterizedTest
    @CsvSource({"4, 4", "4, 5", "3, 6", "3, 3", "5, 3", "3, 7", "5, 5"})
    void kaufmanEqualsGrayCodeEnumeration(int l, int m) {
        // Source: independent brute force over all 2^N configurations of the torus
        assertEquals(BruteForce.densityOfStates(Lattice.square(l, m, Boundary.PERIODIC), Model.ising(Coupling.FERROMAGNETIC)).rows(),
                Kaufman.densityOfStates(l, m, ProgressListener.NONE).rows());
    }

    @ParameterizedTest
    @CsvSource({"3, 5", "5, 7", "3, 4", "7, 9"})
    void bothOrientationsOfTheProductAgree(int n, int m) {
        // Source: closed form, the L x M and M x L tori are the same graph; the product over n factors
        // (n odd or even) must give the same polynomial as the product over m factors
        assertEquals(java.util.Arrays.asList(Kaufman.coefficients(n, m, ProgressListener.NONE)),
                java.util.Arrays.asList(Kaufman.coefficients(m, n, ProgressListener.NONE)));
    }

    @ParameterizedTest
    @CsvSource({"4, 4", "6, 4"})
    void antiferromagnetOnEvenToriEqualsTransferMatrix(int l, int m) {
        Model anti = Model.ising(Coupling.ANTIFERROMAGNETIC);
        // Source: independent route, transfer matrix of the antiferromagnet on the same torus
        assertEquals(TransferMatrix.densityOfStates(Lattice.square(l, m, Boundary.PERIODIC), anti, ProgressListener.NONE).rows(),
                Kaufman.densityOfStates(l, m, Coupling.ANTIFERROMAGNETIC, ProgressListener.NONE).rows());
        // common practice, no source: an odd period is refused for the antiferromagnet
        org.junit.jupiter.api.Assertions.assertThrows(org.microtally.InvalidInputException.class,
                () -> Kaufman.densityOfStates(l, 5, Coupling.ANTIFERROMAGNETIC, ProgressListener.NONE));
    }
}
