package org.ritzwerk.refdata;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.ByteArrayInputStream;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.util.List;
import java.util.stream.Collectors;
import org.junit.jupiter.api.Test;
import org.ritzwerk.atom.Species;
import org.ritzwerk.data.QuantumDefects;

/** The uncertainty columns and header of the quantum-defect format: read, refused when wrong, written back. */
class QuantumDefectUncertaintyFilesTest {

    @Test
    void builtInRubidiumStatesItsLimitAndDefectUncertainties() {
        QuantumDefects rb = (QuantumDefects) DataRegistry.builtIn().load("quantum-defects-rb-87");
        // 0.0003 GHz (Mack et al. 2011, from memory) in cm-1: 3e5 Hz / (100 c)
        assertEquals(3e5 / (299_792_458.0 * 100), rb.limitUncertaintyPerCm(), 1e-18);
        QuantumDefects.Series s = rb.series().get(0);
        assertEquals(List.of(0.0000008, 0.0002), s.uncertainties());
        assertTrue(s.hasAllUncertainties());
        QuantumDefects na = (QuantumDefects) DataRegistry.builtIn().load("quantum-defects-na-23");
        // Na's limit states no uncertainty; the built-in file carries ours (check R limit, from-residuals)
        assertEquals(0.039, na.statedLimitUncertaintyPerCm().orElseThrow(), 1e-15);
        // Na: no paper's uncertainties; our own, derived from the residuals (ResidualDerivedUncertaintyTest)
        assertTrue(na.series().stream().allMatch(x -> x.residualDerived() && x.hasAllUncertainties()));
        assertTrue(rb.series().stream().noneMatch(QuantumDefects.Series::residualDerived), "Rb-87: the papers'");
    }

    @Test
    void everyBadUncertaintyIsReportedWithItsLine() throws Exception {
        DataFileException e;
        try (InputStream in = getClass().getResourceAsStream("/rydberg/quantum-defects-bad-uncertainties.csv")) {
            e = assertThrows(DataFileException.class, () -> QuantumDefectFiles.read(in, "bad-uncertainties.csv"));
        }
        assertEquals(List.of("qd.bad-uncertainty:14", "qd.bad-uncertainty:15", "qd.bad-uncertainty:16",
                "qd.bad-uncertainty:17"), e.problems().stream().map(p -> p.code() + ":" + p.line())
                        .collect(Collectors.toList()));
        assertTrue(e.problems().stream().map(DataProblem::reason).anyMatch(m -> m.contains("u-d0 must be empty")),
                e.getMessage());
    }

    @Test
    void writtenSetReadsBackEqualWithItsUncertainties() {
        QuantumDefects cs = DataContext.builtIn().alkaliAtom(Species.parse("Cs-133 I")).quantumDefects();
        String text = QuantumDefectFiles.writeCsv(cs);
        assertTrue(text.contains("# limit-uncertainty: ") && text.contains("u-d0,u-d2"), text);
        QuantumDefects back = QuantumDefectFiles.read(new ByteArrayInputStream(text.getBytes(StandardCharsets.UTF_8)),
                "cs.csv").defects();
        assertEquals(cs.limitUncertaintyPerCm(), back.limitUncertaintyPerCm());
        assertEquals(cs.series(), back.series());
    }
}
