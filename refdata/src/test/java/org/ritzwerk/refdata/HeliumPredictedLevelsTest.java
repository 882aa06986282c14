package org.ritzwerk.refdata;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

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
 * The He I levels n = 5 to 10 of levels-he-i, which make_helium_levels.py predicts by a Rydberg-Ritz
 * fit of the recalled n = 2-4 levels and the published ionization energy: the engine's series fit
 * gives the same levels, and their Ritz lines meet the Handbook's strong lines within their stated
 * uncertainties.
 */
class HeliumPredictedLevelsTest {

    private static final Species HE = Species.parse("He I");
    /**
     * IE(1s2 1S0) = 5 945 204 290(33) MHz: D. C. Morton, Q. Wu and G. W. F. Drake, Can. J. Phys. 84, 83
     * (2006), as read in the abstract (the value make_helium_levels.py uses); in cm^-1 with c exact.
     */
    private static final double IE_PER_CM = 5945204290e6 / 299792458e2;
    private static final double IE_UNCERTAINTY_PER_CM = 33e6 / 299792458e2;
    /** Series: label pattern (n in place of %d), the lowest recalled n, terms of the script's fit. */
    private static final Object[][] SERIES = {
        {"1s%ds 1S0", 2, 3}, {"1s%ds 3S1", 2, 3}, {"1s%dp 1P1", 2, 3}, {"1s%dp 3P2", 2, 3},
        {"1s%dd 1D2", 3, 2}, {"1s%dd 3D3", 3, 2}};
    private static final Pattern FIT_U = Pattern.compile("u = fit ([0-9.e+-]+) \\(\\+\\) truncation ([0-9.e+-]+) cm-1");

    private static Map<String, Integer> index(LevelList list) {
        Map<String, Integer> byLabel = new HashMap<>();
        for (int i = 0; i < list.size(); i++) {
            byLabel.put(list.label(i), i);
        }
        return byLabel;
    }

    @Test
    void theEngineSeriesFitOfTheRecalledLevelsGivesThePredictedLevels() {
        // The script's fit, done again by the engine (SeriesFitter with the ionization energy as one more
        // datum, the R_M of He-4 that the series command uses): each predicted level within 1e-4 cm^-1
        // (the file prints 4 decimals) and within 1 % of its stated uncertainty; the engine's covariance
        // gives the note's fit part within its two printed digits; the stated uncertainty covers it
        DataContext context = DataContext.builtIn();
        LevelList list = context.levelList(HE).orElseThrow();
        Map<String, Integer> byLabel = index(list);
        double rydberg = SeriesFiles.rydbergPerCm(context, Species.parse("He-4 I"));
        int predicted = 0;
        for (Object[] s : SERIES) {
            String pattern = (String) s[0];
            RydbergSeries.Builder b = RydbergSeries.builder(pattern);
            for (int n = (int) s[1]; n <= 4; n++) {
                int i = byLabel.get(String.format(pattern, n));
                assertTrue(list.rowNote(i).startsWith("from memory"), list.label(i));
                b.add(n, list.energy(i), list.uncertainty(i).orElseThrow());
            }
            SeriesFit fit = SeriesFitter.defaults().withTerms((int) s[2]).withLimit(IE_PER_CM, IE_UNCERTAINTY_PER_CM)
                    .fit(rydberg, List.of(b.build()));
            assertEquals(0, fit.degreesOfFreedom(), pattern + ": the fit interpolates");
            for (int n = 5; n <= 10; n++) {
                String label = String.format(pattern, n);
                Integer i = byLabel.get(label);
                assertTrue(i != null, label + " missing");
                predicted++;
                SeriesFit.Member m = fit.prediction(0, n).memberOrThrow();
                double u = list.uncertainty(i).orElseThrow();
                assertEquals(m.energyPerCm(), list.energy(i), Math.min(1e-4, 0.01 * u), label);
                Matcher parts = FIT_U.matcher(list.rowNote(i));
                assertTrue(parts.find() && list.rowNote(i).startsWith("computed"), list.rowNote(i));
                double fitPart = Double.parseDouble(parts.group(1));
                double truncation = Double.parseDouble(parts.group(2));
                assertEquals(fitPart, m.fitUncertaintyPerCm(), 0.05 * fitPart, label + " covariance part");
                assertTrue(u >= Math.hypot(m.fitUncertaintyPerCm(), truncation) * 0.99, label + " u = " + u);
                // the truncation part is what makes the uncertainty honest: far above the covariance's
                assertTrue(truncation > 3 * m.fitUncertaintyPerCm(), label + ": " + list.rowNote(i));
            }
        }
        assertEquals(36, predicted);
        // the other J levels: their n = 4 (3P) or n = 3 (3D) splitting scaled as n^-3
        for (int n = 4; n <= 10; n++) {
            for (String[] fine : new String[][] {{"p 3P2", "p 3P1", "4"}, {"p 3P2", "p 3P0", "4"},
                {"d 3D3", "d 3D2", "3"}, {"d 3D3", "d 3D1", "3"}}) {
                int m = Integer.parseInt(fine[2]);
                if (n == m) {
                    continue;
                }
                double split = list.energy(byLabel.get("1s" + m + fine[1])) - list.energy(byLabel.get("1s" + m + fine[0]));
                double ours = list.energy(byLabel.get("1s" + n + fine[1])) - list.energy(byLabel.get("1s" + n + fine[0]));
                assertEquals(split * Math.pow((double) m / n, 3), ours, 1.1e-4, "1s" + n + fine[1]);
            }
        }
        // 4d 3D2 and 3D1 are not recalled: computed from 4d 3D3 as the n >= 5 ones are
        for (String j : new String[] {"2", "1"}) {
            int i = byLabel.get("1s4d 3D" + j);
            assertTrue(list.rowNote(i).startsWith("computed: 1s4d 3D3 plus the n = 3 splitting"), list.rowNote(i));
        }
        assertEquals(25 + 2 + 60, list.size(), "n <= 4 recalled (and 4d 3D2, 3D1 computed), n = 5-10 predicted "
                + "(10 levels per n)");
    }

