package org.ritzwerk.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.junit.jupiter.api.Test;
import org.ritzwerk.atom.Species;
import org.ritzwerk.engine.hydrogenic.Tier;
import org.ritzwerk.engine.lines.LineQuery;
import org.ritzwerk.engine.lines.LineSet;
import org.ritzwerk.engine.lines.LineSources;
import org.ritzwerk.engine.ritz.RitzLines;
import org.ritzwerk.medium.Medium;
import org.ritzwerk.quantity.Wavelength;
import org.ritzwerk.refdata.DataContext;
import org.ritzwerk.refdata.DataLines;

/**
 * The lines of a level list are the same whichever way a user asks: the engine's plain
 * {@code LineSources.withLevelList}, refdata's {@code DataLines.sources} and the {@code lines}
 * command all apply the LS rules where the labels give terms.
 */
class LevelListLinesAgreeTest {

    private static final Species HE = Species.parse("He I");
    // 1s4d 3D1 - 1s2p 1P1 changes the spin: the LS rules forbid it (common practice).
    private static final String SPIN_CHANGING = "1s4d 3D1 - 1s2p 1P1";

    @Test
    void theEngineRefdataAndTheCommandGiveTheSameHeliumLines() {
        DataContext data = DataContext.builtIn();
        LineQuery window = LineQuery.defaults()
                .withWindow(Wavelength.ofNanometres(490, Medium.air()), Wavelength.ofNanometres(510, Medium.air()));
        LineSet plain = window.run(LineSources.none().withLevelList(data.levelList(HE).orElseThrow()));
        LineSet fromData = window.run(DataLines.sources(data, List.of(HE), Tier.QED));
        List<String[]> rows = CliTest.run("lines", "--species", "He I", "--from", "490 nm air", "--to",
                "510 nm air", "--medium", "air", "--format", "csv").out().lines().skip(1)
                .map(line -> line.split(",")).toList();

        assertTrue(plain.size() > 0);
        assertEquals(names(fromData), names(plain));
        assertEquals(rows.size(), plain.size());
        for (int i = 0; i < plain.size(); i++) {
            assertEquals(fromData.vacuumWavelengthNm(i), plain.vacuumWavelengthNm(i), 0.0);
            assertEquals(plain.name(i), rows.get(i)[3].replace("\"", ""));
            assertEquals(plain.wavelengthMetres(i, Medium.air()) * 1e9, Double.parseDouble(rows.get(i)[4]), 0.0);
        }
        assertFalse(names(plain).contains(SPIN_CHANGING), names(plain).toString());
        // He I 1s3p 1P1 - 1s2s 1S0 at 501.568 nm in air (NIST ASD He I lines, from memory): 0.001 nm.
        int i = names(plain).indexOf("1s3p 1P1 - 1s2s 1S0");
        assertEquals(501.568, plain.wavelengthMetres(i, Medium.air()) * 1e9, 0.001);
        // The looser rules, asked for explicitly, let the spin-changing line through.
        LineSet loose = window.run(LineSources.none().withLevelList(data.levelList(HE).orElseThrow(),
                RitzLines.defaults()));
        assertTrue(names(loose).contains(SPIN_CHANGING), names(loose).toString());
    }

    private static List<String> names(LineSet lines) {
        return java.util.stream.IntStream.range(0, lines.size()).mapToObj(lines::name).toList();
    }
}
