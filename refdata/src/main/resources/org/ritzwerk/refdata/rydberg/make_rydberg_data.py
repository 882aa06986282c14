#!/usr/bin/python3
"""Writes Ritzwerk's built-in Rydberg data for Li-6, Li-7, Na-23, K-39, K-40, K-41, Rb-85, Rb-87 and Cs-133.

Run from this folder:   /usr/bin/python3 make_rydberg_data.py
Needs only the Python 3 standard library.  Deterministic: rewrites the same bytes each time.

Outputs (beside this script):
  quantum-defects-<atom>.csv   modified Rydberg-Ritz parameters per l, j (l = 0..3), the
                               ionisation limit, core polarizabilities, the lowest n each series
                               is used for (valid-from-n), the source of every number and how
                               each was checked (column "checked", header keys limit-check and
                               core-check)
  levels-<atom>.csv            measured energies of the levels below each series' valid-from-n
                               (project format ritzwerk-levels 1), each row saying how it was checked
  model-potentials.csv         the core model potentials of Marinescu, Sadeghpour and Dalgarno
                               (1994) in Ritzwerk's own layout (format ritzwerk-model-potentials 1)
  fit-residuals.txt            every check below, with its numbers

Where the numbers come from, and how sure we are of them.
  * Quantum defects: the papers named per series.  The digits are typed in from memory (the
    papers themselves were not at hand when this script was written), so every row is marked
    provenance from-memory with its paper as the citation, and checked against the measured
    levels (check 1) and, where two papers measured the same series, against each other.
  * Ionisation limits: the Cs limit of Deiglmayr et al. (2016) was read in the paper
    (arXiv:1601.08005, abstract) and the K-39 limit of Peper et al. (2019) in its abstract; Na is the
    NIST ASD ionisation energy (from memory; the limit of the Na quantum defects' paper, 330 MHz
    below it, is the second value); the others are from memory with their papers as citations,
    checked by check 1 and against a second value: for Li the NIST ASD ionisation energy (from
    memory); for Rb-85 the Rb-87 limit; for Cs, Shen et al. (2024), read in its abstract; for K-39
    the limit of the K quantum defects' paper.  Each is written in the unit and with the digits its
    publication prints (PUBLISHED_LIMITS; Rb-87 in GHz from its ground F = 1 level), which the
    reader converts exactly.  Li-6, K-40 and K-41 get their partner's limit with the normal mass
    shift (isotope_limit), written in cm^-1 with the size of the neglected shifts beside it.
  * Measured levels: NIST Atomic Spectra Database (ASD) energy levels of the natural element,
    in cm^-1 as the ASD prints them, from memory (ASD version not re-checked).  Each row is
    checked: the ground level is the zero; the resonance levels (lowest p1/2, p3/2) against
    the D-line frequencies of the alkali D-line data sheets (D. A. Steck; T. G. Tiecke; M. E.
    Gehm), which refdata's PublishedRydbergTest asserts; every other level by check 2.
  * Core polarizabilities: Rb (Berl et al. 2020) and Na (1988) read in the papers' abstracts;
    Li, K and Cs from memory.  All checked against the core polarizability alpha_c of Marinescu
    et al. (1994) and, for Rb, against the measured g-series quantum defect (check 3).
  * Model potentials: Marinescu et al. (1994), Table I, from memory; checked by check 4.

Uncertainties.  Each quantum-defect row states its coefficients' standard uncertainties (u-d0 to
u-d8; SERIES_UNCERTAINTIES, recalled from the series' paper, marked from-memory) where recalled, and
each header the limit's (limit-uncertainty; LIMIT_UNCERTAINTIES); where none is stated, the file says
nothing and the engine gives the levels none.  Check U writes what they propagate to.  Where a series'
paper states no uncertainty, or its atom's limit has none, the series gets our own estimate instead,
marked from-residuals (check R below; never as if a paper stated it).  The measured
levels' column uncertainty is half a unit in the ASD's last digit (plus, for a shared isotope, the
estimated neglected isotope shift).

Check 1 (chooses valid-from-n).  For each series the Rydberg-Ritz energy
    E(n) = limit - R_M / (n - delta(n))^2,  delta = d0 + d2/(n-d0)^2 + d4/(n-d0)^4 + ...
is compared with every measured level below.  valid-from-n is the lowest n from which on every
tabulated level agrees within TOLERANCE_PER_CM plus the level's stated uncertainty; all levels
below it, and the lowest level of every series (so the ground state and the resonance levels are
always measured), are written to the levels file.  The engine uses a measured level where the
file has one and the formula otherwise.  Levels above the last tabulated one are taken on trust
from the published fit.

Check 2 (series regularity of the measured levels).  For each series, the measured levels'
own quantum defects delta_n = n - sqrt(R_M / (limit - E_n)) are fitted, by least squares, with
delta = c0 + c1 x + c2 x^2 (c2 dropped for series of three or four), x = 1 / (n - delta_n)^2, leaving out the lowest member (whose defect
the expansion does not follow).  A mistyped digit shows as a residual far above its neighbours';
a level passes when its residual, expressed as an energy, is within REGULARITY_PER_CM (1 cm^-1:
the scatter of the older measurements of the lighter atoms reaches 0.5 cm^-1, so this check sees
mistakes in the units digit and above; finer digits rest on the D lines and on check 1).

Check R (from-residuals uncertainties; derived_uncertainties).  For a series whose paper states no
coefficient uncertainty (Na, K, Li, Cs d3/2 and f), or whose atom's limit states none (Rb-85, and the
isotopes with a scaled limit: Li-6, K-40, K-41, computed from their own scaled levels, so the partner's
figure applies scaled with the estimated isotope shift of those levels included), each check-1 residual
r = formula - measured at n >= valid-from-n, with the level's stated uncertainty u added in quadrature,
is turned into the error of d0 it stands for, dd0 = sqrt(r^2 + u^2) n*^3 / (2 R_M) (from dE/d delta
= -2 R_M / n*^3), and u(d0) is their root mean square, rounded up to two digits (u(d2), ... written 0:
the figure stands for the error of delta(n) as a whole; for Rb-85, whose paper states u(d0), the two
are added in quadrature).  A constant offset, as a limit error makes, would be carried to higher n
only as n*^-3 that way, so an atom whose limit states no uncertainty (Na, Li-7, Rb-85; Li-6, K-40 and
K-41, whose limits are scaled from a partner) gets one of our own too (check R limit;
derived_limit_uncertainty): the largest over its series of the root mean square of sqrt(r^2 + u^2) over
the checked levels, rounded up to two digits, written as limit-uncertainty with limit-uncertainty-source
saying so.  It is constant in n, shared by the atom's levels (it cancels between two formula levels, as
a limit's error does) and overlaps the u(d0) term at the checked n (counted twice there: cautious by up to
a factor sqrt 2).  Rb-85, whose paper states its defects' uncertainties, then keeps the paper's.  Series
with no measured level at n >= valid-from-n (Li s, p, f; Rb-85 p) get no u(d0) of ours.  Check R prints
u(d0), the levels used, u(E) at a few n and the highest checked level's residual beside its u(E).

Check 3 (core polarizabilities).  alpha_d against Marinescu et al.'s alpha_c (within 10 %); the
core-polarization quantum defect of the Rb g series, delta = n^3 (alpha_d <r^-4> + alpha_q <r^-6>)/2
with hydrogenic expectation values, against the measured g-series defects of Afrousheh et al.,
Phys. Rev. A 74, 062712 (2006) (delta_g(30) = 0.00405(6)) and Moore et al., arXiv:2004.11407
(2020) (delta_0 = 0.0039990(21), delta_2 = -0.0202(21)), both read in the papers' abstracts.

Check 4 (model potentials).  The lowest bound state of each l in the model potential
(Numerov, logarithmic grid, eigenvalue by node counting and bisection) against the measured
fine-structure-weighted level; Marinescu et al. fitted their parameters to such energies, so a
mistyped digit shows as a disagreement far beyond the others.
"""

import math

# CODATA 2018 (the constants edition Ritzwerk uses, api PhysicalConstants).
C = 299792458.0
R_INF_PER_CM = 109737.31568160
ELECTRON_MASS_U = 5.48579909065e-4
HARTREE_PER_CM = 2 * R_INF_PER_CM

FINE_STRUCTURE_ALPHA = 7.2973525693e-3   # CODATA 2018
TOLERANCE_PER_CM = 0.1
REGULARITY_PER_CM = 1.0

# Atomic masses in u, AME2020, as in ../nuclear/isotopes.csv (the provider computes R_M from that
# file at run time; these copies serve only the checks below).
MASS_U = {"li-6": 6.01512288742, "li-7": 7.01600343426, "k-40": 39.963998165, "k-41": 40.96182525611, "na-23": 22.98976928195, "k-39": 38.96370648482,
          "rb-85": 84.91178973604, "rb-87": 86.909180529, "cs-133": 132.905451958}

# ---------------------------------------------------------------------------------------------
# Papers.
# ---------------------------------------------------------------------------------------------
LI_2003 = ("W. Li, I. Mourachko, M. W. Noel and T. F. Gallagher, Phys. Rev. A 67, 052502 (2003), "
           "doi:10.1103/PhysRevA.67.052502")
HAN_2006 = ("J. Han, Y. Jamil, D. V. L. Norum, P. J. Tanner and T. F. Gallagher, Phys. Rev. A 74, 054502 (2006), "
            "doi:10.1103/PhysRevA.74.054502")
MACK_2011 = ("M. Mack, F. Karlewski, H. Hattermann, S. Hoeckh, F. Jessen, D. Cano and J. Fortagh, "
             "Phys. Rev. A 83, 052515 (2011), doi:10.1103/PhysRevA.83.052515")
DEIGLMAYR_2016 = ("J. Deiglmayr, H. Herburger, H. Sassmannshausen, P. Jansen, H. Schmutz and F. Merkt, "
                  "Phys. Rev. A 93, 013424 (2016), doi:10.1103/PhysRevA.93.013424")
GOY_1982 = ("P. Goy, J. M. Raimond, G. Vitrant and S. Haroche, Phys. Rev. A 26, 2733 (1982), "
            "doi:10.1103/PhysRevA.26.2733")
