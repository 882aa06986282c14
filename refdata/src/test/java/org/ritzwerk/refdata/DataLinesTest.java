package org.ritzwerk.refdata;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.junit.jupiter.api.Test;
import org.ritzwerk.atom.Species;
import org.ritzwerk.data.LineList;
import org.ritzwerk.engine.hydrogenic.Tier;
import org.ritzwerk.engine.lines.LineQuery;
import org.ritzwerk.engine.lines.LineSet;
import org.ritzwerk.engine.lines.LineSources;
import org.ritzwerk.medium.Medium;
import org.ritzwerk.quantity.Wavelength;

/** Line sources from a data context: ions, alkali atoms and the built-in lamp lists through one query. */
class DataLinesTest {

    /**
     * The lamp of a gas: its lamp set where one exists (Ne I, the same lines as the set read
     * directly), else the Ritz lines of its level list ranked by g_u A (He I), the visible
     * triplet 587.6 nm among them with weight 7 A; a species with neither is refused.
     */
    @Test
    void aSpeciesFilterWithoutMassNumberKeepsTheLinesOfTheIsotopeTheContextResolves() {
        // "Cs I" is computed as Cs-133 I; filtering by "Cs I" gave no lines when the filter was exact.
        DataContext data = DataContext.builtIn();
        for (String element : List.of("Li I", "Na I", "Rb I", "Cs I")) {
            Species s = Species.parse(element);
            LineSources sources = DataLines.sources(data, List.of(s), Tier.QED);
            LineQuery query = LineQuery.defaults().withMaxN(8)
                    .withWindow(Wavelength.ofNanometres(300, Medium.vacuum()), Wavelength.ofNanometres(1000,
                            Medium.vacuum()));
            LineSet all = query.run(sources);
            assertTrue(all.size() > 0, element);
            assertEquals(all, query.withSpecies(List.of(s)).run(sources), element);
        }
        // Cs D2 and D1 at 852.35 and 894.59 nm in vacuum (NIST ASD Cs I, from memory): 0.01 nm.
        LineSet cs = LineQuery.defaults().withMaxN(6).withMaxL(1).withSpecies(List.of(Species.parse("Cs I")))
                .withWindow(Wavelength.ofNanometres(800, Medium.vacuum()),
                        Wavelength.ofNanometres(900, Medium.vacuum()))
                .run(DataLines.sources(data, List.of(Species.parse("Cs I")), Tier.QED));
        assertEquals(2, cs.size());
        assertEquals(852.35, cs.vacuumWavelengthNm(0), 0.01);
        assertEquals(894.59, cs.vacuumWavelengthNm(1), 0.01);
    }

    @Test
    void aLampIsTheLampSetOrTheLevelListsRitzLines() {
        DataContext data = DataContext.builtIn();
        org.ritzwerk.engine.calibrate.LampSet neon = DataLines.lamp(data, Species.parse("Ne I"), Medium.air());
        org.ritzwerk.engine.calibrate.LampSet direct = org.ritzwerk.engine.calibrate.LampSet.of(
                List.of(data.lampLines(Species.parse("Ne I"))), Medium.air());
        assertEquals(direct.size(), neon.size());
        assertEquals(direct.setIds(), neon.setIds());
        assertEquals(0, neon.withoutRate());

        org.ritzwerk.engine.calibrate.LampSet helium = DataLines.lamp(data, Species.parse("He I"), Medium.air());
        assertEquals(List.of("levels-he-i"), helium.setIds());
        assertTrue(helium.outsideMedium() > 100, helium.outsideMedium() + " outside");
        assertTrue(helium.withoutRate() > 0, helium.withoutRate() + " without A");
        int found = -1;
        for (int i = 0; i < helium.size(); i++) {
            found = helium.label(i).equals("He I 1s3d 3D3 - 1s2p 3P2") ? i : found;
        }
        assertTrue(found >= 0, "587.6 nm 3D3 component");
        // Source: lines-he-i's A of 1s3d 3D3 - 1s2p 3P2, times g_u = 7 (the level's 2J + 1).
        LineList rates = data.lineList("lines-he-i");
        double a = Double.NaN;
        for (int i = 0; i < rates.size(); i++) {
            if ("1s3d 3D3".equals(rates.upper(i)) && "1s2p 3P2".equals(rates.lower(i))) {
                a = rates.einsteinA(i).orElseThrow();
            }
        }
        assertEquals(7 * a, helium.lines().intensity(found), 1e-9 * a);
        // 587.5618 nm in air (common practice: the He D3 line).
        assertEquals(587.5618, helium.lines().wavelength(found), 5e-4);
        assertThrows(ReferenceDataException.class, () -> DataLines.lamp(data, Species.parse("Xe II"), Medium.air()));
    }

