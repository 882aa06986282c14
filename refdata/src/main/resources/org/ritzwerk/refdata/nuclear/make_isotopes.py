#!/usr/bin/python3
"""Generate isotopes.csv and elements.csv (nuclear reference data for Ritzwerk).

Deterministic: the output depends only on this file and on three Debian
packages, whose versions are checked and written into the CSV headers:

    apt-get install bodr python3-qcelemental python3-periodictable
    /usr/bin/python3 make_isotopes.py          # writes both CSVs beside this file
    /usr/bin/python3 make_isotopes.py --check  # regenerate in memory, diff against files

What comes from where
---------------------
* Debian bodr (Blue Obelisk Data Repository 10), /usr/share/bodr/isotopes.xml:
  ground-state spin I (bo:spin, parity sign stripped); elements.xml: names.
* Debian python3-qcelemental, qcelemental/data/nist_2018_codata.py (CODATA 2018):
  magnetic moments of p, d, t, helion and the p and d rms charge radii.
* Debian python3-periodictable: names of Z = 113, 115, 117, 118 (bodr 10
  still has the systematic placeholder names there).
* QUOTED below (no Debian package ships them): AME2020 atomic masses,
  Stone 2019 moments and Angeli & Marinova 2013 radii, transcribed from a
  public tabular extract of the IAEA LiveChart of Nuclides (IAEA Nuclear Data
  Section), which carries these evaluations.  See the header written by
  header_lines() for every citation and check.

Every file written starts with the standard header keys of Ritzwerk's data
files (# id, # title, # source, # provenance, # version), which NuclearData
reads and validates.  most-abundant.csv is not written here (see its header).

The script cross-checks the quoted masses against bodr's (older, AME2003-era)
masses and the quoted moments against bodr's moments, and prints every
disagreement; it never silently changes a value.
"""

import csv
import io
import os
import subprocess
import sys
import xml.etree.ElementTree as ET
from decimal import Decimal

HERE = os.path.dirname(os.path.abspath(__file__))
CML = "{http://www.xml-cml.org/schema}"
XML_LANG = "{http://www.w3.org/XML/1998/namespace}lang"

EXPECTED_PACKAGES = {
    "bodr": "10-2",
    "python3-qcelemental": "0.25.1+dfsg-1",
    "python3-periodictable": "1.6.0-1",
}
BODR_ISOTOPES = "/usr/share/bodr/isotopes.xml"
BODR_ELEMENTS = "/usr/share/bodr/elements.xml"
QCEL_CODATA = "/usr/lib/python3/dist-packages/qcelemental/data/nist_2018_codata.py"

QUOTED_REF = "a public tabular extract of the IAEA LiveChart of Nuclides"

# Isotopes taken from bodr 10 alone (mass, its uncertainty and spin; no moment, no radius):
# Hg-202, the most abundant mercury isotope, so that the built-in Hg I lamp set can be
# synthesised (Doppler widths need the mass); Sr-88, the most abundant strontium isotope, whose
# reduced-mass Rydberg constant the built-in Sr I Rydberg levels (levels/levels-sr-i.csv) use;
# Cd-114, the most abundant cadmium isotope, for the built-in Cd I lamp set.
BODR_ONLY = [(38, 88), (48, 114), (80, 202)]