WEBER_1987 = "K.-H. Weber and C. J. Sansonetti, Phys. Rev. A 35, 4650 (1987), doi:10.1103/PhysRevA.35.4650"
LN_1984 = "C.-J. Lorenzen and K. Niemax, Z. Phys. A 315, 127 (1984), doi:10.1007/BF01419370"
LN_1983 = "C.-J. Lorenzen and K. Niemax, Phys. Scr. 27, 300 (1983)"
GOY_1986 = ("P. Goy, J. Liang, M. Gross and S. Haroche, Phys. Rev. A 34, 2889 (1986), "
            "doi:10.1103/PhysRevA.34.2889")
MARINESCU_1994 = ("M. Marinescu, H. R. Sadeghpour and A. Dalgarno, Phys. Rev. A 49, 982 (1994), "
                  "doi:10.1103/PhysRevA.49.982")
PEPER_2019 = ("M. Peper, F. Helmrich, J. Butscher, J. A. Agner, H. Schmutz, F. Merkt and J. Deiglmayr, "
              "Phys. Rev. A 100, 012501 (2019), doi:10.1103/PhysRevA.100.012501, arXiv:1907.02776")
SHEN_2024 = ("P. Shen et al., Phys. Rev. Lett. 133, 233005 (2024), doi:10.1103/PhysRevLett.133.233005")
NIST_ASD = "NIST Atomic Spectra Database (A. Kramida, Yu. Ralchenko, J. Reader and NIST ASD Team)"

# ---------------------------------------------------------------------------------------------
# Quantum-defect sets.  Each series: (l, 2j, [d0, d2, d4, ...], paper).  All digits from memory.
# ---------------------------------------------------------------------------------------------
RB_85_SERIES = [
    (0, 1, [3.1311804, 0.1784], LI_2003),
    (1, 1, [2.6548849, 0.2900], LI_2003),
    (1, 3, [2.6416737, 0.2950], LI_2003),
    (2, 3, [1.34809171, -0.60286], LI_2003),
    (2, 5, [1.34646572, -0.59600], LI_2003),
    (3, 5, [0.0165192, -0.085], HAN_2006),
    (3, 7, [0.0165437, -0.086], HAN_2006),
]
RB_87_SERIES = [
    (0, 1, [3.1311807, 0.1787], MACK_2011),
    (1, 1, [2.6548849, 0.2900], LI_2003 + " (measured in Rb-85)"),
    (1, 3, [2.6416737, 0.2950], LI_2003 + " (measured in Rb-85)"),
    (2, 3, [1.3480948, -0.6054], MACK_2011),
    (2, 5, [1.3464622, -0.5940], MACK_2011),
    (3, 5, [0.0165192, -0.085], HAN_2006 + " (measured in Rb-85)"),
    (3, 7, [0.0165437, -0.086], HAN_2006 + " (measured in Rb-85)"),
]
CS_SERIES = [
    (0, 1, [4.0493532, 0.2391, 0.06, 11.0, -209.0], DEIGLMAYR_2016),
    (1, 1, [3.5915871, 0.36273], DEIGLMAYR_2016),
    (1, 3, [3.5590676, 0.37469], DEIGLMAYR_2016),
    # The d3/2 series of Goy et al. 1982 (d0 = 2.475365, d2 = 0.5554) misses the measured 13d3/2 by
    # 0.9 cm-1 (check 1), so the D3/2 series is taken from Lorenzen & Niemax 1984.
    (2, 3, [2.4754562, 0.009320, -0.43498, -0.76358, -18.0061], LN_1984),
    (2, 5, [2.4663144, 0.01381, -0.392, -1.9], DEIGLMAYR_2016),
    (3, 5, [0.03341424, -0.198674, 0.28953, -0.2601], WEBER_1987),
    (3, 7, [0.033537, -0.191], GOY_1982),
]
K_SERIES = [
    (0, 1, [2.1801985, 0.13558, 0.0759, 0.117, -0.206], LN_1983),
    (1, 1, [1.713892, 0.233294, 0.16137, 0.5345, -0.234], LN_1983),
    (1, 3, [1.710848, 0.235437, 0.11551, 1.1015, -2.0356], LN_1983),
    (2, 3, [0.27697, -1.024911, -0.709174, 11.839, -26.689], LN_1983),
    (2, 5, [0.2771580, -1.025635, -0.59201, 10.0053, -19.0244], LN_1983),
    (3, 5, [0.010098, -0.100224, 1.56334, -12.6851], LN_1983),
    (3, 7, [0.010098, -0.100224, 1.56334, -12.6851], LN_1983),
]
NA_SERIES = [
    (0, 1, [1.347964, 0.060673, 0.0233, -0.0085], LN_1983),
    (1, 1, [0.855380, 0.11363, 0.0384, 0.1412], LN_1983),
    (1, 3, [0.854565, 0.114195, 0.0352, 0.1533], LN_1983),
    (2, 3, [0.015543, -0.08535, 0.7958, -4.0513], LN_1983),
    (2, 5, [0.015543, -0.08535, 0.7958, -4.0513], LN_1983),
    (3, 5, [0.001453, 0.017312, -0.7809, 7.021], LN_1983),
    (3, 7, [0.001453, 0.017312, -0.7809, 7.021], LN_1983),
]
LI_SERIES = [
    (0, 1, [0.3995101, 0.029], GOY_1986),
    (1, 1, [0.0471780, -0.024], GOY_1986),
    (1, 3, [0.0471665, -0.024], GOY_1986),
    (2, 3, [0.002129, -0.01491, 0.1759, -0.8507], LN_1983),
    (2, 5, [0.002129, -0.01491, 0.1759, -0.8507], LN_1983),
    (3, 5, [-0.000077, 0.021856, -0.4211, 2.3891], LN_1983),
    (3, 7, [-0.000077, 0.021856, -0.4211, 2.3891], LN_1983),
]

# Standard uncertainties of the coefficients, per atom and series: ([u(d0), u(d2), ...], provenance).
# Only where the series' paper gives them: recalled with the digits above from the same papers (the
# abstracts read here print none of them), so every row is from-memory, with no independent check of
# these digits (fit-residuals.txt, check U, shows what they propagate to).  A series not listed, or with fewer uncertainties than coefficients, states none for the
# rest, and levels computed from it get no uncertainty (the engine never fills one in).  Not stated:
# K, Na, Li (Lorenzen & Niemax 1983 and Goy et al. 1986: not recalled), Cs d3/2 (Lorenzen & Niemax
# 1984), Cs f (Weber & Sansonetti 1987, Goy et al. 1982).
LI_2003_U = {(0, 1): [0.0000010, 0.0006], (1, 1): [0.0000010, 0.0006], (1, 3): [0.0000010, 0.0007],
             (2, 3): [0.00000040, 0.00026], (2, 5): [0.00000030, 0.00018]}
HAN_2006_U = {(3, 5): [0.0000009, 0.009], (3, 7): [0.0000007, 0.007]}
MACK_2011_U = {(0, 1): [0.0000008, 0.0002], (2, 3): [0.0000011, 0.0004], (2, 5): [0.0000011, 0.0004]}
DEIGLMAYR_2016_U = {(0, 1): [0.0000004, 0.0005, 0.10, 7.0, 150.0], (1, 1): [0.0000003, 0.00016],
                    (1, 3): [0.0000002, 0.00014], (2, 5): [0.0000006, 0.00015, 0.012, 0.3]}
SERIES_UNCERTAINTIES = {
    "rb-85": LI_2003_U | HAN_2006_U,
    "rb-87": {(1, 1): LI_2003_U[(1, 1)], (1, 3): LI_2003_U[(1, 3)]} | MACK_2011_U | HAN_2006_U,
    "cs-133": DEIGLMAYR_2016_U,
}
UNCERTAINTY_PROVENANCE = "from-memory"
# Our own derivation, not a paper's: u(d0) from the series' residuals against the measured levels (check R).
RESIDUAL_PROVENANCE = "from-residuals"

# Ionisation limits' standard uncertainties, in the unit of PUBLISHED_LIMITS (header 'limit-uncertainty'),
# as each publication prints it: Cs (Deiglmayr et al. 2016) and K-39 (Peper et al. 2019, 22 systematic
# and 3 statistic in the last digits, combined in quadrature: 22) read in the abstracts; Rb-87 (Mack
# et al. 2011, 0.3 MHz) recalled with the limit.  None for Li-7, Na, Rb-85 (not recalled) and for the
# isotopes whose limit is scaled from a partner (its neglected specific mass shift is only estimated).
LIMIT_UNCERTAINTIES = {"cs-133": "0.0000014", "k-39": "0.0000022", "rb-87": "0.0003"}

# Ionisation limits above the ground level's hyperfine centroid, cm^-1:
# (value, provenance, source, second value for the check: (cm^-1, its source) or None).
# Rb-87: Mack et al. give 1 010 029.1646(3) GHz from 5S1/2 F = 1 (from memory); F = 1 lies 5/8 of
# the ground hyperfine splitting 6 834.682 610 904 MHz (Steck, Rubidium 87 D Line Data; from
# memory) below the centroid.
RB87_LIMIT_GHZ_FROM_F1 = 1010029.1646
RB87_GROUND_SPLITTING_GHZ = 6.834682610904
ASD_IE = "NIST ASD ionisation energy (from memory)"
LIMITS = {
    "li-7": (43487.15, "from-memory", LN_1983, (43487.114, ASD_IE)),
    "na-23": (41449.451, "from-memory", ASD_IE + ": 41 449.451 cm-1 (ASD version not re-checked); the limit "
              "the quantum defects of " + LN_1983 + " were fitted with, 41 449.44 cm-1 (from memory), is 330 MHz "
              "below it",
              (41449.44, LN_1983 + " (from memory); 41 449.451 - 41 449.44 = 0.011 cm-1 = 329.8 MHz, the 330 MHz "
               "by which issue 17 found the earlier limit below the evaluated one")),
    "k-39": (35009.8139710, "published", PEPER_2019 + ": 35009.8139710(22) cm-1 (read in the paper's abstract)",
             (35009.8139375, "the weighted average of the series limits in " + LN_1983 + " (from memory)")),
    "rb-85": (33690.79890, "from-memory", LI_2003, None),
    "rb-87": ((RB87_LIMIT_GHZ_FROM_F1 - 5.0 / 8 * RB87_GROUND_SPLITTING_GHZ) / (C / 1e7), "from-memory",
              MACK_2011 + ": 1010029.1646(3) GHz from 5S1/2 F=1; minus 5/8 of the ground hyperfine splitting "
              "6834.682610904 MHz (D. A. Steck, Rubidium 87 D Line Data; from memory) to refer it to "
              "the hyperfine centroid", None),
    "cs-133": (31406.4677325, "published", DEIGLMAYR_2016 + ": 31406.4677325(14) cm-1 (read in the paper; "
               "arXiv:1601.08005)", (31406.46775148, SHEN_2024 + ": 31406.46775148(14) cm-1 (read in its "
               "abstract; not applied)")),
}

