#!/usr/bin/python3
"""Writes Ritzwerk's built-in Rydberg data for Li-7, Na-23, K-39, Rb-85, Rb-87 and Cs-133.

Run from this folder:   /usr/bin/python3 make_rydberg_data.py
Needs only the Python 3 standard library.  Deterministic: rewrites the same bytes each time.

Outputs (beside this script):
  quantum-defects-<atom>.csv   modified Rydberg-Ritz parameters per l, j (l = 0..3), the
                               ionisation limit, core polarizabilities, the lowest n each series
                               is used for (valid-from-n), and the source of every number
  levels-<atom>.csv            measured energies of the levels below each series' valid-from-n
                               (project format ritzwerk-levels 1)
  fit-residuals.txt            the comparison that chose valid-from-n
  model-potentials.csv         Marinescu, Sadeghpour & Dalgarno (1994) core model potentials

How valid-from-n is chosen.  For each series the Rydberg-Ritz energy
    E(n) = limit - R_M / (n - delta(n))^2,  delta = d0 + d2/(n-d0)^2 + d4/(n-d0)^4 + ...
is compared with every measured level transcribed below.  valid-from-n is the lowest n from
which on every tabulated level agrees within TOLERANCE_PER_CM plus the rounding of the
tabulated value (half a unit in its last printed digit); all levels below it, and the lowest
level of every series (so the ground state and the resonance levels are always measured), are
written to the levels file.  The engine uses a measured level where the file has one and the
formula otherwise.  Levels
above the last tabulated one are taken on trust from the published fit.

Where the measured levels come from.  NIST Atomic Spectra Database energy levels, read in the
copies that the ARC library keeps (nikolasibalic/ARC-Alkali-Rydberg-Calculator, files
arc/data/{li,na,k,rb,cs}_NIST_level_data.ascii at commit
8c04bb59fd275ae68fee329c7ceb1dee93206c60).  Those copies give energies in eV; they are
transcribed here digit for digit (values NIST prints in brackets, i.e. not observed, are
left out) and converted with the exact SI factor e/(h c) = 8065.543937... cm^-1 per eV.  The
copies do not say which ASD version they were exported from.  NIST compiles these levels for
the natural element; isotope shifts (below 0.01 cm^-1 here) are not applied.
"""

from fractions import Fraction

# CODATA 2018 (the constants edition Ritzwerk uses, api PhysicalConstants).
E_CHARGE = 1.602176634e-19
PLANCK = 6.62607015e-34
C = 299792458.0
PER_CM_PER_EV = E_CHARGE / (PLANCK * C * 100.0)
R_INF_PER_CM = 109737.31568160
ELECTRON_MASS_U = 5.48579909065e-4

TOLERANCE_PER_CM = 0.1

# Atomic masses in u, AME2020, as in ../nuclear/isotopes.csv (the provider computes R_M from that
# file at run time; these copies serve only the residual check below).
MASS_U = {"li-7": 7.01600343426, "na-23": 22.98976928195, "k-39": 38.96370648482,
          "rb-85": 84.91178973604, "rb-87": 86.909180529, "cs-133": 132.905451958}

ARC = "ARC (nikolasibalic/ARC-Alkali-Rydberg-Calculator) arc/alkali_atom_data.py at commit " \
      "348be8b2fcad113e566d395676e60e1e3abccd9a"
PAIR = "pairinteraction (pairinteraction/pairinteraction) calc/databases/quantum_defects.sql at " \
       "commit 4b3609aaf9ef209101404e6930e1803203e90b5b"
MQDT = "an unnamed public Python MQDT code whose file defines classes Hydrogen_n, Rubidium87, " \
       "Potassium39, Cesium133, Lithium7, Sodium23 (found by the code search, repository not shown)"

