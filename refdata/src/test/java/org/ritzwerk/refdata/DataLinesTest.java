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
