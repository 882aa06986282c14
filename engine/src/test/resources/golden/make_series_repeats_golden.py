#!/usr/bin/python3
"""Golden weighted least-squares fits of Rydberg series with repeated measurements, for
SeriesRepeatsTest, made offline with Debian's numpy, scipy and mpmath.

series-repeats-members.csv: two invented series sharing one limit (only the method is checked),
'a' with d0 = 2.5, d2 = -0.6 at n = 20-40 and 'b' with d0 = 1.2, d2 = 0.9 at n = 21-41 in steps of
2, in the modified Rydberg-Ritz formula E = L - R / (n - delta)^2, delta = d0 + d2 / (n - d0)^2
(+ d4 / (n - d0)^4 for three terms), L = 33690.80395 cm-1, R = 109736.623 cm-1. Some levels are
measured two or three times, each measurement with its own standard uncertainty and its own
seeded normal error (numpy.random.default_rng(2027)); every row is one measurement.

series-repeats-fit.csv: for every combination of 1 to 3 terms per series, the weighted least-squares
fit over every measurement as an independent datum (residual (E_i - model) / u_i): scipy's
least_squares (method 'lm') from a start near the truth, then polished by Gauss-Newton steps in
mpmath at 40 digits; chi2, the information criterion BIC = chi2 + p ln N with N the number of
measurements (not of levels), the degrees of freedom N - p, and the parameters with their standard
uncertainties sqrt(diag((J^T W J)^-1)). The script also checks that a fit to each level's weighted
mean (sum E_i / u_i^2) / (sum 1 / u_i^2) with u = (sum 1 / u_i^2)^-1/2 gives the same parameters
and uncertainties (the closed form the test relies on) and stops if it does not.

Run: /usr/bin/python3 make_series_repeats_golden.py
Each file declares the tolerance its test reads ('# tolerance[ <label>]: ...' header lines).
"""
import itertools
import math

import mpmath
import numpy
import scipy
from scipy.optimize import least_squares

mpmath.mp.dps = 40
LIMIT = 33690.80395
R = 109736.623
TRUTH = {"a": [2.5, -0.6], "b": [1.2, 0.9]}
# n -> the standard uncertainties of its measurements (cm-1); one entry per measurement
PLAN = {
    "a": {n: [0.002] for n in range(20, 41)},
    "b": {n: [0.003] for n in range(21, 42, 2)},
}
PLAN["a"][22] = [0.002, 0.004]
PLAN["a"][30] = [0.002, 0.001, 0.005]
PLAN["a"][37] = [0.002, 0.002]
PLAN["b"][25] = [0.003, 0.0015]
PLAN["b"][33] = [0.003, 0.006]


def defect(c, n):
    d0 = c[0]
    x = 1 / ((n - d0) * (n - d0))
    delta = d0
    power = x
    for k in c[1:]:
        delta += k * power
        power *= x
    return delta


def energy(limit, c, n):
    nu = n - defect(c, n)
    return limit - R / (nu * nu)


rng = numpy.random.default_rng(2027)
rows = []  # (series, n, energy, uncertainty)
for name in ("a", "b"):
    for n in sorted(PLAN[name]):
        for u in PLAN[name][n]:
            rows.append((name, n, energy(LIMIT, TRUTH[name], n) + u * rng.standard_normal(), u))
# read back as printed, so both sides fit the same numbers
rows = [(s, n, float(repr(e)), u) for s, n, e, u in rows]


def unpack(q, terms):
    c = {}
    at = 1
    for name, t in zip(("a", "b"), terms):
        c[name] = list(q[at:at + t])
        at += t
    return q[0], c


def residuals(q, terms, data):
    limit, c = unpack(q, terms)
    return [(e - energy(limit, c[s], n)) / u for s, n, e, u in data]