# Limits stored in the unit and with the digits their publication prints ('# limit:' and, for a
# limit measured from a ground hyperfine level, '# limit-from:' its energy above the centroid);
# the reader converts them exactly.  Every limit not listed here is derived (isotope shift) and
# written as limit-per-cm.  Rb-87: F = 1 lies 5/8 of 6 834.682 610 904 MHz below the centroid,
# -4 271.676 631 815 MHz exactly (decimal arithmetic on the published digits).
PUBLISHED_LIMITS = {
    "li-7": ("43487.15 cm-1", None),
    "na-23": ("41449.451 cm-1", None),
    "k-39": ("35009.8139710 cm-1", None),
    "rb-85": ("33690.79890 cm-1", None),
    "rb-87": ("1010029.1646 GHz", "-4271.676631815 MHz"),
    "cs-133": ("31406.4677325 cm-1", None),
}


def published_limit_per_cm(atom_id):
    """The published limit of PUBLISHED_LIMITS in cm^-1, converted as QuantumDefectFiles converts it."""
    def wavenumber(text):
        value, unit = text.split()
        return float(value) * {"cm-1": 1.0, "GHz": 1e9 / (C * 100), "MHz": 1e6 / (C * 100)}[unit]
    limit, origin = PUBLISHED_LIMITS[atom_id]
    return wavenumber(limit) + (wavenumber(origin) if origin else 0.0)


# Core (ion) dipole (a0^3) and quadrupole (a0^5) polarizabilities, for l >= 4, with their source.
BERL_2020 = ("S. Berl et al., \"Core polarizability of rubidium using spectroscopy of the ng to nh, ni Rydberg "
             "transitions\", Phys. Rev. A 102, 062818 (2020), doi:10.1103/PhysRevA.102.062818, arXiv:2004.08226: "
             "9.116(9) and 38.4(6), read in the paper's abstract")
CORE = {
    "li-7": (0.1884, 0.046, "from memory (published Li+ values as recalled; the paper was not at hand)"),
    "na-23": (0.9980, 0.351, "\"Resonance measurements of d-f-g-h intervals in Rydberg states of sodium and a "
              "redetermination of the core polarizabilities\", Phys. Rev. A 38, 4985 (1988) (journal reference from "
              "memory): 0.9980(33) and 0.351(81), read in the paper's abstract"),
    "k-39": (5.4880, 17.89, "from memory, as recalled from M. Peper et al., Phys. Rev. A 100, 012501 (2019), "
             "arXiv:1907.02776 (its abstract, read, reports core-polarizability estimates without the digits)"),
    "rb-85": (9.116, 38.4, BERL_2020),
    "rb-87": (9.116, 38.4, BERL_2020),
    "cs-133": (15.5440, 70.7, "from memory (published Cs+ values as recalled; the paper was not at hand)"),
}

# ---------------------------------------------------------------------------------------------
# Measured levels (n, l, 2j, energy in cm^-1 as the NIST ASD prints it; from memory).
# Li 10s (42298.1, recalled to one decimal only) is left out: it is 1.5 cm-1 off both the Rydberg-
# Ritz formula of Goy et al. 1986 and the regularity of the Li s series (checks 1 and 2), so the
# formula gives 10s.  Li 4f (36630.2) and 5f (39104.5) are left out for the same reason: they lie
# above the hydrogenic 4f and 5f, where no f level can lie, 1.9 and 7.0 cm-1 above the Rydberg-Ritz
# formula of Lorenzen & Niemax 1983 (check 1), and 4f is 2 cm-1 above the bound state of the model
# potential too (check 4); with no measured f level the formula gives the Li f series from 4f on.
# ---------------------------------------------------------------------------------------------
RB_LEVELS = """
5 0 1 0
5 1 1 12578.950
5 1 3 12816.545
4 2 5 19355.202
4 2 3 19355.648
6 0 1 20132.509
6 1 1 23715.080
6 1 3 23792.590
5 2 3 25700.535
5 2 5 25703.497
7 0 1 26311.436
4 3 7 26792.091
4 3 5 26792.117
7 1 1 27835.02
7 1 3 27870.11
6 2 3 28687.126
6 2 5 28689.389
8 0 1 29046.815
5 3 7 29277.767
5 3 5 29277.786
8 1 1 29834.94
8 1 3 29853.79
7 2 3 30280.112
7 2 5 30281.619
9 0 1 30499.030
6 3 7 30627.961
6 3 5 30627.977
9 1 1 30958.91
9 1 3 30970.19
8 2 3 31221.439
8 2 5 31222.452
10 0 1 31362.330
7 3 7 31441.717
7 3 5 31441.729
10 1 1 31653.85
10 1 3 31661.16
9 2 3 31821.854
9 2 5 31822.549
11 0 1 31917.220
8 3 7 31969.615
8 3 5 31969.620
11 1 1 32113.55
11 1 3 32118.52
10 2 3 32227.609
10 2 5 32228.107
12 0 1 32294.910
12 1 1 32433.50
12 1 3 32437.04
13 1 1 32665.03
13 1 3 32667.63
14 1 1 32838.02
14 1 3 32840.02
"""
CS_LEVELS = """
6 0 1 0
6 1 1 11178.26815870
6 1 3 11732.3071041
5 2 3 14499.2568
5 2 5 14596.84232
7 0 1 18535.5286
7 1 1 21765.348
7 1 3 21946.397
6 2 3 22588.8210
6 2 5 22631.6863
8 0 1 24317.149400
4 3 7 24472.0455
4 3 5 24472.2269
8 1 1 25708.83548
8 1 3 25791.508
7 2 3 26047.8342
7 2 5 26068.7730
9 0 1 26910.6627
5 3 7 26971.1535
5 3 5 26971.3030
9 1 1 27636.9966
9 1 3 27681.6782
8 2 3 27811.2400
8 2 5 27822.8802
10 0 1 28300.2287
6 3 7 28329.4075
6 3 5 28329.5133
10 1 1 28726.8123
10 1 3 28753.6769
9 2 3 28828.6820
9 2 5 28835.79192
11 0 1 29131.73004
7 3 7 29147.90818
7 3 5 29147.98188
11 1 1 29403.42310
11 1 3 29420.824
10 2 3 29468.2878
10 2 5 29472.93995
12 0 1 29668.80336
8 3 7 29678.68970
8 3 5 29678.74280
12 1 1 29852.43153
12 1 3 29864.345
11 2 3 29896.3399
11 2 5 29899.54646
13 0 1 30035.78836
9 3 7 30042.27515
9 3 5 30042.31405
13 1 1 30165.66826
13 1 3 30174.178
12 2 3 30196.7963
12 2 5 30199.09821
14 0 1 30297.64510
10 3 7 30302.13624
10 3 5 30302.16537
14 1 1 30392.87183
14 1 3 30399.163
13 2 3 30415.7533
13 2 5 30417.46075
15 0 1 30491.02346
"""
NA_LEVELS = """
3 0 1 0
3 1 1 16956.17025
3 1 3 16973.36619
4 0 1 25739.999
3 2 5 29172.837
3 2 3 29172.887
4 1 1 30266.99
4 1 3 30272.58
5 0 1 33200.673
4 2 5 34548.729
4 2 3 34548.764
4 3 7 34586.92
4 3 5 34586.92
5 1 1 35040.38
5 1 3 35042.85
6 0 1 36372.618
5 2 5 37036.752
5 2 3 37036.772
5 3 7 37057.65
5 3 5 37057.65
6 1 1 37296.32
6 1 3 37297.61
7 0 1 38012.042
6 2 5 38387.255
6 2 3 38387.268
6 3 5 38399.79
6 3 7 38399.79
7 1 1 38540.18
7 1 3 38540.93
8 0 1 38968.51
7 2 3 39200.93
7 2 5 39200.93
7 3 7 39208.98
7 3 5 39208.98
8 1 1 39298.35
8 1 3 39298.84
9 0 1 39574.85
8 2 5 39728.70
8 2 3 39728.70
8 3 7 39734.16
8 3 5 39734.16
10 0 1 39983.27
9 2 5 40090.31
9 2 3 40090.31
9 3 7 40094.19
9 3 5 40094.19
10 1 1 40136.810
10 1 3 40137.043
11 0 1 40271.396
10 2 5 40348.915
10 2 3 40348.918
11 1 1 40382.925
11 1 3 40383.097
12 0 1 40482.236
"""
K_LEVELS = """
4 0 1 0
4 1 1 12985.185724
4 1 3 13042.896027
5 0 1 21026.551
3 2 5 21534.680
3 2 3 21536.988
5 1 1 24701.382
5 1 3 24720.139
4 2 5 27397.077
4 2 3 27398.147
6 0 1 27450.7104
4 3 5 28127.85
4 3 7 28127.85
6 1 1 28999.27
6 1 3 29007.71
5 2 5 30185.2439
5 2 3 30185.7476
7 0 1 30274.2487
5 3 5 30606.73
5 3 7 30606.73
7 1 1 31069.90
7 1 3 31074.40
6 2 5 31695.9005
6 2 3 31696.1661
8 0 1 31765.3767
6 3 5 31953.17
6 3 7 31953.17
8 1 1 32227.44
8 1 3 32230.11
7 2 5 32598.2881
7 2 3 32598.4437
9 0 1 32648.3511
7 3 5 32764.80
7 3 7 32764.80
9 1 1 32940.2030
9 1 3 32941.9262
8 2 5 33178.1339
8 2 3 33178.2324
10 0 1 33214.2267
8 3 5 33291.40
8 3 7 33291.40
10 1 1 33410.2306
10 1 3 33411.3986
9 2 5 33572.0592
9 2 3 33572.1249
11 0 1 33598.5597
9 3 5 33652.32
9 3 7 33652.32
11 1 1 33736.4979
11 1 3 33737.3284
10 2 5 33851.5956
10 2 3 33851.6418
12 0 1 33871.4788
10 3 7 33910.42
10 3 5 33910.42
12 1 1 33972.2064
12 1 3 33972.8148
"""
LI_LEVELS = """
2 0 1 0
2 1 1 14903.66
2 1 3 14904.00
3 0 1 27206.12
3 1 1 30925.38
3 1 3 30925.38
3 2 3 31283.08
3 2 5 31283.12
4 0 1 35012.06
4 1 3 36469.55
4 1 1 36469.55
4 2 3 36623.38
4 2 5 36623.40
5 0 1 38299.50
5 1 3 39015.56
5 1 1 39015.56
5 2 3 39094.93
5 2 5 39094.94
6 0 1 39987.64
6 1 1 40390.84
6 1 3 40390.84
6 2 3 40437.31
6 2 5 40437.32
7 0 1 40967.9
7 1 1 41217.35
7 1 3 41217.35
7 2 3 41246.5
7 2 5 41246.5
8 0 1 41587.1
8 1 1 41751.63
8 1 3 41751.63
8 2 5 41771.3
8 2 3 41771.3
9 0 1 42003.3
9 1 3 42118.27
9 1 1 42118.27
9 2 5 42131.3
9 2 3 42131.3
10 1 1 42379.16
10 1 3 42379.16
10 2 3 42389.3
10 2 5 42389.3
"""

