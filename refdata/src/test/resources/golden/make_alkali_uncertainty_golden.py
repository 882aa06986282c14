#!/usr/bin/python3
"""Writes alkali-uncertainties.csv: transition frequencies of Rb-87 and Cs-133 and their standard
uncertainties, propagated by hand from the published numbers, for AlkaliUncertaintyTest.

Run from this folder:   python3 make_alkali_uncertainty_golden.py
Needs mpmath (run here with mpmath 1.3.0 under Python 3.11.7; Debian python3-mpmath serves too).  Deterministic.

Independent of the project's code: the energies are E = limit - R_M / (n - delta)^2 with
delta = d0 + d2 / (n - d0)^2 (Gallagher, Rydberg Atoms (1994), eq. 16.19), and their uncertainties
u(E)^2 = u(limit)^2 + sum_k (dE/dc_k)^2 u(c_k)^2 (GUM, JCGM 100:2008, eq. 10, inputs uncorrelated),
with every partial derivative taken NUMERICALLY by mpmath.diff at 50 digits (not the closed form the
engine uses).  A transition's uncertainty is sqrt(u_upper^2 + u_lower^2) (independent levels; the
ground level is the exact zero of the energy scale), except between two levels of the formula (a
microwave line between Rydberg states), whose shared inputs (the limit; in one series the defects) are
propagated together: u^2 = sum_p (d(E_upper - E_lower)/dp)^2 u(p)^2 over the limit and every
coefficient of both series, again by mpmath.diff of the difference itself (GUM, eq. 10).

Numbers, as the data files hold them (their sources named there):
  Rb-87 limit 1 010 029.1646(3) GHz from 5S1/2 F = 1, F = 1 at -4 271.676 631 815 MHz from the
    centroid (M. Mack et al., Phys. Rev. A 83, 052515 (2011); from memory);
  Rb-87 nS: d0 = 3.1311807(8), d2 = 0.1787(2) (Mack et al. 2011; from memory);
  Rb-87 nD5/2: d0 = 1.3464622(11), d2 = -0.5940(4) (Mack et al. 2011; from memory);
  Rb-87 D2 centroid 384 230 484.4685(62) MHz (J. Ye et al., Opt. Lett. 21, 1280 (1996); from memory);
  Cs-133 limit 31 406.467 732 5(14) cm-1 (J. Deiglmayr et al., Phys. Rev. A 93, 013424 (2016), read in
    the abstract); Cs nP3/2: d0 = 3.5590676(2), d2 = 0.37469(14) (Deiglmayr et al. 2016; from memory);
  masses AME2020 (Rb-87 86.909180529 u, Cs-133 132.905451958 u), CODATA 2018 R_inf, m_e and c.
"""

import mpmath

mpmath.mp.dps = 50
C = mpmath.mpf(299792458)
R_INF = mpmath.mpf("109737.31568160")
M_E = mpmath.mpf("5.48579909065e-4")


def r_m(mass):
    return R_INF / (1 + M_E / (mass - M_E))


def energy(limit, rm, d0, d2, n):
    delta = d0 + d2 / (n - d0) ** 2
    return limit - rm / (n - delta) ** 2


def level(limit, u_limit, rm, d, u_d, n):
    """Energy and its uncertainty, cm^-1, derivatives by mpmath.diff."""
    e = energy(limit, rm, d[0], d[1], n)
    dd0 = mpmath.diff(lambda x: energy(limit, rm, x, d[1], n), d[0])
    dd2 = mpmath.diff(lambda x: energy(limit, rm, d[0], x, n), d[1])
    dl = mpmath.diff(lambda x: energy(x, rm, d[0], d[1], n), limit)
    u = mpmath.sqrt((dl * u_limit) ** 2 + (dd0 * u_d[0]) ** 2 + (dd2 * u_d[1]) ** 2)
    return e, u


