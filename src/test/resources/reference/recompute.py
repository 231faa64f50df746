#!/usr/bin/env python3
"""Recomputes the reference values that the code and tests once wrote down from memory, at 40 digits with
mpmath (a general-purpose arbitrary-precision library; Debian package python3-mpmath), and writes them to
values.tsv beside this script (name, index, value with 20 significant digits). ReferenceValuesTest checks
the project's constants and results against that file.

Run from anywhere:  python3 src/test/resources/reference/recompute.py
"""
import os
import mpmath as mp

mp.mp.dps = 40


def erfi(x):
    # erfi(x) = -i erf(ix) = (2/sqrt(pi)) Integral_0^x exp(t^2) dt (Abramowitz and Stegun 7.1.1)
    return mp.erfi(x)


def gauss_legendre(n):
    """Nodes and weights of the n-point Gauss-Legendre rule on [-1, 1], ascending: the roots of P_n by
    Newton's method from the Chebyshev-like starts cos(pi (i - 1/4) / (n + 1/2)), weights
    2 / ((1 - x^2) P_n'(x)^2) (Abramowitz and Stegun 25.4.29)."""
    nodes, weights = [], []
    for i in range(1, n + 1):
        x = mp.cos(mp.pi * (i - mp.mpf(1) / 4) / (n + mp.mpf(1) / 2))
        for _ in range(100):
            p = mp.legendre(n, x)
            dp = n * (x * p - mp.legendre(n - 1, x)) / (x * x - 1)
            dx = p / dp
            x -= dx
            if abs(dx) < mp.mpf(10) ** (-mp.mp.dps + 5):
                break
        dp = n * (x * mp.legendre(n, x) - mp.legendre(n - 1, x)) / (x * x - 1)
        nodes.append(x)
        weights.append(2 / ((1 - x * x) * dp * dp))
    order = sorted(range(n), key=lambda k: nodes[k])
    return [nodes[k] for k in order], [weights[k] for k in order]


def main():
    rows = [("erfi", 0, erfi(1))]
    xs, ws = gauss_legendre(12)
    rows += [("gauss_legendre_12_node", i, x) for i, x in enumerate(xs)]
    rows += [("gauss_legendre_12_weight", i, w) for i, w in enumerate(ws)]
    out = os.path.join(os.path.dirname(os.path.abspath(__file__)), "values.tsv")
    with open(out, "w", encoding="utf-8") as f:
        f.write("# written by recompute.py (mpmath %s, %d digits); do not edit by hand\n" % (mp.__version__, mp.mp.dps))
        f.write("name\tindex\tvalue\n")
        for name, i, v in rows:
            f.write("%s\t%d\t%s\n" % (name, i, mp.nstr(v, 20, min_fixed=-1, max_fixed=1)))
    print("wrote %d values to %s" % (len(rows), out))


if __name__ == "__main__":
    main()