# ---------------------------------------------------------------------------
# Quoted values.  One line per isotope:
#   z a  mass[micro-u] mass_unc[micro-u]  moment[nm] moment_unc  radius[fm] radius_unc
# '-' = not taken from the quoted file (spin 0: no moment; no radius listed).
# Transcribed from the extract's columns atomic_mass, atomic_mass_uncert,
# magnetic_dipole, magnetic_dipole_uncert, radius, radius_uncert, exactly as
# printed there (the extract drops trailing zeros, e.g. 0.684 with unc 1e-5).
# For 1H, 2H, 3H and 3He the moment, and for 1H and 2H the radius, are NOT
# used from here: CODATA 2018 (Debian python3-qcelemental) replaces them; the
# quoted values are kept only for the record (they are the file's values).
# Masses with A <= 19 and the A = 44..53 block were also compared digit for
# digit with a copy of the AME2020 electronic table mass.mas20: all identical.
# ---------------------------------------------------------------------------
QUOTED = """
1 1   1007825.031898 1.4e-5      2.792847351 9e-9     0.8783 0.0086
1 2   2014101.777844 1.5e-5      0.857438231 5e-9     2.1421 0.0088
1 3   3016049.28132 8e-5         2.97896246 1.4e-8    1.7591 0.0363
2 3   3016029.32197 6e-5         -2.12762531 3e-8     1.9661 0.003
2 4   4002603.25413 1.6e-4       - -                  1.6755 0.0028
3 6   6015122.88742 0.00155      0.822043 3e-6        2.589 0.039
3 7   7016003.43426 0.0045       3.256407 1.2e-5      2.444 0.042
4 9   9012183.062 0.082          -1.17743 5e-6        2.519 0.012
5 10  10012936.862 0.016         1.8004636 8e-7       2.4277 0.0499
5 11  11009305.166 0.013         2.688378 1e-6        2.406 0.0294
6 12  12000000 0                 - -                  2.4702 0.0022
6 13  13003354.83534 2.5e-4      0.702369 4e-6        2.4614 0.0034
7 14  14003074.00425 2.4e-4      0.403573 2e-6        2.5582 0.007
7 15  15000108.89827 6.2e-4      -0.2830569 1.4e-6    2.6058 0.008
8 16  15994914.61926 3.2e-4      - -                  2.6991 0.0052
8 17  16999131.75595 6.9e-4      -1.893543 1e-5       2.6932 0.0075
8 18  17999159.61214 6.9e-4      - -                  2.7726 0.0056
9 19  18998403.16207 8.8e-4      2.628321 4e-6        2.8976 0.0025
10 20 19992440.17525 0.00165     - -                  3.0055 0.0021
10 21 20993846.685 0.041         -0.6617 3e-5         2.9695 0.0033
10 22 21991385.113 0.018         - -                  2.9525 0.004
11 23 22989769.28195 0.00194     2.2175 3e-5         2.9936 0.0021
12 24 23985041.689 0.013         - -                  3.057 0.0016
12 25 24985836.966 0.05          -0.85533 3e-5        3.0284 0.0022
12 26 25982592.972 0.031         - -                  3.0337 0.0018
13 27 26981538.408 0.05          3.6407 2e-5          3.061 0.0031
14 28 27976926.53442 5.5e-4      - -                  3.1224 0.0024
14 29 28976494.66434 6e-4        -0.555052 3e-6       3.1176 0.0052
14 30 29973770.137 0.023         - -                  3.1336 0.004
15 31 30973761.99768 8e-4        1.130925 5e-6        3.1889 0.0019
16 32 31972071.17354 0.00141     - -                  3.2611 0.0018
16 33 32971458.90862 0.00144     0.64325 2e-5         - -
16 34 33967867.011 0.047         - -                  3.2847 0.0021
16 36 35967080.692 0.201         - -                  3.2985 0.0024
17 35 34968852.694 0.038         0.8217 2e-5          3.3654 0.0191
17 37 36965902.573 0.055         0.684 1e-5           3.384 0.017
18 36 35967545.106 0.028         - -                  3.3905 0.0023
18 38 37962732.102 0.209         - -                  3.4028 0.0019
18 40 39962383.12204 0.00234     - -                  3.4274 0.0026
19 39 38963706.48482 0.00489     0.39147 8e-6         3.4349 0.0019
19 40 39963998.165 0.06          -1.29797 3e-5        3.4381 0.0028
19 41 40961825.25611 0.00403     0.214872 5e-6       3.4518 0.0055
20 40 39962590.85 0.022          - -                  3.4776 0.0019
20 42 41958617.78 0.159          - -                  3.5081 0.0021
20 43 42958766.381 0.244         -1.31733 6e-5        3.4954 0.0019
20 44 43955481.489 0.348         - -                  3.5179 0.0021
20 46 45953687.726 2.398         - -                  3.4953 0.002
20 48 47952522.654 0.018         - -                  3.4771 0.002
21 45 44955907.051 0.712         4.754 8e-5           3.5459 0.0025
22 46 45952626.356 0.097         - -                  3.607 0.0022
22 47 46951757.491 0.085         -0.78814 1.1e-4     3.5962 0.0019
22 48 47947940.677 0.079         - -                  3.5921 0.0017
22 49 48947864.391 0.084         -1.1037 1.4e-4      3.5733 0.0021
22 50 49944785.622 0.088         - -                  3.5704 0.0022
23 50 49947156.681 0.099         3.3442 4e-4          - -
23 51 50943957.664 0.104         5.1464 7e-4          3.6002 0.0022
24 50 49946042.209 0.1           - -                  3.6588 0.0065
24 52 51940504.714 0.12          - -                  3.6452 0.0042
24 53 52940646.304 0.124         -0.47431 7e-5        3.6511 0.0075
24 54 53938877.359 0.142         - -                  3.6885 0.0074
25 55 54938043.04 0.279          3.4669 6e-4          3.7057 0.0022
26 54 53939608.189 0.368         - -                  3.6933 0.0019
26 56 55934935.537 0.287         - -                  3.7377 0.0016
26 57 56935391.95 0.287          0.09064 7e-5         3.7532 0.0017
26 58 57933273.575 0.339         - -                  3.7745 0.0014
27 59 58933193.524 0.426         4.615 0.025          3.7875 0.0021
28 58 57935341.65 0.374          - -                  3.7757 0.002
28 60 59930785.129 0.378         - -                  3.8118 0.0016
28 61 60931054.819 0.381         -0.74965 5e-5        3.8225 0.0019
28 62 61928344.753 0.455         - -                  3.8399 0.0021
28 64 63927966.228 0.497         - -                  3.8572 0.0023
29 63 62929597.119 0.457         2.2259 4e-4          3.8823 0.0015
29 65 64927789.476 0.69          2.3844 4e-4          3.9022 0.0014
30 64 63929141.776 0.69          - -                  3.9283 0.0015
30 66 65926033.639 0.798         - -                  3.9491 0.0014
30 67 66927127.422 0.81          0.87485 1.6e-4       3.953 0.0027
30 68 67924844.232 0.835         - -                  3.9658 0.0014
30 70 69925319.175 2.058         - -                  3.9845 0.0019
36 84 83911497.72708 0.0041      - -                  4.1884 0.0022
36 86 85910610.62468 0.00399     - -                  4.1835 0.0021
37 85 84911789.73604 0.00537     1.35306 4e-5         4.2036 0.0024
37 87 86909180.529 0.006         2.75129 8e-5         4.1989 0.0021
54 129 128904780.85742 0.00542   -0.777961 1.6e-5     4.7775 0.005
54 132 131904155.08346 0.00544   - -                  4.7859 0.0048
54 136 135907214.474 0.007       - -                  4.7964 0.0047
55 133 132905451.958 0.008       2.5778 0.0014        4.8041 0.0046
82 208 207976652.005 1.232       - -                  5.5012 0.0013
92 238 238050786.936 1.601       - -                  5.8571 0.0033
"""

