package org.ritzwerk;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.api.Test;
import org.ritzwerk.medium.AirModels;
import org.ritzwerk.medium.Ciddor1996;
import org.ritzwerk.medium.Medium;
import org.ritzwerk.quantity.Energy;
import org.ritzwerk.quantity.QuantityText;
import org.ritzwerk.quantity.Unit;
import org.ritzwerk.quantity.Wavelength;

/**
 * The api examples of the README, compiled and run so they never drift. Values named here come
 * from the library itself; their correctness is shown by the reference tests.
 */
class UserGuideTest {

    @Test
    void convertAnAirWavelength() {
        // A wavelength always carries its medium; "air" alone is standard air (Morton 2000).
        Wavelength air = Wavelength.ofNanometres(656.279, Medium.air());
        Wavelength vacuum = air.toWavelength(Medium.vacuum());
        double terahertz = air.toFrequency().valueIn(Unit.TERAHERTZ);
        double electronVolts = air.toEnergy().inElectronVolts();

        assertEquals(656.4603, vacuum.inNanometres(), 5e-5);
        assertEquals(456.680, terahertz, 5e-4);
        assertEquals(1.888678, electronVolts, 5e-7);
    }

    @Test
    void readAndWriteText() {
        QuantityText text = QuantityText.standard();
        Wavelength measured = (Wavelength) text.parse("656.28(2) nm air");
        String inVacuum = text.format(measured.toWavelength(Medium.vacuum()), Unit.NANOMETRE);

        assertEquals("656.461(20) nm vacuum", inVacuum);
    }

    @Test
    void airAtYourLabsConditions() {
        Medium labAir = Medium.air(new Ciddor1996(21.5, 98_400, 45, 430));
        Medium sameLabAir = Medium.air(AirModels.parse("ciddor1996:T=21.5C,p=984hPa,RH=45%,CO2=430ppm"));
        Wavelength line = Wavelength.ofNanometres(632.991, Medium.vacuum()).toWavelength(labAir);

        assertEquals(labAir, sameLabAir);
        assertEquals(632.8251, line.inNanometres(), 5e-4);
    }

    @Test
    void photonEnergyToWavelength() {
        Wavelength wavelength = Energy.ofElectronVolts(1.8886).toWavelength(Medium.air());

        assertEquals(656.306, wavelength.inNanometres(), 5e-4);
    }
}
