#!/usr/bin/env python3
"""Writes zeta-grid-mpmath.csv: 30-digit values of the Riemann zeta function zeta(s) (DLMF 25.2.1)
on a dense grid of real s > 1, for the stated-accuracy test of microtally's Zeta.zeta.

Each value is computed twice by independent mpmath routes (mpmath.zeta, and the Dirichlet eta
series summed by mpmath.nsum divided by 1 - 2^(1-s)); a row is written only if both agree to 20
digits. Arguments are the IEEE doubles nearest the printed decimals, used exactly.

Run: python3 generate_zeta_grid.py > zeta-grid-mpmath.csv
"""
import random
import sys
import mpmath as mp

from generate_reference import write_header, zeta_row

mp.mp.dps = 45
DIGITS = 30


def row(s_text):
    return "zeta,%s,,%s" % (s_text, mp.nstr(zeta_row(s_text), DIGITS, strip_zeros=False))


def main():
    rnd = random.Random(20261202)
    args = []
    args += [repr(1 + 10 ** (-4 + 4 * i / 39)) for i in range(40)]       # 1.0001 .. 2, log spaced
    args += [repr(2 + 0.25 * i) for i in range(57)]                       # 2 .. 16
    args += [repr(16 + 2 * i) for i in range(23)]                         # 16 .. 60 (direct sum)
    args += [repr(1 + rnd.random() * 19) for _ in range(80)]              # random in (1, 20)
    out = sys.stdout
    write_header(out, "generate_zeta_grid.py", "of zeta(s) for microtally's stated-accuracy test",
                 "a second independent mpmath route (eta series) to 20 digits", "function,a,b,value   a = s")
    for a in args:
        out.write(row(a) + "\n")


if __name__ == "__main__":
    main()
