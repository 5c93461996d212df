#!/usr/bin/env python3
"""Writes reference-mpmath.csv: 30-digit values of zeta(s), Li_s(z) and the complete Fermi-Dirac
integral F_j(eta) = -Li_{j+1}(-e^eta) (DLMF 25.12.14-16) for microtally's special-function tests.

Each value is computed twice by independent mpmath routes (library function and a direct series
or quadrature of the defining integral) and the row is written only if both agree to 20 digits.

Run: python3 generate_reference.py > reference-mpmath.csv
"""
import math
import random
import sys
import mpmath as mp

mp.mp.dps = 45
DIGITS = 30


def write_header(out, generator, subject, confirmation, columns, arguments=None, digits_end=","):
    """The comment lines every reference table in this folder starts with: what the values are for, the
    generator with the mpmath and Python versions and the working digits (mp.mp.dps at the call), how
    each value was confirmed, optionally how the arguments are read, and the column legend."""
    out.write("# Reference values %s.\n" % subject)
    out.write("# Generator: %s with mpmath %s (Python %s), %d working digits%s\n"
              % (generator, mp.__version__, sys.version.split()[0], mp.mp.dps, digits_end))
    out.write("# each value confirmed by %s.\n" % confirmation)
    if arguments is not None:
        out.write("# Arguments are the IEEE doubles nearest the printed decimals%s, used exactly.\n" % arguments)
    out.write("# %s\n" % columns)


def agree(a, b, what):
    a = mp.re(a)
    b = mp.re(b)
    scale = max(abs(a), abs(b))
    if scale != 0 and abs(a - b) > mp.mpf(10) ** -20 * scale:
        raise SystemExit("independent routes disagree for %s: %s vs %s" % (what, a, b))
    return a


def exact(x):
    """The printed decimal as the IEEE double the Java test parses, converted exactly."""
    return mp.mpf(float(x))


def zeta_row(s):
    s = exact(s)
    direct = mp.zeta(s)
    # second route: Dirichlet eta by mpmath's alternating-series summation
    eta = mp.nsum(lambda k: (-1) ** (k + 1) / k ** s, [1, mp.inf])
    other = eta / (1 - mp.power(2, 1 - s))
    return agree(direct, other, "zeta(%s)" % s)


def fd_integral(j, eta):
    """F_j(eta) by quadrature of the defining integral: t in [0, 1] after t = u^(1/(j+1)) (removes the
    end-point singularity of t^j), then pieces split at t = eta."""
    g = lambda t: 1 / (mp.exp(t - eta) + 1)
    head = mp.quad(lambda u: g(u ** (1 / (j + 1))), [0, 1], maxdegree=10) / (j + 1)
    f = lambda t: t ** j * g(t)
    pts = [1] + ([eta - 2, eta, eta + 2] if eta > 3 else [3]) + [max(eta, 1) + 40, max(eta, 1) + 200, mp.inf]
    return (head + mp.quad(f, pts, maxdegree=10)) / mp.gamma(j + 1)


def polylog_row(s, z):
    s = exact(s)
    z = exact(z)
    direct = mp.polylog(s, z)
    if s == -1:  # rational closed forms (Li_0 = z/(1-z) and z d/dz applied to it)
        other = z / (1 - z) ** 2
    elif s == -2:
        other = z * (1 + z) / (1 - z) ** 3
    elif s == 0:
        other = z / (1 - z)
    elif abs(z) <= 0.9:
        other = mp.nsum(lambda k: z ** k / k ** s, [1, mp.inf])
    elif abs(z) < 1 and s > -1:
        # Li_s(z) = (z / Gamma(s+1)) int_0^inf t^s e^t / (e^t - z)^2 dt, the integral of DLMF 25.12.11
        # for order s+1 integrated by parts; valid for s > -1 and real z < 1
        g = lambda t: t ** s * mp.exp(t) / (mp.exp(t) - z) ** 2
        a = abs(1 - z)
        other = z * mp.quad(g, [0, a, 10 * a, 1, 40, mp.inf]) / mp.gamma(s + 1)
    elif z == 1:
        other = mp.zeta(s)
    elif s > 0:  # z <= -1: Li_s(-e^eta) = -F_{s-1}(eta), defining integral
        other = -fd_integral(s - 1, mp.log(-z))
    elif s > -1:  # F_{s-1} = dF_s/deta = (1/Gamma(s+1)) int t^s e^(t-eta) / (e^(t-eta)+1)^2 dt
        eta = mp.log(-z)
        g = lambda t: t ** s * mp.exp(t - eta) / (mp.exp(t - eta) + 1) ** 2
        other = -mp.quad(g, [0, max(eta, 0), max(eta, 0) + 40, mp.inf]) / mp.gamma(s + 1)
    else:
        raise SystemExit("no second route for Li_%s(%s)" % (s, z))
    return agree(direct, other, "Li_%s(%s)" % (s, z))


