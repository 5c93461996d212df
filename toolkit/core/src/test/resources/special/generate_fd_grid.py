#!/usr/bin/env python3
"""Writes fd-grid-mpmath.csv: 30-digit values of the complete Fermi-Dirac integral
F_j(eta) = -Li_{j+1}(-e^eta) (DLMF 25.12.14-16) for j = -1/2, 1/2, 3/2, 5 and 12 on a dense grid of
1 < eta < 41, the range where microtally interpolates its quadrature, for the stated-accuracy test.

Each value is computed twice by independent mpmath routes (mpmath.polylog, and quadrature of the
defining integral as in generate_reference.py); a row is written only if both agree to 20 digits.
Arguments are the IEEE doubles nearest the printed decimals, used exactly.

Run: python3 generate_fd_grid.py > fd-grid-mpmath.csv
"""
import random
import sys
import mpmath as mp

from generate_reference import fd_row, write_header, DIGITS

mp.mp.dps = 45


def main():
    rnd = random.Random(41)
    out = sys.stdout
    write_header(out, "generate_fd_grid.py", "of F_j(eta) for microtally's stated-accuracy test",
                 "a second independent mpmath route (quadrature) to 20 digits", "function,a,b,value   a = j, b = eta")
    for j in ["-0.5", "0.5", "1.5", "5", "12"]:
        etas = [repr(1 + 0.5 * i) for i in range(1, 80)] + [repr(1 + 40 * rnd.random()) for _ in range(20)]
        for eta in etas:
            out.write("fermidirac,%s,%s,%s\n" % (j, eta, mp.nstr(fd_row(j, eta), DIGITS, strip_zeros=False)))


if __name__ == "__main__":
    main()
