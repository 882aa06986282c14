package org.ritzwerk.engine.synth;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Arrays;
import java.util.OptionalDouble;
import org.junit.jupiter.api.Test;
import org.ritzwerk.atom.Nucleus;
import org.ritzwerk.atom.Species;
import org.ritzwerk.constants.PhysicalConstants;
import org.ritzwerk.engine.hydrogenic.HydrogenLikeModel;
import org.ritzwerk.engine.hydrogenic.Tier;
import org.ritzwerk.engine.plasma.IonisationBalance;
import org.ritzwerk.engine.profile.BalmerStark;
import org.ritzwerk.engine.profile.Profiles;
import org.ritzwerk.medium.Medium;

/** Scenes: flux bookkeeping, threads, Saha weights, Stark widths, bad descriptions. */
class SceneTest {

    /** Proton (CODATA 2018 mass). */
    private static final Nucleus PROTON = new Nucleus(1, 1, PhysicalConstants.PROTON_MASS.value(), 1,
            OptionalDouble.empty(), OptionalDouble.empty(), "CODATA 2018");
    /**
     * Alpha particle, 6.6446573357e-27 kg (CODATA 2018, Tiesinga et al., Rev. Mod. Phys. 93,
     * 025010 (2021); the digits of Debian scipy 1.10.1's physical_constants["alpha particle mass"]).
     */
    private static final Nucleus ALPHA = new Nucleus(2, 4, 6.6446573357e-27, 0,
            OptionalDouble.empty(), OptionalDouble.empty(), "CODATA 2018");
    private static final HydrogenLikeModel H = HydrogenLikeModel.of(PROTON, Tier.DIRAC);
    private static final HydrogenLikeModel HE_II = HydrogenLikeModel.of(ALPHA, Tier.DIRAC);

    /** Null settings are refused where they are given, naming them (they failed later inside build()). */
    @Test
    void nullSettingsAreRefusedWhereGiven() {
        PixelGrid grid = PixelGrid.linear(400, 700, 100);
        Scene.Builder b = Scene.builder(grid);
        for (org.junit.jupiter.api.function.Executable call : new org.junit.jupiter.api.function.Executable[] {
            () -> Scene.builder(null), () -> b.medium(null), () -> b.instrument(null), () -> b.continuum(null, 5),
            () -> b.hydrogenLike(null, H, 1), () -> b.hydrogenLike(Species.parse("H I"), null, 1)}) {
            NullPointerException e = assertThrows(NullPointerException.class, call);
            assertTrue(e.getMessage() != null && !e.getMessage().isBlank(), "the argument is named");
        }
    }

    @Test
    void everyLineWellInsideTheGridPutsItsCountsIntoThePixels() {
        // Gaussian-only lines, far from the ends: the pixel sum of the expected spectrum is the
        // sum of the lines' counts to 1e-6 (flux conservation through profiles and pixels).
        Scene scene = Scene.builder(PixelGrid.linear(380, 700, 30_000))
                .hydrogenLike(Species.parse("H I"), H, 1)
                .temperature(12_000)
                .instrument(Instrument.ofResolvingPower(8000))
                .medium(Medium.air())
                .build();
        SyntheticSpectrum spectrum = scene.render(1);
        double lines = 0;
        for (int i = 0; i < scene.lines().size(); i++) {
            double at = scene.lines().position(i);
            if (at > 381 && at < 699) {
                lines += spectrum.lineCounts(i);
            }
        }
        double pixels = Arrays.stream(spectrum.expectedCounts()).sum();
        assertTrue(lines > 0);
        // Lines beyond the ends (the Balmer limit side) spill a little in; none near 380 here.
        assertEquals(lines, pixels, 1e-6 * lines);
        assertEquals(10_000, Arrays.stream(spectrum.expectedCounts()).max().orElseThrow(), 1e-9);
    }