def fd_row(j, eta):
    j = exact(j)
    eta = exact(eta)
    # enough working digits that 1 + e^eta is not rounded to 1 for very negative eta
    with mp.workdps(int(max(45, -eta / 2.3 + 50))):
        direct = -mp.polylog(j + 1, -mp.exp(eta))
    if -60 <= eta <= 200:
        other = fd_integral(j, eta)
        return agree(direct, other, "F_%s(%s)" % (j, eta))
    if eta < -60:
        # alternating series in e^eta, converges at once
        other = mp.nsum(lambda k: (-1) ** (k + 1) * mp.exp(k * eta) / k ** (j + 1), [1, mp.inf])
        return agree(direct, other, "F_%s(%s)" % (j, eta))
    return mp.re(direct)


def main():
    out = sys.stdout
    write_header(out, "generate_reference.py", "for microtally special-function tests",
                 "a second independent mpmath route to 20 digits",
                 "function,a,b,value   zeta: a = s; polylog: a = s, b = z; fermidirac: a = j, b = eta",
                 arguments=" (as Java parses them)")
    for s in ["1.0001", "1.01", "1.1", "1.5", "2", "2.5", "3", "3.5", "4", "5", "7.5", "10", "20", "50", "100"]:
        out.write("zeta,%s,,%s\n" % (s, mp.nstr(zeta_row(s), DIGITS)))
    orders = ["-2", "-1", "-0.5", "0", "0.3", "0.5", "0.97", "1", "1.03", "1.5", "1.999", "2", "2.04", "2.5",
              "3", "3.5", "4", "5.5", "10", "30"]
    args = ["-1e6", "-100", "-10", "-3", "-2.7", "-1", "-0.9", "-0.6", "-0.5", "-0.3", "-0.001", "0.001",
            "0.3", "0.5", "0.51", "0.7", "0.9", "0.99", "0.999999", "1"]
    for s in orders:
        for z in args:
            if mp.mpf(z) == 1 and mp.mpf(s) <= 1:
                continue
            if mp.mpf(z) < -mp.e and mp.mpf(s) <= 0:
                continue
            out.write("polylog,%s,%s,%s\n" % (s, z, mp.nstr(polylog_row(s, z), DIGITS)))
    for j in ["-0.9", "-0.5", "0", "0.5", "1", "1.5", "2", "2.5", "3", "4.5", "10", "20"]:
        for eta in ["-700", "-50", "-10", "-2", "-0.7", "-0.69", "0", "0.3", "1", "1.01", "2", "5", "10", "20",
                    "39.9", "40.1", "45", "60", "79", "81", "100", "1000", "10000"]:
            out.write("fermidirac,%s,%s,%s\n" % (j, eta, mp.nstr(fd_row(j, eta), DIGITS)))

    # seeded random points across all regimes (Python's Mersenne Twister, seed 20261201), printed
    # with 17 significant digits so that the Java double is the same number
    rnd = random.Random(20261201)
    for _ in range(150):
        s = rnd.uniform(-2.0, 12.0)
        z = rnd.choice([rnd.uniform(-1.0, 1.0), rnd.uniform(-1.0, 1.0), -math.exp(rnd.uniform(0.0, 12.0)),
                        1.0 - math.exp(rnd.uniform(-30.0, -0.7))])
        if z < -math.e and s <= 0:
            s = -s + 0.01
        if z < -1 and s < 0:
            continue
        if s < -1 and abs(z) > 0.9:
            continue  # no independent second route there
        out.write("polylog,%r,%r,%s\n" % (s, z, mp.nstr(polylog_row(repr(s), repr(z)), DIGITS)))
    for _ in range(150):
        j = rnd.uniform(-0.99, 12.0)
        eta = rnd.choice([rnd.uniform(-50.0, 0.0), rnd.uniform(-1.0, 3.0), rnd.uniform(0.0, 120.0)])
        out.write("fermidirac,%r,%r,%s\n" % (j, eta, mp.nstr(fd_row(repr(j), repr(eta)), DIGITS)))


if __name__ == "__main__":
    main()