# Isotopes whose moment / radius come from CODATA 2018 (qcelemental) instead.
CODATA_MOMENTS = {
    (1, 1): "proton mag. mom. to nuclear magneton ratio",
    (1, 2): "deuteron mag. mom. to nuclear magneton ratio",
    (1, 3): "triton mag. mom. to nuclear magneton ratio",
    (2, 3): "helion mag. mom. to nuclear magneton ratio",
}
CODATA_RADII = {
    (1, 1): "proton rms charge radius",
    (1, 2): "deuteron rms charge radius",
}
# Spins bodr 10 lacks ('?'), supplied from memory and marked as such.
SPIN_FROM_MEMORY = {(20, 46): "0"}  # even-even ground state; NUBASE2020 0+
# Mass differences to bodr's older masses beyond the tolerance that are real
# revisions (all verified directly against AME2020 mass.mas20, see above).
EXPECTED_MASS_DIFFS = {(3, 7), (21, 45), (22, 46), (22, 47), (22, 48), (22, 49), (22, 50)}
# Known errors in bodr 10 moments (sign), found by the cross-check below.
BODR_MOMENT_KNOWN_BAD = {(11, 23), (20, 43)}

COLUMNS = ["z", "a", "symbol", "mass_u", "mass_unc_u", "mass_source", "spin",
           "moment_nm", "moment_unc_nm", "moment_source", "radius_fm",
           "radius_unc_fm", "radius_source"]


