#!/usr/bin/python3
"""Writes Ritzwerk's built-in D-line centroids and hyperfine constants of the alkali isotopes
Li-6, Li-7, Na-23, K-39, K-40, K-41, Rb-85, Rb-87 and Cs-133, with the checks of every value.

Run from this folder:   /usr/bin/python3 make_d_lines.py
Needs only the Python 3 standard library.  Deterministic: rewrites the same bytes each time.

Outputs (beside this script):
  d-lines.csv               hyperfine-free centroids of the D1 (ns 2S1/2 - np 2P1/2) and D2
                            (ns 2S1/2 - np 2P3/2) lines, in the unit and with the digits their
                            source prints (MHz or kHz; cm-1 where only a wavenumber was at hand),
                            format ritzwerk-d-lines 1
  hyperfine-constants.csv   magnetic-dipole (A) and electric-quadrupole (B) hyperfine constants of
                            the ground level and the first p levels, of the Cs-133 7p levels
                            (the 459 nm and 455 nm lines) and of the low d levels read in an abstract
                            (Rb-85 4d3/2; Cs-133 6d3/2 and 6d5/2), in MHz, format ritzwerk-hyperfine 1
  d-line-checks.txt         every check below, with its numbers

Hyperfine-free centroid: the frequency the line would have without hyperfine structure, i.e.
between the (2F+1)-weighted centres of gravity of the two levels' hyperfine levels.  Refdata puts
the centroid above the ground level's centroid in place of the natural element's np levels.

Where the numbers come from.  Values read in a paper's abstract (journal or arXiv page) are
marked provenance published; the others were typed in from memory, with the measurement they come
from as the citation, and each is checked by a relation that does not use it:
  check D (fine structure): D2 - D1 against the np fine-structure interval of the NIST ASD levels of
      the natural element (levels-<atom>.csv, from memory; their stated uncertainty is given);
  check I (isotope shift): the D1 and D2 isotope shifts of an isotope pair must agree to within a few
      MHz (the mass and field shifts of the two lines of a doublet are almost equal), and where a
      published isotope shift was read, against it;
  check S (second measurement): against a second, independent measurement where one was read (for the
      Cs 6d levels the earlier measurements quoted in the abstract of the newer one);
  check A (hyperfine anomaly): the ratio of an isotope pair's A constants against the ratio of their
      nuclear g factors g_I = mu / (I mu_N) from nuclear/isotopes.csv (N. J. Stone, INDC(NDS)-0794,
      2019): they differ only by the hyperfine anomaly, below 1 % for these atoms;
  check N (natural element): the abundance-weighted mean of the isotopes' centroids against the NIST ASD
      level of the natural element (K: abundances 93.2581 %, 0.0117 %, 6.7302 % as in T. G. Tiecke,
      Properties of Potassium, v1.02, Table 1, read; Rb: 72.17 % and 27.83 %, IUPAC, from memory);
  check H (splitting): the hyperfine splitting the constants give, against a published splitting
      read in an abstract or known exactly (Cs-133 ground level: 9 192 631 770 Hz, the SI second);
  check R (series regularity, levels above the first p): A n*^3 against the first p level of the same
      series, and A(np1/2) / A(np3/2) against the first p levels' ratio (both nearly constant along a
      series: common practice), n* = sqrt(R_M / (E_limit - E)) from levels-<atom>.csv and the limit of
      quantum-defects-<atom>.csv (R_M from the atomic mass in ../nuclear/isotopes.csv).
"""

from decimal import Decimal

C_MHZ_PER_CM = Decimal("29979.2458")  # exact: c = 299 792 458 m/s


# Nuclear spin I and magnetic moment mu/mu_N as in ../nuclear/isotopes.csv (Stone 2019; bodr spins).
NUCLEI = {
    "Li-6": (1, 0.822043), "Li-7": (1.5, 3.256407), "Na-23": (1.5, 2.2175), "K-39": (1.5, 0.39147),
    "K-40": (4, -1.29797), "K-41": (1.5, 0.214872), "Rb-85": (2.5, 1.35306), "Rb-87": (1.5, 2.75129),
    "Cs-133": (3.5, 2.5778),
}

# ---------------------------------------------------------------------------------------------
# Papers.
# ---------------------------------------------------------------------------------------------
SANSONETTI_2011 = ("C. J. Sansonetti, C. E. Simien, J. D. Gillaspy, J. N. Tan, S. M. Brewer, R. C. Brown, S. Wu "
                   "and J. V. Porto, Phys. Rev. Lett. 107, 023001 (2011), doi:10.1103/PhysRevLett.107.023001")
JUNCAR_1981 = ("P. Juncar, J. Pinard, J. Hamon and A. Chartier, Metrologia 17, 77 (1981), "
               "doi:10.1088/0026-1394/17/3/001")
