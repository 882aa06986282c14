#!/usr/bin/python3
"""Write levels-sr-i.csv (Sr-88 I Rydberg levels) and strontium-checks.txt.

The Rydberg levels are computed from the published Rydberg-Ritz parameters in
rydberg-ritz-sr-88.csv (beside this file; each series with its paper, the digits typed in
from memory) and the Sr-88 ionization limit printed in the abstract of Couturier et al.,
Phys. Rev. A 99, 022503 (2019):

    E(n) = limit - R_M / (n - delta)^2,  delta = d0 + d2 / (n - d0)^2 + d4 / (n - d0)^4,

for N_FROM <= n <= N_TO, with R_M = R_inf / (1 + m_e / (M - m_e)) of Sr-88 (M from
nuclear/isotopes.csv, R_inf and m_e of CODATA 2018 as in the api's PhysicalConstants),
the same R_M the Java series fit uses.

Uncertainty of each level (standard, cm-1): the limit's 10 MHz, the defect uncertainty
u(delta) = sqrt(u0^2 + (u2 / (n - d0)^2)^2 + (u4 / (n - d0)^4)^2) turned into energy by
dE/ddelta = 2 R_M / n*^3 (the papers' correlations are not given, so the terms are added as
if independent), and for the singlet series 0.003 cm-1 more: their paper's fit used an older
limit, not re-read here, and the published Sr limits differ by a few 1e-3 cm-1.

Shared uncertainties (the "# shared-uncertainties" section of the ritzwerk-levels format): the
Rydberg levels share uncertainty components, and the covariance of two levels is the sum over the
components they share of the products of their contributions (common practice: the GUM, JCGM
100:2008, 5.2 and F.1.2.3, for inputs common to two results), so that lines between two Rydberg
levels are not stated with the shared parts added twice. Each Rydberg level is written with its
signed contribution from each component, to 12 digits: the limit's 10 MHz, shared by every Rydberg
level (contribution limit_u); the singlet series' extra 0.003 cm-1, a limit offset of their paper's
fit, shared by every level of the series that have it (contribution extra); and each series'
defect parameters d0, d2, d4, shared by the levels of that series (contributions dE/ddelta * u0,
* u2 / (n - d0)^2, * u4 / (n - d0)^4, with dE/ddelta = -2 R_M / n*^3; independent between
parameters and series, as the uncertainties above). These are exactly the terms of each level's
uncertainty, so its independent part u^2 - sum v^2 is what the rounding up of u adds; the script
stops if it is negative for a level. The ground level (exact) and the 5s5p levels (from the level
compilation, independent of the limit) share nothing, so their lines keep their uncertainties.
(Before, the file carried the same covariance as 20,503 pairwise correlations r = cov / (u_i u_j).)

Two low levels are added, from memory, for the lines that reach the series (NIST Atomic
Spectra Database Sr I levels, J. E. Sansonetti and G. Nave, J. Phys. Chem. Ref. Data 39,
033103 (2010)): 5s5p 3P1 and 5s5p 1P1, each checked against the air wavelength of its line to
the ground level in the NIST Handbook of Basic Atomic Spectroscopic Data (J. E. Sansonetti and
W. C. Martin, J. Phys. Chem. Ref. Data 34, 1559 (2005), version 1.1.3; also from memory).

Checks (written to strontium-checks.txt; the script stops if one fails):
  1  second paper: for the triplet series, the defect of Couturier et al. (2019) and of
     Vaillant et al. (2012) (both from memory) at n = 30, 40, 50 differ by less than the
     combined stated uncertainties of the two sets (2 sigma);
  2  series regularity: over N_FROM..N_TO the defect changes monotonically, by less than 0.2
     in all, and the d4 term is smaller than the d2 term;
  3  low levels: Ritz air wavelengths (standard air of B. Edlen, Metrologia 2, 71 (1966)) of
     5s2 1S0 - 5s5p 1P1 and 5s2 1S0 - 5s5p 3P1 against the Handbook within 0.002 nm;
  4  plausibility at low n (not a bound the formula must meet: perturbers lie below n = 20):
     the 5s6s 1S0 and 5s6s 3S1 defects (levels from memory, ASD) against the formulas
     extrapolated to n = 6, printed only.
Run: cd refdata/src/main/resources/org/ritzwerk/refdata/levels && /usr/bin/python3 make_strontium_levels.py
"""
import csv
import math
import os