# Marinescu, Sadeghpour and Dalgarno (1994), Table I, from memory: element, Z, alpha_c (a0^3), l
# (the last l of an element serves every higher l), a1, a2, a3 (a0^-1), a4 (a0^-2), r_c (a0).
MODEL_POTENTIALS = """
Li 3 0.1923 0 2.47718079 1.84150932 -0.02169712 -0.11988362 0.61340824
Li 3 0.1923 1 3.45414648 2.55151080 -0.21646561 -0.06990078 0.61566441
Li 3 0.1923 2 2.51909839 2.43712450 0.32505524 0.10602430 2.34126273
Li 3 0.1923 3 2.51909839 2.43712450 0.32505524 0.10602430 2.34126273
Na 11 0.9448 0 4.82223117 2.45449865 -1.12255048 -1.42631393 0.45489422
Na 11 0.9448 1 5.08382502 2.18226881 -1.19534623 -1.03142861 0.45798739
Na 11 0.9448 2 3.53324124 2.48697936 -0.75688448 -1.27852357 0.71875312
Na 11 0.9448 3 1.11056646 1.05458759 1.73203428 -0.09265696 28.6735059
K 19 5.3310 0 3.56079437 1.83909642 -1.74701102 -1.03237313 0.83167545
K 19 5.3310 1 3.65670429 1.67520788 -2.07416615 -0.89030421 0.85235381
K 19 5.3310 2 4.12713694 1.79837462 -1.69935174 -0.98913582 0.83216907
K 19 5.3310 3 1.42310446 1.27861156 4.77441476 -0.94829262 6.50294371
Rb 37 9.076 0 3.69628474 1.64915255 -9.86069196 0.19579987 1.66242117
Rb 37 9.076 1 4.44088978 1.92828831 -16.79597770 -0.81633314 1.50195124
Rb 37 9.076 2 3.78717363 1.57027864 -11.6558897 0.52942835 4.86851938
Rb 37 9.076 3 2.39848933 1.76810544 -12.0710678 0.77256589 4.79831327
Cs 55 15.6440 0 3.49546309 1.47533800 -9.72143084 0.02629242 1.92046930
Cs 55 15.6440 1 4.69366096 1.71398344 -24.65624280 -0.09543125 2.13383095
Cs 55 15.6440 2 4.32466196 1.61365288 -6.70128850 -0.74095193 0.93007296
Cs 55 15.6440 3 3.01048361 1.40000001 -3.20036138 0.00034538 1.99969677
"""

# Li-6, K-40 and K-41 share the quantum defects, the ionisation limit, the core polarizabilities and
# the measured levels of the natural element (whose sets are those of Li-7 and K-39): no
# isotope-specific series or limits were at hand.  Only R_M (from the isotope's own mass) differs, and
# their resonance levels (the D lines) come from their own measurements in d-lines.csv, which refdata
# puts in place of the natural element's.
SHARED = {"li-6": "li-7", "k-40": "k-39", "k-41": "k-39"}


def isotope_limit(atom_id):
    """The limit of a SHARED isotope: its natural partner's, scaled by the ratio of the two R_M.

    The normal mass shift (common practice: a binding energy scales with the reduced mass of electron
    and core, the ratio of the isotopes' R_M).  The specific mass shift and the field shift of the
    limit are not published for these isotopes and are not applied; their size on the D lines (the
    measured isotope shift minus its normal mass shift, d-lines.csv) is stated in the source."""
    natural = SHARED[atom_id]
    return LIMITS[natural][0] * rydberg_per_cm(MASS_U[atom_id]) / rydberg_per_cm(MASS_U[natural])


# measured D1 isotope shifts (MHz, d-lines.csv, make_d_lines.py: check I) minus their normal mass shift,
# the part the normal mass shift leaves out on the resonance line; written beside each shifted limit
RESIDUAL_D1_MHZ = {}
for _shared, _natural in SHARED.items():
    CORE[_shared] = CORE[_natural]

ATOMS = [
    # id, symbol, Z, A, series, levels text, D-line source, version
    ("li-6", "Li", 3, 6, LI_SERIES, LI_LEVELS, "d-lines.csv (the isotope's own D lines)", "1986"),
    ("li-7", "Li", 3, 7, LI_SERIES, LI_LEVELS, "C. J. Sansonetti et al., Phys. Rev. Lett. 107, 023001 (2011), Li-7 D lines (from memory)", "1986"),
    ("na-23", "Na", 11, 23, NA_SERIES, NA_LEVELS, "D. A. Steck, Sodium D Line Data (from memory)", "1983"),
    ("k-39", "K", 19, 39, K_SERIES, K_LEVELS, "T. G. Tiecke, Properties of Potassium (from memory)", "1983"),
    ("k-40", "K", 19, 40, K_SERIES, K_LEVELS, "d-lines.csv (the isotope's own D lines)", "1983"),
    ("k-41", "K", 19, 41, K_SERIES, K_LEVELS, "d-lines.csv (the isotope's own D lines)", "1983"),
    ("rb-85", "Rb", 37, 85, RB_85_SERIES, RB_LEVELS, "D. A. Steck, Rubidium 85 D Line Data (from memory)", "2006"),
    ("rb-87", "Rb", 37, 87, RB_87_SERIES, RB_LEVELS, "D. A. Steck, Rubidium 87 D Line Data (from memory)", "2011"),
    ("cs-133", "Cs", 55, 133, CS_SERIES, CS_LEVELS, "D. A. Steck, Cesium D Line Data (from memory)", "2016"),
]

L_LETTERS = "spdfghik"


def rydberg_per_cm(mass_u):
    core = mass_u - ELECTRON_MASS_U
    return R_INF_PER_CM / (1.0 + ELECTRON_MASS_U / core)


def defect(coefficients, n):
    d0 = coefficients[0]
    x = 1.0 / (n - d0) ** 2
    total, power = 0.0, 1.0
    for c in coefficients:
        total += c * power
        power *= x
    return total


def ritz(limit, r_m, coefficients, n):
    return limit - r_m / (n - defect(coefficients, n)) ** 2


def last_digit_unit(text):
    decimals = len(text.split(".")[1]) if "." in text else 0
    return 10.0 ** (-decimals)


def parse_levels(text):
    rows = []
    for line in text.strip().splitlines():
        n, l, two_j, energy = line.split()
        rows.append((int(n), int(l), int(two_j), energy))
    return rows


# Levels the source prints with one energy for both J of a fine-structure doublet (Li np, n >= 3:
# the ASD gives the unresolved value): split here as that value plus the resonance doublet's
# splitting scaled as n*^-3 (common practice; the published p1/2 and p3/2 Rydberg-Ritz formulas give
# the same splittings at n = 3-10 within 1.5 %, see "# split" in fit-residuals.txt), the J levels at the (2J + 1)-weighted
# centroid minus 2/3 and plus 1/3 of the splitting; uncertainty: the printed half unit and 15 % of
# the splitting in quadrature.  Key (symbol, n, l, 2J) -> (splitting, uncertainty).
SPLIT_FINE_STRUCTURE = ("Li",)
FINE_SPLIT_U_FRACTION = 0.15
split_levels = {}


def split_unresolved_p(symbol, levels, limit, r_m, report=None):
    """The levels with each unresolved p doublet (n >= 3, both J at one printed energy) split as above."""
    if symbol not in SPLIT_FINE_STRUCTURE:
        return levels
    by_key = {(n, l, tj): e for n, l, tj, e in levels}
    low = min(n for n, l, tj, e in levels if l == 1)
    e1, e3 = float(by_key[(low, 1, 1)]), float(by_key[(low, 1, 3)])
    split_low = e3 - e1
    n_low = math.sqrt(r_m / (limit - (2 * e1 + 4 * e3) / 6))
    out = []
    for n, l, tj, e in levels:
        if l == 1 and n > low and by_key.get((n, 1, 1)) == by_key.get((n, 1, 3)):
            value = float(e)
            n_star = math.sqrt(r_m / (limit - value))
            split = split_low * (n_low / n_star) ** 3
            shifted = value - 2 * split / 3 if tj == 1 else value + split / 3
            decimals = len(e.split(".")[1]) if "." in e else 0
            u = math.hypot(0.5 * last_digit_unit(e), FINE_SPLIT_U_FRACTION * split)
            split_levels[(symbol, n, l, tj)] = (split, u)
            out.append((n, l, tj, "%.*f" % (decimals + 3, shifted)))
        else:
            out.append((n, l, tj, e))
    return out


# Series whose paper gives one set of defects for both J of a term (Na, Li nd; Na, K, Li nf): the
# two J would be degenerate, while the fine-structure splitting, E(l + 1/2) - E(l - 1/2), falls as
# n*^-3 and so is a constant difference of the defects, D = d0(l + 1/2) - d0(l - 1/2) =
# -dE n*^3 / (2 R_M) (common practice).  D from the measured levels where a doublet's splitting is
# printed to 10 % or better (the highest such n: Na 6d, inverted), else the one-electron value
# -alpha^2 / (2 l (l + 1)) (Li d and every f: within the printed digits of the measured Li 3d-6d and
# the unresolved nf).  The paper's d0 is taken as the (2J + 1)-weighted centroid's.
J_SPLIT_PRECISION = 0.10
J_SPLIT_MARK = "; d0 split by J here"