def package_versions():
    out = {}
    for pkg in EXPECTED_PACKAGES:
        try:
            v = subprocess.run(["dpkg-query", "-W", "-f=${Version}", pkg],
                               capture_output=True, text=True, check=True).stdout.strip()
        except (subprocess.CalledProcessError, FileNotFoundError):
            v = ""
        if not v:
            sys.exit(f"Debian package {pkg} is not installed: "
                     f"apt-get install {' '.join(EXPECTED_PACKAGES)}")
        if v != EXPECTED_PACKAGES[pkg]:
            print(f"WARNING: {pkg} is {v}, this table was made with "
                  f"{EXPECTED_PACKAGES[pkg]}; check the diff of the output", file=sys.stderr)
        out[pkg] = v
    return out


def dec_str(d):
    """Plain decimal string without exponent and without trailing zeros."""
    s = format(d.normalize(), "f")
    if "." in s:
        s = s.rstrip("0").rstrip(".")
    return s if s not in ("-0", "") else "0"


def unc_str(d):
    """Uncertainty: plain decimal if >= 1e-4, else mantissa e exponent."""
    if d == 0:
        return "0"
    if d >= Decimal("1e-4"):
        return dec_str(d)
    sign, digits, exp = d.normalize().as_tuple()
    mant = "".join(map(str, digits))
    e = exp + len(mant) - 1
    m = mant[0] + ("." + mant[1:] if len(mant) > 1 else "")
    return f"{m}e{e}"


def _dec_or_none(text):
    try:
        return Decimal(text) if text else None
    except ArithmeticError:  # a few bodr entries are not plain numbers
        return None


def read_bodr_isotopes():
    iso = {}
    for el in ET.parse(BODR_ISOTOPES).getroot().iter(CML + "isotope"):
        d = {s.get("dictRef"): s for s in el.iter(CML + "scalar")}
        z = int(d["bo:atomicNumber"].text)
        a = int(el.get("number"))
        spin = d["bo:spin"].text.strip() if "bo:spin" in d else None
        mom = d["bo:magneticMoment"].text.strip() if "bo:magneticMoment" in d else None
        mass = d["bo:exactMass"] if "bo:exactMass" in d else None
        iso[(z, a)] = {
            "symbol": el.get("elementType"),
            "spin": spin,
            "moment": _dec_or_none(mom),
            "mass": Decimal(mass.text) if mass is not None else None,
            "mass_unc": (Decimal(mass.get("errorValue")) if mass is not None
                         and mass.get("errorValue") else None),
        }
    return iso


def read_bodr_elements():
    names = {}
    for atom in ET.parse(BODR_ELEMENTS).getroot().iter(CML + "atom"):
        sym = name = z = None
        for lab in atom.iter(CML + "label"):
            if lab.get("dictRef") == "bo:symbol":
                sym = lab.get("value")
            if lab.get("dictRef") == "bo:name" and lab.get(XML_LANG) == "en":
                name = lab.get("value")
        for sc in atom.iter(CML + "scalar"):
            if sc.get("dictRef") == "bo:atomicNumber":
                z = int(sc.text)
        if z:
            names[z] = (sym, name)
    return names


def read_codata():
    ns = {}
    with open(QCEL_CODATA, encoding="utf-8") as f:
        exec(compile(f.read(), QCEL_CODATA, "exec"), ns)  # plain data module
    consts = ns["nist_2018_codata"]["constants"]

    def get(key):
        c = consts[key]
        val = Decimal(c["value"].replace(" ", ""))
        unc = Decimal(c["uncertainty"].replace(" ", ""))
        if c["unit"] == "m":  # radii: m -> fm
            val, unc = val * Decimal("1e15"), unc * Decimal("1e15")
        return val, unc
    return get


def spin_plain(s):
    s = s.strip()
    if s.endswith(("+", "-")):
        s = s[:-1]
    if not s or s == "?" or not all(ch.isdigit() or ch == "/" for ch in s):
        return None
    return s


