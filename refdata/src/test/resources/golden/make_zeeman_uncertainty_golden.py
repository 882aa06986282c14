#!/usr/bin/python3
"""Writes zeeman-component-uncertainties.csv and zeeman-state-uncertainties.csv: the m_F-resolved Zeeman
components of the Rb-87 D1 and D2 lines, and the eigenstates of the Cs-133 6p3/2 level, at several fields,
each with the standard uncertainty propagated from the published numbers, the largest |J m_J m_I>
component of each state with its weight, and the slope by the field (d nu/dB of a component, dE/dB of a
state, Hz per tesla), for ZeemanUncertaintyTest.

Run from this folder:   python3 make_zeeman_uncertainty_golden.py
Needs sympy and mpmath (run here with sympy 1.14.0 and mpmath 1.3.0 under Python 3.11; Debian
python3-sympy and python3-mpmath serve too).  Deterministic.

Independent of the project's code (which builds each J level in the |J m_J m_I> basis with Clebsch-Gordan
coefficients and takes derivatives by the Hellmann-Feynman theorem):
  * the Hamiltonians are built here in the fully uncoupled basis |m_L m_S m_I> from the angular-momentum
    ladder operators alone (common practice): J = L + S; the projector on J = 3/2 of a p term is
    P = (J^2 - 3/4) / 3; the fine structure is fs P; the hyperfine operator of each J level is its
    A I.J + B [3 (I.J)^2 + 3/2 I.J - I(I+1) J(J+1)] / [2 I (2I-1) J (2J-1)] (E. Arimondo, M. Inguscio and
    P. Violino, Rev. Mod. Phys. 49, 31 (1977), as recalled) times that level's projector (I.J commutes with
    J^2; no hyperfine coupling between the two J, as the engine leaves it out); the Zeeman operator
    mu_B B (L_z + g_S S_z + g_I I_z); an s1/2 level is the same with L = 0;
  * a level on its own (Cs-133 6p3/2) is the term's J = 3/2 part, P H P, with the J = 1/2 states pushed far
    up; its Zeeman operator so becomes g_J J_z with the Lande g_J (g_L = 1), as the engine's;
  * eigenvalues by mpmath.eigsy at 40 digits, per m_F block, rising; the zero-field (J, F) labels of a
    block given to its states by rising energy (states of one m_F do not cross);
  * every derivative of an eigenvalue by A or B is NUMERICAL: a central difference with a step of 1 Hz on
    the 40-digit eigenvalues (truncation error below 1e-15 relative), not the Hellmann-Feynman expectation;
  * so is every derivative by the field (column field_slope_hz_per_t): a central difference with a step of
    1e-9 T on the 40-digit eigenvalues of the whole Hamiltonian rebuilt at B -+ 1e-9 T (same m_F block and
    rank; the slopes change over a few mT, A / (mu_B / h), so the truncation error is below 1e-12 relative),
    a component's the upper state's minus the lower's; at zero field the script asserts that each state's
    slope is g_F m_F mu_B / h with g_F = g_J [F(F+1) + J(J+1) - I(I+1)] / [2F(F+1)]
    + g_I [F(F+1) + I(I+1) - J(J+1)] / [2F(F+1)] (common practice; g_J of s1/2 g_S, of p the Lande value
    with g_L = 1);
  * u(E)^2 = sum over the constants (dE/dX u_X)^2, all constants independent (GUM, JCGM 100:2008, eq. 10,
    from memory; no source states a covariance); a component's u^2 = u_centroid^2 + u(E_lower)^2 +
    u(E_upper)^2; the column hyperfine_uncertainty_hz leaves the centroid's out;
  * a component's strength: d_q takes |m_L = 0, m_S, m_I> to |m_L = q, m_S, m_I> (Wigner-Eckart, one reduced
    element), so its share is |<upper|d_q|lower>|^2 / (6 (2I+1) (2J'+1)/6): the shares of one line sum to 1;
  * the |J m_J m_I> basis states are made from |m_L m_S> with sympy's Clebsch-Gordan coefficients
    (sympy.physics.quantum.cg.CG); each state's largest weight |<J m_J m_I|psi>|^2 (ties within 1e-9 to J,
    then m_J, then m_I ascending); at zero field the script asserts that every weight of |F m_F> is
    <J m_J I m_I|F m_F>^2 by sympy's CG, and writes that number beside it (column cg_weight).

Numbers, as the data files hold them (their sources named there; most from memory):
  Rb-87 (I = 3/2, mu = 2.75129 mu_N, Stone 2019): 5s A = 3417.34130545215(5e-11) MHz (Bize et al. 1999);
    5p1/2 A = 408.328(15) MHz (Barwood et al. 1991); 5p3/2 A = 84.7185(20) MHz, B = 12.4965(37) MHz (Ye et al.
    1996); D1 377 107 463.380(11) MHz (Maric et al. 2008); D2 384 230 484.4685(62) MHz (Ye et al. 1996);
    fine structure D2 - D1;
  Cs-133 (I = 7/2, mu = 2.5778 mu_N, Stone 2019): 6p3/2 A = 50.28827(23) MHz, B = -0.4934(17) MHz (Gerginov
    et al. 2003);
  CODATA 2018: mu_B / h = e / (4 pi m_e), g_S = 2 (1 + a_e), m_e / m_p; g_I = -(mu / mu_N)(m_e / m_p) / I.
"""

