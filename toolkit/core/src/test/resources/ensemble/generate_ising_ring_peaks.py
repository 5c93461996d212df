#!/usr/bin/env python3
"""Writes ising-ring-peaks-mpmath.csv: the temperature kT/J of the heat-capacity maximum of the periodic
ferromagnetic Ising ring of N spins (H = -J sum s_i s_{i+1}), for the stated-accuracy test of
org.microtally.ensemble.ExactCanonical.heatCapacityPeak.

Route 2: Z = (2 cosh K)^N + (2 sinh K)^N, K = J/kT (transfer matrix, closed form); with k2 = d^2 ln Z/dbeta^2
and k3 = -d^3 ln Z/dbeta^3 (mpmath.diff at 50 digits), C = beta^2 k2 and dC/dbeta = beta (2 k2 - beta k3);
the peak is the root of 2 k2 - beta k3 (mpmath.findroot), 120 digits for the derivatives.
Route 1: the same central moments from the exact density of states g(E = -J(N - 2w)) = 2 C(N, w), w even
(domain walls), summed directly (the root is found on this route first); the root and C there must agree with route 2
to 20 digits.

Run: python3 generate_ising_ring_peaks.py > ising-ring-peaks-mpmath.csv
"""
import sys
import mpmath as mp

mp.mp.dps = 50
DIGITS = 25


def ln_z_closed(n, beta):
    return mp.log((2 * mp.cosh(beta)) ** n + (2 * mp.sinh(beta)) ** n)


def moments_closed(n, beta):
    with mp.workdps(120):
        return +mp.diff(lambda b: ln_z_closed(n, b), beta, 2), -mp.diff(lambda b: ln_z_closed(n, b), beta, 3)


def moments_dos(n, beta):
    terms = [(2 * mp.binomial(n, w), -(n - 2 * w)) for w in range(0, n + 1, 2)]
    z = mp.fsum(g * mp.exp(-beta * e) for g, e in terms)
    u = mp.fsum(g * e * mp.exp(-beta * e) for g, e in terms) / z
    k2 = mp.fsum(g * (e - u) ** 2 * mp.exp(-beta * e) for g, e in terms) / z
    k3 = mp.fsum(g * (e - u) ** 3 * mp.exp(-beta * e) for g, e in terms) / z
    return k2, k3


def slope(moments, n, beta):
    k2, k3 = moments(n, beta)
    return 2 * k2 - beta * k3


def main():
    out = sys.stdout
    out.write("# Heat-capacity maxima of the periodic Ising ring for microtally's ExactCanonical stated-accuracy test.\n")
    out.write("# Generator: generate_ising_ring_peaks.py with mpmath %s (Python %s), 50 working digits;\n"
              % (mp.__version__, sys.version.split()[0]))
    out.write("# confirmed by a second route (exact density of states) to 20 digits.\n")
    out.write("# N,kT_peak,C_peak   (J = 1, k = 1)\n")
    # up to N = 32 the ring has a single maximum in 0.3 < kT < 3; from N ~ 48 a second one appears near
    # the bulk value kT = 0.83, and which is the larger is not what this table tests
    for n in (4, 6, 8, 10, 12, 14, 16, 18, 20, 22, 24, 28, 32):
        # bracket: the sign change of the slope on a grid of beta = 1/kT, kT from 3 down to 0.3
        grid = [1 / (3 - mp.mpf(i) / 100) for i in range(271)]
        k = next(i for i in range(len(grid) - 1)
                 if slope(moments_dos, n, grid[i]) > 0 > slope(moments_dos, n, grid[i + 1]))
        beta = mp.findroot(lambda b: slope(moments_dos, n, b), (grid[k], grid[k + 1]), solver="anderson")
        beta2 = mp.findroot(lambda b: slope(moments_closed, n, b), (grid[k], grid[k + 1]), solver="anderson")
        if abs(beta - beta2) > mp.mpf(10) ** -20 * beta:
            raise SystemExit("routes disagree on the peak for N = %d: %s vs %s" % (n, beta, beta2))
        c1, c2 = beta ** 2 * moments_closed(n, beta)[0], beta ** 2 * moments_dos(n, beta)[0]
        if abs(c1 - c2) > mp.mpf(10) ** -20 * c1:
            raise SystemExit("routes disagree on C for N = %d" % n)
        out.write("%d,%s,%s\n" % (n, mp.nstr(1 / beta, DIGITS, strip_zeros=False), mp.nstr(c1, DIGITS, strip_zeros=False)))


if __name__ == "__main__":
    main()
