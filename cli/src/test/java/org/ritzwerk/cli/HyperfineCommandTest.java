package org.ritzwerk.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

/** {@code lines --hyperfine} and {@code --field-tesla}: the D lines' hyperfine and Zeeman components. */
class HyperfineCommandTest {

    @Test
    void rb87D2CoolingLineAndTheSumRule() {
        CliTest.Run run = CliTest.run("lines", "--species", "Rb-87 I", "--hyperfine", "--format", "csv");
        assertEquals(0, run.code(), run.err());
        String[] rows = run.out().strip().split("\n");
        assertEquals("species,line,lower,upper,frequency_hz,uncertainty_hz,offset_mhz,vacuum_wavelength_nm,"
                + "relative_strength", rows[0]);
        assertEquals(1 + 4 + 6, rows.length, run.out());
        double d1 = 0;
        double d2 = 0;
        String cooling = null;
        for (int i = 1; i < rows.length; i++) {
            String[] f = rows[i].split(",");
            double share = Double.parseDouble(f[f.length - 1]);
            if (f[1].equals("D1")) {
                d1 += share;
            } else {
                d2 += share;
            }
            if (rows[i].contains("F=2\",\"5p 2P3/2 F'=3")) {
                cooling = rows[i];
            }
        }
        assertEquals(1, d1, 1e-12);
        assertEquals(1, d2, 1e-12);
        // F = 2 -> F' = 3 of the Rb-87 D2 line at 384 228 115.2 MHz: the centroid 384 230 484.4685 MHz
        // (Ye et al., Opt. Lett. 21, 1280 (1996), from memory) - 2563.006 MHz + 193.741 MHz (A and B of the
        // data file, by hand); the usual cooling-laser reference (common practice)
        assertTrue(cooling != null, run.out());
        assertEquals(384228115.2e6, Double.parseDouble(cooling.split(",")[4]), 0.1e6, cooling);
        // its standard uncertainty: the D2 centroid's 6.2 kHz with the 5p3/2 F' = 3 shift's from u_A = 2.0 kHz and
        // u_B = 3.7 kHz (Ye et al. 1996, from memory), 9/4 u_A and 1/4 u_B, by hand: 7.7 kHz (HyperfineUncertaintyTest
        // checks every component against an independent propagation)
        assertEquals(Math.sqrt(6200.0 * 6200 + 4500.0 * 4500 + 925.0 * 925), Double.parseDouble(cooling.split(",")[5]),
                1, cooling);
    }

