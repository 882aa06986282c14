#!/usr/bin/python3
"""Writes levels-he-i.csv and helium-checks.txt: He I levels n <= 4 recalled from memory, each
kept only with the independent checks below, which this script repeats; and the levels n = 5 to
N_MAX (10) of the same series, predicted by a Rydberg-Ritz fit of the recalled n = 2-4 levels and
the published ionization energy (see PREDICTION below).

Sources (recalled values, not re-read):
  levels  NIST Atomic Spectra Database, He I energy levels (compilation of G. W. F. Drake and
          W. C. Martin, Can. J. Phys. 76, 679 (1998), and D. C. Morton, Q. Wu and G. W. F. Drake,
          Can. J. Phys. 84, 83 (2006)), from memory.
Published values the checks use (read in the papers' abstracts):
  IE(1s2 1S0)  = 5 945 204 290(33) MHz   Morton, Wu and Drake, Can. J. Phys. 84, 83 (2006)
  IE(1s2 1S0)  = 5 945 204 212(6) MHz    measured: D. Z. Kandula, C. Gohle, T. J. Pinkert, W. Ubachs
                 and K. S. E. Eikema, Phys. Rev. A 84, 062512 (2011)
  IE(1s2s 3S1) = 1 152 842 742.728(6) MHz  G. W. F. Drake, A. T. Bondy, O. P. Hallett and
                 B. C. Najem, arXiv:2510.17495 (2025) (theory for the triplet spectrum)
  IE(1s2s 1S0) = 960 332 040.533(10)(20) MHz  J. Chi, H. Fang, Y.-H. Zhang, L.-Y. Tang and
                 T.-Y. Shi, arXiv:2606.04768 (2026) (read in the abstract)
  c = 299 792 458 m/s (exact, SI).
  R_inf = 109 737.315 681 60 cm-1 and m_e = 5.485 799 090 65e-4 u (CODATA 2018), the 4He atomic
  mass 4.002 603 254 13 u (AME2020, this project's nuclear/isotopes.csv).
Checks:
  1  the 1s2s 3S1 and 1s2s 1S0 levels against IE(1s2 1S0) - IE(1s2s) from the papers above;
  2  lines: Ritz air wavelengths against the Handbook's strong lines (list LINES below), within
     2.5e-4 nm (one line) or 4e-4 nm (a blend of fine-structure components);
  3  fine structure: the 3P and 3D splittings scale as n^-3 between n = 2, 3 and 4 within 15 %.
  4  predicted levels: Ritz air wavelengths of Handbook strong lines from n = 5 and 6 (list
     LINES_PREDICTED, from memory) within 3 of the combined standard uncertainty (the Ritz
     uncertainty from the predicted levels and the table's rounding, half a unit of the last digit
     taken as a uniform distribution, 1/sqrt(3) of it).
  5  the truncation rule of the predicted levels, tried one order lower on recalled levels: the
     two-term fit of n = 2, 3 and the ionization energy predicts n = 4 within its truncation
     uncertainty (printed; asserted for every series with n = 2).

PREDICTION (levels n = 5 to N_MAX). For each series tagged in LEVELS (1S0, 3S1, 1P1, 3P2, 1D2,
3D3) the extended Rydberg-Ritz formula E(n) = L - R_M / (n - delta(n))^2, delta(n) = d0 + d2 /
(n - d0)^2 + d4 / (n - d0)^4 (T. F. Gallagher, Rydberg Atoms (1994), eq. 16.19; the formula and
R_M of the project's series fit, engine SeriesFitter) is fitted by weighted least squares to the
series' recalled levels n = 2, 3, 4 (each +- half a unit of its last digit) and the limit L as one
more datum, IE +- IE_U (Morton, Wu and Drake 2006): three terms where n = 2 exists (s and p
series), two for the d series (n = 3, 4). Either way the fit interpolates (as many data as
parameters). Standard uncertainty of a predicted level: the fit's covariance (the data's
uncertainties, J^T W J inverted) and, in quadrature, the truncation of the asymptotic expansion,
the larger of (a) the size of the last term kept, |E(n) - E(n) with that coefficient set to zero|
(common practice for an asymptotic series: the error is taken as no larger than the last term
kept), and (b) for the three-term series, the change of the prediction from the two-term fit of
n = 3, 4 (what leaving out the n = 2 level and the d4 term does); rounded up to two digits.
Fine structure beyond n = 4: 3P1 and 3P0 are 3P2 plus the n = 4 splittings scaled as (4/n)^3, 3D2
and 3D1 are 3D3 plus the n = 3 splittings scaled as (3/n)^3, from n = 4 on (the 4d 3D2 and 3D1
levels are not recalled, so they are computed this way too and written beside the recalled 4d 3D3) (check 3: the 3P splittings follow n^-3 within 8 %), each with 15 % of its splitting
added in quadrature to the uncertainty of its series' level. The 1snf levels are not predicted
(no recalled level at n <= 4 to fit). N_MAX = 10: the strong discharge lines of singly excited
He I come from n <= 7 and the 2p - nd and 2s - np series' members fade as about n^-3 beyond;
at n = 10 the nd and nf levels lie about 0.5 cm-1 apart, so electric fields of some 100 V/cm
(discharge sheaths) already mix them, and field-free levels stop describing a discharge's lines.
GROUND LEVEL UNCERTAINTY. The ASD's excited levels are IE(1s2 1S0) - IE(level): the theoretical
ground ionization energy of Morton, Wu and Drake (2006) minus each level's own, far more precise,
ionization energy (check 1 confirms it: 1s2s 3S1 agrees with that difference to 1e-5 cm-1). So
where the excited levels sit relative to the ground is uncertain by that of IE(1s2 1S0), one
offset shared by every excited level: it cancels in lines between excited levels and enters
every line to the ground. The theory states 33 MHz (1.1e-3 cm-1), but the measurement of Kandula
et al. (2011), 5 945 204 212(6) MHz, differs from it by 78 MHz (2.6e-3 cm-1), 2.4 of the theory's
uncertainties. The standard uncertainty of the shared offset is taken as the larger of the two,
78 MHz, rounded up to two digits: 0.0027 cm-1, written as the ground level's uncertainty (the
excited levels' stated uncertainties are relative to the ground), so that the Ritz lines to the
ground carry it and the lines among excited levels do not. The energies are left as the ASD gives
them (on the theoretical ionization energy): moving them by 78 MHz would mix sources.
Run: cd refdata/src/main/resources/org/ritzwerk/refdata/levels && /usr/bin/python3 make_helium_levels.py
"""
import math

