#!/usr/bin/env python3
"""Writes relativistic-gas-mpmath.csv: reference equation-of-state points for microtally's
RelativisticFermiGas tests, computed here from the definitions alone (nothing from microtally):

  beta = k T / (m c^2),  K_n = 8 pi sqrt(2) (m c / h)^3,  K_p = m c^2 K_n,
  N(eta)  = int_0^inf x^1/2 (1 + beta x) sqrt(1 + beta x/2) f dx            f = 1/(e^(x-eta) + 1)
  n       = K_n beta^3/2 N(eta) per species; electrons with positrons at eta_+ = -eta - 2/beta,
            charge neutrality n_- - n_+ = rho / (mu_e m_u); neutrons: n = rho / m_n, no antiparticles
  P       = (2/3) K_p beta^5/2 int x^3/2 (1 + beta x/2)^3/2 f dx             (summed over species)
  U/V     = K_p beta^5/2 int x^3/2 (1 + beta x) sqrt(1 + beta x/2) f dx  + 2 m c^2 n_+
  S/V     = k K_n beta^3/2 int x^1/2 (1 + beta x) sqrt(1 + beta x/2) s dx   s = -f ln f - (1-f) ln(1-f)

with CODATA 2018 constants. eta is the root of the neutrality (number) equation found by mpmath's
Anderson-Bjorck bracketing solver on a bracket from bisection, every integral by mpmath's tanh-sinh
quadrature on intervals split at the Fermi level (x = u^2 on the first piece), at 30 digits; the
final n, P, U, S are recomputed by Gauss-Legendre on the same intervals and a row is written only if
both routes agree to 16 digits.

Run: python3 generate_relativistic_gas.py > relativistic-gas-mpmath.csv
"""
import sys
import mpmath as mp

mp.mp.dps = 30
K = mp.mpf("1.380649e-23")
H = mp.mpf("6.62607015e-34")
C = mp.mpf("299792458")
M_E = mp.mpf("9.1093837015e-31")
M_U = mp.mpf("1.66053906660e-27")
M_N = mp.mpf("1.67492749804e-27")


def fermi(t):
    return 1 / (mp.exp(t) + 1)


def state_entropy(t):
    a = abs(t)
    return mp.log1p(mp.exp(-a)) + a * mp.exp(-a) / (1 + mp.exp(-a))


def quad(g, eta, method):
    """int_0^inf g(x) dx, split at the Fermi level; tiny integrands (eta < 0) scaled to O(1) first."""
    scale = mp.exp(-eta) if eta < 0 else mp.mpf(1)
    head_end = max(mp.mpf(1), eta - 60)
    head = mp.quad(lambda u: 2 * u * scale * g(u * u), [0, mp.sqrt(head_end)], method=method)
    pts = [head_end]
    for d in (-20, -5, 0, 5, 20, 60):
        if eta + d > pts[-1]:
            pts.append(eta + d)
    for d in (10, 30, 80):
        pts.append(max(eta, head_end) + 60 + d)
    pts.append(mp.inf)
    return (head + mp.quad(lambda x: scale * g(x), pts, method=method)) / scale


def number(eta, beta, method="tanh-sinh"):
    return quad(lambda x: mp.sqrt(x) * (1 + beta * x) * mp.sqrt(1 + beta * x / 2) * fermi(x - eta), eta, method)


def moments(eta, beta, method):
    """(N, P-integral, U-integral, S-integral) of one species."""
    n = number(eta, beta, method)
    p = quad(lambda x: x ** mp.mpf(1.5) * (1 + beta * x / 2) ** mp.mpf(1.5) * fermi(x - eta), eta, method)
    u = quad(lambda x: x ** mp.mpf(1.5) * (1 + beta * x) * mp.sqrt(1 + beta * x / 2) * fermi(x - eta), eta, method)
    s = quad(lambda x: mp.sqrt(x) * (1 + beta * x) * mp.sqrt(1 + beta * x / 2) * state_entropy(x - eta), eta, method)
    return n, p, u, s


def solve(target, beta, pairs):
    """eta with N(eta) - N(-eta - 2/beta) = target (pairs) or N(eta) = target."""
    def g(eta):
        n = number(eta, beta)
        if pairs and -eta - 2 / beta > -700:
            n -= number(-eta - 2 / beta, beta)
        return n / target - 1
    lo = -2 / beta / 2 if pairs else mp.mpf(-700)
    lo = max(lo, mp.mpf(-700))
    hi = mp.mpf(1)
    while g(hi) < 0:
        lo = hi
        hi *= 4
    for _ in range(8):  # a narrower bracket for the bracketing solver
        mid = (lo + hi) / 2
        if g(mid) < 0:
            lo = mid
        else:
            hi = mid
    return mp.findroot(g, (lo, hi), solver="anderson", tol=mp.mpf(10) ** -26)


