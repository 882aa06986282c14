package org.ritzwerk.engine.synth;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.ByteArrayInputStream;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.ObjectInputStream;
import java.io.ObjectOutputStream;
import java.util.List;
import java.util.OptionalDouble;
import org.junit.jupiter.api.Test;
import org.ritzwerk.atom.Nucleus;
import org.ritzwerk.atom.Species;
import org.ritzwerk.constants.PhysicalConstants;
import org.ritzwerk.engine.hydrogenic.HydrogenLikeModel;
import org.ritzwerk.engine.hydrogenic.Tier;

/**
 * The lines on the grid that carry no light, and why: one classification for the scene before
 * rendering, the rendered spectrum and a refused render. Each cause is made here from a limit of
 * IEEE 754 doubles (common practice: the smallest positive double is about 4.9e-324, the smallest
 * normal one about 2.2e-308) or from a Boltzmann factor that is below it.
 */
class DarkLinesTest {

    private static final Nucleus PROTON = new Nucleus(1, 1, PhysicalConstants.PROTON_MASS.value(), 1,
            OptionalDouble.empty(), OptionalDouble.empty(), "CODATA 2018");
    private static final HydrogenLikeModel H = HydrogenLikeModel.of(PROTON, Tier.DIRAC);
    private static final double MASS = 40 * PhysicalConstants.ATOMIC_MASS_CONSTANT.value();

    /** A list line of intensity 0 is dark before and after rendering; the lit one and the one off the grid are not. */
    @Test
    void aListLineOfIntensityZeroIsDarkForThatCause() {
        Scene scene = Scene.builder(PixelGrid.linear(480, 620, 1400))
                .lineList("Xx I", new double[] {500, 600, 700}, new double[] {1, 0, 0}, MASS).temperature(300).build();
        List<DarkLines.Line> expected = List.of(new DarkLines.Line(1, "Xx I", scene.lines().position(1),
                DarkLines.Cause.ZERO_INTENSITY));
        DarkLines before = scene.darkLines();
        assertEquals(2, before.onGrid(), "700 nm lies beyond the grid's 620 nm end");
        assertEquals(expected, before.lines());
        DarkLines after = scene.render(1).darkLines();
        assertEquals(before, after);
        assertEquals(1, after.count(DarkLines.Cause.ZERO_INTENSITY));
        assertEquals(0, after.count(DarkLines.Cause.INTENSITY_UNDERFLOW));
        assertEquals(expected, after.withCause(DarkLines.Cause.ZERO_INTENSITY));
    }

    /**
     * 1e-308 beside 1e308: once the brightest pixel is scaled to 10,000 counts the faint line's
     * counts are about 1e-308 * 1e4 / 1e308 = 1e-612, below the smallest double, so it is 0. The
     * scene cannot tell that before rendering (its rate is above 0); the spectrum can.
     */
    @Test
    void aListLineTooFaintBesideTheBrightestIsDarkOnlyOnceScaled() {
        Scene scene = Scene.builder(PixelGrid.linear(480, 620, 1400))
                .lineList("Xx I", new double[] {500, 600}, new double[] {1e308, 1e-308}, MASS).temperature(300)
                .build();
        assertTrue(scene.darkLines().isEmpty());
        assertEquals(2, scene.darkLines().onGrid());
        SyntheticSpectrum spectrum = scene.render(1);
        assertEquals(0, spectrum.lineCounts(1));
        assertEquals(600, scene.lines().position(1), 1e-9);
        assertEquals(new DarkLines(2, List.of(new DarkLines.Line(1, "Xx I", scene.lines().position(1),
                DarkLines.Cause.INTENSITY_UNDERFLOW))), spectrum.darkLines());
    }

    /**
     * At 100 K the Boltzmann factor of hydrogen's n = 2 and 3 levels, exp(-10.2 eV / kT) with
     * kT = 8.617e-3 eV (k = 8.617333e-5 eV/K, CODATA 2018), is exp(-1184), far below the smallest
     * double (exp(-744.4)): Lyman alpha and beta are dark, while a line list beside them is lit.
     */
    @Test
    void aComputedPopulationThatUnderflowsIsDarkForThatCause() {
        Scene scene = Scene.builder(PixelGrid.linear(100, 130, 600)).hydrogenLike(Species.parse("H I"), H, 1)
                .lineList("Xx I", new double[] {110}, new double[] {1}, MASS).nMax(3).temperature(100).build();
        DarkLines dark = scene.darkLines();
        assertEquals(3, dark.onGrid());
        assertEquals(2, dark.count(DarkLines.Cause.POPULATION_UNDERFLOW));
        assertEquals(2, dark.size());
        for (DarkLines.Line line : dark.lines()) {
            assertTrue(line.label().startsWith("H I"), line.label());
            assertEquals(scene.lines().label(line.index()), line.label());
            assertEquals(scene.lines().position(line.index()), line.positionNm());
        }
        assertEquals(dark, scene.render(1).darkLines());
    }