def split_degenerate_j(atom_id, symbol, series, levels_text, report=None):
    """The series with each pair of identical J defects split as above."""
    partner = SHARED.get(atom_id, atom_id)
    limit, r_m = LIMITS[partner][0], rydberg_per_cm(MASS_U[partner])
    printed = {(n, l, tj): e for n, l, tj, e in parse_levels(levels_text)}
    coefficients_of = {(l, tj): c for l, tj, c, paper in series}
    out = []
    for l, two_j, coefficients, paper in series:
        other = coefficients_of.get((l, 4 * l - two_j))
        if l == 0 or other is None or list(other) != list(coefficients):
            out.append((l, two_j, coefficients, paper))
            continue
        measured = None
        for n in sorted({n for (n, ll, tj) in printed if ll == l}, reverse=True):
            low, high = printed.get((n, l, 2 * l - 1)), printed.get((n, l, 2 * l + 1))
            if low is None or high is None:
                continue
            split = float(high) - float(low)
            u = math.hypot(0.5 * last_digit_unit(low), 0.5 * last_digit_unit(high))
            if split != 0 and u <= J_SPLIT_PRECISION * abs(split):
                centroid = (2 * l * float(low) + (2 * l + 2) * float(high)) / (4 * l + 2)
                n_star = math.sqrt(r_m / (limit - centroid))
                measured = (n, split, u, -split * n_star ** 3 / (2 * r_m))
                break
        if measured is not None:
            n, split, u, d = measured
            how = "from the measured %d%s splitting %+.3f(%d) cm-1" % (n, L_LETTERS[l], split, round(u * 1e3))
        else:
            d = -FINE_STRUCTURE_ALPHA ** 2 / (2 * l * (l + 1))
            how = "the one-electron value -alpha^2 / (2 l (l + 1))"
        shift = 2 * l * d / (4 * l + 2) if two_j == 2 * l + 1 else -(2 * l + 2) * d / (4 * l + 2)
        split_coefficients = [round(coefficients[0] + shift, 9)] + list(coefficients[1:])
        if report is not None and two_j == 2 * l + 1:
            report.append("# j-split %s %s: d0(%s%d/2) - d0(%s%d/2) = %.3e, %s; the splitting at n = 30 is %.2f MHz"
                          % (atom_id, L_LETTERS[l], L_LETTERS[l], 2 * l + 1, L_LETTERS[l], 2 * l - 1, d, how,
                             -2 * r_m * d / (30 - coefficients[0]) ** 3 * C / 1e4))
        out.append((l, two_j, split_coefficients, paper + J_SPLIT_MARK + " (" + how + ")"))
    return out


def j_text(two_j):
    return "%d/2" % two_j


def label(n, l, two_j):
    return "%d%s 2%s%d/2" % (n, L_LETTERS[l], L_LETTERS[l].upper(), two_j)


def fmt(x):
    # shortest round-trip text, as Java's Double.toString reads it back
    return repr(float(x))


def solve3(a, b):
    """Solves the 3x3 (or smaller) linear system a x = b by Gaussian elimination with pivoting."""
    m = len(b)
    a = [row[:] + [b[i]] for i, row in enumerate(a)]  # any size m, despite the name
    for col in range(m):
        pivot = max(range(col, m), key=lambda r: abs(a[r][col]))
        a[col], a[pivot] = a[pivot], a[col]
        for r in range(m):
            if r != col:
                f = a[r][col] / a[col][col]
                for k in range(col, m + 1):
                    a[r][k] -= f * a[col][k]
    return [a[i][m] / a[i][i] for i in range(m)]


def regularity(points, limit, r_m):
    """Check 2: residuals (cm^-1) of each level from a least-squares fit of its series' own defects.

    points: [(n, energy)] of one series without its lowest member.  Returns {n: residual} or {}
    when there are too few points to test anything (a fit needs one point more than parameters)."""
    data = []
    for n, e in points:
        n_star = math.sqrt(r_m / (limit - e))
        data.append((n, n_star, n - n_star, 1.0 / n_star ** 2))
    def fit(rows):
        params = 3 if len(rows) >= 5 else 2 if len(rows) >= 3 else 0
        if params == 0:
            return None
        ata = [[0.0] * params for _ in range(params)]
        atb = [0.0] * params
        for n, n_star, d, x in rows:
            basis = [x ** k for k in range(params)]
            for i in range(params):
                atb[i] += basis[i] * d
                for k in range(params):
                    ata[i][k] += basis[i] * basis[k]
        c = solve3(ata, atb)
        return {n: 2 * r_m / n_star ** 3 * (sum(c[k] * x ** k for k in range(params)) - d) for n, n_star, d, x in data}

    out = fit(data)
    if out is None:
        return {}
    return out


def numerov_lowest(z, alpha_c, p, l, nodes, r_max, e_guess):
    """Check 4: energy (hartree) of the bound state of the model potential with `nodes` radial nodes.

    u(r) = r R(r) on r = exp(s), u = exp(s/2) w: w'' = [2 r^2 (V - E) + (l + 1/2)^2] w, Numerov on
    a uniform s grid, bisection on E by the number of sign changes of w (it jumps by one at each
    eigenvalue), within a factor two of e_guess (nan when no eigenvalue with that node count lies there)."""
    a1, a2, a3, a4, rc = p
    s0, s1, steps = math.log(1e-5), math.log(r_max), 6000
    h = (s1 - s0) / steps
    rs = [math.exp(s0 + i * h) for i in range(steps + 1)]
    vs = []
    for r in rs:
        zl = 1 + (z - 1) * math.exp(-a1 * r) - r * (a3 + a4 * r) * math.exp(-a2 * r)
        vs.append(-zl / r - alpha_c / (2 * r ** 4) * (1 - math.exp(-(r / rc) ** 6)))
    q = (l + 0.5) ** 2

    def count(e):
        g = [2 * rs[i] ** 2 * (vs[i] - e) + q for i in range(steps + 1)]
        w0, w1 = 0.0, 1e-30
        changes = 0
        for i in range(1, steps):
            f0 = 1 - h * h * g[i - 1] / 12
            f1 = 1 + 5 * h * h * g[i] / 12
            f2 = 1 - h * h * g[i + 1] / 12
            w2 = (2 * f1 * w1 - f0 * w0) / f2
            if (w2 < 0) != (w1 < 0):
                changes += 1
            w0, w1 = w1, w2
            if abs(w1) > 1e200:
                w0, w1 = w0 * 1e-200, w1 * 1e-200
        return changes

    lo, hi = 2 * e_guess, 0.5 * e_guess
    if not count(lo) <= nodes < count(hi):
        return float("nan")
    for _ in range(50):
        mid = 0.5 * (lo + hi)
        if count(mid) > nodes:
            hi = mid
        else:
            lo = mid
    return 0.5 * (lo + hi)


def series_of(levels, l, two_j):
    return sorted((n, float(e), e) for n, ll, tj, e in levels if ll == l and tj == two_j)


def check_model_potentials():
    """Check 4 for every row of MODEL_POTENTIALS: [(fields, state, model, measured, relative difference)]."""
    results = []
    by_symbol = {atom[1]: atom for atom in ATOMS if atom[0] != "rb-85" and atom[0] not in SHARED}
    for line in MODEL_POTENTIALS.strip().splitlines():
        el, zt, ac, lt, a1, a2, a3, a4, rc = line.split()
        atom_id, symbol, z, a, series, levels_text, d_line_source, version = by_symbol[el]
        l = int(lt)
        r_m = rydberg_per_cm(MASS_U[atom_id])
        limit = LIMITS[atom_id][0]
        levels = parse_levels(levels_text)
        lows = [n for n, ll, tj, e in levels if ll == l]
        if lows:
            n_low = min(lows)
            members = [(tj, float(e)) for n, ll, tj, e in levels if ll == l and n == n_low]
        else:  # no measured level: the published Rydberg-Ritz formula's lowest level stands in
            n_low = l + 1
            members = [(tj, ritz(limit, r_m, co, n_low)) for ll, tj, co, paper in series if ll == l]
        e_mean = sum((tj + 1) * e for tj, e in members) / sum(tj + 1 for tj, e in members)
        measured = -(limit - e_mean) / (2 * r_m)
        n_star = 1 / math.sqrt(-2 * measured)
        model = numerov_lowest(int(zt), float(ac), [float(v) for v in (a1, a2, a3, a4, rc)], l, n_low - l - 1,
                               4 * n_star ** 2 + 40, measured)
        state = "%d%s" % (n_low, L_LETTERS[l]) + ("" if lows else " (formula)")
        results.append((line.split(), state, model, measured, model / measured - 1))
    return results


def d1_mhz(species):
    """The D1 centroid of d-lines.csv (beside this script) in MHz."""
    with open("d-lines.csv") as f:
        for line in f:
            fields = line.split(",")
            if fields[0] == species and fields[1] == "D1":
                factor = {"MHz": 1.0, "kHz": 1e-3, "GHz": 1e3, "cm-1": C / 1e4}[fields[4]]
                return float(fields[2]) * factor
    raise KeyError(species)


def shift_limits():
    """LIMITS of the SHARED isotopes: the natural partner's published limit with the normal mass shift."""
    for atom_id, natural in SHARED.items():
        sym_iso = "%s-%s I" % (atom_id.split("-")[0].capitalize(), atom_id.split("-")[1])
        sym_nat = "%s-%s I" % (natural.split("-")[0].capitalize(), natural.split("-")[1])
        ratio = rydberg_per_cm(MASS_U[atom_id]) / rydberg_per_cm(MASS_U[natural])
        measured = d1_mhz(sym_iso) - d1_mhz(sym_nat)
        normal = d1_mhz(sym_nat) * (ratio - 1)
        residual = measured - normal
        RESIDUAL_D1_MHZ[atom_id] = residual
        limit = isotope_limit(atom_id)
        shift_mhz = (limit - LIMITS[natural][0]) * C / 1e4
        source = ("the %s limit (%s) with the normal mass shift, times R_M(%s) / R_M(%s) = 1 %+.6e (common "
                  "practice; atomic masses of nuclear/isotopes.csv): %+.1f MHz; the specific mass and field shifts "
                  "of the limit are not published for this isotope and not applied: on the D1 line (d-lines.csv) "
                  "they are the measured isotope shift %+.3f MHz minus its normal mass shift %+.3f MHz = %+.1f MHz, "
                  "the size of the error to expect here" % (
                      sym_nat.replace(" I", ""), PUBLISHED_LIMITS[natural][0], sym_iso.replace(" I", ""),
                      sym_nat.replace(" I", ""), ratio - 1, shift_mhz, measured, normal, residual))
        LIMITS[atom_id] = (limit, LIMITS[natural][1], source,
                           (LIMITS[natural][0], "the natural partner's limit (%s)" % PUBLISHED_LIMITS[natural][0]))