    /**
     * {@code --ladder} with {@code --hyperfine}: the F-resolved paths, the lock path F = 2 -> F' = 3 -> F'' = 2 of
     * Rb-87 with the D2 component's offset -2369.2652 MHz (the D2 lock offset of {@code lines --hyperfine}, from
     * Steck's constants: RydbergHyperfineTest), and a refusal naming the level without constants.
     */
    @Test
    void aLadderResolvedIntoFLevels() {
        CliTest.Run run = CliTest.run("lines", "--species", "Rb-87 I", "--ladder", "5s1/2,5p3/2,60s1/2", "--hyperfine",
                "--format", "csv");
        assertEquals(0, run.code(), run.err());
        String[] rows = run.out().strip().split("\n");
        assertEquals("species,lower,intermediate,upper,lower_f,intermediate_f,upper_f,first_frequency_hz,"
                + "first_uncertainty_hz,first_offset_mhz,first_vacuum_wavelength_nm,first_air_wavelength_nm,"
                + "second_frequency_hz,second_uncertainty_hz,second_offset_mhz,second_vacuum_wavelength_nm,"
                + "second_air_wavelength_nm",
                rows[0].replace("\"", "")); // the CSV writer quotes names of more than 24 characters
        assertEquals(11, rows.length, run.out());
        String lock = java.util.Arrays.stream(rows).filter(r -> r.replace("\"", "")
                .startsWith("Rb-87 I,5s 2S1/2,5p 2P3/2,60s 2S1/2,2,3,2,")).findFirst().orElseThrow();
        assertEquals(-2369.2652, Double.parseDouble(lock.split(",")[9]), 1e-4, lock);
        assertTrue(run.err().contains("a Rydberg level's A and B are scaled with n*"), run.err());
        // each step's standard uncertainty (HyperfineUncertaintyTest checks them against an independent propagation):
        // step 1 the D2 centroid's 6.2 kHz with the 5p3/2 F' = 3 shift's (7.7 kHz, by hand); step 2 about 0.30 MHz,
        // mostly the 60s level's (AlkaliUncertaintyTest)
        String[] lockFields = lock.split(",");
        assertEquals(7716.58, Double.parseDouble(lockFields[8]), 0.01, lock);
        assertEquals(3.0e5, Double.parseDouble(lockFields[13]), 0.05e5, lock);
        // what the scaled 60s constant's part leaves out is said
        assertTrue(run.err().contains("60s 2S1/2 (A = 0.0997011 MHz, scaled as n*^-3 from 7s 2S1/2): its u(A) holds "
                + "the stated uncertainty of its series' constant, scaled like A, and the n*^-3 law's own error"),
                run.err());
        // JSON: the ladder's states on every row, and each step in standard air too, by the same air model as
        // the plain --ladder (Medium.air(), the standard air of the api), so the refusal of --medium air stays true
        CliTest.Run json = CliTest.run("lines", "--species", "Rb-87 I", "--ladder", "5s1/2,5p3/2,50d5/2",
                "--hyperfine", "--format", "json");
        assertEquals(0, json.code(), json.err());
        tools.jackson.databind.json.JsonMapper mapper = tools.jackson.databind.json.JsonMapper.builder().build();
        for (String line : json.out().strip().split("\\R")) {
            tools.jackson.databind.JsonNode row = mapper.readTree(line);
            assertEquals("5s 2S1/2", row.get("lower").asString());
            assertEquals("5p 2P3/2", row.get("intermediate").asString());
            assertEquals("50d 2D5/2", row.get("upper").asString());
            for (String step : new String[] {"first", "second"}) {
                double vacuum = row.get(step + "_vacuum_wavelength_nm").asDouble();
                assertEquals(org.ritzwerk.medium.Medium.air().fromVacuum(vacuum * 1e-9) * 1e9,
                        row.get(step + "_air_wavelength_nm").asDouble(), 1e-9, line);
            }
        }
        // the lock path's step 2 (F' = 3 -> F'' = 4) in air: 479.99126 nm, 0.00015 nm above the plain ladder's
        // centroid 479.991107 nm (F' = 3 lies 193.7 MHz above the 5p3/2 centroid; README example)
        String lockRow = java.util.Arrays.stream(json.out().strip().split("\\R"))
                .filter(l -> l.contains("\"lower_f\":\"2\",\"intermediate_f\":\"3\",\"upper_f\":\"4\""))
                .findFirst().orElseThrow();
        assertEquals(479.99126, mapper.readTree(lockRow).get("second_air_wavelength_nm").asDouble(), 1e-5, lockRow);
        CliTest.Run medium = CliTest.run("lines", "--species", "Rb-87 I", "--ladder", "5s1/2,5p3/2,50d5/2",
                "--hyperfine", "--medium", "air");
        assertEquals(2, medium.code(), medium.err());
        assertTrue(medium.err().contains("--ladder prints its states' lines in vacuum and air"), medium.err());
        CliTest.Run na = CliTest.run("lines", "--species", "Na-23 I", "--ladder", "3s1/2,3p3/2,30d5/2", "--hyperfine");
        assertEquals(2, na.code(), na.err());
        assertTrue(na.err().contains("--ladder with --hyperfine: no hyperfine constants for Na-23 I 30d5/2"), na.err());
    }

