#!/usr/bin/python3
"""Writes hyperfine-shift-uncertainties.csv, hyperfine-component-uncertainties.csv and
hyperfine-ladder-uncertainties.csv: the standard uncertainties of hyperfine F-level shifts, of D-line
F -> F' components and of F -> F' -> F'' ladder steps of Rb-87 and Cs-133, propagated from the published
numbers, for HyperfineUncertaintyTest.

Run from this folder:   python3 make_hyperfine_uncertainty_golden.py
Needs sympy and mpmath (run here with sympy 1.14.0 and mpmath 1.3.0 under Python 3.11; Debian
python3-sympy and python3-mpmath serve too).  Deterministic.

Independent of the project's code:
  * the F-level shift is the Casimir formula (E. Arimondo, M. Inguscio and P. Violino, Rev. Mod. Phys. 49,
    31 (1977), eq. 2.4 as recalled; common practice), written here in sympy with exact rationals:
    E_F = A K/2 + B (3/2 K(K+1) - 2 I(I+1) J(J+1)) / (4 I(2I-1) J(2J-1)), K = F(F+1) - I(I+1) - J(J+1),
    the B term only for I >= 1 and J >= 1; its derivatives by A and by B are taken SYMBOLICALLY (sympy.diff),
    not the closed form the engine uses;
  * u(E_F)^2 = (dE_F/dA u_A)^2 + (dE_F/dB u_B)^2 (GUM, JCGM 100:2008, eq. 10, from memory: A and B of one
    level uncorrelated, no source states a covariance);
  * a component F -> F' of a line, or one step of a ladder, is centroid + E_F'(upper) - E_F(lower); its
    standard uncertainty on its own is sqrt(u_centroid^2 + u(E_F)^2 + u(E_F')^2) (centroid and the two levels'
    constants independent);
  * a centroid's uncertainty: the D lines' as measured; a Rydberg level's from the limit and the series'
    defects by mpmath.diff at 50 digits (as make_alkali_uncertainty_golden.py does), the ground level being
    the exact zero, the step 5p3/2 -> Rydberg combining both levels' as independent;
  * a Rydberg level's A and B are the series' constants scaled as n*^-3 (RydbergHyperfine, common practice):
    A(n) = A_ref (n*_ref / n*)^3 for a constant measured at level n_ref, A(n) = Abar / n*^3 for a published
    scaled constant, and their stated uncertainties scaled by the same factor; n* = n - delta(n) of the formula,
    n*_ref = sqrt(R_M / (limit - E_ref)) of the measured reference level;
  * the n*^-3 law's own error (RydbergHyperfine.scalingLawRelativeUncertainty), added to u_A and u_B in
    quadrature as a relative uncertainty r = min(d |n - n_m|, cap) of A and of B: X = A n*^3 at two measured
    levels of a series, d = |ln(X_b / X_a)| / |n_b - n_a|, n_m the nearest measured n (for a published scaled
    constant the nearest end of the n range it was fitted over, 41-55 for Cs nP); cap the largest |ln(X_b / X_a)|
    over the series of the same l (RydbergHyperfine.seriesLaw), and d of a series with one measured level
    (Rb nD5/2) the largest d of that l: for s the Cs 6s - 7s figure, for d the Cs 6d5/2 - 7d5/2 figure (the
    largest of the project's pairs since the 6d constants were added; for one n apart d and cap are the same
    number), which RydbergHyperfineScalingLawTest checks over every series; a published scaled constant counts
    as measured at the lowest n of its range (Cs nP3/2 at 41, X = 0.718 GHz); Rb nS: 5s, 6s and 7s; Cs nP3/2:
    6p3/2 and 7p3/2; Cs nD3/2: 6d3/2 and 7d3/2;
    measured levels' n* = sqrt(R_M / (limit - E)), E = 0 for a ground level, or, for a level the level list
    lacks (Cs 6d3/2, 7d3/2, 7d5/2), n - delta(n) of the series' modified Rydberg-Ritz formula with every
    coefficient of quantum-defects-cs-133.csv, as the engine takes it there.

Numbers, as the data files hold them (their sources named there; most from memory):
  Rb-87 (I = 3/2): 5s A = 3417.34130545215(5e-11) MHz (Bize et al. 1999); 5p1/2 A = 408.328(15) MHz (Barwood
    et al. 1991); 5p3/2 A = 84.7185(20) MHz, B = 12.4965(37) MHz (Ye et al. 1996); D1 377 107 463.380(11) MHz
    (Maric et al. 2008); D2 384 230 484.4685(62) MHz (Ye et al. 1996); nS from 7s A = 319.759(28) MHz (Chui et
    al. 2005), 7s at 26311.436 cm-1 (NIST ASD as typed in); nD5/2 from 7d5/2 A = -2.2(5) MHz, no B (Phys. Rev.
    A 11, 1125 (1975)), 7d5/2 at 30281.619 cm-1; limit 1 010 029.1646(3) GHz from 5S1/2 F = 1, F = 1 at
    -4 271.676 631 815 MHz from the centroid (Mack et al. 2011); nS d0 = 3.1311807(8), d2 = 0.1787(2); nD5/2
    d0 = 1.3464622(11), d2 = -0.5940(4) (Mack et al. 2011);
  Cs-133 (I = 7/2): 6s A = 2298.1579425 MHz exactly (the SI second); 6p3/2 A = 50.28827(23) MHz, B =
    -0.4934(17) MHz (Gerginov et al. 2003); D2 351 725 718.4744(51) MHz (Gerginov et al. 2004), the 6p3/2
    energy; 7s A = 545.818 MHz (Yang et al. 2016) at 18535.5286 cm-1, 7p3/2 A = 16.605 MHz (Arimondo et al.
    1977) at 21946.397 cm-1 (both energies NIST ASD as typed in, levels-cs-133.csv); 6d3/2 A = 16.34 MHz and
    6d5/2 A = -4.66 MHz (Kortyna et al., DAMOP 2005 abstract, read), 6d5/2 at 22631.6863 cm-1 (levels-cs-133.csv);
    7d3/2 A = 7.3509 MHz (arXiv:2210.01481), 7d5/2 A = -1.70867 MHz (Rahaman and Dutta 2023), both read in the
    abstracts; nD3/2 d0..d8 = 2.4754562, 0.00932, -0.43498, -0.76358, -18.0061 (Lorenzen and Niemax 1984) and
    nD5/2 d0..d6 = 2.4663144, 0.01381, -0.392, -1.9 (Deiglmayr et al. 2016), as quantum-defects-cs-133.csv; nP3/2 scaled
    A = 0.718(27) GHz, B = -0.084(102) GHz (Song et al. 2024, read in the abstract); limit 31 406.467 732 5(14)
    cm-1 and nP3/2 d0 = 3.5590676(2), d2 = 0.37469(14) (Deiglmayr et al. 2016);
  masses AME2020 (Rb-87 86.909180529 u, Cs-133 132.905451958 u), CODATA 2018 R_inf, m_e and c.
"""