    @Test
    void theFastRendererDrawsTheSameSceneWithinItsBound() {
        // Gaussian-only lines (Doppler and instrument): the exact renderer's window leaves out
        // nothing measurable, so the two differ only by the fast renderer's error, at most 1e-4
        // of the brightest pixel (3e-5 asked here, as in FastLineRendererTest).
        PixelGrid grid = PixelGrid.logarithmic(380, 700, 20_000);
        Scene.Builder builder = Scene.builder(grid).hydrogenLike(Species.parse("H I"), H, 1)
                .hydrogenLike(Species.parse("He II"), HE_II, 0.1).temperature(20_000)
                .instrument(Instrument.ofResolvingPower(8000)).medium(Medium.air());
        Scene exact = builder.renderer(Renderer.EXACT).build();
        Scene fast = builder.renderer(Renderer.FAST).build();
        assertFalse(exact.usesFastRenderer());
        assertTrue(fast.usesFastRenderer());
        double[] a = exact.render(1).expectedCounts();
        double[] b = fast.render(2).expectedCounts();
        for (int p = 0; p < a.length; p++) {
            assertEquals(a[p], b[p], 3e-5 * 10_000, "pixel " + p);
        }
    }

    /**
     * A spectrometer that reads long wavelengths first: the counts come in the detector's order,
     * the mirror of the same pixels read the other way, for both renderers and a continuum, and
     * H-alpha (656.28 nm in air, common practice) peaks in the pixel that covers it.
     */
    @Test
    void aFallingGridGivesCountsInTheDetectorsOrder() {
        PixelGrid falling = PixelGrid.dispersion(new double[] {700, -0.03, 1e-6}, 6000);
        double[] edges = new double[6001];
        for (int i = 0; i <= 6000; i++) {
            edges[i] = falling.edge(6000 - i);
        }
        PixelGrid twin = PixelGrid.of(edges);
        for (Renderer renderer : new Renderer[] {Renderer.EXACT, Renderer.FAST}) {
            double[] down = mirrorScene(falling, renderer).render(1).expectedCounts();
            double[] up = mirrorScene(twin, renderer).render(1).expectedCounts();
            int brightest = 0;
            for (int p = 0; p < down.length; p++) {
                assertEquals(up[down.length - 1 - p], down[p], 1e-12 * 10_000, renderer + " pixel " + p);
                brightest = down[p] > down[brightest] ? p : brightest;
            }
            double lo = Math.min(falling.edge(brightest), falling.edge(brightest + 1));
            double hi = Math.max(falling.edge(brightest), falling.edge(brightest + 1));
            assertTrue(lo - 0.03 < 656.28 && 656.28 < hi + 0.03, renderer + ": brightest pixel " + lo + "-" + hi);
        }
    }

    private static Scene mirrorScene(PixelGrid grid, Renderer renderer) {
        return Scene.builder(grid).hydrogenLike(Species.parse("H I"), H, 1).temperature(10_000)
                .instrument(Instrument.ofResolvingPower(8000)).medium(Medium.air()).renderer(renderer)
                .continuum(nm -> Continuum.planckPerWavelength(nm * 1e-9, 10_000), 200).build();
    }

    /**
     * The truth's counts in the pixels are what reaches them. Three Lorentzian lines (collisional FWHM
     * 0.2 nm, a cold heavy emitter so the Doppler width is negligible, no instrument): one inside,
     * one 1 nm beyond the long end, one 50 nm beyond. The share of a Lorentzian of half width
     * gamma between lo and hi is (atan((hi - c) / gamma) - atan((lo - c) / gamma)) / pi (common
     * practice), and the line counts add up to the pixels' sum, with both renderers (the exact
     * one within its window, which a wider window here keeps out of the way). Each line's whole
     * counts stay those of its full profile (equal photon rates here, so equal counts).
     */
    @Test
    void theTruthCountsWhatReachesThePixels() {
        double lo = 500;
        double hi = 520;
        double[] at = {510, 521, 570};
        for (Renderer renderer : new Renderer[] {Renderer.EXACT, Renderer.FAST}) {
            Scene scene = Scene.builder(PixelGrid.linear(lo, hi, 4000)).temperature(1).collisionalFwhm(0.2)
                    .window(2000).renderer(renderer)
                    .lineList("test", at, new double[] {1, 1, 1}, 1e-20).build();
            SyntheticSpectrum spectrum = scene.render(1);
            double scale = spectrum.lineCountsInPixels(0)
                    / ((Math.atan((hi - 510) / 0.1) - Math.atan((lo - 510) / 0.1)) / Math.PI);
            double sum = 0;
            for (int i = 0; i < 3; i++) {
                double c = scene.lines().position(i);
                double share = (Math.atan((hi - c) / 0.1) - Math.atan((lo - c) / 0.1)) / Math.PI;
                assertEquals(share * scale, spectrum.lineCountsInPixels(i), 1e-6 * share * scale,
                        renderer + " line " + i);
                assertEquals(scale, spectrum.lineCounts(i), 1e-6 * scale, "the whole line");
                sum += spectrum.lineCountsInPixels(i);
            }
            assertTrue(spectrum.lineCountsInPixels(2) < 1e-3 * spectrum.lineCountsInPixels(0), "the line 50 nm away");
            // The fast renderer's periodic grid folds a little of the far wings back in (its
            // stated bound, 1e-6 of a line's peak per pixel): 6e-5 of the sum here.
            assertEquals(sum, Arrays.stream(spectrum.expectedCounts()).sum(),
                    (renderer == Renderer.FAST ? 1e-4 : 1e-6) * sum, renderer.toString());
        }
    }

