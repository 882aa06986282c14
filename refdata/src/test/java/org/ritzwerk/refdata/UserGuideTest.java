package org.ritzwerk.refdata;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.io.IOException;
import java.io.StringReader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.ritzwerk.atom.Nucleus;
import org.ritzwerk.atom.Species;
import org.ritzwerk.atom.State;
import org.ritzwerk.data.LineList;
import org.ritzwerk.engine.rydberg.AlkaliAtom;
import org.ritzwerk.quantity.QuantityText;

/** The refdata examples of the README, compiled and run. */
class UserGuideTest {

    @Test
    void readAListOfQuantities() {
        String file = "# peaks from the bench\n412.337(4) nm air\n17298.77 cm-1\n";
        List<QuantityListReader.Entry> entries =
                new QuantityListReader(QuantityText.standard()).read(new StringReader(file), "peaks.txt");

        assertEquals(2, entries.size());
        assertEquals(3, entries.get(1).line());
    }

    @Test
    void passTheDataExplicitly(@TempDir Path dir) throws IOException {
        Path myIsotopes = dir.resolve("my-isotopes.csv");
        Files.writeString(myIsotopes, "# id: my-isotopes\n# title: t\n# source: invented for this test\n"
                + "# provenance: measured\n# version: 1\n" + String.join(",", NuclearData.ISOTOPE_COLUMNS) + "\n"
                + "37,87,Rb,86.9091805310,0,TEST,3/2,2.75,,TEST,4.1989,,TEST\n", StandardCharsets.UTF_8);

        // README "Data context":
        DataContext data = DataContext.discoverDefault()      // built-in sets and provider jars on the class path
                .withUserFile(myIsotopes);                    // your file first: isotopes, quantum defects, lines, levels
        Nucleus helium4 = data.nucleus(Species.parse("He II"));
        AlkaliAtom rb = data.alkaliAtom(Species.parse("Rb-87 I"));   // R_M from this context's Rb-87 mass
        LineList neon = data.lampLines(Species.parse("Ne I"));

        assertEquals(4, helium4.massNumber());
        assertEquals(QuantumDefectFiles.rydbergPerCm(86.9091805310), rb.rydbergPerCm(), 0.0);
        assertEquals(DataContext.builtIn().alkaliAtom(Species.parse("Rb-87 I")).energyPerCm(State.of(50, 0, 1)),
                rb.energyPerCm(State.of(50, 0, 1)), 1e-6);
        assertEquals("lamp-ne-i", neon.info().id());
    }
}
