package org.ritzwerk.refdata;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.HashMap;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.ritzwerk.atom.Species;
import org.ritzwerk.atom.State;
import org.ritzwerk.data.LevelList;
import org.ritzwerk.data.QuantumDefects;
import org.ritzwerk.engine.hydrogenic.HydrogenLikeModel;
import org.ritzwerk.engine.hydrogenic.Tier;
import org.ritzwerk.engine.identify.Candidates;
import org.ritzwerk.engine.identify.Identification;
import org.ritzwerk.engine.identify.IdentificationSearch;
import org.ritzwerk.engine.identify.Identifier;
import org.ritzwerk.engine.identify.PeakList;
import org.ritzwerk.engine.identify.Tolerance;
import org.ritzwerk.engine.lines.LineQuery;
import org.ritzwerk.engine.lines.LineSet;
import org.ritzwerk.engine.lines.LineSources;
import org.ritzwerk.engine.ritz.RitzLevels;
import org.ritzwerk.engine.ritz.RitzLines;
import org.ritzwerk.engine.ritz.RydbergSeries;
import org.ritzwerk.engine.ritz.SeriesFit;
import org.ritzwerk.engine.ritz.SeriesFitter;
import org.ritzwerk.engine.rydberg.AlkaliAtom;
import org.ritzwerk.medium.Medium;
import org.ritzwerk.quantity.Unit;
import org.ritzwerk.quantity.Wavelength;

/** The built-in He I levels (levels/levels-he-i.csv) and their Ritz lines. */
class HeliumLevelsTest {

    private static final Species HE = Species.parse("He I");

    @Test
    void linesToTheGroundCarryTheSharedOffsetOfTheExcitedLevels() {
        RitzLevels levels = DataLines.levels(DataContext.builtIn(), HE);
        org.ritzwerk.engine.ritz.RitzTransitions lines = RitzLines.defaults().compute(levels);
        // The excited levels sit on the theoretical IE(1s2 1S0) of Morton, Wu and Drake (2006),
        // 5 945 204 290(33) MHz; the measurement of Kandula et al., Phys. Rev. A 84, 062512 (2011),
        // 5 945 204 212(6) MHz, lies 78 MHz = 78e6 / 29 979 245 800 cm-1 = 2.6e-3 cm-1 away: a line to the
        // ground must not be stated more precisely than that (it was 7e-5 cm-1, 1.7e-8 nm at 58.43 nm)
        double offset = 78e6 / 29_979_245_800.0;
        boolean ground = false;
        boolean excited = false;
        for (int i = 0; i < lines.size(); i++) {
            String upper = levels.label(lines.upper(i));
            String lower = levels.label(lines.lower(i));
            double u = lines.wavenumberUncertaintyPerCm(i).orElseThrow();
            if (lower.equals("1s2 1S0")) {
                assertTrue(u >= offset, upper + " - 1s2 1S0: u " + u + " cm-1 below the offset " + offset);
                ground |= upper.equals("1s2p 1P1");
            }
            if (upper.equals("1s3d 1D2") && lower.equals("1s2p 1P1")) {
                // both n <= 4 levels at half a unit of their last digit (5e-5 cm-1): the offset cancels
                assertEquals(Math.sqrt(2) * 5e-5, u, 1e-12, "667.8 nm");
                excited = true;
            }
        }
        assertTrue(ground && excited, "58.43 nm and 667.8 nm lines found");
    }