    /** {@code levels --hyperfine}: each F level's model says whether its A and B are measured or scaled. */
    @Test
    void levelsSayWhetherTheirConstantsAreMeasuredOrScaled() {
        CliTest.Run run = CliTest.run("levels", "--species", "Rb-87 I", "--hyperfine", "--n-max", "8", "--l-max", "0",
                "--format", "csv");
        assertEquals(0, run.code(), run.err());
        int measured = 0;
        int scaled = 0;
        for (String quoted : run.out().strip().split("\n")) {
            String row = quoted.replace("\"", "");
            String level = row.split(",")[1];
            if (level.equals("5s 2S1/2") || level.equals("7s 2S1/2")) { // 7s: the level the nS row was measured at
                assertTrue(row.endsWith("measured, hyperfine A, B measured"), row);
                measured++;
            } else if (level.equals("8s 2S1/2")) {
                assertTrue(row.endsWith("measured, hyperfine A, B scaled as n*^-3 from 7s 2S1/2"), row);
                scaled++;
            }
        }
        assertEquals(4, measured, run.out());
        assertEquals(2, scaled, run.out());
    }

    @Test
    void zeemanComponentsInAField() {
        CliTest.Run run = CliTest.run("lines", "--species", "Cs-133 I", "--hyperfine", "--field-tesla", "0.001",
                "--format", "csv");
        assertEquals(0, run.code(), run.err());
        String[] rows = run.out().strip().split("\n");
        assertTrue(rows[0].endsWith(",relative_strength,field_tesla"), rows[0]);
        double d2 = 0;
        for (int i = 1; i < rows.length; i++) {
            String[] f = rows[i].split(",");
            if (f[1].equals("D2")) {
                d2 += Double.parseDouble(f[f.length - 2]);
            }
        }
        assertEquals(1, d2, 1e-9);
        // the B^2 term left out is said with its size (ZeemanStructureTest checks the formula)
        assertTrue(run.err().contains("note: Cs-133 I: the diamagnetic (B^2) shift is left out of the components: "
                + "at 0.001 T it moves D1 by about +0.29 Hz and D2 by about +0.33 Hz"), run.err());
        // at Li-6's 832 G p1/2 and p3/2 mix (the whole 2p term is diagonalised); every upper state still
        // takes the same total strength from the ground level, so each line's shares sum to 1
        CliTest.Run lithium = CliTest.run("lines", "--species", "Li-6 I", "--hyperfine", "--field-tesla", "0.0832",
                "--format", "csv");
        assertEquals(0, lithium.code(), lithium.err());
        double[] byLine = new double[2];
        String[] liRows = lithium.out().strip().split("\n");
        for (int i = 1; i < liRows.length; i++) {
            String[] f = liRows[i].split(",");
            byLine[f[1].equals("D1") ? 0 : 1] += Double.parseDouble(f[f.length - 2]);
        }
        assertEquals(1, byLine[0], 1e-9);
        assertEquals(1, byLine[1], 1e-9);
    }

    /**
     * By default an alkali atom's levels reach two above its ground n (Rb: 7), so the ground and
     * first p levels show (the default of 4 listed only Rb 4d and 4f); with --hyperfine the levels
     * without constants are named in a note instead of passing unsplit without a word.
     */
    @Test
    void alkaliLevelsStartAtTheGroundAndUnsplitLevelsAreNamed() {
        CliTest.Run rb = CliTest.run("levels", "--species", "Rb-87 I", "--hyperfine");
        assertEquals(0, rb.code(), rb.err());
        assertTrue(rb.out().contains("5s 2S1/2") && rb.out().contains("7s 2S1/2") && !rb.out().contains("8s 2S1/2"),
                rb.out());
        assertTrue(rb.err().contains("note: Rb-87 I: no hyperfine constants for ") && rb.err().contains("5d 2D5/2")
                && rb.err().contains("listed unsplit (F -)"), rb.err());
        CliTest.Run cs = CliTest.run("levels", "--species", "Cs I");
        assertTrue(cs.out().contains("6s 2S1/2") && cs.out().contains("6p 2P3/2"), cs.out());
        assertTrue(CliTest.run("levels", "--species", "Cs I", "--n-max", "5").out().contains("5d 2D5/2"));
    }

