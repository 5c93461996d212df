#!/usr/bin/env python3
"""Writes ideal-gas-mpmath.csv: 30-digit reduced thermodynamic-limit quantities of the ideal Bose and
Fermi gases with a power-law density of states g(e) = C e^(alpha-1), for the stated-accuracy tests of
org.microtally.limit.BoseGas and FermiGas (they do not depend on C, the mass or any constant).

Bose gas, t = T/T_c (Bagnato, Pritchard & Kleppner, PRA 35, 4354 (1987)):
  z solves Li_alpha(z) = zeta(alpha) t^-alpha above T_c (z = 1 below);
  U/(N kT) = alpha Li_{alpha+1}(z)/Li_alpha(z) above, alpha t^alpha zeta(alpha+1)/zeta(alpha) below;
  C/(N k) = alpha(alpha+1) Li_{alpha+1}/Li_alpha - alpha^2 Li_alpha/Li_{alpha-1} above,
            alpha(alpha+1) zeta(alpha+1)/zeta(alpha) t^alpha below.
Fermi gas, t = T/T_F, F_j(eta) = -Li_{j+1}(-e^eta) (DLMF 25.12.14-16):
  eta solves F_{alpha-1}(eta) = t^-alpha / Gamma(alpha+1); mu/E_F = eta t;
  U/(N E_F) = alpha t F_alpha(eta)/F_{alpha-1}(eta);
  C/(N k) = alpha(alpha+1) F_alpha/F_{alpha-1} - alpha^2 F_{alpha-1}/F_{alpha-2}.

Maxwell-Boltzmann speed cdf, x = v/v_p: P(x) = erf(x) - (2/sqrt pi) x e^(-x^2), second route the
  regularised incomplete gamma P(3/2, x^2) (DLMF 7.2, 8.2).

Every function value is computed by two independent mpmath routes (mpmath.polylog, and quadrature of
the defining integral; the Bose-Einstein integral DLMF 25.12.11, the Fermi-Dirac integral as in
../special/generate_reference.py); the root is found with the first route and its residual checked
with the second; a row is written only if both routes agree to 20 digits. Arguments t are the IEEE
doubles nearest the printed decimals, used exactly.

Run: python3 generate_ideal_gases.py > ideal-gas-mpmath.csv
"""
import os
import sys
import mpmath as mp

# shared with the special/ tables: F_j(eta) by quadrature of its defining integral (their own second
# route), the check that two routes agree to 20 digits, and a printed argument read as its exact double
sys.path.insert(0, os.path.join(os.path.dirname(os.path.abspath(__file__)), "..", "special"))
from generate_reference import agree, exact, fd_integral  # noqa: E402

mp.mp.dps = 45
DIGITS = 30


def bose_integral(s, z):
    """Li_s(z) = (1/Gamma(s)) int_0^inf x^(s-1) / (e^x / z - 1) dx for s > 0, 0 < z < 1 (DLMF 25.12.11);
    for 0 < s <= 1 integrated by parts: (z / Gamma(s+1)) int x^s e^x / (e^x - z)^2 dx."""
    a = 1 - z
    g = lambda x: x ** s * mp.exp(x) / (mp.exp(x) - z) ** 2
    return z * mp.quad(g, [0, a, 10 * a, 1, 40, 200, mp.inf]) / mp.gamma(s + 1)


def li(s, z):
    return agree(mp.re(mp.polylog(s, z)), bose_integral(s, z), "Li_%s(%s)" % (s, z))


def fd_polylog(j, eta):
    with mp.workdps(60):
        return mp.re(-mp.polylog(j + 1, -mp.exp(eta)))


def fd(j, eta):
    if j == -1:  # F_-1 = logistic function, closed form
        return 1 / (1 + mp.exp(-eta))
    return agree(fd_polylog(j, eta), fd_integral(j, eta), "F_%s(%s)" % (j, eta))