import mpmath
import sympy
import golden_csv

mpmath.mp.dps = 50
C = mpmath.mpf(299792458)
R_INF = mpmath.mpf("109737.31568160")
M_E = mpmath.mpf("5.48579909065e-4")
MHZ_HZ = mpmath.mpf(10) ** 6
GHZ = mpmath.mpf(10) ** 9 / (C * 100)
MHZ = mpmath.mpf(10) ** 6 / (C * 100)
CM_HZ = C * 100

# ---- the Casimir formula and its derivatives, symbolically
A_, B_ = sympy.symbols("A B")


def casimir(two_i, two_j, two_f):
    i, j, f = (sympy.Rational(x, 2) for x in (two_i, two_j, two_f))
    k = f * (f + 1) - i * (i + 1) - j * (j + 1)
    e = A_ * k / 2
    if two_i >= 2 and two_j >= 2:
        e += B_ * (sympy.Rational(3, 2) * k * (k + 1) - 2 * i * (i + 1) * j * (j + 1)) \
            / (4 * i * (2 * i - 1) * j * (2 * j - 1))
    return e


def shift(two_i, two_j, two_f, a, u_a, b, u_b):
    """Shift and its uncertainty, in the unit of a and b (mpf)."""
    e = casimir(two_i, two_j, two_f)
    da = sympy.diff(e, A_)
    db = sympy.diff(e, B_)
    value = mpmath.mpf(sympy.Rational(e.coeff(A_))) * a + mpmath.mpf(sympy.Rational(e.coeff(B_))) * b
    ca = mpmath.mpf(sympy.Rational(da))
    cb = mpmath.mpf(sympy.Rational(db))
    return value, mpmath.sqrt((ca * u_a) ** 2 + (cb * u_b) ** 2)


def f_values(two_i, two_j):
    return list(range(abs(two_i - two_j), two_i + two_j + 1, 2))