    /**
     * The fast renderer's round-off left dark pixels a hair below zero (-1e-12), which the noise
     * refused: a scene drawn with it and given noise failed. No pixel is negative now, and the
     * lit pixels are as before within the renderer's bound.
     */
    @Test
    void theFastRendererGivesNoNegativePixelsSoNoiseCanBeAdded() {
        Scene.Builder builder = Scene.builder(PixelGrid.linear(380, 700, 3200)).hydrogenLike(Species.parse("H I"), H, 1)
                .temperature(10_000).noise(0, 5);
        SyntheticSpectrum fast = builder.renderer(Renderer.FAST).build().render(1);
        double[] exact = builder.renderer(Renderer.EXACT).build().render(1).expectedCounts();
        double[] e = fast.expectedCounts();
        for (int p = 0; p < e.length; p++) {
            assertTrue(e[p] >= 0, "pixel " + p + ": " + e[p]);
            assertEquals(exact[p], e[p], 1e-4 * 10_000, "pixel " + p);
        }
    }

    /**
     * Fine-structure components: H-alpha's seven components carry the multiplet's photons between
     * them (to the Boltzmann factors of their 0.1-0.4 cm^-1 splittings, 5e-5 at 10,000 K), centred
     * on its position, and the 3d 2D - 2p 2P lines stand as the LS line strengths 9 : 5 : 1
     * (2D5/2 - 2P3/2 : 2D3/2 - 2P1/2 : 2D3/2 - 2P3/2, common practice; photon rates follow them to
     * the nu^3 of their 1e-5 relative spread).
     */
    @Test
    void componentsShareTheirMultipletsPhotons() {
        Scene.Builder builder = Scene.builder(PixelGrid.linear(656.0, 656.9, 900)).hydrogenLike(Species.parse("H I"),
                H, 1).temperature(10_000).nMax(3);
        Scene.Lines multiplet = builder.components(false).build().lines();
        Scene.Lines parts = builder.components(true).build().lines();
        assertEquals(1, multiplet.size());
        assertEquals(7, parts.size());
        double photons = 0;
        double moment = 0;
        java.util.Map<String, Double> byLabel = new java.util.HashMap<>();
        for (int i = 0; i < parts.size(); i++) {
            photons += parts.photons(i);
            moment += parts.photons(i) * parts.position(i);
            byLabel.put(parts.label(i), parts.photons(i));
        }
        assertEquals(multiplet.photons(0), photons, 1e-4 * photons);
        assertEquals(multiplet.position(0), moment / photons, 2e-5);
        double strong = byLabel.get("H I 3d 2D5/2 - 2p 2P3/2");
        assertEquals(5.0 / 9, byLabel.get("H I 3d 2D3/2 - 2p 2P1/2") / strong, 1e-4);
        assertEquals(1.0 / 9, byLabel.get("H I 3d 2D3/2 - 2p 2P3/2") / strong, 1e-4);
    }

    @Test
    void autoKeepsSmallScenesOnTheExactRenderer() {
        Scene scene = Scene.builder(PixelGrid.linear(400, 700, 4000)).hydrogenLike(Species.parse("H I"), H, 1)
                .temperature(10_000).build();
        assertFalse(scene.usesFastRenderer());
        assertTrue(scene.lines().size() * 4000.0 < Renderer.AUTO_THRESHOLD);
    }

