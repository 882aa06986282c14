package org.ritzwerk.quantity;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;

import org.junit.jupiter.api.Test;
import org.ritzwerk.medium.Ciddor1996;
import org.ritzwerk.medium.Medium;

/** The text form of quantities: what reads, what is written, and every refusal with its message. */
class QuantityTextTest {

    private final QuantityText text = QuantityText.standard();

    @Test
    void readsTheForms() {
        assertEquals(Wavelength.ofNanometres(656.28, Medium.air()), text.parse("656.28 nm air"));
        assertEquals(Wavelength.of(656.28, 0.02, Unit.NANOMETRE, Medium.vacuum()), text.parse("656.28(2) nm"));
        assertEquals(Wavelength.of(656.28, 0.02, Unit.NANOMETRE, Medium.vacuum()),
                text.parse("656.28 +- 0.02 nm vacuum"));
        assertEquals(Wavelength.of(656.28, 0.02, Unit.NANOMETRE, Medium.vacuum()), text.parse("656.28 ± 0.02 nm"));
        assertEquals(Wavenumber.ofPerCentimetre(15233.1), text.parse("15233.1 cm-1"));
        assertEquals(Frequency.of(457.2, Unit.TERAHERTZ), text.parse("457.2 THz"));
        assertEquals(Energy.ofElectronVolts(1.8886), text.parse("1.8886 eV"));
        assertEquals(Energy.ofJoules(3.6e-19), text.parse("3.6e-19 J"));
        assertEquals(Temperature.ofKelvin(300), text.parse("300 K"));
        assertEquals(Wavelength.of(6562.8, Unit.ANGSTROM, Medium.air()), text.parse("6562.8 Angstrom air"));
        assertEquals(Wavelength.of(6562.8, Unit.ANGSTROM, Medium.air()), text.parse("6562.8 \u00c5 air"));
        assertEquals(Wavelength.of(1.5, Unit.MICROMETRE, Medium.vacuum()), text.parse("1.5 \u00b5m"));
        assertEquals(Wavelength.ofNanometres(656, Medium.vacuum()), text.parse("  656nm  "));
        assertEquals(Wavelength.ofNanometres(656.28, Medium.air(new Ciddor1996(20, 101_325, 40, 450))),
                text.parse("656.28 nm air(ciddor1996:T=20C,p=101325Pa,RH=40%,CO2=450ppm)"));
    }

    @Test
    void conciseUncertaintyCountsInTheLastDigits() {
        Quantity planck = text.parse("6.62607015(81)e-34 J");
        assertEquals(8.1e-41, planck.uncertaintyIn(Unit.JOULE).orElseThrow(), 1e-55);
        assertEquals(0.12, text.parse("656.28(12) nm").uncertaintyIn(Unit.NANOMETRE).orElseThrow(), 1e-15);
        assertEquals(2, text.parse("656(2) nm").uncertaintyIn(Unit.NANOMETRE).orElseThrow(), 0);
    }

    @Test
    void aWavelengthWithoutMediumIsVacuumAndPrintsItsMedium() {
        Wavelength wavelength = (Wavelength) text.parse("656.28 nm");
        assertEquals(Medium.vacuum(), wavelength.medium());
        assertEquals("656.28 nm vacuum", text.format(wavelength, Unit.NANOMETRE));
        assertEquals("656.28 nm air", text.format(Wavelength.ofNanometres(656.28, Medium.air()), Unit.NANOMETRE));
    }

    @Test
    void writesUncertaintyConcisely() {
        assertEquals("656.4608(20) nm vacuum",
                text.format(Wavelength.of(656.46084, 0.002, Unit.NANOMETRE, Medium.vacuum()), Unit.NANOMETRE));
        assertEquals("6.62607015(81)e-34 J", text.format(Energy.of(6.62607015e-34, 8.1e-41, Unit.JOULE), Unit.JOULE));
        assertEquals("6.626070150(81)e-34 J", text.format(Energy.of(6.62607015e-34, 8.1e-42, Unit.JOULE), Unit.JOULE));
        assertEquals("1234567(25) Hz", text.format(Frequency.of(1234567.3, 25, Unit.HERTZ), Unit.HERTZ));
        assertEquals("1.23457(25)e8 Hz", text.format(Frequency.of(123456789, 25000, Unit.HERTZ), Unit.HERTZ));
        assertEquals("656.28(0) nm vacuum",
                text.format(Wavelength.of(656.28, 0, Unit.NANOMETRE, Medium.vacuum()), Unit.NANOMETRE));
        assertEquals("1(25) eV", text.format(Energy.of(1.2, 25, Unit.ELECTRONVOLT), Unit.ELECTRONVOLT));
        assertEquals("1.2 +- 250 eV", text.format(Energy.of(1.2, 250, Unit.ELECTRONVOLT), Unit.ELECTRONVOLT));
    }

