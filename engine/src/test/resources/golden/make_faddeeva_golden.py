#!/usr/bin/python3
"""Generate golden reference values of the Faddeeva function for Ritzwerk's Voigt-profile tests.

    w(z) = exp(-z^2) * erfc(-i z),   z = x + i y,  y >= 0 (upper half-plane)

Run with Debian's interpreter and Debian packages (NOT a pyenv python):

    apt-get install -y python3-mpmath python3-scipy
    /usr/bin/python3 make_faddeeva_golden.py

Writes faddeeva.csv next to this script.  Deterministic: no timestamps, no
randomness; rerunning with the same package versions rewrites a byte-identical
file.  The script refuses to write anything if any internal cross-check fails.

Method
  * Every input x, y is the IEEE-754 double nearest to the listed decimal
    (mpf(float) is exact), so the reference is w at exactly the double a Java
    test obtains from Double.parseDouble of the x,y columns (written with
    Python repr(float), which round-trips).
  * w is evaluated with mpmath as exp(-z^2) * erfc(-1j*z) at mp.dps = 40, 60
    and 100 for every point.  For large |z| the product exp(-z^2) * erfc(-iz)
    multiplies numbers of size exp(-+ (x^2 - y^2)) (up to exp(1e6)) and the
    real part can cancel by many digits, so a point is accepted only if Re w
    and Im w (each separately, relative to itself) agree to 1e-25 between the
    dps-40, dps-60 and dps-100 results; otherwise dps is raised further
    (150, 200, 300).  The value printed is the highest-precision one, rounded
    to 20 significant digits with mpmath.nstr.
  * On the imaginary axis (x = 0) the exact identity w(i y) = exp(y^2) erfc(y)
    (real) is used for the printed value, with Im w written as exact 0, after
    checking it against the general formula; w(0) = 1 exactly.
  * Independent check for |z| >= 30: the Laplace continued fraction (no erfc)
    must agree to 1e-25 (complex value; Re and Im separately when y > 0).
  * Cross-checks: mpmath vs scipy.special.wofz (Faddeeva package, double
    precision) on every point; the symmetry w(-x + i y) = conj(w(x + i y)).
"""

import os
import platform
import subprocess
import sys

import mpmath
from mpmath import mp, mpf, mpc
import numpy
import scipy
import scipy.special

HERE = os.path.dirname(os.path.abspath(__file__))
SCRIPT = "engine/src/test/resources/golden/make_faddeeva_golden.py"
OUT = "faddeeva.csv"


def deb_version(pkg):
    try:
        out = subprocess.run(["dpkg-query", "-W", "-f=${Version}", pkg],
                             capture_output=True, text=True, check=True).stdout.strip()
        return out or "unknown"
    except Exception:
        return "unknown"


PY = "python3.%d" % sys.version_info[1]

# --------------------------------------------------------------------------
# grid
# --------------------------------------------------------------------------
X_POS = [0.0, 1e-6, 0.01, 0.1, 0.5, 1.0, 1.5, 2.0, 3.0, 4.0, 5.0, 6.0, 8.0, 10.0,
         15.0, 20.0, 30.0, 50.0, 100.0, 1000.0]
X_NEG = [-0.5, -2.0, -10.0, -100.0]
Y_VALS = [0.0, 1e-10, 1e-6, 1e-4, 0.001, 0.01, 0.1, 0.3, 1.0, 2.0, 5.0, 10.0,
          30.0, 100.0, 1000.0]
# extra points on the imaginary axis (identity rows w(i y) = exp(y^2) erfc(y)),
# at y values not already in the grid
Y_IDENTITY_EXTRA = [1e-3 / 3, 0.5, 0.75, 3.0, 7.0, 20.0, 50.0, 300.0, 1e4]

DPS_BASE = 40
DPS_LADDER = [40, 60, 100, 150, 200, 300]
AGREE = mpmath.mpf('1e-25')
SCIPY_TOL = 1e-13
CF_MIN_ABS_Z = 30

# Global working precision for bookkeeping (mpc construction, negation,
# comparisons): high enough never to round a computed value.  The values
# themselves are computed inside mp.workdps(dps) for dps in DPS_LADDER.
mp.dps = 320

FAILURES = []


def check(cond, msg, quiet_ok=False):
    if not cond or not quiet_ok:
        print(("ok    " if cond else "FAIL  ") + msg)
    if not cond:
        FAILURES.append(msg)


def w_general(x, y, dps):
    with mp.workdps(dps):
        z = mpc(mpf(x), mpf(y))
        return mpmath.exp(-z * z) * mpmath.erfc(-1j * z)


def w_imag_axis(y, dps):
    with mp.workdps(dps):
        yy = mpf(y)
        return mpmath.exp(yy * yy) * mpmath.erfc(yy)