# ---------------------------------------------------------------------------------------------
# Quantum-defect sets.  Each series: (l, 2j, [d0, d2, d4, ...], citation, where it was read).
# ---------------------------------------------------------------------------------------------
LI_2003 = "W. Li, I. Mourachko, M. W. Noel and T. F. Gallagher, Phys. Rev. A 67, 052502 (2003)"
HAN_2006 = "J. Han, Y. Jamil, D. V. L. Norum, P. J. Tanner and T. F. Gallagher, Phys. Rev. A 74, 054502 (2006)"
MACK_2011 = "M. Mack et al., Phys. Rev. A 83, 052515 (2011)"
DEIGLMAYR_2016 = "J. Deiglmayr et al., Phys. Rev. A 93, 013424 (2016)"
GOY_1982 = "P. Goy, J. M. Raimond, G. Vitrant and S. Haroche, Phys. Rev. A 26, 2733 (1982)"
WEBER_1987 = "K.-H. Weber and C. J. Sansonetti, Phys. Rev. A 35, 4650 (1987)"
LN_1984 = "C.-J. Lorenzen and K. Niemax, Z. Phys. A 315, 127 (1984)"
LN_1983 = "C.-J. Lorenzen and K. Niemax, Phys. Scr. 27, 300 (1983)"
GOY_1986 = "P. Goy, J. Liang, M. Gross and S. Haroche, Phys. Rev. A 34, 2889 (1986)"

RB_85_SERIES = [
    (0, 1, [3.1311804, 0.1784], LI_2003, ARC + " (Rubidium85); same in bgrich/starkr R/quantum_defect.R"),
    (1, 1, [2.6548849, 0.2900], LI_2003, ARC + " (Rubidium85); same in " + PAIR),
    (1, 3, [2.6416737, 0.2950], LI_2003, ARC + " (Rubidium85); same in " + PAIR),
    (2, 3, [1.34809171, -0.60286], LI_2003, ARC + " (Rubidium85)"),
    (2, 5, [1.34646572, -0.59600], LI_2003, ARC + " (Rubidium85)"),
    (3, 5, [0.0165192, -0.085], HAN_2006, ARC + " (Rubidium85); same in " + PAIR),
    (3, 7, [0.0165437, -0.086], HAN_2006, ARC + " (Rubidium85); same in " + PAIR),
]
RB_87_SERIES = [
    (0, 1, [3.1311807, 0.1787], MACK_2011, PAIR + "; same in ryd-numerov 0.5.5 elements/rubidium.py"),
    (1, 1, [2.6548849, 0.2900], LI_2003 + " (measured in Rb-85)", PAIR),
    (1, 3, [2.6416737, 0.2950], LI_2003 + " (measured in Rb-85)", PAIR),
    (2, 3, [1.3480948, -0.6054], MACK_2011, PAIR + "; same in ryd-numerov 0.5.5 elements/rubidium.py"),
    (2, 5, [1.3464622, -0.5940], MACK_2011, PAIR + "; same in ryd-numerov 0.5.5 elements/rubidium.py"),
    (3, 5, [0.0165192, -0.085], HAN_2006 + " (measured in Rb-85)", PAIR),
    (3, 7, [0.0165437, -0.086], HAN_2006 + " (measured in Rb-85)", PAIR),
]
CS_SERIES = [
    (0, 1, [4.0493532, 0.2391, 0.06, 11.0, -209.0], DEIGLMAYR_2016, PAIR + "; same in ryd-numerov (cesium.py)"),
    (1, 1, [3.5915871, 0.36273], DEIGLMAYR_2016, PAIR),
    (1, 3, [3.5590676, 0.37469], DEIGLMAYR_2016, PAIR),
    # Goy et al. 1982 (2.475365, 0.5554; in pairinteraction) misses the measured 13d3/2 by 0.9 cm-1,
    # so the D3/2 series is taken from Lorenzen & Niemax 1984, as ARC does.
    (2, 3, [2.4754562, 0.009320, -0.43498, -0.76358, -18.0061], LN_1984, ARC + " (Caesium)"),
    (2, 5, [2.4663144, 0.01381, -0.392, -1.9], DEIGLMAYR_2016, PAIR),
    (3, 5, [0.03341424, -0.198674, 0.28953, -0.2601], WEBER_1987, PAIR + "; same in " + ARC),
    (3, 7, [0.033537, -0.191], GOY_1982, PAIR),
]
K_SERIES = [
    (0, 1, [2.1801985, 0.13558, 0.0759, 0.117, -0.206], LN_1983, ARC + " (Potassium39)"),
    (1, 1, [1.713892, 0.233294, 0.16137, 0.5345, -0.234], LN_1983, ARC + " (Potassium39)"),
    (1, 3, [1.710848, 0.235437, 0.11551, 1.1015, -2.0356], LN_1983, ARC + " (Potassium39)"),
    (2, 3, [0.27697, -1.024911, -0.709174, 11.839, -26.689], LN_1983, ARC + " (Potassium39)"),
    (2, 5, [0.2771580, -1.025635, -0.59201, 10.0053, -19.0244], LN_1983, ARC + " (Potassium39)"),
    (3, 5, [0.010098, -0.100224, 1.56334, -12.6851], LN_1983, ARC + " (Potassium39)"),
    (3, 7, [0.010098, -0.100224, 1.56334, -12.6851], LN_1983, ARC + " (Potassium39)"),
]
NA_SERIES = [
    (0, 1, [1.347964, 0.060673, 0.0233, -0.0085], LN_1983, ARC + " (Sodium)"),
    (1, 1, [0.855380, 0.11363, 0.0384, 0.1412], LN_1983, ARC + " (Sodium)"),
    (1, 3, [0.854565, 0.114195, 0.0352, 0.1533], LN_1983, ARC + " (Sodium)"),
    (2, 3, [0.015543, -0.08535, 0.7958, -4.0513], LN_1983, ARC + " (Sodium)"),
    (2, 5, [0.015543, -0.08535, 0.7958, -4.0513], LN_1983, ARC + " (Sodium)"),
    (3, 5, [0.001453, 0.017312, -0.7809, 7.021], LN_1983, ARC + " (Sodium)"),
    (3, 7, [0.001453, 0.017312, -0.7809, 7.021], LN_1983, ARC + " (Sodium)"),
]
LI_SERIES = [
    (0, 1, [0.3995101, 0.029], GOY_1986, ARC + " (Lithium7); same in " + PAIR),
    (1, 1, [0.0471780, -0.024], GOY_1986, ARC + " (Lithium7); same in " + PAIR),
    (1, 3, [0.0471665, -0.024], GOY_1986, ARC + " (Lithium7); same in " + PAIR),
    (2, 3, [0.002129, -0.01491, 0.1759, -0.8507], LN_1983, ARC + " (Lithium7)"),
    (2, 5, [0.002129, -0.01491, 0.1759, -0.8507], LN_1983, ARC + " (Lithium7)"),
    (3, 5, [-0.000077, 0.021856, -0.4211, 2.3891], LN_1983, ARC + " (Lithium7)"),
    (3, 7, [-0.000077, 0.021856, -0.4211, 2.3891], LN_1983, ARC + " (Lithium7)"),
]