from make_helium_levels import edlen

HERE = os.path.dirname(os.path.abspath(__file__))
N_FROM = 20
N_TO = 60
C_MHZ_PER_CM = 29979.2458
R_INF = 109737.31568160          # cm-1, CODATA 2018
ME_U = 9.1093837015e-31 / 1.66053906660e-27   # electron mass in u, CODATA 2018

# Second paper, Vaillant, Jones and Potvliege (2012), triplet rows (from memory): d0, u, d2, u, d4, u
SECOND = {
    "5sns 3S1": (3.371, 0.002, 0.5, 0.2, -1.0, 2.0),
    "5snd 3D1": (2.658, 0.006, 3.0, 2.0, -8800.0, 7000.0),
    "5snd 3D2": (2.636, 0.005, -1.0, 2.0, -9800.0, 6000.0),
}
# Low levels (cm-1, from memory, NIST ASD) and the Handbook's air wavelength of the line to ground (nm)
LOW = [
    ("5s5p 3P1", "1", 14504.334, 0.005, 689.2592),
    ("5s5p 1P1", "1", 21698.452, 0.005, 460.7331),
]
# Low-n plausibility (check 4): label, series, n, energy (cm-1, from memory, NIST ASD)
LOW_N = [("5s6s 1S0", "5sns 1S0", 6, 30591.825), ("5s6s 3S1", "5sns 3S1", 6, 29038.773)]


def sr88_mass():
    with open(os.path.join(HERE, "..", "nuclear", "isotopes.csv")) as f:
        for line in f:
            parts = line.strip().split(",")
            if len(parts) > 3 and parts[0] == "38" and parts[1] == "88":
                return float(parts[3])
    raise SystemExit("Sr-88 is not in nuclear/isotopes.csv")


def read_parameters():
    header = {}
    rows = []
    with open(os.path.join(HERE, "rydberg-ritz-sr-88.csv")) as f:
        lines = f.read().splitlines()
    body = []
    for line in lines:
        if line.startswith("#"):
            if ":" in line:
                key, value = line[1:].split(":", 1)
                header[key.strip()] = value.strip()
        elif line.strip():
            body.append(line)
    for row in csv.DictReader(body):
        rows.append(row)
    return header, rows


def up2(u):
    """The uncertainty rounded up to two significant digits (never printed smaller than it is)."""
    step = 10 ** (math.floor(math.log10(u)) - 1)
    return "%.1e" % (math.ceil(u / step - 1e-9) * step)


def delta(n, d0, d2, d4):
    m = n - d0
    return d0 + d2 / m ** 2 + d4 / m ** 4


def delta_unc(n, d0, u0, u2, u4):
    m = n - d0
    return math.sqrt(u0 ** 2 + (u2 / m ** 2) ** 2 + (u4 / m ** 4) ** 2)


