package org.ritzwerk.refdata;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.junit.jupiter.api.Test;
import org.ritzwerk.atom.Species;
import org.ritzwerk.atom.State;
import org.ritzwerk.engine.hyperfine.HyperfineConstants;

/**
 * The n*^-3 law's own error in the uncertainties of scaled Rydberg hyperfine constants. The figures are checked
 * against golden/make_hyperfine_uncertainty_golden.py (mpmath at 50 digits, offline; it prints them) and against
 * hand computations written beside each check; the measured constants are the project's data files' (sources
 * named there and below).
 */
class RydbergHyperfineScalingLawTest {

    private static final DataContext CONTEXT = DataContext.builtIn();
    private static final RydbergHyperfine DATA = CONTEXT.rydbergHyperfine();
    private static final Species CS = Species.parse("Cs-133 I");
    private static final Species RB87 = Species.parse("Rb-87 I");
    private static final Species LI7 = Species.parse("Li-7 I");

    private static RydbergHyperfine.Series row(Species species, int l, int twoJ) {
        return DATA.series(species, l, twoJ).orElseThrow();
    }

    private static double law(Species species, State state) {
        return DATA.scalingLawRelativeUncertainty(CONTEXT, species, state).orElseThrow();
    }

    /**
     * The largest drift: Cs 6d5/2, A = -4.66(4) MHz (A. Kortyna et al., APS DAMOP 2005 abstract D6.8, read) at
     * 22631.6863 cm-1, n* = 3.5364, A n*^3 = -206.09 MHz; Cs 7d5/2, A = -1.70867 MHz (B. Rahaman and S. Dutta 2023,
     * read in the abstract), n* = 7 - delta(7) of the nD5/2 formula = 4.5342, A n*^3 = -159.28 MHz;
     * ln(206.09 / 159.28) = 0.2577 over one n. The golden script gives 0.2576856110141 (mpmath, 50 digits). Before
     * the 6d constants the largest was Cs 6s - 7s, 0.0995148083737 (A = 2298.1579425 MHz, the SI second, against
     * 545.818 MHz, G. Yang et al., arXiv:1601.02749, read in the abstract; the golden script prints it too), which
     * is now Cs nS's own drift. Every other series' pair drifts less per n (Rb 5s - 6s 0.0771, Cs 6d3/2 - 7d3/2
     * 0.0517, Na 3s - 4s 0.0229, K 4s - 7s 0.0208, Cs 6p1/2 - 7p1/2 0.0176, Li 2s - 3s 0.0115, Cs 6p3/2 - 7p3/2
     * 0.0097, Rb-87 5p - 6p 0.0013 and 0.0005), and changes less in all (Rb 5s - 7s 0.0912).
     */
    @Test
    void theMeasuredPairsInTheDataGiveTheStatedDriftPerN() {
        RydbergHyperfine.ScalingLawError law = DATA.scalingLawError(CONTEXT);
        assertEquals(0.2576856110141, law.driftPerN(), 1e-9);
        assertEquals(0.2576856110141, law.cap(), 1e-9);
        assertEquals("Cs-133 I 6d 2D5/2 - 7d 2D5/2", law.pair());
        assertEquals(0.0995148083737, DATA.driftPerN(CONTEXT, row(CS, 0, 1)).orElseThrow(), 1e-9);
        // Rb-87 5s - 6s (6s A = 807.66(8) MHz, A. Perez Galvan et al., Phys. Rev. A 78, 012502 (2008), read in the
        // abstract), the largest of its three pairs, and Cs 6p3/2 - 7p3/2 over one n (golden script: 0.077137373749,
        // 0.00972858701347); 5s - 7s over two n alone gave 0.0456
        assertEquals(0.077137373749, DATA.driftPerN(CONTEXT, row(RB87, 0, 1)).orElseThrow(), 1e-9);
        assertEquals(0.00972858701347, DATA.driftPerN(CONTEXT, row(CS, 1, 3)).orElseThrow(), 1e-9);
        // Cs 6d3/2 (16.34 MHz, Kortyna et al. 2005) - 7d3/2 (7.3509 MHz, arXiv:2210.01481), both n* from the nD3/2
        // formula (the level list has neither): golden script 0.05172485568539
        assertEquals(0.05172485568539, DATA.driftPerN(CONTEXT, row(CS, 2, 3)).orElseThrow(), 1e-9);
        // Li-7 2s: A = 401.7520433 MHz at n* = 1.588473, A n*^3 = 1610.26 MHz; 3s: A = 93.095 MHz at n* = 2.596087,
        // A n*^3 = 1628.86 MHz; ln(1628.86 / 1610.26) = 0.01148 per n (hand, with the project's n*)
        assertEquals(0.011483, DATA.driftPerN(CONTEXT, row(LI7, 0, 1)).orElseThrow(), 2e-6);
        // a series with one measured level has no drift of its own: it takes the largest of its l (d: Cs 6d5/2 -
        // 7d5/2)
        assertTrue(DATA.driftPerN(CONTEXT, row(RB87, 2, 5)).isEmpty());
        assertEquals(0.2576856110141, law(RB87, State.of(8, 2, 5)), 1e-9);
        assertEquals(0.2576856110141, DATA.seriesLaw(CONTEXT, row(RB87, 2, 5)).driftPerN(), 1e-9);
        for (RydbergHyperfine.Series s : DATA.series()) {
            DATA.driftPerN(CONTEXT, s).ifPresent(d -> assertTrue(d <= law.driftPerN(), s.toString()));
        }
    }

