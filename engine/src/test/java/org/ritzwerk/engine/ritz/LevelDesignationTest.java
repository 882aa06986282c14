package org.ritzwerk.engine.ritz;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.junit.jupiter.api.Test;
import org.ritzwerk.atom.Species;

/**
 * Parities read from configurations whose digits run together. Expected parities are
 * (-1)^(sum of l times occupation) of the one valid reading (common practice; R. D. Cowan, The
 * Theory of Atomic Structure and Spectra (1981)), worked out by hand beside each check.
 */
class LevelDesignationTest {

    @Test
    void aTwoDigitNAfterAnOrbitalIsNotReadAsAnOccupation() {
        // 5p 20s: l = 1 + 0, odd. The old reading 5p2 0s (n = 0, not an orbital) gave even.
        assertEquals(-1, LevelDesignation.parse("5p20s 1P1", -1).parity(), "5p20s = 5p 20s, odd");
        // 5p 21d: 1 + 2, odd (5p2 1d has l = 2 >= n = 1)
        assertEquals(-1, LevelDesignation.parse("5p21d 3D2", -1).parity(), "5p21d = 5p 21d, odd");
        // 5s 20s: even; 5s 60d: even (5s6 has 6 > 2 electrons in an s shell)
        assertEquals(1, LevelDesignation.parse("5s20s 1S0", -1).parity(), "5s20s = 5s 20s, even");
        assertEquals(1, LevelDesignation.parse("5s60d 1D2", -1).parity(), "5s60d = 5s 60d, even");
        // 1s 10d: even; 1s 10p: odd
        assertEquals(1, LevelDesignation.parse("1s10d 1D2", -1).parity(), "1s10d, even");
        assertEquals(-1, LevelDesignation.parse("1s10p 1P1", -1).parity(), "1s10p, odd");
        // 4f14 6s 6p: 3 * 14 + 0 + 1, odd
        assertEquals(-1, LevelDesignation.parse("4f14.6s6p 3P1", -1).parity(), "4f14 6s 6p, odd");
    }

    @Test
    void readingsOfDifferentParityLeaveItUnknown() {
        // 2p6 3s (even) or 2p 63s (odd): both valid
        assertEquals(0, LevelDesignation.parse("2p63s 2S1/2", -1).parity(), "2p63s is ambiguous");
        // with a separator only 2p6 3s is left
        assertEquals(1, LevelDesignation.parse("2p6.3s 2S1/2", -1).parity(), "2p6.3s, even");
        assertEquals(1, LevelDesignation.parse("2p6 3s 2S1/2", -1).parity(), "2p6 3s, even");
        // 4f14 6s 6p (odd) or 4f1 46s 6p (3 + 0 + 1, even): both valid
        assertEquals(0, LevelDesignation.parse("4f146s6p 3P1", -1).parity(), "4f146s6p is ambiguous");
        // 1s2 2s or 1s 22s: both even, so even
        assertEquals(1, LevelDesignation.parse("1s22s 2S1/2", -1).parity(), "1s22s, even either way");
        // an odd-parity mark decides whatever the configuration
        assertEquals(-1, LevelDesignation.parse("2p63s 2So1/2", -1).parity(), "the mark decides");
    }

    @Test
    void invalidOrbitalsGiveNoParity() {
        assertFalse(LevelDesignation.parse("0s 1S0", -1).hasParity(), "n = 0");
        assertFalse(LevelDesignation.parse("1p 2P1/2", -1).hasParity(), "l = 1 is not below n = 1");
        assertEquals(1, LevelDesignation.parse("3d 2D3/2", -1).parity(), "3d is valid: even");
        assertFalse(LevelDesignation.parse("2s3 2S1/2", -1).hasParity(), "3 electrons in an s shell");
        assertFalse(LevelDesignation.parse("2p7 2P1/2", -1).hasParity(), "7 electrons in a p shell");
        assertFalse(LevelDesignation.parse("05s 2S1/2", -1).hasParity(), "leading zero");
        assertFalse(LevelDesignation.parse("5S5p 1P1", -1).hasParity(), "upper-case orbital");
        assertFalse(LevelDesignation.parse("2p5(2P3/2)3s [3/2]2", -1).hasParity(), "jK label: not read");
        assertTrue(LevelDesignation.parse("2p5.3s 3P2", -1).hasParity(), "2p5 3s, odd");
        assertEquals(-1, LevelDesignation.parse("2p5.3s 3P2", -1).parity(), "2p5 3s: 5, odd");
    }