    /**
     * A render refused for want of light carries the classification of every line on the grid,
     * and its message counts the causes as before: a list line of intensity 0 beside H-alpha at
     * 30 K (exp(-12.09 eV / kT) = exp(-4677)).
     */
    @Test
    void aRefusedRenderCarriesEveryLineOnTheGridWithItsCause() throws IOException, ClassNotFoundException {
        Scene scene = Scene.builder(PixelGrid.linear(640, 660, 200)).hydrogenLike(Species.parse("H I"), H, 1)
                .lineList("Xx I", new double[] {650}, new double[] {0}, MASS).temperature(30).build();
        SceneException e = assertThrows(SceneException.class, () -> scene.render(1));
        assertEquals(SceneException.NO_LIGHT, e.code());
        assertTrue(e.getMessage().startsWith("2 lines fall on the grid from 640.0 to 660.0 nm, but none carries any"
                + " light: 1 of them because their line lists give them intensity 0, the others because at the"
                + " scene's temperature the Boltzmann populations"), e.getMessage());
        DarkLines dark = e.darkLines().orElseThrow();
        assertEquals(2, dark.onGrid());
        assertEquals(1, dark.count(DarkLines.Cause.ZERO_INTENSITY));
        assertEquals(1, dark.count(DarkLines.Cause.POPULATION_UNDERFLOW));
        assertEquals(scene.darkLines(), dark, "both rates are 0, so the scene knew before rendering");
        // It travels with the exception (a Spark task, a remote caller).
        ByteArrayOutputStream bytes = new ByteArrayOutputStream();
        try (ObjectOutputStream out = new ObjectOutputStream(bytes)) {
            out.writeObject(e);
        }
        try (ObjectInputStream in = new ObjectInputStream(new ByteArrayInputStream(bytes.toByteArray()))) {
            assertEquals(dark, ((SceneException) in.readObject()).darkLines().orElseThrow());
        }
        // No line on the grid at all: the same code, nothing dark, nothing on the grid.
        SceneException empty = assertThrows(SceneException.class, () -> Scene.builder(PixelGrid.linear(2000, 2100, 10))
                .hydrogenLike(Species.parse("H I"), H, 1).temperature(10_000).nMax(3).build().render(1));
        assertEquals(new DarkLines(0, List.of()), empty.darkLines().orElseThrow());
        assertTrue(new SceneException(SceneException.DARK_CONTINUUM, "x").darkLines().isEmpty());
    }

    /** The README's example (synth section), compiled and run. */
    @Test
    void theReadmeExample() {
        Scene scene = Scene.builder(PixelGrid.linear(100, 130, 600)).hydrogenLike(Species.parse("H I"), H, 1)
                .lineList("Xx I", new double[] {110, 120}, new double[] {1, 0}, MASS).nMax(3).temperature(100).build();
        StringBuilder printed = new StringBuilder();
        // --- README: lines without light ---
        DarkLines before = scene.darkLines();             // rates already 0: known before rendering
        SyntheticSpectrum spectrum = scene.render(1);
        DarkLines dark = spectrum.darkLines();            // and those whose counts vanished in the scaling
        for (DarkLines.Line line : dark.lines()) {
            printed.append(line.label() + " at " + line.positionNm() + " nm: " + line.cause() + "\n");
        }
        int faint = dark.count(DarkLines.Cause.POPULATION_UNDERFLOW);   // of dark.onGrid() lines on the grid
        // --- end ---
        assertEquals(before, dark);
        assertEquals(4, dark.onGrid());
        assertEquals(2, faint);
        assertEquals(1, dark.count(DarkLines.Cause.ZERO_INTENSITY));
        assertTrue(printed.toString().contains("Xx I at " + scene.lines().position(dark.withCause(
                DarkLines.Cause.ZERO_INTENSITY).get(0).index()) + " nm: ZERO_INTENSITY\n"), printed.toString());
    }

    @Test
    void badValuesAreRefused() {
        assertThrows(IllegalArgumentException.class, () -> new DarkLines(0, List.of(new DarkLines.Line(0, "x", 1,
                DarkLines.Cause.ZERO_INTENSITY))));
        assertThrows(IllegalArgumentException.class, () -> new DarkLines.Line(-1, "x", 1,
                DarkLines.Cause.ZERO_INTENSITY));
        assertThrows(NullPointerException.class, () -> new DarkLines.Line(0, null, 1, DarkLines.Cause.ZERO_INTENSITY));
        assertThrows(NullPointerException.class, () -> new DarkLines.Line(0, "x", 1, null));
    }
}