FALKE_2006 = ("S. Falke, E. Tiemann, C. Lisdat, H. Schnatz and G. Grosche, Phys. Rev. A 74, 032503 (2006), "
              "doi:10.1103/PhysRevA.74.032503")
YE_1996 = ("J. Ye, S. Swartz, P. Jungner and J. L. Hall, Opt. Lett. 21, 1280 (1996), doi:10.1364/OL.21.001280")
MARIC_2008 = ("M. Maric, J. J. McFerran and A. N. Luiten, Phys. Rev. A 77, 032502 (2008), "
              "doi:10.1103/PhysRevA.77.032502")
BARWOOD_1991 = "G. P. Barwood, P. Gill and W. R. C. Rowley, Appl. Phys. B 53, 142 (1991), doi:10.1007/BF00330229"
BANERJEE_2004 = ("A. Banerjee, D. Das and V. Natarajan, Europhys. Lett. 65, 172 (2004), "
                 "doi:10.1209/epl/i2003-10069-3")
GERGINOV_2006 = ("V. Gerginov, K. Calkins, C. E. Tanner, J. J. McFerran, S. Diddams, A. Bartels and L. Hollberg, "
                 "Phys. Rev. A 73, 032504 (2006), doi:10.1103/PhysRevA.73.032504")
UDEM_1999 = ("Th. Udem, J. Reichert, R. Holzwarth and T. W. Haensch, Phys. Rev. Lett. 82, 3568 (1999), "
             "doi:10.1103/PhysRevLett.82.3568")
GERGINOV_2004 = ("V. Gerginov, C. E. Tanner, S. Diddams, A. Bartels and L. Hollberg, Phys. Rev. A 70, 042505 "
                 "(2004), doi:10.1103/PhysRevA.70.042505")
GERGINOV_2003 = ("V. Gerginov, A. Derevianko and C. E. Tanner, Phys. Rev. Lett. 91, 072501 (2003), "
                 "doi:10.1103/PhysRevLett.91.072501")
ARIMONDO_1977 = ("E. Arimondo, M. Inguscio and P. Violino, Rev. Mod. Phys. 49, 31 (1977), "
                 "doi:10.1103/RevModPhys.49.31")
CS_7P_2022 = ("Compact 459 nm Cs cell optical frequency standard with short-term stability, arXiv:2206.09409 "
              "(2022)")
DUSPAYEV_2023 = ("A. Duspayev and G. Raithel, Spectroscopy of the 85Rb 4D3/2 state for hyperfine-structure "
                 "determination, arXiv:2305.00265 (2023)")
KORTYNA_2005 = ("A. Kortyna, N. Masluk and T. Bragdon, Two-photon, sub-Doppler hyperfine measurements of the 6d 2Dj "
                "states of cesium, APS DAMOP 2005 meeting abstract D6.8 (Lafayette College)")
# second measurements of the Cs 6d constants, as the abstract of KORTYNA_2005 quotes them (read there)
GEORGIADES_1994 = "N. Georgiades, E. Polzik and H. Kimble, Opt. Lett. 19, 1474 (1994), as quoted in " \
                  "the abstract of Kortyna et al. 2005"
TAI_1975 = "C. Tai, W. Happer and R. Gupta, Phys. Rev. A 12, 736 (1975), as quoted in the abstract of Kortyna et " \
           "al. 2005"
PEREZ_GALVAN_2008 = ("A. Perez Galvan, Y. Zhao and L. A. Orozco, Measurement of the hyperfine splitting of the "
                     "6S1/2 level in rubidium, Phys. Rev. A 78, 012502 (2008), doi:10.1103/PhysRevA.78.012502")
BIZE_1999 = ("S. Bize, Y. Sortais, M. S. Santos, C. Mandache, A. Clairon and C. Salomon, Europhys. Lett. 45, 558 "
             "(1999), doi:10.1209/epl/i1999-00203-9")
SI_SECOND = ("the SI definition of the second (BIPM, The International System of Units, 9th edition, 2019): "
             "the Cs-133 ground-state hyperfine splitting is exactly 9 192 631 770 Hz")
WIJNGAARDEN_1994 = ("W. A. van Wijngaarden and J. Li, J. Quant. Spectrosc. Radiat. Transfer 52, 555 (1994), "
                    "doi:10.1016/0022-4073(94)90024-8")
YEI_1993 = "W. Yei, A. Sieradzan and M. D. Havey, Phys. Rev. A 48, 1909 (1993), doi:10.1103/PhysRevA.48.1909"
HUANG_2018 = ("Y.-C. Huang, Laser Spectroscopy of Low-lying Levels in Atomic Lithium, PhD thesis, National Tsing "
              "Hua University (2018), abstract read: 2P1/2 hyperfine splittings 26.108(9) MHz (Li-6) and "
              "91.873(5) MHz (Li-7), D1 isotope shift 10533.800(15) MHz")
