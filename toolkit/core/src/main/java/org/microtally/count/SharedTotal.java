package org.microtally.count;

import java.math.BigInteger;
import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.Objects;
import org.apache.commons.math3.fraction.BigFraction;
import org.microtally.Inputs;
import org.microtally.InvalidInputException;
import org.microtally.Tabular;
import org.microtally.exact.ExactLog;
import org.microtally.exact.ExactRatio;

/**
 * Two subsystems A and B that exchange a conserved integer quantity (energy quanta, particles) with
 * fixed total q: the joint multiplicity Omega_A(q_A) Omega_B(q - q_A) of every split q_A = 0..q. All
 * microstates of the combined system being equally likely, the split has the exact distribution
 * P(q_A) = Omega_A(q_A) Omega_B(q - q_A) / Omega(q), Omega(q) = sum over splits. Immutable.
 *
 * <p><b>Method.</b> Omega(q) is the coefficient of t^q in the product of the two generating
 * functions sum_k Omega_A(k) t^k and sum_k Omega_B(k) t^k (the product rule for ordinary generating
 * functions, H. S. Wilf, generatingfunctionology, 2nd ed. (1994), ch. 1-2, from memory); only this one
 * coefficient is needed, so it is the direct sum over the q + 1 splits, in BigInteger. Reading the
 * normalised joint count as the probability of the split is the postulate of equal a priori
 * probabilities for the combined isolated system (e.g. D. V. Schroeder, An Introduction to Thermal
 * Physics (2000), section 2.3, from memory).
 *
 * <p><b>Accuracy.</b> Joint counts, Omega(q) and the probabilities are exact (BigInteger,
 * BigFraction). The mean and width (standard deviation) of q_A come from the exact sums
 * S_k = sum q_A^k Omega_A Omega_B as exact rationals S_1/S_0 and (S_2 S_0 - S_1^2)/S_0^2, each
 * rounded once to the nearest double ({@link ExactRatio}, half an ulp), the width then through one
 * correctly rounded square root: within about 1 ulp however large the counts are. Entropies are ln of
 * the exact integers ({@link ExactLog}, within 2 ulp).
 */
public final class SharedTotal implements Tabular {
    private final int total;
    private final BigInteger[] omegaA;
    private final BigInteger[] omegaB;
    private final BigInteger[] joint;
    private final BigInteger all;

    private SharedTotal(int total, BigInteger[] a, BigInteger[] b) {
        this.total = total;
        this.omegaA = a;
        this.omegaB = b;
        this.joint = new BigInteger[total + 1];
        BigInteger s = BigInteger.ZERO;
        for (int qa = 0; qa <= total; qa++) {
            joint[qa] = a[qa].multiply(b[total - qa]);
            s = s.add(joint[qa]);
        }
        this.all = s;
        if (s.signum() == 0) {
            throw InvalidInputException.of("number of joint microstates with total " + total, 0, "> 0",
                    "No split of the total is possible for these subsystems.");
        }
    }

    /**
     * From two multiplicity sequences: {@code omegaA.get(k)} and {@code omegaB.get(k)} are the
     * multiplicities of subsystem A or B holding k units, for k = 0..total (longer lists are fine).
     */
    public static SharedTotal of(List<BigInteger> omegaA, List<BigInteger> omegaB, int total) {
        Objects.requireNonNull(omegaA, "omegaA");
        Objects.requireNonNull(omegaB, "omegaB");
        Inputs.atLeast("shared total q", total, 0);
        return new SharedTotal(total, prefix("A", omegaA, total), prefix("B", omegaB, total));
    }

    /** From rows of count tables: A holds {@code particlesA} particles of table a, B likewise. */
    public static SharedTotal of(CountTable a, int particlesA, CountTable b, int particlesB, int total) {
        if (total > a.maxEnergy() || total > b.maxEnergy()) {
            throw InvalidInputException.of("shared total q", total, "at most the tables' maximum energies ("
                    + a.maxEnergy() + ", " + b.maxEnergy() + ")", "Build the tables with E >= q.");
        }
        return of(a.row(particlesA), b.row(particlesB), total);
    }

