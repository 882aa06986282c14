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
 * Shared uncertainty components in the {@code ritzwerk-levels} format: each defect reported at its file,
 * line and column (fixtures named after their defects, invented levels); exact round trips, alone and
 * beside correlations; lines from a file with components take them into account, as from the same
 * covariance written as correlations.
 */
class LevelSharedUncertaintyFilesTest {

    private static final Species HE = Species.parse("He I");
    private static final String HEAD = "# ritzwerk-levels 1\n# id: x\n# title: t\n# source: s\n# provenance: computed\n"
            + "# version: 1\n# energy-unit: cm-1\nspecies,label,energy,uncertainty\n";

    private static DataFileException refused(String fixture) {
        try (InputStream in = LevelSharedUncertaintyFilesTest.class.getResourceAsStream("/files/" + fixture)) {
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
    void everyBadRowIsReportedWhereItStands() {
        DataFileException e = refused("levels-shared-unknown-and-bad-values.csv");
        assertEquals(List.of("16:2 data.unknown-level", "17:3 data.missing-value", "18:4 data.not-a-number",
                "19:4 data.missing-value", "20:3 data.duplicate", "22:4 data.share-too-large", "23:2 data.bad-share"),
                where(e), e.getMessage());
        String m = e.getMessage();
        assertTrue(m.contains("levels-shared-unknown-and-bad-values.csv:16:2: column label: no level '1s3p 3P2' "
                + "of He I"), m);
        assertTrue(m.contains("component's name is empty"), m);
        assertTrue(m.contains("is given component 'limit' on line 15 already"), m);
        // 1s3s 3S1, u = 0.004: 0.003^2 + 0.003^2 = 1.8e-5 > 1.6e-5 (arithmetic)
        assertTrue(m.contains("the contributions of level '1s3s 3S1' squared add up to 1.800e-05 here, more than its "
                + "uncertainty 0.004 squared (line 12)"), m);
        assertTrue(m.contains("level '1s2 1S0' (line 9) has uncertainty 0"), m);
    }

    @Test
    void jsonSharesAreCheckedLikeCsvOnes() {
        DataFileException e = refused("levels-shared-bad.json");
        assertEquals(List.of("16:0 data.bad-share", "17:5 data.wrong-type"), where(e), e.getMessage());
        assertTrue(e.getMessage().contains("entry 2 of 'sharedUncertainties', column component: component 'limit' is "
                + "shared by He I levels already"), e.getMessage());
    }

    @Test
    void aCorrelatedPairMustShareNoComponentAndEachSectionComesOnce() {
        DataFileException e = refused("levels-shared-and-correlated-pair.csv");
        assertEquals(List.of("19:3 data.bad-correlation", "20:1 data.section-twice"), where(e), e.getMessage());
        assertTrue(e.getMessage().contains("levels '1s2p 3P2' and '1s2s 3S1' share the uncertainty component 'limit'"),
                e.getMessage());
        assertTrue(e.getMessage().contains("a second '# shared-uncertainties' section: give its rows in the first "
                + "(line 12)"), e.getMessage());
    }

    @Test
    void aSpeciesWithComponentsNeedsEveryUncertainty() {
        DataFileException e = assertThrows(DataFileException.class, () -> LevelListFiles.readCsv(HEAD
                + "He I,1s2s 3S1,159855.97,\nHe I,1s2p 3P2,169086.77,0.003\n# shared-uncertainties\n"
                + "species,label,component,value\nHe I,1s2p 3P2,limit,0.001\n", "u.csv"));
        assertEquals(List.of("9:4 data.missing-value"), where(e), e.getMessage());
    }

    @Test
    void correlationsBesideSharesStillMakeASemidefiniteMatrixOrAreRefused() {
        // a and b share "limit" fully (0.002 of u = 0.002 each, so their covariance is 4e-6 and their correlation
        // 1); c correlated +0.9 with a and -0.9 with b cannot be (common practice: a 3 x 3 correlation matrix
        // needs 1 + 2 r_ab r_ac r_bc - r_ab^2 - r_ac^2 - r_bc^2 >= 0; here 1 - 1.62 - 1 - 1.62 < 0), refused at
        // the last row correlating c (the third level) with a level before it
        String text = HEAD + "He I,1s2s 3S1,159855.97,0.002\nHe I,1s2p 3P2,169086.77,0.002\n"
                + "He I,1s3s 3S1,183236.79,0.004\n# shared-uncertainties\nspecies,label,component,value\n"
                + "He I,1s2s 3S1,limit,0.002\nHe I,1s2p 3P2,limit,0.002\n# correlations\n"
                + "species,label,other,correlation\nHe I,1s3s 3S1,1s2s 3S1,0.9\nHe I,1s3s 3S1,1s2p 3P2,-0.9\n";
        DataFileException e = assertThrows(DataFileException.class, () -> LevelListFiles.readCsv(text, "psd.csv"));
        assertEquals(List.of("19:4 data.not-semidefinite"), where(e), e.getMessage());
        // with +0.9 to both it is one (1 + 1.62 - 1 - 1.62 = 0, on the boundary): read
        LevelList list = LevelListFiles.readCsv(text.replace("-0.9", "0.9"), "ok.csv");
        assertEquals(2, list.shareCount());
        assertEquals(2, list.correlationCount());
    }

    @Test
    void writtenSharesReadBackBitForBit() {
        qt().withFixedSeed(21L).withExamples(60).forAll(longs().all(), integers().between(1, 12))
                .checkAssert((seed, n) -> {
                    Random random = new Random(seed);
                    DataSetInfo info = new DataSetInfo("generated", DataKind.LEVELS, "generated table", "1",
                            Provenance.computedBy("the test's generator"), List.of(HE));
                    LevelList.Builder b = LevelList.builder(info, n % 2 == 0 ? Unit.PER_CENTIMETRE : Unit.ELECTRONVOLT,
                            "");
                    double[] u = new double[n];
                    for (int i = 0; i < n; i++) {
                        u[i] = 1e-4 + random.nextDouble() * 1e-2;
                        b.add(HE, "level " + i, 1000.0 * i + random.nextDouble(), u[i], -1, null);
                    }
                    // up to four components, each level taking a random subset with parts that fit its uncertainty
                    String[] names = {"limit", "calibration, lamp", "series \"a\" d0", "\u00fcn\u00efcode"};
                    boolean[] shares = new boolean[n];
                    for (int i = 0; i < n; i++) {
                        double left = u[i];
                        for (String name : names) {
                            if (random.nextBoolean()) {
                                double v = (2 * random.nextDouble() - 1) * left / 2;
                                b.share(i, name, v);
                                left = Math.sqrt(left * left - v * v) * 0.999;
                                shares[i] = true;
                            }
                        }
                    }
                    // correlations of pairs where a level has no component (never a pair sharing one), small
                    // enough to keep the matrix diagonally dominant
                    for (int i = 0; i < n; i++) {
                        for (int j = i + 1; j < n; j++) {
                            if (!shares[i] && !shares[j] && random.nextInt(3) == 0) {
                                b.correlate(i, j, (2 * random.nextDouble() - 1) / n);
                            }
                        }
                    }
                    LevelList table = b.build();
                    assertEquals(table, LevelListFiles.readCsv(LevelListFiles.writeCsv(table), "x.csv"));
                    assertEquals(table, LevelListFiles.readJson(LevelListFiles.writeJson(table), "x.json"));
                });
    }

    @Test
    void spacesAroundAComponentNameDoNotMakeAnotherSource() {
        // common practice: a CSV cell's surrounding spaces are not part of a name
        String text = HEAD + "He I,1s2s 3S1,159855.97,0.002\nHe I,1s2p 3P2,169086.77,0.003\n"
                + "# shared-uncertainties\nspecies,label,component,value\nHe I,1s2s 3S1, series  limit ,0.001\n"
                + "He I,1s2p 3P2,series limit,-0.002\n";
        LevelList list = LevelListFiles.readCsv(text, "spaces.csv");
        assertEquals("series limit", list.shareComponent(0));
        assertEquals(list.shareComponent(0), list.shareComponent(1));
    }

    @Test
    void theTwoSectionsReadInEitherOrder() {
        String levels = HEAD + "He I,1s2s 3S1,159855.97,0.002\nHe I,1s2p 3P2,169086.77,0.003\n"
                + "He I,1s3s 3S1,183236.79,0.004\n";
        String shares = "# shared-uncertainties\nspecies,label,component,value\nHe I,1s2s 3S1,limit,0.001\n"
                + "He I,1s2p 3P2,limit,-0.002\n";
        String correlations = "# correlations\nspecies,label,other,correlation\nHe I,1s3s 3S1,1s2p 3P2,0.25\n";
        LevelList first = LevelListFiles.readCsv(levels + correlations + shares, "a.csv");
        assertEquals(first, LevelListFiles.readCsv(levels + shares + correlations, "b.csv"));
        assertEquals(2, first.shareCount());
        assertEquals(1, first.correlationCount());
        String written = LevelListFiles.writeCsv(first);
        assertTrue(written.indexOf("\n# correlations\n") < written.indexOf("\n# shared-uncertainties\n")
                && written.indexOf("\n# correlations\n") > 0, written);
        assertEquals(first, LevelListFiles.readCsv(written, "w.csv"));
    }

    @Test
    void linesTakeTheSharedPartsAsTheSameCovarianceWrittenAsCorrelationsDoes() {
        // two levels of opposite parity, u = 0.002 and 0.003 cm-1, sharing one component with contributions 0.001
        // and -0.002 and another with 0.0012 and 0.0015: covariance -2e-6 + 1.8e-6 = -2e-7 cm-2, so the line
        // has u = sqrt(u1^2 + u2^2 - 2 V_12) (common practice: the GUM, JCGM 100:2008, eq. 13)
        String levels = HEAD + "He I,1s2s 3S1,159855.97,0.002\nHe I,1s2p 3P2,169086.77,0.003\n";
        LevelList shared = LevelListFiles.readCsv(levels + "# shared-uncertainties\nspecies,label,component,value\n"
                + "He I,1s2s 3S1,limit,0.001\nHe I,1s2p 3P2,limit,-0.002\nHe I,1s2s 3S1,lamp,0.0012\n"
                + "He I,1s2p 3P2,lamp,0.0015\n", "s.csv");
        double cov = 0.001 * -0.002 + 0.0012 * 0.0015;
        double expected = Math.sqrt(4e-6 + 9e-6 - 2 * cov);
        RitzTransitions lines = RitzLines.defaults().compute(RitzLevels.of(shared, HE));
        assertEquals(1, lines.size());
        assertEquals(expected, lines.wavenumberUncertaintyPerCm(0).getAsDouble(), 1e-15);
        // the same covariance as a correlation r = cov / (u1 u2)
        LevelList correlated = LevelListFiles.readCsv(levels + "# correlations\nspecies,label,other,correlation\n"
                + "He I,1s2s 3S1,1s2p 3P2," + cov / 6e-6 + "\n", "c.csv");
        assertEquals(expected, RitzLines.defaults().compute(RitzLevels.of(correlated, HE))
                .wavenumberUncertaintyPerCm(0).getAsDouble(), 1e-15);
        // the levels keep their stated uncertainties (the shared parts are parts of them)
        RitzLevels ritz = RitzLevels.of(shared, HE);
        assertEquals(0.002, ritz.uncertaintyPerCm(0).getAsDouble(), 0.0);
        assertEquals(0.003, ritz.uncertaintyPerCm(1).getAsDouble(), 0.0);
    }

    @Test
    void sharesInElectronvoltsAreConvertedWithTheEnergies() {
        // the same level pair in eV: shares scale as the energies do, so the line's uncertainty in cm-1 is that of
        // the file in cm-1 (1 eV = 8065.54... cm-1; compared relative, the factor itself not needed here)
        String cm = HEAD + "He I,1s2s 3S1,159855.97,0.002\nHe I,1s2p 3P2,169086.77,0.003\n"
                + "# shared-uncertainties\nspecies,label,component,value\nHe I,1s2s 3S1,limit,0.0015\n"
                + "He I,1s2p 3P2,limit,0.0025\n";
        LevelList perCm = LevelListFiles.readCsv(cm, "cm.csv");
        double uCm = RitzLines.defaults().compute(RitzLevels.of(perCm, HE)).wavenumberUncertaintyPerCm(0)
                .getAsDouble();
        assertEquals(Math.sqrt(4e-6 + 9e-6 - 2 * 0.0015 * 0.0025), uCm, 1e-15);
        LevelList.Builder ev = LevelList.builder(perCm.info(), Unit.ELECTRONVOLT, "");
        double f = 1.239841984e-4;   // eV per cm-1 (from memory, hc / e; any factor works, the test compares ratios)
        ev.add(HE, "1s2s 3S1", 159855.97 * f, 0.002 * f, -1, null).add(HE, "1s2p 3P2", 169086.77 * f, 0.003 * f, -1,
                null).share(0, "limit", 0.0015 * f).share(1, "limit", 0.0025 * f);
        RitzLevels inEv = RitzLevels.of(ev.build(), HE);
        double ratio = inEv.uncertaintyPerCm(0).getAsDouble() / 0.002;
        assertEquals(uCm * ratio, RitzLines.defaults().compute(inEv).wavenumberUncertaintyPerCm(0).getAsDouble(),
                1e-12 * uCm * ratio);
    }
}
