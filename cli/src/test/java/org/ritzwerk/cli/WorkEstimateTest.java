package org.ritzwerk.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

/** The up-front estimates and limits of long runs, and the progress line's wording; no timing. */
class WorkEstimateTest {

    @Test
    void shortRunsSayNothingLongOnesSayHowLongAndRunsPastTheLimitAreRefused() {
        assertTrue(WorkEstimate.hydrogenLifetimes(30, 1).isEmpty(), "about 0.2 s: no notice");
        assertTrue(WorkEstimate.hydrogenLifetimes(2000, 0).isEmpty(), "no one-electron ion: nothing to estimate");
        String notice = WorkEstimate.hydrogenLifetimes(200, 1).orElseThrow();
        // 14 s x 2^3.5 = 158 s.
        assertEquals("note: levels: the lifetimes of every level up to n = 200 will take about 3 min (a rough estimate);"
                + " Ctrl-C stops it", notice);
        assertTrue(WorkEstimate.hydrogenLifetimes(WorkEstimate.HYDROGEN_LIFETIMES_N_MAX, 2).isPresent());
        OptionException refused = assertThrows(OptionException.class,
                () -> WorkEstimate.hydrogenLifetimes(WorkEstimate.HYDROGEN_LIFETIMES_N_MAX + 1, 1));
        assertTrue(refused.getMessage().startsWith("--lifetimes of one-electron ions goes up to --n-max 300 (about 11 min);"
                + " --n-max 301 would take about 11 min"), refused.getMessage());
        assertTrue(WorkEstimate.hydrogenLifetimesSeconds(200, 2) > WorkEstimate.hydrogenLifetimesSeconds(200, 1));
    }

    @Test
    void theLevelsCommandRefusesBeforeAnyWork() {
        CliTest.Run run = CliTest.run("levels", "--species", "H I", "--n-max", "2000", "--lifetimes");
        assertEquals(2, run.code());
        assertEquals("", run.out());
        assertTrue(run.err().contains("--lifetimes of one-electron ions goes up to --n-max 300"), run.err());
        CliTest.Run alkali = CliTest.run("levels", "--species", "Rb-87 I", "--n-max", "8", "--lifetimes");
        assertEquals(0, alkali.code(), "the limit is the one-electron ions' only: " + alkali.err());
    }

    @Test
    void noticesStartAtTenSeconds() {
        assertFalse(WorkEstimate.notice("x", 9.9).isPresent());
        assertFalse(WorkEstimate.notice("x", Double.NaN).isPresent());
        assertEquals("note: x will take about 10 s (a rough estimate); Ctrl-C stops it",
                WorkEstimate.notice("x", 10).orElseThrow());
    }

    @Test
    void durationsReadAtAGlance() {
        assertEquals("40 s", Progress.duration(40));
        assertEquals("2 min", Progress.duration(100));
        assertEquals("3.5 h", Progress.duration(3.5 * 3600));
        assertEquals("5.8 days", Progress.duration(5.8 * 86400));
    }

    @Test
    void theProgressLineGivesTheTimeLeftOnceItCanBeJudged() {
        assertEquals("lines: H I:   1 % (5.0 s)   ", Progress.line("lines: H I", 0.01, 5));
        assertEquals("lines: H I:  50 % (1.0 s)   ", Progress.line("lines: H I", 0.5, 1));
        assertEquals("lines: H I:  50 % (30.0 s, about 30 s left)   ", Progress.line("lines: H I", 0.5, 30));
        assertEquals("lines: H I:  20 % (30.0 s, about 2 min left)   ", Progress.line("lines: H I", 0.2, 30));
        assertEquals("lines: H I: 100 % (30.0 s)   ", Progress.line("lines: H I", 1, 30));
    }

    @Test
    void longLineRunsAreAnnouncedAndRunsPastAnHourRefused() {
        // Work units of H I multiplets at 4.9-5.1 GHz, from HydrogenLikeLines.workUnits (the
        // engine's own count; 1.47e9 units took 13 s on the build machine).
        org.ritzwerk.engine.hydrogenic.HydrogenLikeModel h = org.ritzwerk.engine.hydrogenic.HydrogenLikeModel.of(
                org.ritzwerk.refdata.DataContext.builtIn().nucleus(org.ritzwerk.atom.Species.parse("H I")),
                org.ritzwerk.engine.hydrogenic.Tier.QED);
        org.ritzwerk.engine.hydrogenic.HydrogenLikeLines lines = org.ritzwerk.engine.hydrogenic.HydrogenLikeLines.of(h);
        double small = lines.workUnits(100, 4.9e9, 5.1e9, false);
        double mid = lines.workUnits(350, 4.9e9, 5.1e9, false);
        double huge = lines.workUnits(2000, 4.9e9, 5.1e9, false);
        assertTrue(small < mid && mid < huge, small + " " + mid + " " + huge);
        assertTrue(WorkEstimate.hydrogenLines("lines", "x", small).isEmpty(), "n <= 100: no notice");
        assertTrue(WorkEstimate.hydrogenLines("lines", "the one-electron lines", mid).orElseThrow()
                .matches("note: lines: the one-electron lines will take about \\d+ s \\(a rough estimate\\); Ctrl-C stops it"));
        OptionException refused = assertThrows(OptionException.class,
                () -> WorkEstimate.hydrogenLines("lines", "the one-electron lines up to n = 2000", huge));
        assertTrue(refused.getMessage().startsWith("the one-electron lines up to n = 2000 would take about ")
                && refused.getMessage().contains("runs up to about 60 min are started"), refused.getMessage());
    }
}