    @Test
    void threadsDoNotChangeTheSpectrum() {
        Scene scene = Scene.builder(PixelGrid.logarithmic(300, 700, 50_000))
                .hydrogenLike(Species.parse("H I"), H, 1)
                .hydrogenLike(Species.parse("He II"), HE_II, 0.1)
                .temperature(30_000).electronDensity(3e22).collisionalFwhm(0.01)
                .instrument(Instrument.ofResolvingPower(20_000))
                .continuum(nm -> Continuum.planckPerWavelength(nm * 1e-9, 30_000), 50)
                .noise(3, 99)
                .build();
        SyntheticSpectrum one = scene.render(1);
        SyntheticSpectrum four = scene.render(4);
        assertTrue(Arrays.equals(one.counts(), four.counts()));
        assertTrue(Arrays.equals(one.expectedCounts(), four.expectedCounts()));
    }

    @Test
    void sahaWeightsTheStagesOfEachElement() {
        // With an electron density the H I and He II line rates carry their Saha fractions.
        PixelGrid grid = PixelGrid.linear(360, 700, 1000);   // the Balmer lines from n = 33 to 40 near 365 nm
        double t = 25_000;
        double ne = 1e22;
        Scene withDensity = Scene.builder(grid).hydrogenLike(Species.parse("H I"), H, 1)
                .hydrogenLike(Species.parse("He II"), HE_II, 1).temperature(t).electronDensity(ne).nMax(40).build();
        Scene without = Scene.builder(grid).hydrogenLike(Species.parse("H I"), H, 1)
                .hydrogenLike(Species.parse("He II"), HE_II, 1).temperature(t).nMax(40).build();
        double hI = IonisationBalance.hydrogen(H, t, ne)[0];
        double heII = IonisationBalance.helium(HE_II, t, ne)[1];
        // Without a density U is Planck-Larkin's, with one it is summed over the bound levels
        // (changed 2026-12-05: both were the sum to nMax, so the ratio was the fraction alone).
        double hU = IonisationBalance.planckLarkinPartition(H, t) / IonisationBalance.boundPartition(H, t, ne);
        double heU = IonisationBalance.planckLarkinPartition(HE_II, t)
                / IonisationBalance.boundPartition(HE_II, t, ne);
        int lastH = IonisationBalance.highestBoundN(H, t, ne);
        // dChi = 0.0132 eV at 25,000 K and 1e22 m^-3 (1.44 eV nm / lambda_D, lambda_D = 109 nm):
        // 13.6 eV / 32^2 > dChi > 13.6 eV / 33^2.
        assertEquals(32, lastH);
        // The Stark widths widen the reach, so the dense scene may hold more lines beyond the ends.
        java.util.Map<String, Double> dense = new java.util.HashMap<>();
        for (int i = 0; i < withDensity.lines().size(); i++) {
            dense.put(withDensity.lines().label(i), withDensity.lines().photons(i));
        }
        assertTrue(without.lines().size() > 10);
        int dissolved = 0;
        for (int i = 0; i < without.lines().size(); i++) {
            String label = without.lines().label(i);
            if (!dense.containsKey(label)) {
                // Only H I lines from n = 33 to 40, above the lowered limit, are left out.
                assertTrue(label.startsWith("H I"), label);
                dissolved++;
                continue;
            }
            double fraction = label.startsWith("He II") ? heII * heU : hI * hU;
            assertEquals(without.lines().photons(i) * fraction, dense.get(label),
                    1e-12 * without.lines().photons(i), label);
        }
        assertTrue(dissolved > 0);
        assertTrue(withDensity.notes().stream().anyMatch(n -> n.startsWith("H I: levels above n = 32 lie above the"
                + " ionisation limit lowered by the plasma")), withDensity.notes().toString());
    }