import mpmath
import sympy
import golden_csv
from sympy.physics.quantum.cg import CG

mpmath.mp.dps = 40
M = mpmath.mpf
MHZ = M(10) ** 6
E_CHARGE = M("1.602176634e-19")
M_E = M("9.1093837015e-31")
M_P = M("1.67262192369e-27")
A_E = M("1.15965218128e-3")
MU_B = E_CHARGE / (4 * mpmath.pi * M_E)
G_S = 2 * (1 + A_E)


def half(two):
    return str(two // 2) if two % 2 == 0 else "%d/2" % two


def ladder(two_j):
    """J_z, J_+ of one angular momentum in the basis m ascending."""
    j = M(two_j) / 2
    ms = [M(m) / 2 for m in range(-two_j, two_j + 1, 2)]
    n = len(ms)
    jz = mpmath.zeros(n, n)
    jp = mpmath.zeros(n, n)
    for a, m in enumerate(ms):
        jz[a, a] = m
        if a + 1 < n:
            jp[a + 1, a] = mpmath.sqrt(j * (j + 1) - m * (m + 1))
    return jz, jp


def kron(*ms):
    out = ms[0]
    for m in ms[1:]:
        r = mpmath.zeros(out.rows * m.rows, out.cols * m.cols)
        for a in range(out.rows):
            for b in range(out.cols):
                if out[a, b] == 0:
                    continue
                for c in range(m.rows):
                    for d in range(m.cols):
                        r[a * m.rows + c, b * m.cols + d] = out[a, b] * m[c, d]
        out = r
    return out


def eye(n):
    return mpmath.eye(n)


class Atom:
    """Operators of |m_L m_S m_I> (index (m_L + L) * 2 (2I+1) + (m_S + 1/2) (2I+1) + m_I + I)."""

    def __init__(self, two_l, two_i):
        self.two_l, self.two_i = two_l, two_i
        nl, ns, ni = two_l + 1, 2, two_i + 1
        self.n = nl * ns * ni
        lz, lp = ladder(two_l)
        sz, sp = ladder(1)
        iz, ip = ladder(two_i)
        il, is_, ii = eye(nl), eye(ns), eye(ni)
        self.Lz, self.Lp = kron(lz, is_, ii), kron(lp, is_, ii)
        self.Sz, self.Sp = kron(il, sz, ii), kron(il, sp, ii)
        self.Iz, self.Ip = kron(il, is_, iz), kron(il, is_, ip)
        self.Jz = self.Lz + self.Sz
        self.Jp = self.Lp + self.Sp
        jm = self.Jp.T
        im = self.Ip.T
        self.IJ = self.Iz * self.Jz + (self.Ip * jm + im * self.Jp) / 2
        self.J2 = self.Jz * self.Jz + (self.Jp * jm + jm * self.Jp) / 2
        self.mf = []
        self.ml, self.ms, self.mi = [], [], []
        for a in range(nl):
            for b in range(ns):
                for c in range(ni):
                    self.ml.append(2 * a - two_l)
                    self.ms.append(2 * b - 1)
                    self.mi.append(2 * c - two_i)
                    self.mf.append(2 * a - two_l + 2 * b - 1 + 2 * c - two_i)

    def projector(self, two_j):
        if self.two_l == 0:
            return eye(self.n)
        p32 = (self.J2 - eye(self.n) * M(3) / 4) / 3
        return p32 if two_j == 3 else eye(self.n) - p32

    def quadrupole(self, two_j):
        i, j = M(self.two_i) / 2, M(two_j) / 2
        q = self.IJ * self.IJ * 3 + self.IJ * M(3) / 2 - eye(self.n) * i * (i + 1) * j * (j + 1)
        return q / (2 * i * (2 * i - 1) * j * (2 * j - 1))

    def zeeman(self, g_i, tesla):
        return (self.Lz + self.Sz * G_S + self.Iz * g_i) * (MU_B * tesla)

    def uncoupled(self, two_j, two_mj, two_mi):
        """|J m_J m_I> as a vector over |m_L m_S m_I>, by sympy's CG."""
        v = mpmath.zeros(self.n, 1)
        for a in range(self.n):
            if self.mi[a] != two_mi or self.ml[a] + self.ms[a] != two_mj:
                continue
            c = CG(sympy.Rational(self.two_l, 2), sympy.Rational(self.ml[a], 2), sympy.Rational(1, 2),
                   sympy.Rational(self.ms[a], 2), sympy.Rational(two_j, 2), sympy.Rational(two_mj, 2)).doit()
            v[a] = M(sympy.Rational(c) if c.is_rational else sympy.N(c, 50))
        return v


def casimir(two_i, two_j, two_f, a, b):
    i, j, f = M(two_i) / 2, M(two_j) / 2, M(two_f) / 2
    k = f * (f + 1) - i * (i + 1) - j * (j + 1)
    e = a * k / 2
    if two_i >= 2 and two_j >= 2:
        e += b * (M(3) / 2 * k * (k + 1) - 2 * i * (i + 1) * j * (j + 1)) / (4 * i * (2 * i - 1) * j * (2 * j - 1))
    return e


def blocks(atom, h, labels_of):
    """Eigenstates by m_F block: list of (2mF, energy, vector, label), rising within a block."""
    out = []
    for mf in sorted(set(atom.mf)):
        idx = [a for a in range(atom.n) if atom.mf[a] == mf]
        sub = mpmath.matrix([[h[a, b] for b in idx] for a in idx])
        e, q = mpmath.eigsy(sub)
        order = sorted(range(len(idx)), key=lambda k: e[k])
        labels = labels_of(mf)
        for rank, k in enumerate(order):
            v = mpmath.zeros(atom.n, 1)
            for r, a in enumerate(idx):
                v[a] = q[r, k]
            out.append((mf, e[k], v, labels[rank] if rank < len(labels) else None))
    return out


def energies(atom, build, constants):
    """Eigenvalues (keyed by 2mF and rank) of the Hamiltonian build(constants)."""
    h = build(constants)
    out = {}
    for mf in sorted(set(atom.mf)):
        idx = [a for a in range(atom.n) if atom.mf[a] == mf]
        e = sorted(mpmath.eigsy(mpmath.matrix([[h[a, b] for b in idx] for a in idx]), eigvals_only=True))
        for rank, x in enumerate(e):
            out[(mf, rank)] = x
    return out


def uncertainties(atom, build, constants, stated):
    """u(E) of every eigenvalue by central differences (step 1 Hz) over the constants with a stated u."""
    u2 = {}
    for name, u in stated.items():
        up = dict(constants)
        dn = dict(constants)
        up[name] += 1
        dn[name] -= 1
        eu, ed = energies(atom, build, up), energies(atom, build, dn)
        for key in eu:
            d = (eu[key] - ed[key]) / 2
            u2[key] = u2.get(key, M(0)) + (d * u) ** 2
    return {k: mpmath.sqrt(v) for k, v in u2.items()}


SLOPE_STEP = M("1e-9")


def slopes(atom, build_at, constants, tesla):
    """dE/dB (Hz per tesla) of every eigenvalue, keyed by 2mF and rank: central difference in the field."""
    up = energies(atom, build_at(tesla + SLOPE_STEP), constants)
    dn = energies(atom, build_at(tesla - SLOPE_STEP), constants)
    return {k: (up[k] - dn[k]) / (2 * SLOPE_STEP) for k in up}


def g_f(two_j, two_i, two_f, g_j, g_i):
    """g_F of a hyperfine level (common practice); 0 for F = 0."""
    if two_f == 0:
        return M(0)
    i, j, f = M(two_i) / 2, M(two_j) / 2, M(two_f) / 2
    ff, ii, jj = f * (f + 1), i * (i + 1), j * (j + 1)
    return g_j * (ff + jj - ii) / (2 * ff) + g_i * (ff + ii - jj) / (2 * ff)


def check_weak_slope(slope, two_j, two_i, two_f, two_mf, g_j, g_i):
    expected = g_f(two_j, two_i, two_f, g_j, g_i) * M(two_mf) / 2 * MU_B
    assert abs(slope - expected) < M("1e-12") * MU_B, (two_j, two_f, two_mf, slope, expected)


def dominant(atom, v, js):
    best = None
    for two_j in js:
        for two_mj in range(-two_j, two_j + 1, 2):
            for two_mi in range(-atom.two_i, atom.two_i + 1, 2):
                b = atom.uncoupled(two_j, two_mj, two_mi)
                w = sum(b[a] * v[a] for a in range(atom.n)) ** 2
                if best is None or w > best[3] + M("1e-9"):
                    best = (two_j, two_mj, two_mi, w)
    return best


def cg_weight(two_j, two_i, two_f, two_mf, lab):
    """<J m_J I m_I | F m_F>^2 by sympy, for the dominant label lab."""
    c = CG(sympy.Rational(two_j, 2), sympy.Rational(lab[1], 2), sympy.Rational(two_i, 2), sympy.Rational(lab[2], 2),
           sympy.Rational(two_f, 2), sympy.Rational(two_mf, 2)).doit()
    return M(sympy.Rational(c ** 2))


def check_cg(atom, v, two_j, two_f, two_mf):
    for two_mj in range(-two_j, two_j + 1, 2):
        for two_mi in range(-atom.two_i, atom.two_i + 1, 2):
            b = atom.uncoupled(two_j, two_mj, two_mi)
            w = sum(b[a] * v[a] for a in range(atom.n)) ** 2
            assert abs(w - cg_weight(two_j, atom.two_i, two_f, two_mf, (two_j, two_mj, two_mi))) < M("1e-25"), \
                (two_j, two_f, two_mf, two_mj, two_mi)


def nstr(x, digits=20):
    return mpmath.nstr(x, digits)


HEADER = ["# generated by make_zeeman_uncertainty_golden.py with sympy %s and mpmath %s at 40 digits"
          % (sympy.__version__, mpmath.__version__),
          "# inputs and method in the script's docstring; frequencies, energies and uncertainties in Hz"]


def write(name, tolerances, columns, rows):
    golden_csv.write(name, HEADER + tolerances, columns, rows)


# ---- 1. Rb-87 D lines in a field
RB_I = 3
RB_G_I = -M("2.75129") * (M_E / M_P) / (M(RB_I) / 2)
RB = {"As": M("3417.34130545215") * MHZ, "Ap12": M("408.328") * MHZ, "Ap32": M("84.7185") * MHZ,
      "Bp32": M("12.4965") * MHZ}
RB_U = {"As": M("0.00000000005") * MHZ, "Ap12": M("0.015") * MHZ, "Ap32": M("0.0020") * MHZ,
        "Bp32": M("0.0037") * MHZ}
D1, U_D1 = M("377107463.380") * MHZ, M("0.011") * MHZ
D2, U_D2 = M("384230484.4685") * MHZ, M("0.0062") * MHZ
FS = D2 - D1
S = Atom(0, RB_I)
P = Atom(2, RB_I)
P12, P32 = P.projector(1), P.projector(3)
Q32 = P.quadrupole(3)


def lande_p(two_j):
    """g_J of a p level by the Lande formula with g_L = 1 and g_S."""
    j = M(two_j) / 2
    jj = j * (j + 1)
    return (jj - M(3) / 4 + 2) / (2 * jj) + G_S * (jj + M(3) / 4 - 2) / (2 * jj)


def ground_h(tesla):
    return lambda c: S.IJ * c["As"] + S.zeeman(RB_G_I, tesla)


def term_h(tesla):
    return lambda c: (P12 * P.IJ * P12 * c["Ap12"] + P32 * P.IJ * P32 * c["Ap32"] + P32 * Q32 * P32 * c["Bp32"]
                      + P32 * FS + P.zeeman(RB_G_I, tesla))


def ground_labels(mf):
    fs = [f for f in (RB_I - 1, RB_I + 1) if f >= abs(mf)]
    return [(1, f) for f in sorted(fs, key=lambda f: casimir(RB_I, 1, f, RB["As"], 0))]


def term_labels(mf):
    out = []
    for two_j in (1, 3):
        for f in range(abs(RB_I - two_j), RB_I + two_j + 1, 2):
            if f >= abs(mf):
                a = RB["Ap12"] if two_j == 1 else RB["Ap32"]
                b = 0 if two_j == 1 else RB["Bp32"]
                out.append((two_j, f, (FS if two_j == 3 else 0) + casimir(RB_I, two_j, f, a, b)))
    return [(j, f) for j, f, _ in sorted(out, key=lambda x: x[2])]


component_rows = []
for tesla in (M(0), M("1e-4"), M("0.01"), M(1)):
    lo = blocks(S, ground_h(tesla)(RB), ground_labels)
    up = blocks(P, term_h(tesla)(RB), term_labels)
    u_lo = uncertainties(S, ground_h(tesla), RB, {"As": RB_U["As"]})
    u_up = uncertainties(P, term_h(tesla), RB, {k: RB_U[k] for k in ("Ap12", "Ap32", "Bp32")})
    s_lo = slopes(S, ground_h, RB, tesla)
    s_up = slopes(P, term_h, RB, tesla)
    rank_lo, rank_up = {}, {}
    for mf, e, v, lab in lo:
        rank_lo.setdefault(mf, 0)
    for two_j_line, centroid, u_c in ((1, D1, U_D1), (3, D2, U_D2)):
        low_centroid = D1
        ranks_l = {}
        for mf, e, v, lab in lo:
            rl = ranks_l[mf] = ranks_l.get(mf, -1) + 1
            dl = dominant(S, v, (1,))
            if tesla == 0:
                check_cg(S, v, 1, lab[1], mf)
                check_weak_slope(s_lo[(mf, rl)], 1, RB_I, lab[1], mf, G_S, RB_G_I)
            ranks_u = {}
            for mfu, eu, vu, labu in up:
                ru = ranks_u[mfu] = ranks_u.get(mfu, -1) + 1
                if labu[0] != two_j_line or abs(mfu - mf) > 2:
                    continue
                q = (mfu - mf) // 2
                amp = M(0)
                for a in range(S.n):
                    # |m_L = 0, m_S, m_I> -> |m_L = q, m_S, m_I>
                    b = (q + 1) * 2 * (RB_I + 1) + a
                    amp += vu[b] * v[a]
                share = amp ** 2 / (6 * (RB_I + 1) * M(two_j_line + 1) / 6)
                if share <= M("1e-12"):
                    continue
                du = dominant(P, vu, (1, 3))
                if tesla == 0:
                    check_cg(P, vu, labu[0], labu[1], mfu)
                    check_weak_slope(s_up[(mfu, ru)], labu[0], RB_I, labu[1], mfu, lande_p(labu[0]), RB_G_I)
                freq = low_centroid + eu - e
                u_hf = mpmath.sqrt(u_lo[(mf, rl)] ** 2 + u_up[(mfu, ru)] ** 2)
                component_rows.append((
                    nstr(tesla, 6), "D1" if two_j_line == 1 else "D2", lab[1], mf, labu[1], mfu, nstr(freq),
                    nstr(mpmath.sqrt(u_c ** 2 + u_hf ** 2), 15), nstr(u_hf, 15), nstr(share, 15),
                    half(dl[1]), half(dl[2]), nstr(dl[3], 15), half(du[1]), half(du[2]), nstr(du[3], 15),
                    nstr(cg_weight(1, RB_I, lab[1], mf, dl), 15) if tesla == 0 else "",
                    nstr(cg_weight(labu[0], RB_I, labu[1], mfu, du), 15) if tesla == 0 else "",
                    nstr(s_up[(mfu, ru)] - s_lo[(mf, rl)], 15)))
write("zeeman-component-uncertainties.csv",
      ["# tolerance: 1e-12 relative (frequency: double arithmetic on a 3.8e14 Hz centroid and the engine's fine "
       "structure from its level energies)",
       "# tolerance uncertainty: 1e-6 relative (u: the engine's Hellmann-Feynman derivatives in double precision "
       "against 40-digit central differences)",
       "# tolerance weight: 1e-9 absolute (shares and weights: double-precision eigenvectors)",
       "# tolerance field_slope: 1e-6 relative (d nu/dB: the engine's Hellmann-Feynman expectation in double "
       "precision against 40-digit central differences in the field)",
       "# tolerance field_slope_floor: 10 absolute (Hz per tesla, added to the relative one for slopes near 0: "
       "7e-10 of mu_B / h)"],
      ["field_tesla", "line", "twice_f_lower", "twice_mf_lower", "twice_f_upper", "twice_mf_upper", "frequency_hz",
       "uncertainty_hz", "hyperfine_uncertainty_hz", "relative_strength", "lower_m_j", "lower_m_i", "lower_weight",
       "upper_m_j", "upper_m_i", "upper_weight", "lower_cg_weight", "upper_cg_weight", "field_slope_hz_per_t"],
      component_rows)

# ---- 2. Cs-133 6p3/2 on its own
CS_I = 7
CS_G_I = -M("2.5778") * (M_E / M_P) / (M(CS_I) / 2)
CS = {"A": M("50.28827") * MHZ, "B": M("-0.4934") * MHZ}
CS_U = {"A": M("0.00023") * MHZ, "B": M("0.0017") * MHZ}
CP = Atom(2, CS_I)
CP32 = CP.projector(3)
CQ = CP.quadrupole(3)
FAR = M(10) ** 18


def cs_h(tesla):
    return lambda c: (CP32 * (CP.IJ * c["A"] + CQ * c["B"] + CP.zeeman(CS_G_I, tesla)) * CP32
                      + (eye(CP.n) - CP32) * FAR)


def cs_labels(mf):
    fs = [f for f in range(abs(CS_I - 3), CS_I + 4, 2) if f >= abs(mf)]
    return [(3, f) for f in sorted(fs, key=lambda f: casimir(CS_I, 3, f, CS["A"], CS["B"]))]


state_rows = []
for tesla in (M(0), M("1e-3"), M("0.1"), M(1)):
    states = blocks(CP, cs_h(tesla)(CS), cs_labels)
    u = uncertainties(CP, cs_h(tesla), CS, CS_U)
    slope = slopes(CP, cs_h, CS, tesla)
    ranks = {}
    for mf, e, v, lab in states:
        r = ranks[mf] = ranks.get(mf, -1) + 1
        if lab is None:
            continue  # a J = 1/2 state pushed far up
        d = dominant(CP, v, (3,))
        if tesla == 0:
            check_cg(CP, v, 3, lab[1], mf)
            check_weak_slope(slope[(mf, r)], 3, CS_I, lab[1], mf, lande_p(3), CS_G_I)
        state_rows.append((nstr(tesla, 6), lab[1], mf, nstr(e), nstr(u[(mf, r)], 15), half(d[1]), half(d[2]),
                           nstr(d[3], 15), nstr(cg_weight(3, CS_I, lab[1], mf, d), 15) if tesla == 0 else "",
                           nstr(slope[(mf, r)], 15)))
write("zeeman-state-uncertainties.csv",
      ["# tolerance: 1e-3 absolute (energy, Hz: double-precision diagonalisation of matrices of up to 3e10 Hz)",
       "# tolerance uncertainty: 1e-6 relative (Hellmann-Feynman in double precision against 40-digit central "
       "differences)",
       "# tolerance weight: 1e-9 absolute",
       "# tolerance field_slope: 1e-6 relative (dE/dB: Hellmann-Feynman in double precision against 40-digit central "
       "differences in the field)",
       "# tolerance field_slope_floor: 10 absolute (Hz per tesla, added to the relative one for slopes near 0)"],
      ["field_tesla", "twice_f", "twice_mf", "energy_hz", "energy_uncertainty_hz", "m_j", "m_i", "weight",
       "cg_weight", "field_slope_hz_per_t"], state_rows)
print("wrote %d component and %d state rows" % (len(component_rows), len(state_rows)))
