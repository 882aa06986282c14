package org.ritzwerk.refdata;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.ByteArrayInputStream;
import java.nio.charset.StandardCharsets;
import java.util.List;
import java.util.Optional;
import java.util.OptionalDouble;
import org.junit.jupiter.api.Test;
import org.ritzwerk.atom.Species;
import org.ritzwerk.data.CorePolarizability;
import org.ritzwerk.data.DataKind;
import org.ritzwerk.data.DataSetInfo;
import org.ritzwerk.data.Isotope;
import org.ritzwerk.data.IsotopeTable;
import org.ritzwerk.data.Provenance;
import org.ritzwerk.data.QuantumDefects;

/**
 * The writers of the isotope and quantum-defect formats: what they write reads back equal, and
 * what the formats cannot hold is refused with a message saying what, never written wrong.
 */
class DataSetWritersTest {

    private static ByteArrayInputStream bytes(String text) {
        return new ByteArrayInputStream(text.getBytes(StandardCharsets.UTF_8));
    }

    private static final DataSetInfo ISOTOPES = new DataSetInfo("my-isotopes", DataKind.NUCLEAR, "invented isotopes",
            "1", new Provenance(Provenance.Kind.MEASURED, "invented for a test"), List.of());

    @Test
    void isotopesWithKeysAndUncertaintiesReadBackEqual() {
        // Invented values; the second has no moment, the third no radius.
        IsotopeTable table = new IsotopeTable(ISOTOPES, List.of(
                Isotope.tabulated(1, 1, 1.0078, 1e-9, 1, OptionalDouble.of(2.79), OptionalDouble.of(1e-6),
                        OptionalDouble.of(0.84), OptionalDouble.of(0.002), new Isotope.SourceKeys("k1", "k2;spin=k3", "k4")),
                Isotope.tabulated(2, 4, 4.0026, 0, 0, OptionalDouble.empty(), OptionalDouble.empty(),
                        OptionalDouble.of(1.68), OptionalDouble.empty(), new Isotope.SourceKeys("k1", "spin=k3", "k4")),
                Isotope.tabulated(37, 87, 86.909, 5e-9, 3, OptionalDouble.of(2.75), OptionalDouble.empty(),
                        OptionalDouble.empty(), OptionalDouble.empty(), new Isotope.SourceKeys("k1", "", ""))));
        String text = IsotopeFiles.writeCsv(table);
        assertEquals(table, IsotopeFiles.read(bytes(text), "mine.csv"));
        assertEquals("mass k1; ; radius none", table.isotopes().get(2).source());
    }

    @Test
    void aFreeTextIsotopeSourceIsRefusedNotWrittenWrong() {
        IsotopeTable table = new IsotopeTable(ISOTOPES, List.of(new Isotope(1, 1, 1.0078, 0, 1,
                OptionalDouble.of(2.79), OptionalDouble.empty(), "a handbook")));
        ReferenceDataException e = assertThrows(ReferenceDataException.class, () -> IsotopeFiles.writeCsv(table));
        assertEquals(ReferenceDataException.NOT_WRITABLE, e.code());
        assertTrue(e.getMessage().contains("isotope H-1 of 'my-isotopes' has a free-text source ('a handbook')"),
                e.getMessage());
    }

    @Test
    void anIsotopeFileRowWithAnUncertaintyButNoValueIsReported() {
        String text = "# id: mine\n# title: t\n# source: s\n# provenance: measured\n# version: 1\n"
                + String.join(",", NuclearData.ISOTOPE_COLUMNS) + "\n2,4,He,4.0026,0,k,0,,0.1,spin=k,1.68,,k\n";
        DataFileException e = assertThrows(DataFileException.class, () -> NuclearData.read(bytes(text), "mine.csv"));
        assertTrue(e.getMessage().contains("mine.csv:7") && e.getMessage().contains("a moment uncertainty without a"
                + " moment"), e.getMessage());
        String bad = text.replace(",0.1,", ",x,");
        DataFileException b = assertThrows(DataFileException.class, () -> NuclearData.read(bytes(bad), "mine.csv"));
        assertTrue(b.getMessage().contains("field moment_unc_nm is not a finite number: 'x'"), b.getMessage());
    }

    private static QuantumDefects rb87(List<QuantumDefects.Series> series) {
        Species rb = Species.parse("Rb-87 I");
        DataSetInfo info = new DataSetInfo("my-rb", DataKind.QUANTUM_DEFECTS, "invented Rb defects", "1",
                new Provenance(Provenance.Kind.FROM_MEMORY, "invented: for a test"), List.of(rb));
        return new QuantumDefects(info, rb, 33690.8, QuantumDefectFiles.rydbergPerCm(rb), series,
                Optional.of(new CorePolarizability(9.1, 38.4, "invented, 2020")), Optional.of("levels-rb-87"));
    }

    @Test
    void quantumDefectsReadBackEqual() {
        QuantumDefects set = rb87(List.of(new QuantumDefects.Series(0, 1, List.of(3.13, 0.18, -1e-3, 2.5, -7.0), 10),
                new QuantumDefects.Series(1, 3, List.of(2.64), 15)));
        String text = QuantumDefectFiles.writeCsv(set);
        assertEquals(set, QuantumDefectFiles.read(bytes(text), "mine.csv").defects());
    }

    @Test
    void whatTheQuantumDefectFormatCannotHoldIsRefused() {
        ReferenceDataException six = assertThrows(ReferenceDataException.class, () -> QuantumDefectFiles.writeCsv(
                rb87(List.of(new QuantumDefects.Series(0, 1, List.of(3.1, 0.1, 0.1, 0.1, 0.1, 0.1), 10)))));
        assertTrue(six.getMessage().contains("series l = 0, j = 1/2 has the coefficients"), six.getMessage());
        ReferenceDataException zero = assertThrows(ReferenceDataException.class, () -> QuantumDefectFiles.writeCsv(
                rb87(List.of(new QuantumDefects.Series(0, 1, List.of(3.1, 0.0), 10)))));
        assertEquals(ReferenceDataException.NOT_WRITABLE, zero.code());
    }
}