# Ionisation limits above the ground level's fine-structure (hyperfine-centroid) energy, cm^-1.
# Rb-87: Mack et al. 2011 give 1 010 029.1646(3) GHz from 5S1/2 F = 1 (read in ryd-numerov
# 0.5.5 elements/rubidium.py and in ARC); F = 1 lies 5/8 of the ground hyperfine splitting below
# the centroid, 4.271676631815181 GHz as ARC subtracts it (read there; 5/8 of 6 834.682 610 904 MHz,
# Steck, Rubidium 87 D Line Data, from memory, gives the same), so the limit above the centroid is
# 1 010 029.1646 - 4.2716766 GHz.
RB87_LIMIT_GHZ_FROM_F1 = 1010029.1646
RB87_F1_BELOW_CENTROID_GHZ = 4.271676631815181
LIMITS = {
    "li-7": (43487.15, "published", LN_1983 + ", read in " + ARC + " (Lithium6; the Lithium7 class quotes the "
             "same 5.391719 eV from R. L. Kelly, J. Phys. Chem. Ref. Data 16, Suppl. 1 (1987))"),
    "na-23": (41449.44, "published", LN_1983 + ", read in " + ARC + " (Sodium)"),
    "k-39": (35009.8139375, "published", "weighted average of the values in " + LN_1983 + ", read in " + ARC
             + " (Potassium39)"),
    "rb-85": (33690.79890, "from-memory", LI_2003 + "; recalled, and the same digits are in a public "
              "code's table of Rb-85 ionisation frequencies (c*33690.79890; repository not shown)"),
    "rb-87": ((RB87_LIMIT_GHZ_FROM_F1 - RB87_F1_BELOW_CENTROID_GHZ) / (C / 1e7), "published",
              MACK_2011 + ": 1010029.1646(3) GHz from 5S1/2 F=1, read in ryd-numerov 0.5.5 elements/rubidium.py "
              "and " + ARC + "; minus 4.271676631815181 GHz (5/8 of the ground hyperfine splitting, as ARC "
              "subtracts it) to refer it to the hyperfine centroid"),
    "cs-133": (31406.4677325, "published", DEIGLMAYR_2016 + ", read in " + ARC + " (Caesium) and " + PAIR
               + "; the 2025 erratum (Phys. Rev. A 112, 049902) gives 31406.4677482, read in the rydstate "
               "package's sqdt cesium file, 1.6e-5 cm-1 higher, not applied"),
}