    @Test
    void roundsToSignificantDigitsWhenAsked() {
        Wavelength wavelength = Wavelength.ofNanometres(656.4602977309532, Medium.vacuum());
        assertEquals("656.46 nm vacuum", text.format(wavelength, Unit.NANOMETRE, 5));
        assertEquals("656.4603 nm vacuum", text.format(wavelength, Unit.NANOMETRE, 7));
        assertEquals("208.510 cm-1", text.format(Wavenumber.ofPerCentimetre(208.50969), Unit.PER_CENTIMETRE, 6));
        assertEquals("1.20000e10 Hz", text.format(Frequency.ofHertz(1.2e10), Unit.HERTZ, 6));
        assertEquals("656.4602977309532 nm vacuum", text.format(wavelength, Unit.NANOMETRE));
        assertEquals("1.5e-19 J", text.format(Energy.ofJoules(1.5e-19), Unit.JOULE));
    }

    @Test
    void readsTargets() {
        assertEquals(new Target(Unit.NANOMETRE, Medium.vacuum()), text.parseTarget("nm vacuum"));
        assertEquals(new Target(Unit.NANOMETRE, Medium.vacuum()), text.parseTarget("nm"));
        assertEquals(new Target(Unit.NANOMETRE, Medium.air()), text.parseTarget("nm air"));
        assertEquals(Target.of(Unit.TERAHERTZ), text.parseTarget("THz"));
    }

    @Test
    void temperaturesConvertThroughKt() {
        // 1 K is k / (h c) = 0.69503480 cm-1 (CODATA 2018 kelvin-inverse meter relationship
        // 69.50348004 m^-1; Tiesinga et al. 2021).
        Wavenumber sigma = (Wavenumber) Target.of(Unit.PER_CENTIMETRE).convert(Temperature.ofKelvin(1));
        assertEquals(0.6950348004, sigma.inPerCentimetre(), 1e-10);
        Temperature back = (Temperature) Target.of(Unit.KELVIN).convert(sigma);
        assertEquals(1, back.inKelvin(), 1e-15);
    }

    // ---- refusals: each names the column and what is wrong there ----

    @Test
    void refusesEmptyInput() {
        refuses("   ", QuantityParseException.EMPTY,
                "cannot read \"   \" (column 4): empty; expected a number and a unit, e.g. 656.28 nm air");
    }

    @Test
    void refusesMissingNumber() {
        refuses("nm 656", QuantityParseException.NO_NUMBER,
                "cannot read \"nm 656\" (column 1): expected a number, found 'nm'");
    }

    @Test
    void refusesMissingUnit() {
        refuses("656.28", QuantityParseException.MISSING_UNIT, "cannot read \"656.28\" (column 7): no unit after "
                + "the number; known units: m, um, nm, \u00c5, m-1, cm-1, Hz, kHz, MHz, GHz, THz, J, eV, meV, K");
    }

    @Test
    void refusesUnknownUnit() {
        refuses("656.28 furlongs", QuantityParseException.UNKNOWN_UNIT, "cannot read \"656.28 furlongs\" (column 8): "
                + "unknown unit 'furlongs'; known units: m, um, nm, \u00c5, m-1, cm-1, Hz, kHz, MHz, GHz, THz, J, eV, "
                + "meV, K");
        refuses("457 thz", QuantityParseException.UNKNOWN_UNIT,
                "cannot read \"457 thz\" (column 5): unknown unit 'thz'; did you mean 'THz'? (units are case-sensitive)");
        refuses("6562.8 A", QuantityParseException.UNKNOWN_UNIT,
                "cannot read \"6562.8 A\" (column 8): unknown unit 'A'; write \u00c5 or Angstrom for the angstrom");
    }

    @Test
    void refusesNegativeValues() {
        refuses("-656.28 nm", QuantityParseException.NEGATIVE,
                "cannot read \"-656.28 nm\" (column 1): the value must not be negative");
    }

    @Test
    void refusesNonFiniteValues() {
        refuses("NaN nm", QuantityParseException.NOT_FINITE, "cannot read \"NaN nm\" (column 1): the value must be "
                + "a finite number");
        refuses("Infinity eV", QuantityParseException.NOT_FINITE,
                "cannot read \"Infinity eV\" (column 1): the value must be a finite number");
        refuses("1e400 nm", QuantityParseException.NOT_FINITE,
                "cannot read \"1e400 nm\" (column 1): the value is too large for a double");
        refuses("1e300 THz", QuantityParseException.NOT_FINITE,
                "cannot read \"1e300 THz\" (column 1): the value is too large in SI units");
    }