def build_rows():
    bodr = read_bodr_isotopes()
    codata = read_codata()
    rows, notes = [], []
    for line in QUOTED.strip().splitlines():
        f = line.split()
        z, a = int(f[0]), int(f[1])
        m_uu, mu_uu = Decimal(f[2]), Decimal(f[3])
        mom, momu = f[4], f[5]
        rad, radu = f[6], f[7]
        b = bodr[(z, a)]
        symbol = b["symbol"]

        mass = m_uu * Decimal("1e-6")
        mass_unc = mu_uu * Decimal("1e-6")
        # cross-check against bodr (AME2003-era) masses
        if b["mass"] is not None:
            tol = max(Decimal("5") * (b["mass_unc"] or 0), Decimal("1e-6"))
            if abs(mass - b["mass"]) > tol and (z, a) not in EXPECTED_MASS_DIFFS:
                notes.append(f"mass {z}-{a}: quoted {mass} vs bodr {b['mass']}")

        spin = spin_plain(b["spin"] or "")
        spin_key = "bodr10"
        if spin is None:
            spin = SPIN_FROM_MEMORY[(z, a)]
            spin_key = "from-memory:NUBASE2020"

        if spin == "0":
            if mom != "-":
                notes.append(f"spin-0 {z}-{a} has a quoted moment {mom}: dropped")
            m_val = m_unc = ""
            mom_src = f"spin={spin_key}"
        elif (z, a) in CODATA_MOMENTS:
            v, u = codata(CODATA_MOMENTS[(z, a)])
            m_val, m_unc = dec_str(v), unc_str(u)
            mom_src = f"CODATA2018;spin={spin_key}"
        else:
            if mom == "-":
                sys.exit(f"no moment for {z}-{a} with spin {spin}")
            m_val, m_unc = dec_str(Decimal(mom)), unc_str(Decimal(momu))
            mom_src = f"Stone2019;spin={spin_key}"
        if m_val and b["moment"] is not None and (z, a) not in BODR_MOMENT_KNOWN_BAD:
            d = abs(Decimal(m_val) - b["moment"])
            if d > Decimal("0.02") * abs(b["moment"]) + Decimal("0.001"):
                notes.append(f"moment {z}-{a}: {m_val} vs bodr {b['moment']}")
        if m_val and b["moment"] is not None and (z, a) in BODR_MOMENT_KNOWN_BAD:
            if (Decimal(m_val) > 0) == (b["moment"] > 0):
                notes.append(f"moment {z}-{a}: listed as bodr sign error but signs agree")

        if (z, a) in CODATA_RADII:
            v, u = codata(CODATA_RADII[(z, a)])
            r_val, r_unc, r_src = dec_str(v), unc_str(u), "CODATA2018"
        elif rad == "-":
            r_val = r_unc = r_src = ""
        else:
            r_val, r_unc, r_src = dec_str(Decimal(rad)), unc_str(Decimal(radu)), "Angeli2013"

        rows.append([str(z), str(a), symbol, dec_str(mass), unc_str(mass_unc), "AME2020",
                     spin, m_val, m_unc, mom_src, r_val, r_unc, r_src])
    # Isotopes the quoted extract was not read for: mass, uncertainty and spin from bodr 10
    # itself (its AME2003-era evaluation; ample for Doppler widths and reduced masses).
    for z, a in BODR_ONLY:
        b = bodr[(z, a)]
        spin = spin_plain(b["spin"] or "")
        if spin != "0":
            sys.exit(f"bodr-only isotope {z}-{a} needs a moment source (spin {spin})")
        rows.append([str(z), str(a), b["symbol"], dec_str(b["mass"]), unc_str(b["mass_unc"]), "bodr10",
                     spin, "", "", "spin=bodr10", "", "", ""])
    rows.sort(key=lambda r: (int(r[0]), int(r[1])))
    return rows, notes


