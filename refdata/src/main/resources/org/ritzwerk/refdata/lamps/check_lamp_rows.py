#!/usr/bin/python3
"""Checks every row of the built-in lamp files (lamp-*.csv beside this script).

A row passes when at least one of two independent checks holds:

1. Ritz loop. Two upper levels that both combine with the same two lower levels give four
   lines whose vacuum wavenumbers obey s1 - s2 = s3 - s4 (Ritz combination principle). The
   script searches each file for such quadruples of rows. A loop counts when it closes within
   three times the root-sum-square of 2 units of the last printed digit of its four rows
   (NIST's statement for its evaluated wavelengths: 2 to 20 units of the last digit) and all
   four rows are printed to at least 4 decimals in nm; rows printed to 3 decimals (0.001 nm)
   are too coarse: at that precision loops close by chance about as often as real ones. To show how often loops close by chance at these tolerances,
   each file is also searched after shifting every row by a random amount (seeded), which
   destroys the real loops; that count is printed as "chance".
2. Level energies recalled from memory. For the Ne I 2p5 3s - 2p5 3p and Ar I 3p5 4s - 3p5 4p
   lines (Paschen 1s - 2p), the Hg I 6s6p 3P1 - 6s2 1S0 line, two Xe I 6s - 6p lines and the
   Cd I and Zn I lines among the ground, ns np, ns (n+1)s and ns nd levels the
   level energies below (cm-1, recalled, not looked
   up) give a Ritz wavelength; the row passes when it agrees within 2 units of its last digit.
   The recalled Ne levels reproduce 19 rows, most to 0.00001 nm, and the recalled Ar levels
   25 rows to 0.00015 nm, which also checks the recollection.

Air and vacuum are converted with the dispersion formula of standard air of B. Edlen,
Metrologia 2, 71 (1966), evaluated here in float64 (edlen1966_index below; n taken at the
vacuum wavelength): vacuum -> air directly, air -> vacuum by fixed-point iteration
lambda_vac <- lambda_air n(lambda_vac) until the step is below 1e-12 relative. The
coefficients are from memory; checked against Morton 2000 eq. 8 (Birch and Downs's revision
of the same formula, which Ritzwerk's StandardAir uses): the two refractivities differ by
less than 1e-4 of n - 1 from 250 nm to 1000 nm (edlen_check below asserts it on every run).

Usage: /usr/bin/python3 check_lamp_rows.py         prints the check of every row, exits 1 if any row fails
       /usr/bin/python3 check_lamp_rows.py --write  also rewrites the note column with the check
"""
import math
import os
import random
import sys

import numpy as np

HERE = os.path.dirname(os.path.abspath(__file__))
FILES = ["lamp-hg-i.csv", "lamp-ne-i.csv", "lamp-ar-i.csv", "lamp-kr-i.csv", "lamp-xe-i.csv", "lamp-cd-i.csv",
         "lamp-zn-i.csv"]
UNITS = 2.0
MIN_DECIMALS = 4
SEED = 13
# The table's line remarks, written out in words in the note column (kept when rewriting).
REMARKS = ("persistent", "complex", "unresolved double", "hazy")
# Our own remark, kept too: on rows added later whose intensity was not recalled to the table's digits.
GUESSED = "intensity a rough guess and not from the table"

