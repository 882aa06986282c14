package org.ritzwerk.refdata;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.junit.jupiter.api.Test;
import org.ritzwerk.atom.Species;
import org.ritzwerk.data.LevelList;
import org.ritzwerk.engine.hydrogenic.Tier;
import org.ritzwerk.engine.lines.LineQuery;
import org.ritzwerk.engine.lines.LineSet;
import org.ritzwerk.engine.ritz.RydbergSeries;
import org.ritzwerk.engine.ritz.SeriesFit;
import org.ritzwerk.engine.ritz.SeriesFitter;
import org.ritzwerk.medium.Medium;
import org.ritzwerk.quantity.Wavelength;

/**
 * The built-in Sr-88 I Rydberg levels (levels/levels-sr-i.csv, written by make_strontium_levels.py
 * from the published Rydberg-Ritz parameters in levels/rydberg-ritz-sr-88.csv) and their lines.
 */
class StrontiumLevelsTest {

    private static final Species SR = Species.parse("Sr I");
    private static final Species SR88 = Species.parse("Sr-88 I");
    /**
     * The first ionization limit of Sr-88, 1 377 012 721(10) MHz: L. Couturier et al., Phys. Rev. A 99,
     * 022503 (2019), as printed in the paper's abstract (arXiv:1810.07611); in cm^-1 with c exact.
     */
    private static final double LIMIT_PER_CM = 1377012721e6 / 299792458e2;
    private static final double LIMIT_UNCERTAINTY_PER_CM = 10e6 / 299792458e2;

    /** One row of the parameter file: series name, label pattern, d0, d2, d4. */
    private record Params(String series, Pattern label, double[] defects) {
    }

    @Test
    void strontiumIsASpeciesWithALevelList() {
        DataContext context = DataContext.builtIn();
        assertTrue(context.levelSpecies().stream().anyMatch(s -> s.z() == 38 && s.charge() == 0),
                context.levelSpecies().toString());
        LevelList list = context.levelList(SR).orElseThrow();
        assertEquals("levels-sr-i", list.info().id());
        assertEquals("levels-sr-i", context.levelList(SR88).orElseThrow().info().id());
        // the ground level, the two 5s5p levels and five series (3D2 left out, see the parameter file)
        Map<String, Integer> perSeries = countPerSeries(list);
        assertEquals(Map.of("5sns 3S1", 41, "5snd 3D1", 39, "5sns 1S0", 41, "5snp 1P1", 41, "5snd 1D2", 41),
                perSeries);
        assertEquals(3 + 41 * 4 + 39, list.size());
    }

    @Test
    void fittingTheLevelsBackGivesThePublishedLimitAndDefects() {
        // Each series' levels n = 20 (22 for 3D1) to 60, each given 1e-5 cm^-1 (the file prints 1e-6),
        // fitted with three defect terms and the R_M of Sr-88 that the series command uses: the limit is
        // the published one (abstract of Couturier et al. 2019) and d0, d2, d4 those of the parameter
        // file. This fails if the level file and the fitter disagree on R_M, the formula or the labels.
        DataContext context = DataContext.builtIn();
        LevelList list = context.levelList(SR).orElseThrow();
        double rydberg = SeriesFiles.rydbergPerCm(context, SR88);
        List<Params> params = parameters();
        assertEquals(5, params.size(), "series in use");
        List<RydbergSeries> all = new ArrayList<>();
        for (Params p : params) {
            RydbergSeries series = series(list, p, 1e-5);
            all.add(series(list, p, 0));
            SeriesFit fit = SeriesFitter.defaults().withTerms(3).fit(rydberg, List.of(series));
            assertEquals(LIMIT_PER_CM, fit.limitPerCm(), 2e-5, p.series() + " limit");
            assertTrue(fit.limitUncertaintyPerCm() > 0 && fit.limitUncertaintyPerCm() < 0.05, p.series());
            for (int k = 0; k < 3; k++) {
                double tolerance = 2e-6 * Math.max(1, Math.abs(p.defects()[k])) * Math.pow(400, k);
                assertEquals(p.defects()[k], fit.defects(0)[k], tolerance, p.series() + " d" + 2 * k);
            }
            assertEquals(0.0, fit.chiSquare(), 0.5, p.series() + ": the levels follow the formula (to rounding)");
        }
        // all five series with their stated uncertainties, sharing one limit, the number of terms
        // chosen by the information criterion: the published limit and each d0 lie within three of
        // the fit's standard uncertainties
        SeriesFit shared = SeriesFitter.defaults().fit(rydberg, all);
        assertEquals(LIMIT_PER_CM, shared.limitPerCm(), 3 * shared.limitUncertaintyPerCm());
        assertTrue(shared.limitUncertaintyPerCm() < 0.01, "limit known to " + shared.limitUncertaintyPerCm());
        for (int s = 0; s < all.size(); s++) {
            assertEquals(params.get(s).defects()[0], shared.defects(s)[0], 3 * shared.defectUncertainties(s)[0],
                    params.get(s).series());
        }
    }