    @Test
    void strongLinesFromNFiveAndSixMeetTheHandbookWithinTheirUncertainties() {
        // Air wavelengths (nm) of the strong-lines table of the NIST Handbook of Basic Atomic
        // Spectroscopic Data (J. E. Sansonetti and W. C. Martin, J. Phys. Chem. Ref. Data 34, 1559 (2005),
        // version 1.1.3), from memory (make_helium_levels.py, check 4). A blend of fine-structure
        // components is compared with the components' mean weighted by their LS line strengths (the
        // J = 0 component left out), as the script does. Each Ritz wavelength must lie within twice the
        // combined standard uncertainty (the Ritz uncertainty of the predicted levels and the table's
        // rounding, half a unit of its last digit over sqrt(3)); the root-mean-square pull must be at
        // most 1, and the stated uncertainty must stay useful (below 0.01 nm), so an inflated
        // uncertainty fails as much as a wrong level
        LineSet lines = LineQuery.defaults()
                .withWindow(Wavelength.ofNanometres(290, Medium.air()), Wavelength.ofNanometres(450, Medium.air()))
                .run(DataLines.sources(DataContext.builtIn(), List.of(HE), Tier.QED));
        Map<String, Integer> byName = new HashMap<>();
        for (int i = 0; i < lines.size(); i++) {
            byName.put(lines.name(i), i);
        }
        Object[][] handbook = {
            {438.7929, new Object[] {"1s5d 1D2 - 1s2p 1P1", 1}},
            {443.7551, new Object[] {"1s5s 1S0 - 1s2p 1P1", 1}},
            {414.3761, new Object[] {"1s6d 1D2 - 1s2p 1P1", 1}},
            {416.8967, new Object[] {"1s6s 1S0 - 1s2p 1P1", 1}},
            {361.3641, new Object[] {"1s5p 1P1 - 1s2s 1S0", 1}},
            {294.5104, new Object[] {"1s5p 3P2 - 1s2s 3S1", 1}},
            {412.0812, new Object[] {"1s5s 3S1 - 1s2p 3P2", 5, "1s5s 3S1 - 1s2p 3P1", 3}},
            {402.6191, new Object[] {"1s5d 3D3 - 1s2p 3P2", 84, "1s5d 3D2 - 1s2p 3P2", 15, "1s5d 3D1 - 1s2p 3P2", 1,
                "1s5d 3D2 - 1s2p 3P1", 45, "1s5d 3D1 - 1s2p 3P1", 15}},
            {381.9607, new Object[] {"1s6d 3D3 - 1s2p 3P2", 84, "1s6d 3D2 - 1s2p 3P2", 15, "1s6d 3D1 - 1s2p 3P2", 1,
                "1s6d 3D2 - 1s2p 3P1", 45, "1s6d 3D1 - 1s2p 3P1", 15}},
        };
        double rounding = 0.5e-4 / Math.sqrt(3);
        double sumPull2 = 0;
        for (Object[] row : handbook) {
            Object[] parts = (Object[]) row[1];
            double weights = 0;
            double nm = 0;
            double u = 0;
            for (int k = 0; k < parts.length; k += 2) {
                Integer i = byName.get((String) parts[k]);
                assertTrue(i != null, parts[k] + " missing");
                double w = (int) parts[k + 1];
                weights += w;
                nm += w * lines.wavelengthMetres(i, Medium.air()) * 1e9;
                u += w * lines.vacuumWavelengthUncertaintyMetres(i).orElseThrow() * 1e9;
                assertTrue(lines.einsteinA(i).isPresent(), parts[k] + " has an A");
            }
            nm /= weights;
            u /= weights;
            double combined = Math.hypot(u, rounding);
            double pull = (nm - (double) row[0]) / combined;
            sumPull2 += pull * pull;
            assertTrue(Math.abs(pull) <= 2, parts[0] + ": Ritz " + nm + " +- " + u + " nm, handbook " + row[0]);
            assertTrue(u < 0.01, parts[0] + ": uncertainty " + u + " nm");
        }
        assertTrue(Math.sqrt(sumPull2 / handbook.length) <= 1, "rms pull " + Math.sqrt(sumPull2 / handbook.length));
    }

    @Test
    void twoDigitPrincipalNumbersKeepTheirParity() {
        // 1s10s, 1s10p and 1s10d: the label reader must give them the parity of their orbitals
        LineSet uv = LineQuery.defaults()
                .withWindow(Wavelength.ofNanometres(250, Medium.vacuum()), Wavelength.ofNanometres(390, Medium.vacuum()))
                .run(DataLines.sources(DataContext.builtIn(), List.of(HE), Tier.QED));
        List<String> names = java.util.stream.IntStream.range(0, uv.size()).mapToObj(uv::name).toList();
        assertTrue(names.contains("1s10d 1D2 - 1s2p 1P1") && names.contains("1s10s 1S0 - 1s2p 1P1")
                && names.contains("1s10p 1P1 - 1s2s 1S0") && names.contains("1s10p 3P2 - 1s2s 3S1"), names.toString());
        assertFalse(names.contains("1s10s 1S0 - 1s2s 1S0") || names.contains("1s10p 1P1 - 1s2p 1P1")
                || names.contains("1s10d 1D2 - 1s2s 1S0"), names.toString());
    }
}
