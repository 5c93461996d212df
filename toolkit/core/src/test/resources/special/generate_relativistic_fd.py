#!/usr/bin/env python3
"""Writes relativistic-fd-mpmath.csv: 20-digit values of the generalised (relativistic) Fermi-Dirac
integrals used by microtally's RelativisticFermiDirac tests,

  F_k(eta, beta)        = int_0^inf x^k sqrt(1 + beta x/2) f dx,          f = 1/(e^(x-eta) + 1)
  dF_k/deta             = int_0^inf x^k sqrt(1 + beta x/2) f (1 - f) dx
  dF_k/dbeta            = int_0^inf x^(k+1) / (4 sqrt(1 + beta x/2)) f dx
  S_k(eta, beta)        = int_0^inf x^k sqrt(1 + beta x/2) s dx,          s = -f ln f - (1-f) ln(1-f)

for k = -1/2, 1/2, 3/2, 5/2. Each value is computed twice, by mpmath's tanh-sinh and by its
Gauss-Legendre quadrature on the same split intervals (x = u^2 on the first piece, up to
x = max(1, eta - 60), removes the x^k end-point singularity), and a row is written only if both routes agree to 16 digits.

Run: python3 generate_relativistic_fd.py > relativistic-fd-mpmath.csv
"""
import random
import sys
import mpmath as mp

from generate_reference import write_header

mp.mp.dps = 30
DIGITS = 20


def fermi(t):
    return 1 / (mp.exp(t) + 1)


def integrand(what, k, eta, beta):
    def g(x):
        s = mp.sqrt(1 + beta * x / 2)
        t = x - eta
        f = fermi(t)
        if what == "F":
            return x ** k * s * f
        if what == "dEta":
            return x ** k * s * f * fermi(-t)
        if what == "dBeta":
            return x ** (k + 1) / (4 * s) * f
        # entropy density of one state, written without cancellation
        a = abs(t)
        return x ** k * s * (mp.log1p(mp.exp(-a)) + a * mp.exp(-a) / (1 + mp.exp(-a)))
    return g


def integral(what, k, eta, beta, method):
    # mpmath's quadrature stops on an absolute error estimate: scale tiny integrands (eta < 0) to O(1)
    scale = mp.exp(-eta) if eta < 0 else mp.mpf(1)
    raw = integrand(what, k, eta, beta)
    g = lambda x: scale * raw(x)
    head_end = max(mp.mpf(1), eta - 60)
    # first piece in u = sqrt(x): int_0^a g(x) dx = int_0^sqrt(a) 2 u g(u^2) du, cut where the
    # square root's branch point u = i sqrt(2/beta) needs resolving
    cuts = [mp.mpf(0)]
    if beta > 0:
        u_branch = mp.sqrt(2 / beta)
        for m in (1, 4, 16, 64, 256):
            if m * u_branch < mp.sqrt(head_end):
                cuts.append(m * u_branch)
    cuts.append(mp.sqrt(head_end))
    head = mp.quad(lambda u: 2 * u * g(u * u), cuts, method=method)
    pts = [head_end]
    for d in (-20, -5, 0, 5, 20, 60):
        p = eta + d
        if p > pts[-1]:
            pts.append(p)
    for d in (10, 30, 80):  # the exponential tail beyond the Fermi level (or beyond x = 1)
        p = max(eta, head_end) + 60 + d
        pts.append(p)
    pts.append(mp.inf)
    return (head + mp.quad(g, pts, method=method)) / scale


def value(what, k, eta, beta):
    k, eta, beta = mp.mpf(k), mp.mpf(eta), mp.mpf(beta)
    a = integral(what, k, eta, beta, "tanh-sinh")
    b = integral(what, k, eta, beta, "gauss-legendre")
    if abs(a - b) > mp.mpf(10) ** -16 * abs(a):
        raise SystemExit("routes disagree for %s k=%s eta=%s beta=%s: %s vs %s" % (what, k, eta, beta, a, b))
    return a


def main():
    out = sys.stdout
    write_header(out, "generate_relativistic_fd.py", "for microtally's relativistic Fermi-Dirac integral tests",
                 "mpmath tanh-sinh and Gauss-Legendre quadrature to 16 digits",
                 "quantity,k,eta,beta,value   quantity: F, dEta, dBeta, S (see the generator's docstring)",
                 arguments="", digits_end=";")
    etas = ["-300", "-40", "-10", "-2", "-0.5", "0", "0.7", "1.9", "2.3", "5", "15", "31", "34", "80", "400",
            "5000", "1e6"]
    betas = ["0", "1e-9", "1e-4", "0.01", "0.3", "1", "6", "80", "2000"]
    rows = [(e, b) for e in etas for b in betas]
    rnd = random.Random(20261202)
    for _ in range(40):
        eta = rnd.choice([rnd.uniform(-50.0, 5.0), rnd.uniform(0.0, 60.0), 10 ** rnd.uniform(1.0, 5.0)])
        beta = rnd.choice([0.0, 10 ** rnd.uniform(-8.0, 3.0)])
        rows.append((repr(eta), repr(beta)))
    for eta, beta in rows:
        for k in ["-0.5", "0.5", "1.5", "2.5"]:
            for what in ["F", "dEta", "dBeta", "S"]:
                v = value(what, k, mp.mpf(float(eta)), mp.mpf(float(beta)))
                out.write("%s,%s,%s,%s,%s\n" % (what, k, eta, beta, mp.nstr(v, DIGITS)))
        out.flush()


if __name__ == "__main__":
    main()