def header_lines(versions, rows):
    n_mem = sum(r[9].count("from-memory") + r[12].count("from-memory") + r[5].count("from-memory")
                for r in rows)
    return f"""\
# id: nuclear-isotopes
# title: Nuclear masses, spins, moments and charge radii of {len(rows)} isotopes
# source: M. Wang et al., Chin. Phys. C 45, 030003 (2021) (AME2020 masses); N. J. Stone, INDC(NDS)-0794 (2019) and CODATA 2018 (moments); I. Angeli and K. P. Marinova, At. Data Nucl. Data Tables 99, 69 (2013) and CODATA 2018 (radii); Blue Obelisk Data Repository 10, Debian package bodr {versions['bodr']} (spins, and the masses of Sr-88, Cd-114 and Hg-202: source key bodr10); the file's source keys say which applies to each value
# provenance: published
# version: 2021 (AME2020; moments 2019; radii 2013; CODATA 2018; bodr 10)
# Ritzwerk nuclear reference data: one row per isotope.
# Generated by make_isotopes.py (beside this file); do not edit by hand.
#
# Columns
#   z              atomic number Z
#   a              mass number A
#   symbol         element symbol
#   mass_u         ATOMIC mass of the neutral atom (electrons included, as AME
#                  tabulates), in unified atomic mass units u
#   mass_unc_u     its standard uncertainty, u (12C: exactly 0 by definition of u)
#   mass_source    source key of the mass
#   spin           nuclear ground-state spin I in units of hbar, as a string
#                  ("0", "1", "1/2", "7/2"); parity not given
#   moment_nm      nuclear magnetic dipole moment in nuclear magnetons mu_N,
#                  with sign; empty for I = 0
#   moment_unc_nm  its standard uncertainty, mu_N
#   moment_source  "<moment key>;spin=<spin key>", or "spin=<spin key>" when I = 0
#   radius_fm      rms nuclear charge radius, fm
#   radius_unc_fm  its standard uncertainty, fm
#   radius_source  source key of the radius
# An EMPTY field means "not available / not applicable" (never 0 in that sense).
# Uncertainties below 1e-4 are written as mantissa e exponent (e.g. 1.4e-11).
#
# Source keys
#   AME2020    M. Wang, W.J. Huang, F.G. Kondev, G. Audi, S. Naimi, "The AME 2020
#              atomic mass evaluation (II)", Chin. Phys. C 45, 030003 (2021)
#              (with W.J. Huang et al., Chin. Phys. C 45, 030002 (2021)).
#              quoted: {QUOTED_REF},
#              columns atomic_mass, atomic_mass_uncert (micro-u).  Checked digit
#              for digit against a copy of the AME2020 electronic table mass.mas20
#              for A <= 19 and 44 <= A <= 53 (32 rows): identical.
#   Stone2019  N.J. Stone, "Table of recommended nuclear magnetic dipole moments:
#              Part I, long-lived states", IAEA report INDC(NDS)-0794 (2019).
#              quoted: {QUOTED_REF},
#              columns magnetic_dipole, magnetic_dipole_uncert.  CAVEAT: that
#              extract does not itself name the evaluation; the attribution to INDC(NDS)-0794 is ours (the
#              LiveChart ground-state moments follow Stone's IAEA tables; the values
#              fit, e.g. 1H +2.792847351(9) there).  Several differ in the 4th-5th
#              digit from older compilations (e.g. 133Cs 2.5778(14) vs 2.582025,
#              87Rb 2.75129(8) vs 2.751818): check against the report before
#              relying on the last digits.
#   Angeli2013 I. Angeli and K.P. Marinova, "Table of experimental nuclear ground
#              state charge radii: an update", At. Data Nucl. Data Tables 99, 69
#              (2013).  quoted: {QUOTED_REF},
#              columns radius, radius_uncert (values coincide with the Angeli &
#              Marinova table, e.g. 1H 0.8783(86), 3H 1.7591(363), 208Pb 5.5012(13)).
#   CODATA2018 E. Tiesinga, P.J. Mohr, D.B. Newell, B.N. Taylor, "CODATA recommended
#              values of the fundamental physical constants: 2018", Rev. Mod. Phys.
#              93, 025010 (2021); read from Debian package python3-qcelemental
#              {versions['python3-qcelemental']}, qcelemental/data/nist_2018_codata.py (NIST SRD 121).
#              Used for the moments of 1H (proton), 2H (deuteron), 3H (triton),
#              3He (helion) -- bare-nucleus moments, not shielded -- and for the
#              rms charge radii of 1H (proton, 0.8414(19) fm) and 2H (deuteron).
#              These replace Angeli2013's 1H 0.8783(86) / 2H 2.1421(88), which
#              predate the muonic-hydrogen results that CODATA 2018 includes.
#   bodr10     Blue Obelisk Data Repository release 10, Debian package bodr
#              {versions['bodr']}, /usr/share/bodr/isotopes.xml, field bo:spin (parity
#              stripped).  Used for every spin except where marked from-memory.
#   from-memory:NUBASE2020  value recalled, NOT looked up (F.G. Kondev et al.,
#              "The NUBASE2020 evaluation of nuclear physics properties", Chin.
#              Phys. C 45, 030001 (2021)); needs checking.  Used once: 46Ca I = 0
#              (even-even ground state; bodr 10 gives "?").
#
# How this file was made: make_isotopes.py reads the Debian packages above
# (bodr {versions['bodr']}, python3-qcelemental {versions['python3-qcelemental']}) and the quoted
# values it embeds, cross-checks masses and moments against bodr (bodr 10 has
# the wrong sign for the 23Na and 43Ca moments; those are not used), and writes
# this file.  Coverage: all stable or primordial long-lived isotopes of
# Z = 1..30 (incl. 40K, 48Ca, 50V), plus 3H, 84Kr, 86Kr, 85Rb, 87Rb, 129Xe,
# 132Xe, 136Xe, 133Cs, 208Pb, 238U.  Radius not available in the quoted
# extract: 33S, 50V.  Values marked from-memory: {n_mem}.
"""


