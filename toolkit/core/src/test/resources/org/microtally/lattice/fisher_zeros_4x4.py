#!/usr/bin/python3
"""Reference Fisher zeros of the 4 x 4 periodic square Ising lattice, generated with mpmath.

Z e^{-32 K} = sum_k g_k x^k, x = e^{-2K}, with the g_k of the 4 x 4 torus (E = 2k - 32):
2, 32, 64, 424, 1728, 6688, 13568, 20524, ... (symmetric), checked in the tests by Gray-code
brute force over all 2^16 states. Roots by mpmath.polyroots (Durand-Kerner) at 60 digits.
Run: /usr/bin/python3 fisher_zeros_4x4.py > fisher_zeros_4x4.csv   (mpmath 1.2.1, Debian python3-mpmath)
"""
import mpmath

mpmath.mp.dps = 60
g = {0: 2, 8: 32, 12: 64, 16: 424, 20: 1728, 24: 6688, 28: 13568, 32: 20524,
     36: 13568, 40: 6688, 44: 1728, 48: 424, 52: 64, 56: 32, 64: 2}
# k = (E + 32) / 2 unequal bonds; only even k occur
poly = [0] * 33
for key, val in g.items():
    poly[key // 2] = val
roots = mpmath.polyroots(list(reversed(poly)), maxsteps=2000, extraprec=400)
print("# re,im  (mpmath %s, dps 60, polyroots)" % mpmath.__version__)
for r in sorted(roots, key=lambda z: (float(mpmath.im(z)), float(mpmath.re(z)))):
    print("%s,%s" % (mpmath.nstr(mpmath.re(r), 35), mpmath.nstr(mpmath.im(r), 35)))
