package org.ritzwerk.engine.lines;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.OptionalDouble;
import java.util.function.Function;
import org.junit.jupiter.api.Test;
import org.ritzwerk.atom.Nucleus;
import org.ritzwerk.atom.Species;
import org.ritzwerk.constants.PhysicalConstants;
import org.ritzwerk.data.LineList;
import org.ritzwerk.engine.calibrate.LampSet;
import org.ritzwerk.engine.hydrogenic.HydrogenLikeModel;
import org.ritzwerk.engine.hydrogenic.Tier;
import org.ritzwerk.engine.identify.Candidates;
import org.ritzwerk.engine.identify.LineCatalog;
import org.ritzwerk.engine.synth.PixelGrid;
import org.ritzwerk.engine.synth.Scene;
import org.ritzwerk.medium.Medium;

/**
 * The identification catalogue, lamp lines and scene lines take a line set in one call, and give
 * what their line-list paths give for the same list.
 */
class LineSetConsumersTest {

    /**
     * Ne-20: atomic mass 19.9924401762 u (AME2020, from memory), spin 0. Both paths compared here
     * take the same nucleus, so its digits do not enter the checks.
     */
    private static final Nucleus NEON = new Nucleus(10, 20, Nucleus.nuclearMassKg(10, 19.9924401762), 0,
            OptionalDouble.empty(), OptionalDouble.empty(), "AME2020");
    private static final Function<Species, Nucleus> NUCLEI = s -> NEON;

    @Test
    void candidatesFromALineSetMatchTheListPath() {
        LineList neon = Sources.neonInAir();
        LineCatalog fromList = Candidates.inWindow(500e-9, 800e-9).lineList(neon).build().catalog();
        LineCatalog fromSet = Candidates.inWindow(500e-9, 800e-9).lineSet(LineSet.of(neon)).build().catalog();
        assertEquals(fromList.size(), fromSet.size());
        for (int j = 0; j < fromList.size(); j++) {
            // Source: Candidates.Builder.lineList on the same list (same conversion, same strengths).
            assertEquals(fromList.wavelength(j), fromSet.wavelength(j), 0.0);
            assertEquals(fromList.sigma(j), fromSet.sigma(j), 0.0);
            assertEquals(fromList.strength(j), fromSet.strength(j), 0.0);
            assertEquals(fromList.species(j), fromSet.species(j));
        }
        assertEquals("2p9 - 3s2", fromSet.label(1));
        // A list line without level labels is named by its list and its position as listed.
        assertEquals("test-ne 585.2488 nm air", fromSet.label(0));
    }

    @Test
    void multipletsBecomeBlendsSpanningTheirComponents() {
        LineSet alpha = LineQuery.defaults().withWindowHz(4.5e14, 4.6e14).withMaxN(3).withMultiplets(true)
                .withMultipletComponents(true)
                .run(LineSources.none().withHydrogenLike(Sources.H, Sources.hydrogen(Tier.QED)));
        LineCatalog catalog = Candidates.inWindow(600e-9, 700e-9).lineSet(alpha).build().catalog();
        assertEquals(1, catalog.size());
        assertTrue(catalog.isBlend(0));
        assertEquals("Balmer alpha", catalog.label(0));
        LineSet parts = alpha.components(0);
        double shortest = Double.POSITIVE_INFINITY;
        double longest = 0;
        for (int k = 0; k < parts.size(); k++) {
            shortest = Math.min(shortest, parts.vacuumWavelengthMetres(k));
            longest = Math.max(longest, parts.vacuumWavelengthMetres(k));
        }
        // Source: the attached components' span; H-alpha's fine structure spans about 0.016 nm
        // (3d5/2-2p3/2 to 3s1/2-2p1/2, common practice), between 0.01 and 0.03 nm.
        assertEquals(longest - shortest, catalog.blendSpread(0), 0.0);
        assertTrue(catalog.blendSpread(0) > 0.01e-9 && catalog.blendSpread(0) < 0.03e-9, "" + catalog.blendSpread(0));
    }

