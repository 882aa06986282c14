package org.ritzwerk.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.EnumSet;
import java.util.List;
import java.util.Set;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.ritzwerk.data.DataKind;
import org.ritzwerk.data.DataSet;
import org.ritzwerk.data.Origin;
import org.ritzwerk.refdata.DataRegistry;
import org.ritzwerk.refdata.UserFiles;

/**
 * Every built-in data set, of every kind, printed with {@code data show ID --format csv} reads
 * back through {@code data --file FILE} (and {@link UserFiles#read}) as a set equal to the
 * built-in one.
 */
class DataShowReadBackTest {

    @Test
    void everyBuiltInSetShownAsCsvReadsBackEqual(@TempDir Path dir) throws IOException {
        DataRegistry builtIn = DataRegistry.builtIn();
        Set<DataKind> kinds = EnumSet.noneOf(DataKind.class);
        for (DataRegistry.Listing listing : builtIn.list()) {
            String id = listing.info().id();
            CliTest.Run show = CliTest.run("data", "show", id, "--format", "csv");
            assertEquals(0, show.code(), id + ": " + show.err());
            Path file = dir.resolve(id + ".csv");
            Files.writeString(file, show.out(), StandardCharsets.UTF_8);
            DataSet original = builtIn.load(id);
            assertEquals(original, UserFiles.read(file), id);
            DataRegistry withFile = DataCommand.registry(List.of(file));
            assertEquals(Origin.USER, withFile.find(id).orElseThrow().origin(), id);
            assertEquals(original, withFile.load(id), id);
            CliTest.Run check = CliTest.run("data", "check", file.toString());
            assertEquals(0, check.code(), id + ": " + check.err());
            kinds.add(listing.info().kind());
        }
        assertEquals(EnumSet.allOf(DataKind.class), kinds, "a built-in set of every kind");
    }

    @Test
    void anIsotopeFileKeepsUncertaintiesAndSourceKeys(@TempDir Path dir) throws IOException {
        CliTest.Run show = CliTest.run("data", "show", "nuclear-isotopes", "--format", "csv");
        assertEquals(0, show.code(), show.err());
        // H-1: moment 2.79284734463(82e-11... as tabulated) with its uncertainty and keys, radius 0.8414(19) fm.
        assertTrue(show.out().contains("\n1,1,H,1.007825031898,1.4E-11,AME2020,1/2,2.79284734463,8.2E-10,"
                + "CODATA2018;spin=bodr10,0.8414,0.0019,CODATA2018\n"), show.out());
        // He-4: spin 0, no moment.
        assertTrue(show.out().contains("\n2,4,He,4.00260325413,1.6E-10,AME2020,0,,,spin=bodr10,1.6755,0.0028,"
                + "Angeli2013\n"), show.out());
    }
}
