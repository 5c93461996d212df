package org.microtally.special;

import java.util.ArrayList;
import java.util.List;
import org.microtally.Tabular;

/**
 * The relativistic Fermi-Dirac integrals of {@link RelativisticFermiDirac} at one (eta, beta), for
 * the four orders k = -1/2, 1/2, 3/2, 5/2: F_k, dF_k/deta, dF_k/dbeta and, when requested, the
 * entropy integrals S_k. Immutable; every value carries the accuracy
 * {@value RelativisticFermiDirac#RELATIVE_ACCURACY} (relative).
 */
public final class FermiDiracValues implements Tabular {
    private final double eta;
    private final double beta;
    private final double[] f;
    private final double[] dEta;
    private final double[] dBeta;
    private final double[] entropy; // null when not computed
    private final double[] entropyEta; // dS_k/deta, null when the entropy was not computed
    private final double[] etaSecond; // d^2F_k/deta^2, null when the entropy was not computed
    private final double[] entropyEtaSecond; // d^2S_k/deta^2, null when the entropy was not computed

    /**
     * Takes ownership of the arrays (no copies): the only caller, {@link RelativisticFermiDirac}, hands over arrays it
     * allocated for this result and never touches again, so the values stay immutable.
     */
    FermiDiracValues(double eta, double beta, double[] f, double[] dEta, double[] dBeta, double[] entropy,
                     double[] entropyEta, double[] etaSecond, double[] entropyEtaSecond) {
        this.eta = eta;
        this.beta = beta;
        this.f = f;
        this.dEta = dEta;
        this.dBeta = dBeta;
        this.entropy = entropy;
        this.entropyEta = entropy == null ? null : entropyEta;
        this.etaSecond = entropy == null ? null : etaSecond;
        this.entropyEtaSecond = entropy == null ? null : entropyEtaSecond;
    }

    /** The eta these values belong to. */
    public double eta() {
        return eta;
    }

    /** The beta these values belong to. */
    public double beta() {
        return beta;
    }

    /** F_k(eta, beta). */
    public double integral(double k) {
        return f[index(k)];
    }

    /** dF_k/deta. */
    public double etaDerivative(double k) {
        return dEta[index(k)];
    }

    /** dF_k/dbeta. */
    public double betaDerivative(double k) {
        return dBeta[index(k)];
    }

    /**
     * S_k = int x^k sqrt(1 + beta x/2) [-f ln f - (1-f) ln(1-f)] dx.
     *
     * @throws IllegalStateException if the values were evaluated without entropy
     */
    public double entropyIntegral(double k) {
        if (entropy == null) {
            throw new IllegalStateException("entropy integrals were not computed: call RelativisticFermiDirac.evaluate(eta, beta, true)");
        }
        return entropy[index(k)];
    }

    /**
     * dS_k/deta = int x^k sqrt(1 + beta x/2) (x - eta) f (1 - f) dx (since d/df of the entropy density
     * is ln((1 - f)/f) = x - eta and df/deta = f (1 - f)); same accuracy as S_k, but as an absolute
     * error relative to S_k where the integrand changes sign (near eta = 0 and below).
     *
     * @throws IllegalStateException if the values were evaluated without entropy
     */
    public double entropyEtaDerivative(double k) {
        if (entropyEta == null) {
            throw new IllegalStateException("entropy integrals were not computed: call RelativisticFermiDirac.evaluate(eta, beta, true)");
        }
        return entropyEta[index(k)];
    }

    /**
     * d^2F_k/deta^2 = int x^k sqrt(1 + beta x/2) f (1 - f) (1 - 2 f) dx, for the Taylor steps of equation-of-state
     * solvers. Its integrand changes sign at the Fermi level, so it carries an absolute error of about
     * {@value RelativisticFermiDirac#RELATIVE_ACCURACY} times dF_k/deta rather than a relative one.
     *
     * @throws IllegalStateException if the values were evaluated without entropy
     */
    public double etaSecondDerivative(double k) {
        if (etaSecond == null) {
            throw new IllegalStateException("second derivatives come with the entropy: call RelativisticFermiDirac.evaluate(eta, beta, true)");
        }
        return etaSecond[index(k)];
    }

    /**
     * d^2S_k/deta^2 = int x^k sqrt(1 + beta x/2) [(x - eta) (1 - 2 f) - 1] f (1 - f) dx; absolute error of about
     * {@value RelativisticFermiDirac#RELATIVE_ACCURACY} times max(S_k, |dS_k/deta|).
     *
     * @throws IllegalStateException if the values were evaluated without entropy
     */
    public double entropyEtaSecondDerivative(double k) {
        if (entropyEtaSecond == null) {
            throw new IllegalStateException("second derivatives come with the entropy: call RelativisticFermiDirac.evaluate(eta, beta, true)");
        }
        return entropyEtaSecond[index(k)];
    }

    private static int index(double k) {
        if (k == -0.5) {
            return 0;
        } else if (k == 0.5) {
            return 1;
        } else if (k == 1.5) {
            return 2;
        } else if (k == 2.5) {
            return 3;
        }
        throw org.microtally.InvalidInputException.of("relativistic Fermi-Dirac order k", k, "one of -0.5, 0.5, 1.5, 2.5",
                "Other orders are not provided.");
    }

    @Override
    public List<String> columnNames() {
        return List.of("k", "F_k", "dF_k/deta", "dF_k/dbeta", "S_k");
    }

    @Override
    public List<List<Object>> rows() {
        List<List<Object>> rows = new ArrayList<>();
        for (int i = 0; i < 4; i++) {
            Object s = entropy == null ? "not computed" : (Object) entropy[i];
            rows.add(List.of(i - 0.5, f[i], dEta[i], dBeta[i], s));
        }
        return List.copyOf(rows);
    }
}