def row(species, rho, mu_e, kelvin):
    rho, kelvin = mp.mpf(rho), mp.mpf(kelvin)
    mass = M_E if species == "electron" else M_N
    pairs = species == "electron"
    net = rho / (mp.mpf(mu_e) * M_U) if pairs else rho / M_N
    beta = K * kelvin / (mass * C ** 2)
    kn = 8 * mp.pi * mp.sqrt(2) * (mass * C / H) ** 3
    kp = mass * C ** 2 * kn
    eta = solve(net / (kn * beta ** mp.mpf(1.5)), beta, pairs)
    results = []
    for method in ("tanh-sinh", "gauss-legendre"):
        n1, p1, u1, s1 = moments(eta, beta, method)
        n2 = p2 = u2 = s2 = mp.mpf(0)
        eta_plus = -eta - 2 / beta
        if pairs and eta_plus > -700:
            n2, p2, u2, s2 = moments(eta_plus, beta, method)
        b15 = beta ** mp.mpf(1.5)
        b25 = beta ** mp.mpf(2.5)
        n_minus = kn * b15 * n1
        n_plus = kn * b15 * n2
        pressure = 2 * kp * b25 * (p1 + p2) / 3
        energy = kp * b25 * (u1 + u2) + 2 * mass * C ** 2 * n_plus
        entropy = K * kn * b15 * (s1 + s2)
        results.append((n_minus, n_plus, pressure, energy, entropy))
    for a, b in zip(results[0], results[1]):
        if abs(a - b) > mp.mpf(10) ** -16 * abs(a):
            raise SystemExit("routes disagree for %s %s %s %s: %s vs %s" % (species, rho, mu_e, kelvin, a, b))
    return [eta] + list(results[0])


# (species, rho in kg/m^3, mu_e, T in K): the benchmark states, the classical gas, partial and strong
# degeneracy on both sides of the Sommerfeld switch (eta = 50), pair plasmas, other mu_e, neutrons
STATES = [
    ("electron", "1e9", "2", "1e7"), ("electron", "1e6", "2", "1e7"), ("electron", "1e9", "2", "3162277660.1683795"),
    ("electron", "1e3", "2", "1e6"), ("electron", "1e-3", "1", "1e4"), ("electron", "1e5", "2", "2e6"),
    ("electron", "1e7", "2", "3e7"), ("electron", "3e8", "2", "1e7"), ("electron", "1e12", "2", "1e8"),
    ("electron", "1e11", "2", "1e9"), ("electron", "1e6", "2", "1e9"), ("electron", "1e8", "2", "5e9"),
    ("electron", "1e5", "2", "1e10"), ("electron", "1e2", "2", "3e9"), ("electron", "1e7", "2.15", "1e8"),
    ("electron", "1e10", "1", "2e9"), ("electron", "1e14", "2", "1e11"),
    ("neutron", "1e17", "1", "1e10"), ("neutron", "1e18", "1", "1e11"), ("neutron", "1e15", "1", "1e9"),
    ("neutron", "1e12", "1", "1e8"),
]


def main():
    out = sys.stdout
    out.write("# Reference equation-of-state points for microtally's RelativisticFermiGas tests.\n")
    out.write("# Generator: generate_relativistic_gas.py with mpmath %s (Python %s), %d working digits;\n"
              % (mp.__version__, sys.version.split()[0], mp.mp.dps))
    out.write("# n, P, U, S confirmed by mpmath tanh-sinh and Gauss-Legendre quadrature to 16 digits.\n")
    out.write("# Inputs are the IEEE doubles nearest the printed decimals; SI units (kg/m^3, K, m^-3, Pa, J/m^3, J/(K m^3)).\n")
    out.write("# species,rho,mu_e,T,eta,n_minus,n_plus,P,U,S\n")
    for species, rho, mu_e, kelvin in STATES:
        values = row(species, mp.mpf(float(rho)), mp.mpf(float(mu_e)), mp.mpf(float(kelvin)))
        out.write("%s,%s,%s,%s,%s\n" % (species, rho, mu_e, kelvin, ",".join(mp.nstr(v, 20) for v in values)))
        out.flush()


if __name__ == "__main__":
    main()
