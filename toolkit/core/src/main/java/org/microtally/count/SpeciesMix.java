package org.microtally.count;

import java.math.BigInteger;
import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.Objects;
import org.microtally.Inputs;
import org.microtally.InvalidInputException;
import org.microtally.Tabular;

/**
 * Several species of particles, each with its own spectrum, statistics and fixed particle number,
 * counted together: Omega(e, L), the number of microstates of the whole system with total energy e
 * and total label L (for example L = 2M for spin-up and spin-down electrons, or protons and neutrons
 * in a shell). Immutable.
 *
 * <p><b>Formula.</b> Particles of different species are distinguishable from each other, so a
 * microstate of the mix is one microstate of each species, and with Omega_s(n_s, e, L) the count of
 * species s at its fixed particle number n_s,
 * <pre>
 *   Omega(e, L) = sum over e_1 + ... + e_S = e, L_1 + ... + L_S = L of prod_s Omega_s(n_s, e_s, L_s),
 * </pre>
 * that is, the generating function of the mix is the product of the species' generating functions
 * sum_{e,L} Omega_s(n_s, e, L) q^e z^L.
 *
 * <p><b>Method.</b> A {@link LabelledCountTable} per species (its method and sources are documented
 * there), sliced at its particle number, then exact two-dimensional convolution over (e, L),
 * truncated at e &lt;= E after each species (the product rule for ordinary generating functions:
 * H. S. Wilf, generatingfunctionology, 2nd ed. (1994), ch. 1-2, from memory). Cost per species
 * O((E+1)^2 W_cur W_s) multiply-adds for label windows of widths W_cur and W_s.
 *
 * <p><b>Accuracy.</b> Exact: BigInteger throughout. Truncating at E loses nothing for e &lt;= E because
 * all energies are &gt;= 0.
 *
 * <p><b>Completeness under spectrum cutoffs.</b> Species s alone is complete through c_s =
 * {@link LabelledCountTable#completeThroughEnergy(int)} at its n_s; in a split of e, its share is at
 * most e - sum_{t != s} E_low,t (the others' lowest energies), so the mix is exact for the
 * untruncated spectra through min_s (c_s + sum_{t != s} E_low,t) ({@link #completeThroughEnergy()}).
 * {@link #count}, {@link #countAtLabel} and {@link #total} refuse what lies beyond;
 * {@link #truncatedModelCount} gives the truncated spectra's count as it is.
 */
public final class SpeciesMix implements Tabular {
    private final List<Species> species;
    private final int maxE;
    private final boolean energyIgnored;
    private final int labelLo;
    private final BigInteger[][] counts; // [e][L - labelLo]
    private final int completeThrough;

    private SpeciesMix(List<Species> species, int maxE, boolean energyIgnored, int labelLo, BigInteger[][] counts,
                       int completeThrough) {
        this.completeThrough = completeThrough;
        this.species = species;
        this.maxE = maxE;
        this.energyIgnored = energyIgnored;
        this.labelLo = labelLo;
        this.counts = counts;
    }

    /** Counts by (e, L) for total energies e = 0..E (integer energies &gt;= 0 in every spectrum). */
    public static SpeciesMix of(List<Species> species, int maxEnergy) {
        Inputs.atLeast("maximum total energy E", maxEnergy, 0);
        return combine(species, maxEnergy, false);
    }

    /** Counts by L alone, every level of every species taking part (energies are not used). */
    public static SpeciesMix ignoringEnergy(List<Species> species) {
        return combine(species, 0, true);
    }

    /** As {@link #of}, by the multi-modular path of {@link LabelledPrimePlan}: the same counts entry by entry. */
    public static SpeciesMix multiModular(List<Species> species, int maxEnergy) {
        LabelledPrimePlan plan = LabelledPrimePlan.forMix(species, maxEnergy, 1);
        return plan.mix(plan.residuesLocally());
    }

    /** As {@link #ignoringEnergy}, by the multi-modular path of {@link LabelledPrimePlan}. */
    public static SpeciesMix multiModularIgnoringEnergy(List<Species> species) {
        LabelledPrimePlan plan = LabelledPrimePlan.forMixIgnoringEnergy(species, 1);
        return plan.mix(plan.residuesLocally());
    }

    /** The species list checked non-empty and copied. */
    static List<Species> checked(List<Species> species) {
        Objects.requireNonNull(species, "species");
        if (species.isEmpty()) {
            throw InvalidInputException.of("number of species", 0, ">= 1", "");
        }
        return List.copyOf(species);
    }

    /** The mix of {@code species} with counts [e][L - labelLo] already computed. */
    static SpeciesMix fromCounts(List<Species> species, int maxE, boolean ignore, int labelLo, BigInteger[][] counts) {
        long complete = maxE;
        if (!ignore) {
            int size = species.size();
            long[] own = new long[size];
            long[] low = new long[size];
            long lowSum = 0;
            for (int i = 0; i < size; i++) {
                Species s = species.get(i);
                own[i] = s.spectrum().isTruncated()
                        ? LabelledCountTable.completeThrough(s.spectrum(), s.statistics(), s.particles(), maxE)
                        : Long.MAX_VALUE / 4;
                low[i] = Math.min(Long.MAX_VALUE / 4,
                        LabelledCountTable.lowestEnergyBound(s.spectrum(), s.statistics(), s.particles()));
                lowSum = Math.min(Long.MAX_VALUE / 4, lowSum + low[i]);
            }
            for (int i = 0; i < size; i++) {
                complete = Math.min(complete, own[i] + (lowSum - low[i]));
            }
        }
        return new SpeciesMix(species, maxE, ignore, labelLo, counts, (int) complete);
    }