C_MHZ_PER_CM = 29979.2458
IE = 5945204290 / C_MHZ_PER_CM
IE_U = 33 / C_MHZ_PER_CM
IE_MEASURED = 5945204212 / C_MHZ_PER_CM
IE_2S3S = 1152842742.728 / C_MHZ_PER_CM
IE_2S1S = 960332040.533 / C_MHZ_PER_CM
R_INF = 109737.31568160
ME = 5.48579909065e-4
M_NUCLEUS = 4.00260325413 - 2 * ME
R_M = R_INF / (1 + ME / M_NUCLEUS)
N_MAX = 10
FINE_SCALING_U = 0.15
L_LETTER = "SPDF"

# label, J, energy (cm-1, as the ASD prints it), series (for check 2), n
LEVELS = [
    ("1s2 1S0", "0", "0", None, 1),
    ("1s2s 3S1", "1", "159855.9743297", "3S", 2),
    ("1s2s 1S0", "0", "166277.4403", "1S", 2),
    ("1s2p 3P2", "2", "169086.7664", "3P", 2),
    ("1s2p 3P1", "1", "169086.8430", None, 2),
    ("1s2p 3P0", "0", "169087.8309", None, 2),
    ("1s2p 1P1", "1", "171134.8970", "1P", 2),
    ("1s3s 3S1", "1", "183236.7918", "3S", 3),
    ("1s3s 1S0", "0", "184864.8294", "1S", 3),
    ("1s3p 3P2", "2", "185564.5620", "3P", 3),
    ("1s3p 3P1", "1", "185564.5840", None, 3),
    ("1s3p 3P0", "0", "185564.8547", None, 3),
    ("1s3d 3D3", "3", "186101.5472", "3D", 3),
    ("1s3d 3D2", "2", "186101.5479", None, 3),
    ("1s3d 3D1", "1", "186101.5922", None, 3),
    ("1s3d 1D2", "2", "186104.9668", "1D", 3),
    ("1s3p 1P1", "1", "186209.3651", "1P", 3),
    ("1s4s 3S1", "1", "190298.1136", "3S", 4),
    ("1s4s 1S0", "0", "190940.2260", "1S", 4),
    ("1s4p 3P2", "2", "191217.0525", "3P", 4),
    ("1s4p 3P1", "1", "191217.0614", None, 4),
    ("1s4p 3P0", "0", "191217.1768", None, 4),
    ("1s4d 3D3", "3", "191444.4822", "3D", 4),
    ("1s4d 1D2", "2", "191446.4556", "1D", 4),
    ("1s4p 1P1", "1", "191492.7110", "1P", 4),
]