# Level energies in cm-1, from memory (for Ne I the values of Saloman and Sansonetti, J. Phys.
# Chem. Ref. Data 33, 1113 (2004); for Ar I the 3p5 4s and 4p levels as tabulated by NIST),
# used only as a check.
LEVELS = {
    "Ne I": ({"2p10": 148257.7898, "2p9": 149657.0393, "2p8": 149824.2215, "2p7": 150121.5922,
              "2p6": 150315.8612, "2p5": 150772.1118, "2p4": 150858.5079, "2p3": 150917.4305,
              "2p2": 151038.4524, "2p1": 152970.7328},
             {"1s5": 134041.8400, "1s4": 134459.2871, "1s3": 134818.6405, "1s2": 135888.7173}),
    "Ar I": ({"2p10": 104102.0990, "2p9": 105462.7596, "2p8": 105617.2700, "2p7": 106087.2598,
              "2p6": 106237.5518, "2p5": 107054.2720, "2p4": 107131.7086, "2p3": 107289.7001,
              "2p2": 107496.4166, "2p1": 108722.6194},
             {"1s5": 93143.7600, "1s4": 93750.5978, "1s3": 94553.6652, "1s2": 95399.8276}),
    "Hg I": ({"6s6p 3P1": 39412.300}, {"6s2 1S0": 0.0}),
    # Xe I: only these four recalled levels are used; the other Xe I levels recalled
    # (6p[5/2]2,3, 6p[3/2]1,2) missed the table rows by 0.03 to 0.07 nm and were left out, as
    # were recalled Hg I 6s6d 3D levels that reproduced no row.
    "Xe I": ({"6p[1/2]1": 77269.145, "6p[1/2]0": 80118.962},
             {"6s[3/2]2": 67067.547, "6s[3/2]1": 68045.156}),
    # Cd I and Zn I: recalled before their lamp rows were written down, not fitted to them. Zn I
    # 4s4d 62772.014 was recalled as 3D3; it combines with 4s4p 3P1 (the 330.2588 row's loop), so
    # J <= 2, and the J = 1 level is the one 4s4p 3P0 reaches (328.2328), so it is 3D2 here; a
    # second recalled value, 62769.029, matched no row and was left out.
    "Cd I": ({"5s5p 3P1": 30656.087, "5s5p 1P1": 43692.384, "5s6s 3S1": 51483.980, "5s5d 1D2": 59219.734,
              "5s5d 3D1": 59485.768, "5s5d 3D2": 59497.868, "5s5d 3D3": 59515.98},
             {"5s2 1S0": 0.0, "5s5p 3P0": 30113.990, "5s5p 3P1": 30656.087, "5s5p 3P2": 31826.952,
              "5s5p 1P1": 43692.384}),
    "Zn I": ({"4s4p 3P1": 32501.421, "4s4p 1P1": 46745.413, "4s5s 3S1": 53672.280, "4s4d 1D2": 62458.53,
              "4s4d 3D1": 62768.747, "4s4d 3D2": 62772.014},
             {"4s2 1S0": 0.0, "4s4p 3P0": 32311.350, "4s4p 3P1": 32501.421, "4s4p 3P2": 32890.352,
              "4s4p 1P1": 46745.413}),
}


def edlen1966_index(vac_nm):
    """n of standard air (Edlen 1966): (n - 1) 1e8 = 8342.13 + 2406030 / (130 - s^2)
    + 15997 / (38.9 - s^2), s = 1 / lambda_vac in um^-1."""
    s2 = (1e3 / np.asarray(vac_nm, dtype=float)) ** 2
    return 1 + 1e-8 * (8342.13 + 2406030 / (130 - s2) + 15997 / (38.9 - s2))


def vac_to_air(vac_nm):
    return np.asarray(vac_nm, dtype=float) / edlen1966_index(vac_nm)


def air_to_vac(air_nm):
    air = np.asarray(air_nm, dtype=float)
    vac = air * edlen1966_index(air)
    for _ in range(30):
        new = air * edlen1966_index(vac)
        if np.all(np.abs(new - vac) <= 1e-12 * vac):
            return new
        vac = new
    raise RuntimeError("air to vacuum did not converge")


def edlen_check():
    """The recalled Edlen 1966 coefficients against Morton 2000 eq. 8 (Birch and Downs 1994)."""
    vac = np.linspace(250.0, 1000.0, 751)
    s2 = (1e3 / vac) ** 2
    morton = 8.34254e-5 + 2.406147e-2 / (130 - s2) + 1.5998e-4 / (38.9 - s2)
    edlen = edlen1966_index(vac) - 1
    assert np.all(np.abs(edlen - morton) < 1e-4 * morton), np.max(np.abs(edlen - morton) / morton)
    assert np.all(np.abs(vac_to_air(air_to_vac(vac)) - vac) <= 1e-13 * vac)