    /**
     * Each series takes the cap of its own l: the largest change of A n*^3 between two measured levels of a series
     * of that l. s: Cs 6s - 7s, 0.0995 (above; Rb 5s - 7s changes 0.0912); d: Cs 6d5/2 - 7d5/2, 0.2577. p: Cs
     * nP3/2 from 7p3/2 (A n*^3 = 656.0 MHz, the file's check R) to its published scaled constant 0.718 GHz (R. Song
     * et al., arXiv:2410.09520, read in the abstract), taken as measured at n = 41: ln(718 / 656.0) = 0.0903 (hand),
     * the largest p change; Cs 6p3/2 - 7p3/2 changes only 0.0097. Before, one cap, the largest of all, served every
     * series, so the Cs 6d constants raised the s and p series' law error from 9.95 % to 25.8 %.
     */
    @Test
    void eachSeriesTakesTheCapOfItsOwnL() {
        assertEquals(0.0995148083737, DATA.seriesLaw(CONTEXT, row(RB87, 0, 1)).cap(), 1e-9);
        assertEquals(0.0995148083737, DATA.seriesLaw(CONTEXT, row(LI7, 0, 1)).cap(), 1e-9);
        assertEquals(0.0903, DATA.seriesLaw(CONTEXT, row(CS, 1, 3)).cap(), 1e-3);
        assertEquals(0.0903, DATA.seriesLaw(CONTEXT, row(RB87, 1, 1)).cap(), 1e-3);
        assertEquals(0.2576856110141, DATA.seriesLaw(CONTEXT, row(CS, 2, 3)).cap(), 1e-9);
        assertEquals(0.2576856110141, DATA.seriesLaw(CONTEXT, row(RB87, 2, 5)).cap(), 1e-9);
        // the scaled constant is a measured point of its series at n = 41
        List<RydbergHyperfine.MeasuredLevel> csP = DATA.measuredLevels(CONTEXT, row(CS, 1, 3));
        assertEquals(List.of(6, 7, 41), csP.stream().map(m -> m.state().n()).toList());
        assertEquals(0.718e9, csP.get(2).aNStarCubedHertz(), 1e-3);
        RydbergHyperfine.ScalingLawError all = DATA.scalingLawError(CONTEXT);
        for (RydbergHyperfine.Series s : DATA.series()) {
            RydbergHyperfine.SeriesLaw own = DATA.seriesLaw(CONTEXT, s);
            assertTrue(own.cap() <= all.cap() && own.driftPerN() <= all.driftPerN(), s.toString());
            // a series' own pairs never change more than its cap allows
            List<RydbergHyperfine.MeasuredLevel> m = DATA.measuredLevels(CONTEXT, s);
            for (int i = 0; i < m.size(); i++) {
                for (int k = i + 1; k < m.size(); k++) {
                    double change = Math.abs(Math.log(m.get(k).aNStarCubedHertz() / m.get(i).aNStarCubedHertz()));
                    assertTrue(change <= own.cap() + 1e-12, s + ": " + change + " > " + own.cap());
                }
            }
        }
    }