    @Test
    void levelsApproachTheLimitAndCarryUncertainties() {
        LevelList list = DataContext.builtIn().levelList(SR).orElseThrow();
        for (int i = 0; i < list.size(); i++) {
            double e = list.energy(i);
            assertTrue(e >= 0 && e < LIMIT_PER_CM, list.label(i) + " below the limit");
            if (list.label(i).startsWith("5s.")) {
                double u = list.uncertainty(i).orElseThrow();
                // at least the limit's 10 MHz, at most 0.05 cm-1 (5snp 1P1 at n = 20: u(d0) = 7e-4 times
                // dE/d(delta) = 2 R_M / n*^3 = 43 cm^-1 gives 0.03 cm^-1)
                assertTrue(u >= LIMIT_UNCERTAINTY_PER_CM * 0.99 && u < 0.05, list.label(i) + " u = " + u);
            }
        }
    }

    @Test
    void linesFollowTheElectricDipoleAndLsRules() {
        DataContext context = DataContext.builtIn();
        LevelList list = context.levelList(SR).orElseThrow();
        LineSet uv = LineQuery.defaults()
                .withWindow(Wavelength.ofNanometres(300, Medium.vacuum()), Wavelength.ofNanometres(440, Medium.vacuum()))
                .run(DataLines.sources(context, List.of(SR), Tier.QED));
        List<String> names = new ArrayList<>();
        for (int i = 0; i < uv.size(); i++) {
            names.add(uv.name(i));
            assertEquals("ritz", uv.source(i).model());
        }
        // 5s30s 3S1 - 5s5p 3P1 (near 319 nm) and 5s30s 1S0 - 5s5p 1P1 / 5s30d 1D2 (near 413 nm) are
        // there; the intercombination line 5s30s 1S0 - 5s5p 3P1 is not, under the default LS rules
        assertTrue(names.contains("5s.30s 3S1 - 5s5p 3P1"), names.toString());
        assertTrue(names.contains("5s.30s 1S0 - 5s5p 1P1") && names.contains("5s.30d 1D2 - 5s5p 1P1"),
                names.toString());
        assertFalse(names.contains("5s.30s 1S0 - 5s5p 3P1"), "intercombination line under the LS rules");
        int i = names.indexOf("5s.30s 3S1 - 5s5p 3P1");
        double upper = energy(list, "5s.30s 3S1");
        double lower = energy(list, "5s5p 3P1");
        assertEquals(1 / ((upper - lower) * 100), uv.vacuumWavelengthMetres(i), 1e-15, "Ritz wavelength");
        // 5snp 1P1 - 5s2 1S0 (VUV, near 218 nm): the ground level reaches the P series only
        LineSet vuv = LineQuery.defaults()
                .withWindow(Wavelength.ofNanometres(200, Medium.vacuum()), Wavelength.ofNanometres(230, Medium.vacuum()))
                .run(DataLines.sources(context, List.of(SR), Tier.QED));
        for (int k = 0; k < vuv.size(); k++) {
            assertTrue(vuv.name(k).startsWith("5s.") && vuv.name(k).endsWith("p 1P1 - 5s2 1S0"), vuv.name(k));
        }
        assertEquals(41, vuv.size(), "one line to each 5snp 1P1 member");
    }

    private static double energy(LevelList list, String label) {
        for (int i = 0; i < list.size(); i++) {
            if (list.label(i).equals(label)) {
                return list.energy(i);
            }
        }
        throw new AssertionError("no level " + label);
    }

    private static Map<String, Integer> countPerSeries(LevelList list) {
        Map<String, Integer> counts = new HashMap<>();
        for (Params p : parameters()) {
            counts.put(p.series(), series(list, p, 0).size());
        }
        return counts;
    }

    /** The series' members; {@code sigma} 0 keeps each level's own uncertainty. */
    private static RydbergSeries series(LevelList list, Params p, double sigma) {
        RydbergSeries.Builder b = RydbergSeries.builder(p.series());
        for (int i = 0; i < list.size(); i++) {
            Matcher m = p.label().matcher(list.label(i));
            if (m.matches()) {
                b.add(Integer.parseInt(m.group(1)), list.energy(i), sigma > 0 ? sigma : list.uncertainty(i).orElseThrow());
            }
        }
        return b.build();
    }

    /** The rows of levels/rydberg-ritz-sr-88.csv whose use column is yes. */
    private static List<Params> parameters() {
        String text;
        try (InputStream in = StrontiumLevelsTest.class.getResourceAsStream(
                "/org/ritzwerk/refdata/levels/rydberg-ritz-sr-88.csv")) {
            text = new String(in.readAllBytes(), StandardCharsets.UTF_8);
        } catch (IOException e) {
            throw new AssertionError(e);
        }
        List<Params> out = new ArrayList<>();
        List<String> columns = null;
        for (String line : text.split("\\R")) {
            if (line.startsWith("#") || line.isBlank()) {
                continue;
            }
            List<String> cells = List.of(line.split(",", -1));
            if (columns == null) {
                columns = cells;
                continue;
            }
            if (!cells.get(columns.indexOf("use")).equals("yes")) {
                continue;
            }
            String label = cells.get(columns.indexOf("label"));
            Pattern pattern = Pattern.compile(Pattern.quote(label).replace("{n}", "\\E(\\d+)\\Q"));
            out.add(new Params(cells.get(columns.indexOf("series")), pattern, new double[] {
                Double.parseDouble(cells.get(columns.indexOf("d0"))), Double.parseDouble(cells.get(columns.indexOf("d2"))),
                Double.parseDouble(cells.get(columns.indexOf("d4")))}));
        }
        return out;
    }
}