# Lines of the strong-lines table of the NIST Handbook of Basic Atomic Spectroscopic Data (J. E.
# Sansonetti and W. C. Martin, J. Phys. Chem. Ref. Data 34, 1559 (2005), version 1.1.3), air
# wavelengths in nm, from memory. A line whose fine-structure components the table gives as one
# wavelength is compared with the components' mean weighted by their LS line strengths (common
# practice: 3S1 - 3PJ in the ratio 5:3:1 of 2J + 1; 3P - 3D as 84:15:1 (J=2), 45:15 (J=1)), the
# J = 0 component, resolved from the rest, left out.
LINES = [
    ([("1s2s 1S0", "1s3p 1P1", 1)], 501.5678, "2s 1S - 3p 1P"),
    ([("1s2s 1S0", "1s4p 1P1", 1)], 396.4729, "2s 1S - 4p 1P"),
    ([("1s2p 1P1", "1s3d 1D2", 1)], 667.8151, "2p 1P - 3d 1D"),
    ([("1s2p 1P1", "1s3s 1S0", 1)], 728.1349, "2p 1P - 3s 1S"),
    ([("1s2p 1P1", "1s4d 1D2", 1)], 492.1931, "2p 1P - 4d 1D"),
    ([("1s2p 1P1", "1s4s 1S0", 1)], 504.7738, "2p 1P - 4s 1S"),
    ([("1s2s 3S1", "1s3p 3P2", 1)], 388.8648, "2s 3S1 - 3p 3P2"),
    ([("1s2s 3S1", "1s4p 3P2", 1)], 318.7745, "2s 3S1 - 4p 3P2"),
    ([("1s2p 3P2", "1s3s 3S1", 5), ("1s2p 3P1", "1s3s 3S1", 3)], 706.5190, "2p 3P2,1 - 3s 3S1"),
    ([("1s2p 3P2", "1s4s 3S1", 5), ("1s2p 3P1", "1s4s 3S1", 3)], 471.3146, "2p 3P2,1 - 4s 3S1"),
    ([("1s2p 3P2", "1s3d 3D3", 84), ("1s2p 3P2", "1s3d 3D2", 15), ("1s2p 3P2", "1s3d 3D1", 1),
      ("1s2p 3P1", "1s3d 3D2", 45), ("1s2p 3P1", "1s3d 3D1", 15)], 587.5621, "2p 3P2,1 - 3d 3D"),
    ([("1s2p 3P2", "1s4d 3D3", 84), ("1s2p 3P2", "1s4d 3D2", 15), ("1s2p 3P2", "1s4d 3D1", 1),
      ("1s2p 3P1", "1s4d 3D2", 45), ("1s2p 3P1", "1s4d 3D1", 15)], 447.1479, "2p 3P2,1 - 4d 3D"),
]