    @Test
    void refusesZeroWavelength() {
        refuses("0 nm", QuantityParseException.NOT_POSITIVE,
                "cannot read \"0 nm\" (column 1): a wavelength must be positive");
    }

    @Test
    void refusesAMediumForANonWavelength() {
        refuses("457.2 THz air", QuantityParseException.MEDIUM_NOT_ALLOWED, "cannot read \"457.2 THz air\" "
                + "(column 11): a medium ('air') is given for a frequency (THz); only wavelengths have a medium");
        QuantityParseException target = assertThrows(QuantityParseException.class, () -> text.parseTarget("eV vacuum"));
        assertEquals(QuantityParseException.MEDIUM_NOT_ALLOWED, target.code());
    }

    @Test
    void refusesUnknownMedium() {
        refuses("656.28 nm water", QuantityParseException.UNKNOWN_MEDIUM, "cannot read \"656.28 nm water\" "
                + "(column 11): unknown medium 'water'; expected vacuum, air or air(<model>), e.g. "
                + "air(ciddor1996:T=20C,p=101325Pa,RH=40%,CO2=450ppm)");
        refuses("656.28 nm air(ciddor1996:T=20C)", QuantityParseException.UNKNOWN_MEDIUM,
                "cannot read \"656.28 nm air(ciddor1996:T=20C)\" (column 11): air model 'ciddor1996:T=20C': "
                        + "all four conditions T, p, RH and CO2 are required, each with its unit");
    }

    @Test
    void refusesBadUncertainties() {
        refuses("656.28(2) +- 0.02 nm", QuantityParseException.BAD_UNCERTAINTY, "cannot read \"656.28(2) +- 0.02 nm\" "
                + "(column 11): the uncertainty is given twice (in parentheses at column 7 and after +-)");
        refuses("656.28 +- -0.02 nm", QuantityParseException.BAD_UNCERTAINTY, "cannot read \"656.28 +- -0.02 nm\" "
                + "(column 11): expected a number that is not negative after '+-', found '-0.02'");
        refuses("656.28(x) nm", QuantityParseException.BAD_UNCERTAINTY, "cannot read \"656.28(x) nm\" (column 7): "
                + "expected digits in parentheses as a concise uncertainty, e.g. 656.28(2)");
    }

    @Test
    void refusesTrailingText() {
        refuses("656.28 nm air please", QuantityParseException.TRAILING_TEXT,
                "cannot read \"656.28 nm air please\" (column 15): unexpected 'please'");
    }

    @Test
    void refusesATemperatureWhereASpectralPositionIsNeeded() {
        QuantityParseException e = assertThrows(QuantityParseException.class, () -> text.parseSpectral("300 K"));
        assertEquals(QuantityParseException.WRONG_KIND, e.code());
    }

    @Test
    void equalityIsExactAndCloseToIsSeparate() {
        Wavelength a = Wavelength.ofNanometres(656.28, Medium.vacuum());
        Wavelength b = Wavelength.ofNanometres(656.2800001, Medium.vacuum());
        assertFalse(a.equals(b));
        assertFalse(a.equals(Wavelength.ofNanometres(656.28, Medium.air())));
        assertEquals(true, a.isCloseTo(b, 1e-9));
        assertFalse(a.isCloseTo(Wavelength.ofNanometres(656.28, Medium.air()), 1));
    }

    @Test
    void factoriesRefuseValuesOutsideTheirDomain() {
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> Wavelength.ofNanometres(-1, Medium.vacuum()));
        assertEquals("wavelength must be positive, got -1 nm", e.getMessage());
        assertThrows(IllegalArgumentException.class, () -> Frequency.ofHertz(Double.NaN));
        assertThrows(IllegalArgumentException.class, () -> Temperature.ofKelvin(-1));
        assertThrows(IllegalArgumentException.class, () -> Energy.of(1, -0.1, Unit.ELECTRONVOLT));
        assertThrows(IllegalArgumentException.class, () -> Energy.of(1, Unit.NANOMETRE));
        ConversionException photon = assertThrows(ConversionException.class,
                () -> Energy.ofElectronVolts(-13.6).toWavelength(Medium.vacuum()));
        assertEquals(ConversionException.NOT_A_PHOTON, photon.code());
    }

    private void refuses(String input, String code, String message) {
        QuantityParseException e = assertThrows(QuantityParseException.class, () -> text.parse(input));
        assertEquals(code, e.code());
        assertEquals(message, e.getMessage());
    }
}
