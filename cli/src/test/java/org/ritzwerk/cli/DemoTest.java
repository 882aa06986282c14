package org.ritzwerk.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.ritzwerk.atom.Species;
import org.ritzwerk.atom.State;
import org.ritzwerk.constants.PhysicalConstants;
import org.ritzwerk.engine.rydberg.AlkaliAtom;
import org.ritzwerk.medium.Medium;
import org.ritzwerk.refdata.DataContext;

/**
 * The demo end to end: its report holds the expected identifications and its estimates come
 * back near the invented truth it was generated from.
 */
class DemoTest {

    @Test
    void theScenarioFindsWhatWasPutIn(@TempDir Path dir) throws IOException {
        StringWriter text = new StringWriter();
        DemoScenario.Results r = new DemoScenario(dir.resolve("out"), new PrintWriter(text), 2,
                DataOptions.context(java.util.List.of())).run();
        String report = text.toString();
        assertTrue(report.contains("an invented scenario"), report);
        // The library's fits left nothing unreported and nothing non-finite in the text.
        assertTrue(!report.contains("NaN") && !report.contains("Infinity"), report);
        assertTrue(report.contains("D/H from their fluxes 0.5"), report);
        // The lamp is described generically, never by a maker's trademark.
        assertTrue(report.replaceAll("\\s+", " ").contains("a small neon calibration lamp"), report);
        assertTrue(Files.readString(dir.resolve("out").resolve("neon-lamp.csv")).contains("a small neon calibration lamp"));
        // Calibration: within a tenth of a pixel of the invented dispersion everywhere.
        assertTrue(r.calibrationWorstErrorPixels < 0.1, report);
        assertTrue(r.calibrationLinesUsed >= 15, report);
        // Identification: Balmer lines of H and D, He II lines of the core.
        for (String line : new String[] {"H I Balmer alpha", "D I Balmer alpha", "H I+D I Balmer beta",
            "H I+D I Balmer gamma", "He II 4686 (4-3)"}) {
            assertTrue(r.identified.contains(line), line + " in " + r.identified);
        }
        // Velocity within 3 of its standard uncertainties of the invented 6 km/s.
        assertEquals(DemoScenario.DISCHARGE_VELOCITY, r.velocity, 3 * r.velocityUncertainty, report);
        // The isotope shift of Balmer-alpha within 0.01 nm of the model's 0.1785 nm.
        assertEquals(r.isotopeShiftPredicted, r.isotopeShiftMeasured, 0.01, report);
        assertEquals(DemoScenario.DEUTERIUM_RATIO, r.deuteriumRatio, 0.1, report);
        // Temperature within 10 %, density within 30 % (He II lines of the core sit under
        // H-beta, H-gamma and H-delta and bias both a little).
        assertEquals(DemoScenario.DISCHARGE_TEMPERATURE, r.temperature, 0.1 * DemoScenario.DISCHARGE_TEMPERATURE, report);
        assertEquals(DemoScenario.DISCHARGE_DENSITY, r.density, 0.3 * DemoScenario.DISCHARGE_DENSITY, report);
        // Rydberg planning: the 50d5/2 -> 51p3/2 line of Rb-87 is the model's (as the report says;
        // no published measurement of it is used here) and the second laser lies near 480 nm: the
        // Rb ionization energy 33 690.80 cm-1 (M. Mack et al., Phys. Rev. A 83, 052515 (2011);
        // recalled, from memory) less the 5p3/2 energy 12 816.55 cm-1 and the 50d binding
        // R / n*^2 = 46.4 cm-1 (n* = 48.65 with the d5/2 quantum defect 1.35; T. F. Gallagher,
        // Rydberg Atoms (Cambridge, 1994), ch. 2) is 20 827.9 cm-1, 479.99 nm in air.
        AlkaliAtom rb = DataContext.builtIn().alkaliAtom(Species.parse("Rb-87 I"));
        double modelGhz = Math.abs(rb.frequencyHz(State.parse("51p3/2"), State.parse("50d5/2"))) / 1e9;
        assertEquals(modelGhz, r.rydbergMicrowaveGhz.get(1), 1e-9, report);
        assertEquals(480.0, r.rydbergSecondLaserNm.get(1), 0.5, report);
        // The cooling/lock line 5s1/2 F=2 -> 5p3/2 F'=3: the Rb-87 D2 centroid 384 230 484.4685 MHz
        // (Ye et al., Opt. Lett. 21, 1280 (1996), as in d-lines.csv) less 3/4 A(5s) = 2563.006 MHz
        // (A = 3417.341 MHz, half the ground splitting 6834.683 MHz of Bize et al. 1999)
        // plus 9/4 A + B/4 of 5p3/2 (A = 84.7185, B = 12.4965 MHz, Arimondo et al. 1977, from memory):
        // 384.228115 THz to 1 MHz.
        assertEquals(384.2304844685 - 2563.006e-6 + (2.25 * 84.7185 + 12.4965 / 4) * 1e-6, r.rydbergLockTerahertz,
                1e-6, report);
        assertTrue(report.contains("Laser 1 locks to D2 5s1/2 F=2 -> 5p3/2 F'=3"), report);
        // The table says which wavelengths are centroids and which the lock components; laser 2's lock from
        // 5p3/2 F'=3 lies 9/4 A + B/4 = 193.74 MHz below its centroid (F'=3 sits that far above the 5p3/2
        // centroid; A = 84.7185, B = 12.4965 MHz, Arimondo et al. 1977, from memory), less the kHz-sized
        // shift of the Rydberg level's F''=4: 0.15 pm longer at 480 nm.
        String flat = report.replaceAll("\\s+", " ");
        assertTrue(flat.contains("'centroid' joins the levels' hyperfine-free centroids (fine structure only); 'lock' "
                + "is the hyperfine component a locked laser sits on"), report);
        for (int i = 0; i < 3; i++) {
            double centroidHz = PhysicalConstants.C / Medium.air().toVacuum(r.rydbergSecondLaserNm.get(i) * 1e-9);
            double lockHz = PhysicalConstants.C / Medium.air().toVacuum(r.rydbergSecondLaserLockNm.get(i) * 1e-9);
            assertEquals(-(2.25 * 84.7185 + 12.4965 / 4), (lockHz - centroidHz) / 1e6, 0.05, report);
        }
        assertTrue(flat.contains("laser 2 from F'=3 to 50d5/2 F''=4 is -193."), report);
        // the lifetimes' stated uncertainty (the model spread, LifetimeModelSpreadTest) is said beside them, to
        // the digit lines --transition prints (the largest of the three states at each temperature)
        double spread0 = 0;
        double spread300 = 0;
        for (int n : new int[] {40, 50, 60}) {
            State s = State.of(n, 2, 5);
            spread0 = Math.max(spread0, rb.radiativeLifetimeUncertainty(s).orElseThrow() / rb.radiativeLifetime(s));
            spread300 = Math.max(spread300, rb.effectiveLifetimeUncertainty(s, 300).orElseThrow()
                    / rb.effectiveLifetime(s, 300));
        }
        assertTrue(flat.contains(String.format(java.util.Locale.ROOT, "uncertain by up to %.1f %% at 0 K and %.1f %% "
                + "at 300 K", 100 * spread0, 100 * spread300)), report);
        assertTrue(spread0 > 0.08 && spread0 < 0.09 && spread300 > 0.05 && spread300 < 0.06, spread0 + " " + spread300);
        for (String name : new String[] {"neon-lamp.csv", "calibration.json", "calibration-residuals.png",
            "discharge.csv", "discharge.png", "discharge-peaks.csv"}) {
            assertTrue(Files.size(dir.resolve("out").resolve(name)) > 100, name);
        }
        // The files it writes are inputs the commands take: calibrate the lamp file again.
        CliTest.Run again = CliTest.run("calibrate", dir.resolve("out").resolve("neon-lamp.csv").toString(),
                "--lamp", "Ne I");
        assertEquals(0, again.code(), again.err());
        CliTest.Run identify = CliTest.run("identify", dir.resolve("out").resolve("discharge-peaks.csv").toString(),
                "--species", "H I,D I,He II", "--search-velocity", "50", "--tolerance", "0.06 nm");
        assertEquals(0, identify.code(), identify.err());
        assertTrue(identify.out().contains("8 peaks: 8 matched"), identify.out());
        // the report says the command's velocity comes out about 2 km/s lower than its own (it said
        // 3 km/s; a review measured 3.91 against 5.77 km/s)
        assertTrue(report.contains("comes out about 2 km/s lower than the report's"), report);
        java.util.regex.Matcher v = java.util.regex.Pattern.compile("velocity (-?[0-9.]+) \\+- ")
                .matcher(identify.out());
        assertTrue(v.find(), identify.out());
        assertEquals(2.0, r.velocity / 1e3 - Double.parseDouble(v.group(1)), 0.5, identify.out());
    }

