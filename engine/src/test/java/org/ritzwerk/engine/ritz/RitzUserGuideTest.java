package org.ritzwerk.engine.ritz;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.junit.jupiter.api.Test;
import org.ritzwerk.atom.Species;
import org.ritzwerk.engine.lines.LineQuery;
import org.ritzwerk.engine.lines.LineSet;
import org.ritzwerk.engine.lines.LineSources;
import org.ritzwerk.medium.Medium;

/**
 * The README's examples of the ritz package, compiled and run. The level energies are near He I's
 * (from memory, rounded; see refdata's levels-he-i for the checked set) and the line wavenumbers
 * invented around them; the series members are Rb-87 nS1/2 levels computed from the built-in
 * quantum defects (cli's series-rb-87.csv). The examples show the calls, the assertions their plumbing.
 */
class RitzUserGuideTest {

    @Test
    void ritzLinesOptimisedLevelsAndASeriesFit() {
        // --- README: Ritz lines ---
        RitzLevels levels = RitzLevels.builder(Species.parse("He I"))
                .add("1s2s 1S0", 166277.4403, 5e-5, -1)             // label, cm-1, u cm-1, 2J (-1: from the label)
                .add("1s2p 1P1", 171134.8970, 5e-5, -1)
                .add("1s3p 1P1", 186209.3651, 5e-5, -1)
                .add("1s3d 1D2", 186104.9668, 5e-5, -1)
                .build();
        RitzTransitions ritz = RitzLines.defaults().withLsRules(true).compute(levels);
        for (int i = 0; i < ritz.size(); i++) {                             // by rising wavenumber
            String name = levels.label(ritz.lower(i)) + " - " + levels.label(ritz.upper(i));
            double vacuumNm = ritz.vacuumWavelengthNm(i);                   // wavelengthNm(i, Medium.air()) in air
            double uNm = ritz.wavelengthUncertaintyNm(i, Medium.vacuum()).orElseThrow();
        }
        LineSet lines = LineQuery.defaults().run(LineSources.none().withLevels(levels));   // like any source, LS rules
        // --- end ---
        assertEquals(4, ritz.size(), "3p-3d (104 cm-1), 2s-2p, 2p-3d, 2s-3p");
        assertEquals("1s3d 1D2", levels.label(ritz.upper(2)));
        // 2p 1P - 3d 1D: 667.8151 nm in air (NIST Handbook strong lines, from memory)
        assertEquals(667.8151, ritz.wavelengthNm(2, Medium.air()), 2e-4);
        assertEquals(Math.sqrt(2) * 5e-5 / ritz.wavenumberPerCm(2) * ritz.vacuumWavelengthNm(2),
                ritz.wavelengthUncertaintyNm(2, Medium.vacuum()).orElseThrow(), 1e-12);
        assertEquals(4, lines.size());

        // --- README: level optimisation ---
        MeasuredLines measured = MeasuredLines.builder("1s2s 1S0", 0)       // the reference level and its energy
                .add("1s2p 1P1", "1s2s 1S0", 4857.4567, 0.0010)            // upper, lower, cm-1, u cm-1
                .add("1s3p 1P1", "1s2s 1S0", 19931.9248, 0.0010)
                .add("1s3p 1P1", "1s2p 1P1", 15074.4690, 0.0015)
                .add("1s3d 1D2", "1s2p 1P1", 14970.0698, 0.0010)
                .build();
        LevelOptimum optimum = LevelOptimizer.defaults().optimize(measured);    // weighted least squares
        double e = optimum.energyPerCm(1);                                  // optimum.covariance(), ritzPerCm(k), flag(k)
        RitzLevels fitted = optimum.levels(Species.parse("He I"));         // Ritz lines with the correlations
        // --- end ---
        assertEquals(4857.457, e, 0.002);
        assertTrue(fitted.hasCovariance());
        assertEquals(LevelOptimum.LineFlag.DETERMINES_LEVEL, optimum.flag(3));

        // the README's He I-like singlets and triplets (examples/data/he-lines.csv, invented wavenumbers)
        MeasuredLines heLines = MeasuredLines.builder("1s2s 1S0", 166277.4403)
                .add("1s2p 1P1", "1s2s 1S0", 4857.4567, 0.0010).add("1s3p 1P1", "1s2s 1S0", 19931.9248, 0.0010)
                .add("1s3p 1P1", "1s2p 1P1", 15074.4690, 0.0015).add("1s3d 1D2", "1s2p 1P1", 14970.0698, 0.0010)
                .add("1s2p 3P1", "1s2s 3S1", 9231.8571, 0.0010).add("1s3p 3P1", "1s2s 3S1", 24355.5421, 0.0012)
                .add("1s3p 3P1", "1s2p 3P1", 15123.6862, 0.0015).add("1s3d 3D2", "1s2p 3P1", 17013.7632, 0.0010)
                .build();
        // --- README: separate systems ---
        LevelOptimum systems = LevelOptimizer.defaults()
                .withSeparateSystems(List.of(SystemReference.at("1s2s 3S1", 159855.9743, 0.0005)))  // cm-1, u cm-1
                .optimize(heLines);                                         // singlets and triplets, no line between
        LevelOptimum.LevelSystem triplets = systems.systems().get(1);       // reference(), standing(), levels()
        boolean absolute = systems.isAbsolute(systems.levelLabels().indexOf("1s3d 3D2"));   // true: anchored
        RitzLevels all = systems.absoluteLevels(Species.parse("He I"));    // both systems, lines between them too
        // --- end ---
        assertEquals(LevelOptimum.Standing.ANCHORED, triplets.standing());
        assertTrue(absolute);
        assertEquals(8, all.size());
        // the README's transcript: the triplets relative to 1s2s 3S1 without the anchor, 1s3d 3D2 at 26245.620044
        assertEquals(159855.9743 + 26245.620044, all.energyPerCm(all.indexOf("1s3d 3D2")), 2e-6);

        // --- README: series fit ---
        RydbergSeries series = RydbergSeries.builder("nS")                 // n, energy cm-1, u cm-1
                .add(20, 33305.13511, 0.001).add(24, 33438.81998, 0.001).add(28, 33513.36403, 0.001)
                .add(32, 33559.12996, 0.001).add(36, 33589.22874, 0.001).add(40, 33610.07372, 0.001)
                .build();
        SeriesFit fit = SeriesFitter.defaults().fit(109736.623, List.of(series));   // R_M of the isotope, cm-1
        double limit = fit.limitPerCm();                                    // fit.defects(0), fit.covariance()
        SeriesFit.Prediction p60 = fit.prediction(0, 60);                  // same rule as predictions(...)
        SeriesFit.Member n60 = p60.memberOrThrow();                         // energy, whole uncertainty
        SeriesFit known = SeriesFitter.defaults().withLimit(33690.80, 0.01).fit(109736.623, List.of(series));
        // --- end ---
        assertEquals(33690.804, limit, 0.01);
        assertEquals(33690.80, known.limitPerCm(), 0.01);
        assertTrue(known.limitUncertaintyPerCm() <= fit.limitUncertaintyPerCm() + 1e-12,
                "a known limit can only narrow the fitted one");
        assertTrue(n60.uncertaintyPerCm() > 0);
    }
}