# Lines from n = 5 and 6 in the same strong-lines table (same edition), air wavelengths in nm, from
# memory; blends weighted as in LINES. They check the predicted levels (check 4), not the recalled ones.
LINES_PREDICTED = [
    ([("1s2p 1P1", "1s5d 1D2", 1)], "438.7929", "2p 1P - 5d 1D"),
    ([("1s2p 1P1", "1s5s 1S0", 1)], "443.7551", "2p 1P - 5s 1S"),
    ([("1s2p 1P1", "1s6d 1D2", 1)], "414.3761", "2p 1P - 6d 1D"),
    ([("1s2p 1P1", "1s6s 1S0", 1)], "416.8967", "2p 1P - 6s 1S"),
    ([("1s2s 1S0", "1s5p 1P1", 1)], "361.3641", "2s 1S - 5p 1P"),
    ([("1s2s 3S1", "1s5p 3P2", 1)], "294.5104", "2s 3S1 - 5p 3P2"),
    ([("1s2p 3P2", "1s5s 3S1", 5), ("1s2p 3P1", "1s5s 3S1", 3)], "412.0812", "2p 3P2,1 - 5s 3S1"),
    ([("1s2p 3P2", "1s5d 3D3", 84), ("1s2p 3P2", "1s5d 3D2", 15), ("1s2p 3P2", "1s5d 3D1", 1),
      ("1s2p 3P1", "1s5d 3D2", 45), ("1s2p 3P1", "1s5d 3D1", 15)], "402.6191", "2p 3P2,1 - 5d 3D"),
    ([("1s2p 3P2", "1s6d 3D3", 84), ("1s2p 3P2", "1s6d 3D2", 15), ("1s2p 3P2", "1s6d 3D1", 1),
      ("1s2p 3P1", "1s6d 3D2", 45), ("1s2p 3P1", "1s6d 3D1", 15)], "381.9607", "2p 3P2,1 - 6d 3D"),
]


def edlen(vacuum_nm):
    """Refractive index of standard air, B. Edlen, Metrologia 2, 71 (1966), the formula and
    coefficients of lamps/check_lamp_rows.py."""
    s2 = (1e3 / vacuum_nm) ** 2
    return 1 + (8342.13 + 2406030 / (130 - s2) + 15997 / (38.9 - s2)) * 1e-8


def half_unit(text):
    return 0.0 if "." not in text else 0.5 * 10 ** -len(text.split(".")[1])


def defect(n, e):
    return n - math.sqrt(R_M / (IE - e))


def rydberg_ritz(limit, c, n, gradient=False):
    """E(n) of the extended Rydberg-Ritz formula (see PREDICTION) and, if asked, its gradient in
    (limit, d0, d2, ...)."""
    d0 = c[0]
    x = 1 / (n - d0) ** 2
    delta = d0 + sum(c[k] * x ** k for k in range(1, len(c)))
    nu = n - delta
    e = limit - R_M / nu ** 2
    if not gradient:
        return e
    de_ddelta = -2 * R_M / nu ** 3
    ddelta_dd0 = 1 + sum(c[k] * 2 * k / (n - d0) ** (2 * k + 1) for k in range(1, len(c)))
    return e, [1.0, de_ddelta * ddelta_dd0] + [de_ddelta * x ** k for k in range(1, len(c))]


def solve(a, b):
    """Solves a x = b (a square, small) by Gaussian elimination with partial pivoting."""
    m = len(a)
    t = [list(a[i]) + [b[i]] for i in range(m)]
    for i in range(m):
        p = max(range(i, m), key=lambda r: abs(t[r][i]))
        t[i], t[p] = t[p], t[i]
        for r in range(m):
            if r != i:
                f = t[r][i] / t[i][i]
                t[r] = [t[r][k] - f * t[i][k] for k in range(m + 1)]
    return [t[i][m] / t[i][i] for i in range(m)]


def inverse(a):
    m = len(a)
    cols = [solve(a, [1.0 if r == k else 0.0 for r in range(m)]) for k in range(m)]
    return [[cols[k][r] for k in range(m)] for r in range(m)]


