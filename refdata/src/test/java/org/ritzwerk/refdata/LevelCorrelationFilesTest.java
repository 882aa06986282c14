package org.ritzwerk.refdata;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.quicktheories.QuickTheory.qt;
import static org.quicktheories.generators.SourceDSL.integers;
import static org.quicktheories.generators.SourceDSL.longs;

import java.io.IOException;
import java.io.InputStream;
import java.util.List;
import java.util.Random;
import java.util.stream.Collectors;
import org.junit.jupiter.api.Test;
import org.ritzwerk.atom.Species;
import org.ritzwerk.data.DataKind;
import org.ritzwerk.data.DataSetInfo;
import org.ritzwerk.data.LevelList;
import org.ritzwerk.data.Provenance;
import org.ritzwerk.engine.ritz.RitzLevels;
import org.ritzwerk.engine.ritz.RitzLines;
import org.ritzwerk.engine.ritz.RitzTransitions;
import org.ritzwerk.quantity.Unit;

/**
 * Correlated levels in the {@code ritzwerk-levels} format: each defect reported at its file, line and
 * column (fixtures named after their defects, invented levels); exact round trips; lines from a file
 * with correlations take them into account.
 */
class LevelCorrelationFilesTest {

    private static final Species HE = Species.parse("He I");

    private static DataFileException refused(String fixture) {
        try (InputStream in = LevelCorrelationFilesTest.class.getResourceAsStream("/files/" + fixture)) {
            return assertThrows(DataFileException.class, () -> LevelListFiles.read(in, fixture));
        } catch (IOException io) {
            throw new java.io.UncheckedIOException(io);
        }
    }

    private static List<String> where(DataFileException e) {
        return e.problems().stream().map(p -> p.line() + ":" + p.column() + " " + p.code())
                .collect(Collectors.toList());
    }

    @Test
    void unknownLevelsSelfCorrelationsAndBadValuesAreReportedWhereTheyStand() {
        DataFileException e = refused("levels-correlation-unknown-and-bad-values.csv");
        assertEquals(List.of("16:3 data.unknown-level", "17:3 data.bad-correlation", "18:4 data.out-of-range",
                "19:4 data.not-a-number"), where(e), e.getMessage());
        assertTrue(e.getMessage().contains("levels-correlation-unknown-and-bad-values.csv:16:3: column other: no level "
                + "'1s3p 3P2' of He I in this file"), e.getMessage());
    }

    @Test
    void aPairGivenTwiceWithTwoValuesIsAsymmetricAndAShortRowIsASizeMismatch() {
        DataFileException e = refused("levels-correlation-asymmetric-and-short-row.csv");
        assertEquals(List.of("16:4 data.duplicate", "17:0 data.field-count"), where(e), e.getMessage());
        assertTrue(e.getMessage().contains("is 0.5 on line 15 and 0.4 here: the matrix would not be symmetric"),
                e.getMessage());
        assertTrue(e.getMessage().contains("row has 3 fields, the header has 4"), e.getMessage());
    }

    @Test
    void jsonCorrelationsAreCheckedLikeCsvOnes() {
        DataFileException e = refused("levels-correlation-asymmetric.json");
        assertEquals(List.of("16:0 data.duplicate", "17:5 data.wrong-type"), where(e), e.getMessage());
        assertTrue(e.getMessage().contains("entry 2 of 'correlations', column correlation"), e.getMessage());
    }

    @Test
    void aMatrixThatIsNotPositiveSemidefiniteIsRefusedAtTheRowThatMakesItSo() {
        // correlations 0.9, 0.9 and -0.9 of three levels: the correlation matrix has determinant
        // 1 - 3 * 0.81 - 2 * 0.729 < 0 (common practice: a 3 x 3 correlation matrix is semidefinite only
        // if 1 + 2 r_ab r_ac r_bc - r_ab^2 - r_ac^2 - r_bc^2 >= 0), so it is refused at the third level's row
        DataFileException e = refused("levels-correlation-not-semidefinite.csv");
        assertEquals(List.of("17:4 data.not-semidefinite"), where(e), e.getMessage());
        assertTrue(e.getMessage().contains("the correlations of level '1s3s 3S1' (line 11)"), e.getMessage());
    }

    @Test
    void aCorrelatedSpeciesNeedsEveryUncertaintyAndAnExactLevelCorrelatesWithNothing() {
        String head = "# ritzwerk-levels 1\n# id: x\n# title: t\n# source: s\n# provenance: computed\n# version: 1\n"
                + "# energy-unit: cm-1\nspecies,label,energy,uncertainty\nHe I,1s2 1S0,0,0\nHe I,1s2s 3S1,159855.97,\n"
                + "He I,1s2p 3P2,169086.77,0.003\nHe I,1s3s 3S1,183236.79,0.004\n# correlations\n"
                + "species,label,other,correlation\n";
        DataFileException e = assertThrows(DataFileException.class, () -> LevelListFiles.readCsv(head
                + "He I,1s2p 3P2,1s3s 3S1,0.5\n", "u.csv"));
        assertEquals(List.of("10:4 data.missing-value"), where(e), e.getMessage());
        e = assertThrows(DataFileException.class, () -> LevelListFiles.readCsv(head
                + "He I,1s2 1S0,1s3s 3S1,0.5\n", "u.csv"));
        assertEquals(List.of("15:2 data.bad-correlation"), where(e), e.getMessage());
    }

