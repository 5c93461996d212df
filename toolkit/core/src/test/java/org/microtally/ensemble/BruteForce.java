package org.microtally.ensemble;

import org.microtally.spectrum.Spectrum;
import org.microtally.spectrum.Statistics;

/**
 * Independent reference for the tests: enumerates every N-particle microstate of a small spectrum
 * directly (occupation vectors over the individual states for indistinguishable particles, state
 * assignments of labelled particles for distinguishable ones) and sums Boltzmann weights.
 * Deliberately naive: no generating functions, no scaling.
 */
final class BruteForce {
    final double z;
    final double u;
    final double varE;
    final double[] perLevel;
    final double[] groundLevelDistribution;

    private final double[] stateEnergy;
    private final int[] stateLevel;
    private final int cap;
    private final double beta;
    private final double e0;
    private double zs;
    private double e1;
    private double e2;
    private final double[] occ;
    private final double[] ground;
    private final int g0;

    BruteForce(Spectrum s, Statistics st, int n, double kT) {
        int states = (int) s.stateCount();
        stateEnergy = new double[states];
        stateLevel = new int[states];
        int k = 0;
        for (int i = 0; i < s.size(); i++) {
            for (int d = 0; d < s.degeneracy(i); d++) {
                stateEnergy[k] = s.energy(i);
                stateLevel[k] = i;
                k++;
            }
        }
        cap = st.capped() ? st.maxOccupancy() : n;
        beta = 1 / kT;
        e0 = s.groundEnergy();
        occ = new double[s.size()];
        ground = new double[n + 1];
        g0 = s.degeneracy(0);
        if (st.indistinguishable()) {
            recurse(0, n, new int[states]);
        } else {
            assign(0, n, new int[n]);
        }
        z = zs;
        u = e1 / zs;
        varE = e2 / zs - u * u;
        perLevel = new double[s.size()];
        for (int i = 0; i < s.size(); i++) {
            perLevel[i] = occ[i] / zs / s.degeneracy(i);
        }
        groundLevelDistribution = new double[n + 1];
        for (int j = 0; j <= n; j++) {
            groundLevelDistribution[j] = ground[j] / zs;
        }
    }

    private void recurse(int state, int left, int[] config) {
        if (state == stateEnergy.length) {
            if (left == 0) {
                record(config);
            }
            return;
        }
        for (int m = 0; m <= Math.min(cap, left); m++) {
            config[state] = m;
            recurse(state + 1, left - m, config);
        }
        config[state] = 0;
    }

    private void assign(int particle, int n, int[] stateOf) {
        if (particle == n) {
            int[] config = new int[stateEnergy.length];
            for (int p = 0; p < n; p++) {
                config[stateOf[p]]++;
            }
            record(config);
            return;
        }
        for (int s = 0; s < stateEnergy.length; s++) {
            stateOf[particle] = s;
            assign(particle + 1, n, stateOf);
        }
    }

    private void record(int[] config) {
        double e = 0;
        int inGround = 0;
        for (int s = 0; s < config.length; s++) {
            e += config[s] * stateEnergy[s];
            if (stateLevel[s] == 0) {
                inGround += config[s];
            }
        }
        double w = Math.exp(-beta * (e - e0 * sum(config)));
        zs += w;
        e1 += w * e;
        e2 += w * e * e;
        for (int s = 0; s < config.length; s++) {
            occ[stateLevel[s]] += w * config[s];
        }
        ground[inGround] += w;
    }

    private static int sum(int[] c) {
        int t = 0;
        for (int x : c) {
            t += x;
        }
        return t;
    }

    /** Asserts that {@code c} (built for the same spectrum, statistics, n and kT) agrees on ln Z, U and Var E. */
    void assertThermodynamicsMatch(Canonical c, int n, String ctx) {
        org.junit.jupiter.api.Assertions.assertEquals(lnZ(n), c.lnZ(), 1e-12 * Math.max(1, Math.abs(lnZ(n))), ctx);
        org.junit.jupiter.api.Assertions.assertEquals(u, c.energy(), 1e-11 * Math.max(1, Math.abs(u)), ctx);
        org.junit.jupiter.api.Assertions.assertEquals(varE, c.energyVariance(), 1e-10 * Math.max(1, varE), ctx);
    }

    /** ln Z including the ground-energy shift removed in the weights. */
    double lnZ(int n) {
        return Math.log(z) - beta * e0 * n;
    }
}