def main():
    header, params = read_parameters()
    value, unit = header["limit"].split()
    assert unit == "MHz"
    limit = float(value) / C_MHZ_PER_CM
    limit_u = float(header["limit-uncertainty"].split()[0]) / C_MHZ_PER_CM
    mass = sr88_mass()
    r_m = R_INF / (1 + ME_U / (mass - ME_U))
    out = ["Sr-88 I level checks (make_strontium_levels.py)",
           "limit = %.6f +- %.6f cm-1 (1377012721(10) MHz), M(Sr-88) = %s u, R_M = %.6f cm-1"
           % (limit, limit_u, mass, r_m)]
    failures = []
    # the ground level is the zero of the scale: exact by definition, u = 0
    rows = [("Sr-88 I", "5s2 1S0", "0", "0", "0", "ground level (the zero of the scale; exact by definition)")]
    for label, j, e, u, handbook in LOW:
        air = 1e7 / e / edlen(1e7 / e)
        diff = air - handbook
        ok = abs(diff) <= 0.002
        out.append("check 3: 5s2 1S0 - %s  Ritz %.4f nm air, handbook %.4f, %+.4f nm %s"
                   % (label, air, handbook, diff, "ok" if ok else "FAIL"))
        if not ok:
            failures.append(label)
        rows.append(("Sr-88 I", label, "%.3f" % e, "%g" % u, j,
                     "from memory (NIST ASD; Sansonetti and Nave 2010); check 3 (%.4f nm air %+.4f)"
                     % (handbook, diff)))
    levels = []
    for p in params:
        name = p["series"]
        used = p["use"] == "yes"
        d0, d2, d4 = float(p["d0"]), float(p["d2"]), float(p["d4"])
        u0, u2, u4 = float(p["d0_unc"]), float(p["d2_unc"]), float(p["d4_unc"])
        extra = float(p["limit_extra_unc_cm"])
        # The series starts at N_FROM, or higher where the d4 term would outweigh the d2 term
        # (there the expansion is no longer an asymptotic series and the formula is not trusted).
        start = N_FROM
        while abs(d4 / (start - d0) ** 4) >= abs(d2 / (start - d0) ** 2) and d2 != 0:
            start += 1
        p["start"] = start
        deltas = [delta(n, d0, d2, d4) for n in range(start, N_TO + 1)]
        steps = [b - a for a, b in zip(deltas, deltas[1:])]
        monotonic = all(s >= 0 for s in steps) or all(s <= 0 for s in steps)
        spread = max(deltas) - min(deltas)
        ok = monotonic and spread < 0.2
        out.append("check 2: %s  from n = %d (first n where |d4 term| < |d2 term|): defect %.6f to %.6f "
                   "(n = %d), monotonic %s, change %.4f: %s" % (name, start, deltas[0], deltas[-1], N_TO,
                                                                monotonic, spread, "ok" if ok else "FAIL"))
        if not ok and used:
            failures.append(name + " regularity")
        if name in SECOND:
            s0, su0, s2, su2, s4, su4 = SECOND[name]
            for n in (30, 40, 50):
                a = delta(n, d0, d2, d4)
                b = delta(n, s0, s2, s4)
                u = math.hypot(delta_unc(n, d0, u0, u2, u4), delta_unc(n, s0, su0, su2, su4))
                good = abs(a - b) <= 2 * u
                out.append("check 1: %s  n = %d  defect %.6f, second paper %.6f, difference %+.6f, 2 sigma %.6f %s"
                           % (name, n, a, b, a - b, 2 * u, "ok" if good else "FAIL"))
                if not good and used:
                    failures.append("%s n = %d second paper" % (name, n))
        if not used:
            out.append("left out: %s (%s)" % (name, p["use"]))
            continue
        for n in range(start, N_TO + 1):
            d = delta(n, d0, d2, d4)
            nstar = n - d
            e = limit - r_m / nstar ** 2
            ue = math.sqrt(limit_u ** 2 + (2 * r_m / nstar ** 3 * delta_unc(n, d0, u0, u2, u4)) ** 2 + extra ** 2)
            m = n - d0
            slope = -2 * r_m / nstar ** 3
            # this level's contribution from each uncertainty component it has in common with others
            shares = {"limit": limit_u}
            if extra > 0:
                shares["singlet limit offset"] = extra
            shares.update({name + " d0": slope * u0, name + " d2": slope * u2 / m ** 2,
                           name + " d4": slope * u4 / m ** 4})
            levels.append((e, ("Sr-88 I", p["label"].replace("{n}", str(n)), "%.6f" % e, up2(ue), p["j"],
                               "from memory: Rydberg-Ritz parameters of %s; limit of Couturier et al. (2019); "
                               "defect %.6f" % (p["source"], d)), shares))
    for label, series, n, e in LOW_N:
        p = next(q for q in params if q["series"] == series)
        d = delta(n, float(p["d0"]), float(p["d2"]), float(p["d4"]))
        measured = n - math.sqrt(r_m / (limit - e))
        out.append("check 4: %s  defect from its level %.4f, series formula at n = %d %.4f (plausibility only)"
                   % (label, measured, n, d))
    levels.sort(key=lambda t: t[0])
    rows.extend(r for _, r, _ in levels)
    share_rows = []
    components = []
    for _, r, sh in levels:
        written = [(k, "%.12g" % v) for k, v in sh.items() if v != 0]
        u = float(r[3])
        independent = u ** 2 - sum(float(v) ** 2 for _, v in written)
        if independent < -1e-12 * u ** 2:
            failures.append("shared parts of %s exceed its uncertainty (%g)" % (r[1], independent))
        for k, v in written:
            share_rows.append("Sr-88 I,%s,%s,%s" % (r[1], k, v))
            if k not in components:
                components.append(k)
    out.append("shared uncertainties: %d contributions of %d components to %d Rydberg levels"
               % (len(share_rows), len(components), len(levels)))
    if failures:
        print("\n".join(out))
        raise SystemExit("checks failed: " + ", ".join(failures))
    with open(os.path.join(HERE, "levels-sr-i.csv"), "w") as f:
        f.write("# ritzwerk-levels 1\n")
        f.write("# id: levels-sr-i\n")
        used = [q for q in params if q["use"] == "yes"]
        f.write("# title: Sr-88 I Rydberg levels n <= %d of five series from published Rydberg-Ritz parameters, "
                "with 5s5p 3P1 and 1P1\n" % N_TO)
        f.write("# source: computed from rydberg-ritz-sr-88.csv: Rydberg-Ritz parameters of L. Couturier et al., "
                "Phys. Rev. A 99, 022503 (2019) (5sns 3S1, 5snd 3D1) and C. L. Vaillant, M. P. A. Jones and R. M. Potvliege, "
                "J. Phys. B 45, 135004 (2012) (5sns 1S0, 5snp 1P1, 5snd 1D2), from memory; the limit 1377012721(10) MHz of Couturier "
                "et al. (2019), read in its abstract; 5s5p levels from memory (NIST ASD, J. E. Sansonetti and "
                "G. Nave, J. Phys. Chem. Ref. Data 39, 033103 (2010))\n")
        f.write("# provenance: from-memory\n")
        f.write("# version: make_strontium_levels.py, n = %d to %d\n" % (N_FROM, N_TO))
        f.write("# energy-unit: cm-1\n")
        f.write("# note: energies above the ground level 5s2 1S0; uncertainty (standard, rounded up to two digits) from the limit's 10 MHz "
                "and the stated defect uncertainties (taken as independent), plus 0.003 cm-1 for the singlet "
                "series; the Rydberg levels' shared uncertainty components (after the levels): the limit, the singlet "
                "limit offset and the defect parameters of each series; series and first n: %s; above n = 50 the triplet formulas are extrapolated beyond the "
                "measured range; checks in strontium-checks.txt\n"
                % ", ".join("%s from n = %d" % (q["series"], q["start"]) for q in used))
        f.write("species,label,energy,uncertainty,j,note\n")
        for r in rows:
            f.write(",".join(r) + "\n")
        f.write("# shared-uncertainties\n")
        f.write("species,label,component,value\n")
        for c in share_rows:
            f.write(c + "\n")
    with open(os.path.join(HERE, "strontium-checks.txt"), "w") as f:
        f.write("\n".join(out) + "\n")
    print("\n".join(out))
    print("wrote %d levels" % len(rows))


if __name__ == "__main__":
    main()
