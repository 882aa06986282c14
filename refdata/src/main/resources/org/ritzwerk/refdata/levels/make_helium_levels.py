#!/usr/bin/python3
"""Writes levels-he-i.csv and helium-checks.txt: He I levels n <= 4 recalled from memory, each
kept only with the independent checks below, which this script repeats.

Sources (recalled values, not re-read):
  levels  NIST Atomic Spectra Database, He I energy levels (compilation of G. W. F. Drake and
          W. C. Martin, Can. J. Phys. 76, 679 (1998), and D. C. Morton, Q. Wu and G. W. F. Drake,
          Can. J. Phys. 84, 83 (2006)), from memory.
Published values the checks use (read in the papers' abstracts):
  IE(1s2 1S0)  = 5 945 204 290(33) MHz   Morton, Wu and Drake, Can. J. Phys. 84, 83 (2006)
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
Run: cd refdata/src/main/resources/org/ritzwerk/refdata/levels && /usr/bin/python3 make_helium_levels.py
"""
import math

C_MHZ_PER_CM = 29979.2458
IE = 5945204290 / C_MHZ_PER_CM
IE_U = 33 / C_MHZ_PER_CM
IE_2S3S = 1152842742.728 / C_MHZ_PER_CM
IE_2S1S = 960332040.533 / C_MHZ_PER_CM
R_INF = 109737.31568160
ME = 5.48579909065e-4
M_NUCLEUS = 4.00260325413 - 2 * ME
R_M = R_INF / (1 + ME / M_NUCLEUS)

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
    ([("1s2p 3P2", "1s4d 3D3", 100), ("1s2p 3P1", "1s4d 3D3", 60)], 447.1479, "2p 3P2,1 - 4d 3D (3D3 for all)"),
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


def main():
    energy = {label: float(e) for label, _, e, _, _ in LEVELS}
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
            if all(x in energy for x in ls):
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
    notes["1s2 1S0"] = "ground level (the zero)"
    rows = []
    for label, j, e, _, _ in LEVELS:
        rows.append("He I,%s,%s,%s,%s,from memory; %s" % (label, e, "%g" % half_unit(e), j, notes[label]))
    header = [
        "# ritzwerk-levels 1",
        "# id: levels-he-i",
        "# title: He I levels n <= 4 (singlets and triplets), for Ritz lines",
        "# source: NIST Atomic Spectra Database, He I energy levels (G. W. F. Drake and W. C. Martin, Can. J. Phys. 76, 679 (1998); D. C. Morton, Q. Wu and G. W. F. Drake, Can. J. Phys. 84, 83 (2006)), from memory; checked against the ionization energies of Morton, Wu and Drake (2006), Drake, Bondy, Hallett and Najem, arXiv:2510.17495 (2025) and Chi, Fang, Zhang, Tang and Shi, arXiv:2606.04768 (2026)",
        "# provenance: from-memory",
        "# version: NIST ASD (version not re-checked)",
        "# energy-unit: cm-1",
        "# note: energies as the ASD prints them; uncertainty is half a unit in the last digit; the 4d 3D2, 4d 3D1 and the 4f levels are left out (not recalled); each row's note names its independent check (make_helium_levels.py, helium-checks.txt)",
        "species,label,energy,uncertainty,j,note",
    ]
    with open("levels-he-i.csv", "w") as f:
        f.write("\n".join(header + rows) + "\n")
    with open("helium-checks.txt", "w") as f:
        f.write("\n".join(out) + "\n")


if __name__ == "__main__":
    main()