def w_contfrac(x, y, nterms, dps=100):
    """Laplace continued fraction w(z) = (i/sqrt(pi)) / (z - (1/2)/(z - 1/(z - (3/2)/(z - ...)))),
    independent of erfc; accurate for large |z| in the upper half-plane (on the real axis it
    omits the exponentially small Re w = exp(-x^2))."""
    with mp.workdps(dps):
        z = mpc(mpf(x), mpf(y))
        t = mpc(0)
        for k in range(nterms, 0, -1):
            t = (mpf(k) / 2) / (z - t)
        return 1j / mpmath.sqrt(mpmath.pi) / (z - t)


def comp_agree(a, b):
    """a, b real mpf: |a - b| <= AGREE * |b| (exact zeros must match exactly)."""
    with mp.workdps(320):
        if b == 0:
            return a == 0
        return abs(a - b) <= AGREE * abs(b)


def stable_w(x, y):
    """Return (w, dps_used): w at the highest dps, checked to be stable."""
    vals = []
    for i, dps in enumerate(DPS_LADDER):
        vals.append(w_general(x, y, dps))
        if i < 2:
            continue
        last3 = vals[-3:]
        ok = all(comp_agree(v.real, last3[-1].real) and comp_agree(v.imag, last3[-1].imag)
                 for v in last3[:-1])
        if ok:
            return vals[-1], dps
    raise RuntimeError("w(%r + %ri) not stable up to dps %d" % (x, y, DPS_LADDER[-1]))


def fmt(v):
    if v == 0:
        return "0"
    with mp.workdps(320):
        s = mpmath.nstr(v, 20)
    assert "nan" not in s.lower() and "inf" not in s.lower(), s
    return s


def fmt_in(v):
    return repr(float(v))


def rel_err_complex(w_approx, w_ref):
    with mp.workdps(320):
        return abs(mpc(w_approx) - w_ref) / abs(w_ref)