    @Test
    void theCommandNamesItsFolder(@TempDir Path dir) {
        CliTest.Run run = CliTest.run("demo", "--out-dir", dir.resolve("wrenfield").toString());
        assertEquals(0, run.code(), run.err());
        assertTrue(run.out().contains("Files written to " + dir.resolve("wrenfield").toAbsolutePath()), run.out());
    }

    @Test
    void aFolderOfTheUsersIsRefusedAndTheDemosOwnIsReused(@TempDir Path dir) throws java.io.IOException {
        Path mine = dir.resolve("mine");
        Files.createDirectories(mine);
        Files.writeString(mine.resolve("notes.txt"), "precious");
        CliTest.Run refused = CliTest.run("demo", "--out-dir", mine.toString());
        assertEquals(2, refused.code(), refused.err());
        assertTrue(refused.err().contains("already holds files the demo did not make (notes.txt)"), refused.err());
        assertEquals("precious", Files.readString(mine.resolve("notes.txt")));
        try (var files = Files.list(mine)) {
            assertEquals(1, files.count(), "nothing was added");
        }
        // The demo's own folder may be run into again.
        Path ours = dir.resolve("ours");
        assertEquals(0, CliTest.run("demo", "--out-dir", ours.toString()).code());
        CliTest.Run again = CliTest.run("demo", "--out-dir", ours.toString());
        assertEquals(0, again.code(), again.err());
    }
}