    @Test
    void theStarkWidthOfHBetaComesBackThroughTheDiagnostic() {
        // Render H-beta at a known density with a fine grid and no instrument, measure the Voigt
        // FWHM from the pixels, remove the Doppler part (Olivero-Longbothum) and invert.
        double ne = 2e22;
        Scene scene = Scene.builder(PixelGrid.linear(470, 500, 60_000))
                .hydrogenLike(Species.parse("H I"), H, 1).temperature(10_000).electronDensity(ne).nMax(6)
                .window(2000).build();
        int beta = -1;
        for (int i = 0; i < scene.lines().size(); i++) {
            if (scene.lines().label(i).endsWith("Balmer beta")) {
                beta = i;
            }
        }
        assertTrue(beta >= 0);
        double[] counts = scene.render(2).expectedCounts();
        double measured = fullWidthAtHalfMaximum(PixelGrid.linear(470, 500, 60_000), counts);
        double gauss = scene.lines().gaussianFwhm(beta);
        // Invert f_V = 0.5346 f_L + sqrt(0.2166 f_L^2 + f_G^2) for f_L.
        double lorentz = solveLorentz(measured, gauss);
        double density = BalmerStark.electronDensity(BalmerStark.Line.BETA, lorentz);
        assertEquals(ne, density, 0.01 * ne);
    }

    @Test
    void naturalWidthsAddTheShellsDecayRates() {
        // Lyman-alpha (vacuum) from n = 2: the 2p decay rate 6.2649e8 s^-1 (Wiese & Fuhr 2009)
        // averaged with the 2s (no E1 decay) over 2n^2 = 8 states with weights 2j + 1: 6/8 of it.
        Scene scene = Scene.builder(PixelGrid.linear(120, 125, 1000))
                .hydrogenLike(Species.parse("H I"), H, 1).temperature(100).naturalWidths(true).nMax(2).build();
        assertEquals(1, scene.lines().size());
        double nu = PhysicalConstants.C / (scene.lines().position(0) * 1e-9);
        double hertz = scene.lines().lorentzFwhm(0) / scene.lines().position(0) * nu;
        assertEquals(0.75 * 6.2649e8 / (2 * Math.PI), hertz, 1e-3 * hertz);
    }

    @Test
    void lineListsAreShiftedAndBroadenedLikeTheRest() {
        double[] vacuum = {500.0, 600.0};
        double v = 30_000;
        Scene scene = Scene.builder(PixelGrid.linear(450, 650, 4000))
                .lineList("Xx I", vacuum, new double[] {1, 2}, 20 * PhysicalConstants.ATOMIC_MASS_CONSTANT.value())
                .velocity(v).temperature(300).build();
        double factor = Math.sqrt((1 + v / PhysicalConstants.C) / (1 - v / PhysicalConstants.C));
        assertEquals(500 * factor, scene.lines().position(0), 1e-9);
        assertEquals("Xx I", scene.lines().label(1));
    }

    /**
     * Each line says whether its photon rate is a list's given intensity or a population the
     * scene computed; a scene whose only lines on the grid have intensity 0 fails saying that,
     * not blaming their Boltzmann populations.
     */
    @Test
    void linesSayWhetherTheirIntensityWasGiven() {
        double mass = 40 * PhysicalConstants.ATOMIC_MASS_CONSTANT.value();
        Scene scene = Scene.builder(PixelGrid.linear(480, 700, 2000)).hydrogenLike(Species.parse("H I"), H, 1)
                .lineList("Xx I", new double[] {500, 600}, new double[] {1, 0}, mass).temperature(9000).build();
        Scene.Lines lines = scene.lines();
        int given = 0;
        for (int i = 0; i < lines.size(); i++) {
            boolean list = lines.label(i).equals("Xx I");
            assertEquals(list, lines.intensityGiven(i), lines.label(i));
            given += list ? 1 : 0;
        }
        assertEquals(2, given);
        SceneException dark = assertThrows(SceneException.class, () -> Scene.builder(PixelGrid.linear(580, 620, 200))
                .lineList("Xx I", new double[] {600}, new double[] {0}, mass).temperature(300).build().render(1));
        assertEquals(SceneException.NO_LIGHT, dark.code());
        assertEquals("1 line falls on the grid from 580.0 to 620.0 nm, but none carries any light: their line lists"
                + " give them intensity 0", dark.getMessage());
        assertFalse(Scene.Lines.of(new double[] {1}, new double[] {1}, new double[] {0}, new double[] {0},
                new String[] {"x"}).intensityGiven(0));
    }

