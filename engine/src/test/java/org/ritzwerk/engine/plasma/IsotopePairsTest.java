package org.ritzwerk.engine.plasma;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.OptionalDouble;
import org.junit.jupiter.api.Test;
import org.ritzwerk.atom.Nucleus;
import org.ritzwerk.atom.Species;
import org.ritzwerk.constants.PhysicalConstants;
import org.ritzwerk.engine.hydrogenic.HydrogenLikeModel;
import org.ritzwerk.engine.hydrogenic.Tier;
import org.ritzwerk.engine.identify.Candidates;
import org.ritzwerk.engine.identify.Identification;
import org.ritzwerk.engine.identify.Identifier;
import org.ritzwerk.engine.identify.LineCatalog;
import org.ritzwerk.engine.identify.PeakList;
import org.ritzwerk.engine.identify.Tolerance;
import org.ritzwerk.medium.Medium;
import org.ritzwerk.quantity.Unit;

/** Pairs of H and D lines: merged where unresolved, measured where resolved. */
class IsotopePairsTest {

    private static final Species HS = Species.parse("H I");
    private static final Species DS = Species.parse("D I");
    // CODATA 2018 masses (as PhysicalConstants).
    private static final double MP = 1.67262192369e-27;
    private static final double MD = 3.3435837724e-27;
    private static final double ME = 9.1093837015e-31;

    private static Candidates candidates() {
        HydrogenLikeModel h = HydrogenLikeModel.of(new Nucleus(1, 1, PhysicalConstants.PROTON_MASS.value(), 1,
                OptionalDouble.empty(), OptionalDouble.empty(), "CODATA 2018"), Tier.DIRAC);
        HydrogenLikeModel d = HydrogenLikeModel.of(new Nucleus(1, 2, PhysicalConstants.DEUTERON_MASS.value(), 2,
                OptionalDouble.empty(), OptionalDouble.empty(), "CODATA 2018"), Tier.DIRAC);
        return Candidates.inWindow(400e-9, 700e-9).hydrogenLike(HS, h, 6, false).hydrogenLike(DS, d, 6, false).build();
    }

    private static int find(LineCatalog lines, Species s, String label) {
        for (int j = 0; j < lines.size(); j++) {
            if (lines.species(j).equals(s) && label.equals(lines.label(j))) {
                return j;
            }
        }
        return -1;
    }

    @Test
    void theBalmerAlphaIsotopeShiftIsTheReducedMassShift() {
        // lambda_D / lambda_H = mu_H / mu_D, so the shift is lambda_H (1 - mu_H / mu_D), with the
        // CODATA 2018 masses: 0.1786 nm at 656.47 nm (vacuum). Fine structure scales with the
        // reduced mass too, so the ratio holds to about 1e-5 of the shift.
        LineCatalog lines = candidates().catalog();
        double lh = lines.wavelength(find(lines, HS, "Balmer alpha"));
        double ld = lines.wavelength(find(lines, DS, "Balmer alpha"));
        double muH = ME * MP / (ME + MP);
        double muD = ME * MD / (ME + MD);
        assertEquals(lh * (1 - muH / muD), lh - ld, 1e-5 * (lh - ld));
        assertEquals(0.1786e-9, lh - ld, 0.0005e-9);
    }

    @Test
    void unresolvedPairsBecomeOneLineAtTheFluxWeightedMean() {
        LineCatalog lines = candidates().catalog();
        IsotopePairs.Merged merged = IsotopePairs.of(HS, DS).withRatio(0.5).withBlendWithin(0.15e-9)
                .withResolved("Balmer gamma").merge(lines);
        LineCatalog m = merged.lines();
        // Balmer-alpha (0.179 nm apart) stays two lines; beta (0.132 nm) becomes one.
        assertTrue(find(m, DS, "Balmer alpha") >= 0);
        assertEquals(-1, find(m, DS, "Balmer beta"));
        int beta = find(m, HS, "Balmer beta");
        double lh = lines.wavelength(find(lines, HS, "Balmer beta"));
        double ld = lines.wavelength(find(lines, DS, "Balmer beta"));
        assertEquals((lh + 0.5 * ld) / 1.5, m.wavelength(beta), 1e-18);
        assertTrue(merged.isPair(m, beta));
        assertEquals("H I+D I Balmer beta", merged.name(m, beta));
        // Declared resolved: gamma is kept apart although it is closer than the blend width.
        assertTrue(find(m, DS, "Balmer gamma") >= 0);
        assertFalse(merged.isPair(m, find(m, HS, "Balmer gamma")));
        assertEquals("D I Balmer alpha", merged.name(m, find(m, DS, "Balmer alpha")));
        assertEquals(lines.size() - 2, m.size());
        // Ratio 0 merges nothing.
        assertEquals(lines.size(), IsotopePairs.of(HS, DS).withBlendWithin(1e-9).merge(lines).lines().size());
    }

    @Test
    void aResolvedPairGivesTheRatioAndTheShift() {
        LineCatalog lines = candidates().catalog();
        double lh = lines.wavelength(find(lines, HS, "Balmer alpha")) * 1e9;
        double ld = lines.wavelength(find(lines, DS, "Balmer alpha")) * 1e9;
        double[] nm = {ld + 0.002, lh - 0.001};
        double[] flux = {500, 1000};
        PeakList peaks = PeakList.of(nm, new double[] {0.003, 0.003}, flux, Unit.NANOMETRE, Medium.vacuum());
        Identification id = Identifier.of(Tolerance.absolute(0.03e-9)).identify(peaks, lines);
        IsotopePairs.Resolved r = IsotopePairs.of(HS, DS).resolved(id, lines, "Balmer alpha", nm, flux,
                new double[] {50, 50}, Medium.vacuum()).orElseThrow();
        assertEquals(1, r.lightPeak());
        assertEquals(0, r.heavyPeak());
        assertEquals(0.5, r.heavyPerLight(), 1e-15);
        // sigma_r = r sqrt((50/500)^2 + (50/1000)^2)
        assertEquals(0.5 * Math.hypot(0.1, 0.05), r.heavyPerLightSigma(), 1e-15);
        assertEquals(lh - ld - 0.003, r.measuredShift(), 1e-9);
        assertEquals(lh - ld, r.predictedShift(), 1e-9);
        assertTrue(IsotopePairs.of(HS, DS).resolved(id, lines, "Balmer beta", nm, flux, null, Medium.vacuum())
                .isEmpty());
    }

    @Test
    void badSettingsAreRefused() {
        assertThrows(IllegalArgumentException.class, () -> IsotopePairs.of(HS, HS));
        assertThrows(IllegalArgumentException.class, () -> IsotopePairs.of(HS, DS).withRatio(-1));
        assertThrows(IllegalArgumentException.class, () -> IsotopePairs.of(HS, DS).withBlendWithin(Double.NaN));
        assertEquals(2.0, IsotopePairs.blendWavelength(1, 4, 0.5), 1e-15);
    }
}