    /**
     * A calibration lamp of several gases: lamp sets as they are (Ne I, unblended without a
     * resolving power), a gas with only a level list (He I) blended at the default resolving power,
     * the sets first; a given resolving power blends both; a gas with neither is refused by name.
     */
    @Test
    void aCalibrationLampJoinsLampSetsAndLevelListsAsTheCommandDoes() {
        DataContext data = DataContext.builtIn();
        Species ne = Species.parse("Ne I");
        Species he = Species.parse("He I");
        DataLines.CalibrationLamp lamp = DataLines.calibrationLamp(data, List.of(he, ne), List.of(), Medium.air(),
                Double.NaN);
        org.ritzwerk.engine.calibrate.LampSet neon = DataLines.lamp(data, ne, Medium.air());
        org.ritzwerk.engine.calibrate.LampSet helium = DataLines.lamp(data, he, Medium.air())
                .blendedAt(DataLines.DEFAULT_LEVEL_LAMP_RESOLVING_POWER);
        assertEquals(neon.size(), lamp.fromLists().size());
        assertEquals(1, lamp.fromLevels().size());
        assertEquals(he, lamp.fromLevels().get(0).species());
        assertEquals(DataLines.lamp(data, he, Medium.air()).size(), lamp.fromLevels().get(0).components());
        assertEquals(helium.size(), lamp.fromLevels().get(0).lamp().size());
        assertTrue(helium.size() < lamp.fromLevels().get(0).components(), "587.6 nm's components are one line");
        assertEquals(neon.size() + helium.size(), lamp.lamp().size());
        assertEquals(List.of("lamp-ne-i", "levels-he-i"), lamp.lamp().setIds());

        DataLines.CalibrationLamp coarse = DataLines.calibrationLamp(data, List.of(ne, he), List.of(), Medium.air(),
                500);
        assertEquals(neon.blendedAt(500).size(), coarse.fromLists().size());
        assertTrue(coarse.fromLists().size() < neon.size(), "neon lines closer than half the FWHM at R = 500 merge");
        assertEquals(500, coarse.fromLevels().get(0).resolvingPower());

        ReferenceDataException unknown = assertThrows(ReferenceDataException.class, () -> DataLines.calibrationLamp(
                data, List.of(Species.parse("Xe II")), List.of(), Medium.air(), Double.NaN));
        assertEquals("no built-in lamp set or level list for Xe II", unknown.getMessage());
        assertThrows(IllegalArgumentException.class, () -> DataLines.calibrationLamp(data, List.of(), List.of(),
                Medium.air(), Double.NaN));
        assertThrows(IllegalArgumentException.class, () -> DataLines.calibrationLamp(data, List.of(ne), List.of(),
                Medium.air(), 0.5));
    }

    @Test
    void ionsAtomsAndListsOfTheContextAnswerOneQuery() {
        DataContext data = DataContext.builtIn();
        LineSources sources = DataLines.withLineLists(DataLines.sources(data,
                List.of(Species.parse("H I"), Species.parse("Rb-87 I")), Tier.QED), data, List.of("lamp-ne-i"));
        assertEquals(3, sources.size());
        LineSet lines = LineQuery.defaults().withMaxN(10)
                .withWindow(Wavelength.ofNanometres(580, Medium.air()), Wavelength.ofNanometres(800, Medium.air()))
                .run(sources);
        List<Species> species = lines.speciesList();
        assertTrue(species.contains(Species.parse("H I")) && species.contains(Species.parse("Rb-87 I"))
                && species.contains(Species.parse("Ne I")), species.toString());
        // Source: the built-in lamp list itself: every one of its lines in the window, none other.
        LineList neon = data.lineList("lamp-ne-i");
        int inWindow = 0;
        for (int i = 0; i < neon.size(); i++) {
            double nm = neon.position(i);   // the neon list is in nm in air
            inWindow += nm >= 580 && nm <= 800 ? 1 : 0;
        }
        int fromNeon = 0;
        for (int i = 0; i < lines.size(); i++) {
            if (lines.source(i).dataSet().map(d -> d.id().equals("lamp-ne-i")).orElse(false)) {
                fromNeon++;
                assertEquals(Species.parse("Ne I"), lines.species(i));
            }
        }
        assertEquals("nm", neon.unit().symbol());
        assertEquals(Medium.air(), neon.medium());
        assertEquals(inWindow, fromNeon);
    }

    @Test
    void aSpeciesWithoutASourceIsNamed() {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> DataLines.sources(DataContext.builtIn(), List.of(Species.parse("Fe II")), Tier.QED));
        assertTrue(e.getMessage().startsWith("Fe II has no line source in this data context"), e.getMessage());
    }
}