# Core (ion) dipole and quadrupole polarizabilities in atomic units, for l >= 4.
CORE = {
    "li-7": (0.1884, 0.046, "Phys. Rev. A 16, 1141 (1977) as cited in " + MQDT),
    "na-23": (0.9980, 0.351, "Phys. Rev. A 38, 4985 (1988) as cited in " + MQDT),
    "k-39": (5.4880, 17.89, "Phys. Rev. A 100, 012501 (2019) as cited in " + MQDT),
    "rb-85": (9.116, 38.4, "Phys. Rev. A 102, 062818 (2020) as cited in " + MQDT),
    "rb-87": (9.116, 38.4, "Phys. Rev. A 102, 062818 (2020) as cited in " + MQDT),
    "cs-133": (15.5440, 70.7, "Phys. Rev. A 22, 2672 (1980) as cited in " + MQDT
               + " (Marinescu et al. 1994 use 15.644 for the dipole part)"),
}

# ---------------------------------------------------------------------------------------------
# Measured levels (n, l, 2j, energy in eV as printed in the ARC copy of NIST ASD).
# ---------------------------------------------------------------------------------------------
RB_LEVELS = """
5 0 1 0.000000
5 1 1 1.5595910
5 1 3 1.5890490
4 2 5 2.3997392
4 2 3 2.3997945
6 0 1 2.4961130
6 1 1 2.9402952
6 1 3 2.9499052
5 2 3 3.1864602
5 2 5 3.1868275
7 0 1 3.2622023
4 3 7 3.3217959
4 3 5 3.3217991
7 1 1 3.451102
7 1 3 3.455453
6 2 3 3.5567503
6 2 5 3.5570309
8 0 1 3.6013460
5 3 7 3.6299804
5 3 5 3.6299828
8 1 1 3.699061
8 1 3 3.701398
7 2 3 3.7542554
7 2 5 3.7544422
9 0 1 3.7813977
6 3 7 3.7973832
6 3 5 3.7973851
9 1 1 3.838415
9 1 3 3.839814
8 2 3 3.8709650
8 2 5 3.8710906
10 0 1 3.8884333
7 3 7 3.8982760
7 3 5 3.8982775
10 1 1 3.924577
10 1 3 3.925483
9 2 3 3.9454070
9 2 5 3.9454932
11 0 1 3.9572309
8 3 7 3.9637270
8 3 5 3.9637277
11 1 1 3.981573
11 1 3 3.982189
10 2 3 3.9957142
10 2 5 3.9957760
12 0 1 4.0040585
12 1 1 4.021241
12 1 3 4.021680
13 1 1 4.049947
13 1 3 4.050270
14 1 1 4.071395
14 1 3 4.071643
"""
CS_LEVELS = """
6 0 1 0.0000000
6 1 1 1.385928556931
6 1 3 1.45462062847
5 2 3 1.79767865
5 2 5 1.809777716
7 0 1 2.29811256
7 1 1 2.6985591
7 1 3 2.7210063
6 2 3 2.80065674
6 2 5 2.80597136
8 0 1 3.0149421447
4 3 7 3.03414681
4 3 5 3.03416930
8 1 1 3.187489220
8 1 3 3.1977393
7 2 3 3.22951970
7 2 5 3.23211578
9 0 1 3.33649680
5 3 7 3.34399670
5 3 5 3.34401524
9 1 1 3.42655072
9 1 3 3.43209053
8 2 3 3.44815415
8 2 5 3.44959735
10 0 1 3.50878102
6 3 7 3.51239873
6 3 5 3.51241184
10 1 1 3.56167064
10 1 3 3.56500143
9 2 3 3.57430087
9 2 5 3.575182391
11 0 1 3.611874040
7 3 7 3.613879874
7 3 5 3.613889011
11 1 1 3.645559685
11 1 3 3.6477171
10 2 3 3.65360188
10 2 5 3.654178675
12 0 1 3.678462642
8 3 7 3.679688392
8 3 5 3.679694976
12 1 1 3.701229633
12 1 3 3.7027067
11 2 3 3.70667358
11 2 5 3.707071139
13 0 1 3.723962981
9 3 7 3.724767241
9 3 5 3.724772064
13 1 1 3.740066036
13 1 3 3.7411211
12 2 3 3.74392542
12 2 5 3.744210821
14 0 1 3.756429078
10 3 7 3.756985908
10 3 5 3.756989520
14 1 1 3.768235687
14 1 3 3.7690157
13 2 3 3.77107263
13 2 5 3.771284325
15 0 1 3.780404938
"""
NA_LEVELS = """
3 0 1 0.00000000
3 1 1 2.102297159
3 1 3 2.104429184
4 0 1 3.1913531
3 2 5 3.6169708
3 2 3 3.6169770
4 1 1 3.752628
4 1 3 3.753322
5 0 1 4.1163588
4 2 5 4.2834964
4 2 3 4.2835008
4 3 7 4.288232
4 3 5 4.288232
5 1 1 4.344453
5 1 3 4.344760
6 0 1 4.5096298
5 2 5 4.5919720
5 2 3 4.5919745
5 3 7 4.594563
5 3 5 4.594563
6 1 1 4.624154
6 1 3 4.624314
7 0 1 4.7128925
6 2 5 4.7594130
6 2 3 4.7594146
6 3 5 4.760967
6 3 7 4.760967
7 1 1 4.778373
7 1 3 4.778466
8 0 1 4.831479
7 2 3 4.860296
7 2 5 4.860296
7 3 7 4.861294
7 3 5 4.861294
8 1 1 4.872374
8 1 3 4.872435
9 0 1 4.906656
8 2 5 4.925731
8 2 3 4.925731
8 3 7 4.926408
8 3 5 4.926408
10 0 1 4.957294
9 2 5 4.970565
9 2 3 4.970565
9 3 7 4.971046
9 3 5 4.971046
10 1 1 4.9763302
10 1 3 4.9763591
11 0 1 4.9930167
10 2 5 5.0026278
10 2 3 5.0026282
11 1 1 5.0068445
11 1 3 5.0068659
12 0 1 5.0191575
"""
K_LEVELS = """
4 0 1 0.0000000
4 1 1 1.6099578300
4 1 3 1.6171129956
5 0 1 2.6069600
3 2 5 2.6699600
3 2 3 2.6702462
5 1 1 3.0625810
5 1 3 3.0649066
4 2 5 3.3968046
4 2 3 3.3969373
6 0 1 3.40345430
4 3 5 3.487409
4 3 7 3.487409
6 1 1 3.595451
6 1 3 3.596498
5 2 5 3.74249324
5 2 3 3.74255569
7 0 1 3.75352843
5 3 5 3.794751
5 3 7 3.794751
7 1 1 3.852177
7 1 3 3.852735
6 2 5 3.92979078
6 2 3 3.92982371
8 0 1 3.93840474
6 3 5 3.961688
6 3 7 3.961688
8 1 1 3.995693
8 1 3 3.996024
7 2 5 4.04167259
7 2 3 4.04169188
9 0 1 4.04787961
7 3 5 4.062317
7 3 7 4.062317
9 1 1 4.08406463
9 1 3 4.08427828
8 2 5 4.11356430
8 2 3 4.11357652
10 0 1 4.11803924
8 3 5 4.127608
8 3 7 4.127608
10 1 1 4.14234063
10 1 3 4.14248544
9 2 5 4.16240481
9 2 3 4.16241296
11 0 1 4.16569046
9 3 5 4.172356
9 3 7 4.172356
11 1 1 4.18279261
11 1 3 4.18289558
10 2 5 4.19706291
10 2 3 4.19706864
12 0 1 4.19952811
10 3 7 4.204356
10 3 5 4.204356
12 1 1 4.21201674
12 1 3 4.21209218
"""
LI_LEVELS = """
2 0 1 0.00000
2 1 1 1.847818
2 1 3 1.847860
3 0 1 3.373129
3 1 1 3.834258
3 1 3 3.834258
3 2 3 3.878608
3 2 5 3.878613
4 0 1 4.340942
4 1 3 4.521648
4 1 1 4.521648
4 2 3 4.540720
4 2 5 4.540723
4 3 7 4.54157
4 3 5 4.54157
5 0 1 4.748533
5 1 3 4.837313
5 1 1 4.837313
5 2 3 4.847154
5 2 5 4.847155
5 3 7 4.84834
5 3 5 4.84834
6 0 1 4.957835
6 1 1 5.007826
6 1 3 5.007826
6 2 3 5.013587
6 2 5 5.013589
7 0 1 5.07937
7 1 1 5.110300
7 1 3 5.110300
7 2 3 5.11391
7 2 5 5.11391
8 0 1 5.15614
8 1 1 5.176542
8 1 3 5.176542
8 2 5 5.17898
8 2 3 5.17898
9 0 1 5.20775
9 1 3 5.222000
9 1 1 5.222000
9 2 5 5.22362
9 2 3 5.22362
10 0 1 5.2443
10 1 1 5.254346
10 1 3 5.254346
10 2 3 5.2556
10 2 5 5.2556
"""