def main():
    rows = []
    ref = {}
    max_dps = 0
    worst_scipy = (mpf(0), None)
    worst_scipy_comp = (mpf(0), None)

    # base precision result (dps 40) vs final: record largest change
    worst_base = (mpf(0), None)

    n_cf = 0
    xs = X_POS + X_NEG
    for x in xs:
        for y in Y_VALS:
            w, dps = stable_w(x, y)
            max_dps = max(max_dps, dps)
            w40 = w_general(x, y, DPS_BASE)
            d = rel_err_complex(w40, w)
            if d > worst_base[0]:
                worst_base = (d, (x, y))
            if x == 0.0:
                wi = w_imag_axis(y, 100)
                check(rel_err_complex(wi, w) < AGREE and abs(w.imag) <= AGREE * abs(w),
                      "identity w(i y) = exp(y^2) erfc(y) at y=%r" % y, quiet_ok=True)
                w = mpc(wi, 0)
                if y == 0.0:
                    check(w == 1, "w(0) == 1 exactly")
            ref[(x, y)] = w
            if abs(mpc(x, y)) >= CF_MIN_ABS_Z:
                c1, c2 = w_contfrac(x, y, 200), w_contfrac(x, y, 400)
                ok = rel_err_complex(c1, w) < AGREE and rel_err_complex(c2, w) < AGREE
                if y > 0:
                    ok = ok and comp_agree(c2.real, w.real) and comp_agree(c2.imag, w.imag)
                check(ok, "continued fraction vs mpmath erfc at x=%r y=%r" % (x, y), quiet_ok=True)
                n_cf += 1
            rows.append((x, y, w))

            ws = complex(scipy.special.wofz(numpy.complex128(complex(x, y))))
            e = rel_err_complex(ws, w)
            if e > worst_scipy[0]:
                worst_scipy = (e, (x, y, ws))
            # componentwise, relative to |w| (informational)
            with mp.workdps(320):
                ec = max(abs(mpf(ws.real) - w.real), abs(mpf(ws.imag) - w.imag)) / abs(w)
            if ec > worst_scipy_comp[0]:
                worst_scipy_comp = (ec, (x, y))
            check(e <= SCIPY_TOL, "scipy wofz vs mpmath at x=%r y=%r: rel %s"
                  % (x, y, mpmath.nstr(e, 3)), quiet_ok=True)

    # symmetry w(-x + iy) = conj(w(x + iy))
    for x in X_NEG:
        for y in Y_VALS:
            a, b = ref[(x, y)], ref[(-x, y)]
            check(comp_agree(a.real, b.real) and comp_agree(a.imag, -b.imag),
                  "symmetry w(-x+iy) = conj(w(x+iy)) at x=%r y=%r" % (x, y), quiet_ok=True)

    # extra imaginary-axis identity rows
    extra = []
    for y in Y_IDENTITY_EXTRA:
        wg, dps = stable_w(0.0, y)
        max_dps = max(max_dps, dps)
        wi = w_imag_axis(y, 100)
        check(rel_err_complex(wi, wg) < AGREE, "identity (extra) at y=%r" % y, quiet_ok=True)
        ws = complex(scipy.special.wofz(numpy.complex128(complex(0.0, y))))
        e = rel_err_complex(ws, wi)
        check(e <= SCIPY_TOL, "scipy wofz (extra) y=%r rel %s" % (y, mpmath.nstr(e, 3)),
              quiet_ok=True)
        if e > worst_scipy[0]:
            worst_scipy = (e, (0.0, y, ws))
        extra.append((0.0, y, mpc(wi, 0)))

    n_grid = len(rows)
    print("continued-fraction cross-check on %d rows with |z| >= %g" % (n_cf, CF_MIN_ABS_Z))
    rows += extra

    ex, (sx, sy, sws) = worst_scipy
    print("grid rows %d, identity rows %d, total %d" % (n_grid, len(extra), len(rows)))
    print("max dps needed for stability: %d" % max_dps)
    print("largest dps-%d vs final change (complex rel): %s at %r"
          % (DPS_BASE, mpmath.nstr(worst_base[0], 3), worst_base[1]))
    print("largest scipy vs mpmath (complex rel): %s at x=%r y=%r"
          % (mpmath.nstr(ex, 3), sx, sy))
    print("largest scipy vs mpmath (componentwise / |w|): %s at %r"
          % (mpmath.nstr(worst_scipy_comp[0], 3), worst_scipy_comp[1]))

    if FAILURES:
        print("%d check(s) FAILED; nothing written" % len(FAILURES))
        sys.exit(1)

    comments = [
        "generated by %s (run with /usr/bin/python3 %s, Debian package %s %s)"
        % (SCRIPT, platform.python_version(), PY, deb_version(PY)),
        "libraries: mpmath %s (Debian python3-mpmath %s), scipy %s (Debian python3-scipy %s),"
        % (mpmath.__version__, deb_version("python3-mpmath"),
           scipy.__version__, deb_version("python3-scipy")),
        "           numpy %s (Debian python3-numpy %s)" % (numpy.__version__, deb_version("python3-numpy")),
        "computed offline; do not edit by hand, rerun the script instead",
        "",
        "Faddeeva function w(z) = exp(-z^2) * erfc(-i z), z = x + i y, upper half-plane y >= 0",
        "(Voigt profile: V(x; sigma, gamma) = Re w((x + i gamma) / (sigma sqrt 2)) / (sigma sqrt(2 pi))).",
        "columns: x = Re z, y = Im z (each the IEEE double nearest the decimal shown; repr(float), round-trips),",
        "         re_w = Re w(z), im_w = Im w(z), 20 significant digits (mpmath.nstr), 0 = exact zero.",
        "method: mpmath exp(-z^2)*erfc(-1j*z) at mp.dps = %d, recomputed at dps 60 and 100; every point" % DPS_BASE,
        "  accepted only if Re w and Im w each agree to 1e-25 relative across the last three dps levels",
        "  (ladder %s; max needed here: %d); printed value from the highest dps."
        % (DPS_LADDER, max_dps),
        "  This guards the cancellation in exp(-z^2)*erfc(-iz) for large |z| (factors up to exp(+-1e6) at |z| = 1000).",
        "  Largest change of the dps-%d value vs the final one: %s (complex relative)."
        % (DPS_BASE, mpmath.nstr(worst_base[0], 3)),
        "independent check for |z| >= %g (%d rows): Laplace continued fraction (200 and 400 terms, dps 100)"
        % (CF_MIN_ABS_Z, n_cf),
        "  agrees with the computed (pre-rounding) values to 1e-25 (complex; also Re and Im separately when y > 0).",
        "x = 0 rows use the exact identity w(i y) = exp(y^2) erfc(y) (real, im_w = 0), checked against",
        "  the general formula; w(0) = 1 exactly.  Symmetry w(-x + i y) = conj(w(x + i y)) checked",
        "  for the x < 0 rows.",
        "grid: x in %s" % ", ".join(fmt_in(v) for v in X_POS + X_NEG),
        "      y in %s (all combinations, %d rows)" % (", ".join(fmt_in(v) for v in Y_VALS), n_grid),
        "then %d extra imaginary-axis identity rows (x = 0, y in %s)."
        % (len(extra), ", ".join(fmt_in(v) for v in Y_IDENTITY_EXTRA)),
        "Some re_w values underflow IEEE double (e.g. Re w(1000) = exp(-1e6)); they parse to 0.0, which",
        "  is within tolerance because the tolerance is on the complex value.",
        "cross-check: scipy.special.wofz (double precision) agrees to at most %s complex relative"
        % mpmath.nstr(ex, 3),
        "  (largest at x = %s, y = %s); required <= %g on every row." % (fmt_in(sx), fmt_in(sy), SCIPY_TOL),
        "tolerance: 1e-10 relative (of the complex value, |w_java - w_ref| / |w_ref|, every row)",
        "tolerance real-part: 1e-6 relative (Re w alone, rows with |Re w| > 1e-300: the Voigt function)",
    ]
    path = os.path.join(HERE, OUT)
    with open(path, "w", newline="\n") as fh:
        for c in comments:
            fh.write(("# " + c).rstrip() + "\n")
        fh.write("x,y,re_w,im_w\n")
        for x, y, w in rows:
            fh.write("%s,%s,%s,%s\n" % (fmt_in(x), fmt_in(y), fmt(w.real), fmt(w.imag)))
    print("wrote %s (%d data rows)" % (path, len(rows)))


if __name__ == "__main__":
    main()