def render_isotopes(versions):
    rows, notes = build_rows()
    buf = io.StringIO()
    buf.write(header_lines(versions, rows))
    w = csv.writer(buf, lineterminator="\n")
    w.writerow(COLUMNS)
    w.writerows(rows)
    return buf.getvalue(), rows, notes


def render_elements(versions):
    import periodictable  # Debian python3-periodictable
    bodr = read_bodr_elements()
    pt = {el.number: (el.symbol, el.name) for el in periodictable.elements if el.number > 0}
    from_pt = (113, 115, 117, 118)
    buf = io.StringIO()
    buf.write(f"""\
# id: nuclear-elements
# title: Chemical elements Z = 1..118: atomic number, symbol, English IUPAC name
# source: Blue Obelisk Data Repository 10 (Debian package bodr {versions['bodr']}, elements.xml) for every Z but 113, 115, 117, 118; their names (IUPAC Recommendations 2016) from Debian package python3-periodictable {versions['python3-periodictable']}
# provenance: published
# version: bodr 10; IUPAC 2016 names
# Generated by make_isotopes.py (beside this file); do not edit by hand.
# Names: Debian package bodr {versions['bodr']} (Blue Obelisk Data Repository 10),
#   /usr/share/bodr/elements.xml, English names (IUPAC spelling: Aluminium,
#   Caesium, Sulfur), for every Z except 113, 115, 117, 118, where bodr 10 still
#   has the systematic placeholder names; those four (Nihonium, Moscovium,
#   Tennessine, Oganesson, IUPAC 2016) come from Debian package
#   python3-periodictable {versions['python3-periodictable']}, capitalised.
""")
    w = csv.writer(buf, lineterminator="\n")
    w.writerow(["z", "symbol", "name"])
    for z in range(1, 119):
        if z in from_pt:
            sym, name = pt[z]
            name = name.capitalize()
        else:
            sym, name = bodr[z]
        w.writerow([z, sym, name])
    return buf.getvalue()


def main():
    versions = package_versions()
    iso_text, rows, notes = render_isotopes(versions)
    el_text = render_elements(versions)
    for n in notes:
        print("NOTE:", n, file=sys.stderr)
    targets = {os.path.join(HERE, "isotopes.csv"): iso_text,
               os.path.join(HERE, "elements.csv"): el_text}
    if "--check" in sys.argv[1:]:
        bad = [p for p, t in targets.items()
               if not os.path.exists(p) or open(p, encoding="utf-8").read() != t]
        for p in bad:
            print("DIFFERS:", p, file=sys.stderr)
        sys.exit(1 if bad else 0)
    for p, t in targets.items():
        with open(p, "w", encoding="utf-8", newline="\n") as f:
            f.write(t)
    print(f"wrote {len(rows)} isotopes and 118 elements", file=sys.stderr)


if __name__ == "__main__":
    main()
