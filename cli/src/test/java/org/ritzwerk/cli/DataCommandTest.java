package org.ritzwerk.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.ritzwerk.data.DataKind;
import org.ritzwerk.data.LineList;
import org.ritzwerk.refdata.DataRegistry;
import org.ritzwerk.refdata.LineListFiles;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.json.JsonMapper;

/** {@code ritzwerk data} end to end, on files the test writes. */
class DataCommandTest {

    @Test
    void listsTheBuiltInSetsWithTheirSources() {
        CliTest.Run run = CliTest.run("data", "--format", "json");
        assertEquals(0, run.code(), run.err());
        JsonMapper json = JsonMapper.builder().build();
        boolean neon = false;
        for (String line : run.out().strip().split("\\R")) {
            JsonNode node = json.readTree(line);
            if (node.get("id").asString().equals("lamp-ne-i")) {
                neon = true;
                assertEquals("lamp-lines", node.get("kind").asString());
                assertEquals("built-in", node.get("origin").asString());
                assertTrue(node.get("source").asString().startsWith("from memory: J. E. Sansonetti and W. C. Martin"));
            }
        }
        assertTrue(neon);
    }

    @Test
    void showWritesAFileThatReadsBackEqual(@TempDir Path dir) throws IOException {
        for (String format : new String[] {"csv", "json"}) {
            CliTest.Run run = CliTest.run("data", "show", "lamp-ar-i", "--format", format);
            assertEquals(0, run.code(), run.err());
            Path file = dir.resolve("argon." + format);
            Files.writeString(file, run.out(), StandardCharsets.UTF_8);
            LineList copy = LineListFiles.read(file, DataKind.LAMP_LINES);
            assertEquals(DataRegistry.builtIn().load("lamp-ar-i"), copy);
            CliTest.Run check = CliTest.run("data", "check", file.toString());
            assertEquals(0, check.code(), check.err());
            assertTrue(check.out().contains(": ok, " + copy.size() + " lines of 1 species in nm air (id lamp-ar-i)"),
                    check.out());
        }
        CliTest.Run text = CliTest.run("data", "show", "nuclear-isotopes");
        assertEquals(0, text.code(), text.err());
        assertTrue(text.out().contains("Source: published: M. Wang et al."), text.out());
    }

    @Test
    void checkNamesTheSharedUncertaintiesOfALevelFileAndWhereOneIsBad(@TempDir Path dir) throws IOException {
        // the built-in Sr I levels, shown and checked back: 17 components (make_strontium_levels.py: the limit, the
        // singlet limit offset, d0, d2 and d4 of five series)
        org.ritzwerk.data.LevelList sr = (org.ritzwerk.data.LevelList) DataRegistry.builtIn().load("levels-sr-i");
        CliTest.Run show = CliTest.run("data", "show", "levels-sr-i", "--format", "csv");
        assertEquals(0, show.code(), show.err());
        Path file = dir.resolve("sr.csv");
        Files.writeString(file, show.out(), StandardCharsets.UTF_8);
        assertEquals(sr, org.ritzwerk.refdata.LevelListFiles.read(file));
        CliTest.Run check = CliTest.run("data", "check", file.toString());
        assertEquals(0, check.code(), check.err());
        assertTrue(check.out().contains(": ok, " + sr.size() + " levels of 1 species in cm-1, 17 shared uncertainty "
                + "components (" + sr.shareCount() + " contributions) (id levels-sr-i)"), check.out());
        // a contribution larger than its level's uncertainty, reported at its line and column
        Path bad = dir.resolve("bad.csv");
        Files.writeString(bad, "# ritzwerk-levels 1\n# id: bad\n# title: t\n# source: s\n# provenance: computed\n"
                + "# version: 1\n# energy-unit: cm-1\nspecies,label,energy,uncertainty\nHe I,1s2s 3S1,159855.97,0.002\n"
                + "# shared-uncertainties\nspecies,label,component,value\nHe I,1s2s 3S1,limit,-0.003\n",
                StandardCharsets.UTF_8);
        CliTest.Run refused = CliTest.run("data", "check", bad.toString());
        assertEquals(2, refused.code());
        assertTrue(refused.err().contains(bad + ":12:4: column value: the contributions of level '1s2s 3S1' squared "
                + "add up to 9.000e-06 here, more than its uncertainty 0.002 squared (line 9)"), refused.err());
    }

    @Test
    void aUserFileTakesPrecedenceAndABadOneIsReportedWhole(@TempDir Path dir) throws IOException {
        Path mine = dir.resolve("mine.csv");
        Files.writeString(mine, "# ritzwerk-lines 1\n# id: lamp-ne-i\n# title: my neon lamp\n# source: measured by me\n"
                + "# provenance: measured\n# version: 1\n# kind: lamp-lines\n# position-unit: nm\n# medium: air\n"
                + "species,position\nNe I,640.2249\n", StandardCharsets.UTF_8);
        CliTest.Run show = CliTest.run("data", "show", "lamp-ne-i", "--file", mine.toString());
        assertEquals(0, show.code(), show.err());
        assertTrue(show.out().contains("user from file:" + mine), show.out());
        assertTrue(show.out().contains("640.2249"), show.out());

        Path bad = dir.resolve("bad.csv");
        Files.writeString(bad, "# ritzwerk-lines 1\n# id: bad\n# title: t\n# source: s\n# provenance: measured\n"
                + "# version: 1\n# position-unit: nm\n# medium: air\nspecies,position\nNe I,-1\nQq I,2\n",
                StandardCharsets.UTF_8);
        CliTest.Run check = CliTest.run("data", "check", bad.toString());
        assertEquals(2, check.code());
        assertTrue(check.err().startsWith("2 problems in " + bad + ":"), check.err());
        assertTrue(check.err().contains(bad + ":10:2: column position: position must not be negative"), check.err());
        assertTrue(check.err().contains(bad + ":11:1: column species"), check.err());
        CliTest.Run list = CliTest.run("data", "--file", bad.toString());
        assertEquals(2, list.code());
        assertEquals("", list.out());
    }

    @Test
    void unknownSetIsOneClearLine() {
        CliTest.Run run = CliTest.run("data", "show", "lamp-unobtainium");
        assertEquals(2, run.code());
        assertEquals("ritzwerk data show: no data set 'lamp-unobtainium'; 'ritzwerk data' lists the sets available",
                run.err().strip());
    }
}