# ---- Rydberg levels (cm^-1), as make_alkali_uncertainty_golden.py
def r_m(mass):
    return R_INF / (1 + M_E / (mass - M_E))


def energy(limit, rm, d0, d2, n):
    delta = d0 + d2 / (n - d0) ** 2
    return limit - rm / (n - delta) ** 2


def level(limit, u_limit, rm, d, u_d, n):
    e = energy(limit, rm, d[0], d[1], n)
    dd0 = mpmath.diff(lambda x: energy(limit, rm, x, d[1], n), d[0])
    dd2 = mpmath.diff(lambda x: energy(limit, rm, d[0], x, n), d[1])
    dl = mpmath.diff(lambda x: energy(x, rm, d[0], d[1], n), limit)
    return e, mpmath.sqrt((dl * u_limit) ** 2 + (dd0 * u_d[0]) ** 2 + (dd2 * u_d[1]) ** 2)


def n_star_formula(d, n):
    return n - (d[0] + d[1] / (n - d[0]) ** 2)


def n_star_measured(limit, rm, e):
    return mpmath.sqrt(rm / (limit - e))


M = mpmath.mpf
RB_LIMIT = M("1010029.1646") * GHZ + M("-4271.676631815") * MHZ
RB_U_LIMIT = M("0.0003") * GHZ
RB_RM = r_m(M("86.909180529"))
RB_S = ([M("3.1311807"), M("0.1787")], [M("0.0000008"), M("0.0002")])
RB_D52 = ([M("1.3464622"), M("-0.5940")], [M("0.0000011"), M("0.0004")])
CS_LIMIT = M("31406.4677325")
CS_RM = r_m(M("132.905451958"))
CS_P32 = ([M("3.5590676"), M("0.37469")], [M("0.0000002"), M("0.00014")])

# constants in Hz: (2J, A, u_A, B, u_B)
RB_I = 3
CS_I = 7
RB = {
    "5s1/2": (1, M("3417.34130545215") * MHZ_HZ, M("0.00000000005") * MHZ_HZ, M(0), M(0)),
    "5p1/2": (1, M("408.328") * MHZ_HZ, M("0.015") * MHZ_HZ, M(0), M(0)),
    "5p3/2": (3, M("84.7185") * MHZ_HZ, M("0.0020") * MHZ_HZ, M("12.4965") * MHZ_HZ, M("0.0037") * MHZ_HZ),
}


def x_measured(a_mhz, limit, rm, e):
    """A n*^3 of a measured level, MHz."""
    return a_mhz * n_star_measured(limit, rm, e) ** 3


def n_star_ritz(d, n):
    """n - delta(n), delta = d0 + d2/(n - d0)^2 + d4/(n - d0)^4 + ... (every coefficient given)."""
    x = n - d[0]
    return n - (d[0] + sum(c / x ** (2 * k + 2) for k, c in enumerate(d[1:])))


CS_D32 = [M("2.4754562"), M("0.00932"), M("-0.43498"), M("-0.76358"), M("-18.0061")]
CS_D52 = [M("2.4663144"), M("0.01381"), M("-0.392"), M("-1.9")]
# the n*^-3 law's error: the cap (and the drift per n of a one-level series) from Cs 6d5/2 - 7d5/2, one n apart
CS_LAW_CAP = abs(mpmath.log(x_measured(M("-4.66"), CS_LIMIT, CS_RM, M("22631.6863"))
                            / (M("-1.70867") * n_star_ritz(CS_D52, 7) ** 3)))
CS_S_CHANGE = abs(mpmath.log(x_measured(M("2298.1579425"), CS_LIMIT, CS_RM, M(0))
                             / x_measured(M("545.818"), CS_LIMIT, CS_RM, M("18535.5286"))))
CS_D32_DRIFT = abs(mpmath.log(M("16.34") * n_star_ritz(CS_D32, 6) ** 3 / (M("7.3509") * n_star_ritz(CS_D32, 7) ** 3)))
# Rb-87 nS: 5s, 6s (A = 807.66(8) MHz, Perez Galvan et al. 2008, read in the abstract; 6s at 20132.509 cm-1) and
# 7s; the largest drift per n of the three pairs (5s - 6s)
RB_X = [x_measured(M("3417.34130545215"), RB_LIMIT, RB_RM, M(0)),
        x_measured(M("807.66"), RB_LIMIT, RB_RM, M("20132.509")),
        x_measured(M("319.759"), RB_LIMIT, RB_RM, M("26311.436"))]