    @Test
    void aQueriedSetWithItsModelsIsTheOneElectronPathWithItsPlasmaPhysics() {
        HydrogenLikeModel model = Sources.hydrogen(Tier.QED);
        // The Balmer window 380-700 nm, n <= 12, multiplets with their components.
        double lo = 380e-9;
        double hi = 700e-9;
        LineSet balmer = LineQuery.defaults().withWindowHz(PhysicalConstants.C / hi, PhysicalConstants.C / lo)
                .withMaxN(12).withMultiplets(true).withMultipletComponents(true)
                .run(LineSources.none().withHydrogenLike(Sources.H, model));
        Candidates direct = Candidates.inWindow(lo, hi).hydrogenLike(Sources.H, model, 12, false).build();
        Candidates queried = Candidates.inWindow(lo, hi).lineSet(balmer, s -> model).build();
        LineCatalog a = direct.catalog();
        LineCatalog b = queried.catalog();
        assertEquals(a.size(), b.size());
        // Balmer alpha (656 nm) to 9 -> 2 (383.5 nm); 10 -> 2 lies at 379.8 nm (common practice).
        assertEquals(7, a.size());
        for (int j = 0; j < a.size(); j++) {
            // Source: Candidates.Builder.hydrogenLike, the one-electron path, on the same model.
            assertEquals(a.wavelength(j), b.wavelength(j), 0.0);
            assertEquals(a.strength(j), b.strength(j), 0.0);
            assertEquals(a.label(j), b.label(j));
            assertEquals(a.blendSpread(j), b.blendSpread(j), 0.0);
            assertEquals(direct.multiplet(a, j), queried.multiplet(b, j));
        }
        // Without the models the lines are the same but carry no plasma physics.
        Candidates bare = Candidates.inWindow(lo, hi).lineSet(balmer).build();
        assertEquals(null, bare.multiplet(bare.catalog(), 0));
    }

    @Test
    void lampLinesFromALineSetMatchTheListPath() {
        LineList neon = Sources.neonInAir();
        LampSet fromList = LampSet.of(List.of(neon), Medium.air());
        LampSet fromSet = LampSet.of(LineSet.of(neon), Medium.air());
        assertEquals(fromList.size(), fromSet.size());
        assertEquals(fromList.setIds(), fromSet.setIds());
        for (int i = 0; i < fromList.size(); i++) {
            // Source: LampSet.of(lists) on the same list; back through vacuum to air within rounding,
            // the uncertainty through the air model's slope instead of the identity (1e-4 relative).
            assertEquals(fromList.lines().wavelength(i), fromSet.lines().wavelength(i),
                    1e-12 * fromList.lines().wavelength(i));
            assertEquals(fromList.lines().intensity(i), fromSet.lines().intensity(i), 0.0);
            assertEquals(fromList.lines().sigma(i), fromSet.lines().sigma(i), 1e-4 * fromList.lines().sigma(i));
            assertEquals(fromList.label(i), fromSet.label(i));
            assertEquals(fromList.strength(i), fromSet.strength(i));
        }
        assertEquals(fromList.lines().sigmasGiven(), fromSet.lines().sigmasGiven());
        assertThrows(IllegalArgumentException.class, () -> LampSet.of(LineSet.empty(), Medium.air()));
    }