def main():
    for atom_id, (text, origin) in PUBLISHED_LIMITS.items():
        assert abs(published_limit_per_cm(atom_id) - LIMITS[atom_id][0]) < 1e-9, atom_id
    shift_limits()
    model_results = check_model_potentials()
    model_check = {(fields[0], int(fields[3])): rel for fields, state, model, measured, rel in model_results}
    report = ["# Checks of the built-in Rydberg data, written by make_rydberg_data.py (see its docstring)",
              "#",
              "# Check 1: Rydberg-Ritz formula of each series against the measured levels, cm^-1; tolerance %.2f "
              "cm^-1 + half a unit in the last digit of the tabulated level; X marks a level outside it" % TOLERANCE_PER_CM,
              "# Check 2: residual of each measured level from a least-squares fit of its own series' quantum "
              "defects (lowest member left out), cm^-1; ! marks one above %.2f cm^-1" % REGULARITY_PER_CM,
              "# atom  series  n  measured  formula  formula-measured  allowed  regularity-residual"]
    problems = []
    atoms = []
    for atom_id, symbol, z, a, series, levels_text, d_line_source, version in ATOMS:
        split = split_degenerate_j(atom_id, symbol, series, levels_text,
                                   None if atom_id in SHARED else report)
        atoms.append((atom_id, symbol, z, a, split, levels_text, d_line_source, version))
    second_values = {}
    for atom_id, symbol, z, a, series, levels_text, d_line_source, version in atoms:
        if atom_id in SHARED:
            continue
        for l, two_j, coefficients, paper in series:
            second_values.setdefault((symbol, l, two_j), []).append((atom_id, coefficients, paper))
    for atom_id, symbol, z, a, series, levels_text, d_line_source, version in atoms:
        r_m = rydberg_per_cm(MASS_U[atom_id])
        limit, limit_provenance, limit_source, limit_second = LIMITS[atom_id]
        printed = parse_levels(levels_text)
        levels = split_unresolved_p(symbol, printed, LIMITS[SHARED.get(atom_id, atom_id)][0],
                                    rydberg_per_cm(MASS_U[SHARED.get(atom_id, atom_id)]))
        # check 1's allowance: half a unit of the digits as the ASD prints them
        half_unit = {(n, l, tj): 0.5 * last_digit_unit(e) for n, l, tj, e in printed}
        uncertainty = {(n, l, tj): 0.5 * last_digit_unit(e) for n, l, tj, e in levels}
        if atom_id in SHARED:
            levels, uncertainty = shifted_levels(atom_id, levels)
        if atom_id not in SHARED:
            coefficients_of = {(l, tj): c for l, tj, c, paper in series}
            for (sym, n, l, tj), (split, u) in sorted(split_levels.items()):
                if sym == symbol and tj == 1:
                    published = ritz(limit, r_m, coefficients_of[(l, 3)], n) - ritz(limit, r_m, coefficients_of[(l, 1)], n)
                    report.append("# split %s %d%s: the resonance doublet's splitting scaled as n*^-3 gives %.5f cm-1; "
                                  "the published %s1/2 and %s3/2 Rydberg-Ritz formulas %.5f (ratio %.3f)"
                                  % (atom_id, n, L_LETTERS[l], split, L_LETTERS[l], L_LETTERS[l], published,
                                     split / published))
        texts = {(n, l, tj): e for n, l, tj, e in levels}
        for (sym, n, l, tj), (split, u) in split_levels.items():
            if sym == symbol:
                # the split's uncertainty in place of the half unit of the digits written (a shared
                # isotope keeps its addition for the neglected isotope shifts)
                uncertainty[(n, l, tj)] += u - 0.5 * last_digit_unit(texts[(n, l, tj)])
        valid_from = {}
        row_check = {}
        level_check = {}
        for l, two_j, coefficients, paper in series:
            measured = series_of(levels, l, two_j)
            regular = regularity([(n, e) for n, e, t in measured[1:]], limit, r_m)
            first_good = None
            within = []
            for n, e, text in measured:
                fit = ritz(limit, r_m, coefficients, n)
                allowed = TOLERANCE_PER_CM + half_unit[(n, l, two_j)]
                good = abs(fit - e) <= allowed
                reg = regular.get(n)
                reg_text = "-" if reg is None else "%+.4f%s" % (reg, "" if abs(reg) <= REGULARITY_PER_CM else " !")
                if reg is not None and abs(reg) > REGULARITY_PER_CM:
                    problems.append("%s %s check 2: %s" % (atom_id, label(n, l, two_j), reg_text))
                report.append("%-6s %s%s  %2d  %.4f  %.4f  %+.4f  %.4f  %s%s" % (
                    atom_id, L_LETTERS[l], j_text(two_j), n, e, fit, fit - e, allowed, reg_text,
                    "" if good else "  X"))
                level_check[(n, l, two_j)] = (fit - e, reg)
                if good and first_good is None:
                    first_good = n
                elif not good:
                    first_good = None
                    within = []
                if good:
                    within.append((n, abs(fit - e)))
            if measured:
                valid_from[(l, two_j)] = first_good if first_good is not None else measured[-1][0] + 1
            else:
                valid_from[(l, two_j)] = l + 1
            if within:
                text = "check 1: %s agree%s within %.2f cm-1 (largest |formula - measured| %.4f cm-1)" % (
                    "the measured level n = %d" % within[0][0] if len(within) == 1 else
                    "the %d measured levels n = %d-%d" % (len(within), within[0][0], within[-1][0]),
                    "s" if len(within) == 1 else "", TOLERANCE_PER_CM, max(d for n, d in within))
            elif measured:
                n, e, t = measured[-1]
                text = "check 1: no measured level within %.2f cm-1; the highest one (n = %d) is %+.4f cm-1 off" % (
                    TOLERANCE_PER_CM, n, ritz(limit, r_m, coefficients, n) - e)
            else:
                text = "check 1: no measured level (the recalled ones failed the checks and were left out); " \
                       "check 4: the model potential's %d%s bound state is %+.1e (relative) from this formula's" % (
                           l + 1, L_LETTERS[l], model_check[(symbol, l)])
            for other_id, other_coefficients, other_paper in second_values[(symbol, l, two_j)]:
                if other_paper.split(" (")[0] != paper.split(" (")[0]:
                    d50 = defect(coefficients, 50) - defect(other_coefficients, 50)
                    text += "; second value: the %s set (%s) gives a defect at n = 50 differing by %.1e (%.4f cm-1)" % (
                        other_id, other_paper.split(",")[0] + " et al." if "," in other_paper else other_paper,
                        d50, 2 * r_m / 50 ** 3 * abs(d50))
            row_check[(l, two_j)] = text
        # limit check
        if atom_id in SHARED:
            limit_check = "check 1 (the series meet the measured levels with this limit); %s is %+.1f MHz from " \
                          "this one (the normal mass shift); reader and script convert alike (LimitsTest)" % (
                              limit_second[1], (limit_second[0] - limit) * C / 1e4)
        elif limit_second is not None:
            limit_check = "check 1 (the series meet the measured levels with this limit); %s: %s, %+.6f cm-1 from " \
                          "this value" % (limit_second[1], fmt(limit_second[0]), limit_second[0] - limit) \
                if limit_second[0] != 31406.46775148 else \
                "check 1 (the series meet the measured levels with this limit); second value: %s, %+.8f cm-1 from " \
                "this one" % (limit_second[1], limit_second[0] - limit)
        else:
            other = LIMITS["rb-87" if atom_id == "rb-85" else "rb-85"][0]
            limit_check = "check 1 (the series meet the measured levels with this limit); the other Rb isotope's " \
                          "limit here is %+.4f cm-1 from it" % (other - limit)
        # core check
        alpha_d, alpha_q, core_source = CORE[atom_id]
        mp_alpha = {ln.split()[0]: float(ln.split()[2]) for ln in MODEL_POTENTIALS.strip().splitlines()}[symbol]
        ratio = alpha_d / mp_alpha - 1
        if abs(ratio) > 0.10:
            problems.append("%s core: alpha_d %s is %.1f %% from Marinescu's %s" % (atom_id, alpha_d, 100 * ratio, mp_alpha))
        core_check = "check 3: alpha_d is %+.1f %% from the alpha_c = %s a0^3 of Marinescu et al. 1994" % (
            100 * ratio, fmt(mp_alpha))
        if symbol == "Rb":
            g30 = polarization_defect(30, 4, alpha_d, alpha_q)
            g35 = polarization_defect(35, 4, alpha_d, alpha_q)
            moore35 = 0.0039990 - 0.0202 / (35 - 0.0039990) ** 2
            core_check += "; g-series defect from these values %.5f at n = 30 (Afrousheh et al. 2006 measured " \
                          "0.00405(6)) and %.5f at n = 35 (Moore et al. 2020: %.5f)" % (g30, g35, moore35)
            report.append("# check 3 %s: %s" % (atom_id, core_check))
        else:
            report.append("# check 3 %s: %s" % (atom_id, core_check))
        # the limit's uncertainty where none is stated (check R limit), before the header names it
        derived_limit_uncertainty(report, atom_id, {
            (l, two_j): [(n, level_check[(n, l, two_j)][0], 0.0 if e == 0 else uncertainty[(n, l, two_j)])
                         for n, e, t in series_of(levels, l, two_j) if n >= valid_from[(l, two_j)]]
            for l, two_j, coefficients, paper in series})
        # quantum-defect file
        species = "%s-%d I" % (symbol, a)
        papers = sorted({s[3].split(" (measured")[0].split(J_SPLIT_MARK)[0] for s in series})
        out = ["# ritzwerk-quantum-defects 1",
               "# id: quantum-defects-%s" % atom_id,
               "# title: %s quantum defects (modified Rydberg-Ritz) for l = 0..3" % species,
               "# species: %s" % species,
               "# source: " + "; ".join(papers) + " (the paper of each series is named per row)",
               "# provenance: from-memory",
               "# version: %s" % version,
               ] + limit_lines(atom_id, limit) + [
               "# limit-provenance: %s" % limit_provenance,
               "# limit-source: %s" % limit_source,
               "# limit-check: %s" % limit_check,
               "# core-dipole-polarizability-au: %s" % fmt(alpha_d),
               "# core-quadrupole-polarizability-au: %s" % fmt(alpha_q),
               "# core-source: %s" % core_source,
               "# core-check: %s" % core_check,
               "# levels: levels-%s" % atom_id,
               "# note: the digits of every series were typed in from memory with its paper as citation and "
               "checked as the column checked says (fit-residuals.txt; written by make_rydberg_data.py); "
               "energies are above the ground level (hyperfine centroid); R_M is not stored: the provider "
               "computes it from the atomic mass in nuclear/isotopes.csv; valid-from-n is the lowest n from "
               "which the formula agrees with the measured levels within %.2f cm-1; below it the engine uses "
               "levels-%s.csv; u-d0 to u-d8 are the coefficients' standard uncertainties as recalled from the series' "
               "paper (column uncertainty-provenance from-memory), or our own estimate where the paper states none "
               "or the limit has none (from-residuals, no paper's: check R in fit-residuals.txt; u-d0 is the root "
               "mean square over the measured levels at n >= valid-from-n of sqrt(r^2 + u^2) n*^3 / (2 R_M), r = "
               "formula - measured, u the level's stated uncertainty, rounded up to two digits, added in quadrature "
               "to the paper's u-d0 where it states one, u-d2 to u-d8 the paper's or else 0); empty: not stated, and a "
               "level of that series then has no uncertainty; limit-uncertainty is the limit's in its unit, stated "
               "or, where limit-uncertainty-source says from-residuals, ours (a constant offset the checked levels "
               "cannot tell from the limit, carried to every n; check R limit); for from-memory rows no floor is added for the "
               "formula's own residuals near valid-from-n (check U in fit-residuals.txt), so a level's uncertainty "
               "covers the published parameters only%s" % (TOLERANCE_PER_CM, atom_id, shared_note(atom_id)),
               "l,j,d0,d2,d4,d6,d8,u-d0,u-d2,u-d4,u-d6,u-d8,uncertainty-provenance,valid-from-n,provenance,source,"
               "checked"]
        stated = SERIES_UNCERTAINTIES.get(atom_id, {})
        for l, two_j, coefficients, paper in series:
            cs = list(coefficients) + [0.0] * (5 - len(coefficients))
            us = stated.get((l, two_j), [])
            kind = UNCERTAINTY_PROVENANCE if us else ""
            # (the ground level is the exact zero of the scale: u = 0, as the levels file writes it)
            checked = [(n, level_check[(n, l, two_j)][0], 0.0 if e == 0 else uncertainty[(n, l, two_j)])
                       for n, e, t in series_of(levels, l, two_j) if n >= valid_from[(l, two_j)]]
            if needs_derived(atom_id, coefficients, us) and checked:
                us, derived = derived_uncertainties(coefficients, us, checked, r_m)
                kind = RESIDUAL_PROVENANCE
                check_r(report, atom_id, l, two_j, coefficients, us, derived, checked, valid_from[(l, two_j)],
                        r_m)
            elif needs_derived(atom_id, coefficients, us):
                report.append("# check R %s %s%s: no measured level at n >= valid-from-n = %d, so no uncertainty "
                              "is derived (the levels keep none)" % (atom_id, L_LETTERS[l], j_text(two_j),
                                                                      valid_from[(l, two_j)]))
            u_text = ",".join(fmt_u(us[i]) if i < len(us) else "" for i in range(5))
            out.append("%d,%s,%s,%s,%s,%d,from-memory,%s,%s" % (
                l, j_text(two_j), ",".join(fmt(c) for c in cs), u_text, kind,
                valid_from[(l, two_j)], paper.replace(",", ";"), row_check[(l, two_j)].replace(",", ";")))
            if us and kind != RESIDUAL_PROVENANCE:
                check_u(report, atom_id, l, two_j, coefficients, us, valid_from[(l, two_j)], limit, r_m,
                        level_check, problems)
        with open("quantum-defects-%s.csv" % atom_id, "w") as f:
            f.write("\n".join(out) + "\n")
        # levels file
        keep = []
        lowest = {}
        for n, l, two_j, e in levels:
            lowest[(l, two_j)] = min(n, lowest.get((l, two_j), n))
        for n, l, two_j, e in levels:
            if n < valid_from[(l, two_j)] or n == lowest[(l, two_j)]:
                keep.append((float(e), n, l, two_j, e))
        keep.sort()
        lv = ["# ritzwerk-levels 1",
              "# id: levels-%s" % atom_id,
              "# title: %s measured levels below the quantum-defect fits" % species,
              "# source: %s, %s I energy levels (natural element), from memory%s" % (
                  NIST_ASD, symbol, "; with the normal mass shift to this isotope (common practice)"
                  if atom_id in SHARED else ""),
              "# provenance: from-memory",
              "# version: NIST ASD (version not re-checked)",
              "# energy-unit: cm-1",
              ("# note: energies in cm-1 as the ASD prints them; uncertainty is half a unit in the last digit; "
               "isotope shifts (below 0.01 cm-1 here) not applied; " if atom_id not in SHARED else
               "# note: energies in cm-1, the partner's ASD levels with the normal mass shift (see below); ") +
              "column note says how each level was checked "
              "(D line: against %s; check 1: published Rydberg-Ritz formula minus level; check 2: residual "
              "from the series' own regularity; fit-residuals.txt); written by make_rydberg_data.py"
              % d_line_source + shared_note(atom_id),
              "species,label,energy,uncertainty,j,note"]
        for e, n, l, two_j, text in keep:
            u = 0.0 if e == 0 else uncertainty[(n, l, two_j)]
            if e == 0:
                check = "ground level (the zero)"
            else:
                formula, reg = level_check[(n, l, two_j)]
                if l == 1 and n == lowest[(l, two_j)]:
                    check = "D line"
                elif n == lowest[(l, two_j)]:
                    check = "check 4 (model-potential bound state %+.1e relative)" % model_check[(symbol, l)]
                else:
                    check = "check 1 %+.4f cm-1" % formula
                    check += "; check 2 %+.4f cm-1" % reg if reg is not None else "; check 2 not possible (too few members)"
            if (symbol, n, l, two_j) in split_levels:
                split, u_split = split_levels[(symbol, n, l, two_j)]
                check += ("; the ASD's unresolved %d%s doublet split by the resonance doublet's splitting scaled "
                          "as n*^-3 (%.4f cm-1; u adds 15 %% of it)" % (n, L_LETTERS[l], split))
            lv.append("%s,%s,%s,%s,%s,from memory; %s" % (species, label(n, l, two_j), text, "%.2g" % u,
                                                           j_text(two_j), check))
        with open("levels-%s.csv" % atom_id, "w") as f:
            f.write("\n".join(lv) + "\n")
    # model potentials
    report.append("# Check 4: lowest bound state of each l in the model potential against the measured level "
                  "(fine-structure weighted), hartree")
    report.append("# element  l  state  model  measured  relative-difference")
    mp = ["# ritzwerk-model-potentials 1",
          "# id: model-potentials",
          "# title: l-dependent core model potentials of Li, Na, K, Rb and Cs",
          "# source: " + MARINESCU_1994 + ", Table I",
          "# provenance: from-memory",
          "# version: 1994",
          "# formula: V_l(r) = -Z_l(r)/r - alpha_c/(2 r^4) (1 - exp(-(r/r_c)^6)); "
          "Z_l(r) = 1 + (Z - 1) exp(-a1 r) - r (a3 + a4 r) exp(-a2 r); atomic units",
          "# note: one row per element and l; the row with the highest l of an element serves every higher l; "
          "digits typed in from memory and checked by the bound states they give (column checked: check 4 of "
          "fit-residuals.txt); written by make_rydberg_data.py",
          "element,nuclear-charge,core-polarizability-a0^3,l,a1-per-a0,a2-per-a0,a3-per-a0,a4-per-a0^2,"
          "cutoff-radius-a0,checked"]
    for fields, state, model, measured, rel in model_results:
        report.append("%-3s  %s  %-4s  %.6f  %.6f  %+.1e" % (fields[0], fields[3], state, model, measured, rel))
        if not abs(rel) <= 0.01:
            problems.append("%s l=%s check 4: %.1e" % (fields[0], fields[3], rel))
        mp.append(",".join(fields + ["check 4: %s bound state %.6f hartree against the %s %.6f (%+.1e)" % (
            state.split()[0], model, "formula's" if "formula" in state else "measured", measured, rel)]))
    with open("model-potentials.csv", "w") as f:
        f.write("\n".join(mp) + "\n")
    if problems:
        report.append("# problems:")
        report.extend("#   " + p for p in problems)
    with open("fit-residuals.txt", "w") as f:
        f.write("\n".join(report) + "\n")