    /** --medium air adds each component's wavelength in standard air (it was refused with --hyperfine). */
    @Test
    void componentsInAir() {
        CliTest.Run run = CliTest.run("lines", "--species", "Rb-87 I", "--hyperfine", "--medium", "air", "--format",
                "csv");
        assertEquals(0, run.code(), run.err());
        String[] rows = run.out().strip().split("\n");
        assertTrue(rows[0].contains(",vacuum_wavelength_nm,air_wavelength_nm,relative_strength"), rows[0]);
        for (int i = 1; i < rows.length; i++) {
            String[] f = rows[i].split(",");
            double vacuum = Double.parseDouble(f[f.length - 3]);
            double air = Double.parseDouble(f[f.length - 2]);
            assertEquals(org.ritzwerk.medium.Medium.air().fromVacuum(vacuum * 1e-9) * 1e9, air, 1e-9, rows[i]);
            assertTrue(vacuum - air > 0.2 && vacuum - air < 0.23, rows[i]); // about 0.21 nm at 780-795 nm
        }
        CliTest.Run zeeman = CliTest.run("lines", "--species", "Rb-87 I", "--hyperfine", "--field-tesla", "0.001",
                "--medium", "air", "--format", "csv");
        assertTrue(zeeman.out().startsWith("species,line,lower,lower_m_j,lower_m_i,lower_weight,upper,upper_j,"
                + "upper_m_j,upper_m_i,upper_weight,polarisation,frequency_hz,uncertainty_hz,field_slope_hz_per_t,"
                + "offset_mhz,vacuum_wavelength_nm,air_wavelength_nm,relative_strength,field_tesla\n"), zeeman.out());
    }

