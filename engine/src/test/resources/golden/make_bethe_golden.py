#!/usr/bin/python3
"""Recompute the hydrogen Bethe logarithms ln k0(n, l), n = 1..8, l = 0..n-1.

Run with Debian's interpreter and Debian's python3-mpmath:

    /usr/bin/python3 make_bethe_golden.py

Writes bethe-logarithms.csv next to this script.  Deterministic; refuses to write if a
cross-check fails.

Definition (atomic units, Z = 1, infinite nuclear mass; H. A. Bethe, Phys. Rev. 72, 339
(1947); H. A. Bethe and E. E. Salpeter, Quantum Mechanics of One- and Two-Electron Atoms
(Springer, 1957), the chapter on radiative corrections; the normalisation for l > 0 is
the one the tabulations use, G. W. F. Drake and R. A. Swainson, Phys. Rev. A 41, 1243
(1990), and the CODATA adjustments, e.g. P. J. Mohr, B. N. Taylor, D. B. Newell,
Rev. Mod. Phys. 84, 1527 (2012)):

    ln k0(n, l) = (n^3 / 2) * sum_m |<m|p|n l>|^2 (E_m - E_n) ln(2 |E_m - E_n|)

where the sum runs over all bound and continuum states m (all magnetic sublevels),
E in hartree, so 2 |E_m - E_n| is the excitation energy in rydbergs.  With
|<m|p|n>|^2 = (E_m - E_n)^2 |<m|r|n>|^2 and the angular sum max(l, l') / (2l + 1) this is

    (n^3 / 2) * sum_{l' = l +- 1} max(l, l') / (2l + 1) *
        [ sum_{n'} dE^3 R(n l; n' l')^2 ln(2|dE|) + int_0^inf dE' dE^3 R(n l; E' l')^2 ln(2 dE) ]

R is the radial integral int R_nl r R_m r^2 dr; continuum functions are normalised on the
energy scale (delta(E - E')).  Bound-bound integrals are exact finite sums of
int r^p e^(-lambda r) dr = p! / lambda^(p+1).  Bound-free integrals use
int r^(s-1) e^(-lambda r) M(a, b, c r) dr = Gamma(s) lambda^(-s) 2F1(a, s; b; c / lambda)
(M. Abramowitz and I. A. Stegun, Handbook of Mathematical Functions (1964), 13.10.3, with
Euler's transformation 15.3.3), whose 2F1 terminates after Euler's transformation here, so every term is
elementary.  The sum over n' is taken explicitly up to N = 25, 50, ..., 800 and the
partial sums are extrapolated to N = infinity by Richardson's method in powers 1/N^2,
1/N^3, ...; the continuum integral uses mpmath.quad (tanh-sinh) over k = sqrt(2E').

Cross-checks (the script stops if one fails):
  * the sum rule sum_m |<m|p|n>|^2 (E_m - E_n) = (1/2) <laplacian V> = 2 delta_l0 / n^3,
    computed with the same states, holds to 1e-12;
  * the whole table recomputed at a second working precision (36 instead of 40 digits),
    with other cut-offs N and other integration break points agrees to 1e-11.
"""

import os
import platform
import subprocess
import sys

import mpmath
from mpmath import mp, mpf, mpc, binomial, factorial, sqrt, exp, log, pi, inf, quad

HERE = os.path.dirname(os.path.abspath(__file__))
SCRIPT = "engine/src/test/resources/golden/make_bethe_golden.py"
NMAX = 8


def deb_version(pkg):
    try:
        out = subprocess.run(["dpkg-query", "-W", "-f=${Version}", pkg],
                             capture_output=True, text=True, check=True).stdout.strip()
        return out or "unknown"
    except Exception:
        return "unknown"


def radial_coefficients(n, l):
    """R_nl(r) = r^l e^(-r/n) * sum_j c_j r^j (normalised; associated Laguerre polynomial)."""
    m = n - l - 1
    a = 2 * l + 1
    x = mpf(2) / n
    norm = sqrt(x ** 3 * factorial(m) / (2 * n * factorial(n + l))) * x ** l
    c = [norm * binomial(m + a, m)]
    for j in range(m):
        # L_m^(a)(x) = sum_j (-1)^j C(m + a, m - j) x^j / j!
        c.append(-c[-1] * (m - j) / ((a + j + 1) * (j + 1)) * x)
    return c