    private static SpeciesMix combine(List<Species> species, int maxE, boolean ignore) {
        List<Species> copy = checked(species);
        BigInteger[][] cur = {{BigInteger.ONE}};
        int curLo = 0;
        cur = extend(cur, maxE);
        for (Species s : copy) {
            LabelledCountTable t = ignore
                    ? LabelledCountTable.ignoringEnergy(s.spectrum(), s.statistics(), s.particles())
                    : LabelledCountTable.of(s.spectrum(), s.statistics(), s.particles(), maxE);
            BigInteger[][] sl = t.slice(s.particles());
            int w1 = cur[0].length;
            int w2 = sl[0].length;
            BigInteger[][] next = new BigInteger[maxE + 1][w1 + w2 - 1];
            for (BigInteger[] row : next) {
                java.util.Arrays.fill(row, BigInteger.ZERO);
            }
            for (int e1 = 0; e1 <= maxE; e1++) {
                for (int l1 = 0; l1 < w1; l1++) {
                    BigInteger a = cur[e1][l1];
                    if (a.signum() == 0) {
                        continue;
                    }
                    for (int e2 = 0; e1 + e2 <= maxE; e2++) {
                        for (int l2 = 0; l2 < w2; l2++) {
                            BigInteger b = sl[e2][l2];
                            if (b.signum() != 0) {
                                next[e1 + e2][l1 + l2] = next[e1 + e2][l1 + l2].add(a.multiply(b));
                            }
                        }
                    }
                }
            }
            cur = next;
            curLo += t.minLabelTotal();
        }
        return fromCounts(copy, maxE, ignore, curLo, cur);
    }

    /**
     * The largest total energy through which every entry equals the count for the untruncated
     * spectra (see the class notes); E when no spectrum is truncated.
     */
    public int completeThroughEnergy() {
        return completeThrough;
    }

    private static BigInteger[][] extend(BigInteger[][] cur, int maxE) {
        BigInteger[][] out = new BigInteger[maxE + 1][];
        for (int e = 0; e <= maxE; e++) {
            out[e] = e < cur.length ? cur[e] : new BigInteger[] {BigInteger.ZERO};
        }
        return out;
    }

    /**
     * Omega(e, L): microstates of the whole system with energy e and label total L.
     *
     * @throws InvalidInputException for e beyond {@link #completeThroughEnergy()}
     */
    public BigInteger count(int e, int labelTotal) {
        BigInteger v = truncatedModelCount(e, labelTotal);
        if (e > completeThrough) {
            throw InvalidInputException.of("total energy e", e, "at most " + completeThrough + ": above it a species' "
                            + "spectrum cutoff omits microstates this mix lacks",
                    "Raise the cutoffs of the truncated spectra by at least " + (e - completeThrough)
                            + ", or call truncatedModelCount(e, L) for the count in the truncated spectra as given.");
        }
        return v;
    }

    /** Omega(e, L) in the spectra exactly as given (levels above their cutoffs absent), no completeness check. */
    public BigInteger truncatedModelCount(int e, int labelTotal) {
        if (e < 0 || e > maxE) {
            throw InvalidInputException.of("total energy e", e, "in [0, " + maxE + "]",
                    energyIgnored ? "This mix ignores energy: use countAtLabel(L)." : "Build with a larger E.");
        }
        long li = (long) labelTotal - labelLo;
        return li < 0 || li >= counts[e].length ? BigInteger.ZERO : counts[e][(int) li];
    }

    /** sum over e &lt;= E of Omega(e, L); for a mix that ignores energy, the number of states with label total L. */
    public BigInteger countAtLabel(int labelTotal) {
        BigInteger s = BigInteger.ZERO;
        for (int e = 0; e <= maxE; e++) {
            s = s.add(count(e, labelTotal));
        }
        return s;
    }

    /** Every microstate counted (all e &lt;= E, all labels). */
    public BigInteger total() {
        if (maxE > completeThrough) {
            count(maxE, labelLo);
        }
        BigInteger s = BigInteger.ZERO;
        for (BigInteger[] row : counts) {
            for (BigInteger v : row) {
                s = s.add(v);
            }
        }
        return s;
    }

    /** Smallest label total in the window. */
    public int minLabelTotal() {
        return labelLo;
    }

    /** Largest label total in the window. */
    public int maxLabelTotal() {
        return labelLo + counts[0].length - 1;
    }

    /** E (0 when energy is ignored). */
    public int maxEnergy() {
        return maxE;
    }

    /** The species, in the order given. */
    public List<Species> species() {
        return species;
    }

    /** Columns E, label total, Omega (E omitted when energy is ignored). */
    @Override
    public List<String> columnNames() {
        return energyIgnored ? List.of("label total", "Omega") : List.of("E", "label total", "Omega");
    }

    /** One row per non-zero entry. */
    @Override
    public List<List<Object>> rows() {
        List<List<Object>> out = new ArrayList<>();
        for (int e = 0; e <= maxE; e++) {
            for (int li = 0; li < counts[e].length; li++) {
                BigInteger v = counts[e][li];
                if (v.signum() != 0) {
                    out.add(energyIgnored ? List.of(labelLo + li, v) : List.of(e, labelLo + li, v));
                }
            }
        }
        return Collections.unmodifiableList(out);
    }
}