    /**
     * Zeeman components carry the uncertainty column of the zero-field ones (equal to them at 0 T, where the
     * Hellmann-Feynman derivatives are the Casimir factors; ZeemanUncertaintyTest checks the values against an
     * independent propagation) and each state's largest |m_J m_I> component: at 1 T, well into the Paschen-Back
     * regime of the Rb-87 ground level (mu_B B about 8 times its 6.8 GHz splitting), every ground state is
     * nearly pure, weight above 0.98 (0.986 at least, by make_zeeman_uncertainty_golden.py), and the F = 2 branch
     * but its m_F = -2 state has m_J = +1/2 (the Breit-Rabi branches; common practice).
     */
    @Test
    void zeemanComponentsCarryUncertaintiesAndHighFieldLabels() {
        CliTest.Run zero = CliTest.run("lines", "--species", "Rb-87 I", "--hyperfine", "--field-tesla", "0",
                "--format", "csv");
        CliTest.Run plain = CliTest.run("lines", "--species", "Rb-87 I", "--hyperfine", "--format", "csv");
        assertEquals(0, zero.code(), zero.err());
        java.util.Map<String, Double> byF = new java.util.HashMap<>();
        for (String row : plain.out().strip().split("\n")) {
            String[] f = row.replace("\"", "").split(",");
            if (!f[0].equals("species")) {
                byF.put(f[1] + " " + f[2].replaceAll(".*F=", "") + " " + f[3].replaceAll(".*F'=", ""),
                        Double.parseDouble(f[5]));
            }
        }
        String[] rows = zero.out().strip().split("\n");
        assertEquals(1 + 36 + 54, rows.length, zero.out());
        for (int i = 1; i < rows.length; i++) {
            String[] f = rows[i].replace("\"", "").split(",");
            String key = f[1] + " " + f[2].replaceAll(".*F=(\\S+) mF.*", "$1") + " "
                    + f[6].replaceAll(".*F'=(\\S+) mF.*", "$1");
            assertEquals(byF.get(key), Double.parseDouble(f[13]), 1e-6 * byF.get(key), rows[i]);
        }
        CliTest.Run high = CliTest.run("lines", "--species", "Rb-87 I", "--hyperfine", "--field-tesla", "1",
                "--format", "csv");
        assertEquals(0, high.code(), high.err());
        assertTrue(high.err().contains("note: --field-tesla: u Hz is each component's own standard uncertainty"),
                high.err());
        for (String row : high.out().strip().split("\n")) {
            String[] f = row.replace("\"", "").split(",");
            if (f[0].equals("species")) {
                continue;
            }
            String lower = f[2];
            int twoMF = 2 * Integer.parseInt(lower.replaceAll(".*mF=", ""));
            boolean upperBranch = lower.contains("F=2") && twoMF != -4;
            assertEquals(upperBranch ? "1/2" : "-1/2", f[3], row);
            int twoMI = twoMF - (upperBranch ? 1 : -1);
            assertEquals(twoMI + "/2", f[4], row);
            assertTrue(Double.parseDouble(f[5]) > 0.98, row);
            // Rb's 7 THz fine structure keeps each upper state's largest component in its own J at 1 T
            assertEquals(f[1].equals("D1") ? "1/2" : "3/2", f[7], row);
            assertTrue(Double.parseDouble(f[13]) > 6000 && Double.parseDouble(f[13]) < 30000, row);
        }
        // Li's 10 GHz fine structure does not at 3 T: some D2 upper states are mostly J = 1/2 there
        CliTest.Run lithium = CliTest.run("lines", "--species", "Li-7 I", "--hyperfine", "--field-tesla", "3",
                "--format", "csv");
        assertTrue(java.util.Arrays.stream(lithium.out().split("\n")).map(r -> r.replace("\"", "").split(","))
                .anyMatch(f -> f[1].equals("D2") && f[7].equals("1/2")), lithium.out());
    }

