"""Reference canonical U and Var E of ideal fermions/bosons in a 2D isotropic oscillator.

Generator: mpmath (Debian python3-mpmath), 60 significant digits. Method: exact elementary (Fermi)
or complete homogeneous (Bose) symmetric-polynomial recursion over single states, carrying the
first and second energy moments, in multiprecision (independent of the Java code's scaling).
Output: canonical_moments_mpmath.csv with columns statistics,spin,cutoff,N,kT,U,VarE.
Run: /usr/bin/python3 canonical_moments_mpmath.py
"""
import mpmath as mp

mp.mp.dps = 60

def states(cutoff, spin):
    out = []
    for e in range(cutoff + 1):
        out += [e] * ((e + 1) * spin)
    return out

def moments(stat, energies, n, kT):
    beta = 1 / mp.mpf(kT)
    c = [mp.mpf(0)] * (n + 1); u = [mp.mpf(0)] * (n + 1); v = [mp.mpf(0)] * (n + 1)
    c[0] = mp.mpf(1)
    for e in energies:
        y = mp.e ** (-beta * e)
        if stat == "FERMI":
            for m in range(n, 0, -1):
                v[m] += y * (v[m-1] + 2 * e * u[m-1] + e * e * c[m-1])
                u[m] += y * (u[m-1] + e * c[m-1])
                c[m] += y * c[m-1]
        else:
            for m in range(1, n + 1):
                v[m] += y * (v[m-1] + 2 * e * u[m-1] + e * e * c[m-1])
                u[m] += y * (u[m-1] + e * c[m-1])
                c[m] += y * c[m-1]
    mean = u[n] / c[n]
    return mean, v[n] / c[n] - mean * mean

cases = [("FERMI", 1, 30, 60, "0.5"), ("FERMI", 2, 30, 90, "0.25"), ("FERMI", 2, 30, 90, "2.0"),
         ("BOSE", 1, 30, 40, "1.5"),
         # added for the stated-accuracy test of Canonical (CanonicalStatedAccuracyTest)
         ("FERMI", 1, 30, 60, "0.1"), ("FERMI", 1, 30, 60, "1.0"), ("FERMI", 1, 30, 60, "5.0"),
         ("FERMI", 2, 40, 200, "0.5"), ("BOSE", 1, 30, 40, "0.5"), ("BOSE", 1, 30, 40, "3.0"),
         ("BOSE", 2, 30, 100, "1.0")]
with open("canonical_moments_mpmath.csv", "w") as f:
    f.write("statistics,spin,cutoff,N,kT,U,VarE\n")
    for stat, spin, cut, n, kT in cases:
        mean, var = moments(stat, states(cut, spin), n, kT)
        f.write("%s,%d,%d,%d,%s,%s,%s\n" % (stat, spin, cut, n, kT, mp.nstr(mean, 30), mp.nstr(var, 30)))