    @Test
    void heliumIsASpeciesWithLinesFromItsLevels() {
        DataContext context = DataContext.builtIn();
        assertTrue(context.levelSpecies().contains(HE), context.levelSpecies().toString());
        assertTrue(context.levelSpecies().stream().noneMatch(s -> s.z() == 37 || s.isHydrogenLike()),
                "alkali and one-electron level sets are not listed: " + context.levelSpecies());
        LevelList list = context.levelList(Species.parse("He-4 I")).orElseThrow();
        assertEquals("levels-he-i", list.info().id());
        LineSet lines = LineQuery.defaults()
                .withWindow(Wavelength.ofNanometres(380, Medium.air()), Wavelength.ofNanometres(730, Medium.air()))
                .run(DataLines.sources(context, List.of(HE), Tier.QED));
        Map<String, Integer> byName = new HashMap<>();
        for (int i = 0; i < lines.size(); i++) {
            byName.put(lines.name(i), i);
            assertEquals(HE, lines.species(i));
            assertEquals("ritz", lines.source(i).model());
            assertTrue(lines.vacuumWavelengthUncertaintyMetres(i).isPresent());
        }
        // Air wavelengths of singlet lines (single lines, no fine structure) in the strong-lines table
        // of the NIST Handbook of Basic Atomic Spectroscopic Data (J. E. Sansonetti and W. C. Martin, J.
        // Phys. Chem. Ref. Data 34, 1559 (2005), version 1.1.3), from memory, printed to 1e-4 nm: the
        // Ritz lines agree within 2 units of that last digit (the Ritz uncertainties are ~1e-6 nm; the
        // printed wavelengths' own uncertainty, not stated here, dominates)
        Object[][] published = {
            {"1s3p 1P1 - 1s2s 1S0", 501.5678}, {"1s3d 1D2 - 1s2p 1P1", 667.8151}, {"1s3s 1S0 - 1s2p 1P1", 728.1349},
            {"1s4d 1D2 - 1s2p 1P1", 492.1931}, {"1s4s 1S0 - 1s2p 1P1", 504.7738}, {"1s4p 1P1 - 1s2s 1S0", 396.4729},
            {"1s3p 3P2 - 1s2s 3S1", 388.8648}};
        for (Object[] row : published) {
            Integer i = byName.get((String) row[0]);
            assertTrue(i != null, row[0] + " missing from " + byName.keySet());
            assertEquals((double) row[1], lines.wavelengthMetres(i, Medium.air()) * 1e9, 2e-4, (String) row[0]);
        }
        // by default the LS rules hold where both labels give a term, as in the lines command:
        // 1s2p 1P1 - 1s2 1S0 (VUV) is there, the intercombination line 1s2p 3P1 - 1s2 1S0 is not
        LineQuery vuvWindow = LineQuery.defaults()
                .withWindow(Wavelength.ofNanometres(50, Medium.vacuum()), Wavelength.ofNanometres(70, Medium.vacuum()));
        List<String> withLs = names(vuvWindow.run(DataLines.sources(context, List.of(HE), Tier.QED)));
        assertTrue(withLs.contains("1s2p 1P1 - 1s2 1S0") && !withLs.contains("1s2p 3P1 - 1s2 1S0"), withLs.toString());
        // the E1 rules alone keep it, and still refuse Delta J = 2 and parity-keeping pairs
        List<String> e1 = names(vuvWindow.run(LineSources.none().withLevels(DataLines.levels(context, HE),
                DataLines.ritzLines(context, HE).withLsRules(false))));
        assertTrue(e1.contains("1s2p 3P1 - 1s2 1S0") && e1.contains("1s2p 1P1 - 1s2 1S0"), e1.toString());
        assertTrue(!e1.contains("1s2p 3P2 - 1s2 1S0") && !e1.contains("1s2s 3S1 - 1s2 1S0"), e1.toString());
    }

    private static List<String> names(LineSet lines) {
        return java.util.stream.IntStream.range(0, lines.size()).mapToObj(lines::name).toList();
    }

    @Test
    void aPublishedSeriesGivesItsPublishedLimitAndDefects() {
        // The Rb-87 nS1/2 series of the built-in quantum-defect set (limit from M. Mack et al., Phys. Rev.
        // A 83, 052515 (2011), defects as the set's file names them): its levels n = 20 to 60, each
        // given an uncertainty of 1e-4 cm^-1, fitted with the isotope's R_M give back the set's limit
        // and d0, d2 within the fit's own uncertainties (the levels carry no noise: a check that the
        // fitter inverts the formula it shares with AlkaliAtom, at the published parameters)
        DataContext context = DataContext.builtIn();
        Species rb = Species.parse("Rb-87 I");
        AlkaliAtom atom = context.alkaliAtom(rb);
        QuantumDefects.Series s = atom.quantumDefects().series().stream().filter(x -> x.l() == 0).findFirst()
                .orElseThrow();
        RydbergSeries.Builder b = RydbergSeries.builder("nS1/2");
        for (int n = 20; n <= 60; n++) {
            b.add(n, atom.energyPerCm(State.of(n, 0, 1)), 1e-4);
        }
        SeriesFit fit = SeriesFitter.defaults().withTerms(s.coefficients().size())
                .fit(atom.rydbergPerCm(), List.of(b.build()));
        assertEquals(atom.ionisationLimitPerCm(), fit.limitPerCm(), 1e-3 * fit.limitUncertaintyPerCm() + 1e-7);
        for (int k = 0; k < s.coefficients().size(); k++) {
            assertEquals(s.coefficients().get(k), fit.defects(0)[k], 1e-3 * fit.defectUncertainties(0)[k] + 1e-9,
                    "d" + 2 * k);
        }
        assertEquals(0.0, fit.chiSquare(), 1e-6);
    }