    /**
     * The field slope column: the Rb-87 D2 cycling component F = 2, m_F = 2 -> F' = 3, m_F' = 3 moves by exactly
     * mu_B / h = 13.996 GHz/T (1.4 MHz/G; common practice: both states stretched, g_L = 1; CODATA 2018 mu_B / h,
     * from memory) at any field, printed in MHz/mT in text; with --field-uncertainty-tesla each u Hz takes
     * |dnu/dB| u(B) in quadrature (ZeemanUncertaintyTest checks every component against 40-digit central
     * differences), the option's value in its own column, and 0 changes no u Hz.
     */
    @Test
    void fieldSlopeAndFieldUncertainty() {
        CliTest.Run csv = CliTest.run("lines", "--species", "Rb-87 I", "--hyperfine", "--field-tesla", "1e-4",
                "--format", "csv");
        assertEquals(0, csv.code(), csv.err());
        CliTest.Run known = CliTest.run("lines", "--species", "Rb-87 I", "--hyperfine", "--field-tesla", "1e-4",
                "--field-uncertainty-tesla", "1e-6", "--format", "csv");
        assertEquals(0, known.code(), known.err());
        CliTest.Run zero = CliTest.run("lines", "--species", "Rb-87 I", "--hyperfine", "--field-tesla", "1e-4",
                "--field-uncertainty-tesla", "0", "--format", "csv");
        String[] rows = csv.out().strip().split("\n");
        String[] knownRows = known.out().strip().split("\n");
        String[] zeroRows = zero.out().strip().split("\n");
        assertTrue(knownRows[0].endsWith(",relative_strength,field_tesla,field_uncertainty_tesla"), knownRows[0]);
        assertEquals(rows.length, knownRows.length);
        int cycling = 0;
        for (int i = 1; i < rows.length; i++) {
            String[] f = rows[i].replace("\"", "").split(",");
            String[] k = knownRows[i].replace("\"", "").split(",");
            String[] z = zeroRows[i].replace("\"", "").split(",");
            double u = Double.parseDouble(f[13]);
            double slope = Double.parseDouble(f[14]);
            assertEquals(Math.hypot(u, slope * 1e-6), Double.parseDouble(k[13]), 1e-9 * u, knownRows[i]);
            assertEquals(f[13], z[13], zeroRows[i]); // u(B) = 0: the same text, to the last digit
            assertEquals("1.0E-6", k[k.length - 1], knownRows[i]);
            if (f[1].equals("D2") && f[2].endsWith("F=2 mF=2") && f[6].endsWith("F'=3 mF'=3")) {
                assertEquals(13.9962449361e9, slope, 1, rows[i]);
                cycling++;
            }
        }
        assertEquals(1, cycling, csv.out());
        assertTrue(known.err().contains("and the field's, |dnu/dB| times the --field-uncertainty-tesla 0.000001 T"),
                known.err());
        assertTrue(csv.err().contains("the field's (taken as exact; give --field-uncertainty-tesla)"), csv.err());
        // text: MHz per mT; JSON: Hz per tesla
        CliTest.Run text = CliTest.run("lines", "--species", "Rb-87 I", "--hyperfine", "--field-tesla", "1e-4");
        assertTrue(text.out().contains("dnu/dB MHz/mT"), text.out());
        assertTrue(text.out().lines().anyMatch(l -> l.contains("5s 2S1/2 F=2 mF=2") && l.contains("F'=3 mF'=3")
                && l.contains(" 13.996245 ")), text.out());
        CliTest.Run json = CliTest.run("lines", "--species", "Rb-87 I", "--hyperfine", "--field-tesla", "1e-4",
                "--format", "json");
        assertTrue(json.out().contains("\"field_slope_hz_per_t\":1.399624493"), json.out());
    }

    @Test
    void badFieldUncertaintyIsRefusedWithExit2() {
        String[] base = {"lines", "--species", "Rb-87 I", "--hyperfine", "--field-tesla", "1e-4",
            "--field-uncertainty-tesla"};
        for (String[] bad : new String[][] {{"-1e-6", "must be a standard uncertainty of 0 to 1000 T, got -1e-6"},
            {"NaN", "must be a standard uncertainty of 0 to 1000 T, got a value that is not a number"},
            {"Infinity", "must be a standard uncertainty of 0 to 1000 T, got an infinite value"},
            {"10 mG", "--field-uncertainty-tesla takes the field's standard uncertainty in tesla as a plain number, "
                + "without a unit (e.g. 1e-6 for 10 mG"}}) {
            String[] args = java.util.Arrays.copyOf(base, base.length + 1);
            args[base.length] = bad[0];
            CliTest.Run run = CliTest.run(args);
            assertEquals(2, run.code(), bad[0] + ": " + run.err());
            assertTrue(run.err().contains(bad[1]), bad[0] + ": " + run.err());
        }
        // without --field-tesla it would have no effect: refused, with --hyperfine or in any other table
        for (String[] args : new String[][] {{"lines", "--species", "Rb-87 I", "--hyperfine",
            "--field-uncertainty-tesla", "1e-6"}, {"lines", "--species", "Rb-87 I", "--transition", "5s1/2 -> 5p3/2",
            "--field-uncertainty-tesla", "1e-6"}}) {
            CliTest.Run run = CliTest.run(args);
            assertEquals(2, run.code(), run.err());
            assertTrue(run.err().contains("--field-uncertainty-tesla has no effect without --field-tesla"), run.err());
        }
    }