def shifted_levels(atom_id, levels):
    """The partner's measured levels with the normal mass shift (times the ratio of the R_M), for a SHARED isotope.

    Returns the levels (energies as text with three more decimals than the partner's, so the scaling is
    not rounded away) and their uncertainties: the partner's half unit in the last digit plus the part of
    the D1 isotope shift the normal mass shift leaves out, scaled by E / E(D1) (an estimate of the
    neglected specific mass and field shifts, not a bound)."""
    natural = SHARED[atom_id]
    ratio = rydberg_per_cm(MASS_U[atom_id]) / rydberg_per_cm(MASS_U[natural])
    species = "%s-%s I" % (atom_id.split("-")[0].capitalize(), atom_id.split("-")[1])
    d1_per_cm = d1_mhz(species) * 1e4 / C
    residual_per_cm = abs(RESIDUAL_D1_MHZ[atom_id]) * 1e4 / C
    out, uncertainty = [], {}
    for n, l, tj, e in levels:
        decimals = len(e.split(".")[1]) if "." in e else 0
        value = float(e)
        out.append((n, l, tj, "0" if value == 0 else "%.*f" % (decimals + 3, value * ratio)))
        uncertainty[(n, l, tj)] = 0.5 * last_digit_unit(e) + residual_per_cm * value / d1_per_cm
    return out, uncertainty


def limit_lines(atom_id, limit):
    """The header lines of the limit: as published (unit and digits), or derived in cm^-1; its stated
    uncertainty, or ours from the residuals (check R limit; in cm^-1, the unit of every such limit)."""
    derived = []
    if atom_id in DERIVED_LIMIT_UNCERTAINTIES:
        u, text = DERIVED_LIMIT_UNCERTAINTIES[atom_id]
        derived = ["# limit-uncertainty: %s" % fmt_u(u), "# limit-uncertainty-source: %s" % text]
    if atom_id not in PUBLISHED_LIMITS:
        return ["# limit-per-cm: %s" % fmt(limit)] + derived
    text, origin = PUBLISHED_LIMITS[atom_id]
    assert not derived or text.endswith(" cm-1"), atom_id
    return (["# limit: %s" % text] + (["# limit-from: %s" % origin] if origin else [])
            + (["# limit-uncertainty: %s" % LIMIT_UNCERTAINTIES[atom_id]] if atom_id in LIMIT_UNCERTAINTIES
               else derived))


