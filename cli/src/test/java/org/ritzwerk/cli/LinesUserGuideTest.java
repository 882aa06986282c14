package org.ritzwerk.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.List;
import org.junit.jupiter.api.Test;
import org.ritzwerk.atom.Species;
import org.ritzwerk.engine.hydrogenic.HydrogenLikeModel;
import org.ritzwerk.engine.hydrogenic.Tier;
import org.ritzwerk.engine.lines.LineQuery;
import org.ritzwerk.engine.lines.LineSet;
import org.ritzwerk.engine.lines.LineSources;
import org.ritzwerk.medium.Medium;
import org.ritzwerk.quantity.Wavelength;
import org.ritzwerk.refdata.DataContext;

/**
 * The README's line-query example ("Using the library"): the Balmer series of H I with A values
 * and air wavelengths, and the D lines of Rb-87, each through one query; the numbers are those
 * the {@code lines} command prints.
 */
class LinesUserGuideTest {

    @Test
    void theBalmerSeriesAndTheRubidiumDLines() {
        DataContext data = DataContext.builtIn();
        Species hydrogen = Species.parse("H I");
        Species rb87 = Species.parse("Rb-87 I");
        LineSources sources = LineSources.none()
                .withHydrogenLike(hydrogen, HydrogenLikeModel.of(data.nucleus(hydrogen), Tier.QED))
                .withAlkali(data.alkaliAtom(rb87));
        LineQuery visible = LineQuery.defaults().withMaxN(10)
                .withWindow(Wavelength.ofNanometres(360, Medium.air()), Wavelength.ofNanometres(800, Medium.air()));

        LineSet balmer = visible.withSpecies(List.of(hydrogen)).withMultiplets(true).withLowerN(2).run(sources);
        LineSet dLines = visible.withSpecies(List.of(rb87)).withMaxN(5).withMaxL(1).run(sources);

        int alpha = balmer.size() - 1;                                  // by falling frequency
        double alphaAirNm = balmer.wavelengthMetres(alpha, Medium.air()) * 1e9;
        double alphaA = balmer.einsteinA(alpha).getAsDouble();          // s^-1
        double d2AirNm = dLines.wavelengthMetres(0, Medium.air()) * 1e9;

        assertEquals(8, balmer.size());                                 // n = 3 .. 10 -> 2
        assertEquals("Balmer alpha", balmer.name(alpha));
        // H-alpha 656.28 nm in air (NIST ASD H I lines, from memory; the Rydberg formula gives
        // 656.47 nm in vacuum), A = 4.4101e7 s^-1 (Wiese & Fuhr, J. Phys. Chem. Ref. Data 38, 565 (2009)).
        assertEquals(656.28, alphaAirNm, 0.01);
        assertEquals(4.4101e7, alphaA, 4.4101e4);
        assertEquals(2, dLines.size());
        assertEquals("5p 2P3/2", dLines.upperLabel(0).orElseThrow());  // D2, then D1
        assertEquals("5p 2P1/2", dLines.upperLabel(1).orElseThrow());
        // D2 and D1 at 780.241 and 794.979 nm in vacuum: 1e7 / 12816.545 and 1e7 / 12578.950 cm-1,
        // the 5p levels of the NIST ASD Rb I table (from memory, as in refdata's levels-rb-87).
        assertEquals(780.241, dLines.vacuumWavelengthNm(0), 0.001);
        assertEquals(794.979, dLines.vacuumWavelengthNm(1), 0.001);

        // The same numbers as `ritzwerk lines ... --medium air --format csv` (full precision).
        List<String[]> hRows = rows(CliTest.run("lines", "--species", "H I", "--from", "360 nm air", "--to",
                "800 nm air", "--n-max", "10", "--multiplets", "--medium", "air", "--format", "csv").out());
        String[] hAlpha = hRows.get(hRows.size() - 1);
        assertEquals("Balmer alpha", hAlpha[3].replace("\"", ""));
        assertEquals(alphaAirNm, Double.parseDouble(hAlpha[4]), 0.0);
        assertEquals(alphaA, Double.parseDouble(hAlpha[8]), 0.0);
        List<String[]> rbRows = rows(CliTest.run("lines", "--species", "Rb-87 I", "--from", "360 nm air", "--to",
                "800 nm air", "--n-max", "5", "--l-max", "1", "--medium", "air", "--format", "csv").out());
        assertEquals(2, rbRows.size());
        assertEquals(d2AirNm, Double.parseDouble(rbRows.get(0)[4]), 0.0);
        // alkali lines have the uncertainty_nm column (index 6) before the frequency and A
        assertEquals(dLines.einsteinA(1).getAsDouble(), Double.parseDouble(rbRows.get(1)[9]), 0.0);
    }

    /** The data rows of a CSV table without quoted commas. */
    private static List<String[]> rows(String csv) {
        return csv.lines().skip(1).map(line -> line.split(",")).toList();
    }
}