    @Test
    void badDescriptionsAreRefusedWithTheirName() {
        PixelGrid grid = PixelGrid.linear(400, 700, 100);
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> Scene.builder(grid).build());
        assertTrue(e.getMessage().contains("no emitters"), e.getMessage());
        e = assertThrows(IllegalArgumentException.class, () -> Scene.builder(grid).temperature(-1));
        assertTrue(e.getMessage().startsWith("temperature"), e.getMessage());
        e = assertThrows(IllegalArgumentException.class, () -> Scene.builder(grid).electronDensity(1e27));
        assertTrue(e.getMessage().contains("Stark fit"), e.getMessage());
        e = assertThrows(IllegalArgumentException.class,
                () -> Scene.builder(grid).hydrogenLike(Species.parse("He II"), H, 1));
        assertTrue(e.getMessage().contains("He II"), e.getMessage());
        e = assertThrows(IllegalArgumentException.class, () -> Scene.builder(grid)
                .lineList("Ne I", new double[] {500, -1}, new double[] {1, 1}, 3e-26));
        assertTrue(e.getMessage().contains("Ne I line 1"), e.getMessage());
        SceneException dark = assertThrows(SceneException.class, () -> Scene.builder(PixelGrid.linear(2000, 2100, 10))
                .hydrogenLike(Species.parse("H I"), H, 1).temperature(10_000).nMax(3).build().render(1));
        assertEquals(SceneException.NO_LIGHT, dark.code());
        assertTrue(dark.getMessage().contains("no line falls"), dark.getMessage());
        // H-alpha lies in the grid, but at 30 K no atom is in n = 3: the message says which it is.
        SceneException cold = assertThrows(SceneException.class, () -> Scene.builder(PixelGrid.linear(640, 660, 200))
                .hydrogenLike(Species.parse("H I"), H, 1).temperature(30).build().render(1));
        assertEquals(SceneException.NO_LIGHT, cold.code());
        assertTrue(cold.getMessage().startsWith("1 line falls on the grid from 640.0 to 660.0 nm, but none carries any"
                + " light"), cold.getMessage());
        e = assertThrows(IllegalArgumentException.class, () -> Scene.builder(grid)
                .hydrogenLike(Species.parse("H I"), H, 1).temperature(10_000).naturalWidths(true).nMax(100).build());
        assertTrue(e.getMessage().contains("natural widths"), e.getMessage());
    }

    /**
     * The review found a scene without a temperature rendered at 10,000 K, silently. Every scene
     * needs one (populations and Doppler widths, line lists included), so build() refuses, naming it.
     */
    @Test
    void aSceneWithoutATemperatureIsRefusedNamingIt() {
        PixelGrid grid = PixelGrid.linear(400, 700, 100);
        for (Scene.Builder b : new Scene.Builder[] {Scene.builder(grid).hydrogenLike(Species.parse("H I"), H, 1),
            Scene.builder(grid).lineList("Xx I", new double[] {500}, new double[] {1}, 3e-26)}) {
            IllegalArgumentException e = assertThrows(IllegalArgumentException.class, b::build);
            assertTrue(e.getMessage().contains("no temperature") && e.getMessage().contains("temperature(kelvin)"),
                    e.getMessage());
            b.temperature(10_000);
            assertTrue(b.build().lines().size() > 0, "given one, it builds");
        }
    }

    /**
     * The review's scene (H I and He II, 380-700 nm, 20,000 K): H-alpha / He II 468.6 was
     * 9.42e8, 2.40e8 and 3.28e5 for nMax 10, 30 and 300, and with 1e22 m^-3 6.73e6 and 4.81e5 for
     * nMax 30 and 300, because U was summed to nMax. The drawing cutoff must not change the
     * physics: now the ratio is the same for every nMax, with a density and without.
     */
    @Test
    void theRatioOfTwoSpeciesLinesDoesNotDependOnNMax() {
        PixelGrid grid = PixelGrid.linear(380, 700, 2000);
        for (double ne : new double[] {Double.NaN, 1e22}) {
            double first = Double.NaN;
            for (int nMax : Double.isNaN(ne) ? new int[] {10, 30, 120} : new int[] {10, 30, 300}) {
                Scene.Builder b = Scene.builder(grid).hydrogenLike(Species.parse("H I"), H, 1)
                        .hydrogenLike(Species.parse("He II"), HE_II, 1).temperature(20_000).nMax(nMax);
                if (!Double.isNaN(ne)) {
                    b.electronDensity(ne);
                }
                if (!Double.isNaN(ne) && nMax == 300) {
                    // The build's work estimate (for the command's long-build warning) stops at the
                    // last bound level too: the same as for nMax 42 (H I ends at 30, He II at 42).
                    double bound = Scene.builder(grid).hydrogenLike(Species.parse("H I"), H, 1)
                            .hydrogenLike(Species.parse("He II"), HE_II, 1).temperature(20_000).electronDensity(ne)
                            .nMax(42).ionLineWorkUnits();
                    assertEquals(bound, b.ionLineWorkUnits(), 0.0);
                }
                Scene.Lines lines = b.build().lines();
                double ratio = photonsNear(lines, "H I", 656.47) / photonsNear(lines, "He II", 468.70);
                if (Double.isNaN(first)) {
                    first = ratio;
                }
                assertEquals(first, ratio, 1e-12 * first, "ne " + ne + ", nMax " + nMax);
            }
        }
    }

    /**
     * Alkali atoms had the same fault: U summed over the model's levels to nMax. Rb at 6000 K beside
     * H I: the ratio of Rb's D2 line to H-alpha is now the same for nMax 20 and 80, with a density
     * and without (the old sum grew by about 32 exp(-chi / kT) = 0.01 per n there).
     */
    @Test
    void anAlkaliAtomsLinesDoNotDependOnNMaxEither() {
        org.ritzwerk.engine.rydberg.AlkaliAtom rb = org.ritzwerk.engine.rydberg.TestAtoms.rubidium();
        // Rb-87 mass 86.909 u (from memory), for the Doppler width only.
        Nucleus rb87 = new Nucleus(37, 87, 86.909 * PhysicalConstants.ATOMIC_MASS_CONSTANT.value(), 3,
                OptionalDouble.empty(), OptionalDouble.empty(), "test");
        PixelGrid grid = PixelGrid.linear(640, 800, 2000);
        for (double ne : new double[] {Double.NaN, 1e22}) {
            double first = Double.NaN;
            for (int nMax : new int[] {20, 80}) {
                Scene.Builder b = Scene.builder(grid).hydrogenLike(Species.parse("H I"), H, 1).alkali(rb, 1, rb87)
                        .temperature(6000).nMax(nMax);
                if (!Double.isNaN(ne)) {
                    b.electronDensity(ne);
                }
                Scene.Lines lines = b.build().lines();
                double ratio = photonsNear(lines, rb.species().notation(), 780.24) / photonsNear(lines, "H I", 656.47);
                if (Double.isNaN(first)) {
                    first = ratio;
                }
                assertEquals(first, ratio, 1e-12 * first, "ne " + ne + ", nMax " + nMax);
            }
        }
    }

    /** The photon rate of the line of a species nearest a vacuum wavelength (within 0.1 nm). */
    private static double photonsNear(Scene.Lines lines, String species, double vacuumNm) {
        int best = -1;
        for (int i = 0; i < lines.size(); i++) {
            double off = Math.abs(lines.position(i) - vacuumNm);
            if (lines.label(i).startsWith(species + " ") && off < 0.1
                    && (best < 0 || off < Math.abs(lines.position(best) - vacuumNm))) {
                best = i;
            }
        }
        assertTrue(best >= 0, species + " near " + vacuumNm);
        return lines.photons(best);
    }

    /**
     * Without a density, at a temperature where the Planck-Larkin sum falls below the ground
     * level's weight (H near 50,000 K: 1.963 by planck-larkin.csv), a note says that a one-electron
     * stage without a density is not meaningful there.
     */
    @Test
    void aHotSceneWithoutADensityIsNoted() {
        Scene hot = Scene.builder(PixelGrid.linear(400, 700, 100)).hydrogenLike(Species.parse("H I"), H, 1)
                .temperature(50_000).build();
        assertTrue(hot.notes().stream().anyMatch(n -> n.startsWith("H I: without an electron density")),
                hot.notes().toString());
        Scene warm = Scene.builder(PixelGrid.linear(400, 700, 100)).hydrogenLike(Species.parse("H I"), H, 1)
                .temperature(20_000).build();
        assertTrue(warm.notes().isEmpty(), warm.notes().toString());
    }

    /**
     * The review: a lamp list's lines against H-beta changed by 6.9 times between a 430-500 nm
     * and a 430-660 nm window of the same scene, the list being scaled by its strongest line
     * anywhere and the ions by theirs in the window. Now both scales are fixed by the scene, so
     * two windows (two channels of one instrument) give the same ratio of two lines in both.
     */
    @Test
    void aListLinesRatioToAnIonLineIsTheSameInEveryWindow() {
        Species ne = Species.parse("Ne I");
        // Invented intensities: the list's strongest line (640.2 nm) lies only in the wider window.
        org.ritzwerk.data.LineList lamp = org.ritzwerk.data.LineList.builder(new org.ritzwerk.data.DataSetInfo(
                "test-lamp", org.ritzwerk.data.DataKind.LAMP_LINES, "test lamp", "1",
                org.ritzwerk.data.Provenance.fromMemory("test"), java.util.List.of(ne)),
                org.ritzwerk.quantity.Unit.NANOMETRE, Medium.air(), "")
                .add(ne, 470.886, Double.NaN, 50, null, Double.NaN, null, null, null)
                .add(ne, 640.2248, Double.NaN, 1000, null, Double.NaN, null, null, null)
                .build();
        // Ne-20 mass 19.992 u (from memory), for the Doppler width only.
        Nucleus neon = new Nucleus(10, 20, 19.992 * PhysicalConstants.ATOMIC_MASS_CONSTANT.value(), 0,
                OptionalDouble.empty(), OptionalDouble.empty(), "test");
        double[] ratios = new double[2];
        double[] to = {500, 660};
        for (int w = 0; w < 2; w++) {
            Scene scene = Scene.builder(PixelGrid.linear(430, to[w], 2000)).medium(Medium.air())
                    .hydrogenLike(Species.parse("H I"), H, 1).lineList(lamp, s -> neon).temperature(9000).build();
            ratios[w] = photonsNear(scene.lines(), "Ne I", 470.886) / photonsNear(scene.lines(), "H I", 486.13);
        }
        assertEquals(ratios[0], ratios[1], 1e-12 * ratios[0]);
        // The list's strongest line (1000) carries H-beta's photons, the strongest H I line in the
        // list's span (470.9 to 640.2 nm: H-alpha lies beyond), so 470.886 nm has 50 / 1000 of them.
        assertEquals(0.05, ratios[0], 1e-12);
    }

    @Test
    void aDensityBelowTheStarkFitIsNoted() {
        Scene scene = Scene.builder(PixelGrid.linear(400, 700, 100)).hydrogenLike(Species.parse("H I"), H, 1)
                .temperature(10_000).electronDensity(1e18).build();
        assertEquals(1, scene.notes().size());
        assertTrue(scene.notes().get(0).contains("Stark widths are left out"), scene.notes().get(0));
    }

    private static double fullWidthAtHalfMaximum(PixelGrid grid, double[] counts) {
        int top = 0;
        for (int p = 1; p < counts.length; p++) {
            if (counts[p] > counts[top]) {
                top = p;
            }
        }
        double half = counts[top] / 2;
        int left = top;
        while (counts[left] > half) {
            left--;
        }
        int right = top;
        while (counts[right] > half) {
            right++;
        }
        double x1 = grid.centre(left) + (half - counts[left]) / (counts[left + 1] - counts[left])
                * (grid.centre(left + 1) - grid.centre(left));
        double x2 = grid.centre(right - 1) + (half - counts[right - 1]) / (counts[right] - counts[right - 1])
                * (grid.centre(right) - grid.centre(right - 1));
        return x2 - x1;
    }

    private static double solveLorentz(double voigt, double gauss) {
        double lo = 0;
        double hi = voigt;
        for (int i = 0; i < 200; i++) {
            double mid = (lo + hi) / 2;
            if (Profiles.voigtFwhm(gauss, mid) < voigt) {
                lo = mid;
            } else {
                hi = mid;
            }
        }
        return (lo + hi) / 2;
    }
}