GHZ = mpmath.mpf(1e9) / (C * 100)
MHZ = mpmath.mpf(1e6) / (C * 100)
RB_LIMIT = mpmath.mpf("1010029.1646") * GHZ + mpmath.mpf("-4271.676631815") * MHZ
RB_U_LIMIT = mpmath.mpf("0.0003") * GHZ
RB_RM = r_m(mpmath.mpf("86.909180529"))
RB_S = ([mpmath.mpf("3.1311807"), mpmath.mpf("0.1787")], [mpmath.mpf("0.0000008"), mpmath.mpf("0.0002")])
RB_D52 = ([mpmath.mpf("1.3464622"), mpmath.mpf("-0.5940")], [mpmath.mpf("0.0000011"), mpmath.mpf("0.0004")])
RB_D2 = (mpmath.mpf("384230484.4685") * MHZ, mpmath.mpf("0.0062") * MHZ)
CS_LIMIT = mpmath.mpf("31406.4677325")
CS_U_LIMIT = mpmath.mpf("0.0000014")
CS_RM = r_m(mpmath.mpf("132.905451958"))
CS_P32 = ([mpmath.mpf("3.5590676"), mpmath.mpf("0.37469")], [mpmath.mpf("0.0000002"), mpmath.mpf("0.00014")])

rows = []
# Rb-87 D2: ground (exact zero) to the measured 5p3/2 centroid
rows.append(("Rb-87 I", "5s1/2", "5p3/2", RB_D2[0], RB_D2[1]))
for n in (20, 30, 60, 100):
    e, u = level(RB_LIMIT, RB_U_LIMIT, RB_RM, RB_S[0], RB_S[1], n)
    rows.append(("Rb-87 I", "5s1/2", "%ds1/2" % n, e, u))
# ladder's second step 5p3/2 -> 60d5/2: both levels' uncertainties combined
e, u = level(RB_LIMIT, RB_U_LIMIT, RB_RM, RB_D52[0], RB_D52[1], 60)
rows.append(("Rb-87 I", "5p3/2", "60d5/2", e - RB_D2[0], mpmath.sqrt(u ** 2 + RB_D2[1] ** 2)))
# microwave lines between two formula levels: the difference propagated from the shared inputs
RB_PARAMS = [RB_LIMIT] + RB_S[0] + RB_D52[0]
RB_U_PARAMS = [RB_U_LIMIT] + RB_S[1] + RB_D52[1]


def rb_formula(params, label):
    limit, s0, s2, d0, d2 = params
    n, series = label
    return energy(limit, RB_RM, s0, s2, n) if series == "s" else energy(limit, RB_RM, d0, d2, n)


def microwave(lower, upper):
    diff = lambda p: rb_formula(p, upper) - rb_formula(p, lower)
    variance = 0
    for i in range(len(RB_PARAMS)):
        def moved(x, i=i):
            p = list(RB_PARAMS)
            p[i] = x
            return diff(p)
        variance += (mpmath.diff(moved, RB_PARAMS[i]) * RB_U_PARAMS[i]) ** 2
    return diff(RB_PARAMS), mpmath.sqrt(variance)


for lower, upper in (((60, "s"), (61, "s")), ((60, "s"), (59, "d")), ((40, "d"), (41, "d"))):
    e, u = microwave(lower, upper)
    rows.append(("Rb-87 I", "%d%s" % (lower[0], "s1/2" if lower[1] == "s" else "d5/2"),
                 "%d%s" % (upper[0], "s1/2" if upper[1] == "s" else "d5/2"), e, u))
for n in (30, 60):
    e, u = level(CS_LIMIT, CS_U_LIMIT, CS_RM, CS_P32[0], CS_P32[1], n)
    rows.append(("Cs-133 I", "6s1/2", "%dp3/2" % n, e, u))

with open("alkali-uncertainties.csv", "w") as f:
    f.write("# generated by make_alkali_uncertainty_golden.py with mpmath %s at 50 digits\n"
            % mpmath.__version__)
    f.write("# inputs and method in the script's docstring; frequencies and uncertainties in Hz (c = 299792458 m/s)\n")
    f.write("# tolerance: 1e-11 relative (frequency: the engine's double energies against 50-digit ones)\n")
    f.write("# tolerance uncertainty: 1e-6 relative (the engine's closed-form derivatives against numerical ones)\n")
    f.write("species,lower,upper,frequency_hz,uncertainty_hz\n")
    for species, lower, upper, e, u in rows:
        f.write("%s,%s,%s,%s,%s\n" % (species, lower, upper, mpmath.nstr(e * C * 100, 20),
                                      mpmath.nstr(u * C * 100, 12)))
