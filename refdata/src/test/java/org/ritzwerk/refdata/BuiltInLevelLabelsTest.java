package org.ritzwerk.refdata;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
import org.ritzwerk.atom.Species;
import org.ritzwerk.engine.ritz.LevelDesignation;
import org.ritzwerk.engine.ritz.RitzLevels;

/**
 * Every label of the built-in level lists is read with the parity, term and J it has. Each level
 * of these lists has one electron outside a closed or s shell (He I 1s nl, Sr I 5s nl, and the two
 * ground configurations 1s2 and 5s2), so its parity is (-1)^L of its term (common practice:
 * parity (-1)^(sum of l), and for an s electron plus one nl electron L = l).
 */
class BuiltInLevelLabelsTest {

    @Test
    void everyBuiltInLabelKeepsItsParity() {
        DataContext context = DataContext.builtIn();
        int checked = 0;
        for (Species species : context.levelSpecies()) {
            RitzLevels levels = DataLines.levels(context, species);
            for (int i = 0; i < levels.size(); i++) {
                LevelDesignation d = levels.designation(i);
                String where = species.notation() + " '" + levels.label(i) + "'";
                assertTrue(d.hasTerm() && d.hasJ() && d.hasParity(), where + " read as " + d);
                assertEquals(d.l() % 2 == 0 ? 1 : -1, d.parity(), where + ": parity (-1)^L");
                checked++;
            }
        }
        // levels-he-i (87 rows) and levels-sr-i (206 rows) at least
        assertTrue(checked > 280, checked + " labels checked");
        assertFalse(context.levelSpecies().isEmpty());
    }

    @Test
    void everyBuiltInLevelStatesItsUncertaintyTheGroundLevelToo() {
        // the ground level is the zero of the scale: u = 0 in levels-sr-i (it was empty, and every
        // Sr I line to the ground had no uncertainty)
        DataContext context = DataContext.builtIn();
        for (Species species : context.levelSpecies()) {
            org.ritzwerk.data.LevelList list = context.levelList(species).orElseThrow();
            for (int i = 0; i < list.size(); i++) {
                assertTrue(list.uncertainty(i).isPresent(), list.info().id() + " '" + list.label(i)
                        + "' has no uncertainty");
            }
        }
    }
}
