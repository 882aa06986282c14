package org.ritzwerk.refdata;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
import org.ritzwerk.atom.Species;
import org.ritzwerk.data.LevelList;
import org.ritzwerk.engine.ritz.RitzLevels;
import org.ritzwerk.engine.ritz.RitzLines;
import org.ritzwerk.engine.ritz.RitzTransitions;

/**
 * The built-in Sr-88 I Rydberg levels share the series limit's uncertainty (and, for the singlet
 * series, the 0.003 cm-1 limit offset of their paper's fit, {@code limit_extra_unc_cm} in
 * levels/rydberg-ritz-sr-88.csv), which the list's shared uncertainty components carry: a line between
 * two Rydberg levels of two series has the shared parts cancelled, a line to a low level keeps its
 * uncertainty. The expected
 * values are computed here from the levels' stated uncertainties and the shared parts alone (two series
 * share nothing else: their defect parameters are independent), not from the components in the file.
 */
class StrontiumCorrelationsTest {

    private static final Species SR = Species.parse("Sr I");
    /** The limit's 10 MHz (Couturier et al., Phys. Rev. A 99, 022503 (2019), abstract), cm^-1 with c exact. */
    private static final double LIMIT_U = 10e6 / 299792458e2;
    /** The singlet series' extra limit uncertainty, cm^-1 (limit_extra_unc_cm of rydberg-ritz-sr-88.csv). */
    private static final double SINGLET_OFFSET_U = 0.003;

    private static final RitzLevels LEVELS = DataLines.levels(DataContext.builtIn(), SR);
    private static final RitzTransitions LINES = RitzLines.defaults().withLsRules(true).withIntercombination(true)
            .compute(LEVELS);

    private static double u(String label) {
        return LEVELS.uncertaintyPerCm(LEVELS.indexOf(label)).getAsDouble();
    }

    private static double lineU(String upper, String lower) {
        int a = LEVELS.indexOf(upper);
        int b = LEVELS.indexOf(lower);
        assertTrue(a >= 0 && b >= 0, upper + " / " + lower);
        for (int k = 0; k < LINES.size(); k++) {
            if (LINES.upper(k) == a && LINES.lower(k) == b) {
                return LINES.wavenumberUncertaintyPerCm(k).getAsDouble();
            }
        }
        throw new AssertionError("no line " + upper + " - " + lower);
    }

    @Test
    void theBuiltInListCarriesSharedUncertaintiesOfItsRydbergLevelsOnly() {
        LevelList list = DataContext.builtIn().levelList(SR).orElseThrow();
        assertEquals(0, list.correlationCount());
        // components (make_strontium_levels.py): the limit, the singlet limit offset, and d0, d2, d4 of each of
        // the five series used (rydberg-ritz-sr-88.csv, use = yes)
        assertEquals(1 + 1 + 5 * 3, list.uncertaintyComponents().size(), list.uncertaintyComponents().toString());
        java.util.Map<Integer, Double> squares = new java.util.HashMap<>();
        java.util.Set<Integer> withLimit = new java.util.HashSet<>();
        for (int k = 0; k < list.shareCount(); k++) {
            int row = list.shareRow(k);
            assertTrue(list.label(row).startsWith("5s."), list.label(row));
            squares.merge(row, list.share(k) * list.share(k), Double::sum);
            if (list.shareComponent(k).equals("limit")) {
                // written to 12 digits
                assertEquals(LIMIT_U, list.share(k), 1e-12 * LIMIT_U, list.label(row));
                withLimit.add(row);
            }
            if (list.shareComponent(k).equals("singlet limit offset")) {
                assertTrue(list.label(row).matches("5s\\.\\d+[spd] 1[SPD][0-2]"), list.label(row));
                assertEquals(SINGLET_OFFSET_U, list.share(k), 0.0);
            }
        }
        int rydberg = list.size() - 3;   // all but 5s2 1S0, 5s5p 3P1 and 5s5p 1P1
        assertEquals(rydberg, withLimit.size());
        // each level's independent part u^2 - sum v^2 is what rounding u up to two digits adds: not negative
        squares.forEach((row, sum) -> assertTrue(sum <= Math.pow(list.uncertainty(row).getAsDouble(), 2)
                * (1 + LevelList.SHARE_ROUNDING), list.label(row)));
        assertTrue(LEVELS.hasCovariance());
        // listing and loading the set agree on what it is
        org.ritzwerk.refdata.internal.LevelProvider provider = new org.ritzwerk.refdata.internal.LevelProvider();
        assertEquals(provider.dataSets().stream().filter(i -> i.id().equals("levels-sr-i")).findFirst()
                .orElseThrow(), provider.load("levels-sr-i").info());
        assertEquals(list, provider.load("levels-sr-i"));
    }

    @Test
    void aLineBetweenTwoSingletSeriesHasTheSharedLimitPartsCancelled() {
        for (int n : new int[] {25, 40, 60}) {
            String p = "5s." + n + "p 1P1";
            String s = "5s." + n + "s 1S0";
            // u^2 = u_p^2 + u_s^2 - 2 cov, cov = LIMIT_U^2 + SINGLET_OFFSET_U^2 (common practice: the GUM 5.2)
            double expected = Math.sqrt(u(p) * u(p) + u(s) * u(s)
                    - 2 * (LIMIT_U * LIMIT_U + SINGLET_OFFSET_U * SINGLET_OFFSET_U));
            assertEquals(expected, lineU(p, s), 1e-9 * expected, p + " - " + s);
            // taken as independent they would be larger (at n = 60: 0.0013 against 0.0045 cm-1)
            assertTrue(lineU(p, s) < Math.hypot(u(p), u(s)), "smaller than taken as independent");
            String d = "5s." + n + "d 1D2";
            if (LEVELS.energyPerCm(LEVELS.indexOf(d)) > LEVELS.energyPerCm(LEVELS.indexOf(p))) {
                expected = Math.sqrt(u(p) * u(p) + u(d) * u(d)
                        - 2 * (LIMIT_U * LIMIT_U + SINGLET_OFFSET_U * SINGLET_OFFSET_U));
                assertEquals(expected, lineU(d, p), 1e-9 * expected, d + " - " + p);
            }
        }
    }

    @Test
    void anIntercombinationLineSharesTheLimitOnly() {
        // 5snp 1P1 (singlet, with the offset) and 5sns 3S1 (triplet, without): only the limit is shared
        String p = "5s.40p 1P1";
        String t = "5s.40s 3S1";
        double expected = Math.sqrt(u(p) * u(p) + u(t) * u(t) - 2 * LIMIT_U * LIMIT_U);
        assertEquals(expected, lineU(p, t), 1e-9 * expected);
    }

    @Test
    void linesToTheLowLevelsKeepTheirUncertainties() {
        // the ground level is exact, the 5s5p levels are independent of the series: sqrt(u_u^2 + u_l^2)
        assertEquals(u("5s.40p 1P1"), lineU("5s.40p 1P1", "5s2 1S0"), 0.0);
        assertEquals(Math.hypot(u("5s.40s 1S0"), u("5s5p 1P1")), lineU("5s.40s 1S0", "5s5p 1P1"),
                1e-12 * u("5s.40s 1S0"));
        assertEquals(Math.hypot(u("5s.30s 3S1"), u("5s5p 3P1")), lineU("5s.30s 3S1", "5s5p 3P1"),
                1e-12 * u("5s.30s 3S1"));
    }
}