    @Test
    void aParityForbiddenLineIsNotGivenAndAnAllowedOneIs() {
        // the reviewer's case: 5p20s 1P1 (odd) and 5s5p 1P1 (odd) give no E1 line; 5s20s 1S0 (even) does
        RitzLevels levels = RitzLevels.builder(Species.parse("Sr I"))
                .add("5s5p 1P1", 21698.452, 0.005, -1)
                .add("5s20s 1S0", 45540.205, 0.003, -1)
                .add("5p20s 1P1", 66000.0, 0.1, -1)
                .add("5p20s 1S0", 65900.0, 0.1, -1)
                .build();
        RitzTransitions lines = RitzLines.defaults().compute(levels);
        for (int i = 0; i < lines.size(); i++) {
            String pair = levels.label(lines.upper(i)) + " - " + levels.label(lines.lower(i));
            assertFalse(pair.equals("5p20s 1P1 - 5s5p 1P1"), "parity-forbidden line listed: " + pair);
        }
        boolean allowed = false;
        for (int i = 0; i < lines.size(); i++) {
            allowed |= levels.label(lines.upper(i)).equals("5p20s 1P1")
                    && levels.label(lines.lower(i)).equals("5s20s 1S0");
        }
        assertTrue(allowed, "5p20s 1P1 - 5s20s 1S0 (odd - even, J 1 - 0) is allowed");
    }

    @Test
    void levelsWhoseLabelsGiveNoParityOrJAreNamedWithTheReason() {
        // the reviewer's Ne I and Ca I files: a jK label and free text give no parity; a label with a
        // configuration but neither a J in its term nor a j column gives no J
        RitzLevels levels = RitzLevels.builder(Species.parse("Ne I"))
                .add("2p6 1S0", 0, 0, -1)
                .add("2p5(2P3/2)3s [3/2]2", 134041.84, 0.001, 4)
                .add("2p5.3s 3P1", 134459.2871, 0.001, -1)
                .add("mystery level", 140000, 0.01, -1)
                .add("2p5.3p 3D", 149657.0, 0.001, -1)
                .build();
        List<RitzLines.LevelWithoutLines> none = RitzLines.levelsWithoutLines(levels);
        assertEquals(List.of(new RitzLines.LevelWithoutLines(1, "2p5(2P3/2)3s [3/2]2", "no parity"),
                new RitzLines.LevelWithoutLines(3, "mystery level", "no parity and no J"),
                new RitzLines.LevelWithoutLines(4, "2p5.3p 3D", "no J")), none);
        RitzTransitions lines = RitzLines.defaults().compute(levels);
        assertEquals(none, lines.levelsWithoutLines(), "the computed lines carry the same report");
        for (int i = 0; i < lines.size(); i++) {
            for (RitzLines.LevelWithoutLines level : none) {
                assertTrue(lines.upper(i) != level.index() && lines.lower(i) != level.index(), level.label());
            }
        }
        // 2p5.3s 3P1 (odd, J = 1) - 2p6 1S0 (even, J = 0) is the one line
        assertEquals(1, lines.size());
        assertTrue(RitzLines.levelsWithoutLines(RitzLevels.builder(Species.parse("He I"))
                .add("1s2 1S0", 0, 0, -1).add("1s2p 1P1", 171134.897, 5e-5, -1).build()).isEmpty());
    }
}