LI_FS_REVIEW = ("the 2009 critical review of the 6,7Li fine structure and isotope shifts listed on the York "
                "University laser-spectroscopy group's publication page (abstract read): 2P fine-structure "
                "intervals 10 052.954(49) MHz (Li-6) and 10 053.154(40) MHz (Li-7)")
BANERJEE_K_2004 = ("A. Banerjee and V. Natarajan, Phys. Rev. A 70, 052505 (2004), arXiv:physics/0401165 (abstract "
                   "read): K-39 D2 391 015 578.040(75) MHz")

# ---------------------------------------------------------------------------------------------
# D lines: (species, line, value text, uncertainty text, unit, provenance, source).
# ---------------------------------------------------------------------------------------------
D_LINES = [
    ("Li-6", "D1", "446789596.091", "0.007", "MHz", "from-memory", SANSONETTI_2011),
    ("Li-6", "D2", "446799650.653", "0.009", "MHz", "from-memory", SANSONETTI_2011),
    ("Li-7", "D1", "446800129.853", "0.006", "MHz", "from-memory", SANSONETTI_2011),
    ("Li-7", "D2", "446810184.329", "0.008", "MHz", "from-memory", SANSONETTI_2011),
    # Na D1: the value recalled for Juncar et al. (508 332 465.8 MHz) gives a fine-structure interval
    # 730 MHz (0.024 cm-1) wider than the ASD levels' 17.19594 cm-1 (check D), so it was not used; the
    # ASD wavenumber (cm-1, from memory, as levels-na-23.csv) stands, in its own unit.
    ("Na-23", "D1", "16956.17025", "0.000005", "cm-1", "from-memory",
     "NIST Atomic Spectra Database (A. Kramida, Yu. Ralchenko, J. Reader and NIST ASD Team), Na I 3p 2P1/2 "
     "(natural element = Na-23; version not re-checked)"),
    ("Na-23", "D2", "508848716.2", "1.3", "MHz", "from-memory", JUNCAR_1981),
    ("K-39", "D1", "389286058.716", "0.062", "MHz", "from-memory", FALKE_2006),
    ("K-39", "D2", "391016170.03", "0.12", "MHz", "from-memory", FALKE_2006),
    ("K-40", "D1", "389286184.353", "0.073", "MHz", "from-memory", FALKE_2006),
    ("K-40", "D2", "391016296.050", "0.088", "MHz", "from-memory", FALKE_2006),
    ("K-41", "D1", "389286294.205", "0.062", "MHz", "from-memory", FALKE_2006),
    ("K-41", "D2", "391016406.21", "0.12", "MHz", "from-memory", FALKE_2006),
    ("Rb-85", "D1", "377107385.690", "0.046", "MHz", "from-memory", BANERJEE_2004),
    ("Rb-85", "D2", "384230406.373", "0.014", "MHz", "from-memory", BARWOOD_1991),
    ("Rb-87", "D1", "377107463.380", "0.011", "MHz", "from-memory", MARIC_2008),
    ("Rb-87", "D2", "384230484.4685", "0.0062", "MHz", "from-memory", YE_1996),
    ("Cs-133", "D1", "335116048748.1", "2.4", "kHz", "published",
     GERGINOV_2006 + " (read in the abstract: f_D1 = 335 116 048 748.1(2.4) kHz)"),
    ("Cs-133", "D2", "351725718.4744", "0.0051", "MHz", "from-memory", GERGINOV_2004),
]

# NIST ASD np levels of the natural element as in levels-<atom>.csv (cm-1, from memory): check D.
ASD_P = {"Li": ("14903.66", "14904.00"), "Na": ("16956.17025", "16973.36619"), "K": ("12985.185724", "13042.896027"),
         "Rb": ("12578.950", "12816.545"), "Cs": ("11178.26815870", "11732.3071041")}