def bound_bound(n, l, n2, l2, c1=None):
    """int R_nl R_n2l2 r^3 dr, exact finite sum of int r^p e^(-lambda r) dr = p! / lambda^(p+1)."""
    if c1 is None:
        c1 = radial_coefficients(n, l)
    c2 = radial_coefficients(n2, l2)
    lam = mpf(1) / n + mpf(1) / n2
    base = l + l2 + 3
    # t[q] = (base + q)! / lam^(base + q + 1)
    t = [factorial(base) / lam ** (base + 1)]
    for q in range(1, len(c1) + len(c2) - 1):
        t.append(t[-1] * (base + q) / lam)
    total = mpf(0)
    for i, a in enumerate(c1):
        inner = mpf(0)
        for j, b in enumerate(c2):
            inner += b * t[i + j]
        total += a * inner
    return total


def bound_free(n, l, k, l2):
    """int R_nl r u_El2 r dr with u = r R energy-normalised, E = k^2 / 2, eta = -1/k.

    u = sqrt(2 / (pi k)) F_l2(eta, k r), with the regular Coulomb function
    F_L = C_L(eta) rho^(L+1) e^(-i rho) M(L + 1 - i eta, 2L + 2, 2 i rho) (Abramowitz & Stegun
    14.1.3 and 14.1.7, |Gamma(L + 1 + i eta)|^2 by 6.1.15 and 6.1.31).
    """
    c1 = radial_coefficients(n, l)
    # Coulomb normalisation C_l(eta)^2 = 2^(2l) e^(-pi eta) |Gamma(l+1+i eta)|^2 / ((2l+1)!)^2
    c2 = mpf(4) ** l2 * (2 * pi / k) / (1 - exp(-2 * pi / k))
    for s in range(1, l2 + 1):
        c2 *= s * s + 1 / (k * k)
    c2 /= factorial(2 * l2 + 1) ** 2
    prefactor = sqrt(2 / (pi * k)) * sqrt(c2) * k ** (l2 + 1)
    lam = mpc(mpf(1) / n, k)
    a = mpc(l2 + 1, 1 / k)
    b = 2 * l2 + 2
    z = mpc(0, 2 * k) / lam
    total = mpc(0)
    for j, cj in enumerate(c1):
        s = l + l2 + 4 + j
        # 2F1(a, s; b; z) = (1 - z)^(b - a - s) 2F1(b - a, b - s; b; z), b - s a negative integer
        poly = mpc(0)
        term = mpc(1)
        for q in range(s - b + 1):
            poly += term
            term *= (b - a + q) * (b - s + q) / ((b + q) * (q + 1)) * z
        total += cj * factorial(s - 1) / lam ** s * (1 - z) ** (b - a - s) * poly
    return (prefactor * total).real


def richardson(partial, sizes):
    """Extrapolate partial sums S(N) = S + a2/N^2 + a3/N^3 + ... to N = infinity.

    sizes double from one to the next; the tail of a sum of n'^-3 F(n'^-2), F smooth, has
    such an expansion (Euler-Maclaurin), so each column removes the next power of 1/N.
    """
    column = list(partial)
    power = 2
    while len(column) > 1:
        factor = mpf(2) ** power
        column = [(factor * column[i + 1] - column[i]) / (factor - 1) for i in range(len(column) - 1)]
        power += 1
    return column[0]


def discrete_sums(n, l, l2, w, sizes):
    """sum over bound n' of w dE^3 R^2 ln(2|dE|) and of w dE^3 R^2, extrapolated."""
    en = -mpf(1) / (2 * n * n)
    c1 = radial_coefficients(n, l)
    with_log = mpf(0)
    plain = mpf(0)
    partial_log = []
    partial_plain = []
    for n2 in range(l2 + 1, sizes[-1] + 1):
        if n2 != n:
            de = -mpf(1) / (2 * n2 * n2) - en
            r = bound_bound(n, l, n2, l2, c1)
            t = w * de ** 3 * r * r
            plain += t
            with_log += t * log(2 * abs(de))
        if n2 in sizes:
            partial_log.append(with_log)
            partial_plain.append(plain)
    return richardson(partial_log, sizes), richardson(partial_plain, sizes)


