#!/usr/bin/env python3
"""Writes chemical-potential-mpmath.csv: 30-digit chemical potentials mu of ideal Bose and Fermi gases
in a truncated isotropic 2D or 3D harmonic oscillator (levels e = 0..cutoff in units of hbar omega,
degeneracy C(e+d-1, d-1)), solving N(mu) = sum_e g_e / (e^((e - mu)/kT) -+ 1) = N, for the
stated-accuracy test of org.microtally.occupation.ChemicalPotential.

Columns: statistics,dimensions,cutoff,kT,N,mu,dlnN_dmu; the last is (1/N) dN/dmu at the root, with
which the test turns an error in mu into the relative error of <N> it implies (to first order).
The root is found by bisection in 45-digit arithmetic on a bracket checked by sign (Bose: mu below
the ground level 0), then confirmed: N(mu) is re-summed with 60 digits and must agree with N to 25
digits; dN/dmu is the analytic derivative sum g_e f (1 -+ f)/kT, confirmed by a central difference.

Run: python3 generate_chemical_potential.py > chemical-potential-mpmath.csv
"""
import sys
import mpmath as mp

mp.mp.dps = 45
DIGITS = 30


def levels(d, cutoff):
    return [(mp.mpf(e), mp.binomial(e + d - 1, d - 1)) for e in range(cutoff + 1)]


def number(stat, lv, kt, mu):
    sign = -1 if stat == "BOSE" else 1
    return mp.fsum(g / (mp.exp((e - mu) / kt) + sign) for e, g in lv)


def slope(stat, lv, kt, mu):
    sign = -1 if stat == "BOSE" else 1
    total = mp.mpf(0)
    for e, g in lv:
        f = 1 / (mp.exp((e - mu) / kt) + sign)
        total += g * f * (1 - sign * f) / kt
    return total


def solve(stat, lv, kt, n):
    if stat == "BOSE":
        lo, hi = -mp.mpf(10) ** 6, -mp.mpf(10) ** -40
    else:
        lo, hi = -mp.mpf(10) ** 6, mp.mpf(10) ** 6
    assert number(stat, lv, kt, lo) < n < number(stat, lv, kt, hi)
    for _ in range(400):
        mid = (lo + hi) / 2
        if number(stat, lv, kt, mid) < n:
            lo = mid
        else:
            hi = mid
        if hi - lo < mp.mpf(10) ** -38 * max(1, abs(mid)):
            break
    return (lo + hi) / 2


def main():
    out = sys.stdout
    out.write("# Chemical potentials for microtally's ChemicalPotential stated-accuracy test.\n")
    out.write("# Generator: generate_chemical_potential.py with mpmath %s (Python %s), 45 working digits;\n"
              % (mp.__version__, sys.version.split()[0]))
    out.write("# each root re-checked with 60 digits (N(mu) = N to 25 digits), each slope by a central difference.\n")
    out.write("# statistics,dimensions,cutoff,kT,N,mu,dlnN_dmu\n")
    cases = []
    for kt in ("0.05", "0.3", "1", "5", "20"):
        cases += [("FERMI", 2, 40, kt, n) for n in ("1", "7.5", "42", "300")]
        cases += [("FERMI", 3, 30, kt, n) for n in ("20", "1000")]
        cases += [("BOSE", 3, 60, kt, n) for n in ("1", "100", "2000")]
    for stat, d, cut, kt, n in cases:
        lv = levels(d, cut)
        k = mp.mpf(kt)
        nn = mp.mpf(n)
        mu = solve(stat, lv, k, nn)
        with mp.workdps(60):
            check = number(stat, lv, k, mu)
        if abs(check - nn) > mp.mpf(10) ** -25 * nn:
            raise SystemExit("root check failed for %s" % ((stat, d, cut, kt, n),))
        s = slope(stat, lv, k, mu) / nn
        h = mp.mpf(10) ** -15 * max(1, abs(mu))
        diff = (number(stat, lv, k, mu + h) - number(stat, lv, k, mu - h)) / (2 * h) / nn
        if abs(diff - s) > mp.mpf(10) ** -10 * abs(s):
            raise SystemExit("slope check failed for %s" % ((stat, d, cut, kt, n),))
        out.write("%s,%d,%d,%s,%s,%s,%s\n" % (stat, d, cut, kt, n, mp.nstr(mu, DIGITS, strip_zeros=False),
                                               mp.nstr(s, 10)))


if __name__ == "__main__":
    main()
