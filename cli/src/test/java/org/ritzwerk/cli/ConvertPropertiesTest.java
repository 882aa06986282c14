package org.ritzwerk.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.quicktheories.QuickTheory.qt;
import static org.quicktheories.generators.SourceDSL.arbitrary;
import static org.quicktheories.generators.SourceDSL.doubles;

import java.util.List;
import org.junit.jupiter.api.Test;

/**
 * The command line as a user chains it: what {@code convert} prints is itself a valid input,
 * and converting there and back returns the start to 1e-12 (QuickTheories, fixed seed).
 */
class ConvertPropertiesTest {

    @Test
    void printedResultsAreValidInputsThatConvertBack() {
        List<String> targets = List.of("nm air", "nm vacuum", "cm-1", "THz", "eV", "um air");
        qt().withFixedSeed(11L).withExamples(60)
                .forAll(doubles().between(300, 1600), arbitrary().pick(targets))
                .checkAssert((nm, target) -> {
                    String start = nm + " nm air";
                    CliTest.Run there = CliTest.run("convert", start, "--to", target);
                    assertEquals(0, there.code(), there.err());
                    CliTest.Run back = CliTest.run("convert", there.out().strip(), "--to", "nm air");
                    assertEquals(0, back.code(), back.err());
                    double returned = Double.parseDouble(back.out().strip().split(" ")[0]);
                    assertEquals(nm, returned, 1e-12 * nm, start + " -> " + there.out().strip());
                });
    }
}