# ---------------------------------------------------------------------------------------------
# Hyperfine constants, MHz: (species, level, A, dA, B, dB, provenance, source).  B is empty for J = 1/2.
# ---------------------------------------------------------------------------------------------
HYPERFINE = [
    ("Li-6", "2s 2S1/2", "152.1368407", "0.0000020", "", "", "from-memory", ARIMONDO_1977),
    ("Li-6", "2p 2P1/2", "17.386", "0.031", "", "", "from-memory", ARIMONDO_1977),
    ("Li-6", "2p 2P3/2", "-1.155", "0.008", "-0.10", "0.14", "from-memory", ARIMONDO_1977),
    ("Li-7", "2s 2S1/2", "401.7520433", "0.0000005", "", "", "from-memory", ARIMONDO_1977),
    ("Li-7", "2p 2P1/2", "45.914", "0.025", "", "", "from-memory", ARIMONDO_1977),
    ("Li-7", "2p 2P3/2", "-3.055", "0.014", "-0.221", "0.029", "from-memory", ARIMONDO_1977),
    ("Na-23", "3s 2S1/2", "885.8130644", "0.0000005", "", "", "from-memory", ARIMONDO_1977),
    ("Na-23", "3p 2P1/2", "94.44", "0.13", "", "", "from-memory", WIJNGAARDEN_1994),
    ("Na-23", "3p 2P3/2", "18.534", "0.015", "2.724", "0.030", "from-memory", YEI_1993),
    ("K-39", "4s 2S1/2", "230.8598601", "0.0000003", "", "", "from-memory", ARIMONDO_1977),
    ("K-39", "4p 2P1/2", "27.775", "0.042", "", "", "from-memory", FALKE_2006),
    ("K-39", "4p 2P3/2", "6.093", "0.025", "2.786", "0.071", "from-memory", ARIMONDO_1977),
    ("K-40", "4s 2S1/2", "-285.7308", "0.0024", "", "", "from-memory", ARIMONDO_1977),
    ("K-40", "4p 2P1/2", "-34.523", "0.025", "", "", "from-memory", FALKE_2006),
    ("K-40", "4p 2P3/2", "-7.585", "0.010", "-3.445", "0.090", "from-memory", FALKE_2006),
    ("K-41", "4s 2S1/2", "127.0069352", "0.0000006", "", "", "from-memory", ARIMONDO_1977),
    ("K-41", "4p 2P1/2", "15.245", "0.042", "", "", "from-memory", FALKE_2006),
    ("K-41", "4p 2P3/2", "3.363", "0.025", "3.351", "0.071", "from-memory", ARIMONDO_1977),
    ("Rb-85", "5s 2S1/2", "1011.910813", "0.000002", "", "", "from-memory", ARIMONDO_1977),
    ("Rb-85", "5p 2P1/2", "120.527", "0.056", "", "", "from-memory", BARWOOD_1991),
    ("Rb-85", "5p 2P3/2", "25.0020", "0.0099", "25.790", "0.093", "from-memory", BARWOOD_1991),
    ("Rb-87", "5s 2S1/2", "3417.34130545215", "0.00000000005", "", "", "from-memory", BIZE_1999),
    ("Rb-87", "5p 2P1/2", "408.328", "0.015", "", "", "from-memory", BARWOOD_1991),
    ("Rb-87", "5p 2P3/2", "84.7185", "0.0020", "12.4965", "0.0037", "from-memory", YE_1996),
    ("Cs-133", "6s 2S1/2", "2298.1579425", "0", "", "", "published", SI_SECOND + "; A = 9 192.631 770 MHz / 4"),
    ("Cs-133", "6p 2P1/2", "291.9309", "0.0012", "", "", "published",
     GERGINOV_2006 + " (read in the abstract: 6p 2P1/2 splitting 1 167 723.6(4.8) kHz; A = splitting / 4)"),
    ("Cs-133", "6p 2P3/2", "50.28827", "0.00023", "-0.4934", "0.0017", "from-memory", GERGINOV_2003),
    # Cs 7p: lasers at 459 nm (6s - 7p1/2) and 455 nm (6s - 7p3/2) lock to these F' levels; without rows here
    # the levels took the Rydberg series' n*^-3-scaled constants of rydberg-hyperfine.csv (A 3.7 % and 9 % high).
    ("Cs-133", "7p 2P1/2", "94.38", "0.06", "", "", "published",
     CS_7P_2022 + " (authors not read; read in the abstract: A of the 7P1/2 level 94.38(6) MHz)"),
    ("Cs-133", "7p 2P3/2", "16.605", "0.006", "-0.15", "0.03", "from-memory", ARIMONDO_1977),
    # low d levels of ladder and two-photon excitation (issue 17): Rb 5p3/2 - 4d at 1529 nm, 5s - 4d3/2 two-photon
    # via 5p1/2 (795 nm + 1476 nm); Cs 6s - 6d two-photon, 6p3/2 - 6d5/2 at 917 nm.  Only values read in an
    # abstract; Rb 4d5/2, Rb 5d, Rb-87 4d and Cs 5d were not found in a source read here and are left out.
    ("Rb-85", "4d 2D3/2", "7.419", "0.035", "4.19", "0.19", "published",
     DUSPAYEV_2023 + " (read in the abstract: A = 7.419(35) MHz and B = 4.19(19) MHz from the hyperfine intervals "
     "of the two-photon 5S1/2 - 4D3/2 transition)"),
    ("Cs-133", "6d 2D3/2", "16.34", "0.05", "-0.1", "0.3", "published",
     KORTYNA_2005 + " (read in the abstract: 6d 2D3/2 A = 16.34 +- 0.05 MHz and B = -0.1 +- 0.3 MHz)"),
    ("Cs-133", "6d 2D5/2", "-4.66", "0.04", "0.9", "0.6", "published",
     KORTYNA_2005 + " (read in the abstract: 6d 2D5/2 A = -4.66 +- 0.04 MHz and B = 0.9 +- 0.6 MHz)"),
    # Rb 6s (5p - 6s at 1324 and 1367 nm; 5s - 6s two-photon at 993 nm): read in the abstract, which also reports
    # a hyperfine anomaly difference 87d85 = -0.0036(2) between the two isotopes' 6s constants
    ("Rb-85", "6s 2S1/2", "239.18", "0.03", "", "", "published",
     PEREZ_GALVAN_2008 + " (read in the abstract: A = 239.18(03) MHz for 85Rb)"),
    ("Rb-87", "6s 2S1/2", "807.66", "0.08", "", "", "published",
     PEREZ_GALVAN_2008 + " (read in the abstract: A = 807.66(08) MHz for 87Rb)"),
]