def bose_rows(alpha, t, out):
    a = mp.mpf(alpha)
    t = exact(t)
    if t <= 1:
        z = mp.mpf(1)
        u = a * t ** a * mp.zeta(a + 1) / mp.zeta(a)
        c = a * (a + 1) * mp.zeta(a + 1) / mp.zeta(a) * t ** a
    else:
        y = mp.zeta(a) * t ** -a
        # bracket y/(1+y) <= z <= min(y, 1) (Li_a(z) >= z and <= z/(1-z)), bracketing solver
        lo, hi = mp.log(y / (1 + y)), min(mp.log(y), mp.mpf(0))
        lnz = mp.re(mp.findroot(lambda x: mp.log(mp.polylog(a, mp.exp(x))) - mp.log(y), (lo, hi), solver="anderson"))
        z = mp.exp(lnz)
        agree(li(a, z), y, "Bose root residual at t = %s" % t)
        u = a * li(a + 1, z) / li(a, z)
        c = a * (a + 1) * li(a + 1, z) / li(a, z) - a * a * li(a, z) / li(a - 1, z)
    for name, value in (("fugacity", z), ("u_per_kt", u), ("c", c)):
        out.write("bose,%s,%r,%s,%s\n" % (alpha, float(t), name, mp.nstr(value, DIGITS, strip_zeros=False)))


def fermi_rows(alpha, t, out):
    a = mp.mpf(alpha)
    t = exact(t)
    j = a - 1
    y = t ** -a / mp.gamma(a + 1)
    start = max(1 / t, mp.mpf(1)) if y > 1 else mp.log(y)
    eta = mp.re(mp.findroot(lambda e: mp.log(fd_polylog(j, e)) - mp.log(y), start, tol=mp.mpf(10) ** -40))
    agree(fd(j, eta), y, "Fermi root residual at t = %s" % t)
    u = a * t * fd(a, eta) / fd(j, eta)
    c = a * (a + 1) * fd(a, eta) / fd(j, eta) - a * a * fd(j, eta) / fd(a - 2, eta)
    for name, value in (("eta", eta), ("mu_per_ef", eta * t), ("u_per_ef", u), ("c", c)):
        out.write("fermi,%s,%r,%s,%s\n" % (alpha, float(t), name, mp.nstr(value, DIGITS, strip_zeros=False)))


def maxwell_row(x, out):
    x = exact(x)
    closed = mp.erf(x) - 2 / mp.sqrt(mp.pi) * x * mp.exp(-x * x)
    value = agree(closed, mp.gammainc(mp.mpf(1.5), 0, x * x, regularized=True), "Maxwell cdf at %s" % x)
    out.write("maxwell,,%r,cdf,%s\n" % (float(x), mp.nstr(value, DIGITS, strip_zeros=False)))


def main():
    out = sys.stdout
    out.write("# Reduced ideal-gas quantities for microtally's limit stated-accuracy tests.\n")
    out.write("# Generator: generate_ideal_gases.py with mpmath %s (Python %s), 45 working digits,\n"
              % (mp.__version__, sys.version.split()[0]))
    out.write("# each function value confirmed by a second independent mpmath route (quadrature) to 20 digits.\n")
    out.write("# gas,alpha,t,quantity,value   bose: t = T/T_c; fermi: t = T/T_F; maxwell: t = v/v_p\n")
    for alpha in ("1.5", "3"):
        for t in ("0.3", "0.7", "0.99", "1.001", "1.01", "1.1", "1.5", "2", "5", "20", "100"):
            bose_rows(alpha, t, out)
    for alpha in ("1.5", "2", "3"):
        for t in ("0.001", "0.005", "0.01", "0.02", "0.05", "0.1", "0.3", "0.5", "1", "2", "5", "20", "100"):
            fermi_rows(alpha, t, out)
    for x in ("0.001", "0.01", "0.1", "0.3", "0.49", "0.5", "0.51", "0.7", "1", "1.5", "2", "3", "4", "6"):
        maxwell_row(x, out)


if __name__ == "__main__":
    main()
