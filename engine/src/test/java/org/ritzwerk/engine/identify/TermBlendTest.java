package org.ritzwerk.engine.identify;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.ritzwerk.atom.Species;
import org.ritzwerk.engine.lines.LineQuery;
import org.ritzwerk.engine.lines.LineSet;
import org.ritzwerk.engine.lines.LineSources;
import org.ritzwerk.engine.ritz.RitzLevels;

/**
 * The components of an LS multiplet of a level list that lie within 1e-4 of one another in
 * wavelength are one blend for identification (a He I 587.6 nm peak was "ambiguous" between the
 * components of its own multiplet, and a lone such peak found no velocity); components further
 * apart stay separate. Invented levels, laid out like a He I triplet (common practice: the J
 * splittings of a triplet term) and like the wide 3P term of an alkaline earth.
 */
class TermBlendTest {

    private static List<String> labels(RitzLevels levels) {
        LineSet lines = LineQuery.defaults().withWindowHz(1e14, 1e15).run(LineSources.none().withLevels(levels));
        LineCatalog catalog = Candidates.inWindow(100e-9, 3000e-9).lineSet(lines).build().catalog();
        List<String> out = new ArrayList<>();
        for (int j = 0; j < catalog.size(); j++) {
            out.add(catalog.label(j));
        }
        return out;
    }

    @Test
    void closeComponentsBlendAndFarOnesStaySeparate() {
        // 3D1,2,3 above 3P0,1,2 with splittings of 0.1-1 cm-1 at 17 000 cm-1: within 1e-4 (1.7 cm-1)
        RitzLevels close = RitzLevels.builder(Species.parse("He I"))
                .add("1s2p 3P2", 169086.77, 1e-3, -1).add("1s2p 3P1", 169087.83, 1e-3, -1)
                .add("1s2p 3P0", 169086.84, 1e-3, -1)
                .add("1s3d 3D3", 186101.55, 1e-3, -1).add("1s3d 3D2", 186101.59, 1e-3, -1)
                .add("1s3d 3D1", 186101.65, 1e-3, -1).build();
        List<String> blended = labels(close);
        assertEquals(List.of("1s3d 3D - 1s2p 3P (6 components)"), blended);
        // 3P0,1,2 spread over 600 cm-1 at 14 000 cm-1: three separate lines
        RitzLevels wide = RitzLevels.builder(Species.parse("Sr I"))
                .add("5s5p 3P0", 14317.5, 1e-3, -1).add("5s5p 3P1", 14504.3, 1e-3, -1)
                .add("5s5p 3P2", 14898.5, 1e-3, -1).add("5s6s 3S1", 29038.8, 1e-3, -1).build();
        List<String> separate = labels(wide);
        assertEquals(3, separate.size(), separate.toString());
        assertTrue(separate.stream().allMatch(l -> l.matches("5s6s 3S1 - 5s5p 3P[012]")), separate.toString());
    }
}
