package org.ritzwerk.engine.plasma;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import org.junit.jupiter.api.Test;
import org.ritzwerk.constants.PhysicalConstants;

/** The Saha prefactor and ratio, exposed, agree with the stage fractions and the textbook constant. */
class SahaRatioTest {

    @Test
    void prefactorIsTheTextbookConstant() {
        // 2 (2 pi m_e k / h^2)^(3/2) = 4.8294e21 m^-3 K^-3/2 (common practice, the usual
        // 2.4147e21 T^3/2 m^-3 times the electron's two spin states; from memory). At 10,000 K:
        assertEquals(4.8294e21 * Math.pow(1e4, 1.5), IonisationBalance.sahaPrefactor(1e4),
                2e-4 * 4.8294e21 * Math.pow(1e4, 1.5));
        // T^(3/2) scaling, exactly.
        assertEquals(8, IonisationBalance.sahaPrefactor(4e4) / IonisationBalance.sahaPrefactor(1e4), 1e-12);
    }

    @Test
    void ratioIsWhatTheFractionsGive() {
        double chi = 13.6 * PhysicalConstants.E;   // a test input near hydrogen's (invented)
        for (double t : new double[] {5_000, 12_000, 30_000}) {
            for (double ne : new double[] {1e18, 1e21, 1e24}) {
                double[] f = IonisationBalance.fractions(t, ne, new double[] {chi}, new double[] {2, 1});
                double ratio = IonisationBalance.sahaRatio(t, ne, chi, 2, 1);
                if (f[0] > 1e-300 && f[1] > 1e-300) {
                    assertEquals(f[1] / f[0], ratio, 1e-12 * ratio, "T " + t + " ne " + ne);
                }
            }
        }
        assertThrows(IllegalArgumentException.class, () -> IonisationBalance.sahaRatio(1e4, 0, chi, 2, 1));
        assertThrows(IllegalArgumentException.class, () -> IonisationBalance.sahaPrefactor(Double.NaN));
    }

    @Test
    void anIonisationEnergyInElectronVoltsIsRefusedWithTheLikelySlip() {
        // 13.6 given as J (meant in eV): above 1e-13 J, more than any ion's (the bound's reason, from memory).
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> IonisationBalance.sahaRatio(12_000, 1e21, 13.6, 2, 1));
        assertEquals("ionisation energy must be at most 1.0E-13 J (above every ion's), got 13.6 J; an energy in eV?"
                + " multiply it by 1.602176634E-19 J/eV (13.6 eV = 2.179e-18 J)", e.getMessage());
        assertThrows(IllegalArgumentException.class, () -> IonisationBalance.fractions(12_000, 1e21,
                new double[] {109_678.77}, new double[] {2, 1}), "cm-1 given as J");
        // The hydrogen-like uranium 1s binding, about 132 keV (from memory), is taken.
        assertEquals(0.0, IonisationBalance.sahaRatio(1e4, 1e21, 132e3 * PhysicalConstants.E, 2, 1), 0.0);
    }
}