def fmt_u(u):
    """An uncertainty as written in the files: plain decimals, no exponent."""
    text = ("%.10f" % u).rstrip("0").rstrip(".")
    assert float(text) == u, u
    return text


# Per atom whose limit states no uncertainty: (ours from the residuals in cm^-1, the header's words);
# filled by derived_limit_uncertainty before the atom's files are written.
DERIVED_LIMIT_UNCERTAINTIES = {}


def derived_limit_uncertainty(report, atom_id, checked_by_series):
    """Check R limit: for an atom whose limit states no uncertainty, the largest over its series of the
    root mean square of sqrt(r^2 + u^2) over the series' checked levels (n >= valid-from-n), rounded up
    to two digits: a constant offset the checks cannot tell from the limit, carried to every n."""
    if atom_id in LIMIT_UNCERTAINTIES:
        return
    worst = None
    for (l, two_j), checked in checked_by_series.items():
        if checked:
            rms = math.sqrt(sum(r * r + u * u for n, r, u in checked) / len(checked))
            if worst is None or rms > worst[0]:
                worst = (rms, l, two_j, checked)
    if worst is None:
        return
    rms, l, two_j, checked = worst
    ns = [n for n, r, u in checked]
    where = "%s%s n = %s" % (L_LETTERS[l], j_text(two_j), "%d" % ns[0] if len(ns) == 1 else "%d-%d" % (ns[0], ns[-1]))
    text = ("from-residuals (ours, not a paper's: the largest root mean square over the series of sqrt(r^2 + u^2), "
            "r = formula - measured at the checked levels, here %s: %.3e cm-1, rounded up; check R limit in "
            "fit-residuals.txt)" % (where, rms))
    DERIVED_LIMIT_UNCERTAINTIES[atom_id] = (round_up_2(rms), text)
    report.append("# check R limit %s: the limit states no uncertainty; ours %s cm-1 = the largest root mean square "
                  "of sqrt(r^2 + u^2) over a series' checked levels, %s (%.3e), rounded up to two digits" % (
                      atom_id, fmt_u(round_up_2(rms)), where, rms))


def limit_uncertainty_per_cm(atom_id):
    """The limit's standard uncertainty in cm^-1, converted as QuantumDefectFiles converts it, or None."""
    if atom_id in DERIVED_LIMIT_UNCERTAINTIES:
        return DERIVED_LIMIT_UNCERTAINTIES[atom_id][0]
    if atom_id not in LIMIT_UNCERTAINTIES:
        return None
    unit = PUBLISHED_LIMITS[atom_id][0].split()[1]
    return float(LIMIT_UNCERTAINTIES[atom_id]) * {"cm-1": 1.0, "GHz": 1e9 / (C * 100), "MHz": 1e6 / (C * 100)}[unit]


def ritz_uncertainty(u_limit, r_m, coefficients, us, n):
    """First-order standard uncertainty of ritz(): every input uncorrelated (as AlkaliAtom computes it)."""
    d0 = coefficients[0]
    x = 1.0 / (n - d0) ** 2
    n_star = n - defect(coefficients, n)
    de = 2 * r_m / n_star ** 3
    partials = [1 + sum(2 * k * c * x ** (k - 1) / (n - d0) ** 3 for k, c in enumerate(coefficients) if k >= 1)]
    partials += [x ** k for k in range(1, len(coefficients))]
    return math.sqrt(u_limit ** 2 + sum((p * de * u) ** 2 for p, u in zip(partials, us)))


def check_u(report, atom_id, l, two_j, coefficients, us, valid_from, limit, r_m, level_check, problems):
    """Check U: the energy uncertainty the stated uncertainties propagate to (ritz_uncertainty), beside
    the formula's residual against the measured levels at the edge of its validity (check 1), which it
    does not include.  The recalled uncertainties themselves have no independent check here."""
    u_limit = limit_uncertainty_per_cm(atom_id)
    if len(us) < len(coefficients) or u_limit is None:
        report.append("# check U %s %s%s: no level uncertainty (%s not stated)" % (
            atom_id, L_LETTERS[l], j_text(two_j), "the limit's" if u_limit is None else "a coefficient's"))
        return
    edge = [abs(level_check[k][0]) for k in level_check if k[1] == l and k[2] == two_j and k[0] >= valid_from]
    report.append("# check U %s %s%s: u(E) at n = %d, 30, 60, 100: %.2e, %.2e, %.2e, %.2e cm-1 "
                  "(the limit's alone %.1e); the formula's largest check-1 residual at n >= %d: %s (not included)" % (
                      atom_id, L_LETTERS[l], j_text(two_j), valid_from,
                      *(ritz_uncertainty(u_limit, r_m, coefficients, us, n) for n in (valid_from, 30, 60, 100)),
                      u_limit, valid_from, "%.4f cm-1" % max(edge) if edge else "no measured level"))


def needs_derived(atom_id, coefficients, us):
    """Whether a series gets an uncertainty derived from its residuals (check R): when its paper states
    no uncertainty for some coefficient, or its atom's limit has none, stated or ours (then a level
    could get none)."""
    return len(us) < len(significant(coefficients)) or limit_uncertainty_per_cm(atom_id) is None


def significant(coefficients):
    """The coefficients without trailing zeros (the reader drops those; they can carry no u)."""
    cs = list(coefficients)
    while len(cs) > 1 and cs[-1] == 0:
        cs.pop()
    return cs


def round_up_2(x):
    """x rounded up to two significant digits (a stated uncertainty is not rounded down)."""
    exponent = math.floor(math.log10(x)) - 1
    value = math.ceil(round(x / 10 ** exponent, 9)) * 10 ** exponent
    return float("%.2g" % value)


def defect_equivalent(residual, u_level, n, coefficients, r_m):
    """The error of d0 a level's residual stands for: dE = 2 R_M dd0 / n*^3 (to first order), so
    dd0 = sqrt(residual^2 + u_level^2) n*^3 / (2 R_M); the level's own stated uncertainty is added in
    quadrature, since a residual below it does not show the formula better than that."""
    n_star = n - defect(coefficients, n)
    return math.sqrt(residual ** 2 + u_level ** 2) * n_star ** 3 / (2 * r_m)


def derived_uncertainties(coefficients, us, checked, r_m):
    """Check R: u(d0) from the series' own residuals at the checked levels (n >= valid-from-n):
    the root mean square of defect_equivalent over them, rounded up to two digits.  Where the paper
    states u(d0) (Rb-85, whose limit has none) the two are added in quadrature and the paper's
    u(d2)... kept; otherwise u(d2)... are written 0: the derived u(d0) stands for the error of
    delta(n) as a whole at the checked n.  Returns (the row's u list, the unrounded RMS)."""
    cs = significant(coefficients)
    rms = math.sqrt(sum(defect_equivalent(r, u, n, coefficients, r_m) ** 2 for n, r, u in checked) / len(checked))
    if len(us) == len(cs):
        return [round_up_2(math.hypot(us[0], rms))] + list(us[1:]), rms
    return [round_up_2(rms)] + [0.0] * (len(cs) - 1), rms


def check_r(report, atom_id, l, two_j, coefficients, us, rms, checked, valid_from, r_m):
    """Check R: the derived u(d0), the levels it comes from, and what it propagates to (limit error
    taken as counted in it where the limit's is not stated; see derived_uncertainties)."""
    u_limit = limit_uncertainty_per_cm(atom_id) or 0.0
    ns = [n for n, r, u in checked]
    top = checked[-1]
    report.append("# check R %s %s%s: u(d0) = %.3e (written %s) = RMS over the %d measured level%s n = %s of "
                  "sqrt(r^2 + u^2) n*^3 / (2 R_M); u(E) at n = %d, 30, 60, 100: %.2e, %.2e, %.2e, %.2e cm-1; "
                  "the highest checked level n = %d: residual %+.4f cm-1 against u(E) %.4f" % (
                      atom_id, L_LETTERS[l], j_text(two_j), rms, fmt_u(us[0]), len(checked),
                      "" if len(checked) == 1 else "s", "%d" % ns[0] if len(ns) == 1 else "%d-%d" % (ns[0], ns[-1]),
                      valid_from,
                      *(ritz_uncertainty(u_limit, r_m, significant(coefficients), us, n)
                        for n in (valid_from, 30, 60, 100)),
                      top[0], top[1], ritz_uncertainty(u_limit, r_m, significant(coefficients), us, top[0])))


def shared_note(atom_id):
    """The header note of a set shared with the natural element (empty for the others)."""
    if atom_id not in SHARED:
        return ""
    return ("; SHARED with the natural element: the series, core polarizabilities and measured levels "
            "are those of quantum-defects-%s / levels-%s (no isotope-specific data at hand), only R_M and the "
            "limit (the partner's with the normal mass shift, see limit-source) are this isotope's; its resonance "
            "levels come from its own D lines (d-lines.csv)" % (SHARED[atom_id], SHARED[atom_id])) + (
        "; the measured levels other than the resonance levels are the partner's times R_M(this isotope) / "
        "R_M(partner) (the normal mass shift, as for the limit; three more decimals so the scaling is kept); "
        "their uncertainty adds to the partner's half unit the part of the D1 isotope shift the normal mass "
        "shift leaves out (%+.1f MHz), scaled by E / E(D1): an estimate of the specific mass and field shifts "
        "not applied%s" % (RESIDUAL_D1_MHZ[atom_id], " (for Li-6 about 0.16 cm-1 at the D lines' energy and 0.4 "
                                                  "cm-1 near the limit)" if atom_id == "li-6" else ""))


def polarization_defect(n, l, alpha_d, alpha_q):
    """Core-polarization quantum defect with hydrogenic <r^-4> and <r^-6> (as AlkaliAtom.polarizationDefect)."""
    r4 = (3 * n * n - l * (l + 1)) / (2 * n ** 5 * (l - 0.5) * l * (l + 0.5) * (l + 1) * (l + 1.5))
    r6 = (35 * n ** 4 - 5 * n * n * (6 * l * (l + 1) - 5) + 3 * (l - 1) * l * (l + 1) * (l + 2)) / (
        8 * n ** 7 * (l - 1.5) * (l - 1) * (l - 0.5) * l * (l + 0.5) * (l + 1) * (l + 1.5) * (l + 2) * (l + 2.5))
    return n ** 3 * (alpha_d * r4 + alpha_q * r6) / 2


if __name__ == "__main__":
    main()