def fit_series(points, terms):
    """Weighted least squares (Gauss-Newton) of the limit and `terms` defect coefficients to the
    levels points = [(n, E, u)] and the limit datum IE +- IE_U. Returns (parameters, covariance)."""
    q = [IE, defect(points[-1][0], points[-1][1])] + [0.0] * (terms - 1)
    for _ in range(100):
        rows = []
        res = []
        for n, e, u in points:
            value, g = rydberg_ritz(q[0], q[1:], n, True)
            rows.append([x / u for x in g])
            res.append((e - value) / u)
        rows.append([1 / IE_U] + [0.0] * terms)
        res.append((IE - q[0]) / IE_U)
        jtj = [[sum(r[i] * r[k] for r in rows) for k in range(terms + 1)] for i in range(terms + 1)]
        jtr = [sum(r[i] * v for r, v in zip(rows, res)) for i in range(terms + 1)]
        step = solve(jtj, jtr)
        q = [a + b for a, b in zip(q, step)]
        if max(abs(x) for x in step[1:]) < 1e-15 and abs(step[0]) < 1e-12:
            break
    return q, inverse(jtj)


def round_up(u):
    """u rounded up to two significant digits."""
    scale = 10 ** (math.floor(math.log10(u)) - 1)
    return math.ceil(u / scale - 1e-9) * scale


def predict(energy, out):
    """The levels n = 5..N_MAX (see PREDICTION): [(label, j, energy, uncertainty, note)]."""
    rows = []
    predicted = {}
    tags = []
    for label, j, _, tag, _ in LEVELS:
        if tag and tag not in [t for t, _, _ in tags]:
            tags.append((tag, j, label.split(" ")[1]))
    for s, j, term in tags:
        members = sorted((x[4], float(x[2]), half_unit(x[2])) for x in LEVELS if x[3] == s)
        terms = len(members)
        q, cov = fit_series(members, terms)
        alt = None
        if terms == 3:
            alt, _ = fit_series(members[1:], 2)
        out.append("fit %s: n = %s and IE; L = %.6f cm-1, %s" % (s, ", ".join(str(m[0]) for m in members), q[0],
                   ", ".join("d%d = %.8f +- %.2g" % (2 * k, q[1 + k], math.sqrt(cov[1 + k][1 + k])) for k in range(terms))))
        for m_n, m_e, _ in members:
            assert abs(rydberg_ritz(q[0], q[1:], m_n) - m_e) < 1e-7, (s, m_n)
        orbital = "spdf"[L_LETTER.index(s[1])]
        for n_new in range(5, N_MAX + 1):
            e, g = rydberg_ritz(q[0], q[1:], n_new, True)
            u_cov = math.sqrt(sum(g[a] * cov[a][b] * g[b] for a in range(len(g)) for b in range(len(g))))
            last = list(q[1:])
            last[-1] = 0.0
            u_last = abs(e - rydberg_ritz(q[0], last, n_new))
            u_alt = abs(e - rydberg_ritz(alt[0], alt[1:], n_new)) if alt else 0.0
            u = round_up(math.sqrt(u_cov ** 2 + max(u_last, u_alt) ** 2))
            label_new = "1s%d%s %s" % (n_new, orbital, term)
            text = "%.4f" % e
            predicted[label_new] = (e, u)
            delta = n_new - math.sqrt(R_M / (q[0] - e))
            out.append("predicted %-10s %s +- %.2g cm-1 (fit %.2g; last term %.2g%s); delta %.6f"
                       % (label_new, text, u, u_cov, u_last, "; two-term fit of n = 3 and 4 %.2g" % u_alt if alt else "",
                          delta))
            rows.append((label_new, j, text, u, "computed: predicted by the Rydberg-Ritz fit of n = %s and the "
                         "ionization energy (this project's script make_helium_levels.py); u = fit %.1e (+) truncation "
                         "%.1e cm-1; delta %.6f" % ("-".join(str(m[0]) for m in members[::len(members) - 1]), u_cov,
                                                    max(u_last, u_alt), delta)))
            # fine structure: the other J of a triplet term, scaled as n^-3 from the highest n where recalled
            others = sorted({x[1] for x in LEVELS if x[0].split(" ")[1][:-1] == s and x[1] != j}, reverse=True)
            for other in others:
                ref_n = max(x[4] for x in LEVELS if x[0].split(" ")[1] == s + other)
                split = (energy["1s%d%s %s%s" % (ref_n, orbital, s, other)] - energy["1s%d%s %s" % (ref_n, orbital, term)]) \
                    * (ref_n / n_new) ** 3
                e_j = e + split
                u_j = round_up(math.sqrt(u ** 2 + (FINE_SCALING_U * split) ** 2))
                label_j = "1s%d%s %s%s" % (n_new, orbital, s, other)
                predicted[label_j] = (e_j, u_j)
                rows.append((label_j, other, "%.4f" % e_j, u_j, "computed: %s plus the n = %d splitting scaled as "
                             "n^-3 (%+.5f cm-1); u adds %.0f %% of the splitting" % (label_new, ref_n, split,
                                                                                      100 * FINE_SCALING_U)))
    return rows, predicted