    private static BigInteger[] prefix(String name, List<BigInteger> omega, int total) {
        if (omega.size() < total + 1) {
            throw InvalidInputException.of("length of the multiplicities of " + name, omega.size(),
                    ">= total + 1 = " + (total + 1), "");
        }
        BigInteger[] out = new BigInteger[total + 1];
        for (int k = 0; k <= total; k++) {
            BigInteger v = omega.get(k);
            if (v == null || v.signum() < 0) {
                throw InvalidInputException.of("multiplicity of " + name + " at " + k, v, "an integer >= 0", "");
            }
            out[k] = v;
        }
        return out;
    }

    /** The shared total q. */
    public int total() {
        return total;
    }

    /** Omega_A(q_A) Omega_B(q - q_A). */
    public BigInteger jointCount(int qa) {
        check(qa);
        return joint[qa];
    }

    /** Omega(q) = the sum of the joint counts over every split. */
    public BigInteger totalCount() {
        return all;
    }

    /** Exact probability of the split q_A. */
    public BigFraction probability(int qa) {
        return new BigFraction(jointCount(qa), all);
    }

    /** The q_A of largest joint count (the smallest such q_A if several tie). */
    public int mostProbableSplit() {
        int best = 0;
        for (int qa = 1; qa <= total; qa++) {
            if (joint[qa].compareTo(joint[best]) > 0) {
                best = qa;
            }
        }
        return best;
    }

    /** Mean of q_A under the exact distribution. */
    public double mean() {
        return ExactRatio.toDouble(moment(1), all);
    }

    /** Standard deviation of q_A under the exact distribution. */
    public double width() {
        BigInteger s1 = moment(1);
        BigInteger var = moment(2).multiply(all).subtract(s1.multiply(s1));
        double v = ExactRatio.toDouble(var, all.multiply(all));
        return Math.sqrt(v);
    }

    /** ln Omega_A(q_A) (S_A/k); throws when it is zero. */
    public double entropyA(int qa) {
        check(qa);
        return ln(omegaA[qa], "Omega_A(" + qa + ")");
    }

    /** ln Omega_B(q - q_A); throws when it is zero. */
    public double entropyB(int qa) {
        check(qa);
        return ln(omegaB[total - qa], "Omega_B(" + (total - qa) + ")");
    }

    /** ln [Omega_A(q_A) Omega_B(q - q_A)] = S_A/k + S_B/k at this split. */
    public double entropy(int qa) {
        return ln(jointCount(qa), "joint count at q_A = " + qa);
    }

    /** ln Omega(q): the entropy of the combined system with the split unconstrained. */
    public double totalEntropy() {
        return ExactLog.ln(all);
    }

    private BigInteger moment(int k) {
        BigInteger s = BigInteger.ZERO;
        for (int qa = 1; qa <= total; qa++) {
            s = s.add(joint[qa].multiply(BigInteger.valueOf(qa).pow(k)));
        }
        return s;
    }

    private static double ln(BigInteger v, String what) {
        if (v.signum() == 0) {
            throw InvalidInputException.of(what, 0, "> 0 for a logarithm", "This split has no microstate.");
        }
        return ExactLog.ln(v);
    }

    private void check(int qa) {
        if (qa < 0 || qa > total) {
            throw InvalidInputException.of("split q_A", qa, "in [0, " + total + "]", "");
        }
    }

    /** Columns q_A, q_B, Omega_A, Omega_B, Omega_A*Omega_B, probability. */
    @Override
    public List<String> columnNames() {
        return List.of("q_A", "q_B", "Omega_A", "Omega_B", "Omega_A*Omega_B", "probability");
    }

    /** One row per split, exact values. */
    @Override
    public List<List<Object>> rows() {
        List<List<Object>> out = new ArrayList<>(total + 1);
        for (int qa = 0; qa <= total; qa++) {
            out.add(List.of(qa, total - qa, omegaA[qa], omegaB[total - qa], joint[qa], new BigFraction(joint[qa], all)));
        }
        return Collections.unmodifiableList(out);
    }
}