def bethe(n, l, points, sizes):
    en = -mpf(1) / (2 * n * n)
    numerator = mpf(0)
    sum_rule = mpf(0)
    for l2 in (l - 1, l + 1):
        if l2 < 0:
            continue
        w = mpf(max(l, l2)) / (2 * l + 1)

        def continuum(k, with_log):
            de = k * k / 2 - en
            r = bound_free(n, l, k, l2)
            return w * de ** 3 * r * r * (log(2 * de) if with_log else 1) * k

        s_log, s_plain = discrete_sums(n, l, l2, w, sizes)
        numerator += s_log + quad(lambda k: continuum(k, True), points(n))
        sum_rule += s_plain + quad(lambda k: continuum(k, False), points(n))
    return numerator * n ** 3 / 2, sum_rule * n ** 3 / 2


def table(dps, points, sizes):
    out = {}
    with mp.workdps(dps):
        for n in range(1, NMAX + 1):
            for l in range(n):
                value, rule = bethe(n, l, points, sizes)
                out[(n, l)] = (value, rule)
                print("dps %d  n %d  l %d  ln k0 = %s  sum rule %s" % (dps, n, l, mpmath.nstr(value, 15),
                                                                    mpmath.nstr(rule, 5)), flush=True)
    return out


def main():
    failures = []
    first = table(40, lambda n: [0, mpf(1) / (4 * n), mpf(1) / n, 1, 4, 16, 64, inf],
                  [25, 50, 100, 200, 400, 800])
    second = table(36, lambda n: [0, mpf(1) / (2 * n), mpf(2) / n, 3, 10, 100, inf],
                   [24, 48, 96, 192, 384, 768])
    with mp.workdps(40):
        for key, (value, rule) in first.items():
            expected = 1 if key[1] == 0 else 0
            if abs(rule - expected) > mpf("1e-12"):
                failures.append("sum rule %s: %s" % (key, rule))
            if abs(value - second[key][0]) > mpf("1e-11"):
                failures.append("precision %s: %s vs %s" % (key, value, second[key][0]))
    if failures:
        print("\n".join(failures))
        sys.exit(1)
    py = "python3.%d" % sys.version_info[1]
    lines = [
        "# generated by %s (run with /usr/bin/python3 %s, Debian package %s %s)"
        % (SCRIPT, platform.python_version(), py, deb_version(py)),
        "# libraries: mpmath %s (Debian python3-mpmath %s)" % (mpmath.__version__, deb_version("python3-mpmath")),
        "# computed offline; do not edit by hand, rerun the script instead",
        "#",
        "# Hydrogen Bethe logarithms ln k0(n, l) (Z = 1, infinite nuclear mass), defined as in",
        "# Bethe (1947), Bethe & Salpeter (1957) and the CODATA adjustments; method in the script's docstring.",
        "# tolerance: 1e-11 absolute (two working precisions, sum cut-offs and integration grids agree",
        "#            to it; the sum rule sum |p|^2 dE = 2 delta_l0 / n^3 holds to 1e-12 with the same states)",
        "n,l,ln_k0",
    ]
    with mp.workdps(40):
        for (n, l), (value, _) in sorted(first.items()):
            lines.append("%d,%d,%s" % (n, l, mpmath.nstr(value, 15, min_fixed=-1, max_fixed=1)))
    path = os.path.join(HERE, "bethe-logarithms.csv")
    tmp = path + ".tmp"
    with open(tmp, "w", encoding="utf-8", newline="\n") as fh:
        fh.write("\n".join(lines) + "\n")
    os.replace(tmp, path)
    print("wrote", path)


if __name__ == "__main__":
    main()