def truncation_rule_check(out):
    """Check 5: the two-term fit of n = 2, 3 (and IE) predicts the recalled n = 4 within its truncation
    uncertainty (the last term kept), for every series that has n = 2."""
    for s in ("1S", "3S", "1P", "3P"):
        members = sorted((x[4], float(x[2]), half_unit(x[2])) for x in LEVELS if x[3] == s)
        q, _ = fit_series(members[:2], 2)
        e = rydberg_ritz(q[0], q[1:], 4)
        last = [q[1], 0.0]
        u_last = abs(e - rydberg_ritz(q[0], last, 4))
        miss = e - members[2][1]
        out.append("check 5: %s n = 4 from the two-term fit of n = 2, 3: %+.4f cm-1 off, last term %.4f cm-1 (ratio %.2f)"
                   % (s, miss, u_last, abs(miss) / u_last))
        assert abs(miss) <= u_last, s


def fine_structure_n4(energy):
    """The 4d 3D2 and 3D1 levels, not recalled: 4d 3D3 plus the n = 3 splittings scaled as (3/4)^3
    (as for n >= 5; check 3 shows the 3P splittings follow n^-3 within 8 %), u the half unit of 4d 3D3
    and 15 % of the splitting. Returns (label, J, energy text, u, note) rows."""
    rows = []
    base = "1s4d 3D3"
    for j in ("2", "1"):
        split = (energy["1s3d 3D" + j] - energy["1s3d 3D3"]) * (3 / 4) ** 3
        e = energy[base] + split
        u = round_up(math.sqrt(half_unit("191444.4822") ** 2 + (FINE_SCALING_U * split) ** 2))
        rows.append(("1s4d 3D" + j, j, "%.4f" % e, u, "computed: %s plus the n = 3 splitting scaled as n^-3 (%+.5f "
                     "cm-1); u adds %.0f %% of the splitting" % (base, split, 100 * FINE_SCALING_U)))
    return rows