    @Test
    void badInputIsRefusedWithExit2() {
        CliTest.Run negative = CliTest.run("lines", "--species", "Rb-87 I", "--hyperfine", "--field-tesla", "-1");
        assertEquals(2, negative.code());
        assertTrue(negative.err().contains("--field-tesla must be a field of 0 to 1000 T, got -1"), negative.err());
        CliTest.Run alone = CliTest.run("lines", "--species", "Rb-87 I", "--field-tesla", "0.1");
        assertEquals(2, alone.code());
        assertTrue(alone.err().contains("--field-tesla needs --hyperfine"), alone.err());
        CliTest.Run ion = CliTest.run("lines", "--species", "H I", "--hyperfine");
        assertEquals(2, ion.code());
        assertTrue(ion.err().contains("--hyperfine needs alkali isotopes"), ion.err());
        CliTest.Run window = CliTest.run("lines", "--species", "Rb-87 I", "--hyperfine", "--from", "1 GHz");
        assertEquals(2, window.code());
        assertTrue(window.err().contains("--from has no effect with --hyperfine"), window.err());
        // a field with a unit: the option takes tesla as a plain number, and the message says how to write 1 G
        CliTest.Run gauss = CliTest.run("lines", "--species", "Rb-87 I", "--hyperfine", "--field-tesla", "1 G");
        assertEquals(2, gauss.code(), gauss.err());
        assertTrue(gauss.err().contains("--field-tesla takes the field in tesla as a plain number, without a unit "
                + "(e.g. 1e-4 for 1 G"), gauss.err());
        // an isotope without level data (Rb-86: radioactive, no quantum defects or levels built in) is named as such
        CliTest.Run rb86 = CliTest.run("lines", "--species", "Rb-86 I", "--hyperfine");
        assertEquals(2, rb86.code(), rb86.err());
        assertTrue(rb86.err().contains("no alkali level data (quantum defects and levels, hence no lines, lifetimes or "
                + "hyperfine structure) for Rb-86 I; isotopes with level data: Li-6 I"), rb86.err());
        // the note on levels listed unsplit points to a README section that exists
        CliTest.Run unsplit = CliTest.run("levels", "--species", "Rb-87 I", "--hyperfine", "--n-max", "6");
        assertEquals(0, unsplit.code(), unsplit.err());
        assertTrue(unsplit.err().contains("README, Built-in reference data, names the levels that have them"),
                unsplit.err());
        assertTrue(readme().contains("### Built-in reference data"));
    }

    private static String readme() {
        try {
            return java.nio.file.Files.readString(java.nio.file.Path.of("..", "README.md"));
        } catch (java.io.IOException e) {
            throw new java.io.UncheckedIOException(e);
        }
    }

    /**
     * A field too weak to resolve (1e-160 T) gives the zero-field components, as the engine takes it
     * (it stopped with an internal error, and at 1e-200 T printed no component), and the notes give
     * such a field in powers of ten rather than 160 zeros.
     */
    @Test
    void aFieldTooWeakToResolveGivesTheZeroFieldComponents() {
        CliTest.Run zero = CliTest.run("lines", "--species", "Rb-87 I", "--hyperfine", "--field-tesla", "0",
                "--format", "csv");
        for (String field : new String[] {"1e-160", "1e-200"}) {
            CliTest.Run weak = CliTest.run("lines", "--species", "Rb-87 I", "--hyperfine", "--field-tesla", field,
                    "--format", "csv");
            assertEquals(0, weak.code(), weak.err());
            String[] zeroRows = zero.out().strip().split("\n");
            String[] weakRows = weak.out().strip().split("\n");
            assertEquals(zeroRows.length, weakRows.length, weak.out());
            for (int k = 1; k < zeroRows.length; k++) {
                // every column but the field's, the last
                assertEquals(zeroRows[k].substring(0, zeroRows[k].lastIndexOf(',')),
                        weakRows[k].substring(0, weakRows[k].lastIndexOf(',')));
            }
            assertTrue(weak.err().contains("at " + field.toUpperCase(java.util.Locale.ROOT) + " T"),
                    weak.err());
        }
    }
}