RB_S_DRIFT = max(abs(mpmath.log(RB_X[i] / RB_X[k])) / (k - i) for i in range(3) for k in range(i + 1, 3))


def law(drift, distance, cap):
    return min(drift * distance, cap)


def with_law(a, u_a, r):
    return mpmath.sqrt(u_a ** 2 + (r * a) ** 2)


scale_60s = (n_star_measured(RB_LIMIT, RB_RM, M("26311.436")) / n_star_formula(RB_S[0], 60)) ** 3
a_60s = M("319.759") * MHZ_HZ * scale_60s
RB["60s1/2"] = (1, a_60s, with_law(a_60s, M("0.028") * MHZ_HZ * scale_60s, law(RB_S_DRIFT, 60 - 7, CS_S_CHANGE)),
                M(0), M(0))
scale_60d = (n_star_measured(RB_LIMIT, RB_RM, M("30281.619")) / n_star_formula(RB_D52[0], 60)) ** 3
# no B given for the series: the quadrupole term and its uncertainty are left out (B = 0, u_B = 0)
a_60d = M("-2.2") * MHZ_HZ * scale_60d
RB["60d5/2"] = (5, a_60d, with_law(a_60d, M("0.5") * MHZ_HZ * scale_60d, law(CS_LAW_CAP, 60 - 7, CS_LAW_CAP)),
                M(0), M(0))
CS = {
    "6s1/2": (1, M("2298.1579425") * MHZ_HZ, M(0), M(0), M(0)),
    "6p3/2": (3, M("50.28827") * MHZ_HZ, M("0.00023") * MHZ_HZ, M("-0.4934") * MHZ_HZ, M("0.0017") * MHZ_HZ),
}
scale_40p = n_star_formula(CS_P32[0], 40) ** -3
CS_P32_DRIFT = abs(mpmath.log(x_measured(M("50.28827"), CS_LIMIT, CS_RM, M("351725718.4744") * MHZ)
                              / x_measured(M("16.605"), CS_LIMIT, CS_RM, M("21946.397"))))
# the p cap (at least Cs nP3/2's change from 6p3/2 to its scaled constant, taken at n = 41) does not bind one n
# from the fitted range
CS_P32_SCALED_CHANGE = abs(mpmath.log(M("718") / x_measured(M("50.28827"), CS_LIMIT, CS_RM,
                                                             M("351725718.4744") * MHZ)))
assert CS_P32_SCALED_CHANGE > CS_P32_DRIFT
r_40p = law(CS_P32_DRIFT, 41 - 40, CS_P32_SCALED_CHANGE)
a_40p = M("0.718") * 10 ** 9 * scale_40p
b_40p = M("-0.084") * 10 ** 9 * scale_40p
CS["40p3/2"] = (3, a_40p, with_law(a_40p, M("0.027") * 10 ** 9 * scale_40p, r_40p),
                b_40p, with_law(b_40p, M("0.102") * 10 ** 9 * scale_40p, r_40p))
print("law: cap %s, Rb nS drift %s, Cs nP3/2 drift %s, Cs nD3/2 drift %s, Cs 6s - 7s %s"
      % (mpmath.nstr(CS_LAW_CAP, 13), mpmath.nstr(RB_S_DRIFT, 12),
         mpmath.nstr(CS_P32_DRIFT, 12), mpmath.nstr(CS_D32_DRIFT, 13), mpmath.nstr(CS_S_CHANGE, 13)))

HEADER = ["# generated by make_hyperfine_uncertainty_golden.py with sympy %s and mpmath %s at 50 digits"
          % (sympy.__version__, mpmath.__version__),
          "# inputs and method in the script's docstring; frequencies and uncertainties in Hz (c = 299792458 m/s)"]


def nstr(x, digits=20):
    return mpmath.nstr(x, digits)


def write(name, tolerances, columns, rows):
    golden_csv.write(name, HEADER + tolerances, columns, rows)


# ---- 1. F-level shifts and their uncertainties
shift_rows = []
for species, two_i, table in (("Rb-87 I", RB_I, RB), ("Cs-133 I", CS_I, CS)):
    for label, (two_j, a, u_a, b, u_b) in table.items():
        for two_f in f_values(two_i, two_j):
            s, u = shift(two_i, two_j, two_f, a, u_a, b, u_b)
            shift_rows.append((species, label, two_f, nstr(a), nstr(u_a, 12), nstr(b), nstr(u_b, 12), nstr(s),
                               nstr(u, 12)))