# Marinescu, Sadeghpour & Dalgarno, Phys. Rev. A 49, 982 (1994): element, l, alpha_c (a0^3), Z, a1, a2,
# a3, a4, r_c, as printed in pairinteraction's quantum_defects.sql (commit 4b3609aa, table
# model_potential); ARC's alkali_atom_data.py has the same numbers except Rb l = 1 a4, printed
# there as -0.8163314 (pairinteraction: -0.81633314, used here).
MARINESCU_1994 = """
Li 0 0.1923 3 2.47718079 1.84150932 -0.02169712 -0.11988362 0.61340824
Li 1 0.1923 3 3.45414648 2.55151080 -0.21646561 -0.06990078 0.61566441
Li 2 0.1923 3 2.51909839 2.43712450 0.32505524 0.10602430 2.34126273
Li 3 0.1923 3 2.51909839 2.43712450 0.32505524 0.10602430 2.34126273
Na 0 0.9448 11 4.82223117 2.45449865 -1.12255048 -1.42631393 0.45489422
Na 1 0.9448 11 5.08382502 2.18226881 -1.19534623 -1.03142861 0.45798739
Na 2 0.9448 11 3.53324124 2.48697936 -0.75688448 -1.27852357 0.71875312
Na 3 0.9448 11 1.11056646 1.05458759 1.73203428 -0.09265696 28.6735059
K 0 5.3310 19 3.56079437 1.83909642 -1.74701102 -1.03237313 0.83167545
K 1 5.3310 19 3.65670429 1.67520788 -2.07416615 -0.89030421 0.85235381
K 2 5.3310 19 4.12713694 1.79837462 -1.69935174 -0.98913582 0.83216907
K 3 5.3310 19 1.42310446 1.27861156 4.77441476 -0.94829262 6.50294371
Rb 0 9.076 37 3.69628474 1.64915255 -9.86069196 0.19579987 1.66242117
Rb 1 9.076 37 4.44088978 1.92828831 -16.79597770 -0.81633314 1.50195124
Rb 2 9.076 37 3.78717363 1.57027864 -11.6558897 0.52942835 4.86851938
Rb 3 9.076 37 2.39848933 1.76810544 -12.0710678 0.77256589 4.79831327
Cs 0 15.6440 55 3.49546309 1.47533800 -9.72143084 0.02629242 1.92046930
Cs 1 15.6440 55 4.69366096 1.71398344 -24.65624280 -0.09543125 2.13383095
Cs 2 15.6440 55 4.32466196 1.61365288 -6.70128850 -0.74095193 0.93007296
Cs 3 15.6440 55 3.01048361 1.40000001 -3.20036138 0.00034538 1.99969677
"""