    @Test
    void writtenCorrelationsReadBackBitForBit() {
        qt().withFixedSeed(21L).withExamples(60).forAll(longs().all(), integers().between(2, 12))
                .checkAssert((seed, n) -> {
                    Random random = new Random(seed);
                    DataSetInfo info = new DataSetInfo("generated", DataKind.LEVELS, "generated table", "1",
                            Provenance.computedBy("the test's generator"), List.of(HE));
                    // groups of levels correlated within, not between (a block-diagonal, positive definite
                    // covariance: the pairs between groups are not written)
                    int[] group = new int[n];
                    for (int i = 0; i < n; i++) {
                        group[i] = random.nextInt(3);
                    }
                    double[][] v = covariance(random, n);
                    for (int i = 0; i < n; i++) {
                        for (int j = 0; j < n; j++) {
                            v[i][j] = group[i] == group[j] ? v[i][j] : 0;
                        }
                    }
                    LevelList.Builder b = LevelList.builder(info, n % 2 == 0 ? Unit.PER_CENTIMETRE : Unit.ELECTRONVOLT,
                            "");
                    for (int i = 0; i < n; i++) {
                        b.add(HE, "level " + i, 1000.0 * i + random.nextDouble(), Math.sqrt(v[i][i]), -1, null);
                    }
                    for (int i = 0; i < n; i++) {
                        for (int j = i + 1; j < n; j++) {
                            if (group[i] == group[j]) {
                                double r = v[i][j] / Math.sqrt(v[i][i] * v[j][j]);
                                if (random.nextBoolean()) {
                                    b.correlate(i, j, r);
                                } else {
                                    b.correlate(j, i, r);
                                }
                            }
                        }
                    }
                    LevelList table = b.build();
                    assertEquals(table, LevelListFiles.readCsv(LevelListFiles.writeCsv(table), "x.csv"));
                    assertEquals(table, LevelListFiles.readJson(LevelListFiles.writeJson(table), "x.json"));
                });
    }

    /** A A^T + diag(1e-7) (cm^-2), A with entries uniform in [-1e-3, 1e-3]: positive definite. */
    private static double[][] covariance(Random random, int n) {
        double[][] a = new double[n][n];
        for (double[] row : a) {
            for (int j = 0; j < n; j++) {
                row[j] = (2 * random.nextDouble() - 1) * 1e-3;
            }
        }
        double[][] v = new double[n][n];
        for (int i = 0; i < n; i++) {
            v[i][i] = 1e-7;
            for (int j = 0; j < n; j++) {
                for (int k = 0; k < n; k++) {
                    v[i][j] += a[i][k] * a[j][k];
                }
            }
        }
        return v;
    }

    @Test
    void linesFromAFileWithCorrelationsTakeThemIntoAccount() {
        // two levels of opposite parity, u = 0.002 and 0.003 cm-1, correlation 0.5: the line's wavenumber
        // has u = sqrt(u1^2 + u2^2 - 2 r u1 u2) (common practice: the GUM, JCGM 100:2008, eq. 13)
        String text = "# ritzwerk-levels 1\n# id: x\n# title: t\n# source: s\n# provenance: computed\n# version: 1\n"
                + "# energy-unit: cm-1\nspecies,label,energy,uncertainty\nHe I,1s2s 3S1,159855.97,0.002\n"
                + "He I,1s2p 3P2,169086.77,0.003\n# correlations\nspecies,label,other,correlation\n"
                + "He I,1s2p 3P2,1s2s 3S1,0.5\n";
        LevelList list = LevelListFiles.readCsv(text, "r.csv");
        RitzTransitions lines = RitzLines.defaults().compute(RitzLevels.of(list, HE));
        assertEquals(1, lines.size());
        double expected = Math.sqrt(4e-6 + 9e-6 - 2 * 0.5 * 6e-6);
        assertEquals(expected, lines.wavenumberUncertaintyPerCm(0).getAsDouble(), 1e-15);
        // without the correlation section: the plain sqrt(u1^2 + u2^2)
        LevelList plain = LevelListFiles.readCsv(text.substring(0, text.indexOf("# correlations")), "p.csv");
        assertEquals(Math.sqrt(13e-6), RitzLines.defaults().compute(RitzLevels.of(plain, HE))
                .wavenumberUncertaintyPerCm(0).getAsDouble(), 1e-15);
    }
}
