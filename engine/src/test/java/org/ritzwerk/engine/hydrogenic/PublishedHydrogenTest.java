package org.ritzwerk.engine.hydrogenic;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
import org.ritzwerk.constants.PhysicalConstants;
import org.ritzwerk.medium.Medium;
import org.ritzwerk.quantity.Wavelength;

/**
 * Hydrogen and deuterium against published values. The level energies and transition
 * probabilities were read in copies of NIST ASD output quoted in public repositories (ASD names
 * Kramida, At. Data Nucl. Data Tables 96, 586 (2010) for the levels and Wiese &amp; Fuhr, J. Phys.
 * Chem. Ref. Data 38, 565 (2009) for the rates); the measured frequencies in the papers' abstracts
 * or secondary quotations, as noted per check.
 */
class PublishedHydrogenTest {

    private static final double H = PhysicalConstants.H;
    private static final double HC_PER_CM = PhysicalConstants.H * PhysicalConstants.C * 100;

    private final HydrogenLikeModel hydrogen = HydrogenLikeModel.of(Nuclei.PROTON, Tier.QED);

    @Test
    void levelsOfKramida2010To1e9() {
        // Energies above 1s in cm-1 (Kramida 2010 via NIST ASD); the issue asks for 1e-7, the
        // QED tier does better, so 1e-9 is declared.
        double ground = hydrogen.energy(1, 0, 1);
        assertLevel(82258.9543992821, 2, 0, 1, ground);
        assertLevel(82258.9191133, 2, 1, 1, ground);
        assertLevel(82259.2850014, 2, 1, 3, ground);
        assertLevel(97492.221701, 3, 0, 1, ground);
        assertLevel(97492.211200, 3, 1, 1, ground);
        assertLevel(97492.319611, 3, 1, 3, ground);
        assertLevel(97492.319433, 3, 2, 3, ground);
        assertLevel(97492.355566, 3, 2, 5, ground);
        assertLevel(102823.8530211, 4, 0, 1, ground);
        assertLevel(102823.8485825, 4, 1, 1, ground);
        // Ionization limit 109678.77174307 cm-1.
        assertEquals(109678.77174307, -ground / HC_PER_CM, 1e-9 * 109678.77174307);
    }

    private void assertLevel(double expectedPerCm, int n, int l, int twoJ, double ground) {
        double perCm = (hydrogen.energy(n, l, twoJ) - ground) / HC_PER_CM;
        assertEquals(expectedPerCm, perCm, 1e-9 * expectedPerCm, Notation.level(n, l, twoJ, -1));
    }

    @Test
    void measuredIntervals() {
        // 1S-2S hyperfine centroid 2 466 061 413 187 035(10) Hz (Parthey et al., PRL 107, 203001
        // (2011), abstract as quoted): to 1e-9 relative.
        double oneSTwoS = (hydrogen.energy(2, 0, 1) - hydrogen.energy(1, 0, 1)) / H;
        assertEquals(2466061413187035.0, oneSTwoS, 1e-9 * oneSTwoS);
        // Lamb shift 2S1/2 - 2P1/2 = 1057.845(9) MHz (Lundeen & Pipkin 1981, secondary quotation): 0.1 %.
        double lamb = (hydrogen.energy(2, 0, 1) - hydrogen.energy(2, 1, 1)) / H / 1e6;
        assertEquals(1057.845, lamb, 1.057845);
        // Fine structure 2P3/2 - 2P1/2 = 10969.13(10) MHz (PRA 5, 564 (1972)): 0.05 %.
        double fine = (hydrogen.energy(2, 1, 3) - hydrogen.energy(2, 1, 1)) / H / 1e6;
        assertEquals(10969.13, fine, 5e-4 * 10969.13);
        // Deuterium 2P fine structure 10971.59(20) MHz (Dayhoff, Triebwasser, Lamb, Phys. Rev. 89, 106 (1953)).
        HydrogenLikeModel deuterium = HydrogenLikeModel.of(Nuclei.DEUTERON, Tier.QED);
        double fineD = (deuterium.energy(2, 1, 3) - deuterium.energy(2, 1, 1)) / H / 1e6;
        assertEquals(10971.59, fineD, 5e-4 * 10971.59);
    }

    @Test
    void groundStateHyperfineWithinTheStatedAccuracy() {
        // Hydrogen 21-cm line 1 420 405 751.768(2) Hz (hydrogen maser; as quoted): the issue asks 0.1 %,
        // the Fermi formula with a_e and the reduced mass gives 6e-5; 1e-4 is declared.
        HydrogenLikeModel h = HydrogenLikeModel.of(Nuclei.PROTON, Tier.HYPERFINE);
        double hydrogenLine = (h.energy(1, 0, 1, 2) - h.energy(1, 0, 1, 0)) / H;
        assertEquals(1420405751.768, hydrogenLine, 1e-4 * 1420405751.768);
        // Deuterium 327 384 352.522 Hz (Wineland & Ramsey 1972, as quoted): nuclear structure
        // corrections missing from the Fermi formula are ~2e-4 here; 0.1 % declared.
        HydrogenLikeModel d = HydrogenLikeModel.of(Nuclei.DEUTERON, Tier.HYPERFINE);
        double deuteriumLine = (d.energy(1, 0, 1, 3) - d.energy(1, 0, 1, 1)) / H;
        assertEquals(327384352.522, deuteriumLine, 1e-3 * 327384352.522);
        // Without spin resolution the centroid is the QED level.
        assertEquals(hydrogen.energy(1, 0, 1), h.energy(1, 0, 1), 0.0);
    }