NIST_COPY = {"li": "li_NIST_level_data.ascii", "na": "na_NIST_level_data.ascii", "k": "k_NIST_level_data.ascii",
             "rb": "rb_NIST_level_data.ascii", "cs": "cs_NIST_level_data.ascii"}

ATOMS = [
    # id, symbol, Z, A, series, levels text, element key, version
    ("li-7", "Li", 3, 7, LI_SERIES, LI_LEVELS, "li", "1986"),
    ("na-23", "Na", 11, 23, NA_SERIES, NA_LEVELS, "na", "1983"),
    ("k-39", "K", 19, 39, K_SERIES, K_LEVELS, "k", "1983"),
    ("rb-85", "Rb", 37, 85, RB_85_SERIES, RB_LEVELS, "rb", "2006"),
    ("rb-87", "Rb", 37, 87, RB_87_SERIES, RB_LEVELS, "rb", "2011"),
    ("cs-133", "Cs", 55, 133, CS_SERIES, CS_LEVELS, "cs", "2016"),
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


def half_unit_of_last_digit_ev(text):
    decimals = len(text.split(".")[1]) if "." in text else 0
    return 0.5 * 10.0 ** (-decimals)


def parse_levels(text):
    rows = []
    for line in text.strip().splitlines():
        n, l, two_j, ev = line.split()
        rows.append((int(n), int(l), int(two_j), ev))
    return rows


def j_text(two_j):
    return "%d/2" % two_j


def label(n, l, two_j):
    return "%d%s 2%s%d/2" % (n, L_LETTERS[l], L_LETTERS[l].upper(), two_j)


def fmt(x):
    # shortest round-trip text, as Java's Double.toString reads it back
    return repr(float(x))


def main():
    report = ["# Rydberg-Ritz fit against the measured levels (NIST ASD copies in ARC), cm^-1",
              "# written by make_rydberg_data.py; tolerance %.2f cm^-1 + rounding of the tabulated value"
              % TOLERANCE_PER_CM,
              "# atom  series  n  measured  fit  fit-measured  allowed"]
    for atom_id, symbol, z, a, series, levels_text, element, version in ATOMS:
        r_m = rydberg_per_cm(MASS_U[atom_id])
        limit, limit_provenance, limit_source = LIMITS[atom_id]
        levels = parse_levels(levels_text)
        valid_from = {}
        for l, two_j, coefficients, citation, read_in in series:
            measured = sorted((n, ev) for n, ll, tj, ev in levels if ll == l and tj == two_j)
            first_good = None
            for n, ev in measured:
                e = float(ev) * PER_CM_PER_EV
                fit = ritz(limit, r_m, coefficients, n)
                allowed = TOLERANCE_PER_CM + half_unit_of_last_digit_ev(ev) * PER_CM_PER_EV
                good = abs(fit - e) <= allowed
                report.append("%-6s %s%s  %2d  %.4f  %.4f  %+.4f  %.4f%s" % (
                    atom_id, L_LETTERS[l], j_text(two_j), n, e, fit, fit - e, allowed, "" if good else "  X"))
                if good and first_good is None:
                    first_good = n
                elif not good:
                    first_good = None
            last = measured[-1][0] if measured else l + 1
            valid_from[(l, two_j)] = first_good if first_good is not None else last + 1
        # quantum-defect file
        species = "%s-%d I" % (symbol, a)
        out = ["# ritzwerk-quantum-defects 1",
               "# id: quantum-defects-%s" % atom_id,
               "# title: %s quantum defects (modified Rydberg-Ritz) for l = 0..3" % species,
               "# species: %s" % species,
               "# source: " + "; ".join(sorted({s[3] for s in series})) + "; the numbers were read in the "
               "public copies named per row (column read-in), not in the papers",
               "# provenance: published",
               "# version: %s" % version,
               "# limit-per-cm: %s" % fmt(limit),
               "# limit-provenance: %s" % limit_provenance,
               "# limit-source: %s" % limit_source,
               "# core-dipole-polarizability-au: %s" % fmt(CORE[atom_id][0]),
               "# core-quadrupole-polarizability-au: %s" % fmt(CORE[atom_id][1]),
               "# core-source: %s" % CORE[atom_id][2],
               "# levels: levels-%s" % atom_id,
               "# note: energies are above the ground level (hyperfine centroid); R_M is not stored: the provider "
               "computes it from the atomic mass in nuclear/isotopes.csv; valid-from-n is the lowest n from which "
               "the formula agrees with the measured levels within %.2f cm-1 (fit-residuals.txt, written by "
               "make_rydberg_data.py); below it the engine uses levels-%s.csv" % (TOLERANCE_PER_CM, atom_id),
               "l,j,d0,d2,d4,d6,d8,valid-from-n,provenance,source,read-in"]
        for l, two_j, coefficients, citation, read_in in series:
            cs = list(coefficients) + [0.0] * (5 - len(coefficients))
            out.append("%d,%s,%s,%d,published,%s,%s" % (
                l, j_text(two_j), ",".join(fmt(c) for c in cs), valid_from[(l, two_j)],
                citation.replace(",", ";"), read_in.replace(",", ";")))
        with open("quantum-defects-%s.csv" % atom_id, "w") as f:
            f.write("\n".join(out) + "\n")
        # levels file
        keep = []
        lowest = {}
        for n, l, two_j, ev in levels:
            lowest[(l, two_j)] = min(n, lowest.get((l, two_j), n))
        for n, l, two_j, ev in levels:
            if n < valid_from[(l, two_j)] or n == lowest[(l, two_j)]:
                keep.append((float(ev) * PER_CM_PER_EV, n, l, two_j, ev))
        keep.sort()
        lv = ["# ritzwerk-levels 1",
              "# id: levels-%s" % atom_id,
              "# title: %s measured levels below the quantum-defect fits" % species,
              "# source: NIST Atomic Spectra Database levels of %s I, read in the copy %s in "
              "nikolasibalic/ARC-Alkali-Rydberg-Calculator arc/data at commit "
              "8c04bb59fd275ae68fee329c7ceb1dee93206c60 (in eV; ASD version not stated there)"
              % (symbol, NIST_COPY[element]),
              "# provenance: published",
              "# version: NIST ASD (copy of unstated version)",
              "# energy-unit: cm-1",
              "# note: converted from eV with e/(h c) = %s cm-1/eV (exact, SI 2019); levels of the natural "
              "element, isotope shifts not applied; uncertainty is half a unit in the last eV digit printed; "
              "written by make_rydberg_data.py" % fmt(PER_CM_PER_EV),
              "species,label,energy,uncertainty,j,note"]
        for e, n, l, two_j, ev in keep:
            u = half_unit_of_last_digit_ev(ev) * PER_CM_PER_EV
            lv.append("%s,%s,%s,%s,%s,measured; %s eV" % (species, label(n, l, two_j), "%.6f" % e, "%.2g" % u,
                                                           j_text(two_j), ev))
        with open("levels-%s.csv" % atom_id, "w") as f:
            f.write("\n".join(lv) + "\n")
    mp = ["# ritzwerk Rydberg model potentials 1",
          "# source: M. Marinescu, H. R. Sadeghpour and A. Dalgarno, Phys. Rev. A 49, 982 (1994), eqs. 5-7; "
          "read in " + PAIR + " (table model_potential); ARC prints Rb l=1 a4 as -0.8163314, here -0.81633314",
          "# provenance: published",
          "# units: alpha_c in a0^3; a1, a2, a3 in a0^-1; a4 in a0^-2; r_c in a0; written by make_rydberg_data.py",
          "element,l,alpha_c,z,a1,a2,a3,a4,rc"]
    for line in MARINESCU_1994.strip().splitlines():
        mp.append(",".join(line.split()))
    with open("model-potentials.csv", "w") as f:
        f.write("\n".join(mp) + "\n")
    with open("fit-residuals.txt", "w") as f:
        f.write("\n".join(report) + "\n")


if __name__ == "__main__":
    main()