def read(path):
    header, rows = [], []
    with open(path, encoding="utf-8") as f:
        for line in f:
            line = line.rstrip("\n")
            if line.startswith("#") or line.startswith("species,"):
                header.append(line)
            elif line:
                rows.append(line.split(",", 7))
    return header, rows


def wavenumbers(rows):
    text = [r[1] for r in rows]
    air = np.array([float(t) for t in text])
    decimals = np.array([len(t.split(".")[1]) for t in text])
    vac = air_to_vac(air)
    sigma = 1e7 / vac
    unit = UNITS * 10.0 ** (-decimals) / air * sigma  # UNITS x last digit, in cm-1
    return text, air, decimals, sigma, unit


def loops(sigma, unit, decimals):
    n = len(sigma)
    pairs = sorted((sigma[i] - sigma[j], i, j) for i in range(n) for j in range(n) if sigma[i] > sigma[j])
    found = []
    for a, (da, i, j) in enumerate(pairs):
        for db, k, l in pairs[a + 1:]:
            if db - da > 1.0:
                break
            if len({i, j, k, l}) < 4:
                continue
            tol = 3 * math.sqrt(unit[i] ** 2 + unit[j] ** 2 + unit[k] ** 2 + unit[l] ** 2)
            if min(decimals[i], decimals[j], decimals[k], decimals[l]) >= MIN_DECIMALS and abs(db - da) < tol:
                found.append((abs(db - da), tol, (i, j, k, l)))
    return found


def memory_checks(species, air, decimals):
    if species not in LEVELS:
        return {}
    upper, lower = LEVELS[species]
    out = {}
    for un, eu in upper.items():
        for ln, el in lower.items():
            if eu <= el:
                continue
            ritz = float(vac_to_air(1e7 / (eu - el)))
            for i, a in enumerate(air):
                if abs(a - ritz) <= UNITS * 10.0 ** (-decimals[i]):
                    out[i] = "%s - %s = %.5f nm" % (ln, un, ritz)
    return out


def main(write):
    edlen_check()
    failed = 0
    rng = random.Random(SEED)
    for name in FILES:
        path = os.path.join(HERE, name)
        header, rows = read(path)
        species = rows[0][0]
        text, air, decimals, sigma, unit = wavenumbers(rows)
        found = loops(sigma, unit, decimals)
        chance = [len(loops(sigma + np.array([rng.uniform(-30.0, 30.0) for _ in sigma]), unit, decimals))
                  for _ in range(5)]
        memory = memory_checks(species, air, decimals)
        print("%s: %d rows, %d Ritz loops; after five random shifts (chance) %s" % (
            name, len(rows), len({frozenset(lp[2]) for lp in found}),
            [c // 2 for c in chance]))
        notes = []
        for i, row in enumerate(rows):
            mine = [lp for lp in found if i in lp[2]]
            distinct = len({frozenset(lp[2]) for lp in mine})
            checks = []
            if mine:
                best = min(mine, key=lambda lp: lp[0])
                partners = " ".join(text[k] for k in best[2] if k != i)
                checks.append("Ritz loop with %s closes to %.4f cm-1 (limit %.4f; %d loop%s)" % (
                    partners, best[0], best[1], distinct, "" if distinct == 1 else "s"))
            if i in memory:
                checks.append("Ritz wavelength of levels from memory " + memory[i])
            remarks = [w for w in (row[7].split("; ") if len(row) > 7 else []) if w in REMARKS + (GUESSED,)]
            flags = "; ".join(remarks)
            if checks:
                note = ("%s; " % flags if flags else "") + "checked: " + "; ".join(checks)
            else:
                note = flags
                failed += 1
            notes.append(note)
            print("  %-10s %s" % (text[i], "; ".join(checks) if checks else "NO CHECK"))
        if write:
            with open(path, "w", encoding="utf-8", newline="\n") as f:
                for line in header:
                    f.write(line + "\n")
                for row, note in zip(rows, notes):
                    f.write(",".join(row[:7] + [note]) + "\n")
    return 1 if failed else 0


if __name__ == "__main__":
    sys.exit(main("--write" in sys.argv[1:]))