write("hyperfine-shift-uncertainties.csv",
      ["# tolerance: 1e-9 relative (A; B and the shift: double arithmetic; Rydberg levels' n* ratio from the "
       "engine's double energies)",
       "# tolerance uncertainty: 1e-9 relative (u of A; B and the shift)"],
      ["species", "level", "twice_f", "a_hz", "a_uncertainty_hz", "b_hz", "b_uncertainty_hz", "shift_hz",
       "shift_uncertainty_hz"], shift_rows)


def f_shift(two_i, table, label, two_f):
    two_j, a, u_a, b, u_b = table[label]
    return shift(two_i, two_j, two_f, a, u_a, b, u_b)


def allowed(two_f, two_g):
    return abs(two_f - two_g) <= 2 and not (two_f == 0 and two_g == 0)


# ---- 2. D-line components (zero field)
D_LINES = [("Rb-87 I", RB_I, RB, "D1", "5s1/2", "5p1/2", M("377107463.380") * MHZ_HZ, M("0.011") * MHZ_HZ),
           ("Rb-87 I", RB_I, RB, "D2", "5s1/2", "5p3/2", M("384230484.4685") * MHZ_HZ, M("0.0062") * MHZ_HZ),
           ("Cs-133 I", CS_I, CS, "D2", "6s1/2", "6p3/2", M("351725718.4744") * MHZ_HZ, M("0.0051") * MHZ_HZ)]
component_rows = []
for species, two_i, table, line, lower, upper, centroid, u_centroid in D_LINES:
    for two_f in f_values(two_i, table[lower][0]):
        for two_g in f_values(two_i, table[upper][0]):
            if not allowed(two_f, two_g):
                continue
            s_lo, u_lo = f_shift(two_i, table, lower, two_f)
            s_up, u_up = f_shift(two_i, table, upper, two_g)
            component_rows.append((species, line, two_f, two_g, nstr(centroid + s_up - s_lo),
                                   nstr(mpmath.sqrt(u_centroid ** 2 + u_lo ** 2 + u_up ** 2), 12)))
write("hyperfine-component-uncertainties.csv",
      ["# tolerance: 1e-13 relative (frequency: double arithmetic on a 3.8e14 Hz centroid)",
       "# tolerance uncertainty: 1e-9 relative"],
      ["species", "line", "twice_f_lower", "twice_f_upper", "frequency_hz", "uncertainty_hz"], component_rows)

# ---- 3. ladders 5s -> 5p3/2 -> 60s1/2 and -> 60d5/2 of Rb-87
D2, U_D2 = D_LINES[1][6], D_LINES[1][7]
ladder_rows = []
for upper, d in (("60s1/2", RB_S), ("60d5/2", RB_D52)):
    e, u_e = level(RB_LIMIT, RB_U_LIMIT, RB_RM, d[0], d[1], 60)
    second = e * CM_HZ - D2
    u_second = mpmath.sqrt((u_e * CM_HZ) ** 2 + U_D2 ** 2)
    for two_f in f_values(RB_I, 1):
        for two_g in f_values(RB_I, 3):
            if not allowed(two_f, two_g):
                continue
            for two_h in f_values(RB_I, RB[upper][0]):
                if not allowed(two_g, two_h):
                    continue
                s0, u0 = f_shift(RB_I, RB, "5s1/2", two_f)
                s1, u1 = f_shift(RB_I, RB, "5p3/2", two_g)
                s2, u2 = f_shift(RB_I, RB, upper, two_h)
                ladder_rows.append(("Rb-87 I", "5s1/2", "5p3/2", upper, two_f, two_g, two_h, nstr(D2 + s1 - s0),
                                    nstr(mpmath.sqrt(U_D2 ** 2 + u0 ** 2 + u1 ** 2), 12), nstr(second + s2 - s1),
                                    nstr(mpmath.sqrt(u_second ** 2 + u1 ** 2 + u2 ** 2), 12)))
write("hyperfine-ladder-uncertainties.csv",
      ["# tolerance: 1e-11 relative (frequency: the engine's double energies against 50-digit ones)",
       "# tolerance uncertainty: 1e-6 relative (the engine's closed-form derivatives of the Rydberg energy "
       "against numerical ones)"],
      ["species", "lower", "intermediate", "upper", "twice_f_lower", "twice_f_intermediate", "twice_f_upper",
       "first_hz", "first_uncertainty_hz", "second_hz", "second_uncertainty_hz"], ladder_rows)
print("wrote %d shift, %d component and %d ladder rows" % (len(shift_rows), len(component_rows), len(ladder_rows)))