    @Test
    void theLawsErrorGrowsWithTheDistanceInNFromTheMeasuredLevel() {
        double d = DATA.driftPerN(CONTEXT, row(LI7, 0, 1)).orElseThrow();
        assertEquals(0, law(LI7, State.of(3, 0, 1)), 0); // the measured level itself
        double previous = 0;
        for (int n = 4; n <= 40; n++) {
            double r = law(LI7, State.of(n, 0, 1));
            assertEquals(Math.min(d * (n - 3), 0.0995148083737), r, 1e-9, "Li-7 " + n + "s"); // the s cap
            assertTrue(r >= previous, "Li-7 " + n + "s");
            previous = r;
        }
        assertTrue(law(LI7, State.of(8, 0, 1)) > law(LI7, State.of(5, 0, 1)));
        // Cs nP3/2: a published scaled constant fitted over n = 41-55 (R. Song et al., arXiv:2410.09520, read in
        // the abstract): no law error inside that range, d = 0.00973 per n below it
        assertEquals(0, law(CS, State.of(48, 1, 3)), 0);
        assertEquals(0.00972858701347, law(CS, State.of(40, 1, 3)), 1e-9);
        double pCap = DATA.seriesLaw(CONTEXT, row(CS, 1, 3)).cap();
        assertEquals(0.00972858701347 * 9, law(CS, State.of(32, 1, 3)), 1e-9);
        assertEquals(Math.min(0.0972858701347, pCap), law(CS, State.of(31, 1, 3)), 1e-9);
        assertEquals(Math.min(21 * 0.00972858701347, pCap), law(CS, State.of(20, 1, 3)), 1e-9);
        // 31 x 0.00973 = 0.30, capped at the p cap
        assertEquals(DATA.seriesLaw(CONTEXT, row(CS, 1, 3)).cap(), law(CS, State.of(10, 1, 3)), 0);
        // Cs nD3/2 from 7d3/2 with its own drift, 0.0517 per n
        assertEquals(3 * 0.05172485568539, law(CS, State.of(10, 2, 3)), 1e-9);
        // and the uncertainty of A itself grows with it (Rb-87 nP1/2 from 6p: d = 0.000515 per n)
        double u7 = relative(RB87, State.of(7, 1, 1));
        double u30 = relative(RB87, State.of(30, 1, 1));
        double u60 = relative(RB87, State.of(60, 1, 1));
        assertTrue(u7 < u30 && u30 < u60, u7 + " " + u30 + " " + u60);
    }

    private static double relative(Species species, State state) {
        HyperfineConstants c = DATA.constants(CONTEXT, species, state).orElseThrow();
        return c.aUncertaintyHertz() / Math.abs(c.aHertz());
    }

    /**
     * Rb-87 60s from 7s (A = 319.759(28) MHz; H.-C. Chui et al. 2005, from memory): the carried uncertainty is
     * 0.028 / 319.759 = 8.76e-5 of A; the law's 53 n x 0.0771 per n = 4.1 is capped at the s cap, 0.0995148: u(A)
     * = A sqrt(8.76e-5^2 + 0.0995148^2) = 0.0995148 A (hand). Before the law was carried, u(A) was 8.76e-5 A; while
     * one cap served every series, the Cs 6d constants made it 0.2576856 A.
     */
    @Test
    void aScaledConstantCarriesTheLawsErrorInQuadrature() {
        HyperfineConstants c = DATA.constants(CONTEXT, RB87, State.of(60, 0, 1)).orElseThrow();
        double carried = 0.028 / 319.759;
        assertEquals(Math.abs(c.aHertz()) * Math.hypot(carried, 0.0995148083737), c.aUncertaintyHertz(),
                1e-9 * c.aUncertaintyHertz());
        assertEquals(0.0995148, c.aUncertaintyHertz() / c.aHertz(), 1e-6);
        // the measured reference level keeps its stated uncertainty only
        HyperfineConstants ref = DATA.constants(CONTEXT, RB87, State.of(7, 0, 1)).orElseThrow();
        assertEquals(0.028e6, ref.aUncertaintyHertz(), 1e-6);
        // B carries the same relative law error (Cs 40p3/2: B = -0.084(102) GHz / n*^3, r = 0.00973)
        HyperfineConstants p = DATA.constants(CONTEXT, CS, State.of(40, 1, 3)).orElseThrow();
        double scale = p.bHertz() / -0.084e9;
        assertEquals(Math.hypot(0.102e9 * scale, 0.00972858701347 * p.bHertz()), p.bUncertaintyHertz(),
                1e-9 * p.bUncertaintyHertz());
    }

    /**
     * The law's uncertainty covers the measured constants the file's checks compare with: Cs 8s A = 219.12 MHz
     * (J. E. Stalnaker et al., Phys. Rev. A 81, 043840 (2010), from memory), Cs 8d3/2, 9d3/2, 10d3/2 |A| = 3.98(8),
     * 2.37(3), 1.52(3) MHz (Phys. Rev. A 11, 1125 (1975), read in the abstract): each within two of the scaled
     * constant's standard uncertainties. Before the law's error was carried only the stated uncertainty of the 7s
     * and 7d3/2 constants entered, scaled: under 7 kHz (8s) and under 1 kHz (8d3/2 to 10d3/2), far below the
     * differences of 0.06 MHz and more this test sees.
     */
    @Test
    void theUncertaintyCoversTheCheckLevels() {
        double[][] checks = {{8, 0, 1, 219.12}, {8, 2, 3, 3.98}, {9, 2, 3, 2.37}, {10, 2, 3, 1.52}};
        for (double[] k : checks) {
            HyperfineConstants c = DATA.constants(CONTEXT, CS, State.of((int) k[0], (int) k[1], (int) k[2]))
                    .orElseThrow();
            double off = Math.abs(Math.abs(c.aHertz()) / 1e6 - k[3]);
            assertTrue(off < 2 * c.aUncertaintyHertz() / 1e6, (int) k[0] + " l=" + (int) k[1] + ": " + off
                    + " MHz vs u " + c.aUncertaintyHertz() / 1e6);
        }
    }
}