def main():
    energy = {label: float(e) for label, _, e, _, _ in LEVELS}
    n4_rows = fine_structure_n4(energy)
    for label, _, e, _, _ in n4_rows:
        energy[label] = float(e)
    computed_n4 = {row[0] for row in n4_rows}
    notes = {}
    out = []
    out.append("He I level checks (make_helium_levels.py)")
    out.append("IE = %.6f +- %.6f cm-1, R_M(4He) = %.6f cm-1" % (IE, IE_U, R_M))
    d = energy["1s2s 3S1"] - (IE - IE_2S3S)
    out.append("check 1: 1s2s 3S1 minus (IE - IE(2s 3S1)) = %+.7f cm-1 (IE known to %.4f)" % (d, IE_U))
    assert abs(d) < 3 * IE_U, "1s2s 3S1 does not agree with the published ionization energies"
    notes["1s2s 3S1"] = "check 1 %+.7f cm-1" % d
    d = energy["1s2s 1S0"] - (IE - IE_2S1S)
    out.append("check 1: 1s2s 1S0 minus (IE - IE(2s 1S0)) = %+.7f cm-1 (IE known to %.4f)" % (d, IE_U))
    assert abs(d) < 3 * IE_U, "1s2s 1S0 does not agree with the published ionization energies"
    notes["1s2s 1S0"] = "check 1 %+.5f cm-1" % d
    for label, _, e, s, n in LEVELS:
        if s:
            out.append("defect %-9s n = %d: %.6f" % (label, n, defect(n, float(e))))
    for lines, air, what in LINES:
        vac = sum(w * 1e7 / (energy[u] - energy[l]) for l, u, w in lines) / sum(w for _, _, w in lines)
        ritz = vac / edlen(vac)
        miss = ritz - air
        tol = 2.5e-4 if len(lines) == 1 else 4e-4
        ok = abs(miss) <= tol
        out.append("check 2: %-40s Ritz %.5f nm air, handbook %.4f, %+.5f nm %s" % (what, ritz, air, miss,
                   "ok" if ok else "NOT USED"))
        if ok:
            for l, u, _ in lines:
                for x in (l, u):
                    notes.setdefault(x, "check 2 (%.4f nm air %+.5f)" % (air, miss))
    for term, parts in (("3P", ("2", "1", "0")), ("3D", ("3", "2", "1"))):
        for n in (2, 3, 4):
            ls = ["1s%d%s %s%s" % (n, term[1].lower(), term, j) for j in parts]
            if all(x in energy for x in ls) and not any(x in computed_n4 for x in ls):
                split = energy[ls[2]] - energy[ls[0]]
                ref = None
                for m in (2, 3):
                    lm = ["1s%d%s %s%s" % (m, term[1].lower(), term, j) for j in parts]
                    if m != n and all(x in energy for x in lm):
                        ref = (m, energy[lm[2]] - energy[lm[0]])
                        break
                if ref:
                    scaled = ref[1] * (ref[0] / n) ** 3
                    ratio = split / scaled
                    out.append("check 3: %s n = %d splitting %.4f cm-1, n^-3 scaling from n = %d gives %.4f (ratio %.3f)"
                               % (term, n, split, ref[0], scaled, ratio))
                    assert 0.85 < ratio < 1.15, term + " fine structure does not scale"
                    for x in ls[1:]:
                        notes.setdefault(x, "check 3 (fine structure scales as n^-3: ratio %.3f)" % ratio)
    ground_u = round_up(max(IE_U, abs(IE - IE_MEASURED)))
    out.append("ground level: u = %.2g cm-1, the shared offset of the excited levels: the larger of IE_U %.2g cm-1 "
               "(Morton, Wu and Drake 2006) and the measured IE's difference from it, %.2g cm-1 (Kandula et al. 2011)"
               % (ground_u, IE_U, abs(IE - IE_MEASURED)))
    notes["1s2 1S0"] = ("ground level (the zero); u is the offset shared by all excited levels: the ground ionization "
                        "energy's (theory 33 MHz; measured value %.0f MHz away)" % ((IE - IE_MEASURED) * C_MHZ_PER_CM))
    rows = []
    for label, j, e, _, _ in LEVELS:
        u_text = "%.2g" % ground_u if label == "1s2 1S0" else "%g" % half_unit(e)
        rows.append("He I,%s,%s,%s,%s,from memory; %s" % (label, e, u_text, j, notes[label]))
        if label == "1s4d 3D3":
            for l4, j4, e4, u4, note4 in n4_rows:
                rows.append("He I,%s,%s,%.2g,%s,%s" % (l4, e4, u4, j4, note4))
    predicted_rows, predicted = predict(energy, out)
    uncertainty = {label: half_unit(e) for label, _, e, _, _ in LEVELS}
    for label, _, _, u, _ in n4_rows:
        uncertainty[label] = u
    for label, (e, u) in predicted.items():
        energy[label] = e
        uncertainty[label] = u
    worst = 0
    for lines, air, what in LINES_PREDICTED:
        total = sum(w for _, _, w in lines)
        vac = sum(w * 1e7 / (energy[u] - energy[l]) for l, u, w in lines) / total
        ritz = vac / edlen(vac)
        # the components share their upper series' uncertainty (taken as fully correlated); the lower
        # levels' is added in quadrature
        u_upper = sum(w * uncertainty[u] for _, u, w in lines) / total
        u_lower = sum(w * uncertainty[l] for l, _, w in lines) / total
        u_nm = (vac * 1e-7) ** 2 * math.hypot(u_upper, u_lower) * 1e7
        u_round = half_unit(air) / math.sqrt(3)
        combined = math.hypot(u_nm, u_round)
        miss = ritz - float(air)
        pull = miss / combined
        worst = max(worst, abs(pull))
        out.append("check 4: %-24s Ritz %.5f +- %.5f nm air, handbook %s (+- %.5f rounding), %+.5f nm, pull %+.2f"
                   % (what, ritz, u_nm, air, u_round, miss, pull))
        assert abs(pull) < 3, what
    out.append("check 4: largest |pull| %.2f (bound 3)" % worst)
    truncation_rule_check(out)
    for label, j, e, u, note in predicted_rows:
        assert "," not in note
        rows.append("He I,%s,%s,%.2g,%s,%s" % (label, e, u, j, note))
    header = [
        "# ritzwerk-levels 1",
        "# id: levels-he-i",
        "# title: He I levels n <= %d (singlets and triplets; n <= 4 recalled and n = 5-%d predicted by a Rydberg-Ritz fit), for Ritz lines" % (N_MAX, N_MAX),
        "# source: NIST Atomic Spectra Database, He I energy levels (G. W. F. Drake and W. C. Martin, Can. J. Phys. 76, 679 (1998); D. C. Morton, Q. Wu and G. W. F. Drake, Can. J. Phys. 84, 83 (2006)), from memory; checked against the ionization energies of Morton, Wu and Drake (2006), Drake, Bondy, Hallett and Najem, arXiv:2510.17495 (2025) and Chi, Fang, Zhang, Tang and Shi, arXiv:2606.04768 (2026)",
        "# provenance: from-memory",
        "# version: NIST ASD (version not re-checked)",
        "# energy-unit: cm-1",
        "# note: ground level 1s2 1S0: uncertainty %.2g cm-1, the offset shared by every excited level (where they sit relative to the ground is uncertain by the ground ionization energy's uncertainty: theory of Morton, Wu and Drake (2006) 33 MHz, and the measurement of Kandula et al., Phys. Rev. A 84, 062512 (2011), 5945204212(6) MHz, %.0f MHz away; the larger is taken), so lines to the ground carry it and lines between excited levels do not; the excited levels' uncertainties are relative to the ground. n <= 4: energies as the ASD prints them; uncertainty is half a unit in the last digit; the 4d 3D2 and 3D1 levels (not recalled) are computed: 4d 3D3 plus the n = 3 splittings scaled as (3/4)^3 with 15 %% of the splitting added to the uncertainty; the 4f levels are left out (not recalled); each row's note names its independent check. n = 5-%d (rows whose note begins 'computed'): predicted by this project's Rydberg-Ritz fit of each series' recalled n = 2-4 levels (n = 3-4 for the d series) and the ionization energy of Morton, Wu and Drake (2006); standard uncertainty from the fit's covariance and the truncation of the quantum-defect expansion; 3P1 3P0 3D2 3D1 from the n^-3-scaled splittings of n = 4 (3P) and n = 3 (3D); no nf levels. Checks in helium-checks.txt (make_helium_levels.py)" % (ground_u, (IE - IE_MEASURED) * C_MHZ_PER_CM, N_MAX),
        "species,label,energy,uncertainty,j,note",
    ]
    with open("levels-he-i.csv", "w") as f:
        f.write("\n".join(header + rows) + "\n")
    with open("helium-checks.txt", "w") as f:
        f.write("\n".join(out) + "\n")


if __name__ == "__main__":
    main()