# check S of the low d levels: a second measurement of the same level, as read (value, uncertainty, source).
SECOND_D = {
    ("Cs-133", "6d 2D3/2"): ("16.3", "0.15", None, None, TAI_1975 + " (B < 8 MHz in size)"),
    ("Cs-133", "6d 2D5/2"): ("-4.69", "0.04", "0.2", "0.7", GEORGIADES_1994),
}


# Where the from-memory digits were recalled from: the alkali data compilations that tabulate these
# measurements (standard references; their titles and revisions were found, their tables not read).  They
# tabulate the D lines and the ground and first p levels only; a level above those (Cs 7p) was recalled from
# the table of the review it cites.
RECALLED_FROM = {
    "Na-23": "D. A. Steck, Sodium D Line Data (revision 2.0.1, 2008)",
    "K-39": "T. G. Tiecke, Properties of Potassium (v1.02, 2011)",
    "K-40": "T. G. Tiecke, Properties of Potassium (v1.02, 2011)",
    "K-41": "T. G. Tiecke, Properties of Potassium (v1.02, 2011)",
    "Rb-85": "D. A. Steck, Rubidium 85 D Line Data (revision 2.1.6, 2013)",
    "Rb-87": "D. A. Steck, Rubidium 87 D Line Data (revision 2.1.5, 2015)",
    "Cs-133": "D. A. Steck, Cesium D Line Data",
}


# n of the ground level (= n of the first p levels) per element: the levels the compilations tabulate.
GROUND_N = {"Li": 2, "Na": 3, "K": 4, "Rb": 5, "Cs": 6}


def recalled(species, provenance, source, level=None):
    """The source text of a row; for a from-memory row, also the compilation its digits were recalled as in."""
    if provenance != "from-memory" or species not in RECALLED_FROM or source.startswith("NIST"):
        return source
    if level is not None and int(level.split()[0][:-1]) != GROUND_N[species.split("-")[0]]:
        return source + " (digits recalled from its table; the attribution is recalled too)"
    return source + " (digits recalled as tabulated in " + RECALLED_FROM[species] + "; the attribution to this " \
                    "measurement is recalled too)"


def to_mhz(value, unit):
    v = Decimal(value)
    if unit == "MHz":
        return v
    if unit == "kHz":
        return v / 1000
    if unit == "cm-1":
        return v * C_MHZ_PER_CM
    raise ValueError(unit)


def d_line(species, line):
    for s, l, v, u, unit, prov, src in D_LINES:
        if s == species and l == line:
            return to_mhz(v, unit)
    raise KeyError((species, line))


def spin(species):
    return NUCLEI[species][0]


def g_nuclear(species):
    i, mu = NUCLEI[species]
    return mu / i


def casimir(a, b, i, j, f):
    """Hyperfine energy of level F (MHz): A K/2 + B [3/2 K(K+1) - 2 I(I+1) J(J+1)] / [4 I(2I-1) J(2J-1)]."""
    k = f * (f + 1) - i * (i + 1) - j * (j + 1)
    e = a * k / 2
    if b and i >= 1 and j >= 1:
        e += b * (1.5 * k * (k + 1) - 2 * i * (i + 1) * j * (j + 1)) / (4 * i * (2 * i - 1) * j * (2 * j - 1))
    return e


def splittings(species, level):
    for s, lv, a, da, b, db, prov, src in HYPERFINE:
        if s == species and lv == level:
            i = spin(species)
            j = int(level[-3]) / 2  # 2J from the label: 1/2, 3/2 or 5/2
            fs = [abs(i - j) + k for k in range(int(round(i + j - abs(i - j))) + 1)]
            e = [casimir(float(a), float(b) if b else 0.0, i, j, f) for f in fs]
            return fs, e
    raise KeyError((species, level))


R_INF_PER_CM = 109737.31568160  # CODATA 2018 (as make_rydberg_data.py)
ELECTRON_MASS_U = 5.48579909065e-4  # CODATA 2018 (as make_rydberg_data.py)