    /**
     * A list computed from levels holds lines no spectrometer in air sees: a far-ultraviolet
     * resonance line (58.4 nm) and far-infrared lines between high levels (4 um, 3 mm). In air
     * the lamp keeps the visible lines, in both paths, and counts the ones left out; in vacuum it
     * keeps all. A list with no line in the air model's range is refused, naming the list.
     */
    @Test
    void lampLinesOutsideTheAirModelAreLeftOutAndCounted() {
        Species he = Species.parse("He I");
        double[] vacuumNm = {58.4334, 501.7077, 4000.0, 587.7249, 3.2e6};
        LineList mixed = list("mixed-he", he, vacuumNm);
        LampSet air = LampSet.of(List.of(mixed), Medium.air());
        assertEquals(2, air.size());
        assertEquals(3, air.outsideMedium());
        // Source: the air model itself, line by line (the lamp converts the same way).
        assertEquals(Medium.air().fromVacuum(501.7077e-9) * 1e9, air.lines().wavelength(0), 1e-9);
        assertEquals(Medium.air().fromVacuum(587.7249e-9) * 1e9, air.lines().wavelength(1), 1e-9);
        assertEquals("He I 501.7077 nm vacuum", air.label(0));
        LampSet fromSet = LampSet.of(LineSet.of(mixed), Medium.air());
        assertEquals(2, fromSet.size());
        assertEquals(3, fromSet.outsideMedium());
        assertEquals(air.lines().wavelength(1), fromSet.lines().wavelength(1), 1e-12 * 600);
        LampSet vacuum = LampSet.of(List.of(mixed), Medium.vacuum());
        assertEquals(5, vacuum.size());
        assertEquals(0, vacuum.outsideMedium());
        // Leaving lines out of the selection by strength keeps the count.
        assertEquals(3, air.atLeast(org.ritzwerk.data.StrengthClass.WEAK).outsideMedium());

        LineList farOnly = list("far-only", he, new double[] {58.4334, 3.2e6});
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> LampSet.of(List.of(farOnly), Medium.air()));
        assertTrue(e.getMessage().contains("far-only"), e.getMessage());
        assertThrows(IllegalArgumentException.class, () -> LampSet.of(LineSet.of(farOnly), Medium.air()));
    }

    private static LineList list(String id, Species species, double[] vacuumNm) {
        LineList.Builder b = LineList.builder(new org.ritzwerk.data.DataSetInfo(id,
                org.ritzwerk.data.DataKind.LINES, id, "1", org.ritzwerk.data.Provenance.computedBy("test"),
                List.of(species)), org.ritzwerk.quantity.Unit.NANOMETRE, Medium.vacuum(), "");
        for (double nm : vacuumNm) {
            b.add(species, nm, Double.NaN, 1.0, null, Double.NaN, null, null, null);
        }
        return b.build();
    }

    @Test
    void sceneLinesFromALineSetMatchTheListPath() {
        LineList neon = Sources.neonInAir();
        PixelGrid grid = PixelGrid.linear(580, 650, 700);
        Scene.Lines fromList = Scene.builder(grid).medium(Medium.air()).temperature(300).lineList(neon, NUCLEI).build()
                .lines();
        Scene.Lines fromSet = Scene.builder(grid).medium(Medium.air()).temperature(300)
                .lineSet(LineSet.of(neon), NUCLEI).build().lines();
        assertEquals(fromList.size(), fromSet.size());
        for (int i = 0; i < fromList.size(); i++) {
            // Source: Scene.Builder.lineList on the same list.
            assertEquals(fromList.position(i), fromSet.position(i), 1e-12 * fromList.position(i));
            assertEquals(fromList.photons(i), fromSet.photons(i), 0.0);
            assertEquals(fromList.gaussianFwhm(i), fromSet.gaussianFwhm(i), 1e-12 * fromList.gaussianFwhm(i));
            assertEquals(fromList.label(i), fromSet.label(i));
        }
        LineSet dark = LineSet.builder().addWavelength(Species.parse("Ne I"), LineSet.Source.of("mine"), "dark",
                600e-9).build();
        assertThrows(IllegalArgumentException.class, () -> Scene.builder(grid).lineSet(dark, NUCLEI));
        assertEquals(PhysicalConstants.C / 600e-9, dark.frequencyHz(0), 0.0);
    }
}