def fit(terms, data):
    start = [LIMIT + 0.01] + TRUTH["a"][:1] + [0.0] * (terms[0] - 1) + TRUTH["b"][:1] + [0.0] * (terms[1] - 1)
    x = least_squares(lambda q: [float(v) for v in residuals(q, terms, data)], start, method="lm", x_scale="jac", xtol=1e-15,
                      ftol=1e-15, gtol=1e-15, max_nfev=100000).x
    q = mpmath.matrix([mpmath.mpf(float(v)) for v in x])
    p = len(q)
    h = mpmath.mpf(10) ** -15
    for _ in range(8):
        r = mpmath.matrix(residuals(list(q), terms, data))
        jac = mpmath.matrix(len(data), p)
        for k in range(p):
            up = list(q)
            down = list(q)
            up[k] += h
            down[k] -= h
            ru = residuals(up, terms, data)
            rd = residuals(down, terms, data)
            for i in range(len(data)):
                jac[i, k] = (ru[i] - rd[i]) / (2 * h)
        # residuals are data minus model: r(q + dq) ~ r + J dq, least squares dq = -(J^T J)^-1 J^T r
        jtj = jac.T * jac
        dq = mpmath.lu_solve(jtj, -(jac.T * r))
        q = q + dq
    cov = jtj ** -1
    chi2 = sum(v * v for v in residuals(list(q), terms, data))
    return [q[k] for k in range(p)], [mpmath.sqrt(cov[k, k]) for k in range(p)], chi2


results = {}
for terms in itertools.product((1, 2, 3), repeat=2):
    results[terms] = fit(terms, rows)

# the closed form: each level's measurements replaced by their weighted mean gives the same fit
means = []
for name in ("a", "b"):
    for n in sorted(PLAN[name]):
        mine = [(mpmath.mpf(e), mpmath.mpf(u)) for s, m, e, u in rows if s == name and m == n]
        w = sum(1 / (u * u) for e, u in mine)
        means.append((name, n, sum(e / (u * u) for e, u in mine) / w, 1 / mpmath.sqrt(w)))
q2, u2, _ = fit((2, 2), means)
q1, u1, _ = fit((2, 2), rows)
for a, b in zip(q1, q2):
    assert abs(a - b) < 1e-20 * max(1, abs(a)), (a, b)
for a, b in zip(u1, u2):
    assert abs(a - b) < 1e-12 * a, (a, b)

with open("series-repeats-members.csv", "w") as out:
    out.write("# generated by engine/src/test/resources/golden/make_series_repeats_golden.py with numpy %s "
              "(invented series, seeded normal errors)\n" % numpy.__version__)
    out.write("# limit %r cm-1, R_M %r cm-1; a: d0 2.5, d2 -0.6; b: d0 1.2, d2 0.9 (invented)\n" % (LIMIT, R))
    out.write("# tolerance: none (inputs, read as printed; the fits made from them are in series-repeats-fit.csv)\n")
    out.write("series,n,energy,uncertainty\n")
    for s, n, e, u in rows:
        out.write("%s,%d,%r,%r\n" % (s, n, e, u))

N = len(rows)
with open("series-repeats-fit.csv", "w") as out:
    out.write("# generated by engine/src/test/resources/golden/make_series_repeats_golden.py with scipy %s, "
              "numpy %s, mpmath %s\n" % (scipy.__version__, numpy.__version__, mpmath.__version__))
    out.write("# weighted least squares over all %d measurements of %d levels (scipy.optimize.least_squares "
              "'lm', polished by Gauss-Newton in mpmath at 40 digits)\n"
              % (N, sum(len(v) for v in PLAN.values())))
    out.write("# parameter columns: limit (cm-1), then d0 d2 d4 of a, then of b (empty where the model lacks the "
              "term); u_ their standard uncertainties sqrt(diag((J^T W J)^-1))\n")
    out.write("# tolerance limit: 2e-7 absolute (cm-1; the limit's uncertainty is about 4e-4 cm-1, the engine's "
              "Levenberg-Marquardt stops within about 1e-8 cm-1)\n")
    out.write("# tolerance defect: 2e-7 absolute (d0, d2, d4; their uncertainties are 1e-5 to 1e-1)\n")
    out.write("# tolerance uncertainty: 1e-4 relative (u_ columns: the covariance at the two optima)\n")
    out.write("# tolerance chi2: 1e-6 absolute (chi2 and bic)\n")
    out.write("terms_a,terms_b,measurements,dof,chi2,bic,limit,u_limit,a_d0,u_a_d0,a_d2,u_a_d2,a_d4,u_a_d4,"
              "b_d0,u_b_d0,b_d2,u_b_d2,b_d4,u_b_d4\n")
    for terms, (q, u, chi2) in results.items():
        p = len(q)
        cells = [str(terms[0]), str(terms[1]), str(N), str(N - p), repr(float(chi2)),
                 repr(float(chi2 + p * math.log(N))), repr(float(q[0])), repr(float(u[0]))]
        at = 1
        for t in terms:
            for k in range(3):
                if k < t:
                    cells += [repr(float(q[at + k])), repr(float(u[at + k]))]
                else:
                    cells += ["", ""]
            at += t
        out.write(",".join(cells) + "\n")
