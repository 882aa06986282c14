package org.ritzwerk.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.api.Test;

/** The shared count wording of identify's and calibrate's reports: singular for one only (common practice). */
class WordsTest {

    @Test
    void oneIsSingularAndEveryOtherCountPlural() {
        assertEquals("1 peak", Words.count(1, "peak"));
        assertEquals("0 peaks", Words.count(0, "peak"));
        assertEquals("2 strong lines", Words.count(2, "strong line"));
        assertEquals("1000000 lines", Words.count(1_000_000L, "line"));
    }
}