    @Test
    void ratesOfWieseAndFuhr2009() {
        HydrogenLikeLines lines = HydrogenLikeLines.of(hydrogen);
        LineTable multiplets = lines.multiplets(5, 1e13, 1e16);
        // n -> n' multiplets: A (s^-1) and absorption f (Wiese & Fuhr 2009 via ASD), 0.1 %.
        assertMultiplet(multiplets, 2, 1, 4.6986e8, 0.41641);
        assertMultiplet(multiplets, 3, 2, 4.4101e7, 0.64108);
        assertMultiplet(multiplets, 3, 1, 5.5751e7, Double.NaN);
        assertMultiplet(multiplets, 4, 2, 8.4193e6, Double.NaN);
        assertMultiplet(multiplets, 5, 2, 2.5304e6, Double.NaN);
        assertMultiplet(multiplets, 4, 3, 8.9860e6, Double.NaN);
        assertMultiplet(multiplets, 4, 1, 1.2785e7, Double.NaN);
        // Components of H-alpha (same source): A and f, 0.1 %.
        LineTable alpha = lines.components(3, 4.5e14, 4.6e14);
        assertComponent(alpha, 3, 2, 5, 2, 1, 3, 6.4651e7, 6.2654e-1);
        assertComponent(alpha, 3, 2, 3, 2, 1, 1, 5.3877e7, 6.9614e-1);
        assertComponent(alpha, 3, 2, 3, 2, 1, 3, 1.0775e7, 6.9615e-2);
        assertComponent(alpha, 3, 1, 3, 2, 0, 1, 2.2448e7, 2.9005e-1);
        assertComponent(alpha, 3, 1, 1, 2, 0, 1, 2.2449e7, 1.4503e-1);
        assertComponent(alpha, 3, 0, 1, 2, 1, 1, 2.1046e6, 1.3597e-2);
        assertComponent(alpha, 3, 0, 1, 2, 1, 3, 4.2097e6, 1.3599e-2);
        // Lyman alpha components: 2p3/2 and 2p1/2 -> 1s, A 6.2647e8 and 6.2648e8, f 0.27760 and 0.13880;
        // the window given as vacuum wavelengths, either way round.
        LineTable lyman = lines.components(2, Wavelength.ofNanometres(122, Medium.vacuum()),
                Wavelength.ofNanometres(121, Medium.vacuum()));
        assertEquals(2, lyman.size());
        assertComponent(lyman, 2, 1, 3, 1, 0, 1, 6.2647e8, 0.27760);
        assertComponent(lyman, 2, 1, 1, 1, 0, 1, 6.2648e8, 0.13880);
    }

    @Test
    void lifetimeOfTwoPIsAbout1point6Nanoseconds() {
        // 1/A(2p -> 1s) with A = 6.2649e8 s^-1 (Wiese & Fuhr 2009): 1.596 ns; 0.1 %.
        assertEquals(1.596e-9, HydrogenLikeLines.of(hydrogen).lifetime(2, 1, 1), 1.6e-12);
        assertEquals(1.596e-9, HydrogenLikeLines.of(hydrogen).lifetime(2, 1, 3), 1.6e-12);
    }

    private static void assertMultiplet(LineTable table, int nU, int nL, double a, double f) {
        for (int i = 0; i < table.size(); i++) {
            if (table.upperN(i) == nU && table.lowerN(i) == nL) {
                assertEquals(a, table.einsteinA(i), 1e-3 * a, table.lineName(i) + " A");
                if (!Double.isNaN(f)) {
                    assertEquals(f, table.oscillatorStrength(i), 1e-3 * f, table.lineName(i) + " f");
                }
                return;
            }
        }
        throw new AssertionError("no multiplet " + nU + " -> " + nL);
    }

    private static void assertComponent(LineTable table, int nU, int lU, int twoJU, int nL, int lL, int twoJL,
            double a, double f) {
        for (int i = 0; i < table.size(); i++) {
            if (table.upperN(i) == nU && table.upperL(i) == lU && table.upperTwoJ(i) == twoJU
                    && table.lowerN(i) == nL && table.lowerL(i) == lL && table.lowerTwoJ(i) == twoJL) {
                String label = table.upperLabel(i) + " - " + table.lowerLabel(i);
                assertEquals(a, table.einsteinA(i), 1e-3 * a, label + " A");
                assertEquals(f, table.oscillatorStrength(i), 1e-3 * f, label + " f");
                assertTrue(table.frequency(i) > 0);
                return;
            }
        }
        throw new AssertionError("no component " + Notation.level(nU, lU, twoJU, -1) + " - "
                + Notation.level(nL, lL, twoJL, -1));
    }
}
