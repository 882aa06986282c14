package org.ritzwerk.engine.calibrate;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.junit.jupiter.api.Test;
import org.ritzwerk.atom.Species;
import org.ritzwerk.data.DataKind;
import org.ritzwerk.data.DataSetInfo;
import org.ritzwerk.data.LineList;
import org.ritzwerk.data.Provenance;
import org.ritzwerk.data.StrengthClass;
import org.ritzwerk.engine.lines.LineSet;
import org.ritzwerk.medium.Medium;
import org.ritzwerk.quantity.Unit;

/**
 * Lamps made from lines with rates (g_u A) and blended at a resolving power, as for the Ritz lines
 * of a level list, whose fine-structure components a compact spectrometer sees as one peak.
 */
class LampSetBlendTest {

    private static final Species HE = Species.parse("He I");
    private static final Species NE = Species.parse("Ne I");

    /**
     * Three components of one multiplet (0.004 and 0.053 nm apart, intensities 5 : 3 : 1) and a
     * line 1 nm away: at R = 5000 (half FWHM 0.07 nm) the three become one line at their
     * intensity-weighted centroid with the summed intensity, labelled by the strongest; at
     * R = 50,000 (half FWHM 0.007 nm) only the two closest merge; the far line stays alone.
     */
    @Test
    void componentsWithinHalfTheFwhmBecomeOneBlendAtTheirCentroid() {
        LampSet lamp = LampSet.of(List.of(list(HE, new double[] {706.5708, 706.5177, 707.5, 706.5215},
                new double[] {1, 5, 2, 3}, new double[] {1e-4, 1e-4, 1e-4, 1e-4}, null)), Medium.air());
        LampSet coarse = lamp.blendedAt(5000);
        assertEquals(2, coarse.size());
        // Source: the intensity-weighted mean, by hand (common practice for an unresolved blend).
        double centroid = (5 * 706.5177 + 3 * 706.5215 + 706.5708) / 9;
        assertEquals(centroid, coarse.lines().wavelength(0), 1e-9);
        assertEquals(9, coarse.lines().intensity(0), 0.0);
        assertEquals("He I 706.5177 nm air (+2 blended)", coarse.label(0));
        assertEquals(707.5, coarse.lines().wavelength(1), 0.0);
        assertEquals("He I 707.5 nm air", coarse.label(1));
        // The blend's uncertainty holds the components' spread (0.017 nm), far above their 1e-4 nm.
        double spread = Math.sqrt((5 * sq(706.5177 - centroid) + 3 * sq(706.5215 - centroid)
                + sq(706.5708 - centroid)) / 9);
        assertEquals(Math.hypot(spread, Math.sqrt(35) / 9 * 1e-4), coarse.lines().sigma(0), 1e-12);

        LampSet fine = lamp.blendedAt(50_000);
        assertEquals(3, fine.size());
        assertEquals((5 * 706.5177 + 3 * 706.5215) / 8, fine.lines().wavelength(0), 1e-9);
        assertEquals(706.5708, fine.lines().wavelength(1), 0.0);
        assertThrows(IllegalArgumentException.class, () -> lamp.blendedAt(0.5));
    }

    /** Lines of two gases never merge, however close; the strongest class of a blend is kept. */
    @Test
    void linesOfDifferentGasesStaySeparateAndTheStrongestClassIsKept() {
        LineList helium = list(HE, new double[] {500.0, 500.01}, new double[] {1, 1}, null,
                new StrengthClass[] {StrengthClass.WEAK, StrengthClass.STRONG});
        LineList neon = list(NE, new double[] {500.005}, new double[] {1}, null, null);
        LampSet both = LampSet.of(List.of(helium, neon), Medium.air()).blendedAt(1000);
        assertEquals(3, both.size());
        LampSet heliumOnly = LampSet.of(List.of(helium), Medium.air()).blendedAt(1000);
        assertEquals(1, heliumOnly.size());
        assertEquals(StrengthClass.STRONG, heliumOnly.strength(0));
        assertEquals(500.005, heliumOnly.lines().wavelength(0), 1e-12);
    }

    /**
     * A lamp ranked by rate: intensity g_u A; a line without A is left out and counted; so are
     * lines outside the air model. Joined to a handbook lamp, the counts add up.
     */
    @Test
    void aLampRankedByRateWeighsEachLineByGA() {
        double c = 299_792_458.0;
        LineSet.Builder b = LineSet.builder();
        LineSet.Source source = LineSet.Source.of("test");
        b.addFrequency(HE, source, "a", c / 587.7e-9).einsteinA(7e7).weights(7, 5);
        b.addFrequency(HE, source, "b", c / 667.9e-9).einsteinA(6e7).weights(5, 3);
        b.addFrequency(HE, source, "no A", c / 591.6e-9).weights(3, 5);
        b.addFrequency(HE, source, "far ultraviolet", c / 58.4e-9).einsteinA(1.8e9).weights(3, 1);
        LampSet rated = LampSet.ofRates(b.build(), Medium.air());
        assertEquals(2, rated.size());
        assertEquals(1, rated.withoutRate());
        assertEquals(1, rated.outsideMedium());
        assertEquals(7 * 7e7, rated.lines().intensity(0), 0.0);
        assertEquals(5 * 6e7, rated.lines().intensity(1), 0.0);
        assertNull(rated.strength(0));

        LampSet neon = LampSet.of(List.of(list(NE, new double[] {640.2248}, new double[] {1000}, null, null)),
                Medium.air());
        LampSet joined = neon.plus(rated);
        assertEquals(3, joined.size());
        assertEquals(640.2248, joined.lines().wavelength(0), 0.0);
        assertEquals(NE, joined.species(0));
        assertEquals(HE, joined.species(2));
        assertEquals(1, joined.withoutRate());
        assertEquals(1, joined.outsideMedium());
        assertTrue(joined.setIds().contains("test-ne-i") && joined.setIds().contains("test"), joined.setIds().toString());
        assertThrows(IllegalArgumentException.class, () -> neon.plus(LampSet.ofRates(b.build(), Medium.vacuum())));

        LineSet.Builder none = LineSet.builder();
        none.addFrequency(HE, source, "no A", c / 591.6e-9).weights(3, 5);
        assertThrows(IllegalArgumentException.class, () -> LampSet.ofRates(none.build(), Medium.air()));
    }

    private static double sq(double x) {
        return x * x;
    }

    private static LineList list(Species species, double[] nm, double[] intensity, double[] sigma,
            StrengthClass[] strength) {
        String id = "test-" + species.notation().toLowerCase(java.util.Locale.ROOT).replace(' ', '-');
        LineList.Builder b = LineList.builder(new DataSetInfo(id, DataKind.LAMP_LINES, id, "1",
                Provenance.computedBy("test"), List.of(species)), Unit.NANOMETRE, Medium.air(), "");
        for (int i = 0; i < nm.length; i++) {
            b.add(species, nm[i], sigma == null ? Double.NaN : sigma[i], intensity[i],
                    strength == null ? null : strength[i], Double.NaN, null, null, null);
        }
        return b.build();
    }
}