def atomic_mass_u(species):
    """The atomic mass of ../nuclear/isotopes.csv (AME2020)."""
    symbol, a = species.split("-")
    with open("../nuclear/isotopes.csv") as f:
        for row in f:
            cells = row.strip().split(",")
            if not row.startswith("#") and len(cells) > 3 and cells[1] == a and cells[2] == symbol:
                return float(cells[3])
    raise KeyError(species)


def n_star(species, level):
    """n* = sqrt(R_M / (E_limit - E)) of a level of levels-<atom>.csv, with quantum-defects-<atom>.csv's limit."""
    atom = species.lower()
    limit = None
    with open("quantum-defects-%s.csv" % atom) as f:
        for row in f:
            if row.startswith("# limit: "):
                limit = float(row.split()[2])
    energy = None
    with open("levels-%s.csv" % atom) as f:
        for row in f:
            cells = row.split(",")
            if len(cells) > 2 and cells[1] == level:
                energy = float(cells[2])
    core = atomic_mass_u(species) - ELECTRON_MASS_U
    r_m = R_INF_PER_CM / (1.0 + ELECTRON_MASS_U / core)
    return (r_m / (limit - energy)) ** 0.5


def main():
    report = ["# Checks of d-lines.csv and hyperfine-constants.csv, written by make_d_lines.py (see its docstring)"]
    checked = {}
    # check D: fine structure against the ASD levels
    for species in ["Li-6", "Li-7", "Na-23", "K-39", "K-40", "K-41", "Rb-85", "Rb-87", "Cs-133"]:
        symbol = species.split("-")[0]
        fs = d_line(species, "D2") - d_line(species, "D1")
        p12, p32 = ASD_P[symbol]
        asd = (Decimal(p32) - Decimal(p12)) * C_MHZ_PER_CM
        last = max(Decimal(1).scaleb(Decimal(p12).as_tuple().exponent),
                   Decimal(1).scaleb(Decimal(p32).as_tuple().exponent)) * C_MHZ_PER_CM
        text = "check D: D2 - D1 = %.3f MHz; the ASD levels' fine structure %.3f MHz (last digit %.3g MHz): %+.3f MHz" % (
            fs, asd, last, fs - asd)
        report.append("%s %s" % (species, text))
        for line in ("D1", "D2"):
            level = Decimal(ASD_P[symbol][0 if line == "D1" else 1]) * C_MHZ_PER_CM
            extra = "; the ASD natural-element level %s: %+.1f MHz" % ("np 2P1/2" if line == "D1" else "np 2P3/2",
                                                                        d_line(species, line) - level)
            checked[(species, line)] = [text + extra]
    # check I: isotope shifts of D1 and D2
    for heavy, light, published in [("Li-7", "Li-6", ("D1", Decimal("10533.800"), HUANG_2018.split(",")[0] +
                                                      " (thesis, 2018): D1 isotope shift 10533.800(15) MHz")),
                                    ("K-40", "K-39", None), ("K-41", "K-39", None), ("Rb-87", "Rb-85", None)]:
        i1 = d_line(heavy, "D1") - d_line(light, "D1")
        i2 = d_line(heavy, "D2") - d_line(light, "D2")
        text = "check I: isotope shift %s - %s: D1 %.3f MHz, D2 %.3f MHz, D2 - D1 %+.3f MHz" % (heavy, light, i1, i2,
                                                                                               i2 - i1)
        if published is not None:
            text += "; %s: D1 %+.3f MHz from it" % (published[2], i1 - published[1])
        report.append(text)
        for s in (heavy, light):
            for line in ("D1", "D2"):
                checked[(s, line)].append(text)
    # check N: natural-element centroid against the ASD level
    for symbol, shares in [("K", {"K-39": Decimal("0.932581"), "K-40": Decimal("0.000117"), "K-41": Decimal("0.067302")}),
                           ("Rb", {"Rb-85": Decimal("0.7217"), "Rb-87": Decimal("0.2783")})]:
        for k, line in enumerate(("D1", "D2")):
            mean = sum(w * d_line(sp, line) for sp, w in shares.items()) / sum(shares.values())
            asd = Decimal(ASD_P[symbol][k]) * C_MHZ_PER_CM
            text = "check N: abundance-weighted %s %s %.3f MHz against the ASD natural-element level %.3f MHz: %+.3f MHz" % (
                symbol, line, mean, asd, mean - asd)
            report.append(text)
            for sp in shares:
                checked[(sp, line)].append(text)
    # check S: second measurements
    udem = Decimal("335116048807") / 1000
    text = "check S: %s, read in the abstract: 335 116 048 807(41) kHz, %+.3f MHz from this value" % (
        UDEM_1999.split(", doi")[0], udem - d_line("Cs-133", "D1"))
    checked[("Cs-133", "D1")].append(text)
    report.append("Cs-133 D1 " + text)
    k39 = Decimal("391015578.040")
    text = ("check S: %s differs by %+.1f MHz; the three-isotope comb measurement of Falke et al. found the "
            "earlier cavity values off by several 100 MHz (their conference abstract, DPG Frankfurt 2006, A 4.3, "
            "read), so this value is not a check but a known disagreement" % (
                BANERJEE_K_2004.split(" (abstract")[0], k39 - d_line("K-39", "D2")))
    checked[("K-39", "D2")].append(text)
    report.append("K-39 D2 " + text)
    # Li fine structure against the review
    for species, fs_pub in [("Li-6", Decimal("10052.954")), ("Li-7", Decimal("10053.154"))]:
        fs = d_line(species, "D2") - d_line(species, "D1")
        text = "check S: fine structure %.3f MHz against %s: %+.3f MHz (the 2011 comb measurement is newer)" % (
            fs, LI_FS_REVIEW.split(" (abstract")[0], fs - fs_pub)
        checked[(species, "D2")].append(text)
        report.append(species + " " + text)
    # hyperfine checks
    hf_checked = {}
    for s, lv, a, da, b, db, prov, src in HYPERFINE:
        fs, e = splittings(s, lv)
        gaps = ["F=%s-%s %.4f" % (fmt_f(fs[k + 1]), fmt_f(fs[k]), e[k + 1] - e[k]) for k in range(len(fs) - 1)]
        hf_checked[(s, lv)] = ["splittings (MHz): " + ", ".join(gaps)]
    # check R: levels above the first p against the first p levels of their series
    for s, lv, a, da, b, db, prov, src in HYPERFINE:
        n = int(lv.split()[0][:-1])
        if n == GROUND_N[s.split("-")[0]] or not lv.split()[0].endswith("p"):
            continue
        first = [h for h in HYPERFINE if h[0] == s and h[1] == "%dp%s" % (GROUND_N[s.split("-")[0]], lv[len(str(n)) + 1:])][0]
        scaled = float(a) * n_star(s, lv) ** 3
        scaled_first = float(first[2]) * n_star(s, first[1]) ** 3
        text = "check R: A n*^3 = %.1f MHz (n* %.5f) against %.1f MHz of %s (n* %.5f): %+.1f %%" % (
            scaled, n_star(s, lv), scaled_first, first[1], n_star(s, first[1]), 100 * (scaled / scaled_first - 1))
        hf_checked[(s, lv)].append(text)
        report.append(s + " " + lv + " " + text)
    for s, lv, a, da, b, db, prov, src in HYPERFINE:
        n = int(lv.split()[0][:-1])
        if n == GROUND_N[s.split("-")[0]] or not lv.endswith("P1/2"):
            continue
        lv32 = lv.replace("P1/2", "P3/2")
        upper = [h for h in HYPERFINE if h[0] == s and h[1] == lv32]
        if not upper:
            continue
        g = "%dp" % GROUND_N[s.split("-")[0]]
        ratio = float(a) / float(upper[0][2])
        ratio_first = float([h for h in HYPERFINE if h[0] == s and h[1] == g + " 2P1/2"][0][2]) / float(
            [h for h in HYPERFINE if h[0] == s and h[1] == g + " 2P3/2"][0][2])
        text = "check R: A(%s)/A(%s) = %.3f against A(%s 2P1/2)/A(%s 2P3/2) = %.3f: %+.1f %%" % (
            lv, lv32, ratio, g, g, ratio_first, 100 * (ratio / ratio_first - 1))
        hf_checked[(s, lv)].append(text)
        hf_checked[(s, lv32)].append(text)
        report.append(s + " " + text)
    # check S of the low d levels: against a second measurement of the same level
    for (s, lv), (a2, da2, b2, db2, name) in sorted(SECOND_D.items()):
        rows = [h for h in HYPERFINE if h[0] == s and h[1] == lv]
        if not rows:
            continue
        row = rows[0]
        da = (float(row[3]) ** 2 + float(da2) ** 2) ** 0.5
        text = "check S: A %s MHz against %s(%s) MHz of %s: %+.3f MHz (%.1f combined standard uncertainties)" % (
            row[2], a2, da2, name, float(row[2]) - float(a2),
            abs(float(row[2]) - float(a2)) / da)
        if b2 is not None:
            db = (float(row[5]) ** 2 + float(db2) ** 2) ** 0.5
            text += "; B %s MHz against %s(%s) MHz: %+.2f MHz (%.1f)" % (row[4], b2, db2, float(row[4]) - float(b2),
                                                                        abs(float(row[4]) - float(b2)) / db)
        hf_checked[(s, lv)].append(text)
        report.append(s + " " + lv + " " + text)
    pairs = [("Li-7", "Li-6"), ("K-40", "K-39"), ("K-41", "K-39"), ("Rb-87", "Rb-85")]
    for x, y in pairs:
        gratio = g_nuclear(x) / g_nuclear(y)
        for lv_x in [h for h in HYPERFINE if h[0] == x]:
            lv_y = [h for h in HYPERFINE if h[0] == y and h[1] == lv_x[1]][0]
            ratio = float(lv_x[2]) / float(lv_y[2])
            text = "check A: A(%s)/A(%s) = %.5f against g_I ratio %.5f: anomaly %+.2f %%" % (
                x, y, ratio, gratio, 100 * (ratio / gratio - 1))
            hf_checked[(x, lv_x[1])].append(text)
            hf_checked[(y, lv_x[1])].append(text)
            report.append(text + " (" + lv_x[1] + ")")
    for s, lv, published, name in [
            ("Cs-133", "6s 2S1/2", 9192.631770, "the SI second: 9 192.631 770 MHz exactly"),
            ("Rb-87", "5s 2S1/2", 6834.682610904, BIZE_1999.split(", doi")[0] + ": 6 834.682 610 904 29(9) MHz "
             "(from memory; the same digits as the Rb-87 limit note of quantum-defects-rb-87.csv)"),
            ("Li-6", "2p 2P1/2", 26.108, "Huang 2018 thesis (abstract read): 26.108(9) MHz"),
            ("Li-7", "2p 2P1/2", 91.873, "Huang 2018 thesis (abstract read): 91.873(5) MHz"),
            ("Cs-133", "6p 2P1/2", 1167.688, UDEM_1999.split(", doi")[0] + " (abstract read): 1 167 688(81) kHz")]:
        fs, e = splittings(s, lv)
        text = "check H: splitting %.6f MHz against %s: %+.4f MHz" % (e[-1] - e[0], name, e[-1] - e[0] - published)
        hf_checked[(s, lv)].append(text)
        report.append(s + " " + lv + " " + text)
    # d-lines.csv
    out = ["# ritzwerk-d-lines 1",
           "# id: d-lines",
           "# title: Hyperfine-free centroids of the alkali D1 and D2 lines, per isotope",
           "# source: the measurement named per row",
           "# provenance: from-memory",
           "# version: 2006-2011 measurements; Cs-133 D1 2006",
           "# note: frequency and uncertainty are stored with the digits and in the unit their source prints "
           "(MHz, kHz; cm-1 for the one value taken from a wavenumber table), never through a rounded unit; "
           "refdata converts them exactly (c = 299 792 458 m/s) to the np 2P1/2 and np 2P3/2 levels above the "
           "ground level's hyperfine centroid; column provenance says per row whether the digits were read in "
           "the source (published) or recalled (from-memory); column checked says how each was checked "
           "(d-line-checks.txt; written by make_d_lines.py)",
           "species,line,frequency,uncertainty,unit,provenance,source,checked"]
    for s, l, v, u, unit, prov, src in D_LINES:
        out.append(",".join([s + " I", l, v, u, unit, prov, recalled(s, prov, src).replace(",", ";"),
                             "; ".join(checked[(s, l)]).replace(",", ";")]))
    with open("d-lines.csv", "w") as f:
        f.write("\n".join(out) + "\n")
    hf = ["# ritzwerk-hyperfine 1",
          "# id: hyperfine-constants",
          "# title: Magnetic-dipole (A) and electric-quadrupole (B) hyperfine constants of the alkali ground and "
          "first p levels, of the Cs-133 7p levels and of the low d levels of ladder and two-photon excitation "
          "read in an abstract, per isotope",
          "# source: " + ARIMONDO_1977 + ", and the later measurements named per row",
          "# provenance: from-memory",
          "# version: 1977-2023",
          "# unit: MHz",
          "# note: A and B in MHz (energy / h) with the digits their source prints; B only for J > 1/2; the "
          "hyperfine energy of level F is A K/2 + B (3K(K+1)/2 - 2I(I+1)J(J+1)) / (4I(2I-1)J(2J-1)), K = "
          "F(F+1) - I(I+1) - J(J+1) (Arimondo et al. 1977, Eq. 2.4 as recalled; common practice); a d level's "
          "constants here are also measured levels of its Rydberg series for the n*^-3 law's error "
          "(RydbergHyperfine.measuredLevels); column "
          "checked gives the splittings and the checks (d-line-checks.txt; written by make_d_lines.py)",
          "species,level,a,a-uncertainty,b,b-uncertainty,provenance,source,checked"]
    for s, lv, a, da, b, db, prov, src in HYPERFINE:
        hf.append(",".join([s + " I", lv, a, da, b, db, prov, recalled(s, prov, src, lv).replace(",", ";"),
                            "; ".join(hf_checked[(s, lv)]).replace(",", ";")]))
    with open("hyperfine-constants.csv", "w") as f:
        f.write("\n".join(hf) + "\n")
    with open("d-line-checks.txt", "w") as f:
        f.write("\n".join(report) + "\n")


def fmt_f(f):
    return str(int(f)) if f == int(f) else "%d/2" % int(2 * f)


if __name__ == "__main__":
    main()