    @Test
    void heliumLinesAreIdentifiedInASyntheticDischarge() {
        // An invented discharge: the He I singlet lines of the built-in levels and the H I Balmer lines
        // in 380-700 nm, in air, each moved by a seeded error of 2e-4 nm (its stated sigma); the He
        // lines come as Ritz lines under the E1 and LS rules, H I from its one-electron model
        DataContext data = DataContext.builtIn();
        RitzLevels levels = RitzLevels.of(data.levelList(HE).orElseThrow(), HE);
        LineSet he = LineQuery.defaults()
                .withWindow(Wavelength.ofNanometres(380, Medium.air()), Wavelength.ofNanometres(700, Medium.air()))
                .run(LineSources.none().withLevels(levels, RitzLines.defaults().withLsRules(true)));
        HydrogenLikeModel hydrogen = HydrogenLikeModel.of(data.nucleus(Species.parse("H I")), Tier.QED);
        Candidates balmer = Candidates.inWindow(380e-9, 700e-9).hydrogenLike(Species.parse("H I"), hydrogen, 8, false)
                .build();
        java.util.List<Double> positions = new java.util.ArrayList<>();
        java.util.List<String> expected = new java.util.ArrayList<>();
        for (int i = 0; i < he.size(); i++) {
            if (he.upperLabel(i).orElseThrow().endsWith("1P1") || he.upperLabel(i).orElseThrow().endsWith("1D2")
                    || he.upperLabel(i).orElseThrow().endsWith("1S0")) {
                positions.add(he.wavelengthMetres(i, Medium.air()) * 1e9);
                expected.add(he.upperLabel(i).orElseThrow() + " - " + he.lowerLabel(i).orElseThrow());
            }
        }
        int heLines = positions.size();
        for (int j = 0; j < balmer.catalog().size(); j++) {
            positions.add(Medium.air().fromVacuum(balmer.catalog().wavelength(j)) * 1e9);
            expected.add(null);
        }
        java.util.Random r = new java.util.Random(2026);
        int n = positions.size();
        double[] nm = new double[n];
        double[] sigma = new double[n];
        double[] intensity = new double[n];
        for (int k = 0; k < n; k++) {
            nm[k] = positions.get(k) + 2e-4 * r.nextGaussian();
            sigma[k] = 2e-4;
            intensity[k] = 100;
        }
        PeakList peaks = PeakList.of(nm, sigma, intensity, Unit.NANOMETRE, Medium.air());
        IdentificationSearch search = IdentificationSearch.of(Identifier.of(Tolerance.parse("4 sigma")));
        double[] window = search.candidateWindow(peaks);
        Candidates candidates = Candidates.inWindow(window[0], window[1])
                .hydrogenLike(Species.parse("H I"), hydrogen, 8, false).lineSet(he).build();
        Identification result = search.run(peaks, candidates.catalog()).identification();
        // 396.5, 492.2, 501.6, 504.8, 667.8 nm from n <= 4, and 12 with an upper level n = 5 to 10 (predicted
        // levels): 2p 1P - nd 1D and ns 1S for n = 5 to 10 (438.8 and 443.8 nm down to 383.4 and 384.3 nm)
        assertEquals(17, heLines, "singlet lines in the window: " + expected);
        for (int k = 0; k < heLines; k++) {
            assertEquals(Identification.MATCHED, result.status(k), "peak " + nm[k] + " nm");
            assertEquals(expected.get(k), candidates.catalog().label(result.line(k)), "peak " + nm[k] + " nm");
        }
        for (int k = heLines; k < n; k++) {
            assertEquals(Identification.MATCHED, result.status(k), "Balmer peak " + nm[k] + " nm");
            assertTrue(!candidates.catalog().label(result.line(k)).contains("1s"), "a Balmer peak stays H I");
        }
    }
}
